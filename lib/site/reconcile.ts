/**
 * Field reconciliation: compare readings taken on site with the plan, infer the liquid's sound
 * speed from the measured transit time, name the likely causes of a mismatch, and recompute the
 * flow with the corrected figures.
 *
 * @module
 */
import { InputError, type Warning } from "../errors.ts";
import { trace as traceEntry, type TraceEntry } from "../trace.ts";
import { defaultRegistry, type Registry } from "../registry/mod.ts";
import { liquidProperties, liquids } from "../liquids/mod.ts";
import { profileFactor } from "../flow/mod.ts";
import { planSite, type SitePlan } from "./plan.ts";
import type { SiteInput } from "./schema.ts";
import {
  causeModels,
  type CauseName,
  FIT_ASSUMPTIONS,
  fitCause,
  type FittedCause,
  type ForwardSetup,
  predictTimes,
  type TimeReading,
  traverseLine,
} from "./reconcile_fit.ts";

/** One mounting's readings. SI. */
export interface MountingReading {
  /** Traverse count of the mounting read. */
  readonly traverses: number;
  /** Measured total transit time at (or averaged about) zero flow, s: mean of up and down. */
  readonly totalTime: number;
  /** The transducer pair's fixed delay (wedges, cables, electronics), s; default 0. */
  readonly fixedDelay?: number;
  /** Measured Δt (upstream − downstream), s. */
  readonly deltaT?: number;
  /** Area-mean velocity the meter indicated with the planned figures, m/s. */
  readonly indicatedVelocity?: number;
  /** Δt read with the flow stopped (a zero check), s; any value other than 0 is a zero offset. */
  readonly zeroFlowDeltaT?: number;
}

/** Readings taken on site. SI. */
export interface FieldReadings {
  /** Liquid temperature measured on site, K. */
  readonly temperature?: number;
  /** Wall thickness from a thickness gauge, m. */
  readonly wallThickness?: number;
  /** Readings per mounting. */
  readonly mountings: readonly MountingReading[];
}

/** A candidate cause of the mismatch, fitted to every reading at once. */
export interface MismatchCause {
  /**
   * Cause name: temperature, fixed-delay, wedge, wall, lining, deposits, gas, other-liquid, or
   * zero-offset (a Δt offset read at zero flow; it moves the flow, not the transit times).
   */
  readonly cause: CauseName;
  /** What would explain the readings, in words with figures. */
  readonly explanation: string;
  /** The fitted change, SI (see unit): K, s, m/s, m, or a fraction for gas. */
  readonly value: number;
  /** SI unit of value. */
  readonly unit: string;
  /** Root-mean-square time residual after the fit, s. */
  readonly rmsResidual: number;
  /** The fit leaves residuals within the readings' scatter and the change is plausible. */
  readonly plausible: boolean;
  /** Ranking score: χ² + (2·change/bound)² + penalty; smaller is likelier. */
  readonly score: number;
}

/** Reconciliation of one mounting. */
export interface MountingReconciliation {
  /** Crossings of the bore. */
  readonly traverses: number;
  /** Time in the liquid from the reading: total − fixed delay − wall − lining, s. */
  readonly measuredLiquidTime: number;
  /** Time in the liquid the plan expects, s. */
  readonly plannedLiquidTime: number;
  /** Liquid sound speed inferred from the reading, m/s. */
  readonly inferredSoundSpeed: number;
  /** Registry sound speed at the (measured) temperature, m/s. */
  readonly registrySoundSpeed: number;
  /** inferred − registry, m/s. */
  readonly difference: number;
  /** Tolerance the difference is judged against (2 standard uncertainties), m/s. */
  readonly tolerance: number;
  /** |difference| ≤ tolerance. */
  readonly consistent: boolean;
  /** Likely causes, likeliest first (empty when consistent). */
  readonly causes: readonly MismatchCause[];
  /** Flow from Δt or the indicated velocity, planned and corrected (when given). */
  readonly flow?: {
    /** plannedVelocity */
    readonly plannedVelocity: number;
    /** correctedVelocity */
    readonly correctedVelocity: number;
    /** plannedFlowRate */
    readonly plannedFlowRate: number;
    /** correctedFlowRate */
    readonly correctedFlowRate: number;
    /** relativeCorrection */
    readonly relativeCorrection: number;
  };
  /**
   * Δt zero offset read with the flow stopped, s, and the area-mean velocity it alone would show
   * (m/s); present when the reading carries `zeroFlowDeltaT`.
   */
  readonly zeroOffset?: {
    /** The Δt read at zero flow, s. */
    readonly deltaT: number;
    /** Area-mean velocity worth of the offset, m/s: planned figures, minimum flow's profile factor. */
    readonly velocity: number;
    /** |deltaT| above {@link RECONCILE_BOUNDS}.zeroDeltaT. */
    readonly significant: boolean;
  };
}

/** Result of {@link reconcile}. */
export interface Reconciliation {
  /** Site name. */
  readonly name: string;
  /** SHA-256 content hash of the reference data the plan was computed from. */
  readonly registryHash: string;
  /** Liquid temperature used (measured when given), K. */
  readonly temperature: number;
  /** Wall thickness used, m. */
  readonly wallThickness: number;
  /** Per mounting read. */
  readonly mountings: readonly MountingReconciliation[];
  /** Causes fitted to all readings at once, likeliest first (empty when the readings agree). */
  readonly causes: readonly MismatchCause[];
  /**
   * Z/V/W agreement (two or more traverse counts): t − fixed delay = offset + N·perTraverse,
   * measured and planned, s.
   */
  readonly traverseLine?: {
    /** Measured time outside the bore (delay error, wall, lining, wedge), s. */
    readonly offset: number;
    /** Planned time outside the bore, s. */
    readonly plannedOffset: number;
    /** Measured time per crossing of the bore, s. */
    readonly perTraverse: number;
    /** Planned time per crossing of the bore, s. */
    readonly plannedPerTraverse: number;
  };
  /** Whether the readings can tell delay errors from sound-speed errors (two traverse counts). */
  readonly separable: boolean;
  /** One-line summary. */
  readonly summary: string;
  /** Warnings (defaults assumed, extrapolations, estimates). */
  readonly warnings: readonly Warning[];
  /** Every constant and formulation used, with source and basis. */
  readonly trace: readonly TraceEntry[];
}

/**
 * Plausible sizes of the causes (common practice, project choices; read as two standard
 * deviations): temperature, fixed delay, wedge speed, wall, lining, deposits, gas.
 */
export const RECONCILE_BOUNDS = {
  /** Largest plausible error in the stated liquid temperature, K. */
  temperature: 15,
  /** Largest plausible error in a liquid temperature measured on site, K. */
  measuredTemperature: 2,
  /** Largest plausible error of a stated fixed delay, s. */
  fixedDelay: 5e-6,
  /** Largest plausible fixed delay when none is stated, s. */
  unstatedFixedDelay: 30e-6,
  /** Largest plausible wedge sound-speed error, relative. */
  wedgeRelative: 0.03,
  /** Largest plausible catalogue-wall error (corrosion, another schedule), relative. */
  wallRelative: 0.3,
  /** Largest plausible error of a gauged wall, m. */
  gaugedWall: 0.5e-3,
  /** Largest plausible lining thickness error, relative. */
  liningRelative: 0.5,
  /** Largest plausible deposit layer, relative to the bore radius. */
  depositRelative: 0.05,
  /** Largest plausible sound-speed drop from entrained gas, relative. */
  gasRelative: 0.05,
  /** Largest Δt read at zero flow that is still read as zero (noise of a zero check), s. */
  zeroDeltaT: 50e-12,
} as const;

/**
 * Invert the liquid-path time for the liquid's sound speed.
 *
 * Method: with the Snell invariant s = sin θ_w / c_w fixed by the wedge, the liquid angle obeys
 * sin θ = s·c, so the time in the liquid is τ = N·D / (c·cos θ) = N·D / (c·√(1 − s²c²)). The
 * function g(c) = c·√(1 − s²c²) rises on 0 < c < 1/(s√2) (liquid angles below 45°); solved by
 * bisection to 1e-12 relative.
 *
 * @param liquidTime τ, s
 * @param traverses N
 * @param boreDiameter D, m
 * @param snellInvariant s, s/m
 * @returns c, m/s
 * @throws {InputError} when no sound speed with a liquid angle below 45° fits
 *
 * @example
 * ```ts
 * import { soundSpeedFromLiquidTime } from "./reconcile.ts";
 * const s = Math.sin(38 * Math.PI / 180) / 2720, c = 1482, D = 0.1023, N = 2;
 * const tau = N * D / (c * Math.sqrt(1 - s * s * c * c));
 * if (Math.abs(soundSpeedFromLiquidTime(tau, N, D, s) - c) > 1e-6) throw new Error();
 * ```
 */
export function soundSpeedFromLiquidTime(
  liquidTime: number,
  traverses: number,
  boreDiameter: number,
  snellInvariant: number,
): number {
  const target = traverses * boreDiameter / liquidTime;
  const cMax = 1 / (snellInvariant * Math.SQRT2);
  const g = (c: number) => c * Math.sqrt(Math.max(0, 1 - snellInvariant * snellInvariant * c * c));
  if (!(liquidTime > 0) || !(target < g(cMax))) {
    throw new InputError(
      "readings.totalTime",
      `a liquid time of ${(liquidTime * 1e6).toPrecision(5)} µs`,
      "a time that some liquid sound speed can explain (check the fixed delay and the traverses)",
    );
  }
  let lo = 0, hi = cMax;
  for (let i = 0; i < 200 && hi - lo > 1e-12 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (g(mid) < target) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/**
 * Reconcile readings taken on site with the plan.
 *
 * Method: re-plan the site with the measured temperature and wall thickness. Per mounting, the
 * liquid time τ = measured total − fixed delay − (planned total − planned liquid time), then
 * the liquid's sound speed from τ ({@link soundSpeedFromLiquidTime}), compared with the
 * registry's within two standard uncertainties. On a mismatch, every candidate cause within the
 * declared liquid (temperature, fixed delay, wedge data, wall, lining, deposits, gas) is fitted
 * to all readings at once with the clamp-on forward model and ranked by χ² plus plausibility
 * (lib/site/reconcile_fit.ts); readings of two traverse counts separate delay errors (constant
 * time) from sound-speed errors (time per crossing). Another registry liquid is offered only
 * when no cause within the declared one fits. A Δt read with the flow stopped
 * (`zeroFlowDeltaT`) above {@link RECONCILE_BOUNDS}.zeroDeltaT is a cause of its own
 * (`zero-offset`, listed first: it is read, not inferred) and is subtracted from the Δt of the
 * corrected flow. Flow is recomputed with the measured liquid time
 * in the Snell-invariant form v = c_w·Δt / (2·sin θ_w·τ) and the re-planned bore. Bounds of the
 * causes: {@link RECONCILE_BOUNDS} (common practice). See docs/readings.md.
 *
 * @param site the site as planned (SI)
 * @param readings the readings (SI)
 * @param options registry
 * @returns per mounting: inferred sound speed, consistency, causes, corrected flow
 *
 * @example
 * ```ts
 * import { readSiteText } from "./read.ts";
 * import { planSite } from "./plan.ts";
 * import { reconcile } from "./reconcile.ts";
 * const site = await readSiteText(`
 * name: Example (invented)
 * pipe: { standard: ASME B36.10M, nps: "4", schedule: "40", material: carbon-steel }
 * fluid: { liquid: water, temperature: 20 degC }
 * flow: { minimum: 2 L/s, maximum: 10 L/s }
 * transducer: { wedgeSoundSpeed: 2720 m/s, wedgeAngle: 38 deg, frequency: 1 MHz }
 * mountings: [2]
 * `);
 * const plan = planSite(site, { monteCarlo: false });
 * const m = plan.mountings[0];
 * const r = reconcile(site, { mountings: [{ traverses: 2, totalTime: m.totalTime }] });
 * if (!r.mountings[0].consistent) throw new Error("the plan's own time must reconcile");
 * ```
 */
export function reconcile(
  site: SiteInput,
  readings: FieldReadings,
  options: { readonly registry?: Registry } = {},
): Reconciliation {
  const reg = options.registry ?? defaultRegistry();
  if (!readings || !Array.isArray(readings.mountings) || readings.mountings.length === 0) {
    throw new InputError("readings.mountings", "nothing", "at least one mounting's readings");
  }
  const warnings: Warning[] = [];
  const tr: TraceEntry[] = [];
  const T = readings.temperature ?? site.fluid.temperature;
  if (readings.temperature !== undefined) {
    tr.push(traceEntry("liquid temperature (measured on site)", T, "K", "site", "measured"));
  }
  const { planned, plan } = replan(site, readings, T, reg);
  for (const t of plan.trace) tr.push(t);
  const out = readings.mountings.map((r, i) =>
    reconcileMounting(site, readings, plan, planned, r, i)
  );
  const bad = out.filter((m) => !m.consistent);
  const stated = readings.mountings.map((r) => r.fixedDelay ?? site.transducer.fixedDelay);
  const timeReadings: TimeReading[] = readings.mountings.map((r, i) => ({
    traverses: r.traverses,
    totalTime: r.totalTime,
    fixedDelay: stated[i] ?? 0,
  }));
  const setup = forwardSetup(site, plan, T, reg);
  const separable = new Set(timeReadings.map((r) => r.traverses)).size >= 2;
  if (!separable && bad.length > 0) {
    warnings.push({
      code: "reconcile-one-traverse",
      message: "readings of one traverse count cannot tell a delay error from a sound-speed " +
        "error: read a second mounting (Z and V, or V and W) on the same pipe",
    });
  }
  const timeCauses = bad.length === 0 ? [] : rankCauses(site, readings, setup, timeReadings, {
    delayStated: stated.some((d) => d !== undefined),
    wallGauged: readings.wallThickness !== undefined,
    temperatureMeasured: readings.temperature !== undefined,
    T,
  });
  const zero = zeroOffsetCauses(out);
  const causes = [...zero, ...timeCauses];
  const withCauses = out.map((m) =>
    m.consistent
      ? { ...m, causes: zero.filter((c) => c.explanation.startsWith(`${m.traverses}-traverse`)) }
      : { ...m, causes }
  );
  tr.push(
    traceEntry(
      "reconciliation bounds (plausible sizes of the causes)",
      JSON.stringify(RECONCILE_BOUNDS),
      "",
      "common-practice",
      "common-practice",
    ),
  );
  return {
    name: site.name,
    registryHash: reg.hash,
    temperature: T,
    wallThickness: plan.pipe.wallThickness,
    mountings: withCauses,
    causes,
    traverseLine: traverseLineSummary(timeReadings, setup),
    separable,
    summary: summaryLine(bad.length, timeCauses, zero),
    warnings: [...plan.warnings, ...warnings],
    trace: tr,
  };
}

/** The site as planned, and re-planned with the measured temperature, wall and every mounting read. */
function replan(
  site: SiteInput,
  readings: FieldReadings,
  T: number,
  reg: Registry,
): { planned: SitePlan; plan: SitePlan } {
  const traverses = [...new Set([...site.mountings, ...readings.mountings.map((m) => m.traverses)])]
    .sort((a, b) => a - b);
  const adjusted: SiteInput = {
    ...site,
    fluid: { ...site.fluid, temperature: T, temperatureRange: undefined },
    pipe: readings.wallThickness !== undefined
      ? { ...site.pipe, measuredWallThickness: readings.wallThickness }
      : site.pipe,
    mountings: traverses,
  };
  return {
    planned: planSite(site, { registry: reg, monteCarlo: false }),
    plan: planSite(adjusted, { registry: reg, monteCarlo: false }),
  };
}

/** One mounting: liquid time, inferred sound speed and its tolerance, flow, zero offset. */
function reconcileMounting(
  site: SiteInput,
  readings: FieldReadings,
  plan: SitePlan,
  planned: SitePlan,
  r: MountingReading,
  i: number,
): MountingReconciliation {
  const field = `readings.mountings[${i}]`;
  if (!Number.isInteger(r.traverses) || r.traverses < 1 || r.traverses > 8) {
    throw new InputError(`${field}.traverses`, String(r.traverses), "an integer from 1 to 8");
  }
  if (!(Number.isFinite(r.totalTime) && r.totalTime > 0)) {
    throw new InputError(`${field}.totalTime`, String(r.totalTime), "a time > 0");
  }
  if (r.zeroFlowDeltaT !== undefined && !Number.isFinite(r.zeroFlowDeltaT)) {
    throw new InputError(`${field}.zeroFlowDeltaT`, String(r.zeroFlowDeltaT), "a finite time");
  }
  const s = Math.sin(plan.transducer.wedgeAngle) / plan.transducer.wedgeSoundSpeed;
  const bore = plan.pipe.boreDiameter;
  const wall = plan.pipe.wallThickness;
  const m = plan.mountings.find((x) => x.traverses === r.traverses)!;
  const fixed = r.fixedDelay ?? site.transducer.fixedDelay ?? 0;
  // the plan's total less its liquid time: wall, lining and (when its geometry is known) wedge
  const tau = r.totalTime - fixed - (m.totalTime - m.fluidTime);
  const c = soundSpeedFromLiquidTime(tau, r.traverses, bore, s);
  // standard uncertainty of the inferred speed: wall tolerance (bore), fixed delay, data spread
  const uBore = 2 * (readings.wallThickness !== undefined ? 0.1e-3 : 0.125 * wall / 2) /
    Math.sqrt(3);
  const cBore = soundSpeedFromLiquidTime(tau, r.traverses, bore + uBore, s);
  const cTau = soundSpeedFromLiquidTime(tau - 50e-9 / Math.sqrt(3), r.traverses, bore, s);
  const u = Math.hypot(cBore - c, cTau - c, plan.fluid.soundSpeedSpread / Math.sqrt(3));
  const cReg = plan.fluid.soundSpeed;
  const pm = planned.mountings.find((x) => x.traverses === r.traverses) ?? m;
  const flows = flowFromReading(r, plan, planned, pm.fluidTime, tau);
  return {
    traverses: r.traverses,
    measuredLiquidTime: tau,
    plannedLiquidTime: m.fluidTime,
    inferredSoundSpeed: c,
    registrySoundSpeed: cReg,
    difference: c - cReg,
    tolerance: 2 * u,
    consistent: Math.abs(c - cReg) <= 2 * u,
    causes: [] as MismatchCause[],
    flow: flows.flow,
    zeroOffset: flows.zeroOffset,
  };
}

/**
 * Flow from Δt (less any zero offset read at zero flow) or the indicated velocity, with the
 * planned and the measured liquid time; and the velocity a zero offset alone indicates.
 */
function flowFromReading(
  r: MountingReading,
  plan: SitePlan,
  planned: SitePlan,
  plannedLiquidTime: number,
  tau: number,
): Pick<MountingReconciliation, "flow" | "zeroOffset"> {
  const cw = plan.transducer.wedgeSoundSpeed;
  const sinW = Math.sin(plan.transducer.wedgeAngle);
  const bore = plan.pipe.boreDiameter;
  const nu = plan.fluid.kinematicViscosity;
  // profile factor at the velocity read: iterate v → Re → k (three steps converge)
  const kFor = (vPath: number) => {
    let k = plan.operatingPoints[0].profileFactor;
    for (let j = 0; j < 4; j++) {
      k = profileFactor(Math.max(1, Math.abs(k * vPath) * bore / nu), {
        extrapolate: true,
        warnings: [],
      });
    }
    return k;
  };
  const pathV = (dt: number, t: number) => cw * dt / (2 * sinW * t);
  const zero = r.zeroFlowDeltaT;
  const zeroOffset = zero === undefined ? undefined : {
    deltaT: zero,
    // worth at the minimum flow's profile factor (the offset rides on whatever flow runs)
    velocity: plan.operatingPoints[0].profileFactor * pathV(zero, plannedLiquidTime),
    significant: Math.abs(zero) > RECONCILE_BOUNDS.zeroDeltaT,
  };
  const areaPlanned = Math.PI / 4 * planned.pipe.boreDiameter ** 2;
  const areaNow = Math.PI / 4 * bore ** 2;
  const rates = (vPlanned: number, vNow: number) => ({
    plannedVelocity: vPlanned,
    correctedVelocity: vNow,
    plannedFlowRate: vPlanned * areaPlanned,
    correctedFlowRate: vNow * areaNow,
    relativeCorrection: vNow * areaNow / (vPlanned * areaPlanned) - 1,
  });
  if (r.deltaT !== undefined) {
    const pathPlanned = pathV(r.deltaT, plannedLiquidTime);
    const pathNow = pathV(r.deltaT - (zero ?? 0), tau);
    return { flow: rates(kFor(pathPlanned) * pathPlanned, kFor(pathNow) * pathNow), zeroOffset };
  }
  if (r.indicatedVelocity !== undefined) {
    const vNow = (r.indicatedVelocity - (zeroOffset?.velocity ?? 0)) * plannedLiquidTime / tau;
    return { flow: rates(r.indicatedVelocity, vNow), zeroOffset };
  }
  return { zeroOffset };
}

/** A zero offset read at zero flow is a cause of its own: it moves the flow, not the times. */
function zeroOffsetCauses(out: readonly MountingReconciliation[]): MismatchCause[] {
  return out.filter((m) => m.zeroOffset?.significant).map((m) => {
    const z = m.zeroOffset!;
    return {
      cause: "zero-offset" as const,
      explanation: `${m.traverses}-traverse Δt reads ${
        (z.deltaT * 1e9).toFixed(2)
      } ns with the flow stopped (a zero offset worth ${
        (z.velocity * 1e3).toFixed(1)
      } mm/s): re-zero at no flow; the corrected flow subtracts it`,
      value: z.deltaT,
      unit: "s",
      rmsResidual: 0,
      plausible: true,
      score: 0,
    };
  });
}

/** Z/V/W agreement, measured and planned, when the readings hold two traverse counts. */
function traverseLineSummary(
  timeReadings: readonly TimeReading[],
  setup: ForwardSetup,
): Reconciliation["traverseLine"] {
  const line = traverseLine(timeReadings);
  if (!line) return undefined;
  const ns = [...new Set(timeReadings.map((r) => r.traverses))];
  const planned = traverseLine(ns.map((n) => ({
    traverses: n,
    fixedDelay: 0,
    totalTime:
      predictTimes({ setup, delay: 0 }, [{ traverses: n, totalTime: 0, fixedDelay: 0 }])[0],
  })))!;
  return {
    offset: line.offset,
    plannedOffset: planned.offset,
    perTraverse: line.perTraverse,
    plannedPerTraverse: planned.perTraverse,
  };
}

/** The one-line summary. */
function summaryLine(
  bad: number,
  timeCauses: readonly MismatchCause[],
  zero: readonly MismatchCause[],
): string {
  const zeroNote = zero.length === 0
    ? ""
    : `; Δt zero offset on ${zero.length} ${zero.length === 1 ? "mounting" : "mountings"}`;
  if (bad === 0) return "readings agree with the plan within their uncertainty" + zeroNote;
  return `readings disagree with the plan on ${bad} ${bad === 1 ? "mounting" : "mountings"}` +
    `; likeliest cause: ${timeCauses[0]?.explanation ?? "none found"}` + zeroNote;
}

/** The planned setup the causes perturb, from the re-planned site. */
function forwardSetup(site: SiteInput, plan: SitePlan, T: number, reg: Registry): ForwardSetup {
  const opts = {
    salinity: site.fluid.salinity,
    formulation: site.fluid.formulation,
    extrapolate: true,
    warnings: [],
  };
  const cAt = (dT: number) =>
    liquidProperties(site.fluid.liquid, T + dT, site.fluid.pressure, opts).soundSpeed;
  // the plan's own wedge speed 1 K warmer: whatever temperature rule the plan applies
  let perK = 0;
  try {
    const warm: SiteInput = {
      ...site,
      fluid: { ...site.fluid, temperature: T + 1, temperatureRange: undefined },
      mountings: [plan.mountings[0].traverses],
    };
    perK = planSite(warm, { registry: reg, monteCarlo: false }).transducer.wedgeSoundSpeed -
      plan.transducer.wedgeSoundSpeed;
  } catch {
    perK = 0;
  }
  const td = site.transducer;
  return {
    outsideDiameter: plan.pipe.outsideDiameter,
    wallThickness: plan.pipe.wallThickness,
    wallSoundSpeed: plan.pipe.wallSoundSpeed,
    wallShearSpeed: plan.pipe.wallShearSpeed,
    lining: plan.pipe.lining.map((l) => ({ thickness: l.thickness, soundSpeed: l.soundSpeed })),
    fluidSoundSpeed: plan.fluid.soundSpeed,
    wedgeSoundSpeed: plan.transducer.wedgeSoundSpeed,
    wedgeAngle: plan.transducer.wedgeAngle,
    wedge: td.elementHeight !== undefined || td.indexOffset !== undefined
      ? { elementHeight: td.elementHeight, indexOffset: td.indexOffset }
      : undefined,
    wedgeSpeedPerKelvin: perK,
    soundSpeedAt: cAt,
  };
}

const us = (x: number, d = 2) => `${(x * 1e6).toFixed(d)} µs`;
const mmStr = (x: number, d = 2) => `${(x * 1e3).toFixed(d)} mm`;

/** Words with figures for a fitted cause. */
function explain(
  f: FittedCause,
  setup: ForwardSetup,
  ctx: { readonly T: number; readonly temperatureMeasured: boolean; readonly delay: number },
): string {
  const v = f.value;
  const more = (x: number, up: string, down: string) => (x >= 0 ? up : down);
  switch (f.cause) {
    case "temperature":
      return `temperature ${Math.abs(v).toFixed(1)} K ${more(v, "higher", "lower")} than ${
        ctx.temperatureMeasured ? "measured" : "stated"
      } (liquid at ${(ctx.T + v - 273.15).toFixed(1)} °C)`;
    case "fixed-delay":
      return `fixed delay ${us(Math.abs(v))} ${more(v, "larger", "smaller")} (${
        us(ctx.delay + v)
      } instead of ${us(ctx.delay)})`;
    case "wedge": {
      const sinNew = Math.sin(setup.wedgeAngle) * setup.wedgeSoundSpeed /
        (setup.wedgeSoundSpeed + v);
      const dAngle = sinNew < 1 ? (Math.asin(sinNew) - setup.wedgeAngle) * 180 / Math.PI : NaN;
      return `wedge sound speed ${Math.abs(v).toFixed(0)} m/s ${more(v, "higher", "lower")} (${
        (setup.wedgeSoundSpeed + v).toFixed(0)
      } m/s)` + (Number.isFinite(dAngle)
        ? `, or a wedge angle ${Math.abs(dAngle).toFixed(2)}° ${more(dAngle, "larger", "smaller")}`
        : "");
    }
    case "wall":
      return `wall ${mmStr(Math.abs(v))} ${more(v, "thicker", "thinner")} (${
        mmStr(setup.wallThickness + v)
      } instead of ${mmStr(setup.wallThickness)})`;
    case "lining":
      return `lining ${mmStr(Math.abs(v))} ${more(v, "thicker", "thinner")} (${
        mmStr(setup.lining[0].thickness + v)
      } instead of ${mmStr(setup.lining[0].thickness)})`;
    case "deposits":
      return `a deposit layer ${
        mmStr(v)
      } thick inside the bore (sound speed ${FIT_ASSUMPTIONS.depositSoundSpeed} m/s assumed)`;
    case "gas":
      return `liquid sound speed ${(-v * 100).toFixed(1)} % lower than the registry's: ` +
        "entrained gas or air (it also weakens the signal)";
    default:
      return f.cause;
  }
}

/** Fit every cause, explain, rank; another liquid only when nothing within the declared fits. */
function rankCauses(
  site: SiteInput,
  readings: FieldReadings,
  setup: ForwardSetup,
  timeReadings: readonly TimeReading[],
  ctx: {
    readonly delayStated: boolean;
    readonly wallGauged: boolean;
    readonly temperatureMeasured: boolean;
    readonly T: number;
  },
): MismatchCause[] {
  const B = RECONCILE_BOUNDS;
  const models = causeModels(setup, {
    temperature: ctx.temperatureMeasured ? B.measuredTemperature : B.temperature,
    fixedDelay: ctx.delayStated ? B.fixedDelay : B.unstatedFixedDelay,
    wedgeRelative: B.wedgeRelative,
    wall: ctx.wallGauged ? B.gaugedWall : B.wallRelative * setup.wallThickness,
    liningRelative: B.liningRelative,
    deposit: B.depositRelative * (setup.outsideDiameter / 2 - setup.wallThickness),
    gasRelative: B.gasRelative,
  });
  const delay = timeReadings[0].fixedDelay;
  const fitted = models.map((m) => fitCause(m, setup, timeReadings))
    .filter((f) =>
      Number.isFinite(f.score) && !(f.cause === "deposits" && f.value <= 0) &&
      !(f.cause === "gas" && f.value >= 0)
    );
  const out: MismatchCause[] = fitted.map((f) => ({
    cause: f.cause,
    explanation: explain(f, setup, { ...ctx, delay }),
    value: f.value,
    unit: f.unit,
    rmsResidual: f.rmsResidual,
    plausible: f.plausible,
    score: f.score,
  }));
  if (!out.some((c) => c.plausible)) out.push(...otherLiquids(site, readings, setup, timeReadings));
  return out.sort((a, b) => Number(b.plausible) - Number(a.plausible) || a.score - b.score);
}

/** Registry liquids whose sound speed at the temperature explains the readings. */
function otherLiquids(
  site: SiteInput,
  readings: FieldReadings,
  setup: ForwardSetup,
  timeReadings: readonly TimeReading[],
): MismatchCause[] {
  const T = readings.temperature ?? site.fluid.temperature;
  const sd = FIT_ASSUMPTIONS.readingTimeSd;
  const out: MismatchCause[] = [];
  for (const l of liquids()) {
    if (l.id === site.fluid.liquid) continue;
    let st;
    try {
      st = liquidProperties(l.id, T, site.fluid.pressure, { extrapolate: false });
    } catch {
      continue; // outside that liquid's range: not a candidate
    }
    let r: number[];
    try {
      const t = predictTimes({ setup: { ...setup, fluidSoundSpeed: st.soundSpeed }, delay: 0 }, [
        ...timeReadings,
      ]);
      r = timeReadings.map((x, i) => x.totalTime - t[i]);
    } catch {
      continue;
    }
    const rms = Math.sqrt(r.reduce((a, v) => a + v * v, 0) / r.length);
    // the liquid's own data spread, as a time: the liquid time scales as 1/c (to first order)
    const slack = st.soundSpeedSpread / st.soundSpeed *
      Math.max(...timeReadings.map((x) => x.totalTime - x.fixedDelay));
    if (rms > 2 * sd + slack) continue;
    out.push({
      cause: "other-liquid",
      explanation: `the readings fit ${l.id} at this temperature (${
        st.soundSpeed.toFixed(0)
      } m/s against ${setup.fluidSoundSpeed.toFixed(0)} m/s for ${site.fluid.liquid})`,
      value: st.soundSpeed,
      unit: "m/s",
      rmsResidual: rms,
      plausible: rms <= 2 * sd,
      // a change of liquid is the least likely explanation when the liquid is named
      score: r.reduce((a, v) => a + (v / sd) ** 2, 0) + 6,
    });
  }
  return out.sort((a, b) => a.score - b.score).slice(0, 5);
}
