/**
 * Plan stage 11, the assembly: the stages' results put together as the plan, in the plan's
 * fixed key order (reports and the golden files depend on it). No computation beyond choosing
 * what to show; SI throughout.
 *
 * @module
 */
import { pipeDescription } from "../../pipe/describe.ts";
import type { Warning } from "../../errors.ts";
import type { TraceEntry } from "../../trace.ts";
import type { SiteInput } from "../schema.ts";
import type { SitePlan } from "../plan.ts";
import type { PipeStage } from "./pipe.ts";
import type { LiquidStage } from "./liquid.ts";
import type { TransducerStage } from "./transducer.ts";
import type { PointsStage } from "./points.ts";
import type { RunStage } from "./run.ts";
import type { BudgetStage } from "./budget.ts";
import type { VerdictStage } from "./verdict.ts";

/** Input of {@link assemblePlan}: the site and every stage's result. */
export interface AssembleStageInput {
  /** The validated site. */
  readonly site: SiteInput;
  /** Content hash of the registry used. */
  readonly registryHash: string;
  /** Pipe stage. */
  readonly pipe: PipeStage;
  /** Liquid stage. */
  readonly liquid: LiquidStage;
  /** Transducer stage. */
  readonly transducer: TransducerStage;
  /** Operating-points stage. */
  readonly points: PointsStage;
  /** Straight-run stage. */
  readonly run: RunStage;
  /** Budget stage (its mountings carry the expanded uncertainties). */
  readonly budget: BudgetStage;
  /** Verdict stage. */
  readonly verdict: VerdictStage;
  /** Cautions. */
  readonly cautions: readonly string[];
  /** The plan's trace, repeats dropped. */
  readonly trace: readonly TraceEntry[];
  /** The plan's warnings in stage order. */
  readonly warnings: readonly Warning[];
}

/**
 * The plan of one site from its stages' results.
 *
 * @param input the site and the stages' results
 * @returns the plan (SI)
 * @example
 * ```ts
 * import { assemblePlan } from "./assemble.ts";
 * const plan = assemblePlan({
 *   site: { name: "Example (invented)", invented: true, pipe: {}, fluid: {}, transducer: {} },
 *   registryHash: "h", pipe: { rp: { origin: "measured" }, lining: [] },
 *   liquid: { liq: { name: "water" } }, transducer: {}, points: { points: [] }, run: {},
 *   budget: { mountingPlans: [], chosen: { traverses: 2 } }, verdict: {},
 *   cautions: [], trace: [], warnings: [],
 * } as unknown as Parameters<typeof assemblePlan>[0]);
 * // the plan names its site first and recommends the budget's mounting
 * if (Object.keys(plan)[0] !== "name" || plan.recommendedMounting !== 2) throw new Error();
 * ```
 */
export function assemblePlan(input: AssembleStageInput): SitePlan {
  const { site, budget, verdict } = input;
  const { chosen } = budget;
  return {
    name: site.name,
    id: site.id,
    invented: site.invented ?? false,
    registryHash: input.registryHash,
    pipe: pipeSection(input.pipe, site.pipe),
    fluid: fluidSection(input.liquid, site.fluid),
    transducer: {
      wedgeSoundSpeed: input.transducer.cw,
      wedgeAngle: site.transducer.wedgeAngle,
      frequency: site.transducer.frequency,
      timingResolution: input.transducer.timingResolution,
      zeroOffset: input.transducer.zeroOffset,
    },
    operatingPoints: input.points.points,
    profileFactorChange: input.points.profileFactorChange,
    mountings: budget.mountingPlans.map(({ path: _x, inputs: _y, ...m }) => m),
    recommendedMounting: chosen.traverses,
    straightRun: input.run.straightRun,
    uncertainty: budget.uncertainty,
    target: verdict.target,
    technique: verdict.technique,
    mainLimitation: verdict.mainLimitation,
    trace: input.trace,
    cautions: input.cautions,
    warnings: input.warnings,
  };
}

/**
 * The pipe section of a plan.
 *
 * @param p the pipe stage
 * @param sp the site's pipe section (the gauged wall, when given)
 * @returns the pipe as planned, SI
 * @example
 * ```ts
 * import { pipeSection } from "./assemble.ts";
 * const s = pipeSection({
 *   rp: { origin: "catalogue", standard: "ASME B36.10M", nps: "8", schedule: "40" },
 *   lining: [],
 * } as unknown as Parameters<typeof pipeSection>[0], { geometry: "catalogue" });
 * if (s.description !== "ASME B36.10M NPS 8 schedule 40") throw new Error();
 * ```
 */
export function pipeSection(p: PipeStage, sp: SiteInput["pipe"]): SitePlan["pipe"] {
  const { rp } = p;
  return {
    outsideDiameter: rp.outsideDiameter,
    wallThickness: p.wallThickness,
    insideDiameter: p.insideDiameter,
    boreDiameter: p.bore,
    material: p.materialId,
    wallSoundSpeed: p.wallL,
    wallShearSpeed: p.wallS,
    lining: p.lining.map(({ material, thickness, soundSpeed }) => ({
      material,
      thickness,
      soundSpeed,
    })),
    description: pipeDescription(rp),
    measuredWallThickness: sp.measuredWallThickness,
  };
}

/** The liquid section of a plan: the liquid stage's state at the site's line conditions. */
function fluidSection(l: LiquidStage, fl: SiteInput["fluid"]): SitePlan["fluid"] {
  return {
    liquid: fl.liquid,
    name: l.liq.name,
    temperature: fl.temperature,
    pressure: fl.pressure,
    soundSpeed: l.c,
    soundSpeedSpread: l.cSpread,
    density: l.rho,
    kinematicViscosity: l.nu,
  };
}
