/**
 * Property-based tests of lib/pipe (fast-check, seeded): every catalogue record resolves to its
 * own figures under any spelling the reader accepts; random measured pipes (diameter or
 * circumference, wall, lining layers) hold ID = OD − 2·wall, bore = ID − 2·Σ lining,
 * 0 < bore ≤ ID < OD, or are refused with a named error; any junk spec gives a named error.
 */
import fc from "fast-check";
import { assert } from "../_assert.ts";
import { InputError } from "../../lib/errors.ts";
import { defaultRegistry } from "../../lib/registry/mod.ts";
import { pipe, type PipeSpec, PLAUSIBLE_OUTSIDE_DIAMETER } from "../../lib/pipe/mod.ts";
import { logUniform, outcome, RUNS, Tally } from "./_check.ts";

const reg = defaultRegistry();
const RECORDS = reg.pipes();
const MATERIALS = reg.materials().map((m) => m.id);

function invariants(p: ReturnType<typeof pipe>, liningSum: number | undefined): void {
  const at = `OD ${p.outsideDiameter}, wall ${p.wallThickness}`;
  assert.ok(p.wallThickness > 0 && p.wallThickness < p.outsideDiameter / 2, at);
  assert.equal(p.insideDiameter, p.outsideDiameter - 2 * p.wallThickness, at);
  const sum = liningSum ?? p.lining.reduce((s, l) => s + l.thickness, 0);
  const bore = p.insideDiameter - 2 * sum;
  assert.ok(Math.abs(p.boreDiameter - bore) <= 1e-12 * p.outsideDiameter, `${at}: bore`);
  assert.ok(p.boreDiameter > 0 && p.boreDiameter <= p.insideDiameter, `${at}: bore range`);
  // ≤, not <: a wall of a few denormal metres (accepted: only wall > 0 is asked) leaves
  // OD − 2·wall equal to OD in floating point.
  assert.ok(p.insideDiameter <= p.outsideDiameter, at);
}

Deno.test("pipe property: every catalogue record resolves to its own figures", () => {
  const spelling = fc.constantFrom("as-is", "number", "lower", "padded");
  fc.assert(
    fc.property(fc.constantFrom(...RECORDS), spelling, (rec, how) => {
      const nps = how === "number" ? rec.nominalSize : how === "padded" ? ` ${rec.nps} ` : rec.nps;
      const schedule = how === "lower" ? rec.schedule.toLowerCase() : rec.schedule;
      const standard = how === "lower" ? rec.standardId : rec.standard;
      const o = outcome(
        `pipe(${rec.standard} ${rec.nps} ${rec.schedule} as ${how})`,
        () => pipe({ standard, nps, schedule }),
      );
      if (!o.ok) {
        // Another spelling may be ambiguous or not accepted: a named refusal, never a wrong pipe.
        assert.ok(
          how !== "as-is",
          `${rec.standard} ${rec.nps} ${rec.schedule}: ${o.error.message}`,
        );
        return;
      }
      const p = o.value;
      assert.equal(p.outsideDiameter, rec.outsideDiameter);
      assert.equal(p.wallThickness, rec.wallThickness);
      assert.equal(p.standardId, rec.standardId);
      invariants(p, undefined);
    }),
    RUNS,
  );
});

/** A positive length on a log scale from 10 µm to 100 m, or an awkward value. */
const unit = fc.integer({ min: 0, max: 1_000_000 }).map((i) => i / 1_000_000);
const length = fc.oneof(
  { arbitrary: unit.map((u) => logUniform(u, 1e-5, 100)), weight: 6 },
  fc.constantFrom(0, -0.001, Number.NaN, Infinity, -Infinity, 1e308, 5e-324),
);
const liningMaterial = fc.constantFrom("cement-mortar", "epoxy", "rubber", "");
const lining = fc.array(fc.record({ material: liningMaterial, thickness: length }), {
  maxLength: 3,
});
/** Lining layers as fractions of the outside diameter (mostly thin), or awkward ones. */
const liningFractions = fc.array(
  fc.record({
    material: fc.oneof({ arbitrary: fc.constant("cement-mortar"), weight: 5 }, liningMaterial),
    fraction: fc.oneof(
      { arbitrary: unit.map((u) => 0.1 * u), weight: 5 },
      fc.constantFrom(0, -0.01, 0.3, Number.NaN),
    ),
  }),
  { maxLength: 3 },
);

Deno.test("pipe property: measured pipes hold their invariants or are refused by name", () => {
  const tally = new Tally();
  fc.assert(
    fc.property(
      fc.boolean(),
      length,
      fc.oneof(unit.map((u) => 0.6 * u), fc.double({ min: 0, max: 0.6, noNaN: true })),
      fc.option(length),
      liningFractions,
      fc.constantFrom(...MATERIALS, "unobtainium"),
      (byCircumference, size, wallFraction, tape, fractions, material) => {
        const wall = size * wallFraction;
        const layers = fractions.map((l) => ({
          material: l.material,
          thickness: l.fraction * size,
        }));
        const spec: PipeSpec = {
          ...(byCircumference
            ? { circumference: size * Math.PI, ...(tape === null ? {} : { tapeThickness: tape }) }
            : { outsideDiameter: size }),
          wallThickness: wall,
          material,
          ...(layers.length ? { lining: layers } : {}),
        };
        const o = tally.add(outcome(`pipe(${JSON.stringify(spec)})`, () => pipe(spec)));
        const sum = layers.reduce((s, l) => s + l.thickness, 0);
        if (o.ok) {
          assert.notEqual(material, "unobtainium", "an unknown material must be refused");
          invariants(o.value, sum);
          const od = o.value.outsideDiameter;
          assert.ok(od >= PLAUSIBLE_OUTSIDE_DIAMETER[0] && od <= PLAUSIBLE_OUTSIDE_DIAMETER[1]);
          return;
        }
        // A plainly good measured pipe must not be refused; an unknown material always is.
        if (material === "unobtainium") {
          assert.match(o.error.message, /material/);
          return;
        }
        const good = !byCircumference && size >= 0.003 && size <= 6 && wall > 0 &&
          wallFraction < 0.49 && layers.every((l) => l.material && l.thickness > 0) &&
          sum < 0.45 * (size - 2 * wall) && Number.isFinite(sum);
        assert.ok(!good, `refused a good pipe: ${o.error.message}`);
      },
    ),
    RUNS,
  );
  console.log(tally.line("pipe measured"));
  assert.ok(tally.ok > 1000 && tally.refusals > 1000);
});

Deno.test("pipe property: junk specs and unknown catalogue entries give named errors", () => {
  const tally = new Tally();
  const standards = [...new Set(RECORDS.map((r) => r.standard))];
  const junkValue = fc.oneof(
    fc.anything(),
    fc.double(),
    fc.string({ maxLength: 8 }),
    fc.constantFrom("4", "1-1/2", "40", "STD", "DR 11", "__proto__", "constructor"),
  );
  const catalogue = fc.record(
    {
      standard: fc.oneof(fc.constantFrom(...standards), junkValue),
      nps: junkValue,
      schedule: junkValue,
      material: junkValue,
      lining: fc.oneof(lining, junkValue),
    },
    { requiredKeys: [] },
  );
  const measured = fc.record(
    {
      outsideDiameter: fc.oneof(length, junkValue),
      circumference: fc.oneof(length, junkValue),
      tapeThickness: fc.oneof(length, junkValue),
      wallThickness: fc.oneof(length, junkValue),
      material: junkValue,
      lining: fc.oneof(lining, junkValue),
      uncertainty: fc.oneof(
        fc.record({ outsideDiameter: length, wallThickness: length }),
        junkValue,
      ),
      toleranceFrom: junkValue,
    },
    { requiredKeys: [] },
  );
  fc.assert(
    fc.property(fc.oneof(catalogue, measured, fc.anything()), fc.boolean(), (spec, extrapolate) => {
      const o = tally.add(
        outcome("pipe(junk)", () => pipe(spec as PipeSpec, { extrapolate, warnings: [] })),
      );
      if (o.ok) invariants(o.value, undefined);
      else assert.ok(o.error instanceof InputError || o.error.name === "OutOfRangeError");
    }),
    RUNS,
  );
  console.log(tally.line("pipe junk"));
});
