/**
 * Tests of the plan stages one by one (lib/site/stages/), each against an outside source or a
 * rule of the trade named beside the check. The whole composition is guarded by golden.test.ts.
 */
import { assert, closeAbs, closeRel } from "../_assert.ts";
import { hasPython, runPython } from "../_python.ts";
import { readSiteText } from "../../lib/site/read.ts";
import { defaultRegistry } from "../../lib/registry/mod.ts";
import { InputError } from "../../lib/errors.ts";
import { planPipe } from "../../lib/site/stages/pipe.ts";
import { planLiquid } from "../../lib/site/stages/liquid.ts";
import { planTransducer } from "../../lib/site/stages/transducer.ts";
import { planOperatingPoints } from "../../lib/site/stages/points.ts";
import { planStraightRun } from "../../lib/site/stages/run.ts";
import { profileErrorEstimate } from "../../lib/installation/mod.ts";
import { planMountings } from "../../lib/site/stages/mountings.ts";
import { fmtMm, halfWidthTol, mountingName } from "../../lib/site/stages/assumptions.ts";

const BASE = `
name: Stage test line (invented)
pipe: { standard: ASME B36.10M, nps: "8", schedule: "40", material: carbon-steel }
fluid: { liquid: water, temperature: 20 degC, pressure: 3 bar }
flow: { minimum: 20 L/s, design: 60 L/s, maximum: 90 L/s }
transducer: { wedgeSoundSpeed: 2720 m/s, wedgeAngle: 38 deg, frequency: 1 MHz, timingResolution: 100 ps }
mountings: [1, 2, 4]
`;
const reg = defaultRegistry();

Deno.test("pipe stage: NPS 8 Sch 40 bore from ASME B36.10M (OD 219.1 mm, wall 8.18 mm)", async () => {
  const site = await readSiteText(BASE);
  const s = planPipe({ pipe: site.pipe, registry: reg });
  // ASME B36.10M table: NPS 8 OD 219.1 mm, Sch 40 wall 8.18 mm → bore 202.74 mm
  closeAbs(s.rp.outsideDiameter, 0.2191, 1e-6);
  closeAbs(s.wallThickness, 0.00818, 1e-6);
  closeAbs(s.bore, 0.2191 - 2 * 0.00818, 1e-9);
  closeRel(s.area, Math.PI / 4 * s.bore ** 2, 1e-12);
});

Deno.test("pipe stage: a gauged wall is used and a wall beyond the radius refused", async () => {
  const site = await readSiteText(
    BASE.replace(
      `material: carbon-steel }`,
      `material: carbon-steel, measuredWallThickness: 7 mm }`,
    ),
  );
  const s = planPipe({ pipe: site.pipe, registry: reg });
  assert.equal(s.wallThickness, 0.007);
  // 8.18 → 7 mm is beyond the ASTM A530 −12.5 % wall tolerance: warned (common practice)
  assert.ok(s.warnings.some((w) => w.code === "wall-differs"));
  assert.throws(
    () => planPipe({ pipe: { ...site.pipe, measuredWallThickness: 0.2 }, registry: reg }),
    InputError,
  );
});

Deno.test(
  {
    name: "liquid stage: water at 20 °C, 3 bar against python3-iapws (IAPWS-95)",
    ignore: !hasPython("iapws"),
  },
  async () => {
    const site = await readSiteText(BASE);
    const s = planLiquid({ fluid: site.fluid });
    const ref = await runPython<{ w: number; rho: number }>(
      `import json,sys
from iapws import IAPWS95
d=json.load(sys.stdin)
s=IAPWS95(T=d["T"], P=d["p"]/1e6)
print(json.dumps({"w": s.w, "rho": s.rho}))`,
      { T: site.fluid.temperature, p: site.fluid.pressure },
    );
    closeRel(s.c, ref.w, 1e-8, "sound speed vs python3-iapws");
    closeRel(s.rho, ref.rho, 1e-8, "density vs python3-iapws");
  },
);

Deno.test("liquid stage: a stated sound speed wins and carries no spread", async () => {
  const site = await readSiteText(BASE);
  const s = planLiquid({ fluid: { ...site.fluid, soundSpeed: 1500 } });
  assert.equal(s.c, 1500);
  assert.equal(s.cSpread, 0);
});

Deno.test("transducer stage: registry wedge speed follows c(T) = c_ref + dc/dT·ΔT", () => {
  const wm = reg.material("acrylic");
  const T = wm.referenceTemperature + 15;
  const s = planTransducer(
    {
      transducer: { wedgeMaterial: "acrylic", wedgeAngle: 0.6, frequency: 1e6 },
      temperature: T,
      registry: reg,
    } as unknown as Parameters<typeof planTransducer>[0],
  );
  // linear temperature correction (definition of the coefficient)
  closeAbs(s.cw - wm.longitudinal, (wm.dLongitudinalDT ?? 0) * 15, 1e-9);
  assert.ok((wm.dLongitudinalDT ?? 0) < 0, "polymer wedges slow when warm (recalled)");
  assert.throws(
    () =>
      planTransducer(
        {
          transducer: { wedgeAngle: 0.6, frequency: 1e6 },
          temperature: T,
          registry: reg,
        } as unknown as Parameters<typeof planTransducer>[0],
      ),
    InputError,
  );
});

Deno.test("points stage: Re = VD/ν and a turbulent profile factor V_mean/V_path between 0.85 and 1", () => {
  const D = 0.2;
  const s = planOperatingPoints(
    {
      flow: { quantity: "flow", minimum: 0.01, design: 0.03, maximum: 0.05 },
      bore: D,
      area: Math.PI / 4 * D * D,
      roughness: 0,
      nu: 1.0e-6,
    } as unknown as Parameters<typeof planOperatingPoints>[0],
  );
  assert.deepEqual(s.points.map((p) => p.label), ["minimum", "design", "maximum"]);
  const V = 0.03 / (Math.PI / 4 * D * D);
  closeRel(s.points[1].reynolds, V * D / 1e-6, 1e-12);
  // fully developed turbulent flow: k = V_mean/V_path about 0.93–0.97 (common practice)
  for (const p of s.points) assert.ok(p.profileFactor > 0.85 && p.profileFactor < 1);
  // smooth-pipe friction factor at Re ≈ 1.9e5: Moody chart ≈ 0.0158 (Colebrook; recalled)
  closeRel(s.points[1].frictionFactor, 0.0158, 0.03);
});

/** Operating points of a site's flows in a smooth bore of diameter d, water-like ν = 1e-6 m²/s. */
function smoothPoints(
  site: { flow: Parameters<typeof planOperatingPoints>[0]["flow"] },
  d: number,
) {
  return planOperatingPoints({
    flow: site.flow,
    bore: d,
    area: Math.PI / 4 * d * d,
    roughness: 0,
    nu: 1e-6,
  }).points;
}

/** The run stage in a smooth bore of diameter d for a V path at 0.3 rad in the liquid. */
function smoothRun(run: unknown, d: number, points: ReturnType<typeof smoothPoints>) {
  return planStraightRun({
    run: run as Parameters<typeof planStraightRun>[0]["run"],
    bore: d,
    relativeRoughness: 0,
    points,
    traverses: 2,
    fluidAngle: 0.3,
  });
}

Deno.test("run stage: after a 90° elbow, 10 D up and 5 D down meets (common practice)", async () => {
  const site = await readSiteText(BASE);
  const D = 0.2;
  const run = {
    length: 15 * D,
    upstream: { fitting: "elbow-90" },
    downstream: { fitting: "gate-valve" },
    plannedPosition: 10 * D,
  };
  const points = smoothPoints(site, D);
  const s = smoothRun(run, D, points);
  assert.equal(s.straightRun!.verdict, "meets");
  closeAbs(s.straightRun!.upstreamDiameters, 10, 1e-9);
  assert.ok(s.installHalf >= 0);
  const none = planStraightRun({
    run: undefined,
    bore: D,
    relativeRoughness: 0,
    points,
    traverses: 2,
    fluidAngle: 0.3,
  });
  assert.equal(none.warnings[0].code, "no-run");
});

Deno.test("run stage: the recommended plane's estimate uses its angle to the fitting's plane", async () => {
  // The distorted-profile model depends on the angle between the path plane and the upstream
  // fitting's plane (lib/installation, rankPositions scores candidates by o − orientation); the
  // plan's estimate at the recommended plane must be that candidate's, whatever the fitting's
  // own orientation. Differences of angles: geometry, no outside source needed.
  const site = await readSiteText(BASE);
  const D = 0.2;
  const points = smoothPoints(site, D);
  const design = points.find((p) => p.label === "design")!;
  for (const theta of [0, 0.5, -1.1]) {
    const run = {
      length: 12 * D,
      upstream: { fitting: "elbow-90", orientation: theta },
      downstream: { fitting: "gate-valve" },
    };
    const s = smoothRun(run, D, points).straightRun!;
    const expected = profileErrorEstimate({
      distanceDiameters: s.position / D,
      fitting: "elbow-90",
      orientation: s.recommendedOrientation - theta,
      traverses: 2,
      reynolds: design.reynolds,
      fluidAngle: 0.3,
      relativeRoughness: 0,
    });
    closeAbs(s.estimatedProfileError, expected.error, 1e-15, `fitting plane at ${theta} rad`);
    closeAbs(s.estimatedProfileErrorSpread, expected.spread, 1e-15);
  }
});

Deno.test("mountings stage: Snell's law in the liquid, Δt doubles from Z to V", async () => {
  const site = await readSiteText(BASE);
  const p = planPipe({ pipe: site.pipe, registry: reg });
  const l = planLiquid({ fluid: site.fluid });
  const t = planTransducer({
    transducer: site.transducer,
    temperature: site.fluid.temperature,
    registry: reg,
  });
  const pts = planOperatingPoints({
    flow: site.flow,
    bore: p.bore,
    area: p.area,
    roughness: 0,
    nu: l.nu,
  });
  const s = planMountings({
    mountings: [1, 2],
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
  const [z, v] = s.mountingPlans;
  assert.deepEqual([z.name, v.name], ["Z", "V"]);
  // Snell's law: sin θ_liquid / c_liquid = sin θ_wedge / c_wedge
  closeRel(Math.sin(z.fluidAngle) / l.c, Math.sin(site.transducer.wedgeAngle) / t.cw, 1e-9);
  // Δt grows with the traverse count at the same path velocity (geometry of the path)
  closeRel(v.times[0].deltaT / z.times[0].deltaT, 2, 1e-6);
});

Deno.test("shared helpers: tolerance half-width, mm text, mounting names (trade terms)", () => {
  // ASTM A530 wall −12.5 % / +0 on 8.18 mm: full band 1.0225 mm, half 0.51125 mm
  closeAbs(halfWidthTol({ plus: 0, minus: 0.125 * 0.00818 })!, 0.125 * 0.00818 / 2, 1e-15);
  assert.equal(halfWidthTol({ plus: 0, minus: 0 }), undefined);
  assert.equal(fmtMm(0.2191), "219.1 mm");
  assert.deepEqual([1, 2, 4].map(mountingName), ["Z", "V", "W"]);
});

Deno.test("transducer stage: a wedge outside its material's temperature range is warned", () => {
  const wm = reg.material("acrylic");
  assert.ok(wm.temperatureRange, "acrylic has a stated coefficient range in the registry");
  const [lo, hi] = wm.temperatureRange!;
  const at = (T: number) =>
    planTransducer(
      {
        transducer: { wedgeMaterial: "acrylic", wedgeAngle: 0.6, frequency: 1e6 },
        temperature: T,
        registry: reg,
      } as unknown as Parameters<typeof planTransducer>[0],
    ).warnings.some((w) => w.code === "wedge-range");
  assert.equal(at((lo + hi) / 2), false, "inside the range: no warning");
  assert.equal(at(hi + 5), true, "above the range: warned");
  assert.equal(at(lo - 5), true, "below the range: warned");
});

Deno.test("transducer stage: a stated wedge speed is corrected by dc/dT × (T − T_ref)", async () => {
  const hot = BASE.replace("temperature: 20 degC", "temperature: 50 degC").replace(
    "wedgeSoundSpeed: 2720 m/s,",
    "wedgeSoundSpeed: 2720 m/s, wedgeTemperatureCoefficient: -2.5 m/s/K, wedgeReferenceTemperature: 20 degC,",
  );
  const site = await readSiteText(hot);
  closeAbs(site.transducer.wedgeReferenceTemperature!, 293.15, 1e-9);
  const s = planTransducer({
    transducer: site.transducer,
    temperature: site.fluid.temperature,
    registry: reg,
  });
  // linear correction (definition of the coefficient): −2.5 m/s/K × 30 K = −75 m/s
  closeAbs(s.cw - 2720, -2.5 * 30, 1e-9);
  // without a reference: the stated speed holds at the line temperature, recorded as a default
  const noRef = planTransducer({
    transducer: { ...site.transducer, wedgeReferenceTemperature: undefined },
    temperature: site.fluid.temperature,
    registry: reg,
  });
  assert.equal(noRef.cw, 2720);
  assert.ok(
    noRef.warnings.some((w) => w.code === "default" && /reference temperature/.test(w.message)),
  );
});
