/**
 * Behaviour of lib/units.ts at the edges: temperatures converted (never subtracted), wrong
 * dimensions named by field, bare numbers refused except ratios, gauge pressures.
 * Expected values are unit definitions (SI brochure; NIST SP 811), not our own output.
 */
import fc from "fast-check";
import { assert, closeRel } from "./_assert.ts";
import { UnitError } from "../lib/errors.ts";
import { parseQuantity, parseQuantityFull, toUnit } from "../lib/units.ts";

const ATM = 101325; // Pa, standard atmosphere (definition)

Deno.test("temperatures are converted, not treated as differences", () => {
  closeRel(parseQuantity("12 degC", "temperature", "T"), 285.15, 1e-15);
  closeRel(parseQuantity("0 degC", "temperature", "T"), 273.15, 1e-15);
  closeRel(parseQuantity("54 degF", "temperature", "T"), 273.15 + (54 - 32) * 5 / 9, 1e-15);
  closeRel(parseQuantity("285.15 K", "temperature", "T"), 285.15, 1e-15);
  closeRel(parseQuantity("491.67 degR", "temperature", "T"), 273.15, 1e-12);
  // −40 is the same temperature on both scales
  closeRel(
    parseQuantity("-40 degF", "temperature", "T"),
    parseQuantity("-40 degC", "temperature", "T"),
    1e-15,
  );
  // typographic minus and the "deg C" spelling
  closeRel(parseQuantity("\u22125 deg C", "temperature", "T"), 268.15, 1e-15);
  // a difference of 9 degF is 5 K, a difference of 5 degC is 5 K (not 278.15)
  closeRel(parseQuantity("9 degF", "temperatureDifference", "dT"), 5, 1e-15);
  closeRel(parseQuantity("5 degC", "temperatureDifference", "dT"), 5, 1e-15);
});

Deno.test("a wrong dimension names the field and what is accepted", () => {
  const cases: [string, Parameters<typeof parseQuantity>[1], string][] = [
    ["12 m", "temperature", "fluid.temperature"],
    ["12 degC", "length", "pipe.outsideDiameter"],
    ["5 barg", "speed", "wedge.soundSpeed"],
    ["20 L/s", "speed", "flow.velocity"],
    ["1 MHz", "time", "timing.resolution"],
    ["12 kg/m^3", "dynamicViscosity", "fluid.viscosity"],
  ];
  for (const [text, dim, field] of cases) {
    assert.throws(
      () => parseQuantity(text, dim, field),
      (e: unknown) =>
        e instanceof UnitError && e.field === field && e.message.startsWith(`${field}:`) &&
        e.message.includes(JSON.stringify(text)) && e.exitCode === 2,
      `${text} as ${dim}`,
    );
  }
});

Deno.test("bare numbers are refused except for ratios", () => {
  for (const dim of ["length", "temperature", "pressure", "speed", "flowRate"] as const) {
    assert.throws(() => parseQuantity("12", dim, "f"), UnitError, `"12" as ${dim}`);
    // a number where a string was expected (for example from YAML)
    assert.throws(() => parseQuantity(12 as unknown as string, dim, "f"), UnitError);
  }
  assert.equal(parseQuantity("0.02", "ratio", "r"), 0.02);
  assert.equal(parseQuantity(0.02 as unknown as string, "ratio", "r"), 0.02);
  closeRel(parseQuantity("2 %", "ratio", "r"), 0.02, 1e-15);
  closeRel(parseQuantity("500 ppm", "ratio", "r"), 5e-4, 1e-15);
  for (const bad of ["", "abc", "12 furlongs", "1.2.3 m", "NaN m", "Infinity m"]) {
    assert.throws(() => parseQuantity(bad, "length", "f"), UnitError, JSON.stringify(bad));
  }
});

Deno.test("gauge pressures add one standard atmosphere; absolute ones do not", () => {
  closeRel(parseQuantity("4 barg", "pressure", "p"), 4e5 + ATM, 1e-15);
  closeRel(parseQuantity("0 barg", "pressure", "p"), ATM, 1e-15);
  closeRel(parseQuantity("4 bara", "pressure", "p"), 4e5, 1e-15);
  closeRel(parseQuantity("4 bar", "pressure", "p"), 4e5, 1e-15);
  // psi = lbf/in² exactly: 0.45359237 kg × 9.80665 m/s² / (0.0254 m)² (NIST SP 811)
  const psi = 0.45359237 * 9.80665 / (0.0254 * 0.0254);
  closeRel(parseQuantity("58 psig", "pressure", "p"), 58 * psi + ATM, 1e-14);
  closeRel(parseQuantity("58 psia", "pressure", "p"), 58 * psi, 1e-14);
  closeRel(
    parseQuantity("58 psig", "pressure", "p") - parseQuantity("58 psi", "pressure", "p"),
    ATM,
    1e-9,
  );
  assert.throws(() => parseQuantity("4 barg", "length", "l"), UnitError);
});

Deno.test("the mathjs fallback reads expressions and refuses code", async () => {
  closeRel(await parseQuantityFull("5 ft + 3 inch", "length", "l"), 5 * 0.3048 + 3 * 0.0254, 1e-12);
  closeRel(await parseQuantityFull("12 degC", "temperature", "T"), 285.15, 1e-15);
  await assert.rejects(() => parseQuantityFull("12 m", "temperature", "T"), UnitError);
  await assert.rejects(() => parseQuantityFull("3 kg + 2 m", "length", "l"), UnitError);
  for (const code of ["import({}, {})", 'evaluate("1 m")', "sqrt(4) m", "[1, 2] m", "a = 3 m"]) {
    await assert.rejects(() => parseQuantityFull(code, "length", "l"), UnitError, code);
  }
});

Deno.test("toUnit inverts parseQuantity (property)", () => {
  const units: [string, Parameters<typeof parseQuantity>[1]][] = [
    ["mm", "length"],
    ["in", "length"],
    ["degC", "temperature"],
    ["degF", "temperature"],
    ["L/s", "flowRate"],
    ["us", "time"],
    ["m/s", "speed"],
  ];
  fc.assert(
    fc.property(
      fc.double({ min: 0.001, max: 1e4, noNaN: true }),
      fc.constantFrom(...units),
      (x, [u, dim]) => {
        const back = toUnit(parseQuantity(`${x} ${u}`, dim, "x"), u, 12);
        return Math.abs(back - x) <= 1e-9 * Math.max(1, Math.abs(x));
      },
    ),
  );
});
