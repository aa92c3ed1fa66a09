/**
 * The fleet index page: headings of its own (not the CSV's column keys), verdict cells coloured
 * and always spelled out, counts that add up, refusals shown with their reason. Built from the
 * plans of the invented demo sites. Colour contrast is checked with the WCAG 2.1 relative
 * luminance and contrast-ratio formulas (W3C, Web Content Accessibility Guidelines 2.1, 1.4.3:
 * at least 4.5:1 for text).
 */
import { assert } from "../_assert.ts";
import { readSiteFile } from "../../lib/site/read.ts";
import { planSite } from "../../lib/site/plan.ts";
import {
  FLEET_HEADERS,
  FLEET_INDEX_HEADINGS,
  fleetHtml,
  fleetRow,
  VERDICT_CLASSES,
} from "../../lib/report/mod.ts";

async function demoIndex(): Promise<string> {
  const rows = [];
  for (const f of ["01-reservoir-outlet", "02-pump-station-bends", "03-lined-trunk-main"]) {
    const p = planSite(await readSiteFile(`data/demo/${f}.yaml`), { monteCarlo: false });
    rows.push({ row: fleetRow(p), href: `${f}.html` });
  }
  return fleetHtml(
    [...rows, { id: "x9", name: "Bad site", error: "unknown liquid 'watr'" }],
    "Demo",
  );
}

Deno.test("index headings are words of their own, one per CSV column", async () => {
  const html = await demoIndex();
  assert.equal(FLEET_INDEX_HEADINGS.length, FLEET_HEADERS.length);
  const ths = [...html.matchAll(/<th>([^<]*)<\/th>/g)].map((m) => m[1]);
  assert.deepEqual(ths, [...FLEET_INDEX_HEADINGS]);
  for (const key of FLEET_HEADERS) assert.ok(!ths.includes(key), `CSV key ${key} shown as heading`);
});

Deno.test("every verdict cell carries its colour class and its word; counts add up", async () => {
  const html = await demoIndex();
  const cells = [...html.matchAll(/<td class="(v-[a-z]+)">([^<]*)<\/td>/g)];
  // two verdict cells per planned site (target, straight run), one per refusal
  assert.equal(cells.length, 3 * 2 + 1);
  for (const [, cls, word] of cells) assert.equal(cls, VERDICT_CLASSES[word], word);
  const target = html.match(/Accuracy target: (.*?)<\/p>/)![1];
  const run = html.match(/Straight run: (.*?)<\/p>/)![1];
  const sum = (s: string) => [...s.matchAll(/>(\d+) /g)].reduce((a, m) => a + Number(m[1]), 0);
  assert.equal(sum(target), 3);
  assert.equal(sum(run), 3);
  assert.match(html, /3 sites planned/);
  assert.match(html, /1 refused/);
  assert.match(html, /unknown liquid &#39;watr&#39;|unknown liquid 'watr'/);
  assert.match(html, /<a href="02-pump-station-bends\.html">/);
});

function luminance(hex: string): number {
  const c = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255)
    .map((v) => v <= 0.04045 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4);
  return 0.2126 * c[0] + 0.7152 * c[1] + 0.0722 * c[2];
}

Deno.test("verdict colours: distinct per class, text contrast at least 4.5:1 (WCAG 2.1)", async () => {
  const html = await demoIndex();
  const seen = new Set<string>();
  for (const cls of new Set(Object.values(VERDICT_CLASSES))) {
    const m = html.match(
      new RegExp(`\\.${cls} \\{ background: (#[0-9a-f]{6}); color: (#[0-9a-f]{6})`),
    );
    assert.ok(m, `${cls} has a background and a text colour`);
    const [a, b] = [luminance(m![1]), luminance(m![2])];
    const ratio = (Math.max(a, b) + 0.05) / (Math.min(a, b) + 0.05);
    assert.ok(ratio >= 4.5, `${cls} contrast ${ratio.toFixed(2)}`);
    assert.ok(!seen.has(m![1]), `${cls} background repeats another class's`);
    seen.add(m![1]);
  }
});
