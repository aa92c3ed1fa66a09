/**
 * pipe(): catalogue and measured pipes, linings, tolerances, refusals naming the field.
 */
import { assert, closeAbs, closeRel } from "../_assert.ts";
import { InputError, NotFoundError, OutOfRangeError, type Warning } from "../../lib/errors.ts";
import { pipe } from "../../lib/pipe/mod.ts";

function refusedField(f: () => unknown, field: string): void {
  assert.throws(f, (e: unknown) => {
    assert.ok(e instanceof InputError, `expected InputError, got ${e}`);
    assert.equal(e.field, field, e.message);
    return true;
  });
}

Deno.test("catalogue pipe: geometry, default lining, tolerances and trace", () => {
  const p = pipe({ standard: "AWWA C151", nps: "12", schedule: "350" });
  assert.equal(p.origin, "catalogue");
  assert.equal(p.lining.length, 1);
  closeAbs(p.boreDiameter, p.insideDiameter - 2 * p.lining[0].thickness, 1e-15, "bore");
  assert.ok(p.tolerances && p.tolerances.set === "ductile-iron-c151");
  assert.ok(p.trace.some((t) => t.source === "awwa-c104" && t.basis === "recalled"));
  assert.ok(p.trace.every((t) => typeof t.value !== "number" || Number.isFinite(t.value)));
  const bare = pipe({ standard: "AWWA C151", nps: "12", schedule: "350", lining: [] });
  assert.equal(bare.lining.length, 0);
  assert.equal(bare.boreDiameter, bare.insideDiameter);
});

Deno.test("steel wall tolerance is the -12.5 % rule (ASTM A530 minimum wall, recalled)", () => {
  const p = pipe({ standard: "ASME B36.10M", nps: "8", schedule: "40" });
  closeRel(p.tolerances!.wallThickness.minus!, 0.125 * 8.18e-3, 1e-12, "wall minus");
  assert.equal(p.tolerances!.wallThickness.plus, undefined);
  // NPS 8 (OD 219.1 mm) falls in the NPS 5-8 band: +1.6 / -0.8 mm.
  closeAbs(p.tolerances!.outsideDiameter.plus!, 1.6e-3, 1e-15, "OD plus");
});

Deno.test("measured by circumference: OD = C/pi minus tape thickness", () => {
  const c = 0.359;
  const m = pipe({
    circumference: c,
    tapeThickness: 0.0002,
    wallThickness: 0.006,
    material: "carbon-steel",
  });
  closeAbs(m.outsideDiameter, c / Math.PI - 0.0002, 1e-15, "OD");
  closeAbs(m.insideDiameter, m.outsideDiameter - 0.012, 1e-15, "ID");
  assert.equal(m.tolerances, undefined);
  assert.ok(m.trace.some((t) => t.basis === "measured" && t.value === c));
});

Deno.test("measured with lining layers, uncertainty and tolerance sets", () => {
  const m = pipe({
    outsideDiameter: 0.2191,
    wallThickness: 0.0082,
    material: "ductile-iron",
    lining: [
      { material: "cement-mortar", thickness: 0.004 },
      { material: "epoxy", thickness: 0.0005 },
    ],
    uncertainty: { circumference: 0.001 * Math.PI, wallThickness: 0.0001 },
  });
  closeAbs(m.boreDiameter, 0.2191 - 2 * 0.0082 - 2 * 0.0045, 1e-15, "bore");
  assert.equal(m.tolerances!.origin, "measurement");
  closeAbs(m.tolerances!.outsideDiameter.plus!, 0.001, 1e-15, "u(OD) from u(C)/pi");
  const t = pipe({
    outsideDiameter: 0.1143,
    wallThickness: 0.006,
    material: "pvc",
    toleranceFrom: "pvc",
  });
  closeRel(t.tolerances!.wallThickness.plus!, 0.12 * 0.006, 1e-12, "PVC +12 %");
  assert.equal(t.tolerances!.wallThickness.minus, 0);
  assert.throws(
    () => pipe({ outsideDiameter: 0.1, wallThickness: 0.005, material: "x", toleranceFrom: "zz" }),
    NotFoundError,
  );
});

Deno.test("refusals name the field", () => {
  refusedField(
    () => pipe({ outsideDiameter: 0.1, wallThickness: 0.05, material: "pvc" }),
    "wallThickness",
  );
  refusedField(
    () => pipe({ outsideDiameter: 0.1, wallThickness: 0, material: "pvc" }),
    "wallThickness",
  );
  refusedField(
    () => pipe({ outsideDiameter: -0.1, wallThickness: 0.01, material: "pvc" }),
    "outsideDiameter",
  );
  refusedField(
    () => pipe({ outsideDiameter: Number.NaN, wallThickness: 0.01, material: "pvc" }),
    "outsideDiameter",
  );
  refusedField(
    () => pipe({ outsideDiameter: 0.1, circumference: 0.3, wallThickness: 0.01, material: "pvc" }),
    "outsideDiameter/circumference",
  );
  refusedField(
    () => pipe({ circumference: 0.3, tapeThickness: 0.2, wallThickness: 0.01, material: "pvc" }),
    "tapeThickness",
  );
  refusedField(() => pipe({ outsideDiameter: 0.1, wallThickness: 0.01, material: "" }), "material");
  refusedField(
    () =>
      pipe({
        outsideDiameter: 0.1,
        wallThickness: 0.01,
        material: "pvc",
        lining: [{ material: "cement-mortar", thickness: 0.03 }, {
          material: "epoxy",
          thickness: 0.01,
        }],
      }),
    "lining",
  );
  refusedField(
    () =>
      pipe({
        outsideDiameter: 0.1,
        wallThickness: 0.01,
        material: "pvc",
        lining: { material: "epoxy", thickness: -1 },
      }),
    "lining[0].thickness",
  );
  refusedField(
    // deno-lint-ignore no-explicit-any
    () => pipe({ standard: "B36.10M", nps: 4, schedule: "40", wallThickness: 0.01 } as any),
    "pipe",
  );
  // deno-lint-ignore no-explicit-any
  refusedField(() => pipe({ standard: "B36.10M", nps: 4 } as any), "schedule");
});

Deno.test("an implausible measured size throws unless extrapolation is asked for", () => {
  const spec = { outsideDiameter: 8, wallThickness: 0.02, material: "carbon-steel" };
  assert.throws(() => pipe(spec), OutOfRangeError);
  const warnings: Warning[] = [];
  const p = pipe(spec, { extrapolate: true, warnings });
  assert.equal(warnings.length, 1);
  assert.equal(p.warnings.length, 1);
});
