import { assert, throws } from "../_assert.ts";
import {
  NoPhysicalAnswerError,
  NotFoundError,
  OutOfRangeError,
  type Warning,
} from "../../lib/errors.ts";
import { liquidProperties, liquids, waltherViscosity } from "../../lib/liquids/mod.ts";

Deno.test("liquidProperties: every liquid positive and finite over its validity range", () => {
  for (const l of liquids()) {
    const [lo, hi] = l.temperatureRange;
    const top = Math.min(hi, 373.15);
    for (let k = 0; k <= 8; k++) {
      const T = lo + (top - lo) * k / 8;
      const p = l.id === "ammonia" ? 3e6 : l.id === "water" ? 2e5 : 101325 * 3;
      let s;
      try {
        s = liquidProperties(l.id, T, p, l.id === "seawater" ? { salinity: 35 } : {});
      } catch (e) {
        if (e instanceof NoPhysicalAnswerError) continue; // boils (volatile liquids near the top)
        throw e;
      }
      for (const x of [s.soundSpeed, s.density, s.dynamicViscosity, s.kinematicViscosity]) {
        assert.ok(Number.isFinite(x) && x > 0, `${l.id} at ${T}: ${x}`);
      }
      assert.ok(s.soundSpeed > 800 && s.soundSpeed < 2100, `${l.id} c ${s.soundSpeed}`);
      assert.ok(s.density > 500 && s.density < 1400, `${l.id} rho ${s.density}`);
      assert.ok(s.soundSpeedSpread >= 0 && Number.isFinite(s.soundSpeedSpread));
      assert.ok(s.trace.length > 0);
    }
  }
});

Deno.test("liquidProperties: viscosity falls with temperature (all but none)", () => {
  for (const l of liquids()) {
    if (l.id === "seawater" || l.id === "water") continue;
    const [lo, hi] = l.temperatureRange;
    const p = l.id === "ammonia" ? 3e6 : 101325;
    const a = liquidProperties(l.id, lo, p).dynamicViscosity;
    const b = liquidProperties(l.id, Math.min(hi, lo + 30), p).dynamicViscosity;
    assert.ok(b < a, `${l.id}: ${a} -> ${b}`);
  }
});

Deno.test("liquidProperties: errors", () => {
  throws(() => liquidProperties("metanol", 293.15), (e: unknown) => {
    return e instanceof NotFoundError && e.nearby.includes("methanol");
  });
  throws(() => liquidProperties("seawater", 293.15), /salinity/);
  throws(() => liquidProperties("glycerol", 473.15), OutOfRangeError);
  throws(() => liquidProperties("ammonia", 293.15), NoPhysicalAnswerError); // boils at 1 atm
  throws(() => liquidProperties("acetone", 318.15, 50e3), NoPhysicalAnswerError); // psat(45 °C) ≈ 68 kPa
  throws(() => liquidProperties("water", 393.15), NoPhysicalAnswerError);
  throws(
    () => liquidProperties("methanol", 293.15, 101325, { formulation: "if97" }),
    /formulation/,
  );
  const warnings: Warning[] = [];
  const s = liquidProperties("glycerol", 383.15, 101325, { extrapolate: true, warnings });
  assert.ok(warnings.length === 1 && s.warnings.length === 1);
});

Deno.test("liquidProperties: pressure raises sound speed and density", () => {
  const a = liquidProperties("toluene", 293.15, 1e5);
  const b = liquidProperties("toluene", 293.15, 5e6);
  assert.ok(b.soundSpeed > a.soundSpeed && b.density > a.density);
});

// Source: ASTM D341 (Walther) reproduces both anchor points exactly by construction; check the
// interpolation is monotonic and passes through them.
Deno.test("Walther equation passes through its two points", () => {
  const pts: [number, number][] = [[40, 46], [100, 6.8]];
  assert.ok(Math.abs(waltherViscosity(pts, 313.15) - 46e-6) < 1e-10);
  assert.ok(Math.abs(waltherViscosity(pts, 373.15) - 6.8e-6) < 1e-10);
  assert.ok(waltherViscosity(pts, 333.15) < 46e-6 && waltherViscosity(pts, 333.15) > 6.8e-6);
});
