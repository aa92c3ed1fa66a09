/**
 * Material queries: SI conversion of the data file's units, the temperature coefficient and
 * its validity range, near-miss suggestions, roles, and the consistency of the bundled data.
 * Expected conversions follow from unit definitions (ft = 0.3048 m, degF), not from our code.
 */
import { assert, closeRel } from "../_assert.ts";
import { InputError, NotFoundError, OutOfRangeError, type Warning } from "../../lib/errors.ts";
import { createRegistry } from "../../lib/registry/mod.ts";
import { loadRegistry } from "../../lib/registry/load.ts";
import { removeTemp, tempData } from "./_tempdata.ts";

const bundled = createRegistry(loadRegistry(new URL("../../data/", import.meta.url)));

/** The ids and roles other rooms depend on (see the materials brief). */
const REQUIRED: Record<string, string> = {
  "carbon-steel": "wall",
  "stainless-steel-304": "wall",
  "stainless-steel-316": "wall",
  "cast-iron": "wall",
  "ductile-iron": "wall",
  copper: "wall",
  brass: "wall",
  aluminium: "wall",
  pvc: "wall",
  cpvc: "wall",
  hdpe: "wall",
  pp: "wall",
  pvdf: "wall",
  frp: "wall",
  glass: "wall",
  "cement-mortar": "lining",
  epoxy: "lining",
  rubber: "lining",
  "polyethylene-lining": "lining",
  acrylic: "wedge",
  peek: "wedge",
  polyetherimide: "wedge",
  polysulfone: "wedge",
};

Deno.test("every required material is there with its role", () => {
  for (const [id, role] of Object.entries(REQUIRED)) {
    const m = bundled.material(id);
    assert.ok(m.roles.includes(role as "wall"), `${id} plays ${role}`);
    assert.ok(bundled.materials({ role: role as "wall" }).includes(m), `${id} listed as ${role}`);
  }
  assert.ok(bundled.materials().length >= Object.keys(REQUIRED).length);
  assert.throws(
    () => bundled.materials({ role: "gasket" as "wall" }),
    (e: unknown) => e instanceof InputError && e.field === "role",
  );
});

Deno.test("bundled materials are physically consistent", () => {
  for (const m of bundled.materials()) {
    assert.ok(
      m.longitudinal > 500 && m.longitudinal < 7000,
      `${m.id} longitudinal ${m.longitudinal}`,
    );
    assert.ok(m.density > 800 && m.density < 9500, `${m.id} density`);
    assert.ok(m.referenceTemperature > 273 && m.referenceTemperature < 313, `${m.id} T0`);
    if (m.shear !== undefined) {
      // Poisson's ratio from the two speeds must lie in (0, 0.5) for an isotropic solid
      const r2 = (m.longitudinal / m.shear) ** 2;
      const nu = (r2 - 2) / (2 * (r2 - 1));
      assert.ok(nu > 0 && nu < 0.5, `${m.id}: Poisson's ratio ${nu.toFixed(3)} from its speeds`);
    }
    if (m.roles.includes("wall") || m.roles.includes("lining")) {
      assert.ok(m.roughness !== undefined && m.roughness > 0 && m.roughness < 0.01, `${m.id} ε`);
      if (m.roughnessAged !== undefined) assert.ok(m.roughnessAged >= m.roughness!, `${m.id} aged`);
    }
    if (m.roles.includes("wedge")) {
      assert.ok(m.dLongitudinalDT !== undefined && m.dLongitudinalDT < 0, `${m.id} dc/dT`);
    }
    // every datum is traced to a known source
    assert.ok(m.trace.length >= 3, `${m.id} trace`);
    for (const t of m.trace) bundled.source(t.source);
    assert.ok(Object.isFrozen(m) && Object.isFrozen(m.trace), `${m.id} frozen`);
  }
});

Deno.test("a miss names the nearest ids", () => {
  assert.throws(
    () => bundled.material("acrylc"),
    (e: unknown) =>
      e instanceof NotFoundError && e.nearby[0] === "acrylic" && e.message.includes("acrylic"),
  );
  assert.throws(
    () => bundled.material("stainless-steel-321"),
    (e: unknown) => e instanceof NotFoundError && e.nearby.includes("stainless-steel-316"),
  );
});

Deno.test("data units are converted to SI by their definitions", () => {
  const file = `kind: materials
materials:
  - id: test-plastic
    name: Test plastic in US units
    roles: [wedge, lining]
    source: common-practice
    basis: common-practice
    referenceTemperature: { value: 68, unit: degF }
    longitudinal: { value: 8956.7, unit: ft/s, spread: 100 }
    shear: { value: 1.43, unit: mm/us }
    density: { value: 1.19, unit: g/cm^3 }
    temperatureCoefficient:
      longitudinal: { value: -4.5, unit: ft/s/degF }
      range: { min: "32 degF", max: "140 degF" }
    attenuation:
      - { value: 0.12, unit: 1/cm, frequency: { value: 500, unit: kHz } }
    roughness: { value: 0.06, unit: mil, source: snellpath-computed, basis: computed }
`;
  const dir = tempData({ "materials.yaml": file });
  try {
    const reg = createRegistry(loadRegistry(dir));
    const m = reg.material("test-plastic");
    closeRel(m.referenceTemperature, 293.15, 1e-12, "68 degF");
    closeRel(m.longitudinal, 8956.7 * 0.3048, 1e-12, "ft/s");
    closeRel(m.longitudinalSpread!, 100 * 0.3048, 1e-12, "spread in ft/s");
    closeRel(m.shear!, 1430, 1e-12, "mm/us");
    closeRel(m.density, 1190, 1e-12, "g/cm^3");
    closeRel(m.dLongitudinalDT!, -4.5 * 0.3048 * 1.8, 1e-12, "ft/s/degF");
    closeRel(m.temperatureRange![0], 273.15, 1e-12);
    closeRel(m.temperatureRange![1], 333.15, 1e-12);
    closeRel(m.attenuation!.value, 12, 1e-12, "1/cm");
    closeRel(m.attenuation!.frequency, 5e5, 1e-12, "kHz");
    assert.equal(m.attenuation!.mode, "longitudinal");
    closeRel(m.roughness!, 0.06 * 25.4e-6, 1e-12, "mil");
    // the roughness datum keeps its own provenance in the trace
    const rt = m.trace.find((t) => t.quantity.includes("roughness"))!;
    assert.equal(rt.source, "snellpath-computed");
    assert.equal(rt.basis, "computed");
    assert.equal(m.trace.find((t) => t.quantity.includes("density"))!.source, "common-practice");
  } finally {
    removeTemp(dir);
  }
});

Deno.test("materialSpeedAt applies the linear coefficient inside its range only", () => {
  const m = bundled.material("acrylic");
  const [lo, hi] = m.temperatureRange!;
  for (const T of [lo, m.referenceTemperature, 310, hi]) {
    const c = bundled.materialSpeedAt("acrylic", T, "longitudinal");
    closeRel(c, m.longitudinal + m.dLongitudinalDT! * (T - m.referenceTemperature), 1e-14);
    const s = bundled.materialSpeedAt("acrylic", T, "shear");
    closeRel(s, m.shear! + m.dShearDT! * (T - m.referenceTemperature), 1e-14);
  }
  // the brief's figure for acrylic: roughly 2–3 m/s per kelvin, falling
  const drop = bundled.materialSpeedAt("acrylic", 293.15) -
    bundled.materialSpeedAt("acrylic", 303.15);
  assert.ok(drop >= 20 && drop <= 30, `acrylic drop over 10 K: ${drop}`);
  assert.throws(
    () => bundled.materialSpeedAt("acrylic", hi + 10),
    (e: unknown) =>
      e instanceof OutOfRangeError && e.quantity === "temperature" && e.range[1] === hi,
  );
  const warnings: Warning[] = [];
  const c = bundled.materialSpeedAt("acrylic", hi + 10, "longitudinal", {
    extrapolate: true,
    warnings,
  });
  assert.equal(warnings.length, 1);
  assert.equal(warnings[0].code, "extrapolated");
  assert.ok(c < bundled.materialSpeedAt("acrylic", hi));
  assert.throws(() => bundled.materialSpeedAt("acrylic", Number.NaN), InputError);
});

Deno.test("materialSpeedAt without a coefficient holds only near the reference temperature", () => {
  const m = bundled.material("copper");
  assert.equal(m.dLongitudinalDT, undefined, "copper has no coefficient in the data");
  assert.equal(bundled.materialSpeedAt("copper", m.referenceTemperature + 3), m.longitudinal);
  assert.throws(
    () => bundled.materialSpeedAt("copper", m.referenceTemperature + 40),
    OutOfRangeError,
  );
  const warnings: Warning[] = [];
  assert.equal(
    bundled.materialSpeedAt("copper", 350, "shear", { extrapolate: true, warnings }),
    m.shear,
  );
  assert.equal(warnings.length, 1);
});

Deno.test("materialSpeedAt refuses a shear speed the data do not hold", () => {
  assert.equal(bundled.material("rubber").shear, undefined);
  assert.throws(
    () => bundled.materialSpeedAt("rubber", 293.15, "shear"),
    (e: unknown) => e instanceof InputError && e.field === "mode",
  );
  assert.throws(() => bundled.materialSpeedAt("rubber", 293.15, "torsion" as "shear"), InputError);
  assert.throws(() => bundled.materialSpeedAt("rubbr", 293.15), NotFoundError);
});
