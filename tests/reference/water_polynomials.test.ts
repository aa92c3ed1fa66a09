/**
 * Del Grosso–Mader (1972) and Marczak (1997) against IAPWS-95 at 1 atm, and the saturation
 * pressure against Debian python3-iapws. The polynomial coefficients are transcribed from public
 * copies (tests/reference/props_copies.test.ts); these checks confirm them numerically.
 */
import { assert, closeRel, throws } from "../_assert.ts";
import { debianVersion, hasPython, runPython } from "../_python.ts";
import { OutOfRangeError } from "../../lib/errors.ts";
import { delGrossoMaderSoundSpeed, marczakSoundSpeed, water } from "../../lib/water/mod.ts";

Deno.test("Del Grosso–Mader and Marczak agree with IAPWS-95 within 0.07 m/s, 0–95 °C at 1 atm", () => {
  // IAPWS-95 (source: iapws-r6-95) reproduces the best sound-speed data in liquid water at 1 atm
  // to about 0.005 %, i.e. 0.08 m/s (recalled from its paper's stated uncertainty).
  let wd = 0, td = 0, wm = 0, tm = 0, wdm = 0;
  for (let t = 0; t <= 95; t += 0.25) {
    const T = 273.15 + t;
    const ref = water.soundSpeed(T, 101325);
    const d = delGrossoMaderSoundSpeed(T), m = marczakSoundSpeed(T);
    if (Math.abs(d - ref) > wd) [wd, td] = [Math.abs(d - ref), t];
    if (Math.abs(m - ref) > wm) [wm, tm] = [Math.abs(m - ref), t];
    wdm = Math.max(wdm, Math.abs(d - m));
  }
  console.log(
    `vs IAPWS-95 at 1 atm: Del Grosso-Mader worst ${wd.toFixed(3)} m/s at ${td} °C, ` +
      `Marczak worst ${wm.toFixed(3)} m/s at ${tm} °C; the two differ by at most ${
        wdm.toFixed(3)
      } m/s`,
  );
  assert.ok(wd < 0.07, `Del Grosso-Mader ${wd}`);
  assert.ok(wm < 0.07, `Marczak ${wm}`);
  assert.ok(wdm < 0.03, `polynomials apart ${wdm}`);
});

Deno.test("Del Grosso–Mader at 150 °C throws OutOfRangeError naming the formulation", () => {
  throws(() => water.soundSpeed(423.15, 101325, "del-grosso-mader"), (e: unknown) => {
    assert.ok(e instanceof OutOfRangeError);
    assert.equal(e.formulation, "Del Grosso-Mader 1972");
    assert.equal(e.quantity, "temperature");
    assert.ok(e.message.includes("Del Grosso-Mader 1972"));
    return true;
  });
  throws(() => delGrossoMaderSoundSpeed(423.15), OutOfRangeError);
});

Deno.test({
  name: "saturation pressure against Debian python3-iapws (IAPWS-95 phase equilibrium), 0–300 °C",
  ignore: !hasPython("iapws"),
  fn: async () => {
    const Ts = Array.from({ length: 31 }, (_, i) => 273.16 + i * 10);
    const ref = await runPython<number[]>(
      `import json, sys
from iapws import IAPWS95
print(json.dumps([IAPWS95(T=T, x=0).P * 1e6 for T in json.load(sys.stdin)]))`,
      Ts,
    );
    let worst = 0;
    Ts.forEach((T, i) =>
      worst = Math.max(worst, Math.abs(water.saturationPressure(T) / ref[i] - 1))
    );
    console.log(
      `python3-iapws ${debianVersion("python3-iapws")} IAPWS95 saturation: worst relative ` +
        `${worst.toExponential(1)} (auxiliary equation vs full phase equilibrium)`,
    );
    // Wagner & Pruß (1993) state the auxiliary equation within 0.025 % of IAPWS-95 (recalled)
    assert.ok(worst < 2.5e-4, `worst ${worst}`);
    closeRel(water.saturationPressure(373.124), 101325, 3e-4, "normal boiling point, ITS-90");
  },
});
