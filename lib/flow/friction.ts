/**
 * Darcy friction factor of pipe flow: Colebrook–White solved to machine precision, laminar
 * 64/Re, a stated transition treatment, and the explicit Haaland and Swamee–Jain forms.
 *
 * @module
 */
import {
  checkRange,
  InputError,
  NoPhysicalAnswerError,
  requireFinite,
  type ValidityOptions,
} from "../errors.ts";
import { flowConstants } from "./constants.ts";

/** Methods accepted by {@link frictionFactor}. */
export type FrictionMethod = "colebrook" | "haaland" | "swamee-jain";

const LN10 = Math.LN10;

/**
 * Solve Colebrook–White, 1/√f = −2 log10(ε/(3.7 D) + 2.51/(Re √f)), for x = 1/√f by Newton's
 * method started from Haaland's explicit value; stops when the step is below 1e-15·x.
 */
function colebrook(re: number, rr: number): number {
  const a = rr / 3.7;
  const b = 2.51 / re;
  let x = -1.8 * Math.log10(Math.pow(a, 1.11) + 6.9 / re);
  for (let i = 0; i < 30; i++) {
    const arg = a + b * x;
    const g = x + 2 * Math.log10(arg);
    const dg = 1 + (2 / LN10) * b / arg;
    const dx = g / dg;
    x -= dx;
    if (Math.abs(dx) <= 1e-15 * Math.abs(x)) break;
  }
  return 1 / (x * x);
}

function checkInputs(reynolds: number, relativeRoughness: number): void {
  requireFinite("reynolds", reynolds, "1", true);
  requireFinite("relativeRoughness", relativeRoughness, "1");
  if (relativeRoughness < 0) {
    throw new InputError("relativeRoughness", String(relativeRoughness), "a ratio ε/D ≥ 0");
  }
}

/**
 * Darcy friction factor f of fully developed pipe flow.
 *
 * - Re < 2000: laminar, f = 64/Re (Hagen–Poiseuille), whatever the roughness.
 * - 2000 ≤ Re < 4000: transition, the least certain region: f interpolated linearly in Re
 *   between 64/2000 and the turbulent value at Re = 4000; a warning `transition` is pushed
 *   to `options.warnings` when a sink is given. The limits are common practice (source
 *   `common-practice`, data/flow/regimes.yaml).
 * - Re ≥ 4000: turbulent, by `method`: "colebrook" (default; Colebrook–White, source
 *   `colebrook-1939`, solved for 1/√f by Newton's method to machine precision), "haaland"
 *   (`haaland-1983`) or "swamee-jain" (`swamee-jain-1976`), see {@link frictionFactorExplicit}.
 *
 * Validity: 0 < Re ≤ 1e8 and 0 ≤ ε/D ≤ 0.05; outside, OutOfRangeError unless
 * `options.extrapolate`.
 *
 * @param reynolds Reynolds number (bulk velocity, inside diameter), dimensionless; > 0
 * @param relativeRoughness equivalent sand-grain roughness over inside diameter ε/D, dimensionless
 * @param method turbulent formula; default "colebrook"
 * @param options extrapolation opt-in and warning sink
 * @returns the Darcy friction factor, dimensionless
 *
 * @example
 * ```ts
 * import { frictionFactor } from "./friction.ts";
 * if (frictionFactor(1000, 0) !== 0.064) throw new Error("laminar");
 * const f = frictionFactor(1e5, 1e-4);
 * if (Math.abs(f - 0.01851) > 1e-4) throw new Error("Colebrook");
 * ```
 */
export function frictionFactor(
  reynolds: number,
  relativeRoughness = 0,
  method: FrictionMethod = "colebrook",
  options?: ValidityOptions,
): number {
  checkInputs(reynolds, relativeRoughness);
  const c = flowConstants();
  checkRange("reynolds", reynolds, [0, c.reynoldsMax], "1", "Darcy friction factor", options);
  checkRange(
    "relativeRoughness",
    relativeRoughness,
    [0, c.relativeRoughnessMax],
    "1",
    "Colebrook–White",
    options,
  );
  if (reynolds < c.laminarLimit) {
    const f = 64 / reynolds;
    // A denormal Re (5e-324) is positive and finite but 64/Re overflows.
    if (!Number.isFinite(f)) {
      throw new InputError("reynolds", String(reynolds), "a Reynolds number above 1e-300");
    }
    return f;
  }
  if (reynolds < c.colebrookLimit) {
    options?.warnings?.push({
      code: "transition",
      message: `Re ${Math.round(reynolds)} is in the laminar–turbulent transition ` +
        `(${c.laminarLimit}–${c.colebrookLimit}): friction factor interpolated, least certain`,
    });
    const fl = 64 / c.laminarLimit;
    const ft = turbulent(c.colebrookLimit, relativeRoughness, method);
    const w = (reynolds - c.laminarLimit) / (c.colebrookLimit - c.laminarLimit);
    return fl + w * (ft - fl);
  }
  return turbulent(reynolds, relativeRoughness, method);
}

function turbulent(re: number, rr: number, method: FrictionMethod): number {
  const f = turbulentForm(re, rr, method);
  // Only reachable when extrapolating far out (ε/D of 1e278): the forms give NaN or ±Infinity.
  if (!(Number.isFinite(f) && f > 0)) {
    throw new NoPhysicalAnswerError(
      `${method} gives no finite friction factor at Re ${re}, relative roughness ${rr}`,
    );
  }
  return f;
}

function turbulentForm(re: number, rr: number, method: FrictionMethod): number {
  switch (method) {
    case "colebrook":
      return colebrook(re, rr);
    case "haaland": {
      const x = -1.8 * Math.log10(Math.pow(rr / 3.7, 1.11) + 6.9 / re);
      return 1 / (x * x);
    }
    case "swamee-jain": {
      const l = Math.log10(rr / 3.7 + 5.74 / Math.pow(re, 0.9));
      return 0.25 / (l * l);
    }
    default:
      throw new InputError("method", String(method), "colebrook, haaland or swamee-jain");
  }
}

/**
 * Explicit approximations to Colebrook–White, for comparison.
 *
 * - "haaland": 1/√f = −1.8 log10[(ε/3.7D)^1.11 + 6.9/Re] (source `haaland-1983`); stated
 *   range 4e3 ≤ Re ≤ 1e8, 0 ≤ ε/D ≤ 0.05 (recalled); about 2 % from Colebrook.
 * - "swamee-jain": f = 0.25 / [log10(ε/3.7D + 5.74/Re^0.9)]² (source `swamee-jain-1976`);
 *   stated range 5e3 ≤ Re ≤ 1e8, 1e-6 ≤ ε/D ≤ 1e-2 (recalled), accepted here from ε/D = 0
 *   (the smooth limit).
 *
 * Outside the range, OutOfRangeError unless `options.extrapolate`.
 *
 * @param reynolds Reynolds number, dimensionless
 * @param relativeRoughness ε/D, dimensionless
 * @param method "haaland" | "swamee-jain"
 * @param options extrapolation opt-in and warning sink
 * @returns the Darcy friction factor, dimensionless
 *
 * @example
 * ```ts
 * import { frictionFactorExplicit } from "./friction.ts";
 * const f = frictionFactorExplicit(1e5, 1e-4, "swamee-jain");
 * if (Math.abs(f - 0.018452) > 1e-5) throw new Error("Swamee–Jain");
 * ```
 */
export function frictionFactorExplicit(
  reynolds: number,
  relativeRoughness: number,
  method: "haaland" | "swamee-jain",
  options?: ValidityOptions,
): number {
  checkInputs(reynolds, relativeRoughness);
  if (method === "haaland") {
    checkRange("reynolds", reynolds, [4e3, 1e8], "1", "Haaland 1983", options);
    checkRange("relativeRoughness", relativeRoughness, [0, 0.05], "1", "Haaland 1983", options);
  } else if (method === "swamee-jain") {
    checkRange("reynolds", reynolds, [5e3, 1e8], "1", "Swamee–Jain 1976", options);
    checkRange("relativeRoughness", relativeRoughness, [0, 1e-2], "1", "Swamee–Jain 1976", options);
  } else {
    throw new InputError("method", String(method), "haaland or swamee-jain");
  }
  return turbulent(reynolds, relativeRoughness, method);
}
