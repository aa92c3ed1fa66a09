/**
 * Side-by-side timing of our water and seawater formulations against Debian's reference
 * libraries on the same inputs in one run: python3-iapws (IAPWS95 and IAPWS97 objects per state)
 * and python3-gsw (vectorised over 10⁵ points). Each side times itself (the Python side with
 * time.perf_counter around its loop, imports excluded); the script prints per-state medians of
 * several repeats, the ratio, and the largest relative difference between the two answers (so
 * the same work is compared). Run with --help.
 *
 * Numbers drift on shared machines: quote the ratios and medians, not bare times.
 *
 * @module
 */
import { water } from "../lib/water/mod.ts";
import { seawater } from "../lib/liquids/mod.ts";
import { InputError } from "../lib/errors.ts";
import { parseCli, runMain } from "./_cli.ts";

const HELP = `
bench_compare — time our formulations against Debian's python3-iapws and python3-gsw

Usage:
  deno task bench:compare [--repeats 7] [--points 100000] [--json]

Options:
  --repeats N   repeats of each timed loop; medians are reported (default 7, at least 3)
  --points N    seawater points for the vectorised gsw comparison (default 100000)
  --json        machine-readable output
  -h, --help    this help

Needs /usr/bin/python3 with Debian's python3-iapws, python3-gsw and python3-numpy; a comparison
whose package is missing is skipped with a notice (exit 0). Times drift on shared machines:
quote the ratios.
`;

const PYTHON = "/usr/bin/python3";

/** One comparison row. */
interface Row {
  name: string;
  reference: string;
  states: number;
  oursNs: number;
  theirsNs: number;
  /** theirs / ours: how many times faster ours is. */
  speedup: number;
  target: string;
  met: boolean;
  worstRelativeDifference: number;
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/**
 * Alternate our timed loop and one timed reference run, `repeats` times, so that both sides see
 * the same load; medians in ns per state. Our loop is warmed up first and repeated until it has
 * run at least `minMs` per repeat.
 */
async function interleaved<R extends { time: number }>(
  n: number,
  repeats: number,
  minMs: number,
  fn: () => void,
  reference: () => Promise<R>,
): Promise<{ oursNs: number; theirsNs: number; last: R }> {
  const start = performance.now();
  let passes = 0;
  do {
    fn();
    passes++;
  } while (performance.now() - start < minMs);
  const ours: number[] = [], theirs: number[] = [];
  let last: R | undefined;
  for (let r = 0; r < repeats; r++) {
    const t0 = performance.now();
    for (let k = 0; k < passes; k++) fn();
    ours.push((performance.now() - t0) * 1e6 / (passes * n));
    last = await reference();
    theirs.push(last.time * 1e9 / n);
  }
  return { oursNs: median(ours), theirsNs: median(theirs), last: last! };
}

function hasModules(mods: string[]): boolean {
  try {
    const r = new Deno.Command(PYTHON, {
      args: ["-c", mods.map((m) => `import ${m}`).join(";")],
      stdout: "null",
      stderr: "null",
    }).outputSync();
    return r.success;
  } catch {
    return false;
  }
}

/** Run a Python snippet with JSON on stdin, JSON back on stdout. */
async function python<T>(code: string, input: unknown): Promise<T> {
  const env = Deno.env.toObject();
  // OpenBLAS overrides set on some machines slow numpy; gsw's loops are its own C, but keep the
  // reference side at its best (only in this child process).
  delete env.OPENBLAS_CORETYPE;
  delete env.OPENBLAS_L2_SIZE;
  const child = new Deno.Command(PYTHON, {
    args: ["-c", code],
    stdin: "piped",
    stdout: "piped",
    stderr: "piped",
    env,
    clearEnv: true,
  }).spawn();
  const w = child.stdin.getWriter();
  await w.write(new TextEncoder().encode(JSON.stringify(input)));
  await w.close();
  const out = await child.output();
  if (!out.success) {
    throw new Error(`python failed: ${new TextDecoder().decode(out.stderr).trim()}`);
  }
  return JSON.parse(new TextDecoder().decode(out.stdout)) as T;
}

const PY_IAPWS = `
import json, sys, time
from iapws import IAPWS95, IAPWS97
d = json.load(sys.stdin)
cls = IAPWS95 if d["which"] == "95" else IAPWS97
T, P = d["T"], [p / 1e6 for p in d["p"]]
cls(T=T[0], P=P[0]).w
t0 = time.perf_counter()
w = [cls(T=T[i], P=P[i]).w for i in range(len(T))]
print(json.dumps({"time": time.perf_counter() - t0, "w": w}))
`;

const PY_GSW = `
import json, sys, time
import numpy as np, gsw
d = json.load(sys.stdin)
SA, t, p = (np.array(d[k], dtype=float) for k in ("SA", "t", "p"))
fns = {
    "teos10": lambda: gsw.sound_speed(SA, gsw.CT_from_t(SA, t, p), p),
    "teos10-gibbs": lambda: gsw.sound_speed_t_exact(SA, t, p),
}
f = fns[d["which"]]
f()
t0 = time.perf_counter()
c = f()
elapsed = time.perf_counter() - t0
idx = np.linspace(0, len(SA) - 1, 2000).astype(int)
print(json.dumps({"time": elapsed, "c": c[idx].tolist(), "idx": idx.tolist()}))
`;

function worstRel(ours: ArrayLike<number>, theirs: ArrayLike<number>): number {
  let w = 0;
  for (let i = 0; i < theirs.length; i++) {
    w = Math.max(w, Math.abs(ours[i] - theirs[i]) / Math.abs(theirs[i]));
  }
  return w;
}

async function compareWater(
  which: "95" | "97",
  n: number,
  repeats: number,
): Promise<Row> {
  // Liquid states 1–95 °C, 0.2–9.2 MPa.
  const T = Float64Array.from({ length: n }, (_, i) => 274.15 + (94 * i) / Math.max(1, n - 1));
  const P = Float64Array.from({ length: n }, (_, i) => 2e5 + (i % 10) * 1e6);
  const form = which === "95" ? "iapws95" : "if97";
  const ours = new Float64Array(n);
  const run = () => {
    for (let i = 0; i < n; i++) ours[i] = water.soundSpeed(T[i], P[i], form);
  };
  const input = { which, T: Array.from(T), p: Array.from(P) };
  const { oursNs, theirsNs, last: ref } = await interleaved(
    n,
    repeats,
    200,
    run,
    () => python<{ time: number; w: number[] }>(PY_IAPWS, input),
  );
  const speedup = theirsNs / oursNs;
  const goal = which === "95" ? 300 : 100;
  return {
    name: which === "95" ? "IAPWS-95 sound speed at (T, p)" : "IAPWS-IF97 sound speed at (T, p)",
    reference: which === "95" ? "python3-iapws IAPWS95(T, P).w" : "python3-iapws IAPWS97(T, P).w",
    states: n,
    oursNs,
    theirsNs,
    speedup,
    target: `ours >= ${goal}x faster`,
    met: speedup >= goal,
    worstRelativeDifference: worstRel(ours, ref.w),
  };
}

async function compareSeawater(
  which: "teos10" | "teos10-gibbs",
  n: number,
  repeats: number,
  varySalinity: boolean,
): Promise<Row> {
  // Ocean-like points: practical salinity 35 (or 30–40 varying), −1.5 to 35 °C, 0–6000 dbar.
  const S = Float64Array.from(
    { length: n },
    (_, i) => varySalinity ? 30 + (i * 7919 % 1000) / 100 : 35,
  );
  const t = Float64Array.from({ length: n }, (_, i) => -1.5 + (36.5 * i) / (n - 1));
  const pd = Float64Array.from({ length: n }, (_, i) => (i * 104729 % n) * 6000 / n);
  const T = t.map((x) => x + 273.15);
  const P = pd.map((x) => 101325 + x * 1e4);
  const ours = new Float64Array(n);
  const run = () => {
    for (let i = 0; i < n; i++) ours[i] = seawater.soundSpeed(S[i], T[i], P[i], which);
  };
  const input = {
    which,
    SA: Array.from(S, (s) => s * 35.16504 / 35),
    t: Array.from(t),
    p: Array.from(pd),
  };
  const { oursNs, theirsNs, last: ref } = await interleaved(
    n,
    repeats,
    300,
    run,
    () => python<{ time: number; c: number[]; idx: number[] }>(PY_GSW, input),
  );
  const speedup = theirsNs / oursNs;
  return {
    name: `TEOS-10 ${
      which === "teos10" ? "75-term sound speed incl. Θ from t" : "Gibbs-function sound speed"
    }${varySalinity ? ", salinity varying per point" : ""}`,
    reference: which === "teos10"
      ? "python3-gsw sound_speed(SA, CT_from_t(SA, t, p), p), vectorised"
      : "python3-gsw sound_speed_t_exact(SA, t, p), vectorised",
    states: n,
    oursNs,
    theirsNs,
    speedup,
    target: "ours within 2x of gsw (speedup >= 0.5)",
    met: speedup >= 0.5,
    worstRelativeDifference: worstRel(ref.idx.map((i) => ours[i]), ref.c),
  };
}

function fmtNs(ns: number): string {
  return ns >= 1e6
    ? `${(ns / 1e6).toPrecision(3)} ms`
    : ns >= 1e3
    ? `${(ns / 1e3).toPrecision(3)} µs`
    : `${ns.toPrecision(3)} ns`;
}

runMain(async () => {
  const { values } = parseCli(Deno.args, {
    repeats: { type: "string" },
    points: { type: "string" },
  }, HELP);
  const repeats = values.repeats === undefined ? 7 : Number(values.repeats);
  const points = values.points === undefined ? 100_000 : Number(values.points);
  if (!Number.isInteger(repeats) || repeats < 3) {
    throw new InputError("--repeats", String(values.repeats), "an integer >= 3");
  }
  if (!Number.isInteger(points) || points < 1000) {
    throw new InputError("--points", String(values.points), "an integer >= 1000");
  }
  const rows: Row[] = [];
  const skipped: string[] = [];
  if (hasModules(["iapws"])) {
    rows.push(await compareWater("95", 24, repeats));
    rows.push(await compareWater("97", 1000, repeats));
  } else skipped.push(`python3-iapws not importable by ${PYTHON}: IAPWS-95 and IF97 skipped`);
  if (hasModules(["gsw", "numpy"])) {
    rows.push(await compareSeawater("teos10", points, repeats, false));
    rows.push(await compareSeawater("teos10", points, repeats, true));
    rows.push(await compareSeawater("teos10-gibbs", points, repeats, false));
  } else skipped.push(`python3-gsw or numpy not importable by ${PYTHON}: TEOS-10 skipped`);

  if (values.json) {
    console.log(JSON.stringify({ repeats, rows, skipped }, null, 2));
    return 0;
  }
  for (const s of skipped) console.log(`notice: ${s}`);
  if (rows.length === 0) return 0;
  console.log(
    `medians of ${repeats} interleaved repeats, per state; ratio = reference time / our time\n`,
  );
  for (const r of rows) {
    console.log(
      `${r.name}\n  ours ${fmtNs(r.oursNs)}   ${r.reference}: ${fmtNs(r.theirsNs)}   ` +
        `ratio ${r.speedup.toPrecision(3)}x  (${r.target}: ${r.met ? "met" : "not met"})\n` +
        `  ${r.states} states; largest relative difference of the answers ${
          r.worstRelativeDifference.toExponential(1)
        }`,
    );
  }
  return 0;
});
