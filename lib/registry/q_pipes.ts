/**
 * Registry queries for the pipe catalogue and manufacturing tolerances: registry.pipe(),
 * registry.pipes(), registry.pipeStandards(), registry.pipeStandard(), registry.pipeTolerance().
 *
 * Sizes are accepted as the trade writes them ("1-1/2", "1 1/2", "1.5", 1.5, "NPS 4", `4"`);
 * standards by name, id or alias, ignoring case, spaces and punctuation ("B36.10M",
 * "asme b36.10", "hdpe"); schedules in the usual forms ("40", "Sch 40", "sch40", "STD",
 * "extra strong", "40S", "DR 11", "SDR11", "Type L", "Class 350"). A miss names what exists
 * nearby.
 *
 * @module
 */
import { InputError, NotFoundError } from "../errors.ts";
import type { LoadedRegistry } from "./load.ts";
import { nearest } from "./nearest.ts";
import type { Basis } from "./schemas/common.ts";
import type { PipesFile } from "./schemas/pipes.ts";
import { sizeValue } from "./schemas/values.ts";
import type { ToleranceSet } from "./schemas/tolerances.ts";

/** Millimetres to metres by division, so that 114.3 mm prints as 0.1143 m. */
const mm = (x: number): number => x / 1000;

/** Provenance of one catalogue quantity. */
export interface PipeProvenance {
  /** Source id in data/sources.yaml. */
  readonly source: string;
  /** How the value got here. */
  readonly basis: Basis;
  /** Half-width of its spread (m), for recalled values. */
  readonly spread?: number;
}

/** A lining layer of a catalogue pipe, SI. */
export interface PipeLiningRecord {
  /** Material id (materials room). */
  readonly material: string;
  /** Thickness (m). */
  readonly thickness: number;
  /** Source id. */
  readonly source: string;
  /** Basis. */
  readonly basis: Basis;
  /** Half-width of the spread on the thickness (m), when stated. */
  readonly spread?: number;
}

/** One catalogue pipe: a size and schedule of a standard, SI. */
export interface PipeRecord {
  /** Standard's display name, for example "ASME B36.10M". */
  readonly standard: string;
  /** Standard's id (its data file's `id`), for example "asme-b36-10m". */
  readonly standardId: string;
  /** Nominal size as the standard writes it, for example "1-1/2". */
  readonly nps: string;
  /** Nominal size as a number of inches (nominal, not a length). */
  readonly nominalSize: number;
  /** Label of the size as the trade writes it: "NPS 4" or "4 in" (tube, ductile iron). */
  readonly sizeLabel: string;
  /** Schedule, class, DR or type as the catalogue writes it, for example "40", "DR 11". */
  readonly schedule: string;
  /** Outside diameter (m). */
  readonly outsideDiameter: number;
  /** Wall thickness (m): nominal, or the minimum where the standard tabulates minimum walls. */
  readonly wallThickness: number;
  /** Inside diameter = outside diameter − 2·wall (m), before any lining. */
  readonly insideDiameter: number;
  /** Default material id. */
  readonly material: string;
  /** Default lining, where the standard's pipe comes lined. */
  readonly lining?: PipeLiningRecord;
  /** Source id of the standard. */
  readonly source: string;
  /** The weaker basis of outside diameter and wall. */
  readonly basis: Basis;
  /** Where our copy came from, when transcribed from a copy. */
  readonly copy?: string;
  /** Provenance per quantity. */
  readonly provenance: {
    readonly outsideDiameter: PipeProvenance;
    readonly wallThickness: PipeProvenance;
  };
}

/** What a standard in the catalogue offers. */
export interface PipeStandardInfo {
  /** Id (data file `id`). */
  readonly id: string;
  /** Display name. */
  readonly standard: string;
  /** Title. */
  readonly title: string;
  /** Other names accepted. */
  readonly aliases: readonly string[];
  /** What its sizes mean (NPS, nominal size). */
  readonly sizeSystem: string;
  /** Default material id. */
  readonly material: string;
  /** Source id. */
  readonly source: string;
  /** Basis of the outside diameters. */
  readonly basis: Basis;
  /** Copy, when transcribed from one. */
  readonly copy?: string;
  /** Schedules in order of growing wall, one list per series. */
  readonly series: readonly (readonly string[])[];
  /** Sizes, smallest first. */
  readonly sizes: readonly string[];
  /** Default lining material, if any. */
  readonly liningMaterial?: string;
}

/** One side pair of a tolerance, SI: absolute (m) or a fraction of nominal. */
export interface ToleranceBandSI {
  /** Plus side (m). */
  readonly plus?: number;
  /** Minus side (m), a positive number. */
  readonly minus?: number;
  /** Plus side as a fraction of nominal. */
  readonly plusFraction?: number;
  /** Minus side as a fraction of nominal, a positive number. */
  readonly minusFraction?: number;
}

/** One size band of a tolerance set, SI. */
export interface PipeToleranceRule {
  /** Applies to outside diameters up to this (m), above the previous rule's. */
  readonly odMax: number;
  /** Outside-diameter tolerance. */
  readonly outsideDiameter: ToleranceBandSI;
  /** Wall tolerance. */
  readonly wall: ToleranceBandSI;
}

/** A manufacturing-tolerance set, SI. */
export interface PipeToleranceSet {
  /** Id. */
  readonly id: string;
  /** Title. */
  readonly title: string;
  /** Standard ids it is the default for. */
  readonly standards: readonly string[];
  /** Material ids it is the default for. */
  readonly materials: readonly string[];
  /** Source id. */
  readonly source: string;
  /** Basis. */
  readonly basis: Basis;
  /** Note. */
  readonly note?: string;
  /** Size bands, ascending. */
  readonly rules: readonly PipeToleranceRule[];
}

/** What {@link pipeQueries}' `pipe` takes. */
export interface PipeQuery {
  /** Standard: name, id or alias, for example "ASME B36.10M". */
  readonly standard: string;
  /** Nominal size: "4", "1-1/2", "1 1/2", "1.5", 1.5. */
  readonly nps: string | number;
  /** Schedule, class, DR or type: "40", "Sch 40", "STD", "DR 11", "L", "PC 350". */
  readonly schedule: string;
}

/** Filter for {@link pipeQueries}' `pipes`. */
export interface PipeFilter {
  /** Standard name, id or alias. */
  readonly standard?: string;
  /** Nominal size. */
  readonly nps?: string | number;
  /** Schedule. */
  readonly schedule?: string;
  /** Default material id. */
  readonly material?: string;
}

/** The pipe-catalogue queries merged into the registry object. */
export interface PipeQueries {
  /**
   * One catalogue pipe by standard, nominal size and schedule (SI). A miss throws a
   * NotFoundError naming what exists nearby (sizes near an unknown size, schedules at a size).
   */
  pipe(query: PipeQuery): PipeRecord;
  /** Every catalogue pipe matching a filter (all when none), ordered by standard, size, series. */
  pipes(filter?: PipeFilter): PipeRecord[];
  /** Every standard in the catalogue. */
  pipeStandards(): PipeStandardInfo[];
  /** One standard by name, id or alias. */
  pipeStandard(name: string): PipeStandardInfo;
  /**
   * The manufacturing-tolerance set for a tolerance-set id, a standard (name, id or alias)
   * or a material id, in that order of lookup.
   */
  pipeTolerance(standardOrMaterial: string): PipeToleranceSet;
}

const UNICODE_FRACTIONS: Record<string, string> = {
  "½": "1/2",
  "¼": "1/4",
  "¾": "3/4",
  "⅛": "1/8",
  "⅜": "3/8",
  "⅝": "5/8",
  "⅞": "7/8",
};

/**
 * Read a nominal pipe size as the trade writes it and return it as a number of inches
 * (nominal). Accepts whole numbers, decimals, fractions and mixed numbers with a hyphen or a
 * space ("1-1/2", "1 1/2"), an "NPS" prefix, an inch mark or "in" suffix, and ½-style glyphs.
 *
 * Method: text parsing only; no source needed. Validity: sizes > 0.
 *
 * @param nps the size (text or number)
 * @returns the nominal size as a number (for example 1.5)
 * @throws InputError when the text is not a size
 *
 * @example
 * ```ts
 * import { parseNominalSize } from "./q_pipes.ts";
 * if (parseNominalSize("1-1/2") !== 1.5) throw new Error();
 * if (parseNominalSize("1 1/2") !== 1.5) throw new Error();
 * if (parseNominalSize("NPS 4") !== 4) throw new Error();
 * ```
 */
export function parseNominalSize(nps: string | number): number {
  if (typeof nps === "number") {
    if (Number.isFinite(nps) && nps > 0) return nps;
    throw new InputError("nps", String(nps), 'a nominal size greater than 0, such as 4 or "1-1/2"');
  }
  let s = String(nps).trim();
  for (const [g, f] of Object.entries(UNICODE_FRACTIONS)) s = s.replace(g, ` ${f}`);
  s = s.replace(/^(nps|dn\s*in|size)\s*/i, "").replace(/\s*(in\.?|inch(es)?|"|″)$/i, "").trim();
  let v = NaN;
  let m: RegExpExecArray | null;
  if ((m = /^(\d+)\s*[- ]\s*(\d+)\s*\/\s*(\d+)$/.exec(s))) {
    v = Number(m[1]) + Number(m[2]) / Number(m[3]);
  } else if ((m = /^(\d+)\s*\/\s*(\d+)$/.exec(s))) {
    v = Number(m[1]) / Number(m[2]);
  } else if (/^\d+(\.\d+)?$|^\.\d+$/.test(s)) {
    v = Number(s);
  }
  if (!Number.isFinite(v) || !(v > 0)) {
    throw new InputError(
      "nps",
      JSON.stringify(String(nps)),
      'a nominal size such as 4, "1-1/2", "1 1/2" or 1.5',
    );
  }
  return v;
}

/** Normal form of a standard's name: lower case, letters and digits only. */
function normStandard(s: string): string {
  return s.toLowerCase().replace(/[^a-z0-9]/g, "");
}

const SCHEDULE_ALIASES: Record<string, string> = {
  STANDARD: "STD",
  STANDARDWEIGHT: "STD",
  STDWT: "STD",
  EXTRASTRONG: "XS",
  XH: "XS",
  XSTRONG: "XS",
  DOUBLEEXTRASTRONG: "XXS",
  XXH: "XXS",
};

/**
 * Normal form of a schedule: upper case, no spaces or hyphens, common prefixes dropped
 * ("Sch", "Schedule", "Type", "Class", "PC", "DR", "SDR"), named weights mapped (STD, XS, XXS).
 *
 * @param s schedule as written
 * @returns its normal form
 *
 * @example
 * ```ts
 * import { normalizeSchedule } from "./q_pipes.ts";
 * if (normalizeSchedule("Sch 40") !== "40") throw new Error();
 * if (normalizeSchedule("DR 13.50") !== "13.5") throw new Error();
 * if (normalizeSchedule("extra strong") !== "XS") throw new Error();
 * ```
 */
export function normalizeSchedule(s: string): string {
  let t = String(s).toUpperCase().replace(/[\s_-]/g, "");
  t = t.replace(/^(SCHEDULE|SCHED\.?|SCH\.?|TYPE|PRESSURECLASS|CLASS|PC|SDR|DR)/, "");
  t = SCHEDULE_ALIASES[t] ?? t;
  if (/^\d+(\.\d+)?$/.test(t)) t = String(Number(t));
  return t;
}

/** A standard of the catalogue and every name it answers to; its size index is built on first use. */
interface StdEntry {
  readonly file: PipesFile;
  /** Every name it answers to, normalised. */
  readonly names: readonly string[];
  /** The size and schedule index, once built. */
  index?: StdIndex;
}

interface StdIndex {
  readonly file: PipesFile;
  readonly info: PipeStandardInfo;
  /** Rows by nominal size value, ascending. */
  readonly rows: readonly { readonly value: number; readonly row: PipesFile["sizes"][number] }[];
  /** Schedule normal form → catalogue key. */
  readonly schedules: ReadonlyMap<string, string>;
}

const BASIS_RANK: Record<Basis, number> = {
  transcribed: 0,
  computed: 1,
  "common-practice": 2,
  recalled: 3,
};

function weaker(a: Basis, b: Basis): Basis {
  return BASIS_RANK[a] >= BASIS_RANK[b] ? a : b;
}

function band(
  b: { plusMm?: number; minusMm?: number; plusPercent?: number; minusPercent?: number } | undefined,
): ToleranceBandSI {
  const out: Record<string, number> = {};
  if (b?.plusMm !== undefined) out.plus = mm(b.plusMm);
  if (b?.minusMm !== undefined) out.minus = mm(b.minusMm);
  if (b?.plusPercent !== undefined) out.plusFraction = b.plusPercent / 100;
  if (b?.minusPercent !== undefined) out.minusFraction = b.minusPercent / 100;
  return Object.freeze(out);
}

/**
 * Queries over the pipe catalogue and tolerances, bound to one loaded registry.
 *
 * Data: data/pipes/*.yaml (kind `pipes`, one standard per file) and data/pipes/tolerances.yaml
 * (kind `tolerances`). Sources: asme-b36.10m-2018, asme-b36.19m-2018, astm-d1785, astm-f441,
 * astm-f2619, astm-f714, awwa-c151, awwa-c104, astm-b88 and, for tolerances, astm-a530,
 * astm-a53, astm-a999; each record names its own.
 *
 * @param loaded the loaded registry
 * @returns `pipe`, `pipes`, `pipeStandards`, `pipeStandard`, `pipeTolerance`
 *
 * @example
 * ```ts
 * import { loadRegistry } from "./load.ts";
 * import { pipeQueries } from "./q_pipes.ts";
 * const q = pipeQueries(loadRegistry(new URL("../../data/", import.meta.url)));
 * const p = q.pipe({ standard: "ASME B36.10M", nps: "4", schedule: "40" });
 * if (Math.abs(p.outsideDiameter - 0.1143) > 1e-9) throw new Error("OD");
 * if (Math.abs(p.insideDiameter - (0.1143 - 2 * 0.00602)) > 1e-9) throw new Error("ID");
 * ```
 */
export function pipeQueries(loaded: LoadedRegistry): PipeQueries {
  // Built on first use: the standards' names on the first query, a standard's size index when a
  // query reaches it, the tolerance sets on the first tolerance query (a plan needs one standard).
  let entries: readonly StdEntry[] | undefined;
  const standards = () => entries ??= listStandards(loaded);
  let tolerances: readonly PipeToleranceSet[] | undefined;
  const toleranceSetsOf = () => tolerances ??= indexTolerances(loaded);
  const records = new Map<string, PipeRecord>();
  const findStandard = (name: string) => indexOf(standardIn(standards(), name));
  const record = (
    std: StdIndex,
    row: PipesFile["sizes"][number],
    value: number,
    key: string,
  ): PipeRecord => {
    const id = `${std.file.id}|${row.nps}|${key}`;
    const cached = records.get(id);
    if (cached) return cached;
    const rec = pipeRecord(std, row, value, key);
    records.set(id, rec);
    return rec;
  };

  return {
    /**
     * One catalogue pipe by standard, nominal size and schedule (SI). A miss throws a
     * NotFoundError naming what exists nearby (sizes near an unknown size, schedules at a size).
     */
    pipe(query: PipeQuery): PipeRecord {
      if (!query || typeof query !== "object") {
        throw new InputError("pipe", String(query), "{ standard, nps, schedule }");
      }
      const std = findStandard(query.standard);
      const { value, row } = findRow(std, query.nps);
      return record(std, row, value, findSchedule(std, row, query.schedule));
    },
    /** Every catalogue pipe matching a filter (all when none), ordered by standard, size, series. */
    pipes(filter: PipeFilter = {}): PipeRecord[] {
      const stds = filter.standard !== undefined
        ? [standardIn(standards(), filter.standard)]
        : standards();
      const v = filter.nps !== undefined ? parseNominalSize(filter.nps) : undefined;
      const sched = filter.schedule !== undefined ? normalizeSchedule(filter.schedule) : undefined;
      const out: PipeRecord[] = [];
      for (const e of stds) {
        if (filter.material !== undefined && e.file.material !== filter.material) continue;
        const std = indexOf(e);
        for (const { value, row } of std.rows) {
          if (v !== undefined && Math.abs(value - v) > 1e-9) continue;
          for (const key of std.file.series.flat()) {
            if (!(key in row.wallMm)) continue;
            if (sched !== undefined && normalizeSchedule(key) !== sched) continue;
            out.push(record(std, row, value, key));
          }
        }
      }
      return out;
    },
    /** Every standard in the catalogue. */
    pipeStandards(): PipeStandardInfo[] {
      return standards().map((s) => indexOf(s).info);
    },
    /** One standard by name, id or alias. */
    pipeStandard(name: string): PipeStandardInfo {
      return findStandard(name).info;
    },
    /**
     * The manufacturing-tolerance set for a tolerance-set id, a standard (name, id or alias)
     * or a material id, in that order of lookup.
     */
    pipeTolerance(standardOrMaterial: string): PipeToleranceSet {
      const toleranceSets = toleranceSetsOf();
      const byId = toleranceSets.find((t) => t.id === standardOrMaterial);
      if (byId) return byId;
      const n = normStandard(String(standardOrMaterial));
      const std = standards().find((s) => s.names.includes(n));
      if (std) {
        const t = toleranceSets.find((t) => t.standards.includes(std.file.id));
        if (t) return t;
      }
      const byMaterial = toleranceSets.find((t) => t.materials.includes(standardOrMaterial));
      if (byMaterial) return byMaterial;
      throw new NotFoundError(
        "tolerance (standard, material or tolerance-set id)",
        String(standardOrMaterial),
        nearest(String(standardOrMaterial), [
          ...toleranceSets.map((t) => t.id),
          ...toleranceSets.flatMap((t) => t.materials),
          ...standards().map((s) => s.file.standard),
        ], 6),
      );
    },
  };
}

/** The pipe standards of the loaded registry, in data-file order, with the names they answer to. */
function listStandards(loaded: LoadedRegistry): StdEntry[] {
  const standards: StdEntry[] = [];
  for (const d of loaded.docs) {
    if (d.kind !== "pipes") continue;
    const f = d.data as PipesFile;
    standards.push({ file: f, names: [f.id, f.standard, ...f.aliases].map(normStandard) });
  }
  return standards;
}

/** The size and schedule index of a standard (built once), sizes ordered by nominal size. */
function indexOf(entry: StdEntry): StdIndex {
  return entry.index ??= indexStandard(entry.file);
}

function indexStandard(f: PipesFile): StdIndex {
  const rows = f.sizes.map((row) => ({ value: sizeValue(row.nps), row }))
    .sort((a, b) => a.value - b.value);
  const schedules = new Map<string, string>();
  for (const s of f.series.flat()) schedules.set(normalizeSchedule(s), s);
  const info: PipeStandardInfo = Object.freeze({
    id: f.id,
    standard: f.standard,
    title: f.title,
    aliases: f.aliases,
    sizeSystem: f.sizeSystem,
    material: f.material,
    source: f.source,
    basis: f.basis,
    ...(f.copy ? { copy: f.copy } : {}),
    series: f.series,
    sizes: Object.freeze(rows.map((r) => r.row.nps)),
    ...(f.lining ? { liningMaterial: f.lining.material } : {}),
  });
  return { file: f, info, rows, schedules };
}

/** The manufacturing-tolerance sets of the loaded registry, SI. */
function indexTolerances(loaded: LoadedRegistry): PipeToleranceSet[] {
  const toleranceSets: PipeToleranceSet[] = [];
  for (const d of loaded.docs) {
    if (d.kind !== "tolerances") continue;
    for (const s of d.data.sets as ToleranceSet[]) {
      toleranceSets.push(Object.freeze({
        id: s.id,
        title: s.title,
        standards: s.standards,
        materials: s.materials,
        source: s.source,
        basis: s.basis,
        ...(s.note ? { note: s.note } : {}),
        rules: Object.freeze(s.rules.map((r) =>
          Object.freeze({
            odMax: mm(r.odMaxMm),
            outsideDiameter: band(r.outsideDiameter),
            wall: band(r.wall),
          })
        )),
      }));
    }
  }
  return toleranceSets;
}

/** A standard by id, name or alias (a missing ASME/ASTM/AWWA/ANSI prefix tolerated). */
function standardIn(standards: readonly StdEntry[], name: string): StdEntry {
  if (typeof name !== "string" || name.trim() === "") {
    throw new InputError(
      "standard",
      JSON.stringify(name),
      "a pipe standard such as ASME B36.10M",
    );
  }
  const n = normStandard(name);
  const hit = standards.find((s) => s.names.includes(n)) ??
    standards.find((s) => s.names.some((x) => x.replace(/^(asme|astm|awwa|ansi)/, "") === n));
  if (!hit) {
    throw new NotFoundError(
      "standard",
      name,
      nearest(name, standards.flatMap((s) => [s.file.standard, ...s.file.aliases]), 6),
    );
  }
  return hit;
}

/** The size row of a standard; a miss names the four nearest sizes. */
function findRow(std: StdIndex, nps: string | number): StdIndex["rows"][number] {
  const v = parseNominalSize(nps);
  const hit = std.rows.find((r) => Math.abs(r.value - v) < 1e-9);
  if (!hit) {
    const near = [...std.rows].sort((a, b) => Math.abs(a.value - v) - Math.abs(b.value - v))
      .slice(0, 4).sort((a, b) => a.value - b.value).map((r) => r.row.nps);
    throw new NotFoundError(`nps (${std.info.standard})`, String(nps), near);
  }
  return hit;
}

/** The schedule key of a size row; a miss names the schedules the size has. */
function findSchedule(
  std: StdIndex,
  row: PipesFile["sizes"][number],
  schedule: string,
): string {
  if (typeof schedule !== "string" && typeof schedule !== "number") {
    throw new InputError("schedule", String(schedule), "a schedule such as 40, STD or DR 11");
  }
  const n = normalizeSchedule(String(schedule));
  const key = std.schedules.get(n) ?? std.schedules.get(n + "S");
  if (!key || !(key in row.wallMm)) {
    throw new NotFoundError(
      `schedule (${std.info.standard} NPS ${row.nps})`,
      String(schedule),
      std.file.series.flat().filter((s) => s in row.wallMm),
    );
  }
  return key;
}

/** One catalogue pipe record (SI) with its provenance, frozen; `value` is the row's nominal size. */
function pipeRecord(
  std: StdIndex,
  row: PipesFile["sizes"][number],
  value: number,
  key: string,
): PipeRecord {
  const f = std.file;
  const w = row.wallMm[key];
  const wallMm = typeof w === "number" ? w : w.valueMm;
  const wallProv: PipeProvenance = typeof w === "number"
    ? {
      source: f.wallProvenance?.source ?? f.source,
      basis: f.wallProvenance?.basis ?? f.basis,
      ...(f.spreadMm !== undefined ? { spread: mm(f.spreadMm) } : {}),
    }
    : {
      source: w.source ?? f.source,
      basis: w.basis,
      ...((w.spreadMm ?? f.spreadMm) !== undefined
        ? { spread: mm((w.spreadMm ?? f.spreadMm)!) }
        : {}),
    };
  const rule = f.lining?.rules.find((r) => value >= r.npsMin && value <= r.npsMax);
  const lining: PipeLiningRecord | undefined = f.lining && rule
    ? Object.freeze({
      material: f.lining.material,
      thickness: mm(rule.thicknessMm),
      source: f.lining.source,
      basis: f.lining.basis,
      ...(f.lining.spreadMm !== undefined ? { spread: mm(f.lining.spreadMm) } : {}),
    })
    : undefined;
  const od = mm(row.outsideDiameterMm);
  const wall = mm(wallMm);
  const basis = weaker(f.basis, wallProv.basis);
  const rec: PipeRecord = Object.freeze({
    standard: f.standard,
    standardId: f.id,
    nps: row.nps,
    nominalSize: value,
    sizeLabel: f.sizeSystem === "NPS" ? `NPS ${row.nps}` : `${row.nps} in`,
    schedule: key,
    outsideDiameter: od,
    wallThickness: wall,
    insideDiameter: mm(row.outsideDiameterMm - 2 * wallMm),
    material: f.material,
    ...(lining ? { lining } : {}),
    source: f.source,
    basis,
    ...(f.copy && (f.basis === "transcribed" || wallProv.basis === "transcribed")
      ? { copy: f.copy }
      : {}),
    provenance: Object.freeze({
      outsideDiameter: Object.freeze({ source: f.source, basis: f.basis }),
      wallThickness: Object.freeze(wallProv),
    }),
  });
  return rec;
}
