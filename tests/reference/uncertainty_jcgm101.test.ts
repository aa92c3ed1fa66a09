/**
 * Outside checks of the Monte Carlo engine against JCGM 101:2008 (Supplement 1 to the GUM),
 * §9.2 "Additive model", and of GUM against Monte Carlo where the two must agree or differ.
 *
 * Tolerances: with M = 10⁶ draws the standard deviation of a 95 % interval endpoint of these
 * models is about 0.005 (√(p(1−p)/M)/f(y) with f the output density at the endpoint), and the
 * published values are rounded to two decimals (±0.005); 0.02 covers both with margin (≈ 4σ).
 */
import { assert, closeAbs, closeRel } from "../_assert.ts";
import { hasPython, runPython } from "../_python.ts";
import { gumPropagate, monteCarlo, type UncertainInput } from "../../lib/uncertainty/mod.ts";

const four = (distribution: UncertainInput["distribution"]): UncertainInput[] =>
  [1, 2, 3, 4].map((i) => ({ name: `X${i}`, value: 0, standardUncertainty: 1, distribution }));
const sum4 = (x: Float64Array) => x[0] + x[1] + x[2] + x[3];
const ENDPOINT_TOL = 0.02;

Deno.test("JCGM 101:2008 §9.2.2: four normal inputs, u = 1: u(y) = 2.0, 95 % interval ±3.92", () => {
  // Source: JCGM 101:2008 §9.2.2 (GUM and MCM both give u(y) = 2.00 and [−3.92, 3.92]).
  const gum = gumPropagate(sum4, four("normal"), { coverage: 0.95 });
  closeAbs(gum.standardUncertainty, 2.0, 1e-9, "GUM u(y)");
  closeAbs(gum.expanded, 3.92, 0.005, "GUM expanded, k = 1.96");
  const mc = monteCarlo(sum4, four("normal"), { draws: 1_000_000, seed: 20080 });
  closeAbs(mc.standardUncertainty, 2.0, 0.01, "MCM u(y)");
  closeAbs(mc.mean, 0, 0.01, "MCM mean");
  closeAbs(mc.interval[0], -3.92, ENDPOINT_TOL, "MCM low");
  closeAbs(mc.interval[1], 3.92, ENDPOINT_TOL, "MCM high");
});

Deno.test("JCGM 101:2008 §9.2.3: four rectangular inputs, u = 1: MCM ±3.88 where GUM gives ±3.92", () => {
  // Source: JCGM 101:2008 §9.2.3 (GUM [−3.92, 3.92]; MCM [−3.88, 3.88], u(y) = 2.00).
  const gum = gumPropagate(sum4, four("rectangular"), { coverage: 0.95 });
  closeAbs(gum.expanded, 3.92, 0.005, "GUM expanded");
  const mc = monteCarlo(sum4, four("rectangular"), { draws: 1_000_000, seed: 20081 });
  closeAbs(mc.standardUncertainty, 2.0, 0.01, "MCM u(y)");
  closeAbs(mc.interval[0], -3.88, ENDPOINT_TOL, "MCM low");
  closeAbs(mc.interval[1], 3.88, ENDPOINT_TOL, "MCM high");
  // The narrower Monte Carlo interval is the point of the example.
  assert.ok(mc.interval[1] - mc.interval[0] < 2 * gum.expanded - 0.04, "MCM narrower than GUM");
});

Deno.test("GUM and Monte Carlo agree on a linear model with mixed distributions", () => {
  // Common practice (JCGM 101:2008 §8 validation idea): for a linear model the GUM u(y) is exact.
  const inputs: UncertainInput[] = [
    { name: "a", value: 10, standardUncertainty: 0.3, distribution: "normal" },
    { name: "b", value: -2, standardUncertainty: 0.2, distribution: "rectangular" },
    { name: "c", value: 5, standardUncertainty: 0.1, distribution: "triangular" },
    { name: "d", value: 1, standardUncertainty: 0.4, distribution: "u-shaped" },
  ];
  const model = (x: Float64Array) => 2 * x[0] - 3 * x[1] + 0.5 * x[2] + x[3];
  const gum = gumPropagate(model, inputs);
  const mc = monteCarlo(model, inputs, { draws: 400_000, seed: 5 });
  closeAbs(gum.value, 29.5, 1e-12, "estimate");
  closeRel(mc.mean, gum.value, 1e-3, "mean");
  closeRel(mc.standardUncertainty, gum.standardUncertainty, 0.01, "u(y)");
});

Deno.test("Y = X², X ~ N(0, 1): GUM first order gives u = 0, Monte Carlo the χ²(1) distribution", async (t) => {
  // Source: χ² with one degree of freedom: mean 1, variance 2 (standard result); its 2.5 %,
  // 97.5 % and 95 % quantiles 0.000982, 5.024, 3.841 (recalled from common χ² tables, and
  // checked against scipy.stats.chi2 below where python3-scipy is installed).
  const x: UncertainInput[] = [{
    name: "X",
    value: 0,
    standardUncertainty: 1,
    distribution: "normal",
  }];
  const model = (v: Float64Array) => v[0] * v[0];
  const gum = gumPropagate(model, x);
  assert.equal(gum.value, 0);
  closeAbs(gum.standardUncertainty, 0, 1e-9, "GUM misses the curvature");
  const mc = monteCarlo(model, x, { draws: 1_000_000, seed: 11, shortest: true });
  closeAbs(mc.mean, 1, 0.01, "mean");
  closeAbs(mc.standardUncertainty, Math.SQRT2, 0.01, "u");
  closeAbs(mc.symmetricInterval[0], 0.000982, 0.0001, "symmetric low");
  closeAbs(mc.symmetricInterval[1], 5.024, 0.05, "symmetric high");
  closeAbs(mc.interval[0], 0, 1e-4, "shortest low");
  closeAbs(mc.interval[1], 3.841, 0.03, "shortest high");
  await t.step({
    name: "quantiles against scipy.stats.chi2 (Debian python3-scipy)",
    ignore: !hasPython("scipy"),
    fn: async () => {
      const q = await runPython<number[]>(
        "import json,sys\nfrom scipy.stats import chi2\n" +
          "print(json.dumps([chi2.ppf(0.025,1), chi2.ppf(0.975,1), chi2.ppf(0.95,1)]))",
      );
      closeAbs(mc.symmetricInterval[0], q[0], 0.0001, "scipy 2.5 %");
      closeAbs(mc.symmetricInterval[1], q[1], 0.05, "scipy 97.5 %");
      closeAbs(mc.interval[1], q[2], 0.03, "scipy 95 %");
    },
  });
});

Deno.test("seeded Monte Carlo runs are reproducible bit for bit", () => {
  const inputs = four("triangular");
  const model = (x: Float64Array) => x[0] * x[1] + Math.exp(0.1 * x[2]) - x[3];
  const a = monteCarlo(model, inputs, { draws: 5000, seed: 99, keepValues: true });
  const b = monteCarlo(model, inputs, { draws: 5000, seed: 99, keepValues: true });
  assert.deepEqual(Array.from(a.values!), Array.from(b.values!));
  assert.equal(a.mean, b.mean);
  assert.deepEqual(a.interval, b.interval);
  const c = monteCarlo(model, inputs, { draws: 5000, seed: 100 });
  assert.notEqual(c.mean, a.mean);
});
