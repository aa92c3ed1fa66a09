/**
 * Outside checks of the profile factor: closed forms of textbook profiles and the
 * Nikuradse/Schlichting exponent table.
 */
import { assert, closeRel } from "../_assert.ts";
import {
  chordMeanVelocity,
  chordWeights,
  powerLawExponent,
  profileFactor,
  profileShape,
} from "../../lib/flow/mod.ts";

Deno.test("laminar profile factor is 3/4 exactly (Hagen–Poiseuille: mean/centre 1/2, diameter mean/centre 2/3)", () => {
  for (const re of [1, 100, 1999]) assert.equal(profileFactor(re), 0.75);
  assert.equal(profileFactor(5e4, { model: "laminar" }), 0.75);
});

Deno.test("power law n = 7 gives 14/15 (textbook closed form 2n/(2n+1))", () => {
  // Schlichting's table gives n = 7.0 at Re = 1.1e5 (schlichting-1979, recalled)
  closeRel(profileFactor(1.1e5), 14 / 15, 1e-14, "n=7");
});

Deno.test("Nikuradse/Schlichting n–Re points reproduced (schlichting-1979, values recalled)", () => {
  // The points as listed independently here (recalled from Schlichting's table):
  const points: [number, number][] = [
    [4.0e3, 6.0],
    [2.3e4, 6.6],
    [1.1e5, 7.0],
    [1.1e6, 8.8],
    [2.0e6, 10.0],
    [3.2e6, 10.0],
  ];
  for (const [re, n] of points) closeRel(powerLawExponent(re), n, 1e-12, `n at ${re}`);
  // between two points, interpolation in ln Re stays between them
  const mid = powerLawExponent(Math.sqrt(2.3e4 * 1.1e5));
  closeRel(mid, 6.8, 1e-12, "log-midpoint");
  assert.throws(() => powerLawExponent(5e6), /outside the validity range/);
});

Deno.test("off-centre chord of the laminar profile: closed form 3/(4(1 − h²))", () => {
  // laminar chord mean (4/3)(1 − h²) follows from integrating 2(1 − r²) along the chord
  for (const h of [0.1, 0.5, 0.9]) {
    closeRel(profileFactor(500, { chord: h }), 3 / (4 * (1 - h * h)), 1e-14, `h=${h}`);
  }
});

Deno.test("Gauss–Jacobi chords integrate the laminar profile exactly (2 to 5 paths)", () => {
  const lam = profileShape(100);
  for (let n = 2; n <= 5; n++) {
    const { positions, weights } = chordWeights(n, "gauss-jacobi");
    let v = 0;
    positions.forEach((h, i) => v += weights[i] * chordMeanVelocity(lam, Math.abs(h)));
    closeRel(v, 1, 1e-14, `${n} paths`);
  }
});

Deno.test("Gauss–Jacobi 4 chords recover the area mean of turbulent profiles within 0.5 %", () => {
  // a common-practice expectation of multi-path integration with 4 chords
  for (const model of ["power-law-nikuradse", "log-law"] as const) {
    const s = profileShape(1e5, { model });
    const { positions, weights } = chordWeights(4, "gauss-jacobi");
    let v = 0;
    positions.forEach((h, i) => v += weights[i] * chordMeanVelocity(s, Math.abs(h)));
    closeRel(v, 1, 5e-3, model);
  }
});
