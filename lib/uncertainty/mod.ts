/**
 * Uncertainty engines: the GUM law of propagation (JCGM 100:2008) and the Monte Carlo
 * propagation of distributions (JCGM 101:2008), with a seeded reproducible generator and the
 * normal and Student t quantiles for coverage factors. Re-exports only.
 *
 * @module
 */
export {
  type Correlation,
  type Distribution,
  DISTRIBUTIONS,
  type UncertainInput,
} from "./inputs.ts";
export {
  type BudgetLine,
  type GumOptions,
  gumPropagate,
  type GumResult,
  type MeasurementModel,
} from "./gum.ts";
export { monteCarlo, type MonteCarloOptions, type MonteCarloResult } from "./montecarlo.ts";
export {
  coverageFactor,
  normalCdf,
  normalQuantile,
  studentTCdf,
  studentTQuantile,
} from "./quantiles.ts";
export { type RandomStream, randomStream } from "./rng.ts";
