/**
 * Outside checks of the registry liquids: the ammonia tables against the Tillner-Roth equation of
 * state in Debian python3-iapws between the tabulated points and above the saturation pressure,
 * and the handbook sound speeds at their reference temperatures against independent values.
 */
import { assert } from "../_assert.ts";
import { debianVersion, hasPython, runPython } from "../_python.ts";
import { liquidProperties } from "../../lib/liquids/mod.ts";

// Source: Debian python3-iapws (iapws.ammonia.NH3, Tillner-Roth et al. 1993). The registry holds
// saturated-liquid values every 10 K; here states between the nodes and 0.5-5 MPa above
// saturation test the interpolation and the pressure slope. Worst measured when written:
// sound speed 15 m/s at 45 °C, 5 MPa above saturation (inside the stated spread, which grows
// with the pressure step), density 0.5 % (isentropic compressibility stands in for isothermal).
Deno.test({
  name: `ammonia vs python3-iapws ${debianVersion("python3-iapws")} (Tillner-Roth EOS)`,
  ignore: !hasPython("iapws"),
  async fn() {
    const states: [number, number][] = [];
    for (const t of [-35, -15, 5, 25, 45]) for (const dp of [0.5, 2, 5]) states.push([t, dp]);
    const ref = await runPython<number[][]>(
      `import json,sys,warnings
warnings.simplefilter("ignore")
from iapws.ammonia import NH3
out=[]
for t,dp in json.load(sys.stdin):
    s=NH3(T=273.15+t,x=0); P=s.P+dp; l=NH3(T=273.15+t,P=P)
    out.append([P*1e6, l.w, l.rho])
print(json.dumps(out))`,
      states,
    );
    let worstC = 0, worstRho = 0;
    states.forEach(([t], k) => {
      const [p, w, rho] = ref[k];
      const s = liquidProperties("ammonia", 273.15 + t, p);
      const dc = Math.abs(s.soundSpeed - w);
      worstC = Math.max(worstC, dc);
      worstRho = Math.max(worstRho, Math.abs(s.density - rho) / rho);
      assert.ok(dc <= s.soundSpeedSpread + 2, `c at ${t} °C, ${p} Pa: ${s.soundSpeed} vs ${w}`);
    });
    assert.ok(worstRho < 0.008, `density ${worstRho}`);
    console.log(
      `  worst: sound speed ${worstC.toFixed(2)} m/s, density ${(worstRho * 100).toFixed(3)} %`,
    );
  },
});

// Source: handbook values of the sound speed of pure liquids at 20 °C as tabulated in Kaye & Laby
// (section 2.4.1) and the CRC Handbook, recalled here independently of data/liquids.yaml (the
// data there is given at 25 °C with a slope, so this checks value and slope together).
// Values are recalled: the tolerance is the entry's stated spread.
const AT_20C: [string, number][] = [
  ["methanol", 1121],
  ["ethanol", 1162],
  ["acetone", 1192],
  ["toluene", 1328],
  ["glycerol", 1923],
  ["ethylene-glycol", 1666],
];
Deno.test("handbook sound speeds at 20 °C (recalled Kaye & Laby / CRC values)", () => {
  for (const [id, c] of AT_20C) {
    const s = liquidProperties(id, 293.15);
    assert.ok(
      Math.abs(s.soundSpeed - c) <= s.soundSpeedSpread,
      `${id}: ${s.soundSpeed} vs ${c} (spread ${s.soundSpeedSpread})`,
    );
  }
});

// Source: API gravity definition (density at 60 °F = 141.5/(API+131.5) g/cm³), the standard of the
// petroleum trade: the Batzle-Wang density at 15.6 °C, 1 atm must sit close to it.
Deno.test("crude oil density near the API-gravity definition at 15.6 °C", () => {
  for (
    const [id, api] of [["crude-oil-light", 40], ["crude-oil-medium", 30], [
      "crude-oil-heavy",
      18,
    ]] as const
  ) {
    const rho = liquidProperties(id, 288.71).density;
    const def = 141.5 / (api + 131.5) * 1000;
    assert.ok(Math.abs(rho - def) / def < 0.01, `${id}: ${rho} vs ${def}`);
  }
});
