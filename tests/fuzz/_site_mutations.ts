/**
 * The site fuzzer's generator of mutated site texts (seeded, reproducible): text-level
 * mutations (lines deleted, duplicated or swapped; numbers replaced by extremes or scaled; units
 * moved; keys misspelt; random characters; broken structure; anchors and aliases; truncation;
 * JSON) and object-level ones (keys dropped, values of another type, values swapped, unknown
 * keys) written back as YAML or JSON. Shared by tests/fuzz/site_mutations.test.ts and the YAML
 * subset's differential test.
 *
 * @module
 */
import { parse as parseYaml, stringify as stringifyYaml } from "yaml";

/** The demo site files (data/demo/*.yaml, invented sites), sorted by name. */
export async function demoSiteFiles(): Promise<{ name: string; text: string }[]> {
  const demo = new URL("../../data/demo/", import.meta.url);
  const files: { name: string; text: string }[] = [];
  for await (const e of Deno.readDir(demo)) {
    if (e.isFile && e.name.endsWith(".yaml")) {
      files.push({ name: e.name, text: await Deno.readTextFile(new URL(e.name, demo)) });
    }
  }
  files.sort((a, b) => a.name.localeCompare(b.name));
  return files;
}

/** mulberry32: a small seeded 32-bit generator (reproducible across runs and machines). */
export function prng(seed: number): () => number {
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

/** One mutated text: its case number, the file it came from and the mutations applied. */
export interface MutatedSite {
  index: number;
  name: string;
  labels: string[];
  text: string;
}

/**
 * The mutated texts, in the order the fuzzer runs them.
 *
 * @param files the files to mutate (as from demoSiteFiles)
 * @param seed the generator's seed
 * @param cases how many texts
 */
export function* mutatedSites(
  files: readonly { name: string; text: string }[],
  seed: number,
  cases: number,
): Generator<MutatedSite> {
  const r = prng(seed);
  const textNames = Object.keys(TEXT_MUTATIONS);
  const objectNames = Object.keys(OBJECT_MUTATIONS);
  for (let c = 0; c < cases; c++) {
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
    yield { index: c, name: f.name, labels, text };
  }
}
