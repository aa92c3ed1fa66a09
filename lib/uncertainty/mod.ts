/**
 * Uncertainty engines: the GUM law of propagation (JCGM 100:2008) and the Monte Carlo
 * propagation of distributions (JCGM 101:2008), with a seeded reproducible generator and the
 * normal and Student t quantiles for coverage factors. Re-exports only.
 *
 * @module
 */
export * from "./inputs.ts";
export * from "./gum.ts";
export * from "./montecarlo.ts";
export * from "./quantiles.ts";
export * from "./rng.ts";
