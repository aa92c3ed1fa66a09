/**
 * Plan stage 5, the straight run: the position along the run (planned or ranked), its check
 * against the fittings' requirements, and the estimated profile error from the upstream fitting,
 * which enters the budget as a rectangular half-width.
 *
 * Method: {@link rankPositions} and {@link checkStraightRun} (common-practice diameters), and the
 * distorted-profile estimate {@link profileErrorEstimate} (lib/installation); its source and
 * basis ({@link modelProvenance} of the upstream fitting) go to the trace and the budget.
 *
 * @module
 */
import type { Warning } from "../../errors.ts";
import { trace as traceEntry, type TraceEntry } from "../../trace.ts";
import {
  checkStraightRun,
  type ModelProvenance,
  modelProvenance,
  profileError,
  profileErrorEstimate,
  type ProfileErrorInput,
  rankPositions,
  resolveFitting,
} from "../../installation/mod.ts";
import { defaultRegistry } from "../../registry/mod.ts";
import type { SiteInput } from "../schema.ts";
import type { OperatingPoint, SitePlan } from "../plan.ts";

/** Input of {@link planStraightRun}. */
export interface RunStageInput {
  /** The site file's run section (m), when any. */
  readonly run: SiteInput["run"];
  /** Bore, m. */
  readonly bore: number;
  /** Relative roughness of the bore, dimensionless. */
  readonly relativeRoughness: number;
  /** The operating points (Reynolds numbers). */
  readonly points: readonly OperatingPoint[];
  /** Traverses of the mounting the run is ranked for. */
  readonly traverses: number;
  /** Path angle in the liquid of that mounting, rad. */
  readonly fluidAngle: number;
}

/** Output of {@link planStraightRun}. */
export interface RunStage {
  /** The straight-run part of the plan, undefined without a run. */
  readonly straightRun: SitePlan["straightRun"];
  /** Installation-effect half-width, relative (0 without a run). */
  readonly installHalf: number;
  /** Source and basis of the model terms behind `installHalf` (of "none" without a run). */
  readonly installProvenance: Pick<ModelProvenance, "source" | "basis">;
  /** Warnings of this stage. */
  readonly warnings: Warning[];
  /** Trace entries of this stage. */
  readonly trace: TraceEntry[];
}

/**
 * The straight-run assessment of a site.
 *
 * @param input run (m), bore (m), roughness, points, traverses and liquid path angle (rad)
 * @returns the straight-run section and the installation half-width (relative)
 * @example
 * ```ts
 * import { planStraightRun } from "./run.ts";
 * const s = planStraightRun({
 *   run: undefined, bore: 0.2, relativeRoughness: 0, points: [], traverses: 2, fluidAngle: 0.3,
 * });
 * // no run: nothing assessed, a warning says so
 * if (s.straightRun !== undefined || s.installHalf !== 0 || s.warnings[0].code !== "no-run") {
 *   throw new Error();
 * }
 * ```
 */
export function planStraightRun(input: RunStageInput): RunStage {
  const { bore, points } = input;
  const rr = input.relativeRoughness;
  const provisional = { traverses: input.traverses, fluidAngle: input.fluidAngle };
  const warnings: Warning[] = [];
  const tr: TraceEntry[] = [];
  const addTrace = (entries: readonly TraceEntry[] | undefined) => {
    if (entries) { for (const e of entries) tr.push(e); }
  };
  let straightRun: SitePlan["straightRun"];
  let installHalf = 0;
  let installProvenance: RunStage["installProvenance"] = modelProvenance("none");
  const reList = points.map((p) => p.reynolds);
  const designPoint = points.find((p) => p.label === "design") ?? points[points.length - 1];
  if (input.run) {
    const run = input.run;
    const upFit = resolveFitting(run.upstream.fitting);
    const downFit = run.downstream
      ? resolveFitting(run.downstream.fitting)
      : mostDemandingDownstream();
    if (!run.downstream) {
      const d = downFit.straightRun.downstream.diameters;
      warnings.push({
        code: "default",
        message: `run.downstream not given; the most demanding downstream fitting in the ` +
          `registry (${downFit.id}, ${d} D downstream) assumed — state the fitting to relax this`,
      });
    }
    const rank = rankPositions({
      runLength: run.length,
      diameter: bore,
      upstream: { fitting: upFit.id, orientation: run.upstream.orientation },
      downstream: { fitting: downFit.id },
      traverses: provisional.traverses,
      reynolds: reList,
      fluidAngle: provisional.fluidAngle,
    });
    const position = run.plannedPosition ?? rank.recommendedPosition;
    // The model takes the angle between the path plane and the fitting's plane. A ranked
    // position uses the recommended plane, scored by rankPositions as (plane − fitting's
    // orientation); a planned position keeps the site's angle as given.
    const orientation = run.plannedPosition !== undefined
      ? run.upstream.orientation ?? 0
      : rank.recommendedOrientation - (run.upstream.orientation ?? 0);
    const check = checkStraightRun({
      diameter: bore,
      upstream: { fitting: upFit.id, distance: position },
      downstream: { fitting: downFit.id, distance: run.length - position },
    });
    addTrace(check.trace);
    const estInput = (x: number): ProfileErrorInput => ({
      distanceDiameters: x / bore,
      fitting: upFit.id,
      orientation,
      traverses: provisional.traverses,
      reynolds: designPoint.reynolds,
      fluidAngle: provisional.fluidAngle,
      relativeRoughness: rr,
    });
    const est = profileErrorEstimate(estInput(position));
    installHalf = Math.abs(est.error) + est.spread;
    installProvenance = { source: est.source, basis: est.basis };
    const along: { position: number; error: number }[] = [];
    for (let i = 0; i <= 40; i++) {
      const x = run.length * i / 40;
      along.push({
        position: x,
        error: profileError(estInput(x)),
      });
    }
    tr.push(
      traceEntry(
        "formulation: distorted-profile model (estimate)",
        "lib/installation",
        "",
        est.source,
        est.basis,
      ),
    );
    straightRun = {
      verdict: check.verdict,
      position,
      positionSource: run.plannedPosition !== undefined ? "planned" : "recommended",
      upstreamDiameters: check.upstreamDiameters,
      downstreamDiameters: check.downstreamDiameters,
      requiredUpstream: check.requiredUpstream,
      requiredDownstream: check.requiredDownstream,
      commonPracticePosition: rank.commonPracticePosition,
      recommendedPosition: rank.recommendedPosition,
      recommendedOrientation: rank.recommendedOrientation,
      estimatedProfileError: est.error,
      estimatedProfileErrorSpread: est.spread,
      reasons: check.reasons,
      notes: [...rank.notes, est.note],
      errorAlongRun: along,
      runLength: run.length,
      upstreamFitting: upFit.id,
      downstreamFitting: downFit.id,
      ...(run.downstream ? {} : { downstreamAssumed: true }),
    };
  } else {
    warnings.push({
      code: "no-run",
      message: "no straight run described: installation effects are not assessed",
    });
  }

  return { straightRun, installHalf, installProvenance, warnings, trace: tr };
}

/**
 * The registry fitting with the largest downstream straight-run requirement: the conservative
 * stand-in when a site does not say what follows the run (first by registry order on a tie).
 */
function mostDemandingDownstream(): ReturnType<typeof resolveFitting> {
  let best = resolveFitting("none");
  for (const f of defaultRegistry().fittings()) {
    if (f.straightRun.downstream.diameters > best.straightRun.downstream.diameters) {
      best = resolveFitting(f.id);
    }
  }
  return best;
}
