/**
 * Δt zero offset as a cause of its own: a Δt read with the flow stopped is named, sized as a
 * velocity, and subtracted from the corrected flow; the transit-time causes are unaffected.
 * Synthetic readings from the plan itself; the rule that a zero
 * check must read zero within its noise is common practice.
 */
import { assert, closeRel } from "../_assert.ts";
import { readSiteText } from "../../lib/site/read.ts";
import { planSite } from "../../lib/site/plan.ts";
import { reconcile, RECONCILE_BOUNDS } from "../../lib/site/reconcile.ts";
import { readReadingsText } from "../../lib/site/reconcile_read.ts";

const SITE = `
name: Zero-offset test (invented)
pipe: { standard: ASME B36.10M, nps: "6", schedule: "40", material: carbon-steel }
fluid: { liquid: water, temperature: 15 degC, pressure: 4 bar }
flow: { minimum: 5 L/s, design: 20 L/s, maximum: 30 L/s }
transducer: { wedgeSoundSpeed: 2720 m/s, wedgeAngle: 38 deg, frequency: 1 MHz }
mountings: [1, 2]
`;

async function setup() {
  const site = await readSiteText(SITE);
  const plan = planSite(site, { monteCarlo: false });
  return { site, plan };
}

Deno.test("a 0.8 ns zero offset is named first, sized, and taken out of the corrected flow", async () => {
  const { site, plan } = await setup();
  const v = plan.mountings.find((m) => m.traverses === 2)!;
  // Δt the plan expects at the design point
  const design = plan.operatingPoints[1];
  const dt = v.times[1].deltaT;
  const offset = 0.8e-9;
  const clean = reconcile(site, {
    mountings: [{ traverses: 2, totalTime: v.totalTime, deltaT: dt }],
  });
  const r = reconcile(site, {
    mountings: [{
      traverses: 2,
      totalTime: v.totalTime,
      deltaT: dt + offset,
      zeroFlowDeltaT: offset,
    }],
  });
  assert.equal(r.causes[0].cause, "zero-offset");
  assert.match(r.causes[0].explanation, /0\.80 ns/);
  assert.ok(r.mountings[0].consistent, "a zero offset does not move the transit times");
  assert.ok(r.mountings[0].zeroOffset!.significant);
  // the velocity the offset alone shows is the path velocity of Δt = offset, times the profile factor
  const vOffset = r.mountings[0].zeroOffset!.velocity;
  closeRel(
    vOffset / (design.pathVelocity * offset / dt),
    design.profileFactor,
    0.02,
    "k·v(offset)",
  );
  // corrected flow equals the flow of the clean reading
  closeRel(
    r.mountings[0].flow!.correctedFlowRate,
    clean.mountings[0].flow!.correctedFlowRate,
    1e-9,
    "flow less the offset",
  );
  assert.match(r.summary, /zero offset on 1 mounting\b/);
  // without the zero check the same Δt reads high by about offset/Δt
  const blind = reconcile(site, {
    mountings: [{ traverses: 2, totalTime: v.totalTime, deltaT: dt + offset }],
  });
  assert.ok(blind.mountings[0].flow!.correctedFlowRate > r.mountings[0].flow!.correctedFlowRate);
  assert.ok(!blind.causes.some((c) => c.cause === "zero-offset"));
});

Deno.test("a zero check within its noise is not a cause", async () => {
  const { site, plan } = await setup();
  const v = plan.mountings.find((m) => m.traverses === 2)!;
  const r = reconcile(site, {
    mountings: [{
      traverses: 2,
      totalTime: v.totalTime,
      zeroFlowDeltaT: 0.5 * RECONCILE_BOUNDS.zeroDeltaT,
    }],
  });
  assert.equal(r.causes.length, 0);
  assert.equal(r.mountings[0].zeroOffset!.significant, false);
});

Deno.test("a zero offset and a 2 µs fixed-delay error: both named, each on its own", async () => {
  const { site, plan } = await setup();
  const z = plan.mountings.find((m) => m.traverses === 1)!;
  const v = plan.mountings.find((m) => m.traverses === 2)!;
  const r = reconcile(site, {
    mountings: [
      { traverses: 1, totalTime: z.totalTime + 2e-6, fixedDelay: 0 },
      { traverses: 2, totalTime: v.totalTime + 2e-6, fixedDelay: 0, zeroFlowDeltaT: -1.5e-9 },
    ],
  });
  assert.equal(r.causes[0].cause, "zero-offset");
  assert.match(r.causes[0].explanation, /^2-traverse Δt reads -1\.50 ns/);
  assert.equal(r.causes[1].cause, "fixed-delay", "the delay error is the likeliest time cause");
  closeRel(r.causes[1].value, 2e-6, 0.01, "delay error sized");
});

Deno.test("the readings file carries zeroFlowDeltaT with its unit, negative values included", async () => {
  const r = await readReadingsText(`
mountings:
  - { traverses: V, totalTime: 234.1 us, zeroFlowDeltaT: -0.6 ns }
`);
  closeRel(r.mountings[0].zeroFlowDeltaT!, -0.6e-9, 1e-12, "zeroFlowDeltaT in s");
});
