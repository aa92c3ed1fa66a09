/**
 * The Monte Carlo draw loop takes its deviates in the stream's own order: its draws equal, bit
 * for bit, those of a plain loop that asks the seeded stream for one deviate at a time and applies
 * the samplers of JCGM 101:2008 §6.4 as monteCarlo documents them. The draw loop fills blocks of
 * uniform deviates ahead for speed; this checks that doing so changes no number, across several
 * blocks, for every distribution kind and a fixed input. (An invariant of our own: two routes to
 * the same numbers.)
 */
import { assert } from "../_assert.ts";
import { monteCarlo, randomStream, type UncertainInput } from "../../lib/uncertainty/mod.ts";

const INPUTS: UncertainInput[] = [
  { name: "a", value: 2, standardUncertainty: 0.1, distribution: "normal" },
  { name: "b", value: 1, standardUncertainty: 0.2, distribution: "rectangular" },
  { name: "c", value: 3, standardUncertainty: 0.3, distribution: "triangular" },
  { name: "d", value: 0.5, standardUncertainty: 0.05, distribution: "u-shaped" },
  { name: "e", value: 4, standardUncertainty: 0, distribution: "normal" },
  { name: "f", value: -1, standardUncertainty: 0.01, distribution: "normal" },
];
const model = (x: ArrayLike<number>) => x[0] * Math.sin(x[1]) + x[2] / x[4] - x[3] * x[3] + x[5];

/** The plain loop: one stream call per deviate, half-widths a = √3·u, √6·u, √2·u. */
function plainDraws(
  draws: number,
  seed: number,
  inputs: readonly UncertainInput[] = INPUTS,
  f: (x: ArrayLike<number>) => number = model,
): Float64Array {
  const s = randomStream(seed);
  const out = new Float64Array(draws);
  const x = new Float64Array(inputs.length);
  for (let m = 0; m < draws; m++) {
    inputs.forEach((inp, i) => {
      const u = inp.standardUncertainty;
      if (u === 0) x[i] = inp.value;
      else if (inp.distribution === "normal") x[i] = inp.value + u * s.normal();
      else if (inp.distribution === "rectangular") {
        x[i] = inp.value + u * Math.sqrt(3) * (2 * s.uniform() - 1);
      } else if (inp.distribution === "triangular") {
        x[i] = inp.value + u * Math.sqrt(6) * (s.uniform() + s.uniform() - 1);
      } else x[i] = inp.value + u * Math.SQRT2 * Math.cos(Math.PI * s.uniform());
    });
    out[m] = f(x);
  }
  return out.sort();
}

Deno.test("Monte Carlo draws equal a one-deviate-at-a-time loop, bit for bit, over many blocks", () => {
  for (const [draws, seed] of [[5000, 1], [2049, 77], [100, 4294967295]]) {
    const r = monteCarlo(model, INPUTS, { draws, seed, keepValues: true });
    const want = plainDraws(draws, seed);
    const got = r.values!;
    assert.equal(got.length, want.length);
    let differ = 0;
    for (let m = 0; m < draws; m++) if (!Object.is(got[m], want[m])) differ++;
    assert.equal(differ, 0, `${differ} of ${draws} draws differ (seed ${seed})`);
  }
});

Deno.test("Monte Carlo draws of a long input list (the generic loop) equal the plain loop too", () => {
  // 70 inputs: past the longest list the draw loop is specialised for (draw_loop.ts)
  const many = Array.from(
    { length: 70 },
    (_, i) => ({ ...INPUTS[i % INPUTS.length], name: `x${i}` }),
  );
  const sum = (x: ArrayLike<number>) => {
    let s = 0;
    for (let i = 0; i < x.length; i++) s += (i + 1) * x[i];
    return s;
  };
  const r = monteCarlo(sum, many, { draws: 300, seed: 9, keepValues: true });
  const want = plainDraws(300, 9, many, sum);
  let differ = 0;
  for (let m = 0; m < 300; m++) if (!Object.is(r.values![m], want[m])) differ++;
  assert.equal(differ, 0, `${differ} of 300 draws differ`);
});
