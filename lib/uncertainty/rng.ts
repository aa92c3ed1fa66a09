/**
 * Seeded, reproducible pseudo-random numbers for Monte Carlo propagation (JCGM 101:2008 §6.3
 * asks for a generator with good statistical properties and a seed so runs can be repeated).
 *
 * The generator is xoshiro128** (Blackman and Vigna, 2018): 128 bits of state, period 2^128 − 1,
 * four 32-bit words updated with shifts, rotations and xors. The four words are filled from the
 * 32-bit seed by the SplitMix32 mixing step, so neighbouring seeds give unrelated streams.
 * Uniform doubles take 53 random bits from two outputs and lie strictly inside (0, 1).
 * Normal deviates come from the Marsaglia polar method, which yields them in pairs; the spare
 * is kept for the next call.
 *
 * @module
 */
import { InputError } from "../errors.ts";

/** A seeded random stream. Its state lives in typed arrays; nothing is allocated per call. */
export interface RandomStream {
  /** The seed the stream started from (an unsigned 32-bit integer). */
  readonly seed: number;
  /** Next raw 32-bit output, as an unsigned integer. */
  nextUint32(): number;
  /** Next uniform deviate in the open interval (0, 1), with 53 random bits. */
  uniform(): number;
  /** Next standard normal deviate (mean 0, standard deviation 1), Marsaglia polar method. */
  normal(): number;
}

const TWO_POW_26 = 67108864;
const TWO_POW_53 = 9007199254740992;

/**
 * The state of a xoshiro128** stream in typed arrays (numbers kept in closure variables or object
 * fields outside the small-integer range are boxed on every write; typed arrays are not).
 */
export interface RandomState {
  /** The four 32-bit state words. */
  readonly words: Int32Array;
  /** [the spare normal deviate of the last polar pair, 1 while it is unused else 0]. */
  readonly spare: Float64Array;
}

function checkSeed(seed: number): void {
  if (!Number.isInteger(seed) || seed < 0 || seed > 0xffffffff) {
    throw new InputError("seed", String(seed), "an integer from 0 to 4294967295");
  }
}

/**
 * Seed a xoshiro128** state through SplitMix32 (the state {@link randomStream} uses; the
 * functions {@link nextUint32Of}, {@link uniformOf} and {@link normalOf} advance it).
 *
 * Method: SplitMix32 mixing of the seed into four words (never all zero). Validity: any
 * unsigned 32-bit integer seed. Source: jcgm-101-2008 (§6.3, requirements on the generator).
 *
 * @param seed unsigned 32-bit integer seed (dimensionless)
 * @returns a fresh state
 * @throws {InputError} when the seed is not an integer in 0 … 2^32 − 1
 *
 * @example
 * ```ts
 * import { randomState, randomStream, uniformOf } from "./rng.ts";
 * if (uniformOf(randomState(5).words) !== randomStream(5).uniform()) throw new Error("same stream");
 * ```
 */
export function randomState(seed: number): RandomState {
  checkSeed(seed);
  let sm = seed >>> 0;
  const mix = (): number => {
    sm = (sm + 0x9e3779b9) >>> 0;
    let z = sm;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
    return (z ^ (z >>> 16)) >>> 0;
  };
  const words = new Int32Array(4);
  words[0] = mix();
  words[1] = mix();
  words[2] = mix();
  words[3] = mix();
  if ((words[0] | words[1] | words[2] | words[3]) === 0) words[0] = 1;
  return { words, spare: new Float64Array(2) };
}

/**
 * Advance a state by one xoshiro128** step (Blackman & Vigna 2018).
 *
 * @param w the state's words ({@link RandomState}`.words`, changed)
 * @returns the next raw 32-bit output, as an unsigned integer
 *
 * @example
 * ```ts
 * import { nextUint32Of, randomState } from "./rng.ts";
 * const x = nextUint32Of(randomState(1).words);
 * if (!(Number.isInteger(x) && x >= 0 && x < 2 ** 32)) throw new Error();
 * ```
 */
export function nextUint32Of(w: Int32Array): number {
  const s0 = w[0], s1 = w[1];
  const m = Math.imul(s1, 5);
  const r = Math.imul((m << 7) | (m >>> 25), 9) >>> 0;
  const s2 = w[2] ^ s0;
  const s3 = w[3] ^ s1;
  w[1] = s1 ^ s2;
  w[0] = s0 ^ s3;
  w[2] = s2 ^ (s1 << 9);
  w[3] = (s3 << 11) | (s3 >>> 21);
  return r;
}

/**
 * Fill `out` with the next `out.length` uniform deviates of a state, in stream order: the same
 * numbers, in the same order, as that many {@link uniformOf} calls, with the state words held in
 * local variables for the whole block (one load and one store of the state per block).
 *
 * @param w the state's words ({@link RandomState}`.words`, changed)
 * @param out filled with uniform deviates in (0, 1)
 *
 * @example
 * ```ts
 * import { fillUniformOf, randomState, uniformOf } from "./rng.ts";
 * const a = randomState(5), b = randomState(5);
 * const block = new Float64Array(3);
 * fillUniformOf(a.words, block);
 * for (const u of block) if (u !== uniformOf(b.words)) throw new Error("same stream");
 * ```
 */
export function fillUniformOf(w: Int32Array, out: Float64Array): void {
  let s0 = w[0], s1 = w[1], s2 = w[2], s3 = w[3];
  for (let k = 0; k < out.length; k++) {
    // two xoshiro128** steps, as nextUint32Of
    let m = Math.imul(s1, 5);
    const hi = (Math.imul((m << 7) | (m >>> 25), 9) >>> 0) >>> 5;
    let t2 = s2 ^ s0, t3 = s3 ^ s1;
    s2 = t2 ^ (s1 << 9);
    s1 = s1 ^ t2;
    s0 = s0 ^ t3;
    s3 = (t3 << 11) | (t3 >>> 21);
    m = Math.imul(s1, 5);
    const lo = (Math.imul((m << 7) | (m >>> 25), 9) >>> 0) >>> 6;
    t2 = s2 ^ s0;
    t3 = s3 ^ s1;
    s2 = t2 ^ (s1 << 9);
    s1 = s1 ^ t2;
    s0 = s0 ^ t3;
    s3 = (t3 << 11) | (t3 >>> 21);
    out[k] = (hi * TWO_POW_26 + lo + 0.5) / TWO_POW_53;
  }
  w[0] = s0;
  w[1] = s1;
  w[2] = s2;
  w[3] = s3;
}

// One short call at load, on a scratch state (no stream is touched): the optimising compiler then
// has type feedback for the stores after the loop before the loop gets hot. Without it, the code
// compiled on-stack while the first block is filled has never seen those stores and is thrown
// away at the end of every block (about 30 ms lost in a cold 10⁵-draw Monte Carlo).
for (let i = 0; i < 16; i++) fillUniformOf(new Int32Array([1, 2, 3, 4]), new Float64Array(1));

/**
 * Next uniform deviate of a state: 53 random bits from two outputs, in the open interval (0, 1).
 *
 * @param w the state's words ({@link RandomState}`.words`, changed)
 * @returns a uniform deviate in (0, 1)
 *
 * @example
 * ```ts
 * import { randomState, uniformOf } from "./rng.ts";
 * const u = uniformOf(randomState(2).words);
 * if (!(u > 0 && u < 1)) throw new Error();
 * ```
 */
export function uniformOf(w: Int32Array): number {
  const hi = nextUint32Of(w) >>> 5; // 27 bits
  const lo = nextUint32Of(w) >>> 6; // 26 bits
  return (hi * TWO_POW_26 + lo + 0.5) / TWO_POW_53;
}

/**
 * Next standard normal deviate of a state by the Marsaglia polar method; the second deviate of
 * each pair is kept in the state for the next call.
 *
 * @param w the state's words ({@link RandomState}`.words`, changed)
 * @param sp the state's spare ({@link RandomState}`.spare`, changed)
 * @returns a standard normal deviate (mean 0, standard deviation 1)
 *
 * @example
 * ```ts
 * import { normalOf, randomState } from "./rng.ts";
 * const st = randomState(3);
 * if (!Number.isFinite(normalOf(st.words, st.spare))) throw new Error();
 * ```
 */
export function normalOf(w: Int32Array, sp: Float64Array): number {
  if (sp[1] === 1) {
    sp[1] = 0;
    return sp[0];
  }
  let u: number, v: number, q: number;
  do {
    u = 2 * uniformOf(w) - 1;
    v = 2 * uniformOf(w) - 1;
    q = u * u + v * v;
  } while (q >= 1 || q === 0);
  const f = Math.sqrt(-2 * Math.log(q) / q);
  sp[0] = v * f;
  sp[1] = 1;
  return u * f;
}

/**
 * Create a seeded xoshiro128** stream.
 *
 * Method: xoshiro128** (Blackman & Vigna 2018), seeded through SplitMix32; normal deviates by the
 * Marsaglia polar method. Validity: any unsigned 32-bit integer seed (0 … 4 294 967 295).
 * Source: jcgm-101-2008 (§6.3 and annex C, requirements on the generator).
 *
 * @param seed unsigned 32-bit integer seed (dimensionless)
 * @returns the stream
 * @throws {InputError} when the seed is not an integer in 0 … 2^32 − 1
 *
 * @example
 * ```ts
 * import { randomStream } from "./rng.ts";
 * const a = randomStream(42), b = randomStream(42);
 * const x = a.uniform();
 * if (x !== b.uniform() || !(x > 0 && x < 1)) throw new Error("reproducible uniform in (0,1)");
 * ```
 */
export function randomStream(seed: number): RandomStream {
  const { words, spare } = randomState(seed);
  return {
    seed: seed >>> 0,
    nextUint32: () => nextUint32Of(words),
    uniform: () => uniformOf(words),
    normal: () => normalOf(words, spare),
  };
}
