/**
 * Property-based tests of lib/liquids (fast-check, seeded): every liquid over its temperature
 * range gives finite positive properties or a named error; the directions physics fixes hold
 * (sound speed, density and viscosity of the organic liquids fall as they warm; density rises
 * with pressure; seawater's sound speed and density rise with salinity); any id, temperature,
 * pressure or salinity gives a finite result or a named error.
 */
import fc from "fast-check";
import { assert } from "../_assert.ts";
import { NoPhysicalAnswerError } from "../../lib/errors.ts";
import { liquidProperties, liquids, type LiquidState, seawater } from "../../lib/liquids/mod.ts";
import { outcome, RUNS, Tally } from "./_check.ts";

const ALL = liquids();
const REGISTRY = ALL.filter((l) => l.id !== "water" && l.id !== "seawater");
/** Categories whose sound speed falls with temperature (every liquid but water-rich ones). */
const FALLING_C = new Set([
  "alcohol",
  "glycol",
  "polyol",
  "ketone",
  "aromatic hydrocarbon",
  "petroleum distillate",
  "lubricant",
  "refrigerant",
  "crude oil",
]);

function check(s: LiquidState): void {
  for (const k of ["soundSpeed", "density", "dynamicViscosity", "kinematicViscosity"] as const) {
    assert.ok(s[k] > 0, `${s.id}: ${k} = ${s[k]}`);
  }
  assert.ok(s.soundSpeedSpread >= 0, `${s.id}: spread ${s.soundSpeedSpread}`);
  const nu = s.dynamicViscosity / s.density;
  assert.ok(Math.abs(s.kinematicViscosity / nu - 1) < 1e-12, `${s.id}: ν ≠ μ/ρ`);
}

/** A liquid, a temperature inside its range and a pressure 1 atm … 10 MPa. */
const state = fc.constantFrom(...REGISTRY, ...ALL.filter((l) => l.id === "water")).chain((l) =>
  fc.tuple(
    fc.constant(l),
    fc.double({
      min: l.temperatureRange[0],
      max: Math.min(l.temperatureRange[1], 373.15),
      noNaN: true,
    }),
    fc.double({ min: 101325, max: 10e6, noNaN: true }),
  )
);

Deno.test("liquids property: every liquid over its range gives finite positive properties", () => {
  const tally = new Tally();
  const okBy = new Map<string, number>();
  fc.assert(
    fc.property(state, ([l, T, p]) => {
      const o = tally.add(
        outcome(`liquidProperties(${l.id}, ${T}, ${p})`, () => liquidProperties(l.id, T, p)),
      );
      if (o.ok) {
        check(o.value);
        okBy.set(l.id, (okBy.get(l.id) ?? 0) + 1);
      } else {
        // Inside its temperature range a liquid is refused only when it boils.
        assert.ok(o.error instanceof NoPhysicalAnswerError, `${l.id}: ${o.error.message}`);
      }
    }),
    RUNS,
  );
  console.log(tally.line("liquids in range"));
  for (const l of [...REGISTRY, { id: "water" }]) {
    assert.ok((okBy.get(l.id) ?? 0) > 0, `${l.id}: never gave a result in its own range`);
  }
});

Deno.test("liquids property: organic liquids get slower, lighter and thinner as they warm", () => {
  // Physics (recalled from any liquids handbook, e.g. CRC Handbook tables of sound speed and
  // density): dc/dT < 0 in non-aqueous liquids, dρ/dT < 0, dμ/dT < 0 in every liquid.
  fc.assert(
    fc.property(
      state.filter(([l]) => FALLING_C.has(l.category)),
      fc.double({ min: 0.5, max: 100, noNaN: true }),
      ([l, T1, p], dT) => {
        const T2 = Math.min(T1 + dT, l.temperatureRange[1]);
        if (!(T2 - T1 >= 0.5)) return;
        const a = outcome("", () => liquidProperties(l.id, T1, p));
        const b = outcome("", () => liquidProperties(l.id, T2, p));
        if (!a.ok || !b.ok) return; // a refusal (boiling) was checked above
        const A = a.value, B = b.value;
        const at = `${l.id} ${T1}→${T2} K at ${p} Pa`;
        assert.ok(B.soundSpeed < A.soundSpeed, `${at}: c ${A.soundSpeed} → ${B.soundSpeed}`);
        assert.ok(B.density < A.density, `${at}: rho ${A.density} → ${B.density}`);
        assert.ok(
          B.dynamicViscosity < A.dynamicViscosity,
          `${at}: mu ${A.dynamicViscosity} → ${B.dynamicViscosity}`,
        );
      },
    ),
    RUNS,
  );
});

Deno.test("liquids property: density and sound speed do not fall with pressure", () => {
  fc.assert(
    fc.property(state, fc.double({ min: 0.1e6, max: 9e6, noNaN: true }), ([l, T, p1], dp) => {
      const p2 = Math.min(p1 + dp, 10e6);
      const a = outcome("", () => liquidProperties(l.id, T, p1));
      const b = outcome("", () => liquidProperties(l.id, T, p2));
      if (!a.ok || !b.ok || !(p2 - p1 >= 0.1e6)) return;
      const at = `${l.id} at ${T} K, ${p1}→${p2} Pa`;
      assert.ok(b.value.density > a.value.density, `${at}: rho`);
      assert.ok(b.value.soundSpeed >= a.value.soundSpeed, `${at}: c`);
    }),
    RUNS,
  );
});

Deno.test("liquids property: seawater over S 0–40, 0–40 °C, 0.1–10 MPa, three formulations", () => {
  // Salinity raises both the sound speed and the density of seawater over this whole range
  // (UNESCO 1983 and TEOS-10 tables; recalled direction).
  const tally = new Tally();
  fc.assert(
    fc.property(
      fc.constantFrom("teos10", "teos10-gibbs", "unesco1983"),
      fc.double({ min: 0, max: 39, noNaN: true }),
      fc.double({ min: 0.5, max: 5, noNaN: true }),
      fc.double({ min: 273.15, max: 313.15, noNaN: true }),
      fc.double({ min: 101325, max: 10e6, noNaN: true }),
      (f, S1, dS, T, p) => {
        const S2 = Math.min(S1 + dS, 40);
        const a = tally.add(
          outcome(
            `seawater(${S1}, ${T}, ${p}, ${f})`,
            () => liquidProperties("seawater", T, p, { salinity: S1, formulation: f }),
          ),
        );
        if (!a.ok) throw new Error(`seawater in range refused: ${a.error.message}`);
        check(a.value);
        const c2 = seawater.soundSpeed(S2, T, p, f as "teos10");
        assert.ok(c2 > a.value.soundSpeed, `${f}: c(S ${S1}→${S2}) at ${T} K, ${p} Pa`);
        if (f !== "unesco1983") {
          const r2 = seawater.density(S2, T, p, f as "teos10");
          assert.ok(r2 > a.value.density, `${f}: rho(S ${S1}→${S2}) at ${T} K, ${p} Pa`);
        }
      },
    ),
    RUNS,
  );
  console.log(tally.line("seawater in range"));
});

Deno.test("liquids property: any id, temperature, pressure, salinity: a result or a named error", () => {
  const tally = new Tally();
  const id = fc.oneof(
    fc.constantFrom(...ALL.map((l) => l.id)),
    fc.constantFrom(
      "__proto__",
      "constructor",
      "toString",
      "hasOwnProperty",
      "",
      "Water",
      " water",
    ),
    fc.string({ maxLength: 12 }),
  );
  const num = fc.oneof(fc.double(), { arbitrary: fc.double({ min: 150, max: 700 }), weight: 3 });
  const press = fc.oneof(fc.double(), { arbitrary: fc.double({ min: -1e5, max: 2e8 }), weight: 3 });
  const form = fc.oneof(
    { arbitrary: fc.constant(null), weight: 4 },
    fc.constantFrom("iapws95", "if97", "marczak", "teos10", "teos10-gibbs", "unesco1983", "x"),
  );
  fc.assert(
    fc.property(
      id,
      num,
      press,
      fc.option(fc.oneof(fc.double(), fc.double({ min: -1, max: 45 }))),
      form,
      fc.boolean(),
      (l, T, p, S, f, extrapolate) => {
        const opts = {
          extrapolate,
          warnings: [],
          ...(S === null ? {} : { salinity: S }),
          ...(f === null ? {} : { formulation: f }),
        };
        const o = tally.add(
          outcome(
            `liquidProperties(${JSON.stringify(l)}, ${T}, ${p}, …)`,
            () => liquidProperties(l, T, p, opts),
          ),
        );
        if (o.ok) check(o.value);
      },
    ),
    RUNS,
  );
  console.log(tally.line("liquids over any input"));
  assert.ok(tally.ok > 0 && tally.refusals > 0);
});
