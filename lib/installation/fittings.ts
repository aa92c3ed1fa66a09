/**
 * Fitting lookup for the installation room (from the bundled registry).
 *
 * @module
 */
import { defaultRegistry } from "../registry/mod.ts";
import type { Fitting } from "../registry/schemas/fittings.ts";

export type {
  Fitting,
  FittingComponent,
  FittingLength,
  FittingProvenance,
} from "../registry/schemas/fittings.ts";

/**
 * A fitting by id or alias from data/fittings.yaml, or the entry itself when given one.
 * Throws NotFoundError listing the nearest ids for an unknown id.
 *
 * @param fitting id (`elbow-90`, `pump`, …), alias (`straight`) or a fitting entry
 * @returns the fitting entry
 *
 * @example
 * ```ts
 * import { resolveFitting } from "./fittings.ts";
 * if (resolveFitting("bend").id !== "elbow-90") throw new Error();
 * ```
 */
export function resolveFitting(fitting: string | Fitting): Fitting {
  return typeof fitting === "string" ? defaultRegistry().fitting(fitting) : fitting;
}
