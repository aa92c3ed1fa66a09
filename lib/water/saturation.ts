/**
 * Saturation pressure of water and the boiling check shared by every water formulation.
 *
 * @module
 */
import { checkRange, NoPhysicalAnswerError, type ValidityOptions } from "../errors.ts";
import { saturationCoefficients } from "./coefficients.ts";

/** Validity of the saturation-pressure auxiliary equation, K (triple point to critical point). */
export const SATURATION_RANGE: readonly [number, number] = [273.15, 647.096];

const SAT_NAME = "Wagner-Pruss 1993 saturation pressure";

/**
 * Saturation (vapour) pressure of ordinary water by the auxiliary equation of Wagner & Pruß
 * (1993), as given in IAPWS SR1-86(1992):
 * ln(p_s/p_c) = (T_c/T)·(a1·θ + a2·θ^1.5 + a3·θ³ + a4·θ^3.5 + a5·θ⁴ + a6·θ^7.5), θ = 1 − T/T_c.
 * It reproduces IAPWS-95 saturation pressures to within about 0.03 %.
 *
 * Validity: 273.16 K (triple point; 273.15 K accepted) to 647.096 K (critical point).
 * Sources: wagner-pruss-1993 (coefficients in data/water/saturation.yaml).
 *
 * @param T temperature, K (ITS-90)
 * @param options extrapolation opt-in and warning sink
 * @returns saturation pressure, Pa
 *
 * @example
 * ```ts
 * import { saturationPressure } from "./saturation.ts";
 * const p = saturationPressure(373.124); // normal boiling point on ITS-90
 * if (Math.abs(p - 101325) > 30) throw new Error(String(p));
 * ```
 */
export function saturationPressure(T: number, options?: ValidityOptions): number {
  checkRange("temperature", T, SATURATION_RANGE, "K", SAT_NAME, options);
  return saturationPressureUnchecked(T);
}

/** The auxiliary equation without range checks (clamped at the critical point). */
export function saturationPressureUnchecked(T: number): number {
  const c = saturationCoefficients();
  const theta = 1 - T / c.Tc;
  if (theta <= 0) return c.pc;
  let sum = 0;
  for (let i = 0; i < c.a.length; i++) sum += c.a[i] * Math.pow(theta, c.e[i]);
  return c.pc * Math.exp((c.Tc / T) * sum);
}

// p_s at whole kelvins above the triple point, for the fast pass: each filled when first asked
// for (NaN until then), so a process that meets a few temperatures evaluates a few.
let bounds: Float64Array | undefined;

function saturationBound(T: number): number {
  if (!bounds) {
    bounds = new Float64Array(Math.ceil(SATURATION_RANGE[1] - SATURATION_RANGE[0]) + 1);
    bounds.fill(NaN);
  }
  const i = Math.ceil(T - SATURATION_RANGE[0]);
  let b = bounds[i];
  if (Number.isNaN(b)) {
    b = bounds[i] = saturationPressureUnchecked(Math.min(SATURATION_RANGE[0] + i, 647.096));
  }
  return b;
}

/**
 * Refuse a (T, p) where water is not liquid (p below the saturation pressure at T).
 *
 * @param T temperature, K
 * @param p absolute pressure, Pa
 * @throws NoPhysicalAnswerError whose message starts "water boils at this pressure"
 */
export function assertLiquid(T: number, p: number): void {
  if (T >= SATURATION_RANGE[1]) {
    throw new NoPhysicalAnswerError(
      `water boils at this pressure: saturation pressure is undefined at ${fmtC(T)} ` +
        `(at or above the critical temperature 647.096 K); no liquid phase exists`,
    );
  }
  if (T < SATURATION_RANGE[0]) return;
  // Fast pass: p_s(T) rises with T, so p at or above p_s at the next whole kelvin is liquid.
  const bound = saturationBound(T);
  if (p >= bound) return;
  const ps = saturationPressureUnchecked(T);
  if (p < ps) {
    throw new NoPhysicalAnswerError(
      `water boils at this pressure: saturation pressure is ${fmtP(ps)} at ${fmtC(T)}; ` +
        `given ${fmtP(p)} absolute (raise the pressure or lower the temperature)`,
    );
  }
}

function sig(x: number, n = 4): string {
  return String(Number(x.toPrecision(n)));
}

function fmtP(p: number): string {
  return `${sig(p / 1000)} kPa (${sig(p / 1e5)} bar)`;
}

function fmtC(T: number): string {
  return `${sig(T - 273.15, 5)} °C (${sig(T, 6)} K)`;
}
