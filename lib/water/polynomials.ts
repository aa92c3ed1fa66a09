/**
 * Sound speed in pure water at atmospheric pressure from published polynomials in temperature:
 * Del Grosso & Mader (1972, IPTS-68) and Marczak (1997, ITS-90).
 *
 * @module
 */
import { checkRange, type ValidityOptions } from "../errors.ts";
import { polynomialCoefficients } from "./coefficients.ts";

/** Names used in messages and traces. */
export const DEL_GROSSO_MADER_NAME = "Del Grosso-Mader 1972";
/** Names used in messages and traces. */
export const MARCZAK_NAME = "Marczak 1997";

/** Temperature validity of both polynomials, K (0–95 °C). */
export const POLYNOMIAL_RANGE: readonly [number, number] = [273.15, 368.15];

function horner(k: Float64Array, t: number): number {
  let c = 0;
  for (let i = k.length - 1; i >= 0; i--) c = c * t + k[i];
  return c;
}

/**
 * Speed of sound in pure water at 1 atm by Del Grosso & Mader (1972): c = Σ₀⁵ kᵢ t₆₈ⁱ, a
 * fifth-degree polynomial in the IPTS-68 Celsius temperature. The ITS-90 input is converted
 * with t₆₈ = 1.00024 t₉₀ (Saunders 1990; ≤ 0.01 K from the exact scale difference here).
 * Coefficients transcribed from public copies of the paper's table (data/sources.yaml,
 * copy-del-grosso-mader-1972-coefficients) and confirmed against IAPWS-95 at 101.325 kPa: worst difference 0.062 m/s near 76 °C, a smooth fit residual
 * (tests/reference/water_polynomials.test.ts).
 *
 * Validity: 0–95 °C (273.15–368.15 K) at atmospheric pressure; OutOfRangeError naming
 * "Del Grosso-Mader 1972" outside unless extrapolating.
 * Sources: del-grosso-mader-1972, saunders-1990.
 *
 * @param T temperature, K (ITS-90)
 * @param options extrapolation opt-in and warning sink
 * @returns speed of sound, m/s
 *
 * @example
 * ```ts
 * import { delGrossoMaderSoundSpeed } from "./polynomials.ts";
 * const c = delGrossoMaderSoundSpeed(293.15);
 * if (Math.abs(c - 1482.3) > 0.2) throw new Error(String(c));
 * ```
 */
export function delGrossoMaderSoundSpeed(T: number, options?: ValidityOptions): number {
  checkRange("temperature", T, POLYNOMIAL_RANGE, "K", DEL_GROSSO_MADER_NAME, options);
  const k = polynomialCoefficients();
  return horner(k.delGrossoMader, k.t68PerT90 * (T - 273.15));
}

/**
 * Speed of sound in pure water at 1 atm by Marczak (1997): c = Σ₀⁵ kᵢ t₉₀ⁱ, a fifth-degree
 * polynomial in the ITS-90 Celsius temperature. Coefficients transcribed from a public copy
 * (data/sources.yaml, copy-marczak-1997-coefficients) and checked against IAPWS-95 at 101.325 kPa: worst difference 0.057 m/s near
 * 78 °C; it agrees with Del Grosso–Mader within 0.03 m/s (tests/reference/water_polynomials.test.ts).
 *
 * Validity: 0–95 °C (273.15–368.15 K) at atmospheric pressure; OutOfRangeError naming
 * "Marczak 1997" outside unless extrapolating.
 * Sources: marczak-1997.
 *
 * @param T temperature, K (ITS-90)
 * @param options extrapolation opt-in and warning sink
 * @returns speed of sound, m/s
 *
 * @example
 * ```ts
 * import { marczakSoundSpeed } from "./polynomials.ts";
 * const c = marczakSoundSpeed(293.15);
 * if (Math.abs(c - 1482.3) > 0.2) throw new Error(String(c));
 * ```
 */
export function marczakSoundSpeed(T: number, options?: ValidityOptions): number {
  checkRange("temperature", T, POLYNOMIAL_RANGE, "K", MARCZAK_NAME, options);
  return horner(polynomialCoefficients().marczak, T - 273.15);
}
