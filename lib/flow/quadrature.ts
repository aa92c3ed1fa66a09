/**
 * Quadrature: Gauss–Legendre nodes, the half-chord rule used to average a velocity profile
 * along an acoustic chord, and multi-chord positions and weights.
 *
 * @module
 */
import { InputError } from "../errors.ts";

/**
 * Gauss–Legendre nodes and weights on [−1, 1] (Newton's method on the Legendre polynomial
 * from Chebyshev-like starting points, to machine precision). Method: Gauss–Legendre
 * quadrature (any numerical-analysis text); exact for polynomials of degree ≤ 2n − 1.
 *
 * @param n number of nodes, 1 ≤ n ≤ 512
 * @returns ascending nodes and their weights (weights sum to 2)
 *
 * @example
 * ```ts
 * import { gaussLegendre } from "./quadrature.ts";
 * const { nodes, weights } = gaussLegendre(2);
 * if (Math.abs(nodes[1] - 1 / Math.sqrt(3)) > 1e-15 || Math.abs(weights[0] - 1) > 1e-15) {
 *   throw new Error("2-point rule");
 * }
 * ```
 */
export function gaussLegendre(n: number): { nodes: Float64Array; weights: Float64Array } {
  if (!Number.isInteger(n) || n < 1 || n > 512) {
    throw new InputError("n", String(n), "an integer from 1 to 512");
  }
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  const m = Math.floor((n + 1) / 2);
  for (let i = 0; i < m; i++) {
    let x = Math.cos(Math.PI * (i + 0.75) / (n + 0.5));
    let dp = 0;
    for (let it = 0; it < 100; it++) {
      let p0 = 1;
      let p1 = x;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      if (n === 1) p0 = 1;
      dp = n * (x * p1 - p0) / (x * x - 1);
      const dx = p1 / dp;
      x -= dx;
      if (Math.abs(dx) < 1e-16) break;
    }
    // Recompute the derivative at the converged node for the weight.
    let p0 = 1;
    let p1 = x;
    for (let k = 2; k <= n; k++) {
      const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
      p0 = p1;
      p1 = p2;
    }
    dp = n === 1 ? 1 : n * (x * p1 - p0) / (x * x - 1);
    const w = 2 / ((1 - x * x) * dp * dp);
    nodes[i] = -x;
    nodes[n - 1 - i] = x;
    weights[i] = w;
    weights[n - 1 - i] = w;
  }
  if (n % 2 === 1) nodes[m - 1] = 0;
  return { nodes, weights };
}

/**
 * The half-chord rule: nodes s ∈ (0, 1) and weights (summing to 1) for the mean of a function
 * over [0, 1] whose only singular behaviour is at s = 1 (the pipe wall), such as (1 − r)^(1/n)
 * or ln(1 − r). Gauss–Legendre on t ∈ [−1, 1] after the substitution s = (1 + φ(t))/2 with
 * φ'(t) = (35/16)(1 − t²)³, which clusters nodes at both ends and smooths the wall
 * singularity. `oneMinusS` is computed without cancellation near the wall.
 */
export interface HalfChordRule {
  /** Nodes s in (0, 1). */
  readonly s: Float64Array;
  /** 1 − s, accurate near s = 1. */
  readonly oneMinusS: Float64Array;
  /** 1 − s², accurate near s = 1. */
  readonly oneMinusS2: Float64Array;
  /** Weights, summing to 1. */
  readonly w: Float64Array;
}

/** 1 − φ(t) for t ≥ 0, with e = 1 − t: (35/16)(2e⁴ − 12e⁵/5 + e⁶ − e⁷/7). */
function oneMinusPhi(t: number): number {
  const e = 1 - t;
  const e4 = e * e * e * e;
  return (35 / 16) * e4 * (2 - 2.4 * e + e * e - e * e * e / 7);
}

/**
 * Build a half-chord rule (see {@link HalfChordRule}).
 *
 * @param n Gauss–Legendre nodes, 1 ≤ n ≤ 512
 * @returns the rule
 *
 * @example
 * ```ts
 * import { halfChordRule } from "./quadrature.ts";
 * const r = halfChordRule(32);
 * // mean of (1 - s)^(1/7) over [0, 1] is 7/8
 * let m = 0;
 * for (let i = 0; i < r.s.length; i++) m += r.w[i] * Math.pow(r.oneMinusS[i], 1 / 7);
 * if (Math.abs(m - 7 / 8) > 1e-9) throw new Error("rule");
 * ```
 */
export function halfChordRule(n: number): HalfChordRule {
  const gl = gaussLegendre(n);
  const s = new Float64Array(n);
  const oms = new Float64Array(n);
  const oms2 = new Float64Array(n);
  const w = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = gl.nodes[i];
    const omp = t >= 0 ? oneMinusPhi(t) : 2 - oneMinusPhi(-t); // 1 − φ(t), φ odd
    oms[i] = omp / 2;
    s[i] = 1 - oms[i];
    oms2[i] = oms[i] * (1 + s[i]);
    const u = 1 - t * t;
    w[i] = gl.weights[i] * (35 / 16) * u * u * u / 2;
  }
  return Object.freeze({ s, oneMinusS: oms, oneMinusS2: oms2, w });
}

/** Multi-chord integration rules accepted by {@link chordWeights}. */
export type ChordRule = "gauss-jacobi" | "gauss-legendre";

/** Chord positions and weights of a multi-path arrangement. */
export interface ChordWeights {
  /** The rule. */
  readonly rule: ChordRule;
  /** Signed chord offsets h/R, ascending, in (−1, 1). */
  readonly positions: readonly number[];
  /**
   * Weights w_i: area-mean velocity ≈ Σ w_i · v̄_i, where v̄_i is the mean axial velocity
   * along chord i. Sum to 1 for Gauss–Jacobi; for Gauss–Legendre they sum to slightly
   * less than 1 (the rule is exact for polynomials times √(1 − x²) only approximately).
   */
  readonly weights: readonly number[];
}

const GL_SMALL = new Map<number, ReturnType<typeof gaussLegendre>>();
for (let n = 2; n <= 5; n++) GL_SMALL.set(n, gaussLegendre(n));

/**
 * Chord positions and weights for 2–5 parallel acoustic paths.
 *
 * The area mean is V = (2/π) ∫₋₁¹ √(1 − x²) v̄(x) dx with x = h/R.
 * - "gauss-jacobi": Gauss quadrature for the weight √(1 − x²) (Gauss–Chebyshev of the second
 *   kind, the Jacobi case α = β = ½): x_i = cos(iπ/(n+1)), w_i = 2 sin²(iπ/(n+1))/(n+1).
 *   Exact when v̄(x) is a polynomial of degree ≤ 2n − 1 (the laminar v̄ is quadratic).
 * - "gauss-legendre": Gauss–Legendre nodes x_i with w_i = (2/π) W_i √(1 − x_i²).
 *
 * Methods: Gauss quadrature (numerical-analysis texts; no data source needed).
 *
 * @param n number of paths, 2–5
 * @param rule "gauss-jacobi" (default) or "gauss-legendre"
 * @returns positions (h/R) and weights
 *
 * @example
 * ```ts
 * import { chordWeights } from "./quadrature.ts";
 * const c = chordWeights(2, "gauss-jacobi");
 * if (Math.abs(c.positions[1] - 0.5) > 1e-15 || Math.abs(c.weights[0] - 0.5) > 1e-15) {
 *   throw new Error("two paths at ±R/2, weight 1/2 each");
 * }
 * ```
 */
export function chordWeights(n: number, rule: ChordRule = "gauss-jacobi"): ChordWeights {
  if (!Number.isInteger(n) || n < 2 || n > 5) {
    throw new InputError("paths", String(n), "an integer number of paths from 2 to 5");
  }
  const positions: number[] = [];
  const weights: number[] = [];
  if (rule === "gauss-jacobi") {
    for (let i = n; i >= 1; i--) {
      const th = i * Math.PI / (n + 1);
      const x = Math.cos(th);
      positions.push(Math.abs(x) < 1e-15 ? 0 : x);
      weights.push(2 * Math.sin(th) ** 2 / (n + 1));
    }
  } else if (rule === "gauss-legendre") {
    const gl = GL_SMALL.get(n)!;
    for (let i = 0; i < n; i++) {
      const x = gl.nodes[i];
      positions.push(x);
      weights.push((2 / Math.PI) * gl.weights[i] * Math.sqrt(1 - x * x));
    }
  } else {
    throw new InputError("rule", String(rule), "gauss-jacobi or gauss-legendre");
  }
  return Object.freeze({
    rule,
    positions: Object.freeze(positions),
    weights: Object.freeze(weights),
  });
}
