/**
 * The `water` namespace: sound speed, density and viscosity of liquid water at (T, p) by named
 * formulation, with validity ranges, the boiling check and traces for reports.
 *
 * @module
 */
import { checkRange, InputError, NoPhysicalAnswerError, type ValidityOptions } from "../errors.ts";
import { trace, type TraceEntry } from "../trace.ts";
import { WATER_COEFFICIENT_IDS } from "./coefficients.ts";
import {
  IAPWS95_LIQUID_RANGE,
  IAPWS95_NAME,
  iapws95DensityUnchecked,
  iapws95SoundSpeedUnchecked,
} from "./iapws95.ts";
import { IF97_NAME, IF97_REGION1_RANGE, if97Region1Unchecked } from "./if97.ts";
import {
  DEL_GROSSO_MADER_NAME,
  delGrossoMaderSoundSpeed,
  MARCZAK_NAME,
  marczakSoundSpeed,
  POLYNOMIAL_RANGE,
} from "./polynomials.ts";
import { iapws2008ViscosityUnchecked, VISCOSITY_NAME } from "./viscosity.ts";
import { assertLiquid, saturationPressure } from "./saturation.ts";

/** Names of the water formulations. */
export type WaterFormulation = "iapws95" | "if97" | "del-grosso-mader" | "marczak";

/** Standard atmosphere, Pa: the default pressure. */
export const STANDARD_ATMOSPHERE = 101325;

/** Pressure band accepted by the 1-atm polynomials, Pa (the pressure effect on c here is < 0.03 m/s). */
export const POLYNOMIAL_PRESSURE_RANGE: readonly [number, number] = [90e3, 110e3];

/** One formulation: its name, source, what it gives and where it is valid (SI). */
export interface WaterFormulationInfo {
  /** Key used in the API. */
  readonly id: WaterFormulation;
  /** Published name. */
  readonly name: string;
  /** Source id in data/sources.yaml. */
  readonly source: string;
  /** Registry id of its coefficient set. */
  readonly coefficients: string;
  /** Basis of the coefficients. */
  readonly basis: "transcribed" | "recalled";
  /** Properties it provides. */
  readonly provides: readonly ("soundSpeed" | "density")[];
  /** Temperature validity, K. */
  readonly temperature: readonly [number, number];
  /** Pressure validity, Pa (the liquid side of saturation is also required). */
  readonly pressure: readonly [number, number];
}

/** The water formulations with their validity ranges in SI units. */
export const waterFormulations: readonly WaterFormulationInfo[] = Object.freeze(
  [
    {
      id: "iapws95",
      name: IAPWS95_NAME,
      source: "iapws-r6-95",
      coefficients: WATER_COEFFICIENT_IDS.iapws95,
      basis: "transcribed",
      provides: ["soundSpeed", "density"],
      temperature: IAPWS95_LIQUID_RANGE.temperature,
      pressure: [0, IAPWS95_LIQUID_RANGE.pressure[1]],
    },
    {
      id: "if97",
      name: IF97_NAME,
      source: "iapws-r7-97",
      coefficients: WATER_COEFFICIENT_IDS.if97,
      basis: "transcribed",
      provides: ["soundSpeed", "density"],
      temperature: IF97_REGION1_RANGE.temperature,
      pressure: IF97_REGION1_RANGE.pressure,
    },
    {
      id: "del-grosso-mader",
      name: DEL_GROSSO_MADER_NAME,
      source: "del-grosso-mader-1972",
      coefficients: WATER_COEFFICIENT_IDS.delGrossoMader,
      basis: "transcribed",
      provides: ["soundSpeed"],
      temperature: POLYNOMIAL_RANGE,
      pressure: POLYNOMIAL_PRESSURE_RANGE,
    },
    {
      id: "marczak",
      name: MARCZAK_NAME,
      source: "marczak-1997",
      coefficients: WATER_COEFFICIENT_IDS.marczak,
      basis: "transcribed",
      provides: ["soundSpeed"],
      temperature: POLYNOMIAL_RANGE,
      pressure: POLYNOMIAL_PRESSURE_RANGE,
    },
  ] as const,
);

const BY_ID = new Map(waterFormulations.map((f) => [f.id as string, f]));

function formulationInfo(formulation: string): WaterFormulationInfo {
  const f = BY_ID.get(formulation);
  if (!f) {
    throw new InputError(
      "formulation",
      JSON.stringify(formulation),
      `one of ${waterFormulations.map((x) => x.id).join(", ")}`,
    );
  }
  return f;
}

const OUT2 = new Float64Array(2);

function checked(value: number, what: string, T: number, p: number, name: string): number {
  if (!Number.isFinite(value) || !(value > 0)) {
    throw new NoPhysicalAnswerError(
      `${name} gives no finite ${what} at ${T} K, ${p} Pa (outside where it can be evaluated)`,
    );
  }
  return value;
}

function checkTp(
  f: WaterFormulationInfo,
  T: number,
  p: number,
  options?: ValidityOptions,
): void {
  checkRange("temperature", T, f.temperature, "K", f.name, options);
  checkRange("pressure", p, f.pressure, "Pa", f.name, options);
  assertLiquid(T, p);
}

/** IAPWS-95 density at (T, p) after the IAPWS-95 range and liquid-phase checks. */
function checkedLiquidDensity(T: number, p: number, options?: ValidityOptions): number {
  checkTp(formulationInfo("iapws95"), T, p, options);
  return iapws95DensityUnchecked(T, p);
}

/**
 * Speed of sound in liquid water at (T, p) by a named formulation: IAPWS-95 (default; density
 * by a Newton solve, then w from the Helmholtz derivatives), IAPWS-IF97 region 1, or the 1-atm
 * polynomials of Del Grosso & Mader (1972) and Marczak (1997).
 *
 * Validity: per formulation (see {@link waterFormulations}): IAPWS-95 273.15–647 K, up to
 * 100 MPa; IF97 273.15–623.15 K, up to 100 MPa; polynomials 0–95 °C at 90–110 kPa. Outside,
 * OutOfRangeError naming the formulation (unless `options.extrapolate`, then a warning).
 * Below the saturation pressure, NoPhysicalAnswerError "water boils at this pressure: …".
 * Sources: iapws-r6-95, iapws-r7-97, del-grosso-mader-1972, marczak-1997, wagner-pruss-1993.
 *
 * @param T temperature, K (ITS-90)
 * @param p absolute pressure, Pa (default 101325)
 * @param formulation "iapws95" (default) | "if97" | "del-grosso-mader" | "marczak"
 * @param options extrapolation opt-in and warning sink
 * @returns speed of sound, m/s
 *
 * @example
 * ```ts
 * import { waterSoundSpeed } from "./water.ts";
 * const w = waterSoundSpeed(293.15);
 * if (Math.abs(w - 1482.35) > 0.05) throw new Error(String(w));
 * ```
 */
export function waterSoundSpeed(
  T: number,
  p: number = STANDARD_ATMOSPHERE,
  formulation: WaterFormulation = "iapws95",
  options?: ValidityOptions,
): number {
  const f = formulationInfo(formulation);
  checkTp(f, T, p, options);
  let w: number;
  switch (f.id) {
    case "iapws95":
      w = iapws95SoundSpeedUnchecked(T, iapws95DensityUnchecked(T, p));
      break;
    case "if97":
      if97Region1Unchecked(T, p, OUT2);
      w = OUT2[0];
      break;
    case "del-grosso-mader":
      w = delGrossoMaderSoundSpeed(T, { extrapolate: true });
      break;
    case "marczak":
      w = marczakSoundSpeed(T, { extrapolate: true });
      break;
  }
  return checked(w, "sound speed", T, p, f.name);
}

/**
 * Density of liquid water at (T, p): IAPWS-95 (default; Newton solve of p(T, ρ) on the liquid
 * branch) or IAPWS-IF97 region 1 (ρ = 1/v). The sound-speed polynomials give no density and are
 * refused with an InputError.
 *
 * Validity: as {@link waterSoundSpeed}. Sources: iapws-r6-95, iapws-r7-97, wagner-pruss-1993.
 *
 * @param T temperature, K (ITS-90)
 * @param p absolute pressure, Pa (default 101325)
 * @param formulation "iapws95" (default) | "if97"
 * @param options extrapolation opt-in and warning sink
 * @returns density, kg/m³
 *
 * @example
 * ```ts
 * import { waterDensity } from "./water.ts";
 * const rho = waterDensity(277.13); // near the density maximum
 * if (Math.abs(rho - 999.975) > 0.005) throw new Error(String(rho));
 * ```
 */
export function waterDensity(
  T: number,
  p: number = STANDARD_ATMOSPHERE,
  formulation: WaterFormulation = "iapws95",
  options?: ValidityOptions,
): number {
  const f = formulationInfo(formulation);
  if (!f.provides.includes("density")) {
    throw new InputError(
      "formulation",
      JSON.stringify(formulation),
      "iapws95 or if97 for density (the sound-speed polynomials give no density)",
    );
  }
  checkTp(f, T, p, options);
  let rho: number;
  if (f.id === "iapws95") rho = iapws95DensityUnchecked(T, p);
  else {
    if97Region1Unchecked(T, p, OUT2);
    rho = OUT2[1];
  }
  return checked(rho, "density", T, p, f.name);
}

/**
 * Dynamic viscosity of liquid water at (T, p): IAPWS 2008 (industrial form, μ₂ = 1) with the
 * density from IAPWS-95.
 *
 * Validity: liquid, 273.15–647 K, p_sat(T) ≤ p ≤ 100 MPa (the IAPWS-95 liquid range).
 * Sources: iapws-r12-08, iapws-r6-95.
 *
 * @param T temperature, K (ITS-90)
 * @param p absolute pressure, Pa (default 101325)
 * @param options extrapolation opt-in and warning sink
 * @returns dynamic viscosity, Pa·s
 *
 * @example
 * ```ts
 * import { waterViscosity } from "./water.ts";
 * const mu = waterViscosity(293.15);
 * if (Math.abs(mu - 1.0016e-3) > 2e-6) throw new Error(String(mu));
 * ```
 */
export function waterViscosity(
  T: number,
  p: number = STANDARD_ATMOSPHERE,
  options?: ValidityOptions,
): number {
  const rho = checkedLiquidDensity(T, p, options);
  return checked(iapws2008ViscosityUnchecked(T, rho), "viscosity", T, p, VISCOSITY_NAME);
}

/**
 * Kinematic viscosity of liquid water at (T, p): ν = μ/ρ with μ from IAPWS 2008 (industrial
 * form) and ρ from IAPWS-95.
 *
 * Validity: as {@link waterViscosity}. Sources: iapws-r12-08, iapws-r6-95.
 *
 * @param T temperature, K (ITS-90)
 * @param p absolute pressure, Pa (default 101325)
 * @param options extrapolation opt-in and warning sink
 * @returns kinematic viscosity, m²/s
 *
 * @example
 * ```ts
 * import { waterKinematicViscosity } from "./water.ts";
 * const nu = waterKinematicViscosity(293.15);
 * if (Math.abs(nu - 1.0034e-6) > 3e-9) throw new Error(String(nu));
 * ```
 */
export function waterKinematicViscosity(
  T: number,
  p: number = STANDARD_ATMOSPHERE,
  options?: ValidityOptions,
): number {
  const rho = checkedLiquidDensity(T, p, options);
  return checked(
    iapws2008ViscosityUnchecked(T, rho) / rho,
    "kinematic viscosity",
    T,
    p,
    VISCOSITY_NAME,
  );
}

/** What {@link waterTrace} can describe: a formulation, the viscosity or the saturation check. */
export type WaterTraceSubject = WaterFormulation | "viscosity" | "saturation";

/**
 * Trace entries (formulation name, source id, basis) for a report line that used a water
 * formulation; viscosity also names IAPWS-95 for its density.
 *
 * @param formulation a formulation id, "viscosity" or "saturation"
 * @returns trace entries, frozen
 *
 * @example
 * ```ts
 * import { waterTrace } from "./water.ts";
 * const t = waterTrace("del-grosso-mader");
 * if (t[0].source !== "del-grosso-mader-1972" || t[0].basis !== "transcribed") throw new Error();
 * ```
 */
export function waterTrace(formulation: WaterTraceSubject = "iapws95"): readonly TraceEntry[] {
  if (formulation === "viscosity") {
    return Object.freeze([
      trace("formulation", VISCOSITY_NAME, "", "iapws-r12-08", "transcribed"),
      trace("formulation", IAPWS95_NAME, "", "iapws-r6-95", "transcribed"),
    ]);
  }
  if (formulation === "saturation") {
    return Object.freeze([
      trace(
        "formulation",
        "Wagner-Pruss 1993 saturation pressure",
        "",
        "wagner-pruss-1993",
        "transcribed",
      ),
    ]);
  }
  const f = formulationInfo(formulation);
  const out = [trace("formulation", f.name, "", f.source, f.basis)];
  if (f.id === "del-grosso-mader") {
    out.push(trace("t68 from t90 factor", 1.00024, "", "saunders-1990", "transcribed"));
  }
  return Object.freeze(out);
}

/** Shape of the {@link water} namespace. */
export interface WaterNamespace {
  /** {@link waterSoundSpeed}: m/s at (T K, p Pa). */
  readonly soundSpeed: typeof waterSoundSpeed;
  /** {@link waterDensity}: kg/m³ at (T K, p Pa). */
  readonly density: typeof waterDensity;
  /** {@link waterViscosity}: Pa·s at (T K, p Pa). */
  readonly viscosity: typeof waterViscosity;
  /** {@link waterKinematicViscosity}: m²/s at (T K, p Pa). */
  readonly kinematicViscosity: typeof waterKinematicViscosity;
  /** Saturation pressure, Pa, at T K (Wagner–Pruß 1993 auxiliary equation). */
  readonly saturationPressure: typeof saturationPressure;
  /** The formulations with source and validity. */
  readonly formulations: readonly WaterFormulationInfo[];
  /** {@link waterTrace}: trace entries for reports. */
  readonly trace: typeof waterTrace;
}

/**
 * The water namespace: `water.soundSpeed`, `density`, `viscosity`, `kinematicViscosity`,
 * `saturationPressure`, `formulations`, `trace`.
 *
 * @example
 * ```ts
 * import { water } from "./water.ts";
 * if (water.formulations.length !== 4) throw new Error("formulations");
 * if (!(water.soundSpeed(300, 1e6) > 1500)) throw new Error("w");
 * ```
 */
export const water: WaterNamespace = Object.freeze({
  soundSpeed: waterSoundSpeed,
  density: waterDensity,
  viscosity: waterViscosity,
  kinematicViscosity: waterKinematicViscosity,
  saturationPressure,
  formulations: waterFormulations,
  trace: waterTrace,
});
