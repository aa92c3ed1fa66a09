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
import { Basis, EntryId, range, SourceId } from "./common.ts";

const Prov = {
  source: SourceId.optional(),
  basis: Basis.optional(),
  copy: z.string().optional(),
  note: z.string().optional(),
};
const Point = z.tuple([z.number(), z.number()]);
const Points = z.array(Point).min(2).refine(
  (p) => p.every((x, i) => i === 0 || x[0] > p[i - 1][0]),
  "points must be in increasing temperature",
);

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
  z.strictObject({
    model: z.literal("batzle-wang"),
    spread: z.number().nonnegative(),
    ...Prov,
  }),
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
  z.strictObject({
    model: z.literal("table"),
    unit: z.literal("kg/m^3"),
    points: Points,
    spread: z.number().nonnegative(),
    ...Prov,
  }),
  z.strictObject({
    model: z.literal("batzle-wang"),
    spread: z.number().nonnegative(),
    ...Prov,
  }),
]);

/** Viscosity model. */
export const ViscosityModel = z.discriminatedUnion("model", [
  z.strictObject({
    model: z.literal("table"),
    unit: z.enum(["mPa s", "Pa s"]),
    points: Points,
    spread: z.number().nonnegative(),
    ...Prov,
  }),
  z.strictObject({
    model: z.literal("walther"),
    unit: z.literal("mm^2/s"),
    points: z.tuple([Point, Point]),
    spread: z.number().nonnegative(),
    ...Prov,
  }),
  z.strictObject({
    model: z.literal("batzle-wang"),
    spread: z.number().nonnegative(),
    ...Prov,
  }),
]);

/** One liquid. */
export const Liquid = z.strictObject({
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
/** One liquid. */
export type Liquid = z.infer<typeof Liquid>;

/** The liquids data file. */
export const LiquidsFile = z.strictObject({
  kind: z.literal("liquids"),
  liquids: z.array(Liquid).min(1),
});
