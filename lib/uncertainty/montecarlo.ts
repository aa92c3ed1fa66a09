/**
 * Propagation of distributions by the Monte Carlo method (JCGM 101:2008 §7): draw the inputs
 * from their distributions, evaluate the model for each draw, and summarise the output draws
 * by their mean, standard deviation and a coverage interval. Independent inputs are drawn by
 * a loop written once per pattern of input kinds (./draw_loop.ts); correlated inputs and long
 * input lists by the generic loop here. Both give the same bits.
 *
 * @module
 */
import { InputError, NoPhysicalAnswerError } from "../errors.ts";
import {
  checkInputs,
  cholesky,
  type Correlation,
  correlationMatrix,
  HALF_WIDTH_PER_U,
  type UncertainInput,
} from "./inputs.ts";
import type { MeasurementModel } from "./gum.ts";
import { fillUniformOf, type RandomState, randomState } from "./rng.ts";
import {
  drawLoopFor,
  KIND_FIXED,
  KIND_NORMAL,
  KIND_RECT,
  KIND_TRI,
  KIND_U,
  MAX_SPECIALISED_INPUTS,
} from "./draw_loop.ts";

/** Options of {@link monteCarlo}. */
export interface MonteCarloOptions {
  /** Number of draws M (default 100 000; 100 … 50 000 000). */
  readonly draws?: number;
  /** Seed of the xoshiro128** stream (unsigned 32-bit integer, default 1). */
  readonly seed?: number;
  /** Coverage probability p (default 0.95). */
  readonly coverage?: number;
  /** Return the shortest coverage interval as `interval` (JCGM 101:2008 §7.7.2). */
  readonly shortest?: boolean;
  /** Correlations; only between normal inputs (multivariate Gaussian, JCGM 101:2008 §6.4.8). */
  readonly correlations?: readonly Correlation[];
  /** Keep the sorted output draws in the result (for histograms). */
  readonly keepValues?: boolean;
}

/** Result of {@link monteCarlo}. */
export interface MonteCarloResult {
  /** Mean of the output draws, the estimate of Y (JCGM 101:2008 eq. 16). */
  readonly mean: number;
  /** Standard deviation of the output draws, u(y) (eq. 17). */
  readonly standardUncertainty: number;
  /** The coverage interval: probabilistically symmetric, or shortest when asked. */
  readonly interval: readonly [number, number];
  /** Which interval `interval` is. */
  readonly intervalKind: "symmetric" | "shortest";
  /** The probabilistically symmetric interval (§7.7.1), always given. */
  readonly symmetricInterval: readonly [number, number];
  /** Coverage probability of the intervals. */
  readonly coverage: number;
  /** Number of draws M. */
  readonly draws: number;
  /** The seed used. */
  readonly seed: number;
  /** Sorted output draws, when `keepValues` was set. */
  readonly values?: Float64Array;
}

/** Uniform deviates drawn ahead per block in the draw loop. */
const UNIFORM_BLOCK = 1024;

const KIND_CORR = 5;

/**
 * Propagate distributions through a model by Monte Carlo.
 *
 * Method: JCGM 101:2008 §7. Draws: normal by the Marsaglia polar method; rectangular
 * x + a(2U − 1); triangular x + a(U₁ + U₂ − 1); U-shaped (arc-sine) x + a·cos(πU), with the
 * half-widths a = √3·u, √6·u, √2·u, each centred on x + `centreOffset` (asymmetric bounds,
 * JCGM 101 §6.4.2.1; 0 when omitted); correlated normal inputs as x + u·(L z), L the Cholesky
 * factor of their correlation matrix. U from a seeded xoshiro128** stream, so a run is
 * reproducible bit for bit. Output: mean, standard deviation (divisor M − 1), and from the
 * sorted draws the probabilistically symmetric interval [y_(r), y_(r+q)], q = pM (rounded to
 * the nearest integer when pM is not one), r = (M − q)/2 (rounded up by ½ when odd), or the
 * shortest such interval. One Float64Array of M outputs, one input vector and one block of 1024
 * uniform deviates (taken in stream order) are allocated per run; nothing per draw. Validity: 100 ≤ M ≤ 5·10⁷; JCGM 101 §7.2 suggests M ≥ 10⁴/(1 − p)
 * for a reliable interval (2·10⁵ for 95 %). Sources: jcgm-101-2008.
 *
 * @param model measurement model f(x) → y (SI), called once per draw with a reused vector
 * @param inputs the inputs with estimates, standard uncertainties and distributions (SI)
 * @param options draws, seed, coverage, shortest, correlations
 * @returns mean, standard uncertainty and coverage interval of Y
 * @throws {InputError} on bad inputs or options
 * @throws {NoPhysicalAnswerError} when the model returns a non-finite value for some draw
 *
 * @example
 * ```ts
 * import { monteCarlo } from "./montecarlo.ts";
 * const inputs = [1, 2].map((i) => ({
 *   name: `x${i}`, value: 0, standardUncertainty: 1, distribution: "normal" as const,
 * }));
 * const r = monteCarlo((x) => x[0] + x[1], inputs, { draws: 20000, seed: 7 });
 * if (Math.abs(r.standardUncertainty - Math.SQRT2) > 0.05) throw new Error("u");
 * const again = monteCarlo((x) => x[0] + x[1], inputs, { draws: 20000, seed: 7 });
 * if (again.interval[0] !== r.interval[0]) throw new Error("reproducible");
 * ```
 */
export function monteCarlo(
  model: MeasurementModel,
  inputs: readonly UncertainInput[],
  options: MonteCarloOptions = {},
): MonteCarloResult {
  if (typeof model !== "function") {
    throw new InputError("model", typeof model, "a function of the input vector");
  }
  const est = checkInputs(inputs);
  const n = inputs.length;
  // Asymmetric bounds: draws are centred on the middle of [x − b₋, x + b₊] (JCGM 101 §6.4.2.1).
  for (let i = 0; i < n; i++) est[i] += inputs[i].centreOffset ?? 0;
  const draws = options.draws ?? 100_000;
  if (!Number.isInteger(draws) || draws < 100 || draws > 50_000_000) {
    throw new InputError("draws", String(draws), "an integer from 100 to 50000000");
  }
  const coverage = options.coverage ?? 0.95;
  if (!(coverage > 0 && coverage < 1)) {
    throw new InputError("coverage", String(coverage), "a probability in (0, 1), e.g. 0.95");
  }
  const seed = options.seed ?? 1;
  const rng = randomState(seed);

  // Per-input sampler kind and scale, precomputed.
  const kind = new Uint8Array(n);
  const scale = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const inp = inputs[i];
    const u = inp.standardUncertainty;
    if (u === 0) kind[i] = KIND_FIXED;
    else if (inp.distribution === "normal") kind[i] = KIND_NORMAL;
    else if (inp.distribution === "rectangular") kind[i] = KIND_RECT;
    else if (inp.distribution === "triangular") kind[i] = KIND_TRI;
    else kind[i] = KIND_U;
    scale[i] = inp.distribution === "normal" ? u : u * HALF_WIDTH_PER_U[inp.distribution];
  }

  // Correlated normal inputs: Cholesky factor of their correlation sub-matrix.
  const corr = correlationMatrix(inputs, options.correlations);
  let group = new Int32Array(0);
  let lower: Float64Array = new Float64Array(0);
  let z = new Float64Array(0);
  if (corr) {
    const members: number[] = [];
    for (let i = 0; i < n; i++) {
      let involved = false;
      for (let j = 0; j < n; j++) if (j !== i && corr[i * n + j] !== 0) involved = true;
      if (!involved) continue;
      if (inputs[i].distribution !== "normal") {
        throw new InputError(
          `${inputs[i].name}.distribution`,
          JSON.stringify(inputs[i].distribution),
          "normal for a correlated input (Monte Carlo draws correlated inputs jointly Gaussian)",
        );
      }
      members.push(i);
    }
    const g = members.length;
    const sub = new Float64Array(g * g);
    for (let a = 0; a < g; a++) {
      for (let b = 0; b < g; b++) sub[a * g + b] = corr[members[a] * n + members[b]];
    }
    lower = cholesky(sub, g, 1e-12) as Float64Array;
    group = Int32Array.from(members);
    z = new Float64Array(g);
    for (const i of members) kind[i] = KIND_CORR;
  }

  const out = new Float64Array(draws);
  const sampler: Sampler = { n, kind, est, scale, group, lower, z, x: new Float64Array(n) };
  // The sum is taken in draw order, as a separate pass over `out` would.
  // Independent inputs take the loop written for their pattern of kinds (same bits).
  const sum = group.length === 0 && n <= MAX_SPECIALISED_INPUTS
    ? drawLoopFor(kind)(model, est, scale, rng.words, rng.spare, out, sampler.x, (y, m, x) => {
      throw notFinite(inputs, y, m, x);
    })
    : drawAll(model, inputs, sampler, rng, out);

  // Mean and standard deviation, two passes for accuracy.
  const mean = sum / draws;
  const u = Math.sqrt(sumOfSquares(out, mean) / (draws - 1));

  const pm = coverage * draws;
  const q = Number.isInteger(pm) ? pm : Math.floor(pm + 0.5);
  if (q < 1 || q >= draws) {
    throw new InputError("draws", String(draws), `enough draws for a ${coverage} interval`);
  }
  // 1-based r per JCGM 101 §7.7.1; array index r − 1.
  const r = (draws - q) % 2 === 0 ? (draws - q) / 2 : (draws - q + 1) / 2;
  const fullSort = options.shortest === true || options.keepValues === true;
  if (fullSort) out.sort();
  // Only two order statistics are needed: found without sorting every draw.
  const symmetric: [number, number] = fullSort
    ? [out[r - 1], out[r - 1 + q]]
    : orderStatistics(out, r - 1, r - 1 + q);
  let interval: [number, number] = symmetric;
  if (options.shortest) {
    let best = 0, width = Infinity;
    for (let s = 0; s + q < draws; s++) {
      const w = out[s + q] - out[s];
      if (w < width) {
        width = w;
        best = s;
      }
    }
    interval = [out[best], out[best + q]];
  }
  return {
    mean,
    standardUncertainty: u,
    interval,
    intervalKind: options.shortest ? "shortest" : "symmetric",
    symmetricInterval: symmetric,
    coverage,
    draws,
    seed: seed >>> 0,
    ...(options.keepValues ? { values: out } : {}),
  };
}

/** What one draw needs, precomputed per run. */
interface Sampler {
  readonly n: number;
  readonly kind: Uint8Array;
  readonly est: Float64Array;
  readonly scale: Float64Array;
  /** Indices of the correlated normal inputs. */
  readonly group: Int32Array;
  /** Cholesky factor of their correlation matrix, row-major. */
  readonly lower: Float64Array;
  /** Scratch: independent normal deviates of the correlated group. */
  readonly z: Float64Array;
  /** Scratch: the input vector handed to the model. */
  readonly x: Float64Array;
}

/**
 * Draw every input M times in draw order and evaluate the model (JCGM 101:2008 §6.4 for the
 * distributions; normal deviates by Marsaglia's polar method, as `normalOf`). Uniform deviates
 * come from a block filled ahead in the stream's own order, so the numbers are those of one
 * `uniformOf` call per deviate. Everything lives in this one function's locals (no closures):
 * the optimising compiler then compiles the whole loop early in the first call, which a cold
 * one-site plan depends on.
 *
 * @returns the sum of the outputs, in draw order
 */
function drawAll(
  model: MeasurementModel,
  inputs: readonly UncertainInput[],
  sp: Sampler,
  rng: RandomState,
  out: Float64Array,
): number {
  const { n, kind, est, scale, group, lower, z, x } = sp;
  const { words, spare } = rng;
  const block = new Float64Array(UNIFORM_BLOCK);
  let next = UNIFORM_BLOCK;
  let hasSpare = spare[1] === 1;
  let spareValue = spare[0];
  const g = group.length;
  const pi = Math.PI;
  const draws = out.length;
  let sum = 0;
  for (let m = 0; m < draws; m++) {
    for (let i = 0; i < n + g; i++) {
      // i < n: input i by its own kind; n ≤ i < n + g: the correlated group's deviate i − n
      const k = i < n ? kind[i] : KIND_NORMAL;
      if (k === KIND_FIXED) {
        x[i] = est[i];
        continue;
      }
      if (k === KIND_CORR) continue;
      let e: number; // the deviate: standard normal, or in [−1, 1] for the bounded kinds
      if (k === KIND_NORMAL) {
        if (hasSpare) {
          hasSpare = false;
          e = spareValue;
        } else {
          let u: number, v: number, q: number;
          do {
            if (next === UNIFORM_BLOCK) {
              fillUniformOf(words, block);
              next = 0;
            }
            u = 2 * block[next++] - 1;
            if (next === UNIFORM_BLOCK) {
              fillUniformOf(words, block);
              next = 0;
            }
            v = 2 * block[next++] - 1;
            q = u * u + v * v;
          } while (q >= 1 || q === 0);
          const f = Math.sqrt(-2 * Math.log(q) / q);
          spareValue = v * f;
          hasSpare = true;
          e = u * f;
        }
      } else {
        if (next === UNIFORM_BLOCK) {
          fillUniformOf(words, block);
          next = 0;
        }
        const u1 = block[next++];
        if (k === KIND_RECT) e = 2 * u1 - 1;
        else if (k === KIND_U) e = Math.cos(pi * u1);
        else {
          if (next === UNIFORM_BLOCK) {
            fillUniformOf(words, block);
            next = 0;
          }
          e = u1 + block[next++] - 1; // triangular
        }
      }
      if (i < n) x[i] = est[i] + scale[i] * e;
      else z[i - n] = e;
    }
    for (let a = 0; a < g; a++) {
      let s = 0;
      for (let b = 0; b <= a; b++) s += lower[a * g + b] * z[b];
      const i = group[a];
      x[i] = est[i] + scale[i] * s;
    }
    const y = model(x);
    if (!Number.isFinite(y)) throw notFinite(inputs, y, m, x);
    out[m] = y;
    sum += y;
  }
  spare[0] = spareValue;
  spare[1] = hasSpare ? 1 : 0;
  return sum;
}

/** The error for a model value that is not finite at draw m (0-based) with inputs x. */
function notFinite(
  inputs: readonly UncertainInput[],
  y: number,
  m: number,
  x: Float64Array,
): NoPhysicalAnswerError {
  return new NoPhysicalAnswerError(
    `the model gives ${y} for draw ${m + 1} (inputs ${
      Array.from(x, (v, i) => `${inputs[i].name} = ${v}`).join(", ")
    })`,
  );
}

/** Σ (y − mean)², in index order. */
function sumOfSquares(out: Float64Array, mean: number): number {
  let ss = 0;
  for (let m = 0; m < out.length; m++) {
    const d = out[m] - mean;
    ss += d * d;
  }
  return ss;
}

/** Draws in the sample that brackets an order statistic ({@link orderStatistics}). */
const BRACKET_SAMPLE = 1024;

/**
 * The values a full ascending sort of `a` (as `Float64Array#sort`: −0 before +0) would put at
 * indices `k1 ≤ k2`, without sorting all of `a` (which may be rearranged).
 *
 * Method: a strided sample of {@link BRACKET_SAMPLE} values is sorted, and for each k the sample
 * values about k/n ± 3 binomial standard deviations bracket it; one pass counts the values below
 * each bracket and gathers those inside; when k falls inside its bracket, the gathered values are
 * sorted and k read off. Exact whatever the data: when a bracket misses (unlikely for random
 * draws, possible for ordered ones) or gathers too much, it falls back to selection
 * ({@link selectInPlace}). Cost: one pass and two sorts of a few per cent of the values.
 */
function orderStatistics(a: Float64Array, k1: number, k2: number): [number, number] {
  const n = a.length;
  if (n >= 4 * BRACKET_SAMPLE) {
    const found = bracketed(a, k1, k2);
    if (found) return found;
  }
  selectInPlace(a, k1, 0, n - 1);
  selectInPlace(a, k2, k1 + 1 <= k2 ? k1 + 1 : k1, n - 1);
  return [signedZeroAt(a, k1), signedZeroAt(a, k2)];
}

function bracketOf(sample: Float64Array, n: number, k: number): [number, number] {
  const S = sample.length;
  const p = k / n;
  const c = p * S;
  const d = Math.ceil(3 * Math.sqrt(S * p * (1 - p))) + 2;
  const lo = Math.floor(c - d), hi = Math.ceil(c + d);
  return [lo < 0 ? -Infinity : sample[lo], hi >= S ? Infinity : sample[hi]];
}

function bracketed(a: Float64Array, k1: number, k2: number): [number, number] | undefined {
  const n = a.length;
  const S = BRACKET_SAMPLE;
  const stride = Math.floor(n / S);
  const sample = new Float64Array(S);
  for (let j = 0; j < S; j++) sample[j] = a[j * stride];
  sample.sort();
  const [lo1, hi1] = bracketOf(sample, n, k1);
  const [lo2, hi2] = bracketOf(sample, n, k2);
  // Room for 4× the expected share of each bracket; more means the sample misled: fall back.
  const cap = Math.min(n, 4 * Math.ceil(n * (6 * Math.sqrt(S) / S + 8 / S)) + 64);
  const buf1 = new Float64Array(cap), buf2 = new Float64Array(cap);
  let below1 = 0, below2 = 0, c1 = 0, c2 = 0;
  for (let m = 0; m < n; m++) {
    const x = a[m];
    if (x < lo1) below1++;
    else if (x <= hi1) {
      if (c1 === cap) return undefined;
      buf1[c1++] = x;
    }
    if (x < lo2) below2++;
    else if (x <= hi2) {
      if (c2 === cap) return undefined;
      buf2[c2++] = x;
    }
  }
  if (k1 < below1 || k1 >= below1 + c1 || k2 < below2 || k2 >= below2 + c2) return undefined;
  const s1 = buf1.subarray(0, c1).sort(), s2 = buf2.subarray(0, c2).sort();
  return [s1[k1 - below1], s2[k2 - below2]];
}

/**
 * Rearrange `a[lo..hi]` so that `a[k]` holds the value a full ascending sort would put there,
 * with nothing greater before it and nothing smaller after it (Hoare's selection, FIND, with a
 * median-of-three pivot). Falls back to sorting the remaining range after many passes, so the
 * cost stays O(n log n) at worst. Zeros of either sign compare equal here; see
 * {@link signedZeroAt}.
 */
function selectInPlace(a: Float64Array, k: number, lo: number, hi: number): void {
  let l = lo, ir = hi;
  for (let pass = 0;; pass++) {
    if (ir <= l + 1) {
      if (ir === l + 1 && a[ir] < a[l]) swap(a, l, ir);
      return;
    }
    if (pass === 64) {
      a.subarray(l, ir + 1).sort();
      return;
    }
    swap(a, (l + ir) >>> 1, l + 1);
    if (a[l] > a[ir]) swap(a, l, ir);
    if (a[l + 1] > a[ir]) swap(a, l + 1, ir);
    if (a[l] > a[l + 1]) swap(a, l, l + 1);
    let i = l + 1, j = ir;
    const pivot = a[l + 1];
    for (;;) {
      do i++; while (a[i] < pivot);
      do j--; while (a[j] > pivot);
      if (j < i) break;
      swap(a, i, j);
    }
    a[l + 1] = a[j];
    a[j] = pivot;
    if (j >= k) ir = j - 1;
    if (j <= k) l = i;
  }
}

function swap(a: Float64Array, i: number, j: number): void {
  const t = a[i];
  a[i] = a[j];
  a[j] = t;
}

/**
 * `a[k]` after {@link selectInPlace}, with the sign of a zero a full sort would give (a sort
 * puts −0 before +0; selection cannot tell them apart).
 */
function signedZeroAt(a: Float64Array, k: number): number {
  const v = a[k];
  if (v !== 0) return v;
  let below = 0, negZero = 0;
  for (let m = 0; m < a.length; m++) {
    const x = a[m];
    if (x < 0) below++;
    else if (x === 0 && Object.is(x, -0)) negZero++;
  }
  return k >= below && k < below + negZero ? -0 : 0;
}
