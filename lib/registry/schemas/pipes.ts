/**
 * Schema of the pipe catalogue (data/pipes/*.yaml): one file per standard, sizes in mm.
 *
 * A file names its standard, default material, provenance and the ordered schedule series;
 * each size row gives the outside diameter and the wall per schedule. The schema refuses
 * physically impossible rows (non-positive sizes, wall at or beyond the radius, a lining that
 * fills the bore), duplicate sizes, and schedules that are not in a declared series.
 *
 * @module
 */
import { z } from "zod";
import { sizeValue } from "./values.ts";

export { sizeValue };
import { BasisSchema, EntryId, SourceId } from "./common.ts";

/** A size as the trade writes it: "1/8", "1-1/2", "4", "13.5". */
export const SizeLabel = z.string().regex(
  /^(\d+(\.\d+)?|\d+\/\d+|\d+-\d+\/\d+)$/,
  'a nominal size such as "1/8", "1-1/2" or "4"',
);

const positiveMm = z.number().refine((x) => Number.isFinite(x) && x > 0, "a positive length in mm");

/** One wall value with its own provenance, for a value whose basis differs from the file's. */
export const WallOverride = z.strictObject({
  valueMm: positiveMm,
  source: SourceId.optional(),
  basis: BasisSchema,
  spreadMm: z.number().nonnegative().optional(),
  note: z.string().optional(),
});

/** A wall: a number (mm) under the file's provenance, or a value with its own. */
export const Wall = z.union([positiveMm, WallOverride]);

/** One size row. */
export const PipeSize = z.strictObject({
  nps: SizeLabel,
  outsideDiameterMm: positiveMm,
  /** Wall per schedule, in mm. */
  wallMm: z.record(z.string().min(1), Wall).refine(
    (w) => Object.keys(w).length > 0,
    "at least one schedule",
  ),
});

/** Lining thickness by size range, for a standard whose pipe comes lined. */
export const LiningRule = z.strictObject({
  npsMin: z.number().positive(),
  npsMax: z.number().positive(),
  thicknessMm: positiveMm,
});

/** The default lining of a standard's pipe. */
export const DefaultLining = z.strictObject({
  material: EntryId,
  source: SourceId,
  basis: BasisSchema,
  copy: z.string().optional(),
  spreadMm: z.number().nonnegative().optional(),
  note: z.string().optional(),
  rules: z.array(LiningRule).min(1),
});

/** Provenance of the walls when it differs from that of the outside diameters. */
export const WallProvenance = z.strictObject({
  source: SourceId,
  basis: BasisSchema,
  note: z.string().optional(),
});

/** The pipes data file: one standard. */
export const PipesFile = z.strictObject({
  kind: z.literal("pipes"),
  id: EntryId,
  standard: z.string().min(1),
  title: z.string().min(1),
  aliases: z.array(z.string().min(1)).default([]),
  sizeSystem: z.string().min(1),
  material: EntryId,
  source: SourceId,
  basis: BasisSchema,
  copy: z.string().optional(),
  note: z.string().optional(),
  /** Half-width of the spread on walls (mm), for recalled data. */
  spreadMm: z.number().nonnegative().optional(),
  wallProvenance: WallProvenance.optional(),
  lining: DefaultLining.optional(),
  /** Schedules in order of growing wall, one list per series (numbered, named weights, …). */
  series: z.array(z.array(z.string().min(1)).min(1)).min(1),
  sizes: z.array(PipeSize).min(1),
}).superRefine((f, ctx) => {
  const known = new Set(f.series.flat());
  const seen = new Map<number, number>();
  f.sizes.forEach((row, i) => {
    const v = sizeValue(row.nps);
    const prev = seen.get(v);
    if (prev !== undefined) {
      ctx.addIssue({
        code: "custom",
        path: ["sizes", i, "nps"],
        message: `duplicate size ${row.nps} (also sizes[${prev}])`,
      });
    }
    seen.set(v, i);
    const liningMm = f.lining?.rules.find((r) => v >= r.npsMin && v <= r.npsMax)?.thicknessMm ?? 0;
    for (const [sched, w] of Object.entries(row.wallMm)) {
      const wall = typeof w === "number" ? w : w.valueMm;
      if (!known.has(sched)) {
        ctx.addIssue({
          code: "custom",
          path: ["sizes", i, "wallMm", sched],
          message: `schedule '${sched}' is not in any declared series (${[...known].join(", ")})`,
        });
      }
      if (!(wall < row.outsideDiameterMm / 2)) {
        ctx.addIssue({
          code: "custom",
          path: ["sizes", i, "wallMm", sched],
          message: `wall ${wall} mm is not less than the radius ${row.outsideDiameterMm / 2} mm ` +
            `(outside diameter ${row.outsideDiameterMm} mm): no bore`,
        });
      } else if (!(wall + liningMm < row.outsideDiameterMm / 2)) {
        ctx.addIssue({
          code: "custom",
          path: ["sizes", i, "wallMm", sched],
          message: `wall ${wall} mm plus lining ${liningMm} mm fills the bore`,
        });
      }
    }
  });
});
/** The pipes data file: one standard. */
export type PipesFile = z.infer<typeof PipesFile>;
