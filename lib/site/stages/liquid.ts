/**
 * Plan stage 2, the liquid: its state at the line temperature and pressure, with any site
 * overrides of sound speed, density and viscosity.
 *
 * Method: {@link liquidProperties} (the registry's formulation for the liquid, e.g. IAPWS-95 for
 * water); a stated sound speed carries no formulation spread.
 *
 * @module
 */
import type { Warning } from "../../errors.ts";
import { trace as traceEntry, type TraceEntry } from "../../trace.ts";
import { liquidProperties, type LiquidState } from "../../liquids/mod.ts";
import type { SiteInput } from "../schema.ts";

/** Input of {@link planLiquid}. */
export interface LiquidStageInput {
  /** The site file's fluid section (SI: K, Pa). */
  readonly fluid: SiteInput["fluid"];
}

/** Output of {@link planLiquid}. */
export interface LiquidStage {
  /** The liquid's state from its formulation. */
  readonly liq: LiquidState;
  /** Sound speed used, m/s. */
  readonly c: number;
  /** Density used, kg/m³. */
  readonly rho: number;
  /** Kinematic viscosity used, m²/s. */
  readonly nu: number;
  /** Half-width of the sound speed, m/s (0 when stated). */
  readonly cSpread: number;
  /** Warnings raised by this stage, in order. */
  readonly warnings: Warning[];
  /** Trace entries of this stage, in order. */
  readonly trace: TraceEntry[];
}

/**
 * The liquid's properties at the line state.
 *
 * @param input the fluid section of a site (temperature K, pressure Pa)
 * @returns sound speed (m/s), density (kg/m³), viscosity (m²/s) with warnings and trace
 * @throws {InputError} from the formulation outside its validity range
 * @example
 * ```ts
 * import { planLiquid } from "./liquid.ts";
 * const s = planLiquid({
 *   fluid: { liquid: "water", temperature: 293.15, pressure: 101325 },
 * } as unknown as Parameters<typeof planLiquid>[0]);
 * // water at 20 °C, 1 atm: about 1482 m/s (IAPWS-95, recalled)
 * if (Math.abs(s.c - 1482.3) > 1) throw new Error(String(s.c));
 * ```
 */
export function planLiquid(input: LiquidStageInput): LiquidStage {
  const fl = input.fluid;
  const T = fl.temperature;
  const tr: TraceEntry[] = [];
  const warnings: Warning[] = [];
  const liq: LiquidState = liquidProperties(fl.liquid, T, fl.pressure, {
    salinity: fl.salinity,
    formulation: fl.formulation,
    warnings,
  });
  if (liq.trace) { for (const e of liq.trace) tr.push(e); }
  const c = fl.soundSpeed ?? liq.soundSpeed;
  const rho = fl.density ?? liq.density;
  const nu = fl.kinematicViscosity ?? liq.kinematicViscosity;
  if (fl.soundSpeed !== undefined) {
    tr.push(traceEntry("liquid sound speed (site override)", c, "m/s", "site", "input"));
  }
  if (fl.density !== undefined) {
    tr.push(traceEntry("liquid density (site override)", rho, "kg/m^3", "site", "input"));
  }
  if (fl.kinematicViscosity !== undefined) {
    tr.push(traceEntry("liquid kinematic viscosity (site override)", nu, "m^2/s", "site", "input"));
  }
  const cSpread = fl.soundSpeed !== undefined ? 0 : liq.soundSpeedSpread;
  return { liq, c, rho, nu, cSpread, warnings, trace: tr };
}
