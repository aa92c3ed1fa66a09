/**
 * A catalogue pipe named as its own standard names it: copper tube by type and nominal size,
 * ductile iron by nominal size and pressure class, polyethylene by NPS and dimension ratio,
 * steel and PVC pipe by NPS and schedule.
 *
 * @module
 */

/** What {@link pipeDescription} reads of a resolved pipe. */
export interface DescribedPipe {
  /** `catalogue` or `measured`. */
  readonly origin: string;
  /** Standard as the catalogue names it (catalogue pipes). */
  readonly standard?: string;
  /** Nominal size (catalogue pipes). */
  readonly nps?: string;
  /** Schedule, type, class or DR (catalogue pipes). */
  readonly schedule?: string;
}

/**
 * The designation of a pipe in the words of its standard.
 *
 * - ASTM B88 (copper water tube): `ASTM B88 type L, nominal size 3 in` (the standard sizes
 *   tube by type K/L/M and nominal size, not by schedule);
 * - AWWA C151 (ductile iron): `AWWA C151 nominal size 24 in, pressure class 350`;
 * - a DR series (polyethylene): `<standard> NPS 8 DR 11`;
 * - otherwise (ASME B36.10M/B36.19M, ASTM D1785/F441): `<standard> NPS 4 schedule 40`;
 * - a measured pipe: `measured pipe`.
 *
 * @param p the pipe's origin, standard, size and schedule
 * @returns the designation
 *
 * @example
 * ```ts
 * import { pipeDescription } from "./describe.ts";
 * const d = pipeDescription({ origin: "catalogue", standard: "ASTM B88", nps: "3", schedule: "L" });
 * if (d !== "ASTM B88 type L, nominal size 3 in") throw new Error(d);
 * ```
 */
export function pipeDescription(p: DescribedPipe): string {
  if (p.origin !== "catalogue" || !p.standard) return "measured pipe";
  const sched = String(p.schedule ?? "").trim();
  if (/^ASTM B88\b/i.test(p.standard)) {
    const type = sched.replace(/^type\s*/i, "").toUpperCase();
    return `${p.standard} type ${type}, nominal size ${p.nps} in`;
  }
  if (/^AWWA C151\b/i.test(p.standard)) {
    const cls = /^PC\s*(\d+)$/i.exec(sched);
    return cls
      ? `${p.standard} nominal size ${p.nps} in, pressure class ${cls[1]}`
      : `${p.standard} nominal size ${p.nps} in, ${sched}`;
  }
  if (/^DR\b/i.test(sched)) return `${p.standard} NPS ${p.nps} ${sched}`;
  return `${p.standard} NPS ${p.nps} schedule ${sched}`;
}
