/**
 * Input quantities of a measurement model and their checking, shared by the GUM law of
 * propagation and the Monte Carlo method.
 *
 * @module
 */
import { InputError } from "../errors.ts";

/**
 * Probability distribution assigned to an input (JCGM 101:2008 §6.4):
 * - `normal`: Gaussian, standard deviation u;
 * - `rectangular`: uniform on value ± u·√3;
 * - `triangular`: symmetric triangular on value ± u·√6;
 * - `u-shaped`: arc-sine on value ± u·√2 (for example a quantity varying sinusoidally).
 */
export type Distribution = "normal" | "rectangular" | "triangular" | "u-shaped";

/** The distributions accepted, in a stable order. */
export const DISTRIBUTIONS: readonly Distribution[] = [
  "normal",
  "rectangular",
  "triangular",
  "u-shaped",
];

/** One input quantity X_i of a measurement model, in SI units. */
export interface UncertainInput {
  /** Name, unique within the model (shown in budgets). */
  readonly name: string;
  /** Best estimate x_i (SI). */
  readonly value: number;
  /** Standard uncertainty u(x_i) (SI, ≥ 0). */
  readonly standardUncertainty: number;
  /** Distribution assigned to X_i. */
  readonly distribution: Distribution;
  /**
   * Asymmetric bounds (Monte Carlo only): the centre of the assigned distribution minus the
   * best estimate, SI. For an input known only to lie in [x − b₋, x + b₊] with b₋ ≠ b₊, GUM
   * propagation keeps the estimate x and u² = (b₊ + b₋)²/12 (JCGM 100:2008 §4.3.8); the
   * Monte Carlo draws take the rectangular distribution R(x − b₋, x + b₊), whose expectation
   * is x + (b₊ − b₋)/2 (JCGM 101:2008 §6.4.2.1), so `centreOffset` = (b₊ − b₋)/2. Omitted
   * means 0 (symmetric).
   */
  readonly centreOffset?: number;
  /** Degrees of freedom ν_i (Type A evaluations); omitted means infinite. */
  readonly degreesOfFreedom?: number;
  /** SI unit of value and uncertainty, for reports. */
  readonly unit?: string;
  /** Source id in data/sources.yaml, for reports. */
  readonly source?: string;
  /** How the value got here, for reports. */
  readonly basis?:
    | "transcribed"
    | "computed"
    | "common-practice"
    | "recalled"
    | "input"
    | "measured";
}

/** A correlation coefficient r(X_a, X_b) between two inputs named a and b. */
export interface Correlation {
  /** Name of the first input. */
  readonly a: string;
  /** Name of the second input. */
  readonly b: string;
  /** Correlation coefficient, −1 … 1. */
  readonly r: number;
}

/** Half-width of the distribution per unit standard uncertainty. */
export const HALF_WIDTH_PER_U: Record<Distribution, number> = {
  normal: NaN,
  rectangular: Math.sqrt(3),
  triangular: Math.sqrt(6),
  "u-shaped": Math.SQRT2,
};

/**
 * Check the inputs and return their estimates as a Float64Array.
 *
 * @param inputs the inputs
 * @returns the vector of estimates
 * @throws {InputError} on an empty list, a duplicate or empty name, a non-finite value, a
 *   negative or non-finite uncertainty, an unknown distribution or degrees of freedom ≤ 0
 */
export function checkInputs(inputs: readonly UncertainInput[]): Float64Array {
  if (!Array.isArray(inputs) || inputs.length === 0) {
    throw new InputError("inputs", describe(inputs), "a non-empty list of input quantities");
  }
  const seen = new Set<string>();
  const x = new Float64Array(inputs.length);
  inputs.forEach((inp, i) => {
    const where = `inputs[${i}]`;
    if (typeof inp?.name !== "string" || inp.name.trim() === "") {
      throw new InputError(`${where}.name`, describe(inp?.name), "a non-empty name");
    }
    if (seen.has(inp.name)) {
      throw new InputError(`${where}.name`, JSON.stringify(inp.name), "a name used only once");
    }
    seen.add(inp.name);
    if (typeof inp.value !== "number" || !Number.isFinite(inp.value)) {
      throw new InputError(`${inp.name}.value`, String(inp.value), "a finite number (SI)");
    }
    const u = inp.standardUncertainty;
    if (typeof u !== "number" || !Number.isFinite(u) || u < 0) {
      throw new InputError(
        `${inp.name}.standardUncertainty`,
        String(u),
        "a finite number ≥ 0 (SI)",
      );
    }
    if (!DISTRIBUTIONS.includes(inp.distribution)) {
      throw new InputError(
        `${inp.name}.distribution`,
        JSON.stringify(inp.distribution),
        `one of: ${DISTRIBUTIONS.join(", ")}`,
      );
    }
    const off = inp.centreOffset;
    if (off !== undefined && !(typeof off === "number" && Number.isFinite(off))) {
      throw new InputError(`${inp.name}.centreOffset`, String(off), "a finite number (SI)");
    }
    const nu = inp.degreesOfFreedom;
    if (nu !== undefined && !(typeof nu === "number" && nu > 0)) {
      throw new InputError(`${inp.name}.degreesOfFreedom`, String(nu), "a number > 0 or Infinity");
    }
    x[i] = inp.value;
  });
  return x;
}

/**
 * Build the full correlation matrix (row-major, n×n, unit diagonal) from pairwise entries and
 * check that it is a valid correlation matrix (positive semi-definite).
 *
 * @param inputs the inputs (for names)
 * @param correlations pairwise coefficients
 * @returns the matrix, or undefined when no correlation is given
 * @throws {InputError} on an unknown name, a self-correlation, a repeated pair, |r| > 1 or a
 *   matrix that is not positive semi-definite
 */
export function correlationMatrix(
  inputs: readonly UncertainInput[],
  correlations: readonly Correlation[] | undefined,
): Float64Array | undefined {
  if (correlations === undefined) return undefined;
  if (!Array.isArray(correlations)) {
    throw new InputError("correlations", describe(correlations), "a list of { a, b, r }");
  }
  if (correlations.length === 0) return undefined;
  const n = inputs.length;
  const index = new Map(inputs.map((inp, i) => [inp.name, i]));
  const m = new Float64Array(n * n);
  for (let i = 0; i < n; i++) m[i * n + i] = 1;
  const pairs = new Set<string>();
  correlations.forEach((c, k) => {
    const where = `correlations[${k}]`;
    const ia = index.get(c?.a), ib = index.get(c?.b);
    if (ia === undefined) throw new InputError(`${where}.a`, describe(c?.a), "an input's name");
    if (ib === undefined) throw new InputError(`${where}.b`, describe(c?.b), "an input's name");
    if (ia === ib) throw new InputError(where, `${c.a} with itself`, "two different inputs");
    if (typeof c.r !== "number" || !(c.r >= -1 && c.r <= 1)) {
      throw new InputError(`${where}.r`, describe(c.r), "a number from −1 to 1");
    }
    const key = ia < ib ? `${ia},${ib}` : `${ib},${ia}`;
    if (pairs.has(key)) throw new InputError(where, `${c.a}–${c.b} again`, "each pair once");
    pairs.add(key);
    m[ia * n + ib] = c.r;
    m[ib * n + ia] = c.r;
  });
  if (!cholesky(m, n, 1e-12)) {
    throw new InputError(
      "correlations",
      "a set of coefficients that no joint distribution can have",
      "a positive semi-definite correlation matrix",
    );
  }
  return m;
}

/**
 * Cholesky factor L (lower, row-major) of a symmetric positive semi-definite matrix, with
 * tiny negative pivots (≥ −tol) set to zero. Returns undefined when the matrix is not PSD.
 *
 * @param a symmetric matrix, row-major n×n
 * @param n order
 * @param tol tolerance on negative pivots
 * @returns L, or undefined
 */
export function cholesky(a: Float64Array, n: number, tol: number): Float64Array | undefined {
  const l = new Float64Array(n * n);
  for (let j = 0; j < n; j++) {
    let d = a[j * n + j];
    for (let k = 0; k < j; k++) d -= l[j * n + k] * l[j * n + k];
    if (d < -tol) return undefined;
    const ljj = d > tol ? Math.sqrt(d) : 0;
    l[j * n + j] = ljj;
    for (let i = j + 1; i < n; i++) {
      let s = a[i * n + j];
      for (let k = 0; k < j; k++) s -= l[i * n + k] * l[j * n + k];
      if (ljj === 0) {
        if (Math.abs(s) > 1e-9) return undefined;
        l[i * n + j] = 0;
      } else {
        l[i * n + j] = s / ljj;
      }
    }
  }
  return l;
}

/** Short description of an unexpected value, for messages. */
export function describe(v: unknown): string {
  if (v === null) return "null";
  if (v === undefined) return "nothing";
  if (Array.isArray(v)) return "a list";
  if (typeof v === "object") return "an object";
  return `${typeof v} ${String(v)}`;
}
