/**
 * The site plan: one validated site in, a traced plan out.
 *
 * pipe (catalogue or measured) → liquid properties at operating conditions → Snell chain per
 * mounting (spacing, search window, transit times, Δt at each flow, resolvability at minimum
 * flow, wall-borne signal, signal budget) → Reynolds number and profile factor per operating
 * point → straight run, common-practice and model-ranked positions → GUM uncertainty budget at
 * each operating point, Monte Carlo (JCGM 101) beside it → a verdict on the target and what
 * would reach it. Every constant used is listed in `trace` with its source and basis.
 *
 * @module
 */
import type { Warning } from "../errors.ts";
import type { TraceEntry } from "../trace.ts";
import { defaultRegistry, type Registry } from "../registry/mod.ts";
import type { ClampOnPath, SearchWindow } from "../acoustics/mod.ts";
import { MODEL_INPUTS } from "./model.ts";
import type { SiteInput } from "./schema.ts";

export { PLAN_ASSUMPTIONS } from "./stages/assumptions.ts";
import { type PipeStage, planPipe } from "./stages/pipe.ts";
import { type LiquidStage, planLiquid } from "./stages/liquid.ts";
import {
  boreRoughness,
  planOperatingPoints,
  type PointsStage,
  type PointsStageInput,
  type RoughnessStage,
  type RoughnessStageInput,
} from "./stages/points.ts";
import {
  planTransducer,
  type TransducerStage,
  type TransducerStageInput,
} from "./stages/transducer.ts";
import { planStraightRun, type RunStage, type RunStageInput } from "./stages/run.ts";
import {
  type MountingsStage,
  type MountingsStageInput,
  planMountings,
} from "./stages/mountings.ts";
import { chooseMounting } from "./stages/choose.ts";
import { type BudgetStage, type BudgetStageInput, planBudget } from "./stages/budget.ts";
import { planVerdict, type VerdictStageInput } from "./stages/verdict.ts";
import { type CautionsStageInput, planCautions } from "./stages/cautions.ts";
import { assumptionTrace, planNotes } from "./stages/trace.ts";
import { assemblePlan } from "./stages/assemble.ts";

/** Options of {@link planSite}. */
export interface PlanOptions {
  /** Registry to use (default: the bundled one). */
  readonly registry?: Registry;
  /** Monte Carlo beside GUM: `false` to skip; default 1e5 draws, seed 1. */
  readonly monteCarlo?: false | { readonly draws?: number; readonly seed?: number };
}

/** One operating point of the plan. */
export interface OperatingPoint {
  /** `minimum`, `design` or `maximum`. */
  readonly label: "minimum" | "design" | "maximum";
  /** Volume flow rate, m³/s. */
  readonly flowRate: number;
  /** Area-mean velocity, m/s. */
  readonly meanVelocity: number;
  /** Reynolds number on the bore. */
  readonly reynolds: number;
  /** Flow regime. */
  readonly regime: string;
  /** Profile factor (area mean / path mean), diametral path. */
  readonly profileFactor: number;
  /** Half-width of the spread between profile models. */
  readonly profileFactorSpread: number;
  /** Path-averaged axial velocity, m/s. */
  readonly pathVelocity: number;
  /** Darcy friction factor (Colebrook–White). */
  readonly frictionFactor: number;
}

/** Transit times of one mounting at one operating point. */
export interface MountingTimes {
  /** Operating point label. */
  readonly label: OperatingPoint["label"];
  /** Upstream transit time, s. */
  readonly upstream: number;
  /** Downstream transit time, s. */
  readonly downstream: number;
  /** Δt, s. */
  readonly deltaT: number;
}

/** One mounting (traverse count) of the plan. */
export interface MountingPlan {
  /** Crossings of the bore. */
  readonly traverses: number;
  /** Mounting letter where the trade has one (Z 1, V 2, W 4), else `N-traverse`. */
  readonly name: string;
  /** Spacing between beam entry and exit on the outer surface, m. */
  readonly spacing: number;
  /** Distance between the housings' reference marks, m (when the wedge geometry is known). */
  readonly referenceMarkDistance?: number;
  /** Liquid angle from the wall normal, rad. */
  readonly fluidAngle: number;
  /** Wall angle, rad. */
  readonly wallAngle: number;
  /** Angles in the lining layers, rad. */
  readonly liningAngles: readonly number[];
  /** Wall mode the spacing is for. */
  readonly wallMode: string;
  /** Modes considered, with their role. */
  readonly modes: ClampOnPath["modes"];
  /** Liquid path length, m. */
  readonly fluidPathLength: number;
  /** Zero-flow times: liquid, wall, lining, total, s. */
  readonly fluidTime: number;
  /** Time in the wall, in and out, s. */
  readonly wallTime: number;
  /** Time in the lining, in and out, s. */
  readonly liningTime: number;
  /** Zero-flow arrival time without fixed delays, s. */
  readonly totalTime: number;
  /** Search window. */
  readonly searchWindow: SearchWindow;
  /** Transit times at each operating point. */
  readonly times: readonly MountingTimes[];
  /** Smallest path velocity resolvable for the timing offset, m/s. */
  readonly minimumResolvableVelocity: number;
  /** Timing offset / Δt at minimum flow. */
  readonly offsetFraction: number;
  /** Δt at minimum flow ≥ resolvableMultiple × timing offset. */
  readonly resolvableAtMinimum: boolean;
  /** Wall-borne signal check. */
  readonly wallBorne: { readonly separation: number; readonly overlaps: boolean };
  /** Signal budget: total dB and rating. */
  readonly signal: { readonly totalDb: number; readonly rating: string };
  /** Spacing across the seasonal temperature range (when given). */
  readonly overTemperature?: readonly {
    /** Liquid temperature, K. */
    readonly temperature: number;
    /** Spacing at that temperature, m. */
    readonly spacing: number;
    /** fluidSoundSpeed */
    readonly fluidSoundSpeed: number;
    /** Zero-flow arrival time without fixed delays, s. */
    readonly totalTime: number;
  }[];
  /** Expanded relative uncertainty per operating point (GUM, k = 2). */
  readonly expandedByPoint: readonly number[];
}

/** A budget line in the plan. */
export interface PlanBudgetLine {
  /** Site name. */
  readonly name: string;
  /** Best estimate (SI). */
  readonly value: number;
  /** SI unit of value. */
  readonly unit: string;
  /** Standard uncertainty (SI). */
  readonly standardUncertainty: number;
  /** Distribution assigned. */
  readonly distribution: string;
  /** Sensitivity coefficient ∂Q/∂x. */
  readonly sensitivity: number;
  /** Relative contribution |c·u| / Q. */
  readonly relativeContribution: number;
  /** Share of the variance. */
  readonly share: number;
  /** Source id. */
  readonly source: string;
  /** Basis of the value. */
  readonly basis: string;
  /**
   * Asymmetric tolerance band only: centre of [x − minus, x + plus] minus x, SI. The GUM row
   * keeps x and u = (plus + minus)/√12 (JCGM 100 §4.3.8); the Monte Carlo draws are centred
   * on x + centreOffset (JCGM 101 §6.4.2.1).
   */
  readonly centreOffset?: number;
}

/** The plan of one site. SI throughout. */
export interface SitePlan {
  /** Site name. */
  readonly name: string;
  /** Short id of the site, for fleets. */
  readonly id?: string;
  /** True for an invented scenario (demo). */
  readonly invented: boolean;
  /** SHA-256 content hash of the reference data the plan was computed from. */
  readonly registryHash: string;
  /** The pipe as planned, SI. */
  readonly pipe: {
    /** Outside diameter, m. */
    readonly outsideDiameter: number;
    /** Wall thickness used, m. */
    readonly wallThickness: number;
    /** Inside diameter of the wall, m. */
    readonly insideDiameter: number;
    /** Diameter of the liquid bore (inside the lining), m. */
    readonly boreDiameter: number;
    /** Wall material id. */
    readonly material: string;
    /** Longitudinal sound speed of the wall, m/s. */
    readonly wallSoundSpeed: number;
    /** Shear sound speed of the wall, m/s. */
    readonly wallShearSpeed?: number;
    /** Lining layers: material, thickness (m), sound speed (m/s). */
    readonly lining: readonly { material: string; thickness: number; soundSpeed: number }[];
    /** What the pipe is: catalogue designation or measured. */
    readonly description: string;
    /** Thickness-gauge reading, m, when given. */
    readonly measuredWallThickness?: number;
  };
  /** The liquid at operating conditions, SI. */
  readonly fluid: {
    /** Liquid id. */
    readonly liquid: string;
    /** Site name. */
    readonly name: string;
    /** Liquid temperature, K. */
    readonly temperature: number;
    /** Absolute pressure, Pa. */
    readonly pressure: number;
    /** Liquid sound speed, m/s. */
    readonly soundSpeed: number;
    /** Half-width of the sound-speed spread, m/s. */
    readonly soundSpeedSpread: number;
    /** Liquid density, kg/m³. */
    readonly density: number;
    /** Kinematic viscosity, m²/s. */
    readonly kinematicViscosity: number;
  };
  /** The transducer pair as planned, SI. */
  readonly transducer: {
    /** Wedge sound speed at the operating temperature, m/s. */
    readonly wedgeSoundSpeed: number;
    /** Beam angle in the wedge, rad. */
    readonly wedgeAngle: number;
    /** Centre frequency, Hz. */
    readonly frequency: number;
    /** Timing resolution, s. */
    readonly timingResolution: number;
    /** Zero offset of Δt, s. */
    readonly zeroOffset: number;
  };
  /** Minimum, design and maximum flow. */
  readonly operatingPoints: readonly OperatingPoint[];
  /** Relative change of the profile factor across the flow range. */
  readonly profileFactorChange: number;
  /** Every mounting evaluated. */
  readonly mountings: readonly MountingPlan[];
  /** Traverse count of the mounting the budget is for. */
  readonly recommendedMounting: number;
  /** Straight-run assessment, when a run is described. */
  readonly straightRun?: {
    /** Straight-run verdict: meets, marginal or short. */
    readonly verdict: string;
    /** Meter position from the upstream fitting, m. */
    readonly position: number;
    /** Whether the position was planned by the site or recommended here. */
    readonly positionSource: "planned" | "recommended";
    /** Straight length upstream of the meter, in diameters. */
    readonly upstreamDiameters: number;
    /** Straight length downstream of the meter, in diameters. */
    readonly downstreamDiameters: number | null;
    /** Upstream length common practice asks, in diameters. */
    readonly requiredUpstream: number;
    /** Downstream length common practice asks, in diameters. */
    readonly requiredDownstream: number;
    /** Common-practice position from the upstream fitting, m. */
    readonly commonPracticePosition: number;
    /** Model-ranked position from the upstream fitting, m. */
    readonly recommendedPosition: number;
    /** Model-ranked path-plane angle, rad. */
    readonly recommendedOrientation: number;
    /** Estimated relative error from the disturbed profile (an estimate). */
    readonly estimatedProfileError: number;
    /** Half-width of that estimate. */
    readonly estimatedProfileErrorSpread: number;
    /** Reasons for the verdict. */
    readonly reasons: readonly string[];
    /** Notes of the ranking and the model. */
    readonly notes: readonly string[];
    /** Estimated error along the run: position (m) and relative error. */
    readonly errorAlongRun: readonly { position: number; error: number }[];
    /** Length of the straight run, m. */
    readonly runLength: number;
    /** Upstream fitting id. */
    readonly upstreamFitting: string;
    /** Downstream fitting id. */
    readonly downstreamFitting: string;
    /** True when the site did not name the downstream fitting and the plan assumed one. */
    readonly downstreamAssumed?: boolean;
  };
  /** Uncertainty budget of the recommended mounting. */
  readonly uncertainty: {
    /** Traverse count the budget is for. */
    readonly mounting: number;
    /** Operating point the budget table is for. */
    readonly operatingPoint: OperatingPoint["label"];
    /** Expanded relative uncertainty (k = 2). */
    readonly expanded: number;
    /** Coverage factor. */
    readonly coverageFactor: number;
    /** Expanded relative uncertainty per operating point. */
    readonly expandedByPoint: readonly { label: string; expanded: number }[];
    /** Budget lines, largest first. */
    readonly budget: readonly PlanBudgetLine[];
    /** Monte Carlo check (JCGM 101) beside GUM. */
    readonly monteCarlo?: {
      /** Number of Monte Carlo draws. */
      readonly draws: number;
      /** Seed of the random stream. */
      readonly seed: number;
      /** Expanded relative uncertainty (k = 2). */
      readonly expanded: number;
      /** 95 % coverage interval of the flow rate, m³/s. */
      readonly interval: readonly [number, number];
    };
  };
  /** Verdict on the target uncertainty, when one is stated. */
  readonly target?: {
    /** Target expanded relative uncertainty (k = 2). */
    readonly uncertainty: number;
    /** Whether the worst expanded uncertainty meets the target. */
    readonly reachable: boolean;
    /** Worst expanded relative uncertainty over the operating points. */
    readonly worstExpanded: number;
    /** Operating point where it is worst. */
    readonly worstPoint: string;
    /** What would reach the target. */
    readonly suggestions: readonly string[];
  };
  /** Which technique the stated solids and gas content favours. */
  readonly technique: { readonly favours: string; readonly reasons: readonly string[] };
  /** Largest contributor to the uncertainty budget. */
  readonly mainLimitation: string;
  /** Every constant and formulation used, with source and basis. */
  readonly trace: readonly TraceEntry[];
  /** Safety and interpretation cautions. */
  readonly cautions: readonly string[];
  /** Warnings (defaults assumed, extrapolations, estimates). */
  readonly warnings: readonly Warning[];
}

/**
 * Plan one site.
 *
 * Method: the composition described in the module text. Measurement model for the budget:
 * Q = k·(1 + ε)·(π/4)·D²·c_w·Δt / (2·sin θ_w·τ) (see ./model.ts), propagated by the GUM law of
 * propagation (jcgm-100-2008) at each operating point, and by Monte Carlo (jcgm-101-2008) at the
 * worst one. Assumptions no site file states are in {@link PLAN_ASSUMPTIONS}, each traced as
 * common practice.
 *
 * @param site a validated site from the site-file reader (SI)
 * @param options registry, Monte Carlo settings
 * @returns the plan (SI), with trace, registry hash, cautions and warnings
 * @throws {InputError} on unknown pipe sizes, materials, liquids or fittings
 * @throws {NoPhysicalAnswerError} beyond a critical angle, or for a boiling liquid
 *
 * @example
 * ```ts
 * import { readSiteText } from "./read.ts";
 * import { planSite } from "./plan.ts";
 * const site = await readSiteText(`
 * name: Example line (invented)
 * pipe: { standard: ASME B36.10M, nps: "8", schedule: "40", material: carbon-steel }
 * fluid: { liquid: water, temperature: 12 degC, pressure: 5 bar }
 * flow: { minimum: 20 L/s, design: 60 L/s, maximum: 90 L/s }
 * transducer: { wedgeSoundSpeed: 2720 m/s, wedgeAngle: 38 deg, frequency: 1 MHz }
 * mountings: [1, 2]
 * `);
 * const plan = planSite(site, { monteCarlo: false });
 * if (!(plan.mountings[1].spacing > plan.mountings[0].spacing)) throw new Error("V wider than Z");
 * ```
 */
export function planSite(site: SiteInput, options: PlanOptions = {}): SitePlan {
  const reg = options.registry ?? defaultRegistry();
  const notes = planNotes(site.defaults);
  const pipe = notes.add(planPipe({ pipe: site.pipe, registry: reg }));
  const liquid = notes.add(planLiquid({ fluid: site.fluid }));
  const transducer = notes.add(planTransducer(transducerInput(site, reg)));
  notes.add({ warnings: [], trace: assumptionTrace() });
  const rough = notes.add(boreRoughness(roughnessInput(site, pipe)));
  const points = notes.add(planOperatingPoints(pointsInput(site, pipe, liquid, rough)), true);
  const mountings = notes.add(
    planMountings(mountingsInput(site, pipe, liquid, transducer, points, reg)),
    true,
  );
  const run = notes.add(planStraightRun(runInput(site, pipe, rough, points, mountings)));
  const budget = notes.add(
    planBudget(budgetInput(site, pipe, transducer, points, mountings, run, reg, options)),
  );
  const verdict = notes.add(planVerdict(verdictInput(site, points, run, budget)));
  const { cautions } = planCautions(cautionsInput(site, pipe));
  const { warnings } = notes;
  return assemblePlan({
    site,
    registryHash: reg.hash,
    pipe,
    liquid,
    transducer,
    points,
    run,
    budget,
    verdict,
    cautions,
    trace: notes.trace(),
    warnings,
  });
}

function transducerInput(site: SiteInput, registry: Registry): TransducerStageInput {
  return { transducer: site.transducer, temperature: site.fluid.temperature, registry };
}

function roughnessInput(site: SiteInput, p: PipeStage): RoughnessStageInput {
  return {
    stated: site.pipe.roughness,
    material: p.mat.roughness,
    materialId: p.materialId,
    bore: p.bore,
  };
}

function pointsInput(
  site: SiteInput,
  p: PipeStage,
  l: LiquidStage,
  r: RoughnessStage,
): PointsStageInput {
  return { flow: site.flow, bore: p.bore, area: p.area, roughness: r.roughness, nu: l.nu };
}

function mountingsInput(
  site: SiteInput,
  p: PipeStage,
  l: LiquidStage,
  t: TransducerStage,
  points: PointsStage,
  reg: Registry,
): MountingsStageInput {
  return {
    mountings: site.mountings,
    sp: site.pipe,
    fl: site.fluid,
    td: site.transducer,
    rp: p.rp,
    mat: p.mat,
    wallThickness: p.wallThickness,
    wallL: p.wallL,
    wallS: p.wallS,
    lining: p.lining,
    c: l.c,
    cSpread: l.cSpread,
    rho: l.rho,
    T: site.fluid.temperature,
    cw: t.cw,
    cwHalf: t.cwHalf,
    dcwdT: t.dcwdT,
    wedgeDensity: t.wedgeDensity,
    wedgeAtt: t.wedgeAtt,
    timingOffset: t.timingOffset,
    points: points.points,
    reg,
  };
}

/** The straight run is ranked for the mounting chosen before any budget (V by default). */
function runInput(
  site: SiteInput,
  p: PipeStage,
  r: RoughnessStage,
  points: PointsStage,
  m: MountingsStage,
): RunStageInput {
  const provisional = chooseMounting(m.mountingPlans);
  return {
    run: site.run,
    bore: p.bore,
    relativeRoughness: r.relativeRoughness,
    points: points.points,
    traverses: provisional.traverses,
    fluidAngle: provisional.fluidAngle,
  };
}

function budgetInput(
  site: SiteInput,
  p: PipeStage,
  t: TransducerStage,
  points: PointsStage,
  m: MountingsStage,
  run: RunStage,
  reg: Registry,
  options: PlanOptions,
): BudgetStageInput {
  return {
    sp: site.pipe,
    td: site.transducer,
    rp: p.rp,
    mat: p.mat,
    wallThickness: p.wallThickness,
    wallL: p.wallL,
    lining: p.lining,
    cw: t.cw,
    cwHalf: t.cwHalf,
    dcwdT: t.dcwdT,
    zeroOffset: t.zeroOffset,
    timingResolution: t.timingResolution,
    wallTolHalf: m.wallTolHalf,
    odHalf: m.odHalf,
    tolOffsets: m.tolOffsets,
    mountingPlans: m.mountingPlans,
    installHalf: run.installHalf,
    installProvenance: run.installProvenance,
    points: points.points,
    reg,
    monteCarlo: options.monteCarlo,
  };
}

function verdictInput(
  site: SiteInput,
  points: PointsStage,
  run: RunStage,
  b: BudgetStage,
): VerdictStageInput {
  return {
    targetUncertainty: site.targetUncertainty,
    content: site.content,
    points: points.points,
    mountingPlans: b.mountingPlans,
    chosen: b.chosen,
    worstIdx: b.worstIdx,
    worstBudget: b.worstBudget,
    budget: b.uncertainty.budget.map((l) => l.name),
    straightRun: run.straightRun,
  };
}

function cautionsInput(site: SiteInput, p: PipeStage): CautionsStageInput {
  const { temperature, pressure, liquid } = site.fluid;
  return { temperature, pressure, liquid, lined: p.lining.length > 0 };
}

/** Re-exported for reports: the model's input names, in order. */
export const PLAN_MODEL_INPUTS: readonly string[] = MODEL_INPUTS;
