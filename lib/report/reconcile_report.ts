/**
 * Reconciliation reports: terminal text, Markdown, HTML and JSON of a {@link Reconciliation}.
 * Reads results only; no physics.
 *
 * @module
 */
import type { MismatchCause, Reconciliation } from "../site/reconcile.ts";
import {
  escapeHtml,
  formatQuantity,
  htmlPage,
  markdownTable,
  type TableCell,
  textTable,
} from "./format.ts";

/** Formats a reconciliation can be written in. */
export const RECONCILE_FORMATS = ["text", "md", "html", "json"] as const;

/** One of {@link RECONCILE_FORMATS}. */
export type ReconcileFormat = typeof RECONCILE_FORMATS[number];

/** The caution every reconciliation report carries. */
export const RECONCILE_SAFETY: string =
  "Caution: readings are taken on live lines. Hot, pressurised or hazardous-area pipework, " +
  "confined spaces, work at height and the removal of insulation or lagging need the site's " +
  "permits and a competent person; local codes and licensed practice take precedence over " +
  "this report.";

const HEAD = [
  "mounting",
  "liquid time",
  "planned",
  "inferred c",
  "registry c",
  "difference",
  "agrees",
];

function mountingRows(r: Reconciliation): TableCell[][] {
  return r.mountings.map((m) => [
    String(m.traverses),
    formatQuantity(m.measuredLiquidTime, "us", 5),
    formatQuantity(m.plannedLiquidTime, "us", 5),
    formatQuantity(m.inferredSoundSpeed, "m/s", 5),
    formatQuantity(m.registrySoundSpeed, "m/s", 5),
    `${m.difference.toFixed(1)} ± ${m.tolerance.toFixed(1)} m/s`,
    m.consistent ? "yes" : "no",
  ]);
}

const CAUSE_HEAD = [
  "rank",
  "cause",
  "what would explain the readings",
  "rms residual",
  "score",
  "fits",
];

function causeRows(causes: readonly MismatchCause[]): TableCell[][] {
  return causes.map((c, i) => [
    String(i + 1),
    c.cause,
    c.explanation,
    Number.isFinite(c.rmsResidual) ? `${(c.rmsResidual * 1e9).toFixed(1)} ns` : "no path",
    Number.isFinite(c.score) ? c.score.toFixed(2) : "-",
    c.plausible ? "yes" : "no",
  ]);
}

function wrap(text: string, width = 100): string {
  const lines: string[] = [];
  let line = "";
  for (const w of text.split(" ")) {
    if (line && line.length + 1 + w.length > width) {
      lines.push(line);
      line = w;
    } else line = line ? `${line} ${w}` : w;
  }
  return [...lines, line].join("\n");
}

function lineText(r: Reconciliation): string[] {
  const l = r.traverseLine;
  if (!l) return [];
  return [
    `Z/V/W agreement: time outside the bore ${formatQuantity(l.offset, "us", 5)} (planned ${
      formatQuantity(l.plannedOffset, "us", 5)
    }), per crossing ${formatQuantity(l.perTraverse, "us", 6)} (planned ${
      formatQuantity(l.plannedPerTraverse, "us", 6)
    })`,
  ];
}

function flowLines(r: Reconciliation): string[] {
  return r.mountings.filter((m) => m.flow).map((m) =>
    `${m.traverses}-traverse flow ${
      formatQuantity(m.flow!.plannedFlowRate, "L/s", 4)
    } as planned → ${formatQuantity(m.flow!.correctedFlowRate, "L/s", 4)} corrected (${
      (m.flow!.relativeCorrection * 100).toFixed(2)
    } %)`
  );
}

function header(r: Reconciliation): string {
  return `liquid temperature ${formatQuantity(r.temperature, "degC", 3)}, wall ${
    formatQuantity(r.wallThickness, "mm", 3)
  }`;
}

/**
 * A reconciliation as terminal text (at most 100 columns where the explanations allow).
 *
 * @param r a reconciliation
 * @returns text
 *
 * @example
 * ```ts
 * import { reconcileText } from "./reconcile_report.ts";
 * const t = reconcileText({ name: "A (invented)", registryHash: "h", temperature: 293.15,
 *   wallThickness: 0.006, mountings: [], causes: [], separable: false, summary: "ok",
 *   warnings: [], trace: [] });
 * if (!t.includes("20.0 °C") || !t.includes("Caution")) throw new Error();
 * ```
 */
export function reconcileText(r: Reconciliation): string {
  const out = [r.name, `registry ${r.registryHash}`, "", header(r)];
  if (r.mountings.length) out.push(textTable(HEAD, mountingRows(r)));
  out.push(...lineText(r));
  if (r.causes.length) {
    out.push("", "causes, likeliest first:", textTable(CAUSE_HEAD, causeRows(r.causes)));
  }
  out.push(...flowLines(r));
  for (const w of r.warnings) out.push(wrap(`warning: ${w.message}`));
  out.push("", wrap(r.summary), "", wrap(RECONCILE_SAFETY));
  return out.join("\n") + "\n";
}

/**
 * A reconciliation as Markdown.
 *
 * @param r a reconciliation
 * @returns Markdown
 *
 * @example
 * ```ts
 * import { reconcileMarkdown } from "./reconcile_report.ts";
 * const t = reconcileMarkdown({ name: "A (invented)", registryHash: "h", temperature: 293.15,
 *   wallThickness: 0.006, mountings: [], causes: [], separable: false, summary: "ok",
 *   warnings: [], trace: [] });
 * if (!t.startsWith("# Reconciliation: A (invented)")) throw new Error();
 * ```
 */
export function reconcileMarkdown(r: Reconciliation): string {
  const out = [
    `# Reconciliation: ${r.name}`,
    "",
    `Registry \`${r.registryHash}\`; ${header(r)}.`,
    "",
  ];
  if (r.mountings.length) out.push(markdownTable(HEAD, mountingRows(r)), "");
  for (const l of lineText(r)) out.push(l, "");
  if (r.causes.length) {
    out.push("## Causes, likeliest first", "", markdownTable(CAUSE_HEAD, causeRows(r.causes)), "");
  }
  for (const l of flowLines(r)) out.push(`- ${l}`);
  for (const w of r.warnings) out.push(`- warning: ${w.message}`);
  out.push("", `**${r.summary}**`, "", `> ${RECONCILE_SAFETY}`);
  return out.join("\n") + "\n";
}

function htmlTable(head: readonly string[], rows: TableCell[][]): string {
  return `<table><thead><tr>${head.map((h) => `<th>${escapeHtml(h)}</th>`).join("")}</tr></thead>` +
    `<tbody>${
      rows.map((r) => `<tr>${r.map((c) => `<td>${escapeHtml(String(c))}</td>`).join("")}</tr>`)
        .join("")
    }</tbody></table>`;
}

/**
 * A reconciliation as a standalone HTML page.
 *
 * @param r a reconciliation
 * @returns HTML
 *
 * @example
 * ```ts
 * import { reconcileHtml } from "./reconcile_report.ts";
 * const h = reconcileHtml({ name: "A <invented>", registryHash: "h", temperature: 293.15,
 *   wallThickness: 0.006, mountings: [], causes: [], separable: false, summary: "ok",
 *   warnings: [], trace: [] });
 * if (!h.includes("A &lt;invented&gt;")) throw new Error();
 * ```
 */
export function reconcileHtml(r: Reconciliation): string {
  const parts = [
    `<h1>Reconciliation: ${escapeHtml(r.name)}</h1>`,
    `<p>Registry <code>${escapeHtml(r.registryHash)}</code>; ${escapeHtml(header(r))}.</p>`,
  ];
  if (r.mountings.length) parts.push(htmlTable(HEAD, mountingRows(r)));
  for (const l of lineText(r)) parts.push(`<p>${escapeHtml(l)}</p>`);
  if (r.causes.length) {
    parts.push("<h2>Causes, likeliest first</h2>", htmlTable(CAUSE_HEAD, causeRows(r.causes)));
  }
  const items = [...flowLines(r), ...r.warnings.map((w) => `warning: ${w.message}`)];
  if (items.length) {
    parts.push(`<ul>${items.map((i) => `<li>${escapeHtml(i)}</li>`).join("")}</ul>`);
  }
  parts.push(
    `<p><strong>${escapeHtml(r.summary)}</strong></p>`,
    `<p>${escapeHtml(RECONCILE_SAFETY)}</p>`,
  );
  return htmlPage({ title: `Reconciliation: ${r.name}`, body: parts.join("\n") });
}

/**
 * A reconciliation in one of {@link RECONCILE_FORMATS}.
 *
 * @param r a reconciliation
 * @param format text, md, html or json
 * @returns the report
 *
 * @example
 * ```ts
 * import { reconcileReport } from "./reconcile_report.ts";
 * const j = reconcileReport({ name: "A (invented)", registryHash: "h", temperature: 293.15,
 *   wallThickness: 0.006, mountings: [], causes: [], separable: false, summary: "ok",
 *   warnings: [], trace: [] }, "json");
 * if (JSON.parse(j).summary !== "ok") throw new Error();
 * ```
 */
export function reconcileReport(r: Reconciliation, format: ReconcileFormat): string {
  switch (format) {
    case "json":
      return JSON.stringify(r, (_k, v) => (v === Infinity ? null : v), 2) + "\n";
    case "md":
      return reconcileMarkdown(r);
    case "html":
      return reconcileHtml(r);
    default:
      return reconcileText(r);
  }
}
