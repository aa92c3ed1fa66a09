/**
 * Installation effects: fittings and their straight-run requirements, the straight-run check,
 * the distorted-profile model and the ranking of positions along a run. Re-exports only.
 *
 * @example
 * ```ts
 * import { checkStraightRun } from "./mod.ts";
 * const r = checkStraightRun({ diameter: 0.1, upstream: { fitting: "elbow-90", distance: 0.6 } });
 * if (r.verdict !== "short") throw new Error();
 * ```
 *
 * @module
 */
export {
  type Fitting,
  type FittingComponent,
  type FittingLength,
  type FittingProvenance,
  resolveFitting,
} from "./fittings.ts";
export {
  checkStraightRun,
  MARGINAL_FRACTION,
  type StraightRunInput,
  type StraightRunResult,
  type StraightRunVerdict,
} from "./straight_run.ts";
export {
  DEFAULT_FLUID_ANGLE,
  type ErrorComponents,
  JUDGEMENT_RELATIVE_SPREAD,
  MODEL_NOTE,
  MODEL_RELATIVE_SPREAD,
  type ModelProvenance,
  modelProvenance,
  profileError,
  profileErrorEstimate,
  type ProfileErrorInput,
  type ProfileErrorResult,
  profileErrorSweep,
  type SweepRow,
} from "./model.ts";
export { type BendFit, type BendFitInput, fitSingleBend, worstCorrectionFactor } from "./fit.ts";
export {
  CHECK_ANGLES,
  CHECK_TRAVERSES,
  checkDistances,
  checkInstallationData,
  INSTALLATION_DATA_TABLES,
  type InstallationCheck,
} from "./published.ts";
export {
  DEFAULT_PATH_ORIENTATIONS,
  type PathPlane,
  type RankedPosition,
  type RankInput,
  rankPositions,
  type RankResult,
  SCORE_TIE_TOLERANCE,
  SHORT_RUN_FRACTION,
} from "./rank.ts";
