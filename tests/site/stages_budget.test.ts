/**
 * Tests of the later plan stages (lib/site/stages/): roughness, the mounting choice, the
 * uncertainty budget, the verdict, the cautions, the notes collector and the assembly. Each check
 * names its outside source or the rule of the trade it holds to. The composition as a whole is
 * guarded byte for byte by golden.test.ts.
 */
import { assert, closeRel } from "../_assert.ts";
import { readSiteText } from "../../lib/site/read.ts";
import { defaultRegistry } from "../../lib/registry/mod.ts";
import type { SiteInput } from "../../lib/site/schema.ts";
import { planPipe } from "../../lib/site/stages/pipe.ts";
import { planLiquid } from "../../lib/site/stages/liquid.ts";
import { planTransducer } from "../../lib/site/stages/transducer.ts";
import { boreRoughness, planOperatingPoints } from "../../lib/site/stages/points.ts";
import { planMountings } from "../../lib/site/stages/mountings.ts";
import { chooseMounting } from "../../lib/site/stages/choose.ts";
import { budgetInputs, planBudget } from "../../lib/site/stages/budget.ts";
import { planVerdict } from "../../lib/site/stages/verdict.ts";
import { planCautions } from "../../lib/site/stages/cautions.ts";
import { assumptionTrace, planNotes } from "../../lib/site/stages/trace.ts";
import { assemblePlan } from "../../lib/site/stages/assemble.ts";
import { planSite } from "../../lib/site/plan.ts";
import { planStraightRun } from "../../lib/site/stages/run.ts";
import { PLAN_ASSUMPTIONS } from "../../lib/site/stages/assumptions.ts";

/** An invented site. */
const BASE = `
name: Budget stage line (invented)
pipe: { standard: ASME B36.10M, nps: "8", schedule: "40", material: carbon-steel }
fluid: { liquid: water, temperature: 20 degC, pressure: 3 bar }
flow: { minimum: 20 L/s, design: 60 L/s, maximum: 90 L/s }
transducer: { wedgeSoundSpeed: 2720 m/s, wedgeAngle: 38 deg, frequency: 1 MHz, timingResolution: 100 ps }
mountings: [1, 2, 4]
`;
const reg = defaultRegistry();

/** The stages up to the mountings, wired as planSite wires them, with a stated install band. */
function upToBudget(site: SiteInput, installHalf: number) {
  const p = planPipe({ pipe: site.pipe, registry: reg });
  const l = planLiquid({ fluid: site.fluid });
  const t = planTransducer({
    transducer: site.transducer,
    temperature: site.fluid.temperature,
    registry: reg,
  });
  const r = boreRoughness({
    stated: site.pipe.roughness,
    material: p.mat.roughness,
    materialId: p.materialId,
    bore: p.bore,
  });
  const pts = planOperatingPoints({
    flow: site.flow,
    bore: p.bore,
    area: p.area,
    roughness: r.roughness,
    nu: l.nu,
  });
  const m = planMountings({
    mountings: site.mountings,
    sp: site.pipe,
    fl: site.fluid,
    td: site.transducer,
    rp: p.rp,
    mat: p.mat,
    wallThickness: p.wallThickness,
    wallL: p.wallL,
    wallS: p.wallS,
    lining: p.lining,
    c: l.c,
    cSpread: l.cSpread,
    rho: l.rho,
    T: site.fluid.temperature,
    cw: t.cw,
    cwHalf: t.cwHalf,
    dcwdT: t.dcwdT,
    wedgeDensity: t.wedgeDensity,
    wedgeAtt: t.wedgeAtt,
    points: pts.points,
    timingOffset: t.timingOffset,
    reg,
  });
  const input = {
    sp: site.pipe,
    td: site.transducer,
    rp: p.rp,
    mat: p.mat,
    wallThickness: p.wallThickness,
    wallL: p.wallL,
    lining: p.lining,
    cw: t.cw,
    cwHalf: t.cwHalf,
    dcwdT: t.dcwdT,
    zeroOffset: t.zeroOffset,
    timingResolution: t.timingResolution,
    wallTolHalf: m.wallTolHalf,
    odHalf: m.odHalf,
    tolOffsets: m.tolOffsets,
    mountingPlans: m.mountingPlans,
    installHalf,
    points: pts.points,
    reg,
  };
  return { p, pts, m, input };
}

Deno.test("roughness stage: ε/D from the site, else the material, else smooth with a warning", () => {
  // relative roughness is ε/D by definition (Colebrook's parameter)
  const stated = boreRoughness({ stated: 1e-4, material: 4.5e-5, materialId: "x", bore: 0.5 });
  assert.equal(stated.roughness, 1e-4);
  closeRel(stated.relativeRoughness, 2e-4, 1e-12);
  const smooth = boreRoughness({
    stated: undefined,
    material: undefined,
    materialId: "glass",
    bore: 0.1,
  });
  assert.equal(smooth.relativeRoughness, 0);
  assert.equal(smooth.warnings[0].code, "roughness");
  assert.match(smooth.warnings[0].message, /glass/);
});

Deno.test("budget stage: GUM combined uncertainty by hand, JCGM 100 eq. (10) with log derivatives", async () => {
  const site = await readSiteText(BASE);
  const { input } = upToBudget(site, 0.01);
  const b = planBudget({ ...input, monteCarlo: false });
  const m = b.chosen;
  const pi = b.mountingPlans[0].times.findIndex((t) => t.label === b.uncertainty.operatingPoint);
  const x = budgetInputs(input, m, pi);
  const [od, e, lin, cw, th, dt, tau, k, eps] = x;
  // Q = k(1+ε)(π/4)D²·c_w·Δt/(2 sin θ·τ), D = OD − 2e − 2l: relative sensitivities ∂lnQ/∂x
  const D = od.value - 2 * e.value - 2 * lin.value;
  const rel = [
    (2 / D) * od.standardUncertainty,
    (4 / D) * e.standardUncertainty,
    (4 / D) * lin.standardUncertainty,
    cw.standardUncertainty / cw.value,
    th.standardUncertainty / Math.tan(th.value),
    dt.standardUncertainty / Math.abs(dt.value),
    tau.standardUncertainty / tau.value,
    k.standardUncertainty / k.value,
    eps.standardUncertainty / (1 + eps.value),
  ];
  const uRel = Math.hypot(...rel);
  // JCGM 100 §6.2: U = k·u_c; the plan states k = 2 for these normal/rectangular inputs
  closeRel(b.uncertainty.expanded / b.uncertainty.coverageFactor, uRel, 1e-5);
  assert.equal(b.uncertainty.monteCarlo, undefined);
  // the budget lines' shares of the variance sum to one (JCGM 100 eq. (10))
  closeRel(b.uncertainty.budget.reduce((s, l) => s + l.share, 0), 1, 1e-9);
});

Deno.test("budget stage: rectangular bands give u = a/√3 (JCGM 100 §4.3.7), timing q gives q/√12", async () => {
  const site = await readSiteText(BASE);
  const { input } = upToBudget(site, 0.02);
  const x = budgetInputs(input, input.mountingPlans[0], 0);
  const byName = (s: string) => x.find((i) => i.name.startsWith(s))!;
  closeRel(byName("installation").standardUncertainty, 0.02 / Math.sqrt(3), 1e-12);
  closeRel(
    byName("wedge angle").standardUncertainty,
    PLAN_ASSUMPTIONS.wedgeAngleHalfWidth / Math.sqrt(3),
    1e-12,
  );
  // 100 ps resolution and the stated zero offset, combined in quadrature
  const dt = byName("transit-time difference");
  closeRel(
    dt.standardUncertainty,
    Math.hypot(input.zeroOffset / Math.sqrt(3), 1e-10 / Math.sqrt(12)),
    1e-12,
  );
});

Deno.test("budget stage: Monte Carlo agrees with GUM for this near-linear model (JCGM 101 §8)", async () => {
  const site = await readSiteText(BASE);
  const { input } = upToBudget(site, 0.01);
  const b = planBudget({ ...input, monteCarlo: { draws: 20_000, seed: 3 } });
  const mc = b.uncertainty.monteCarlo!;
  assert.equal(mc.draws, 20_000);
  // JCGM 101 §8: the GUM interval is validated when its ends agree with the Monte Carlo ones
  // within the numerical tolerance; here a loose 10 % of the half-width (common practice)
  closeRel(mc.expanded, b.uncertainty.expanded, 0.1);
  assert.equal(b.trace.length, 2);
});

Deno.test("budget stage: the copy of each mounting keeps its keys in place and its path", async () => {
  const site = await readSiteText(BASE);
  const { input } = upToBudget(site, 0);
  const b = planBudget({ ...input, monteCarlo: false });
  for (const [i, m] of b.mountingPlans.entries()) {
    assert.deepEqual(Object.keys(m), Object.keys(input.mountingPlans[i]));
    assert.equal(m.expandedByPoint.length, 3);
    assert.ok(m.expandedByPoint.every((u) => u > 0 && Number.isFinite(u)));
  }
  assert.ok(b.mountingPlans.includes(b.chosen));
  // the worst point is the largest of the chosen mounting's expanded uncertainties
  assert.equal(b.chosen.expandedByPoint[b.worstIdx], Math.max(...b.chosen.expandedByPoint));
});

Deno.test("mounting choice: weak or wall-borne paths are passed over; V before Z (common practice)", () => {
  const m = (traverses: number, over: Record<string, unknown> = {}) =>
    ({
      traverses,
      signal: { rating: "good" },
      wallBorne: { overlaps: false },
      resolvableAtMinimum: true,
      expandedByPoint: [0.02],
      ...over,
    }) as unknown as Parameters<typeof chooseMounting>[0][number];
  assert.equal(chooseMounting([m(1), m(2), m(4)]).traverses, 2);
  assert.equal(chooseMounting([m(1), m(2, { signal: { rating: "weak" } })]).traverses, 1);
  assert.equal(chooseMounting([m(1), m(2, { wallBorne: { overlaps: true } })]).traverses, 1);
  // V at 3 % is more than 5 % worse than Z at 2 %: Z
  assert.equal(chooseMounting([m(1), m(2, { expandedByPoint: [0.03] })]).traverses, 1);
  // resolvable at minimum flow before not
  assert.equal(chooseMounting([m(1), m(2, { resolvableAtMinimum: false })]).traverses, 1);
  assert.throws(() => chooseMounting([]), { name: "InputError" });
});

Deno.test("verdict stage: a hard target names the largest lines' remedies; solids warn (common practice)", () => {
  const chosen = { name: "V", traverses: 2, expandedByPoint: [0.05, 0.03, 0.02] };
  const w = { name: "W", traverses: 4, expandedByPoint: [0.009, 0.008, 0.007] };
  const points = [{ label: "minimum" }, { label: "design" }, { label: "maximum" }];
  const v = planVerdict(
    {
      targetUncertainty: 0.01,
      content: { solids: 0.1 },
      points,
      mountingPlans: [chosen, w],
      chosen,
      worstIdx: 0,
      worstBudget: ["transit-time difference (zero offset, resolution)", "wall thickness"],
      budget: ["wall thickness", "transit-time difference (zero offset, resolution)"],
      straightRun: undefined,
    } as unknown as Parameters<typeof planVerdict>[0],
  );
  assert.equal(v.target!.reachable, false);
  assert.equal(v.target!.worstExpanded, 0.05);
  assert.equal(v.target!.worstPoint, "minimum");
  assert.match(v.target!.suggestions[0], /more traverses than 2/);
  assert.ok(v.target!.suggestions.some((s) => s.startsWith("the W mounting")));
  assert.equal(v.mainLimitation, "wall thickness");
  // 10 % solids is beyond what transit time tolerates (data/acoustics/practice-thresholds.yaml)
  assert.equal(v.technique.favours, "doppler");
  assert.equal(v.warnings[0].code, "technique");
  const easy = planVerdict(
    {
      targetUncertainty: 0.06,
      content: undefined,
      points,
      mountingPlans: [chosen],
      chosen,
      worstIdx: 0,
      worstBudget: [],
      budget: [],
      straightRun: undefined,
    } as unknown as Parameters<typeof planVerdict>[0],
  );
  assert.deepEqual([easy.target!.reachable, easy.target!.suggestions], [true, []]);
  assert.equal(easy.warnings.length, 0);
});

Deno.test("cautions stage: hot, cold, pressurised, process liquid and lined pipe (common practice)", () => {
  const c = (temperature: number, pressure: number, liquid = "water", lined = false) =>
    planCautions({ temperature, pressure, liquid, lined }).cautions;
  const mild = c(293.15, 3e5);
  // the general cautions always: defer to permits and local codes; lagging; confined spaces
  assert.ok(mild.some((s) => s.includes("local codes and licensed practice")));
  assert.ok(mild.some((s) => s.includes("confined spaces")));
  assert.ok(mild.some((s) => s.includes("insulation or lagging")));
  assert.ok(!mild.some((s) => /^(Hot|Cold|Pressurised|Process|Lined)/.test(s)));
  assert.ok(c(353.15, 3e5).some((s) => s.startsWith("Hot line (80 °C)")));
  assert.ok(c(275.15, 3e5).some((s) => s.startsWith("Cold line")));
  assert.ok(c(293.15, 1.6e6).some((s) => s.startsWith("Pressurised line (16.0 bar")));
  assert.ok(c(293.15, 3e5, "propylene-glycol-30").some((s) => s.startsWith("Process liquid")));
  assert.ok(c(293.15, 3e5, "water", true).some((s) => s.startsWith("Lined pipe")));
});

Deno.test("notes: stage order kept, repeats dropped only where asked, trace repeats dropped", () => {
  const notes = planNotes([{ message: "flow.design not given" }]);
  const w = { code: "x", message: "m" };
  const e = { quantity: "q", value: 1, unit: "", source: "s", basis: "recalled" } as const;
  const e2 = { ...e, value: 2 };
  notes.add({ warnings: [w, w], trace: [e] });
  notes.add({ warnings: [w, { code: "y", message: "n" }], trace: [e, e2] }, true);
  assert.deepEqual(notes.warnings.map((x) => x.message), ["flow.design not given", "m", "m", "n"]);
  assert.equal(notes.warnings[0].code, "default");
  assert.deepEqual(notes.trace().map((t) => t.value), [1, 2]);
  // every plan assumption is traced as common practice
  const a = assumptionTrace();
  assert.deepEqual(
    a.map((t) => t.value),
    Object.values(PLAN_ASSUMPTIONS),
  );
});

Deno.test("assembly: the plan from its stages equals planSite's, path and inputs dropped", async () => {
  const site = await readSiteText(
    BASE +
      "run: { length: 4 m, upstream: { fitting: elbow-90 }, downstream: { fitting: gate-valve } }\n",
  );
  const whole = planSite(site, { monteCarlo: false });
  const { p, pts, m, input } = upToBudget(site, 0);
  const provisional = chooseMounting(m.mountingPlans);
  const r = boreRoughness({
    stated: undefined,
    material: p.mat.roughness,
    materialId: p.materialId,
    bore: p.bore,
  });
  const run = planStraightRun({
    run: site.run,
    bore: p.bore,
    relativeRoughness: r.relativeRoughness,
    points: pts.points,
    traverses: provisional.traverses,
    fluidAngle: provisional.fluidAngle,
  });
  const budget = planBudget({
    ...input,
    installHalf: run.installHalf,
    installProvenance: run.installProvenance,
    monteCarlo: false,
  });
  const plan = assemblePlan({
    site,
    registryHash: reg.hash,
    pipe: p,
    liquid: planLiquid({ fluid: site.fluid }),
    transducer: planTransducer({
      transducer: site.transducer,
      temperature: site.fluid.temperature,
      registry: reg,
    }),
    points: pts,
    run,
    budget,
    verdict: planVerdict({
      targetUncertainty: undefined,
      content: undefined,
      points: pts.points,
      mountingPlans: budget.mountingPlans,
      chosen: budget.chosen,
      worstIdx: budget.worstIdx,
      worstBudget: budget.worstBudget,
      budget: budget.uncertainty.budget.map((l) => l.name),
      straightRun: run.straightRun,
    }),
    cautions: whole.cautions,
    trace: whole.trace,
    warnings: whole.warnings,
  });
  assert.ok(plan.mountings.every((x) => !("path" in x) && !("inputs" in x)));
  assert.equal(JSON.stringify(plan), JSON.stringify(whole));
});
