/**
 * Plan stage 7, the uncertainty budget: the inputs of the measurement model with their standard
 * uncertainties for each mounting at each operating point, the GUM propagation of each, the
 * mounting the budget is for, its budget table at the design point (else the worst one) and a
 * Monte Carlo check beside it.
 *
 * Method: measurement model Q = k·(1 + ε)·(π/4)·D²·c_w·Δt / (2·sin θ_w·τ) (../model.ts); GUM law
 * of propagation (jcgm-100-2008); Monte Carlo propagation (jcgm-101-2008). A rectangular band of
 * half-width a gives u = a/√3 (JCGM 100 §4.3.7); the timing resolution q gives u = q/√12.
 *
 * @module
 */
import type { TraceEntry } from "../../trace.ts";
import { trace as traceEntry } from "../../trace.ts";
import type { Registry } from "../../registry/mod.ts";
import {
  gumPropagate,
  type GumResult,
  monteCarlo,
  type UncertainInput,
} from "../../uncertainty/mod.ts";
import { flowModel } from "../model.ts";
import type { SiteInput } from "../schema.ts";
import type { OperatingPoint, PlanBudgetLine, PlanOptions, SitePlan } from "../plan.ts";
import { PLAN_ASSUMPTIONS } from "./assumptions.ts";
import type { PipeStage } from "./pipe.ts";
import type { MountingsStage, PlannedMounting } from "./mountings.ts";
import { chooseMounting } from "./choose.ts";

/** What the model inputs of {@link budgetInputs} are built from: SI (m, m/s, rad, s). */
export interface BudgetModelInput {
  /** The site's pipe section (whether the wall was gauged). */
  readonly sp: SiteInput["pipe"];
  /** The site's transducer section (wedge angle and material). */
  readonly td: SiteInput["transducer"];
  /** Resolved pipe (outside diameter, tolerances and their source). */
  readonly rp: PipeStage["rp"];
  /** Wall material record (longitudinal speed spread, m/s). */
  readonly mat: PipeStage["mat"];
  /** Wall thickness used, m. */
  readonly wallThickness: number;
  /** Wall longitudinal speed, m/s. */
  readonly wallL: number;
  /** Lining layers. */
  readonly lining: PipeStage["lining"];
  /** Wedge speed at line temperature, m/s. */
  readonly cw: number;
  /** Wedge speed half-width, m/s. */
  readonly cwHalf: number;
  /** Wedge dc/dT, m/(s·K). */
  readonly dcwdT: number;
  /** Zero offset of Δt, s. */
  readonly zeroOffset: number;
  /** Timing resolution, s. */
  readonly timingResolution: number;
  /** Wall-thickness half-width, m. */
  readonly wallTolHalf: MountingsStage["wallTolHalf"];
  /** Outside-diameter half-width, m. */
  readonly odHalf: MountingsStage["odHalf"];
  /** Centre offsets of the tolerance bands, m. */
  readonly tolOffsets: MountingsStage["tolOffsets"];
  /** Installation-effect half-width, relative. */
  readonly installHalf: number;
  /** Source and basis of the installation-effect estimate; default the judgement model's. */
  readonly installProvenance?: { readonly source: string; readonly basis: string };
  /** Operating points (profile factor and its spread). */
  readonly points: readonly OperatingPoint[];
  /** Registry (source of a named wedge material). */
  readonly reg: Registry;
}

/** Input of {@link planBudget}. */
export interface BudgetStageInput extends BudgetModelInput {
  /** Every mounting planned, in the order asked. */
  readonly mountingPlans: readonly PlannedMounting[];
  /** Monte Carlo settings: `false` to skip; default 1e5 draws, seed 1. */
  readonly monteCarlo?: PlanOptions["monteCarlo"];
}

/** Output of {@link planBudget}. */
export interface BudgetStage {
  /** The mountings with their expanded uncertainty per operating point filled in. */
  readonly mountingPlans: PlannedMounting[];
  /** The mounting the budget is for (one of `mountingPlans`). */
  readonly chosen: PlannedMounting;
  /** Index of the operating point with the largest expanded uncertainty. */
  readonly worstIdx: number;
  /** Names of the budget lines at the worst point, largest first. */
  readonly worstBudget: readonly string[];
  /** The uncertainty section of the plan. */
  readonly uncertainty: SitePlan["uncertainty"];
  /** Warnings of this stage (none). */
  readonly warnings: [];
  /** Trace: the propagation methods used. */
  readonly trace: TraceEntry[];
}

/**
 * The model inputs of one mounting at one operating point, with their standard uncertainties,
 * distributions, units, sources and bases.
 *
 * The liquid time's uncertainty combines the fixed-delay half-width with the wall and lining
 * times' own: u(τ) = √((a_d/√3)² + u_wall² + u_lin²), u_wall = t_wall·√((a_e/e)² + (a_c/c)²)/√3
 * (common practice).
 *
 * @param input pipe, transducer, tolerance and installation data (SI)
 * @param m the mounting (its path and Δt per point)
 * @param pi index of the operating point
 * @returns the inputs in the order of MODEL_INPUTS (../model.ts)
 * @example
 * ```ts
 * import { budgetInputs } from "./budget.ts";
 * import { MODEL_INPUTS } from "../model.ts";
 * const inputs = budgetInputs({
 *   sp: {}, td: { wedgeAngle: 0.66 }, rp: { outsideDiameter: 0.2191 }, mat: {},
 *   wallThickness: 0.00818, wallL: 5900, lining: [], cw: 2720, cwHalf: 0, dcwdT: 0,
 *   zeroOffset: 0, timingResolution: 1e-10, wallTolHalf: 5e-4, odHalf: 1e-3,
 *   tolOffsets: { wallThickness: 0, outsideDiameter: 0 }, installHalf: 0.01,
 *   points: [{ profileFactor: 0.94, profileFactorSpread: 0.005 }],
 * } as unknown as Parameters<typeof budgetInputs>[0], {
 *   times: [{ deltaT: 1e-7 }], path: { wallTime: 2e-6, liningTime: 0, fluidTime: 1.5e-4 },
 * } as unknown as Parameters<typeof budgetInputs>[1], 0);
 * if (inputs.length !== MODEL_INPUTS.length) throw new Error();
 * // rectangular installation band: u = a/√3
 * if (Math.abs(inputs[8].standardUncertainty - 0.01 / Math.sqrt(3)) > 1e-15) throw new Error();
 * ```
 */
export function budgetInputs(
  input: BudgetModelInput,
  m: PlannedMounting,
  pi: number,
): UncertainInput[] {
  const { sp, td, rp, mat, wallThickness, wallL, lining, cw, cwHalf, dcwdT } = input;
  const { zeroOffset, timingResolution, wallTolHalf, odHalf, tolOffsets, installHalf } = input;
  const installSource = input.installProvenance ??
    { source: "snellpath-installation-model", basis: "recalled" };
  const linThick = lining.reduce((s, l) => s + l.thickness, 0);
  const p = input.points[pi];
  const dt = m.times[pi].deltaT;
  const path = m.path;
  // uncertainty of the liquid time: fixed delay, plus wall and lining times' own uncertainty
  const uWallTime = path.wallTime *
    Math.hypot(wallTolHalf / wallThickness, (mat.longitudinalSpread ?? 0) / wallL) / Math.sqrt(3);
  const uLinTime = path.liningTime *
    Math.hypot(
      PLAN_ASSUMPTIONS.liningThicknessRelative,
      lining.some((l) => !l.overridden) ? PLAN_ASSUMPTIONS.liningSpeedRelative : 0,
    ) /
    Math.sqrt(3);
  const uTau = Math.hypot(
    PLAN_ASSUMPTIONS.fixedDelayHalfWidth / Math.sqrt(3),
    uWallTime,
    uLinTime,
  );
  return [
    u(
      "outside diameter",
      rp.outsideDiameter,
      odHalf / Math.sqrt(3),
      "rectangular",
      "m",
      rp.tolerances?.source ?? "common-practice",
      rp.tolerances ? rp.tolerances.basis as UncertainInput["basis"] : "common-practice",
      tolOffsets.outsideDiameter,
    ),
    u(
      "wall thickness",
      wallThickness,
      wallTolHalf / Math.sqrt(3),
      "rectangular",
      "m",
      sp.measuredWallThickness !== undefined
        ? "common-practice"
        : rp.tolerances?.source ?? "common-practice",
      sp.measuredWallThickness !== undefined
        ? "measured"
        : rp.tolerances
        ? rp.tolerances.basis as UncertainInput["basis"]
        : "common-practice",
      tolOffsets.wallThickness,
    ),
    u(
      "lining thickness",
      linThick,
      PLAN_ASSUMPTIONS.liningThicknessRelative * linThick / Math.sqrt(3),
      "rectangular",
      "m",
      "common-practice",
      "common-practice",
    ),
    u(
      "wedge sound speed",
      cw,
      Math.hypot(cwHalf, Math.abs(dcwdT) * PLAN_ASSUMPTIONS.wedgeTemperatureHalfWidth) /
        Math.sqrt(3),
      "rectangular",
      "m/s",
      td.wedgeMaterial ? input.reg.material(td.wedgeMaterial).source : "common-practice",
      td.wedgeMaterial ? "recalled" : "common-practice",
    ),
    u(
      "wedge angle",
      td.wedgeAngle,
      PLAN_ASSUMPTIONS.wedgeAngleHalfWidth / Math.sqrt(3),
      "rectangular",
      "rad",
      "common-practice",
      "common-practice",
    ),
    u(
      "transit-time difference (zero offset, resolution)",
      dt,
      Math.hypot(zeroOffset / Math.sqrt(3), timingResolution / Math.sqrt(12)),
      "normal",
      "s",
      "common-practice",
      "input",
    ),
    u(
      "time in the liquid (fixed delays)",
      path.fluidTime,
      uTau,
      "normal",
      "s",
      "common-practice",
      "common-practice",
    ),
    u(
      "profile factor (model spread)",
      p.profileFactor,
      p.profileFactorSpread / Math.sqrt(3),
      "rectangular",
      "",
      "common-practice",
      "computed",
    ),
    u(
      "installation effect (estimate)",
      0,
      installHalf / Math.sqrt(3),
      "rectangular",
      "",
      installSource.source,
      installSource.basis as UncertainInput["basis"],
    ),
  ];
}

/**
 * The uncertainty budget of a site: GUM at every operating point of every mounting, the mounting
 * chosen by {@link chooseMounting}, its budget table at the design point (else the worst), and a
 * Monte Carlo check of that point unless switched off.
 *
 * @param input model data, mountings and Monte Carlo settings (SI)
 * @returns the mountings with expanded uncertainties, the chosen one, the uncertainty section
 * @example
 * ```ts
 * import { planBudget } from "./budget.ts";
 * // no mountings: nothing to budget, refused by name
 * let refused = false;
 * try {
 *   planBudget({ mountingPlans: [], points: [] } as unknown as Parameters<typeof planBudget>[0]);
 * } catch (e) {
 *   refused = (e as Error).name === "InputError";
 * }
 * if (!refused) throw new Error();
 * ```
 */
export function planBudget(input: BudgetStageInput): BudgetStage {
  const { points } = input;
  const gumAt = (m: PlannedMounting, pi: number) => {
    const inputs = budgetInputs(input, m, pi);
    return { inputs, result: gumPropagate(flowModel, inputs) };
  };
  // a copy keeps each key where planMountings put it, so the plan's bytes do not move
  const mountingPlans = input.mountingPlans.map((m) => ({
    ...m,
    expandedByPoint: points.map((_p, i) => gumAt(m, i).result.relativeExpanded ?? Infinity),
  }));
  const chosen = chooseMounting(mountingPlans);
  const byPoint = chosen.expandedByPoint;
  let worstIdx = 0;
  byPoint.forEach((x, i) => {
    if (x > byPoint[worstIdx]) worstIdx = i;
  });
  const designIdx = points.findIndex((p) => p.label === "design");
  const reportIdx = designIdx >= 0 ? designIdx : worstIdx;
  const { inputs: repInputs, result: rep } = gumAt(chosen, reportIdx);
  const worst = worstIdx === reportIdx ? rep : gumAt(chosen, worstIdx).result;
  const mc = input.monteCarlo === false
    ? undefined
    : monteCarloCheck(repInputs, rep.value, input.monteCarlo ?? {});
  const trace = [
    traceEntry(
      "formulation: GUM law of propagation",
      "JCGM 100:2008",
      "",
      "jcgm-100-2008",
      "transcribed",
    ),
  ];
  if (mc) {
    trace.push(
      traceEntry(
        "formulation: Monte Carlo propagation",
        "JCGM 101:2008",
        "",
        "jcgm-101-2008",
        "transcribed",
      ),
    );
  }
  return {
    mountingPlans,
    chosen,
    worstIdx,
    worstBudget: worst.budget.map((b) => b.name),
    uncertainty: {
      mounting: chosen.traverses,
      operatingPoint: points[reportIdx].label,
      expanded: rep.relativeExpanded ?? Infinity,
      coverageFactor: rep.coverageFactor,
      expandedByPoint: points.map((p, i) => ({ label: p.label, expanded: byPoint[i] })),
      budget: budgetLines(repInputs, rep),
      monteCarlo: mc,
    },
    warnings: [],
    trace,
  };
}

/** The plan's budget table from a GUM result and the inputs it came from. */
function budgetLines(inputs: readonly UncertainInput[], rep: GumResult): PlanBudgetLine[] {
  const Q = rep.value;
  return rep.budget.map((b) => {
    const inp = inputs.find((x) => x.name === b.name)!;
    return {
      name: b.name,
      value: b.value,
      unit: inp.unit ?? "",
      standardUncertainty: b.standardUncertainty,
      distribution: b.distribution,
      sensitivity: b.sensitivity,
      relativeContribution: b.contribution / Math.abs(Q),
      share: b.share,
      source: inp.source ?? "",
      basis: inp.basis ?? "",
      ...(inp.centreOffset ? { centreOffset: inp.centreOffset } : {}),
    };
  });
}

/** Monte Carlo (JCGM 101) at the budget's point: expanded = half the 95 % interval over |Q|. */
function monteCarloCheck(
  inputs: readonly UncertainInput[],
  Q: number,
  options: { readonly draws?: number; readonly seed?: number },
): NonNullable<SitePlan["uncertainty"]["monteCarlo"]> {
  const draws = options.draws ?? 100_000;
  const seed = options.seed ?? 1;
  const r = monteCarlo(flowModel, inputs, { draws, seed });
  return {
    draws: r.draws,
    seed: r.seed,
    expanded: (r.interval[1] - r.interval[0]) / 2 / Math.abs(Q),
    interval: r.interval,
  };
}

function u(
  name: string,
  value: number,
  standardUncertainty: number,
  distribution: UncertainInput["distribution"],
  unit: string,
  source: string,
  basis: UncertainInput["basis"],
  centreOffset = 0,
): UncertainInput {
  const input = { name, value, standardUncertainty, distribution, unit, source, basis };
  return centreOffset === 0 ? input : { ...input, centreOffset };
}
