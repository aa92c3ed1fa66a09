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

/** A seeded random stream. Its state lives in the closure; nothing is allocated per call. */
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
  if (!Number.isInteger(seed) || seed < 0 || seed > 0xffffffff) {
    throw new InputError("seed", String(seed), "an integer from 0 to 4294967295");
  }
  // SplitMix32 fills the state; it never yields four zero words.
  let sm = seed >>> 0;
  const mix = (): number => {
    sm = (sm + 0x9e3779b9) >>> 0;
    let z = sm;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
    return (z ^ (z >>> 16)) >>> 0;
  };
  let s0 = mix(), s1 = mix(), s2 = mix(), s3 = mix();
  if ((s0 | s1 | s2 | s3) === 0) s0 = 1;

  const nextUint32 = (): number => {
    const m = Math.imul(s1, 5);
    const r = Math.imul((m << 7) | (m >>> 25), 9) >>> 0;
    const t = s1 << 9;
    s2 ^= s0;
    s3 ^= s1;
    s1 ^= s2;
    s0 ^= s3;
    s2 ^= t;
    s3 = (s3 << 11) | (s3 >>> 21);
    return r;
  };
  const uniform = (): number => {
    const hi = nextUint32() >>> 5; // 27 bits
    const lo = nextUint32() >>> 6; // 26 bits
    return (hi * TWO_POW_26 + lo + 0.5) / TWO_POW_53;
  };
  let spare = 0;
  let hasSpare = false;
  const normal = (): number => {
    if (hasSpare) {
      hasSpare = false;
      return spare;
    }
    let u: number, v: number, s: number;
    do {
      u = 2 * uniform() - 1;
      v = 2 * uniform() - 1;
      s = u * u + v * v;
    } while (s >= 1 || s === 0);
    const f = Math.sqrt(-2 * Math.log(s) / s);
    spare = v * f;
    hasSpare = true;
    return u * f;
  };
  return { seed: seed >>> 0, nextUint32, uniform, normal };
}
