/**
 * Plain helpers of the schemas that the queries also use at run time, kept apart from the zod
 * schemas so that querying a loaded registry does not load zod.
 *
 * @module
 */
import { parseQuantity } from "../../units.ts";

/**
 * Parse a size label to inches (nominal): `"4"`, `"1/2"`, `"1-1/4"`.
 *
 * @param label the size label
 * @returns the nominal size, inches (NaN for a label that is not a size)
 *
 * @example
 * ```ts
 * import { sizeValue } from "./values.ts";
 * if (sizeValue("1-1/4") !== 1.25 || sizeValue("3/4") !== 0.75) throw new Error();
 * ```
 */
export function sizeValue(label: string): number {
  const m = /^(\d+)-(\d+)\/(\d+)$/.exec(label);
  if (m) return Number(m[1]) + Number(m[2]) / Number(m[3]);
  const f = /^(\d+)\/(\d+)$/.exec(label);
  if (f) return Number(f[1]) / Number(f[2]);
  return Number(label);
}

/**
 * Split a rate-of-change unit `<speed unit>/<temperature unit>` (`m/s/K`, `m/s/degC`,
 * `ft/s/degF`) into the SI factor that turns it into m/s per kelvin.
 *
 * @param unit the unit string
 * @returns factor to (m/s)/K, or undefined when not such a unit
 *
 * @example
 * ```ts
 * import { speedPerKelvinFactor } from "./values.ts";
 * if (speedPerKelvinFactor("m/s/K") !== 1) throw new Error("m/s/K");
 * if (Math.abs(speedPerKelvinFactor("ft/s/degF")! - 0.3048 * 1.8) > 1e-15) throw new Error();
 * ```
 */
export function speedPerKelvinFactor(unit: string): number | undefined {
  const m = /^(.+)\/\s*(K|degC|degF)$/.exec(unit.trim());
  if (!m) return undefined;
  let speed: number;
  try {
    speed = parseQuantity(`1 ${m[1]}`, "speed", "unit");
  } catch {
    return undefined;
  }
  return m[2] === "degF" ? speed * 9 / 5 : speed;
}
