/**
 * Outside check: critical angles of common wedge/wall pairs against handbook values.
 *
 * - Acrylic (perspex, c_L ≈ 2730 m/s) on steel (c_L ≈ 5900 m/s, c_T ≈ 3230 m/s): first critical
 *   angle about 27.6°, second about 57.8° — recalled from NDT handbooks (krautkramer-1990;
 *   asm-handbook-17), recalled, so checked to ±0.5°.
 * - Water (1483 m/s) on steel, immersion testing: first critical angle about 14.5°, second
 *   about 27.3° — recalled (krautkramer-1990), ±0.6°.
 * - With the registry's own material speeds (materials room; acrylic, carbon-steel), the
 *   computed angles must stay within the same recalled bands.
 */
import { assert, closeAbs } from "../_assert.ts";
import { clampOnPath, criticalAngle, criticalAngles } from "../../lib/acoustics/path.ts";
import { defaultRegistry } from "../../lib/registry/mod.ts";
import { NoPhysicalAnswerError } from "../../lib/errors.ts";

const DEG = Math.PI / 180;

Deno.test("acrylic on steel: first ≈ 27.6°, second ≈ 57.8° (NDT handbooks, recalled)", () => {
  closeAbs(criticalAngle(2730, 5900)! / DEG, 27.6, 0.5, "first critical");
  closeAbs(criticalAngle(2730, 3230)! / DEG, 57.8, 0.5, "second critical");
});

Deno.test("water on steel: first ≈ 14.5°, second ≈ 27.3° (immersion testing, recalled)", () => {
  const c = criticalAngles({
    wedgeSoundSpeed: 1483,
    wallSoundSpeed: 5920,
    wallShearSpeed: 3240,
    fluidSoundSpeed: 1483,
  });
  closeAbs(c.wallLongitudinal! / DEG, 14.5, 0.6, "first");
  closeAbs(c.wallShear! / DEG, 27.3, 0.6, "second");
});

Deno.test("registry speeds (acrylic wedge, carbon-steel wall) give the handbook angles", () => {
  const reg = defaultRegistry();
  let acrylic, steel;
  try {
    acrylic = reg.material("acrylic");
    steel = reg.material("carbon-steel");
  } catch {
    return; // materials not in the registry yet
  }
  const c = criticalAngles({
    wedgeSoundSpeed: acrylic.longitudinal,
    wallSoundSpeed: steel.longitudinal,
    wallShearSpeed: steel.shear,
    fluidSoundSpeed: 1482,
  });
  // The registry's acrylic is the ASTM E494 row (2670 m/s), lower than the perspex of the
  // handbook angles above (2730 m/s): the handbook angles must lie inside the range that the
  // registry's stated spreads give, and the nominal angles within 1° and 2.5°.
  const lo = Math.asin(
    (acrylic.longitudinal - (acrylic.longitudinalSpread ?? 0)) /
      (steel.longitudinal + (steel.longitudinalSpread ?? 0)),
  ) / DEG;
  const hi = Math.asin(
    (acrylic.longitudinal + (acrylic.longitudinalSpread ?? 0)) /
      (steel.longitudinal - (steel.longitudinalSpread ?? 0)),
  ) / DEG;
  assert.ok(lo <= 27.6 && 27.6 <= hi, `first critical ${lo.toFixed(2)}–${hi.toFixed(2)}°`);
  const loS = Math.asin(
    (acrylic.longitudinal - (acrylic.longitudinalSpread ?? 0)) /
      (steel.shear! + (steel.shearSpread ?? 0)),
  ) / DEG;
  const hiS = Math.asin(
    (acrylic.longitudinal + (acrylic.longitudinalSpread ?? 0)) /
      (steel.shear! - (steel.shearSpread ?? 0)),
  ) / DEG;
  assert.ok(loS <= 57.8 && 57.8 <= hiS, `second critical ${loS.toFixed(2)}–${hiS.toFixed(2)}°`);
  closeAbs(c.wallLongitudinal! / DEG, 27.6, 1.0, "first");
  closeAbs(c.wallShear! / DEG, 57.8, 2.5, "second");
  // Between the two, only shear reaches the liquid; beyond the second, nothing does.
  const base = {
    outsideDiameter: 0.1143,
    wallThickness: 0.00602,
    wallSoundSpeed: steel.longitudinal,
    wallShearSpeed: steel.shear,
    fluidSoundSpeed: 1482,
    wedgeSoundSpeed: acrylic.longitudinal,
    traverses: 2,
  };
  assert.equal(clampOnPath({ ...base, wedgeAngle: 40 * DEG }).wallMode, "shear");
  assert.equal(clampOnPath({ ...base, wedgeAngle: 20 * DEG }).wallMode, "longitudinal");
  assert.throws(() => clampOnPath({ ...base, wedgeAngle: 60 * DEG }), NoPhysicalAnswerError);
});
