/**
 * The Gibbs function of seawater of TEOS-10: the pure-water part of IAPWS SR7-09 plus the saline
 * part of IAPWS R13-08, with the derivatives needed for sound speed, potential temperature and
 * conservative temperature. Coefficients come from data/seawater/iapws09_water.yaml and
 * data/seawater/iapws08_saline.yaml.
 *
 * Units: absolute salinity S_A as a mass fraction (kg/kg), temperature in K, absolute pressure
 * in Pa; g in J/kg, g_T in J/(kg K), g_p in m³/kg.
 *
 * @module
 */
import { checkRange, NoPhysicalAnswerError, type ValidityOptions } from "../errors.ts";
import { defaultRegistry } from "../registry/mod.ts";

/** Standard atmosphere, Pa. */
export const P0 = 101325;
/** Celsius zero, K. */
export const T0 = 273.15;
/** TEOS-10 heat capacity that defines conservative temperature, J/(kg K) (IOC et al. 2010). */
export const CP0 = 3991.86795711963;

/** Derivatives of the Gibbs function at one state (SI units). */
export interface GibbsDerivatives {
  /** g, J/kg */
  g: number;
  /** ∂g/∂T, J/(kg K) (minus the specific entropy) */
  gT: number;
  /** ∂g/∂p, m³/kg (the specific volume) */
  gP: number;
  /** ∂²g/∂T², J/(kg K²) */
  gTT: number;
  /** ∂²g/∂T∂p, m³/(kg K) */
  gTP: number;
  /** ∂²g/∂p², m³/(kg Pa) */
  gPP: number;
}

interface GibbsTables {
  /** Highest power of τ and of π over both parts. */
  J: number;
  K: number;
  /** Pure-water coefficients on a dense (J+1)×(K+1) grid, row j, column k. */
  water: Float64Array;
  si: Int8Array;
  sj: Int8Array;
  sk: Int8Array;
  sg: Float64Array;
  Su: number;
}

let tables: GibbsTables | undefined;

function load(): GibbsTables {
  if (tables) return tables;
  const reg = defaultRegistry();
  const w = reg.coefficients("seawater-iapws09-water").coefficients.g as number[][];
  const sd = reg.coefficients("seawater-iapws08-saline");
  const s = sd.coefficients.g as number[][];
  const J = Math.max(...w.map((r) => r[0]), ...s.map((r) => r[1]));
  const K = Math.max(...w.map((r) => r[1]), ...s.map((r) => r[2]));
  const water = new Float64Array((J + 1) * (K + 1));
  for (const r of w) water[r[0] * (K + 1) + r[1]] += r[2];
  tables = {
    J,
    K,
    water,
    si: Int8Array.from(s.map((r) => r[0])),
    sj: Int8Array.from(s.map((r) => r[1])),
    sk: Int8Array.from(s.map((r) => r[2])),
    sg: Float64Array.from(s.map((r) => r[3])),
    Su: sd.constants.Su as number,
  };
  coef = new Float64Array(water.length);
  return tables;
}

const TU = 40;
const PU = 1e8;
const powX = new Float64Array(9);
/** Water plus saline coefficients at the salinity `coefSA`, on the dense (j, k) grid. */
let coef = new Float64Array(0);
let coefSA = Number.NaN;

/**
 * Collapse the salinity sum at S_A into the dense grid: g = Σ_jk C_jk τ^j π^k with
 * C_jk = g^W_jk + Σ_i g^S_ijk x^i (x² ln x for i = 1), x = sqrt(S_A/S_u). Kept until S_A changes.
 */
function collapse(t: GibbsTables, SA: number): Float64Array {
  if (SA === coefSA) return coef;
  coef.set(t.water);
  if (SA > 0) {
    const x = Math.sqrt(SA / t.Su);
    powX[0] = 1;
    for (let i = 1; i < powX.length; i++) powX[i] = powX[i - 1] * x;
    const x2lnx = powX[2] * Math.log(x);
    const W = t.K + 1;
    for (let n = 0; n < t.sg.length; n++) {
      const i = t.si[n];
      coef[t.sj[n] * W + t.sk[n]] += t.sg[n] * (i === 1 ? x2lnx : powX[i]);
    }
  }
  coefSA = SA;
  return coef;
}

/** Reduced g and its derivatives by nested Horner sums over the collapsed grid, into `out`. */
function evaluate(t: GibbsTables, c: Float64Array, tau: number, pi: number): void {
  const W = t.K + 1;
  // Outer Horner in τ over the rows' values q_j(π), q'_j(π), q''_j(π).
  let a0 = 0, a1 = 0, a2 = 0, b0 = 0, b1 = 0, c0 = 0;
  for (let j = t.J; j >= 0; j--) {
    let q = 0, q1 = 0, q2 = 0;
    for (let k = j * W + t.K; k >= j * W; k--) {
      q2 = q2 * pi + q1;
      q1 = q1 * pi + q;
      q = q * pi + c[k];
    }
    a2 = a2 * tau + a1;
    a1 = a1 * tau + a0;
    a0 = a0 * tau + q;
    b1 = b1 * tau + b0;
    b0 = b0 * tau + q1;
    c0 = c0 * tau + 2 * q2;
  }
  out.g = a0;
  out.gT = a1 / TU;
  out.gP = b0 / PU;
  out.gTT = 2 * a2 / (TU * TU);
  out.gTP = b1 / (TU * PU);
  out.gPP = c0 / (PU * PU);
}

/**
 * Evaluate the Gibbs function of seawater and its derivatives up to second order in T and p
 * (TEOS-10: IAPWS SR7-09 water part + IAPWS R13-08 saline part). The result object is reused
 * between calls: copy what you keep.
 *
 * Validity: as the two releases state, S_A 0–0.042 kg/kg, −6 to 40 °C, 0–100 MPa (the
 * oceanographic range); no check here, callers check.
 *
 * Sources: iapws-sr7-09, iapws-r13-08, ioc-teos10-2010.
 *
 * @param SA absolute salinity, kg/kg
 * @param T temperature, K (ITS-90)
 * @param p absolute pressure, Pa
 * @returns g and its derivatives in SI units (a shared object)
 *
 * @example
 * ```ts
 * import { gibbsSeawater } from "./gibbs.ts";
 * const d = gibbsSeawater(0.03516504, 273.15, 101325);
 * // TEOS-10 sets entropy and enthalpy of standard seawater at 0 °C, 1 atm to (nearly) zero:
 * if (Math.abs(d.gT) > 1e-5) throw new Error("entropy");
 * if (Math.abs(d.gP - 1 / 1028.1) > 1e-6) throw new Error("specific volume");
 * ```
 */
export function gibbsSeawater(SA: number, T: number, p: number): GibbsDerivatives {
  const t = load();
  evaluate(t, collapse(t, SA), (T - T0) / TU, (p - P0) / PU);
  return out;
}

const out: GibbsDerivatives = { g: 0, gT: 0, gP: 0, gTT: 0, gTP: 0, gPP: 0 };

/**
 * θ for potentialTemperature and conservativeTemperature, checks done. Newton's method on
 * g_T(S_A, θ, p0) = g_T(S_A, T, p) over the 101 325 Pa isobar of the collapsed polynomial (its
 * k = 0 column), started from the linear lapse-rate estimate θ₀ = T + (g_Tp/g_TT)(p − p0) at
 * (T, p). Works in the reduced τ = (θ − T0)/40 K.
 */
function theta(SA: number, T: number, p: number): number {
  const t = load();
  const c = collapse(t, SA);
  const W = t.K + 1, J = t.J, K = t.K;
  // Reduced g_τ, g_ττ, g_τπ at (T, p): rows j ≥ 1 summed in π (value, derivative), then τ.
  const tau0 = (T - T0) / TU, pi = (p - P0) / PU;
  let e0 = 0, e1 = 0, f0 = 0;
  for (let j = J; j > 0; j--) {
    let q = 0, q1 = 0;
    for (let k = j * W + K; k >= j * W; k--) {
      q1 = q1 * pi + q;
      q = q * pi + c[k];
    }
    e1 = e1 * tau0 + e0;
    e0 = e0 * tau0 + j * q;
    f0 = f0 * tau0 + j * q1;
  }
  const eta = e0; // ∂g/∂τ at (T, p)
  let th = T + (f0 * TU / (e1 * PU)) * (p - P0);
  for (let n = 0; n < 30; n++) {
    const tau = (th - T0) * (1 / TU);
    let a0 = 0, a1 = 0, a2 = 0;
    for (let j = J; j > 0; j--) {
      a2 = a2 * tau + a1;
      a1 = a1 * tau + a0;
      a0 = a0 * tau + j * c[j * W];
    }
    // On the isobar: a0 = ∂g/∂τ, a1 = ∂²g/∂τ², a2 = ½ ∂³g/∂τ³. Newton step in τ, and the
    // error left after it, |½ f''/f'| s² (quadratic convergence), as a stopping test.
    const s = (a0 - eta) / a1;
    th -= TU * s;
    if (Math.abs(s) < 1e-12 / TU || Math.abs(a2 / a1) * s * s < 1e-15 / TU) return th;
  }
  throw new NoPhysicalAnswerError(
    `potential temperature did not converge at S_A ${SA} kg/kg, T ${T} K, p ${p} Pa`,
  );
}

/** Potential enthalpy h0 = g − θ g_T at (S_A, θ, p0), J/kg, from the collapsed polynomial. */
function potentialEnthalpy(SA: number, th: number): number {
  const t = load();
  const c = collapse(t, SA);
  const W = t.K + 1;
  const tau = (th - T0) / TU;
  let a0 = 0, a1 = 0;
  for (let j = t.J * W; j >= 0; j -= W) {
    a1 = a1 * tau + a0;
    a0 = a0 * tau + c[j];
  }
  return a0 - th * a1 / TU;
}

const SA_RANGE: [number, number] = [0, 0.042];
const T_RANGE: [number, number] = [T0 - 6, T0 + 40];
const P_RANGE: [number, number] = [0, 100e6];
const NAME = "TEOS-10 Gibbs function (IAPWS-08 with SR7-09)";

function checkState(SA: number, T: number, p: number, options?: ValidityOptions): void {
  checkRange("absolute salinity", SA, SA_RANGE, "kg/kg", NAME, options);
  checkRange("temperature", T, T_RANGE, "K", NAME, options);
  checkRange("pressure", p, P_RANGE, "Pa", NAME, options);
}

/**
 * Potential temperature referenced to one standard atmosphere: the temperature θ at which
 * seawater brought adiabatically to 101 325 Pa has the entropy it has at (S_A, T, p); solves
 * g_T(S_A, θ, p0) = g_T(S_A, T, p) by Newton's method (TEOS-10 definition).
 *
 * Validity: S_A 0–0.042 kg/kg, −6 to 40 °C, 0–100 MPa (throws OutOfRangeError outside unless
 * extrapolate). Sources: ioc-teos10-2010, iapws-r13-08, iapws-sr7-09.
 *
 * @param SA absolute salinity, kg/kg
 * @param T in-situ temperature, K (ITS-90)
 * @param p absolute pressure, Pa
 * @param options extrapolation opt-in and warnings sink
 * @returns potential temperature, K
 *
 * @example
 * ```ts
 * import { potentialTemperature } from "./gibbs.ts";
 * const th = potentialTemperature(0.035, 283.15, 101325);
 * if (Math.abs(th - 283.15) > 1e-9) throw new Error("at p0 theta equals t");
 * ```
 */
export function potentialTemperature(
  SA: number,
  T: number,
  p: number,
  options?: ValidityOptions,
): number {
  checkState(SA, T, p, options);
  return theta(SA, T, p);
}

/**
 * Conservative temperature Θ from in-situ temperature (TEOS-10): Θ = h0(S_A, θ)/c_p0 with θ
 * the potential temperature at 101 325 Pa, h0 = g − T g_T the potential enthalpy and
 * c_p0 = 3991.86795711963 J/(kg K). Exact Gibbs-function route (not a fitted polynomial).
 *
 * Validity: S_A 0–0.042 kg/kg, −6 to 40 °C, 0–100 MPa. Sources: ioc-teos10-2010,
 * iapws-r13-08, iapws-sr7-09.
 *
 * @param SA absolute salinity, kg/kg
 * @param T in-situ temperature, K (ITS-90)
 * @param p absolute pressure, Pa
 * @param options extrapolation opt-in and warnings sink
 * @returns conservative temperature as a Celsius value, °C (TEOS-10 convention)
 *
 * @example
 * ```ts
 * import { conservativeTemperature } from "./gibbs.ts";
 * // Θ is (nearly) 0 for standard seawater at 0 °C and 1 atm (gsw gives -8.2e-8 °C):
 * if (Math.abs(conservativeTemperature(0.03516504, 273.15, 101325)) > 1e-6) throw new Error();
 * ```
 */
export function conservativeTemperature(
  SA: number,
  T: number,
  p: number,
  options?: ValidityOptions,
): number {
  checkState(SA, T, p, options);
  const th = theta(SA, T, p);
  return potentialEnthalpy(SA, th) / CP0;
}

/**
 * Sound speed of seawater from the full TEOS-10 Gibbs function:
 * c = g_p · sqrt(g_TT / (g_Tp² − g_TT g_pp)).
 *
 * Validity: S_A 0–0.042 kg/kg, −6 to 40 °C, 0–100 MPa (throws OutOfRangeError outside unless
 * extrapolate). Sources: ioc-teos10-2010, iapws-r13-08, iapws-sr7-09.
 *
 * @param SA absolute salinity, kg/kg
 * @param T in-situ temperature, K (ITS-90)
 * @param p absolute pressure, Pa
 * @param options extrapolation opt-in and warnings sink
 * @returns sound speed, m/s
 *
 * @example
 * ```ts
 * import { soundSpeedGibbs } from "./gibbs.ts";
 * const c = soundSpeedGibbs(0.03516504, 283.15, 101325);
 * if (Math.abs(c - 1490) > 2) throw new Error(String(c));
 * ```
 */
export function soundSpeedGibbs(
  SA: number,
  T: number,
  p: number,
  options?: ValidityOptions,
): number {
  checkState(SA, T, p, options);
  const d = gibbsSeawater(SA, T, p);
  const den = d.gTP * d.gTP - d.gTT * d.gPP;
  const c = d.gP * Math.sqrt(d.gTT / den);
  if (!Number.isFinite(c) || c <= 0) {
    throw new NoPhysicalAnswerError(`no sound speed at S_A ${SA} kg/kg, T ${T} K, p ${p} Pa`);
  }
  return c;
}

/**
 * Density of seawater from the full TEOS-10 Gibbs function: ρ = 1/g_p.
 *
 * Validity and sources as {@link soundSpeedGibbs}.
 *
 * @param SA absolute salinity, kg/kg
 * @param T in-situ temperature, K (ITS-90)
 * @param p absolute pressure, Pa
 * @param options extrapolation opt-in and warnings sink
 * @returns density, kg/m³
 *
 * @example
 * ```ts
 * import { densityGibbs } from "./gibbs.ts";
 * if (Math.abs(densityGibbs(0.03516504, 273.15, 101325) - 1028.1) > 0.1) throw new Error();
 * ```
 */
export function densityGibbs(
  SA: number,
  T: number,
  p: number,
  options?: ValidityOptions,
): number {
  checkState(SA, T, p, options);
  return 1 / gibbsSeawater(SA, T, p).gP;
}
