/**
 * Seawater: sound speed (TEOS-10 75-term polynomial, TEOS-10 Gibbs function, UNESCO 1983),
 * density (TEOS-10 75-term) and viscosity (Sharqawy et al. 2010 ratio on IAPWS 2008 water).
 *
 * Inputs at the public edge are practical salinity S_P (PSS-78), temperature in K (ITS-90) and
 * absolute pressure in Pa. TEOS-10 needs absolute salinity: the reference salinity
 * S_R = (35.16504/35)·S_P (Millero et al. 2008) is used for it (no regional anomaly), and
 * conservative temperature Θ is computed from the in-situ temperature through the Gibbs function
 * (see gibbs.ts).
 *
 * @module
 */
import { checkRange, InputError, NoPhysicalAnswerError, type ValidityOptions } from "../errors.ts";
import { defaultRegistry } from "../registry/mod.ts";
import { trace, type TraceEntry } from "../trace.ts";
import { conservativeTemperature, densityGibbs, P0, soundSpeedGibbs, T0 } from "./gibbs.ts";
import { soundSpeedUnesco1983 } from "./unesco.ts";
import { lit, polyExpr, powers } from "./codegen.ts";

/** Seawater sound-speed formulations. */
export type SeawaterFormulation = "teos10" | "teos10-gibbs" | "unesco1983";

/** Reference-salinity factor u_PS = 35.16504/35 g/kg (Millero et al. 2008). */
export const UPS = 35.16504 / 35;

interface V75 {
  /** Highest power of τ and of ζ. */
  J: number;
  K: number;
  Su: number;
  dS: number;
  /** Highest power of τ with a non-zero term, per power k of ζ (the grid is zero beyond it). */
  jmax: Int8Array;
  /**
   * Coefficients cell by cell, for generating the collapse: for k from K down to 0, j from
   * jmax_k down to 0, the cell's v_ijk from the highest i down to i = 0 (zeros fill gaps);
   * cellLen holds each cell's length in that order.
   */
  cells: Float64Array;
  cellLen: Int8Array;
}
let v75: V75 | undefined;
const DATA_FILE = "data/seawater/teos10_75term.yaml";
const DATA_ID = "seawater-teos10-75term";
const WHERE = { file: DATA_FILE, entry: DATA_ID };

function load(): V75 {
  if (v75) return v75;
  const d = defaultRegistry().coefficients("seawater-teos10-75term");
  const rows = d.coefficients.v as number[][];
  const sso = d.constants.SSO as number;
  const J = Math.max(...rows.map((r) => r[1]));
  const K = Math.max(...rows.map((r) => r[2]));
  const jmax = new Int8Array(K + 1);
  const imax = new Int8Array((J + 1) * (K + 1));
  for (const [i, j, k] of rows) {
    jmax[k] = Math.max(jmax[k], j);
    imax[k * (J + 1) + j] = Math.max(imax[k * (J + 1) + j], i);
  }
  const order: number[] = [];
  for (let k = K; k >= 0; k--) for (let j = jmax[k]; j >= 0; j--) order.push(k * (J + 1) + j);
  const cellLen = Int8Array.from(order, (c) => imax[c] + 1);
  const start = new Map<number, number>();
  let n = 0;
  for (const c of order) {
    start.set(c, n);
    n += imax[c] + 1;
  }
  const cells = new Float64Array(n);
  for (const [i, j, k, v] of rows) {
    const c = k * (J + 1) + j;
    cells[start.get(c)! + imax[c] - i] += v;
  }
  v75 = {
    J,
    K,
    Su: 40 * sso / 35,
    dS: d.constants.deltaS as number,
    jmax,
    cells,
    cellLen,
  };
  grid = new Float64Array((J + 1) * (K + 1));
  const gen = build75(v75);
  evalGrid = gen.evaluate;
  collapse75 = gen.collapse;
  return v75;
}

/** (grid, tau, z, res) => void: generated v and ∂v/∂ζ from the grid into res[0], res[1]. */
type Eval75 = (grid: Float64Array, tau: number, z: number, res: Float64Array) => void;
/** (grid, s) => void: generated salinity sums of the cells into the grid. */
type Collapse75 = (grid: Float64Array, s: number) => void;

/**
 * Generate, from the coefficient layout, straight-line code for (a) the collapse: each (k, j)
 * cell's polynomial in s into the (τ, ζ) grid, and (b) v and ∂v/∂ζ from the grid: rows k of ζ as
 * polynomials in τ, then in ζ. Estrin's scheme throughout (see polyExpr). Generated once per
 * process: the same sums as loops over the layout, without the loop overhead and the long
 * dependency chains of Horner's scheme, which dominate these short sums.
 */
function build75(c: V75): { evaluate: Eval75; collapse: Collapse75 } {
  const W = c.J + 1;
  const ev: string[] = [powers("tau"), powers("z")];
  const co: string[] = [powers("s")];
  const rows: string[] = [], drows: string[] = [];
  let n = 0, m = 0;
  for (let k = c.K; k >= 0; k--) {
    const cs: string[] = [];
    for (let j = c.jmax[k]; j >= 0; j--) {
      const terms: string[] = [];
      for (const e = n + c.cellLen[m++]; n < e; n++) terms.push(lit(c.cells[n]));
      co.push(`grid[${k * W + j}] = ${polyExpr(terms, "s", WHERE)};`);
      cs.push(`grid[${k * W + j}]`);
    }
    ev.push(`const r${k} = ${polyExpr(cs, "tau", WHERE)};`);
    rows.push(`r${k}`);
    if (k > 0) drows.push(`${k} * r${k}`);
  }
  ev.push(`res[0] = ${polyExpr(rows, "z", WHERE)};`);
  ev.push(`res[1] = ${drows.length ? polyExpr(drows, "z", WHERE) : "0"};`);
  return {
    evaluate: new Function("grid", "tau", "z", "res", ev.join("\n")) as Eval75,
    collapse: new Function("grid", "s", co.join("\n")) as Collapse75,
  };
}

let evalGrid: Eval75 | undefined;
let collapse75: Collapse75 | undefined;
const res = new Float64Array(2);
/** The polynomial with the salinity sum done at gridSA[0]: v = Σ_kj D_kj τ^j ζ^k, row k. */
let grid = new Float64Array(0);
/** The grid's salinity, g/kg (in a typed array: a module-level `let` number is boxed on write). */
const gridSA = Float64Array.of(Number.NaN);

/**
 * Collapse the salinity sum of the 75-term polynomial at S_A (g/kg) into the (τ, ζ) grid unless
 * it is already there: straight-line code, about as cheap as summing the cells in place, so it
 * is done for every new salinity. Callers that know S_A before Θ call it first, so that this
 * work does not wait for Θ.
 */
function prepare75(SAgkg: number): void {
  if (SAgkg === gridSA[0]) return;
  const c = load();
  collapse75!(grid, Math.sqrt((SAgkg + c.dS) / c.Su));
  gridSA[0] = SAgkg;
}

/** v and ∂v/∂ζ of the 75-term polynomial, into `res`. SA g/kg, CT °C, sea pressure dbar. */
function v75eval(SAgkg: number, CT: number, pdbar: number): Float64Array {
  prepare75(SAgkg);
  evalGrid!(grid, CT / 40, pdbar * 1e-4, res);
  return res;
}

const NAME75 = "TEOS-10 75-term polynomial (Roquet et al. 2015)";
const SA75: [number, number] = [0, 42];
const CT75: [number, number] = [-3, 42.5]; // Θ of in-situ −2..40 °C over the S, p range
const T75: [number, number] = [-2, 40];
const P75: [number, number] = [0, 8000];
const T75K: [number, number] = [T0 + T75[0], T0 + T75[1]];

function check75(SAgkg: number, CT: number, pdbar: number, options?: ValidityOptions): void {
  checkRange("absolute salinity", SAgkg, SA75, "g/kg", NAME75, options);
  checkRange("conservative temperature", CT, CT75, "degC", NAME75, options);
  checkRange("sea pressure", pdbar, P75, "dbar", NAME75, options);
  if (SAgkg < 0 || pdbar < -10) {
    throw new InputError("salinity or pressure", `${SAgkg} g/kg, ${pdbar} dbar`, "S_A >= 0");
  }
}

/**
 * Specific volume of seawater by the TEOS-10 75-term polynomial of Roquet et al. (2015),
 * v = Σ v_ijk s^i τ^j ζ^k with s = sqrt((S_A + 24 g/kg)/S_u), τ = Θ/40 °C, ζ = p_sea/10⁴ dbar.
 *
 * Validity: S_A 0–42 g/kg, Θ −2 to 40 °C, sea pressure 0–8000 dbar (throws OutOfRangeError
 * outside unless extrapolate). Sources: roquet-2015, ioc-teos10-2010.
 *
 * @param SA absolute salinity, kg/kg
 * @param CT conservative temperature, °C (TEOS-10 convention: a Celsius value)
 * @param seaPressure sea pressure p − 101 325 Pa, Pa
 * @param options extrapolation opt-in and warnings sink
 * @returns specific volume, m³/kg
 *
 * @example
 * ```ts
 * import { specificVolume75 } from "./seawater.ts";
 * const v = specificVolume75(0.035, 10, 1000e4);
 * if (Math.abs(v - 9.696677509681e-4) > 1e-15) throw new Error(String(v));
 * ```
 */
export function specificVolume75(
  SA: number,
  CT: number,
  seaPressure: number,
  options?: ValidityOptions,
): number {
  check75(SA * 1000, CT, seaPressure * 1e-4, options);
  return v75eval(SA * 1000, CT, seaPressure * 1e-4)[0];
}

/**
 * Sound speed of seawater from the TEOS-10 75-term specific volume: c = v·sqrt(−1/(∂v/∂p)) at
 * constant S_A and Θ (Θ fixes entropy), as TEOS-10 defines it for the polynomial.
 *
 * Validity: S_A 0–42 g/kg, Θ −2 to 40 °C, sea pressure 0–8000 dbar. Sources: roquet-2015,
 * ioc-teos10-2010.
 *
 * @param SA absolute salinity, kg/kg
 * @param CT conservative temperature, °C
 * @param seaPressure sea pressure p − 101 325 Pa, Pa
 * @param options extrapolation opt-in and warnings sink
 * @returns sound speed, m/s
 *
 * @example
 * ```ts
 * import { soundSpeed75 } from "./seawater.ts";
 * const c = soundSpeed75(0.03516504, 10, 0);
 * if (Math.abs(c - 1490.3) > 0.5) throw new Error(String(c));
 * ```
 */
export function soundSpeed75(
  SA: number,
  CT: number,
  seaPressure: number,
  options?: ValidityOptions,
): number {
  check75(SA * 1000, CT, seaPressure * 1e-4, options);
  const r = v75eval(SA * 1000, CT, seaPressure * 1e-4);
  const dvdp = r[1] * 1e-8; // per Pa: ζ = p[dbar]/1e4, 1 dbar = 1e4 Pa
  const c = r[0] * Math.sqrt(-1 / dvdp);
  if (!Number.isFinite(c)) {
    throw new NoPhysicalAnswerError(`75-term polynomial gives no sound speed at Θ ${CT} °C`);
  }
  return c;
}

const SP_RANGE: [number, number] = [0, 42 / UPS];

function absoluteSalinity(S: number, options?: ValidityOptions): number {
  if (!Number.isFinite(S) || S < 0) {
    throw new InputError("salinity", String(S), "a practical salinity >= 0 (for example 35)");
  }
  checkRange("practical salinity", S, SP_RANGE, "", "TEOS-10", options);
  return UPS * S / 1000;
}

/**
 * Sound speed of seawater.
 *
 * - `"teos10"` (default): TEOS-10 75-term polynomial (Roquet et al. 2015) at Θ computed from T
 *   by the Gibbs function, with S_A = S_R = (35.16504/35)·S (Millero et al. 2008).
 * - `"teos10-gibbs"`: the full TEOS-10 Gibbs function (IAPWS-08 with SR7-09) at (S_A, T, p).
 * - `"unesco1983"`: UNESCO 1983 (Fofonoff & Millard 1983; Chen & Millero 1977), t68 = 1.00024 t90.
 *
 * Validity: TEOS-10 S 0–41.8 (S_A ≤ 42 g/kg), −2 to 40 °C, sea pressure 0–80 MPa (Gibbs:
 * −6 to 40 °C, 0–100 MPa); UNESCO 1983: S 0–40, 0–40 °C, 0–100 MPa sea pressure. Throws
 * OutOfRangeError outside unless extrapolate. Sources: roquet-2015, ioc-teos10-2010,
 * millero-2008, iapws-r13-08, iapws-sr7-09, fofonoff-millard-1983, chen-millero-1977.
 *
 * @param S practical salinity (PSS-78), dimensionless (35 for open ocean)
 * @param T temperature, K (ITS-90)
 * @param p absolute pressure, Pa (default 101 325)
 * @param formulation "teos10" (default) | "teos10-gibbs" | "unesco1983"
 * @param options extrapolation opt-in and warnings sink
 * @returns sound speed, m/s
 *
 * @example
 * ```ts
 * import { seawater } from "./seawater.ts";
 * const c = seawater.soundSpeed(35, 283.15);
 * const u = seawater.soundSpeed(35, 283.15, 101325, "unesco1983");
 * if (Math.abs(c - u) > 0.5) throw new Error(`${c} ${u}`);
 * ```
 */
function soundSpeed(
  S: number,
  T: number,
  p: number = P0,
  formulation: SeawaterFormulation = "teos10",
  options?: ValidityOptions,
): number {
  switch (formulation) {
    case "teos10": {
      const SA = absoluteSalinity(S, options);
      prepare75(SA * 1000);
      checkRange("temperature", T, T75K, "K", NAME75, options);
      const CT = conservativeTemperature(SA, T, p, options);
      return soundSpeed75(SA, CT, p - P0, options);
    }
    case "teos10-gibbs":
      return soundSpeedGibbs(absoluteSalinity(S, options), T, p, options);
    case "unesco1983":
      return soundSpeedUnesco1983(S, T, p, options);
    default:
      throw new InputError(
        "formulation",
        JSON.stringify(formulation),
        "teos10, teos10-gibbs or unesco1983",
      );
  }
}

/**
 * Density of seawater: TEOS-10 75-term polynomial, ρ = 1/v(S_A, Θ, p), with Θ from T by the
 * Gibbs function and S_A = (35.16504/35)·S; or the full Gibbs function with `"teos10-gibbs"`.
 *
 * Validity: as {@link seawater.soundSpeed}. Sources: roquet-2015, ioc-teos10-2010,
 * millero-2008.
 *
 * @param S practical salinity, dimensionless
 * @param T temperature, K (ITS-90)
 * @param p absolute pressure, Pa (default 101 325)
 * @param formulation "teos10" (default) | "teos10-gibbs"
 * @param options extrapolation opt-in and warnings sink
 * @returns density, kg/m³
 *
 * @example
 * ```ts
 * import { seawater } from "./seawater.ts";
 * const rho = seawater.density(35, 288.15);
 * if (Math.abs(rho - 1026.0) > 0.2) throw new Error(String(rho));
 * ```
 */
function density(
  S: number,
  T: number,
  p: number = P0,
  formulation: "teos10" | "teos10-gibbs" = "teos10",
  options?: ValidityOptions,
): number {
  const SA = absoluteSalinity(S, options);
  if (formulation === "teos10-gibbs") return densityGibbs(SA, T, p, options);
  if (formulation !== "teos10") {
    throw new InputError("formulation", JSON.stringify(formulation), "teos10 or teos10-gibbs");
  }
  prepare75(SA * 1000);
  checkRange("temperature", T, T75K, "K", NAME75, options);
  const CT = conservativeTemperature(SA, T, p, options);
  return 1 / specificVolume75(SA, CT, p - P0, options);
}

let visc: { A: number[]; B: number[]; u: number } | undefined;

/**
 * Dynamic viscosity of seawater: μ = μ_w(T, p)·(1 + A·s + B·s²), s the salinity as a mass fraction
 * (taken as S_R = (35.16504/35)·S/1000), A and B quadratic in t (°C), Sharqawy et al. (2010)
 * eq. 22; μ_w is pure water by IAPWS 2008 (passed in by the caller so this room does not depend on
 * the water room's loading order). Stated accuracy ±1.5 %.
 *
 * Validity: s 0–0.15 kg/kg, 0–180 °C (throws OutOfRangeError outside unless extrapolate).
 * Sources: sharqawy-2010, iapws-r12-08.
 *
 * @param S practical salinity, dimensionless
 * @param T temperature, K
 * @param waterViscosity viscosity of pure water at the same T and p, Pa·s
 * @param options extrapolation opt-in and warnings sink
 * @returns dynamic viscosity, Pa·s
 *
 * @example
 * ```ts
 * import { seawater } from "./seawater.ts";
 * const mu = seawater.viscosityFromWater(35, 293.15, 1.0016e-3);
 * const ratio = mu / 1.0016e-3; // seawater is about 8 % more viscous than fresh water
 * if (ratio < 1.06 || ratio > 1.09) throw new Error(String(mu));
 * ```
 */
function viscosityFromWater(
  S: number,
  T: number,
  waterViscosity: number,
  options?: ValidityOptions,
): number {
  if (!visc) {
    const d = defaultRegistry().coefficients("seawater-sharqawy2010-viscosity");
    visc = {
      A: d.coefficients.A as number[],
      B: d.coefficients.B as number[],
      u: d.constants.relativeUncertainty as number,
    };
  }
  if (!Number.isFinite(S) || S < 0) {
    throw new InputError("salinity", String(S), "a practical salinity >= 0");
  }
  const s = UPS * S / 1000;
  const name = "Sharqawy et al. 2010 seawater viscosity";
  checkRange("salinity mass fraction", s, [0, 0.15], "kg/kg", name, options);
  checkRange("temperature", T, [T0, T0 + 180], "K", name, options);
  const t = T - T0;
  const A = visc.A[0] + visc.A[1] * t + visc.A[2] * t * t;
  const B = visc.B[0] + visc.B[1] * t + visc.B[2] * t * t;
  return waterViscosity * (1 + A * s + B * s * s);
}

/**
 * Trace entries for a seawater sound speed: formulation, sources, basis.
 *
 * @param formulation the formulation used
 * @returns trace entries
 *
 * @example
 * ```ts
 * import { seawaterTrace } from "./seawater.ts";
 * if (seawaterTrace("teos10")[0].source !== "roquet-2015") throw new Error();
 * ```
 */
export function seawaterTrace(formulation: SeawaterFormulation): TraceEntry[] {
  switch (formulation) {
    case "teos10":
      return [
        trace(
          "formulation: TEOS-10 75-term sound speed",
          "teos10",
          "",
          "roquet-2015",
          "transcribed",
        ),
        trace(
          "conservative temperature: TEOS-10 Gibbs function",
          "Θ",
          "",
          "ioc-teos10-2010",
          "transcribed",
        ),
        trace("absolute salinity = (35.16504/35) S_P", UPS, "", "millero-2008", "transcribed"),
      ];
    case "teos10-gibbs":
      return [
        trace(
          "formulation: TEOS-10 Gibbs function sound speed",
          "teos10-gibbs",
          "",
          "iapws-r13-08",
          "transcribed",
        ),
        trace("pure-water part: IAPWS SR7-09", "SR7-09", "", "iapws-sr7-09", "transcribed"),
        trace("absolute salinity = (35.16504/35) S_P", UPS, "", "millero-2008", "transcribed"),
      ];
    case "unesco1983":
      return [
        trace(
          "formulation: UNESCO 1983 sound speed",
          "unesco1983",
          "",
          "fofonoff-millard-1983",
          "transcribed",
        ),
        trace("t68 = 1.00024 t90", 1.00024, "", "saunders-1990", "transcribed"),
      ];
  }
}

/** Seawater formulations by name, with their sources. */
export const seawaterFormulations: Readonly<Record<SeawaterFormulation, readonly string[]>> = Object
  .freeze({
    "teos10": ["roquet-2015", "ioc-teos10-2010", "millero-2008"],
    "teos10-gibbs": ["iapws-r13-08", "iapws-sr7-09", "ioc-teos10-2010"],
    "unesco1983": ["fofonoff-millard-1983", "chen-millero-1977"],
  });

/** The shape of {@link seawater}: see each function's own documentation there. */
export interface SeawaterNamespace {
  /** Sound speed, m/s, from practical salinity, T in K and absolute p in Pa. */
  readonly soundSpeed: (
    S: number,
    T: number,
    p?: number,
    formulation?: SeawaterFormulation,
    options?: ValidityOptions,
  ) => number;
  /** Density, kg/m³, from practical salinity, T in K and absolute p in Pa. */
  readonly density: (
    S: number,
    T: number,
    p?: number,
    formulation?: "teos10" | "teos10-gibbs",
    options?: ValidityOptions,
  ) => number;
  /** Dynamic viscosity, Pa·s, from practical salinity, T in K and pure-water viscosity. */
  readonly viscosityFromWater: (
    S: number,
    T: number,
    waterViscosity: number,
    options?: ValidityOptions,
  ) => number;
  /** Formulation names with their source ids. */
  readonly formulations: Readonly<Record<SeawaterFormulation, readonly string[]>>;
}

/**
 * Seawater properties: `soundSpeed(S, T, p?, formulation?, options?)`, `density(S, T, p?, …)`,
 * `viscosityFromWater(S, T, μ_w, options?)`, and the formulations list. Salinity is practical
 * salinity, T in K, p absolute in Pa.
 *
 * @example
 * ```ts
 * import { seawater } from "./seawater.ts";
 * if (!(seawater.soundSpeed(35, 293.15) > 1500)) throw new Error();
 * ```
 */
export const seawater: SeawaterNamespace = Object.freeze({
  soundSpeed,
  density,
  viscosityFromWater,
  formulations: seawaterFormulations,
});
