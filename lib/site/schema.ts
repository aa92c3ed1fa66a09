/**
 * The site file's validated form: {@link SiteInput}, SI numbers only, and its check.
 *
 * The reader (`read.ts`) turns a YAML, JSON or CSV site description written with unit strings
 * into this shape; every later stage (the plan, reconciliation, reports) reads only this shape.
 * Units inside are SI: m, s, K, Pa, m/s, m³/s, m²/s, kg/m³, Hz, rad, and plain fractions for
 * ratios (0.02 for 2 %).
 *
 * @module
 */

/** Formulations of the water properties a site may ask for (see DESIGN.md, `water`). */
export const WATER_FORMULATIONS = ["iapws95", "if97", "del-grosso-mader", "marczak"] as const;

/** Largest site file read, in bytes (YAML or JSON). */
export const MAX_SITE_BYTES = 256 * 1024;

/** Largest fleet CSV read, in bytes. */
export const MAX_SITES_CSV_BYTES = 4 * 1024 * 1024;

/** Traverse counts a site may ask for: integers 1 to 8. */
export const MAX_TRAVERSES = 8;

/** A lining on the inner wall. */
export interface SiteLining {
  /** Lining material id, for example `cement-mortar`. */
  material: string;
  /** Thickness, m. */
  thickness: number;
  /** Longitudinal sound speed override, m/s. */
  soundSpeed?: number;
}

/**
 * The pipe: from the catalogue (standard, NPS, schedule), measured (outside diameter or
 * circumference, and wall thickness), or both, in which case `geometry` is `"measured"`: the
 * measured size wins.
 */
export interface SitePipe {
  /** Which size the plan uses. */
  geometry: "catalogue" | "measured";
  /** Dimension standard, for example `ASME B36.10M`. */
  standard?: string;
  /** Nominal pipe size designation, for example `"8"`, `"1-1/2"`. */
  nps?: string;
  /** Schedule designation, for example `"40"`, `"STD"`, `"10S"`. */
  schedule?: string;
  /** Measured outside diameter, m. */
  outsideDiameter?: number;
  /** Measured circumference, m. */
  circumference?: number;
  /** Thickness of the tape the circumference was taped with, m (OD = C/π − 2·tape). */
  tapeThickness?: number;
  /** Wall thickness of the measured pipe, m. */
  wallThickness?: number;
  /** Pipe material id, for example `carbon-steel`. */
  material?: string;
  /** Longitudinal sound speed override of the wall, m/s. */
  wallSoundSpeed?: number;
  /** Shear sound speed override of the wall, m/s. */
  wallShearSpeed?: number;
  /** Thickness-gauge reading, m. */
  measuredWallThickness?: number;
  /** Absolute roughness of the bore, m. */
  roughness?: number;
  /** Lining, if any. */
  lining?: SiteLining;
}

/** The liquid and its operating state; the overrides replace the registry's values. */
export interface SiteFluid {
  /** Liquid id, for example `water`, `seawater`. */
  liquid: string;
  /** Operating temperature, K. */
  temperature: number;
  /** Absolute pressure, Pa. */
  pressure: number;
  /** Practical salinity (PSS-78), dimensionless. */
  salinity?: number;
  /** Seasonal temperature range, K. */
  temperatureRange?: { min: number; max: number };
  /** Sound speed override, m/s. */
  soundSpeed?: number;
  /** Density override, kg/m³. */
  density?: number;
  /** Kinematic viscosity override, m²/s. */
  kinematicViscosity?: number;
  /** Formulation id, for example `iapws95`. */
  formulation?: string;
}

/** The flow range: volume flow rates (m³/s) or area-mean velocities (m/s), per `quantity`. */
export interface SiteFlow {
  /** What the numbers are. */
  quantity: "flowRate" | "velocity";
  /** Lowest flow to measure (> 0), m³/s or m/s. */
  minimum: number;
  /** Design flow, m³/s or m/s. */
  design?: number;
  /** Highest flow, m³/s or m/s. */
  maximum: number;
}

/** The transducer pair. */
export interface SiteTransducer {
  /** Wedge material id, for example `acrylic`. */
  wedgeMaterial?: string;
  /** Wedge sound speed, m/s (wins over the material's). */
  wedgeSoundSpeed?: number;
  /** Beam angle in the wedge from the wall normal, rad. */
  wedgeAngle: number;
  /** Centre frequency, Hz. */
  frequency: number;
  /** Timing resolution, s. */
  timingResolution?: number;
  /** Zero offset of Δt, s (signed). */
  zeroOffset?: number;
  /** Fixed delay in wedges, cables and electronics, s. */
  fixedDelay?: number;
  /** Change of wedge sound speed with temperature, m/s/K. */
  wedgeTemperatureCoefficient?: number;
  /** Temperature at which a stated wedge sound speed holds, K (default: the line temperature). */
  wedgeReferenceTemperature?: number;
  /** Element height, m. */
  elementHeight?: number;
  /** Index offset, m (signed). */
  indexOffset?: number;
}

/** A fitting bounding the straight run. */
export interface SiteFitting {
  /** Fitting id, for example `elbow-90`. */
  fitting: string;
  /**
   * Angle of the fitting's plane, rad: to the beam plane when the position is planned; from the
   * vertical (the reference of the path planes the plan ranks) otherwise.
   */
  orientation?: number;
}

/** The available straight run between two fittings. */
export interface SiteRun {
  /** Length of the straight run, m. */
  length: number;
  /** Fitting at the upstream end. */
  upstream: SiteFitting;
  /**
   * Fitting at the downstream end; optional: when absent the plan assumes the registry fitting
   * with the most demanding downstream requirement and says so in a `default` warning.
   */
  downstream?: SiteFitting;
  /** Planned position from the upstream fitting, m. */
  plannedPosition?: number;
}

/** A value the reader supplied because the file left it out. */
export interface SiteDefault {
  /** Key path, for example `fluid.pressure`. */
  field: string;
  /** The value assumed (SI). */
  value: unknown;
  /** One-line message for the plan to print. */
  message: string;
}

/** Where a site came from. */
export interface SiteSource {
  /** File name, or `<text>` / `<csv>`. */
  file: string;
  /** Format read. */
  format: "yaml" | "json" | "csv";
  /** CSV: the file line where the row starts. */
  row?: number;
}

/** A validated site, SI inside (m, s, K, Pa, m/s, m³/s, m²/s, kg/m³, Hz, rad, fractions). */
export interface SiteInput {
  /** Site name. */
  name: string;
  /** Short id, for fleets. */
  id?: string;
  /** True for a made-up scenario (demo sites). */
  invented?: boolean;
  /** The pipe. */
  pipe: SitePipe;
  /** The liquid. */
  fluid: SiteFluid;
  /** The flow range. */
  flow: SiteFlow;
  /** The transducer pair. */
  transducer: SiteTransducer;
  /** Traverse counts to evaluate, sorted, 1–8. */
  mountings: number[];
  /** The straight run, if described. */
  run?: SiteRun;
  /** Expanded (k = 2) relative target uncertainty, fraction. */
  targetUncertainty?: number;
  /** Volume fractions of solids and gas. */
  content?: { solids?: number; gas?: number };
  /** Free notes. */
  notes?: string;
  /** What the reader assumed. */
  defaults: SiteDefault[];
  /** Where the site came from. */
  source: SiteSource;
}

// The check below is hand-written (no zod on the site-read path: importing zod and building its
// schema cost more than a one-site run's reading). It gives the issues, paths and messages that
// the equivalent zod v4 strict-object schema gives, in the same order (tests/site/schema_check.test.ts
// compares the two on many broken sites).

/** A check of one value: pushes its problems (path, message) and returns nothing. */
type Check = (v: unknown, path: PropertyKey[], out: SiteSchemaIssue[]) => void;

function received(v: unknown): string {
  if (v === null) return "null";
  if (Array.isArray(v)) return "array";
  if (typeof v === "number") {
    return Number.isNaN(v)
      ? "NaN"
      : Number.isFinite(v)
      ? "number"
      : v > 0
      ? "Infinity"
      : "-Infinity";
  }
  if (typeof v === "object") {
    const c = Object.getPrototypeOf(v)?.constructor?.name;
    return c && c !== "Object" ? c : "object";
  }
  return typeof v;
}

const bad = (out: SiteSchemaIssue[], path: PropertyKey[], message: string) =>
  void out.push({ path: [...path], message });
const expected = (out: SiteSchemaIssue[], path: PropertyKey[], what: string, v: unknown) =>
  bad(out, path, `Invalid input: expected ${what}, received ${received(v)}`);

interface NumberRule {
  int?: boolean;
  gt?: number;
  ge?: number;
  lt?: number;
  le?: number;
}

function num(rule: NumberRule = {}): Check {
  return (v, path, out) => {
    if (typeof v !== "number" || !Number.isFinite(v)) return expected(out, path, "number", v);
    if (rule.int) {
      if (!Number.isInteger(v)) return expected(out, path, "int", v);
      if (v > Number.MAX_SAFE_INTEGER) {
        bad(out, path, `Too big: expected int to be <=${Number.MAX_SAFE_INTEGER}`);
      } else if (v < -Number.MAX_SAFE_INTEGER) {
        bad(out, path, `Too small: expected int to be >=${-Number.MAX_SAFE_INTEGER}`);
      }
    }
    const what = "number";
    if (rule.gt !== undefined && !(v > rule.gt)) {
      bad(out, path, `Too small: expected ${what} to be >${rule.gt}`);
    }
    if (rule.ge !== undefined && !(v >= rule.ge)) {
      bad(out, path, `Too small: expected ${what} to be >=${rule.ge}`);
    }
    if (rule.lt !== undefined && !(v < rule.lt)) {
      bad(out, path, `Too big: expected ${what} to be <${rule.lt}`);
    }
    if (rule.le !== undefined && !(v <= rule.le)) {
      bad(out, path, `Too big: expected ${what} to be <=${rule.le}`);
    }
  };
}

function str(min = 0, pattern?: RegExp): Check {
  return (v, path, out) => {
    if (typeof v !== "string") return expected(out, path, "string", v);
    if (v.length < min) bad(out, path, `Too small: expected string to have >=${min} characters`);
    if (pattern && !pattern.test(v)) {
      bad(out, path, `Invalid string: must match pattern ${pattern}`);
    }
  };
}

const bool: Check = (v, path, out) => {
  if (typeof v !== "boolean") expected(out, path, "boolean", v);
};

function oneOf(options: readonly string[]): Check {
  return (v, path, out) => {
    if (typeof v !== "string" || !options.includes(v)) {
      bad(out, path, `Invalid option: expected one of ${options.map((o) => `"${o}"`).join("|")}`);
    }
  };
}

/** Marks a key that may be absent (or undefined). */
const OPTIONAL = Symbol("optional");
/** Marks a key that must be there, whatever its value (undefined included). */
const KEY = Symbol("key");
type Field = Check & { [OPTIONAL]?: true; [KEY]?: true };

const present: Field = Object.assign((() => {}) as Check, { [KEY]: true as const });
function opt(c: Check): Field {
  const f: Field = (v, path, out) => {
    if (v !== undefined) c(v, path, out);
  };
  f[OPTIONAL] = true;
  return f;
}

function strict(shape: Record<string, Field>): Check {
  const keys = Object.keys(shape);
  return (v, path, out) => {
    if (v === null || typeof v !== "object" || Array.isArray(v)) {
      return expected(out, path, "object", v);
    }
    const o = v as Record<string, unknown>;
    for (const k of keys) {
      path.push(k);
      if (shape[k][KEY] && !Object.hasOwn(o, k)) expected(out, path, "nonoptional", undefined);
      else shape[k](o[k], path, out);
      path.pop();
    }
    const extra = Object.keys(o).filter((k) => !Object.hasOwn(shape, k));
    if (extra.length) {
      const list = extra.map((k) => `"${k}"`).join(", ");
      bad(out, path, `Unrecognized key${extra.length > 1 ? "s" : ""}: ${list}`);
    }
  };
}

function list(item: Check, min = 0): Check {
  return (v, path, out) => {
    if (!Array.isArray(v)) return expected(out, path, "array", v);
    for (let i = 0; i < v.length; i++) {
      path.push(i);
      item(v[i], path, out);
      path.pop();
    }
    if (v.length < min) bad(out, path, `Too small: expected array to have >=${min} items`);
  };
}

const finite = num();
const positive = num({ gt: 0 });
const nonNegative = num({ ge: 0 });
const fraction = num({ ge: 0, le: 1 });
const idText = str(0, /^[a-z0-9][a-z0-9.+-]*$/);
const text1 = str(1);

const fitting = strict({ fitting: idText, orientation: opt(finite) });

const siteCheck = strict({
  name: text1,
  id: opt(text1),
  invented: opt(bool),
  pipe: strict({
    geometry: oneOf(["catalogue", "measured"]),
    standard: opt(text1),
    nps: opt(text1),
    schedule: opt(text1),
    outsideDiameter: opt(positive),
    circumference: opt(positive),
    tapeThickness: opt(nonNegative),
    wallThickness: opt(positive),
    material: opt(idText),
    wallSoundSpeed: opt(positive),
    wallShearSpeed: opt(positive),
    measuredWallThickness: opt(positive),
    roughness: opt(nonNegative),
    lining: opt(strict({ material: idText, thickness: positive, soundSpeed: opt(positive) })),
  }),
  fluid: strict({
    liquid: idText,
    temperature: positive,
    pressure: positive,
    salinity: opt(nonNegative),
    temperatureRange: opt(strict({ min: positive, max: positive })),
    soundSpeed: opt(positive),
    density: opt(positive),
    kinematicViscosity: opt(positive),
    formulation: opt(idText),
  }),
  flow: strict({
    quantity: oneOf(["flowRate", "velocity"]),
    minimum: positive,
    design: opt(positive),
    maximum: positive,
  }),
  transducer: strict({
    wedgeMaterial: opt(idText),
    wedgeSoundSpeed: opt(positive),
    wedgeAngle: positive,
    frequency: positive,
    timingResolution: opt(positive),
    zeroOffset: opt(finite),
    fixedDelay: opt(nonNegative),
    wedgeTemperatureCoefficient: opt(finite),
    wedgeReferenceTemperature: opt(positive),
    elementHeight: opt(positive),
    indexOffset: opt(finite),
  }),
  mountings: list(num({ int: true, ge: 1, le: MAX_TRAVERSES }), 1),
  run: opt(strict({
    length: positive,
    upstream: fitting,
    downstream: opt(fitting),
    plannedPosition: opt(nonNegative),
  })),
  targetUncertainty: opt(num({ gt: 0, lt: 1 })),
  content: opt(strict({ solids: opt(fraction), gas: opt(fraction) })),
  notes: opt(str()),
  defaults: list(strict({ field: str(), value: present, message: str() })),
  source: strict({
    file: str(),
    format: oneOf(["yaml", "json", "csv"]),
    row: opt(num({ int: true, gt: 0 })),
  }),
});

/** One problem found by {@link SiteInputSchema}. */
export interface SiteSchemaIssue {
  /** Key path of the problem. */
  readonly path: readonly PropertyKey[];
  /** What is wrong. */
  readonly message: string;
}

/** What {@link SiteInputSchema} offers: `parse` and `safeParse`, as a zod schema would. */
export interface SiteInputValidator {
  /** Return the data typed as a site, or throw an error naming the first problem. */
  parse(data: unknown): SiteInput;
  /** Check the data without throwing. */
  safeParse(
    data: unknown,
  ):
    | { success: true; data: SiteInput }
    | { success: false; error: { issues: readonly SiteSchemaIssue[] } };
}

/**
 * The check of {@link SiteInput}: every site the reader returns satisfies it. Strict objects
 * (unknown keys refused), SI numbers finite and within their sign ranges, ids in lower case,
 * mountings integers 1 to {@link MAX_TRAVERSES}. Issues come in key order, each object's
 * unknown keys after its known ones, with the paths and messages of the equivalent zod v4
 * strict-object schema.
 *
 * @example
 * ```ts
 * import { SiteInputSchema } from "./schema.ts";
 * const r = SiteInputSchema.safeParse({ name: "x" });
 * if (r.success || r.error.issues[0].path.join(".") !== "pipe") throw new Error("incomplete site");
 * ```
 */
export const SiteInputSchema: SiteInputValidator = {
  safeParse(data: unknown) {
    const issues: SiteSchemaIssue[] = [];
    siteCheck(data, [], issues);
    return issues.length
      ? { success: false, error: { issues } }
      : { success: true, data: data as SiteInput };
  },
  parse(data: unknown): SiteInput {
    const r = SiteInputSchema.safeParse(data);
    if (!r.success) {
      const i = r.error.issues[0];
      throw new TypeError(`invalid site at ${i.path.join(".") || "(root)"}: ${i.message}`);
    }
    return r.data;
  },
};

/**
 * The keys a site file may hold, per object path (`""` is the top level). The reader refuses
 * any other key and suggests the nearest of these.
 */
export const SITE_KEYS: Readonly<Record<string, readonly string[]>> = {
  "": [
    "name",
    "id",
    "invented",
    "pipe",
    "fluid",
    "flow",
    "transducer",
    "mountings",
    "run",
    "targetUncertainty",
    "content",
    "notes",
  ],
  pipe: [
    "standard",
    "nps",
    "schedule",
    "outsideDiameter",
    "circumference",
    "tapeThickness",
    "wallThickness",
    "material",
    "wallSoundSpeed",
    "wallShearSpeed",
    "measuredWallThickness",
    "roughness",
    "lining",
  ],
  "pipe.lining": ["material", "thickness", "soundSpeed"],
  fluid: [
    "liquid",
    "temperature",
    "pressure",
    "salinity",
    "temperatureRange",
    "soundSpeed",
    "density",
    "kinematicViscosity",
    "formulation",
  ],
  "fluid.temperatureRange": ["min", "max"],
  flow: ["minimum", "design", "maximum", "minimumVelocity", "designVelocity", "maximumVelocity"],
  transducer: [
    "wedgeMaterial",
    "wedgeSoundSpeed",
    "wedgeAngle",
    "frequency",
    "timingResolution",
    "zeroOffset",
    "fixedDelay",
    "wedgeTemperatureCoefficient",
    "wedgeReferenceTemperature",
    "elementHeight",
    "indexOffset",
  ],
  run: ["length", "upstream", "downstream", "plannedPosition"],
  "run.upstream": ["fitting", "orientation"],
  "run.downstream": ["fitting", "orientation"],
  content: ["solids", "gas"],
};
