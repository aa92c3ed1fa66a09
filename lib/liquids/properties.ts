/**
 * One entry point for the properties of any liquid the site plan may meet: water (lib/water),
 * seawater (TEOS-10 / UNESCO 1983) and the registry liquids of data/liquids.yaml.
 *
 * @module
 */
import {
  checkRange,
  InputError,
  NoPhysicalAnswerError,
  NotFoundError,
  type ValidityOptions,
  type Warning,
} from "../errors.ts";
import { defaultRegistry } from "../registry/mod.ts";
import { nearest } from "../registry/nearest.ts";
import type { LiquidEntry } from "../registry/schemas/liquids.ts";
import { trace, type TraceEntry } from "../trace.ts";
import { parseQuantity } from "../units.ts";
import {
  waterDensity,
  type WaterFormulation,
  waterSoundSpeed,
  waterTrace,
  waterViscosity,
} from "../water/mod.ts";
import {
  batzleWangDensity,
  batzleWangSoundSpeed,
  batzleWangViscosity,
  waltherViscosity,
} from "./petroleum.ts";
import { seawater, type SeawaterFormulation, seawaterTrace } from "./seawater.ts";

const P_ATM = 101325;

/** Options of {@link liquidProperties}. */
export interface LiquidOptions extends ValidityOptions {
  /** Sound-speed formulation: water "iapws95" | "if97" | "del-grosso-mader" | "marczak";
   * seawater "teos10" | "teos10-gibbs" | "unesco1983". Registry liquids have one model each. */
  readonly formulation?: string;
  /** Practical salinity (PSS-78), required for `seawater`. */
  readonly salinity?: number;
}

/** Properties of a liquid at one state, SI units. */
export interface LiquidState {
  /** Liquid id. */
  readonly id: string;
  /** Display name. */
  readonly name: string;
  /** Sound speed, m/s. */
  readonly soundSpeed: number;
  /** Density, kg/m³. */
  readonly density: number;
  /** Dynamic viscosity, Pa·s. */
  readonly dynamicViscosity: number;
  /** Kinematic viscosity, m²/s. */
  readonly kinematicViscosity: number;
  /** Half-width of the sound-speed spread, m/s: stated spread of the data, or for water and
   * seawater the largest difference to the other applicable formulations. */
  readonly soundSpeedSpread: number;
  /** Constants and formulations used. */
  readonly trace: readonly TraceEntry[];
  /** Warnings (for example extrapolation). */
  readonly warnings: readonly Warning[];
}

/** A liquid in the listing. */
export interface LiquidInfo {
  /** Id for {@link liquidProperties}. */
  readonly id: string;
  /** Display name. */
  readonly name: string;
  /** Category, for example `alcohol`. */
  readonly category: string;
  /** Temperature validity, K. */
  readonly temperatureRange: readonly [number, number];
  /** Main source id. */
  readonly source: string;
  /** Basis of the data. */
  readonly basis: string;
  /** Sound-speed formulations to choose from (water, seawater), else []. */
  readonly formulations: readonly string[];
}

const WATER_FORMS: readonly WaterFormulation[] = ["iapws95", "if97", "del-grosso-mader", "marczak"];
const SEA_FORMS: readonly SeawaterFormulation[] = ["teos10", "teos10-gibbs", "unesco1983"];

interface Prepared {
  entry: LiquidEntry;
  tRange: [number, number];
  pRange: [number, number];
  soundAt: number;
  densAt: number;
}
const prepared = new Map<string, Prepared>();

function prepare(entry: LiquidEntry): Prepared {
  let p = prepared.get(entry.id);
  if (p) return p;
  const tq = (s: string) => parseQuantity(s, "temperature", `${entry.id} temperature`);
  const pq = (s: string) => parseQuantity(s, "pressure", `${entry.id} pressure`);
  const v = entry.validity;
  p = {
    entry,
    tRange: [tq(v.temperature.min), tq(v.temperature.max)],
    pRange: v.pressure ? [pq(v.pressure.min), pq(v.pressure.max)] : [0, 10e6],
    soundAt: entry.soundSpeed.model === "linear" ? tq(entry.soundSpeed.at) : NaN,
    densAt: entry.density.model === "linear" ? tq(entry.density.at) : NaN,
  };
  prepared.set(entry.id, p);
  return p;
}

/** Linear interpolation in a [°C, value] table; end segments extend beyond. */
function interp(points: readonly (readonly [number, number])[], tC: number): number {
  let i = 1;
  while (i < points.length - 1 && tC > points[i][0]) i++;
  const [x0, y0] = points[i - 1], [x1, y1] = points[i];
  return y0 + (y1 - y0) * (tC - x0) / (x1 - x0);
}

/** ln y linear in 1/T between [°C, y] points (Andrade / Clausius–Clapeyron form). */
function interpLogInv(points: readonly (readonly [number, number])[], T: number): number {
  const tC = T - 273.15;
  let i = 1;
  while (i < points.length - 1 && tC > points[i][0]) i++;
  const [x0, y0] = points[i - 1], [x1, y1] = points[i];
  const u0 = 1 / (x0 + 273.15), u1 = 1 / (x1 + 273.15), u = 1 / T;
  return Math.exp(Math.log(y0) + (Math.log(y1) - Math.log(y0)) * (u - u0) / (u1 - u0));
}

function prov(entry: LiquidEntry, part: { source?: string; basis?: string }) {
  return {
    source: part.source ?? entry.source ?? "common-practice",
    basis: (part.basis ?? entry.basis ?? "recalled") as TraceEntry["basis"],
  };
}

/**
 * Vapour pressure of a registry liquid from its table (ln p linear in 1/T between points,
 * Clausius–Clapeyron form), or undefined when the entry has none.
 *
 * Validity: the table's span; beyond it the end segments extend (indicative). Sources: per entry.
 *
 * @param id liquid id of data/liquids.yaml
 * @param T temperature, K
 * @returns vapour pressure, Pa, or undefined
 *
 * @example
 * ```ts
 * import { liquidVapourPressure } from "./properties.ts";
 * const p = liquidVapourPressure("ammonia", 293.15);
 * if (p === undefined || Math.abs(p - 857.48e3) > 1) throw new Error(String(p));
 * ```
 */
export function liquidVapourPressure(id: string, T: number): number | undefined {
  const e = defaultRegistry().liquid(id);
  return e.vapourPressure ? interpLogInv(e.vapourPressure.points, T) * 1e3 : undefined;
}

function registryLiquid(
  entry: LiquidEntry,
  T: number,
  p: number,
  opts: ValidityOptions,
): LiquidState {
  const pr = prepare(entry);
  const name = `${entry.name} (data/liquids.yaml)`;
  checkRange("temperature", T, pr.tRange, "K", name, opts);
  checkRange("pressure", p, pr.pRange, "Pa", name, opts);
  const traceOut: TraceEntry[] = [];
  let pRef = P_ATM;
  if (entry.vapourPressure) {
    const ps = interpLogInv(entry.vapourPressure.points, T) * 1e3;
    if (p < ps) {
      throw new NoPhysicalAnswerError(
        `${entry.id} boils at this pressure: vapour pressure ${(ps / 1e3).toPrecision(4)} kPa at ` +
          `${(T - 273.15).toFixed(2)} °C is above ${(p / 1e3).toPrecision(4)} kPa`,
      );
    }
    if (entry.soundSpeed.model === "table" && entry.soundSpeed.atSaturation) pRef = ps;
    const pv = prov(entry, entry.vapourPressure);
    traceOut.push(trace("vapour pressure (boiling check)", ps, "Pa", pv.source, pv.basis));
  }
  const tC = T - 273.15;
  const dpMPa = (p - pRef) / 1e6;
  const api = entry.api ?? NaN;
  const needApi = () => {
    if (!(api > 0)) throw new InputError(`${entry.id}.api`, "nothing", "an API gravity");
  };

  // sound speed
  const s = entry.soundSpeed;
  let c: number, spread: number;
  if (s.model === "linear") {
    const dT = T - pr.soundAt;
    c = s.value + s.slope * dT + (s.curvature ?? 0) * dT * dT + (s.pressureSlope ?? 0) * dpMPa;
    spread = s.spread + (s.slopeSpread ?? 0) * Math.abs(dT);
  } else if (s.model === "table") {
    c = interp(s.points, tC) + (s.pressureSlope ?? 0) * dpMPa;
    spread = s.spread;
  } else {
    needApi();
    c = batzleWangSoundSpeed(api, T, p);
    spread = s.spread;
  }
  if (s.model !== "batzle-wang" && s.pressureSlope) {
    spread += 0.6 * Math.abs(s.pressureSlope * dpMPa); // slopes are rough: ±60 %
  }
  const ps = prov(entry, s);
  traceOut.push(trace(`sound speed (${s.model} model)`, c, "m/s", ps.source, ps.basis));

  // density
  const d = entry.density;
  let rho: number;
  if (d.model === "linear") rho = d.value + d.slope * (T - pr.densAt);
  else if (d.model === "table") rho = interp(d.points, tC);
  else {
    needApi();
    rho = batzleWangDensity(api, T, p);
  }
  if (d.model !== "batzle-wang") {
    rho *= 1 + (p - pRef) / (rho * c * c); // isentropic compressibility 1/(ρc²)
  }
  const pd = prov(entry, d);
  traceOut.push(trace(`density (${d.model} model)`, rho, "kg/m^3", pd.source, pd.basis));

  // viscosity
  const v = entry.viscosity;
  let mu: number;
  if (v.model === "table") mu = interpLogInv(v.points, T) * (v.unit === "mPa s" ? 1e-3 : 1);
  else if (v.model === "walther") mu = waltherViscosity(v.points, T) * rho;
  else {
    needApi();
    mu = batzleWangViscosity(api, T);
  }
  const pv = prov(entry, v);
  traceOut.push(trace(`dynamic viscosity (${v.model} model)`, mu, "Pa s", pv.source, pv.basis));

  if (![c, rho, mu, spread].every((x) => Number.isFinite(x)) || !(c > 0 && rho > 0 && mu > 0)) {
    throw new NoPhysicalAnswerError(
      `${entry.id}: no physical property values at ${
        tC.toFixed(2)
      } °C, ${p} Pa (far outside the data)`,
    );
  }
  return {
    id: entry.id,
    name: entry.name,
    soundSpeed: c,
    density: rho,
    dynamicViscosity: mu,
    kinematicViscosity: mu / rho,
    soundSpeedSpread: spread,
    trace: traceOut,
    warnings: [],
  };
}

function otherSpread(c: number, others: (() => number)[]): number {
  let m = 0;
  for (const f of others) {
    try {
      m = Math.max(m, Math.abs(f() - c));
    } catch {
      // formulation not applicable at this state
    }
  }
  return m;
}

/**
 * Properties of a liquid at temperature T and absolute pressure p: sound speed, density, dynamic and
 * kinematic viscosity, the sound-speed spread, a trace and warnings.
 *
 * - `water`: lib/water (IAPWS-95 default; option `formulation`), viscosity IAPWS 2008; spread =
 *   largest difference to the other water formulations valid at the state.
 * - `seawater`: option `salinity` (practical) required; TEOS-10 75-term default, or
 *   "teos10-gibbs" / "unesco1983"; density TEOS-10; viscosity Sharqawy et al. 2010 on IAPWS 2008
 *   water; spread = largest difference to the other seawater formulations valid at the state.
 * - registry liquids (data/liquids.yaml): the entry's models; density corrected for pressure by the
 *   isentropic compressibility 1/(ρc²) and the sound speed by the entry's pressure slope; viscosity
 *   not corrected for pressure. A liquid below its vapour pressure boils: NoPhysicalAnswerError.
 *
 * Validity: per formulation or entry; OutOfRangeError outside unless `extrapolate`. Unknown id:
 * NotFoundError naming the nearest ids. Sources: per entry / formulation (see the trace).
 *
 * @param id liquid id: "water", "seawater" or an id of data/liquids.yaml
 * @param T temperature, K
 * @param p absolute pressure, Pa (default 101 325)
 * @param options formulation, salinity, extrapolation opt-in and warnings sink
 * @returns the liquid's state
 *
 * @example
 * ```ts
 * import { liquidProperties } from "./properties.ts";
 * const w = liquidProperties("water", 293.15);
 * if (Math.abs(w.soundSpeed - 1482.35) > 0.1) throw new Error(String(w.soundSpeed));
 * const m = liquidProperties("methanol", 298.15);
 * if (m.soundSpeed !== 1103) throw new Error(String(m.soundSpeed));
 * const s = liquidProperties("seawater", 283.15, 101325, { salinity: 35 });
 * if (Math.abs(s.soundSpeed - 1489.8) > 0.1) throw new Error(String(s.soundSpeed));
 * ```
 */
export function liquidProperties(
  id: string,
  T: number,
  p: number = P_ATM,
  options: LiquidOptions = {},
): LiquidState {
  return liquidState(id, T, p, options, true);
}

/**
 * Sound speed of a liquid at temperature T and absolute pressure p: the `soundSpeed` of
 * {@link liquidProperties} with the same checks, warnings and errors (its density and viscosity
 * are still evaluated and checked), without comparing the other formulations for the spread.
 * For sweeps that use the sound speed alone.
 *
 * Validity, sources and options: as {@link liquidProperties}.
 *
 * @param id liquid id: "water", "seawater" or an id of data/liquids.yaml
 * @param T temperature, K
 * @param p absolute pressure, Pa (default 101 325)
 * @param options formulation, salinity, extrapolation opt-in and warnings sink
 * @returns sound speed, m/s
 *
 * @example
 * ```ts
 * import { liquidProperties, liquidSoundSpeed } from "./properties.ts";
 * const c = liquidSoundSpeed("water", 283.15, 5e5);
 * if (c !== liquidProperties("water", 283.15, 5e5).soundSpeed) throw new Error(String(c));
 * ```
 */
export function liquidSoundSpeed(
  id: string,
  T: number,
  p: number = P_ATM,
  options: LiquidOptions = {},
): number {
  return liquidState(id, T, p, options, false).soundSpeed;
}

/** {@link liquidProperties}; `spread` false leaves soundSpeedSpread 0 (not compared). */
function liquidState(
  id: string,
  T: number,
  p: number,
  options: LiquidOptions,
  spread: boolean,
): LiquidState {
  if (!Number.isFinite(T) || T <= 0) {
    throw new InputError("temperature", String(T), "a finite absolute temperature in K above 0");
  }
  if (!Number.isFinite(p) || p < 0) {
    throw new InputError("pressure", String(p), "a finite absolute pressure in Pa, 0 or more");
  }
  const warnings: Warning[] = [];
  const opts: ValidityOptions = { extrapolate: options.extrapolate, warnings };
  let out: LiquidState;
  if (id === "water") {
    const f = (options.formulation ?? "iapws95") as WaterFormulation;
    if (!WATER_FORMS.includes(f)) {
      throw new InputError(
        "formulation",
        JSON.stringify(f),
        `for water one of ${WATER_FORMS.join(", ")}`,
      );
    }
    const c = waterSoundSpeed(T, p, f, opts);
    const rho = waterDensity(T, p, f === "if97" ? "if97" : "iapws95", opts);
    const mu = waterViscosity(T, p, opts);
    out = {
      id,
      name: "Water",
      soundSpeed: c,
      density: rho,
      dynamicViscosity: mu,
      kinematicViscosity: mu / rho,
      soundSpeedSpread: spread
        ? otherSpread(
          c,
          WATER_FORMS.filter((x) => x !== f).map((x) => () => waterSoundSpeed(T, p, x)),
        )
        : 0,
      trace: [...waterTrace(f), ...waterTrace("viscosity")],
      warnings,
    };
  } else if (id === "seawater") {
    const S = options.salinity;
    if (S === undefined || !Number.isFinite(S)) {
      throw new InputError("salinity", String(S), "a practical salinity for seawater, such as 35");
    }
    const f = (options.formulation ?? "teos10") as SeawaterFormulation;
    if (!SEA_FORMS.includes(f)) {
      throw new InputError(
        "formulation",
        JSON.stringify(f),
        `for seawater one of ${SEA_FORMS.join(", ")}`,
      );
    }
    const c = seawater.soundSpeed(S, T, p, f, opts);
    const rho = seawater.density(S, T, p, f === "teos10-gibbs" ? "teos10-gibbs" : "teos10", opts);
    // Below 0 °C (cold seawater stays liquid) pure-water viscosity is extrapolated a little.
    const muW = waterViscosity(T, p, T < 273.15 ? { extrapolate: true, warnings } : opts);
    const mu = seawater.viscosityFromWater(S, T, muW, { extrapolate: T < 273.15, warnings });
    out = {
      id,
      name: `Seawater (S ${S})`,
      soundSpeed: c,
      density: rho,
      dynamicViscosity: mu,
      kinematicViscosity: mu / rho,
      soundSpeedSpread: spread
        ? otherSpread(
          c,
          SEA_FORMS.filter((x) => x !== f).map((x) => () => seawater.soundSpeed(S, T, p, x)),
        )
        : 0,
      trace: [
        ...seawaterTrace(f),
        trace("salinity (practical)", S, "", "millero-2008", "input"),
        trace(
          "viscosity ratio: Sharqawy et al. 2010",
          "eq. 22",
          "",
          "sharqawy-2010",
          "transcribed",
        ),
        ...waterTrace("viscosity"),
      ],
      warnings,
    };
  } else {
    const reg = defaultRegistry();
    let entry: LiquidEntry;
    try {
      entry = reg.liquid(id);
    } catch (e) {
      if (e instanceof NotFoundError) {
        throw new NotFoundError(
          "liquid",
          id,
          nearest(id, ["water", "seawater", ...reg.liquids().map((l) => l.id)]),
        );
      }
      throw e;
    }
    if (options.formulation !== undefined) {
      throw new InputError(
        "formulation",
        JSON.stringify(options.formulation),
        `no formulation choice for ${id} (only water and seawater have one)`,
      );
    }
    out = { ...registryLiquid(entry, T, p, opts), warnings };
  }
  options.warnings?.push(...warnings);
  return out;
}

/**
 * Every liquid {@link liquidProperties} knows: water, seawater and the registry liquids.
 *
 * Sources: data/liquids.yaml entries; water and seawater formulations.
 *
 * @returns the listing, water and seawater first
 *
 * @example
 * ```ts
 * import { liquids } from "./properties.ts";
 * const ids = liquids().map((l) => l.id);
 * if (!ids.includes("water") || !ids.includes("ammonia")) throw new Error(ids.join());
 * ```
 */
export function liquids(): LiquidInfo[] {
  const list: LiquidInfo[] = [
    {
      id: "water",
      name: "Water",
      category: "water",
      temperatureRange: [273.15, 647.096],
      source: "iapws-r6-95",
      basis: "transcribed",
      formulations: WATER_FORMS,
    },
    {
      id: "seawater",
      name: "Seawater (give the practical salinity)",
      category: "seawater",
      temperatureRange: [271.15, 313.15],
      source: "roquet-2015",
      basis: "transcribed",
      formulations: SEA_FORMS,
    },
  ];
  for (const e of defaultRegistry().liquids()) {
    const p = prepare(e);
    list.push({
      id: e.id,
      name: e.name,
      category: e.category,
      temperatureRange: p.tRange,
      source: e.source ?? e.soundSpeed.source ?? "common-practice",
      basis: e.basis ?? e.soundSpeed.basis ?? "recalled",
      formulations: [],
    });
  }
  return list;
}
