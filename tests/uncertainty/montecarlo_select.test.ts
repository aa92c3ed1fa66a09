/**
 * The Monte Carlo interval ends are found without sorting every draw (a sorted sample brackets
 * each order statistic, falling back to selection). They must be exactly the values a full sort
 * gives (JCGM 101:2008 §7.7.1), sign of zero included, whatever the draws: random, tied,
 * all zeros of both signs, ordered, or patterned so that the strided sample misleads. The full
 * sort is the `keepValues` run of the same seed.
 */
import { assert } from "../_assert.ts";
import { monteCarlo } from "../../lib/uncertainty/montecarlo.ts";
import type { UncertainInput } from "../../lib/uncertainty/inputs.ts";

const INPUTS: UncertainInput[] = [
  { name: "a", value: 1, standardUncertainty: 0.1, distribution: "normal" },
  { name: "b", value: 2, standardUncertainty: 0.05, distribution: "rectangular" },
];

/** A model fed by the draw count (ordered or patterned outputs). */
function counter(f: (m: number) => number): (x: ArrayLike<number>) => number {
  let m = 0;
  return () => f(m++);
}

const MODELS: Record<string, () => (x: ArrayLike<number>) => number> = {
  "random product": () => (x) => x[0] * x[1],
  "few distinct values (ties)": () => (x) => Math.round(x[0] * 3),
  "zeros of both signs": () => (x) => (x[1] > 2 ? 0 : -0),
  "negatives, then zeros of both signs": () => (x) =>
    x[0] < 0.85 ? -1 : x[0] > 1.15 ? 1 : x[1] > 2 ? 0 : -0,
  "ascending": () => counter((m) => m),
  "descending": () => counter((m) => -m),
  "sample-misleading pattern": () => counter((m) => (m % 24 === 0 ? 0 : m)),
  "constant": () => () => 7,
};

Deno.test("interval ends equal a full sort's, sign of zero included", () => {
  let compared = 0;
  for (const [name, make] of Object.entries(MODELS)) {
    for (const draws of [100, 4095, 4096, 4097, 25_000, 100_000, 123_457]) {
      for (const coverage of [0.95, 0.99, 0.5]) {
        const opts = { draws, seed: 11, coverage };
        const fast = monteCarlo(make(), INPUTS, opts);
        const sorted = monteCarlo(make(), INPUTS, { ...opts, keepValues: true });
        for (const e of [0, 1]) {
          assert.ok(
            Object.is(fast.symmetricInterval[e], sorted.symmetricInterval[e]),
            `${name}, ${draws} draws, p = ${coverage}: end ${e} ${
              fast.symmetricInterval[e]
            } against a full sort's ${sorted.symmetricInterval[e]}`,
          );
        }
        compared++;
      }
    }
  }
  assert.equal(compared, Object.keys(MODELS).length * 7 * 3);
});
