/**
 * Coefficient sets of the water formulations, read once from the registry (data/water/*.yaml)
 * and packed into Float64Arrays on first use. Nothing here allocates after the first call.
 *
 * @module
 */
import { defaultRegistry } from "../registry/mod.ts";

/** IAPWS-95 coefficients, packed for evaluation (source iapws-r6-95). */
export interface Iapws95Coefficients {
  /** Critical temperature, K. */
  readonly Tc: number;
  /** Critical density, kg/m³. */
  readonly rhoc: number;
  /** Specific gas constant, J/(kg·K). */
  readonly R: number;
  /** Ideal part: n1, n2, n3 (ln τ). */
  readonly n1: number;
  readonly n2: number;
  readonly n3: number;
  /** Ideal part: Planck-Einstein terms n4..n8 and γ4..γ8. */
  readonly nExp: Float64Array;
  readonly gExp: Float64Array;
  /** Polynomial and exponential residual terms 1..51: n, d, t, c (c = 0 for terms 1..7). */
  readonly n: Float64Array;
  readonly d: Float64Array;
  readonly t: Float64Array;
  readonly c: Float64Array;
  /** Gaussian terms 52..54. */
  readonly gn: Float64Array;
  readonly gd: Float64Array;
  readonly gt: Float64Array;
  readonly ga: Float64Array;
  readonly gb: Float64Array;
  readonly gg: Float64Array;
  readonly ge: Float64Array;
  /** Non-analytic terms 55..56. */
  readonly nn: Float64Array;
  readonly na: Float64Array;
  readonly nb: Float64Array;
  readonly nA: Float64Array;
  readonly nB: Float64Array;
  readonly nC: Float64Array;
  readonly nD: Float64Array;
  readonly nBeta: Float64Array;
}

/** IAPWS-IF97 region-1 coefficients (source iapws-r7-97). */
export interface If97Region1Coefficients {
  readonly pstar: number;
  readonly Tstar: number;
  readonly R: number;
  readonly I: Float64Array;
  readonly J: Float64Array;
  readonly n: Float64Array;
}

/** IAPWS 2008 viscosity coefficients (source iapws-r12-08). */
export interface Viscosity2008Coefficients {
  readonly Tc: number;
  readonly rhoc: number;
  readonly mustar: number;
  readonly H0: Float64Array;
  readonly I: Float64Array;
  readonly J: Float64Array;
  readonly Hij: Float64Array;
}

/** Saturation-pressure auxiliary equation (source wagner-pruss-1993). */
export interface SaturationCoefficients {
  readonly Tc: number;
  readonly pc: number;
  readonly a: Float64Array;
  readonly e: Float64Array;
  /** Saturated-liquid density auxiliary equation: ρc, b_i and exponents k_i/3. */
  readonly rhoc: number;
  readonly rhoLb: Float64Array;
  readonly rhoLe: Float64Array;
}

/** Del Grosso–Mader, Marczak polynomial coefficients and the t68/t90 factor. */
export interface PolynomialCoefficients {
  readonly delGrossoMader: Float64Array;
  readonly marczak: Float64Array;
  readonly t68PerT90: number;
}

/** Registry ids of the coefficient sets, with the source ids they carry. */
export const WATER_COEFFICIENT_IDS = {
  iapws95: "water-iapws95",
  if97: "water-if97-region1",
  viscosity: "water-iapws2008-viscosity",
  saturation: "water-saturation-wagner-pruss-1993",
  delGrossoMader: "water-del-grosso-mader-1972",
  marczak: "water-marczak-1997",
  t68: "water-t68-from-t90",
} as const;

const f64 = (x: unknown): Float64Array => Float64Array.from(x as number[]);
// deno-lint-ignore no-explicit-any
const set = (id: string): any => defaultRegistry().coefficients(id);

let i95: Iapws95Coefficients | undefined;
let r1: If97Region1Coefficients | undefined;
let vis: Viscosity2008Coefficients | undefined;
let sat: SaturationCoefficients | undefined;
let poly: PolynomialCoefficients | undefined;

/** @returns the packed IAPWS-95 coefficients (loaded on first call) */
export function iapws95Coefficients(): Iapws95Coefficients {
  if (i95) return i95;
  const s = set(WATER_COEFFICIENT_IDS.iapws95);
  const k = s.coefficients;
  const n = [...k.nr1, ...k.nr2];
  const d = [...k.d1, ...k.d2];
  const t = [...k.t1, ...k.t2];
  const c = [...k.nr1.map(() => 0), ...k.c2];
  if (n.length !== 51 || k.nr3.length !== 3 || k.nr4.length !== 2) {
    throw new Error("IAPWS-95 coefficient set: expected 51 + 3 + 2 residual terms");
  }
  i95 = Object.freeze({
    Tc: s.constants.Tc,
    rhoc: s.constants.rhoc,
    R: s.constants.R,
    n1: k.ideal_n_pow[0],
    n2: k.ideal_n_pow[1],
    n3: k.ideal_n_log,
    nExp: f64(k.ideal_n_exp),
    gExp: f64(k.ideal_gamma),
    n: f64(n),
    d: f64(d),
    t: f64(t),
    c: f64(c),
    gn: f64(k.nr3),
    gd: f64(k.d3),
    gt: f64(k.t3),
    ga: f64(k.alfa3),
    gb: f64(k.beta3),
    gg: f64(k.gamma3),
    ge: f64(k.epsilon3),
    nn: f64(k.nr4),
    na: f64(k.a4),
    nb: f64(k.b4),
    nA: f64(k.A),
    nB: f64(k.B),
    nC: f64(k.C),
    nD: f64(k.D),
    nBeta: f64(k.beta4),
  });
  return i95;
}

/** @returns the packed IF97 region-1 coefficients (loaded on first call) */
export function if97Region1Coefficients(): If97Region1Coefficients {
  if (r1) return r1;
  const s = set(WATER_COEFFICIENT_IDS.if97);
  r1 = Object.freeze({
    pstar: s.constants.pstar,
    Tstar: s.constants.Tstar,
    R: s.constants.R,
    I: f64(s.coefficients.I),
    J: f64(s.coefficients.J),
    n: f64(s.coefficients.n),
  });
  return r1;
}

/** @returns the packed IAPWS 2008 viscosity coefficients (loaded on first call) */
export function viscosity2008Coefficients(): Viscosity2008Coefficients {
  if (vis) return vis;
  const s = set(WATER_COEFFICIENT_IDS.viscosity);
  vis = Object.freeze({
    Tc: s.constants.Tc,
    rhoc: s.constants.rhoc,
    mustar: s.constants.mustar,
    H0: f64(s.coefficients.H0),
    I: f64(s.coefficients.I),
    J: f64(s.coefficients.J),
    Hij: f64(s.coefficients.Hij),
  });
  return vis;
}

/** @returns the saturation-pressure coefficients (loaded on first call) */
export function saturationCoefficients(): SaturationCoefficients {
  if (sat) return sat;
  const s = set(WATER_COEFFICIENT_IDS.saturation);
  sat = Object.freeze({
    Tc: s.constants.Tc,
    pc: s.constants.pc,
    a: f64(s.coefficients.a),
    e: f64(s.coefficients.e),
    rhoc: s.constants.rhoc,
    rhoLb: f64(s.coefficients.rhoL_b),
    rhoLe: f64((s.coefficients.rhoL_k as number[]).map((x) => x / 3)),
  });
  return sat;
}

/** @returns the sound-speed polynomial coefficients (loaded on first call) */
export function polynomialCoefficients(): PolynomialCoefficients {
  if (poly) return poly;
  poly = Object.freeze({
    delGrossoMader: f64(set(WATER_COEFFICIENT_IDS.delGrossoMader).coefficients.k),
    marczak: f64(set(WATER_COEFFICIENT_IDS.marczak).coefficients.k),
    t68PerT90: set(WATER_COEFFICIENT_IDS.t68).coefficients.factor,
  });
  return poly;
}
