/**
 * Labels of the straight-run drawing never overprint, on short runs and long, with the longest
 * fitting names of the registry and positions at the very ends of the run: every <text> box, as
 * headless Chromium (Debian package chromium) lays it out, meets no other and stays inside the
 * drawing. Common practice for technical drawings (no source): a label that overprints another
 * cannot be read.
 */
import { assert } from "../_assert.ts";
import { hasChromium, renderHtml } from "../_browser.ts";
import { svgRun } from "../../lib/report/mod.ts";
import { registry } from "../../mod.ts";

function cases(): string[] {
  const names = registry.fittings().map((f) => f.id).sort((a, b) => b.length - a.length);
  const longest = names.slice(0, 4);
  const out: string[] = [];
  const d = 0.1;
  // run lengths from a third of a diameter to 80 D; requirements from 0 to past the run
  const runs = [0.3, 1, 2, 4, 7, 12, 20, 35, 80];
  let k = 0;
  for (const runD of runs) {
    for (const [upD, downD] of [[10, 5], [30, 10], [0.5, 0.2], [runD, runD], [0, 0]]) {
      const run = runD * d;
      for (const at of [0, 0.02, 0.5, 0.98, 1]) {
        out.push(svgRun({
          runLength: run,
          diameter: d,
          upstreamLabel: longest[k % longest.length],
          downstreamLabel: longest[(k + 1) % longest.length],
          requiredUpstream: upD * d,
          requiredDownstream: downD * d,
          recommendedPosition: at * run,
          commonPracticePosition: (1 - at) * run * 0.75,
          title: `case ${k}`,
        }));
        k++;
      }
    }
  }
  return out;
}

const PROBE = `
const res = [];
document.querySelectorAll("svg").forEach((svg, i) => {
  const vb = svg.viewBox.baseVal;
  const boxes = [...svg.querySelectorAll("text")].map((t) => {
    const b = t.getBBox();
    return { s: t.textContent, x0: b.x, x1: b.x + b.width, y0: b.y, y1: b.y + b.height };
  });
  for (const [a, p] of boxes.entries()) {
    if (p.x0 < -0.5 || p.x1 > vb.width + 0.5 || p.y0 < -0.5 || p.y1 > vb.height + 0.5) {
      res.push({ svg: i, outside: p.s });
    }
    for (const q of boxes.slice(a + 1)) {
      const ox = Math.min(p.x1, q.x1) - Math.max(p.x0, q.x0);
      const oy = Math.min(p.y1, q.y1) - Math.max(p.y0, q.y0);
      if (ox > 0.5 && oy > 0.5) res.push({ svg: i, overlap: [p.s, q.s] });
    }
  }
});
document.getElementById("out").textContent = JSON.stringify({ n: document.querySelectorAll("svg").length, res });
`;

Deno.test({
  name: "straight-run drawing: no label overprints another or leaves the drawing (Chromium layout)",
  ignore: !hasChromium(),
  fn: async () => {
    const svgs = cases();
    const page = `<!DOCTYPE html><html><head><meta charset="utf-8"></head><body>${
      svgs.join("\n")
    }<pre id="out"></pre><script>${PROBE}</script></body></html>`;
    const r = await renderHtml(page, { width: 900, height: 1200 });
    const m = r.dom.match(/<pre id="out">([^<]*)<\/pre>/);
    assert.ok(m, "probe output in the DOM");
    const got = JSON.parse(m![1].replaceAll("&quot;", '"').replaceAll("&amp;", "&"));
    assert.equal(got.n, svgs.length, "every drawing laid out");
    assert.deepEqual(got.res.slice(0, 5), [], `${got.res.length} overprints or overflows`);
  },
});
