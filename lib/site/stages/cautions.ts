/**
 * Plan stage 9, the cautions: the safety and interpretation notes a plan carries, by line
 * temperature, pressure, liquid and lining. They defer to the site's permit-to-work system,
 * local codes and licensed practice (common practice).
 *
 * @module
 */

/** Input of {@link planCautions}: SI. */
export interface CautionsStageInput {
  /** Line temperature, K. */
  readonly temperature: number;
  /** Absolute pressure, Pa. */
  readonly pressure: number;
  /** Liquid id. */
  readonly liquid: string;
  /** Whether the pipe is lined. */
  readonly lined: boolean;
}

/** Output of {@link planCautions}. */
export interface CautionsStage {
  /** The cautions, general ones first. */
  readonly cautions: string[];
}

/**
 * The cautions of a plan: hot above 60 °C, cold below 5 °C, pressurised above 10 bar absolute,
 * lagging, confined spaces, process liquids (hazardous areas) and lined pipe (common practice).
 *
 * @param input line temperature (K), pressure (Pa, absolute), liquid id, lined or not
 * @returns the cautions
 * @example
 * ```ts
 * import { planCautions } from "./cautions.ts";
 * const { cautions } = planCautions({
 *   temperature: 363.15, pressure: 2e6, liquid: "water", lined: false,
 * });
 * // 90 °C and 20 bar: both the hot-line and the pressurised-line cautions
 * if (!cautions.some((c) => c.startsWith("Hot line (90 °C)"))) throw new Error();
 * if (!cautions.some((c) => c.startsWith("Pressurised line (20.0 bar"))) throw new Error();
 * ```
 */
export function planCautions(input: CautionsStageInput): CautionsStage {
  const { temperature: T, pressure: p, liquid, lined } = input;
  const out = [
    "Plans are estimates: installation-effect figures come from a model, not a calibration.",
    "Follow the site's permit-to-work system, local codes and licensed practice; they take precedence over this plan.",
  ];
  if (T > 333.15) {
    out.push(
      `Hot line (${
        (T - 273.15).toFixed(0)
      } °C): burn hazard; let lagging and surfaces be checked before contact.`,
    );
  }
  if (T < 273.15 + 5) out.push("Cold line: condensation and ice; frost-burn hazard on bare metal.");
  if (p > 1e6) {
    out.push(
      `Pressurised line (${
        (p / 1e5).toFixed(1)
      } bar absolute): never loosen fittings or tapping points.`,
    );
  }
  out.push(
    "Lifting insulation or lagging may expose hot surfaces or hazardous fibres: have it surveyed first.",
  );
  out.push(
    "Pits, chambers and vaults are confined spaces: gas test, permit and standby person first.",
  );
  if (!["water", "seawater"].includes(liquid)) {
    out.push(
      `Process liquid (${liquid}): check the hazardous-area classification and use certified equipment.`,
    );
  }
  if (lined) {
    out.push("Lined pipe: do not cut or drill to check the lining; use records or a fitting.");
  }
  return { cautions: out };
}
