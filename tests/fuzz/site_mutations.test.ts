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
import { assert } from "../_assert.ts";
import { SnellpathError } from "../../lib/errors.ts";
import { readSiteText } from "../../lib/site/read.ts";
import { planSite } from "../../lib/site/plan.ts";
import { nonFinitePath } from "../property/_check.ts";
import { demoSiteFiles, mutatedSites } from "./_site_mutations.ts";

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
  const files = await demoSiteFiles();
  assert.ok(files.length > 0, "no demo site files");
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
  const t0 = performance.now();
  for (const m of mutatedSites(files, SEED, CASES)) {
    for (const l of m.labels) rep.byMutation[l] = (rep.byMutation[l] ?? 0) + 1;
    await runCase(m.text, `case ${m.index} (${m.name}: ${m.labels.join(", ")})`, rep);
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
