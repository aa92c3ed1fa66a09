/**
 * Sites: the site-file reader, the plan pipeline, field reconciliation.
 *
 * @module
 */
export {
  DEFAULT_MOUNTINGS,
  readSiteFile,
  readSitesCsv,
  readSitesCsvFile,
  readSitesCsvText,
  readSiteText,
  SITE_LIMITS,
  siteFiles,
  SiteInputError,
  streamSitesCsv,
} from "./read.ts";
export type { ReadSiteOptions, SitesCsvResult, SitesCsvRow } from "./read.ts";
export type * from "./schema.ts";
export {
  type MountingPlan,
  type MountingTimes,
  type OperatingPoint,
  PLAN_ASSUMPTIONS,
  type PlanBudgetLine,
  type PlanOptions,
  planSite,
  type SitePlan,
} from "./plan.ts";
export {
  type FieldReadings,
  type MismatchCause,
  type MountingReading,
  type MountingReconciliation,
  reconcile,
  RECONCILE_BOUNDS,
  type Reconciliation,
  soundSpeedFromLiquidTime,
} from "./reconcile.ts";
export type { CauseName } from "./reconcile_fit.ts";
export { deltaTForFlow, flowModel, MODEL_INPUTS } from "./model.ts";
