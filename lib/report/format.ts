/**
 * Formatting primitives for reports: quantities in display units, aligned text tables,
 * Markdown tables, CSV (RFC 4180), HTML escaping and a self-contained HTML page shell.
 * Pure functions from plain data to strings; no physics, no file I/O.
 *
 * @module
 */
import { InputError } from "../errors.ts";
import { toUnit } from "../units.ts";

/** A table cell: text, or a number shown as given (format numbers first to control digits). */
export type TableCell = string | number;

/** Display forms of unit names that read better in print. */
const UNIT_DISPLAY: Record<string, string> = {
  degC: "°C",
  degF: "°F",
  deg: "°",
  us: "µs",
  ns: "ns",
  ps: "ps",
  "m^3/h": "m³/h",
  "m^3/s": "m³/s",
  "m^2/s": "m²/s",
  "mm^2/s": "mm²/s",
  "kg/m^3": "kg/m³",
  "m^3": "m³",
  "m^2": "m²",
};

/**
 * The printed form of a unit name (`degC` → `°C`, `m^3/h` → `m³/h`, `us` → `µs`).
 *
 * @param unit unit name of the fast table in lib/units.ts
 * @returns the form to print
 *
 * @example
 * ```ts
 * import { displayUnit } from "./format.ts";
 * if (displayUnit("degC") !== "°C" || displayUnit("mm") !== "mm") throw new Error();
 * ```
 */
export function displayUnit(unit: string): string {
  return UNIT_DISPLAY[unit] ?? unit.replace(/\^2/g, "²").replace(/\^3/g, "³");
}

/**
 * Format a number to `digits` significant digits, keeping trailing zeros, without exponent
 * notation between 1e-4 and 1e21 (exponent form `1.23e-7` outside).
 *
 * @param value the number (must be finite)
 * @param digits significant digits, 1 … 17 (default 4)
 * @returns the text
 * @throws {InputError} for a non-finite value or bad digits
 *
 * @example
 * ```ts
 * import { formatNumber } from "./format.ts";
 * if (formatNumber(0.1, 3) !== "0.100") throw new Error("trailing zeros");
 * if (formatNumber(123456, 3) !== "123000") throw new Error("no exponent");
 * if (formatNumber(1.5e-7, 2) !== "1.5e-7") throw new Error("small");
 * ```
 */
export function formatNumber(value: number, digits = 4): string {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new InputError("value", String(value), "a finite number");
  }
  if (!Number.isInteger(digits) || digits < 1 || digits > 17) {
    throw new InputError("digits", String(digits), "an integer from 1 to 17");
  }
  if (value === 0) return digits > 1 ? "0." + "0".repeat(digits - 1) : "0";
  const s = value.toPrecision(digits);
  if (!s.includes("e")) return s;
  const r = Number(s);
  if (Math.abs(r) >= 1e-4 && Math.abs(r) < 1e21) return String(r);
  return s.replace("e+", "e");
}

/**
 * Like {@link formatNumber}, with trailing zeros after the decimal point removed (for labels).
 *
 * @param value the number (must be finite)
 * @param digits significant digits at most (default 4)
 * @returns the text
 * @throws {InputError} for a non-finite value or bad digits
 *
 * @example
 * ```ts
 * import { formatCompact } from "./format.ts";
 * if (formatCompact(8.18, 4) !== "8.18" || formatCompact(0.05, 3) !== "0.05") throw new Error();
 * ```
 */
export function formatCompact(value: number, digits = 4): string {
  const s = formatNumber(value, digits);
  const [mantissa, exponent] = s.split("e");
  if (!mantissa.includes(".")) return s;
  const m = mantissa.replace(/0+$/, "").replace(/\.$/, "");
  return exponent === undefined ? m : `${m}e${exponent}`;
}

/**
 * Format an SI value in a display unit: `formatQuantity(0.1143, "mm", 4)` → `"114.3 mm"`.
 *
 * Method: conversion by lib/units.ts `toUnit` (temperatures converted, not scaled), then
 * {@link formatNumber}. Validity: any finite value; the unit must be one the fast unit table
 * reads (or a temperature unit). Source: none (presentation only).
 *
 * @param value SI value (m, s, K, Pa, m/s, m³/s, rad, …)
 * @param unit display unit, for example `"mm"`, `"degC"`, `"L/s"`, `"us"`, `"deg"`
 * @param digits significant digits (default 4)
 * @param compact drop trailing zeros after the decimal point (default false)
 * @returns number and printed unit, separated by a space (no space before `°`)
 * @throws {InputError} for a non-finite value or an unknown unit
 *
 * @example
 * ```ts
 * import { formatQuantity } from "./format.ts";
 * if (formatQuantity(0.1143, "mm") !== "114.3 mm") throw new Error("mm");
 * if (formatQuantity(293.15, "degC", 3) !== "20.0 °C") throw new Error("degC");
 * if (formatQuantity(Math.PI / 6, "deg", 3) !== "30.0°") throw new Error("deg");
 * ```
 */
export function formatQuantity(
  value: number,
  unit: string,
  digits = 4,
  compact = false,
): string {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new InputError("value", String(value), "a finite number (SI)");
  }
  const x = toUnit(value, unit, 17);
  const shown = displayUnit(unit);
  const num = compact ? formatCompact(x, digits) : formatNumber(x, digits);
  return shown === "°" ? `${num}°` : shown === "" ? num : `${num} ${shown}`;
}

function cellText(c: TableCell, where: string): string {
  if (typeof c === "number") {
    if (!Number.isFinite(c)) throw new InputError(where, String(c), "a finite number or a text");
    return String(c);
  }
  if (typeof c !== "string") throw new InputError(where, typeof c, "a text or a number");
  return c;
}

function checkShape(headers: readonly string[], rows: readonly (readonly TableCell[])[]): void {
  if (!Array.isArray(headers) || headers.length === 0) {
    throw new InputError("headers", String(headers), "a non-empty list of column names");
  }
  rows.forEach((r, i) => {
    if (!Array.isArray(r) || r.length !== headers.length) {
      throw new InputError(
        `rows[${i}]`,
        `${Array.isArray(r) ? r.length : "no"} cells`,
        `${headers.length} cells`,
      );
    }
  });
}

/** Width of a text in terminal columns (code points; combining marks count zero). */
function width(s: string): number {
  let w = 0;
  for (const ch of s) if (!/\p{M}/u.test(ch)) w++;
  return w;
}

/** Options of {@link textTable}. */
export interface TextTableOptions {
  /** Alignment per column; default right for columns whose body cells are all numbers. */
  readonly align?: readonly ("left" | "right")[];
  /** Text between columns (default two spaces). */
  readonly gap?: string;
}

/**
 * An aligned plain-text table for the terminal: header, a rule of dashes, rows.
 *
 * @param headers column names
 * @param rows rows of cells (same length as headers)
 * @param options alignment and gap
 * @returns the table, lines joined by "\n", no trailing newline
 * @throws {InputError} on ragged rows or non-finite numbers
 *
 * @example
 * ```ts
 * import { textTable } from "./format.ts";
 * const t = textTable(["pipe", "OD mm"], [["4 in", 114.3], ["10 in", 273]]);
 * const lines = t.split("\n");
 * if (lines[1] !== "-----  -----" || lines[2] !== "4 in   114.3") throw new Error(t);
 * ```
 */
export function textTable(
  headers: readonly string[],
  rows: readonly (readonly TableCell[])[],
  options: TextTableOptions = {},
): string {
  checkShape(headers, rows);
  const text = rows.map((r, i) => r.map((c, j) => cellText(c, `rows[${i}][${j}]`)));
  const head = headers.map((h, j) => cellText(h, `headers[${j}]`));
  const align = headers.map((_, j) =>
    options.align?.[j] ??
      (rows.length > 0 && rows.every((r) => typeof r[j] === "number") ? "right" : "left")
  );
  const widths = head.map((h, j) => Math.max(width(h), ...text.map((r) => width(r[j]))));
  const pad = (s: string, j: number) => {
    const fill = " ".repeat(widths[j] - width(s));
    return align[j] === "right" ? fill + s : s + fill;
  };
  const gap = options.gap ?? "  ";
  const line = (cells: string[]) => cells.map(pad).join(gap).replace(/\s+$/, "");
  return [line(head), widths.map((w) => "-".repeat(w)).join(gap), ...text.map(line)].join("\n");
}

/**
 * A GitHub-flavoured Markdown table; `|` in cells is escaped, line breaks become spaces.
 * Columns whose body cells are all numbers are right-aligned.
 *
 * @param headers column names
 * @param rows rows of cells
 * @returns the table, lines joined by "\n"
 * @throws {InputError} on ragged rows or non-finite numbers
 *
 * @example
 * ```ts
 * import { markdownTable } from "./format.ts";
 * const t = markdownTable(["a|b", "n"], [["x", 1]]);
 * if (t !== "| a\\|b | n |\n| --- | ---: |\n| x | 1 |") throw new Error(t);
 * ```
 */
export function markdownTable(
  headers: readonly string[],
  rows: readonly (readonly TableCell[])[],
): string {
  checkShape(headers, rows);
  const esc = (s: string) => s.replace(/\\/g, "\\\\").replace(/\|/g, "\\|").replace(/\r?\n/g, " ");
  const right = headers.map((_, j) =>
    rows.length > 0 && rows.every((r) => typeof r[j] === "number")
  );
  const line = (cells: string[]) => `| ${cells.map(esc).join(" | ")} |`;
  return [
    line(headers.map((h, j) => cellText(h, `headers[${j}]`))),
    `| ${right.map((r) => (r ? "---:" : "---")).join(" | ")} |`,
    ...rows.map((r, i) => line(r.map((c, j) => cellText(c, `rows[${i}][${j}]`)))),
  ].join("\n");
}

/**
 * CSV per RFC 4180: fields containing a comma, a double quote, CR or LF are enclosed in double
 * quotes with inner quotes doubled; records end with CRLF. Numbers are written in full
 * precision (`String(n)`).
 *
 * @param headers column names (the header record)
 * @param rows records
 * @returns the CSV text, each record ending in "\r\n"
 * @throws {InputError} on ragged rows or non-finite numbers
 *
 * @example
 * ```ts
 * import { csvTable } from "./format.ts";
 * const c = csvTable(["name", "note"], [["DN 100", 'say "hi", then go']]);
 * if (c !== 'name,note\r\nDN 100,"say ""hi"", then go"\r\n') throw new Error(c);
 * ```
 */
export function csvTable(
  headers: readonly string[],
  rows: readonly (readonly TableCell[])[],
): string {
  checkShape(headers, rows);
  const field = (s: string) => (/[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);
  const rec = (cells: string[]) => cells.map(field).join(",") + "\r\n";
  return rec(headers.map((h, j) => cellText(h, `headers[${j}]`))) +
    rows.map((r, i) => rec(r.map((c, j) => cellText(c, `rows[${i}][${j}]`)))).join("");
}

/**
 * Escape text for HTML and XML (element content and quoted attributes): & < > " '.
 *
 * @param text any text
 * @returns the escaped text
 *
 * @example
 * ```ts
 * import { escapeHtml } from "./format.ts";
 * if (escapeHtml(`<a href="x">&'`) !== "&lt;a href=&quot;x&quot;&gt;&amp;&#39;") throw new Error();
 * ```
 */
export function escapeHtml(text: string): string {
  return String(text)
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;")
    .replace(/'/g, "&#39;");
}

/** Arguments of {@link htmlPage}. */
export interface HtmlPageOptions {
  /** Page title (plain text; escaped). */
  readonly title: string;
  /** Body content: trusted HTML, built with {@link escapeHtml} for any text it holds. */
  readonly body: string;
  /** Extra CSS appended to the built-in print-friendly style. */
  readonly css?: string;
  /** Language tag (default "en"). */
  readonly lang?: string;
}

/** The built-in style: neutral, readable on screen and in print. */
export const BASE_CSS = `
:root { color-scheme: light; }
body { font-family: "DejaVu Sans", "Liberation Sans", Arial, sans-serif; color: #1d1d1d;
  background: #fff; margin: 2em auto; max-width: 60em; padding: 0 1.5em; line-height: 1.45; }
h1, h2, h3 { line-height: 1.2; font-weight: 600; }
h1 { font-size: 1.6em; border-bottom: 2px solid #1d1d1d; padding-bottom: .2em; }
h2 { font-size: 1.25em; margin-top: 1.8em; border-bottom: 1px solid #999; }
table { border-collapse: collapse; margin: .8em 0; font-size: .92em; }
th, td { border: 1px solid #bbb; padding: .25em .6em; vertical-align: top; }
th { background: #eee; text-align: left; }
td.num { text-align: right; font-variant-numeric: tabular-nums; }
figure { margin: 1.2em 0; break-inside: avoid; }
figure svg { width: 100%; height: auto; max-width: 52em; display: block; }
figcaption { font-size: .9em; color: #444; margin-top: .3em; }
.caution { border-left: 4px solid #1d1d1d; background: #f4f4f4; padding: .5em .9em; }
code, pre { font-family: "DejaVu Sans Mono", monospace; font-size: .9em; }
@media print { body { margin: 0; max-width: none; } h2 { break-after: avoid; } }
`;

/**
 * A complete HTML5 page that opens offline: inline CSS only, a Content-Security-Policy that
 * forbids any outside resource or script, UTF-8.
 *
 * @param options title, body HTML, extra CSS, language
 * @returns the HTML document
 * @throws {InputError} when title or body are not texts
 *
 * @example
 * ```ts
 * import { htmlPage } from "./format.ts";
 * const html = htmlPage({ title: "Plan <A>", body: "<p>ok</p>" });
 * if (!html.startsWith("<!DOCTYPE html>") || !html.includes("<title>Plan &lt;A&gt;</title>")) {
 *   throw new Error("page");
 * }
 * ```
 */
export function htmlPage(options: HtmlPageOptions): string {
  const { title, body, css = "", lang = "en" } = options;
  if (typeof title !== "string") throw new InputError("title", typeof title, "a text");
  if (typeof body !== "string") throw new InputError("body", typeof body, "an HTML text");
  if (/<\/style/i.test(css)) throw new InputError("css", "a closing style tag", "plain CSS");
  return [
    "<!DOCTYPE html>",
    `<html lang="${escapeHtml(lang)}">`,
    "<head>",
    '<meta charset="utf-8">',
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    `<meta http-equiv="Content-Security-Policy" content="default-src 'none'; ` +
    `style-src 'unsafe-inline'; img-src data:">`,
    `<title>${escapeHtml(title)}</title>`,
    `<style>${BASE_CSS}${css}</style>`,
    "</head>",
    "<body>",
    body,
    "</body>",
    "</html>",
    "",
  ].join("\n");
}

/**
 * A value with its uncertainty as the range it is, `v ± u unit`, rounded as GUM 7.2.6 advises:
 * the uncertainty to two significant digits, the value to the same last decimal place. Both
 * are given in SI and shown in `unit`.
 *
 * Source: JCGM 100:2008 (GUM), 7.2.6 (at most two significant digits for the uncertainty) and
 * the example of 7.2.2 (100.021 47 g with u = 0.35 mg).
 *
 * @param value the value, SI (finite)
 * @param uncertainty its standard uncertainty or half-width, SI (finite, ≥ 0)
 * @param unit display unit (as {@link formatQuantity})
 * @returns e.g. "1463.5 ± 0.54 m/s"; a zero uncertainty gives the value to 6 digits
 * @throws {InputError} on non-finite value or a negative or non-finite uncertainty
 *
 * @example
 * ```ts
 * import { formatWithUncertainty } from "./format.ts";
 * const s = formatWithUncertainty(0.10002147, 0.00000035, "g");
 * if (s !== "100.02147 ± 0.00035 g") throw new Error(s);
 * ```
 */
export function formatWithUncertainty(value: number, uncertainty: number, unit: string): string {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new InputError("value", String(value), "a finite number (SI)");
  }
  if (!(Number.isFinite(uncertainty) && uncertainty >= 0)) {
    throw new InputError("uncertainty", String(uncertainty), "a finite number ≥ 0 (SI)");
  }
  const x = toUnit(value, unit, 17);
  const u = uncertainty === 0 ? 0 : toUnit(value + uncertainty, unit, 17) - x;
  const shown = displayUnit(unit);
  const tail = shown === "°" ? "°" : shown === "" ? "" : ` ${shown}`;
  if (u === 0) return `${formatNumber(x, 6)}${tail}`;
  const exp = Math.floor(Math.log10(Math.abs(u))) - 1; // last kept decimal exponent
  const dec = Math.max(0, -exp);
  const step = 10 ** exp;
  const r = (v: number) => (Math.round(v / step) * step).toFixed(dec);
  return `${r(x)} ± ${r(u)}${tail}`;
}

/**
 * A catalogue pipe's designation in the words of its own standard. Copper tube (ASTM B88) is
 * named by type and nominal size (`ASTM B88 type L, nominal size 3 in`), not by NPS and
 * schedule; ductile iron (AWWA C151) by nominal size and pressure class; other descriptions are
 * returned unchanged. Plans now carry this form in `pipe.description` (lib/pipe `pipeDescription`);
 * this turns the older "NPS … schedule …" form of saved plan JSON into it.
 *
 * Source: ASTM B88 (tube types K, L, M by standard size); AWWA C151 (pressure classes) —
 * naming conventions, common practice.
 *
 * @param description a plan's pipe description, e.g. "ASTM B88 NPS 3 schedule L"
 * @returns the designation text
 *
 * @example
 * ```ts
 * import { pipeDesignation } from "./format.ts";
 * const s = pipeDesignation("ASTM B88 NPS 3 schedule L");
 * if (s !== "ASTM B88 type L, nominal size 3 in") throw new Error(s);
 * ```
 */
export function pipeDesignation(description: string): string {
  const cu = /^ASTM B88 NPS (\S+) schedule (?:type )?([KLM])$/i.exec(description);
  if (cu) return `ASTM B88 type ${cu[2].toUpperCase()}, nominal size ${cu[1]} in`;
  const di = /^AWWA C151 NPS (\S+) schedule PC ?(\d+)$/i.exec(description);
  if (di) return `AWWA C151 nominal size ${di[1]} in, pressure class ${di[2]}`;
  return description;
}
