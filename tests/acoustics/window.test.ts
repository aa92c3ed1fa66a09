/**
 * Search window and temperature drift (lib/acoustics/window.ts), against analytic derivatives
 * of the spacing formula.
 */
import { assert, closeAbs, closeRel } from "../_assert.ts";
import { InputError } from "../../lib/errors.ts";
import { clampOnPath } from "../../lib/acoustics/path.ts";
import { DEG, STEEL_V } from "./_fixture.ts";
import { searchWindow, spacingOverTemperature } from "../../lib/acoustics/window.ts";

Deno.test("wall-thickness contribution equals the analytic 2·tanθ_w − 2·N·tanθ_f (linear in t)", () => {
  for (const n of [1, 2, 4]) {
    const p = clampOnPath({ ...STEEL_V, traverses: n });
    const u = 0.0006;
    const w = searchWindow({ ...STEEL_V, traverses: n }, { wallThickness: u });
    const c = w.contributions[0];
    const analytic = (2 * Math.tan(p.wallAngle) - 2 * n * Math.tan(p.fluidAngle)) * u;
    closeRel(c.contribution, analytic, 1e-9, `N = ${n}`);
    assert.equal(c.ifHigher, analytic > 0 ? "further" : "closer");
  }
});

Deno.test("liquid-speed contribution ≈ N·D·sec²θ_f·tanθ_f / c_f · u (analytic derivative)", () => {
  const p = clampOnPath(STEEL_V);
  const u = 1; // small: the secant equals the derivative to ~1e-6
  const w = searchWindow(STEEL_V, { fluidSoundSpeed: u });
  const tf = Math.tan(p.fluidAngle);
  const dSdc = 2 * p.boreDiameter * (1 + tf * tf) * tf / 1482;
  closeRel(w.contributions[0].contribution, dSdc * u, 1e-5, "dS/dc");
  assert.equal(w.contributions[0].ifHigher, "further");
});

Deno.test("wedge speed: faster wedge → smaller invariant → closer; warmer acrylic → further", () => {
  const w = searchWindow(STEEL_V, {
    wedgeSoundSpeed: 20,
    wedgeTemperature: { uncertainty: 5, dSoundSpeedDT: -2.5 },
  });
  const ws = w.contributions.find((c) => c.input === "wedgeSoundSpeed")!;
  const wt = w.contributions.find((c) => c.input === "wedgeTemperature")!;
  assert.equal(ws.ifHigher, "closer");
  assert.equal(wt.ifHigher, "further");
  // 5 K at −2.5 m/s/K is 12.5 m/s of wedge speed: scaled by 12.5/20, sign flipped.
  closeRel(-wt.contribution, ws.contribution * 12.5 / 20, 2e-3, "temperature as speed");
});

Deno.test("combination: worst case is Σ|c|, root-sum-square √Σc², sorted largest first", () => {
  const w = searchWindow(STEEL_V, {
    fluidSoundSpeed: 10,
    wallThickness: 0.0006,
    wallShearSpeed: 50,
    wedgeAngle: 0.5 * DEG,
  });
  const cs = w.contributions.map((c) => c.contribution);
  closeRel(w.worstCase, cs.reduce((a, b) => a + Math.abs(b), 0), 1e-14, "worst");
  closeRel(w.rss, Math.sqrt(cs.reduce((a, b) => a + b * b, 0)), 1e-14, "rss");
  for (let i = 1; i < cs.length; i++) assert.ok(Math.abs(cs[i - 1]) >= Math.abs(cs[i]));
  closeAbs(w.range.max - w.range.min, 2 * w.worstCase, 1e-15, "range");
});

Deno.test("near a critical angle the secant goes one-sided and says so", () => {
  // Wedge angle just under the second critical angle: +u crosses it.
  const a = Math.asin(2720 / 3230) - 0.2 * DEG;
  const w = searchWindow({ ...STEEL_V, wedgeAngle: a }, { wedgeAngle: 0.5 * DEG });
  assert.ok(w.contributions[0].note?.includes("one-sided"));
});

Deno.test("bad uncertainties are refused", () => {
  assert.throws(() => searchWindow(STEEL_V, { fluidSoundSpeed: -1 }), InputError);
  assert.throws(
    () => searchWindow(STEEL_V, { colour: 1 } as unknown as Record<string, number>),
    InputError,
  );
});

Deno.test("spacing over temperature equals clampOnPath at each temperature", () => {
  const cf = (T: number) => 1482 + 2.4 * (T - 293.15);
  const r = spacingOverTemperature(
    { ...STEEL_V },
    {
      temperatures: [278.15, 293.15, 333.15],
      fluidSoundSpeed: cf,
      wedge: { soundSpeed: 2720, dSoundSpeedDT: -2.5, referenceTemperature: 293.15 },
    },
  );
  for (const row of r.rows) {
    const cw = 2720 - 2.5 * (row.temperature - 293.15);
    const p = clampOnPath({
      ...STEEL_V,
      fluidSoundSpeed: cf(row.temperature),
      wedgeSoundSpeed: cw,
    });
    closeRel(row.spacing, p.spacing, 1e-15, `${row.temperature} K`);
    closeRel(row.totalTime, p.totalTime, 1e-15, "time");
  }
  closeRel(r.spacingSpan, r.rows[2].spacing - r.rows[0].spacing, 1e-14, "span");
  assert.throws(
    () =>
      spacingOverTemperature(STEEL_V, {
        temperatures: [],
        fluidSoundSpeed: cf,
        wedge: { soundSpeed: 2720, dSoundSpeedDT: -2.5, referenceTemperature: 293.15 },
      }),
    InputError,
  );
  assert.throws(
    () =>
      spacingOverTemperature(STEEL_V, {
        temperatures: [300],
        fluidSoundSpeed: () => NaN,
        wedge: { soundSpeed: 2720, dSoundSpeedDT: -2.5, referenceTemperature: 293.15 },
      }),
    InputError,
  );
});
