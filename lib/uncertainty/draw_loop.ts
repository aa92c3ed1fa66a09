/**
 * The Monte Carlo draw loop specialised to one pattern of input kinds.
 *
 * The generic loop of montecarlo.ts looks up each input's kind, index, estimate and scale on
 * every draw. For independent inputs (no correlated group), this module writes the loop's source
 * once per pattern of kinds (for example normal, rectangular, fixed, …), with one statement per
 * input in input order and the estimates and scales held in locals, compiles it with the
 * `Function` constructor and keeps it for the next run with the same pattern. The statements are
 * the generic loop's, in the same order and with the same arithmetic, so every draw has the same
 * bits (tests/uncertainty/montecarlo_stream.test.ts and montecarlo_select.test.ts compare the
 * two routes). Only kinds and integer indices enter the source; values are passed in as arrays.
 *
 * Method: JCGM 101:2008 §6.4 (rectangular x + a(2U − 1), triangular x + a(U₁ + U₂ − 1),
 * U-shaped x + a·cos(πU), normal x + u·z with z by Marsaglia's polar method). Uniform deviates
 * come from a first-in first-out block filled in the stream's own order.
 *
 * @module
 */
import { fillUniformOf } from "./rng.ts";

/** Kind codes shared with montecarlo.ts. */
export const KIND_NORMAL = 0, KIND_RECT = 1, KIND_TRI = 2, KIND_U = 3, KIND_FIXED = 4;

/**
 * A compiled draw loop: fills `out` with the model's values over successive draws and returns
 * their sum in draw order; `spare` holds the polar method's spare deviate ([value, 1 when held]);
 * `onBad(y, m, x)` is called for a non-finite model value and must throw.
 */
export type DrawLoop = (
  model: (x: Float64Array) => number,
  est: Float64Array,
  scale: Float64Array,
  words: Int32Array,
  spare: Float64Array,
  out: Float64Array,
  x: Float64Array,
  onBad: (y: number, m: number, x: Float64Array) => never,
) => number;

/** Most inputs a specialised loop is written for; longer input lists take the generic loop. */
export const MAX_SPECIALISED_INPUTS = 64;

/** Top up the block: keep what is left at its start, fill the rest from the stream. */
const REFILL = "block.copyWithin(0, next); fill(words, block.subarray(size - next)); next = 0;";

/** Smallest uniform block. */
const MIN_BLOCK = 1024;

const loops = new Map<string, DrawLoop>();

/**
 * The draw loop for a pattern of kinds, compiled on first use and kept.
 *
 * Method: see the module documentation; the loop equals montecarlo.ts's generic loop for
 * independent inputs, bit for bit. Validity: 1 to {@link MAX_SPECIALISED_INPUTS} inputs, kinds
 * among the exported codes.
 *
 * @param kinds kind code of each input, in input order
 * @returns the compiled loop
 * @throws {RangeError} for an empty or too long pattern or an unknown kind code
 *
 * @example
 * ```ts
 * import { drawLoopFor, KIND_FIXED, KIND_RECT } from "./draw_loop.ts";
 * import { randomState } from "./rng.ts";
 * const loop = drawLoopFor(Uint8Array.of(KIND_RECT, KIND_FIXED));
 * const out = new Float64Array(4), st = randomState(1);
 * const sum = loop((x) => x[0] + x[1], Float64Array.of(1, 2), Float64Array.of(0.5, 0), st.words,
 *   st.spare, out, new Float64Array(2), () => { throw new Error("bad"); });
 * if (!out.every((y) => y >= 2.5 && y <= 3.5) || sum !== out[0] + out[1] + out[2] + out[3]) {
 *   throw new Error("draws within x ± a");
 * }
 * ```
 */
export function drawLoopFor(kinds: Uint8Array): DrawLoop {
  if (kinds.length < 1 || kinds.length > MAX_SPECIALISED_INPUTS) {
    throw new RangeError(`expected 1 to ${MAX_SPECIALISED_INPUTS} kinds, got ${kinds.length}`);
  }
  const key = kinds.join(",");
  let loop = loops.get(key);
  if (!loop) {
    loop = compile(kinds);
    loops.set(key, loop);
  }
  return loop;
}

/** Write and compile the loop's source for one pattern. */
function compile(kinds: Uint8Array): DrawLoop {
  let bounded = 0;
  const locals: string[] = [];
  const body: string[] = [];
  kinds.forEach((k, i) => {
    if (k === KIND_FIXED) {
      locals.push(`const f${i} = est[${i}];`);
      body.push(`x[${i}] = f${i};`);
      return;
    }
    locals.push(`const e${i} = est[${i}], s${i} = scale[${i}];`);
    if (k === KIND_RECT) {
      bounded += 1;
      body.push(`x[${i}] = e${i} + s${i} * (2 * block[next++] - 1);`);
    } else if (k === KIND_U) {
      bounded += 1;
      body.push(`x[${i}] = e${i} + s${i} * Math.cos(PI * block[next++]);`);
    } else if (k === KIND_TRI) {
      bounded += 2;
      body.push(
        `{ const u1 = block[next++]; x[${i}] = e${i} + s${i} * (u1 + block[next++] - 1); }`,
      );
    } else if (k === KIND_NORMAL) {
      body.push(
        `if (hasSpare) { hasSpare = false; x[${i}] = e${i} + s${i} * spareValue; } else {`,
        "  let u, v, q;",
        "  do {",
        "    if (next + 2 + BOUNDED > size) { " + REFILL + " }",
        "    u = 2 * block[next++] - 1;",
        "    v = 2 * block[next++] - 1;",
        "    q = u * u + v * v;",
        "  } while (q >= 1 || q === 0);",
        "  const f = Math.sqrt(-2 * Math.log(q) / q);",
        "  spareValue = v * f;",
        "  hasSpare = true;",
        `  x[${i}] = e${i} + s${i} * (u * f);`,
        "}",
      );
    } else {
      throw new RangeError(`expected a kind code 0 to 4, got ${k} for input ${i}`);
    }
  });
  const size = Math.max(MIN_BLOCK, 2 * bounded + 2);
  const source = [
    '"use strict";',
    "return function drawLoop(model, est, scale, words, spare, out, x, onBad) {",
    `  const size = ${size}, BOUNDED = ${bounded}, PI = Math.PI;`,
    "  const block = new Float64Array(size);",
    "  let next = size;",
    "  let hasSpare = spare[1] === 1, spareValue = spare[0];",
    ...locals.map((l) => "  " + l),
    "  let sum = 0;",
    "  const draws = out.length;",
    "  for (let m = 0; m < draws; m++) {",
    "    if (next + BOUNDED > size) { " + REFILL + " }",
    ...body.map((l) => "    " + l),
    "    const y = model(x);",
    "    if (!Number.isFinite(y)) onBad(y, m, x);",
    "    out[m] = y;",
    "    sum += y;",
    "  }",
    "  spare[0] = spareValue;",
    "  spare[1] = hasSpare ? 1 : 0;",
    "  return sum;",
    "};",
  ].join("\n");
  return new Function("fill", source)(fillUniformOf) as DrawLoop;
}
