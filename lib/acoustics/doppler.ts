/**
 * Doppler shift of a clamp-on beam, and a rough screening of which technique (transit time or
 * Doppler) a stated solids or gas content favours.
 *
 * @module
 */
import { InputError, requireFinite } from "../errors.ts";
import { defaultRegistry } from "../registry/mod.ts";

/**
 * Doppler shift of sound scattered back by particles moving at an axial velocity.
 *
 * Method: Δf = 2·f·v·sin θ_f / c_f; by Snell's law sin θ_f / c_f = sin θ_w / c_w, so
 * Δf = 2·f·v·sin θ_w / c_w: the liquid's sound speed drops out.
 *
 * @param p `frequency` Hz (> 0), `velocity` m/s (axial velocity of the scatterers, signed),
 *   `wedgeSoundSpeed` m/s (> 0), `wedgeAngle` rad in (0, π/2)
 * @returns the shift, Hz (positive for a positive velocity)
 * @throws {InputError} on a bad input
 *
 * Source: Doppler effect and Snell's law (kinsler-2000).
 *
 * @example
 * ```ts
 * import { dopplerShift } from "./doppler.ts";
 * const df = dopplerShift({ frequency: 1e6, velocity: 1, wedgeSoundSpeed: 2720,
 *   wedgeAngle: 38 * Math.PI / 180 });
 * if (Math.abs(df - 452.69) > 0.01) throw new Error(String(df));
 * ```
 */
export function dopplerShift(p: {
  readonly frequency: number;
  readonly velocity: number;
  readonly wedgeSoundSpeed: number;
  readonly wedgeAngle: number;
}): number {
  const f = requireFinite("frequency", p?.frequency, "Hz", true);
  const v = requireFinite("velocity", p.velocity, "m/s");
  const cw = requireFinite("wedgeSoundSpeed", p.wedgeSoundSpeed, "m/s", true);
  const a = requireFinite("wedgeAngle", p.wedgeAngle, "rad", true);
  if (!(a < Math.PI / 2)) {
    throw new InputError("wedgeAngle", String(a), "an angle between 0 and 90 deg (in rad)");
  }
  return 2 * f * v * Math.sin(a) / cw;
}

/** Result of {@link techniqueScreening}. */
export interface TechniqueScreening {
  /** `transit-time`, `doppler`, or `either` (both may work; transit time is the more accurate). */
  readonly favours: "transit-time" | "doppler" | "either";
  /** One line per reason. */
  readonly reasons: readonly string[];
  /** The thresholds used (fractions by volume), all common practice. */
  readonly thresholds: {
    readonly transitTimeMaxSolids: number;
    readonly transitTimeMaxGas: number;
    readonly dopplerMinReflectors: number;
  };
  /** Source id of the thresholds. */
  readonly source: string;
}

let cachedThresholds: TechniqueScreening["thresholds"] | undefined;

/**
 * Threshold value by name from the registry table `acoustics-practice-thresholds`.
 *
 * @param name the row name, for example `budget-weak-loss`
 * @returns the value (unit in the table)
 *
 * @example
 * ```ts
 * import { practiceThreshold } from "./doppler.ts";
 * if (!(practiceThreshold("budget-weak-loss") > practiceThreshold("budget-marginal-loss"))) {
 *   throw new Error();
 * }
 * ```
 */
export function practiceThreshold(name: string): number {
  const t = defaultRegistry().table("acoustics-practice-thresholds");
  const row = (t.rows as { name: string; value: number }[]).find((r) => r.name === name);
  if (!row) throw new InputError("threshold", name, "a row of acoustics-practice-thresholds");
  return row.value;
}

/**
 * Which clamp-on technique a stated content of suspended solids or gas favours.
 *
 * Method (common practice, thresholds in data/acoustics/practice-thresholds.yaml): transit time
 * needs a beam that crosses the liquid, so it tolerates solids up to about 2 % and gas up to
 * about 1 % by volume; Doppler needs scatterers, at least about 100 ppm by volume. Within the
 * transit-time limits and above the Doppler minimum: `either`; beyond a transit-time limit:
 * `doppler`; below the Doppler minimum: `transit-time`.
 *
 * @param content `solidsFraction`, `gasFraction`: fractions by volume in [0, 1] (default 0)
 * @returns what is favoured, with reasons and the thresholds
 * @throws {InputError} on a fraction outside [0, 1]
 *
 * Source: `common-practice`.
 *
 * @example
 * ```ts
 * import { techniqueScreening } from "./doppler.ts";
 * if (techniqueScreening({ gasFraction: 0.05 }).favours !== "doppler") throw new Error();
 * if (techniqueScreening({}).favours !== "transit-time") throw new Error();
 * ```
 */
export function techniqueScreening(
  content: { readonly solidsFraction?: number; readonly gasFraction?: number },
): TechniqueScreening {
  const s = fraction("solidsFraction", content?.solidsFraction ?? 0);
  const g = fraction("gasFraction", content.gasFraction ?? 0);
  const th = cachedThresholds ??= {
    transitTimeMaxSolids: practiceThreshold("transit-time-max-solids-fraction"),
    transitTimeMaxGas: practiceThreshold("transit-time-max-gas-fraction"),
    dopplerMinReflectors: practiceThreshold("doppler-min-reflector-fraction"),
  };
  const reasons: string[] = [];
  const pct = (x: number) => `${Number((x * 100).toPrecision(3))} %`;
  const ttOk = s <= th.transitTimeMaxSolids && g <= th.transitTimeMaxGas;
  if (s > th.transitTimeMaxSolids) {
    reasons.push(`solids ${pct(s)} exceed ${pct(th.transitTimeMaxSolids)}: the beam is scattered`);
  }
  if (g > th.transitTimeMaxGas) {
    reasons.push(`gas ${pct(g)} exceeds ${pct(th.transitTimeMaxGas)}: the beam is scattered`);
  }
  const dopplerOk = s + g >= th.dopplerMinReflectors;
  if (!dopplerOk) {
    reasons.push(
      `reflectors ${pct(s + g)} below ${pct(th.dopplerMinReflectors)}: too few for Doppler`,
    );
  }
  let favours: TechniqueScreening["favours"];
  if (!ttOk) favours = "doppler";
  else if (!dopplerOk) favours = "transit-time";
  else {
    favours = "either";
    reasons.push(
      "within transit-time limits and enough reflectors for Doppler; " +
        "transit time is the more accurate where its signal holds",
    );
  }
  return { favours, reasons, thresholds: th, source: "common-practice" };
}

function fraction(field: string, x: number): number {
  if (typeof x !== "number" || !Number.isFinite(x) || x < 0 || x > 1) {
    throw new InputError(field, String(x), "a fraction by volume from 0 to 1");
  }
  return x;
}
