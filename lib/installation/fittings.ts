/**
 * Fitting lookup for the installation room (from the bundled registry).
 *
 * @module
 */
import { InputError } from "../errors.ts";
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
 * Throws NotFoundError listing the nearest ids for an unknown id, InputError for a value that
 * is neither an id nor a fitting entry.
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
  if (typeof fitting === "string") return defaultRegistry().fitting(fitting);
  if (
    fitting === null || typeof fitting !== "object" || typeof fitting.id !== "string" ||
    !fitting.straightRun || !fitting.disturbance
  ) {
    throw new InputError(
      "fitting",
      fitting === null || typeof fitting !== "object" ? String(fitting) : "an object",
      "a fitting id such as elbow-90 or pump, or a fitting entry of the registry",
    );
  }
  return fitting;
}
