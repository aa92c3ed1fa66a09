/**
 * The YAML subset reader (lib/site/yaml_subset.ts) against npm `yaml` 2.9.1, the reference
 * library from the npm registry that the site reader falls back to: whenever the subset reader
 * returns a value, `yaml` must accept the text with the site reader's options (no error, no
 * warning) and give a value equal to it (-0 apart from 0, NaN, infinities, key order), and the
 * readings reader's call of `yaml` must give the same value too. The texts: every YAML file in
 * data/ and tests/ (with the refused-site corpus), the YAML examples in docs/, their CRLF
 * copies, the site fuzzer's 10 000 mutated texts (its generator and default seed), and
 * documents generated with fast-check.
 */
import fc from "fast-check";
import { parse, parseDocument } from "yaml";
import { assert, refusal } from "../_assert.ts";
import { readYamlSubset } from "../../lib/site/yaml_subset.ts";
import { parseYamlText, YAML_OPTIONS } from "../../lib/site/read_text.ts";
import { readReadingsText } from "../../lib/site/reconcile_read.ts";
import { demoSiteFiles, mutatedSites } from "../fuzz/_site_mutations.ts";

const ROOT = new URL("../../", import.meta.url);
const FUZZ_SEED = 20240611; // the site fuzzer's default seed
const FUZZ_CASES = 10_000; // and its default count

/** npm yaml with the site reader's options (lib/site/read_text.ts). */
function viaYaml(text: string): { ok: true; value: unknown } | { ok: false; why: string } {
  const doc = parseDocument(text, { ...YAML_OPTIONS, customTags: [] });
  const problem = doc.errors[0] ?? doc.warnings[0];
  if (problem) return { ok: false, why: problem.code };
  try {
    return { ok: true, value: doc.toJS({ maxAliasCount: 20 }) };
  } catch (e) {
    return { ok: false, why: String(e) };
  }
}

/** Where two values differ (Object.is on leaves, key order, plain prototypes), or undefined. */
function difference(a: unknown, b: unknown, at = "$"): string | undefined {
  if (a === null || b === null || typeof a !== "object" || typeof b !== "object") {
    return Object.is(a, b) ? undefined : `${at}: ${show(a)} vs ${show(b)}`;
  }
  if (Array.isArray(a) !== Array.isArray(b)) return `${at}: array vs not`;
  if (Object.getPrototypeOf(a) !== Object.getPrototypeOf(b)) return `${at}: prototypes differ`;
  const ka = Object.keys(a), kb = Object.keys(b);
  if (ka.join("\u0000") !== kb.join("\u0000")) return `${at}: keys ${show(ka)} vs ${show(kb)}`;
  for (const k of ka) {
    const d = difference(
      (a as Record<string, unknown>)[k],
      (b as Record<string, unknown>)[k],
      `${at}.${k}`,
    );
    if (d) return d;
  }
  return undefined;
}

function show(v: unknown): string {
  return Object.is(v, -0) ? "-0" : typeof v === "string" ? JSON.stringify(v) : String(v);
}

interface Tally {
  texts: number;
  read: number;
}

/** The contract on one text; counts it, and what the subset reader read. */
function check(text: string, label: string, tally: Tally): boolean {
  tally.texts++;
  const quick = readYamlSubset(text);
  if (!quick) return false;
  tally.read++;
  const full = viaYaml(text);
  if (!full.ok) {
    throw new Error(`${label}: subset read what yaml refuses (${full.why}):\n${text}`);
  }
  const d = difference(quick.value, full.value);
  if (d) throw new Error(`${label}: values differ at ${d}:\n${text}`);
  const readings = parse(text, { maxAliasCount: 10, uniqueKeys: true });
  const r = difference(quick.value, readings);
  if (r) throw new Error(`${label}: differs from the readings reader's yaml at ${r}:\n${text}`);
  return true;
}

async function yamlFiles(dir: URL, into: { name: string; text: string }[]): Promise<void> {
  for await (const e of Deno.readDir(dir)) {
    const url = new URL(e.name + (e.isDirectory ? "/" : ""), dir);
    if (e.isDirectory) await yamlFiles(url, into);
    else if (/\.(ya?ml)(\.sample)?$/.test(e.name)) {
      const bytes = await Deno.readFile(url);
      let text: string;
      try {
        text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
      } catch {
        continue; // not UTF-8 (the corpus's latin-1 case): no text to compare
      }
      into.push({ name: url.href.slice(ROOT.href.length), text });
    }
  }
}

/** The ```yaml blocks of docs/*.md, named by file and block number. */
async function docExamples(): Promise<{ name: string; text: string }[]> {
  const out: { name: string; text: string }[] = [];
  for await (const e of Deno.readDir(new URL("docs/", ROOT))) {
    if (!e.name.endsWith(".md")) continue;
    const md = await Deno.readTextFile(new URL(`docs/${e.name}`, ROOT));
    let n = 0;
    for (const m of md.matchAll(/^```yaml\n([\s\S]*?)^```$/gm)) {
      out.push({ name: `docs/${e.name} block ${++n}`, text: m[1] });
    }
  }
  return out.sort((a, b) => a.name.localeCompare(b.name));
}

Deno.test("yaml subset: every YAML file of the project, and its CRLF copy, as npm yaml reads it", async () => {
  const files: { name: string; text: string }[] = [];
  await yamlFiles(new URL("data/", ROOT), files);
  await yamlFiles(new URL("tests/", ROOT), files);
  files.push(...await docExamples());
  files.sort((a, b) => a.name.localeCompare(b.name));
  assert.ok(files.length >= 120, `only ${files.length} YAML texts found`);
  const tally = { texts: 0, read: 0 };
  const byDir: Record<string, [number, number]> = {};
  for (const f of files) {
    const dir = f.name.replace(/\/[^/]*$|\s.*$/, "");
    const t = (byDir[dir] ??= [0, 0]);
    t[0]++;
    if (check(f.text, f.name, tally)) t[1]++;
    check(f.text.replaceAll("\n", "\r\n"), `${f.name} (CRLF)`, tally);
  }
  console.log(
    `project YAML: subset read ${tally.read} of ${tally.texts} texts (files and CRLF copies); ` +
      Object.entries(byDir).map(([d, [n, r]]) => `${d} ${r}/${n}`).join(", "),
  );
  // The refused-site corpus holds files the subset must read (semantic refusals) and files it
  // must leave to yaml (syntax): both sides of the contract are exercised.
  assert.ok(
    byDir["tests/site/bad"][1] > 0 && byDir["tests/site/bad"][1] < byDir["tests/site/bad"][0],
  );
});

Deno.test("yaml subset: the site fuzzer's 10 000 texts (default seed), as npm yaml reads them", async () => {
  const files = await demoSiteFiles();
  const tally = { texts: 0, read: 0 };
  for (const m of mutatedSites(files, FUZZ_SEED, FUZZ_CASES)) {
    check(m.text, `fuzz case ${m.index} (${m.name}: ${m.labels.join(", ")})`, tally);
  }
  console.log(`fuzz texts (seed ${FUZZ_SEED}): subset read ${tally.read} of ${tally.texts}`);
  assert.equal(tally.texts, FUZZ_CASES);
  assert.ok(tally.read > FUZZ_CASES / 4, `the subset read only ${tally.read} fuzz texts`);
  assert.ok(tally.read < FUZZ_CASES, "the subset deferred none of the broken texts");
});

// ---- generated documents ------------------------------------------------------------------

type Node =
  | { k: "scalar"; text: string }
  | { k: "fseq"; items: Node[]; gap: string }
  | { k: "fmap"; entries: [string, Node][]; gap: string }
  | { k: "bseq"; items: [Node, Deco][] }
  | { k: "bmap"; entries: [string, Node, Deco][] };

interface Deco {
  trail: string;
  comment: boolean;
  blank: boolean;
  extra: number;
  compact: boolean;
}

const TRICKY_NUMBERS = [
  "0",
  "-0",
  "+0",
  "00",
  "012",
  "0.0",
  "-0.0",
  "-.0",
  "1.",
  ".5",
  "+.5e3",
  "1e308",
  "1e309",
  "-1e309",
  "5e-324",
  "1e-400",
  "-1e-400",
  "9007199254740991",
  "9007199254740993",
  "123456789012345",
  "1234567890123456",
  "0x1F",
  "0xff",
  "0XFF",
  "0xFFFFFFFFFFFF",
  "0x1000000000000",
  "-0x1",
  "0o17",
  "0o8",
  "0o777777777777777",
  "0b101",
  ".inf",
  ".Inf",
  ".INF",
  "+.inf",
  "-.inf",
  "-.INF",
  ".iNf",
  ".nan",
  ".NaN",
  ".NAN",
  "-.nan",
  "NaN",
  "Infinity",
  "1_000",
  "1,5",
  "1e",
  "e1",
  "1.2.3",
  "+",
  "-",
  ".",
  "12 degC",
  "4.5 m/s",
];
const TRICKY_WORDS = [
  "~",
  "null",
  "Null",
  "NULL",
  "nULL",
  "true",
  "True",
  "TRUE",
  "tRUE",
  "false",
  "False",
  "FALSE",
  "yes",
  "no",
  "on",
  "off",
  "y",
  "n",
  "a:b",
  "a: b",
  "a:",
  "http://example.invalid/x",
  "a #b",
  "a#b",
  "#a",
  "a  b",
  "it's",
  'say "hi"',
  "- a",
  "-a",
  "--a",
  "---",
  "...",
  "? a",
  "?a",
  ":a",
  "&a",
  "*a",
  "!a",
  "|",
  ">",
  "%a",
  "@a",
  "`a",
  "a, b",
  "a]b",
  "{a}",
  "[a]",
  "é ü ß",
  "m^3/h",
  "100 %",
  "—",
];
const KEY_WORDS = [
  "a",
  "b",
  "name",
  "x.y",
  "a-b",
  "_",
  "null",
  "True",
  "false",
  "on",
  "__proto__",
  "constructor",
  "toString",
  "hasOwnProperty",
  "e1",
  "inf",
  "NaN",
];

const plainText = fc.oneof(
  fc.constantFrom(...TRICKY_NUMBERS),
  fc.constantFrom(...TRICKY_WORDS),
  fc.double().map(String),
  fc.integer().map(String),
  fc.stringMatching(/^[A-Za-z0-9 #:.,'"\-+%^\/_~]{1,12}$/),
);
const singleQuoted = fc.oneof(fc.constantFrom(...TRICKY_WORDS), fc.string({ maxLength: 8 }))
  .map((s) => `'${s.replaceAll("'", "''")}'`);
const doubleQuoted = fc.oneof(
  fc.constantFrom(...TRICKY_WORDS, ...TRICKY_NUMBERS).map((s) => JSON.stringify(s)),
  fc.string({ maxLength: 8 }).map((s) => JSON.stringify(s)),
  fc.constantFrom('"\\x41\\u00e9\\/\\0"', '"\\e"', '"\\ud800"', '"a\\', '"\\U0001F600"'),
);
const scalar = fc.oneof(
  { weight: 4, arbitrary: plainText },
  { weight: 1, arbitrary: singleQuoted },
  { weight: 1, arbitrary: doubleQuoted },
).map((text): Node => ({ k: "scalar", text }));
const key = fc.oneof(
  { weight: 3, arbitrary: fc.stringMatching(/^[A-Za-z_][A-Za-z0-9_.\-]{0,6}$/) },
  { weight: 1, arbitrary: fc.constantFrom(...KEY_WORDS) },
);
const deco = fc.record({
  trail: fc.constantFrom("", "", "", " ", "   "),
  comment: fc.boolean(),
  blank: fc.boolean(),
  extra: fc.constantFrom(0, 0, 1, 2),
  compact: fc.boolean(),
});
const gap = fc.constantFrom("", " ", "  ");

const { node } = fc.letrec<{ node: Node; flow: Node }>((tie) => ({
  flow: fc.oneof(
    { depthSize: "small", withCrossShrink: true },
    { weight: 4, arbitrary: scalar },
    {
      weight: 1,
      arbitrary: fc.record({
        k: fc.constant("fseq" as const),
        items: fc.array(tie("flow"), { maxLength: 4 }),
        gap,
      }),
    },
    {
      weight: 1,
      arbitrary: fc.record({
        k: fc.constant("fmap" as const),
        entries: fc.array(fc.tuple(key, tie("flow")), { maxLength: 4 }),
        gap,
      }),
    },
  ) as fc.Arbitrary<Node>,
  node: fc.oneof(
    { depthSize: "small", withCrossShrink: true },
    { weight: 2, arbitrary: tie("flow") },
    {
      weight: 2,
      arbitrary: fc.record({
        k: fc.constant("bmap" as const),
        entries: fc.array(fc.tuple(key, tie("node"), deco), { minLength: 1, maxLength: 5 }),
      }),
    },
    {
      weight: 1,
      arbitrary: fc.record({
        k: fc.constant("bseq" as const),
        items: fc.array(fc.tuple(tie("node"), deco), { minLength: 1, maxLength: 4 }),
      }),
    },
  ) as fc.Arbitrary<Node>,
}));

function inline(n: Node): string {
  if (n.k === "scalar") return n.text;
  if (n.k === "fseq") return `[${n.gap}${n.items.map(inline).join(", ")}${n.gap}]`;
  if (n.k === "fmap") {
    return `{${n.gap}${n.entries.map(([k, v]) => `${k}: ${inline(v)}`).join(", ")}${n.gap}}`;
  }
  return "";
}

function tail(d: Deco): string {
  return d.trail + (d.comment ? " # note: [x] {y} 'z'" : "") + (d.blank ? "\n" : "");
}

/** Block lines of a node at indentation `n`. */
function render(v: Node, n: number): string[] {
  const pad = " ".repeat(n);
  if (v.k === "bmap") {
    const out: string[] = [];
    for (const [k, x, d] of v.entries) {
      if (x.k === "bmap" || x.k === "bseq") {
        out.push(`${pad}${k}:${tail(d)}`);
        out.push(...render(x, x.k === "bseq" && d.compact ? n : n + 2 + d.extra));
      } else out.push(`${pad}${k}: ${inline(x)}${tail(d)}`);
    }
    return out;
  }
  if (v.k === "bseq") {
    const out: string[] = [];
    for (const [x, d] of v.items) {
      if ((x.k === "bmap" || x.k === "bseq") && !d.compact) {
        out.push(`${pad}-${tail(d)}`);
        out.push(...render(x, n + 2 + d.extra));
      } else if (x.k === "bmap" || x.k === "bseq") {
        const inner = render(x, n + 2 + d.extra);
        inner[0] = `${pad}-${" ".repeat(1 + d.extra)}${inner[0].trimStart()}`;
        out.push(...inner);
      } else out.push(`${pad}- ${inline(x)}${tail(d)}`);
    }
    return out;
  }
  return [pad + inline(v)];
}

const documents = fc.record({
  root: node,
  indent: fc.constantFrom(0, 0, 0, 2),
  marker: fc.constantFrom("", "", "---\n", "--- # start\n", "# head\n"),
  end: fc.constantFrom("\n", "", "\n\n", "\n# tail\n"),
}).map(({ root, indent, marker, end }) => marker + render(root, indent).join("\n") + end);

Deno.test("yaml subset: generated documents (fast-check) as npm yaml reads them", () => {
  const tally = { texts: 0, read: 0 };
  fc.assert(
    fc.property(documents, (text) => {
      check(text, "generated", tally);
    }),
    { numRuns: 4000, seed: 20261203 },
  );
  console.log(`generated documents: subset read ${tally.read} of ${tally.texts}`);
  assert.ok(tally.read > tally.texts / 4, `the subset read only ${tally.read} generated texts`);
});

Deno.test("yaml subset: the demo sites and the docs' site examples need no fallback", async () => {
  const files = await demoSiteFiles();
  assert.ok(files.length >= 4);
  const examples = (await docExamples()).filter((e) => /site-file|readings/.test(e.name));
  assert.ok(examples.length >= 2, "the docs' site and readings examples are not found");
  const readings: { name: string; text: string }[] = [];
  await yamlFiles(new URL("data/demo/readings/", ROOT), readings);
  assert.ok(readings.length >= 1);
  for (const f of [...files, ...examples, ...readings]) {
    const tally = { texts: 0, read: 0 };
    assert.ok(check(f.text, f.name, tally), `${f.name} is left to the full YAML parser`);
  }
});

Deno.test("yaml subset: deferred texts keep the full parser's messages", async () => {
  const ctx = { file: "site.yaml" };
  const dup = "name: a\npipe:\n  nps: 8\n  nps: 10\n";
  assert.equal(readYamlSubset(dup), undefined);
  const e1 = await refusal(parseYamlText(ctx, dup));
  assert.match(e1.message, /line 4, column 3/);
  assert.match(e1.message, /the key "nps" a second time/);
  const bomb = await Deno.readTextFile(new URL("tests/site/bad/alias-bomb.yaml.sample", ROOT));
  assert.equal(readYamlSubset(bomb), undefined);
  const e2 = await refusal(parseYamlText(ctx, bomb));
  assert.match(e2.message, /too many YAML aliases/);
  const tab = "pipe:\n\tnps: 8\n";
  assert.equal(readYamlSubset(tab), undefined);
  const e3 = await refusal(parseYamlText(ctx, tab));
  assert.match(e3.message, /line 2, column 1/);
  // The readings reader too: a repeated key is still named by yaml's message.
  const e4 = await refusal(readReadingsText("temperature: 1 degC\ntemperature: 2 degC\n"));
  assert.match(e4.message, /neither YAML nor JSON \(Map keys must be unique/);
});

Deno.test("yaml subset: odd and large inputs are deferred without throwing", () => {
  const odd: unknown[] = [
    "[".repeat(100_000),
    "{a: ".repeat(50_000),
    Array.from({ length: 200 }, (_, i) => " ".repeat(i) + "a:").join("\n"),
    Array.from({ length: 200 }, (_, i) => " ".repeat(2 * i) + "- ").join("\n"),
    "a: 'x\ny'",
    'a: "x\\\ny"',
    "a: |\n  x\n",
    "a: &x 1\nb: *x\n",
    "a: !!str 1\n",
    "%YAML 1.2\n---\na: 1\n",
    "a: 1\n...\n",
    "? a\n: 1\n",
    "<<: {a: 1}\n",
    "a: 1\u2028b: 2\n",
    "a: \u0007\n",
    "a: 1\rb: 2\n",
    "a: \ud800\n",
    "'a': 1\n",
    "1: a\n",
    "null: a\n",
    "__proto__: 1\n",
    42 as unknown,
    undefined,
  ];
  for (const t of odd) assert.equal(readYamlSubset(t as string), undefined, JSON.stringify(t));
  // A large file in the subset is read (about 1 MB, 40 000 lines).
  const big = Array.from({ length: 40_000 }, (_, i) => `k${i}: [${i}, ${i}.5, x${i}] # c`)
    .join("\n");
  const r = readYamlSubset(big)?.value as Record<string, unknown[]> | undefined;
  assert.ok(r && Object.keys(r).length === 40_000 && r.k39999[1] === 39999.5);
});
