/**
 * Independent derivations for the Snell chain and path geometry (lib/acoustics/path.ts).
 */
import fc from "fast-check";
import { assert, closeAbs, closeRel } from "../_assert.ts";
import { InputError, NoPhysicalAnswerError } from "../../lib/errors.ts";
import {
  type ClampOnInputs,
  clampOnPath,
  criticalAngle,
  criticalAngles,
} from "../../lib/acoustics/path.ts";
import { DEG, STEEL_V } from "./_fixture.ts";

Deno.test("liquid angle does not depend on the wall (speed, thickness, mode) or the lining", () => {
  const base = clampOnPath(STEEL_V);
  const variants: ClampOnInputs[] = [
    { ...STEEL_V, wallThickness: 0.012 },
    { ...STEEL_V, wallShearSpeed: 3100 },
    { ...STEEL_V, wallSoundSpeed: 2400, wallShearSpeed: 1100 }, // plastic: longitudinal mode
    { ...STEEL_V, lining: { thickness: 0.006, soundSpeed: 3800 } },
  ];
  for (const v of variants) {
    const p = clampOnPath(v);
    closeAbs(p.fluidAngle, base.fluidAngle, 1e-15, "fluid angle");
  }
  // Snell's law between wedge and liquid directly.
  closeAbs(base.fluidAngle, Math.asin(Math.sin(38 * DEG) * 1482 / 2720), 1e-15, "asin");
});

Deno.test("Snell invariant holds in every layer", () => {
  const p = clampOnPath({
    ...STEEL_V,
    lining: [{ thickness: 0.004, soundSpeed: 3800 }, {
      thickness: 0.001,
      soundSpeed: 2500,
    }],
  });
  const s = p.snellInvariant;
  closeRel(Math.sin(p.wallAngle) / 3230, s, 1e-14, "wall");
  closeRel(Math.sin(p.liningAngles[0]) / 3800, s, 1e-14, "lining 0");
  closeRel(Math.sin(p.liningAngles[1]) / 2500, s, 1e-14, "lining 1");
  closeRel(Math.sin(p.fluidAngle) / 1482, s, 1e-14, "liquid");
  closeAbs(p.boreDiameter, 0.1143 - 2 * 0.00602 - 2 * 0.005, 1e-15, "bore");
});

Deno.test("spacing scales with traverses as N·D·tanθ_f plus the fixed wall terms", () => {
  fc.assert(
    fc.property(
      fc.double({ min: 0.02, max: 2, noNaN: true }),
      fc.double({ min: 0.05, max: 0.3, noNaN: true }),
      fc.double({ min: 20, max: 45, noNaN: true }),
      (od, wallFrac, angle) => {
        const inputs = {
          ...STEEL_V,
          outsideDiameter: od,
          wallThickness: od * wallFrac / 2,
          wedgeAngle: angle * DEG,
        };
        let p1;
        try {
          p1 = clampOnPath({ ...inputs, traverses: 1 });
        } catch (e) {
          if (e instanceof NoPhysicalAnswerError) return; // beyond a critical angle
          throw e;
        }
        const step = p1.boreDiameter * Math.tan(p1.fluidAngle);
        const fixed = 2 * inputs.wallThickness * Math.tan(p1.wallAngle);
        closeRel(p1.spacing, step + fixed, 1e-12, "N = 1");
        for (const n of [2, 3, 4, 8]) {
          const p = clampOnPath({ ...inputs, traverses: n });
          closeRel(p.spacing - p1.spacing, (n - 1) * step, 1e-9, `N = ${n}`);
          closeRel(p.fluidPathLength, n * p1.fluidPathLength, 1e-12, "path length");
          closeRel(p.wallTime, p1.wallTime, 1e-14, "wall crossed twice whatever N");
        }
      },
    ),
    { numRuns: 200 },
  );
});

Deno.test("times: each layer's time is thickness/(c·cosθ), wall and lining twice", () => {
  const p = clampOnPath({
    ...STEEL_V,
    lining: { thickness: 0.005, soundSpeed: 4000 },
    wedge: { elementHeight: 0.01, indexOffset: 0.012 },
  });
  closeRel(p.wallTime, 2 * 0.00602 / (3230 * Math.cos(p.wallAngle)), 1e-14, "wall");
  closeRel(p.liningTime, 2 * 0.005 / (4000 * Math.cos(p.liningAngles[0])), 1e-14, "lining");
  closeRel(p.fluidTime, p.fluidPathLength / 1482, 1e-14, "liquid");
  closeRel(p.wedgeTime!, 2 * 0.01 / (2720 * Math.cos(38 * DEG)), 1e-14, "wedge");
  closeRel(p.totalTime, p.wallTime + p.liningTime + p.fluidTime + p.wedgeTime!, 1e-14, "total");
  closeRel(p.referenceMarkDistance!, p.spacing + 0.024, 1e-14, "marks");
  closeRel(p.elementSpacing!, p.spacing + 0.02 * Math.tan(38 * DEG), 1e-14, "elements");
});

Deno.test("steel behind a 38° acrylic-class wedge: only shear reaches the liquid", () => {
  const p = clampOnPath(STEEL_V);
  assert.equal(p.wallMode, "shear");
  const l = p.modes.find((m) => m.wallMode === "longitudinal")!;
  assert.equal(l.reachesLiquid, false);
  assert.ok(l.blockedBy!.includes("first critical angle"));
});

Deno.test("thin PVC wall with a steep wedge: both modes reach; longitudinal is primary", () => {
  const p = clampOnPath({
    ...STEEL_V,
    wallSoundSpeed: 2380,
    wallShearSpeed: 1060,
    wallThickness: 0.003,
  });
  assert.equal(p.modes.length, 2);
  assert.ok(p.modes.every((m) => m.reachesLiquid));
  assert.equal(p.wallMode, "longitudinal");
  const sh = p.modes.find((m) => m.wallMode === "shear")!;
  assert.equal(sh.role, "secondary");
  assert.ok(sh.totalTime! > p.totalTime, "the slower shear leg arrives later");
  assert.ok(sh.spacing! < p.spacing, "and is refracted less, so its spacing is shorter");
  // Forcing the mode gives the secondary figures.
  const f = clampOnPath({
    ...STEEL_V,
    wallSoundSpeed: 2380,
    wallShearSpeed: 1060,
    wallThickness: 0.003,
    wallMode: "shear",
  });
  closeRel(f.spacing, sh.spacing!, 1e-15, "forced shear");
});

Deno.test("near grazing longitudinal wall wave: shear becomes primary", () => {
  // s·c_L just below 1 → θ_L ≈ 80°; shear well inside.
  const cw = 2720;
  const aw = Math.asin(0.985 * cw / 5920);
  const p = clampOnPath({ ...STEEL_V, wedgeAngle: aw });
  assert.ok(p.modes[0].reachesLiquid && p.modes[0].wallAngle! > 70 * DEG);
  assert.equal(p.wallMode, "shear");
});

Deno.test("nothing reaches the liquid → NoPhysicalAnswerError naming both critical angles", () => {
  const first = (Math.asin(2720 / 5920) / DEG).toFixed(2);
  const second = (Math.asin(2720 / 3230) / DEG).toFixed(2);
  assert.throws(
    () => clampOnPath({ ...STEEL_V, wedgeAngle: 62 * DEG }),
    (err: unknown) =>
      err instanceof NoPhysicalAnswerError && err.exitCode === 1 &&
      err.message.includes(first) && err.message.includes(second),
  );
  // Liquid faster than the wedge (e.g. a slow wedge) and beyond its critical angle.
  assert.throws(
    () => clampOnPath({ ...STEEL_V, wedgeSoundSpeed: 1200, wedgeAngle: 60 * DEG }),
    (err: unknown) => err instanceof NoPhysicalAnswerError && /liquid/.test((err as Error).message),
  );
  // Lining beyond critical.
  assert.throws(
    () =>
      clampOnPath({
        ...STEEL_V,
        wedgeAngle: 40 * DEG,
        lining: { thickness: 0.005, soundSpeed: 4500 },
      }),
    (err: unknown) => err instanceof NoPhysicalAnswerError && /lining/.test((err as Error).message),
  );
  // Forced longitudinal beyond the first critical angle.
  assert.throws(() => clampOnPath({ ...STEEL_V, wallMode: "longitudinal" }), NoPhysicalAnswerError);
});

Deno.test("input validation names the field", () => {
  const bad: [Partial<ClampOnInputs> & Record<string, unknown>, string][] = [
    [{ traverses: 0 }, "traverses"],
    [{ traverses: 2.5 }, "traverses"],
    [{ traverses: 9 }, "traverses"],
    [{ outsideDiameter: -0.1 }, "outsideDiameter"],
    [{ wallThickness: 0 }, "wallThickness"],
    [{ wallThickness: 0.06 }, "wallThickness"],
    [{ fluidSoundSpeed: NaN }, "fluidSoundSpeed"],
    [{ wedgeSoundSpeed: Infinity }, "wedgeSoundSpeed"],
    [{ wedgeAngle: Math.PI / 2 }, "wedgeAngle"],
    [{ wedgeAngle: -0.1 }, "wedgeAngle"],
    [{ wallShearSpeed: -1 }, "wallShearSpeed"],
    [{ lining: { thickness: 0.06, soundSpeed: 4000 } }, "lining.thickness"],
    [{ lining: { thickness: 0.001, soundSpeed: 0 } }, "lining[0].soundSpeed"],
    [{ wallMode: "sideways" as "shear" }, "wallMode"],
    [{ wallShearSpeed: undefined, wallMode: "shear" }, "wallShearSpeed"],
    [{ wedge: { elementHeight: -1 } }, "wedge.elementHeight"],
  ];
  for (const [patch, field] of bad) {
    assert.throws(
      () => clampOnPath({ ...STEEL_V, ...patch } as ClampOnInputs),
      (e: unknown) => e instanceof InputError && e.field === field,
      `${JSON.stringify(patch)} → ${field}`,
    );
  }
});

Deno.test("criticalAngle: none against a slower medium; asin otherwise", () => {
  assert.equal(criticalAngle(2720, 1482), undefined);
  closeAbs(criticalAngle(1482, 5920)!, Math.asin(1482 / 5920), 1e-15);
  const c = criticalAngles({ ...STEEL_V, lining: { thickness: 0.005, soundSpeed: 4000 } });
  closeAbs(c.lining[0]!, Math.asin(2720 / 4000), 1e-15);
  assert.equal(c.fluid, undefined);
});
