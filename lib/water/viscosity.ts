/**
 * IAPWS 2008 viscosity of ordinary water, industrial form (no critical enhancement, μ₂ = 1).
 *
 * @module
 */
import { checkRange, type ValidityOptions } from "../errors.ts";
import { viscosity2008Coefficients } from "./coefficients.ts";

/** Name used in messages and traces. */
export const VISCOSITY_NAME = "IAPWS 2008 viscosity (industrial form)";

/** (T, ρ) validity: K and kg/m³. */
export const VISCOSITY_RANGE = {
  temperature: [273.15, 1173.15] as const,
  density: [1e-9, 1250] as const,
};

/**
 * Dynamic viscosity of water from IAPWS R12-08 in the industrial form μ = μ*·μ̄₀(T̄)·μ̄₁(T̄, ρ̄):
 * μ̄₀ = 100·√T̄ / Σ₀³ Hᵢ/T̄ⁱ (eq. 11), μ̄₁ = exp(ρ̄ Σ Hᵢⱼ (1/T̄ − 1)ⁱ (ρ̄ − 1)ʲ) (eq. 12),
 * T̄ = T/647.096 K, ρ̄ = ρ/322 kg/m³, μ* = 1 µPa·s; the critical enhancement μ̄₂ is taken as 1,
 * which the release allows outside a small region around the critical point.
 *
 * Validity: 273.15–1173.15 K, densities up to 1250 kg/m³ (OutOfRangeError outside unless
 * extrapolating). Sources: iapws-r12-08.
 *
 * @param T temperature, K (ITS-90)
 * @param rho density, kg/m³
 * @param options extrapolation opt-in and warning sink
 * @returns dynamic viscosity, Pa·s
 *
 * @example
 * ```ts
 * import { iapws2008Viscosity } from "./viscosity.ts";
 * const mu = iapws2008Viscosity(298.15, 998); // IAPWS R12-08 Table 4, first row
 * if (Math.abs(mu - 889.7351e-6) > 1e-12) throw new Error(String(mu));
 * ```
 */
export function iapws2008Viscosity(T: number, rho: number, options?: ValidityOptions): number {
  checkRange("temperature", T, VISCOSITY_RANGE.temperature, "K", VISCOSITY_NAME, options);
  checkRange("density", rho, VISCOSITY_RANGE.density, "kg/m^3", VISCOSITY_NAME, options);
  return iapws2008ViscosityUnchecked(T, rho);
}

/** The same without checks. */
export function iapws2008ViscosityUnchecked(T: number, rho: number): number {
  const k = viscosity2008Coefficients();
  const Tr = T / k.Tc, Dr = rho / k.rhoc;
  let den = 0, trp = 1;
  for (let i = 0; i < k.H0.length; i++) {
    den += k.H0[i] / trp;
    trp *= Tr;
  }
  const mu0 = 100 * Math.sqrt(Tr) / den;
  const x = 1 / Tr - 1, y = Dr - 1;
  let sum = 0;
  for (let i = 0; i < k.Hij.length; i++) {
    sum += k.Hij[i] * ipow(x, k.I[i]) * ipow(y, k.J[i]);
  }
  return k.mustar * mu0 * Math.exp(Dr * sum);
}

function ipow(x: number, n: number): number {
  let r = 1;
  for (let i = 0; i < n; i++) r *= x;
  return r;
}
