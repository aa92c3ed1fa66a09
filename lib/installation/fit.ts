/**
 * The stated fit of the single-elbow terms of the distorted-profile model to the bounds
 * published for a single 90° bend (synowiec-2021-abstract, data/installation/synowiec-2021-bend
 * .yaml), so anyone can rerun it and compare with the constants in data/fittings.yaml.
 *
 * @module
 */
import { InputError, NoPhysicalAnswerError } from "../errors.ts";
import type { Fitting } from "../registry/schemas/fittings.ts";
import { resolveFitting } from "./fittings.ts";
import { profileErrorEstimate } from "./model.ts";
import { CHECK_ANGLES, CHECK_TRAVERSES } from "./published.ts";

/** Inputs of {@link fitSingleBend}; every field has the default used for data/fittings.yaml. */
export interface BendFitInput {
  /** Nearest distance, D; default 1 (our assumption: the abstract gives no distances). */
  readonly nearDiameters?: number;
  /** Worst correction factor wanted there; default 1.108 (up to 10.8 %, read as K − 1). */
  readonly kNear?: number;
  /** Distance of the 2 % bound, D; default 8. */
  readonly farDiameters?: number;
  /** Worst correction factor wanted there; default 1.020 (K ≤ 1.02 from 8 D on). */
  readonly kFar?: number;
  /** Fixed ratio of the (axisymmetric, second-harmonic) amplitudes; default (−0.39, 0.22). */
  readonly shape?: readonly [number, number];
  /** Reynolds numbers; default 7×10⁴ and 10⁵ (the two published). */
  readonly reynolds?: readonly number[];
  /** Bore crossings; default Z and V (1, 2), the abstract names no mounting. */
  readonly traverses?: readonly number[];
  /** Path angles from the bend plane, rad; default every 30° (the published step). */
  readonly angles?: readonly number[];
  /** Starting point (scale s, decay L in D); default (1, 4). */
  readonly start?: { readonly scale: number; readonly decay: number };
}

/** Result of {@link fitSingleBend}. */
export interface BendFit {
  /** Common scale s of the amplitude pair. */
  readonly scale: number;
  /** Common e-folding decay length L, D. */
  readonly decay: number;
  /** Axisymmetric amplitude s·shape[0]. */
  readonly axisymmetric: number;
  /** Second-harmonic amplitude s·shape[1]. */
  readonly secondHarmonic: number;
  /** Worst K reached at the near distance. */
  readonly kNear: number;
  /** Worst K reached at the far distance. */
  readonly kFar: number;
  /** Newton iterations taken. */
  readonly iterations: number;
}

/**
 * Worst (largest) correction factor K = 1/(1 + e) over path angles, mountings and Reynolds
 * numbers at one distance behind a fitting, by {@link profileErrorEstimate}.
 *
 * @param fitting fitting id or entry
 * @param distanceDiameters distance from the fitting, D (≥ 0)
 * @param grid Reynolds numbers, traverses and angles (rad); defaults as {@link fitSingleBend}
 * @returns the largest K
 *
 * @example
 * ```ts
 * import { worstCorrectionFactor } from "./fit.ts";
 * if (!(worstCorrectionFactor("elbow-90", 1) > worstCorrectionFactor("elbow-90", 8))) {
 *   throw new Error();
 * }
 * ```
 */
export function worstCorrectionFactor(
  fitting: string | Fitting,
  distanceDiameters: number,
  grid: Pick<BendFitInput, "reynolds" | "traverses" | "angles"> = {},
): number {
  let worst = -Infinity;
  for (const re of grid.reynolds ?? [7e4, 1e5]) {
    for (const traverses of grid.traverses ?? CHECK_TRAVERSES) {
      for (const orientation of grid.angles ?? CHECK_ANGLES) {
        const e = profileErrorEstimate({
          distanceDiameters,
          fitting,
          orientation,
          traverses,
          reynolds: re,
        }).error;
        worst = Math.max(worst, 1 / (1 + e));
      }
    }
  }
  return worst;
}

/** The registry's single elbow with its axisymmetric and second-harmonic terms replaced. */
function elbowWith(a: number, b: number, decay: number): Fitting {
  const base = resolveFitting("elbow-90");
  return {
    ...base,
    disturbance: {
      ...base.disturbance,
      axisymmetric: { ...base.disturbance.axisymmetric, amplitude: a, decay },
      secondHarmonic: { ...base.disturbance.secondHarmonic, amplitude: b, decay },
    },
  };
}

/**
 * Fit the single elbow's axisymmetric and second-harmonic terms to the published bounds.
 *
 * Unknowns: a common scale s of the amplitude pair (A, B) = s·shape and a common decay length
 * L. Equations: the worst K ({@link worstCorrectionFactor}) equals `kNear` at `nearDiameters`
 * and `kFar` at `farDiameters`. Method: Newton's method in (s, ln L) with a forward-difference
 * Jacobian (steps 1e-6), stopping when both residuals are below 1e-10 (at most 30 steps).
 * Skew, swirl and cross-flow keep their registry values (judgement), so the fit holds for the
 * model as a whole. Source: synowiec-2021-abstract (bounds); the nearest distance and the
 * reading of 10.8 % as K − 1 are our assumptions.
 *
 * @param input targets and grid (defaults: 1 D → 1.108, 8 D → 1.020, Re 7×10⁴ and 10⁵, Z and
 *   V paths, 12 angles)
 * @returns s, L, the amplitudes, the K reached, iterations
 *
 * @example
 * ```ts
 * import { fitSingleBend } from "./fit.ts";
 * const f = fitSingleBend({ angles: [0, Math.PI / 2], traverses: [2] });
 * if (Math.abs(f.kNear - 1.108) > 1e-8 || Math.abs(f.kFar - 1.02) > 1e-8) throw new Error();
 * ```
 */
export function fitSingleBend(input: BendFitInput = {}): BendFit {
  const xN = input.nearDiameters ?? 1, kN = input.kNear ?? 1.108;
  const xF = input.farDiameters ?? 8, kF = input.kFar ?? 1.02;
  const [ra, rb] = input.shape ?? [-0.39, 0.22];
  if (!(xF > xN && xN >= 0) || !(kN > kF && kF > 1)) {
    throw new InputError(
      "targets",
      `${xN} D → ${kN}, ${xF} D → ${kF}`,
      "a near distance with the larger K and a farther one with K above 1",
    );
  }
  const grid = { reynolds: input.reynolds, traverses: input.traverses, angles: input.angles };
  const residual = (s: number, lnL: number): [number, number] => {
    const f = elbowWith(s * ra, s * rb, Math.exp(lnL));
    return [worstCorrectionFactor(f, xN, grid) - kN, worstCorrectionFactor(f, xF, grid) - kF];
  };
  let s = input.start?.scale ?? 1;
  let lnL = Math.log(input.start?.decay ?? 4);
  let r = residual(s, lnL);
  let it = 0;
  const h = 1e-6;
  while (Math.max(Math.abs(r[0]), Math.abs(r[1])) > 1e-10) {
    if (++it > 30) {
      throw new NoPhysicalAnswerError(`the single-bend fit did not converge: residuals ${r}`);
    }
    const rs = residual(s + h, lnL), rl = residual(s, lnL + h);
    const j11 = (rs[0] - r[0]) / h, j12 = (rl[0] - r[0]) / h;
    const j21 = (rs[1] - r[1]) / h, j22 = (rl[1] - r[1]) / h;
    const det = j11 * j22 - j12 * j21;
    if (!(Math.abs(det) > 0)) throw new NoPhysicalAnswerError("the single-bend fit is singular");
    s -= (j22 * r[0] - j12 * r[1]) / det;
    lnL -= (j11 * r[1] - j21 * r[0]) / det;
    r = residual(s, lnL);
  }
  return Object.freeze({
    scale: s,
    decay: Math.exp(lnL),
    axisymmetric: s * ra,
    secondHarmonic: s * rb,
    kNear: r[0] + kN,
    kFar: r[1] + kF,
    iterations: it,
  });
}
