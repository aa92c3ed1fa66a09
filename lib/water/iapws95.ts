/**
 * IAPWS-95: the Helmholtz free-energy formulation for ordinary water (scientific use).
 *
 * φ(δ, τ) = φ⁰(δ, τ) + φʳ(δ, τ), δ = ρ/ρc, τ = Tc/T, with the ideal-gas part φ⁰ (eq. 5 of the
 * release) and the residual part φʳ (eq. 6: 7 polynomial, 44 exponential, 3 Gaussian and
 * 2 non-analytic terms). Properties follow from the derivatives (Table 3 of the release).
 * Sources: iapws-r6-95, wagner-pruss-2002; coefficients in data/water/iapws95.yaml.
 *
 * @module
 */
import { checkRange, NoPhysicalAnswerError, type ValidityOptions } from "../errors.ts";
import {
  type Iapws95Coefficients,
  iapws95Coefficients,
  saturationCoefficients,
} from "./coefficients.ts";
import { assertLiquid, saturationPressureUnchecked } from "./saturation.ts";
import { if97Region1Unchecked } from "./if97.ts";

/** Name used in messages and traces. */
export const IAPWS95_NAME = "IAPWS-95";

/** (T, ρ) validity of the formulation itself, K and kg/m³ (release: to 1273 K, 1000 MPa). */
export const IAPWS95_STATE_RANGE = {
  temperature: [273.15, 1273] as const,
  density: [1e-9, 1250] as const,
};

/** (T, p) validity of the liquid-region density solve: K and Pa. */
export const IAPWS95_LIQUID_RANGE = {
  temperature: [273.15, 647] as const,
  pressure: [0, 100e6] as const,
};

/** Derivatives of φ⁰ and φʳ: [φ, φ_δ, φ_δδ, φ_τ, φ_ττ, φ_δτ]. */
export interface HelmholtzDerivatives {
  /** Ideal-gas part φ⁰ and its derivatives. */
  readonly ideal: readonly [number, number, number, number, number, number];
  /** Residual part φʳ and its derivatives. */
  readonly residual: readonly [number, number, number, number, number, number];
}

/** Properties of a state from IAPWS-95, SI units. */
export interface Iapws95State {
  /** Pressure, Pa. */
  readonly p: number;
  /** Speed of sound, m/s. */
  readonly w: number;
  /** Isobaric heat capacity, J/(kg·K). */
  readonly cp: number;
  /** Isochoric heat capacity, J/(kg·K). */
  readonly cv: number;
  /** Specific enthalpy, J/kg. */
  readonly h: number;
  /** Specific entropy, J/(kg·K). */
  readonly s: number;
  /** Specific internal energy, J/kg. */
  readonly u: number;
}

// Scratch for residual derivatives: r, r_d, r_dd, r_t, r_tt, r_dt (module-level, reused).
const R = new Float64Array(6);
// Scratch for ideal derivatives: i, i_t, i_tt.
const I0 = new Float64Array(3);

// Integer-exponent tables for the 51 polynomial/exponential terms, built once from the
// coefficient set: δ^d from a power table (d ≤ 15), τ^t from a power table when t is an
// integer (≤ 50) and by exp(t·ln τ) otherwise, exp(−δ^c) once per distinct c.
interface Tables {
  readonly dI: Int32Array;
  readonly tI: Int32Array; // −1: fractional exponent
  readonly cI: Int32Array;
  readonly maxD: number;
  readonly maxT: number;
  readonly maxC: number;
  readonly dPow: Float64Array;
  readonly tPow: Float64Array;
  readonly eC: Float64Array; // exp(−δ^c) by c
  readonly dC: Float64Array; // δ^c by c
}
let TB: Tables | undefined;
function tables(k: Iapws95Coefficients): Tables {
  if (TB) return TB;
  const m = k.n.length;
  const dI = new Int32Array(m), tI = new Int32Array(m), cI = new Int32Array(m);
  let maxD = 0, maxT = 0, maxC = 0;
  for (let i = 0; i < m; i++) {
    dI[i] = k.d[i];
    cI[i] = k.c[i];
    tI[i] = Number.isInteger(k.t[i]) && k.t[i] >= 0 ? k.t[i] : -1;
    maxD = Math.max(maxD, dI[i]);
    maxT = Math.max(maxT, tI[i]);
    maxC = Math.max(maxC, cI[i]);
  }
  TB = {
    dI,
    tI,
    cI,
    maxD,
    maxT,
    maxC,
    dPow: new Float64Array(maxD + 1),
    tPow: new Float64Array(maxT + 1),
    eC: new Float64Array(maxC + 1),
    dC: new Float64Array(maxC + 1),
  };
  return TB;
}

/**
 * Gaussian and non-analytic terms whose exponential factor is below e^−50 (they carry
 * exp(−α(δ−ε)² − β(τ−γ)²) or ψ = exp(−C(δ−1)² − D(τ−1)²)) contribute less than 1e−18 to any
 * derivative used here, far below double-precision relevance; they are skipped. In the liquid
 * away from the critical point this is the usual case.
 */
const NEGLIGIBLE_EXPONENT = -50;

/** Residual part and all five derivatives at (δ, τ) into R. */
function residual(k: Iapws95Coefficients, delta: number, tau: number, all: boolean): void {
  const tb = tables(k);
  let r = 0, rd = 0, rdd = 0, rt = 0, rtt = 0, rdt = 0;
  const lnD = Math.log(delta), lnT = Math.log(tau);
  const inv2 = 1 / (delta * delta);
  const dPow = tb.dPow, tPow = tb.tPow, eC = tb.eC, dC = tb.dC;
  dPow[0] = 1;
  for (let j = 1; j <= tb.maxD; j++) dPow[j] = dPow[j - 1] * delta;
  tPow[0] = 1;
  for (let j = 1; j <= tb.maxT; j++) tPow[j] = tPow[j - 1] * tau;
  eC[0] = 1;
  dC[0] = 0; // c = 0 marks a polynomial term: no exp(−δ^c) factor and no δ^c in derivatives
  for (let j = 1; j <= tb.maxC; j++) {
    dC[j] = dPow[j];
    eC[j] = Math.exp(-dC[j]);
  }
  const n = k.n, t = k.t, dI = tb.dI, tI = tb.tI, cI = tb.cI;
  for (let i = 0; i < n.length; i++) {
    const ci = cI[i], di = dI[i], ti = t[i], tj = tI[i];
    const dc = dC[ci];
    const term = n[i] * dPow[di] * (tj >= 0 ? tPow[tj] : Math.exp(ti * lnT)) * eC[ci];
    const a = di - ci * dc; // δ·∂/∂δ factor
    r += term;
    rd += term * a;
    rdd += term * (a * (a - 1) - ci * ci * dc);
    if (all) {
      rt += term * ti;
      rtt += term * ti * (ti - 1);
      rdt += term * a * ti;
    }
  }
  // the sums above are δ·φ_δ, δ²·φ_δδ, τ·φ_τ, τ²·φ_ττ and δτ·φ_δτ: scale them
  rd /= delta;
  rdd *= inv2;
  if (all) {
    rt /= tau;
    rtt /= tau * tau;
    rdt /= delta * tau;
  }
  // Gaussian terms 52..54
  for (let i = 0; i < k.gn.length; i++) {
    const di = k.gd[i], ti = k.gt[i];
    const de = delta - k.ge[i], tg = tau - k.gg[i];
    const ex = -k.ga[i] * de * de - k.gb[i] * tg * tg;
    if (ex < NEGLIGIBLE_EXPONENT) continue;
    const term = k.gn[i] * Math.exp(di * lnD + ti * lnT + ex);
    const fd = di / delta - 2 * k.ga[i] * de;
    const ft = ti / tau - 2 * k.gb[i] * tg;
    r += term;
    rd += term * fd;
    rdd += term * (fd * fd - di * inv2 - 2 * k.ga[i]);
    if (all) {
      rt += term * ft;
      rtt += term * (ft * ft - ti / (tau * tau) - 2 * k.gb[i]);
      rdt += term * fd * ft;
    }
  }
  // Non-analytic terms 55..56
  let dm1 = delta - 1;
  if (Math.abs(dm1) < 1e-12) dm1 = dm1 < 0 ? -1e-12 : 1e-12;
  const dm1sq = dm1 * dm1;
  const tm1 = tau - 1;
  for (let i = 0; i < k.nn.length; i++) {
    const ai = k.na[i], bi = k.nb[i], A = k.nA[i], B = k.nB[i], C = k.nC[i], D = k.nD[i];
    const beta = k.nBeta[i], ni = k.nn[i];
    const ex = -C * dm1sq - D * tm1 * tm1;
    if (ex < NEGLIGIBLE_EXPONENT) continue;
    const q = Math.pow(dm1sq, 1 / (2 * beta) - 1); // ((δ−1)²)^(1/(2β)−1)
    const theta = (1 - tau) + A * q * dm1sq;
    const qa = Math.pow(dm1sq, ai - 1);
    const Delta = theta * theta + B * qa * dm1sq;
    const psi = Math.exp(ex);
    const dDelta = dm1 * (A * theta * (2 / beta) * q + 2 * B * ai * qa);
    const dDeltaD2 = dDelta / dm1 + dm1sq * (
          4 * B * ai * (ai - 1) * Math.pow(dm1sq, ai - 2) +
          2 * A * A * (1 / (beta * beta)) * q * q +
          A * theta * (4 / beta) * (1 / (2 * beta) - 1) * Math.pow(dm1sq, 1 / (2 * beta) - 2)
        );
    const Db = Math.pow(Delta, bi);
    const Db1 = Math.pow(Delta, bi - 1);
    const Db2 = Math.pow(Delta, bi - 2);
    const dDb = bi * Db1 * dDelta;
    const dDbD2 = bi * (Db1 * dDeltaD2 + (bi - 1) * Db2 * dDelta * dDelta);
    const psiD = -2 * C * dm1 * psi;
    const psiDD = (2 * C * dm1sq - 1) * 2 * C * psi;
    r += ni * Db * delta * psi;
    rd += ni * (Db * (psi + delta * psiD) + dDb * delta * psi);
    rdd += ni * (Db * (2 * psiD + delta * psiDD) + 2 * dDb * (psi + delta * psiD) +
      dDbD2 * delta * psi);
    if (all) {
      const dDbT = -2 * theta * bi * Db1;
      const dDbTT = 2 * bi * Db1 + 4 * theta * theta * bi * (bi - 1) * Db2;
      const dDbDT = -A * bi * (2 / beta) * Db1 * dm1 * q -
        2 * theta * bi * (bi - 1) * Db2 * dDelta;
      const psiT = -2 * D * tm1 * psi;
      const psiTT = (2 * D * tm1 * tm1 - 1) * 2 * D * psi;
      const psiDT = 4 * C * D * dm1 * tm1 * psi;
      rt += ni * delta * (dDbT * psi + Db * psiT);
      rtt += ni * delta * (dDbTT * psi + 2 * dDbT * psiT + Db * psiTT);
      rdt += ni * (Db * (psiT + delta * psiDT) + delta * dDb * psiT +
        dDbT * (psi + delta * psiD) + dDbDT * delta * psi);
    }
  }
  R[0] = r;
  R[1] = rd;
  R[2] = rdd;
  R[3] = rt;
  R[4] = rtt;
  R[5] = rdt;
}

/** Ideal-gas part φ⁰ (without ln δ) and its τ-derivatives into I0. */
function ideal(k: Iapws95Coefficients, tau: number): void {
  let f = k.n1 + k.n2 * tau + k.n3 * Math.log(tau);
  let ft = k.n2 + k.n3 / tau;
  let ftt = -k.n3 / (tau * tau);
  for (let i = 0; i < k.nExp.length; i++) {
    const g = k.gExp[i], e = Math.exp(-g * tau), om = 1 - e;
    f += k.nExp[i] * Math.log(om);
    ft += k.nExp[i] * g * (1 / om - 1);
    ftt -= k.nExp[i] * g * g * e / (om * om);
  }
  I0[0] = f;
  I0[1] = ft;
  I0[2] = ftt;
}

/**
 * The IAPWS-95 dimensionless Helmholtz free energy and its derivatives (ideal part φ⁰ of eq. 5,
 * residual part φʳ of eq. 6, derivatives as in Tables 4 and 5 of the release), for checking
 * against Table 6 of the release.
 *
 * Validity: 273.15–1273 K, densities up to 1250 kg/m³ (the formulation's range).
 * Sources: iapws-r6-95, wagner-pruss-2002.
 *
 * @param T temperature, K
 * @param rho density, kg/m³
 * @returns φ⁰ and φʳ with derivatives [φ, φ_δ, φ_δδ, φ_τ, φ_ττ, φ_δτ]
 *
 * @example
 * ```ts
 * import { iapws95Helmholtz } from "./iapws95.ts";
 * const h = iapws95Helmholtz(500, 838.025);
 * if (Math.abs(h.residual[0] + 3.42693206) > 1e-8) throw new Error("phir");
 * ```
 */
export function iapws95Helmholtz(T: number, rho: number): HelmholtzDerivatives {
  const k = iapws95Coefficients();
  const delta = rho / k.rhoc, tau = k.Tc / T;
  residual(k, delta, tau, true);
  ideal(k, tau);
  return {
    ideal: [Math.log(delta) + I0[0], 1 / delta, -1 / (delta * delta), I0[1], I0[2], 0],
    residual: [R[0], R[1], R[2], R[3], R[4], R[5]],
  };
}

function checkState(T: number, rho: number, options?: ValidityOptions): void {
  checkRange("temperature", T, IAPWS95_STATE_RANGE.temperature, "K", IAPWS95_NAME, options);
  checkRange("density", rho, IAPWS95_STATE_RANGE.density, "kg/m^3", IAPWS95_NAME, options);
  if (!(rho > 0) || !(T > 0)) {
    throw new NoPhysicalAnswerError(
      `IAPWS-95 needs a positive temperature and density (got ${T} K, ${rho} kg/m^3)`,
    );
  }
}

/**
 * Thermodynamic properties at (T, ρ) from IAPWS-95 (Table 3 of the release):
 * p = ρRT(1 + δφʳ_δ); s/R = τ(φ⁰_τ + φʳ_τ) − φ⁰ − φʳ; u/(RT) = τ(φ⁰_τ + φʳ_τ);
 * h/(RT) = 1 + τ(φ⁰_τ + φʳ_τ) + δφʳ_δ; cv/R = −τ²(φ⁰_ττ + φʳ_ττ);
 * cp/R = cv/R + (1 + δφʳ_δ − δτφʳ_δτ)²/(1 + 2δφʳ_δ + δ²φʳ_δδ);
 * w²/(RT) = 1 + 2δφʳ_δ + δ²φʳ_δδ − (1 + δφʳ_δ − δτφʳ_δτ)²/(τ²(φ⁰_ττ + φʳ_ττ)).
 * Works in every single-phase region (liquid, vapour, supercritical); this function does not
 * decide the phase.
 *
 * Validity: 273.15–1273 K, 0–1250 kg/m³ (OutOfRangeError outside unless extrapolating).
 * Sources: iapws-r6-95, wagner-pruss-2002.
 *
 * @param T temperature, K (ITS-90)
 * @param rho density, kg/m³
 * @param options extrapolation opt-in and warning sink
 * @returns { p Pa, w m/s, cp J/(kg·K), cv J/(kg·K), h J/kg, s J/(kg·K), u J/kg }
 *
 * @example
 * ```ts
 * import { iapws95State } from "./iapws95.ts";
 * const st = iapws95State(300, 996.556); // IAPWS R6-95 Table 7, first row
 * if (Math.abs(st.w - 1501.51914) > 1e-5) throw new Error(String(st.w));
 * ```
 */
export function iapws95State(T: number, rho: number, options?: ValidityOptions): Iapws95State {
  checkState(T, rho, options);
  const k = iapws95Coefficients();
  const delta = rho / k.rhoc, tau = k.Tc / T;
  residual(k, delta, tau, true);
  ideal(k, tau);
  const RT = k.R * T;
  const a = 1 + delta * R[1] - delta * tau * R[5];
  const b = 1 + 2 * delta * R[1] + delta * delta * R[2];
  const cvR = -tau * tau * (I0[2] + R[4]);
  const tauPhiT = tau * (I0[1] + R[3]);
  const w2 = RT * (b + a * a / cvR);
  const out: Iapws95State = {
    p: rho * RT * (1 + delta * R[1]),
    w: Math.sqrt(w2),
    cp: k.R * (cvR + a * a / b),
    cv: k.R * cvR,
    h: RT * (1 + tauPhiT + delta * R[1]),
    s: k.R * (tauPhiT - Math.log(delta) - I0[0] - R[0]),
    u: RT * tauPhiT,
  };
  if (!Number.isFinite(out.w) || !(w2 > 0) || !Number.isFinite(out.cp)) {
    throw new NoPhysicalAnswerError(
      `IAPWS-95 has no stable single-phase state at ${T} K, ${rho} kg/m^3 (inside the two-phase dome)`,
    );
  }
  return out;
}

/** Speed of sound at (T, ρ), m/s, no checks, no allocation. */
export function iapws95SoundSpeedUnchecked(T: number, rho: number): number {
  const k = iapws95Coefficients();
  const delta = rho / k.rhoc, tau = k.Tc / T;
  residual(k, delta, tau, true);
  ideal(k, tau);
  const a = 1 + delta * R[1] - delta * tau * R[5];
  const b = 1 + 2 * delta * R[1] + delta * delta * R[2];
  const cvR = -tau * tau * (I0[2] + R[4]);
  return Math.sqrt(k.R * T * (b + a * a / cvR));
}

/** Pressure (Pa) and dp/dρ (Pa·m³/kg) at (T, ρ) into P2, residual δ-derivatives only. */
const P2 = new Float64Array(2);
function pressureAndSlope(k: Iapws95Coefficients, T: number, rho: number): void {
  const delta = rho / k.rhoc;
  residual(k, delta, k.Tc / T, false);
  const RT = k.R * T;
  P2[0] = rho * RT * (1 + delta * R[1]);
  P2[1] = RT * (1 + 2 * delta * R[1] + delta * delta * R[2]);
}

/**
 * Saturated-liquid density from the auxiliary equation of Wagner & Pruß (1993),
 * ρ'/ρc = 1 + Σ b_i θ^(k_i/3), θ = 1 − T/Tc: only the starting bracket of the solve (~0.1 %).
 */
function saturatedLiquidDensityGuess(T: number): number {
  const c = saturationCoefficients();
  const theta = Math.max(1 - T / c.Tc, 0);
  let s = 1;
  for (let i = 0; i < c.rhoLb.length; i++) s += c.rhoLb[i] * Math.pow(theta, c.rhoLe[i]);
  return c.rhoc * s;
}

const GUESS = new Float64Array(2);

// The last solve's state and root: sound speed, density and viscosity of one state each solve
// the same (T, p) in a row, and the solve is deterministic, so the root is reused as it is.
let lastT = NaN, lastP = NaN, lastRho = NaN;

/**
 * Liquid density at (T, p) without range or phase checks. Fast path: Newton iteration on
 * p(T, ρ) − p = 0 from the IF97 region-1 density (within ~1e-5 of the answer, so two or three
 * steps reach 1e-13); if that start is unavailable or a step misbehaves, a bracketed Newton
 * solve from the saturated-liquid side with a bisection fallback. Throws NoPhysicalAnswerError
 * if no liquid root is found. A call at the (T, p) of the previous successful one returns its
 * root without solving again (the same number).
 */
export function iapws95DensityUnchecked(T: number, p: number): number {
  if (T === lastT && p === lastP) return lastRho;
  const rho = densitySolve(T, p);
  lastT = T;
  lastP = p;
  lastRho = rho;
  return rho;
}

function densitySolve(T: number, p: number): number {
  const k = iapws95Coefficients();
  if (T >= 273.15 && T <= 623.15 && p > 0 && p <= 100e6) {
    if97Region1Unchecked(T, p, GUESS);
    let rho = GUESS[1];
    for (let it = 0; it < 8 && rho > 0; it++) {
      pressureAndSlope(k, T, rho);
      if (!(P2[1] > 0)) break;
      const step = (P2[0] - p) / P2[1];
      rho -= step;
      if (Math.abs(step) <= 1e-13 * rho) return rho;
    }
  }
  return densityBracketed(k, T, p);
}

function densityBracketed(k: Iapws95Coefficients, T: number, p: number): number {
  // Bracket: lo on the liquid side of saturation (p(lo) < p), hi compressed (p(hi) > p).
  let lo = saturatedLiquidDensityGuess(T) * 0.995;
  let hi = 1400;
  pressureAndSlope(k, T, lo);
  for (let j = 0; j < 30 && P2[0] > p && P2[1] > 0; j++) {
    lo *= 0.99;
    pressureAndSlope(k, T, lo);
  }
  // Start from the tangent at lo: for the convex liquid isotherm it lands just above the root.
  let rho = lo + (p - P2[0]) / P2[1];
  if (!(rho > lo && rho < hi)) rho = 0.5 * (lo + hi);
  for (let it = 0; it < 200; it++) {
    pressureAndSlope(k, T, rho);
    const f = P2[0] - p;
    if (f > 0) hi = rho;
    else lo = rho;
    let next = rho - f / P2[1];
    if (!(P2[1] > 0) || !(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - rho) <= 1e-13 * rho) return next;
    rho = next;
    if (hi - lo <= 1e-13 * rho) return rho;
  }
  throw new NoPhysicalAnswerError(`IAPWS-95: no liquid density found at ${T} K, ${p} Pa`);
}

/**
 * Liquid-water density at (T, p) from IAPWS-95, by a safeguarded Newton solve of
 * p = ρRT(1 + δφʳ_δ) on the liquid branch (bracketed from the saturated-liquid side, with a
 * bisection fallback; converged to about 1e-13 relative).
 *
 * Validity: liquid region, 273.15 K ≤ T ≤ 647 K, p_sat(T) ≤ p ≤ 100 MPa. Outside the T/p range
 * OutOfRangeError (unless extrapolating); below the saturation pressure NoPhysicalAnswerError
 * ("water boils at this pressure: …").
 * Sources: iapws-r6-95, wagner-pruss-2002 (boiling check: wagner-pruss-1993).
 *
 * @param T temperature, K (ITS-90)
 * @param p absolute pressure, Pa
 * @param options extrapolation opt-in and warning sink
 * @returns density, kg/m³
 *
 * @example
 * ```ts
 * import { iapws95Density } from "./iapws95.ts";
 * const rho = iapws95Density(293.15, 101325);
 * if (Math.abs(rho - 998.2) > 0.05) throw new Error(String(rho));
 * ```
 */
export function iapws95Density(T: number, p: number, options?: ValidityOptions): number {
  checkRange("temperature", T, IAPWS95_LIQUID_RANGE.temperature, "K", IAPWS95_NAME, options);
  checkRange("pressure", p, IAPWS95_LIQUID_RANGE.pressure, "Pa", IAPWS95_NAME, options);
  assertLiquid(T, p);
  return iapws95DensityUnchecked(T, p);
}

/** Re-exported for the boiling message of callers that solved density themselves. */
export { saturationPressureUnchecked };
