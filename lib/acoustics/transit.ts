/**
 * Transit times and their difference Δt along a clamp-on path; the inverse (path velocity from
 * measured times) in its exact, Snell-invariant and sound-speed forms with sensitivity
 * coefficients; Δt over a flow range; the smallest resolvable velocity; the wall-borne signal.
 *
 * @module
 */
import { InputError, NoPhysicalAnswerError, requireFinite } from "../errors.ts";
import type { ClampOnPath } from "./path.ts";

/** The parts of a path that transit times need (a {@link ClampOnPath} has them all). */
export type TransitPath = Pick<
  ClampOnPath,
  | "fluidPathLength"
  | "fluidAngle"
  | "fluidSoundSpeed"
  | "wallTime"
  | "liningTime"
  | "wedgeTime"
  | "snellInvariant"
  | "fluidTime"
>;

/** Transit times of one velocity, s. */
export interface TransitTimes {
  /** Path-averaged axial velocity, m/s (positive downstream). */
  readonly velocity: number;
  /** Upstream (against the flow) arrival time, s. */
  readonly upstream: number;
  /** Downstream (with the flow) arrival time, s. */
  readonly downstream: number;
  /** upstream − downstream, exact, s. */
  readonly deltaT: number;
  /** Linearised Δt ≈ 2·L·v·sin θ_f / c², s. */
  readonly deltaTLinear: number;
  /** (upstream + downstream) / 2, s. */
  readonly meanTime: number;
  /** Fixed time outside the liquid (wall, lining, wedge when known), s. */
  readonly fixedTime: number;
}

function fixedTime(p: TransitPath): number {
  return p.wallTime + p.liningTime + (p.wedgeTime ?? 0);
}

function checkPath(p: TransitPath): void {
  if (p === null || typeof p !== "object") {
    throw new InputError("path", String(p), "a path from clampOnPath()");
  }
  requireFinite("path.fluidPathLength", p.fluidPathLength, "m", true);
  requireFinite("path.fluidSoundSpeed", p.fluidSoundSpeed, "m/s", true);
  requireFinite("path.fluidAngle", p.fluidAngle, "rad", true);
}

/**
 * Upstream and downstream transit times and Δt for a path-averaged axial velocity.
 *
 * Method: along the liquid path of length L at angle θ_f the sound travels at c ± v·sin θ_f, so
 * t_up/down = t_fixed + L / (c ∓ v·sin θ_f) (exact, straight ray, the ray bending by the flow
 * neglected); Δt = 2·L·v·sin θ_f / (c² − v²·sin² θ_f); linearised Δt ≈ 2·L·v·sin θ_f / c²
 * (relative error (v·sin θ_f / c)²). The fixed part (wall, lining, wedge) does not depend on v.
 *
 * @param path a path from {@link clampOnPath} (SI)
 * @param velocity path-averaged axial velocity, m/s (|v·sin θ_f| < c)
 * @returns the times, s
 * @throws {InputError} on a non-finite velocity
 * @throws {NoPhysicalAnswerError} when |v·sin θ_f| ≥ c
 *
 * Source: acoustics of a moving medium (common derivation; no table needed).
 *
 * @example
 * ```ts
 * import { clampOnPath } from "./path.ts";
 * import { transitTimes } from "./transit.ts";
 * const p = clampOnPath({ outsideDiameter: 0.1143, wallThickness: 0.00602,
 *   wallSoundSpeed: 5920, wallShearSpeed: 3230, fluidSoundSpeed: 1482,
 *   wedgeSoundSpeed: 2720, wedgeAngle: 38 * Math.PI / 180, traverses: 2 });
 * const t = transitTimes(p, 1);
 * if (!(t.deltaT > 0 && t.upstream > t.downstream)) throw new Error();
 * if (Math.abs(t.deltaT / t.deltaTLinear - 1) > 1e-6) throw new Error("second order");
 * ```
 */
export function transitTimes(path: TransitPath, velocity: number): TransitTimes {
  checkPath(path);
  requireFinite("velocity", velocity, "m/s");
  const L = path.fluidPathLength;
  const c = path.fluidSoundSpeed;
  const vs = velocity * Math.sin(path.fluidAngle);
  if (!(Math.abs(vs) < c)) {
    throw new NoPhysicalAnswerError(
      `velocity ${velocity} m/s: its component along the beam reaches the sound speed ${c} m/s`,
    );
  }
  const tf = fixedTime(path);
  const upstream = tf + L / (c - vs);
  const downstream = tf + L / (c + vs);
  const out = {
    velocity,
    upstream,
    downstream,
    deltaT: 2 * L * vs / (c * c - vs * vs),
    deltaTLinear: 2 * L * vs / (c * c),
    meanTime: 0.5 * (upstream + downstream),
    fixedTime: tf,
  };
  const fin = Number.isFinite;
  if (!fin(out.deltaT) || !fin(out.deltaTLinear) || !fin(out.meanTime) || !fin(tf)) {
    // Finite inputs can still overflow (a path of 1e308 m): refuse rather than return ±Infinity.
    throw new InputError(
      "path",
      `a path whose times overflow (liquid path ${L} m, fixed time ${tf} s)`,
      "a path from clampOnPath() of a real mounting",
    );
  }
  return out;
}

/** Relative sensitivity coefficients ∂v/∂x · x/v of a velocity form. */
export type VelocitySensitivities = Readonly<Record<string, number>>;

/** The path velocity from measured times, in three forms. */
export interface PathVelocity {
  /** Exact inverse: v = L/(2 sin θ_f) · (1/τ_dn − 1/τ_up), m/s. */
  readonly velocity: number;
  /** Liquid-path times τ_up, τ_dn (measured less the fixed time), s. */
  readonly liquidTimes: { readonly upstream: number; readonly downstream: number };
  /** Snell-invariant form v = c_w/(2 sin θ_w) · Δt/τ (τ = mean liquid time): no liquid speed. */
  readonly snellInvariant: {
    readonly velocity: number;
    readonly sensitivity: VelocitySensitivities;
  };
  /** Sound-speed form v = c_f²·Δt / (2·N·D·tan θ_f), with θ_f from Snell's law. */
  readonly soundSpeedForm: {
    readonly velocity: number;
    readonly sensitivity: VelocitySensitivities;
  };
  /** Liquid sound speed implied by the times, c = L·(1/τ_up + 1/τ_dn)/2 (exact), m/s. */
  readonly impliedSoundSpeed: number;
}

/**
 * Path-averaged axial velocity from measured upstream and downstream transit times.
 *
 * Method: subtract the fixed time (wall, lining, wedge) to get the liquid times τ_up, τ_dn; then
 * - exact: v = L / (2·sin θ_f) · (1/τ_dn − 1/τ_up);
 * - Snell-invariant form: v = c_w / (2·sin θ_w) · Δt / τ̄ with τ̄ = (τ_up + τ_dn)/2; it is
 *   exact too and does not use the liquid's sound speed (sin θ_f / c_f = sin θ_w / c_w);
 *   sensitivities: Δt +1, τ̄ −1, c_w +1, θ_w −θ_w·cot θ_w;
 * - sound-speed form: v = c_f²·Δt / (2·N·D·tan θ_f) (linearised), sensitivities with θ_f from
 *   Snell's law: c_f 2 − sec² θ_f, Δt +1, D −1, c_w +sec² θ_f, θ_w −sec² θ_f·θ_w·cot θ_w.
 * The liquid sound speed implied by the times, c = L·(1/τ_up + 1/τ_dn)/2, is returned too.
 *
 * @param path a path from {@link clampOnPath} (SI); `traverses`, `boreDiameter`,
 *   `wedgeSoundSpeed`, `wedgeAngle` are read for the two forms
 * @param upstream measured upstream transit time, s
 * @param downstream measured downstream transit time, s
 * @returns the velocity (exact) and both forms with their sensitivities
 * @throws {InputError} on non-finite times, or times not longer than the fixed time
 * @throws {NoPhysicalAnswerError} when the beam is too near normal incidence for any form
 *
 * Source: derived from {@link transitTimes}; GUM sensitivity coefficients (jcgm-100-2008).
 *
 * @example
 * ```ts
 * import { clampOnPath } from "./path.ts";
 * import { pathVelocity, transitTimes } from "./transit.ts";
 * const p = clampOnPath({ outsideDiameter: 0.1143, wallThickness: 0.00602,
 *   wallSoundSpeed: 5920, wallShearSpeed: 3230, fluidSoundSpeed: 1482,
 *   wedgeSoundSpeed: 2720, wedgeAngle: 38 * Math.PI / 180, traverses: 2 });
 * const t = transitTimes(p, 2.5);
 * const v = pathVelocity(p, t.upstream, t.downstream);
 * if (Math.abs(v.velocity - 2.5) > 1e-9) throw new Error(String(v.velocity));
 * if (Math.abs(v.snellInvariant.velocity - 2.5) > 1e-9) throw new Error("invariant form");
 * ```
 */
export function pathVelocity(
  path: ClampOnPath,
  upstream: number,
  downstream: number,
): PathVelocity {
  checkPath(path);
  requireFinite("upstream", upstream, "s", true);
  requireFinite("downstream", downstream, "s", true);
  const tf = fixedTime(path);
  const tu = upstream - tf;
  const td = downstream - tf;
  if (!(tu > 0) || !(td > 0)) {
    throw new InputError(
      !(tu > 0) ? "upstream" : "downstream",
      `${!(tu > 0) ? upstream : downstream} s`,
      `a time longer than the fixed time ${tf} s outside the liquid`,
    );
  }
  const L = path.fluidPathLength;
  const sinf = Math.sin(path.fluidAngle);
  const cosf = Math.cos(path.fluidAngle);
  const dt = upstream - downstream;
  const v = L / (2 * sinf) * (1 / td - 1 / tu);
  const tm = 0.5 * (tu + td);
  const sw = Math.sin(path.wedgeAngle);
  const vi = path.wedgeSoundSpeed / (2 * sw) * dt / tm;
  const aw = path.wedgeAngle;
  const cotw = Math.cos(aw) / sw;
  const c = path.fluidSoundSpeed;
  const tanf = sinf / cosf;
  const vc = c * c * dt / (2 * path.traverses * path.boreDiameter * tanf);
  const sec2 = 1 / (cosf * cosf);
  const fin = Number.isFinite;
  if (!fin(v) || !fin(vi) || !fin(vc) || !fin(sec2) || !fin(aw * cotw)) {
    // A beam at (or within rounding of) normal incidence carries no axial component: the
    // forms divide 0 by 0 instead of giving a velocity.
    throw new NoPhysicalAnswerError(
      `no velocity from transit times: the beam (${path.fluidAngle} rad in the liquid, ` +
        `${aw} rad in the wedge) is too near normal incidence to carry the axial flow`,
    );
  }
  return {
    velocity: v,
    liquidTimes: { upstream: tu, downstream: td },
    snellInvariant: {
      velocity: vi,
      sensitivity: { deltaT: 1, liquidTime: -1, wedgeSoundSpeed: 1, wedgeAngle: -aw * cotw },
    },
    soundSpeedForm: {
      velocity: vc,
      sensitivity: {
        fluidSoundSpeed: 2 - sec2,
        deltaT: 1,
        boreDiameter: -1,
        wedgeSoundSpeed: sec2,
        wedgeAngle: -sec2 * aw * cotw,
      },
    },
    impliedSoundSpeed: 0.5 * L * (1 / tu + 1 / td),
  };
}

/** One row of {@link flowRangeTimes}. */
export interface FlowPoint extends TransitTimes {
  /** Volume flow rate, m³/s (when flow rates were given, or computed from the velocity). */
  readonly flowRate: number;
  /** Area-mean velocity, m/s. */
  readonly areaVelocity: number;
}

/** Result of {@link flowRangeTimes}. */
export interface FlowRange {
  /** Every point, in the order given. */
  readonly points: readonly FlowPoint[];
  /** The point with the smallest |Δt|. */
  readonly minimum: FlowPoint;
  /** The median point (the middle one of three). */
  readonly design: FlowPoint;
  /** The point with the largest |Δt|. */
  readonly maximum: FlowPoint;
  /** Profile factor used (area mean / path mean). */
  readonly profileFactor: number;
  /** Flow area used, m². */
  readonly area: number;
  /** Timing offset / |Δt at minimum|, when an offset was given. */
  readonly offsetFraction?: number;
}

/**
 * Transit times and Δt over a flow range.
 *
 * Method: area-mean velocity V = Q / A (A = π·D²/4), path velocity v = V / k with the profile
 * factor k (area mean / path mean; 1 when not given: then the velocities are taken as path
 * velocities), then {@link transitTimes}. With `timingOffset` (timing resolution or zero
 * offset, s) the fraction offset / |Δt| at the minimum flow is returned.
 *
 * @param path a path from {@link clampOnPath}
 * @param range `flowRates` (m³/s) or `velocities` (area-mean, m/s); `insideDiameter` (m) or
 *   `area` (m²), default the path's bore; `profileFactor` in (0.5, 1.5], default 1;
 *   `timingOffset` (s, ≥ 0)
 * @returns the rows and the minimum / design / maximum points
 * @throws {InputError} on empty or non-finite lists, bad factor or diameter
 *
 * Source: continuity Q = V·A; profile factor as defined in DESIGN.md.
 *
 * @example
 * ```ts
 * import { clampOnPath } from "./path.ts";
 * import { flowRangeTimes } from "./transit.ts";
 * const p = clampOnPath({ outsideDiameter: 0.1143, wallThickness: 0.00602,
 *   wallSoundSpeed: 5920, wallShearSpeed: 3230, fluidSoundSpeed: 1482,
 *   wedgeSoundSpeed: 2720, wedgeAngle: 38 * Math.PI / 180, traverses: 2 });
 * const r = flowRangeTimes(p, { flowRates: [0.002, 0.02, 0.04], timingOffset: 1e-10 });
 * if (!(r.maximum.deltaT > r.design.deltaT && r.design.deltaT > r.minimum.deltaT)) throw new Error();
 * if (!(r.offsetFraction! > 0)) throw new Error();
 * ```
 */
export function flowRangeTimes(
  path: ClampOnPath,
  range: {
    readonly flowRates?: readonly number[];
    readonly velocities?: readonly number[];
    readonly insideDiameter?: number;
    readonly area?: number;
    readonly profileFactor?: number;
    readonly timingOffset?: number;
  },
): FlowRange {
  checkPath(path);
  const k = range.profileFactor ?? 1;
  if (!Number.isFinite(k) || !(k > 0.5 && k <= 1.5)) {
    throw new InputError("profileFactor", String(k), "a number in (0.5, 1.5]");
  }
  let area: number;
  if (range.area !== undefined) area = requireFinite("area", range.area, "m^2", true);
  else {
    const d = range.insideDiameter ?? path.boreDiameter;
    requireFinite("insideDiameter", d, "m", true);
    area = Math.PI * d * d / 4;
  }
  const list = range.flowRates ?? range.velocities;
  const isFlow = range.flowRates !== undefined;
  if (!Array.isArray(list) || list.length === 0) {
    throw new InputError("flowRates", String(list), "one or more flow rates or velocities");
  }
  const points: FlowPoint[] = list.map((x, i) => {
    requireFinite(`${isFlow ? "flowRates" : "velocities"}[${i}]`, x, isFlow ? "m^3/s" : "m/s");
    const V = isFlow ? x / area : x;
    const t = transitTimes(path, V / k);
    return { ...t, flowRate: V * area, areaVelocity: V };
  });
  const sorted = [...points].sort((a, b) => Math.abs(a.deltaT) - Math.abs(b.deltaT));
  const minimum = sorted[0];
  let offsetFraction: number | undefined;
  if (range.timingOffset !== undefined) {
    const o = requireFinite("timingOffset", range.timingOffset, "s");
    if (o < 0) throw new InputError("timingOffset", String(o), "a time of 0 s or more");
    offsetFraction = minimum.deltaT === 0 ? Number.MAX_VALUE : o / Math.abs(minimum.deltaT);
  }
  return {
    points,
    minimum,
    design: sorted[Math.floor((sorted.length - 1) / 2)],
    maximum: sorted[sorted.length - 1],
    profileFactor: k,
    area,
    offsetFraction,
  };
}

/**
 * The smallest path velocity whose Δt equals a timing resolution or zero offset δt.
 *
 * Method: invert the exact Δt: v·sin θ_f = (−L + √(L² + δt²·c²)) / δt ≈ δt·c² / (2·L·sin θ_f).
 *
 * @param path a path from {@link clampOnPath}
 * @param timingOffset δt, s (> 0), for example 100e-12
 * @returns the velocity, m/s
 * @throws {InputError} on a non-positive offset
 *
 * Source: inverse of {@link transitTimes}.
 *
 * @example
 * ```ts
 * import { clampOnPath } from "./path.ts";
 * import { minimumResolvableVelocity, transitTimes } from "./transit.ts";
 * const p = clampOnPath({ outsideDiameter: 0.1143, wallThickness: 0.00602,
 *   wallSoundSpeed: 5920, wallShearSpeed: 3230, fluidSoundSpeed: 1482,
 *   wedgeSoundSpeed: 2720, wedgeAngle: 38 * Math.PI / 180, traverses: 2 });
 * const v = minimumResolvableVelocity(p, 100e-12);
 * if (Math.abs(transitTimes(p, v).deltaT - 100e-12) > 1e-20) throw new Error();
 * ```
 */
export function minimumResolvableVelocity(path: TransitPath, timingOffset: number): number {
  checkPath(path);
  const d = requireFinite("timingOffset", timingOffset, "s", true);
  const L = path.fluidPathLength;
  const c = path.fluidSoundSpeed;
  // Stable form of (−L + √(L² + d²c²)) / d.
  const x = d * c * c / (L + Math.sqrt(L * L + d * d * c * c));
  return x / Math.sin(path.fluidAngle);
}

/** Result of {@link wallBorneSignal}. */
export interface WallBorne {
  /** Arrival of sound travelling along the wall over the spacing (plus wedges), s. */
  readonly wallArrival: number;
  /** Arrival of the liquid-borne signal at zero flow, s. */
  readonly liquidArrival: number;
  /** liquidArrival − wallArrival, s (positive: the wall signal comes first). */
  readonly separation: number;
  /** Margin used, s (periods / frequency). */
  readonly margin: number;
  /** True when |separation| < margin. */
  readonly overlaps: boolean;
  /** Speed along the wall used, m/s. */
  readonly wallSpeed: number;
}

/**
 * Compare the wall-borne signal (through one wedge, along the wall at its fastest speed over the
 * spacing, up the other wedge) with the liquid-borne arrival.
 *
 * Method: t_wall = t_wedge + spacing / c_fast, with c_fast the wall's longitudinal speed (the
 * fastest bulk speed; guided plate waves are slower, so this is the earliest arrival);
 * t_liquid = path.totalTime. The wedge legs are common to both, so the separation does not
 * depend on them. Flag when |t_liquid − t_wall| < margin = periods / frequency
 * (default 3 periods, common practice).
 *
 * @param path a path from {@link clampOnPath}
 * @param options `frequency` Hz (> 0); `periods` (> 0, default 3); `wallSpeed` m/s (default the
 *   path's longitudinal wall speed)
 * @returns the arrivals, separation, margin and the flag
 * @throws {InputError} on a bad frequency, periods or speed
 *
 * Source: geometry above; margin `common-practice`.
 *
 * @example
 * ```ts
 * import { clampOnPath } from "./path.ts";
 * import { wallBorneSignal } from "./transit.ts";
 * const p = clampOnPath({ outsideDiameter: 0.1143, wallThickness: 0.00602,
 *   wallSoundSpeed: 5920, wallShearSpeed: 3230, fluidSoundSpeed: 1482,
 *   wedgeSoundSpeed: 2720, wedgeAngle: 38 * Math.PI / 180, traverses: 2 });
 * const w = wallBorneSignal(p, { frequency: 1e6 });
 * if (!(w.separation > 0) || w.overlaps) throw new Error("wall signal comes well first here");
 * ```
 */
export function wallBorneSignal(
  path: ClampOnPath,
  options: { readonly frequency: number; readonly periods?: number; readonly wallSpeed?: number },
): WallBorne {
  checkPath(path);
  const f = requireFinite("frequency", options?.frequency, "Hz", true);
  const periods = requireFinite("periods", options.periods ?? 3, "", true);
  const cfast = requireFinite(
    "wallSpeed",
    options.wallSpeed ?? Math.max(path.wallSoundSpeed, path.wallModeSpeed),
    "m/s",
    true,
  );
  const tw = path.wedgeTime ?? 0;
  const wallArrival = tw + path.spacing / cfast;
  const liquidArrival = path.totalTime;
  const separation = liquidArrival - wallArrival;
  const margin = periods / f;
  return {
    wallArrival,
    liquidArrival,
    separation,
    margin,
    overlaps: Math.abs(separation) < margin,
    wallSpeed: cfast,
  };
}
