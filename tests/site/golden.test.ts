/**
 * Byte-identical plan JSON for every demo site and the sites the plan tests use, against golden
 * files made from the code before the plan was split into stages (issue 13 item 1).
 *
 * The bytes are those of `planJson` (the JSON report writer). Monte Carlo runs at its fixed seed,
 * which is deterministic (lib/uncertainty/rng.ts). Regenerate after a legitimate data or model
 * change with:
 *
 *     UPDATE_GOLDEN=1 deno test --ignore-env=LOG_TOKENS,LOG_STREAM -A tests/site/golden.test.ts
 *
 * and say in the commit message why the outputs changed.
 */
import { assert } from "../_assert.ts";
import { readSiteFile, readSiteText } from "../../lib/site/read.ts";
import { planSite } from "../../lib/site/plan.ts";
import { planJson } from "../../lib/report/plan_report.ts";
import type { SiteInput } from "../../lib/site/schema.ts";

const ROOT = new URL("../../", import.meta.url);
const GOLDEN = new URL("golden/", import.meta.url);
const UPDATE = Deno.env.get("UPDATE_GOLDEN") === "1";

/** The inline site of tests/site/plan.test.ts (invented). */
const BASE = `
name: Test line (invented)
pipe: { standard: ASME B36.10M, nps: "8", schedule: "40", material: carbon-steel }
fluid: { liquid: water, temperature: 20 degC, pressure: 3 bar }
flow: { minimum: 20 L/s, design: 60 L/s, maximum: 90 L/s }
transducer: { wedgeSoundSpeed: 2720 m/s, wedgeAngle: 38 deg, frequency: 1 MHz, timingResolution: 100 ps }
mountings: [1, 2, 4]
`;
const RUN = (len: string, extra = "") =>
  BASE +
  `run: { length: ${len}, upstream: { fitting: elbow-90 }, downstream: { fitting: gate-valve }${extra} }\n`;

/** Inline sites (all invented), keyed by golden file name. */
const INLINE: Record<string, string> = {
  "inline-base": BASE,
  "inline-run-1m": RUN("1 m"),
  "inline-run-4m": RUN("4 m"),
  "inline-run-planned": RUN("3.1 m", ", plannedPosition: 2.1 m"),
  "inline-target-easy": BASE + "targetUncertainty: 20 %\n",
  "inline-target-hard": BASE + "targetUncertainty: 0.1 %\n",
  "inline-measured": BASE.replace(
    `pipe: { standard: ASME B36.10M, nps: "8", schedule: "40", material: carbon-steel }`,
    `pipe: { circumference: 688.3 mm, wallThickness: 8.18 mm, measuredWallThickness: 8.18 mm, material: carbon-steel }`,
  ),
};

async function sites(): Promise<[string, SiteInput][]> {
  const out: [string, SiteInput][] = [];
  const demo = new URL("data/demo/", ROOT);
  const files = [...Deno.readDirSync(demo)].map((e) => e.name).filter((n) => n.endsWith(".yaml"))
    .sort();
  // relative paths, so that the source file recorded in the plan does not depend on the checkout
  for (const f of files) {
    out.push([`demo-${f.replace(/\.yaml$/, "")}`, await readSiteFile(`data/demo/${f}`)]);
  }
  for (const [k, text] of Object.entries(INLINE)) out.push([k, await readSiteText(text)]);
  return out;
}

Deno.test("plan JSON is byte-identical to the golden files (Monte Carlo at seed 1)", async () => {
  const cwd = Deno.cwd();
  Deno.chdir(ROOT);
  try {
    const all = await sites();
    assert.ok(all.length >= 11);
    for (const [name, site] of all) {
      const bytes = planJson(planSite(site, { monteCarlo: { draws: 20_000, seed: 1 } }));
      const file = new URL(`${name}.json`, GOLDEN);
      if (UPDATE) {
        Deno.writeTextFileSync(file, bytes);
        continue;
      }
      const want = Deno.readTextFileSync(file);
      assert.ok(bytes === want, `${name}: plan JSON differs from tests/site/golden/${name}.json`);
    }
  } finally {
    Deno.chdir(cwd);
  }
});
