/**
 * Outside checks of the seawater room against Debian python3-gsw (the TEOS-10 GSW toolbox's
 * C library) and against published check values.
 */
import { assert, closeRel } from "../_assert.ts";
import { debianVersion, hasPython, runPython } from "../_python.ts";
import {
  conservativeTemperature,
  seawater,
  seawaterSoundSpeed75,
  soundSpeedUnesco1983,
  verifySeawaterTable,
} from "../../lib/liquids/mod.ts";

const noGsw = !hasPython("gsw", "numpy");

// Source: UNESCO 1983 (Fofonoff & Millard 1983, p. 48) check value: S 40, t68 40 °C, 1000 bar
// sea pressure -> 1731.995 m/s (published to 3 decimals).
Deno.test("UNESCO 1983 check value 1731.995 m/s (Fofonoff & Millard 1983)", () => {
  const c = soundSpeedUnesco1983(40, 273.15 + 40 / 1.00024, 101325 + 1000e5);
  assert.ok(Math.abs(c - 1731.995) <= 0.0005, `computed ${c}`);
});

// Source: TEOS-10 GSW check values (gsw_cv_v3_0.npz in Debian python3-gsw), transcribed into
// data/seawater/gsw_cv_*.yaml: 98 states per quantity.
for (
  const id of [
    "seawater-gsw-cv-sound-speed",
    "seawater-gsw-cv-sound-speed-t-exact",
    "seawater-gsw-cv-ct-from-t",
  ]
) {
  Deno.test(`TEOS-10 check values ${id} (GSW, python3-gsw test data)`, () => {
    const checks = verifySeawaterTable(id);
    assert.equal(checks.length, 98);
    for (const c of checks) assert.ok(c.ok, `${id} row ${c.row}: ${c.computed} vs ${c.expected}`);
  });
}

// Source: Debian python3-gsw (gsw.sound_speed, gsw.CT_from_t, gsw.SR_from_SP, gsw.rho,
// gsw.sound_speed_t_exact) over a grid of 6 x 10 x 10 = 600 states. Worst relative differences
// measured when written: sound speed 1.4e-15, density 2e-16, CT 1e-13 (abs).
Deno.test({
  name: `TEOS-10 sound speed, density, CT on 600 states vs python3-gsw ${
    debianVersion("python3-gsw")
  }`,
  ignore: noGsw,
  async fn() {
    const states: [number, number, number][] = [];
    for (const S of [0, 5, 15, 30, 35, 40]) {
      for (let i = 0; i < 10; i++) {
        for (let j = 0; j < 10; j++) states.push([S, -2 + 4.2 * i, j * 800]); // dbar
      }
    }
    const ref = await runPython<number[][]>(
      `import json,sys,gsw
st=json.load(sys.stdin); out=[]
for S,t,p in st:
    SA=gsw.SR_from_SP(S); CT=gsw.CT_from_t(SA,t,p)
    out.append([float(CT), float(gsw.sound_speed(SA,CT,p)), float(gsw.rho(SA,CT,p)), float(gsw.sound_speed_t_exact(SA,t,p))])
print(json.dumps(out))`,
      states,
    );
    let worstC = 0, worstRho = 0, worstCT = 0, worstG = 0;
    states.forEach(([S, t, pd], k) => {
      const T = 273.15 + t, p = 101325 + pd * 1e4;
      const [CT, c, rho, cg] = ref[k];
      const SA = S * 35.16504 / 35 / 1000;
      worstCT = Math.max(worstCT, Math.abs(conservativeTemperature(SA, T, p) - CT));
      worstC = Math.max(
        worstC,
        closeRel(seawater.soundSpeed(S, T, p), c, 1e-12, `c ${S} ${t} ${pd}`),
      );
      worstRho = Math.max(worstRho, closeRel(seawater.density(S, T, p), rho, 1e-12, "rho"));
      worstG = Math.max(
        worstG,
        closeRel(seawater.soundSpeed(S, T, p, "teos10-gibbs"), cg, 1e-12, "c exact"),
      );
      closeRel(seawaterSoundSpeed75(SA, CT, pd * 1e4), c, 1e-12, "c from gsw CT");
    });
    assert.ok(worstCT < 1e-10, `CT worst ${worstCT}`);
    console.log(
      `  worst vs gsw: c ${worstC.toExponential(2)}, rho ${worstRho.toExponential(2)}, ` +
        `c exact ${worstG.toExponential(2)}, CT ${worstCT.toExponential(2)} K`,
    );
  },
});
