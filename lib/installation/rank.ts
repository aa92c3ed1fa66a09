/**
 * Ranking of meter positions (and path orientations) along an available straight run.
 *
 * @module
 */
import { InputError, requireFinite } from "../errors.ts";
import { resolveFitting } from "./fittings.ts";
import { MODEL_NOTE, profileErrorEstimate } from "./model.ts";
import { MARGINAL_FRACTION, type StraightRunVerdict } from "./straight_run.ts";
import type { ProfileModel } from "../flow/profile.ts";

/** Fraction of the run used as the common-practice position when the run is short. */
export const SHORT_RUN_FRACTION = 0.75;

/** Default candidate path-plane angles from the top of the pipe, rad: horizontal, ±45°. */
export const DEFAULT_PATH_ORIENTATIONS: readonly number[] = Object.freeze([
  Math.PI / 2,
  Math.PI / 4,
  3 * Math.PI / 4,
]);

/** Input of {@link rankPositions}. */
export interface RankInput {
  /** Straight length available between the upstream and downstream fittings, m (> 0). */
  readonly runLength: number;
  /** Inside diameter, m (> 0). */
  readonly diameter: number;
  /**
   * Upstream fitting; `orientation` is the angle of its reference plane (an elbow's bend
   * plane) from the vertical plane through the pipe axis, rad; default 0.
   */
  readonly upstream: { readonly fitting: string; readonly orientation?: number };
  /** Downstream fitting; default none (a long straight pipe). */
  readonly downstream?: { readonly fitting: string };
  /** Bore crossings (1 Z, 2 V, 4 W); default 2. */
  readonly traverses?: number;
  /** Reynolds number or numbers (minimum, design, maximum flow); default [1e5]. */
  readonly reynolds?: number | readonly number[];
  /** Candidate positions, m from the upstream fitting; default 41 points along the run. */
  readonly positions?: readonly number[];
  /** Candidate path-plane angles from the vertical, rad; default horizontal and ±45°. */
  readonly pathOrientations?: readonly number[];
  /** Beam angle in the liquid, rad; default 20°. */
  readonly fluidAngle?: number;
  /** Chord offset h/R (lateral misalignment), default 0. */
  readonly chordOffset?: number;
  /** Fully developed profile model, default power-law-nikuradse. */
  readonly model?: ProfileModel;
}

/** One ranked candidate. */
export interface RankedPosition {
  /** m from the upstream fitting. */
  readonly position: number;
  /** Path-plane angle from the vertical, rad. */
  readonly orientation: number;
  /** Estimated relative error at each Reynolds number given (same order). */
  readonly errors: readonly number[];
  /** The estimated error of largest magnitude over the Reynolds numbers. */
  readonly estimatedError: number;
  /** Reading shift magnitude from the downstream fitting. */
  readonly downstreamEffect: number;
  /** |estimatedError| + downstreamEffect: the ranking key (smaller is better). */
  readonly score: number;
  /** Straight-run verdict at this position. */
  readonly verdict: StraightRunVerdict;
}

/** Result of {@link rankPositions}. */
export interface RankResult {
  /** The common practice position. */
  readonly commonPracticePosition: number;
  /** The recommended position. */
  readonly recommendedPosition: number;
  /** The recommended orientation. */
  readonly recommendedOrientation: number;
  /** The ranking. */
  readonly ranking: readonly RankedPosition[];
  /** The meets common practice. */
  readonly meetsCommonPractice: boolean;
  /** The required upstream. */
  readonly requiredUpstream: number;
  /** The required downstream. */
  readonly requiredDownstream: number;
  /** The notes. */
  readonly notes: readonly string[];
}

/**
 * Rank meter positions and path orientations along a straight run between two fittings.
 *
 * - Common-practice position (rule stated here): when the run holds both requirements
 *   (upstream U D after the upstream fitting, downstream W D before the downstream one), the
 *   point U D after the upstream fitting (the nearest point that meets the upstream rule while
 *   keeping the downstream one); when it does not, three quarters of the way along the run
 *   from the upstream fitting (common practice).
 * - Ranking: each candidate position × path orientation is scored with
 *   {@link profileErrorEstimate} at every Reynolds number given (the worst magnitude counts)
 *   plus the downstream fitting's reading shift; smaller is better. The ranking lists the
 *   candidates meeting the straight-run rule first, then marginal, then short ones, each group
 *   by score; the recommended candidate is the first.
 *
 * Sources: requirements `common-practice`; model as {@link profileErrorEstimate}.
 * The ranking is an estimate, not a calibration.
 *
 * @param input run length and diameter (m), fittings, traverses, Reynolds numbers, candidates
 * @returns both positions, the recommended orientation, the ranking (best first), notes
 *
 * @example
 * ```ts
 * import { rankPositions } from "./rank.ts";
 * const r = rankPositions({ runLength: 1.2, diameter: 0.2, upstream: { fitting: "elbow-90" } });
 * if (Math.abs(r.commonPracticePosition - 0.9) > 1e-12 || r.meetsCommonPractice) throw new Error();
 * ```
 */
export function rankPositions(input: RankInput): RankResult {
  const L = requireFinite("runLength", input?.runLength, "m", true);
  const D = requireFinite("diameter", input.diameter, "m", true);
  if (!input.upstream) throw new InputError("upstream", "nothing", "{ fitting, orientation? }");
  const up = resolveFitting(input.upstream.fitting);
  const down = resolveFitting(input.downstream?.fitting ?? "none");
  const fitOrient = requireFinite("upstream.orientation", input.upstream.orientation ?? 0, "rad");
  const res = input.reynolds === undefined
    ? [1e5]
    : typeof input.reynolds === "number"
    ? [input.reynolds]
    : [...input.reynolds];
  if (res.length === 0) throw new InputError("reynolds", "[]", "one or more Reynolds numbers");
  for (const re of res) requireFinite("reynolds", re, "1", true);
  const reqUp = up.straightRun.upstream.diameters;
  const reqDown = down.straightRun.downstream.diameters;
  const runD = L / D;
  const meets = runD >= reqUp + reqDown;
  const commonPracticePosition = meets ? reqUp * D : SHORT_RUN_FRACTION * L;
  let positions: number[];
  if (input.positions) {
    positions = input.positions.map((p, i) => {
      requireFinite(`positions[${i}]`, p, "m");
      if (p < 0 || p > L) {
        throw new InputError(`positions[${i}]`, `${p} m`, `a position from 0 to the run ${L} m`);
      }
      return p;
    });
  } else {
    const margin = Math.min(D, L / 4);
    positions = [];
    for (let i = 0; i <= 40; i++) positions.push(margin + (L - 2 * margin) * i / 40);
    positions.push(commonPracticePosition);
  }
  const orients = input.pathOrientations ?? DEFAULT_PATH_ORIENTATIONS;
  const de = down.disturbance.downstreamEffect;
  const ranking: RankedPosition[] = [];
  for (const p of positions) {
    const xUp = p / D;
    const xDown = (L - p) / D;
    const downstreamEffect = Math.abs(de.amplitude) * Math.exp(-xDown / de.decay);
    const verdict = sideVerdict(xUp, reqUp, xDown, reqDown);
    for (const o of orients) {
      requireFinite("pathOrientations", o, "rad");
      const errors = res.map((re) =>
        profileErrorEstimate({
          distanceDiameters: xUp,
          fitting: up,
          orientation: o - fitOrient,
          traverses: input.traverses,
          reynolds: re,
          chordOffset: input.chordOffset,
          fluidAngle: input.fluidAngle,
          model: input.model,
        }).error
      );
      let worst = errors[0];
      for (const e of errors) if (Math.abs(e) > Math.abs(worst)) worst = e;
      ranking.push({
        position: p,
        orientation: o,
        errors,
        estimatedError: worst,
        downstreamEffect,
        score: Math.abs(worst) + downstreamEffect,
        verdict,
      });
    }
  }
  const vOrder = { meets: 0, marginal: 1, short: 2 };
  ranking.sort((a, b) => vOrder[a.verdict] - vOrder[b.verdict] || a.score - b.score);
  const best = ranking[0];
  const notes = [
    MODEL_NOTE,
    `common-practice position: ${
      meets
        ? `${reqUp} D after ${up.id} (the run of ${round1(runD)} D holds ${reqUp} D + ${reqDown} D)`
        : `three quarters of the run (${round1(runD)} D is short of ${reqUp} D + ${reqDown} D)`
    }`,
    "path planes are measured from the vertical; on horizontal pipes keep the path within 45° " +
    "of horizontal so the beam avoids gas at the crown and sediment at the invert (common practice)",
  ];
  if (!meets) {
    notes.push("the run is short of the common-practice requirement: expect a larger error");
  }
  if (res.length > 1) notes.push("each candidate is scored by its worst error over the flow range");
  return Object.freeze({
    commonPracticePosition,
    recommendedPosition: best.position,
    recommendedOrientation: best.orientation,
    ranking: Object.freeze(ranking),
    meetsCommonPractice: meets,
    requiredUpstream: reqUp,
    requiredDownstream: reqDown,
    notes: Object.freeze(notes),
  });
}

function sideVerdict(
  xUp: number,
  reqUp: number,
  xDown: number,
  reqDown: number,
): StraightRunVerdict {
  const f = Math.min(reqUp > 0 ? xUp / reqUp : Infinity, reqDown > 0 ? xDown / reqDown : Infinity);
  return f >= 1 ? "meets" : f >= MARGINAL_FRACTION ? "marginal" : "short";
}

function round1(x: number): number {
  return Math.round(x * 10) / 10;
}
