/**
 * Reynolds number of pipe flow.
 *
 * @module
 */
import { requireFinite } from "../errors.ts";

/**
 * Reynolds number of pipe flow, Re = |V|·D/ν (bulk velocity, inside diameter, kinematic
 * viscosity). The sign of the velocity (flow direction) does not matter.
 *
 * Method: definition of the Reynolds number (Reynolds 1883; any fluid-mechanics text, e.g.
 * source `white-fluid-mechanics-2011`). Valid for any finite velocity, diameter > 0 and
 * viscosity > 0; throws an InputError otherwise.
 *
 * @param velocity bulk (area-mean) velocity, m/s; any finite value
 * @param diameter inside diameter, m; > 0
 * @param kinematicViscosity kinematic viscosity, m²/s; > 0 (water at 20 °C ≈ 1.0e-6)
 * @returns the Reynolds number, dimensionless
 *
 * @example
 * ```ts
 * import { reynoldsNumber } from "./reynolds.ts";
 * const re = reynoldsNumber(1.5, 0.2, 1.0e-6);
 * if (Math.abs(re - 3.0e5) > 1e-6) throw new Error("Re");
 * ```
 */
export function reynoldsNumber(
  velocity: number,
  diameter: number,
  kinematicViscosity: number,
): number {
  requireFinite("velocity", velocity, "m/s");
  requireFinite("diameter", diameter, "m", true);
  requireFinite("kinematicViscosity", kinematicViscosity, "m^2/s", true);
  const re = Math.abs(velocity) * diameter / kinematicViscosity;
  return requireFinite("reynolds", re, "1");
}

/** Flow regime by the Reynolds number. */
export type FlowRegime = "laminar" | "transition" | "turbulent";
