/**
 * Dead (gas-free) crude oil after Batzle & Wang (1992): sound speed, density and viscosity from
 * API gravity, temperature and pressure, and the Walther equation (ASTM D341) for the viscosity of
 * petroleum products between two kinematic-viscosity points.
 *
 * The Batzle–Wang relations are implemented from memory of the paper's equations (basis
 * recalled in data/liquids.yaml); their spreads are wide.
 *
 * @module
 */
import { InputError } from "../errors.ts";

/**
 * Reference density of a crude oil from API gravity at 15.6 °C: ρ0 = 141.5/(API + 131.5) g/cm³
 * (definition of API gravity), returned in kg/m³.
 *
 * Validity: API 5–70. Source: batzle-wang-1992 (definition restated there).
 *
 * @param api API gravity, degrees API
 * @returns density at standard conditions, kg/m³
 *
 * @example
 * ```ts
 * import { apiToDensity } from "./petroleum.ts";
 * if (Math.abs(apiToDensity(10) - 1000) > 1) throw new Error();
 * ```
 */
export function apiToDensity(api: number): number {
  if (!(api > 0) || !Number.isFinite(api)) {
    throw new InputError("API gravity", String(api), "a number of degrees API above 0");
  }
  return 141.5 / (api + 131.5) * 1000;
}

/**
 * Sound speed of dead crude oil, Batzle & Wang (1992):
 * V = 15450 (77.1 + API)^(−1/2) − 3.7 T + 4.64 P + 0.0115 (0.36 API^(1/2) − 1) T P,
 * V in m/s, T in °C, P in MPa.
 *
 * Validity: as stated for the data behind it, about 0–100 °C, 0–50 MPa, API 10–50 (callers check).
 * Source: batzle-wang-1992 (recalled).
 *
 * @param api API gravity
 * @param T temperature, K
 * @param p absolute pressure, Pa
 * @returns sound speed, m/s
 *
 * @example
 * ```ts
 * import { batzleWangSoundSpeed } from "./petroleum.ts";
 * const c = batzleWangSoundSpeed(30, 293.15, 101325);
 * if (c < 1350 || c > 1500) throw new Error(String(c));
 * ```
 */
export function batzleWangSoundSpeed(api: number, T: number, p: number): number {
  const t = T - 273.15;
  const P = p / 1e6;
  return 15450 / Math.sqrt(77.1 + api) - 3.7 * t + 4.64 * P +
    0.0115 * (0.36 * Math.sqrt(api) - 1) * t * P;
}

/**
 * Density of dead crude oil, Batzle & Wang (1992):
 * ρ_P = ρ0 + (0.00277 P − 1.71·10⁻⁷ P³)(ρ0 − 1.15)² + 3.49·10⁻⁴ P,
 * ρ = ρ_P / (0.972 + 3.81·10⁻⁴ (T + 17.78)^1.175), ρ in g/cm³, P in MPa, T in °C.
 *
 * Validity: about 0–100 °C, 0–50 MPa (callers check). Source: batzle-wang-1992 (recalled).
 *
 * @param api API gravity
 * @param T temperature, K
 * @param p absolute pressure, Pa
 * @returns density, kg/m³
 *
 * @example
 * ```ts
 * import { batzleWangDensity } from "./petroleum.ts";
 * const rho = batzleWangDensity(30, 288.7, 101325);
 * if (Math.abs(rho - 876) > 10) throw new Error(String(rho));
 * ```
 */
export function batzleWangDensity(api: number, T: number, p: number): number {
  const r0 = apiToDensity(api) / 1000;
  const t = T - 273.15;
  const P = p / 1e6;
  const rp = r0 + (0.00277 * P - 1.71e-7 * P ** 3) * (r0 - 1.15) ** 2 + 3.49e-4 * P;
  return rp / (0.972 + 3.81e-4 * (t + 17.78) ** 1.175) * 1000;
}

/**
 * Dynamic viscosity of dead crude oil, Batzle & Wang (1992) restating Beggs & Robinson (1975):
 * log10(η + 1) = 0.505 y (17.8 + T)^(−1.163), log10 y = 5.693 − 2.863/ρ0, η in cP, T in °C, ρ0 in
 * g/cm³. Known to scatter by a factor of about two for real crudes: measure when it matters.
 *
 * Validity: about 5–100 °C (callers check). Source: batzle-wang-1992 (recalled).
 *
 * @param api API gravity
 * @param T temperature, K
 * @returns dynamic viscosity, Pa·s
 *
 * @example
 * ```ts
 * import { batzleWangViscosity } from "./petroleum.ts";
 * const mu = batzleWangViscosity(30, 293.15);
 * if (mu < 0.005 || mu > 0.2) throw new Error(String(mu));
 * ```
 */
export function batzleWangViscosity(api: number, T: number): number {
  const r0 = apiToDensity(api) / 1000;
  const t = T - 273.15;
  const y = 10 ** (5.693 - 2.863 / r0);
  const eta = 10 ** (0.505 * y * (17.8 + t) ** -1.163) - 1;
  return eta * 1e-3;
}

/**
 * Kinematic viscosity of a petroleum liquid by the Walther equation of ASTM D341,
 * log10 log10(ν + 0.7) = A − B log10(T), through two points (ν in mm²/s, T in K).
 *
 * Validity: the standard's range, ν ≥ 2 mm²/s (callers check temperature). Source: astm-d341.
 *
 * @param points two points [°C, mm²/s]
 * @param T temperature, K
 * @returns kinematic viscosity, m²/s
 *
 * @example
 * ```ts
 * import { waltherViscosity } from "./petroleum.ts";
 * const nu = waltherViscosity([[40, 32], [100, 5.4]], 313.15);
 * if (Math.abs(nu - 32e-6) > 1e-9) throw new Error(String(nu));
 * ```
 */
export function waltherViscosity(
  points: readonly (readonly [number, number])[],
  T: number,
): number {
  const [[t1, n1], [t2, n2]] = points;
  const y1 = Math.log10(Math.log10(n1 + 0.7));
  const y2 = Math.log10(Math.log10(n2 + 0.7));
  const x1 = Math.log10(t1 + 273.15), x2 = Math.log10(t2 + 273.15);
  const B = (y1 - y2) / (x2 - x1);
  const A = y1 + B * x1;
  const nu = 10 ** (10 ** (A - B * Math.log10(T))) - 0.7;
  return nu * 1e-6;
}
