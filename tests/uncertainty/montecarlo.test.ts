import { assert, closeAbs, closeRel } from "../_assert.ts";
import { InputError, NoPhysicalAnswerError } from "../../lib/errors.ts";
import { monteCarlo, randomStream, type UncertainInput } from "../../lib/uncertainty/mod.ts";

const one = (distribution: UncertainInput["distribution"], u = 1): UncertainInput[] => [
  { name: "X", value: 10, standardUncertainty: u, distribution },
];

Deno.test("each distribution has its standard deviation and its support", () => {
  // Half-widths per unit u: rectangular √3, triangular √6, U-shaped √2 (JCGM 101:2008 §6.4).
  const cases: [UncertainInput["distribution"], number][] = [
    ["rectangular", Math.sqrt(3)],
    ["triangular", Math.sqrt(6)],
    ["u-shaped", Math.SQRT2],
  ];
  for (const [d, a] of cases) {
    const r = monteCarlo((x) => x[0], one(d, 0.5), { draws: 200_000, seed: 3, keepValues: true });
    closeRel(r.standardUncertainty, 0.5, 0.01, `${d} u`);
    const v = r.values!;
    assert.ok(v[0] >= 10 - 0.5 * a && v[v.length - 1] <= 10 + 0.5 * a, `${d} support`);
    assert.ok(v[0] < 10 - 0.49 * a && v[v.length - 1] > 10 + 0.49 * a, `${d} reaches its ends`);
  }
  // U-shaped: more draws near the ends than in the middle.
  const u = monteCarlo((x) => x[0], one("u-shaped"), { draws: 100_000, seed: 4, keepValues: true });
  const vals = u.values!;
  const near = (lo: number, hi: number) => vals.filter((y) => y >= lo && y < hi).length;
  assert.ok(near(11.3, 11.4) > 3 * near(9.95, 10.05), "arc-sine density");
});

Deno.test("correlated normal inputs are drawn with the asked correlation", () => {
  const inputs: UncertainInput[] = [
    { name: "a", value: 0, standardUncertainty: 1, distribution: "normal" },
    { name: "b", value: 0, standardUncertainty: 2, distribution: "normal" },
    { name: "c", value: 1, standardUncertainty: 0.1, distribution: "rectangular" },
  ];
  const r = monteCarlo((x) => x[0] + x[1] + x[2], inputs, {
    draws: 200_000,
    seed: 8,
    correlations: [{ a: "a", b: "b", r: 0.6 }],
  });
  // u² = 1 + 4 + 2·0.6·1·2 + 0.01 = 7.41.
  closeRel(r.standardUncertainty, Math.sqrt(7.41), 0.01, "u with correlation");
  assert.throws(
    () => monteCarlo((x) => x[0], inputs, { correlations: [{ a: "a", b: "c", r: 0.5 }] }),
    InputError,
  );
});

Deno.test("the uniform stream: moments, open interval, seeds", () => {
  const s = randomStream(123);
  let sum = 0, sum2 = 0, min = 1, max = 0;
  const N = 200_000;
  for (let i = 0; i < N; i++) {
    const u = s.uniform();
    sum += u;
    sum2 += u * u;
    if (u < min) min = u;
    if (u > max) max = u;
  }
  closeAbs(sum / N, 0.5, 0.003, "mean 1/2");
  closeAbs(sum2 / N - (sum / N) ** 2, 1 / 12, 0.001, "variance 1/12");
  assert.ok(min > 0 && max < 1);
  let nsum = 0, nsum2 = 0;
  for (let i = 0; i < N; i++) {
    const z = s.normal();
    nsum += z;
    nsum2 += z * z;
  }
  closeAbs(nsum / N, 0, 0.01, "normal mean");
  closeAbs(nsum2 / N, 1, 0.01, "normal variance");
  assert.notEqual(randomStream(1).nextUint32(), randomStream(2).nextUint32());
  assert.throws(() => randomStream(-1), InputError);
  assert.throws(() => randomStream(1.5), InputError);
  assert.throws(() => randomStream(2 ** 32), InputError);
});

Deno.test("Monte Carlo options are checked and non-finite outputs are refused", () => {
  const x = one("normal");
  assert.throws(() => monteCarlo((v) => v[0], x, { draws: 10 }), InputError);
  assert.throws(() => monteCarlo((v) => v[0], x, { draws: 1e5 + 0.5 }), InputError);
  assert.throws(() => monteCarlo((v) => v[0], x, { coverage: 0 }), InputError);
  assert.throws(
    () => monteCarlo((v) => Math.log(v[0] - 10), x, { draws: 1000 }),
    NoPhysicalAnswerError,
  );
  const fixed = monteCarlo((v) => 2 * v[0], one("normal", 0), { draws: 100 });
  assert.equal(fixed.standardUncertainty, 0);
  assert.deepEqual(fixed.interval, [20, 20]);
  const shortest = monteCarlo((v) => v[0], x, { draws: 1000, shortest: true });
  assert.equal(shortest.intervalKind, "shortest");
  assert.ok(
    shortest.interval[1] - shortest.interval[0] <=
      shortest.symmetricInterval[1] - shortest.symmetricInterval[0],
  );
});

Deno.test("asymmetric bounds: draws on [x − b₋, x + b₊], GUM keeps x and (b₊ + b₋)/√12", () => {
  // A wall of 8 mm known to lie in [7 mm, 8 mm] (−12.5 % style band, no plus side): b₋ = 1 mm,
  // b₊ = 0. JCGM 101 §6.4.2.1: R(a, b) has expectation (a + b)/2 and variance (b − a)²/12;
  // JCGM 100 §4.3.8: u² = (b₊ + b₋)²/12 about the stated estimate.
  const bMinus = 1e-3, bPlus = 0, x0 = 8e-3;
  const inputs: UncertainInput[] = [{
    name: "wall",
    value: x0,
    standardUncertainty: (bPlus + bMinus) / Math.sqrt(12),
    distribution: "rectangular",
    centreOffset: (bPlus - bMinus) / 2,
  }];
  const r = monteCarlo((x) => x[0], inputs, { draws: 200_000, seed: 5, keepValues: true });
  const v = r.values!;
  assert.ok(v[0] >= x0 - bMinus && v[v.length - 1] <= x0 + bPlus, "support is the stated band");
  assert.ok(v[0] < x0 - 0.99 * bMinus && v[v.length - 1] > x0 - 0.01 * bMinus, "reaches both ends");
  closeAbs(r.mean, x0 - bMinus / 2, 5e-6, "mean at the middle of the band");
  closeRel(r.standardUncertainty, 1e-3 / Math.sqrt(12), 0.01, "u of R(a,b)");
  // A non-linear model: E[X²] on R(a,b) = (a² + ab + b²)/3, in closed form.
  const sq = monteCarlo((x) => x[0] * x[0], inputs, { draws: 200_000, seed: 6 });
  const a = x0 - bMinus, b = x0 + bPlus;
  closeRel(sq.mean, (a * a + a * b + b * b) / 3, 1e-4, "E[X²] on R(a,b)");
  // Symmetric band: centreOffset 0 and omitted give the same draws bit for bit.
  const sym = { ...inputs[0], centreOffset: 0 };
  const base: UncertainInput = { ...inputs[0] };
  delete (base as { centreOffset?: number }).centreOffset;
  const r0 = monteCarlo((x) => x[0], [sym], { draws: 1000, seed: 7 });
  const r1 = monteCarlo((x) => x[0], [base], { draws: 1000, seed: 7 });
  assert.equal(r0.mean, r1.mean);
  assert.throws(
    () => monteCarlo((x) => x[0], [{ ...sym, centreOffset: NaN }], { draws: 1000 }),
    InputError,
  );
});
