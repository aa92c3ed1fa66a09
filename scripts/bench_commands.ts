/**
 * Whole-command wall time of the quick scripts, each as a ratio to a bare `deno eval 0` started
 * the same way (same flags), medians of several runs taken in turn. Run with --help.
 *
 * @module
 */
import { InputError } from "../lib/errors.ts";
import { parseCli, runMain } from "./_cli.ts";
import { STEEL_V_OPTIONS } from "../tests/acoustics/_fixture.ts";

const HELP = `
bench_commands — wall time of whole commands as a ratio to bare Deno start-up

Usage:
  deno task bench:commands [--runs 9] [--baseline DIR] [--json]

Options:
  --runs N        runs of each command, taken in turn (default 9, at least 7); medians reported
  --baseline DIR  also run each script command from another checkout (an earlier commit, for
                  example from 'git archive'), in turn with ours, and report ours / baseline
  --json          machine-readable output
  -h, --help   this help

Times each command as a child process from spawn to exit. The baseline is 'deno eval 0' with the
same flags. A command whose script does not exist yet is skipped with a notice. The last case is
the command 'deno task plan' runs, read from each checkout's deno.json (ours runs the bundle in
scripts/bundled/ with eager compilation; an older checkout may run scripts/plan.ts).
`;

const FLAGS = ["--ignore-env=LOG_TOKENS,LOG_STREAM", "--allow-read=."];

interface Case {
  name: string;
  args: string[];
  /** The script file that must exist. */
  script?: string;
  /** Goal: at most this many times bare start-up. */
  goal?: number;
  /** Working folder of the child (default: this one). */
  cwd?: string;
  /** Index of the case this one is the baseline of. */
  baselineOf?: number;
  /**
   * A deno task: the command is that task's `deno …` line from deno.json in the working folder
   * (the baseline's own deno.json for its twin), then `args`.
   */
  task?: string;
}

const CASES: Case[] = [
  { name: "bare start-up: deno eval 0", args: ["eval", ...FLAGS, "0"] },
  {
    name: "spacing.ts, raw figures, --json",
    script: "scripts/spacing.ts",
    goal: 2,
    args: [
      "run",
      ...FLAGS,
      "scripts/spacing.ts",
      ...STEEL_V_OPTIONS,
      "--json",
    ],
  },
  {
    name: "plan.ts, one invented site, --format json",
    script: "scripts/plan.ts",
    goal: 4,
    args: [
      "run",
      ...FLAGS,
      "scripts/plan.ts",
      "data/demo/01-reservoir-outlet.yaml",
      "--format",
      "json",
    ],
  },
  {
    name: "deno task plan's command, one site, --format json",
    script: "scripts/plan.ts",
    goal: 4,
    task: "plan",
    args: ["data/demo/01-reservoir-outlet.yaml", "--format", "json"],
  },
];

/**
 * The `deno …` command of a task in a checkout's deno.json, without the leading `deno`.
 *
 * @param dir the checkout ("." for this one)
 * @param task the task name
 * @returns the command's arguments
 */
function taskArgs(dir: string, task: string): string[] {
  const json = JSON.parse(Deno.readTextFileSync(`${dir}/deno.json`));
  const line = json?.tasks?.[task];
  const cmd = typeof line === "string" ? line : line?.command;
  if (typeof cmd !== "string" || !cmd.startsWith("deno ") || /["'|&;<>$]/.test(cmd)) {
    throw new InputError(`task ${task} in ${dir}/deno.json`, String(cmd), "a plain deno command");
  }
  return cmd.split(/\s+/).slice(1);
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

async function timeOnce(
  args: string[],
  cwd?: string,
): Promise<{ ms: number; ok: boolean; err: string }> {
  const t0 = performance.now();
  const out = await new Deno.Command(Deno.execPath(), {
    args,
    cwd,
    stdout: "null",
    stderr: "piped",
  }).output();
  const ms = performance.now() - t0;
  return { ms, ok: out.success, err: new TextDecoder().decode(out.stderr).trim().split("\n")[0] };
}

function exists(path: string): boolean {
  try {
    return Deno.statSync(path).isFile;
  } catch {
    return false;
  }
}

runMain(async () => {
  const { values } = parseCli(Deno.args, {
    runs: { type: "string" },
    baseline: { type: "string" },
  }, HELP);
  const runs = values.runs === undefined ? 9 : Number(values.runs);
  if (!Number.isInteger(runs) || runs < 7) {
    throw new InputError("--runs", String(values.runs), "an integer >= 7");
  }
  const notices: string[] = [];
  const cases = CASES.filter((c) => {
    if (!c.script || exists(c.script)) return true;
    notices.push(`${c.script} not found: "${c.name}" skipped`);
    return false;
  });
  const baseline = values.baseline as string | undefined;
  if (baseline !== undefined) {
    const n = cases.length;
    for (let i = 1; i < n; i++) {
      const c = cases[i];
      if (!exists(`${baseline}/${c.script}`)) {
        notices.push(`${baseline}/${c.script} not found: no baseline for "${c.name}"`);
        continue;
      }
      cases.push({
        ...c,
        name: `${c.name} [baseline]`,
        goal: undefined,
        cwd: baseline,
        baselineOf: i,
      });
    }
  }
  for (const c of cases) {
    if (c.task) c.args = [...taskArgs(c.cwd ?? ".", c.task), ...c.args];
  }
  // One warm-up each (module cache, type-check cache), then runs taken in turn.
  for (const c of cases) {
    const r = await timeOnce(c.args, c.cwd);
    if (!r.ok) throw new Error(`"${c.name}" failed: ${r.err}`);
  }
  const times: number[][] = cases.map(() => []);
  for (let r = 0; r < runs; r++) {
    for (let i = 0; i < cases.length; i++) {
      times[i].push((await timeOnce(cases[i].args, cases[i].cwd)).ms);
    }
  }
  const base = median(times[0]);
  const rows = cases.map((c, i) => {
    const ms = median(times[i]);
    const ratio = ms / base;
    const twin = cases.findIndex((b) => b.baselineOf === i);
    return {
      name: c.name,
      medianMs: ms,
      ratio,
      goal: c.goal ?? null,
      met: c.goal === undefined ? null : ratio <= c.goal,
      /** Ours / baseline checkout, when one was timed. */
      vsBaseline: twin < 0 ? null : ms / median(times[twin]),
    };
  });
  if (values.json) {
    console.log(JSON.stringify({ runs, rows, notices }, null, 2));
    return 0;
  }
  for (const n of notices) console.log(`notice: ${n}`);
  console.log(`medians of ${runs} runs taken in turn; ratio = command / bare start-up\n`);
  for (const r of rows) {
    const goal = r.goal === null ? "" : `  (goal <= ${r.goal}x: ${r.met ? "met" : "not met"})`;
    const vs = r.vsBaseline === null ? "" : `  ${r.vsBaseline.toFixed(2)} of baseline`;
    console.log(
      `${r.name.padEnd(56)} ${r.medianMs.toFixed(0).padStart(6)} ms  ${
        r.ratio.toFixed(2)
      }x${goal}${vs}`,
    );
  }
  return 0;
});
