/**
 * Resolve a pipe's geometry, from the catalogue or from measurements on site, into SI with
 * its lining layers, applicable tolerances and a trace of every value used.
 *
 * @module
 */
import { checkRange, InputError, NotFoundError, type ValidityOptions } from "../errors.ts";
import type { Warning } from "../errors.ts";
import { defaultRegistry, type Registry } from "../registry/mod.ts";
import type { PipeRecord, PipeToleranceSet } from "../registry/q_pipes.ts";
import type { Basis } from "../registry/schemas/common.ts";
import { trace, type TraceEntry } from "../trace.ts";

/** One lining layer, innermost last. */
export interface PipeLiningLayer {
  /** Material id (materials room), for example "cement-mortar". */
  readonly material: string;
  /** Thickness (m). */
  readonly thickness: number;
}

/** A pipe from the catalogue. */
export interface PipeCatalogueSpec {
  /** Standard: name, id or alias, for example "ASME B36.10M". */
  readonly standard: string;
  /** Nominal size: "4", "1-1/2", 1.5. */
  readonly nps: string | number;
  /** Schedule, class, DR or type: "40", "STD", "DR 11", "L", "PC 350". */
  readonly schedule: string;
  /** Material id replacing the standard's default. */
  readonly material?: string;
  /**
   * Lining layer(s), outermost first, replacing the standard's default lining; `[]` for an
   * unlined pipe of a standard that normally comes lined.
   */
  readonly lining?: PipeLiningLayer | readonly PipeLiningLayer[];
}

/** A pipe described by measurements. */
export interface PipeMeasuredSpec {
  /** Outside diameter (m); give this or `circumference`. */
  readonly outsideDiameter?: number;
  /** Circumference taped round the pipe (m); OD = C/π − tape thickness. */
  readonly circumference?: number;
  /** Thickness of the tape used for the circumference (m), default 0. */
  readonly tapeThickness?: number;
  /** Wall thickness (m), for example from an ultrasonic thickness gauge. */
  readonly wallThickness: number;
  /** Pipe material id, for example "carbon-steel". */
  readonly material: string;
  /** Lining layer(s), outermost first. */
  readonly lining?: PipeLiningLayer | readonly PipeLiningLayer[];
  /** Standard uncertainty or ± band of the measurements (m), reported as the tolerances. */
  readonly uncertainty?: {
    readonly outsideDiameter?: number;
    readonly circumference?: number;
    readonly wallThickness?: number;
  };
  /**
   * Also apply a manufacturing-tolerance set (tolerance-set id, standard or material id),
   * for example to bound a wall that was not measured everywhere. Ignored when `uncertainty`
   * is given.
   */
  readonly toleranceFrom?: string;
}

/** What {@link pipe} takes. */
export type PipeSpec = PipeCatalogueSpec | PipeMeasuredSpec;

/** One side pair of a tolerance (m); a side left out is not limited. */
export interface PipeToleranceSides {
  /** Plus side (m). */
  readonly plus?: number;
  /** Minus side (m), a positive number. */
  readonly minus?: number;
}

/** The tolerances that apply to a resolved pipe. */
export interface PipeTolerances {
  /** Manufacturing tolerances of a standard, or the stated uncertainty of measurements. */
  readonly origin: "manufacturing" | "measurement";
  /** Tolerance-set id, for manufacturing tolerances. */
  readonly set?: string;
  /** Source id, for manufacturing tolerances. */
  readonly source?: string;
  /** Basis of the tolerance data, or "measured". */
  readonly basis: Basis | "measured";
  /** Outside diameter ± (m). */
  readonly outsideDiameter: PipeToleranceSides;
  /** Wall thickness ± (m). */
  readonly wallThickness: PipeToleranceSides;
}

/** A resolved pipe, SI. */
export interface ResolvedPipe {
  /** Where the geometry came from. */
  readonly origin: "catalogue" | "measured";
  /** Standard's display name (catalogue only). */
  readonly standard?: string;
  /** Standard's id (catalogue only). */
  readonly standardId?: string;
  /** Nominal size (catalogue only). */
  readonly nps?: string;
  /** Size as the trade writes it, "NPS 4" or "4 in" (catalogue only). */
  readonly sizeLabel?: string;
  /** Schedule (catalogue only). */
  readonly schedule?: string;
  /** Outside diameter (m). */
  readonly outsideDiameter: number;
  /** Wall thickness (m). */
  readonly wallThickness: number;
  /** Inside diameter of the pipe wall = OD − 2·wall (m). */
  readonly insideDiameter: number;
  /** Bore the liquid fills = inside diameter − 2·Σ lining thickness (m). */
  readonly boreDiameter: number;
  /** Pipe material id. */
  readonly material: string;
  /** Lining layers, outermost first (empty when unlined). */
  readonly lining: readonly PipeLiningLayer[];
  /** Tolerances that apply, when known. */
  readonly tolerances?: PipeTolerances;
  /** Every value used, with unit, source and basis. */
  readonly trace: readonly TraceEntry[];
  /** Warnings (for example a size outside the plausible range, when extrapolating). */
  readonly warnings: readonly Warning[];
}

/** Options of {@link pipe}. */
export interface PipeOptions extends ValidityOptions {
  /** Registry to resolve catalogue pipes against (default: the bundled one). */
  readonly registry?: Registry;
}

/** Outside diameters this module accepts without `extrapolate` (m). */
export const PLAUSIBLE_OUTSIDE_DIAMETER: readonly [number, number] = [0.003, 6];

const GEOMETRY = "pipe geometry (plausible clamp-on range)";

function layers(
  lining: PipeLiningLayer | readonly PipeLiningLayer[] | undefined,
): PipeLiningLayer[] {
  if (lining === undefined || lining === null) return [];
  const list = Array.isArray(lining) ? lining : [lining as PipeLiningLayer];
  return list.map((l, i) => {
    const field = `lining[${i}]`;
    if (!l || typeof l !== "object") {
      throw new InputError(field, String(l), "{ material, thickness (m) }");
    }
    if (typeof l.material !== "string" || l.material.trim() === "") {
      throw new InputError(
        `${field}.material`,
        String(l.material),
        'a material id such as "cement-mortar"',
      );
    }
    if (typeof l.thickness !== "number" || !Number.isFinite(l.thickness) || !(l.thickness > 0)) {
      throw new InputError(
        `${field}.thickness`,
        String(l.thickness),
        "a thickness greater than 0 (m)",
      );
    }
    return Object.freeze({ material: l.material, thickness: l.thickness });
  });
}

function positive(field: string, v: unknown): number {
  if (typeof v !== "number" || !Number.isFinite(v) || !(v > 0)) {
    throw new InputError(field, String(v), "a finite length greater than 0 (m)");
  }
  return v;
}

function manufacturing(
  set: PipeToleranceSet,
  od: number,
  wall: number,
): PipeTolerances | undefined {
  const rule = set.rules.find((r) => od <= r.odMax + 1e-12);
  if (!rule) return undefined;
  const side = (
    b: { plus?: number; minus?: number; plusFraction?: number; minusFraction?: number },
    nominal: number,
  ): PipeToleranceSides => {
    const plus = b.plus ?? (b.plusFraction !== undefined ? b.plusFraction * nominal : undefined);
    const minus = b.minus ??
      (b.minusFraction !== undefined ? b.minusFraction * nominal : undefined);
    return Object.freeze({
      ...(plus !== undefined ? { plus } : {}),
      ...(minus !== undefined ? { minus } : {}),
    });
  };
  return Object.freeze({
    origin: "manufacturing",
    set: set.id,
    source: set.source,
    basis: set.basis,
    outsideDiameter: side(rule.outsideDiameter, od),
    wallThickness: side(rule.wall, wall),
  });
}

/** Refuse a material the registry does not hold (the error suggests the nearest names). */
function knownMaterial(reg: Registry, id: string): void {
  reg.material(id);
}

function findTolerance(reg: Registry, key: string): PipeToleranceSet | undefined {
  try {
    return reg.pipeTolerance(key);
  } catch (e) {
    if (e instanceof NotFoundError) return undefined;
    throw e;
  }
}

function finish(
  base: Omit<ResolvedPipe, "boreDiameter" | "trace" | "warnings" | "lining">,
  lining: readonly PipeLiningLayer[],
  entries: TraceEntry[],
  liningSource: { source: string; basis: TraceEntry["basis"] },
  warnings: Warning[],
): ResolvedPipe {
  const { outsideDiameter: od, wallThickness: wall } = base;
  if (!(wall < od / 2)) {
    throw new InputError(
      "wallThickness",
      `${wall} m with outside diameter ${od} m`,
      `a wall thinner than the radius (${od / 2} m)`,
    );
  }
  const id = od - 2 * wall;
  let bore = id;
  lining.forEach((l, i) => {
    bore -= 2 * l.thickness;
    entries.push(
      trace(
        `lining ${i + 1} thickness (${l.material})`,
        l.thickness,
        "m",
        liningSource.source,
        liningSource.basis,
      ),
    );
  });
  if (!(bore > 1e-9 * od)) {
    throw new InputError(
      "lining",
      `${lining.map((l) => l.thickness).join(" + ")} m inside a pipe of inside diameter ${id} m`,
      `lining thinner in total than the inside radius (${id / 2} m)`,
    );
  }
  entries.push(trace("inside diameter (OD − 2·wall)", id, "m", "snellpath-computed", "computed"));
  if (lining.length) {
    entries.push(
      trace("bore diameter (ID − 2·Σ lining)", bore, "m", "snellpath-computed", "computed"),
    );
  }
  return Object.freeze({
    ...base,
    insideDiameter: id,
    boreDiameter: bore,
    lining: Object.freeze([...lining]),
    trace: Object.freeze(entries),
    warnings: Object.freeze(warnings),
  });
}

function fromCatalogue(spec: PipeCatalogueSpec, reg: Registry): ResolvedPipe {
  const rec: PipeRecord = reg.pipe({
    standard: spec.standard,
    nps: spec.nps,
    schedule: spec.schedule,
  });
  const entries: TraceEntry[] = [
    trace(
      `outside diameter (${rec.standard} ${rec.sizeLabel})`,
      rec.outsideDiameter,
      "m",
      rec.provenance.outsideDiameter.source,
      rec.provenance.outsideDiameter.basis,
    ),
    trace(
      `wall thickness (${rec.standard} ${rec.sizeLabel}, ${rec.schedule})`,
      rec.wallThickness,
      "m",
      rec.provenance.wallThickness.source,
      rec.provenance.wallThickness.basis,
    ),
  ];
  let lining: PipeLiningLayer[];
  let liningSource: { source: string; basis: TraceEntry["basis"] };
  if (spec.lining !== undefined) {
    lining = layers(spec.lining);
    liningSource = { source: "input", basis: "input" };
  } else if (rec.lining) {
    lining = [Object.freeze({ material: rec.lining.material, thickness: rec.lining.thickness })];
    liningSource = { source: rec.lining.source, basis: rec.lining.basis };
  } else {
    lining = [];
    liningSource = { source: "input", basis: "input" };
  }
  const material = spec.material ?? rec.material;
  if (spec.material !== undefined) knownMaterial(reg, spec.material);
  const set = findTolerance(reg, rec.standardId) ?? findTolerance(reg, material);
  const tolerances = set ? manufacturing(set, rec.outsideDiameter, rec.wallThickness) : undefined;
  return finish(
    {
      origin: "catalogue",
      standard: rec.standard,
      standardId: rec.standardId,
      nps: rec.nps,
      sizeLabel: rec.sizeLabel,
      schedule: rec.schedule,
      outsideDiameter: rec.outsideDiameter,
      wallThickness: rec.wallThickness,
      insideDiameter: rec.insideDiameter,
      material,
      ...(tolerances ? { tolerances } : {}),
    },
    lining,
    entries,
    liningSource,
    [],
  );
}

function fromMeasurements(
  spec: PipeMeasuredSpec,
  reg: Registry,
  options?: PipeOptions,
): ResolvedPipe {
  const hasOd = spec.outsideDiameter !== undefined;
  const hasC = spec.circumference !== undefined;
  if (hasOd === hasC) {
    throw new InputError(
      "outsideDiameter/circumference",
      hasOd ? "both" : "neither",
      "exactly one of outsideDiameter or circumference (m)",
    );
  }
  if (typeof spec.material !== "string" || spec.material.trim() === "") {
    throw new InputError(
      "material",
      String(spec.material),
      'a pipe material id such as "carbon-steel"',
    );
  }
  const entries: TraceEntry[] = [];
  knownMaterial(reg, spec.material);
  let od: number;
  if (hasC) {
    const c = positive("circumference", spec.circumference);
    const tape = spec.tapeThickness ?? 0;
    if (typeof tape !== "number" || !Number.isFinite(tape) || tape < 0) {
      throw new InputError("tapeThickness", String(tape), "a thickness of 0 or more (m)");
    }
    od = c / Math.PI - tape;
    if (!(od > 0)) {
      throw new InputError(
        "tapeThickness",
        String(tape),
        `less than circumference/π (${c / Math.PI} m)`,
      );
    }
    entries.push(trace("circumference (taped)", c, "m", "measurement", "measured"));
    if (tape > 0) entries.push(trace("tape thickness", tape, "m", "measurement", "measured"));
    entries.push(trace("outside diameter (C/π − tape)", od, "m", "snellpath-computed", "computed"));
  } else {
    od = positive("outsideDiameter", spec.outsideDiameter);
    entries.push(trace("outside diameter", od, "m", "measurement", "measured"));
  }
  const warnings: Warning[] = [];
  checkRange("outside diameter", od, PLAUSIBLE_OUTSIDE_DIAMETER, "m", GEOMETRY, {
    extrapolate: options?.extrapolate,
    warnings,
  });
  options?.warnings?.push(...warnings);
  const wall = positive("wallThickness", spec.wallThickness);
  entries.push(trace("wall thickness", wall, "m", "measurement", "measured"));
  const lining = layers(spec.lining);

  let tolerances: PipeTolerances | undefined;
  const u = spec.uncertainty;
  if (u) {
    const odU = u.outsideDiameter ??
      (u.circumference !== undefined ? u.circumference / Math.PI : undefined);
    for (const [k, v] of Object.entries(u)) {
      if (v !== undefined && (typeof v !== "number" || !Number.isFinite(v) || v < 0)) {
        throw new InputError(`uncertainty.${k}`, String(v), "a length of 0 or more (m)");
      }
    }
    tolerances = Object.freeze({
      origin: "measurement",
      basis: "measured",
      outsideDiameter: Object.freeze(odU !== undefined ? { plus: odU, minus: odU } : {}),
      wallThickness: Object.freeze(
        u.wallThickness !== undefined ? { plus: u.wallThickness, minus: u.wallThickness } : {},
      ),
    });
  } else if (spec.toleranceFrom !== undefined) {
    const set = reg.pipeTolerance(spec.toleranceFrom);
    tolerances = manufacturing(set, od, wall);
  }
  return finish(
    {
      origin: "measured",
      outsideDiameter: od,
      wallThickness: wall,
      insideDiameter: od - 2 * wall,
      material: spec.material,
      ...(tolerances ? { tolerances } : {}),
    },
    lining,
    entries,
    { source: "input", basis: "input" },
    warnings,
  );
}

/**
 * The catalogue standard assumed when a pipe names only its size and schedule: ASME B36.19M for
 * a stainless schedule with the `S` suffix (5S, 10S, 40S, 80S), ASME B36.10M otherwise. Common
 * practice; the site reader and the scripts use the same rule and say so when they apply it.
 *
 * @param schedule the schedule as written (`"40"`, `"10S"`, `"Sch 40S"`, `"STD"`)
 * @returns the standard's display name
 * @example
 * ```ts
 * import { defaultStandard } from "./resolve.ts";
 * if (defaultStandard("10S") !== "ASME B36.19M") throw new Error();
 * if (defaultStandard("40") !== "ASME B36.10M") throw new Error();
 * ```
 */
export function defaultStandard(schedule: string): string {
  const s = String(schedule).trim().replace(/^sch(edule)?\.?\s*/i, "");
  return /^\d+S$/i.test(s) ? "ASME B36.19M" : "ASME B36.10M";
}

/**
 * Resolve a pipe from the catalogue or from measurements into SI geometry.
 *
 * - Catalogue: `{ standard, nps, schedule }` looked up in the registry (data/pipes/*.yaml);
 *   the standard's default lining applies unless `lining` is given. Tolerances: the standard's
 *   manufacturing-tolerance set (data/pipes/tolerances.yaml), the rule for its OD.
 * - Measured: outside diameter, or circumference taped round the pipe with
 *   OD = C/π − t_tape (the tape's mid-thickness runs on a diameter OD + t_tape), and wall
 *   thickness; lining layers as given. Tolerances: the measurement uncertainty given, or a
 *   manufacturing-tolerance set named by `toleranceFrom`.
 *
 * Inside diameter ID = OD − 2·wall; bore diameter = ID − 2·Σ lining thickness.
 *
 * Units: every length in m. Validity: wall < OD/2 and Σ lining < ID/2 (else InputError naming
 * the field); measured OD within 3 mm–6 m (else OutOfRangeError, or a warning with
 * `{ extrapolate: true, warnings }`).
 *
 * Sources: the catalogue record's own (asme-b36.10m-2018, asme-b36.19m-2018, astm-d1785,
 * astm-f441, astm-f2619, astm-f714, awwa-c151, awwa-c104, astm-b88); tolerances astm-a530,
 * astm-a53, astm-a999 and the standards above; computed values snellpath-computed. Measured
 * values carry source "measurement", basis "measured"; lining layers given by the caller
 * source "input", basis "input".
 *
 * @param spec a {@link PipeCatalogueSpec} or a {@link PipeMeasuredSpec}
 * @param options registry to use; extrapolation opt-in for the plausible-size check
 * @returns the resolved pipe with tolerances and trace
 *
 * @example
 * ```ts
 * import { pipe } from "./resolve.ts";
 * const p = pipe({ standard: "ASME B36.10M", nps: "4", schedule: "40" });
 * if (Math.abs(p.insideDiameter - 0.10226) > 1e-9) throw new Error("ID");
 * const m = pipe({ circumference: 0.359, wallThickness: 0.006, material: "carbon-steel",
 *   lining: { material: "cement-mortar", thickness: 0.008 } });
 * if (Math.abs(m.outsideDiameter - 0.359 / Math.PI) > 1e-12) throw new Error("OD");
 * if (Math.abs(m.boreDiameter - (m.insideDiameter - 0.016)) > 1e-12) throw new Error("bore");
 * ```
 */
export function pipe(spec: PipeSpec, options?: PipeOptions): ResolvedPipe {
  if (!spec || typeof spec !== "object") {
    throw new InputError("pipe", String(spec), "{ standard, nps, schedule } or measured sizes");
  }
  const reg = options?.registry ?? defaultRegistry();
  const s = spec as Partial<PipeCatalogueSpec & PipeMeasuredSpec>;
  const catalogue = s.standard !== undefined || s.nps !== undefined || s.schedule !== undefined;
  const measured = s.outsideDiameter !== undefined || s.circumference !== undefined ||
    s.wallThickness !== undefined;
  if (catalogue && measured) {
    throw new InputError(
      "pipe",
      "both catalogue keys (standard/nps/schedule) and measured sizes",
      "one way of describing the pipe",
    );
  }
  if (catalogue) {
    for (const k of ["standard", "nps", "schedule"] as const) {
      if (s[k] === undefined) {
        throw new InputError(k, "nothing", `the ${k} with the other catalogue keys`);
      }
    }
    return fromCatalogue(spec as PipeCatalogueSpec, reg);
  }
  if (s.wallThickness === undefined) {
    throw new InputError(
      "wallThickness",
      "nothing",
      "a wall thickness with outsideDiameter or circumference (or a catalogue standard/nps/schedule)",
    );
  }
  return fromMeasurements(spec as PipeMeasuredSpec, reg, options);
}
