/**
 * Second pass of issue 12 (items 1 and 4) on materials, liquids, flow tables and fittings:
 * registry values against the public copies recorded in data/sources.yaml. Every expected
 * number below is typed from the copy named beside it, not from our data or code, so a
 * transcription slip or a later edit that drifts from the copy fails here.
 */
import { assert } from "../_assert.ts";
import { defaultRegistry, recalledRows } from "../../lib/registry/mod.ts";
import { liquidProperties } from "../../lib/liquids/mod.ts";
import { powerLawExponent } from "../../lib/flow/mod.ts";

const reg = defaultRegistry();

// ---------------------------------------------------------------- ductile iron (computed)

// copy-ductile-iron-elastic, three public web copies:
//   amesweb.info "Young's Modulus of Iron": ductile iron E 162 to 170 GPa;
//   makeitfrom.com ductile cast iron: E 170 to 180 GPa, Poisson's ratio 0.28 to 0.31,
//     density 7.1 to 7.5 g/cm³;
//   material-properties.org ductile cast iron: density 7300 kg/m³, E 170 GPa.
const E_GPA = [162, 180];
const NU = [0.28, 0.31];
const RHO = [7100, 7300]; // makeitfrom's low end and material-properties.org

/** Isotropic solid: longitudinal and shear bulk-wave speeds from E, ν, ρ. */
function speeds(e: number, nu: number, rho: number): [number, number] {
  return [
    Math.sqrt(e * (1 - nu) / (rho * (1 + nu) * (1 - 2 * nu))),
    Math.sqrt(e / (2 * rho * (1 + nu))),
  ];
}

Deno.test("ductile iron: speeds span what E, ν, ρ of copy-ductile-iron-elastic give an isotropic solid", () => {
  const m = reg.material("ductile-iron");
  let lLo = Infinity, lHi = -Infinity, sLo = Infinity, sHi = -Infinity;
  for (const e of E_GPA) {
    for (const nu of NU) {
      for (const rho of RHO) {
        const [cl, cs] = speeds(e * 1e9, nu, rho);
        lLo = Math.min(lLo, cl), lHi = Math.max(lHi, cl);
        sLo = Math.min(sLo, cs), sHi = Math.max(sHi, cs);
      }
    }
  }
  const lSpread = m.longitudinalSpread!, sSpread = m.shearSpread!;
  // every corner of the copies' ranges lies inside value ± spread …
  assert.ok(
    m.longitudinal - lSpread <= lLo && lHi <= m.longitudinal + lSpread,
    `c_L ${lLo}–${lHi}`,
  );
  assert.ok(m.shear! - sSpread <= sLo && sHi <= m.shear! + sSpread, `c_S ${sLo}–${sHi}`);
  // … and the spread is no wider than the range rounded out to 10 m/s (no padding)
  assert.ok(lSpread - (lHi - lLo) / 2 < 10, `longitudinal spread ${lSpread}`);
  assert.ok(sSpread - (sHi - sLo) / 2 < 10, `shear spread ${sSpread}`);
  assert.ok(Math.abs(m.longitudinal - (lLo + lHi) / 2) < 10, "longitudinal at mid-range");
  assert.ok(Math.abs(m.shear! - (sLo + sHi) / 2) < 10, "shear at mid-range");
  // density: the copies' 7100–7300 kg/m³ as value ± spread
  assert.equal(m.density - m.densitySpread!, RHO[0]);
  assert.equal(m.density + m.densitySpread!, RHO[1]);
});

Deno.test("ductile iron: the entry says computed and no longer rests on memory", () => {
  const rows = recalledRows(reg.loaded.docs).filter((r) =>
    r.file === "materials.yaml" && r.entry === "ductile-iron"
  );
  assert.equal(rows.length, 0, JSON.stringify(rows));
  const doc = reg.loaded.docs.find((d) => d.file === "materials.yaml")!;
  // deno-lint-ignore no-explicit-any
  const raw = (doc.data as any).materials.find((x: { id: string }) => x.id === "ductile-iron");
  assert.equal(raw.basis, "computed");
  assert.equal(raw.source, "copy-ductile-iron-elastic");
  assert.match(raw.note, /sqrt\(E\(1-nu\)/, "the note states the formula");
});

// ---------------------------------------------------------------- flow tables

// copy-schlichting-nikuradse-n: Schlichting, Boundary-Layer Theory, text beside Fig. 20.2
// (n = 6 at R = 4 x 10^3, n = 7 at about 1.1 x 10^5, n = 10 at 3240 x 10^3), and the
// Bird, Stewart & Lightfoot exercise (near Re 4 x 10^3 n = 6; 1.1 x 10^5 n = 7; 3.2 x 10^6 n = 10).
const NIKURADSE_COPY: [number, number][] = [[4e3, 6], [1.1e5, 7], [3.2e6, 10]];

Deno.test("Nikuradse n: the three rows in copy-schlichting-nikuradse-n equal the copies, and the code returns them", () => {
  const t = reg.table("nikuradse-power-law-n");
  type Row = Readonly<Record<string, number | string>>;
  const rows = t.rows as readonly Row[];
  for (const [re, n] of NIKURADSE_COPY) {
    const row = rows.find((r) => r.reynolds === re);
    assert.ok(row, `a row at Re ${re}`);
    assert.equal(row.n, n, `n at Re ${re}`);
    assert.equal(row.basis, "transcribed", `row at Re ${re} marked transcribed`);
    // the interpolating code reproduces the copy at its own points
    assert.ok(Math.abs(powerLawExponent(re) - n) < 1e-12, `powerLawExponent(${re})`);
  }
  // rows the copies do not show stay under the file's recalled basis, with the reason
  assert.equal(t.basis, "recalled");
  const others = rows.filter((r) => !NIKURADSE_COPY.some(([re]) => re === r.reynolds));
  assert.equal(others.length, 3);
  for (const r of others) assert.equal(r.basis, undefined, `row ${r.reynolds} not marked`);
  assert.match(t.note!, /appear in no public\s+copy/);
});

// copy-white-log-law: White, Fluid Mechanics, ch. 6: kappa ≈ 0.41, B ≈ 5.0 (smooth walls);
// Bailey et al., J. Fluid Mech. 749 (2014): kappa = 0.40 ± 0.02 for smooth pipe flow.
Deno.test("log law: κ and B equal White's values (copy-white-log-law); κ inside Bailey et al.'s 0.40 ± 0.02", () => {
  const c = reg.coefficients("log-law");
  assert.equal(c.basis, "transcribed");
  assert.equal(c.coefficients.kappa, 0.41);
  assert.equal(c.coefficients.B, 5.0);
  assert.ok(Math.abs((c.coefficients.kappa as number) - 0.40) <= 0.02);
});

// ---------------------------------------------------------------- glycerol

// copy-liquid-sound-table: Engineering ToolBox, "Glycerol (glycerine) (25oC)" 1920 m/s;
// copy-bar-meir-sound-liquids: Bar-Meir, Table 3.2 (after Aldred 1972), glycerol 1904 m/s.
Deno.test("glycerol: the sound speed is the mean of the two copies and its spread reaches both with room", () => {
  const s = liquidProperties("glycerol", 298.15);
  assert.equal(s.soundSpeed, (1920 + 1904) / 2);
  for (const c of [1920, 1904]) {
    const margin = s.soundSpeedSpread - Math.abs(s.soundSpeed - c);
    assert.ok(margin >= 10, `${c} m/s inside ${s.soundSpeed} ± ${s.soundSpeedSpread}`);
  }
});

// ---------------------------------------------------------------- fittings (common practice)

Deno.test("fittings: every recalled disturbance row records its own reason (straight runs: common practice)", () => {
  const rows = recalledRows(reg.loaded.docs).filter((r) => r.file === "fittings.yaml");
  assert.ok(rows.length > 0);
  for (const r of rows) {
    // a reason, not a remark on the reference plane inherited from the entry
    assert.match(r.reason, /recalled|engineering judgement/i, `${r.entry} ${r.path}: ${r.reason}`);
  }
  const doc = reg.loaded.docs.find((d) => d.file === "fittings.yaml")!;
  // deno-lint-ignore no-explicit-any
  for (const f of (doc.data as any).fittings) {
    assert.equal(f.straightRun.basis, "common-practice", `${f.id} straight run`);
  }
});

// ---------------------------------------------------------------- plastics densities

// copy-plastics-density, g/cm³ → kg/m³: PMC9088909 Table 1 and the 24kjx.com.cn table.
const PMC: Record<string, [number, number]> = {
  LDPE: [914, 940],
  HDPE: [952, 965],
  PP: [900, 910],
  PVC: [1300, 1580],
  PMMA: [1170, 1200],
};
const KJX: Record<string, [number, number]> = {
  LDPE: [910, 925],
  MDPE: [926, 940],
  HDPE: [940, 965],
  PP: [900, 915],
  "PVC-U": [1300, 1450],
  PMMA: [1170, 1190],
};

/** [material, copy rows whose union the value ± spread must equal (to rounding outward)]. */
const DENSITY_UNION: [string, [number, number][]][] = [
  ["hdpe", [PMC.HDPE, KJX.HDPE]],
  ["pp", [PMC.PP, KJX.PP]],
  ["pvc", [KJX["PVC-U"]]],
  ["polyethylene-lining", [KJX.LDPE, KJX.MDPE, PMC.LDPE]],
];

Deno.test("plastics: densities are the ranges of copy-plastics-density (mid-range ± half, rounded outward)", () => {
  for (const [id, rows] of DENSITY_UNION) {
    const lo = Math.min(...rows.map((r) => r[0]));
    const hi = Math.max(...rows.map((r) => r[1]));
    const m = reg.material(id);
    const a = m.density - m.densitySpread!, b = m.density + m.densitySpread!;
    assert.ok(a <= lo && hi <= b, `${id}: ${a}–${b} kg/m³ vs copies ${lo}–${hi}`);
    assert.ok(lo - a <= 1 && b - hi <= 1, `${id}: no more than 1 kg/m³ of rounding`);
  }
  // PVC: the broad PMC row (all grades) contains the rigid-PVC band used
  const pvc = reg.material("pvc");
  assert.ok(PMC.PVC[0] <= pvc.density - pvc.densitySpread!);
  // acrylic (transcribed from ASTM E494: 1180 kg/m³) lies in both PMMA rows
  const acrylic = reg.material("acrylic").density;
  for (const [lo, hi] of [PMC.PMMA, KJX.PMMA]) assert.ok(lo <= acrylic && acrylic <= hi);
});

// copy-pg-density-note: propylene glycol 1.037 g/mL at 25 °C (one copy; value kept, spread widened).
Deno.test("propylene glycol: the density spread reaches the one public copy (1037 kg/m³ at 25 °C)", () => {
  const p = liquidProperties("propylene-glycol", 298.15);
  const doc = reg.loaded.docs.find((d) => d.file === "liquids.yaml")!;
  // deno-lint-ignore no-explicit-any
  const raw = (doc.data as any).liquids.find((x: { id: string }) => x.id === "propylene-glycol");
  const spread = raw.density.spread as number;
  assert.ok(Math.abs(p.density - 1037) <= spread, `${p.density} ± ${spread} vs 1037`);
  assert.match(raw.density.note, /copy-pg-density-note/);
});

// ---------------------------------------------------------------- liquids: spot checks

// copy-viscosity-25c: preproom.org "Viscosity of Liquids" (water 0.894 cP, so 25 °C), cP = mPa·s.
const VISCOSITY_25C: [string, number, number][] = [
  // [liquid, copy value mPa·s, allowed relative difference]
  ["acetone", 0.306, 1e-9],
  ["methanol", 0.544, 1e-9],
  ["ethanol", 1.074, 1e-9],
  ["ethylene-glycol", 16.1, 1e-9],
  ["glycerol", 934, 0.02], // between table points (20 and 30 °C): interpolated
];

Deno.test("liquids: viscosities at 25 °C agree with copy-viscosity-25c", () => {
  for (const [id, mPaS, tol] of VISCOSITY_25C) {
    const mu = liquidProperties(id, 298.15).dynamicViscosity * 1e3;
    assert.ok(Math.abs(mu - mPaS) <= tol * mPaS, `${id}: ${mu} vs ${mPaS} mPa s`);
  }
});

// copy-density-20c: textbook table at 20 °C, 1 atm, kg/m³.
const DENSITY_20C: [string, number][] = [
  ["methanol", 791],
  ["ethanol", 789],
  ["glycerol", 1260],
  ["kerosene", 804],
];

Deno.test("liquids: densities at 20 °C lie inside the stated spreads of copy-density-20c's values", () => {
  const doc = reg.loaded.docs.find((d) => d.file === "liquids.yaml")!;
  // deno-lint-ignore no-explicit-any
  const entries = (doc.data as any).liquids as { id: string; density: { spread: number } }[];
  for (const [id, rho] of DENSITY_20C) {
    const spread = entries.find((e) => e.id === id)!.density.spread;
    const got = liquidProperties(id, 293.15).density;
    assert.ok(Math.abs(got - rho) <= spread, `${id}: ${got} ± ${spread} vs ${rho}`);
  }
  // the copy's gasoline (680 kg/m³) is far outside: recorded in the note, not applied
  const gas = liquidProperties("gasoline", 293.15).density;
  const gasSpread = entries.find((e) => e.id === "gasoline")!.density.spread;
  assert.ok(Math.abs(gas - 680) > gasSpread);
  const note = (doc.data as { liquids: { id: string; note: string }[] }).liquids
    .find((e) => e.id === "gasoline")!.note;
  assert.match(note, /copy-density-20c/);
});

// ---------------------------------------------------------------- 316 and glass densities

// copy-stainless-316-density: tubingchina.com table, 316: 7.98 kg/dm³; compraco.com.br, 8.0 g/cm³.
// copy-borosilicate-density: matmatch.com (ISO 3585 glass 3.3) and huayuanglass.com, 2.23 g/cm³.
Deno.test("densities of 316 and borosilicate glass equal their first copy; the spread reaches the other", () => {
  const s316 = reg.material("stainless-steel-316");
  assert.equal(s316.density, 7980);
  assert.ok(Math.abs(s316.density - 8000) <= s316.densitySpread!);
  const glass = reg.material("glass");
  assert.equal(glass.density, 2230);
  // the CRC reprint's 2320 kg/m³ (copy-crc-sound-solids) is still inside the spread
  assert.ok(Math.abs(glass.density - 2320) <= glass.densitySpread!);
  const rows = recalledRows(reg.loaded.docs).filter((r) =>
    r.file === "materials.yaml" && /^(stainless-steel-316|glass)$/.test(r.entry) &&
    r.path.endsWith(".density")
  );
  assert.equal(rows.length, 0, JSON.stringify(rows));
});

// copy-mazeika-2010-pe80: PE80 pipe material, longitudinal 2030–2060 m/s at 1.0–3.5 MHz.
Deno.test("polyethylene: the PE80 measurements lie in the lining's spread and the HDPE note records the gap", () => {
  const lining = reg.material("polyethylene-lining");
  for (const c of [2030, 2060]) {
    assert.ok(Math.abs(lining.longitudinal - c) <= lining.longitudinalSpread!, `lining vs ${c}`);
  }
  const hdpe = reg.material("hdpe");
  assert.ok(hdpe.longitudinal - hdpe.longitudinalSpread! > 2060, "HDPE row is above PE80");
  const note = recalledRows(reg.loaded.docs)
    .find((r) => r.entry === "hdpe" && /^materials\[\d+\]$/.test(r.path))!.reason;
  assert.match(note, /copy-mazeika-2010-pe80/);
});
