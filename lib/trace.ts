/**
 * Traces: every constant and formulation a result used, with value, unit, source and basis.
 *
 * @module
 */

/** How a traced value got here: a registry basis, a user input, or a field measurement. */
export type TraceBasis =
  | "transcribed"
  | "computed"
  | "common-practice"
  | "recalled"
  | "input"
  | "measured";

/** One line of a result's trace. */
export interface TraceEntry {
  /** What the value is, for example `fluid sound speed` or `formulation: IAPWS-95`. */
  readonly quantity: string;
  /** The value (SI) or, for a formulation, its name. */
  readonly value: number | string;
  /** The SI unit of value, or "" for a dimensionless value or a name. */
  readonly unit: string;
  /** Source id in data/sources.yaml. */
  readonly source: string;
  /** How the value got here. */
  readonly basis: TraceBasis;
}

/**
 * Build a trace entry.
 *
 * @param quantity what the value is
 * @param value SI value or name
 * @param unit SI unit
 * @param source source id
 * @param basis basis
 * @returns a frozen trace entry
 *
 * @example
 * ```ts
 * import { trace } from "./trace.ts";
 * const t = trace("fluid sound speed", 1482.3, "m/s", "iapws-r6-95", "computed");
 * if (t.unit !== "m/s") throw new Error();
 * ```
 */
export function trace(
  quantity: string,
  value: number | string,
  unit: string,
  source: string,
  basis: TraceEntry["basis"],
): TraceEntry {
  return Object.freeze({ quantity, value, unit, source, basis });
}
