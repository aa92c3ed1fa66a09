/**
 * Job card: inch fractions, clock positions, the card's figures against the plan it reads, the
 * 100-column text limit, and (headless Chromium, Debian package chromium) one printed page per
 * demo site and a cross-section drawn in the recommended path plane.
 */
import { assert } from "../_assert.ts";
import { CHROMIUM, hasChromium, renderHtml } from "../_browser.ts";
import {
  clockPosition,
  formatCard,
  formatWithUncertainty,
  inchesSixteenths,
  jobCard,
  MOUNTING_COLOURS,
  mountingColour,
  planHtml,
  planMarkdown,
  planText,
} from "../../lib/report/mod.ts";
import { readSiteFile } from "../../lib/site/read.ts";
import { planSite, type SitePlan } from "../../lib/site/plan.ts";

const DEMO = new URL("../../data/demo/", import.meta.url);

async function demoPlans(): Promise<SitePlan[]> {
  const out: SitePlan[] = [];
  for (const e of [...Deno.readDirSync(DEMO)].sort((a, b) => a.name.localeCompare(b.name))) {
    if (!e.name.endsWith(".yaml")) continue;
    const site = await readSiteFile(new URL(e.name, DEMO).pathname);
    out.push(planSite(site, { monteCarlo: false }));
  }
  return out;
}

Deno.test("inches to 1/16 in: exact inch 25.4 mm (NIST SP 811, appendix B)", () => {
  // 3 7/16 in = 3.4375 × 25.4 mm = 87.3125 mm (arithmetic on the exact definition).
  assert.equal(inchesSixteenths(0.0873125), "3 7/16 in");
  assert.equal(inchesSixteenths(0.0508), "2 in");
  assert.equal(inchesSixteenths(0.015875), "5/8 in");
  // 1/32 in below 2 in rounds half-sixteenths to the nearest: 1.97 in → 2 in.
  assert.equal(inchesSixteenths(1.97 * 0.0254), "2 in");
  assert.throws(() => inchesSixteenths(-1));
});

Deno.test("clock positions: a clock face has 12 hours over 360° (common practice)", () => {
  assert.equal(clockPosition(0), "12:00");
  assert.equal(clockPosition(Math.PI / 2), "3:00");
  assert.equal(clockPosition(Math.PI), "6:00");
  assert.equal(clockPosition(3 * Math.PI / 2), "9:00");
  assert.equal(clockPosition(Math.PI / 4), "1:30");
  assert.equal(clockPosition(2 * Math.PI + Math.PI / 2), "3:00");
});

Deno.test("the card reads its figures from the plan, for every demo site", async () => {
  for (const p of await demoPlans()) {
    const c = jobCard(p);
    const m = p.mountings.find((x) => x.traverses === p.recommendedMounting)!;
    assert.equal(c.spacing, m.spacing);
    assert.equal(c.zeroFlowTime, m.totalTime);
    assert.equal(c.deltaTMinimum, m.times.find((t) => t.label === "minimum")?.deltaT);
    assert.ok(c.window.min <= c.spacing && c.spacing <= c.window.max, "window holds the spacing");
    // Inch text within 1/32 in of the spacing.
    const frac = (x: string) => x.split("/").map(Number).reduce((a, b) => a / b);
    const inch = c.spacingInches.replace(" in", "").split(" ").map(frac).reduce((a, b) => a + b);
    assert.ok(Math.abs(inch * 0.0254 - c.spacing) <= 0.0254 / 32 + 1e-12, c.spacingInches);
    // Z puts the transducers on opposite ends of the plane, V and W on one end.
    if (m.traverses % 2) assert.notEqual(c.clock[0], c.clock[1]);
    else assert.equal(c.clock[0], c.clock[1]);
    if (p.straightRun) {
      assert.ok(c.position.includes(p.straightRun.upstreamFitting), "names the fitting");
      assert.ok(c.position.includes("outlet face"), "names the face");
    }
    for (const f of ["text", "md", "html"] as const) {
      const s = formatCard(p, { format: f });
      assert.ok(/local codes/.test(s) && /licensed/.test(s), `${f}: safety defers to codes`);
      assert.ok(s.includes(c.spacingInches), `${f}: inches shown`);
    }
    assert.ok(planText(p).startsWith("JOB CARD"), "text report opens with the card");
    assert.ok(planMarkdown(p).includes("## Job card"), "markdown report carries the card");
    assert.ok(planHtml(p).includes('<section class="card">'), "html report carries the card");
  }
});

Deno.test("card and text report stay within 100 columns for every demo site", async () => {
  for (const p of await demoPlans()) {
    for (const l of formatCard(p).split("\n")) assert.ok([...l].length <= 100, l);
    const text = planText(p);
    for (const l of text.split("\n")) assert.ok([...l].length <= 100, l);
    // Nothing is lost when a wide table is split: every trace source id still appears.
    for (const t of p.trace) assert.ok(text.includes(t.source), t.source);
  }
});

Deno.test({
  name: "the HTML card prints on one page (Chromium print-to-pdf, A4 and Letter)",
  ignore: !hasChromium(),
  fn: async () => {
    const dir = await Deno.makeTempDir();
    for (const p of await demoPlans()) {
      for (const size of ["A4", "letter"]) {
        const html = formatCard(p, { format: "html" }).replace(
          "@page{size:auto;",
          `@page{size:${size};`,
        );
        const file = `${dir}/card.html`, pdf = `${dir}/card.pdf`;
        await Deno.writeTextFile(file, html);
        const r = await new Deno.Command(CHROMIUM, {
          args: [
            "--headless",
            "--no-sandbox",
            "--disable-gpu",
            "--no-pdf-header-footer",
            `--print-to-pdf=${pdf}`,
            `file://${file}`,
          ],
          stdout: "null",
          stderr: "null",
        }).output();
        assert.ok(r.success, "chromium ran");
        const bytes = new TextDecoder("latin1").decode(await Deno.readFile(pdf));
        const pages = (bytes.match(/\/Type\s*\/Page(?![s\w])/g) ?? []).length;
        assert.equal(pages, 1, `${p.id} ${size}: pages`);
      }
    }
    await Deno.remove(dir, { recursive: true });
  },
});

Deno.test({
  name: "the cross-section in the browser lies in the card's path plane",
  ignore: !hasChromium(),
  fn: async () => {
    for (const p of await demoPlans()) {
      const c = jobCard(p);
      const r = await renderHtml(planHtml(p));
      assert.deepEqual(r.console, [], "console messages");
      const svg = r.dom.slice(r.dom.indexOf("Cross-section"));
      // The bore chord: the first line of stroke-width 2.2.
      const m = svg.match(
        /<line x1="([-\d.]+)" y1="([-\d.]+)" x2="([-\d.]+)" y2="([-\d.]+)"[^>]*stroke-width="2.2"/,
      );
      assert.ok(m, "beam line found");
      const [x1, y1, x2, y2] = m!.slice(1).map(Number);
      // Clockwise from the top looking downstream, screen y down: direction (sin φ, −cos φ).
      const angle = Math.atan2(x2 - x1, -(y2 - y1));
      const d = ((angle - c.pathPlane) % Math.PI + Math.PI) % Math.PI;
      assert.ok(Math.min(d, Math.PI - d) < 0.01, `${p.id}: plane ${angle} vs ${c.pathPlane}`);
      assert.ok(svg.includes(`T1${c.traverses % 2 ? "" : ", T2"} at ${c.clock[0]}`), "clock label");
    }
  },
});

Deno.test("one colour per mounting, the same in the table, the drawings and the chart", async () => {
  // Distinct colours, none taken from a plotting library's default cycle (common practice:
  // the first colours of the usual default cycles, recalled).
  const cycle = ["#1f77b4", "#ff7f0e", "#2ca02c", "#d62728", "#9467bd", "#8c564b"];
  const own = Object.values(MOUNTING_COLOURS);
  assert.equal(new Set(own).size, own.length, "distinct");
  for (const x of own) assert.ok(!cycle.includes(x), x);
  for (const p of await demoPlans()) {
    const html = planHtml(p);
    for (const m of p.mountings) {
      const col = mountingColour(m.traverses);
      const row = html.indexOf(`fill="${col}"/></svg> ${m.name} (${m.traverses})</td>`);
      assert.ok(row > 0, `${p.id} ${m.name}: table swatch`);
      const word = m.traverses === 1 ? "traverse" : "traverses";
      const axial = html.indexOf(`${m.name} mounting (${m.traverses} ${word})`);
      assert.ok(axial > 0, "axial drawing title, singular or plural");
      const after = html.slice(axial, html.indexOf("</svg>", axial));
      assert.ok(after.includes(`stroke="${col}"`), `${p.id} ${m.name}: axial drawing beam`);
      for (const other of p.mountings) {
        if (mountingColour(other.traverses) !== col) {
          assert.ok(!after.includes(`stroke="${mountingColour(other.traverses)}"`), "no mix-up");
        }
      }
    }
  }
});

Deno.test("precision follows the uncertainty (JCGM 100:2008 GUM 7.2.6 and example 7.2.2)", async () => {
  // GUM 7.2.2: m_s = 100.021 47 g with u_c = 0.35 mg.
  assert.equal(formatWithUncertainty(0.10002147, 0.35e-6, "g"), "100.02147 ± 0.00035 g");
  // Two significant digits of the uncertainty (7.2.6), value to the same place.
  assert.equal(formatWithUncertainty(2720.4, 40, "m/s"), "2720 ± 40 m/s");
  assert.equal(formatWithUncertainty(1463.5245, 0.5433, "m/s"), "1463.52 ± 0.54 m/s");
  assert.throws(() => formatWithUncertainty(1, -1, "m/s"));
  // The reports show the liquid's sound speed as a range with matching digits.
  for (const p of await demoPlans()) {
    const s = formatWithUncertainty(p.fluid.soundSpeed, p.fluid.soundSpeedSpread, "m/s");
    const [v, u] = s.replace(" m/s", "").split(" ± ");
    const decimals = (x: string) => (x.split(".")[1] ?? "").length;
    assert.equal(decimals(v), decimals(u), s);
    assert.ok(u.replace(/^[0.]+/, "").replace(".", "").length <= 2, `${s}: two digits`);
    assert.ok(planText(p).includes(s), `${p.id}: text report shows ${s}`);
    assert.ok(planHtml(p).includes(s), `${p.id}: HTML report shows ${s}`);
  }
});

Deno.test("copper tube is named by its own designation (ASTM B88 type and nominal size)", async () => {
  const { readSiteText } = await import("../../lib/site/read.ts");
  const p = planSite(
    await readSiteText(`
name: Copper check (invented)
pipe: { standard: ASTM B88, nps: "3", schedule: "L", material: copper }
fluid: { liquid: water, temperature: 60 degC }
flow: { minimum: 1 L/s, maximum: 5 L/s }
transducer: { wedgeSoundSpeed: 2720 m/s, wedgeAngle: 38 deg, frequency: 1 MHz }
`),
    { monteCarlo: false },
  );
  // ASTM B88 3 in type L: OD 3.125 in, wall 0.090 in (recalled).
  assert.ok(
    Math.abs(p.pipe.outsideDiameter - 3.125 * 0.0254) < 1e-6,
    "the tube planned is B88 3 in",
  );
  for (const s of [planText(p), planHtml(p), formatCard(p)]) {
    assert.ok(s.includes("ASTM B88 type L, nominal size 3 in"), "designation");
    assert.ok(!/B88 NPS|schedule L/.test(s), "no NPS/schedule words for copper");
  }
});
