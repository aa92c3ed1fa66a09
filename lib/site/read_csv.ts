/**
 * A fleet in one CSV: a header of dotted keys (`id`, `name`, `pipe.nps`, `fluid.temperature`,
 * …) and one site a row. Cells hold what the same key holds in a site file, as text; an empty
 * cell leaves the key out; `mountings` holds a list such as `1;2;4`.
 *
 * @module
 */
import { type Ctx, fail, oneLine, suggestKey } from "./read_fields.ts";
import { SITE_KEYS } from "./schema.ts";

/** One CSV record with the file line where it starts. */
export interface CsvRecord {
  /** File line (1-based) where the record starts. */
  readonly line: number;
  /** The cells. */
  readonly cells: string[];
}

/**
 * Split CSV text (RFC 4180: comma separator, double quotes, doubled quotes inside quotes,
 * CRLF or LF) into records. Lines whose first cell starts with `#` and blank lines are
 * skipped.
 *
 * @param ctx error context
 * @param text the CSV text
 * @returns the records
 */
export function splitCsv(ctx: Ctx, text: string): CsvRecord[] {
  const out: CsvRecord[] = [];
  let line = 1;
  let i = 0;
  const n = text.length;
  while (i < n) {
    const start = line;
    const cells: string[] = [];
    let cell = "";
    let quoted = false;
    let wasQuoted = false;
    for (;;) {
      if (i >= n) {
        if (quoted) {
          fail(
            ctx,
            `line ${start}`,
            "a quoted cell that never closes",
            'a closing double quote (")',
          );
        }
        cells.push(cell);
        break;
      }
      const ch = text[i];
      if (quoted) {
        if (ch === '"') {
          if (text[i + 1] === '"') {
            cell += '"';
            i += 2;
            continue;
          }
          quoted = false;
          i++;
          continue;
        }
        if (ch === "\n") line++;
        cell += ch;
        i++;
        continue;
      }
      if (ch === '"') {
        if (cell.trim() !== "" || wasQuoted) {
          fail(
            ctx,
            `line ${line}`,
            "a double quote inside an unquoted cell",
            "quotes around the whole cell",
          );
        }
        cell = "";
        quoted = true;
        wasQuoted = true;
        i++;
        continue;
      }
      if (ch === ",") {
        cells.push(cell);
        cell = "";
        wasQuoted = false;
        i++;
        continue;
      }
      if (ch === "\r" && text[i + 1] === "\n") i++;
      if (ch === "\n" || ch === "\r") {
        cells.push(cell);
        i++;
        line++;
        break;
      }
      if (wasQuoted && ch.trim() !== "") {
        fail(ctx, `line ${line}`, "text after a closing quote", "a comma after a quoted cell");
      }
      if (!wasQuoted) cell += ch;
      i++;
    }
    const blank = cells.every((c) => c.trim() === "");
    if (!blank && !cells[0].trimStart().startsWith("#")) out.push({ line: start, cells });
  }
  return out;
}

/**
 * Check a header of dotted keys against the site keys; refuse unknown, repeated or non-leaf
 * columns, and a missing `id` column.
 *
 * @param ctx error context
 * @param header the header cells
 * @returns the key paths, one per column
 */
export function checkHeader(ctx: Ctx, header: readonly string[]): string[][] {
  const seen = new Set<string>();
  const paths = header.map((h, col) => {
    const name = h.trim();
    const field = `column ${col + 1}`;
    if (name === "") fail(ctx, field, "an empty column name", "a dotted site key such as pipe.nps");
    if (seen.has(name)) {
      fail(ctx, field, `"${oneLine(name, 60)}" a second time`, "each column once");
    }
    seen.add(name);
    const parts = name.split(".");
    let parent = "";
    for (let k = 0; k < parts.length; k++) {
      const valid = SITE_KEYS[parent] ?? [];
      const key = parts[k];
      if (!valid.includes(key)) {
        const hint = suggestKey(key, valid);
        fail(
          ctx,
          field,
          `"${oneLine(name, 60)}"`,
          hint
            ? `a site key; did you mean "${[...parts.slice(0, k), hint].join(".")}"?`
            : `a dotted site key; keys of ${parent || "the site"}: ${valid.join(", ")}`,
        );
      }
      parent = parent ? `${parent}.${key}` : key;
    }
    if (SITE_KEYS[parent]) {
      fail(
        ctx,
        field,
        `"${name}"`,
        `one column per key inside it, such as ${parent}.${SITE_KEYS[parent][0]}`,
      );
    }
    return parts;
  });
  if (!seen.has("id")) fail(ctx, "header", "no id column", "an id column naming each site");
  return paths;
}

/**
 * Turn one record into the nested raw data a site file would hold.
 *
 * @param paths key paths per column
 * @param cells the record's cells
 * @returns nested raw data, cells as trimmed text, `mountings` split into a list
 */
export function nestRow(
  paths: readonly string[][],
  cells: readonly string[],
): Record<string, unknown> {
  const root: Record<string, unknown> = {};
  paths.forEach((parts, col) => {
    const cell = (cells[col] ?? "").trim();
    if (cell === "") return;
    let obj = root;
    for (let k = 0; k < parts.length - 1; k++) {
      obj = (obj[parts[k]] ??= {}) as Record<string, unknown>;
    }
    const leaf = parts[parts.length - 1];
    obj[leaf] = parts.length === 1 && leaf === "mountings"
      ? cell.split(/[;,\s]+/).filter((x) => x !== "")
      : cell;
  });
  return root;
}

/**
 * A row error in the words of a CSV: the hint `{ fitting: elbow-90 }` a site file would take
 * becomes the column that holds it (`a cell in column run.downstream.fitting, for example
 * elbow-90`).
 *
 * @param message the error message, `WHERE: FIELD: got …; expected …`
 * @returns the message with site-file hints turned into column hints
 *
 * @example
 * ```ts
 * import { csvHint } from "./read_csv.ts";
 * const m = csvHint("f.csv row 2 (site s1): run.downstream: got nothing; expected the " +
 *   "downstream fitting, such as { fitting: elbow-90 }");
 * if (!m.endsWith("a cell in column run.downstream.fitting, for example elbow-90")) {
 *   throw new Error(m);
 * }
 * ```
 */
export function csvHint(message: string): string {
  const m = /^(.*?): ([\w.[\]]+): got (.*)$/.exec(message);
  if (!m) return message;
  const field = m[2];
  const rest = m[3].replace(
    /such as \{ (\w+): ([^}]+?) \}/g,
    (_all, k: string, v: string) => `a cell in column ${field}.${k}, for example ${v.trim()}`,
  );
  return `${m[1]}: ${field}: got ${rest}`;
}
