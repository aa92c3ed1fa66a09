/**
 * Water formulations: IAPWS-95, IAPWS-IF97 region 1, Del Grosso–Mader 1972, Marczak 1997,
 * IAPWS 2008 viscosity and the Wagner–Pruß saturation pressure. Re-exports only.
 *
 * @example
 * ```ts
 * import { water } from "./mod.ts";
 * const w = water.soundSpeed(293.15, 101325, "iapws95");
 * if (Math.abs(w - 1482.35) > 0.05) throw new Error(String(w));
 * ```
 *
 * @module
 */
export {
  STANDARD_ATMOSPHERE,
  water,
  waterDensity,
  type WaterFormulation,
  type WaterFormulationInfo,
  waterFormulations,
  waterKinematicViscosity,
  type WaterNamespace,
  waterSoundSpeed,
  waterTrace,
  type WaterTraceSubject,
  waterViscosity,
} from "./water.ts";
export {
  type HelmholtzDerivatives,
  iapws95Density,
  iapws95Helmholtz,
  type Iapws95State,
  iapws95State,
} from "./iapws95.ts";
export { if97Region1, type If97Region1State } from "./if97.ts";
export { delGrossoMaderSoundSpeed, marczakSoundSpeed } from "./polynomials.ts";
export { iapws2008Viscosity } from "./viscosity.ts";
export { saturationPressure as waterSaturationPressure } from "./saturation.ts";
export { verifyWaterTable, WATER_VERIFICATION_TABLES, type WaterCheck } from "./verify.ts";
