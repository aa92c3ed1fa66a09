/**
 * Reports of site plans: terminal text, Markdown, JSON, a fleet CSV and an HTML page with inline
 * SVG drawings. Reads plans; computes no physics. Every report names the registry hash and lists
 * the trace.
 *
 * @module
 */
import { fleetIndexHtml } from "./fleet_index.ts";
import type { SitePlan } from "../site/plan.ts";
import type { Reconciliation } from "../site/reconcile.ts";
import {
  csvTable,
  displayUnit,
  escapeHtml,
  formatQuantity,
  formatWithUncertainty,
  htmlPage,
  markdownTable,
  type TableCell,
  textTable,
} from "./format.ts";
import { mountingColour, svgAxialPath, svgPipeSection, svgRun } from "./drawings.ts";
import { CARD_CSS, formatCard, jobCard, jobCardHtml } from "./card.ts";
import { svgBarChart, svgLineChart } from "./svg.ts";

const DEG = 180 / Math.PI;
/** "1 traverse", "2 traverses". */
const traverseWord = (n: number) => `${n} traverse${n === 1 ? "" : "s"}`;
const pct = (x: number, d = 3) => `${Number((x * 100).toPrecision(d))} %`;
/** An expanded uncertainty as a percentage to two significant digits (JCGM 100:2008, 7.2.6). */
const upct = (x: number) => {
  const v = x * 100;
  return `${Math.abs(v) >= 100 ? String(Math.round(v)) : v.toPrecision(2)} %`;
};
const mm = (x: number, d = 4) => formatQuantity(x, "mm", d);

/** Safety cautions every plan report carries, besides the plan's own. */
export const REPORT_SAFETY: string =
  "Safety: work on live, hot or pressurised lines, lifting lagging or insulation, hazardous " +
  "areas, confined spaces and work at height each need the site's permits and trained people. " +
  "Local codes and licensed practice take precedence over this report.";

function verdictLine(p: SitePlan): string {
  if (!p.target) return "no target uncertainty stated";
  return p.target.reachable
    ? `target ${pct(p.target.uncertainty)} reachable here: worst expanded ${
      upct(p.target.worstExpanded)
    } (${p.target.worstPoint} flow)`
    : `target ${pct(p.target.uncertainty)} NOT reachable as planned: worst expanded ${
      upct(p.target.worstExpanded)
    } (${p.target.worstPoint} flow)`;
}

function mountingRows(p: SitePlan): (string | number)[][] {
  return p.mountings.map((m) => [
    `${m.name} (${m.traverses})`,
    mm(m.spacing),
    `${mm(m.searchWindow.range.min)} – ${mm(m.searchWindow.range.max)}`,
    `${(m.fluidAngle * DEG).toFixed(2)}°`,
    m.wallMode,
    m.times.map((t) => formatQuantity(t.deltaT, "ns", 3)).join(" / "),
    m.resolvableAtMinimum ? "yes" : "no",
    `${m.signal.rating} (${m.signal.totalDb.toFixed(0)} dB)`,
    m.wallBorne.overlaps ? "overlaps" : "clear",
    m.expandedByPoint.map((x) => pct(x)).join(" / "),
  ]);
}

const MOUNTING_HEADERS = [
  "mounting",
  "spacing",
  "search window",
  "liquid angle",
  "wall wave",
  "Δt min/…/max",
  "resolvable",
  "signal",
  "wall signal",
  "U (k=2) min/…/max",
];

function pointRows(p: SitePlan): (string | number)[][] {
  return p.operatingPoints.map((o) => [
    o.label,
    formatQuantity(o.flowRate, "L/s", 4),
    formatQuantity(o.meanVelocity, "m/s", 3),
    Number(o.reynolds.toPrecision(3)).toExponential(2),
    o.regime,
    formatWithUncertainty(o.profileFactor, o.profileFactorSpread, ""),
  ]);
}

const POINT_HEADERS = [
  "flow",
  "flow rate",
  "mean velocity",
  "Reynolds",
  "regime",
  "profile factor",
];

function budgetRows(p: SitePlan): (string | number)[][] {
  return p.uncertainty.budget.map((b) => [
    b.name,
    pct(b.relativeContribution),
    pct(b.share, 2),
    b.distribution,
    b.source,
    b.basis,
  ]);
}

const BUDGET_HEADERS = ["contributor", "u (relative)", "share", "distribution", "source", "basis"];

function traceRows(p: SitePlan | Reconciliation): (string | number)[][] {
  return p.trace.map((t) => [
    t.quantity,
    typeof t.value === "number" ? Number(t.value.toPrecision(6)) : t.value,
    t.unit,
    t.source,
    t.basis,
  ]);
}

const TRACE_HEADERS = ["quantity", "value", "unit", "source", "basis"];

/**
 * The trace as text lines, one entry a line (`  quantity: value unit  [source, basis]`), units
 * written as everywhere else in the report (m³, m²/s, °C…); long lines wrap under their indent.
 */
function traceLines(p: SitePlan | Reconciliation): string[] {
  return p.trace.map((t) => {
    const v = typeof t.value === "number" ? String(Number(t.value.toPrecision(6))) : t.value;
    const unit = t.unit ? ` ${displayUnit(t.unit)}` : "";
    return `  ${t.quantity}: ${v}${unit}  [${t.source}, ${t.basis}]`;
  });
}

/** Text-report width limit, columns. */
export const TEXT_WIDTH = 100;

/**
 * A text table within {@link TEXT_WIDTH} columns: when the whole table is wider, its columns are
 * split into groups (the first column repeated in each), one table per group.
 */
function fitTable(headers: readonly string[], rows: readonly (readonly TableCell[])[]): string {
  const whole = textTable(headers, rows);
  if (whole.split("\n").every((l) => l.length <= TEXT_WIDTH)) return whole;
  const col = (j: number) => headers.map((_, k) => k).filter((k) => k === 0 || k === j);
  const groups: number[][] = [];
  let cur: number[] = [0];
  for (let j = 1; j < headers.length; j++) {
    const tryCols = [...cur, j];
    const t = textTable(tryCols.map((k) => headers[k]), rows.map((r) => tryCols.map((k) => r[k])));
    if (cur.length > 1 && t.split("\n").some((l) => l.length > TEXT_WIDTH)) {
      groups.push(cur);
      cur = col(j);
    } else cur = tryCols;
  }
  groups.push(cur);
  return groups.map((g) => textTable(g.map((k) => headers[k]), rows.map((r) => g.map((k) => r[k]))))
    .join("\n\n");
}

/** Wrap prose lines longer than {@link TEXT_WIDTH}, continuing under their own indent. */
function fitLines(text: string): string {
  const out: string[] = [];
  for (const l of text.split("\n")) {
    if (l.length <= TEXT_WIDTH) {
      out.push(l);
      continue;
    }
    const lead = /^(\s*(?:- )?)/.exec(l)![1];
    const indent = " ".repeat(lead.length + 2);
    let line = "";
    for (const w of l.slice(lead.length).split(" ")) {
      const cand = line ? `${line} ${w}` : lead + w;
      if (line && cand.length > TEXT_WIDTH) {
        out.push(line);
        line = indent + w;
      } else line = cand;
    }
    out.push(line);
  }
  return out.join("\n");
}

/**
 * The plan as terminal text.
 *
 * @param p a plan from planSite
 * @returns text with tables, verdict, straight run, budget, cautions, warnings and trace
 *
 * @example
 * ```ts
 * import { planText } from "./plan_report.ts";
 * import { readSiteText } from "../site/read.ts";
 * import { planSite } from "../site/plan.ts";
 * const plan = planSite(await readSiteText(`
 * name: Example (invented)
 * pipe: { standard: ASME B36.10M, nps: "4", schedule: "40", material: carbon-steel }
 * fluid: { liquid: water, temperature: 20 degC }
 * flow: { minimum: 2 L/s, maximum: 10 L/s }
 * transducer: { wedgeSoundSpeed: 2720 m/s, wedgeAngle: 38 deg, frequency: 1 MHz }
 * `), { monteCarlo: false });
 * if (!planText(plan).includes(plan.registryHash)) throw new Error();
 * ```
 */
export function planText(p: SitePlan): string {
  const out: string[] = [formatCard(p), ""];
  out.push(`${p.name}${p.invented ? "  [invented scenario]" : ""}`);
  out.push(`registry ${p.registryHash}`);
  out.push("");
  out.push(
    `pipe   ${p.pipe.description}, ${p.pipe.material}: OD ${mm(p.pipe.outsideDiameter)}, wall ${
      mm(p.pipe.wallThickness, 3)
    }, bore ${mm(p.pipe.boreDiameter)}` +
      (p.pipe.lining.length
        ? `, lining ${p.pipe.lining.map((l) => `${l.material} ${mm(l.thickness, 2)}`).join(", ")}`
        : ""),
  );
  out.push(
    `fluid  ${p.fluid.name} at ${formatQuantity(p.fluid.temperature, "degC", 3)}, ${
      formatQuantity(p.fluid.pressure, "bar", 3)
    } abs: c ${formatWithUncertainty(p.fluid.soundSpeed, p.fluid.soundSpeedSpread, "m/s")}, ρ ${
      formatQuantity(p.fluid.density, "kg/m^3", 4)
    }, ν ${formatQuantity(p.fluid.kinematicViscosity, "mm^2/s", 3)}`,
  );
  out.push(
    `wedge  ${formatQuantity(p.transducer.wedgeSoundSpeed, "m/s", 4)} at ${
      (p.transducer.wedgeAngle * DEG).toFixed(1)
    }°, ${formatQuantity(p.transducer.frequency, "MHz", 3)}`,
  );
  out.push("");
  out.push(`verdict: ${verdictLine(p)}`);
  for (const s of p.target?.suggestions ?? []) out.push(`  - ${s}`);
  out.push(
    `recommended mounting: ${
      p.mountings.find((m) => m.traverses === p.recommendedMounting)?.name
    } (${traverseWord(p.recommendedMounting)})`,
  );
  out.push("");
  out.push(fitTable(MOUNTING_HEADERS, mountingRows(p)));
  out.push("");
  out.push(fitTable(POINT_HEADERS, pointRows(p)));
  out.push(`profile factor changes by ${pct(p.profileFactorChange)} across the flow range`);
  if (p.straightRun) {
    const r = p.straightRun;
    out.push("");
    out.push(
      `straight run ${
        formatQuantity(r.runLength, "m", 3)
      } from ${r.upstreamFitting} to ${r.downstreamFitting}: ` +
        `${r.verdict} at ${formatQuantity(r.position, "m", 3)} (${r.positionSource}); ` +
        `${r.upstreamDiameters.toFixed(1)} D upstream of ${r.requiredUpstream} D required, ` +
        `${
          r.downstreamDiameters === null ? "—" : r.downstreamDiameters.toFixed(1)
        } D downstream of ${r.requiredDownstream} D`,
    );
    out.push(
      `  common-practice position ${
        formatQuantity(r.commonPracticePosition, "m", 3)
      }; model-ranked position ` +
        `${formatQuantity(r.recommendedPosition, "m", 3)} at ${
          (r.recommendedOrientation * DEG).toFixed(0)
        }°; ` +
        `estimated profile error ${
          formatWithUncertainty(r.estimatedProfileError, r.estimatedProfileErrorSpread, "%")
        } (an estimate)`,
    );
    out.push(sketchRun(p));
  }
  out.push("");
  out.push(
    `uncertainty (${
      p.mountings.find((m) => m.traverses === p.uncertainty.mounting)?.name
    } mounting, ${p.uncertainty.operatingPoint} flow): ` +
      `expanded ${upct(p.uncertainty.expanded)} (k = ${
        p.uncertainty.coverageFactor.toFixed(2)
      }, GUM)` +
      (p.uncertainty.monteCarlo
        ? `; Monte Carlo ${
          upct(p.uncertainty.monteCarlo.expanded)
        } (${p.uncertainty.monteCarlo.draws} draws, 95 %)`
        : ""),
  );
  out.push(fitTable(BUDGET_HEADERS, budgetRows(p)));
  out.push("");
  out.push("cautions:");
  for (const c of p.cautions) out.push(`  - ${c}`);
  if (p.warnings.length) {
    out.push("warnings:");
    for (const w of p.warnings) out.push(`  - ${w.message}`);
  }
  out.push("");
  out.push(`trace (${p.trace.length} entries):`);
  out.push(...traceLines(p));
  return fitLines(out.join("\n")) + "\n";
}

/** An ASCII sketch of the run: fittings, the requirement zones and the chosen position. */
function sketchRun(p: SitePlan): string {
  const r = p.straightRun!;
  const W = 60;
  const at = (x: number) => Math.max(0, Math.min(W - 1, Math.round(x / r.runLength * (W - 1))));
  const line = Array.from({ length: W }, () => "=");
  line[at(r.commonPracticePosition)] = "c";
  line[at(r.position)] = "M";
  return `  [${r.upstreamFitting}]${
    line.join("")
  }[${r.downstreamFitting}]   M meter, c common-practice position`;
}

/**
 * The plan as Markdown.
 *
 * @param p a plan
 * @returns Markdown text
 */
export function planMarkdown(p: SitePlan): string {
  const out: string[] = [];
  out.push(`# ${p.name}`, "", formatCard(p, { format: "md" }), "");
  if (p.invented) out.push("\n*Invented scenario: no figure here describes a real installation.*");
  out.push(`\nRegistry hash: \`${p.registryHash}\`\n`);
  out.push(`**Verdict:** ${verdictLine(p)}`);
  for (const s of p.target?.suggestions ?? []) out.push(`- ${s}`);
  out.push(`\n## Pipe and liquid\n`);
  out.push(markdownTable(["quantity", "value"], [
    ["pipe", `${p.pipe.description}, ${p.pipe.material}`],
    ["outside diameter", mm(p.pipe.outsideDiameter)],
    ["wall thickness", mm(p.pipe.wallThickness, 3)],
    ["bore", mm(p.pipe.boreDiameter)],
    ["liquid", `${p.fluid.name}, ${formatQuantity(p.fluid.temperature, "degC", 3)}`],
    ["sound speed", formatWithUncertainty(p.fluid.soundSpeed, p.fluid.soundSpeedSpread, "m/s")],
    ["density", formatQuantity(p.fluid.density, "kg/m^3", 4)],
    ["kinematic viscosity", formatQuantity(p.fluid.kinematicViscosity, "mm^2/s", 3)],
  ]));
  out.push(`\n## Mountings\n`);
  out.push(markdownTable(MOUNTING_HEADERS, mountingRows(p)));
  out.push(`\n## Operating points\n`);
  out.push(markdownTable(POINT_HEADERS, pointRows(p)));
  if (p.straightRun) {
    const r = p.straightRun;
    out.push(`\n## Straight run\n`);
    out.push(
      `${r.verdict} at ${
        formatQuantity(r.position, "m", 3)
      } (${r.positionSource}); common-practice position ` +
        `${formatQuantity(r.commonPracticePosition, "m", 3)}, model-ranked ${
          formatQuantity(r.recommendedPosition, "m", 3)
        }; ` +
        `estimated profile error ${
          pct(r.estimatedProfileError, 2)
        } (an estimate, not a calibration).`,
    );
    for (const x of r.reasons) out.push(`- ${x}`);
  }
  out.push(`\n## Uncertainty budget\n`);
  out.push(
    `Expanded ${upct(p.uncertainty.expanded)} (k = ${
      p.uncertainty.coverageFactor.toFixed(2)
    }) at ${p.uncertainty.operatingPoint} flow` +
      (p.uncertainty.monteCarlo
        ? `; Monte Carlo ${upct(p.uncertainty.monteCarlo.expanded)}.`
        : ".") +
      "\n",
  );
  out.push(markdownTable(BUDGET_HEADERS, budgetRows(p)));
  out.push(`\n## Cautions\n`);
  for (const c of p.cautions) out.push(`- ${c}`);
  out.push(`- ${REPORT_SAFETY}`);
  if (p.warnings.length) {
    out.push(`\n## Warnings\n`);
    for (const w of p.warnings) out.push(`- ${w.message}`);
  }
  out.push(`\n## Trace\n`);
  out.push(markdownTable(TRACE_HEADERS, traceRows(p)));
  return out.join("\n") + "\n";
}

/** Headers of the fleet summary (CSV and HTML index). */
export const FLEET_HEADERS: readonly string[] = [
  "id",
  "name",
  "verdict",
  "mounting",
  "spacing_mm",
  "expanded_percent",
  "straight_run",
  "main_limitation",
  "registry_hash",
];

/** One fleet summary row of a plan. */
export function fleetRow(p: SitePlan): (string | number)[] {
  const m = p.mountings.find((x) => x.traverses === p.recommendedMounting)!;
  return [
    p.id ?? "",
    p.name,
    p.target ? (p.target.reachable ? "reachable" : "not reachable") : "no target",
    m.name,
    Number((m.spacing * 1000).toFixed(2)),
    Number((Math.max(...p.uncertainty.expandedByPoint.map((x) => x.expanded)) * 100).toFixed(3)),
    p.straightRun?.verdict ?? "not assessed",
    p.mainLimitation,
    p.registryHash,
  ];
}

/**
 * A fleet summary as CSV: one row a site, plus one row per refused site.
 *
 * @param rows summary rows from {@link fleetRow}, or refusals `{ id, name, error }`
 * @returns CSV text (RFC 4180)
 */
export function fleetCsv(
  rows: readonly ((string | number)[] | { id: string; name: string; error: string })[],
): string {
  return csvTable(
    FLEET_HEADERS,
    rows.map((r) =>
      Array.isArray(r) ? r : [r.id, r.name, `refused: ${r.error}`, "", "", "", "", "", ""]
    ),
  );
}

/**
 * The plan as JSON text (SI throughout).
 *
 * @param p a plan
 * @returns pretty JSON
 */
export function planJson(p: SitePlan | readonly SitePlan[]): string {
  return JSON.stringify(p, null, 2) + "\n";
}

const EXTRA_CSS = `
.verdict-ok{border-left:6px solid #2d6a4f;padding:.4em .8em;background:#eef6f1}
.verdict-no{border-left:6px solid #9b2226;padding:.4em .8em;background:#fbeeee}
figure{margin:1em 0} figure svg{max-width:100%;height:auto}
.grid{display:grid;grid-template-columns:repeat(auto-fit,minmax(420px,1fr));gap:1em}
small.hash{font-family:monospace;color:#555}
`;

function htmlTable(
  headers: readonly string[],
  rows: readonly (readonly (string | number)[])[],
): string {
  return `<table><thead><tr>${
    headers.map((h) => `<th>${escapeHtml(h)}</th>`).join("")
  }</tr></thead><tbody>` +
    rows.map((r) => `<tr>${r.map((c) => `<td>${escapeHtml(String(c))}</td>`).join("")}</tr>`).join(
      "",
    ) +
    "</tbody></table>";
}

/** HTML report part: title, verdict and the pipe-and-liquid table. */
function htmlHeadAndPipe(p: SitePlan, b: string[]): void {
  b.push(`<h1>${escapeHtml(p.name)}</h1>`);
  b.push(jobCardHtml(p));
  if (p.invented) {
    b.push(`<p><em>Invented scenario: no figure here describes a real installation.</em></p>`);
  }
  b.push(`<p><small class="hash">registry ${p.registryHash}</small></p>`);
  b.push(
    `<p class="${p.target?.reachable === false ? "verdict-no" : "verdict-ok"}">${
      escapeHtml(verdictLine(p))
    }</p>`,
  );
  if (p.target?.suggestions.length) {
    b.push(`<ul>${p.target.suggestions.map((s) => `<li>${escapeHtml(s)}</li>`).join("")}</ul>`);
  }
  b.push(`<h2>Pipe and liquid</h2>`);
  b.push(htmlTable(["quantity", "value"], [
    ["pipe", `${p.pipe.description}, ${p.pipe.material}`],
    ["outside diameter", mm(p.pipe.outsideDiameter)],
    ["wall thickness", mm(p.pipe.wallThickness, 3)],
    ["bore", mm(p.pipe.boreDiameter)],
    [
      "lining",
      p.pipe.lining.map((l) => `${l.material} ${mm(l.thickness, 2)}`).join(", ") || "none",
    ],
    ["liquid", `${p.fluid.name} at ${formatQuantity(p.fluid.temperature, "degC", 3)}`],
    ["sound speed", formatWithUncertainty(p.fluid.soundSpeed, p.fluid.soundSpeedSpread, "m/s")],
    ["kinematic viscosity", formatQuantity(p.fluid.kinematicViscosity, "mm^2/s", 3)],
  ]));
}

/** HTML report part: the mounting table and drawings. */
function htmlMountings(p: SitePlan, b: string[]): void {
  b.push(`<h2>Mountings</h2>`);
  b.push(
    htmlTable(MOUNTING_HEADERS, mountingRows(p)).replace(
      /<tr><td>([A-Z][\w-]*) \((\d+)\)<\/td>/g,
      (_, name, n) =>
        `<tr><td><svg width="12" height="12" aria-hidden="true"><rect width="12" height="12" ` +
        `fill="${mountingColour(Number(n))}"/></svg> ${name} (${n})</td>`,
    ),
  );
  const lin = p.pipe.lining.reduce((s, l) => s + l.thickness, 0);
  b.push(`<div class="grid">`);
  const rec = p.mountings.find((m) => m.traverses === p.recommendedMounting)!;
  const card = jobCard(p);
  b.push(`<figure>${
    svgPipeSection({
      outsideDiameter: p.pipe.outsideDiameter,
      wallThickness: p.pipe.wallThickness,
      liningThickness: lin || undefined,
      traverses: rec.traverses,
      fluidAngle: rec.fluidAngle,
      pathPlane: card.pathPlane,
      clock: card.clock,
      title: `Cross-section, ${rec.name} mounting`,
    })
  }</figure>`);
  for (const m of p.mountings) {
    b.push(`<figure>${
      svgAxialPath({
        outsideDiameter: p.pipe.outsideDiameter,
        wallThickness: p.pipe.wallThickness,
        liningThickness: lin || undefined,
        spacing: m.spacing,
        traverses: m.traverses,
        fluidAngle: m.fluidAngle,
        wallAngle: m.wallAngle,
        liningAngle: m.liningAngles[0],
        title: `${m.name} mounting (${traverseWord(m.traverses)}): spacing ${mm(m.spacing)}`,
      })
    }</figure>`);
  }
  b.push(`</div>`);
  const temps = p.mountings.filter((m) => m.overTemperature);
  if (temps.length) {
    b.push(`<figure>${
      svgLineChart({
        title: "Spacing against liquid temperature",
        xLabel: "liquid temperature (°C)",
        yLabel: "spacing (mm)",
        series: temps.map((m) => ({
          name: `${m.name} mounting`,
          colour: mountingColour(m.traverses),
          points: m.overTemperature!.map((r) =>
            [r.temperature - 273.15, r.spacing * 1000] as const
          ),
        })),
      })
    }</figure>`);
  }
}

/** HTML report part: operating points and the straight-run section. */
function htmlStraightRun(p: SitePlan, b: string[]): void {
  b.push(`<h2>Operating points</h2>`);
  b.push(htmlTable(POINT_HEADERS, pointRows(p)));
  if (p.straightRun) {
    const r = p.straightRun;
    b.push(`<h2>Straight run</h2>`);
    b.push(
      `<p>${
        escapeHtml(
          `${r.verdict} at ${
            formatQuantity(r.position, "m", 3)
          } (${r.positionSource}). Common-practice position ${
            formatQuantity(r.commonPracticePosition, "m", 3)
          }; model-ranked position ${
            formatQuantity(r.recommendedPosition, "m", 3)
          }. Estimated profile error ${
            formatWithUncertainty(r.estimatedProfileError, r.estimatedProfileErrorSpread, "%")
          }: an estimate from a model, not a calibration.`,
        )
      }</p>`,
    );
    b.push(`<ul>${r.reasons.map((x) => `<li>${escapeHtml(x)}</li>`).join("")}</ul>`);
    b.push(`<figure>${
      svgRun({
        runLength: r.runLength,
        diameter: p.pipe.boreDiameter,
        upstreamLabel: r.upstreamFitting,
        downstreamLabel: r.downstreamFitting,
        requiredUpstream: r.requiredUpstream * p.pipe.boreDiameter,
        requiredDownstream: r.requiredDownstream * p.pipe.boreDiameter,
        recommendedPosition: r.recommendedPosition,
        commonPracticePosition: r.commonPracticePosition,
      })
    }</figure>`);
    b.push(`<figure>${
      svgLineChart({
        title: "Estimated profile error along the run (model estimate)",
        xLabel: "distance from the upstream fitting (m)",
        yLabel: "estimated error (%)",
        series: [{
          name: "estimate",
          points: r.errorAlongRun.map((x) => [x.position, x.error * 100] as const),
        }],
        vLines: [{ x: r.position, label: "meter" }],
      })
    }</figure>`);
  }
}

/** HTML report part: uncertainty, cautions, warnings and trace. */
function htmlBudgetAndTrace(p: SitePlan, b: string[]): void {
  b.push(`<h2>Uncertainty budget</h2>`);
  b.push(
    `<p>${
      escapeHtml(
        `Expanded ${upct(p.uncertainty.expanded)} (k = ${
          p.uncertainty.coverageFactor.toFixed(2)
        }, GUM) at ${p.uncertainty.operatingPoint} flow` + (p.uncertainty.monteCarlo
          ? `; Monte Carlo ${
            upct(p.uncertainty.monteCarlo.expanded)
          } from ${p.uncertainty.monteCarlo.draws} draws.`
          : "."),
      )
    }</p>`,
  );
  b.push(`<figure>${
    svgBarChart({
      title: "Relative standard uncertainty contributions",
      unit: "%",
      bars: p.uncertainty.budget.map((x) => ({
        label: x.name,
        value: x.relativeContribution * 100,
      })),
    })
  }</figure>`);
  b.push(htmlTable(BUDGET_HEADERS, budgetRows(p)));
  b.push(
    `<h2>Cautions</h2><ul>${
      [...p.cautions, REPORT_SAFETY].map((c) => `<li>${escapeHtml(c)}</li>`).join("")
    }</ul>`,
  );
  if (p.warnings.length) {
    b.push(
      `<h2>Warnings</h2><ul>${
        p.warnings.map((w) => `<li>${escapeHtml(w.message)}</li>`).join("")
      }</ul>`,
    );
  }
  b.push(`<h2>Trace</h2>`);
  b.push(htmlTable(TRACE_HEADERS, traceRows(p)));
}

/**
 * The plan as a self-contained HTML page with inline SVG drawings: the pipe in section and along
 * its axis with the beam path for each mounting, the run with its fittings and positions, the
 * estimated profile error along the run, spacing against temperature, and the budget as bars.
 *
 * @param p a plan
 * @returns HTML text that opens offline
 */
export function planHtml(p: SitePlan): string {
  const b: string[] = [];
  htmlHeadAndPipe(p, b);
  htmlMountings(p, b);
  htmlStraightRun(p, b);
  htmlBudgetAndTrace(p, b);
  return htmlPage({ title: p.name, body: b.join("\n"), css: EXTRA_CSS + CARD_CSS });
}

/**
 * The HTML index of a fleet: counts of verdicts, then the summary table with its own headings,
 * verdicts coloured and spelled out, linking each site's page (see {@link fleetIndexHtml}).
 *
 * @param rows summary rows (from {@link fleetRow}) with the page file name, or refusals
 * @param title page title
 * @returns HTML text
 */
export function fleetHtml(
  rows: readonly ({ row: (string | number)[]; href: string } | {
    id: string;
    name: string;
    error: string;
  })[],
  title = "Fleet summary",
): string {
  return fleetIndexHtml(rows, title, REPORT_SAFETY);
}

/**
 * A reconciliation as terminal text.
 *
 * @param r a reconciliation
 * @returns text
 */
export function reconciliationText(r: Reconciliation): string {
  const out: string[] = [`${r.name}`, `registry ${r.registryHash}`, ""];
  out.push(
    `liquid temperature ${formatQuantity(r.temperature, "degC", 3)}, wall ${
      mm(r.wallThickness, 3)
    }`,
  );
  out.push(textTable(
    ["mounting", "liquid time", "planned", "inferred c", "registry c", "difference", "agrees"],
    r.mountings.map((m) => [
      String(m.traverses),
      formatQuantity(m.measuredLiquidTime, "us", 5),
      formatQuantity(m.plannedLiquidTime, "us", 5),
      formatQuantity(m.inferredSoundSpeed, "m/s", 5),
      formatQuantity(m.registrySoundSpeed, "m/s", 5),
      `${m.difference.toFixed(1)} ± ${m.tolerance.toFixed(1)} m/s`,
      m.consistent ? "yes" : "no",
    ]),
  ));
  for (const m of r.mountings) {
    for (const c of m.causes) {
      out.push(
        `  ${m.traverses}: ${c.plausible ? "likely" : "unlikely"} ${c.cause}: ${c.explanation}`,
      );
    }
    if (m.flow) {
      out.push(
        `  ${m.traverses}: flow ${formatQuantity(m.flow.plannedFlowRate, "L/s", 4)} as planned → ` +
          `${formatQuantity(m.flow.correctedFlowRate, "L/s", 4)} corrected (${
            pct(m.flow.relativeCorrection, 2)
          })`,
      );
    }
  }
  out.push("", r.summary);
  return out.join("\n") + "\n";
}
