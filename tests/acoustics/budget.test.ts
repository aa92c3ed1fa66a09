/**
 * Signal budget, Doppler shift and technique screening (lib/acoustics/budget.ts, doppler.ts).
 */
import { assert, closeAbs, closeRel } from "../_assert.ts";
import { InputError, OutOfRangeError, type Warning } from "../../lib/errors.ts";
import { clampOnPath } from "../../lib/acoustics/path.ts";
import { DEG, STEEL_V } from "./_fixture.ts";
import {
  intensityTransmission,
  signalBudget,
  waterAbsorption,
} from "../../lib/acoustics/budget.ts";
import { dopplerShift, techniqueScreening } from "../../lib/acoustics/doppler.ts";

Deno.test("Doppler shift via the wedge equals the shift via the liquid angle (Snell invariant)", () => {
  const p = clampOnPath(STEEL_V);
  const f = 1e6;
  const v = 1.7;
  const viaLiquid = 2 * f * v * Math.sin(p.fluidAngle) / 1482;
  closeRel(
    dopplerShift({ frequency: f, velocity: v, wedgeSoundSpeed: 2720, wedgeAngle: 38 * DEG }),
    viaLiquid,
    1e-14,
    "Δf",
  );
  assert.throws(
    () => dopplerShift({ frequency: 0, velocity: 1, wedgeSoundSpeed: 2720, wedgeAngle: 0.5 }),
    InputError,
  );
});

Deno.test("technique screening follows the stated thresholds", () => {
  assert.equal(techniqueScreening({}).favours, "transit-time");
  assert.equal(techniqueScreening({ solidsFraction: 0.001 }).favours, "either");
  assert.equal(techniqueScreening({ solidsFraction: 0.05 }).favours, "doppler");
  assert.equal(techniqueScreening({ gasFraction: 0.02 }).favours, "doppler");
  const t = techniqueScreening({ gasFraction: 0.02 });
  assert.equal(t.source, "common-practice");
  assert.ok(t.reasons.some((r) => r.includes("gas")));
  assert.throws(() => techniqueScreening({ gasFraction: 1.5 }), InputError);
});

Deno.test("interface transmission: symmetric, 1 when matched, energy conserved with reflection", () => {
  closeRel(intensityTransmission(1.5e6, 45e6), intensityTransmission(45e6, 1.5e6), 1e-15);
  assert.equal(intensityTransmission(3e6, 3e6), 1);
  const z1 = 3.2e6, z2 = 46e6;
  const R = ((z2 - z1) / (z2 + z1)) ** 2;
  closeAbs(intensityTransmission(z1, z2) + R, 1, 1e-15, "T + R = 1");
});

Deno.test("budget: total is the sum; lining and attenuation add loss; thresholds rate it", () => {
  const p = clampOnPath(STEEL_V);
  const media = {
    frequency: 1e6,
    temperature: 293.15,
    liquid: { density: 998 },
    wedge: { density: 1180 },
    wall: { density: 7850 },
  };
  const b = signalBudget(p, media);
  closeRel(b.totalDb, b.terms.reduce((a, t) => a + t.dB, 0), 1e-14, "sum");
  assert.ok(b.warnings.some((w) => w.code === "attenuation-unknown"));
  // Interface terms by hand: two interfaces each way for a bare pipe.
  const Tw = intensityTransmission(1180 * 2720, 7850 * 3230);
  const Tl = intensityTransmission(7850 * 3230, 998 * 1482);
  const iface = -20 * Math.log10(Tw) - 20 * Math.log10(Tl);
  closeRel(
    b.terms.filter((t) => t.name.includes("interface")).reduce((a, t) => a + t.dB, 0),
    iface,
    1e-12,
    "interfaces",
  );
  // Cement-mortar-like lining with strong attenuation pushes it over the weak threshold.
  const pl = clampOnPath({ ...STEEL_V, lining: { thickness: 0.008, soundSpeed: 4000 } });
  const bl = signalBudget(pl, {
    ...media,
    wall: { density: 7850 },
    lining: [{ density: 2200, attenuation: { value: 400, frequency: 1e6 } }],
  });
  assert.ok(bl.totalDb > b.totalDb + 50);
  assert.equal(bl.rating, "weak");
  assert.throws(() => signalBudget(pl, media), InputError); // lining media missing
});

Deno.test("water absorption range: refused outside 0–30 °C unless extrapolating", () => {
  assert.throws(() => waterAbsorption(1e6, 333.15), OutOfRangeError);
  const warnings: Warning[] = [];
  const a = waterAbsorption(1e6, 313.15, 101325, { extrapolate: true, warnings });
  // the range warning, and the note that the classical trend carries the value above 30 °C
  assert.ok(a > 0 && warnings.length === 2);
  assert.ok(warnings.some((w) => w.code === "extrapolated-absorption"));
  // where the cubic would go negative (near 75 °C), the extrapolation stays positive and falls
  const hot = waterAbsorption(1e6, 363.15, 2e5, { extrapolate: true });
  assert.ok(hot > 0 && hot < a);
  // α ∝ f²
  closeRel(waterAbsorption(2e6, 293.15), 4 * waterAbsorption(1e6, 293.15), 1e-14, "f²");
});
