/**
 * The acoustic path: Snell chain, critical angles, spacing per mounting, transit times and Δt,
 * search window, temperature drift, Doppler shift, technique screening and a rough signal
 * budget. Re-exports only.
 *
 * @example
 * ```ts
 * import { clampOnPath, transitTimes } from "./mod.ts";
 * const p = clampOnPath({ outsideDiameter: 0.1143, wallThickness: 0.00602,
 *   wallSoundSpeed: 5920, wallShearSpeed: 3230, fluidSoundSpeed: 1482,
 *   wedgeSoundSpeed: 2720, wedgeAngle: 38 * Math.PI / 180, traverses: 2 });
 * if (!(transitTimes(p, 1).deltaT > 0)) throw new Error();
 * ```
 *
 * @module
 */
export * from "./path.ts";
export * from "./transit.ts";
export * from "./window.ts";
export * from "./doppler.ts";
export * from "./budget.ts";
