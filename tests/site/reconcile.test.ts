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
  closeAbs(t.value, 8, 0.05, "temperature change found");
  assert.ok(x.causes.some((c) => c.cause === "wall"));
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

Deno.test("a thicker wall (deposits) than planned: wall sized correctly", async () => {
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
  const wall = x.causes.find((c) => c.cause === "wall")!;
  // the forward model that made the reading is the plan's own: the wall change comes back
  closeAbs(wall.value, 3e-3, 1e-6, "wall change found");
  assert.match(wall.explanation, /3\.00 mm thicker/);
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

// Two traverse counts on one pipe (Z and V): readings made by the plan's forward model from a
// "true" pipe that differs from the plan in one respect must name that respect first, with its
// size. Tolerances: 0.05 K, 0.01 mm, 1 ns (the readings are exact; the fit converges to well
// below these).
const ZV = SITE.replace("mountings: [2]", "mountings: [1, 2]");

async function zvReadings(trueSite: string, delay = 0, statedDelay = 0) {
  const plan = planSite(await readSiteText(trueSite), { monteCarlo: false });
  return plan.mountings.map((m) => ({
    traverses: m.traverses,
    totalTime: m.totalTime + delay,
    fixedDelay: statedDelay,
  }));
}

Deno.test("Z and V readings, true wall 1 mm thinner: wall named first, 1.00 mm thinner", async () => {
  const site = await readSiteText(ZV);
  const w = planSite(site, { monteCarlo: false }).pipe.wallThickness;
  const trueSite = ZV.replace(
    "material: carbon-steel }",
    `material: carbon-steel, measuredWallThickness: ${((w - 1e-3) * 1e3).toFixed(4)} mm }`,
  );
  const r = reconcile(site, { mountings: await zvReadings(trueSite) });
  assert.ok(r.separable);
  assert.equal(r.causes[0].cause, "wall", JSON.stringify(r.causes.map((c) => c.cause)));
  closeAbs(r.causes[0].value, -1e-3, 1e-8, "wall change");
  assert.match(r.causes[0].explanation, /wall 1\.00 mm thinner/);
  assert.ok(r.causes[0].plausible);
  // the sound-speed causes cannot fit both traverse counts
  const t = r.causes.find((c) => c.cause === "temperature")!;
  assert.ok(t.rmsResidual > 10 * r.causes[0].rmsResidual + 1e-9);
});

Deno.test("Z and V readings, liquid 10 K warmer: temperature named first, 10.0 K higher", async () => {
  const site = await readSiteText(ZV);
  const r = reconcile(site, { mountings: await zvReadings(ZV.replace("15 degC", "25 degC")) });
  assert.equal(r.causes[0].cause, "temperature", JSON.stringify(r.causes.map((c) => c.cause)));
  closeAbs(r.causes[0].value, 10, 0.05, "temperature change");
  assert.match(r.causes[0].explanation, /temperature 10\.0 K higher/);
  // Z/V agreement: the time outside the bore is the plan's, only the time per crossing moved
  const l = r.traverseLine!;
  closeAbs(l.offset, l.plannedOffset, 1e-12, "offset unchanged");
  assert.ok(l.perTraverse < l.plannedPerTraverse);
  // cross-check against IAPWS-95 directly (water.soundSpeed, the project's IAPWS-95 verified
  // against the IAPWS R6-95 tables): the warmer liquid's speed explains the per-crossing time
  const plan = planSite(site, { monteCarlo: false });
  const d = plan.pipe.boreDiameter, s = Math.sin(plan.transducer.wedgeAngle) / 2720;
  const c25 = water.soundSpeed(298.15, 4e5);
  closeRel(l.perTraverse, d / (c25 * Math.sqrt(1 - s * s * c25 * c25)), 1e-9, "b = D/(c cos θ)");
});

Deno.test("Z and V readings, fixed delay 2 µs larger than stated: delay named first", async () => {
  const site = await readSiteText(ZV);
  const r = reconcile(site, { mountings: await zvReadings(ZV, 9e-6, 7e-6) });
  assert.equal(r.causes[0].cause, "fixed-delay", JSON.stringify(r.causes.map((c) => c.cause)));
  closeAbs(r.causes[0].value, 2e-6, 1e-9, "delay change");
  assert.match(r.causes[0].explanation, /fixed delay 2\.00 µs larger/);
  const l = r.traverseLine!;
  closeAbs(l.offset - l.plannedOffset, 2e-6, 1e-12, "Z/V offset moved by the delay error");
  closeRel(l.perTraverse, l.plannedPerTraverse, 1e-9, "per-crossing time unchanged");
});

Deno.test("one traverse count: a warning that delay and sound speed cannot be told apart", async () => {
  const site = await readSiteText(SITE);
  const time = planSite(site, { monteCarlo: false }).mountings[0].totalTime + 2e-6;
  const r = reconcile(site, { mountings: [{ traverses: 2, totalTime: time }] });
  assert.ok(!r.separable);
  assert.ok(r.warnings.some((w) => w.code === "reconcile-one-traverse"));
  // every one-parameter cause fits one reading exactly: all are listed, sized
  assert.ok(r.causes.length >= 4);
});

Deno.test("another liquid only when nothing within the declared one explains the readings", async () => {
  // water declared, the pipe actually full of a liquid far slower than any plausible water state
  const site = await readSiteText(ZV);
  const slow = await readSiteText(
    ZV.replace("fluid: { liquid: water,", "fluid: { soundSpeed: 1150 m/s, liquid: water,"),
  );
  const ms = planSite(slow, { monteCarlo: false }).mountings.map((m) => ({
    traverses: m.traverses,
    totalTime: m.totalTime,
  }));
  const r = reconcile(site, { mountings: ms });
  assert.ok(!r.causes.some((c) => c.plausible && c.cause !== "other-liquid"));
  // and with the declared liquid's own causes plausible, no other liquid is offered
  const warm = reconcile(site, { mountings: await zvReadings(ZV.replace("15 degC", "25 degC")) });
  assert.ok(!warm.causes.some((c) => c.cause === "other-liquid"));
});
