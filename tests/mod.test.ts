/**
 * The public names of DESIGN.md are exported from mod.ts and answer as documented.
 */
import { assert } from "./_assert.ts";
import * as sp from "../mod.ts";

Deno.test("DESIGN.md public names are exported from mod.ts", () => {
  for (
    const name of [
      "registry",
      "water",
      "seawater",
      "pipe",
      "clampOnPath",
      "transitTimes",
      "pathVelocity",
      "reynoldsNumber",
      "frictionFactor",
      "profileFactor",
      "checkStraightRun",
      "rankPositions",
      "planSite",
      "reconcile",
    ]
  ) {
    assert.ok(name in sp, `mod.ts does not export ${name}`);
  }
});

Deno.test("registry.pipe answers in SI with provenance, as DESIGN.md shows", () => {
  const p = sp.registry.pipe({ standard: "ASME B36.10M", nps: "4", schedule: "40" });
  // ASME B36.10M NPS 4 Sch 40: OD 114.3 mm, wall 6.02 mm (recalled from the standard)
  assert.ok(Math.abs(p.outsideDiameter - 0.1143) < 1e-9);
  assert.ok(Math.abs(p.wallThickness - 0.00602) < 1e-9);
  assert.ok(Math.abs(p.insideDiameter - (p.outsideDiameter - 2 * p.wallThickness)) < 1e-12);
  assert.ok(typeof p.source === "string" && typeof p.basis === "string");
  const m = sp.registry.material("carbon-steel");
  assert.ok(m.longitudinal > m.shear! && m.density > 7000);
  assert.ok(sp.registry.source("iapws-r6-95").citation.includes("IAPWS"));
  assert.equal(sp.registry.hash.length, 64);
});

Deno.test("pathVelocity inverts transitTimes through the public API", () => {
  const path = sp.clampOnPath({
    outsideDiameter: 0.1143,
    wallThickness: 0.00602,
    wallSoundSpeed: 5920,
    wallShearSpeed: 3230,
    fluidSoundSpeed: sp.water.soundSpeed(293.15),
    wedgeSoundSpeed: 2720,
    wedgeAngle: 38 * Math.PI / 180,
    traverses: 2,
  });
  const t = sp.transitTimes(path, 1.7);
  const v = sp.pathVelocity(path, t.upstream, t.downstream);
  assert.ok(Math.abs(v.velocity - 1.7) < 1e-9);
});
