/**
 * Independent derivations for transit times, the inverse, flow range, resolution and the
 * wall-borne check (lib/acoustics/transit.ts).
 */
import fc from "fast-check";
import { assert, closeAbs, closeRel } from "../_assert.ts";
import { InputError, NoPhysicalAnswerError } from "../../lib/errors.ts";
import { type ClampOnInputs, clampOnPath } from "../../lib/acoustics/path.ts";
import { STEEL_V as STEEL_V_BARE } from "./_fixture.ts";
import {
  flowRangeTimes,
  minimumResolvableVelocity,
  pathVelocity,
  transitTimes,
  wallBorneSignal,
} from "../../lib/acoustics/transit.ts";

const STEEL_V: ClampOnInputs = { ...STEEL_V_BARE, wedge: { elementHeight: 0.012 } };
const P = clampOnPath(STEEL_V);

Deno.test("exact and linearised Δt agree to second order: ratio error = (v·sinθ/c)²/(1 − …)", () => {
  const s = Math.sin(P.fluidAngle);
  let prev = 0;
  for (const v of [0.5, 1, 2, 4, 8]) {
    const t = transitTimes(P, v);
    const m = v * s / P.fluidSoundSpeed;
    const err = t.deltaT / t.deltaTLinear - 1;
    closeRel(err, m * m / (1 - m * m), 1e-6, `v = ${v}`);
    if (prev > 0) closeRel(err / prev, 4, 1e-3, "doubling v quadruples the error");
    prev = err;
  }
});

Deno.test("reciprocity: upstream at v is downstream at −v; Δt is odd in v", () => {
  fc.assert(fc.property(fc.double({ min: -20, max: 20, noNaN: true }), (v) => {
    const a = transitTimes(P, v);
    const b = transitTimes(P, -v);
    closeRel(a.upstream, b.downstream, 1e-15, "up/down");
    closeAbs(a.deltaT, -b.deltaT, 1e-22, "odd");
    closeRel(a.meanTime, b.meanTime, 1e-15, "mean");
  }));
  const z = transitTimes(P, 0);
  assert.equal(z.deltaT, 0);
  closeRel(z.upstream, P.totalTime, 1e-15, "zero flow arrival");
});

Deno.test("direct time of flight: L/(c ∓ v sinθ) summed with layer times", () => {
  const v = 3;
  const t = transitTimes(P, v);
  const c = 1482;
  const L = P.fluidPathLength;
  const s = Math.sin(P.fluidAngle);
  const fixed = P.wallTime + P.wedgeTime!;
  closeRel(t.upstream, fixed + L / (c - v * s), 1e-15, "up");
  closeRel(t.downstream, fixed + L / (c + v * s), 1e-15, "down");
});

Deno.test("inverse recovers the velocity; all forms agree; the implied sound speed is c", () => {
  fc.assert(fc.property(fc.double({ min: -15, max: 15, noNaN: true }), (v) => {
    const t = transitTimes(P, v);
    const r = pathVelocity(P, t.upstream, t.downstream);
    closeAbs(r.velocity, v, 1e-9 * Math.max(1, Math.abs(v)), "exact");
    closeAbs(r.snellInvariant.velocity, v, 1e-9 * Math.max(1, Math.abs(v)), "Snell invariant");
    const m = v * Math.sin(P.fluidAngle) / 1482;
    // The sound-speed form is linearised: relative error (v sinθ/c)².
    closeAbs(r.soundSpeedForm.velocity, v, Math.abs(v) * (m * m * 1.01 + 1e-9) + 1e-12, "c form");
    closeRel(r.impliedSoundSpeed, 1482, 1e-9, "implied c");
  }));
});

Deno.test("Snell-invariant form does not use the liquid sound speed", () => {
  // Same liquid times, path recomputed for another liquid speed: the invariant form's inputs
  // (Δt, τ̄, c_w, θ_w) do not contain c_f, so its value must not change.
  const t = transitTimes(P, 2);
  const r1 = pathVelocity(P, t.upstream, t.downstream);
  const P2 = { ...P, fluidSoundSpeed: 1300 };
  const r2 = pathVelocity(P2, t.upstream, t.downstream);
  closeRel(r2.snellInvariant.velocity, r1.snellInvariant.velocity, 1e-15, "invariant");
  assert.ok(Math.abs(r2.soundSpeedForm.velocity / r1.soundSpeedForm.velocity - 1) > 0.1);
});

Deno.test("sensitivity coefficients match finite differences of the forms", () => {
  const v = 2;
  const t = transitTimes(P, v);
  const r = pathVelocity(P, t.upstream, t.downstream);
  const h = 1e-6;
  // wedge angle in the Snell-invariant form: v ∝ 1/sinθ_w.
  const vi = (aw: number) => P.wedgeSoundSpeed / (2 * Math.sin(aw));
  const dNum = (Math.log(vi(P.wedgeAngle * (1 + h))) - Math.log(vi(P.wedgeAngle * (1 - h)))) /
    (2 * h);
  closeRel(r.snellInvariant.sensitivity.wedgeAngle, dNum, 1e-6, "θ_w");
  // liquid sound speed in the c form with θ_f from Snell: v ∝ c²/tanθ_f(c).
  const vc = (c: number) => {
    const sf = Math.sin(P.wedgeAngle) / P.wedgeSoundSpeed * c;
    return c * c / Math.tan(Math.asin(sf));
  };
  const dc = (Math.log(vc(1482 * (1 + h))) - Math.log(vc(1482 * (1 - h)))) / (2 * h);
  closeRel(r.soundSpeedForm.sensitivity.fluidSoundSpeed, dc, 1e-6, "c_f");
  const vw = (cw: number) => {
    const sf = Math.sin(P.wedgeAngle) / cw * 1482;
    return 1 / Math.tan(Math.asin(sf));
  };
  const dw = (Math.log(vw(2720 * (1 + h))) - Math.log(vw(2720 * (1 - h)))) / (2 * h);
  closeRel(r.soundSpeedForm.sensitivity.wedgeSoundSpeed, dw, 1e-6, "c_w");
});

Deno.test("pathVelocity refuses times shorter than the fixed time", () => {
  assert.throws(() => pathVelocity(P, P.wallTime / 2, P.totalTime), InputError);
  assert.throws(() => pathVelocity(P, NaN, P.totalTime), InputError);
});

Deno.test("beam-wise velocity at the sound speed has no answer", () => {
  assert.throws(() => transitTimes(P, 1482 / Math.sin(P.fluidAngle)), NoPhysicalAnswerError);
  assert.throws(() => transitTimes(P, NaN), InputError);
});

Deno.test("flow range: Q = V·A, path velocity = V/k, min/design/max by |Δt|", () => {
  const A = Math.PI * P.boreDiameter ** 2 / 4;
  const r = flowRangeTimes(P, {
    flowRates: [0.04, 0.002, 0.02],
    profileFactor: 0.93,
    timingOffset: 1e-10,
  });
  closeRel(r.area, A, 1e-15, "area");
  closeRel(r.points[0].areaVelocity, 0.04 / A, 1e-14, "V");
  closeRel(r.points[0].velocity, 0.04 / A / 0.93, 1e-14, "v path");
  assert.equal(r.minimum.flowRate, r.points[1].flowRate);
  assert.equal(r.design.flowRate, r.points[2].flowRate);
  assert.equal(r.maximum.flowRate, r.points[0].flowRate);
  closeRel(r.offsetFraction!, 1e-10 / r.minimum.deltaT, 1e-14, "fraction");
  const rv = flowRangeTimes(P, { velocities: [1], insideDiameter: 0.1 });
  closeRel(rv.points[0].flowRate, Math.PI * 0.01 / 4, 1e-14, "Q from V");
  assert.throws(() => flowRangeTimes(P, { flowRates: [] }), InputError);
  assert.throws(() => flowRangeTimes(P, { flowRates: [1], profileFactor: 0 }), InputError);
  assert.throws(() => flowRangeTimes(P, { flowRates: [NaN] }), InputError);
});

Deno.test("minimum resolvable velocity: Δt at it equals the offset; ≈ δt·c²/(2L sinθ)", () => {
  for (const d of [1e-12, 1e-10, 1e-8]) {
    const v = minimumResolvableVelocity(P, d);
    closeRel(transitTimes(P, v).deltaT, d, 1e-9, `δt = ${d}`);
    closeRel(v, d * 1482 ** 2 / (2 * P.fluidPathLength * Math.sin(P.fluidAngle)), 1e-4, "lin");
  }
  assert.throws(() => minimumResolvableVelocity(P, 0), InputError);
});

Deno.test("wall-borne signal: arrival over the spacing at the wall's fastest speed", () => {
  const w = wallBorneSignal(P, { frequency: 1e6 });
  closeRel(w.wallArrival, P.wedgeTime! + P.spacing / 5920, 1e-15, "wall arrival");
  closeRel(w.margin, 3e-6, 1e-15, "3 periods");
  assert.equal(w.overlaps, false);
  // A tiny pipe with a fast liquid and a low frequency: the two arrivals come within the margin.
  const small = clampOnPath({
    ...STEEL_V,
    outsideDiameter: 0.02,
    wallThickness: 0.002,
    traverses: 1,
  });
  const ws = wallBorneSignal(small, { frequency: 2e5, periods: 3 });
  assert.ok(ws.overlaps, `separation ${ws.separation}, margin ${ws.margin}`);
  assert.throws(() => wallBorneSignal(P, { frequency: 0 }), InputError);
});
