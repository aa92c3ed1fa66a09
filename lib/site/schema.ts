/**
 * The site file's validated form: {@link SiteInput}, SI numbers only, and its zod schema.
 *
 * The reader (`read.ts`) turns a YAML, JSON or CSV site description written with unit strings
 * into this shape; every later stage (the plan, reconciliation, reports) reads only this shape.
 * Units inside are SI: m, s, K, Pa, m/s, m³/s, m²/s, kg/m³, Hz, rad, and plain fractions for
 * ratios (0.02 for 2 %).
 *
 * @module
 */
import { z } from "zod";

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
  /** Angle of the fitting's plane to the beam plane, rad. */
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

const finite = z.number().finite();
const positive = finite.positive();
const nonNegative = finite.nonnegative();
const fraction = finite.min(0).max(1);
const idText = z.string().regex(/^[a-z0-9][a-z0-9.+-]*$/);

const fitting = z.strictObject({ fitting: idText, orientation: finite.optional() });

/** One problem found by {@link SiteInputSchema}. */
export interface SiteSchemaIssue {
  /** Key path of the problem. */
  readonly path: readonly PropertyKey[];
  /** What is wrong. */
  readonly message: string;
}

/** The part of a zod schema that {@link SiteInputSchema} promises: `parse` and `safeParse`. */
export interface SiteInputValidator {
  /** Return the data typed as a site, or throw zod's error. */
  parse(data: unknown): SiteInput;
  /** Check the data without throwing. */
  safeParse(
    data: unknown,
  ):
    | { success: true; data: SiteInput }
    | { success: false; error: { issues: readonly SiteSchemaIssue[] } };
}

/**
 * The zod schema of {@link SiteInput} (a zod v4 strict object; typed here by the part of its
 * interface we promise): every site the reader returns satisfies it.
 *
 * @example
 * ```ts
 * import { SiteInputSchema } from "./schema.ts";
 * if (SiteInputSchema.safeParse({ name: "x" }).success) throw new Error("incomplete site");
 * ```
 */
export const SiteInputSchema: SiteInputValidator = z.strictObject({
  name: z.string().min(1),
  id: z.string().min(1).optional(),
  invented: z.boolean().optional(),
  pipe: z.strictObject({
    geometry: z.enum(["catalogue", "measured"]),
    standard: z.string().min(1).optional(),
    nps: z.string().min(1).optional(),
    schedule: z.string().min(1).optional(),
    outsideDiameter: positive.optional(),
    circumference: positive.optional(),
    wallThickness: positive.optional(),
    material: idText.optional(),
    wallSoundSpeed: positive.optional(),
    wallShearSpeed: positive.optional(),
    measuredWallThickness: positive.optional(),
    roughness: nonNegative.optional(),
    lining: z.strictObject({
      material: idText,
      thickness: positive,
      soundSpeed: positive.optional(),
    }).optional(),
  }),
  fluid: z.strictObject({
    liquid: idText,
    temperature: positive,
    pressure: positive,
    salinity: nonNegative.optional(),
    temperatureRange: z.strictObject({ min: positive, max: positive }).optional(),
    soundSpeed: positive.optional(),
    density: positive.optional(),
    kinematicViscosity: positive.optional(),
    formulation: idText.optional(),
  }),
  flow: z.strictObject({
    quantity: z.enum(["flowRate", "velocity"]),
    minimum: positive,
    design: positive.optional(),
    maximum: positive,
  }),
  transducer: z.strictObject({
    wedgeMaterial: idText.optional(),
    wedgeSoundSpeed: positive.optional(),
    wedgeAngle: positive,
    frequency: positive,
    timingResolution: positive.optional(),
    zeroOffset: finite.optional(),
    fixedDelay: nonNegative.optional(),
    wedgeTemperatureCoefficient: finite.optional(),
    wedgeReferenceTemperature: positive.optional(),
    elementHeight: positive.optional(),
    indexOffset: finite.optional(),
  }),
  mountings: z.array(z.number().int().min(1).max(MAX_TRAVERSES)).min(1),
  run: z.strictObject({
    length: positive,
    upstream: fitting,
    downstream: fitting.optional(),
    plannedPosition: nonNegative.optional(),
  }).optional(),
  targetUncertainty: finite.gt(0).lt(1).optional(),
  content: z.strictObject({ solids: fraction.optional(), gas: fraction.optional() }).optional(),
  notes: z.string().optional(),
  defaults: z.array(z.strictObject({
    field: z.string(),
    value: z.unknown(),
    message: z.string(),
  })),
  source: z.strictObject({
    file: z.string(),
    format: z.enum(["yaml", "json", "csv"]),
    row: z.number().int().positive().optional(),
  }),
});

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
