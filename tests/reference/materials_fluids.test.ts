/**
 * Outside checks of data/materials.yaml.
 *
 * 1. Roughness transcribed from the Idelchik (2007) and Farshad & Rieke (2006) tables, as
 *    tabulated in Debian's python3-fluids (fluids/friction.py: HHR_roughness,
 *    _Farshad_roughness): every datum whose `copy` names python3-fluids is compared with the
 *    library's table at run time, so a transcription slip fails here.
 * 2. Elastic constants implied by the recalled sound speeds and densities, against handbook
 *    Young's moduli and Poisson's ratios of the metals and glass (values recalled from the
 *    ASM Handbook and Kaye & Laby tables of elastic constants; tolerance wide to match).
 */
import { assert, closeRel } from "../_assert.ts";
import { debianVersion, hasPython, runPython } from "../_python.ts";
import { createRegistry } from "../../lib/registry/mod.ts";
import { loadRegistry } from "../../lib/registry/load.ts";
import type { MaterialEntry } from "../../lib/registry/schemas/materials.ts";

const loaded = loadRegistry(new URL("../../data/", import.meta.url));
const reg = createRegistry(loaded);
const entries = loaded.docs.filter((d) => d.kind === "materials")
  .flatMap((d) => d.data.materials as MaterialEntry[]);

interface Row {
  material: string;
  field: string;
  table: "HHR_roughness" | "_Farshad_roughness";
  key: string;
  value: number;
  spread?: number;
}

function transcribedRows(): Row[] {
  const rows: Row[] = [];
  for (const m of entries) {
    for (const field of ["roughness", "roughnessAged"] as const) {
      const q = m[field];
      if (!q?.copy?.includes("python3-fluids")) continue;
      const hit = /(HHR_roughness|_Farshad_roughness): (.+)$/s.exec(q.copy);
      assert.ok(hit, `${m.id}.${field}: copy names no table row: ${q.copy}`);
      assert.equal(q.unit, "m", `${m.id}.${field} is transcribed in metres`);
      rows.push({
        material: m.id,
        field,
        table: hit[1] as Row["table"],
        key: hit[2].replace(/\s+/g, " ").trim(),
        value: q.value,
        spread: q.spread,
      });
    }
  }
  return rows;
}

const LOOKUP = `
import json, sys
from fluids import friction
out = []
for r in json.load(sys.stdin):
    if r["table"] == "HHR_roughness":
        out.append(list(friction.HHR_roughness.get(r["key"], (None, None, None))))
    else:
        v = friction._Farshad_roughness.get(r["key"])
        out.append([None, None, v[0] if v else None])
print(json.dumps(out))
`;

Deno.test({
  name: `roughness rows match python3-fluids ${debianVersion("python3-fluids")} tables ` +
    "(Idelchik 2007; Farshad & Rieke 2006)",
  ignore: !hasPython("fluids"),
  fn: async () => {
    const rows = transcribedRows();
    assert.ok(rows.length >= 15, `transcribed rows found: ${rows.length}`);
    const got = await runPython<(number | null)[][]>(LOOKUP, rows);
    let worst = 0;
    rows.forEach((r, i) => {
      const [lo, hi, avg] = got[i];
      const what = `${r.material}.${r.field} ← ${r.table}['${r.key}']`;
      assert.ok(lo !== null || hi !== null || avg !== null, `${what}: no such row in fluids`);
      if (lo !== null && hi !== null) {
        // a range: we store its midpoint with the half-width as spread
        worst = Math.max(worst, closeRel(r.value, (lo + hi) / 2, 1e-12, `${what} midpoint`));
        closeRel(r.spread ?? NaN, (hi - lo) / 2, 1e-12, `${what} half-width`);
      } else {
        const v = avg ?? hi ?? lo;
        worst = Math.max(worst, closeRel(r.value, v!, 1e-12, what));
      }
    });
    assert.ok(worst <= 1e-12);
  },
});

/**
 * Handbook elastic constants at room temperature (recalled: ASM Handbook, Kaye & Laby
 * tables of elastic constants). [Young's modulus E in GPa, Poisson's ratio ν].
 */
const ELASTIC: Record<string, [number, number]> = {
  "carbon-steel": [207, 0.29],
  "stainless-steel-304": [195, 0.29],
  "stainless-steel-316": [195, 0.29],
  "ductile-iron": [169, 0.275],
  copper: [125, 0.34],
  brass: [100, 0.34],
  aluminium: [70, 0.33],
  glass: [63, 0.2],
};

function elastic(rho: number, cl: number, cs: number): [number, number] {
  const cl2 = cl * cl;
  const cs2 = cs * cs;
  // isotropic solid: E = ρ cs² (3 cl² − 4 cs²)/(cl² − cs²), ν = (cl² − 2 cs²)/(2(cl² − cs²))
  return [rho * cs2 * (3 * cl2 - 4 * cs2) / (cl2 - cs2), (cl2 - 2 * cs2) / (2 * (cl2 - cs2))];
}

Deno.test("the stated spreads of speeds and density cover the handbook elastic constants (recalled)", () => {
  for (const [id, [eGPa, nuRef]] of Object.entries(ELASTIC)) {
    const m = reg.material(id);
    const [E, nu] = elastic(m.density, m.longitudinal, m.shear!);
    // nominal values within 10 % / 0.05 of the handbook's
    closeRel(E / 1e9, eGPa, 0.1, `${id} Young's modulus (GPa) from nominal data`);
    assert.ok(Math.abs(nu - nuRef) <= 0.05, `${id} Poisson's ratio ${nu.toFixed(3)} vs ${nuRef}`);
    // and the data's own spreads must reach the handbook values
    let eLo = Infinity, eHi = -Infinity, nLo = Infinity, nHi = -Infinity;
    for (const a of [-1, 1]) {
      for (const b of [-1, 1]) {
        for (const c of [-1, 1]) {
          const [e, n] = elastic(
            m.density + c * (m.densitySpread ?? 0),
            m.longitudinal + a * (m.longitudinalSpread ?? 0),
            m.shear! + b * (m.shearSpread ?? 0),
          );
          eLo = Math.min(eLo, e), eHi = Math.max(eHi, e), nLo = Math.min(nLo, n);
          nHi = Math.max(nHi, n);
        }
      }
    }
    assert.ok(eLo / 1e9 <= eGPa && eGPa <= eHi / 1e9, `${id}: E spread ${eLo / 1e9}–${eHi / 1e9}`);
    assert.ok(nLo <= nuRef && nuRef <= nHi, `${id}: ν spread ${nLo.toFixed(3)}–${nHi.toFixed(3)}`);
  }
});
