/**
 * The measurement model of a clamp-on transit-time flow measurement, as used by the plan's
 * uncertainty budget.
 *
 * Volume flow rate from the Snell-invariant form of the path velocity:
 *
 *   Q = k · (1 + ε_inst) · (π/4) · D² · c_w · Δt / (2 · sin θ_w · τ_liq)
 *
 * where D is the bore diameter (outside diameter − 2·wall − 2·lining), c_w and θ_w the wedge
 * sound speed and angle (sin θ_w / c_w is the Snell invariant: the liquid's sound speed cancels),
 * Δt the upstream–downstream transit-time difference (with zero offset and timing jitter), τ_liq
 * the time the sound spends in the liquid (total time less the fixed delays in wedge, wall, lining
 * and electronics), k the profile factor (area-mean / path-mean velocity) and ε_inst the estimated
 * installation effect of a disturbed profile. The model is that of JCGM 100:2008 §4.1: a
 * functional relation whose inputs carry standard uncertainties.
 *
 * @module
 */

/** Index of each input in the model's input vector. */
export const MODEL_INPUTS = [
  "outsideDiameter",
  "wallThickness",
  "liningThickness",
  "wedgeSoundSpeed",
  "wedgeAngle",
  "deltaT",
  "liquidTime",
  "profileFactor",
  "installationEffect",
] as const;

/** Names of the model's inputs. */
export type ModelInputName = typeof MODEL_INPUTS[number];

/**
 * Evaluate the measurement model.
 *
 * @param x input vector in the order of {@link MODEL_INPUTS}, SI units: m, m, m, m/s, rad, s,
 *   s, dimensionless, dimensionless
 * @returns volume flow rate, m³/s
 *
 * @example
 * ```ts
 * import { flowModel } from "./model.ts";
 * const q = flowModel(new Float64Array([0.2191, 0.00818, 0, 2720, 38 * Math.PI / 180, 1e-7, 1.5e-4, 0.94, 0]));
 * if (!(q > 0)) throw new Error();
 * ```
 */
export function flowModel(x: ArrayLike<number>): number {
  const bore = x[0] - 2 * x[1] - 2 * x[2];
  const area = Math.PI / 4 * bore * bore;
  const v = x[3] * x[5] / (2 * Math.sin(x[4]) * x[6]);
  return x[7] * (1 + x[8]) * area * v;
}

/**
 * Invert the measurement model for Δt: the transit-time difference a given flow produces.
 *
 * @param flowRate volume flow rate, m³/s
 * @param x the other inputs (the Δt entry is ignored)
 * @returns Δt, s
 *
 * @example
 * ```ts
 * import { deltaTForFlow, flowModel } from "./model.ts";
 * const x = new Float64Array([0.2191, 0.00818, 0, 2720, 0.66, 0, 1.5e-4, 0.94, 0]);
 * x[5] = deltaTForFlow(0.06, x);
 * if (Math.abs(flowModel(x) - 0.06) > 1e-12) throw new Error();
 * ```
 */
export function deltaTForFlow(flowRate: number, x: ArrayLike<number>): number {
  const y = Array.from(x);
  y[5] = 1;
  return flowRate / flowModel(y);
}
