/**
 * The job card: one page a field crew takes to site. It reads a plan and lays out what the crew
 * needs at the pipe: the mounting, the spacing (mm and inches to 1/16 in), the expected zero-flow
 * transit time and Δt at minimum flow, the clock positions of the transducers, the position along
 * the run with its reference face, the spacing search window, a checklist and safety cautions.
 * Presentation only: no physics is computed here (clock positions and inch fractions are
 * presentation geometry).
 *
 * @module
 */
import type { SitePlan } from "../site/plan.ts";
import { escapeHtml, formatQuantity, htmlPage } from "./format.ts";

/** Safety cautions printed on every card (common practice; defers to local codes). */
export const CARD_SAFETY: readonly string[] = Object.freeze([
  "Hot or pressurised line: treat every surface as hot until measured; wear gloves and eye " +
  "protection; never loosen fittings or remove plugs to gain access.",
  "Lagging and insulation: ask the site owner before lifting it; old lagging may contain " +
  "asbestos, which only licensed removers may disturb. Refit or replace lagging afterwards.",
  "Confined spaces, chambers and work at height need the site's permit and a second person.",
  "These notes do not replace local codes, the site owner's permit-to-work or licensed practice; " +
  "where they differ, those prevail.",
]);

/** The data a job card shows, all taken from a plan (SI units). */
export interface JobCard {
  /** Site name. */
  readonly name: string;
  /** Site id, when the site file gives one. */
  readonly id?: string;
  /** Whether the site is an invented scenario. */
  readonly invented: boolean;
  /** Registry hash of the plan. */
  readonly registryHash: string;
  /** Pipe description and material. */
  readonly pipe: string;
  /** Liquid and temperature, K. */
  readonly liquid: string;
  /** Line temperature, K. */
  readonly temperature: number;
  /** Recommended mounting letter (Z, V, W, …). */
  readonly mounting: string;
  /** Bore crossings of the recommended mounting. */
  readonly traverses: number;
  /** Spacing, m. */
  readonly spacing: number;
  /** Spacing as inches to the nearest 1/16 in, e.g. `3 7/16 in`. */
  readonly spacingInches: string;
  /** Expected zero-flow transit time through wall, lining and liquid, s. */
  readonly zeroFlowTime: number;
  /** Δt at minimum flow, s (undefined without a minimum operating point). */
  readonly deltaTMinimum?: number;
  /** Clock positions of the two transducers looking downstream, e.g. ["3:00", "9:00"]. */
  readonly clock: readonly [string, string];
  /** Path-plane angle from the vertical, rad. */
  readonly pathPlane: number;
  /** Position along the run, sentence form. */
  readonly position: string;
  /** Search window of the spacing, m. */
  readonly window: { readonly min: number; readonly max: number };
  /** Search advice, sentence form. */
  readonly search: string;
  /** Checklist lines. */
  readonly checklist: readonly string[];
}

/**
 * Clock position (hours:minutes, to the nearest half hour) of an angle measured clockwise from
 * the top of the pipe as seen looking downstream. Presentation geometry: hour = 12·θ/(2π).
 *
 * @param angle rad, any value (wrapped)
 * @returns e.g. "3:00", "10:30", "12:00"
 *
 * @example
 * ```ts
 * import { clockPosition } from "./card.ts";
 * if (clockPosition(Math.PI / 2) !== "3:00") throw new Error();
 * if (clockPosition(-Math.PI / 4) !== "10:30") throw new Error();
 * ```
 */
export function clockPosition(angle: number): string {
  if (!Number.isFinite(angle)) throw new RangeError(`clock angle ${angle} is not finite`);
  const halfHours = Math.round(angle / (2 * Math.PI) * 24);
  const h = ((halfHours % 24) + 24) % 24;
  const hour = Math.floor(h / 2) === 0 ? 12 : Math.floor(h / 2);
  return `${hour}:${h % 2 ? "30" : "00"}`;
}

/**
 * A length in inches to the nearest 1/16 in, fraction reduced: 0.0873 m → "3 7/16 in".
 * Exact conversion 1 in = 25.4 mm (NIST SP 811).
 *
 * @param metres length, m (finite, ≥ 0)
 * @returns text such as "3 7/16 in", "2 in", "5/8 in"
 *
 * @example
 * ```ts
 * import { inchesSixteenths } from "./card.ts";
 * if (inchesSixteenths(0.0873125) !== "3 7/16 in") throw new Error();
 * ```
 */
export function inchesSixteenths(metres: number): string {
  if (!Number.isFinite(metres) || metres < 0) {
    throw new RangeError(`length ${metres} m is not a finite length ≥ 0`);
  }
  const n = Math.round(metres / 0.0254 * 16);
  const whole = Math.floor(n / 16);
  let num = n % 16;
  let den = 16;
  while (num && num % 2 === 0) {
    num /= 2;
    den /= 2;
  }
  if (!num) return `${whole} in`;
  return whole ? `${whole} ${num}/${den} in` : `${num}/${den} in`;
}

const us = (s: number) => formatQuantity(s, "us", 4);
const ns = (s: number) => formatQuantity(s, "ns", 3);
const mmq = (m: number, d = 4) => formatQuantity(m, "mm", d);

function couplantLine(T: number): string {
  const c = T - 273.15;
  const t = formatQuantity(T, "degC", 3);
  if (c < 0) {
    return `Couplant: a low-temperature couplant that stays soft at ${t} (common practice).`;
  }
  if (c <= 60) {
    return `Couplant: ordinary gel or grease couplant is suited to ${t} (common practice).`;
  }
  return `Couplant: a high-temperature paste rated above ${t}; gel couplants dry out or run off ` +
    "(common practice). Check the transducers are rated for the surface temperature.";
}

function positionLine(p: SitePlan): string {
  const r = p.straightRun;
  if (!r) return "No straight run is described in the site file: choose the spot on site.";
  return `${formatQuantity(r.position, "m", 3)} downstream of the outlet face of the upstream ` +
    `${r.upstreamFitting}, measured to the middle of the transducer set (${r.positionSource}; ` +
    `straight run ${r.verdict}).`;
}

function searchLine(p: SitePlan, traverses: number): string {
  const m = p.mountings.find((x) => x.traverses === traverses)!;
  const w = m.searchWindow;
  const top =
    [...w.contributions].sort((a, b) => Math.abs(b.contribution) - Math.abs(a.contribution))[0];
  const start = `Start at ${mmq(m.spacing)}; if no signal, search ${mmq(w.range.min)} to ` +
    `${mmq(w.range.max)}`;
  if (!top) return start + ".";
  return `${start}. The largest contributor is ${top.input}: if its real value is higher than ` +
    `planned, move the transducers ${top.ifHigher}, otherwise the other way.`;
}

/**
 * Collect the job-card data of a plan (no physics: every figure is read from the plan). The
 * path plane is the straight-run ranking's recommended plane (angle from the vertical, rad);
 * without a run it is horizontal (common practice). Clock positions look downstream with the
 * angle counted clockwise from 12 o'clock: one traverse (Z) puts the transducers on opposite
 * ends of the plane's diameter, an even count (V, W) both at the first end.
 *
 * @param p a plan from `planSite`
 * @returns the card data
 *
 * @example
 * ```ts
 * import { jobCard } from "./card.ts";
 * import { readSiteText } from "../site/read.ts";
 * import { planSite } from "../site/plan.ts";
 * const plan = planSite(await readSiteText(`
 * name: Example (invented)
 * pipe: { standard: ASME B36.10M, nps: "4", schedule: "40", material: carbon-steel }
 * fluid: { liquid: water, temperature: 20 degC }
 * flow: { minimum: 2 L/s, maximum: 10 L/s }
 * transducer: { wedgeSoundSpeed: 2720 m/s, wedgeAngle: 38 deg, frequency: 1 MHz }
 * `), { monteCarlo: false });
 * if (jobCard(plan).clock[0] !== "3:00") throw new Error();
 * ```
 */
export function jobCard(p: SitePlan): JobCard {
  const m = p.mountings.find((x) => x.traverses === p.recommendedMounting)!;
  const plane = p.straightRun?.recommendedOrientation ?? Math.PI / 2;
  const clock: [string, string] = [
    clockPosition(plane),
    clockPosition(m.traverses % 2 ? plane + Math.PI : plane),
  ];
  const minTime = m.times.find((t) => t.label === "minimum");
  const T = p.fluid.temperature;
  return {
    name: p.name,
    id: p.id,
    invented: p.invented,
    registryHash: p.registryHash,
    pipe: `${p.pipe.description}, ${p.pipe.material}`,
    liquid: `${p.fluid.name} at ${formatQuantity(T, "degC", 3)}`,
    temperature: T,
    mounting: m.name,
    traverses: m.traverses,
    spacing: m.spacing,
    spacingInches: inchesSixteenths(m.spacing),
    zeroFlowTime: m.totalTime,
    deltaTMinimum: minTime?.deltaT,
    clock,
    pathPlane: plane,
    position: positionLine(p),
    window: { min: m.searchWindow.range.min, max: m.searchWindow.range.max },
    search: searchLine(p, m.traverses),
    checklist: [
      "Surface: remove paint, scale and rust down to bright metal over each transducer " +
      "footprint; file flat, wipe clean and dry (common practice).",
      couplantLine(T),
      `Wall: gauge the wall with an ultrasonic thickness gauge at each transducer footprint, ` +
      `at 12, 3, 6 and 9 o'clock; planned wall ${mmq(p.pipe.wallThickness, 3)}.`,
      "Readings file: record temperature, wallThickness and, for each mounting tried, " +
      "traverses, totalTime, fixedDelay, deltaT and, if the flow can be stopped, " +
      "zeroFlowDeltaT (see docs/readings.md).",
    ],
  };
}

function rows(c: JobCard): [string, string][] {
  return [
    ["pipe", c.pipe],
    ["liquid", c.liquid],
    ["mounting", `${c.mounting} (${c.traverses} ${c.traverses === 1 ? "traverse" : "traverses"})`],
    ["spacing", `${mmq(c.spacing)} (${c.spacingInches})`],
    [
      "transducers",
      (c.clock[0] === c.clock[1]
        ? `both at ${c.clock[0]} o'clock`
        : `${c.clock[0]} and ${c.clock[1]} o'clock`) +
      `, looking downstream (path plane ${formatQuantity(c.pathPlane, "deg", 3)} from vertical)`,
    ],
    ["position", c.position],
    ["zero-flow transit", `${us(c.zeroFlowTime)} (wall, lining and liquid; no wedge or delay)`],
    ["Δt at minimum flow", c.deltaTMinimum === undefined ? "no minimum flow" : ns(c.deltaTMinimum)],
    ["search window", `${mmq(c.window.min)} to ${mmq(c.window.max)}`],
    ["if no signal", c.search],
  ];
}

function wrap(first: string, text: string, width: number): string[] {
  const indent = " ".repeat(first.length);
  const out: string[] = [];
  let line = "";
  for (const w of text.split(" ")) {
    if (line && (line + " " + w).length > width - first.length) {
      out.push(line);
      line = w;
    } else line = line ? `${line} ${w}` : w;
  }
  out.push(line);
  return out.map((l, i) => (i ? indent : first) + l);
}

/** The card as terminal text, lines within 100 columns. */
function cardText(c: JobCard): string {
  const out = wrap("JOB CARD  ", `${c.name}${c.invented ? " [invented scenario]" : ""}`, 100);
  for (const [k, v] of rows(c)) out.push(...wrap(k.padEnd(20), v, 100));
  out.push("checklist");
  for (const x of c.checklist) out.push(...wrap("  [ ] ", x, 100));
  out.push("safety");
  for (const x of CARD_SAFETY) out.push(...wrap("  ! ", x, 100));
  out.push(`registry ${c.registryHash}`);
  return out.join("\n");
}

function cardMarkdown(c: JobCard): string {
  const md = (s: string) => s.replace(/\|/g, "\\|");
  return [
    `## Job card${c.invented ? " (invented scenario)" : ""}`,
    "",
    "| item | value |",
    "| --- | --- |",
    ...rows(c).map(([k, v]) => `| ${k} | ${md(v)} |`),
    "",
    "**Checklist**",
    "",
    ...c.checklist.map((x) => `- [ ] ${x}`),
    "",
    "**Safety**",
    "",
    ...CARD_SAFETY.map((x) => `- ${x}`),
  ].join("\n");
}

/** CSS of the card; print rules keep it on one A4/Letter page. */
export const CARD_CSS = `
.card{border:2px solid #333;padding:.6em 1em;margin:0 0 1.5em;font-size:11pt}
.card h2{margin:.1em 0 .4em}
.card table{border-collapse:collapse;width:100%}
.card th{text-align:left;width:11em;vertical-align:top;padding:.15em .4em}
.card td{padding:.15em .4em}
.card ul{margin:.2em 0 .4em;padding-left:1.4em}
.card ul.check{list-style:none;padding-left:.4em}
.card .safety{border-left:5px solid #9b2226;padding-left:.6em}
@page{size:auto;margin:12mm}
@media print{.card{font-size:10pt;break-inside:avoid}}
`;

/**
 * The job card as an HTML fragment (a `<section class="card">`), to sit at the top of a page.
 *
 * @param p a plan
 * @returns HTML fragment (text escaped)
 *
 * @example
 * ```ts
 * import { jobCardHtml } from "./card.ts";
 * import { readSiteText } from "../site/read.ts";
 * import { planSite } from "../site/plan.ts";
 * const plan = planSite(await readSiteText(`
 * name: Example (invented)
 * pipe: { standard: ASME B36.10M, nps: "4", schedule: "40", material: carbon-steel }
 * fluid: { liquid: water, temperature: 20 degC }
 * flow: { minimum: 2 L/s, maximum: 10 L/s }
 * transducer: { wedgeSoundSpeed: 2720 m/s, wedgeAngle: 38 deg, frequency: 1 MHz }
 * `), { monteCarlo: false });
 * if (!jobCardHtml(plan).startsWith('<section class="card"')) throw new Error();
 * ```
 */
export function jobCardHtml(p: SitePlan): string {
  const c = jobCard(p);
  const e = escapeHtml;
  return `<section class="card"><h2>Job card${c.invented ? " (invented scenario)" : ""}</h2>` +
    `<table>${rows(c).map(([k, v]) => `<tr><th>${e(k)}</th><td>${e(v)}</td></tr>`).join("")}` +
    `</table><h3>Checklist</h3><ul class="check">${
      c.checklist.map((x) => `<li>☐ ${e(x)}</li>`).join("")
    }</ul>` +
    `<div class="safety"><h3>Safety</h3><ul>${
      CARD_SAFETY.map((x) => `<li>${e(x)}</li>`).join("")
    }</ul></div></section>`;
}

/** Options of {@link formatCard}. */
export interface CardOptions {
  /** Output format, default text. */
  readonly format?: "text" | "md" | "html";
}

/**
 * The job card alone in a format: text (within 100 columns), Markdown, or a standalone HTML page
 * that prints on one A4/Letter page.
 *
 * @param p a plan
 * @param options format
 * @returns the card
 *
 * @example
 * ```ts
 * import { formatCard } from "./card.ts";
 * import { readSiteText } from "../site/read.ts";
 * import { planSite } from "../site/plan.ts";
 * const plan = planSite(await readSiteText(`
 * name: Example (invented)
 * pipe: { standard: ASME B36.10M, nps: "4", schedule: "40", material: carbon-steel }
 * fluid: { liquid: water, temperature: 20 degC }
 * flow: { minimum: 2 L/s, maximum: 10 L/s }
 * transducer: { wedgeSoundSpeed: 2720 m/s, wedgeAngle: 38 deg, frequency: 1 MHz }
 * `), { monteCarlo: false });
 * if (!formatCard(plan).startsWith("JOB CARD")) throw new Error();
 * ```
 */
export function formatCard(p: SitePlan, options: CardOptions = {}): string {
  const f = options.format ?? "text";
  if (f === "md") return cardMarkdown(jobCard(p));
  if (f === "html") {
    return htmlPage({ title: `Job card: ${p.name}`, body: jobCardHtml(p), css: CARD_CSS });
  }
  return cardText(jobCard(p));
}
