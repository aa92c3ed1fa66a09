/**
 * Plan stage 8, the verdict: whether the worst expanded uncertainty meets the site's target and
 * what would reach it, which technique the stated solids and gas favour, and the budget's main
 * limitation.
 *
 * Method: comparison of the worst expanded relative uncertainty (k = 2, GUM) with the target;
 * suggestions follow the three largest budget lines at the worst point (common practice); the
 * technique screening of lib/acoustics.
 *
 * @module
 */
import type { Warning } from "../../errors.ts";
import type { TraceEntry } from "../../trace.ts";
import { techniqueScreening } from "../../acoustics/mod.ts";
import type { SiteInput } from "../schema.ts";
import type { MountingPlan, OperatingPoint, SitePlan } from "../plan.ts";

/** Input of {@link planVerdict}. */
export interface VerdictStageInput {
  /** Target expanded relative uncertainty (k = 2), when the site states one. */
  readonly targetUncertainty: number | undefined;
  /** Stated solids and gas volume fractions, when given. */
  readonly content: SiteInput["content"];
  /** The operating points. */
  readonly points: readonly OperatingPoint[];
  /** Every mounting, with expanded uncertainty per point. */
  readonly mountingPlans: readonly MountingPlan[];
  /** The mounting the budget is for (one of `mountingPlans`). */
  readonly chosen: MountingPlan;
  /** Index of the worst operating point of the chosen mounting. */
  readonly worstIdx: number;
  /** Budget line names at the worst point, largest first. */
  readonly worstBudget: readonly string[];
  /** Budget line names at the reported point, largest first. */
  readonly budget: readonly string[];
  /** The straight-run section, when a run is described. */
  readonly straightRun: SitePlan["straightRun"];
}

/** Output of {@link planVerdict}. */
export interface VerdictStage {
  /** Verdict on the target, when one is stated. */
  readonly target: SitePlan["target"];
  /** Which technique the stated content favours. */
  readonly technique: SitePlan["technique"];
  /** Largest contributor to the budget. */
  readonly mainLimitation: string;
  /** Warnings of this stage (transit time unlikely to work). */
  readonly warnings: Warning[];
  /** Trace of this stage (none). */
  readonly trace: TraceEntry[];
}

/**
 * The verdict of a plan on its target and technique.
 *
 * @param input target, content, points, mountings with their expanded uncertainties, budgets
 * @returns target verdict, technique and main limitation
 * @example
 * ```ts
 * import { planVerdict } from "./verdict.ts";
 * const chosen = { name: "V", traverses: 2, expandedByPoint: [0.03, 0.02] };
 * const v = planVerdict({
 *   targetUncertainty: 0.01, content: undefined,
 *   points: [{ label: "minimum" }, { label: "design" }],
 *   mountingPlans: [chosen], chosen, worstIdx: 0,
 *   worstBudget: ["wall thickness"], budget: ["wall thickness"], straightRun: undefined,
 * } as unknown as Parameters<typeof planVerdict>[0]);
 * // 3 % > 1 %: not reachable; the wall is the largest line, so gauge it
 * if (v.target?.reachable !== false || !v.target.suggestions[0].includes("thickness gauge")) {
 *   throw new Error();
 * }
 * ```
 */
export function planVerdict(input: VerdictStageInput): VerdictStage {
  const { points, chosen, worstIdx } = input;
  const warnings: Warning[] = [];
  let target: SitePlan["target"];
  const worst = chosen.expandedByPoint[worstIdx];
  if (input.targetUncertainty !== undefined) {
    const reachable = worst <= input.targetUncertainty;
    target = {
      uncertainty: input.targetUncertainty,
      reachable,
      worstExpanded: worst,
      worstPoint: points[worstIdx].label,
      suggestions: reachable ? [] : suggestions(input, input.targetUncertainty),
    };
  }
  const technique = techniqueScreening({
    solidsFraction: input.content?.solids,
    gasFraction: input.content?.gas,
  });
  if (technique.favours === "doppler") {
    warnings.push({
      code: "technique",
      message: `transit time is unlikely to work here: ${technique.reasons.join("; ")}`,
    });
  }
  return {
    target,
    technique: { favours: technique.favours, reasons: technique.reasons },
    mainLimitation: input.budget[0] ?? "",
    warnings,
    trace: [],
  };
}

/** What would reach the target: by the three largest lines at the worst point, other mountings. */
function suggestions(input: VerdictStageInput, targetUncertainty: number): string[] {
  const { chosen } = input;
  const out: string[] = [];
  for (const name of input.worstBudget.slice(0, 3)) {
    out.push(...suggestionFor(name, input.straightRun, chosen.traverses));
  }
  for (const m of input.mountingPlans) {
    if (m !== chosen && Math.max(...m.expandedByPoint) <= targetUncertainty) {
      out.push(`the ${m.name} mounting (${m.traverses} traverses) reaches the target`);
    }
  }
  if (out.length === 0) out.push("no single change found: review the budget");
  return [...new Set(out)];
}

function suggestionFor(
  name: string,
  run: SitePlan["straightRun"],
  traverses: number,
): string[] {
  if (name.startsWith("installation")) {
    const s = ["a longer straight run upstream, or a location further from the upstream fitting"];
    if (run && run.position !== run.recommendedPosition) {
      s.push(
        `move to the recommended position ${
          run.recommendedPosition.toFixed(2)
        } m from the upstream fitting`,
      );
    }
    return s;
  }
  if (name.startsWith("wall thickness")) return ["measure the wall with a thickness gauge"];
  if (name.startsWith("outside diameter")) return ["measure the circumference with a tape"];
  if (name.startsWith("lining")) {
    return ["measure the lining thickness (for example at a cut or a fitting)"];
  }
  if (name.startsWith("transit-time difference")) {
    return [`more traverses than ${traverses} (a longer path gives a larger Δt), or finer timing`];
  }
  if (name.startsWith("profile factor")) {
    return ["a multi-path arrangement, or a site with Reynolds number out of transition"];
  }
  if (name.startsWith("wedge")) return ["check the transducers' wedge data and temperature"];
  if (name.startsWith("time in the liquid")) return ["zero the fixed delays on site"];
  return [];
}
