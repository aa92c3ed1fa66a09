/**
 * IAPWS 2008 viscosity (industrial form) against outside sources:
 * - IAPWS R12-08 Table 4 (all eleven points), data/water/iapws2008_table4.yaml;
 * - Debian python3-iapws (iapws._iapws._Viscosity with IAPWS95 density) on 525 liquid states.
 */
import { assert, closeRel } from "../_assert.ts";
import { debianVersion, hasPython, runPython } from "../_python.ts";
import { liquidWaterGrid } from "./_water_states.ts";
import { iapws2008Viscosity, verifyWaterTable, water } from "../../lib/water/mod.ts";

Deno.test("IAPWS R12-08 Table 4: eleven viscosity values to half a unit of the last digit", () => {
  const checks = verifyWaterTable("water-iapws2008-table4");
  assert.ok(checks.length === 11);
  for (const c of checks) {
    assert.ok(c.ok, `row ${c.row}: ${c.computed} vs ${c.expected} (${c.relDiff})`);
  }
  // source: IAPWS R12-08 Table 4, 373.15 K, 1000 kg/m³: 307.883622 µPa·s
  closeRel(iapws2008Viscosity(373.15, 1000) * 1e6, 307.883622, 1e-8, "mu");
});

Deno.test({
  name: "water viscosity against Debian python3-iapws (_Viscosity, IAPWS95 density), 525 states",
  ignore: !hasPython("iapws"),
  fn: async () => {
    const states = liquidWaterGrid();
    const ref = await runPython<number[][]>(
      `import json, sys
from iapws import IAPWS95
from iapws._iapws import _Viscosity
out = []
for T, p in json.load(sys.stdin):
    rho = IAPWS95(T=T, P=p / 1e6).rho
    out.append([_Viscosity(rho, T), rho])
print(json.dumps(out))`,
      states,
    );
    let worstMu = 0, worstNu = 0;
    states.forEach(([T, p], i) => {
      worstMu = Math.max(worstMu, Math.abs(water.viscosity(T, p) / ref[i][0] - 1));
      const nuRef = ref[i][0] / ref[i][1];
      worstNu = Math.max(worstNu, Math.abs(water.kinematicViscosity(T, p) / nuRef - 1));
    });
    console.log(
      `python3-iapws ${debianVersion("python3-iapws")} _Viscosity, 525 states: worst relative ` +
        `mu ${worstMu.toExponential(1)}, nu ${worstNu.toExponential(1)}`,
    );
    assert.ok(worstMu < 1e-8, `mu ${worstMu}`);
    assert.ok(worstNu < 1e-8, `nu ${worstNu}`);
  },
});
