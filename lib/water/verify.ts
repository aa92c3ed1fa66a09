/**
 * Run the published water verification tables in data/water/ (kind `verification`) against
 * this project's implementations: IAPWS R6-95 Tables 6 and 7, IAPWS R7-97 Table 5,
 * IAPWS R12-08 Table 4.
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
import { iapws95Helmholtz, iapws95State } from "./iapws95.ts";
import { if97Region1 } from "./if97.ts";
import { iapws2008Viscosity } from "./viscosity.ts";

/** One checked cell of a water verification table. */
export type WaterCheck = VerificationCheck;

/** Ids of the water verification tables this module can run. */
export const WATER_VERIFICATION_TABLES = [
  "water-iapws95-table6",
  "water-iapws95-table7",
  "water-if97-table5",
  "water-iapws2008-table4",
] as const;

/** Factor from a table's unit to SI, for the units these tables use. */
const TO_SI: Readonly<Record<string, number>> = {
  "K": 1,
  "kg/m^3": 1,
  "m/s": 1,
  "m^3/kg": 1,
  "1": 1,
  "MPa": 1e6,
  "kJ/kg": 1e3,
  "kJ/(kg*K)": 1e3,
  "uPa s": 1e-6,
};

const EVALUATORS: Readonly<Record<string, RowEvaluator>> = {
  "water-iapws95-table6": (r) => {
    const h = iapws95Helmholtz(r.T, r.rho);
    const names = ["", "_d", "_dd", "_t", "_tt", "_dt"];
    const out: Record<string, number> = {};
    names.forEach((n, i) => {
      out["phi0" + n] = h.ideal[i];
      out["phir" + n] = h.residual[i];
    });
    return out;
  },
  "water-iapws95-table7": (r) => {
    const s = iapws95State(r.T, r.rho);
    return { p: s.p, cv: s.cv, w: s.w, s: s.s };
  },
  "water-if97-table5": (r) => {
    const s = if97Region1(r.T, r.p * 1e6);
    return { v: s.v, h: s.h, u: s.u, s: s.s, cp: s.cp, w: s.w };
  },
  "water-iapws2008-table4": (r) => ({ mu: iapws2008Viscosity(r.T, r.rho) }),
};

/**
 * Check one published water verification table: evaluate every row with the formulation it
 * belongs to, convert to the table's units, compare with the table's relative tolerance.
 *
 * Sources: the table's own source (iapws-r6-95, iapws-r7-97, iapws-r12-08).
 *
 * @param id a table id from {@link WATER_VERIFICATION_TABLES}
 * @returns one check per output cell
 *
 * @example
 * ```ts
 * import { verifyWaterTable } from "./verify.ts";
 * const checks = verifyWaterTable("water-if97-table5");
 * if (checks.length !== 18 || !checks.every((c) => c.ok)) throw new Error("IF97 Table 5");
 * ```
 */
export function verifyWaterTable(id: string): WaterCheck[] {
  const evaluate = EVALUATORS[id];
  if (!evaluate) {
    throw new InputError(
      "table",
      JSON.stringify(id),
      `one of ${WATER_VERIFICATION_TABLES.join(", ")}`,
    );
  }
  return checkVerificationTable(defaultRegistry().verification(id), evaluate, (x, col, unit) => {
    const f = TO_SI[unit];
    if (f === undefined) {
      throw new InputError(`${id} column ${col}`, unit, Object.keys(TO_SI).join(", "));
    }
    return x / f;
  });
}
