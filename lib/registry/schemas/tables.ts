/**
 * Generic schemas: coefficient sets of formulations and published verification tables.
 *
 * @module
 */
import { z } from "zod";
import { BasisSchema, EntryId, SourceId } from "./common.ts";

/** A coefficient set of a published formulation (IAPWS-95, IF97, Del Grosso–Mader, …). */
export const CoefficientsFile = z.strictObject({
  kind: z.literal("coefficients"),
  id: EntryId,
  formulation: z.string(),
  source: SourceId,
  basis: BasisSchema,
  copy: z.string().optional(),
  note: z.string().optional(),
  /** Validity, as unit strings, for example { temperature: { min: "0 degC", max: "95 degC" } }. */
  validity: z.record(z.string(), z.object({ min: z.string(), max: z.string() })).optional(),
  /** Named scalars and arrays of numbers; their meaning is documented by the evaluating module. */
  constants: z.record(z.string(), z.union([z.number(), z.string()])).optional(),
  coefficients: z.record(
    z.string(),
    z.union([z.array(z.number()), z.array(z.array(z.number())), z.number()]),
  ),
});

/** A published verification table: inputs and expected outputs, with the tolerance to check. */
export const VerificationFile = z.strictObject({
  kind: z.literal("verification"),
  id: EntryId,
  formulation: z.string(),
  source: SourceId,
  basis: BasisSchema,
  copy: z.string().optional(),
  note: z.string().optional(),
  /** Column names with their units, for example { T: "K", rho: "kg/m^3", w: "m/s" }. */
  columns: z.record(z.string(), z.string()),
  /** Which columns are inputs; the rest are expected outputs. */
  inputs: z.array(z.string()).min(1),
  /** Relative tolerance per output column (or one for all). */
  tolerance: z.union([z.number().positive(), z.record(z.string(), z.number().positive())]),
  rows: z.array(z.record(z.string(), z.number())).min(1),
});

/** A generic sourced table (for example the Nikuradse exponent n against Re). */
export const TableFile = z.strictObject({
  kind: z.literal("table"),
  id: EntryId,
  title: z.string(),
  source: SourceId,
  basis: BasisSchema,
  copy: z.string().optional(),
  note: z.string().optional(),
  columns: z.record(z.string(), z.string()),
  rows: z.array(z.record(z.string(), z.union([z.number(), z.string()]))).min(1),
});
