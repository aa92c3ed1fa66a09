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

/** A candidate cause of a sound-speed mismatch. */
export interface MismatchCause {
  /** `temperature`, `wall-or-lining`, `other-liquid`, `gas`. */
  readonly cause: "temperature" | "wall-or-lining" | "other-liquid" | "gas";
  /** What would explain the mismatch, in words with figures. */
  readonly explanation: string;
  /** Whether the change needed is within plausible bounds. */
  readonly plausible: boolean;
  /** Change needed relative to its plausible bound (smaller is likelier). */
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
  /** One-line summary. */
  readonly summary: string;
  /** Warnings (defaults assumed, extrapolations, estimates). */
  readonly warnings: readonly Warning[];
  /** Every constant and formulation used, with source and basis. */
  readonly trace: readonly TraceEntry[];
}

/** Plausible bounds of the causes (common practice): temperature error, wall error, gas. */
export const RECONCILE_BOUNDS = {
  /** Largest plausible error in the stated liquid temperature, K. */
  temperature: 15,
  /** Largest plausible error in a liquid temperature measured on site, K. */
  measuredTemperature: 2,
  /** Largest plausible wall (or lining build-up) error, relative to the wall thickness. */
  wallRelative: 0.5,
  /** A sound speed this far below the registry's points to entrained gas, relative. */
  gasRelative: 0.02,
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
      `a liquid time of ${(liquidTime * 1e6).toPrecision(5)} us`,
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
 * Method: re-plan the site with the measured temperature and wall thickness; per mounting, the
 * liquid time τ = measured total − fixed delay − wall and lining times (which depend only on
 * the Snell invariant, not on the liquid), then the liquid's sound speed from τ
 * ({@link soundSpeedFromLiquidTime}); compare with the registry's at that temperature within
 * two standard uncertainties (liquid data spread, wall tolerance, fixed delay). On a mismatch,
 * each candidate cause is sized: the temperature change that would explain it (from dc/dT), the
 * wall or lining change (the bore that reconciles τ with the registry's speed), registry liquids
 * whose speed matches, and entrained gas (a much lower speed). Flow is recomputed with the
 * measured liquid time in the Snell-invariant form v = c_w·Δt / (2·sin θ_w·τ), and the
 * re-planned bore. Bounds of the causes: {@link RECONCILE_BOUNDS} (common practice).
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
  const planned: SitePlan = planSite(site, { registry: reg, monteCarlo: false });
  const plan: SitePlan = planSite(adjusted, { registry: reg, monteCarlo: false });
  for (const t of plan.trace) tr.push(t);
  const cw = plan.transducer.wedgeSoundSpeed;
  const s = Math.sin(plan.transducer.wedgeAngle) / cw;
  const cReg = plan.fluid.soundSpeed;
  const bore = plan.pipe.boreDiameter;
  const wall = plan.pipe.wallThickness;
  const dcdT = (() => {
    try {
      const opts = { salinity: site.fluid.salinity, extrapolate: true, warnings: [] };
      const a = liquidProperties(site.fluid.liquid, T - 0.5, site.fluid.pressure, opts).soundSpeed;
      const b = liquidProperties(site.fluid.liquid, T + 0.5, site.fluid.pressure, opts).soundSpeed;
      return b - a;
    } catch {
      return 0;
    }
  })();
  const out: MountingReconciliation[] = readings.mountings.map((r, i) => {
    const field = `readings.mountings[${i}]`;
    if (!Number.isInteger(r.traverses) || r.traverses < 1 || r.traverses > 8) {
      throw new InputError(`${field}.traverses`, String(r.traverses), "an integer from 1 to 8");
    }
    if (!(Number.isFinite(r.totalTime) && r.totalTime > 0)) {
      throw new InputError(`${field}.totalTime`, String(r.totalTime), "a time > 0");
    }
    const m = plan.mountings.find((x) => x.traverses === r.traverses)!;
    const fixed = r.fixedDelay ?? 0;
    const tau = r.totalTime - fixed - m.wallTime - m.liningTime;
    const c = soundSpeedFromLiquidTime(tau, r.traverses, bore, s);
    // standard uncertainty of the inferred speed: wall tolerance (bore), fixed delay, data spread
    const uBore = 2 * (readings.wallThickness !== undefined ? 0.1e-3 : 0.125 * wall / 2) /
      Math.sqrt(3);
    const cBore = soundSpeedFromLiquidTime(tau, r.traverses, bore + uBore, s);
    const cTau = soundSpeedFromLiquidTime(tau - 50e-9 / Math.sqrt(3), r.traverses, bore, s);
    const u = Math.hypot(cBore - c, cTau - c, plan.fluid.soundSpeedSpread / Math.sqrt(3));
    const tolerance = 2 * u;
    const diff = c - cReg;
    const consistent = Math.abs(diff) <= tolerance;
    const causes: MismatchCause[] = [];
    if (!consistent) {
      if (dcdT !== 0) {
        // the temperature at which the registry's speed equals the inferred one (Newton steps
        // on c(T), started from the linear estimate)
        const opts = { salinity: site.fluid.salinity, extrapolate: true, warnings: [] };
        const cAt = (x: number) =>
          liquidProperties(site.fluid.liquid, x, site.fluid.pressure, opts).soundSpeed;
        let Tx = T + diff / dcdT;
        for (let j = 0; j < 6; j++) {
          try {
            const f0 = cAt(Tx) - c;
            const d = cAt(Tx + 0.05) - cAt(Tx - 0.05);
            if (!(Math.abs(d) > 0)) break;
            const step = f0 / (d / 0.1);
            Tx -= step;
            if (Math.abs(step) < 1e-6) break;
          } catch {
            break;
          }
        }
        const dT = Tx - T;
        const bound = readings.temperature !== undefined
          ? RECONCILE_BOUNDS.measuredTemperature
          : RECONCILE_BOUNDS.temperature;
        causes.push({
          cause: "temperature",
          explanation: `the liquid would be at ${(T + dT - 273.15).toFixed(1)} °C, ` +
            `${Math.abs(dT).toFixed(1)} K ${dT > 0 ? "warmer" : "colder"} than stated`,
          plausible: Math.abs(dT) <= bound,
          score: Math.abs(dT) / bound,
        });
      }
      // the wall change Δ that explains the total time with the registry's speed: the wall time
      // grows by wallTime/wall per metre while the liquid time shrinks by 2·fluidTime/bore
      const plannedTotal = m.wallTime + m.liningTime + m.fluidTime;
      const measuredTotal = r.totalTime - fixed;
      const slope = m.wallTime / wall - 2 * m.fluidTime / bore;
      const dWall = (measuredTotal - plannedTotal) / slope;
      const needBore = bore - 2 * dWall;
      causes.push({
        cause: "wall-or-lining",
        explanation:
          `the wall (or lining, or scale and deposits inside) would be ${
            Math.abs(dWall * 1e3).toFixed(2)
          } mm ` +
          `${dWall > 0 ? "thicker" : "thinner"} than planned (bore ${
            (needBore * 1e3).toFixed(1)
          } mm)`,
        plausible: Math.abs(dWall) <= RECONCILE_BOUNDS.wallRelative * wall,
        score: Math.abs(dWall) / (RECONCILE_BOUNDS.wallRelative * wall),
      });
      const matches: string[] = [];
      for (const l of liquids()) {
        if (l.id === site.fluid.liquid) continue;
        try {
          const st = liquidProperties(l.id, T, site.fluid.pressure, { extrapolate: false });
          if (Math.abs(st.soundSpeed - c) <= tolerance + st.soundSpeedSpread) matches.push(l.id);
        } catch {
          // outside that liquid's range: not a candidate
        }
      }
      if (site.fluid.liquid !== "water") {
        try {
          const w = liquidProperties("water", T, site.fluid.pressure);
          if (Math.abs(w.soundSpeed - c) <= tolerance + w.soundSpeedSpread) {
            matches.unshift("water");
          }
        } catch {
          // not liquid water here
        }
      }
      causes.push({
        cause: "other-liquid",
        explanation: matches.length
          ? `the speed matches ${matches.slice(0, 5).join(", ")} at this temperature`
          : "no registry liquid matches this speed at this temperature",
        plausible: matches.length > 0,
        // a change of liquid is the least likely explanation when the liquid is named
        score: matches.length > 0 ? 1.5 : 3,
      });
      if (diff < -RECONCILE_BOUNDS.gasRelative * cReg) {
        causes.push({
          cause: "gas",
          explanation: `${(-diff / cReg * 100).toFixed(1)} % below the registry's speed: ` +
            "entrained air or gas lowers the apparent speed and weakens the signal",
          plausible: true,
          score: 1.2,
        });
      }
      causes.sort((a, b) => Number(b.plausible) - Number(a.plausible) || a.score - b.score);
    }
    let flow: MountingReconciliation["flow"];
    const pm = planned.mountings.find((x) => x.traverses === r.traverses) ??
      plan.mountings.find((x) => x.traverses === r.traverses)!;
    // profile factor at the velocity read: iterate v → Re → k (three steps converge)
    const nu = plan.fluid.kinematicViscosity;
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
    const areaPlanned = Math.PI / 4 * planned.pipe.boreDiameter ** 2;
    const areaNow = Math.PI / 4 * bore ** 2;
    if (r.deltaT !== undefined) {
      const pathPlanned = cw * r.deltaT / (2 * Math.sin(plan.transducer.wedgeAngle) * pm.fluidTime);
      const pathNow = cw * r.deltaT / (2 * Math.sin(plan.transducer.wedgeAngle) * tau);
      const vPlanned = kFor(pathPlanned) * pathPlanned;
      const vNow = kFor(pathNow) * pathNow;
      flow = {
        plannedVelocity: vPlanned,
        correctedVelocity: vNow,
        plannedFlowRate: vPlanned * areaPlanned,
        correctedFlowRate: vNow * areaNow,
        relativeCorrection: vNow * areaNow / (vPlanned * areaPlanned) - 1,
      };
    } else if (r.indicatedVelocity !== undefined) {
      const vNow = r.indicatedVelocity * pm.fluidTime / tau;
      flow = {
        plannedVelocity: r.indicatedVelocity,
        correctedVelocity: vNow,
        plannedFlowRate: r.indicatedVelocity * areaPlanned,
        correctedFlowRate: vNow * areaNow,
        relativeCorrection: vNow * areaNow / (r.indicatedVelocity * areaPlanned) - 1,
      };
    }
    return {
      traverses: r.traverses,
      measuredLiquidTime: tau,
      plannedLiquidTime: m.fluidTime,
      inferredSoundSpeed: c,
      registrySoundSpeed: cReg,
      difference: diff,
      tolerance,
      consistent,
      causes,
      flow,
    };
  });
  const bad = out.filter((m) => !m.consistent);
  const summary = bad.length === 0
    ? "readings agree with the plan within their uncertainty"
    : `readings disagree with the plan on ${bad.length} mounting(s); likeliest cause: ` +
      (bad[0].causes[0]?.explanation ?? "unknown");
  tr.push(
    traceEntry(
      "reconciliation bounds (temperature, wall, gas)",
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
    wallThickness: wall,
    mountings: out,
    summary,
    warnings: [...plan.warnings, ...warnings],
    trace: tr,
  };
}
