/**
 * The HTML index of a fleet: a count of verdicts, then one row a site with words a reader uses
 * (not the CSV's column keys), the target and straight-run verdicts coloured and always spelled
 * out, and a link to each site's page. Reads summary rows; computes no physics.
 *
 * @module
 */
import { escapeHtml, htmlPage } from "./format.ts";

/** One planned site's summary row, in the order of the fleet CSV's columns. */
export type FleetIndexRow = { readonly row: readonly (string | number)[]; readonly href: string };

/** A site the fleet refused, with the one-line reason. */
export type FleetIndexRefusal = {
  readonly id: string;
  readonly name: string;
  readonly error: string;
};

/** Headings of the index table, one per fleet CSV column (same order). */
export const FLEET_INDEX_HEADINGS: readonly string[] = Object.freeze([
  "Site id",
  "Site",
  "Accuracy target",
  "Mounting",
  "Spacing",
  "Expanded uncertainty (worst flow)",
  "Straight run",
  "Main limitation",
  "Reference data",
]);

/**
 * Verdict words and their colour class (project palette; each colour always carries its word).
 * Target: reachable / not reachable / no target; straight run: meets / marginal / short.
 */
export const VERDICT_CLASSES: Readonly<Record<string, string>> = Object.freeze({
  "reachable": "v-good",
  "not reachable": "v-bad",
  "no target": "v-none",
  "meets": "v-good",
  "marginal": "v-warn",
  "short": "v-bad",
  "not assessed": "v-none",
  "refused": "v-bad",
});

const INDEX_CSS = `
table.fleet td, table.fleet th { padding: .25em .6em; vertical-align: top }
.v-good { background: #e3f1e8; color: #1e4d36; font-weight: 600 }
.v-warn { background: #fbf0d9; color: #6e4a00; font-weight: 600 }
.v-bad { background: #f8e1e1; color: #7a1a1d; font-weight: 600 }
.v-none { background: #eeeeee; color: #3d3d3d }
.counts span { display: inline-block; margin: 0 .6em .3em 0; padding: .15em .5em }
td.num { text-align: right; font-variant-numeric: tabular-nums }
`;

/** Column positions in a summary row (fleet CSV order). */
const COL = { id: 0, name: 1, target: 2, spacing: 4, expanded: 5, run: 6, hash: 8 } as const;

function verdictCell(word: string): string {
  const cls = VERDICT_CLASSES[word] ?? "v-none";
  return `<td class="${cls}">${escapeHtml(word)}</td>`;
}

function cell(row: readonly (string | number)[], i: number, href: string): string {
  const c = String(row[i]);
  switch (i) {
    case COL.name:
      return `<td><a href="${escapeHtml(href)}">${escapeHtml(c)}</a></td>`;
    case COL.target:
    case COL.run:
      return verdictCell(c);
    case COL.spacing:
      return `<td class="num">${escapeHtml(c)} mm</td>`;
    case COL.expanded: {
      // an uncertainty to two significant digits (GUM 7.2.6); the CSV keeps more for machines
      const x = Number(row[i]);
      const shown = !Number.isFinite(x)
        ? c
        : Math.abs(x) >= 100
        ? String(Math.round(x))
        : x.toPrecision(2);
      return `<td class="num">${escapeHtml(shown)} %</td>`;
    }
    case COL.hash:
      return `<td title="${escapeHtml(c)}"><code>${escapeHtml(c.slice(0, 12))}…</code></td>`;
    default:
      return `<td>${escapeHtml(c)}</td>`;
  }
}

/** Counts of each verdict word in one column, in the order of {@link VERDICT_CLASSES}. */
function counts(words: readonly string[]): string {
  const n = new Map<string, number>();
  for (const w of words) n.set(w, (n.get(w) ?? 0) + 1);
  return Object.keys(VERDICT_CLASSES).filter((w) => n.has(w)).map((w) =>
    `<span class="${VERDICT_CLASSES[w]}">${n.get(w)} ${escapeHtml(w)}</span>`
  ).join("");
}

/**
 * The HTML index page of a fleet.
 *
 * Layout: the title; a line of counts (sites planned and refused, target verdicts, straight-run
 * verdicts); a table with {@link FLEET_INDEX_HEADINGS}, verdict cells coloured by
 * {@link VERDICT_CLASSES} and always spelled out; refused sites as rows of their own with the
 * reason; the safety note. The page opens offline (no scripts, no outside resources).
 *
 * @param rows planned rows (fleet CSV order, with the site page's file name) and refusals
 * @param title page title
 * @param safety the safety note printed under the table
 * @returns HTML text
 *
 * @example
 * ```ts
 * import { fleetIndexHtml } from "./fleet_index.ts";
 * const html = fleetIndexHtml([
 *   { row: ["s1", "North main", "reachable", "V", 122.04, 1.9, "meets", "wedge speed", "ab12"],
 *     href: "s1.html" },
 *   { id: "s2", name: "South main", error: "unknown liquid 'watr'" },
 * ], "Fleet", "Follow local codes.");
 * if (!html.includes('class="v-good">reachable') || !html.includes("1 refused")) {
 *   throw new Error("verdicts coloured and counted");
 * }
 * ```
 */
export function fleetIndexHtml(
  rows: readonly (FleetIndexRow | FleetIndexRefusal)[],
  title: string,
  safety: string,
): string {
  const planned = rows.filter((r): r is FleetIndexRow => "row" in r);
  const refused = rows.length - planned.length;
  const sites = (n: number) => `${n} ${n === 1 ? "site" : "sites"}`;
  const summary = `<p class="counts"><span>${sites(planned.length)} planned</span>` +
    (refused ? `<span class="v-bad">${refused} refused</span>` : "") + "</p>" +
    `<p class="counts">Accuracy target: ${
      counts(planned.map((r) => String(r.row[COL.target])))
    }</p>` +
    `<p class="counts">Straight run: ${counts(planned.map((r) => String(r.row[COL.run])))}</p>`;
  const head = `<tr>${FLEET_INDEX_HEADINGS.map((h) => `<th>${escapeHtml(h)}</th>`).join("")}</tr>`;
  const body = rows.map((r) =>
    "row" in r
      ? `<tr>${r.row.map((_, i) => cell(r.row, i, r.href)).join("")}</tr>`
      : `<tr><td>${escapeHtml(r.id)}</td><td>${escapeHtml(r.name)}</td>${
        verdictCell("refused")
      }<td colspan="${FLEET_INDEX_HEADINGS.length - 3}">${escapeHtml(r.error)}</td></tr>`
  ).join("");
  return htmlPage({
    title,
    css: INDEX_CSS,
    body: `<h1>${escapeHtml(title)}</h1>${summary}<h2>Sites</h2>` +
      `<table class="fleet"><thead>${head}</thead><tbody>${body}</tbody></table>` +
      `<h2>Safety</h2><p>${escapeHtml(safety)}</p>`,
  });
}
