/**
 * Pipes: resolve a pipe's geometry from the catalogue or from measurements on site, with
 * lining layers, manufacturing tolerances and a trace. This module only re-exports.
 *
 * @example
 * ```ts
 * import { pipe } from "./mod.ts";
 * const p = pipe({ standard: "ASME B36.10M", nps: "8", schedule: "40" });
 * if (Math.abs(p.wallThickness - 0.00818) > 1e-12) throw new Error("wall");
 * ```
 *
 * @module
 */
export { defaultStandard, pipe, PLAUSIBLE_OUTSIDE_DIAMETER } from "./resolve.ts";
export { type DescribedPipe, pipeDescription } from "./describe.ts";
export type {
  PipeCatalogueSpec,
  PipeLiningLayer,
  PipeMeasuredSpec,
  PipeOptions,
  PipeSpec,
  PipeTolerances,
  PipeToleranceSides,
  ResolvedPipe,
} from "./resolve.ts";
export type {
  PipeFilter,
  PipeLiningRecord,
  PipeProvenance,
  PipeQueries,
  PipeQuery,
  PipeRecord,
  PipeStandardInfo,
  PipeToleranceRule,
  PipeToleranceSet,
  ToleranceBandSI,
} from "../registry/q_pipes.ts";
export type { Basis } from "../registry/schemas/common.ts";
