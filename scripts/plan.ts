/**
 * Plan one site or a fleet: site files (YAML or JSON), folders of them, or a CSV of sites in;
 * a traced plan out as text, JSON, Markdown, HTML with drawings, or a fleet CSV.
 *
 * @module
 */
import { InputError, SnellpathError } from "../lib/errors.ts";
import { defaultRegistry, type Registry } from "../lib/registry/mod.ts";
import { readSiteFile, readSitesCsvText, siteFiles, streamSitesCsv } from "../lib/site/read.ts";
import type { SiteInput } from "../lib/site/schema.ts";
import { planSite } from "../lib/site/plan.ts";
import type { FieldReadings } from "../lib/site/reconcile.ts";
import { fleetCsv, fleetHtml, fleetRow } from "../lib/report/plan_report.ts";
import {
  type Format,
  FORMATS,
  type FromWorker,
  type JobOptions,
  type JobResult,
  planJob,
  render,
  type ToWorker,
} from "./_worker.ts";
import { parseCli, runMain } from "./_cli.ts";

const HELP = `
plan — plan clamp-on transit-time flow measurements for one site or a fleet

usage:
  plan FILE|FOLDER|SITES.csv … [--format text|json|md|html|csv] [--out PATH]
  plan SITE --readings READINGS.yaml [--format text|md|html|json]   reconcile site readings

options:
  --format F          text (default), json, md, html, csv (csv: the fleet summary), card
  --out PATH          write reports there instead of standard output; with several sites (or
                      html) PATH is a folder: one report per site plus index.html / summary.csv
  --monte-carlo       run the Monte Carlo check beside GUM (default with one site)
  --no-monte-carlo    skip it (default with several sites)
  --draws N           Monte Carlo draws (default 100000)
  --seed N            Monte Carlo seed (default 1)
  --registry-hash H   refuse to plan unless the reference data hash is H
  --readings FILE     readings taken on site (YAML/JSON, docs/readings.md): reconcile them
  --jobs N            plan a fleet on N threads (Web Workers; default: the core count); the
                      reports and their order are the same whatever N (1: no workers)
  --quiet             no progress lines on standard error
  --json              same as --format json
  --debug             print the stack trace of an error
  -h, --help          this text

Reports are written atomically (temporary file, then rename): a refused or failed run never
truncates an earlier report. In a fleet, a bad site is reported on standard error and the
others are still planned; the exit code is then 2.

exit codes: 0 ok, 2 bad input (or a refused site in a fleet), 1 no physical answer.

examples:
  deno task plan -- data/demo/01-reservoir-outlet.yaml
  deno task plan -- data/demo --format html --out out/demo
  deno task plan -- sites.csv --format csv --out out/fleet
`;

const EXT: Record<Format, string> = {
  text: "txt",
  json: "json",
  md: "md",
  html: "html",
  csv: "csv",
  card: "card.html",
};

const madeDirs = new Set<string>();

/**
 * Write a file atomically: a temporary file in the same folder, then rename. Synchronous calls:
 * in a fleet they are cheaper than the asynchronous ones, and the run is sequential anyway.
 */
function writeAtomic(path: string, text: string): Promise<void> {
  const slash = path.lastIndexOf("/");
  const dir = slash >= 0 ? path.slice(0, slash) || "/" : ".";
  if (!madeDirs.has(dir)) {
    Deno.mkdirSync(dir, { recursive: true });
    madeDirs.add(dir);
  }
  const tmp = `${dir}/.${path.slice(slash + 1)}.${crypto.randomUUID().slice(0, 8)}.tmp`;
  try {
    Deno.writeTextFileSync(tmp, text);
    Deno.renameSync(tmp, path);
  } catch (e) {
    try {
      Deno.removeSync(tmp);
    } catch {
      // nothing was written
    }
    throw e;
  }
  return Promise.resolve();
}

function safeName(s: string): string {
  return s.normalize("NFKD").replace(/[^A-Za-z0-9._-]+/g, "-").replace(/^-+|-+$/g, "").slice(
    0,
    80,
  ) ||
    "site";
}

/** The readings file, read by the same reader as the reconcile task (Z/V/W letters too). */
async function readReadings(path: string): Promise<FieldReadings> {
  const { readReadingsText } = await import("../lib/site/reconcile_read.ts");
  return await readReadingsText(await Deno.readTextFile(path), path);
}

type Source = { kind: "file"; path: string } | { kind: "csv"; path: string };

/** A refused CSV row: its message already names the file, row and field. */
class RowError extends SnellpathError {
  constructor(message: string) {
    super(message, 2);
  }
}

/** One fleet entry in input order: a site to plan, or the reason it could not be read. */
interface Item {
  readonly label: string;
  readonly site?: SiteInput;
  readonly error?: SnellpathError;
}

/**
 * Web Workers running scripts/_plan_worker.ts (which hands messages to scripts/_worker.ts).
 * Sites go to the least busy worker; outcomes are handed to `finish` strictly in submission
 * order (a reorder buffer), so output is the same as with one thread. At most a few sites per worker are in flight (a long CSV is not read ahead).
 */
class WorkerPool {
  readonly #workers: Worker[] = [];
  readonly #busy: number[] = [];
  readonly #waiting = new Map<number, { item: Item; result?: JobResult; done: boolean }>();
  #nextSeq = 0;
  #nextOut = 0;
  #failure: Error | undefined;
  #wake: (() => void) | undefined;
  #chain: Promise<void> = Promise.resolve();

  constructor(
    n: number,
    options: JobOptions,
    readonly finish: (item: Item, result: JobResult | undefined) => Promise<void>,
  ) {
    // From source the worker is _plan_worker.ts; from the bundle (scripts/bundled/, made by
    // `deno task bundle`) it is the bundled _plan_worker.js beside this file.
    const worker = new URL(
      import.meta.url.endsWith(".js") ? "./_plan_worker.js" : "./_plan_worker.ts",
      import.meta.url,
    );
    for (let i = 0; i < n; i++) {
      const w = new Worker(worker, { type: "module" });
      w.postMessage({ kind: "options", options } satisfies ToWorker);
      w.onmessage = (ev: MessageEvent<FromWorker>) => this.#answer(i, ev.data);
      w.onerror = (ev) => {
        ev.preventDefault();
        this.#fail(new Error(`plan worker failed: ${ev.message}`));
      };
      this.#workers.push(w);
      this.#busy.push(0);
    }
  }

  #fail(e: Error) {
    this.#failure ??= e;
    this.#wake?.();
  }

  #answer(worker: number, m: FromWorker) {
    this.#busy[worker]--;
    if (m.kind === "crash") return this.#fail(new Error(m.message));
    const w = this.#waiting.get(m.seq)!;
    w.result = m.result;
    w.done = true;
    this.#flush();
  }

  /** Hand finished outcomes to `finish` in order (one at a time: writes stay ordered). */
  #flush() {
    this.#chain = this.#chain.then(async () => {
      for (;;) {
        const w = this.#waiting.get(this.#nextOut);
        if (!w?.done) break;
        this.#waiting.delete(this.#nextOut++);
        await this.finish(w.item, w.result);
      }
    }).catch((e) => this.#fail(e)).finally(() => this.#wake?.());
  }

  async #room() {
    while (!this.#failure && this.#waiting.size >= this.#workers.length * 4) {
      await new Promise<void>((r) => (this.#wake = r));
    }
    if (this.#failure) throw this.#failure;
  }

  /** Plan a site on the least busy worker. */
  async submit(item: Item) {
    await this.#room();
    const seq = this.#nextSeq++;
    this.#waiting.set(seq, { item, done: false });
    let best = 0;
    for (let i = 1; i < this.#busy.length; i++) if (this.#busy[i] < this.#busy[best]) best = i;
    this.#busy[best]++;
    this.#workers[best].postMessage({ kind: "site", seq, site: item.site! } satisfies ToWorker);
  }

  /** Queue an entry that needs no planning (a site that could not be read). */
  async submitDone(item: Item) {
    await this.#room();
    this.#waiting.set(this.#nextSeq++, { item, done: true });
    this.#flush();
  }

  /** Wait until every submitted entry was finished. */
  async drain() {
    while (!this.#failure && (this.#waiting.size > 0)) {
      await new Promise<void>((r) => (this.#wake = r));
    }
    await this.#chain;
    if (this.#failure) throw this.#failure;
  }

  close() {
    for (const w of this.#workers) w.terminate();
  }
}

/** The command line, checked: what one run of the script does. */
interface RunOptions {
  readonly format: Format;
  readonly positionals: readonly string[];
  readonly draws: number;
  readonly seed: number;
  readonly jobs: number;
  readonly registryHash: string | undefined;
  readonly readings: string | undefined;
  readonly out: string | undefined;
  readonly quiet: boolean;
  /** --monte-carlo (true), --no-monte-carlo (false), or neither (undefined). */
  readonly monteCarlo: boolean | undefined;
}

/** Read and check the options (in the order the messages have always come). */
function parseOptions(args: string[]): RunOptions {
  const { values, positionals } = parseCli(args, {
    format: { type: "string" },
    out: { type: "string" },
    "monte-carlo": { type: "boolean" },
    "no-monte-carlo": { type: "boolean" },
    draws: { type: "string" },
    seed: { type: "string" },
    "registry-hash": { type: "string" },
    readings: { type: "string" },
    quiet: { type: "boolean" },
    jobs: { type: "string" },
  }, HELP);
  const format = (values.json ? "json" : (values.format as string | undefined) ?? "text") as Format;
  if (!FORMATS.includes(format)) {
    throw new InputError("--format", JSON.stringify(values.format), FORMATS.join(", "));
  }
  if (positionals.length === 0) {
    throw new InputError(
      "arguments",
      "no site file",
      "one or more site files, folders or CSV files",
    );
  }
  const intOpt = (name: string, dflt: number, min: number, max: number) => {
    const v = values[name];
    if (v === undefined) return dflt;
    const n = Number(v);
    if (!Number.isInteger(n) || n < min || n > max) {
      throw new InputError(`--${name}`, JSON.stringify(v), `an integer from ${min} to ${max}`);
    }
    return n;
  };
  return {
    format,
    positionals,
    draws: intOpt("draws", 100_000, 1000, 10_000_000),
    seed: intOpt("seed", 1, 0, 2 ** 31 - 1),
    jobs: intOpt("jobs", Math.max(1, navigator.hardwareConcurrency || 1), 1, 256),
    registryHash: values["registry-hash"] as string | undefined,
    readings: values.readings as string | undefined,
    out: values.out as string | undefined,
    quiet: Boolean(values.quiet),
    monteCarlo: values["no-monte-carlo"] ? false : values["monte-carlo"] ? true : undefined,
  };
}

/** The site files, folders and CSV files named on the command line, folders expanded. */
async function collectSources(positionals: readonly string[]): Promise<Source[]> {
  const sources: Source[] = [];
  for (const p of positionals) {
    let info: Deno.FileInfo;
    try {
      info = await Deno.stat(p);
    } catch (e) {
      // A denied read is not a missing file: let the edge name the permission and the fix.
      if (e instanceof Deno.errors.NotCapable || e instanceof Deno.errors.PermissionDenied) throw e;
      throw new InputError("site file", JSON.stringify(p), "an existing file or folder");
    }
    if (info.isDirectory) {
      for (const f of await siteFiles(p)) sources.push({ kind: "file", path: f });
    } else if (/\.csv$/i.test(p)) sources.push({ kind: "csv", path: p });
    else sources.push({ kind: "file", path: p });
  }
  if (sources.length === 0) {
    throw new InputError(
      "site files",
      positionals.join(" "),
      "a folder holding .yaml, .yml or .json site files",
    );
  }
  return sources;
}

/** Reconciliation mode: one site and the readings taken on it. */
async function reconcileRun(
  sources: readonly Source[],
  opts: RunOptions,
  reg: Registry,
): Promise<number> {
  if (sources.length !== 1 || sources[0].kind !== "file") {
    throw new InputError("--readings", "with several sites", "exactly one site file");
  }
  const site = await readSiteFile(sources[0].path);
  const readings = await readReadings(opts.readings!);
  const { reconcile } = await import("../lib/site/reconcile.ts");
  const r = reconcile(site, readings, { registry: reg });
  const { RECONCILE_FORMATS, reconcileReport } = await import(
    "../lib/report/reconcile_report.ts"
  );
  const format = opts.format;
  if (!(RECONCILE_FORMATS as readonly string[]).includes(format)) {
    throw new InputError("--format", format, `with --readings: ${RECONCILE_FORMATS.join(", ")}`);
  }
  const text = reconcileReport(r, format as typeof RECONCILE_FORMATS[number]);
  if (opts.out) await writeAtomic(opts.out, text);
  else await writeStdout(text);
  return 0;
}

/** One summary entry: a planned site's row and report link, or a refusal. */
type SummaryEntry = { row: (string | number)[]; href: string } | {
  id: string;
  name: string;
  error: string;
};

/**
 * The outcomes of a run, in input order: the summary, the refusals and the worst exit code, the
 * report of each site written as it comes, and the progress lines.
 */
class Outcomes {
  readonly summary: SummaryEntry[] = [];
  refused = 0;
  worstCode = 0;
  count = 0;
  readonly started = performance.now();
  #lastProgress = this.started;
  readonly #usedNames = new Set<string>();

  constructor(
    readonly format: Format,
    readonly out: string | undefined,
    readonly outIsDir: boolean,
    readonly quiet: boolean,
    readonly single: boolean,
  ) {}

  /** A progress line on standard error, at most once a second (never for one site). */
  progress(total: number | undefined) {
    const now = performance.now();
    if (this.quiet || this.single || now - this.#lastProgress < 1000) return;
    this.#lastProgress = now;
    console.error(
      `planned ${this.count}${total ? `/${total}` : ""} sites (${this.refused} refused)`,
    );
  }

  /** Report one site's outcome; called in input order whatever thread planned it. */
  async finish(item: Item, result: JobResult | undefined) {
    this.count++;
    const { site, label, error } = item;
    if (error || !site || !result) {
      this.refused++;
      this.worstCode = Math.max(this.worstCode, error?.exitCode ?? 2);
      const msg = error?.message ?? "refused";
      console.error(
        error instanceof RowError || msg.startsWith(label)
          ? `error: ${msg}`
          : `error: ${label}: ${msg}`,
      );
      this.summary.push({ id: label, name: label, error: error?.message ?? "refused" });
      return;
    }
    if (!result.ok) {
      this.refused++;
      this.worstCode = Math.max(this.worstCode, result.exitCode);
      console.error(
        `error: ${site.source.file}${
          site.source.row ? ` row ${site.source.row}` : ""
        }: ${result.message}`,
      );
      this.summary.push({ id: site.id ?? label, name: site.name, error: result.message });
      return;
    }
    let base = safeName(site.id ?? site.name);
    while (this.#usedNames.has(base)) base += "-x";
    this.#usedNames.add(base);
    const format = this.format;
    const href = `${base}.${format === "csv" ? "html" : EXT[format]}`;
    this.summary.push({ row: result.row, href });
    if (result.text === undefined) return;
    if (this.outIsDir) {
      const out = this.out!;
      await writeAtomic(format === "csv" ? `${out}/${base}.html` : `${out}/${href}`, result.text);
    } else await writeStdout(result.text);
  }
}

/** One site to standard output or one file: its report as it is (no trailing newline added). */
async function planSingle(
  src: Source,
  outcomes: Outcomes,
  jobOptions: JobOptions,
  reg: Registry,
  outIsFile: boolean,
): Promise<number> {
  let site: SiteInput;
  try {
    site = await readSiteFile(src.path);
  } catch (e) {
    if (!(e instanceof SnellpathError)) throw e;
    await outcomes.finish({ label: src.path, error: e }, undefined);
    return outcomes.worstCode;
  }
  let plan;
  try {
    plan = planSite(site, { registry: reg, monteCarlo: jobOptions.monteCarlo });
  } catch (e) {
    if (!(e instanceof SnellpathError)) throw e;
    await outcomes.finish({ label: src.path, site }, {
      ok: false,
      message: e.message,
      exitCode: e.exitCode,
    });
    return outcomes.worstCode;
  }
  outcomes.summary.push({ row: fleetRow(plan), href: "" });
  const text = render(plan, jobOptions.format);
  if (outIsFile) await writeAtomic(outcomes.out!, text);
  else await writeStdout(text);
  return outcomes.worstCode;
}

/** Plan every source in input order, on `jobs` workers (1: this thread). */
async function planAll(
  sources: readonly Source[],
  outcomes: Outcomes,
  jobOptions: JobOptions,
  jobs: number,
): Promise<void> {
  const finish = (item: Item, result: JobResult | undefined) => outcomes.finish(item, result);
  const pool = jobs > 1 ? new WorkerPool(jobs, jobOptions, finish) : undefined;
  const submit = async (item: Item) => {
    if (pool && item.site && !item.error) await pool.submit(item);
    else if (pool) await pool.submitDone(item);
    else await finish(item, item.site && !item.error ? planJob(item.site, jobOptions) : undefined);
  };
  try {
    for (const src of sources) {
      if (src.kind === "csv") {
        const text = await readSitesCsvText(src.path);
        for await (const r of streamSitesCsv(text, { file: src.path })) {
          if ("site" in r) {
            await submit({ site: r.site, label: `${src.path} row ${r.site.source.row}` });
          } else {
            await submit({
              label: `${src.path} row ${r.error.row}`,
              error: new RowError(r.error.message),
            });
          }
          outcomes.progress(undefined);
        }
      } else {
        try {
          const site = await readSiteFile(src.path);
          await submit({ site, label: src.path });
        } catch (e) {
          if (!(e instanceof SnellpathError)) throw e;
          await submit({ label: src.path, error: e });
        }
        outcomes.progress(sources.length);
      }
    }
    await pool?.drain();
  } finally {
    pool?.close();
  }
}

/** After a fleet: summary.csv and index.html in the folder, or the fleet CSV on standard output. */
async function writeFleetSummary(outcomes: Outcomes): Promise<void> {
  const { summary, format, out, outIsDir, quiet, count, refused } = outcomes;
  const rows = summary.map((s) => ("row" in s ? s.row : s));
  if (outIsDir) {
    await writeAtomic(`${out}/summary.csv`, fleetCsv(rows));
    if (format === "html" || format === "csv") {
      await writeAtomic(`${out}/index.html`, fleetHtml(summary, "Site plans"));
    }
    if (!quiet) {
      const secs = (performance.now() - outcomes.started) / 1000;
      console.error(
        `planned ${count - refused} of ${count} sites in ${secs.toFixed(2)} s; reports in ${out}/` +
          (format === "html" || format === "csv" ? " (open index.html)" : ""),
      );
    }
  } else if (format === "csv") {
    await writeStdout(fleetCsv(rows));
  }
}

async function main(): Promise<number> {
  const opts = parseOptions(Deno.args);
  const reg = defaultRegistry();
  const pin = opts.registryHash;
  if (pin !== undefined && pin !== reg.hash) {
    throw new InputError("--registry-hash", pin, `the loaded reference data's hash ${reg.hash}`);
  }
  const sources = await collectSources(opts.positionals);
  if (opts.readings !== undefined) return await reconcileRun(sources, opts, reg);

  const { format, out } = opts;
  const single = sources.length === 1 && sources[0].kind === "file";
  const mcOn = opts.monteCarlo ?? single;
  const outIsFile = out !== undefined && single && format !== "html" && /\.[a-z]+$/i.test(out);
  const outIsDir = out !== undefined && !outIsFile;
  const outcomes = new Outcomes(format, out, outIsDir, opts.quiet, single);
  const jobOptions: JobOptions = {
    monteCarlo: mcOn ? { draws: opts.draws, seed: opts.seed } : false,
    format,
    outIsDir,
  };
  if (single && !outIsDir) {
    return await planSingle(sources[0], outcomes, jobOptions, reg, outIsFile);
  }
  await planAll(sources, outcomes, jobOptions, opts.jobs);
  await writeFleetSummary(outcomes);
  return outcomes.worstCode;
}

async function writeStdout(text: string): Promise<void> {
  const data = new TextEncoder().encode(text);
  let off = 0;
  while (off < data.length) off += await Deno.stdout.write(data.subarray(off));
}

if (import.meta.main) await runMain(main);
