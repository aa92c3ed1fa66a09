/**
 * Mutation fuzzer over the demo site files (data/demo/*.yaml, invented sites): ≥ 1e4 mutated
 * files from a seeded generator of our own, mutated as text (lines deleted, duplicated or
 * swapped; numbers replaced by extremes; units moved between fields; keys misspelt; random
 * characters inserted; YAML structure broken; anchors and aliases) and as objects after parsing
 * (keys dropped, values of another type, values swapped, unknown keys), then read with
 * readSiteText and, when read, planned in-process with planSite(site, { monteCarlo: false }).
 *
 * Each outcome must be a plan whose every number is finite, or a SnellpathError (InputError,
 * OutOfRangeError, NoPhysicalAnswerError, RegistryError and their kin); never another exception.
 * A case over 2 s is reported as a hang and fails the test (time is reported, not asserted on
 * otherwise). Set FUZZ_CASES to run more or fewer cases (default 10 000) and FUZZ_SEED to
 * change the seed (default 20240611).
 */
import { parse as parseYaml, stringify as stringifyYaml } from "yaml";
import { assert } from "../_assert.ts";
import { SnellpathError } from "../../lib/errors.ts";
import { readSiteText } from "../../lib/site/read.ts";
import { planSite } from "../../lib/site/plan.ts";
import { nonFinitePath } from "../property/_check.ts";

const DEMO = new URL("../../data/demo/", import.meta.url);
const CASES = Number(envOr("FUZZ_CASES", "10000"));
const SEED = Number(envOr("FUZZ_SEED", "20240611"));
const HANG_MS = 2000;

function envOr(name: string, fallback: string): string {
  try {
    return Deno.env.get(name) ?? fallback;
  } catch {
    return fallback; // no --allow-env: the defaults
  }
}

/** mulberry32: a small seeded 32-bit generator (reproducible across runs and machines). */
function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

type Rng = () => number;
const pick = <T>(r: Rng, xs: readonly T[]): T => xs[Math.floor(r() * xs.length)];
const int = (r: Rng, n: number) => Math.floor(r() * n);

const EXTREMES = [
  "0",
  "-0",
  "-1",
  "1e308",
  "-1e308",
  "1e-320",
  "NaN",
  ".nan",
  ".inf",
  "-.inf",
  "Infinity",
  "9".repeat(400),
  "0x1F",
  "1_000",
  "1,5",
  "",
  "~",
  "null",
  "true",
  "[]",
  "{}",
  "'12'",
];
const UNITS = [
  "mm",
  "m",
  "in",
  "degC",
  "degF",
  "K",
  "bar",
  "barg",
  "psi",
  "L/s",
  "m^3/h",
  "gpm",
  "m/s",
  "deg",
  "rad",
  "MHz",
  "kHz",
  "ps",
  "%",
  "m/s/K",
  "kg/m^3",
  "cSt",
  "D",
  "",
];
const JUNK = [
  "\t",
  "{",
  "}",
  "[",
  "]",
  ":",
  "- ",
  "&a ",
  "*a",
  "!!binary ",
  "!custom ",
  "%YAML 1.1\n",
  "---\n",
  "...\n",
  "#",
  "'",
  '"',
  "|",
  ">",
  "?",
  "\u00a0",
  "\u2212",
  "\uFEFF",
  "\u202e",
  "\r",
  "\\",
  "<<: *a\n",
];

const NUMBER = /[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?/g;

/** Text-level mutations: each returns the new text and a short label. */
const TEXT_MUTATIONS: Record<string, (t: string, r: Rng) => string> = {
  "delete line": (t, r) => {
    const l = t.split("\n");
    l.splice(int(r, l.length), 1);
    return l.join("\n");
  },
  "duplicate line": (t, r) => {
    const l = t.split("\n");
    const i = int(r, l.length);
    l.splice(i, 0, l[i]);
    return l.join("\n");
  },
  "swap lines": (t, r) => {
    const l = t.split("\n");
    const i = int(r, l.length), j = int(r, l.length);
    [l[i], l[j]] = [l[j], l[i]];
    return l.join("\n");
  },
  "number → extreme": (t, r) => {
    const hits = [...t.matchAll(NUMBER)];
    if (!hits.length) return t;
    const m = pick(r, hits);
    return t.slice(0, m.index) + pick(r, EXTREMES) + t.slice(m.index! + m[0].length);
  },
  "number → scaled": (t, r) => {
    // A plausible but different figure (×0.05 … ×20): keeps most files readable and moves the
    // physics (critical angles, boiling, short runs, unresolvable flows).
    const hits = [...t.matchAll(NUMBER)];
    if (!hits.length) return t;
    const m = pick(r, hits);
    const x = Number(m[0]) * Math.exp((r() * 2 - 1) * Math.log(20));
    return t.slice(0, m.index) + String(Number(x.toPrecision(4))) + t.slice(m.index! + m[0].length);
  },
  "unit → another": (t, r) => {
    const hits = [...t.matchAll(/(\d) ([A-Za-z%^/0-9]+)/g)];
    if (!hits.length) return t;
    const m = pick(r, hits);
    const at = m.index! + 2;
    return t.slice(0, at) + pick(r, UNITS) + t.slice(at + m[2].length);
  },
  "key typo": (t, r) => {
    const l = t.split("\n");
    const keyed = l.map((s, i) => [s, i] as const).filter(([s]) => /^\s*[A-Za-z]+:/.test(s));
    if (!keyed.length) return t;
    const [s, i] = pick(r, keyed);
    const m = /^(\s*)([A-Za-z]+):/.exec(s)!;
    let k = m[2];
    const p = int(r, k.length);
    switch (int(r, 5)) {
      case 0:
        k = k.slice(0, p) + k.slice(p + 1);
        break;
      case 1:
        k = k.slice(0, p) + k[p + 1 < k.length ? p + 1 : p] + k[p] + k.slice(p + 2);
        break;
      case 2:
        k = k.toUpperCase();
        break;
      case 3:
        k = k.replace(/[A-Z]/g, (c) => "_" + c.toLowerCase());
        break;
      default:
        k = k + pick(r, ["s", "x", "_", "2", "Max"]);
    }
    l[i] = m[1] + k + s.slice(m[0].length - 1);
    return l.join("\n");
  },
  "insert characters": (t, r) => {
    const p = int(r, t.length + 1);
    let ins = "";
    for (let n = 1 + int(r, 4); n > 0; n--) {
      ins += r() < 0.5 ? pick(r, JUNK) : String.fromCharCode(1 + int(r, 0xffff - 1));
    }
    return t.slice(0, p) + ins + t.slice(p);
  },
  "break structure": (t, r) => {
    const l = t.split("\n");
    const i = int(r, l.length);
    switch (int(r, 5)) {
      case 0:
        l[i] = "   " + l[i]; // bad indent
        break;
      case 1:
        l[i] = l[i].replace(":", ""); // no colon
        break;
      case 2:
        l[i] = l[i].replace(/^(\s*)/, "$1- "); // turn into a list item
        break;
      case 3:
        l[i] = l[i].replace("}", ""); // unclosed flow mapping
        break;
      default:
        l[i] = l[i].replace(/^ +/, (s) => "\t".repeat(s.length / 2)); // tabs
    }
    return l.join("\n");
  },
  "aliases": (t, r) => {
    const l = t.split("\n");
    const i = int(r, l.length);
    const kinds = [
      () =>
        l.splice(0, 0, "x: &a [1, 2, 3]", "y: &b [*a, *a, *a, *a, *a, *a]", "z: [*b, *b, *b, *b]"),
      () => (l[i] = l[i].replace(/: (\S)/, ": &v $1")),
      () => (l[i] = l[i].replace(/: (\S.*)$/, ": *v")),
      () => l.push("<<: *missing"),
      () => l.splice(i, 0, "anchor: &loop", "  self: *loop"),
    ];
    pick(r, kinds)();
    return l.join("\n");
  },
  "truncate": (t, r) => t.slice(0, int(r, t.length)),
  "json-ify": (t) => {
    try {
      return JSON.stringify(parseYaml(t, { logLevel: "silent" }));
    } catch {
      return t;
    }
  },
};

/** Key paths of a parsed object, for object-level mutations. */
function paths(v: unknown, prefix: string[] = []): string[][] {
  if (v === null || typeof v !== "object") return [prefix];
  const out: string[][] = prefix.length ? [prefix] : [];
  for (const [k, x] of Object.entries(v)) out.push(...paths(x, [...prefix, k]));
  return out;
}

function parentOf(o: Record<string, unknown>, p: string[]): Record<string, unknown> | undefined {
  let cur: unknown = o;
  for (const k of p.slice(0, -1)) {
    if (cur === null || typeof cur !== "object") return undefined;
    cur = (cur as Record<string, unknown>)[k];
  }
  return cur !== null && typeof cur === "object" ? cur as Record<string, unknown> : undefined;
}

const ODD_VALUES: unknown[] = [
  null,
  0,
  -1,
  1e308,
  Number.NaN,
  Infinity,
  -Infinity,
  true,
  "",
  " ",
  "12",
  "12 m",
  "12 degC",
  "abc",
  [],
  [1, 2],
  {},
  { value: 1, unit: "mm" },
  "x".repeat(10_000),
  "__proto__",
  { toString: 1 },
  { constructor: { prototype: 1 } },
];

/** Object-level mutations on the parsed site. */
const OBJECT_MUTATIONS: Record<string, (o: Record<string, unknown>, r: Rng) => void> = {
  "drop key": (o, r) => {
    const p = pick(r, paths(o));
    const parent = parentOf(o, p);
    if (parent) delete parent[p[p.length - 1]];
  },
  "change type": (o, r) => {
    const p = pick(r, paths(o));
    const parent = parentOf(o, p);
    if (parent) parent[p[p.length - 1]] = structuredClone(pick(r, ODD_VALUES));
  },
  "swap values": (o, r) => {
    const all = paths(o);
    const a = pick(r, all), b = pick(r, all);
    // Swapping a value with one inside it would make a cycle: skip those pairs.
    const prefix = (x: string[], y: string[]) => x.every((k, i) => y[i] === k);
    if (prefix(a, b) || prefix(b, a)) return;
    const pa = parentOf(o, a), pb = parentOf(o, b);
    if (!pa || !pb) return;
    const ka = a[a.length - 1], kb = b[b.length - 1];
    const va = pa[ka];
    pa[ka] = pb[kb];
    pb[kb] = va;
  },
  "unknown key": (o, r) => {
    const p = pick(r, paths(o));
    const parent = parentOf(o, p) ?? o;
    // defineProperty, so that "__proto__" becomes an own key as JSON.parse would make it.
    Object.defineProperty(
      parent,
      pick(r, ["extra", "__proto__", "constructor", "diameterr", "pipe", "toString"]),
      { value: pick(r, ODD_VALUES), enumerable: true, writable: true, configurable: true },
    );
  },
};

/** How many mutations a case gets: one in 60 % of cases (most then still read), else 2–3. */
function mutationCount(r: Rng): number {
  return r() < 0.6 ? 1 : 2 + int(r, 2);
}

interface Report {
  cases: number;
  readOk: number;
  plans: number;
  refusals: Record<string, number>;
  crashes: { label: string; error: string; text: string }[];
  hangs: { label: string; ms: number }[];
  slowestMs: number;
  byMutation: Record<string, number>;
}

async function runCase(text: string, label: string, rep: Report): Promise<void> {
  rep.cases++;
  const t0 = performance.now();
  try {
    const site = await readSiteText(text, { file: "fuzz.yaml" });
    rep.readOk++;
    const badSite = nonFinitePath(site);
    if (badSite) throw new Error(`site holds a non-finite number at ${badSite}`);
    const plan = planSite(site, { monteCarlo: false });
    const bad = nonFinitePath(plan);
    if (bad) throw new Error(`plan holds a non-finite number at ${bad}`);
    rep.plans++;
  } catch (e) {
    if (e instanceof SnellpathError) {
      rep.refusals[e.name] = (rep.refusals[e.name] ?? 0) + 1;
    } else {
      const error = e instanceof Error ? `${e.name}: ${e.message}` : String(e);
      rep.crashes.push({ label, error, text: text.slice(0, 2000) });
    }
  }
  const ms = performance.now() - t0;
  rep.slowestMs = Math.max(rep.slowestMs, ms);
  if (ms > HANG_MS) rep.hangs.push({ label, ms });
}

Deno.test("fuzz: mutated demo site files give finite plans or named errors", async () => {
  const files: { name: string; text: string }[] = [];
  for await (const e of Deno.readDir(DEMO)) {
    if (e.isFile && e.name.endsWith(".yaml")) {
      files.push({ name: e.name, text: await Deno.readTextFile(new URL(e.name, DEMO)) });
    }
  }
  files.sort((a, b) => a.name.localeCompare(b.name));
  assert.ok(files.length > 0, "no demo site files");
  const r = prng(SEED);
  const rep: Report = {
    cases: 0,
    readOk: 0,
    plans: 0,
    refusals: {},
    crashes: [],
    hangs: [],
    slowestMs: 0,
    byMutation: {},
  };
  // The unmutated files must plan (else the fuzzer tests nothing past the reader).
  for (const f of files) {
    await runCase(f.text, `${f.name} as is`, rep);
  }
  assert.equal(rep.plans, files.length, `a demo file does not plan: ${JSON.stringify(rep)}`);
  const textNames = Object.keys(TEXT_MUTATIONS);
  const objectNames = Object.keys(OBJECT_MUTATIONS);
  const t0 = performance.now();
  for (let c = 0; c < CASES; c++) {
    const f = pick(r, files);
    const labels: string[] = [];
    let text = f.text;
    if (r() < 0.6) {
      for (let n = mutationCount(r); n > 0; n--) {
        // The scaled-number mutation is drawn a third of the time (it keeps files readable).
        const m = r() < 0.33 ? "number → scaled" : pick(r, textNames);
        labels.push(m);
        text = TEXT_MUTATIONS[m](text, r);
      }
    } else {
      const o = parseYaml(f.text) as Record<string, unknown>;
      for (let n = mutationCount(r); n > 0; n--) {
        const m = pick(r, objectNames);
        labels.push(m);
        OBJECT_MUTATIONS[m](o, r);
      }
      text = r() < 0.5 ? stringifyYaml(o) : JSON.stringify(o) ?? "null";
      labels.push(text.startsWith("{") ? "as JSON" : "as YAML");
    }
    for (const l of labels) rep.byMutation[l] = (rep.byMutation[l] ?? 0) + 1;
    await runCase(text, `case ${c} (${f.name}: ${labels.join(", ")})`, rep);
  }
  const seconds = (performance.now() - t0) / 1000;
  const refusals = Object.entries(rep.refusals).sort().map(([k, n]) => `${k} ${n}`).join(", ");
  console.log(
    `site fuzz (seed ${SEED}): ${rep.cases} files (${files.length} unmutated + ${CASES} mutated) ` +
      `in ${seconds.toFixed(1)} s; read ${rep.readOk}, planned ${rep.plans}; refused: ` +
      `${refusals}; crashes ${rep.crashes.length}; hangs ${rep.hangs.length}; slowest case ` +
      `${rep.slowestMs.toFixed(0)} ms`,
  );
  console.log(
    "mutations applied: " +
      Object.entries(rep.byMutation).sort().map(([k, n]) => `${k} ${n}`).join(", "),
  );
  for (const c of rep.crashes.slice(0, 5)) {
    console.log(`CRASH ${c.label}: ${c.error}\n--- text ---\n${c.text}\n------------`);
  }
  for (const h of rep.hangs.slice(0, 5)) console.log(`HANG ${h.label}: ${h.ms.toFixed(0)} ms`);
  assert.equal(
    rep.crashes.length,
    0,
    `${rep.crashes.length} crashes (first: ${rep.crashes[0]?.error})`,
  );
  assert.equal(rep.hangs.length, 0, `${rep.hangs.length} cases over ${HANG_MS} ms`);
  assert.ok(rep.plans > files.length, "no mutated file planned");
  assert.ok(Object.keys(rep.refusals).length >= 2, "refusals of one class only");
});
