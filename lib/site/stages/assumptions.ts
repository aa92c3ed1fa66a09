/**
 * Plan assumptions no site file states, and small helpers the plan stages share.
 *
 * @module
 */

/** Assumptions of the plan that no site file states: each is common practice or recalled. */
export const PLAN_ASSUMPTIONS = {
  /** Half-width of the wedge-angle uncertainty (machining and mounting), rad. */
  wedgeAngleHalfWidth: 0.2 * Math.PI / 180,
  /** Half-width of the wedge temperature's departure from the liquid's, K. */
  wedgeTemperatureHalfWidth: 2,
  /** Relative half-width of a wedge sound speed stated without a material, dimensionless. */
  statedWedgeSpeedRelative: 0.003,
  /** Relative half-width of a lining's thickness (linings are uneven), dimensionless. */
  liningThicknessRelative: 0.2,
  /** Relative half-width of a lining's sound speed when only its material is known. */
  liningSpeedRelative: 0.05,
  /** Half-width of a thickness-gauge reading, m. */
  gaugeHalfWidth: 0.1e-3,
  /** Half-width of a circumference taped round the pipe, m. */
  tapeHalfWidth: 1e-3,
  /** Half-width of an outside diameter measured with a caliper, m. */
  caliperHalfWidth: 0.5e-3,
  /** Half-width of the fixed delay (electronics, cables, couplant) after zero setting, s. */
  fixedDelayHalfWidth: 50e-9,
  /** Timing resolution assumed when the site states none, s. */
  defaultTimingResolution: 100e-12,
  /** Δt at minimum flow must exceed this multiple of the timing offset to count resolvable. */
  resolvableMultiple: 100,
  /** Outside-diameter half-width when the catalogue gives no tolerance, relative. */
  defaultOdRelative: 0.005,
} as const;

/** Trace wording and unit of each of {@link PLAN_ASSUMPTIONS}. */
export const ASSUMPTION_TEXT: Record<keyof typeof PLAN_ASSUMPTIONS, [string, string]> = {
  wedgeAngleHalfWidth: ["wedge angle uncertainty, half-width", "rad"],
  wedgeTemperatureHalfWidth: ["wedge temperature departure from the liquid's, half-width", "K"],
  statedWedgeSpeedRelative: ["stated wedge sound speed, relative half-width", ""],
  liningThicknessRelative: ["lining thickness, relative half-width", ""],
  liningSpeedRelative: ["lining sound speed from its material, relative half-width", ""],
  gaugeHalfWidth: ["thickness-gauge reading, half-width", "m"],
  tapeHalfWidth: ["circumference taped round the pipe, half-width", "m"],
  caliperHalfWidth: ["outside diameter by caliper, half-width", "m"],
  fixedDelayHalfWidth: ["fixed delay after zero setting, half-width", "s"],
  defaultTimingResolution: ["timing resolution when none is stated", "s"],
  resolvableMultiple: [
    "Δt at minimum flow over timing offset, least ratio to count resolvable",
    "",
  ],
  defaultOdRelative: ["outside diameter, relative half-width when no tolerance is known", ""],
};

/**
 * Half-width of a tolerance band: (|plus| + |minus|)/2, undefined when both are zero or absent.
 *
 * @param t tolerance, m (plus and minus as magnitudes or signed)
 * @returns half-width, m, or undefined
 * @example
 * ```ts
 * import { halfWidthTol } from "./assumptions.ts";
 * if (halfWidthTol({ plus: 1e-3, minus: 3e-3 }) !== 2e-3) throw new Error();
 * ```
 */
export function halfWidthTol(
  t: { plus?: number; minus?: number } | undefined,
): number | undefined {
  if (!t) return undefined;
  const p = t.plus ?? 0, m = t.minus ?? 0;
  const h = (Math.abs(p) + Math.abs(m)) / 2;
  return h > 0 ? h : undefined;
}

/**
 * Centre offset of a tolerance band: (|plus| − |minus|)/2, the distance from the nominal value
 * to the middle of [nominal − minus, nominal + plus] (JCGM 101:2008 §6.4.2.1); 0 when the band
 * is symmetric or absent. A side the standard leaves unlimited counts as 0 here, as in
 * {@link halfWidthTol}.
 *
 * @param t tolerance, m (plus and minus as magnitudes or signed)
 * @returns centre offset, m
 * @example
 * ```ts
 * import { centreOffsetTol } from "./assumptions.ts";
 * if (centreOffsetTol({ plus: 1e-3, minus: 3e-3 }) !== -1e-3) throw new Error();
 * if (centreOffsetTol(undefined) !== 0) throw new Error();
 * ```
 */
export function centreOffsetTol(t: { plus?: number; minus?: number } | undefined): number {
  if (!t) return 0;
  return (Math.abs(t.plus ?? 0) - Math.abs(t.minus ?? 0)) / 2;
}

/**
 * A length in m shown in mm to four significant figures.
 *
 * @param x length, m
 * @returns text such as `8.18 mm`
 * @example
 * ```ts
 * import { fmtMm } from "./assumptions.ts";
 * if (fmtMm(0.00818) !== "8.18 mm") throw new Error();
 * ```
 */
export function fmtMm(x: number): string {
  return `${Number((x * 1000).toPrecision(4))} mm`;
}

const MOUNTING_NAMES: Record<number, string> = { 1: "Z", 2: "V", 4: "W" };

/**
 * Name of a mounting by traverse count: Z, V, W (trade terms), else `N-traverse`.
 *
 * @param traverses traverse count
 * @returns the name
 * @example
 * ```ts
 * import { mountingName } from "./assumptions.ts";
 * if (mountingName(2) !== "V" || mountingName(3) !== "3-traverse") throw new Error();
 * ```
 */
export function mountingName(traverses: number): string {
  return MOUNTING_NAMES[traverses] ?? `${traverses}-traverse`;
}
