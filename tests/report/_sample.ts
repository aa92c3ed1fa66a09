/**
 * A sample page with every drawing and table of lib/report, for the browser checks and for
 * looking at. All numbers are invented for the example (no real site).
 */
import {
  csvTable,
  escapeHtml,
  htmlPage,
  markdownTable,
  svgAxialPath,
  svgBarChart,
  svgLineChart,
  svgPipeSection,
  svgRun,
  textTable,
} from "../../lib/report/mod.ts";

const deg = Math.PI / 180;

/** The drawings of the sample, by name. */
export function sampleDrawings(): Record<string, string> {
  return {
    section: svgPipeSection({
      outsideDiameter: 0.2191,
      wallThickness: 0.00818,
      liningThickness: 0.004,
      traverses: 2,
      fluidAngle: 19.5 * deg,
    }),
    sectionZ: svgPipeSection({
      outsideDiameter: 0.1143,
      wallThickness: 0.00602,
      traverses: 1,
      fluidAngle: 22 * deg,
      paths: 2,
      title: "Cross-section, two paths, Z mounting",
    }),
    axialV: svgAxialPath({
      outsideDiameter: 0.2191,
      wallThickness: 0.00818,
      liningThickness: 0.004,
      spacing: 0.1604,
      traverses: 2,
      fluidAngle: 19.5 * deg,
      wallAngle: 45 * deg,
      liningAngle: 30 * deg,
    }),
    axialZ: svgAxialPath({
      outsideDiameter: 0.1143,
      wallThickness: 0.00602,
      spacing: 0.0533,
      traverses: 1,
      fluidAngle: 22 * deg,
      wallAngle: 45 * deg,
      title: "Beam path, Z mounting",
    }),
    axialW: svgAxialPath({
      outsideDiameter: 0.0603,
      wallThickness: 0.00391,
      spacing: 0.08422,
      traverses: 4,
      fluidAngle: 20 * deg,
      wallAngle: 45 * deg,
      title: "Beam path, W mounting",
    }),
    run: svgRun({
      runLength: 4.2,
      diameter: 0.2027,
      upstreamLabel: "90° elbow",
      downstreamLabel: "gate valve",
      requiredUpstream: 2.03,
      requiredDownstream: 1.01,
      recommendedPosition: 2.6,
      commonPracticePosition: 2.03,
    }),
    runShort: svgRun({
      runLength: 1.5,
      diameter: 0.1023,
      upstreamLabel: "pump outlet",
      downstreamLabel: "tee",
      requiredUpstream: 1.02,
      requiredDownstream: 0.51,
      title: "Straight run too short",
    }),
    profile: svgLineChart({
      title: "Estimated profile error along the run",
      xLabel: "distance from the elbow (D)",
      yLabel: "profile error (%)",
      series: [
        { name: "after elbow", points: [[2, 3.1], [5, 1.9], [10, 0.9], [15, 0.45], [20, 0.2]] },
        { name: "after tee", points: [[2, 2.2], [5, 1.2], [10, 0.5], [15, 0.25], [20, 0.1]] },
      ],
      hLines: [{ y: 1, label: "target 1 %" }],
      vLines: [{ x: 12.8, label: "recommended" }],
    }),
    spacing: svgLineChart({
      title: "Spacing against liquid temperature",
      xLabel: "temperature (°C)",
      yLabel: "spacing (mm)",
      series: [{
        name: "V mounting",
        points: Array.from(
          { length: 11 },
          (_, i) => [i * 8, 160.4 + 0.05 * i * 8 - 0.0012 * (i * 8) ** 2],
        ),
      }],
    }),
    budget: svgBarChart({
      title: "Uncertainty budget (contributions to u(Q))",
      unit: "%",
      bars: [
        { label: "profile factor", value: 0.71 },
        { label: "inside diameter", value: 0.52 },
        { label: "Δt zero offset", value: 0.33 },
        { label: "liquid sound speed", value: 0.12 },
        { label: "spacing", value: 0.05 },
      ],
    }),
  };
}

/** The sample page: every drawing in a figure, plus the tables. */
export function samplePage(): string {
  const d = sampleDrawings();
  const rows: (string | number)[][] = [["profile factor", 0.71], ["inside diameter", 0.52]];
  const body = [
    "<h1>Sample report page (invented data)</h1>",
    '<p class="caution">Invented example. Before work on a live line, follow local codes and ' +
    "the site's permit and isolation procedures.</p>",
    ...Object.entries(d).map(([k, svg]) =>
      `<figure id="fig-${k}">${svg}<figcaption>${escapeHtml(k)}</figcaption></figure>`
    ),
    `<pre>${escapeHtml(textTable(["input", "u %"], rows))}</pre>`,
    `<pre>${escapeHtml(markdownTable(["input", "u %"], rows))}</pre>`,
    `<pre>${escapeHtml(csvTable(["input", "u %"], rows))}</pre>`,
  ].join("\n");
  return htmlPage({ title: "snellpath sample (invented)", body });
}

if (import.meta.main) {
  const out = Deno.args[0] ?? "/tmp/snellpath-sample.html";
  await Deno.writeTextFile(out, samplePage());
  console.log(out);
}
