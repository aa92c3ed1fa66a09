/**
 * Cell-by-cell comparison of a published verification table (data kind `verification`) with
 * this project's code, shared by the rooms that ship such tables (water, seawater).
 *
 * @module
 */

/** One checked cell of a verification table. */
export interface VerificationCheck {
  /** Table id. */
  readonly table: string;
  /** Row index (0-based). */
  readonly row: number;
  /** The row's inputs, as published. */
  readonly inputs: Readonly<Record<string, number>>;
  /** Output column. */
  readonly column: string;
  /** Published value, in the table's unit. */
  readonly expected: number;
  /** Computed value, in the table's unit. */
  readonly computed: number;
  /** |computed − expected| / |expected| (|computed| when expected is 0). */
  readonly relDiff: number;
  /** Tolerance of the table for this column. */
  readonly tolerance: number;
  /** relDiff is finite and ≤ tolerance. */
  readonly ok: boolean;
}

/** The fields of a verification table that a check reads (see schemas/tables.ts). */
export interface VerificationTableData {
  /** Table id. */
  readonly id: string;
  /** Column names with their units. */
  readonly columns: Readonly<Record<string, string>>;
  /** Which columns are inputs; the rest are expected outputs. */
  readonly inputs: readonly string[];
  /** Relative tolerance per output column, or one for all. */
  readonly tolerance: number | Readonly<Record<string, number>>;
  /** The published rows. */
  readonly rows: readonly Readonly<Record<string, number>>[];
}

/** Evaluates one row (the table's inputs) and returns the computed outputs by column name. */
export type RowEvaluator = (
  row: Readonly<Record<string, number>>,
) => Readonly<Record<string, number>>;

/** Converts a computed output to the table's unit for that column. */
export type ToTableUnit = (computed: number, column: string, unit: string) => number;

/**
 * Compare every published output cell of a verification table with the evaluator's value:
 * relative difference against the table's relative tolerance (absolute when the published
 * value is 0). Cells a row leaves out are skipped.
 *
 * @param table the verification table, as the registry returns it
 * @param evaluate computes a row's outputs (keyed by output column)
 * @param toTableUnit converts a computed value to the column's unit (default: unchanged)
 * @returns one check per published output cell
 *
 * @example
 * ```ts
 * import { checkVerificationTable } from "./verify.ts";
 * const table = {
 *   id: "square-check",
 *   columns: { x: "1", y: "1" },
 *   inputs: ["x"],
 *   tolerance: 1e-12,
 *   rows: [{ x: 2, y: 4 }, { x: 3, y: 9.5 }],
 * };
 * const checks = checkVerificationTable(table, (r) => ({ y: r.x * r.x }));
 * if (!checks[0].ok || checks[1].ok) throw new Error(JSON.stringify(checks));
 * ```
 */
export function checkVerificationTable(
  table: VerificationTableData,
  evaluate: RowEvaluator,
  toTableUnit: ToTableUnit = (computed) => computed,
): VerificationCheck[] {
  const outputs = Object.keys(table.columns).filter((c) => !table.inputs.includes(c));
  const checks: VerificationCheck[] = [];
  table.rows.forEach((row, i) => {
    const got = evaluate(row);
    const inputs: Record<string, number> = {};
    for (const k of table.inputs) inputs[k] = row[k];
    for (const column of outputs) {
      const expected = row[column];
      if (expected === undefined) continue;
      const computed = toTableUnit(got[column], column, table.columns[column]);
      const relDiff = expected === 0
        ? Math.abs(computed)
        : Math.abs(computed - expected) / Math.abs(expected);
      const tolerance = typeof table.tolerance === "number"
        ? table.tolerance
        : table.tolerance[column];
      checks.push({
        table: table.id,
        row: i,
        inputs,
        column,
        expected,
        computed,
        relDiff,
        tolerance,
        ok: Number.isFinite(relDiff) && relDiff <= tolerance,
      });
    }
  });
  return checks;
}

/** One datum (or enclosing entry) of the registry that still rests on memory. */
export interface RecalledRow {
  /** Data file, relative to the data folder. */
  readonly file: string;
  /** Id of the nearest enclosing entry (or the file's own id), or "" for none. */
  readonly entry: string;
  /** Path of the object inside the file, for example `materials[3].density`. */
  readonly path: string;
  /** Its source id. */
  readonly source: string;
  /** The recorded reason: the object's own `note`, else the nearest enclosing one; "" if none. */
  readonly reason: string;
}

/**
 * Every object in the data files whose `basis` is `recalled` (issue 12: each must carry a
 * recorded reason). Walks each document depth-first; the source and the reason are inherited
 * from the nearest enclosing object that states one. The bibliography is skipped.
 *
 * @param docs the loaded data files (`loadRegistry(...).docs`)
 * @returns one row per object marked `basis: recalled`, in file order
 *
 * @example
 * ```ts
 * import { recalledRows } from "./verify.ts";
 * const rows = recalledRows([{
 *   file: "x.yaml",
 *   kind: "materials",
 *   data: { materials: [{ id: "a", source: "s", basis: "recalled", note: "no copy found" }] },
 * }]);
 * if (rows.length !== 1 || rows[0].reason !== "no copy found") throw new Error();
 * if (rows[0].path !== "materials[0]" || rows[0].entry !== "a") throw new Error();
 * ```
 */
export function recalledRows(
  // deno-lint-ignore no-explicit-any
  docs: readonly { readonly file: string; readonly kind: string; readonly data: any }[],
): RecalledRow[] {
  const rows: RecalledRow[] = [];
  const walk = (
    node: unknown,
    path: string,
    file: string,
    entry: string,
    source: string,
    note: string,
  ): void => {
    if (Array.isArray(node)) {
      node.forEach((v, i) => walk(v, `${path}[${i}]`, file, entry, source, note));
      return;
    }
    if (node === null || typeof node !== "object") return;
    const o = node as Record<string, unknown>;
    const id = typeof o.id === "string" ? o.id : entry;
    const src = typeof o.source === "string" ? o.source : source;
    const why = typeof o.note === "string" ? o.note : note;
    if (o.basis === "recalled") {
      rows.push({
        file,
        entry: id,
        path: path || "(file)",
        source: src,
        reason: why.replace(/\s+/g, " ").trim(),
      });
    }
    for (const [k, v] of Object.entries(o)) {
      if (v !== null && typeof v === "object") {
        walk(v, path ? `${path}.${k}` : k, file, id, src, why);
      }
    }
  };
  for (const d of docs) {
    if (d.kind === "sources") continue;
    walk(d.data, "", d.file, "", "", "");
  }
  return rows;
}
