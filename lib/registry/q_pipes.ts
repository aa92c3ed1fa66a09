/**
 * Registry queries for pipes and tolerances: registry.pipe(), registry.pipes(), …
 *
 * @module
 */
import type { LoadedRegistry } from "./load.ts";

/**
 * Queries over the pipes data, bound to one loaded registry.
 *
 * @param _loaded the loaded registry
 * @returns query functions
 *
 * @example
 * ```ts
 * import { loadRegistry } from "./load.ts";
 * import { pipeQueries } from "./q_pipes.ts";
 * const q = pipeQueries(loadRegistry(new URL("../../data/", import.meta.url)));
 * if (typeof q !== "object") throw new Error();
 * ```
 */
export function pipeQueries(_loaded: LoadedRegistry) {
  return {};
}
