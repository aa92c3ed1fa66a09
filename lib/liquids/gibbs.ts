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
  wj: Int8Array;
  wk: Int8Array;
  wg: Float64Array;
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
  tables = {
    wj: Int8Array.from(w.map((r) => r[0])),
    wk: Int8Array.from(w.map((r) => r[1])),
    wg: Float64Array.from(w.map((r) => r[2])),
    si: Int8Array.from(s.map((r) => r[0])),
    sj: Int8Array.from(s.map((r) => r[1])),
    sk: Int8Array.from(s.map((r) => r[2])),
    sg: Float64Array.from(s.map((r) => r[3])),
    Su: sd.constants.Su as number,
  };
  return tables;
}

const TU = 40;
const PU = 1e8;
const powT = new Float64Array(9);
const powP = new Float64Array(8);
const powX = new Float64Array(9);
/** Accumulators: g, g_tau, g_pi, g_tautau, g_taupi, g_pipi (reduced variables). */
const acc = new Float64Array(6);

function addTerm(c: number, j: number, k: number): void {
  const tj = powT[j], pk = powP[k];
  acc[0] += c * tj * pk;
  if (j >= 1) acc[1] += c * j * powT[j - 1] * pk;
  if (k >= 1) acc[2] += c * k * tj * powP[k - 1];
  if (j >= 2) acc[3] += c * j * (j - 1) * powT[j - 2] * pk;
  if (j >= 1 && k >= 1) acc[4] += c * j * k * powT[j - 1] * powP[k - 1];
  if (k >= 2) acc[5] += c * k * (k - 1) * tj * powP[k - 2];
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
  const tau = (T - T0) / TU;
  const pi = (p - P0) / PU;
  powT[0] = 1;
  powP[0] = 1;
  for (let i = 1; i < powT.length; i++) powT[i] = powT[i - 1] * tau;
  for (let i = 1; i < powP.length; i++) powP[i] = powP[i - 1] * pi;
  acc.fill(0);
  for (let n = 0; n < t.wg.length; n++) addTerm(t.wg[n], t.wj[n], t.wk[n]);
  if (SA > 0) {
    const x = Math.sqrt(SA / t.Su);
    powX[0] = 1;
    for (let i = 1; i < powX.length; i++) powX[i] = powX[i - 1] * x;
    const lnx = Math.log(x);
    for (let n = 0; n < t.sg.length; n++) {
      const i = t.si[n];
      const c = t.sg[n] * (i === 1 ? powX[2] * lnx : powX[i]);
      addTerm(c, t.sj[n], t.sk[n]);
    }
  }
  out.g = acc[0];
  out.gT = acc[1] / TU;
  out.gP = acc[2] / PU;
  out.gTT = acc[3] / (TU * TU);
  out.gTP = acc[4] / (TU * PU);
  out.gPP = acc[5] / (PU * PU);
  return out;
}

const out: GibbsDerivatives = { g: 0, gT: 0, gP: 0, gTT: 0, gTP: 0, gPP: 0 };

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
  const eta = gibbsSeawater(SA, T, p).gT;
  let th = T;
  for (let n = 0; n < 30; n++) {
    const d = gibbsSeawater(SA, th, P0);
    const step = (d.gT - eta) / d.gTT;
    th -= step;
    if (Math.abs(step) < 1e-12) return th;
  }
  throw new NoPhysicalAnswerError(
    `potential temperature did not converge at S_A ${SA} kg/kg, T ${T} K, p ${p} Pa`,
  );
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
  const th = potentialTemperature(SA, T, p, options);
  const d = gibbsSeawater(SA, th, P0);
  return (d.g - th * d.gT) / CP0;
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
