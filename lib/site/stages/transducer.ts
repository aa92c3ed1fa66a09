/**
 * Plan stage 3, the transducer: the wedge sound speed at the line temperature and its spread,
 * the wedge's density and attenuation for the signal budget, and the timing resolution and
 * offset of the electronics.
 *
 * Method: c_w(T) = c_w,ref + dc/dT·(T − T_ref) for a registry wedge material; a stated wedge
 * speed holds at `wedgeReferenceTemperature` and is corrected by dc/dT·(T − T_ref); without a
 * reference it is taken at the line temperature (a `default` warning says so when a coefficient
 * would apply). A line temperature outside the material's stated coefficient range
 * raises a `wedge-range` warning (issue 11 item 1).
 *
 * @module
 */
import { InputError, type Warning } from "../../errors.ts";
import { trace as traceEntry, type TraceEntry } from "../../trace.ts";
import type { Registry } from "../../registry/mod.ts";
import type { SiteInput } from "../schema.ts";
import { PLAN_ASSUMPTIONS } from "./assumptions.ts";

/** Input of {@link planTransducer}. */
export interface TransducerStageInput {
  /** The site file's transducer section (SI). */
  readonly transducer: SiteInput["transducer"];
  /** Line temperature, K. */
  readonly temperature: number;
  /** The registry wedge materials are read from. */
  readonly registry: Registry;
}

/** Output of {@link planTransducer}. */
export interface TransducerStage {
  /** Wedge sound speed at the line temperature, m/s. */
  readonly cw: number;
  /** Wedge dc/dT, m/(s·K). */
  readonly dcwdT: number;
  /** Half-width of the wedge sound speed, m/s. */
  readonly cwHalf: number;
  /** Wedge density, kg/m³. */
  readonly wedgeDensity: number;
  /** Wedge attenuation, when the material gives one. */
  readonly wedgeAtt: { value: number; frequency: number } | undefined;
  /** Timing resolution, s. */
  readonly timingResolution: number;
  /** Zero offset magnitude, s. */
  readonly zeroOffset: number;
  /** Timing offset max(zero offset, resolution), s. */
  readonly timingOffset: number;
  /** Warnings raised by this stage, in order. */
  readonly warnings: Warning[];
  /** Trace entries of this stage, in order. */
  readonly trace: TraceEntry[];
}

/**
 * The transducer's wedge and timing as the plan uses them.
 *
 * @param input transducer section (SI), line temperature (K), registry
 * @returns wedge speed (m/s) and spread, dc/dT, timing (s), with warnings and trace
 * @throws {InputError} neither a wedge sound speed nor a wedge material
 * @example
 * ```ts
 * import { planTransducer } from "./transducer.ts";
 * import { defaultRegistry } from "../../registry/mod.ts";
 * const s = planTransducer({
 *   transducer: { wedgeSoundSpeed: 2720, wedgeAngle: 0.66, frequency: 1e6 },
 *   temperature: 293.15,
 *   registry: defaultRegistry(),
 * } as unknown as Parameters<typeof planTransducer>[0]);
 * // a stated speed is used as given; no resolution stated: 100 ps (common practice)
 * if (s.cw !== 2720 || s.timingResolution !== 100e-12) throw new Error();
 * ```
 */
export function planTransducer(input: TransducerStageInput): TransducerStage {
  const td = input.transducer;
  const T = input.temperature;
  const reg = input.registry;
  const warnings: Warning[] = [];
  const tr: TraceEntry[] = [];
  const addTrace = (entries: readonly TraceEntry[] | undefined) => {
    if (entries) { for (const e of entries) tr.push(e); }
  };
  // a stated wedge speed holds at wedgeReferenceTemperature (default: the line temperature)
  const statedAtLine = (stated: number, k: number): number => {
    const ref = td.wedgeReferenceTemperature;
    if (ref === undefined) {
      if (k !== 0) {
        warnings.push({
          code: "default",
          message: "no wedge reference temperature stated: the stated wedge sound speed is " +
            "taken to hold at the line temperature",
        });
      }
      return stated;
    }
    const corrected = stated + k * (T - ref);
    tr.push(
      traceEntry("wedge reference temperature (site)", ref, "K", "site", "input"),
      traceEntry(
        "wedge sound speed corrected to the line temperature",
        corrected,
        "m/s",
        "site",
        "computed",
      ),
    );
    return corrected;
  };
  let cw: number;
  let dcwdT: number;
  let cwHalf: number;
  let wedgeDensity = 1180;
  let wedgeAtt: { value: number; frequency: number } | undefined;
  if (td.wedgeMaterial) {
    const wm = reg.material(td.wedgeMaterial);
    addTrace(wm.trace);
    wedgeDensity = wm.density;
    wedgeAtt = wm.attenuation;
    dcwdT = td.wedgeTemperatureCoefficient ?? wm.dLongitudinalDT ?? 0;
    const range = wm.temperatureRange;
    if (range && (T < range[0] || T > range[1])) {
      const degC = (k: number) => `${Number((k - 273.15).toFixed(1))} °C`;
      warnings.push({
        code: "wedge-range",
        message: `line temperature ${degC(T)} is outside the ${degC(range[0])} to ` +
          `${degC(range[1])} range of the ${td.wedgeMaterial} wedge data: its sound speed is ` +
          "extrapolated and the wedge may soften or wear",
      });
    }
    cw = td.wedgeSoundSpeed !== undefined
      ? statedAtLine(td.wedgeSoundSpeed, dcwdT)
      : wm.longitudinal + dcwdT * (T - wm.referenceTemperature);
    cwHalf = td.wedgeSoundSpeed !== undefined
      ? PLAN_ASSUMPTIONS.statedWedgeSpeedRelative * cw
      : wm.longitudinalSpread ?? PLAN_ASSUMPTIONS.statedWedgeSpeedRelative * cw;
    if (td.wedgeSoundSpeed === undefined && dcwdT !== 0) {
      tr.push(
        traceEntry("wedge sound speed at the liquid temperature", cw, "m/s", wm.source, "computed"),
      );
    }
  } else if (td.wedgeSoundSpeed !== undefined) {
    dcwdT = td.wedgeTemperatureCoefficient ?? 0;
    cw = statedAtLine(td.wedgeSoundSpeed, dcwdT);
    cwHalf = PLAN_ASSUMPTIONS.statedWedgeSpeedRelative * cw;
    tr.push(traceEntry("wedge sound speed (site)", cw, "m/s", "site", "input"));
    if (td.wedgeTemperatureCoefficient === undefined) {
      warnings.push({
        code: "wedge-temperature",
        message: "no wedge material or temperature coefficient: the wedge speed is held constant " +
          "over temperature",
      });
    }
  } else {
    throw new InputError("transducer", "neither wedgeSoundSpeed nor wedgeMaterial", "one of them");
  }
  tr.push(traceEntry("wedge angle (site)", td.wedgeAngle, "rad", "site", "input"));
  const timingResolution = td.timingResolution ?? PLAN_ASSUMPTIONS.defaultTimingResolution;
  if (td.timingResolution === undefined) {
    warnings.push({
      code: "default",
      message: `no timing resolution stated: ${timingResolution * 1e12} ps assumed`,
    });
  }
  const zeroOffset = Math.abs(td.zeroOffset ?? timingResolution);
  const timingOffset = Math.max(zeroOffset, timingResolution);

  return {
    cw,
    dcwdT,
    cwHalf,
    wedgeDensity,
    wedgeAtt,
    timingResolution,
    zeroOffset,
    timingOffset,
    warnings,
    trace: tr,
  };
}
