/**
 * The GUM law of propagation of uncertainty (JCGM 100:2008 §5): first-order Taylor expansion
 * of the measurement model about the input estimates, with optional correlations, effective
 * degrees of freedom by the Welch–Satterthwaite formula and a coverage factor from the
 * t-distribution (annex G).
 *
 * @module
 */
import { InputError, NoPhysicalAnswerError } from "../errors.ts";
import {
  checkInputs,
  type Correlation,
  correlationMatrix,
  type Distribution,
  type UncertainInput,
} from "./inputs.ts";
import { coverageFactor as kFor } from "./quantiles.ts";

/** A measurement model Y = f(X): reads the input vector (SI, in the order of the inputs). */
export type MeasurementModel = (x: Float64Array) => number;

/** Options of {@link gumPropagate}. */
export interface GumOptions {
  /** Pairwise correlation coefficients r(x_a, x_b) (JCGM 100:2008 §5.2). */
  readonly correlations?: readonly Correlation[];
  /**
   * Analytic sensitivity coefficients ∂f/∂x_i at x, in the order of the inputs; when omitted
   * they come from central finite differences.
   */
  readonly derivatives?: (x: Float64Array) => ArrayLike<number>;
  /** Coverage probability p (0 < p < 1) from which k is taken (annex G); else k = 2. */
  readonly coverage?: number;
  /** An explicit coverage factor k (> 0); takes precedence over `coverage`. */
  readonly coverageFactor?: number;
  /** Finite-difference step as a fraction of each input's standard uncertainty (default 1e-3). */
  readonly stepFraction?: number;
}

/** One line of an uncertainty budget. */
export interface BudgetLine {
  /** Input name. */
  readonly name: string;
  /** Input estimate x_i (SI). */
  readonly value: number;
  /** Standard uncertainty u(x_i) (SI). */
  readonly standardUncertainty: number;
  /** Distribution assigned. */
  readonly distribution: Distribution;
  /** Sensitivity coefficient c_i = ∂f/∂x_i (unit of Y per unit of X_i). */
  readonly sensitivity: number;
  /** Contribution |c_i·u(x_i)| to u(y), in the unit of Y. */
  readonly contribution: number;
  /** Fraction of u²(y) from this input alone, (c_i·u_i)²/u²(y) (excludes correlation terms). */
  readonly share: number;
  /** Degrees of freedom ν_i, when finite. */
  readonly degreesOfFreedom?: number;
  /** SI unit of the input, when given. */
  readonly unit?: string;
  /** Source id of the input, when given. */
  readonly source?: string;
  /** Basis of the input, when given. */
  readonly basis?: UncertainInput["basis"];
}

/** Result of {@link gumPropagate}. */
export interface GumResult {
  /** Estimate y = f(x) (unit of Y). */
  readonly value: number;
  /** Combined standard uncertainty u_c(y). */
  readonly standardUncertainty: number;
  /** u_c(y)/|y|; undefined when y = 0 (or so near 0 that the ratio overflows). */
  readonly relativeStandardUncertainty: number | undefined;
  /** Welch–Satterthwaite ν_eff, when some input has finite degrees of freedom. */
  readonly effectiveDegreesOfFreedom?: number;
  /** Coverage factor k. */
  readonly coverageFactor: number;
  /** Coverage probability k stands for, when k came from one. */
  readonly coverage?: number;
  /** Expanded uncertainty U = k·u_c(y). */
  readonly expanded: number;
  /** U/|y|; undefined when y = 0. */
  readonly relativeExpanded: number | undefined;
  /** Sum of the correlation terms 2·Σ c_i c_j u_i u_j r_ij in u²(y) (0 without correlations). */
  readonly correlationVariance: number;
  /** Budget lines, largest contribution first. */
  readonly budget: readonly BudgetLine[];
}

/**
 * Propagate standard uncertainties through a model by the GUM law of propagation.
 *
 * Method: JCGM 100:2008 eq. (10) u²(y) = Σ c_i² u²(x_i) and, with correlations, eq. (16)
 * u²(y) = Σ Σ c_i c_j u(x_i) u(x_j) r(x_i, x_j); c_i = ∂f/∂x_i at the estimates, from the
 * supplied derivatives or central differences c_i ≈ [f(x + h e_i) − f(x − h e_i)]/(2h) with
 * h = stepFraction·u(x_i). Welch–Satterthwaite (G.2b) ν_eff = u⁴(y)/Σ (c_i u_i)⁴/ν_i.
 * k: `coverageFactor` if given; else t_{(1+p)/2}(⌊ν_eff⌋) for `coverage` p (normal for
 * infinite ν_eff); else 2. Validity: first-order propagation is exact for linear models and
 * adequate where the model is close to linear over ±u(x_i); compare with {@link monteCarlo}
 * otherwise (JCGM 101:2008). Inputs in SI; the distribution matters only to Monte Carlo.
 * Sources: jcgm-100-2008.
 *
 * @param model measurement model f(x) → y (SI)
 * @param inputs the inputs with estimates and standard uncertainties (SI)
 * @param options correlations, derivatives, coverage
 * @returns the estimate, combined and expanded uncertainty, and the budget
 * @throws {InputError} on bad inputs or options
 * @throws {NoPhysicalAnswerError} when the model returns a non-finite value
 *
 * @example
 * ```ts
 * import { gumPropagate } from "./gum.ts";
 * // Area of a rectangle 2 m × 3 m, u = 0.01 m on each side.
 * const r = gumPropagate((x) => x[0] * x[1], [
 *   { name: "a", value: 2, standardUncertainty: 0.01, distribution: "normal" },
 *   { name: "b", value: 3, standardUncertainty: 0.01, distribution: "rectangular" },
 * ]);
 * if (Math.abs(r.standardUncertainty - Math.hypot(0.03, 0.02)) > 1e-12) throw new Error("u");
 * if (r.budget[0].name !== "a" || r.coverageFactor !== 2) throw new Error("budget");
 * ```
 */
export function gumPropagate(
  model: MeasurementModel,
  inputs: readonly UncertainInput[],
  options: GumOptions = {},
): GumResult {
  if (typeof model !== "function") {
    throw new InputError("model", typeof model, "a function of the input vector");
  }
  const x = checkInputs(inputs);
  const n = inputs.length;
  const corr = correlationMatrix(inputs, options.correlations);
  const stepFraction = options.stepFraction ?? 1e-3;
  if (!(stepFraction > 0 && stepFraction <= 1)) {
    throw new InputError("stepFraction", String(stepFraction), "a number in (0, 1]");
  }

  const y = model(x);
  if (typeof y !== "number" || !Number.isFinite(y)) {
    throw new NoPhysicalAnswerError(`the model gives ${String(y)} at the input estimates`);
  }

  const c = new Float64Array(n);
  if (options.derivatives) {
    const d = options.derivatives(x);
    if (!d || d.length !== n) {
      throw new InputError("derivatives", `${d?.length} values`, `${n} values, one per input`);
    }
    for (let i = 0; i < n; i++) {
      if (!Number.isFinite(d[i])) {
        throw new NoPhysicalAnswerError(`derivative for ${inputs[i].name} is ${d[i]}`);
      }
      c[i] = d[i];
    }
  } else {
    for (let i = 0; i < n; i++) {
      const xi = x[i];
      const u = inputs[i].standardUncertainty;
      let h = u > 0 ? stepFraction * u : Math.max(Math.abs(xi), 1) * 1e-6;
      // A step lost in the rounding of x (u of 1e-320, or u far below x's last digit) would
      // give 0/0 or a zero sensitivity: fall back to the step used for exact inputs.
      if (!(xi + h !== xi && xi - h !== xi)) h = Math.max(Math.abs(xi), 1) * 1e-6;
      x[i] = xi + h;
      const up = model(x);
      x[i] = xi - h;
      const down = model(x);
      x[i] = xi;
      if (!Number.isFinite(up) || !Number.isFinite(down)) {
        throw new NoPhysicalAnswerError(
          `the model is not finite within ±${h} of ${inputs[i].name} = ${xi}`,
        );
      }
      c[i] = (up - down) / (2 * h);
      if (!Number.isFinite(c[i])) {
        throw new NoPhysicalAnswerError(
          `the model's slope in ${inputs[i].name} overflows within ±${h} of ${xi}`,
        );
      }
    }
  }

  const cu = new Float64Array(n);
  let variance = 0;
  for (let i = 0; i < n; i++) {
    cu[i] = c[i] * inputs[i].standardUncertainty;
    variance += cu[i] * cu[i];
  }
  let correlationVariance = 0;
  if (corr) {
    for (let i = 0; i < n; i++) {
      for (let j = i + 1; j < n; j++) correlationVariance += 2 * cu[i] * cu[j] * corr[i * n + j];
    }
  }
  const total = Math.max(variance + correlationVariance, 0);
  const uc = Math.sqrt(total);
  if (!Number.isFinite(uc)) {
    throw new NoPhysicalAnswerError(
      `the combined standard uncertainty overflows (a sensitivity × uncertainty near 1e154)`,
    );
  }

  let nuEff: number | undefined;
  if (inputs.some((inp) => inp.degreesOfFreedom !== undefined && inp.degreesOfFreedom < Infinity)) {
    // ν_eff = u⁴(y) / Σ (c_i u_i)⁴/ν_i, evaluated as 1 / Σ (c_i u_i / u(y))⁴/ν_i so that the
    // fourth powers cannot overflow; an infinite ν_eff is left undefined (as infinite).
    let denom = 0;
    for (let i = 0; i < n; i++) {
      const nu = inputs[i].degreesOfFreedom;
      if (nu !== undefined && nu < Infinity && uc > 0) denom += (cu[i] / uc) ** 4 / nu;
    }
    if (denom > 0 && Number.isFinite(1 / denom)) nuEff = 1 / denom;
  }

  let k: number;
  let coverage: number | undefined;
  if (options.coverageFactor !== undefined) {
    k = options.coverageFactor;
    if (!(typeof k === "number" && k > 0 && Number.isFinite(k))) {
      throw new InputError("coverageFactor", String(k), "a finite number > 0");
    }
  } else if (options.coverage !== undefined) {
    coverage = options.coverage;
    if (!(coverage > 0 && coverage < 1)) {
      throw new InputError("coverage", String(coverage), "a probability in (0, 1), e.g. 0.95");
    }
    k = kFor(coverage, nuEff !== undefined && nuEff < 1 ? 1 : nuEff);
  } else {
    k = 2;
  }

  const budget: BudgetLine[] = inputs.map((inp, i) => {
    const line: BudgetLine = {
      name: inp.name,
      value: inp.value,
      standardUncertainty: inp.standardUncertainty,
      distribution: inp.distribution,
      sensitivity: c[i],
      contribution: Math.abs(cu[i]),
      share: total > 0 ? (cu[i] * cu[i]) / total : 0,
      ...(inp.degreesOfFreedom !== undefined && inp.degreesOfFreedom < Infinity
        ? { degreesOfFreedom: inp.degreesOfFreedom }
        : {}),
      ...(inp.unit !== undefined ? { unit: inp.unit } : {}),
      ...(inp.source !== undefined ? { source: inp.source } : {}),
      ...(inp.basis !== undefined ? { basis: inp.basis } : {}),
    };
    return line;
  });
  budget.sort((a, b) => b.contribution - a.contribution);

  // Undefined when y = 0, or when y is so near 0 (5e-324) that u/|y| overflows.
  const r0 = uc / Math.abs(y);
  const rel = y !== 0 && Number.isFinite(r0) && Number.isFinite(k * r0) ? r0 : undefined;
  return {
    value: y,
    standardUncertainty: uc,
    relativeStandardUncertainty: rel,
    ...(nuEff !== undefined ? { effectiveDegreesOfFreedom: nuEff } : {}),
    coverageFactor: k,
    ...(coverage !== undefined ? { coverage } : {}),
    expanded: k * uc,
    relativeExpanded: rel !== undefined ? k * rel : undefined,
    correlationVariance,
    budget,
  };
}
