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
import {
  checkRange,
  NoPhysicalAnswerError,
  RegistryError,
  type ValidityOptions,
} from "../errors.ts";
import { defaultRegistry } from "../registry/mod.ts";
import { lit, polyExpr, powers } from "./codegen.ts";

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
  /** Highest power of π with a non-zero term, per row j (the grid is zero beyond it). */
  kmax: Int8Array;
  /** First cell of row j in the per-cell layout below (cells (j, 0..kmax_j), row by row). */
  rowStart: Int16Array;
  /** Per cell: the pure-water coefficient. */
  cellW: Float64Array;
  /** Per cell: its saline coefficients g_ijk in cellG[cellOff[c] .. cellOff[c+1]), from the
   * highest i down to i = 2 (zeros fill gaps), for c_jk(x) = w_jk + x² Σ g_ijk x^(i−2). */
  cellOff: Int16Array;
  cellG: Float64Array;
  /** Coefficient of x² ln x per row j (the i = 1 terms, all at k = 0). */
  lnRow: Float64Array;
}

let tables: GibbsTables | undefined;
const DATA_FILE = "data/seawater/iapws08_saline.yaml";
const DATA_ID = "seawater-iapws08-saline";
const WHERE = { file: DATA_FILE, entry: DATA_ID };

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
  // Per-cell layout for evaluating without collapsing (salinity changing at every point).
  const kmax = new Int8Array(J + 1);
  for (const r of w) kmax[r[0]] = Math.max(kmax[r[0]], r[1]);
  for (const r of s) kmax[r[1]] = Math.max(kmax[r[1]], r[2]);
  const rowStart = new Int16Array(J + 2);
  for (let j = 0; j <= J; j++) rowStart[j + 1] = rowStart[j] + kmax[j] + 1;
  const cells = rowStart[J + 1];
  const cellW = new Float64Array(cells);
  const lnRow = new Float64Array(J + 1);
  const imax = new Int8Array(cells).fill(1);
  for (const r of w) cellW[rowStart[r[0]] + r[1]] += r[2];
  for (const r of s) {
    if (r[0] === 1) {
      if (r[2] !== 0) {
        throw new RegistryError(DATA_FILE, DATA_ID, "coefficients.g", "x² ln x rows need k = 0");
      }
      lnRow[r[1]] += r[3];
    } else {
      const c = rowStart[r[1]] + r[2];
      imax[c] = Math.max(imax[c], r[0]);
    }
  }
  const cellOff = new Int16Array(cells + 1);
  for (let c = 0; c < cells; c++) cellOff[c + 1] = cellOff[c] + imax[c] - 1;
  const cellG = new Float64Array(cellOff[cells]);
  for (const r of s) {
    if (r[0] === 1) continue;
    const c = rowStart[r[1]] + r[2];
    cellG[cellOff[c] + imax[c] - r[0]] += r[3];
  }
  tables = {
    J,
    K,
    water,
    si: Int8Array.from(s.map((r) => r[0])),
    sj: Int8Array.from(s.map((r) => r[1])),
    sk: Int8Array.from(s.map((r) => r[2])),
    sg: Float64Array.from(s.map((r) => r[3])),
    Su: sd.constants.Su as number,
    kmax,
    rowStart,
    cellW,
    cellOff,
    cellG,
    lnRow,
  };
  coef = new Float64Array(water.length);
  gridCol = new Float64Array(J + 1);
  pointCol = new Float64Array(J + 1);
  entropyGrid = buildPass(tables, true, false);
  entropyDirect = buildPass(tables, false, false);
  gibbsGrid = buildPass(tables, true, true);
  gibbsDirect = buildPass(tables, false, true);
  isobar = buildIsobar(J);
  return tables;
}

/** (c, x, x2, x2lnx, tau, pi, col, o) => void: a generated pass of buildPass(). */
type GibbsPass = (
  c: Float64Array,
  x: number,
  x2: number,
  x2lnx: number,
  tau: number,
  pi: number,
  col: Float64Array,
  o: Float64Array,
) => void;

/**
 * Generate, from the coefficient layout, straight-line code for sums over the cells c_jk at
 * (τ, π): rows j as polynomials in π (value and π-derivatives), then polynomials in τ (Estrin's
 * scheme throughout, see polyExpr). With `grid` the cells are read from the collapsed grid `c`;
 * otherwise each cell's salinity polynomial c_jk(x) = w_jk + x² Σ g_ijk x^(i−2) (+ the x² ln x
 * term at k = 0) is summed in place and the k = 0 cells, the 101 325 Pa isobar, are stored in
 * `col`. `full` false: the reduced g_τ into o[0] (rows j ≥ 1, for theta());
 * `full` true: g, g_τ, g_ττ, g_π, g_τπ, g_ππ into o[0..5]. Generated once per process: the same
 * sums as loops over the layout, without the loop overhead and the long dependency chains of
 * Horner's scheme, which dominate these short sums.
 */
function buildPass(t: GibbsTables, grid: boolean, full: boolean): GibbsPass {
  const W = t.K + 1;
  const lines: string[] = [powers("x"), powers("pi"), powers("tau")];
  const cell = (j: number, k: number): string => {
    if (grid) return `c[${j * W + k}]`;
    const c = t.rowStart[j] + k;
    const g: string[] = [];
    for (let n = t.cellOff[c]; n < t.cellOff[c + 1]; n++) g.push(lit(t.cellG[n]));
    let e = lit(t.cellW[c]);
    if (g.length) e += ` + x2 * (${polyExpr(g, "x", WHERE)})`;
    if (k === 0 && t.lnRow[j] !== 0) e += ` + ${lit(t.lnRow[j])} * x2lnx`;
    return e;
  };
  // Per output: the τ-derivative order m and which π-sum of the rows (q value, d first, e
  // second π-derivative) it takes.
  const outs: [number, string][] = full
    ? [[0, "q"], [1, "q"], [2, "q"], [0, "d"], [1, "d"], [0, "e"]]
    : [[1, "q"]];
  const terms: string[][] = outs.map(() => []);
  const jLow = full ? 0 : 1;
  for (let j = t.J; j >= jLow; j--) {
    const cs: string[] = [], ds: string[] = [], es: string[] = [];
    for (let k = t.kmax[j]; k >= 0; k--) {
      lines.push(`const c${j}_${k} = ${cell(j, k)};`);
      cs.push(`c${j}_${k}`);
      if (k > 0) ds.push(`${k} * c${j}_${k}`);
      if (k > 1) es.push(`${k * (k - 1)} * c${j}_${k}`);
    }
    if (!grid) lines.push(`col[${j}] = c${j}_0;`);
    lines.push(`const q${j} = ${polyExpr(cs, "pi", WHERE)};`);
    if (outs.some(([, r]) => r === "d")) {
      lines.push(`const d${j} = ${ds.length ? polyExpr(ds, "pi", WHERE) : "0"};`);
    }
    if (outs.some(([, r]) => r === "e")) {
      lines.push(`const e${j} = ${es.length ? polyExpr(es, "pi", WHERE) : "0"};`);
    }
    outs.forEach(([m, r], n) => {
      if (j < m) return;
      let f = 1;
      for (let i = 0; i < m; i++) f *= j - i;
      terms[n].push(f === 1 ? `${r}${j}` : `${f} * ${r}${j}`);
    });
  }
  if (!grid && jLow > 0) lines.push(`col[0] = ${cell(0, 0)};`);
  terms.forEach((ts, n) =>
    lines.push(`o[${n}] = ${ts.length ? polyExpr(ts, "tau", WHERE) : "0"};`)
  );
  return new Function(
    "c",
    "x",
    "x2",
    "x2lnx",
    "tau",
    "pi",
    "col",
    "o",
    lines.join("\n"),
  ) as GibbsPass;
}

/** (col, tau, o) => void: the generated isobar polynomial of theta() and potentialEnthalpy(). */
type Isobar = (col: Float64Array, tau: number, o: Float64Array) => void;

/**
 * Generate straight-line code for the isobar polynomial g(τ) = Σ_j col[j] τ^j: o[0], o[1], o[2],
 * o[3], o[5] = the m-th τ-derivative divided by (m−1)! for m = 1, 2, 3, 4, 5 (g_τ, g_ττ,
 * ½ g_τττ, ⅙ g_ττττ, g_τττττ/24; the coefficient of col[j] τ^(j−m) is m·C(j, m)) and o[4] = g;
 * each its own sum, so the six run side by side.
 */
function buildIsobar(J: number): Isobar {
  const lines: string[] = [powers("tau")];
  [1, 2, 3, 4, 0, 5].forEach((m, d) => {
    const terms: string[] = [];
    for (let j = J; j >= m; j--) {
      let binom = 1;
      for (let n = 1; n <= m; n++) binom = binom * (j - m + n) / n;
      const mult = m === 0 ? 1 : m * binom;
      terms.push(mult === 1 ? `col[${j}]` : `${mult} * col[${j}]`);
    }
    lines.push(`o[${d}] = ${terms.length ? polyExpr(terms, "tau", WHERE) : "0"};`);
  });
  return new Function("col", "tau", "o", lines.join("\n")) as Isobar;
}

let isobar: Isobar | undefined;
let entropyGrid: GibbsPass | undefined;
let entropyDirect: GibbsPass | undefined;
let gibbsGrid: GibbsPass | undefined;
let gibbsDirect: GibbsPass | undefined;
const fo = new Float64Array(6);
const eo = new Float64Array(6);

const TU = 40;
const PU = 1e8;
const powX = new Float64Array(9);
/** Water plus saline coefficients at the salinity state[COEF_SA], on the dense (j, k) grid. */
let coef = new Float64Array(0);
/** The k = 0 column (the 101 325 Pa isobar) of the collapsed grid, and of the current point. */
let gridCol: Float64Array = new Float64Array(0);
let pointCol: Float64Array = new Float64Array(0);
/**
 * Numbers that change from call to call, kept in a typed array (a module-level `let` number
 * would be boxed on every write): the grid's salinity, the previous call's salinity (a grid is
 * collapsed only when a salinity repeats), x = sqrt(S_A/S_u), x² and x² ln x at the current
 * point, and the τ of theta()'s last isobar evaluation.
 */
const state = Float64Array.of(Number.NaN, Number.NaN, 0, 0, 0, 0);
const COEF_SA = 0, LAST_SA = 1, PX = 2, PX2 = 3, PX2LNX = 4, ISO_TAU = 5;

/** Set x, x² and x² ln x of S_A in `state`. */
function saltPowers(t: GibbsTables, SA: number): void {
  if (SA > 0) {
    const x = Math.sqrt(SA / t.Su);
    state[PX] = x;
    state[PX2] = x * x;
    state[PX2LNX] = x * x * Math.log(x);
  } else {
    state[PX] = 0;
    state[PX2] = 0;
    state[PX2LNX] = 0;
  }
}

/**
 * True when the collapsed grid is (now) the one for S_A: the grid is kept while S_A stays the
 * same and collapsed again when a new S_A comes twice in a row; a salinity that changes at every
 * point is summed cell by cell in the generated direct passes instead, which costs less than a
 * collapse and only a little more than reading the grid.
 */
function useGrid(t: GibbsTables, SA: number): boolean {
  if (SA === state[COEF_SA]) return true;
  const repeat = SA === state[LAST_SA];
  state[LAST_SA] = SA;
  if (!repeat) return false;
  collapse(t, SA);
  return true;
}

/**
 * Collapse the salinity sum at S_A into the dense grid: g = Σ_jk C_jk τ^j π^k with
 * C_jk = g^W_jk + Σ_i g^S_ijk x^i (x² ln x for i = 1), x = sqrt(S_A/S_u). Kept until S_A changes.
 */
function collapse(t: GibbsTables, SA: number): Float64Array {
  if (SA === state[COEF_SA]) return coef;
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
  state[COEF_SA] = SA;
  for (let j = 0; j <= t.J; j++) gridCol[j] = coef[j * (t.K + 1)];
  return coef;
}

/** Reduced g and its derivatives into `out`, from the generated full pass (grid or direct). */
function evaluate(grid: boolean, tau: number, pi: number): void {
  if (grid) gibbsGrid!(coef, 0, 0, 0, tau, pi, gridCol, fo);
  else gibbsDirect!(coef, state[PX], state[PX2], state[PX2LNX], tau, pi, pointCol, fo);
  out.g = fo[0];
  out.gT = fo[1] / TU;
  out.gP = fo[3] / PU;
  out.gTT = fo[2] / (TU * TU);
  out.gTP = fo[4] / (TU * PU);
  out.gPP = fo[5] / (PU * PU);
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
  const grid = useGrid(t, SA);
  if (!grid) saltPowers(t, SA);
  evaluate(grid, (T - T0) / TU, (p - P0) / PU);
  return out;
}

const out: GibbsDerivatives = { g: 0, gT: 0, gP: 0, gTT: 0, gTP: 0, gPP: 0 };

/**
 * θ for potentialTemperature and conservativeTemperature, checks done. Solves
 * g_T(S_A, θ, p0) = g_T(S_A, T, p) on the 101 325 Pa isobar of the polynomial (its k = 0
 * column): a start from the reversed Taylor series of the isobar's g_T about T, then Newton's
 * method (normally one step). The isobar's values and derivatives at the last evaluation stay in
 * `eo` for potentialEnthalpy. Works in the reduced τ = (θ − T0)/40 K.
 */
function theta(SA: number, T: number, p: number): number {
  const t = load();
  // Reduced g_τ at (T, p).
  const tau0 = (T - T0) / TU, pi = (p - P0) / PU;
  let col: Float64Array;
  if (useGrid(t, SA)) {
    col = gridCol;
    entropyGrid!(coef, 0, 0, 0, tau0, pi, col, eo);
  } else {
    saltPowers(t, SA);
    col = pointCol;
    entropyDirect!(coef, state[PX], state[PX2], state[PX2LNX], tau0, pi, col, eo);
  }
  const eta = eo[0]; // ∂g/∂τ at (T, p)
  // f(τ) = ∂g/∂τ − η on the isobar; an isobar evaluation leaves in `io` f + η, f', ½ f'',
  // ⅙ f''', g and f''''/24. Start: the evaluation at τ = T (it does not wait for η), and θ₀ from
  // the reversion of f's Taylor series about T to third order: with ε = −f/f', ρ = ½ f''/f' and
  // c = ⅙ f'''/f', δ = ε − ρ ε² + (2ρ² − c) ε³ (error of order ε⁴: at
  // most 5×10⁻⁸ K up to 60 MPa and 10⁻⁶ K up to 100 MPa over the validity range, measured).
  // Then one evaluation at θ₀ and a Newton step, accepted when the step is below 0.1 K and the
  // quadratic error it leaves, |ρ| s², below 10⁻¹³ K (a hundredth of the 10⁻¹¹ K to which
  // TEOS-10 quotes Θ); otherwise more Newton steps, stopped when the step is below 10⁻¹² K or
  // |ρ| s² below 10⁻¹⁵ K.
  const io = eo;
  isobar!(col, tau0, io);
  const inv0 = 1 / io[1];
  const r0 = io[2] * inv0;
  const e = (eta - io[0]) * inv0;
  let th = T + TU * (e * (1 + e * (e * (2 * r0 * r0 - io[3] * inv0) - r0)));
  for (let n = 0; n < 30; n++) {
    state[ISO_TAU] = (th - T0) * (1 / TU);
    isobar!(col, state[ISO_TAU], io);
    const inv = 1 / io[1];
    const r = Math.abs(io[2] * inv);
    const s = (io[0] - eta) * inv;
    th -= TU * s;
    if (
      n === 0
        ? Math.abs(s) < 2.5e-3 && r * s * s < 1e-13 / TU
        : Math.abs(s) < 1e-12 / TU || r * s * s < 1e-15 / TU
    ) return th;
  }
  throw new NoPhysicalAnswerError(
    `potential temperature did not converge at S_A ${SA} kg/kg, T ${T} K, p ${p} Pa`,
  );
}

/**
 * Potential enthalpy h0 = g − θ g_T at (S_A, θ, p0), J/kg, for the θ just returned by theta():
 * g and g_τ by their Taylor series about the τ of theta()'s last isobar evaluation (still in
 * `eo`), to the fifth power of the distance (the last Newton step, below 0.1 K and normally far
 * smaller), exact to rounding there.
 */
function potentialEnthalpy(th: number): number {
  const d = (th - T0) / TU - state[ISO_TAU];
  const o = eo;
  const gt = o[0] + d * (o[1] + d * (o[2] + d * (o[3] + d * o[5])));
  const g = o[4] +
    d * (o[0] + d * (0.5 * o[1] + d * (o[2] / 3 + d * (0.25 * o[3] + d * 0.2 * o[5]))));
  return g - th * gt / TU;
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
  return potentialEnthalpy(th) / CP0;
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
