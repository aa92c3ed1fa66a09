/**
 * Outside check of lib/units.ts's fast table against mathjs (npm mathjs 15.1.1, pinned in
 * deno.json), an independent implementation of unit conversion: every base unit, every
 * prefixed form, every temperature and gauge/absolute pressure unit must agree to 1e-12
 * relative. Where mathjs has no such unit, the comparison is against the unit's definition
 * written in mathjs units, and the test says so.
 */
import { assert, closeRel } from "../_assert.ts";
import { fastTable, loadMathjs, parseQuantity, unitFactor } from "../../lib/units.ts";

/**
 * Our unit name → the mathjs expression it must equal. "def:" marks a unit mathjs does
 * not know, compared with its definition instead (common practice / SI brochure).
 */
const MATHJS: Record<string, string> = {
  m: "1 m",
  in: "1 inch",
  inch: "1 inch",
  inches: "1 inch",
  '"': "1 inch",
  ft: "1 ft",
  foot: "1 ft",
  feet: "1 ft",
  "'": "1 ft",
  yd: "1 yd",
  mil: "1 mil",
  g: "1 g",
  lb: "1 lbm",
  lbm: "1 lbm",
  t: "1 tonne",
  s: "1 s",
  sec: "1 s",
  min: "1 minute",
  h: "1 hour",
  hr: "1 hour",
  hour: "1 hour",
  d: "1 day",
  day: "1 day",
  Hz: "1 Hz",
  Pa: "1 Pa",
  bar: "1 bar",
  atm: "1 atm",
  // mathjs's own `psi` is a rounded constant (6894.75729276459 Pa, 5.9e-11 low); the exact
  // value is lbf/in² = 6.894 757 293 168 E+03 Pa (NIST SP 811, B.8), which is what we use.
  psi: "1 lbf/inch^2",
  L: "1 L",
  l: "1 L",
  gal: "1 gallon",
  gallon: "1 gallon",
  gallons: "1 gallon",
  gpm: "1 gallon/minute",
  P: "def: 0.1 Pa s", // poise (CGS), 1 P = 0.1 Pa·s
  St: "def: 1 cm^2/s", // stokes (CGS)
  rad: "1 rad",
  deg: "1 deg",
  degree: "1 deg",
  degrees: "1 deg",
  "°": "1 deg",
  "%": "def: 0.01",
  percent: "def: 0.01",
  ppm: "def: 0.000001",
  Np: "def: 1", // neper: amplitude ratio, dimensionless in SI
};

/** mathjs spelling of our prefixes (µ and μ are both micro, u in mathjs). */
const MATHJS_PREFIX: Record<string, string> = { "µ": "u", "μ": "u" };

// deno-lint-ignore no-explicit-any
function siValue(math: any, expr: string): number {
  const text = expr.startsWith("def: ") ? expr.slice(5) : expr;
  if (/^[\d.e+-]+$/.test(text)) return Number(text);
  return math.unit(text).toSI().toJSON().value;
}

Deno.test("every base unit of the fast table equals mathjs to 1e-12 (mathjs 15.1.1)", async () => {
  const math = await loadMathjs();
  const table = fastTable();
  assert.ok(table.units.length > 30, "table read");
  for (const { unit } of table.units) {
    const expr = MATHJS[unit];
    assert.ok(
      expr !== undefined,
      `unit '${unit}' of the fast table has no mathjs counterpart in this test`,
    );
    const ours = unitFactor(unit);
    assert.ok(ours !== undefined, `fast table does not read its own unit '${unit}'`);
    closeRel(ours!, siValue(math, expr), 1e-12, `unit ${unit} vs mathjs ${expr}`);
  }
});

Deno.test("every prefixed unit of the fast table equals mathjs to 1e-12 (mathjs 15.1.1)", async () => {
  const math = await loadMathjs();
  const table = fastTable();
  let n = 0;
  for (const { prefix, factor } of table.prefixes) {
    // the prefix itself, through mathjs: 1 <prefix>m in metres
    const p = MATHJS_PREFIX[prefix] ?? prefix;
    closeRel(factor, math.unit(`1 ${p}m`).toNumber("m"), 1e-12, `prefix ${prefix}`);
    for (const { unit, prefix: takes } of table.units) {
      if (!takes) continue;
      const name = prefix + unit;
      const ours = unitFactor(name);
      assert.ok(ours !== undefined, `fast table does not read '${name}'`);
      const expected = math.unit(`1 ${p}m`).toNumber("m") * siValue(math, MATHJS[unit]);
      closeRel(ours!, expected, 1e-12, `unit ${name}`);
      n++;
    }
  }
  assert.ok(n > 100, "prefixed forms checked");
});

Deno.test("compound units used in the trade equal mathjs to 1e-12 (mathjs 15.1.1)", async () => {
  const math = await loadMathjs();
  const cases: [string, string, Parameters<typeof parseQuantity>[1]][] = [
    ["3.5 m^3/h", "3.5 m^3/hour", "flowRate"],
    ["20 L/s", "20 L/s", "flowRate"],
    ["300 gpm", "300 gallon/minute", "flowRate"],
    ["5 ML/d", "5 ML/day", "flowRate"],
    ["4862 ft/s", "4862 ft/s", "speed"],
    ["1.48 mm/us", "1.48 mm/us", "speed"],
    ["998 kg/m^3", "998 kg/m^3", "density"],
    ["0.998 g/cm^3", "0.998 g/cm^3", "density"],
    ["62.4 lb/ft^3", "62.4 lbm/ft^3", "density"],
    ["72 psi", "72 lbf/inch^2", "pressure"],
    ["0.5 MPa", "0.5 MPa", "pressure"],
    ["15 in^2", "15 inch^2", "area"],
    ["1.2 m2", "1.2 m^2", "area"],
    ["12 us", "12 us", "time"],
    ["0.5 1/m", "0.5 m^-1", "attenuation"],
    ["0.002 mm^2/s", "0.002 mm^2/s", "kinematicViscosity"],
  ];
  for (const [ours, theirs, dim] of cases) {
    closeRel(parseQuantity(ours, dim, "x"), siValue(math, theirs), 1e-12, ours);
  }
});

Deno.test("temperatures are converted like mathjs converts them (mathjs 15.1.1)", async () => {
  const math = await loadMathjs();
  const table = fastTable();
  const names: Record<string, string> = {
    K: "K",
    kelvin: "K",
    degC: "degC",
    "°C": "degC",
    C: "degC",
    celsius: "degC",
    degF: "degF",
    "°F": "degF",
    F: "degF",
    fahrenheit: "degF",
    degR: "degR",
  };
  for (const t of table.temperatures) {
    assert.ok(
      names[t] !== undefined,
      `temperature unit '${t}' has no mathjs counterpart in this test`,
    );
    for (const x of [-40, 0, 12, 37.5, 100, 451]) {
      const ours = parseQuantity(`${x} ${t}`, "temperature", "T");
      const theirs = math.unit(x, names[t]).toNumber("K");
      if (theirs === 0) assert.ok(Math.abs(ours) < 1e-12, `${x} ${t}`);
      else closeRel(ours, theirs, 1e-12, `${x} ${t}`);
    }
  }
  for (const t of table.temperatureDifferences) {
    // a difference of 9 units: mathjs difference of two temperatures 9 units apart
    const name = names[t] ?? t;
    const diff = math.unit(19, name).toNumber("K") - math.unit(10, name).toNumber("K");
    closeRel(parseQuantity(`9 ${t}`, "temperatureDifference", "dT"), diff, 1e-12, `9 ${t}`);
  }
});

Deno.test("gauge and absolute pressures agree with mathjs plus one standard atmosphere", async () => {
  const math = await loadMathjs();
  const atm = math.unit("1 atm").toNumber("Pa");
  const expected: Record<string, (x: number) => number> = {
    barg: (x) => math.unit(x, "bar").toNumber("Pa") + atm,
    bara: (x) => math.unit(x, "bar").toNumber("Pa"),
    psig: (x) => x * math.unit("1 lbf/inch^2").toNumber("Pa") + atm,
    psia: (x) => x * math.unit("1 lbf/inch^2").toNumber("Pa"),
  };
  for (const p of fastTable().pressures) {
    assert.ok(expected[p] !== undefined, `pressure unit '${p}' not covered by this test`);
    for (const x of [0, 1, 4, 58, 150]) {
      closeRel(parseQuantity(`${x} ${p}`, "pressure", "p"), expected[p](x), 1e-12, `${x} ${p}`);
    }
  }
});
