/**
 * The site plan: invariants of the composed pipeline, independent derivations, and checks
 * against outside references (python3-iapws for the liquid; Snell's law by hand).
 */
import { assert, closeAbs, closeRel } from "../_assert.ts";
import { hasPython, runPython } from "../_python.ts";
import { readSiteFile, readSiteText } from "../../lib/site/read.ts";
import { planSite, type SitePlan } from "../../lib/site/plan.ts";
import { defaultRegistry } from "../../lib/registry/mod.ts";
import { InputError, NoPhysicalAnswerError } from "../../lib/errors.ts";

const DEMO = new URL("../../data/demo/", import.meta.url);

const BASE = `
name: Test line (invented)
pipe: { standard: ASME B36.10M, nps: "8", schedule: "40", material: carbon-steel }
fluid: { liquid: water, temperature: 20 degC, pressure: 3 bar }
flow: { minimum: 20 L/s, design: 60 L/s, maximum: 90 L/s }
transducer: { wedgeSoundSpeed: 2720 m/s, wedgeAngle: 38 deg, frequency: 1 MHz, timingResolution: 100 ps }
mountings: [1, 2, 4]
`;

function walkFinite(x: unknown, path = "plan"): void {
  if (typeof x === "number") {
    assert.ok(Number.isFinite(x), `${path} is ${x}`);
  } else if (Array.isArray(x)) x.forEach((v, i) => walkFinite(v, `${path}[${i}]`));
  else if (x && typeof x === "object") {
    for (const [k, v] of Object.entries(x)) walkFinite(v, `${path}.${k}`);
  }
}

Deno.test("every demo site plans, with every number finite and the required fields present", async () => {
  const files = [...Deno.readDirSync(DEMO)].filter((e) => e.name.endsWith(".yaml")).map((e) =>
    e.name
  );
  assert.ok(files.length >= 4);
  for (const f of files) {
    const site = await readSiteFile(new URL(f, DEMO).pathname);
    assert.ok(site.invented, `${f} must say it is invented`);
    const p = planSite(site, { monteCarlo: { draws: 20_000, seed: 3 } });
    walkFinite(p);
    for (const k of ["outsideDiameter", "wallThickness", "insideDiameter"] as const) {
      assert.ok(p.pipe[k] > 0);
    }
    assert.ok(p.fluid.soundSpeed > 1000 && p.fluid.density > 900 && p.fluid.kinematicViscosity > 0);
    assert.ok(p.mountings.length >= 2);
    assert.ok(p.operatingPoints.length >= 2);
    assert.ok(p.uncertainty.expanded > 0 && p.uncertainty.coverageFactor > 1.9);
    assert.ok(p.uncertainty.budget.length >= 8);
    assert.equal(p.registryHash, defaultRegistry().hash);
    assert.ok(p.trace.length > 10);
    assert.ok(p.cautions.length >= 2);
    assert.ok(p.straightRun, `${f} describes a run`);
  }
});

Deno.test("trace: every source is a registry source or the site itself", async () => {
  const reg = defaultRegistry();
  const p = planSite(await readSiteFile(new URL("03-lined-trunk-main.yaml", DEMO).pathname), {
    monteCarlo: false,
  });
  for (const t of p.trace) {
    const ok = t.source === "site" || t.source === "measurement" || t.source === "input" ||
      reg.loaded.sources.has(t.source);
    assert.ok(ok, `trace source ${t.source} of ${t.quantity} does not resolve`);
  }
});

Deno.test("hand derivation: spacing = N·D·tanθf + 2·t·tanθw with Snell's law, Δt ∝ N", async () => {
  const p = planSite(await readSiteText(BASE), { monteCarlo: false });
  const cw = 2720, aw = 38 * Math.PI / 180;
  const s = Math.sin(aw) / cw; // Snell invariant
  const thf = Math.asin(s * p.fluid.soundSpeed);
  const wallSpeed = p.mountings[0].wallMode === "shear"
    ? defaultRegistry().material("carbon-steel").shear!
    : p.pipe.wallSoundSpeed;
  const thw = Math.asin(s * wallSpeed);
  for (const m of p.mountings) {
    const expected = m.traverses * p.pipe.boreDiameter * Math.tan(thf) +
      2 * p.pipe.wallThickness * Math.tan(thw);
    closeRel(m.spacing, expected, 1e-12, `spacing, ${m.traverses} traverses`);
    closeRel(m.fluidAngle, thf, 1e-12, "liquid angle");
  }
  const [z, v, w] = p.mountings;
  closeRel(v.times[1].deltaT / z.times[1].deltaT, 2, 1e-9, "V/Z Δt");
  closeRel(w.times[1].deltaT / z.times[1].deltaT, 4, 1e-9, "W/Z Δt");
  assert.ok(z.searchWindow.range.min < z.spacing && z.spacing < z.searchWindow.range.max);
});

Deno.test(
  {
    name: "outside check: plan's water sound speed and viscosity against python3-iapws IAPWS95",
    ignore: !hasPython("iapws"),
  },
  async () => {
    const p = planSite(await readSiteText(BASE), { monteCarlo: false });
    const ref = await runPython<{ w: number; nu: number }>(
      `import json,sys
from iapws import IAPWS95
d=json.load(sys.stdin)
s=IAPWS95(T=d["T"], P=d["p"]/1e6)
print(json.dumps({"w": s.w, "nu": s.nu}))`,
      { T: p.fluid.temperature, p: p.fluid.pressure },
    );
    closeRel(p.fluid.soundSpeed, ref.w, 1e-8, "sound speed vs python3-iapws");
    closeRel(p.fluid.kinematicViscosity, ref.nu, 1e-6, "kinematic viscosity vs python3-iapws");
  },
);

Deno.test("GUM and Monte Carlo agree on the plan's nearly linear model", async () => {
  const p = planSite(await readSiteFile(new URL("02-pump-station-bends.yaml", DEMO).pathname), {
    monteCarlo: { draws: 200_000, seed: 7 },
  });
  const mc = p.uncertainty.monteCarlo!;
  // the rectangular installation term dominates: Monte Carlo's interval is narrower (JCGM 101
  // §9.2.3 shows the same for rectangular inputs), but never narrower than for a rectangular
  // input alone: 95 % of a half-width a is 0.95a against GUM's k = 2 · a/√3 (ratio 0.8227)
  const ratio = mc.expanded / p.uncertainty.expanded;
  assert.ok(ratio >= 0.95 / (2 / Math.sqrt(3)) - 0.005, `Monte Carlo / GUM ${ratio}`);
  assert.ok(ratio <= 1.01, `Monte Carlo / GUM ${ratio}`);
});

Deno.test("a longer straight run never raises the expanded uncertainty", async () => {
  const site = (len: string) =>
    readSiteText(
      BASE +
        `run: { length: ${len}, upstream: { fitting: elbow-90 }, downstream: { fitting: gate-valve } }\n`,
    );
  let prev = Infinity;
  for (const len of ["1 m", "2 m", "4 m", "8 m"]) {
    const p = planSite(await site(len), { monteCarlo: false });
    const u = Math.max(...p.uncertainty.expandedByPoint.map((x) => x.expanded));
    assert.ok(u <= prev + 1e-12, `run ${len}: ${u} > ${prev}`);
    prev = u;
  }
});

Deno.test("common practice as check values: elbow with 10 D up and 5 D down meets", async () => {
  // a run of exactly 15 D after a single 90° elbow: the common-practice position is 10 D
  const p0 = planSite(await readSiteText(BASE), { monteCarlo: false });
  const D = p0.pipe.boreDiameter;
  const p = planSite(
    await readSiteText(
      BASE +
        `run: { length: ${
          (15 * D).toFixed(4)
        } m, upstream: { fitting: elbow-90 }, downstream: { fitting: gate-valve }, plannedPosition: ${
          (10 * D).toFixed(4)
        } m }\n`,
    ),
    { monteCarlo: false },
  );
  assert.equal(p.straightRun!.verdict, "meets");
  closeAbs(p.straightRun!.upstreamDiameters, 10, 1e-3);
  const short = planSite(
    await readSiteText(
      BASE +
        `run: { length: ${
          (8 * D).toFixed(4)
        } m, upstream: { fitting: elbow-90 }, downstream: { fitting: gate-valve } }\n`,
    ),
    { monteCarlo: false },
  );
  // shorter than the requirement: common-practice position at three quarters of the run
  closeRel(short.straightRun!.commonPracticePosition, 0.75 * 8 * D, 1e-3);
});

Deno.test("target verdict: generous target reachable, impossible one not, with suggestions", async () => {
  const easy = planSite(await readSiteText(BASE + "targetUncertainty: 20 %\n"), {
    monteCarlo: false,
  });
  assert.equal(easy.target!.reachable, true);
  assert.equal(easy.target!.suggestions.length, 0);
  const hard = planSite(await readSiteText(BASE + "targetUncertainty: 0.1 %\n"), {
    monteCarlo: false,
  });
  assert.equal(hard.target!.reachable, false);
  assert.ok(hard.target!.suggestions.length > 0);
  assert.ok(hard.target!.worstExpanded > 0.001);
});

Deno.test("measuring the wall and taping the circumference lowers the uncertainty", async () => {
  const nominal = planSite(await readSiteText(BASE), { monteCarlo: false });
  const measured = planSite(
    await readSiteText(
      BASE.replace(
        `pipe: { standard: ASME B36.10M, nps: "8", schedule: "40", material: carbon-steel }`,
        `pipe: { circumference: 688.3 mm, wallThickness: 8.18 mm, measuredWallThickness: 8.18 mm, material: carbon-steel }`,
      ),
    ),
    { monteCarlo: false },
  );
  assert.ok(measured.uncertainty.expanded < nominal.uncertainty.expanded);
});

Deno.test("refusals: unknown material, boiling water, beyond the critical angle", async () => {
  await assert.rejects(
    async () =>
      planSite(await readSiteText(BASE.replace("carbon-steel", "unobtainium")), {
        monteCarlo: false,
      }),
    InputError,
  );
  const boiling = BASE.replace(
    "temperature: 20 degC, pressure: 3 bar",
    "temperature: 150 degC, pressure: 2 bar",
  );
  await assert.rejects(
    async () => planSite(await readSiteText(boiling), { monteCarlo: false }),
    NoPhysicalAnswerError,
  );
  const steep = BASE.replace("wedgeAngle: 38 deg", "wedgeAngle: 80 deg");
  await assert.rejects(
    async () => planSite(await readSiteText(steep), { monteCarlo: false }),
    NoPhysicalAnswerError,
  );
});

Deno.test("plans are reproducible bit for bit (seeded Monte Carlo)", async () => {
  const site = await readSiteFile(new URL("01-reservoir-outlet.yaml", DEMO).pathname);
  const a: SitePlan = planSite(site, { monteCarlo: { draws: 10_000, seed: 11 } });
  const b: SitePlan = planSite(site, { monteCarlo: { draws: 10_000, seed: 11 } });
  assert.equal(JSON.stringify(a), JSON.stringify(b));
});

Deno.test("asymmetric catalogue tolerances stay asymmetric in the budget (JCGM 100 §4.3.8, JCGM 101 §6.4.2.1)", async () => {
  const { pipe } = await import("../../lib/pipe/mod.ts");
  const rp = pipe({ standard: "ASME B36.10M", nps: "8", schedule: "40", material: "carbon-steel" });
  const tol = rp.tolerances!;
  const site = await readSiteText(BASE);
  const plan = planSite(site, { monteCarlo: { draws: 20_000, seed: 1 } });
  const row = (name: string) => plan.uncertainty.budget.find((b) => b.name === name)!;
  for (
    const [name, sides] of [
      ["outside diameter", tol.outsideDiameter],
      ["wall thickness", tol.wallThickness],
    ] as const
  ) {
    const plus = Math.abs(sides.plus ?? 0), minus = Math.abs(sides.minus ?? 0);
    const b = row(name);
    // GUM row: estimate at nominal, u = (b₊ + b₋)/√12.
    closeRel(b.standardUncertainty, (plus + minus) / Math.sqrt(12), 1e-12, `${name} u`);
    if (plus === minus) assert.equal(b.centreOffset, undefined, `${name} symmetric`);
    else closeRel(b.centreOffset!, (plus - minus) / 2, 1e-12, `${name} centre offset`);
  }
  // The ASTM A530 wall band (−12.5 %, no plus side) is asymmetric: the row carries the offset.
  assert.ok(row("wall thickness").centreOffset! < 0, "wall band lies below the nominal");
});

Deno.test("a run without its downstream fitting plans with the most demanding one assumed", async () => {
  const site = await readSiteFile("tests/site/run-without-downstream.yaml");
  assert.equal(site.run?.downstream, undefined);
  const plan = planSite(site, { monteCarlo: false });
  const sr = plan.straightRun!;
  assert.equal(sr.downstreamAssumed, true);
  // Independent of the plan: the largest downstream requirement among the registry fittings.
  const most = Math.max(
    ...defaultRegistry().fittings().map((f) => f.straightRun.downstream.diameters),
  );
  assert.equal(
    defaultRegistry().fitting(sr.downstreamFitting).straightRun.downstream.diameters,
    most,
  );
  assert.equal(sr.requiredDownstream, most);
  assert.ok(
    plan.warnings.some((w) => w.code === "default" && w.message.startsWith("run.downstream")),
  );
  // Naming the fitting removes the assumption.
  const named = planSite(
    { ...site, run: { ...site.run!, downstream: { fitting: "gate-valve" } } },
    { monteCarlo: false },
  );
  assert.equal(named.straightRun!.downstreamAssumed, undefined);
  assert.equal(named.straightRun!.downstreamFitting, "gate-valve");
});
