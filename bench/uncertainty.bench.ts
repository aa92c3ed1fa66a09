/**
 * Monte Carlo throughput: 10⁵ draws of a ten-input model (a flow-like product and quotient
 * with mixed distributions), and the GUM propagation of the same model for comparison.
 */
import { gumPropagate, monteCarlo, type UncertainInput } from "../lib/uncertainty/mod.ts";

const DISTS: UncertainInput["distribution"][] = ["normal", "rectangular", "triangular", "u-shaped"];
const inputs: UncertainInput[] = Array.from({ length: 10 }, (_, i) => ({
  name: `x${i}`,
  value: 1 + 0.1 * i,
  standardUncertainty: 0.01 * (1 + i),
  distribution: DISTS[i % 4],
}));
const model = (x: Float64Array) =>
  x[0] * x[1] * Math.sqrt(x[2]) / (x[3] * x[4]) + x[5] - x[6] + x[7] * x[8] / x[9];

Deno.bench("monteCarlo, 1e5 draws, 10 inputs", { group: "uncertainty", baseline: true }, () => {
  monteCarlo(model, inputs, { draws: 100_000, seed: 1 });
});

Deno.bench("monteCarlo, 1e5 draws, 10 inputs, shortest interval", { group: "uncertainty" }, () => {
  monteCarlo(model, inputs, { draws: 100_000, seed: 1, shortest: true });
});

Deno.bench("gumPropagate, 10 inputs", { group: "uncertainty" }, () => {
  gumPropagate(model, inputs);
});
