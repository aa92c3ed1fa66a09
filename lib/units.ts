/**
 * Unit strings at the edges; SI inside.
 *
 * Two paths read a quantity such as `"12 degC"`, `"20 L/s"` or `"6.02 mm"`:
 *
 * - {@link parseQuantity} (synchronous, fast): a small parser over a table of the units
 *   people write in this trade, with SI prefixes, products, quotients and powers. Every
 *   factor in the table is checked against mathjs in the tests, so both paths agree.
 * - {@link parseQuantityFull} (asynchronous): the same, falling back to mathjs (loaded
 *   lazily, it costs about 0.6 s) for anything the fast table does not read, such as
 *   expressions (`"5 ft + 3 inch"`).
 *
 * Temperatures are converted, never subtracted: `degC`, `degF`, `K`, `degR`. Pressures are
 * absolute; the gauge forms `barg` and `psig` add one standard atmosphere (101 325 Pa).
 *
 * @module
 */
import { UnitError } from "./errors.ts";

/** Physical dimensions snellpath reads at its edges. */
export type Dimension =
  | "length"
  | "area"
  | "volume"
  | "mass"
  | "time"
  | "frequency"
  | "temperature"
  | "temperatureDifference"
  | "pressure"
  | "flowRate"
  | "speed"
  | "angle"
  | "density"
  | "dynamicViscosity"
  | "kinematicViscosity"
  | "ratio"
  | "attenuation";

/** Exponents of metre, kilogram, second, radian. */
type Dim = readonly [number, number, number, number];

const DIMS: Record<Exclude<Dimension, "temperature" | "temperatureDifference">, Dim> = {
  length: [1, 0, 0, 0],
  area: [2, 0, 0, 0],
  volume: [3, 0, 0, 0],
  mass: [0, 1, 0, 0],
  time: [0, 0, 1, 0],
  frequency: [0, 0, -1, 0],
  pressure: [-1, 1, -2, 0],
  flowRate: [3, 0, -1, 0],
  speed: [1, 0, -1, 0],
  angle: [0, 0, 0, 1],
  density: [-3, 1, 0, 0],
  dynamicViscosity: [-1, 1, -1, 0],
  kinematicViscosity: [2, 0, -1, 0],
  ratio: [0, 0, 0, 0],
  attenuation: [-1, 0, 0, 0],
};

/** Examples of accepted units per dimension, for error messages. */
export const ACCEPTED: Record<Dimension, string> = {
  length: "a length such as 114.3 mm, 4.5 in, 0.5 ft, 6 m",
  area: "an area such as 0.01 m^2, 15 in^2",
  volume: "a volume such as 1 L, 1 m^3, 1 gallon",
  mass: "a mass such as 1 kg, 2 lb",
  time: "a time such as 100 ps, 12 us, 3 ms, 1 s",
  frequency: "a frequency such as 1 MHz, 500 kHz",
  temperature: "a temperature such as 12 degC, 54 degF, 285.15 K",
  temperatureDifference: "a temperature difference such as 5 K, 5 degC, 9 degF",
  pressure: "an absolute pressure such as 5 bar, 72 psi, 500 kPa, 0.5 MPa (or 4 barg, 58 psig)",
  flowRate: "a flow rate such as 20 L/s, 72 m^3/h, 300 gpm, 5 ML/d",
  speed: "a speed such as 1482 m/s, 4862 ft/s, 1.48 mm/us",
  angle: "an angle such as 38 deg, 0.66 rad",
  density: "a density such as 998 kg/m^3, 0.998 g/cm^3",
  dynamicViscosity: "a dynamic viscosity such as 1.0 mPa s, 1 cP",
  kinematicViscosity: "a kinematic viscosity such as 1.0 mm^2/s, 1 cSt",
  ratio: "a ratio such as 2 %, 0.02, 500 ppm",
  attenuation: "an attenuation coefficient such as 0.5 1/m (nepers per metre)",
};

interface UnitDef {
  readonly f: number;
  readonly d: Dim;
  readonly prefix?: boolean;
}

const L: Dim = [1, 0, 0, 0];
const M: Dim = [0, 1, 0, 0];
const T: Dim = [0, 0, 1, 0];
const A: Dim = [0, 0, 0, 1];
const ONE: Dim = [0, 0, 0, 0];

const INCH = 0.0254;
const FOOT = 0.3048;
const US_GALLON = 3.785411784e-3;
const POUND = 0.45359237;
const ATM = 101325;
const PSI = POUND * 9.80665 / (INCH * INCH);

/** Base units of the fast table: factor to SI and dimension. */
const UNITS: Record<string, UnitDef> = {
  m: { f: 1, d: L, prefix: true },
  in: { f: INCH, d: L },
  inch: { f: INCH, d: L },
  inches: { f: INCH, d: L },
  '"': { f: INCH, d: L },
  ft: { f: FOOT, d: L },
  foot: { f: FOOT, d: L },
  feet: { f: FOOT, d: L },
  "'": { f: FOOT, d: L },
  yd: { f: 0.9144, d: L },
  mil: { f: INCH / 1000, d: L },
  g: { f: 1e-3, d: M, prefix: true },
  lb: { f: POUND, d: M },
  lbm: { f: POUND, d: M },
  t: { f: 1000, d: M },
  s: { f: 1, d: T, prefix: true },
  sec: { f: 1, d: T },
  min: { f: 60, d: T },
  h: { f: 3600, d: T },
  hr: { f: 3600, d: T },
  hour: { f: 3600, d: T },
  d: { f: 86400, d: T },
  day: { f: 86400, d: T },
  Hz: { f: 1, d: [0, 0, -1, 0], prefix: true },
  Pa: { f: 1, d: [-1, 1, -2, 0], prefix: true },
  bar: { f: 1e5, d: [-1, 1, -2, 0], prefix: true },
  atm: { f: ATM, d: [-1, 1, -2, 0] },
  psi: { f: PSI, d: [-1, 1, -2, 0], prefix: true },
  L: { f: 1e-3, d: [3, 0, 0, 0], prefix: true },
  l: { f: 1e-3, d: [3, 0, 0, 0], prefix: true },
  gal: { f: US_GALLON, d: [3, 0, 0, 0] },
  gallon: { f: US_GALLON, d: [3, 0, 0, 0] },
  gallons: { f: US_GALLON, d: [3, 0, 0, 0] },
  gpm: { f: US_GALLON / 60, d: [3, 0, -1, 0] },
  P: { f: 0.1, d: [-1, 1, -1, 0], prefix: true },
  St: { f: 1e-4, d: [2, 0, -1, 0], prefix: true },
  rad: { f: 1, d: A, prefix: true },
  deg: { f: Math.PI / 180, d: A },
  degree: { f: Math.PI / 180, d: A },
  degrees: { f: Math.PI / 180, d: A },
  "°": { f: Math.PI / 180, d: A },
  "%": { f: 0.01, d: ONE },
  percent: { f: 0.01, d: ONE },
  ppm: { f: 1e-6, d: ONE },
  Np: { f: 1, d: ONE },
};

const PREFIXES: Record<string, number> = {
  p: 1e-12,
  n: 1e-9,
  u: 1e-6,
  "µ": 1e-6,
  "μ": 1e-6,
  m: 1e-3,
  c: 1e-2,
  d: 1e-1,
  k: 1e3,
  M: 1e6,
  G: 1e9,
};

/** Temperature units: value → kelvin. Conversions, never differences. */
const TEMPERATURES: Record<string, (x: number) => number> = {
  K: (x) => x,
  kelvin: (x) => x,
  degC: (x) => x + 273.15,
  "°C": (x) => x + 273.15,
  C: (x) => x + 273.15,
  celsius: (x) => x + 273.15,
  degF: (x) => (x - 32) * 5 / 9 + 273.15,
  "°F": (x) => (x - 32) * 5 / 9 + 273.15,
  F: (x) => (x - 32) * 5 / 9 + 273.15,
  fahrenheit: (x) => (x - 32) * 5 / 9 + 273.15,
  degR: (x) => x * 5 / 9,
};

/** Temperature-difference units: value → kelvin. */
const TEMPERATURE_DIFFERENCES: Record<string, number> = {
  K: 1,
  degC: 1,
  "°C": 1,
  C: 1,
  degF: 5 / 9,
  "°F": 5 / 9,
  F: 5 / 9,
  degR: 5 / 9,
};

/** Gauge and explicitly absolute pressure units: value → absolute Pa. */
const PRESSURES: Record<string, (x: number) => number> = {
  barg: (x) => x * 1e5 + ATM,
  bara: (x) => x * 1e5,
  psig: (x) => x * PSI + ATM,
  psia: (x) => x * PSI,
};

const NUMBER = /^\s*([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)\s*(.*?)\s*$/;

function lookupUnit(token: string): UnitDef | undefined {
  const direct = UNITS[token];
  if (direct) return direct;
  for (let n = 1; n <= 2 && n < token.length; n++) {
    const p = PREFIXES[token.slice(0, n)];
    const base = UNITS[token.slice(n)];
    if (p !== undefined && base?.prefix) return { f: p * base.f, d: base.d };
  }
  return undefined;
}

let folded: Map<string, UnitDef | null> | undefined;

/**
 * A single unit written in another case (`GPM`, `PSI`, `KPA`): accepted only when exactly one
 * table unit (with its prefix) has that spelling case-folded, so `MM` (megametre or millimetre)
 * stays refused.
 */
function foldedUnit(unit: string): { f: number; d: Dim } | undefined {
  if (!/^[A-Za-z]+$/.test(unit)) return undefined;
  if (!folded) {
    folded = new Map();
    const add = (name: string, u: UnitDef) => {
      const k = name.toLowerCase();
      const had = folded!.get(k);
      folded!.set(k, had === undefined || (had && had.f === u.f && sameDim(had.d, u.d)) ? u : null);
    };
    for (const [name, u] of Object.entries(UNITS)) {
      add(name, u);
      if (u.prefix) {
        for (const [p, pf] of Object.entries(PREFIXES)) add(p + name, { f: pf * u.f, d: u.d });
      }
    }
  }
  const u = folded.get(unit.toLowerCase());
  return u ? { f: u.f, d: u.d } : undefined;
}

/** Parse a unit expression (`m^3/h`, `kg/m^3`, `mPa s`, `1/m`) into factor and dimension. */
function parseUnitExpr(expr: string): { f: number; d: Dim } | undefined {
  const normal = expr
    .replace(/²/g, "^2")
    .replace(/³/g, "^3")
    .replace(/·|\*/g, " ")
    .replace(/\s*\/\s*/g, "/")
    .replace(/\s*\^\s*/g, "^")
    .trim();
  if (normal === "") return { f: 1, d: ONE };
  let f = 1;
  const d = [0, 0, 0, 0];
  const parts = normal.split("/");
  for (let i = 0; i < parts.length; i++) {
    const sign = i === 0 ? 1 : -1;
    const tokens = parts[i].split(/\s+/).filter((t) => t.length > 0);
    if (tokens.length === 0) return undefined;
    for (const tok of tokens) {
      if (i === 0 && tok === "1" && parts.length > 1 && tokens.length === 1) continue;
      const m = /^([^\^]+?)(\d)?(?:\^(-?\d+))?$/.exec(tok);
      if (!m) return undefined;
      let name = m[1];
      let pow = m[3] !== undefined ? Number(m[3]) : 1;
      if (m[2] !== undefined) {
        if (m[3] !== undefined) return undefined;
        // "m3" for m^3
        pow = Number(m[2]);
      } else {
        name = m[1];
      }
      const u = lookupUnit(name);
      if (!u) return undefined;
      f *= Math.pow(u.f, sign * pow);
      for (let k = 0; k < 4; k++) d[k] += sign * pow * u.d[k];
    }
  }
  return { f, d: [d[0], d[1], d[2], d[3]] };
}

function sameDim(a: Dim, b: Dim): boolean {
  return a[0] === b[0] && a[1] === b[1] && a[2] === b[2] && a[3] === b[3];
}

/** Result of the fast parser: a value, or why it could not read the text. */
type FastResult = { ok: true; value: number } | { ok: false; wrongDimension: boolean };

function fastParse(text: string, dimension: Dimension): FastResult {
  const m = NUMBER.exec(text.replace(/\u2212/g, "-"));
  if (!m) return { ok: false, wrongDimension: false };
  const x = Number(m[1]);
  const unit = m[2].replace(/^deg\s+([CF])$/, "deg$1");
  if (!Number.isFinite(x)) return { ok: false, wrongDimension: false };
  if (dimension === "temperature") {
    const t = TEMPERATURES[unit];
    if (t) return finite(t(x));
    return { ok: false, wrongDimension: parseUnitExpr(unit) !== undefined };
  }
  if (dimension === "temperatureDifference") {
    const t = TEMPERATURE_DIFFERENCES[unit];
    if (t !== undefined) return finite(x * t);
    return { ok: false, wrongDimension: parseUnitExpr(unit) !== undefined };
  }
  if (dimension === "pressure") {
    // gauge and absolute marks in any case: barg, bar(g), BARG, psia, PSI(A)
    const key = unit.toLowerCase().replace(/\s*\(([ga])\)$/, "$1");
    if (PRESSURES[key]) return finite(PRESSURES[key](x));
  }
  if (unit === "" && dimension !== "ratio") return { ok: false, wrongDimension: true };
  const u = parseUnitExpr(unit) ?? foldedUnit(unit);
  if (!u) {
    return { ok: false, wrongDimension: TEMPERATURES[unit] !== undefined || unit in PRESSURES };
  }
  if (!sameDim(u.d, DIMS[dimension])) return { ok: false, wrongDimension: true };
  return finite(x * u.f);
}

/** A value that overflowed in the conversion (for example "1e308 km") is not read. */
function finite(value: number): FastResult {
  return Number.isFinite(value) ? { ok: true, value } : { ok: false, wrongDimension: false };
}

/**
 * Read a quantity written as text into its SI value, synchronously, with the fast table.
 *
 * Accepts `number unit` where unit is a product or quotient of table units with SI
 * prefixes and powers (`mm`, `m^3/h`, `kg/m^3`, `mPa s`, `1/m`). Temperatures convert to
 * kelvin, pressures are absolute (gauge `barg`, `psig` add 101 325 Pa), ratios accept `%`,
 * `ppm` or a bare number. A bare number is refused for every other dimension.
 *
 * @param text the quantity as written, for example `"12 degC"`
 * @param dimension the dimension the field expects
 * @param field the field's name, for the error message
 * @returns the value in SI units (m, kg, s, K, Pa, m³/s, m/s, rad, …)
 * @throws {UnitError} on a wrong dimension, an unknown unit or a non-number
 *
 * @example
 * ```ts
 * import { parseQuantity } from "./units.ts";
 * const t = parseQuantity("12 degC", "temperature", "fluid.temperature");
 * if (Math.abs(t - 285.15) > 1e-12) throw new Error("degC");
 * const q = parseQuantity("72 m^3/h", "flowRate", "flow.design");
 * if (Math.abs(q - 0.02) > 1e-15) throw new Error("m^3/h");
 * ```
 */
export function parseQuantity(text: string, dimension: Dimension, field: string): number {
  if (typeof text === "number") {
    if (dimension === "ratio" && Number.isFinite(text)) return text;
    throw new UnitError(field, `bare number ${text}`, ACCEPTED[dimension]);
  }
  if (typeof text !== "string") {
    throw new UnitError(field, describe(text), ACCEPTED[dimension]);
  }
  const r = fastParse(text, dimension);
  if (r.ok) return r.value;
  throw new UnitError(field, JSON.stringify(text), ACCEPTED[dimension]);
}

/**
 * Read a quantity like {@link parseQuantity}, falling back to mathjs (imported lazily)
 * for what the fast table does not read, for example `"5 ft + 3 inch"`.
 *
 * @param text the quantity as written
 * @param dimension the dimension the field expects
 * @param field the field's name, for the error message
 * @returns the value in SI units
 * @throws {UnitError} on a wrong dimension or an unreadable text
 *
 * @example
 * ```ts
 * import { parseQuantityFull } from "./units.ts";
 * const l = await parseQuantityFull("1 ft + 6 inch", "length", "run.length");
 * if (Math.abs(l - 0.4572) > 1e-12) throw new Error("expression");
 * ```
 */
export async function parseQuantityFull(
  text: string,
  dimension: Dimension,
  field: string,
): Promise<number> {
  if (typeof text !== "string") return parseQuantity(text, dimension, field);
  const r = fastParse(text, dimension);
  if (r.ok) return r.value;
  if (r.wrongDimension || dimension === "temperature" || dimension === "temperatureDifference") {
    throw new UnitError(field, JSON.stringify(text), ACCEPTED[dimension]);
  }
  const value = await mathjsToSI(text, dimension);
  if (value === undefined || !Number.isFinite(value)) {
    throw new UnitError(field, JSON.stringify(text), ACCEPTED[dimension]);
  }
  return value;
}

/** SI unit strings mathjs understands, per dimension (used by the fallback and the tests). */
export const SI_UNIT: Record<Exclude<Dimension, "temperature" | "temperatureDifference">, string> =
  {
    length: "m",
    area: "m^2",
    volume: "m^3",
    mass: "kg",
    time: "s",
    frequency: "Hz",
    pressure: "Pa",
    flowRate: "m^3/s",
    speed: "m/s",
    angle: "rad",
    density: "kg/m^3",
    dynamicViscosity: "Pa s",
    kinematicViscosity: "m^2/s",
    ratio: "",
    attenuation: "1/m",
  };

// deno-lint-ignore no-explicit-any
let mathjsInstance: any;

/**
 * Load mathjs once, with the gallon-per-minute unit added, and with the functions that
 * could evaluate arbitrary code disabled. Exposed for the tests that check the fast table.
 *
 * @returns the mathjs instance
 *
 * @example
 * ```ts
 * import { loadMathjs } from "./units.ts";
 * const math = await loadMathjs();
 * if (Math.abs(math.unit("1 gpm").toNumber("m^3/s") - 6.30901964e-5) > 1e-12) throw new Error();
 * ```
 */
// deno-lint-ignore no-explicit-any
export async function loadMathjs(): Promise<any> {
  if (mathjsInstance) return mathjsInstance;
  const { create, all } = await import("mathjs");
  const math = create(all, {});
  math.createUnit("gpm", { definition: "1 gallon/minute" }, { override: true });
  const parse = math.parse;
  const unit = math.unit;
  const blocked = (name: string) => () => {
    throw new Error(`function ${name} is disabled`);
  };
  math.import({
    import: blocked("import"),
    createUnit: blocked("createUnit"),
    reviver: blocked("reviver"),
    evaluate: blocked("evaluate"),
    parse: blocked("parse"),
    simplify: blocked("simplify"),
    derivative: blocked("derivative"),
    resolve: blocked("resolve"),
  }, { override: true });
  mathjsInstance = { parse, unit };
  return mathjsInstance;
}

const ALLOWED_NODES = new Set([
  "ConstantNode",
  "OperatorNode",
  "ParenthesisNode",
  "SymbolNode",
]);

async function mathjsToSI(text: string, dimension: Dimension): Promise<number | undefined> {
  if (dimension === "temperature" || dimension === "temperatureDifference") return undefined;
  if (text.length > 200) return undefined;
  const math = await loadMathjs();
  try {
    const node = math.parse(text);
    let safe = true;
    // deno-lint-ignore no-explicit-any
    node.traverse((n: any) => {
      if (!ALLOWED_NODES.has(n.type)) safe = false;
      if (n.type === "OperatorNode" && !["+", "-", "*", "/", "^"].includes(n.op)) {
        safe = false;
      }
    });
    if (!safe) return undefined;
    const v = node.evaluate();
    const si = SI_UNIT[dimension];
    if (si === "") return typeof v === "number" ? v : undefined;
    if (!v || typeof v.toNumber !== "function") return undefined;
    return v.toNumber(si);
  } catch {
    return undefined;
  }
}

/**
 * Format an SI value in a display unit of the fast table (for reports and scripts).
 *
 * @param value SI value
 * @param unit display unit, for example `"mm"`, `"degC"`, `"L/s"`, `"us"`
 * @param digits significant digits (default 4)
 * @returns the number in the display unit, rounded to `digits` significant digits
 *
 * @example
 * ```ts
 * import { toUnit } from "./units.ts";
 * if (toUnit(0.1143, "mm") !== 114.3) throw new Error("mm");
 * if (toUnit(293.15, "degC") !== 20) throw new Error("degC");
 * ```
 */
export function toUnit(value: number, unit: string, digits = 4): number {
  let x: number;
  if (TEMPERATURES[unit]) {
    const at0 = TEMPERATURES[unit](0);
    const at1 = TEMPERATURES[unit](1);
    x = (value - at0) / (at1 - at0);
  } else {
    const u = parseUnitExpr(unit);
    if (!u) throw new UnitError("display unit", JSON.stringify(unit), "a unit of the fast table");
    x = value / u.f;
  }
  return Number(x.toPrecision(digits));
}

/**
 * The SI factor of a unit expression of the fast table (exposed for the tests).
 *
 * @param unit unit expression, for example `"m^3/h"`
 * @returns factor to SI, or undefined when the table does not read it
 *
 * @example
 * ```ts
 * import { unitFactor } from "./units.ts";
 * if (unitFactor("mm") !== 1e-3) throw new Error("mm");
 * ```
 */
export function unitFactor(unit: string): number | undefined {
  return parseUnitExpr(unit)?.f;
}

function describe(v: unknown): string {
  if (v === null) return "null";
  if (Array.isArray(v)) return "a list";
  if (typeof v === "object") return "an object";
  return `${typeof v} ${String(v)}`;
}

/**
 * The fast table's contents, so the tests can check every entry against mathjs.
 *
 * @returns base units (with whether they take SI prefixes), the prefixes with their
 *   factors, and the temperature, temperature-difference and gauge/absolute pressure units
 *
 * @example
 * ```ts
 * import { fastTable } from "./units.ts";
 * const t = fastTable();
 * if (!t.units.some((u) => u.unit === "m" && u.prefix)) throw new Error("m");
 * if (!t.temperatures.includes("degF")) throw new Error("degF");
 * ```
 */
export function fastTable(): {
  units: { unit: string; prefix: boolean }[];
  prefixes: { prefix: string; factor: number }[];
  temperatures: string[];
  temperatureDifferences: string[];
  pressures: string[];
} {
  return {
    units: Object.entries(UNITS).map(([unit, u]) => ({ unit, prefix: u.prefix === true })),
    prefixes: Object.entries(PREFIXES).map(([prefix, factor]) => ({ prefix, factor })),
    temperatures: Object.keys(TEMPERATURES),
    temperatureDifferences: Object.keys(TEMPERATURE_DIFFERENCES),
    pressures: Object.keys(PRESSURES),
  };
}

/**
 * A note for a pressure written in bare `psi`: the toolkit reads it as absolute, where
 * a gauge on site usually shows gauge pressure. Common practice: say so rather than guess.
 *
 * @param text the pressure as written
 * @returns the note, or undefined when the text names gauge or absolute explicitly (or is SI)
 *
 * @example
 * ```ts
 * import { absolutePressureNote } from "./units.ts";
 * if (!absolutePressureNote("72 PSI")?.includes("psig")) throw new Error();
 * if (absolutePressureNote("72 psig") !== undefined) throw new Error();
 * ```
 */
export function absolutePressureNote(text: string): string | undefined {
  const m = /^\s*[+-]?[\d.eE+-]+\s*(psi)\s*$/i.exec(text);
  if (!m) return undefined;
  const u = m[1].toLowerCase();
  return `"${text.trim()}" read as absolute pressure (${u}a); write ${u}g for a gauge reading`;
}

/**
 * A value in SI shown in the unit the user wrote a quantity in: `inUnitOf(0.0063, "100 GPM",
 * "flowRate")` → `"99.86 GPM"`. The unit is read exactly as the parser reads it (any case the
 * parser accepts, gauge or absolute pressure marks, temperature scales with their offset): the
 * conversion is x = (v − s(0)) / (s(1) − s(0)) with s(u) = the SI value of `u <unit>`.
 *
 * @param value the value, SI
 * @param written a quantity as the user wrote it (`"4.5 in"`, `"68 degF"`, `"30 psig"`)
 * @param dimension its dimension
 * @param digits significant digits (default 4)
 * @returns the value with the user's unit, or undefined when `written` carries no unit or the
 *   unit is the SI unit itself
 *
 * @example
 * ```ts
 * import { inUnitOf } from "./units.ts";
 * if (inUnitOf(0.1143, "4.5 in", "length") !== "4.5 in") throw new Error("in");
 * if (inUnitOf(293.15, "68 degF", "temperature") !== "68 degF") throw new Error("degF");
 * if (inUnitOf(2, "1 m", "length") !== undefined) throw new Error("SI unit: nothing to add");
 * ```
 */
export function inUnitOf(
  value: number,
  written: string,
  dimension: Dimension,
  digits = 4,
): string | undefined {
  if (typeof written !== "string" || !Number.isFinite(value)) return undefined;
  const m = NUMBER.exec(written.trim().replace(/\u2212/g, "-"));
  const unit = m?.[2]?.trim();
  if (!unit) return undefined;
  let s0: number, s1: number;
  try {
    s0 = parseQuantity(`0 ${unit}`, dimension, "unit");
    s1 = parseQuantity(`1 ${unit}`, dimension, "unit");
  } catch {
    return undefined;
  }
  if (s0 === 0 && s1 === 1) return undefined;
  const x = (value - s0) / (s1 - s0);
  return `${Number(x.toPrecision(digits))} ${unit}`;
}
