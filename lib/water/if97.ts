/**
 * IAPWS-IF97 region 1 (compressed and saturated liquid): the dimensionless Gibbs free energy
 * γ(π, τ) = Σ nᵢ (7.1 − π)^Iᵢ (τ − 1.222)^Jᵢ, π = p/16.53 MPa, τ = 1386 K/T (eq. 7, Table 2 of the
 * release), and the properties from its derivatives (Table 3 of the release).
 * Sources: iapws-r7-97; coefficients in data/water/if97_region1.yaml.
 *
 * @module
 */
import { checkRange, type ValidityOptions } from "../errors.ts";
import { if97Region1Coefficients } from "./coefficients.ts";
import { assertLiquid } from "./saturation.ts";

/** Name used in messages and traces. */
export const IF97_NAME = "IAPWS-IF97 region 1";

/** Validity of region 1: K and Pa (the lower pressure bound is the saturation pressure). */
export const IF97_REGION1_RANGE = {
  temperature: [273.15, 623.15] as const,
  pressure: [0, 100e6] as const,
};

/** Properties of a region-1 state, SI units. */
export interface If97Region1State {
  /** Specific volume, m³/kg. */
  readonly v: number;
  /** Specific enthalpy, J/kg. */
  readonly h: number;
  /** Specific internal energy, J/kg. */
  readonly u: number;
  /** Specific entropy, J/(kg·K). */
  readonly s: number;
  /** Isobaric heat capacity, J/(kg·K). */
  readonly cp: number;
  /** Isochoric heat capacity, J/(kg·K). */
  readonly cv: number;
  /** Speed of sound, m/s. */
  readonly w: number;
}

// Scratch: γ, γ_π, γ_ππ, γ_τ, γ_ττ, γ_πτ
const G = new Float64Array(6);

// Integer powers of (7.1 − π) and (τ − 1.222) by running products, sized on first use.
let powA = new Float64Array(0);
let powB = new Float64Array(0);
let jMin = 0;
// Exponents as integers and the coefficients times the factors of each derivative.
let I = new Int32Array(0), J = new Int32Array(0);
let nI = new Float64Array(0), nII = nI, nJ = nI, nJJ = nI, nIJ = nI;

function sizeTables(k: { I: ArrayLike<number>; J: ArrayLike<number>; n: Float64Array }): void {
  let iMax = 0, jLo = 0, jHi = 0;
  for (let i = 0; i < k.I.length; i++) {
    iMax = Math.max(iMax, k.I[i]);
    jLo = Math.min(jLo, k.J[i]);
    jHi = Math.max(jHi, k.J[i]);
  }
  powA = new Float64Array(iMax + 1);
  powB = new Float64Array(jHi - jLo + 1);
  jMin = jLo;
  I = Int32Array.from(k.I);
  J = Int32Array.from(k.J);
  const n = (f: (c: number, i: number, j: number) => number) =>
    Float64Array.from(k.n, (c, m) => f(c, k.I[m], k.J[m]));
  nI = n((c, i) => c * i);
  nII = n((c, i) => c * i * (i - 1));
  nJ = n((c, _i, j) => c * j);
  nJJ = n((c, _i, j) => c * j * (j - 1));
  nIJ = n((c, i, j) => c * i * j);
}

function gibbs(pi: number, tau: number): void {
  const k = if97Region1Coefficients();
  if (powA.length === 0) sizeTables(k);
  const a = 7.1 - pi, b = tau - 1.222;
  const ia = 1 / a, ib = 1 / b;
  // b can be negative (τ < 1.222 ⇔ T > 1134 K, outside region 1): integer powers by products
  // keep the sign. powB[J − jMin] = b^J.
  // x^m = x^⌊m/2⌋ · x^⌈m/2⌉: about log₂ m roundings deep, close to Math.pow.
  powA[0] = 1;
  powA[1] = a;
  for (let m = 2; m < powA.length; m++) powA[m] = powA[m >> 1] * powA[m - (m >> 1)];
  const z = -jMin;
  powB[z] = 1;
  powB[z + 1] = b;
  for (let m = 2; z + m < powB.length; m++) {
    powB[z + m] = powB[z + (m >> 1)] * powB[z + m - (m >> 1)];
  }
  if (z >= 1) powB[z - 1] = ib;
  for (let m = 2; m <= z; m++) powB[z - m] = powB[z - (m >> 1)] * powB[z - m + (m >> 1)];
  // Sums of n·I^…·J^…·a^I·b^J; the 1/a and 1/b factors of the derivatives are applied after.
  let g = 0, gp = 0, gpp = 0, gt = 0, gtt = 0, gpt = 0;
  for (let i = 0; i < k.n.length; i++) {
    const ab = powA[I[i]] * powB[J[i] + z];
    g += k.n[i] * ab;
    gp += nI[i] * ab;
    gpp += nII[i] * ab;
    gt += nJ[i] * ab;
    gtt += nJJ[i] * ab;
    gpt += nIJ[i] * ab;
  }
  gp *= -ia;
  gpp *= ia * ia;
  gt *= ib;
  gtt *= ib * ib;
  gpt *= -ia * ib;
  G[0] = g;
  G[1] = gp;
  G[2] = gpp;
  G[3] = gt;
  G[4] = gtt;
  G[5] = gpt;
}

/**
 * Properties of liquid water at (T, p) from IAPWS-IF97 region 1: v = πγ_π RT/p,
 * h = RTτγ_τ, u = RT(τγ_τ − πγ_π), s = R(τγ_τ − γ), cp = −Rτ²γ_ττ,
 * cv = R(−τ²γ_ττ + (γ_π − τγ_πτ)²/γ_ππ),
 * w² = RTγ_π² / ((γ_π − τγ_πτ)²/(τ²γ_ττ) − γ_ππ), R = 461.526 J/(kg·K).
 *
 * Measured departure from IAPWS-95 (this project, tests/reference/water_if97.test.ts): the
 * sound speed at 101.325 kPa (saturation pressure above 100 °C) over 0–100 °C differs by at
 * most 0.19 % (2.9 m/s, IF97 high) near 61.5 °C. Use IAPWS-95 where sound speed matters.
 *
 * Validity: 273.15 K ≤ T ≤ 623.15 K, p_sat(T) ≤ p ≤ 100 MPa (OutOfRangeError outside the
 * T/p box unless extrapolating; NoPhysicalAnswerError below the saturation pressure).
 * Sources: iapws-r7-97 (boiling check: wagner-pruss-1993).
 *
 * @param T temperature, K (ITS-90)
 * @param p absolute pressure, Pa
 * @param options extrapolation opt-in and warning sink
 * @returns { v m³/kg, h J/kg, u J/kg, s J/(kg·K), cp J/(kg·K), cv J/(kg·K), w m/s }
 *
 * @example
 * ```ts
 * import { if97Region1 } from "./if97.ts";
 * const st = if97Region1(300, 3e6); // IAPWS R7-97 Table 5, first column
 * if (Math.abs(st.w - 1507.73921) > 1e-5) throw new Error(String(st.w));
 * ```
 */
export function if97Region1(T: number, p: number, options?: ValidityOptions): If97Region1State {
  checkRange("temperature", T, IF97_REGION1_RANGE.temperature, "K", IF97_NAME, options);
  checkRange("pressure", p, IF97_REGION1_RANGE.pressure, "Pa", IF97_NAME, options);
  assertLiquid(T, p);
  const k = if97Region1Coefficients();
  const pi = p / k.pstar, tau = k.Tstar / T;
  gibbs(pi, tau);
  const RT = k.R * T;
  const x = G[1] - tau * G[5];
  return {
    v: pi * G[1] * RT / p,
    h: RT * tau * G[3],
    u: RT * (tau * G[3] - pi * G[1]),
    s: k.R * (tau * G[3] - G[0]),
    cp: -k.R * tau * tau * G[4],
    cv: k.R * (-tau * tau * G[4] + x * x / G[2]),
    w: Math.sqrt(RT * G[1] * G[1] / (x * x / (tau * tau * G[4]) - G[2])),
  };
}

// The last call's state and results: the IAPWS-95 density solve starts from the IF97 density
// at the (T, p) whose IF97 sound speed a spread check then asks for; the same numbers are reused.
let lastT = NaN, lastP = NaN, lastW = NaN, lastRho = NaN;

/**
 * Speed of sound (m/s) and density (kg/m³) into OUT without checks or allocation. A call at
 * the (T, p) of the previous one writes the previous results again without evaluating.
 */
export function if97Region1Unchecked(T: number, p: number, out: Float64Array): void {
  if (T !== lastT || p !== lastP) {
    const k = if97Region1Coefficients();
    const pi = p / k.pstar, tau = k.Tstar / T;
    gibbs(pi, tau);
    const RT = k.R * T;
    const x = G[1] - tau * G[5];
    lastW = Math.sqrt(RT * G[1] * G[1] / (x * x / (tau * tau * G[4]) - G[2]));
    lastRho = p / (pi * G[1] * RT);
    lastT = T;
    lastP = p;
  }
  out[0] = lastW;
  out[1] = lastRho;
}
