/**
 * Schema of the liquids other than water and seawater (data/liquids.yaml).
 *
 * Each liquid carries provenance (`source`, `basis`) on itself or on each property, a
 * temperature validity range, and one model per property:
 *
 * - sound speed: `linear` (value at `at`, `slope` m/s per K, optional `curvature` m/s per K²),
 *   `table` (points [°C, m/s], linear between points) or `batzle-wang` (from the entry's `api`);
 *   optional `pressureSlope` in m/s per MPa; `spread` (m/s) and `slopeSpread` (m/s per K).
 * - density: `linear` (value at `at`, `slope` kg/m³ per K), `table` or `batzle-wang`.
 * - viscosity: `table` (points [°C, value in `unit`], ln μ linear in 1/T between points),
 *   `walther` (ASTM D341 through two kinematic-viscosity points [°C, mm²/s]) or `batzle-wang`;
 *   `spread` is relative (0.2 = ±20 %).
 *
 * @module
 */
import { z } from "zod";
import { type Basis, BasisSchema, EntryId, range, SourceId } from "./common.ts";

const Prov = {
  source: SourceId.optional(),
  basis: BasisSchema.optional(),
  copy: z.string().optional(),
  note: z.string().optional(),
};
const Point = z.tuple([z.number(), z.number()]);
const Points = z.array(Point).min(2).refine(
  (p) => p.every((x, i) => i === 0 || x[0] > p[i - 1][0]),
  "points must be in increasing temperature",
);

/** Any property by Batzle & Wang from the entry's `api` (same shape for every property). */
const BatzleWang = z.strictObject({
  model: z.literal("batzle-wang"),
  spread: z.number().nonnegative(),
  ...Prov,
});

/** A property tabulated against temperature, in `unit`. */
const tableModel = <U extends z.ZodType>(unit: U) =>
  z.strictObject({
    model: z.literal("table"),
    unit,
    points: Points,
    spread: z.number().nonnegative(),
    ...Prov,
  });

/** Sound-speed model. */
export const SoundSpeedModel = z.discriminatedUnion("model", [
  z.strictObject({
    model: z.literal("linear"),
    at: z.string(),
    value: z.number().positive(),
    unit: z.literal("m/s"),
    slope: z.number(),
    curvature: z.number().optional(),
    pressureSlope: z.number().optional(),
    spread: z.number().nonnegative(),
    slopeSpread: z.number().nonnegative().optional(),
    ...Prov,
  }),
  z.strictObject({
    model: z.literal("table"),
    unit: z.literal("m/s"),
    points: Points,
    pressureSlope: z.number().optional(),
    /** Points lie on the saturation line: pressure effects count from the vapour pressure. */
    atSaturation: z.boolean().optional(),
    spread: z.number().nonnegative(),
    ...Prov,
  }),
  BatzleWang,
]);

/** Density model. */
export const DensityModel = z.discriminatedUnion("model", [
  z.strictObject({
    model: z.literal("linear"),
    at: z.string(),
    value: z.number().positive(),
    unit: z.literal("kg/m^3"),
    slope: z.number(),
    spread: z.number().nonnegative(),
    ...Prov,
  }),
  tableModel(z.literal("kg/m^3")),
  BatzleWang,
]);

/** Viscosity model. */
export const ViscosityModel = z.discriminatedUnion("model", [
  tableModel(z.enum(["mPa s", "Pa s"])),
  z.strictObject({
    model: z.literal("walther"),
    unit: z.literal("mm^2/s"),
    points: z.tuple([Point, Point]),
    spread: z.number().nonnegative(),
    ...Prov,
  }),
  BatzleWang,
]);

/** Provenance fields a liquid entry or one of its models may carry. */
export interface LiquidProvenance {
  /** Source id in data/sources.yaml. */
  readonly source?: string;
  /** How the datum got into the registry. */
  readonly basis?: Basis;
  /** Where our copy of the source came from, when transcribed from a copy. */
  readonly copy?: string;
  /** Free note. */
  readonly note?: string;
}

/** A point of a liquid table: [temperature °C, value in the table's unit]. */
export type LiquidPoint = readonly [number, number];

/** A validity range as unit strings, for example `{ min: "0 degC", max: "95 degC" }`. */
export interface LiquidRange {
  /** Lower end, a unit string. */
  readonly min: string;
  /** Upper end, a unit string. */
  readonly max: string;
}

/** Sound-speed model of a liquid entry: linear in temperature, a table, or Batzle–Wang. */
export type LiquidSoundSpeedModel =
  | (LiquidProvenance & {
    readonly model: "linear";
    /** Reference temperature, a unit string. */
    readonly at: string;
    /** Sound speed at `at`, m/s. */
    readonly value: number;
    readonly unit: "m/s";
    /** Temperature slope, m/s per K. */
    readonly slope: number;
    /** Temperature curvature, m/s per K². */
    readonly curvature?: number;
    /** Pressure slope, m/s per MPa. */
    readonly pressureSlope?: number;
    /** Half-width of the spread, m/s. */
    readonly spread: number;
    /** Half-width of the spread of the slope, m/s per K. */
    readonly slopeSpread?: number;
  })
  | (LiquidProvenance & {
    readonly model: "table";
    readonly unit: "m/s";
    /** Points [°C, m/s], linear between points. */
    readonly points: readonly LiquidPoint[];
    /** Pressure slope, m/s per MPa. */
    readonly pressureSlope?: number;
    /** Points lie on the saturation line: pressure effects count from the vapour pressure. */
    readonly atSaturation?: boolean;
    /** Half-width of the spread, m/s. */
    readonly spread: number;
  })
  | (LiquidProvenance & {
    readonly model: "batzle-wang";
    /** Half-width of the spread, m/s. */
    readonly spread: number;
  });

/** Density model of a liquid entry: linear in temperature, a table, or Batzle–Wang. */
export type LiquidDensityModel =
  | (LiquidProvenance & {
    readonly model: "linear";
    /** Reference temperature, a unit string. */
    readonly at: string;
    /** Density at `at`, kg/m³. */
    readonly value: number;
    readonly unit: "kg/m^3";
    /** Temperature slope, kg/m³ per K. */
    readonly slope: number;
    /** Half-width of the spread, kg/m³. */
    readonly spread: number;
  })
  | (LiquidProvenance & {
    readonly model: "table";
    readonly unit: "kg/m^3";
    /** Points [°C, kg/m³], linear between points. */
    readonly points: readonly LiquidPoint[];
    /** Half-width of the spread, kg/m³. */
    readonly spread: number;
  })
  | (LiquidProvenance & {
    readonly model: "batzle-wang";
    /** Half-width of the spread, kg/m³. */
    readonly spread: number;
  });

/** Viscosity model of a liquid entry: a table, ASTM D341 (Walther), or Batzle–Wang. */
export type LiquidViscosityModel =
  | (LiquidProvenance & {
    readonly model: "table";
    readonly unit: "mPa s" | "Pa s";
    /** Points [°C, viscosity in `unit`]; ln μ linear in 1/T between points. */
    readonly points: readonly LiquidPoint[];
    /** Relative spread (0.2 = ±20 %). */
    readonly spread: number;
  })
  | (LiquidProvenance & {
    readonly model: "walther";
    readonly unit: "mm^2/s";
    /** Two kinematic-viscosity points [°C, mm²/s]. */
    readonly points: readonly [LiquidPoint, LiquidPoint];
    /** Relative spread (0.2 = ±20 %). */
    readonly spread: number;
  })
  | (LiquidProvenance & {
    readonly model: "batzle-wang";
    /** Relative spread (0.2 = ±20 %). */
    readonly spread: number;
  });

/** One liquid of data/liquids.yaml, as the loader validated it (units as in the file). */
export interface LiquidEntry extends LiquidProvenance {
  /** Entry id, for example `methanol`. */
  readonly id: string;
  /** Human name. */
  readonly name: string;
  /** Category, for example `alcohol` or `petroleum`. */
  readonly category: string;
  /** API gravity, for the Batzle–Wang models of petroleum liquids. */
  readonly api?: number;
  /** Mass fraction of the solute in water, for aqueous mixtures. */
  readonly massFraction?: number;
  /** Validity ranges (unit strings). */
  readonly validity: {
    /** Temperature range. */
    readonly temperature: LiquidRange;
    /** Pressure range, when stated. */
    readonly pressure?: LiquidRange;
  };
  /** Vapour pressure points [°C, kPa]; ln p linear in 1/T. Below it the liquid boils. */
  readonly vapourPressure?: LiquidProvenance & {
    readonly unit: "kPa";
    readonly points: readonly LiquidPoint[];
  };
  /** Sound-speed model. */
  readonly soundSpeed: LiquidSoundSpeedModel;
  /** Density model. */
  readonly density: LiquidDensityModel;
  /** Viscosity model. */
  readonly viscosity: LiquidViscosityModel;
}

/** Schema of one {@link LiquidEntry}. */
export const LiquidSchema: z.ZodType<LiquidEntry> = z.strictObject({
  id: EntryId,
  name: z.string(),
  category: z.string(),
  ...Prov,
  /** API gravity, for the Batzle–Wang models of petroleum liquids. */
  api: z.number().positive().optional(),
  /** Mass fraction of the solute in water, for aqueous mixtures. */
  massFraction: z.number().min(0).max(1).optional(),
  validity: z.strictObject({
    temperature: range("temperature"),
    pressure: range("pressure").optional(),
  }),
  /** Vapour pressure points [°C, kPa]; ln p linear in 1/T. Below it the liquid boils. */
  vapourPressure: z.strictObject({ unit: z.literal("kPa"), points: Points, ...Prov }).optional(),
  soundSpeed: SoundSpeedModel,
  density: DensityModel,
  viscosity: ViscosityModel,
});

/** The liquids data file. */
export const LiquidsFile = z.strictObject({
  kind: z.literal("liquids"),
  liquids: z.array(LiquidSchema).min(1),
});
