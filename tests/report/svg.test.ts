import { assert } from "../_assert.ts";
import { InputError } from "../../lib/errors.ts";
import {
  niceTicks,
  svgAxialPath,
  svgBarChart,
  svgLineChart,
  svgPipeSection,
  svgRun,
} from "../../lib/report/mod.ts";
import { sampleDrawings } from "./_sample.ts";

const deg = Math.PI / 180;

Deno.test("every sample drawing is a titled SVG with a viewBox and no NaN", () => {
  for (const [name, svg] of Object.entries(sampleDrawings())) {
    assert.ok(svg.startsWith("<svg ") && svg.endsWith("</svg>"), name);
    assert.match(svg, /viewBox="0 0 \d+(\.\d+)? \d+(\.\d+)?"/, name);
    assert.match(svg, /<title id="[^"]+">[^<]+<\/title>/, name);
    assert.ok(!/NaN|Infinity|undefined/.test(svg), name);
    assert.ok(!/<script|href="http/i.test(svg), name);
  }
});

Deno.test("axial path: beam turns at the inner walls, ends on the right side", () => {
  const common = {
    outsideDiameter: 0.1143,
    wallThickness: 0.00602,
    fluidAngle: 20 * deg,
    wallAngle: 40 * deg,
  };
  const vertices = (svg: string) =>
    svg.match(/<polyline points="([^"]+)"/)![1].split(" ").map((p) => p.split(",").map(Number));
  for (const traverses of [1, 2, 4]) {
    const id = 0.1143 - 2 * 0.00602;
    const s = 2 * 0.00602 * Math.tan(40 * deg) + traverses * id * Math.tan(20 * deg);
    const svg = svgAxialPath({ ...common, traverses, spacing: s });
    const v = vertices(svg);
    // entry, wall exit, one vertex per traverse, wall, exit (no lining).
    assert.equal(v.length, traverses + 3, `traverses ${traverses}`);
    const yTop = v[0][1];
    const yEnd = v[v.length - 1][1];
    assert.equal(yEnd === yTop, traverses % 2 === 0, "same side for even traverses");
    assert.ok(!svg.includes("given spacing"), "consistent spacing draws no note");
  }
  const off = svgAxialPath({ ...common, traverses: 2, spacing: 0.2 });
  assert.ok(off.includes("given spacing"), "inconsistent spacing is noted");
  const lined = svgAxialPath({ ...common, traverses: 2, spacing: 0.1, liningThickness: 0.003 });
  assert.equal(vertices(lined).length, 2 + 3 + 2);
});

Deno.test("drawings refuse non-finite or inconsistent inputs", () => {
  const base = {
    outsideDiameter: 0.1143,
    wallThickness: 0.00602,
    traverses: 2,
    fluidAngle: 0.3,
  };
  assert.throws(() => svgPipeSection({ ...base, outsideDiameter: NaN }), InputError);
  assert.throws(() => svgPipeSection({ ...base, wallThickness: 0.06 }), InputError);
  assert.throws(() => svgPipeSection({ ...base, traverses: 0 }), InputError);
  assert.throws(() => svgPipeSection({ ...base, fluidAngle: 2 }), InputError);
  assert.throws(
    () => svgAxialPath({ ...base, spacing: Infinity, wallAngle: 0.7 }),
    InputError,
  );
  const run = {
    runLength: 3,
    diameter: 0.1,
    upstreamLabel: "elbow",
    downstreamLabel: "valve",
    requiredUpstream: 1,
    requiredDownstream: 1,
  };
  assert.throws(() => svgRun({ ...run, recommendedPosition: 4 }), InputError);
  assert.throws(() => svgRun({ ...run, requiredUpstream: NaN }), InputError);
  assert.ok(svgRun({ ...run, requiredUpstream: 2.5 }).includes("no admissible zone"));
  assert.throws(
    () => svgLineChart({ title: "t", xLabel: "x", yLabel: "y", series: [] }),
    InputError,
  );
  assert.throws(
    () =>
      svgLineChart({
        title: "t",
        xLabel: "x",
        yLabel: "y",
        series: [{ name: "a", points: [[0, NaN]] }],
      }),
    InputError,
  );
  assert.throws(
    () => svgBarChart({ title: "t", unit: "%", bars: [{ label: "a", value: NaN }] }),
    InputError,
  );
});

Deno.test("text is escaped inside drawings", () => {
  const svg = svgBarChart({ title: "<b>&", unit: "%", bars: [{ label: "a<script>", value: 1 }] });
  assert.ok(svg.includes("a&lt;script&gt;") && !svg.includes("<script>"));
});

Deno.test("nice ticks cover the data with round steps", () => {
  for (const [lo, hi] of [[0, 1], [0.013, 0.0171], [-3, 47], [156.2, 160.9], [5, 5]]) {
    const t = niceTicks(lo, hi, 5);
    assert.ok(t[0] <= lo && t[t.length - 1] >= hi, `${lo}..${hi}: ${t}`);
    const step = t[1] - t[0];
    const m = step / 10 ** Math.floor(Math.log10(step));
    assert.ok([1, 2, 2.5, 5].some((k) => Math.abs(m - k) < 1e-6), `step ${step}`);
    assert.ok(t.length >= 2 && t.length <= 12);
  }
});
