/**
 * Registry queries for materials: registry.material(), registry.materials(), …
 *
 * @module
 */
import type { LoadedRegistry } from "./load.ts";

/**
 * Queries over the materials data, bound to one loaded registry.
 *
 * @param _loaded the loaded registry
 * @returns query functions
 *
 * @example
 * ```ts
 * import { loadRegistry } from "./load.ts";
 * import { materialQueries } from "./q_materials.ts";
 * const q = materialQueries(loadRegistry(new URL("../../data/", import.meta.url)));
 * if (typeof q !== "object") throw new Error();
 * ```
 */
export function materialQueries(_loaded: LoadedRegistry) {
  return {};
}
