/**
 * Plan stage 6, the paths per mounting: for each traverse count, the acoustic path through
 * wedge, wall, lining and liquid, its search window, transit times and Δt at every operating
 * point, the least resolvable velocity, the wall-borne signal, the signal budget and the spacing
 * over the stated temperature range.
 *
 * Method: Snell's law through the layers (lib/acoustics clampOnPath), transit times with the
 * path velocity V/k, search window from the inputs' half-widths.
 *
 * @module
 */
import type { Warning } from "../../errors.ts";
import type { TraceEntry } from "../../trace.ts";
import type { Registry } from "../../registry/mod.ts";
import { liquidSoundSpeed } from "../../liquids/mod.ts";
import {
  type ClampOnInputs,
  type ClampOnPath,
  clampOnPath,
  minimumResolvableVelocity,
  searchWindow,
  signalBudget,
  transitTimes,
  wallBorneSignal,
} from "../../acoustics/mod.ts";
import type { SiteInput } from "../schema.ts";
import type { MountingPlan, OperatingPoint } from "../plan.ts";
import { centreOffsetTol, halfWidthTol, mountingName, PLAN_ASSUMPTIONS } from "./assumptions.ts";
import type { PipeStage } from "./pipe.ts";

/** Input of {@link planMountings}: SI throughout (m, m/s, K, Pa, s). */
export interface MountingsStageInput {
  /** Traverse counts to plan (1 Z, 2 V, 4 W …). */
  readonly mountings: readonly number[];
  /** The site's pipe section. */
  readonly sp: SiteInput["pipe"];
  /** The site's fluid section. */
  readonly fl: SiteInput["fluid"];
  /** The site's transducer section. */
  readonly td: SiteInput["transducer"];
  /** Resolved pipe. */
  readonly rp: PipeStage["rp"];
  /** Wall material record. */
  readonly mat: PipeStage["mat"];
  /** Wall thickness used, m. */
  readonly wallThickness: number;
  /** Wall longitudinal speed, m/s. */
  readonly wallL: number;
  /** Wall shear speed, m/s. */
  readonly wallS: number | undefined;
  /** Lining layers. */
  readonly lining: PipeStage["lining"];
  /** Liquid sound speed, m/s. */
  readonly c: number;
  /** Liquid sound speed half-width, m/s. */
  readonly cSpread: number;
  /** Liquid density, kg/m³. */
  readonly rho: number;
  /** Line temperature, K. */
  readonly T: number;
  /** Wedge speed, m/s. */
  readonly cw: number;
  /** Wedge speed half-width, m/s. */
  readonly cwHalf: number;
  /** Wedge dc/dT, m/(s·K). */
  readonly dcwdT: number;
  /** Wedge density, kg/m³. */
  readonly wedgeDensity: number;
  /** Wedge attenuation. */
  readonly wedgeAtt: { value: number; frequency: number } | undefined;
  /** Operating points. */
  readonly points: readonly OperatingPoint[];
  /** Timing offset, s. */
  readonly timingOffset: number;
  /** Registry for lining materials. */
  readonly reg: Registry;
}

/** A mounting plan with the path and inputs it came from. */
export type PlannedMounting = MountingPlan & { path: ClampOnPath; inputs: ClampOnInputs };

/** Output of {@link planMountings}. */
export interface MountingsStage {
  /** One plan per mounting, in the order asked. */
  readonly mountingPlans: PlannedMounting[];
  /** Wall-thickness half-width, m. */
  readonly wallTolHalf: number;
  /** Outside-diameter half-width, m. */
  readonly odHalf: number;
  /**
   * Centre offsets of the wall and outside-diameter tolerance bands, m ((plus − minus)/2; 0 for
   * a symmetric band, a gauged wall or an assumed band), for the Monte Carlo draws.
   */
  readonly tolOffsets: { readonly wallThickness: number; readonly outsideDiameter: number };
  /** Signal-budget warnings (may repeat; the caller drops repeats). */
  readonly warnings: Warning[];
  /** Trace of the first mounting's signal budget. */
  readonly trace: TraceEntry[];
}

/**
 * The acoustic paths of every mounting asked for.
 *
 * @param input the site sections and the earlier stages' results (SI)
 * @returns a plan per mounting and the wall and OD half-widths (m)
 * @example
 * ```ts
 * import { planMountings } from "./mountings.ts";
 * // no mountings asked: nothing planned, half-widths still stated
 * const s = planMountings({
 *   mountings: [], sp: {}, rp: { outsideDiameter: 0.2191 }, wallThickness: 0.00818,
 * } as unknown as Parameters<typeof planMountings>[0]);
 * // no tolerance known: 0.5 % of OD and 12.5 % of wall as full band (common practice)
 * if (s.mountingPlans.length !== 0 || Math.abs(s.odHalf - 0.005 * 0.2191) > 1e-12) {
 *   throw new Error();
 * }
 * ```
 */
export function planMountings(input: MountingsStageInput): MountingsStage {
  const {
    mountings,
    rp,
    wallThickness,
    wallL,
    wallS,
    lining,
    c,
    cw,
    td,
    sp,
    mat,
    points,
    timingOffset,
    T,
    fl,
    rho,
    wedgeDensity,
    wedgeAtt,
    reg,
  } = input;
  const tr: TraceEntry[] = [];
  const addTrace = (entries: readonly TraceEntry[] | undefined) => {
    if (entries) { for (const e of entries) tr.push(e); }
  };
  const baseInputs = (n: number): ClampOnInputs => ({
    outsideDiameter: rp.outsideDiameter,
    wallThickness,
    wallSoundSpeed: wallL,
    wallShearSpeed: wallS,
    lining: lining.map((l) => ({ thickness: l.thickness, soundSpeed: l.soundSpeed })),
    fluidSoundSpeed: c,
    wedgeSoundSpeed: cw,
    wedgeAngle: td.wedgeAngle,
    traverses: n,
    wedge: td.elementHeight !== undefined || td.indexOffset !== undefined
      ? { elementHeight: td.elementHeight, indexOffset: td.indexOffset }
      : undefined,
  });
  const wallTolHalf = sp.measuredWallThickness !== undefined
    ? PLAN_ASSUMPTIONS.gaugeHalfWidth
    : halfWidthTol(rp.tolerances?.wallThickness) ?? 0.125 * wallThickness / 2;
  const odHalf = halfWidthTol(rp.tolerances?.outsideDiameter) ??
    PLAN_ASSUMPTIONS.defaultOdRelative * rp.outsideDiameter;
  const budgetWarnings: Warning[] = [];
  // The liquid's sound speeds over the seasonal range, the same for every mounting: filled by
  // the first mounting that asks (where a failing evaluation would have thrown before).
  const seasonal: number[] = [];
  const mountingPlans: (MountingPlan & { path: ClampOnPath; inputs: ClampOnInputs })[] = [];
  for (const n of mountings) {
    const inputs = baseInputs(n);
    const path = clampOnPath(inputs);
    const win = searchWindow(inputs, windowHalfWidths(input, wallTolHalf));
    const times = points.map((p) => {
      const t = transitTimes(path, p.pathVelocity);
      return { label: p.label, upstream: t.upstream, downstream: t.downstream, deltaT: t.deltaT };
    });
    const dtMin = Math.abs(times[0].deltaT);
    const vmin = minimumResolvableVelocity(path, timingOffset);
    const wb = wallBorneSignal(path, { frequency: td.frequency });
    const budget = signalBudget(path, {
      frequency: td.frequency,
      temperature: T,
      pressure: fl.pressure,
      liquid: { density: rho },
      wedge: { density: wedgeDensity, attenuation: wedgeAtt },
      wall: { density: mat.density, attenuation: mat.attenuation },
      lining: lining.map((l) => {
        const lm = reg.material(l.material);
        return { density: lm.density, attenuation: lm.attenuation };
      }),
    }, { extrapolate: true, warnings: budgetWarnings });
    const overTemperature = spacingOverTemperature(input, inputs, seasonal);
    mountingPlans.push({
      traverses: n,
      name: mountingName(n),
      spacing: path.spacing,
      referenceMarkDistance: path.referenceMarkDistance,
      fluidAngle: path.fluidAngle,
      wallAngle: path.wallAngle,
      liningAngles: path.liningAngles,
      wallMode: path.wallMode,
      modes: path.modes,
      fluidPathLength: path.fluidPathLength,
      fluidTime: path.fluidTime,
      wallTime: path.wallTime,
      liningTime: path.liningTime,
      totalTime: path.totalTime,
      searchWindow: win,
      times,
      minimumResolvableVelocity: vmin,
      offsetFraction: timingOffset / dtMin,
      resolvableAtMinimum: dtMin >= PLAN_ASSUMPTIONS.resolvableMultiple * timingOffset,
      wallBorne: { separation: wb.separation, overlaps: wb.overlaps },
      signal: { totalDb: budget.totalDb, rating: budget.rating },
      overTemperature,
      expandedByPoint: [],
      path,
      inputs,
    });
    if (n === mountings[0]) addTrace(budget.trace);
  }
  const tolOffsets = {
    wallThickness: sp.measuredWallThickness !== undefined
      ? 0
      : centreOffsetTol(rp.tolerances?.wallThickness),
    outsideDiameter: centreOffsetTol(rp.tolerances?.outsideDiameter),
  };
  return { mountingPlans, wallTolHalf, odHalf, tolOffsets, warnings: budgetWarnings, trace: tr };
}

/** The half-widths the search window spans (m, m/s, rad, K): site values known exactly get 0. */
function windowHalfWidths(
  input: MountingsStageInput,
  wallTolHalf: number,
): Parameters<typeof searchWindow>[1] {
  const { sp, mat, cSpread, cwHalf, lining, dcwdT } = input;
  return {
    fluidSoundSpeed: cSpread,
    wallThickness: wallTolHalf,
    wallSoundSpeed: sp.wallSoundSpeed !== undefined ? 0 : mat.longitudinalSpread ?? 0,
    wallShearSpeed: sp.wallShearSpeed !== undefined ? 0 : mat.shearSpread ?? 0,
    wedgeSoundSpeed: cwHalf,
    wedgeAngle: PLAN_ASSUMPTIONS.wedgeAngleHalfWidth,
    ...(lining.length
      ? { liningThickness: PLAN_ASSUMPTIONS.liningThicknessRelative * lining[0].thickness }
      : {}),
    ...(dcwdT !== 0
      ? {
        wedgeTemperature: {
          uncertainty: PLAN_ASSUMPTIONS.wedgeTemperatureHalfWidth,
          dSoundSpeedDT: dcwdT,
        },
      }
      : {}),
  };
}

/**
 * Spacing at seven temperatures across the site's seasonal range (undefined without one): the
 * liquid's sound speed at each (or the stated one), the wedge's by c_w + dc/dT·(T − T_line).
 * `seasonal` holds the liquid's sound speeds already evaluated (index i), shared by the
 * mountings of one plan; missing ones are evaluated and stored.
 */
function spacingOverTemperature(
  input: MountingsStageInput,
  inputs: ClampOnInputs,
  seasonal: number[],
): MountingPlan["overTemperature"] {
  const { fl, cw, dcwdT, T } = input;
  if (!fl.temperatureRange) return undefined;
  const { min, max } = fl.temperatureRange;
  const overTemperature: NonNullable<MountingPlan["overTemperature"]>[number][] = [];
  for (let i = 0; i <= 6; i++) {
    const Ti = min + (max - min) * i / 6;
    const ci = fl.soundSpeed ?? (seasonal[i] ??= liquidSoundSpeed(fl.liquid, Ti, fl.pressure, {
      salinity: fl.salinity,
      formulation: fl.formulation,
      extrapolate: true,
      warnings: [],
    }));
    const cwi = cw + dcwdT * (Ti - T);
    const pi = clampOnPath({ ...inputs, fluidSoundSpeed: ci, wedgeSoundSpeed: cwi });
    overTemperature.push({
      temperature: Ti,
      spacing: pi.spacing,
      fluidSoundSpeed: ci,
      totalTime: pi.totalTime,
    });
  }
  return overTemperature;
}
