/**
 * Monte Carlo throughput: 10⁵ draws of a ten-input model (a flow-like product and quotient
 * with mixed distributions), and the GUM propagation of the same model for comparison.
 */
import { gumPropagate, monteCarlo, type UncertainInput } from "../lib/uncertainty/mod.ts";
import { flowModel } from "../lib/site/model.ts";

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

// The plan's own measurement model (lib/site/model.ts, 9 inputs), 10⁵ draws: an invented 8-inch
// steel line at about 60 L/s; uncertainties of the size a plan carries.
const FLOW_INPUTS: UncertainInput[] = [
  ["outsideDiameter", 0.2191, 0.0005, "rectangular"],
  ["wallThickness", 0.00818, 0.0003, "rectangular"],
  ["liningThickness", 0, 0.0001, "rectangular"],
  ["wedgeSoundSpeed", 2720, 10, "normal"],
  ["wedgeAngle", 38 * Math.PI / 180, 0.002, "normal"],
  ["deltaT", 1.2e-7, 1e-9, "normal"],
  ["liquidTime", 1.5e-4, 2e-7, "normal"],
  ["profileFactor", 0.94, 0.005, "rectangular"],
  ["installationEffect", 0, 0.005, "triangular"],
].map(([name, value, u, d]) => ({
  name: name as string,
  value: value as number,
  standardUncertainty: u as number,
  distribution: d as UncertainInput["distribution"],
}));

Deno.bench("monteCarlo, 1e5 draws, flowModel (9 inputs)", { group: "flow model" }, () => {
  monteCarlo(flowModel, FLOW_INPUTS, { draws: 100_000, seed: 1 });
});
