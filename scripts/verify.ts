/**
 * Run every published verification table the registry knows (kind `verification`) against the
 * code that evaluates it, and print source, quantity, expected, computed, relative difference and
 * pass/fail. Exit 1 if any check fails.
 *
 * @module
 */
import { defaultRegistry, type RecalledRow, recalledRows } from "../lib/registry/mod.ts";
import { verifyWaterTable, WATER_VERIFICATION_TABLES } from "../lib/water/mod.ts";
import { SEAWATER_VERIFICATION_FORMULATIONS, verifySeawaterTable } from "../lib/liquids/mod.ts";
import { parseCli, runMain } from "./_cli.ts";
import { checkInstallationData, type InstallationCheck } from "../lib/installation/published.ts";

const HELP = `
verify — run the published verification tables of the registry against this toolkit's code

Usage:
  deno task verify [--table ID] [--all-rows] [--strict] [--json]

Options:
  --table ID     run one table only (repeatable; skips the installation section)
  --all-rows     print every checked value, not only the worst of each table and the failures
  --strict       also fail when a table has no evaluating code
  --json         machine-readable output (every check)
  --debug        stack trace on errors
  -h, --help     this help

Registry section: every datum still marked basis recalled, with its file, entry, source and the
recorded reason (a row without one says so). It lists; it never fails the run.

Installation section: the distorted-profile model against each published point on readings
behind a single bend (data/installation/), pass when inside the published bounds or outside by
no more than the model's stated spread.

Exit codes: 0 every check within its table's tolerance, 1 a check failed (or, with --strict, a
table could not be run), 2 bad input.
`;

interface Check {
  table: string;
  row: number;
  inputs: Readonly<Record<string, number>>;
  column: string;
  expected: number;
  computed: number;
  relDiff: number;
  tolerance: number;
  ok: boolean;
}

interface TableResult {
  id: string;
  formulation: string;
  source: string;
  status: "pass" | "fail" | "not run";
  reason?: string;
  checks: Check[];
}

function g(x: number): string {
  return Number.isFinite(x) ? x.toPrecision(10) : String(x);
}

runMain(() => {
  const { values } = parseCli(Deno.args, {
    table: { type: "string", multiple: true },
    "all-rows": { type: "boolean" },
    strict: { type: "boolean" },
  }, HELP);
  const reg = defaultRegistry();
  const wanted = values.table as string[] | undefined;
  let tables = reg.verificationTables();
  if (wanted?.length) tables = wanted.map((id) => reg.verification(id));
  const water = new Set<string>(WATER_VERIFICATION_TABLES);
  const sea = new Set(SEAWATER_VERIFICATION_FORMULATIONS);
  const results: TableResult[] = [];
  for (const t of tables) {
    const base = { id: t.id as string, formulation: t.formulation as string, source: t.source };
    let checks: Check[] | undefined;
    let reason: string | undefined;
    try {
      if (water.has(t.id)) checks = verifyWaterTable(t.id);
      else if (sea.has(t.formulation)) checks = verifySeawaterTable(t.id);
      else reason = `no evaluating code for formulation "${t.formulation}"`;
    } catch (e) {
      reason = `error while evaluating: ${(e as Error).message}`;
    }
    if (!checks) {
      results.push({
        ...base,
        status: reason?.startsWith("error") ? "fail" : "not run",
        reason,
        checks: [],
      });
    } else {
      results.push({ ...base, status: checks.every((c) => c.ok) ? "pass" : "fail", checks });
    }
  }
  const failed = results.filter((r) => r.status === "fail").length;
  const notRun = results.filter((r) => r.status === "not run").length;
  const nChecks = results.reduce((a, r) => a + r.checks.length, 0);
  const nFailedChecks = results.reduce((a, r) => a + r.checks.filter((c) => !c.ok).length, 0);
  // --- installation section: the distorted-profile model against published data ----------
  const inst: InstallationCheck[] = wanted?.length ? [] : checkInstallationData();
  const instFailed = inst.filter((c) => !c.ok).length;
  // --- registry section: rows still resting on memory, with their recorded reasons --------
  const recalled: RecalledRow[] = wanted?.length ? [] : recalledRows(reg.loaded.docs);
  if (values.json) {
    console.log(
      JSON.stringify(
        { registryHash: reg.hash, tables: results, installation: inst, recalled },
        null,
        2,
      ),
    );
  } else {
    console.log(`registry ${reg.hash.slice(0, 16)}…: ${results.length} verification tables`);
    for (const r of results) {
      console.log("");
      fit2(
        `${r.status.toUpperCase().padEnd(7)} ${r.id} — ${r.formulation}`,
        `[source ${r.source}]`,
      );
      if (r.reason) {
        console.log(`        ${r.reason}`);
        continue;
      }
      const worst = r.checks.reduce((a, c) => (c.relDiff > a.relDiff ? c : a), r.checks[0]);
      const show = values["all-rows"]
        ? r.checks
        : [...new Set([worst, ...r.checks.filter((c) => !c.ok)])];
      console.log(
        `        ${r.checks.length} values; worst relative difference ${
          worst.relDiff.toExponential(2)
        } (tolerance ${worst.tolerance})`,
      );
      for (const c of show) {
        const inp = Object.entries(c.inputs).map(([k, v]) => `${k}=${+v.toPrecision(8)}`)
          .join(" ");
        fit2(
          `        ${c.ok ? "pass" : "FAIL"} row ${c.row} ${inp}:`,
          `${c.column} expected ${g(c.expected)} computed ${g(c.computed)} rel ${
            c.relDiff.toExponential(2)
          }`,
        );
      }
    }
    console.log(
      `\n${nChecks - nFailedChecks} passed, ${nFailedChecks} failed` +
        (notRun ? ` (${notRun} tables not run)` : ""),
    );
    if (inst.length) printInstallation(inst, values["all-rows"] === true);
    if (!wanted?.length) printRecalled(recalled);
  }
  return failed > 0 || instFailed > 0 || (values.strict && notRun > 0) ? 1 : 0;
});

/** Print head and tail on one line when it fits in 100 columns, else the tail on a second line
 * indented by 10 (a tail that still does not fit is printed whole: no number is cut). */
function fit2(head: string, tail: string): void {
  if ([...head].length + 1 + [...tail].length <= 100) console.log(`${head} ${tail}`);
  else console.log(`${head}\n          ${tail}`);
}

/** Installation section: one line per published statement (worst point), failures in full;
 * every line within 100 columns. */
function printInstallation(checks: InstallationCheck[], all: boolean): void {
  const deg = (o: number) => Number.isNaN(o) ? "all angles" : `${Math.round(o * 180 / Math.PI)}°`;
  const mount = (t: number) =>
    ({ 1: "Z", 2: "V", 4: "W" } as Record<number, string>)[t] ??
      `${t} traverses`;
  const bounds = (c: InstallationCheck) =>
    Number.isFinite(c.high) ? `[${c.low}, ${c.high}]` : `≥ ${c.low}`;
  const line = (c: InstallationCheck) =>
    `        ${c.ok ? "pass" : "FAIL"} ${c.distanceDiameters} D ${deg(c.orientation)} ` +
    `${mount(c.traverses)}${Number.isNaN(c.reynolds) ? "" : ` Re ${c.reynolds.toExponential(1)}`}` +
    `: ${c.model.toFixed(5)} vs ${bounds(c)}, off ${c.deviation.toExponential(1)}, ` +
    `spread ${c.spread.toExponential(1)}`;
  console.log(`\ninstallation model against published data: ${checks.length} checks`);
  const groups = new Map<string, InstallationCheck[]>();
  for (const c of checks) {
    const k = `${c.table}\t${c.source}\t${c.statement}`;
    groups.set(k, [...(groups.get(k) ?? []), c]);
  }
  for (const [k, g] of groups) {
    const [table, source, statement] = k.split("\t");
    const bad = g.filter((c) => !c.ok);
    // closest to its bounds (a point outside them counts as a negative margin)
    const margin = (c: InstallationCheck) =>
      c.deviation > 0 ? -c.deviation : Math.min(c.model - c.low, c.high - c.model);
    const worst = g.reduce((a, c) => (margin(c) < margin(a) ? c : a));
    console.log(`\n${(bad.length ? "FAIL" : "PASS").padEnd(7)} ${table}: ${statement}`);
    console.log(`        source ${source}; ${g.length} points; nearest its bounds:`);
    for (const c of all ? g : [...new Set([worst, ...bad])]) console.log(line(c));
  }
  const nBad = checks.filter((c) => !c.ok).length;
  console.log(`\n${checks.length - nBad} passed, ${nBad} failed (installation)`);
}

/** Registry section: per file, each recalled row and its reason, cut to 100 columns. */
function printRecalled(rows: RecalledRow[]): void {
  const fit = (t: string) => (t.length > 100 ? t.slice(0, 99) + "…" : t);
  const files = new Map<string, RecalledRow[]>();
  for (const r of rows) files.set(r.file, [...(files.get(r.file) ?? []), r]);
  const none = rows.filter((r) => !r.reason).length;
  console.log(
    `\nregistry: ${rows.length} rows still basis recalled in ${files.size} files` +
      ` (${none} without a recorded reason)`,
  );
  for (const [file, g] of files) {
    console.log(`\n${file}: ${g.length}`);
    for (const r of g) {
      const where = r.path.startsWith(r.entry) || !r.entry ? r.path : `${r.entry} ${r.path}`;
      console.log(fit(`        ${where} [${r.source}]`));
      console.log(fit(`          ${r.reason || "(no reason recorded)"}`));
    }
  }
}
