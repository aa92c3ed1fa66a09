/**
 * Ranking of meter positions (and path orientations) along an available straight run.
 *
 * @module
 */
import { InputError, requireFinite } from "../errors.ts";
import { resolveFitting } from "./fittings.ts";
import { MODEL_NOTE, profileError } from "./model.ts";
import { MARGINAL_FRACTION, type StraightRunVerdict } from "./straight_run.ts";
import type { ProfileModel } from "../flow/profile.ts";

/** Relative tolerance under which two scores are a tie (1e-4 of the larger). */
export const SCORE_TIE_TOLERANCE = 1e-4;

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
  /** Whether the length left to the downstream fitting meets its requirement (≥ W D). */
  readonly meetsDownstream: boolean;
}

/**
 * Path plane and transducer clock positions of the recommended candidate.
 *
 * Clock convention: 12 o'clock at the crown (top of the pipe), 6 at the invert, the clock read
 * looking downstream (along the flow) and counted clockwise; an angle ψ from the vertical (rad,
 * counted the same way) is the clock hour 6ψ/π. The path plane contains the pipe axis and
 * meets the wall at ψ and ψ + π. A path crossing the bore an odd number of times (Z: 1) has its
 * transducers on opposite sides, at ψ and ψ + π (horizontal plane: 3 and 9 o'clock); an even
 * number (V: 2, W: 4) has both on one side, at ψ (the side met between 12 and 6 o'clock going
 * clockwise; horizontal plane: both at 3 o'clock).
 */
export interface PathPlane {
  /** Path-plane angle from the vertical, rad, reduced to [0, π) (π/2 is horizontal). */
  readonly angleFromVertical: number;
  /** Bore crossings the clock positions are given for. */
  readonly traverses: number;
  /** Whether both transducers sit on the same side of the pipe (even traverses). */
  readonly sameSide: boolean;
  /**
   * Clock hours of the upstream and the downstream transducer, in (0, 12] (12 is the crown;
   * 1.5 is half past one), by the convention above.
   */
  readonly clockHours: readonly [number, number];
}

/** Result of {@link rankPositions}. */
export interface RankResult {
  /** The common practice position. */
  readonly commonPracticePosition: number;
  /** The recommended position. */
  readonly recommendedPosition: number;
  /** Path-plane angle of the recommended candidate from the vertical, rad (as given). */
  readonly recommendedOrientation: number;
  /** Path plane and transducer clock positions of the recommended candidate. */
  readonly recommendedPathPlane: PathPlane;
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
 * - Score: each candidate position × path orientation is scored with
 *   {@link profileError} (the error of {@link profileErrorEstimate}) at every Reynolds number given (the worst magnitude counts)
 *   plus the downstream fitting's reading shift; smaller is better.
 * - Order (the recommended candidate is the first):
 *   1. downstream filter: when any candidate leaves at least the downstream requirement (W D)
 *      before the downstream fitting, every such candidate comes before every one that does not;
 *   2. within each side of that filter, straight-run verdict: meets, then marginal, then short;
 *   3. then score; scores within {@link SCORE_TIE_TOLERANCE} (relative) of the best one left in
 *      the group are a tie, broken by the path plane nearer horizontal (π/2 from the vertical),
 *      then by the earlier position (nearer the upstream fitting), then by score.
 * - `recommendedPathPlane` gives the recommended plane and the transducer clock positions
 *   ({@link PathPlane}: 12 o'clock at the crown, read looking downstream, clockwise; Z on
 *   opposite sides, V and W both on one side).
 *
 * Sources: requirements `common-practice`; model as {@link profileErrorEstimate}.
 * The ranking is an estimate, not a calibration.
 *
 * @param input run length and diameter (m), fittings, traverses, Reynolds numbers, candidates
 * @returns both positions, the recommended orientation and path plane, the ranking (best
 *   first), notes
 *
 * @example
 * ```ts
 * import { rankPositions } from "./rank.ts";
 * const r = rankPositions({ runLength: 1.2, diameter: 0.2, upstream: { fitting: "elbow-90" } });
 * if (Math.abs(r.commonPracticePosition - 0.9) > 1e-12 || r.meetsCommonPractice) throw new Error();
 * // V path (2 traverses, the default): both transducers on one side
 * if (!r.recommendedPathPlane.sameSide) throw new Error();
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
    const meetsDownstream = xDown >= reqDown;
    for (const o of orients) {
      requireFinite("pathOrientations", o, "rad");
      const errors = res.map((re) =>
        profileError({
          distanceDiameters: xUp,
          fitting: up,
          orientation: o - fitOrient,
          traverses: input.traverses,
          reynolds: re,
          chordOffset: input.chordOffset,
          fluidAngle: input.fluidAngle,
          model: input.model,
        })
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
        meetsDownstream,
      });
    }
  }
  const ordered = orderCandidates(ranking);
  const best = ordered[0];
  const traverses = input.traverses ?? 2;
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
  if (!best.meetsDownstream) {
    notes.push(
      `no candidate leaves ${reqDown} D before ${down.id}: the downstream requirement is broken`,
    );
  }
  if (res.length > 1) notes.push("each candidate is scored by its worst error over the flow range");
  return Object.freeze({
    commonPracticePosition,
    recommendedPosition: best.position,
    recommendedOrientation: best.orientation,
    recommendedPathPlane: pathPlane(best.orientation, traverses),
    ranking: Object.freeze(ordered),
    meetsCommonPractice: meets,
    requiredUpstream: reqUp,
    requiredDownstream: reqDown,
    notes: Object.freeze(notes),
  });
}

/**
 * Order candidates: downstream filter, verdict, then score with ties (relative tolerance
 * {@link SCORE_TIE_TOLERANCE}) broken by the plane nearer horizontal, then the earlier position.
 * Ties are taken as blocks against the best score left in the group, so the order does not
 * depend on the order of the input.
 */
function orderCandidates(cands: readonly RankedPosition[]): RankedPosition[] {
  const vOrder = { meets: 0, marginal: 1, short: 2 };
  const group = (c: RankedPosition) => (c.meetsDownstream ? 0 : 3) + vOrder[c.verdict];
  const tieBreak = (a: RankedPosition, b: RankedPosition) =>
    offHorizontal(a.orientation) - offHorizontal(b.orientation) ||
    a.position - b.position || a.score - b.score;
  const sorted = [...cands].sort((a, b) =>
    group(a) - group(b) || a.score - b.score || tieBreak(a, b)
  );
  const out: RankedPosition[] = [];
  let i = 0;
  while (i < sorted.length) {
    const head = sorted[i];
    const ties = (c: RankedPosition) =>
      group(c) === group(head) && c.score - head.score <= SCORE_TIE_TOLERANCE * Math.abs(c.score);
    let j = i + 1;
    while (j < sorted.length && ties(sorted[j])) j++;
    out.push(...sorted.slice(i, j).sort(tieBreak));
    i = j;
  }
  return out;
}

/** Angular distance of a path plane from the horizontal plane, rad, in [0, π/2]. */
function offHorizontal(o: number): number {
  const r = ((o % Math.PI) + Math.PI) % Math.PI;
  return Math.abs(r - Math.PI / 2);
}

/** {@link PathPlane} of a plane at `o` rad from the vertical for a path of `traverses`. */
function pathPlane(o: number, traverses: number): PathPlane {
  const psi = ((o % Math.PI) + Math.PI) % Math.PI;
  const hour = (a: number) => {
    const h = ((a * 6 / Math.PI) % 12 + 12) % 12;
    return h === 0 ? 12 : h;
  };
  const sameSide = traverses % 2 === 0;
  const first = hour(psi);
  return Object.freeze({
    angleFromVertical: psi,
    traverses,
    sameSide,
    clockHours: Object.freeze([first, sameSide ? first : hour(psi + Math.PI)]) as readonly [
      number,
      number,
    ],
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
