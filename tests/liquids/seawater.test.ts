import { assert, closeRel, throws } from "../_assert.ts";
import { InputError, OutOfRangeError, type Warning } from "../../lib/errors.ts";
import { seawater, seawaterTrace } from "../../lib/liquids/mod.ts";

Deno.test("seawater: ranges enforced, extrapolation warns", () => {
  throws(() => seawater.soundSpeed(35, 273.15 + 45), OutOfRangeError);
  throws(() => seawater.soundSpeed(50, 283.15), OutOfRangeError);
  throws(() => seawater.soundSpeed(35, 283.15, 101325 + 90e6), OutOfRangeError);
  throws(() => seawater.soundSpeed(-1, 283.15), InputError);
  throws(() => seawater.soundSpeed(35, 283.15, 101325, "nope" as never), InputError);
  const warnings: Warning[] = [];
  const c = seawater.soundSpeed(35, 273.15 + 42, 101325, "teos10", { extrapolate: true, warnings });
  assert.ok(Number.isFinite(c) && warnings.length > 0);
});

Deno.test("seawater: physical invariants over the validity range", () => {
  for (const S of [0, 10, 35, 41]) {
    for (let t = -2; t <= 40; t += 3) {
      const T = 273.15 + t;
      const c0 = seawater.soundSpeed(S, T);
      const c1 = seawater.soundSpeed(S, T, 101325 + 10e6);
      assert.ok(c0 > 1380 && c0 < 1600, `c ${c0}`);
      assert.ok(c1 > c0, "sound speed rises with pressure");
      if (S > 0) assert.ok(c0 > seawater.soundSpeed(0, T), "salt raises the sound speed");
      const rho = seawater.density(S, T);
      assert.ok(rho > 990 && rho < 1035, `rho ${rho}`);
    }
  }
});

Deno.test("seawater: zero salinity approaches pure water (IAPWS-95 via lib/water)", async () => {
  const { water } = await import("../../lib/water/mod.ts");
  // The 75-term fit is weighted to ocean salinities; at S = 0 it stays within ~0.15 m/s of
  // IAPWS-95 (measured worst 8.4e-5 relative at 1 °C when written).
  for (const t of [1, 10, 20, 30]) {
    closeRel(seawater.soundSpeed(0, 273.15 + t), water.soundSpeed(273.15 + t), 1.5e-4, `t ${t}`);
  }
});

Deno.test("seawater: viscosity ratio and trace", () => {
  const mu = seawater.viscosityFromWater(35, 293.15, 1e-3);
  assert.ok(mu > 1.05e-3 && mu < 1.11e-3, String(mu));
  assert.ok(seawaterTrace("unesco1983").some((t) => t.source === "fofonoff-millard-1983"));
});
