/**
 * Behaviour of the water room: validity ranges, the boiling refusal, extrapolation warnings,
 * round trips of the density solve, and consistency of code ranges with data/water/*.yaml.
 */
import fc from "fast-check";
import { assert, closeRel, throws } from "../_assert.ts";
import {
  InputError,
  NoPhysicalAnswerError,
  OutOfRangeError,
  type Warning,
} from "../../lib/errors.ts";
import { parseQuantity } from "../../lib/units.ts";
import { registry } from "../../lib/registry/mod.ts";
import {
  iapws95Density,
  iapws95State,
  if97Region1,
  water,
  waterTrace,
} from "../../lib/water/mod.ts";

Deno.test("below saturation pressure: NoPhysicalAnswerError with the boiling message", () => {
  throws(() => water.soundSpeed(373.15 + 50, 101325), (e: unknown) => {
    assert.ok(e instanceof NoPhysicalAnswerError);
    assert.equal(e.exitCode, 1);
    assert.match(e.message, /^water boils at this pressure: saturation pressure is .* at .*/);
    assert.match(e.message, /kPa/);
    assert.match(e.message, /bar/);
    assert.match(e.message, /°C/);
    return true;
  });
  for (const f of ["iapws95", "if97"] as const) {
    throws(() => water.density(400, 2e5, f), NoPhysicalAnswerError);
  }
  throws(() => water.viscosity(400, 2e5), NoPhysicalAnswerError);
  throws(() => iapws95Density(400, 2e5), NoPhysicalAnswerError);
  throws(() => if97Region1(400, 2e5), NoPhysicalAnswerError);
  // just above the saturation pressure is liquid
  const ps = water.saturationPressure(400);
  assert.ok(water.density(400, ps * 1.001) > 900);
});

Deno.test("below freezing: OutOfRangeError; extrapolate pushes a warning instead", () => {
  for (const f of ["iapws95", "if97", "del-grosso-mader", "marczak"] as const) {
    throws(() => water.soundSpeed(270, 101325, f), OutOfRangeError);
  }
  const warnings: Warning[] = [];
  const w = water.soundSpeed(271.15, 101325, "iapws95", { extrapolate: true, warnings });
  assert.ok(Number.isFinite(w) && w > 1380 && w < 1402, String(w));
  assert.equal(warnings.length, 1);
  assert.equal(warnings[0].code, "extrapolated");
});

Deno.test("pressure limits: above 100 MPa refused; polynomials only near 1 atm", () => {
  throws(() => water.soundSpeed(300, 150e6), OutOfRangeError);
  throws(() => water.soundSpeed(300, 1e6, "marczak"), (e: unknown) => {
    assert.ok(e instanceof OutOfRangeError);
    assert.equal(e.quantity, "pressure");
    assert.equal(e.formulation, "Marczak 1997");
    return true;
  });
});

Deno.test("bad inputs: unknown formulation, NaN, density from a sound-speed polynomial", () => {
  // deno-lint-ignore no-explicit-any
  throws(() => water.soundSpeed(300, 101325, "steam-tables" as any), InputError);
  throws(() => water.soundSpeed(Number.NaN), InputError);
  throws(() => water.density(300, Number.POSITIVE_INFINITY), InputError);
  throws(() => water.density(300, 101325, "marczak"), InputError);
});

Deno.test("IAPWS-95 density solve: p(T, rho(T, p)) = p and w is finite over the liquid range", () => {
  fc.assert(
    fc.property(
      fc.double({ min: 273.15, max: 640, noNaN: true }),
      fc.double({ min: 0, max: 1, noNaN: true }),
      (T, u) => {
        const ps = water.saturationPressure(T);
        const p = ps * 1.0001 + u * (100e6 - ps * 1.0001);
        const rho = iapws95Density(T, p);
        const st = iapws95State(T, rho);
        // density error implied by the pressure residual: Δρ/ρ = Δp / (ρ·(∂p/∂ρ)_T),
        // (∂p/∂ρ)_T = w²·cv/cp (a thermodynamic identity)
        const dpdrho = st.w * st.w * st.cv / st.cp;
        const relRho = Math.abs(st.p - p) / (rho * dpdrho);
        assert.ok(relRho < 1e-12, `density residual ${relRho} at ${T} K, ${p} Pa`);
        assert.ok(Number.isFinite(st.w) && st.w > 200 && st.w < 2500, `w ${st.w}`);
        assert.ok(st.cp > st.cv, "cp > cv");
      },
    ),
    { numRuns: 300 },
  );
});

Deno.test("viscosity: kinematic = dynamic / density; water at 20 °C near 1.0 mPa·s", () => {
  const T = 293.15, p = 2e5;
  closeRel(water.kinematicViscosity(T, p), water.viscosity(T, p) / water.density(T, p), 1e-14);
  // recalled handbook value: 1.0016 mPa·s at 20 °C, 1 atm
  closeRel(water.viscosity(T), 1.0016e-3, 5e-4, "20 °C");
});

Deno.test("code validity ranges match the validity recorded in data/water/*.yaml", () => {
  const K = (s: string) => parseQuantity(s, "temperature", "validity");
  const byId = new Map(water.formulations.map((f) => [f.id as string, f]));
  for (
    const [id, set] of [["if97", "water-if97-region1"], ["marczak", "water-marczak-1997"], [
      "del-grosso-mader",
      "water-del-grosso-mader-1972",
    ]]
  ) {
    const v = registry.coefficients(set).validity.temperature;
    const f = byId.get(id)!;
    closeRel(f.temperature[0], K(v.min), 1e-12, `${id} min`);
    closeRel(f.temperature[1], K(v.max), 1e-12, `${id} max`);
    assert.equal(f.coefficients, set);
    assert.equal(registry.coefficients(set).source, f.source);
    assert.equal(registry.coefficients(set).basis, f.basis);
  }
});

Deno.test("waterTrace names formulation, source and basis", () => {
  const t = waterTrace("iapws95");
  assert.equal(t[0].source, "iapws-r6-95");
  assert.equal(t[0].basis, "transcribed");
  assert.ok(registry.source(t[0].source));
  for (const s of ["if97", "del-grosso-mader", "marczak", "viscosity", "saturation"] as const) {
    for (const e of waterTrace(s)) assert.ok(registry.source(e.source), e.source);
  }
  assert.equal(waterTrace("marczak")[0].basis, "transcribed");
});
