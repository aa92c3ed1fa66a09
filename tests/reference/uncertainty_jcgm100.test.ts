/**
 * Outside checks of the GUM engine (JCGM 100:2008) and of the coverage-factor quantiles.
 */
import { assert, closeAbs, closeRel } from "../_assert.ts";
import { debianVersion, hasPython, runPython } from "../_python.ts";
import {
  coverageFactor,
  gumPropagate,
  normalCdf,
  normalQuantile,
  studentTCdf,
  studentTQuantile,
  type UncertainInput,
} from "../../lib/uncertainty/mod.ts";

Deno.test("JCGM 100:2008 table G.2: t_p(ν) for p = 95 % and 99.73 %", () => {
  // Source: JCGM 100:2008 annex G, table G.2 (values recalled, 2 decimals as printed there;
  // confirmed against scipy in the next test where python3-scipy is installed).
  const p95: [number, number][] = [
    [1, 12.71],
    [2, 4.30],
    [3, 3.18],
    [4, 2.78],
    [5, 2.57],
    [
      10,
      2.23,
    ],
    [20, 2.09],
    [50, 2.01],
    [100, 1.984],
  ];
  for (const [nu, t] of p95) closeAbs(coverageFactor(0.95, nu), t, 0.006, `t95(${nu})`);
  const p9973: [number, number][] = [[1, 235.80], [2, 19.21], [3, 9.22], [10, 3.96]];
  // The column headed 99.73 % is the probability of ±3σ of a normal, 0.9973002…, printed rounded.
  const p3 = 2 * normalCdf(3) - 1;
  for (const [nu, t] of p9973) closeAbs(coverageFactor(p3, nu), t, 0.006, `t99.73(${nu})`);
  // ν = ∞ row: k = 1.960 for 95 %, 2.000 for 95.45 %, 3.000 for 99.73 %.
  closeAbs(coverageFactor(0.95), 1.96, 0.0005, "k95");
  closeAbs(coverageFactor(0.9545), 2.0, 0.0005, "k95.45");
  closeAbs(coverageFactor(0.9973), 3.0, 0.0005, "k99.73");
});

Deno.test({
  name: "normal and t distribution functions and quantiles against scipy.stats (python3-scipy)",
  ignore: !hasPython("scipy"),
  fn: async () => {
    // Source: scipy.stats.norm / scipy.stats.t, Debian python3-scipy (version printed below).
    // scipy's t.ppf is itself only good to ~1e-9 relative (its cdf is tighter), hence the tolerances.
    const nus = [1, 2, 2.5, 3, 5, 8, 10, 30, 100, 1000];
    const ps = [0.6, 0.8413, 0.95, 0.975, 0.99, 0.995, 0.99865];
    const ts = [-7.5, -2.1, -0.3, 0.4, 1.7, 3.2, 12];
    const ref = await runPython<{ tq: number[][]; tc: number[][]; zq: number[] }>(
      [
        "import json,sys",
        "from scipy import stats",
        "d=json.load(sys.stdin)",
        "tq=[[stats.t.ppf(p,n) for p in d['ps']] for n in d['nus']]",
        "tc=[[stats.t.cdf(t,n) for t in d['ts']] for n in d['nus']]",
        "zq=[stats.norm.ppf(p) for p in d['ps']+[1e-10,1e-3]]",
        "print(json.dumps({'tq':tq,'tc':tc,'zq':zq}))",
      ].join("\n"),
      { nus, ps, ts },
    );
    let worstQ = 0, worstC = 0;
    nus.forEach((nu, i) => {
      ps.forEach((p, j) => {
        worstQ = Math.max(worstQ, closeRel(studentTQuantile(p, nu), ref.tq[i][j], 1e-8, "t ppf"));
      });
      ts.forEach((t, j) => {
        worstC = Math.max(worstC, closeRel(studentTCdf(t, nu), ref.tc[i][j], 1e-12, "t cdf"));
      });
    });
    [...ps, 1e-10, 1e-3].forEach((p, j) => {
      worstQ = Math.max(worstQ, closeRel(normalQuantile(p), ref.zq[j], 1e-12, "norm ppf"));
    });
    console.log(
      `scipy ${debianVersion("python3-scipy")}: worst relative difference quantiles ${
        worstQ.toExponential(1)
      }, t cdf ${worstC.toExponential(1)}`,
    );
  },
});

// JCGM 100:2008 H.2: simultaneous measurement of resistance and reactance. Inputs (table H.2):
// V = 4.9990 V, u = 0.0032 V; I = 19.661 mA, u = 0.0095 mA; φ = 1.04446 rad, u = 0.00075 rad;
// r(V,I) = −0.36, r(V,φ) = 0.86, r(I,φ) = −0.65. Results (table H.3, approach 1):
// R = 127.732 Ω, u = 0.071 Ω; X = 219.847 Ω, u = 0.295 Ω; Z = 254.260 Ω, u = 0.236 Ω.
// Values recalled; the GUM computed them from unrounded data, so u agrees to a few per cent.
const H2: UncertainInput[] = [
  { name: "V", value: 4.999, standardUncertainty: 0.0032, distribution: "normal", unit: "V" },
  { name: "I", value: 19.661e-3, standardUncertainty: 0.0095e-3, distribution: "normal" },
  { name: "phi", value: 1.04446, standardUncertainty: 0.00075, distribution: "normal" },
];
const H2_CORR = [{ a: "V", b: "I", r: -0.36 }, { a: "V", b: "phi", r: 0.86 }, {
  a: "I",
  b: "phi",
  r: -0.65,
}];
const H2_MODELS: [string, (x: Float64Array) => number, number, number][] = [
  ["R", (x) => x[0] / x[1] * Math.cos(x[2]), 127.732, 0.071],
  ["X", (x) => x[0] / x[1] * Math.sin(x[2]), 219.847, 0.295],
  ["Z", (x) => x[0] / x[1], 254.260, 0.236],
];

Deno.test("JCGM 100:2008 H.2: correlated inputs, resistance, reactance, impedance", () => {
  for (const [name, f, y, u] of H2_MODELS) {
    const r = gumPropagate(f, H2, { correlations: H2_CORR });
    closeRel(r.value, y, 5e-6, `${name} value`);
    closeRel(r.standardUncertainty, u, 0.03, `${name} u`);
    assert.ok(r.correlationVariance !== 0, "correlation terms used");
  }
});

Deno.test({
  name: "GUM propagation against python3-uncertainties (linear propagation with correlations)",
  ignore: !hasPython("uncertainties"),
  fn: async () => {
    // Source: the Python package 'uncertainties' (Debian python3-uncertainties), first-order
    // propagation with automatic differentiation; compared on the H.2 models and a model
    // with a strong curvature.
    const ref = await runPython<number[][]>(
      [
        "import json,sys",
        "from uncertainties import correlated_values_norm, umath, ufloat",
        "d=json.load(sys.stdin)",
        "V,I,p=correlated_values_norm([(4.999,0.0032),(19.661e-3,0.0095e-3),(1.04446,0.00075)],",
        "  [[1,-0.36,0.86],[-0.36,1,-0.65],[0.86,-0.65,1]])",
        "a=ufloat(0.7,0.05); b=ufloat(2.5,0.2); c=ufloat(300.0,4.0)",
        "ys=[V/I*umath.cos(p), V/I*umath.sin(p), V/I, umath.exp(a*b)/umath.sqrt(c)+umath.atan(b/a)]",
        "print(json.dumps([[y.n,y.s] for y in ys]))",
      ].join("\n"),
    );
    let worst = 0;
    H2_MODELS.forEach(([name, f], i) => {
      const r = gumPropagate(f, H2, { correlations: H2_CORR });
      closeRel(r.value, ref[i][0], 1e-12, `${name} value`);
      worst = Math.max(worst, closeRel(r.standardUncertainty, ref[i][1], 1e-6, `${name} u`));
    });
    const abc: UncertainInput[] = [
      { name: "a", value: 0.7, standardUncertainty: 0.05, distribution: "normal" },
      { name: "b", value: 2.5, standardUncertainty: 0.2, distribution: "rectangular" },
      { name: "c", value: 300, standardUncertainty: 4, distribution: "triangular" },
    ];
    const r = gumPropagate(
      (x) => Math.exp(x[0] * x[1]) / Math.sqrt(x[2]) + Math.atan(x[1] / x[0]),
      abc,
    );
    closeRel(r.value, ref[3][0], 1e-12, "value");
    worst = Math.max(worst, closeRel(r.standardUncertainty, ref[3][1], 1e-6, "u"));
    console.log(
      `python3-uncertainties ${debianVersion("python3-uncertainties")}: worst relative ` +
        `difference in u ${worst.toExponential(1)}`,
    );
  },
});
