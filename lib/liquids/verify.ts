/**
 * Run the published seawater verification tables in data/seawater/ (kind `verification`) against
 * this room's implementations: TEOS-10 check values (75-term sound speed, Gibbs-function sound
 * speed, conservative temperature) and the UNESCO 1983 check value.
 *
 * @module
 */
import { InputError } from "../errors.ts";
import { defaultRegistry } from "../registry/mod.ts";
import {
  checkVerificationTable,
  type RowEvaluator,
  type VerificationCheck,
} from "../registry/verify.ts";
import { conservativeTemperature, P0, soundSpeedGibbs, T0 } from "./gibbs.ts";
import { soundSpeed75 } from "./seawater.ts";
import { soundSpeedUnesco1983 } from "./unesco.ts";

/** One checked cell of a seawater verification table. */
export type SeawaterCheck = VerificationCheck;

/** Evaluators by the table's `formulation` field; inputs in the tables' units (g/kg, °C, dbar). */
const EVALUATORS: Readonly<Record<string, RowEvaluator>> = {
  "TEOS-10 75-term sound speed": (r) => ({ c: soundSpeed75(r.SA / 1000, r.CT, r.p * 1e4) }),
  "TEOS-10 Gibbs function sound speed": (r) => ({
    c: soundSpeedGibbs(r.SA / 1000, r.t + T0, r.p * 1e4 + P0),
  }),
  "TEOS-10 conservative temperature": (r) => ({
    CT: conservativeTemperature(r.SA / 1000, r.t + T0, r.p * 1e4 + P0),
  }),
  "UNESCO 1983 sound speed": (r) => ({
    c: soundSpeedUnesco1983(
      r.S,
      T0 + r.t68 / defaultRegistry().coefficients("water-t68-from-t90").coefficients.factor,
      P0 + r.p * 1e4,
    ),
  }),
};

/** The `formulation` names of verification tables this module can run. */
export const SEAWATER_VERIFICATION_FORMULATIONS: readonly string[] = Object.keys(EVALUATORS);

/**
 * Check one seawater verification table (by id) cell by cell against this room's code.
 *
 * Sources: per table (ioc-teos10-2010 check values shipped with python3-gsw; fofonoff-millard-1983).
 *
 * @param id verification table id, for example "seawater-unesco1983-check"
 * @returns one check per output cell
 *
 * @example
 * ```ts
 * import { verifySeawaterTable } from "./verify.ts";
 * const checks = verifySeawaterTable("seawater-unesco1983-check");
 * if (!checks.every((c) => c.ok)) throw new Error(JSON.stringify(checks));
 * ```
 */
export function verifySeawaterTable(id: string): SeawaterCheck[] {
  const t = defaultRegistry().verification(id);
  const evaluate = EVALUATORS[t.formulation as string];
  if (!evaluate) {
    throw new InputError(
      "table",
      JSON.stringify(id),
      `a table whose formulation is one of: ${SEAWATER_VERIFICATION_FORMULATIONS.join(", ")}`,
    );
  }
  return checkVerificationTable(t, evaluate);
}
