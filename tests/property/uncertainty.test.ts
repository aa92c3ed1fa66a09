/**
 * Property-based tests of lib/uncertainty's GUM propagation (fast-check, seeded). For a linear
 * model y = a₀ + Σ aᵢxᵢ the law of propagation (JCGM 100:2008 eq. 10) is exact:
 * u(y) = √Σ(aᵢuᵢ)², and with full correlation r = ±1 of two inputs (eq. 16)
 * u(y) = |a₁u₁ ± a₂u₂|; junk inputs give named errors.
 */
import fc from "fast-check";
import { assert } from "../_assert.ts";
import { gumPropagate, type UncertainInput } from "../../lib/uncertainty/mod.ts";
import { outcome, RUNS, Tally } from "./_check.ts";

const range = (min: number, max: number) => fc.double({ min, max, noNaN: true });
/** A number on a grid of 1e-4 of its range (no magnitudes near underflow). */
const grid = (min: number, max: number) =>
  fc.integer({ min: 0, max: 10_000 }).map((i) => min + (max - min) * i / 10_000);
const DISTS = ["normal", "rectangular", "triangular", "u-shaped"] as const;

const linear = fc.record({
  a0: grid(-100, 100),
  terms: fc.array(
    fc.record({
      a: grid(-10, 10),
      x: grid(-100, 100),
      u: grid(0.01, 10),
      dist: fc.constantFrom(...DISTS),
    }),
    { minLength: 1, maxLength: 8 },
  ),
});

function inputsOf(terms: { x: number; u: number; dist: UncertainInput["distribution"] }[]) {
  return terms.map((t, i) => ({
    name: `x${i}`,
    value: t.x,
    standardUncertainty: t.u,
    distribution: t.dist,
  }));
}

Deno.test("uncertainty property: GUM on linear models equals the root-sum-square", () => {
  let worst = 0;
  fc.assert(
    fc.property(linear, ({ a0, terms }) => {
      const model = (x: Float64Array) => terms.reduce((s, t, i) => s + t.a * x[i], a0);
      const r = gumPropagate(model, inputsOf(terms));
      const rss = Math.sqrt(terms.reduce((s, t) => s + (t.a * t.u) ** 2, 0));
      // Central differences are exact for a linear model up to rounding of y: ε·|y|/h per term.
      const y = Math.abs(r.value) + Math.abs(a0) +
        terms.reduce((s, t) => s + Math.abs(t.a * t.x), 0);
      const tol = 1e-12 * rss +
        terms.reduce((s, t) => s + 8 * Number.EPSILON * y / (1e-3 * t.u) * t.u, 0);
      const d = Math.abs(r.standardUncertainty - rss);
      worst = Math.max(worst, d / Math.max(rss, 1e-300));
      assert.ok(d <= tol, `u ${r.standardUncertainty} vs RSS ${rss} (tol ${tol})`);
      assert.equal(r.coverageFactor, 2);
      assert.ok(Math.abs(r.expanded - 2 * r.standardUncertainty) <= 1e-15 * r.expanded);
      const shares = r.budget.reduce((s, b) => s + b.share, 0);
      // (When every c·u underflows or is lost in y's rounding, u(y) is 0 and so are the shares.)
      const none = r.standardUncertainty < 1e-140;
      assert.ok(none || Math.abs(shares - 1) < 1e-9, `shares add to ${shares}`);
    }),
    RUNS,
  );
  console.log(`GUM linear vs RSS: worst relative difference ${worst.toExponential(2)}`);
});

Deno.test("uncertainty property: full correlation adds or cancels linearly (eq. 16)", () => {
  fc.assert(
    fc.property(
      grid(-10, 10),
      grid(-10, 10),
      grid(0.01, 10),
      grid(0.01, 10),
      fc.constantFrom(1, -1),
      (a1, a2, u1, u2, r) => {
        const res = gumPropagate(
          (x) => a1 * x[0] + a2 * x[1],
          inputsOf([{ x: 1, u: u1, dist: "normal" }, { x: 2, u: u2, dist: "normal" }]),
          { correlations: [{ a: "x0", b: "x1", r }], derivatives: () => [a1, a2] },
        );
        const expect = Math.abs(a1 * u1 + r * a2 * u2);
        assert.ok(
          Math.abs(res.standardUncertainty - expect) <=
            1e-9 * (Math.abs(a1 * u1) + Math.abs(a2 * u2)) + 1e-300,
          `r ${r}: ${res.standardUncertainty} vs ${expect}`,
        );
      },
    ),
    RUNS,
  );
});

Deno.test("uncertainty property: coverage 95 % with infinite degrees of freedom gives k = 1.96", () => {
  // Normal quantile z(0.975) = 1.959963985 (any table of the normal distribution; JCGM 100
  // annex G table G.2 lists 1.960).
  fc.assert(
    fc.property(linear, ({ a0, terms }) => {
      const r = gumPropagate(
        (x) => terms.reduce((s, t, i) => s + t.a * x[i], a0),
        inputsOf(terms),
        {
          coverage: 0.95,
        },
      );
      return Math.abs(r.coverageFactor - 1.959963985) < 1e-6;
    }),
    { ...RUNS, numRuns: 2000 },
  );
});

Deno.test("uncertainty property: junk inputs, options and models give named errors", () => {
  const tally = new Tally();
  const junk = fc.oneof(fc.double(), fc.anything());
  const f = <T>(good: fc.Arbitrary<T>) => fc.oneof({ arbitrary: good, weight: 8 }, junk);
  const input = fc.record({
    name: f(fc.constantFrom("a", "b", "c", "")),
    value: f(range(-10, 10)),
    standardUncertainty: f(range(0, 1)),
    distribution: f(fc.constantFrom(...DISTS)),
    degreesOfFreedom: fc.option(f(range(0.5, 50)), { nil: undefined }),
  }, { requiredKeys: ["name", "value", "standardUncertainty", "distribution"] });
  fc.assert(
    fc.property(
      f(fc.array(input, { maxLength: 4 })),
      fc.constantFrom("sum", "ratio", "sqrt", "nan"),
      fc.record({
        coverage: f(range(0, 1)),
        coverageFactor: f(range(0, 4)),
        stepFraction: f(range(0, 1)),
        correlations: f(
          fc.array(
            fc.record({
              a: f(fc.constantFrom("a", "b")),
              b: f(fc.constantFrom("a", "c")),
              r: f(range(-1.2, 1.2)),
            }),
          ),
        ),
      }, { requiredKeys: [] }),
      (inputs, kind, options) => {
        const model = (x: Float64Array) =>
          kind === "sum"
            ? x.reduce((s, v) => s + v, 0)
            : kind === "ratio"
            ? x[0] / (x[1] ?? 1)
            : kind === "sqrt"
            ? Math.sqrt(x[0])
            : NaN;
        tally.add(outcome(`gumPropagate(${kind})`, () =>
          // deno-lint-ignore no-explicit-any
          gumPropagate(model, inputs as any, options as any)));
      },
    ),
    RUNS,
  );
  console.log(tally.line("gumPropagate over junk"));
  assert.ok(tally.ok > 50 && tally.refusals > 500);
});
