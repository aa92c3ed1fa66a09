/**
 * Flow-room constants read once from the registry (data/flow/*.yaml) and frozen.
 *
 * @module
 */
import { defaultRegistry } from "../registry/mod.ts";

/** Constants used by lib/flow, with the source ids they came from. */
export interface FlowConstants {
  /** Nikuradse/Schlichting table: ln(Re) of each row. */
  readonly nTableLnRe: Float64Array;
  /** Nikuradse/Schlichting table: exponent n of each row. */
  readonly nTableN: Float64Array;
  /** Spread (half-width) on n stated with the table. */
  readonly nSpread: number;
  /** Source id and basis of the n table. */
  readonly nSource: string;
  /** The n basis. */
  readonly nBasis: string;
  /** von Kármán constant κ and log-law intercept B. */
  readonly kappa: number;
  /** The log law b. */
  readonly logLawB: number;
  /** The log law source. */
  readonly logLawSource: string;
  /** The log law basis. */
  readonly logLawBasis: string;
  /** Regime limits on Re. */
  readonly laminarLimit: number;
  /** The colebrook limit. */
  readonly colebrookLimit: number;
  /** The turbulent limit. */
  readonly turbulentLimit: number;
  /** The reynolds max. */
  readonly reynoldsMax: number;
  /** The relative roughness max. */
  readonly relativeRoughnessMax: number;
}

let cached: FlowConstants | undefined;

/**
 * The flow constants from the bundled registry (tables `nikuradse-power-law-n`,
 * coefficient sets `log-law` and `flow-regimes`), loaded on first use.
 *
 * @returns frozen constants
 *
 * @example
 * ```ts
 * import { flowConstants } from "./constants.ts";
 * const c = flowConstants();
 * if (c.laminarLimit !== 2000) throw new Error("laminar limit");
 * ```
 */
export function flowConstants(): FlowConstants {
  if (cached) return cached;
  const reg = defaultRegistry();
  const table = reg.table("nikuradse-power-law-n");
  const rows = [...table.rows].sort((a, b) => (a.reynolds as number) - (b.reynolds as number));
  const log = reg.coefficients("log-law");
  const lim = reg.coefficients("flow-regimes").coefficients;
  cached = Object.freeze({
    nTableLnRe: Float64Array.from(rows, (r) => Math.log(r.reynolds as number)),
    nTableN: Float64Array.from(rows, (r) => r.n as number),
    nSpread: Math.max(...rows.map((r) => (r.spread as number | undefined) ?? 0)),
    nSource: table.source,
    nBasis: table.basis,
    kappa: log.coefficients.kappa,
    logLawB: log.coefficients.B,
    logLawSource: log.source,
    logLawBasis: log.basis,
    laminarLimit: lim.laminarLimit,
    colebrookLimit: lim.colebrookLimit,
    turbulentLimit: lim.turbulentLimit,
    reynoldsMax: lim.reynoldsMax,
    relativeRoughnessMax: lim.relativeRoughnessMax,
  });
  return cached;
}
