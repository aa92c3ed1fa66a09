/**
 * Registry materials, liquids and water polynomials against the public copies recorded in
 * data/sources.yaml (issue 12, items 1 and 4). Every expected number below is typed from the
 * copy named beside it, not from our own data or code; a transcription slip, or an edit of the
 * data that drifts from the copy, fails here.
 */
import { assert } from "../_assert.ts";
import { defaultRegistry, recalledRows } from "../../lib/registry/mod.ts";
import { liquidProperties } from "../../lib/liquids/mod.ts";

const reg = defaultRegistry();

// ---------------------------------------------------------------- water polynomials

// copy-del-grosso-mader-1972-coefficients: SoundVelocity.m (L. Hoff, 2016, "Del Grosso 1972,
// Table III, col. 4"), k0..k5 as printed there (0.140238754e4, 0.503711129e1, ...).
const DGM_COPY = [
  0.140238754e4,
  0.503711129e1,
  -0.580852166e-1,
  0.334198834e-3,
  -0.147800417e-5,
  0.314643091e-8,
];
// copy-marczak-1997-coefficients: SonarDocs "Sound speed in pure water. Marczak equation".
const MARCZAK_COPY = [
  +1.402385e3,
  +5.038813,
  -5.799136e-2,
  +3.287156e-4,
  -1.398845e-6,
  +2.787860e-9,
];

Deno.test("Del Grosso–Mader k0–k5 equal copy-del-grosso-mader-1972-coefficients (SoundVelocity.m)", () => {
  const set = reg.coefficients("water-del-grosso-mader-1972");
  assert.equal(set.basis, "transcribed");
  const k = set.coefficients.k as number[];
  assert.equal(k.length, DGM_COPY.length);
  k.forEach((v, i) => assert.equal(v, DGM_COPY[i], `k${i}: ${v} vs copy ${DGM_COPY[i]}`));
});

Deno.test("Marczak k0–k5 equal copy-marczak-1997-coefficients (SonarDocs Marczak table)", () => {
  const set = reg.coefficients("water-marczak-1997");
  assert.equal(set.basis, "transcribed");
  const k = set.coefficients.k as number[];
  assert.equal(k.length, MARCZAK_COPY.length);
  k.forEach((v, i) => assert.equal(v, MARCZAK_COPY[i], `k${i}: ${v} vs copy ${MARCZAK_COPY[i]}`));
});

// ---------------------------------------------------------------- materials

type Row = { density?: number; longitudinal?: number; shear?: number };

// astm-e494: ASTM E494 Table X3.1 (scanned copy, url in data/sources.yaml), kg/m³ and m/s.
const E494: Record<string, Row> = {
  "Aluminum": { density: 2700, longitudinal: 6300, shear: 3130 },
  "Brass": { density: 8100, longitudinal: 4370, shear: 2100 },
  "Copper": { density: 8900, longitudinal: 4700, shear: 2260 },
  "Plastic (acrylic resin)": { density: 1180, longitudinal: 2670, shear: 1120 },
  "Stainless steel (347)": { density: 7910, longitudinal: 5790, shear: 3100 },
  "Steel": { density: 7700, longitudinal: 5900, shear: 3230 },
};
// E494's cast-iron row is a range: 7200 kg/m³, 3500 to 5600 m/s, 2200 to 3200 m/s.
const E494_CAST_IRON = { density: 7200, longitudinal: [3500, 5600], shear: [2200, 3200] };

// copy-crc-sound-solids: CRC Table 1 (preview page and reprint), density g/cm³ → kg/m³, m/s.
const CRC: Record<string, Row> = {
  "Duralumin 17S": { longitudinal: 6320, shear: 3130 },
  "Brass (70 Cu, 30 Zn)": { density: 8600, longitudinal: 4700, shear: 2110 },
  "Copper, annealed": { density: 8930, longitudinal: 4760, shear: 2325 },
  "Iron, cast": { longitudinal: 4994, shear: 2809 },
  "Steel, mild": { density: 7850, longitudinal: 5960, shear: 3235 },
  "Steel, 347 Stainless": { density: 7900, longitudinal: 5790, shear: 3100 },
  "Glass, pyrex": { density: 2320, longitudinal: 5640, shear: 3280 },
  "Lucite": { density: 1180, longitudinal: 2680, shear: 1100 },
};

/** [material, field, copy table, copy row]: the registry value must equal the copy's. */
const TRANSCRIBED: [string, keyof Row, "E494" | "CRC", string][] = [
  ["carbon-steel", "longitudinal", "E494", "Steel"],
  ["carbon-steel", "shear", "E494", "Steel"],
  ["carbon-steel", "density", "CRC", "Steel, mild"],
  ["stainless-steel-304", "longitudinal", "E494", "Stainless steel (347)"],
  ["stainless-steel-304", "shear", "E494", "Stainless steel (347)"],
  ["stainless-steel-304", "density", "CRC", "Steel, 347 Stainless"],
  ["stainless-steel-316", "longitudinal", "E494", "Stainless steel (347)"],
  ["stainless-steel-316", "shear", "E494", "Stainless steel (347)"],
  ["copper", "longitudinal", "E494", "Copper"],
  ["copper", "shear", "E494", "Copper"],
  ["copper", "density", "E494", "Copper"],
  ["brass", "longitudinal", "E494", "Brass"],
  ["brass", "shear", "E494", "Brass"],
  ["brass", "density", "CRC", "Brass (70 Cu, 30 Zn)"],
  ["aluminium", "longitudinal", "CRC", "Duralumin 17S"],
  ["aluminium", "shear", "CRC", "Duralumin 17S"],
  ["aluminium", "density", "E494", "Aluminum"],
  ["glass", "longitudinal", "CRC", "Glass, pyrex"],
  ["glass", "shear", "CRC", "Glass, pyrex"],
  ["acrylic", "longitudinal", "E494", "Plastic (acrylic resin)"],
  ["acrylic", "shear", "E494", "Plastic (acrylic resin)"],
  ["acrylic", "density", "E494", "Plastic (acrylic resin)"],
];

function field(id: string, f: keyof Row): [number, number] {
  const m = reg.material(id);
  if (f === "longitudinal") return [m.longitudinal, m.longitudinalSpread ?? 0];
  if (f === "shear") return [m.shear!, m.shearSpread ?? 0];
  return [m.density, m.densitySpread ?? 0];
}

Deno.test("materials: transcribed speeds and densities equal their rows in astm-e494 / copy-crc-sound-solids", () => {
  for (const [id, f, table, row] of TRANSCRIBED) {
    const copy = (table === "E494" ? E494 : CRC)[row][f];
    assert.ok(copy !== undefined, `${table} row ${row} has ${f}`);
    const [v] = field(id, f);
    assert.equal(v, copy, `${id}.${f} ${v} vs ${table} "${row}" ${copy}`);
  }
});

Deno.test("materials: grey cast iron is the E494 range (value mid-range, spread half the range)", () => {
  const m = reg.material("cast-iron");
  const [lo, hi] = E494_CAST_IRON.longitudinal;
  const [slo, shi] = E494_CAST_IRON.shear;
  assert.equal(m.longitudinal, (lo + hi) / 2);
  assert.equal(m.longitudinalSpread, (hi - lo) / 2);
  assert.equal(m.shear, (slo + shi) / 2);
  assert.equal(m.shearSpread, (shi - slo) / 2);
  assert.equal(m.density, E494_CAST_IRON.density);
  // the CRC cast-iron row lies inside
  const crc = CRC["Iron, cast"];
  assert.ok(Math.abs(crc.longitudinal! - m.longitudinal) <= m.longitudinalSpread!);
  assert.ok(Math.abs(crc.shear! - m.shear!) <= m.shearSpread!);
});

/** The second copy's row, where the registry follows the first: inside the stated spread. */
const SECOND_COPY: [string, keyof Row, Row][] = [
  ["carbon-steel", "longitudinal", CRC["Steel, mild"]],
  ["carbon-steel", "shear", CRC["Steel, mild"]],
  ["copper", "longitudinal", CRC["Copper, annealed"]],
  ["copper", "density", CRC["Copper, annealed"]],
  ["brass", "longitudinal", CRC["Brass (70 Cu, 30 Zn)"]],
  ["brass", "shear", CRC["Brass (70 Cu, 30 Zn)"]],
  ["aluminium", "longitudinal", E494["Aluminum"]],
  ["aluminium", "shear", E494["Aluminum"]],
  ["acrylic", "longitudinal", CRC["Lucite"]],
  ["acrylic", "shear", CRC["Lucite"]],
  ["acrylic", "density", CRC["Lucite"]],
  ["stainless-steel-304", "density", E494["Stainless steel (347)"]],
  // the glass density (2230, two copies in props_copies2) keeps a spread reaching the CRC 2320
  ["glass", "density", CRC["Glass, pyrex"]],
];

Deno.test("materials: the other copy's row lies inside the stated spread (astm-e494 vs copy-crc-sound-solids)", () => {
  for (const [id, f, row] of SECOND_COPY) {
    const [v, spread] = field(id, f);
    const copy = row[f]!;
    assert.ok(Math.abs(v - copy) <= spread, `${id}.${f}: ${v} ± ${spread} vs ${copy}`);
  }
});

// ---------------------------------------------------------------- liquids

// copy-liquid-sound-table: Engineering ToolBox "Liquids - Speed of Sound", 25 °C rows, m/s.
const LIQUID_25C: [string, string, number][] = [
  ["methanol", "Alcohol, methyl (25oC)", 1103],
  ["ethanol", "Alcohol, ethyl (ethanol) (25oC)", 1144],
  ["acetone", "Acetone (25oC)", 1170],
  ["toluene", "Toluene (25oC)", 1306],
  ["ethylene-glycol", "Ethylene glycol (25oC)", 1660],
];

Deno.test("liquids: sound speeds at 25 °C equal copy-liquid-sound-table (Engineering ToolBox table)", () => {
  for (const [id, row, c] of LIQUID_25C) {
    const s = liquidProperties(id, 298.15);
    assert.ok(Math.abs(s.soundSpeed - c) < 0.01, `${id}: ${s.soundSpeed} vs "${row}" ${c}`);
  }
});

Deno.test("liquids: glycerol's spread covers both copies (1920 m/s in the table, 1904 m/s elsewhere)", () => {
  const s = liquidProperties("glycerol", 298.15);
  for (const c of [1920, 1904]) {
    assert.ok(Math.abs(s.soundSpeed - c) <= s.soundSpeedSpread, `${s.soundSpeed} vs ${c}`);
  }
  // and kerosene (the table's row gives no temperature: 1324 m/s) within the blend spread
  const k = liquidProperties("kerosene", 298.15);
  assert.ok(Math.abs(k.soundSpeed - 1324) <= k.soundSpeedSpread, `kerosene ${k.soundSpeed}`);
});

// ---------------------------------------------------------------- remaining recalled rows

Deno.test("every recalled row of the materials, liquids, water and flow files records a reason", () => {
  const mine = /^(materials\.yaml|liquids\.yaml|water\/|flow\/|acoustics\/|seawater\/)/;
  const rows = recalledRows(reg.loaded.docs).filter((r) => mine.test(r.file));
  assert.ok(rows.length > 0, "some rows are still recalled (listed by deno task verify)");
  for (const r of rows) assert.ok(r.reason.length > 10, `${r.file} ${r.path}: no reason`);
  // the two water polynomials no longer rest on memory
  assert.ok(!rows.some((r) => r.file.startsWith("water/")), "water polynomials transcribed");
});
