/**
 * Property-based tests of lib/water (fast-check, seeded) over 0–100 °C × 0.1–10 MPa: finite
 * positive results on the liquid side of saturation, a NoPhysicalAnswerError below it, density
 * and sound speed rising with pressure, viscosity falling with temperature, the 1-atm
 * polynomials close to IAPWS-95; and any double, in or out of range, extrapolated or not, gives
 * a finite value or a named error.
 */
import fc from "fast-check";
import { assert } from "../_assert.ts";
import { NoPhysicalAnswerError } from "../../lib/errors.ts";
import {
  waterDensity,
  type WaterFormulation,
  waterKinematicViscosity,
  waterSaturationPressure,
  waterSoundSpeed,
  waterViscosity,
} from "../../lib/water/mod.ts";
import { outcome, RUNS, Tally } from "./_check.ts";

const T_LO = 273.15, T_HI = 373.15;
const P_LO = 0.1e6, P_HI = 10e6;
const temperature = fc.double({ min: T_LO, max: T_HI, noNaN: true });
const pressure = fc.double({ min: P_LO, max: P_HI, noNaN: true });
const STATE_FORMS: readonly WaterFormulation[] = ["iapws95", "if97"];

Deno.test("water property: 0–100 °C × 0.1–10 MPa gives finite positive values, or boils", () => {
  const tally = new Tally();
  fc.assert(
    fc.property(fc.constantFrom(...STATE_FORMS), temperature, pressure, (f, T, p) => {
      const liquid = p > waterSaturationPressure(T);
      for (
        const [what, call] of [
          ["soundSpeed", () => waterSoundSpeed(T, p, f)],
          ["density", () => waterDensity(T, p, f)],
          ["viscosity", () => waterViscosity(T, p)],
          ["kinematicViscosity", () => waterKinematicViscosity(T, p)],
        ] as const
      ) {
        const o = tally.add(outcome(`${what}(${T}, ${p}, ${f})`, call));
        if (o.ok) {
          assert.ok(liquid, `${what} at ${T} K, ${p} Pa: a value below the saturation pressure`);
          assert.ok(o.value > 0, `${what} ${o.value} not positive`);
        } else {
          assert.ok(!liquid, `${what} at ${T} K, ${p} Pa refused: ${o.error.message}`);
          assert.ok(o.error instanceof NoPhysicalAnswerError, o.error.name);
        }
      }
    }),
    RUNS,
  );
  console.log(tally.line("water in range"));
});

Deno.test("water property: density and sound speed rise with pressure (liquid water)", () => {
  // Liquid water's isothermal compressibility and dc/dp are positive over 0–100 °C up to
  // 10 MPa (IAPWS-95 release, tables of properties along isobars; recalled).
  fc.assert(
    fc.property(
      fc.constantFrom(...STATE_FORMS),
      temperature,
      pressure,
      fc.double({ min: 10e3, max: P_HI, noNaN: true }),
      (f, T, p1, dp) => {
        const p2 = Math.min(p1 + dp, P_HI);
        if (!(p2 - p1 >= 10e3) || !(p1 > waterSaturationPressure(T))) return;
        const c1 = waterSoundSpeed(T, p1, f), c2 = waterSoundSpeed(T, p2, f);
        const r1 = waterDensity(T, p1, f), r2 = waterDensity(T, p2, f);
        assert.ok(c2 > c1, `${f} c(${T} K): ${c1} at ${p1} Pa, ${c2} at ${p2} Pa`);
        assert.ok(r2 > r1, `${f} rho(${T} K): ${r1} at ${p1} Pa, ${r2} at ${p2} Pa`);
      },
    ),
    RUNS,
  );
});

Deno.test("water property: viscosity falls as liquid water warms (fixed pressure)", () => {
  // Liquid water's viscosity decreases monotonically with temperature from 0 to 100 °C
  // (IAPWS R12-08, table of the viscosity; recalled).
  fc.assert(
    fc.property(
      temperature,
      fc.double({ min: 0.05, max: 100, noNaN: true }),
      pressure,
      (T1, dT, p) => {
        const T2 = Math.min(T1 + dT, T_HI);
        if (!(T2 - T1 >= 0.05) || !(p > waterSaturationPressure(T2))) return;
        const m1 = waterViscosity(T1, p), m2 = waterViscosity(T2, p);
        assert.ok(m2 < m1, `mu(${p} Pa): ${m1} at ${T1} K, ${m2} at ${T2} K`);
      },
    ),
    RUNS,
  );
});

Deno.test("water property: the 1-atm polynomials stay within 0.15 m/s of IAPWS-95 (0–95 °C)", () => {
  // Del Grosso & Mader (1972) and Marczak (1997) against IAPWS-95 (R6-95): three independent
  // published formulations; the polynomials' own stated agreement is about 0.05–0.1 m/s, the
  // bound here leaves room for their recalled coefficients.
  let worst = 0;
  fc.assert(
    fc.property(
      fc.constantFrom<WaterFormulation>("del-grosso-mader", "marczak"),
      fc.double({ min: 273.15, max: 368.15, noNaN: true }),
      (f, T) => {
        const ref = waterSoundSpeed(T, 101325, "iapws95");
        const c = waterSoundSpeed(T, 101325, f);
        worst = Math.max(worst, Math.abs(c - ref));
        assert.ok(Math.abs(c - ref) <= 0.15, `${f} at ${T} K: ${c} vs IAPWS-95 ${ref}`);
      },
    ),
    RUNS,
  );
  console.log(`polynomials vs IAPWS-95: worst ${worst.toFixed(3)} m/s`);
});

Deno.test("water property: any double, any formulation, with or without extrapolation", () => {
  const tally = new Tally();
  const anyT = fc.oneof(
    fc.double(),
    fc.double({ min: 200, max: 700, noNaN: true }),
    fc.constantFrom(0, -273.15, 647.096, 1e308, Number.MIN_VALUE),
  );
  const anyP = fc.oneof(
    fc.double(),
    fc.double({ min: -1e6, max: 2e8, noNaN: true }),
    fc.constantFrom(0, -0, 611.655, 22.064e6, 1e308),
  );
  const form = fc.constantFrom<string>(
    "iapws95",
    "if97",
    "del-grosso-mader",
    "marczak",
    "IAPWS95",
    "",
    "__proto__",
    "constructor",
  );
  fc.assert(
    fc.property(form, anyT, anyP, fc.boolean(), (f, T, p, extrapolate) => {
      const opts = { extrapolate, warnings: [] };
      const wf = f as WaterFormulation;
      tally.add(outcome(`soundSpeed(${T}, ${p}, ${f})`, () => waterSoundSpeed(T, p, wf, opts)));
      tally.add(outcome(`density(${T}, ${p}, ${f})`, () => waterDensity(T, p, wf, opts)));
      tally.add(outcome(`viscosity(${T}, ${p})`, () => waterViscosity(T, p, opts)));
    }),
    RUNS,
  );
  console.log(tally.line("water over any double"));
  assert.ok(tally.ok > 0 && tally.refusals > 0);
});
