import { assert, closeAbs, closeRel } from "../_assert.ts";
import { InputError, NoPhysicalAnswerError } from "../../lib/errors.ts";
import { gumPropagate, type UncertainInput } from "../../lib/uncertainty/mod.ts";

const n = (name: string, value: number, u: number, extra: Partial<UncertainInput> = {}) => ({
  name,
  value,
  standardUncertainty: u,
  distribution: "normal" as const,
  ...extra,
});

Deno.test("finite differences match analytic derivatives on a nonlinear model", () => {
  const inputs = [n("a", 1.3, 0.02), n("b", 0.4, 0.01), n("c", 250, 3)];
  const f = (x: Float64Array) => Math.sin(x[0]) * Math.exp(x[1]) / x[2];
  const d = (x: Float64Array) => [
    Math.cos(x[0]) * Math.exp(x[1]) / x[2],
    Math.sin(x[0]) * Math.exp(x[1]) / x[2],
    -Math.sin(x[0]) * Math.exp(x[1]) / (x[2] * x[2]),
  ];
  const fd = gumPropagate(f, inputs);
  const an = gumPropagate(f, inputs, { derivatives: d });
  closeRel(fd.standardUncertainty, an.standardUncertainty, 1e-7, "u");
  for (const line of fd.budget) {
    const other = an.budget.find((l) => l.name === line.name)!;
    closeRel(line.sensitivity, other.sensitivity, 1e-6, line.name);
  }
});

Deno.test("budget: sorted by contribution, shares sum to 1 without correlation", () => {
  const r = gumPropagate((x) => x[0] + 10 * x[1] - x[2], [
    n("small", 1, 0.1),
    n("big", 1, 0.1),
    n("mid", 1, 0.5),
  ]);
  assert.deepEqual(r.budget.map((l) => l.name), ["big", "mid", "small"]);
  closeAbs(r.budget.reduce((s, l) => s + l.share, 0), 1, 1e-12, "shares");
  closeRel(r.budget[0].contribution, 1, 1e-9, "|c u|");
  closeRel(r.relativeStandardUncertainty!, r.standardUncertainty / 10, 1e-12, "relative");
  closeRel(r.relativeExpanded!, 2 * r.standardUncertainty / 10, 1e-12, "relative expanded");
});

Deno.test("full correlation: r = +1 adds uncertainties, r = −1 subtracts them", () => {
  const inputs = [n("a", 5, 0.3), n("b", 2, 0.1)];
  const sum = (x: Float64Array) => x[0] + x[1];
  const plus = gumPropagate(sum, inputs, { correlations: [{ a: "a", b: "b", r: 1 }] });
  const minus = gumPropagate(sum, inputs, { correlations: [{ a: "b", b: "a", r: -1 }] });
  closeRel(plus.standardUncertainty, 0.4, 1e-9, "r = +1");
  closeRel(minus.standardUncertainty, 0.2, 1e-9, "r = −1");
});

Deno.test("Welch–Satterthwaite ν_eff and the t coverage factor", () => {
  // Two equal contributions with ν = 10 each: ν_eff = (2u²)²/(2u⁴/10) = 20.
  const r = gumPropagate((x) => x[0] + x[1], [
    n("a", 0, 1, { degreesOfFreedom: 10 }),
    n("b", 0, 1, { degreesOfFreedom: 10 }),
  ], { coverage: 0.95 });
  closeRel(r.effectiveDegreesOfFreedom!, 20, 1e-9, "ν_eff");
  closeAbs(r.coverageFactor, 2.086, 0.001, "t95(20), JCGM 100 table G.2 (recalled)");
  assert.equal(r.coverage, 0.95);
  // Without finite ν no ν_eff is reported and k is normal.
  const s = gumPropagate((x) => x[0], [n("a", 0, 1)], { coverage: 0.95 });
  assert.equal(s.effectiveDegreesOfFreedom, undefined);
  closeAbs(s.coverageFactor, 1.96, 0.001, "k");
  const t = gumPropagate((x) => x[0], [n("a", 0, 1)], { coverageFactor: 3 });
  assert.equal(t.expanded, 3);
});

Deno.test("bad inputs and non-finite models throw named errors", () => {
  const ok = [n("a", 1, 0.1)];
  assert.throws(() => gumPropagate((x) => x[0], []), InputError);
  assert.throws(() => gumPropagate((x) => x[0], [n("a", NaN, 1)]), InputError);
  assert.throws(() => gumPropagate((x) => x[0], [n("a", 1, -1)]), InputError);
  assert.throws(() => gumPropagate((x) => x[0], [n("a", 1, 1), n("a", 2, 1)]), InputError);
  assert.throws(
    () => gumPropagate((x) => x[0], [{ ...n("a", 1, 1), distribution: "cauchy" as "normal" }]),
    InputError,
  );
  assert.throws(() => gumPropagate((x) => x[0], ok, { coverage: 1.2 }), InputError);
  assert.throws(() => gumPropagate((x) => x[0], ok, { coverageFactor: -1 }), InputError);
  assert.throws(
    () => gumPropagate((x) => x[0], ok, { correlations: [{ a: "a", b: "zz", r: 0.5 }] }),
    InputError,
  );
  // Pairwise coefficients no joint distribution can have.
  assert.throws(
    () =>
      gumPropagate((x) => x[0] + x[1] + x[2], [n("a", 0, 1), n("b", 0, 1), n("c", 0, 1)], {
        correlations: [{ a: "a", b: "b", r: 0.9 }, { a: "a", b: "c", r: 0.9 }, {
          a: "b",
          b: "c",
          r: -0.9,
        }],
      }),
    InputError,
  );
  assert.throws(() => gumPropagate((x) => Math.log(x[0] - 1), ok), NoPhysicalAnswerError);
  assert.throws(() => gumPropagate((x) => Math.sqrt(x[0] - 1), ok), NoPhysicalAnswerError);
});

Deno.test("zero estimate: relative uncertainties are undefined, not NaN or Infinity", () => {
  const r = gumPropagate((x) => x[0], [n("a", 0, 1)]);
  assert.equal(r.relativeStandardUncertainty, undefined);
  assert.equal(r.relativeExpanded, undefined);
});
