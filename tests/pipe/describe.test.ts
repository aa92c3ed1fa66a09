/**
 * Pipe designations in the words of each standard: ASTM B88 sizes copper water tube by type
 * (K, L, M) and nominal size; AWWA C151 sizes ductile-iron pipe by nominal size and pressure
 * class; polyethylene by dimension ratio; steel and PVC pipe by NPS and schedule (the titles
 * and size tables of each standard, as the registry's catalogue files carry them).
 */
import { assert } from "../_assert.ts";
import { pipe, pipeDescription } from "../../lib/pipe/mod.ts";
import { readSiteText } from "../../lib/site/read.ts";
import { planSite } from "../../lib/site/plan.ts";
import { formatCard } from "../../lib/report/mod.ts";

Deno.test("each standard's own designation", () => {
  const d = (standard: string, nps: string, schedule: string) =>
    pipeDescription({ ...pipe({ standard, nps, schedule }), origin: "catalogue" });
  assert.equal(d("ASTM B88", "3", "L"), "ASTM B88 type L, nominal size 3 in");
  assert.equal(d("AWWA C151", "24", "PC 350"), "AWWA C151 nominal size 24 in, pressure class 350");
  assert.equal(d("ASME B36.10M", "4", "40"), "ASME B36.10M NPS 4 schedule 40");
  assert.match(d("hdpe", "8", "DR 11"), /NPS 8 DR 11$/);
  assert.doesNotMatch(d("hdpe", "8", "DR 11"), /schedule/);
  assert.equal(pipeDescription({ origin: "measured" }), "measured pipe");
});

Deno.test("the plan's JSON carries the designation, and the job card shows it", async () => {
  const site = await readSiteText(`
name: Copper hot water (invented)
pipe: { standard: ASTM B88, nps: "3", schedule: L }
fluid: { liquid: water, temperature: 60 degC, pressure: 3 bar }
flow: { minimum: 1 L/s, maximum: 5 L/s }
transducer: { wedgeSoundSpeed: 2720 m/s, wedgeAngle: 38 deg, frequency: 1 MHz }
mountings: [2]
`);
  const plan = planSite(site, { monteCarlo: false });
  assert.equal(plan.pipe.description, "ASTM B88 type L, nominal size 3 in");
  assert.match(formatCard(plan), /pipe +ASTM B88 type L, nominal size 3 in, copper/);
});
