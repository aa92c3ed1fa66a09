/**
 * Registry queries for liquids: registry.liquid(), registry.liquids(), …
 *
 * @module
 */
import type { LoadedRegistry } from "./load.ts";

/**
 * Queries over the liquids data, bound to one loaded registry.
 *
 * @param _loaded the loaded registry
 * @returns query functions
 *
 * @example
 * ```ts
 * import { loadRegistry } from "./load.ts";
 * import { liquidQueries } from "./q_liquids.ts";
 * const q = liquidQueries(loadRegistry(new URL("../../data/", import.meta.url)));
 * if (typeof q !== "object") throw new Error();
 * ```
 */
export function liquidQueries(_loaded: LoadedRegistry) {
  return {};
}
