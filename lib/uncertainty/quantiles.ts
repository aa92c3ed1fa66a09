/**
 * Quantiles of the normal and Student t distributions, for coverage factors (JCGM 100:2008
 * annex G): k_p = t_p(ν_eff), the quantile that leaves (1 − p)/2 in each tail; for ν → ∞ it is
 * the normal quantile.
 *
 * Method: the distribution functions are written through regularised incomplete functions,
 * Φ(x) = ½[1 + sign(x)·P(½, x²/2)] with P the regularised lower incomplete gamma function, and
 * the Student t tail ½·I_{ν/(ν+t²)}(ν/2, ½) with I the regularised incomplete beta function;
 * P by its power series or the continued fraction of Q = 1 − P, I by its continued fraction
 * (modified Lentz evaluation); ln Γ by the Stirling series after shifting the argument above 10.
 * Quantiles by bracketing and bisection to full double precision. Not a hot path.
 *
 * @module
 */
import { InputError } from "../errors.ts";

const LN_SQRT_2PI = 0.5 * Math.log(2 * Math.PI);

/** ln Γ(x) for x > 0: Stirling series after shifting x above 10 (error < 1e-14). */
function lnGamma(x: number): number {
  let shift = 0;
  while (x < 10) {
    shift += Math.log(x);
    x += 1;
  }
  const r = 1 / x, r2 = r * r;
  const series = r * (1 / 12 - r2 * (1 / 360 - r2 * (1 / 1260 - r2 * (1 / 1680 - r2 / 1188))));
  return (x - 0.5) * Math.log(x) - x + LN_SQRT_2PI + series - shift;
}

/** Regularised lower incomplete gamma P(a, x), for a > 0, x ≥ 0. */
function gammaP(a: number, x: number): number {
  if (x <= 0) return 0;
  const lnPre = a * Math.log(x) - x - lnGamma(a);
  if (x < a + 1) {
    // Series: P = x^a e^-x / Γ(a+1) · Σ x^n / ((a+1)…(a+n)).
    let term = 1 / a, sum = term;
    for (let n = 1; n < 1000; n++) {
      term *= x / (a + n);
      sum += term;
      if (Math.abs(term) < Math.abs(sum) * 1e-17) break;
    }
    return sum * Math.exp(lnPre);
  }
  return 1 - gammaQcf(a, x, lnPre);
}

/** Q(a, x) by its continued fraction, modified Lentz evaluation. */
function gammaQcf(a: number, x: number, lnPre: number): number {
  const tiny = 1e-300;
  let b = x + 1 - a;
  let c = 1 / tiny;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i < 1000; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < tiny) d = tiny;
    c = b + an / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return Math.exp(lnPre) * h;
}

/** Regularised incomplete beta I_x(a, b), 0 ≤ x ≤ 1. */
function betaI(x: number, a: number, b: number): number {
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  const lnPre = lnGamma(a + b) - lnGamma(a) - lnGamma(b) + a * Math.log(x) +
    b * Math.log1p(-x);
  if (x < (a + 1) / (a + b + 2)) return Math.exp(lnPre) * betaCf(x, a, b) / a;
  return 1 - Math.exp(lnPre) * betaCf(1 - x, b, a) / b;
}

/** Continued fraction of the incomplete beta function, modified Lentz evaluation. */
function betaCf(x: number, a: number, b: number): number {
  const tiny = 1e-300;
  let c = 1;
  let d = 1 - (a + b) * x / (a + 1);
  if (Math.abs(d) < tiny) d = tiny;
  d = 1 / d;
  let h = d;
  for (let m = 1; m < 2000; m++) {
    const m2 = 2 * m;
    // Even step.
    let num = m * (b - m) * x / ((a + m2 - 1) * (a + m2));
    d = 1 + num * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + num / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    h *= d * c;
    // Odd step.
    num = -(a + m) * (a + b + m) * x / ((a + m2) * (a + m2 + 1));
    d = 1 + num * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + num / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return h;
}

/**
 * Standard normal distribution function Φ(x).
 *
 * Method: Φ(x) = ½[1 + sign(x)·P(½, x²/2)], P the regularised lower incomplete gamma function.
 * Validity: any finite x (dimensionless). Source: jcgm-100-2008 (annex G, normal quantiles).
 *
 * @param x standardised value (dimensionless)
 * @returns the probability P(Z ≤ x)
 * @throws {InputError} when x is not finite
 *
 * @example
 * ```ts
 * import { normalCdf } from "./quantiles.ts";
 * if (Math.abs(normalCdf(1.959963984540054) - 0.975) > 1e-12) throw new Error("Phi");
 * ```
 */
export function normalCdf(x: number): number {
  if (!Number.isFinite(x)) throw new InputError("x", String(x), "a finite number");
  if (x < -38) return 0;
  if (x > 38) return 1;
  // Far tails through the upper function, to keep relative precision.
  if (x < 0) return 0.5 * gammaQ(0.5, 0.5 * x * x);
  return 0.5 + 0.5 * gammaP(0.5, 0.5 * x * x);
}

function gammaQ(a: number, x: number): number {
  if (x < a + 1) return 1 - gammaP(a, x);
  return gammaQcf(a, x, a * Math.log(x) - x - lnGamma(a));
}

/**
 * Student t distribution function F_ν(t) = P(T ≤ t), ν degrees of freedom (any real ν > 0).
 *
 * Method: tail ½·I_{ν/(ν+t²)}(ν/2, ½), I the regularised incomplete beta function.
 * Validity: ν > 0, any finite t; ν = Infinity gives the normal distribution.
 * Source: jcgm-100-2008 (annex G, t-distribution).
 *
 * @param t value (dimensionless)
 * @param nu degrees of freedom (> 0, may be Infinity)
 * @returns the probability P(T ≤ t)
 * @throws {InputError} for a non-finite t or ν ≤ 0
 *
 * @example
 * ```ts
 * import { studentTCdf } from "./quantiles.ts";
 * // ν = 1 is the Cauchy distribution: F(1) = 3/4.
 * if (Math.abs(studentTCdf(1, 1) - 0.75) > 1e-12) throw new Error("Cauchy");
 * ```
 */
export function studentTCdf(t: number, nu: number): number {
  if (!Number.isFinite(t)) throw new InputError("t", String(t), "a finite number");
  if (!(nu > 0)) throw new InputError("degrees of freedom", String(nu), "a number > 0");
  if (nu === Infinity || nu > 1e7) return normalCdf(t);
  const tail = 0.5 * betaI(nu / (nu + t * t), nu / 2, 0.5);
  return t < 0 ? tail : 1 - tail;
}

function bisectQuantile(cdf: (x: number) => number, p: number): number {
  // The distributions here are symmetric about 0: solve the lower tail F(−x) = min(p, 1 − p)
  // for x ≥ 0, which keeps relative precision for small tail probabilities.
  if (p === 0.5) return 0;
  const upper = p > 0.5;
  const target = upper ? 1 - p : p;
  let lo = 0, hi = 1;
  while (cdf(-hi) > target) {
    lo = hi;
    hi *= 2;
    if (hi > 1e12) break;
  }
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    if (mid === lo || mid === hi) break;
    if (cdf(-mid) > target) lo = mid;
    else hi = mid;
  }
  const x = 0.5 * (lo + hi);
  return upper ? x : -x;
}

function checkProbability(p: number): void {
  if (!(p > 0 && p < 1)) throw new InputError("probability", String(p), "a number in (0, 1)");
}

/**
 * Standard normal quantile z with Φ(z) = p.
 *
 * Method: bisection on {@link normalCdf} to full double precision.
 * Validity: 1e-300 < p < 1 − 1e-16 in practice (p in the open interval (0, 1)).
 * Source: jcgm-100-2008 (annex G, table G.1 for k at given coverage).
 *
 * @param p probability in (0, 1)
 * @returns the quantile (dimensionless)
 * @throws {InputError} when p is not in (0, 1)
 *
 * @example
 * ```ts
 * import { normalQuantile } from "./quantiles.ts";
 * if (Math.abs(normalQuantile(0.975) - 1.959963984540054) > 1e-12) throw new Error("z");
 * ```
 */
export function normalQuantile(p: number): number {
  checkProbability(p);
  return bisectQuantile(normalCdf, p);
}

/**
 * Student t quantile t with F_ν(t) = p.
 *
 * Method: bisection on {@link studentTCdf}. Validity: p in (0, 1), ν > 0 (Infinity → normal).
 * Source: jcgm-100-2008 (annex G, table G.2).
 *
 * @param p probability in (0, 1)
 * @param nu degrees of freedom (> 0, may be Infinity)
 * @returns the quantile (dimensionless)
 * @throws {InputError} when p is not in (0, 1) or ν ≤ 0
 *
 * @example
 * ```ts
 * import { studentTQuantile } from "./quantiles.ts";
 * // ν = 1: t = tan(π(p − ½)).
 * if (Math.abs(studentTQuantile(0.975, 1) - Math.tan(0.475 * Math.PI)) > 1e-9) throw new Error();
 * ```
 */
export function studentTQuantile(p: number, nu: number): number {
  checkProbability(p);
  if (!(nu > 0)) throw new InputError("degrees of freedom", String(nu), "a number > 0");
  if (nu === Infinity || nu > 1e7) return normalQuantile(p);
  return bisectQuantile((t) => studentTCdf(t, nu), p);
}

/**
 * Coverage factor k_p for a coverage probability p and effective degrees of freedom ν_eff
 * (JCGM 100:2008 G.3–G.4): k = t_{(1+p)/2}(ν), with ν_eff truncated to the next lower integer
 * as G.4.1 advises; ν omitted or Infinity gives the normal value (1.960 for 95 %).
 *
 * Method: {@link studentTQuantile}. Validity: 0 < p < 1, ν ≥ 1. Source: jcgm-100-2008.
 *
 * @param p coverage probability in (0, 1), for example 0.95
 * @param nuEff effective degrees of freedom (≥ 1), or undefined / Infinity
 * @returns the coverage factor (dimensionless)
 * @throws {InputError} when p is not in (0, 1) or ν < 1
 *
 * @example
 * ```ts
 * import { coverageFactor } from "./quantiles.ts";
 * if (Math.abs(coverageFactor(0.95) - 1.96) > 0.001) throw new Error("normal");
 * if (Math.abs(coverageFactor(0.95, 10.7) - 2.228) > 0.001) throw new Error("t, nu = 10");
 * ```
 */
export function coverageFactor(p: number, nuEff?: number): number {
  checkProbability(p);
  if (nuEff === undefined || nuEff === Infinity) return normalQuantile((1 + p) / 2);
  if (!(nuEff >= 1)) {
    throw new InputError("effective degrees of freedom", String(nuEff), "a number ≥ 1");
  }
  return studentTQuantile((1 + p) / 2, Math.floor(nuEff));
}
