/**
 * Field reconciliation: readings synthesised from known wrong inputs must be traced back to
 * the right cause, and the inferred sound speed must match the liquid that made them.
 */
import { assert, closeAbs, closeRel } from "../_assert.ts";
import { readSiteText } from "../../lib/site/read.ts";
import { planSite } from "../../lib/site/plan.ts";
import { reconcile, soundSpeedFromLiquidTime } from "../../lib/site/reconcile.ts";
import { water } from "../../lib/water/mod.ts";
import { InputError } from "../../lib/errors.ts";

const SITE = `
name: Reconcile test (invented)
pipe: { standard: ASME B36.10M, nps: "6", schedule: "40", material: carbon-steel }
fluid: { liquid: water, temperature: 15 degC, pressure: 4 bar }
flow: { minimum: 5 L/s, design: 20 L/s, maximum: 30 L/s }
transducer: { wedgeSoundSpeed: 2720 m/s, wedgeAngle: 38 deg, frequency: 1 MHz }
mountings: [2]
`;

Deno.test("the plan's own zero-flow time reconciles, with the registry's sound speed", async () => {
  const site = await readSiteText(SITE);
  const plan = planSite(site, { monteCarlo: false });
  const m = plan.mountings[0];
  const r = reconcile(site, {
    mountings: [{ traverses: 2, totalTime: m.totalTime + 8e-6, fixedDelay: 8e-6 }],
  });
  const x = r.mountings[0];
  assert.ok(x.consistent);
  closeRel(x.inferredSoundSpeed, plan.fluid.soundSpeed, 1e-9, "inferred speed");
  assert.equal(x.causes.length, 0);
});

Deno.test("a liquid 8 K warmer than stated: temperature named with its figure, speed matches IAPWS-95", async () => {
  const site = await readSiteText(SITE);
  const warm = await readSiteText(SITE.replace("15 degC", "23 degC"));
  const time = planSite(warm, { monteCarlo: false }).mountings[0].totalTime;
  const r = reconcile(site, { mountings: [{ traverses: 2, totalTime: time }] });
  const x = r.mountings[0];
  assert.ok(!x.consistent);
  // one reading cannot tell a warmer liquid from a thinner wall (both shorten the liquid
  // time): both are named, each sized
  const t = x.causes.find((c) => c.cause === "temperature")!;
  assert.ok(t.plausible);
  assert.match(t.explanation, /23\.0 °C/);
  assert.ok(x.causes.some((c) => c.cause === "wall-or-lining"));
  closeAbs(x.inferredSoundSpeed, water.soundSpeed(296.15, 4e5), 1e-6, "IAPWS-95 at 23 °C");
});

Deno.test("measured temperature given: the same reading then reconciles", async () => {
  const site = await readSiteText(SITE);
  const warm = await readSiteText(SITE.replace("15 degC", "23 degC"));
  const time = planSite(warm, { monteCarlo: false }).mountings[0].totalTime;
  const r = reconcile(site, {
    temperature: 296.15,
    mountings: [{ traverses: 2, totalTime: time }],
  });
  assert.ok(r.mountings[0].consistent);
});

Deno.test("a thicker wall (deposits) than planned: wall-or-lining sized correctly", async () => {
  const site = await readSiteText(SITE);
  const plan = planSite(site, { monteCarlo: false });
  const thick = await readSiteText(
    SITE.replace("mountings: [2]", "mountings: [2]").replace(
      `material: carbon-steel }`,
      `material: carbon-steel, measuredWallThickness: ${
        (plan.pipe.wallThickness * 1000 + 3).toFixed(3)
      } mm }`,
    ),
  );
  const time = planSite(thick, { monteCarlo: false }).mountings[0].totalTime;
  const r = reconcile(site, { mountings: [{ traverses: 2, totalTime: time }] });
  const x = r.mountings[0];
  assert.ok(!x.consistent);
  const wall = x.causes.find((c) => c.cause === "wall-or-lining")!;
  assert.ok(wall.plausible);
  // the bore change explains the time; the wall-time change is second order, so ~3 mm
  const mmFound = Number(/([\d.]+) mm thicker/.exec(wall.explanation)![1]);
  closeAbs(mmFound, 3, 0.05, "wall change found");
});

Deno.test("corrected flow from Δt uses the measured liquid time", async () => {
  const site = await readSiteText(SITE);
  const plan = planSite(site, { monteCarlo: false });
  const m = plan.mountings[0];
  const r = reconcile(site, {
    mountings: [{ traverses: 2, totalTime: m.totalTime, deltaT: m.times[1].deltaT }],
  });
  const f = r.mountings[0].flow!;
  closeRel(f.correctedFlowRate, plan.operatingPoints[1].flowRate, 1e-4, "design flow back");
  closeAbs(f.relativeCorrection, 0, 1e-9);
});

Deno.test("inversion: soundSpeedFromLiquidTime recovers c and refuses the impossible", () => {
  const s = Math.sin(0.66) / 2720;
  for (const c of [900, 1200, 1482, 1800]) {
    const tau = 4 * 0.15 / (c * Math.sqrt(1 - s * s * c * c));
    closeRel(soundSpeedFromLiquidTime(tau, 4, 0.15, s), c, 1e-10);
  }
  assert.throws(() => soundSpeedFromLiquidTime(1e-9, 2, 0.15, s), InputError);
});
