/**
 * Schema of the manufacturing tolerances (data/pipes/tolerances.yaml).
 *
 * Each set applies to catalogue standards and/or materials and lists rules in ascending
 * outside-diameter order; a pipe takes the first rule whose `odMaxMm` is at or above its
 * outside diameter. Each side of a tolerance is given in mm or in percent of the nominal value,
 * never both; a side left out is not limited by that rule.
 *
 * @module
 */
import { z } from "zod";
import { BasisSchema, EntryId, SourceId } from "./common.ts";

const nonNeg = z.number().refine((x) => Number.isFinite(x) && x >= 0, "a number ≥ 0");

/** Plus and minus sides of a tolerance, each in mm or in percent of nominal. */
export const ToleranceBand = z.strictObject({
  plusMm: nonNeg.optional(),
  minusMm: nonNeg.optional(),
  plusPercent: nonNeg.optional(),
  minusPercent: nonNeg.refine((x) => x < 100, "less than 100 %").optional(),
}).superRefine((b, ctx) => {
  if (b.plusMm !== undefined && b.plusPercent !== undefined) {
    ctx.addIssue({ code: "custom", message: "give plusMm or plusPercent, not both" });
  }
  if (b.minusMm !== undefined && b.minusPercent !== undefined) {
    ctx.addIssue({ code: "custom", message: "give minusMm or minusPercent, not both" });
  }
});

/** One size band of a tolerance set. */
export const ToleranceRule = z.strictObject({
  odMaxMm: z.number().positive(),
  outsideDiameter: ToleranceBand.optional(),
  wall: ToleranceBand.optional(),
});

/** A tolerance set. */
export const ToleranceSet = z.strictObject({
  id: EntryId,
  title: z.string().min(1),
  /** Catalogue standard ids (data/pipes/*.yaml `id`) this set is the default for. */
  standards: z.array(EntryId).default([]),
  /** Material ids this set is the default for. */
  materials: z.array(EntryId).default([]),
  source: SourceId,
  basis: BasisSchema,
  copy: z.string().optional(),
  note: z.string().optional(),
  rules: z.array(ToleranceRule).min(1),
}).superRefine((s, ctx) => {
  for (let i = 1; i < s.rules.length; i++) {
    if (!(s.rules[i].odMaxMm > s.rules[i - 1].odMaxMm)) {
      ctx.addIssue({
        code: "custom",
        path: ["rules", i, "odMaxMm"],
        message: "rules must be in ascending odMaxMm order",
      });
    }
  }
});
/** A tolerance set. */
export type ToleranceSet = z.infer<typeof ToleranceSet>;

/** The tolerances data file. */
export const TolerancesFile = z.strictObject({
  kind: z.literal("tolerances"),
  note: z.string().optional(),
  sets: z.array(ToleranceSet).min(1),
});
