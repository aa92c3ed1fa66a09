/**
 * A rough signal budget of a clamp-on path: absorption in the liquid, attenuation in wedge, wall
 * and lining, and transmission losses at each interface, summed in dB.
 *
 * @module
 */
import {
  checkRange,
  InputError,
  OutOfRangeError,
  requireFinite,
  type ValidityOptions,
  type Warning,
} from "../errors.ts";
import { defaultRegistry } from "../registry/mod.ts";
import { waterDensity, waterSoundSpeed, waterViscosity } from "../water/mod.ts";
import { saturationPressureUnchecked } from "../water/saturation.ts";
import { trace, type TraceEntry } from "../trace.ts";
import { practiceThreshold } from "./doppler.ts";
import type { ClampOnPath } from "./path.ts";

const NP_TO_DB = 20 / Math.LN10; // 8.686 dB per neper
const ATM = 101325;
const FS_ID = "fisher-simmons-1977-pure-water";

interface FsCoefficients {
  readonly a: readonly number[];
  readonly b: readonly number[];
  readonly scale: number;
  readonly tRange: readonly [number, number];
  readonly pRange: readonly [number, number];
}
let fs: FsCoefficients | undefined;

function fsCoefficients(): FsCoefficients {
  if (fs) return fs;
  const c = defaultRegistry().coefficients(FS_ID);
  fs = {
    a: c.coefficients.a,
    b: c.coefficients.b,
    scale: c.constants.scale,
    // Validity in the file is in degC / atm gauge: kept here as the file states it.
    tRange: [0, 30],
    pRange: [0, 600],
  };
  return fs;
}

/**
 * Sound absorption coefficient of pure (fresh) water, Fisher & Simmons (1977) pure-water term.
 *
 * Method: α = A3·P3·f² with A3 = (55.9 − 2.37·t + 4.77e-2·t² − 3.48e-4·t³)·1e-15 Np·s²/m
 * (t in °C) and P3 = 1 − 3.84e-4·P + 7.57e-8·P² (P gauge pressure in atm); coefficients from the
 * registry entry `fisher-simmons-1977-pure-water`. Stated uncertainty 4 %.
 *
 * @param frequency f, Hz (> 0)
 * @param temperature T, K; valid 273.15–303.15 K (0–30 °C)
 * @param pressure absolute pressure, Pa (default 101325); valid up to 600 atm gauge
 * @param options extrapolate outside the range (a warning is pushed). Above 30 °C the
 *   extrapolation carries the 30 °C value by the classical viscous trend μ/(ρc³) of water
 *   (IAPWS 2008 viscosity, IAPWS-95 density and sound speed), stated ±25 %; below 0 °C the
 *   cubic is used as it stands; a non-positive value always throws
 * @returns α, Np/m
 * @throws {OutOfRangeError} outside the validity range unless extrapolating
 *
 * Source: fisher-simmons-1977.
 *
 * @example
 * ```ts
 * import { waterAbsorption } from "./budget.ts";
 * const a = waterAbsorption(1e6, 293.15);
 * if (Math.abs(a / 1e12 / 24.796e-15 - 1) > 1e-3) throw new Error(String(a));
 * ```
 */
export function waterAbsorption(
  frequency: number,
  temperature: number,
  pressure = ATM,
  options?: ValidityOptions,
): number {
  requireFinite("frequency", frequency, "Hz", true);
  requireFinite("temperature", temperature, "K", true);
  requireFinite("pressure", pressure, "Pa", true);
  const c = fsCoefficients();
  const formulation = "Fisher & Simmons 1977 pure-water absorption";
  checkRange(
    "temperature",
    temperature,
    [c.tRange[0] + 273.15, c.tRange[1] + 273.15],
    "K",
    formulation,
    options,
  );
  const P = (pressure - ATM) / ATM;
  checkRange(
    "pressure",
    pressure,
    [ATM + c.pRange[0] * ATM, ATM + c.pRange[1] * ATM],
    "Pa",
    formulation,
    options,
  );
  const t = temperature - 273.15;
  const a = c.a;
  const cubic = (tc: number) => (a[0] + tc * (a[1] + tc * (a[2] + tc * a[3]))) * c.scale;
  const P3 = 1 + P * (c.b[0] + P * c.b[1]);
  if (t > c.tRange[1]) {
    // Above the measured range the cubic soon turns wrong (negative near 75 °C); the caller
    // opted in to extrapolate (checkRange let it through), so follow the classical trend.
    const ratio = classicalTrend(temperature, pressure) /
      classicalTrend(c.tRange[1] + 273.15, pressure);
    options?.warnings?.push({
      code: "extrapolated-absorption",
      message: `water absorption at ${t.toFixed(1)} °C: Fisher & Simmons 1977 holds to ` +
        `${c.tRange[1]} °C; beyond it its value at ${c.tRange[1]} °C is carried by the ` +
        `classical viscous trend μ/(ρc³) (IAPWS 2008, IAPWS-95), ±${
          Math.round(100 * EXTRAPOLATED_ABSORPTION_SPREAD)
        } % (estimate)`,
    });
    return cubic(c.tRange[1]) * ratio * P3 * frequency * frequency;
  }
  const A3 = cubic(t);
  const alpha = A3 * P3 * frequency * frequency;
  if (!(alpha > 0)) {
    throw new OutOfRangeError(
      "temperature",
      temperature,
      [c.tRange[0] + 273.15, c.tRange[1] + 273.15],
      "K",
      formulation + " (extrapolation gives no positive absorption)",
    );
  }
  return alpha;
}

/**
 * Relative spread stated for the water absorption above 30 °C, where it follows the classical
 * viscous trend (judgement: the ratio of bulk to shear viscosity is held at its 30 °C value,
 * while measurements show it falling slowly with temperature). Common practice / estimate.
 */
export const EXTRAPOLATED_ABSORPTION_SPREAD = 0.25;

/**
 * The temperature trend of classical (viscous) absorption, α/f² ∝ (4/3·μ + μ_B)/(ρc³), with
 * μ_B/μ held constant: μ/(ρc³) of water by IAPWS 2008 and IAPWS-95. Evaluated in the liquid:
 * where the given pressure would boil the water (a liquid other than water, or a sweep), at
 * 1.5 × the saturation pressure; above 623 K at 623 K.
 */
function classicalTrend(T: number, p: number): number {
  const Tl = Math.min(T, 623);
  const pl = Math.max(p, 1.5 * saturationPressureUnchecked(Tl));
  const rho = waterDensity(Tl, pl);
  const c = waterSoundSpeed(Tl, pl);
  return waterViscosity(Tl, pl) / (rho * c * c * c);
}

/**
 * Intensity transmission coefficient at normal incidence between two media:
 * T = 4·Z₁·Z₂ / (Z₁ + Z₂)², with Z = ρ·c. Same in both directions.
 *
 * @param z1 acoustic impedance of the first medium, Pa·s/m (> 0)
 * @param z2 acoustic impedance of the second medium, Pa·s/m (> 0)
 * @returns T in (0, 1]
 *
 * Source: kinsler-2000 (normal-incidence transmission).
 *
 * @example
 * ```ts
 * import { intensityTransmission } from "./budget.ts";
 * if (intensityTransmission(1.5e6, 1.5e6) !== 1) throw new Error();
 * ```
 */
export function intensityTransmission(z1: number, z2: number): number {
  requireFinite("z1", z1, "Pa s/m", true);
  requireFinite("z2", z2, "Pa s/m", true);
  return 4 * z1 * z2 / ((z1 + z2) * (z1 + z2));
}

/** Attenuation of a material at a reference frequency (as material entries give it). */
export interface StatedAttenuation {
  /** Attenuation coefficient, Np/m, at `frequency`. */
  readonly value: number;
  /** Frequency it was stated at, Hz. */
  readonly frequency: number;
}

/** One medium of the budget: density and, when known, attenuation. */
export interface BudgetMedium {
  /** Density, kg/m³. */
  readonly density: number;
  /** Attenuation at a reference frequency; scaled linearly with frequency. */
  readonly attenuation?: StatedAttenuation;
}

/** One term of the budget. */
export interface BudgetTerm {
  /** What it is. */
  readonly name: string;
  /** Loss, dB (positive = loss). */
  readonly dB: number;
  /** Model used. */
  readonly model: string;
}

/** Result of {@link signalBudget}. */
export interface SignalBudget {
  /** Every term. */
  readonly terms: readonly BudgetTerm[];
  /** Sum of the terms, dB. */
  readonly totalDb: number;
  /** `adequate` below the marginal threshold, `marginal`, or `weak` at and above the weak one. */
  readonly rating: "adequate" | "marginal" | "weak";
  /** Thresholds used, dB (common practice). */
  readonly thresholds: { readonly marginal: number; readonly weak: number };
  /** What the budget leaves out. */
  readonly notModelled: readonly string[];
  /** Warnings (extrapolation, unknown attenuation). */
  readonly warnings: readonly Warning[];
  /** Constants and formulations used. */
  readonly trace: readonly TraceEntry[];
}

/**
 * A rough signal budget of a clamp-on path, in dB.
 *
 * Model (stated): (1) absorption in the liquid over the liquid path: the given `absorption`
 * (Np/m at `frequency`), else water by Fisher & Simmons 1977 ({@link waterAbsorption}) at
 * `temperature`; (2) attenuation in wedge, wall and lining over their path lengths, the stated
 * coefficient scaled linearly with frequency (common practice for solids and polymers);
 * unknown attenuation counts 0 and warns; (3) normal-incidence intensity transmission at each
 * interface, wedge → wall → lining(s) → liquid and back out, Z = ρ·c with the speed of the mode
 * carried (shear in the wall when the path uses it); oblique-incidence and mode-conversion
 * factors, beam spreading, couplant and electrical losses are not modelled. Rating: marginal at
 * 40 dB, weak at 60 dB (common practice, data/acoustics/practice-thresholds.yaml).
 *
 * @param path a path from {@link clampOnPath}
 * @param media `frequency` Hz; `temperature` K (water absorption); `pressure` Pa absolute;
 *   `liquid` `{ density, absorption? }` (absorption Np/m at `frequency`); `wedge`, `wall`:
 *   {@link BudgetMedium}; `lining`: one per lining layer
 * @param options validity options for the water absorption
 * @returns the terms, total, rating, what is not modelled, warnings and trace
 * @throws {InputError} on a bad input; {@link OutOfRangeError} outside the water range
 *
 * Sources: fisher-simmons-1977, kinsler-2000, common-practice.
 *
 * @example
 * ```ts
 * import { clampOnPath } from "./path.ts";
 * import { signalBudget } from "./budget.ts";
 * const p = clampOnPath({ outsideDiameter: 0.1143, wallThickness: 0.00602,
 *   wallSoundSpeed: 5920, wallShearSpeed: 3230, fluidSoundSpeed: 1482,
 *   wedgeSoundSpeed: 2720, wedgeAngle: 38 * Math.PI / 180, traverses: 2 });
 * const b = signalBudget(p, { frequency: 1e6, temperature: 293.15,
 *   liquid: { density: 998 }, wedge: { density: 1180 }, wall: { density: 7850 } });
 * if (b.rating !== "adequate") throw new Error(String(b.totalDb));
 * ```
 */
export function signalBudget(
  path: ClampOnPath,
  media: {
    readonly frequency: number;
    readonly temperature?: number;
    readonly pressure?: number;
    readonly liquid: { readonly density: number; readonly absorption?: number };
    readonly wedge: BudgetMedium;
    readonly wall: BudgetMedium;
    readonly lining?: readonly BudgetMedium[];
  },
  options?: ValidityOptions,
): SignalBudget {
  if (path === null || typeof path !== "object" || !Number.isFinite(path.fluidPathLength)) {
    throw new InputError("path", String(path), "a path from clampOnPath()");
  }
  const f = requireFinite("frequency", media?.frequency, "Hz", true);
  const warnings: Warning[] = options?.warnings ?? [];
  const opts: ValidityOptions = { extrapolate: options?.extrapolate, warnings };
  const tr: TraceEntry[] = [];
  const terms: BudgetTerm[] = [];
  const rhoL = requireFinite("liquid.density", media.liquid?.density, "kg/m^3", true);
  const rhoW = requireFinite("wedge.density", media.wedge?.density, "kg/m^3", true);
  const rhoP = requireFinite("wall.density", media.wall?.density, "kg/m^3", true);
  const layers = path.lining;
  const lm = media.lining ?? [];
  if (lm.length !== layers.length) {
    throw new InputError("lining", `${lm.length} media`, `${layers.length} (one per lining layer)`);
  }

  // (1) liquid absorption
  let alpha: number;
  if (media.liquid.absorption !== undefined) {
    alpha = requireFinite("liquid.absorption", media.liquid.absorption, "Np/m");
    if (alpha < 0) throw new InputError("liquid.absorption", String(alpha), "0 Np/m or more");
    tr.push(trace("liquid absorption", alpha, "Np/m", "input", "input"));
  } else {
    const T = requireFinite("temperature", media.temperature as number, "K", true);
    alpha = waterAbsorption(f, T, media.pressure ?? ATM, opts);
    tr.push(
      trace(
        "formulation: water absorption",
        "Fisher & Simmons 1977",
        "",
        "fisher-simmons-1977",
        "transcribed",
      ),
    );
  }
  terms.push({
    name: "liquid absorption",
    dB: NP_TO_DB * alpha * path.fluidPathLength,
    model: media.liquid.absorption !== undefined
      ? "given α × liquid path"
      : "Fisher & Simmons 1977",
  });

  // (2) material attenuation
  const att = (name: string, m: BudgetMedium, length: number) => {
    if (length === 0) return;
    if (m.attenuation === undefined) {
      warnings.push({
        code: "attenuation-unknown",
        message: `${name}: attenuation unknown, counted as 0 dB`,
      });
      return;
    }
    const a0 = requireFinite(`${name}.attenuation.value`, m.attenuation.value, "Np/m");
    const f0 = requireFinite(`${name}.attenuation.frequency`, m.attenuation.frequency, "Hz", true);
    if (a0 < 0) throw new InputError(`${name}.attenuation.value`, String(a0), "0 Np/m or more");
    terms.push({
      name: `${name} attenuation`,
      dB: NP_TO_DB * a0 * (f / f0) * length,
      model: "stated α scaled linearly with frequency (common practice)",
    });
  };
  if (path.wedgeTime !== undefined) {
    att("wedge", media.wedge, path.wedgeTime * path.wedgeSoundSpeed);
  }
  att("wall", media.wall, path.wallTime * path.wallModeSpeed);
  layers.forEach((l, i) => {
    att(`lining[${i}]`, lm[i], 2 * l.thickness / Math.cos(path.liningAngles[i]));
  });

  // (3) interfaces, in and out
  const Z: { name: string; z: number }[] = [
    { name: "wedge", z: rhoW * path.wedgeSoundSpeed },
    { name: `wall (${path.wallMode})`, z: rhoP * path.wallModeSpeed },
  ];
  layers.forEach((l, i) => {
    Z.push({
      name: `lining[${i}]`,
      z: requireFinite(`lining[${i}].density`, lm[i]?.density, "kg/m^3", true) * l.soundSpeed,
    });
  });
  Z.push({ name: "liquid", z: rhoL * path.fluidSoundSpeed });
  for (let i = 0; i + 1 < Z.length; i++) {
    const T = intensityTransmission(Z[i].z, Z[i + 1].z);
    terms.push({
      name: `${Z[i].name} / ${Z[i + 1].name} interface, in and out`,
      dB: -2 * 10 * Math.log10(T),
      model: "normal-incidence intensity transmission 4·Z1·Z2/(Z1+Z2)²",
    });
  }
  tr.push(
    trace("interface model", "normal-incidence transmission", "", "kinsler-2000", "recalled"),
  );

  let total = 0;
  for (const t of terms) total += t.dB;
  const marginal = practiceThreshold("budget-marginal-loss");
  const weak = practiceThreshold("budget-weak-loss");
  tr.push(trace("budget marginal threshold", marginal, "dB", "common-practice", "common-practice"));
  tr.push(trace("budget weak threshold", weak, "dB", "common-practice", "common-practice"));
  return {
    terms,
    totalDb: total,
    rating: total >= weak ? "weak" : total >= marginal ? "marginal" : "adequate",
    thresholds: { marginal, weak },
    notModelled: [
      "beam spreading",
      "oblique-incidence and mode-conversion transmission factors",
      "couplant layers",
      "transducer and electronics gain",
      "scattering by solids or bubbles",
    ],
    warnings,
    trace: tr,
  };
}
