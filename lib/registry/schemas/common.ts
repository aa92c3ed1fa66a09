/**
 * Building blocks shared by every data schema: provenance, quantities, validity.
 *
 * @module
 */
import { z } from "zod";
import { parseQuantity } from "../../units.ts";
import type { Dimension } from "../../units.ts";

/**
 * How a datum got into the registry: `transcribed` from the cited document (or a named copy),
 * `computed` from other entries by a stated formula, `common-practice` (a rule of the trade) or
 * `recalled` (from memory of the cited source, with a wider spread).
 */
export type Basis = "transcribed" | "computed" | "common-practice" | "recalled";

/** Schema of a {@link Basis}. */
export const BasisSchema: z.ZodType<Basis> = z.enum([
  "transcribed",
  "computed",
  "common-practice",
  "recalled",
]);

/** A source id: lower-case words joined by hyphens, resolving in data/sources.yaml. */
export const SourceId = z.string().regex(
  /^[a-z0-9][a-z0-9.-]*$/,
  "a source id such as iapws-r6-95",
);

/** Provenance carried by a datum or an entry. */
export const Provenance = z.object({
  source: SourceId,
  basis: BasisSchema,
  /** Where our copy of the source came from, when transcribed from a copy. */
  copy: z.string().optional(),
  note: z.string().optional(),
});

/** An entry id: lower-case words joined by hyphens. */
export const EntryId = z.string().regex(/^[a-z0-9][a-z0-9-]*$/, "an id such as carbon-steel");

/**
 * A quantity in the data files: a value with its unit string, checked to have the
 * expected dimension, plus optional spread (same unit) and provenance.
 */
export function quantity(dimension: Dimension) {
  return z.object({
    value: z.number().refine(Number.isFinite, "a finite number"),
    unit: z.string(),
    /** Half-width of the spread between sources or stated uncertainty, same unit as value. */
    spread: z.number().nonnegative().optional(),
    source: SourceId.optional(),
    basis: BasisSchema.optional(),
    at: z.string().optional(),
    note: z.string().optional(),
  }).superRefine((q, ctx) => {
    try {
      parseQuantity(`${q.value} ${q.unit}`, dimension, "unit");
    } catch {
      ctx.addIssue({
        code: "custom",
        message: `unit '${q.unit}' is not a ${dimension} unit`,
        path: ["unit"],
      });
    }
  });
}

/** A validity range in the data files: `{ min: "0 degC", max: "95 degC" }`. */
export function range(dimension: Dimension) {
  return z.object({ min: z.string(), max: z.string() }).superRefine((r, ctx) => {
    for (const k of ["min", "max"] as const) {
      try {
        parseQuantity(r[k], dimension, k);
      } catch {
        ctx.addIssue({ code: "custom", message: `'${r[k]}' is not a ${dimension}`, path: [k] });
      }
    }
  });
}
