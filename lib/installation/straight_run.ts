/**
 * Straight-run check against the common-practice requirements of data/fittings.yaml.
 *
 * @module
 */
import { InputError, requireFinite } from "../errors.ts";
import { trace, type TraceEntry } from "../trace.ts";
import { type Fitting, resolveFitting } from "./fittings.ts";

/** Verdict of a straight-run check. */
export type StraightRunVerdict = "meets" | "marginal" | "short";

/** Fraction of a requirement from which a run counts as marginal rather than short. */
export const MARGINAL_FRACTION = 0.8;

/** Input of {@link checkStraightRun}. */
export interface StraightRunInput {
  /** Inside diameter, m. */
  readonly diameter: number;
  /** Fitting upstream of the meter and its distance to the meter (m). */
  readonly upstream: { readonly fitting: string | Fitting; readonly distance: number };
  /** Fitting downstream of the meter and its distance from the meter (m); optional. */
  readonly downstream?: { readonly fitting: string | Fitting; readonly distance: number };
}

/** Result of {@link checkStraightRun}. */
export interface StraightRunResult {
  /** The verdict. */
  readonly verdict: StraightRunVerdict;
  /** Available straight lengths, in diameters. */
  readonly upstreamDiameters: number;
  /** The downstream diameters. */
  readonly downstreamDiameters: number | null;
  /** Required straight lengths, in diameters. */
  readonly requiredUpstream: number;
  /** The required downstream. */
  readonly requiredDownstream: number;
  /** The reasons. */
  readonly reasons: readonly string[];
  /** The trace. */
  readonly trace: readonly TraceEntry[];
}

/**
 * Check the straight run at a meter location against the common-practice requirement of the
 * fittings on either side (data/fittings.yaml, source `common-practice`).
 *
 * Rule (stated here, common practice): each side is compared with its requirement; a side
 * at or above it meets, at or above 80 % of it is marginal, below is short; the verdict is
 * the worse side. A missing downstream fitting counts as a long straight pipe. Distances are
 * measured from the fitting (its outlet or inlet face) to the middle of the transducer set.
 *
 * @param input diameter (m, > 0), upstream { fitting, distance m ≥ 0 }, optional downstream
 * @returns verdict, available and required lengths in D, reasons, trace
 *
 * @example
 * ```ts
 * import { checkStraightRun } from "./straight_run.ts";
 * const r = checkStraightRun({
 *   diameter: 0.2,
 *   upstream: { fitting: "elbow-90", distance: 2.0 },
 *   downstream: { fitting: "gate-valve", distance: 1.0 },
 * });
 * if (r.verdict !== "meets" || r.requiredUpstream !== 10) throw new Error();
 * ```
 */
export function checkStraightRun(input: StraightRunInput): StraightRunResult {
  const d = requireFinite("diameter", input?.diameter, "m", true);
  if (!input.upstream) throw new InputError("upstream", "nothing", "{ fitting, distance }");
  const up = resolveFitting(input.upstream.fitting);
  const upDist = requireFinite("upstream.distance", input.upstream.distance, "m");
  if (upDist < 0) {
    throw new InputError("upstream.distance", `${upDist} m`, "a distance ≥ 0 m");
  }
  const down = input.downstream ? resolveFitting(input.downstream.fitting) : undefined;
  let downDist: number | null = null;
  if (input.downstream) {
    downDist = requireFinite("downstream.distance", input.downstream.distance, "m");
    if (downDist < 0) {
      throw new InputError(
        "downstream.distance",
        `${downDist} m`,
        "a distance ≥ 0 m from the meter to the downstream fitting",
      );
    }
  }
  const reqUp = up.straightRun.upstream.diameters;
  const reqDown = down ? down.straightRun.downstream.diameters : 0;
  const upD = upDist / d;
  const downD = downDist === null ? null : downDist / d;
  if (!Number.isFinite(upD) || (downD !== null && !Number.isFinite(downD))) {
    // A denormal diameter (5e-324 m) is positive and finite, but distance/diameter overflows.
    throw new InputError("diameter", `${d} m`, "an inside diameter of a real pipe (m)");
  }
  const reasons: string[] = [];
  const side = (have: number, need: number, label: string, id: string): StraightRunVerdict => {
    if (have >= need) {
      reasons.push(`${label}: ${r1(have)} D from ${id} meets the ${need} D asked`);
      return "meets";
    }
    const frac = have / need;
    const v: StraightRunVerdict = frac >= MARGINAL_FRACTION ? "marginal" : "short";
    reasons.push(
      `${label}: ${r1(have)} D from ${id} is ${Math.round(frac * 100)} % of the ${need} D asked ` +
        `(${v}; marginal from ${MARGINAL_FRACTION * 100} %)`,
    );
    return v;
  };
  const vu = side(upD, reqUp, "upstream", up.id);
  const vd = down && downD !== null ? side(downD, reqDown, "downstream", down.id) : "meets";
  const order: StraightRunVerdict[] = ["meets", "marginal", "short"];
  const verdict = order[Math.max(order.indexOf(vu), order.indexOf(vd))];
  const t: TraceEntry[] = [
    trace("inside diameter", d, "m", "input", "input"),
    trace(`required upstream run after ${up.id}`, reqUp, "D", src(up), basis(up)),
  ];
  if (down) {
    t.push(
      trace(`required downstream run before ${down.id}`, reqDown, "D", src(down), basis(down)),
    );
  }
  return Object.freeze({
    verdict,
    upstreamDiameters: upD,
    downstreamDiameters: downD,
    requiredUpstream: reqUp,
    requiredDownstream: reqDown,
    reasons: Object.freeze(reasons),
    trace: Object.freeze(t),
  });
}

function r1(x: number): string {
  return (Math.round(x * 10) / 10).toString();
}

function src(f: Fitting): string {
  return f.straightRun.upstream.source ?? f.straightRun.source ?? f.source ?? "common-practice";
}

function basis(f: Fitting): "common-practice" | "transcribed" | "computed" | "recalled" {
  return f.straightRun.upstream.basis ?? f.straightRun.basis ?? f.basis ?? "common-practice";
}
