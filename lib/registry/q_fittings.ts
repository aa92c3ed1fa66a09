/**
 * Registry queries for fittings: registry.fitting(), registry.fittings(), …
 *
 * @module
 */
import type { LoadedRegistry } from "./load.ts";

/**
 * Queries over the fittings data, bound to one loaded registry.
 *
 * @param _loaded the loaded registry
 * @returns query functions
 *
 * @example
 * ```ts
 * import { loadRegistry } from "./load.ts";
 * import { fittingQueries } from "./q_fittings.ts";
 * const q = fittingQueries(loadRegistry(new URL("../../data/", import.meta.url)));
 * if (typeof q !== "object") throw new Error();
 * ```
 */
export function fittingQueries(_loaded: LoadedRegistry) {
  return {};
}
