/**
 * Property-based tests of lib/units.ts (fast-check, seeded): random numbers × units read back
 * through toUnit, linearity of the unit factors, and random or hostile text that must give a
 * finite SI value or a UnitError, never NaN, Infinity or another exception.
 */
import fc from "fast-check";
import { assert } from "../_assert.ts";
import { UnitError } from "../../lib/errors.ts";
import { type Dimension, parseQuantity, toUnit } from "../../lib/units.ts";
import { outcome, RUNS, Tally } from "./_check.ts";

/** Display units per dimension that toUnit can write back (no gauge pressures). */
const UNITS: Record<Dimension, readonly string[]> = {
  length: ["m", "mm", "cm", "km", "um", "in", "ft", "yd", "mil", "inch", "feet"],
  area: ["m^2", "mm^2", "in^2", "ft^2", "cm²"],
  volume: ["L", "mL", "m^3", "gal", "ft^3", "m³"],
  mass: ["kg", "g", "lb", "t", "mg"],
  time: ["s", "ms", "us", "ns", "ps", "min", "h", "d"],
  frequency: ["Hz", "kHz", "MHz", "GHz"],
  temperature: ["degC", "degF", "K", "degR", "°C", "°F"],
  temperatureDifference: ["K", "degC", "degF"],
  pressure: ["Pa", "kPa", "MPa", "bar", "mbar", "psi", "atm", "kpsi"],
  flowRate: ["m^3/s", "L/s", "m^3/h", "L/min", "gpm", "ML/d", "gal/min", "ft^3/s"],
  speed: ["m/s", "ft/s", "mm/us", "km/h", "in/s"],
  angle: ["deg", "rad", "mrad", "°"],
  density: ["kg/m^3", "g/cm^3", "lb/ft^3", "g/L"],
  dynamicViscosity: ["Pa s", "mPa s", "cP", "P", "Pa·s"],
  kinematicViscosity: ["m^2/s", "mm^2/s", "cSt", "St"],
  ratio: ["%", "ppm"],
  attenuation: ["1/m", "1/mm", "1/km"],
};
const DIMENSIONS = Object.keys(UNITS) as Dimension[];
const TEMPERATURE_UNITS = new Set(["degC", "degF", "K", "degR", "°C", "°F"]);

/** A dimension and one of its units. */
const dimUnit = fc.constantFrom(...DIMENSIONS).chain((d) =>
  fc.constantFrom(...UNITS[d]).map((u) => ({ d, u }))
);

/** A finite double of moderate magnitude (no underflow or overflow once scaled), or zero. */
const moderate = fc.oneof(
  fc.constant(0),
  fc.double({ min: 1e-150, max: 1e150, noNaN: true }).chain((x) =>
    fc.boolean().map((neg) => neg ? -x : x)
  ),
  fc.integer({ min: -1_000_000, max: 1_000_000 }),
);

Deno.test("units property: value × unit reads to SI and writes back through toUnit", () => {
  // toUnit writes temperatures as temperatures (offset scales), so differences are left out
  // here and checked against their factors below.
  const writable = dimUnit.filter(({ d }) => d !== "temperatureDifference");
  fc.assert(
    fc.property(writable, moderate, ({ d, u }, x) => {
      // A temperature below absolute zero is still read (the reader's limits refuse it later).
      const text = `${x} ${u}`;
      const o = outcome(
        `parseQuantity(${JSON.stringify(text)}, ${d})`,
        () => parseQuantity(text, d, "field"),
      );
      if (!o.ok) throw new Error(`${text} (${d}) refused: ${o.error.message}`);
      const back = toUnit(o.value, u, 17);
      if (d === "temperature" && TEMPERATURE_UNITS.has(u)) {
        // Offset scales: the absolute error is bounded by the offset's rounding.
        return Math.abs(back - x) <= 1e-12 * Math.max(Math.abs(x), 1000);
      }
      return x === 0 ? back === 0 : Math.abs(back / x - 1) <= 1e-12;
    }),
    RUNS,
  );
});

Deno.test("units property: linear units scale linearly (x u = x · (1 u))", () => {
  const linear = dimUnit.filter(({ d }) => d !== "temperature");
  fc.assert(
    fc.property(linear, moderate, ({ d, u }, x) => {
      const one = parseQuantity(`1 ${u}`, d, "f");
      const v = parseQuantity(`${x} ${u}`, d, "f");
      return x === 0 ? v === 0 : Math.abs(v / (x * one) - 1) <= 1e-14;
    }),
    RUNS,
  );
});

Deno.test("units property: temperature differences scale by 1 (K, degC) or 5/9 (degF)", () => {
  // Factors: the definitions of the kelvin and the degree Fahrenheit (ITS-90; NIST SP 811 B.9).
  const factor: Record<string, number> = { K: 1, degC: 1, degF: 5 / 9 };
  fc.assert(
    fc.property(fc.constantFrom("K", "degC", "degF"), moderate, (u, x) => {
      const v = parseQuantity(`${x} ${u}`, "temperatureDifference", "f");
      return x === 0 ? v === 0 : Math.abs(v / (x * factor[u]) - 1) <= 1e-15;
    }),
    RUNS,
  );
});

Deno.test("units property: any double with any unit gives a finite value or a UnitError", () => {
  const tally = new Tally();
  const anyDouble = fc.oneof(
    fc.double(),
    fc.constantFrom(1e308, -1e308, 1.7976931348623157e308, 5e-324, 1e-320),
  );
  // Half the cases ask for the unit's own dimension, half for a random one.
  const asked = dimUnit.chain(({ d, u }) =>
    fc.oneof(fc.constant(d), fc.constantFrom(...DIMENSIONS)).map((a) => ({ d: a, u }))
  );
  fc.assert(
    fc.property(asked, anyDouble, ({ d, u }, x) => {
      const text = `${x} ${u}`;
      const o = tally.add(
        outcome(
          `parseQuantity(${JSON.stringify(text)}, ${d})`,
          () => parseQuantity(text, d, "field"),
        ),
      );
      if (!o.ok && !(o.error instanceof UnitError)) {
        throw new Error(`${text}: ${o.error.name} instead of UnitError`);
      }
    }),
    RUNS,
  );
  console.log(tally.line("parseQuantity over all doubles × units × dimensions"));
  assert.ok(tally.ok > 1000 && tally.refusals > 1000, "both outcomes should occur");
});

/** Text that looks like a quantity but is mangled: numbers, units, operators, spaces, junk. */
const quantityish = fc.array(
  fc.oneof(
    fc.constantFrom(
      "1",
      "-2.5",
      "1e308",
      "1e400",
      "-1e-400",
      ".5",
      "5.",
      "NaN",
      "Infinity",
      "-inf",
      ".inf",
      "0x10",
      "1_000",
      "1,5",
      "−3",
      "+",
      "e5",
      "1e",
      "..",
    ),
    fc.constantFrom(
      "m",
      "mm",
      "degC",
      "°",
      "°C",
      "K",
      "bar",
      "barg",
      "psig",
      "L/s",
      "m^3/h",
      "m^-3",
      "m^99999",
      "mm^-999",
      "/",
      "//",
      "^",
      "^2",
      "²",
      "³",
      "*",
      "·",
      "1/",
      "(",
      ")",
      "µm",
      "kkm",
      "Mm",
      "GHz",
      "deg C",
      "ppm",
      "%",
      "'",
      '"',
    ),
    fc.constantFrom(" ", "  ", "\t", "\n", "\u00a0", ""),
    fc.string({ maxLength: 4 }),
  ),
  { maxLength: 8 },
).map((parts) => parts.join(""));

Deno.test("units property: random and mangled text gives a finite value or a UnitError", () => {
  const tally = new Tally();
  const nearlyValid = fc.tuple(
    fc.string({ maxLength: 2 }),
    fc.oneof(fc.double().map(String), fc.integer().map(String)),
    fc.constantFrom("", " ", "  "),
    dimUnit.map(({ u }) => u),
    fc.string({ maxLength: 2 }),
  ).map((p) => p.join(""));
  const text = fc.oneof(
    nearlyValid,
    quantityish,
    fc.string({ maxLength: 40 }),
    fc.string({ unit: "binary", maxLength: 40 }),
    fc.string({ unit: "grapheme", maxLength: 20 }),
  );
  fc.assert(
    fc.property(fc.constantFrom(...DIMENSIONS), text, (d, t) => {
      const o = tally.add(
        outcome(`parseQuantity(${JSON.stringify(t)}, ${d})`, () => parseQuantity(t, d, "field")),
      );
      if (!o.ok && !(o.error instanceof UnitError)) {
        throw new Error(`${JSON.stringify(t)}: ${o.error.name} instead of UnitError`);
      }
    }),
    RUNS,
  );
  console.log(tally.line("parseQuantity over random text"));
  assert.ok(tally.refusals > 0);
});

Deno.test("units property: values that are not text give a UnitError (ratios may be numbers)", () => {
  fc.assert(
    fc.property(fc.constantFrom(...DIMENSIONS), fc.anything(), (d, v) => {
      const o = outcome(
        `parseQuantity(${typeof v}, ${d})`,
        () => parseQuantity(v as string, d, "field"),
      );
      if (typeof v === "string") return;
      if (o.ok) {
        assert.ok(d === "ratio" && typeof v === "number", `accepted ${String(v)} for ${d}`);
      } else assert.ok(o.error instanceof UnitError, o.error.name);
    }),
    { ...RUNS, numRuns: 2000 },
  );
});
