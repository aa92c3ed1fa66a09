import { assert, closeRel } from "../_assert.ts";
import {
  frictionFactor,
  gaussLegendre,
  profileFactor,
  profileFactorEstimate,
  profileFactorRange,
  reynoldsNumber,
} from "../../lib/flow/mod.ts";
import { InputError, OutOfRangeError, type Warning } from "../../lib/errors.ts";

Deno.test("reynoldsNumber refuses non-physical inputs", () => {
  assert.throws(() => reynoldsNumber(1, 0, 1e-6), InputError);
  assert.throws(() => reynoldsNumber(1, 0.1, -1e-6), InputError);
  assert.throws(() => reynoldsNumber(NaN, 0.1, 1e-6), InputError);
  assert.equal(reynoldsNumber(-2, 0.1, 1e-6), reynoldsNumber(2, 0.1, 1e-6));
});

Deno.test("frictionFactor: ranges enforced, transition stated and continuous", () => {
  assert.throws(() => frictionFactor(1e9, 0), OutOfRangeError);
  assert.throws(() => frictionFactor(1e5, 0.1), OutOfRangeError);
  assert.throws(() => frictionFactor(1e5, -1e-3), InputError);
  const w: Warning[] = [];
  const f = frictionFactor(1e9, 0, "colebrook", { extrapolate: true, warnings: w });
  assert.ok(f > 0 && w.length === 1);
  const wt: Warning[] = [];
  frictionFactor(3000, 0, "colebrook", { warnings: wt });
  assert.equal(wt[0].code, "transition");
  // continuity at both ends of the transition
  closeRel(frictionFactor(1999.999999), frictionFactor(2000), 1e-6, "2000");
  closeRel(frictionFactor(3999.999999), frictionFactor(4000), 1e-6, "4000");
});

Deno.test("Colebrook residual vanishes to machine precision", () => {
  for (const re of [4e3, 1e5, 1e8]) {
    for (const rr of [0, 1e-4, 0.05]) {
      const f = frictionFactor(re, rr);
      const res = 1 / Math.sqrt(f) + 2 * Math.log10(rr / 3.7 + 2.51 / (re * Math.sqrt(f)));
      assert.ok(Math.abs(res) < 1e-13, `residual ${res} at ${re}, ${rr}`);
    }
  }
});

Deno.test("Gauss–Legendre integrates polynomials of degree 2n−1 exactly", () => {
  const { nodes, weights } = gaussLegendre(7);
  let s = 0;
  for (let i = 0; i < 7; i++) s += weights[i] * nodes[i] ** 12;
  closeRel(s, 2 / 13, 1e-14, "x^12");
});

Deno.test("profile factor rises with Re, off-centre chords read lower path velocity", () => {
  const ks = [2e4, 1e5, 1e6].map((re) => profileFactor(re));
  assert.ok(ks[0] < ks[1] && ks[1] < ks[2]);
  // the chord at h/R = 0.5 sees a mean close to the area mean: factor near 1
  const kc = profileFactor(1e5, { chord: 0.5 });
  assert.ok(Math.abs(kc - 1) < 0.01, `chord factor ${kc}`);
  assert.throws(() => profileFactor(1e5, { chord: 1 }), InputError);
  assert.throws(() => profileFactor(1e5, { model: "nope" as never }), InputError);
});

Deno.test("roughness lowers the log-law profile factor (larger f, more peaked profile)", () => {
  // rougher wall → larger f → smaller n → more peaked → smaller k
  const smooth = profileFactor(1e6, { model: "log-law", relativeRoughness: 0 });
  const rough = profileFactor(1e6, { model: "log-law", relativeRoughness: 1e-2 });
  assert.ok(rough < smooth);
});

Deno.test("estimate: spread between models, transition widened and flagged, laminar exact", () => {
  const t = profileFactorEstimate(1e5);
  assert.equal(t.regime, "turbulent");
  assert.equal(Object.keys(t.byModel).length, 3);
  const vals = Object.values(t.byModel) as number[];
  closeRel(t.spread, (Math.max(...vals) - Math.min(...vals)) / 2, 1e-12, "half-width");
  const tr = profileFactorEstimate(5000);
  assert.equal(tr.regime, "transition");
  assert.ok(tr.spread > 0.05, `transition spread ${tr.spread}`);
  assert.ok(tr.warnings.some((w) => w.code === "transition"));
  const lam = profileFactorEstimate(800);
  assert.equal(lam.factor, 0.75);
  assert.equal(lam.spread, 0);
  const big = profileFactorEstimate(1e7);
  assert.equal(big.byModel["power-law-nikuradse"], undefined);
  assert.ok(big.warnings.some((w) => w.code === "model-left-out"));
});

Deno.test("profileFactorRange crosses regimes and reports the change", () => {
  const r = profileFactorRange(1000, 1e5);
  assert.deepEqual([...r.regimes], ["laminar", "transition", "turbulent"]);
  assert.equal(r.atMin, 0.75);
  assert.ok(r.relativeChange > 0.15);
  assert.throws(() => profileFactorRange(1e5, 1e4), InputError);
});
