/**
 * Plan one site or a fleet: site files (YAML or JSON), folders of them, or a CSV of sites in;
 * a traced plan out as text, JSON, Markdown, HTML with drawings, or a fleet CSV.
 *
 * @module
 */
import { InputError, SnellpathError } from "../lib/errors.ts";
import { defaultRegistry } from "../lib/registry/mod.ts";
import { readSiteFile, readSitesCsvText, siteFiles, streamSitesCsv } from "../lib/site/read.ts";
import type { SiteInput } from "../lib/site/schema.ts";
import { planSite, type SitePlan } from "../lib/site/plan.ts";
import { type FieldReadings, reconcile } from "../lib/site/reconcile.ts";
import {
  fleetCsv,
  fleetHtml,
  fleetRow,
  planHtml,
  planJson,
  planMarkdown,
  planText,
} from "../lib/report/plan_report.ts";
import { formatCard } from "../lib/report/card.ts";
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

const FORMATS = ["text", "json", "md", "html", "csv", "card"] as const;
type Format = typeof FORMATS[number];
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

async function main(): Promise<number> {
  const { values, positionals } = parseCli(Deno.args, {
    format: { type: "string" },
    out: { type: "string" },
    "monte-carlo": { type: "boolean" },
    "no-monte-carlo": { type: "boolean" },
    draws: { type: "string" },
    seed: { type: "string" },
    "registry-hash": { type: "string" },
    readings: { type: "string" },
    quiet: { type: "boolean" },
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
  const draws = intOpt("draws", 100_000, 1000, 10_000_000);
  const seed = intOpt("seed", 1, 0, 2 ** 31 - 1);
  const reg = defaultRegistry();
  const pin = values["registry-hash"] as string | undefined;
  if (pin !== undefined && pin !== reg.hash) {
    throw new InputError("--registry-hash", pin, `the loaded reference data's hash ${reg.hash}`);
  }

  // collect the sources
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

  // reconciliation mode
  if (values.readings !== undefined) {
    if (sources.length !== 1 || sources[0].kind !== "file") {
      throw new InputError("--readings", "with several sites", "exactly one site file");
    }
    const site = await readSiteFile(sources[0].path);
    const readings = await readReadings(values.readings as string);
    const r = reconcile(site, readings, { registry: reg });
    const { RECONCILE_FORMATS, reconcileReport } = await import(
      "../lib/report/reconcile_report.ts"
    );
    if (!(RECONCILE_FORMATS as readonly string[]).includes(format)) {
      throw new InputError("--format", format, `with --readings: ${RECONCILE_FORMATS.join(", ")}`);
    }
    const text = reconcileReport(r, format as typeof RECONCILE_FORMATS[number]);
    if (values.out) await writeAtomic(values.out as string, text);
    else await writeStdout(text);
    return 0;
  }

  const single = sources.length === 1 && sources[0].kind === "file";
  const mcOn = values["no-monte-carlo"] ? false : values["monte-carlo"] ? true : single;
  const out = values.out as string | undefined;
  const outIsFile = out !== undefined && single && format !== "html" && /\.[a-z]+$/i.test(out);
  const outIsDir = out !== undefined && !outIsFile;
  const quiet = Boolean(values.quiet);

  const summary:
    ({ row: (string | number)[]; href: string } | { id: string; name: string; error: string })[] =
      [];
  let refused = 0;
  let worstCode = 0;
  let count = 0;
  const started = performance.now();
  let lastProgress = started;
  const usedNames = new Set<string>();
  const progress = (total: number | undefined) => {
    const now = performance.now();
    if (quiet || single || now - lastProgress < 1000) return;
    lastProgress = now;
    console.error(`planned ${count}${total ? `/${total}` : ""} sites (${refused} refused)`);
  };

  async function handle(site: SiteInput | undefined, label: string, error?: SnellpathError) {
    count++;
    if (error || !site) {
      refused++;
      worstCode = Math.max(worstCode, error?.exitCode ?? 2);
      const msg = error?.message ?? "refused";
      console.error(
        error instanceof RowError || msg.startsWith(label)
          ? `error: ${msg}`
          : `error: ${label}: ${msg}`,
      );
      summary.push({ id: label, name: label, error: error?.message ?? "refused" });
      return;
    }
    let plan: SitePlan;
    try {
      plan = planSite(site, { registry: reg, monteCarlo: mcOn ? { draws, seed } : false });
    } catch (e) {
      if (!(e instanceof SnellpathError)) throw e;
      refused++;
      worstCode = Math.max(worstCode, e.exitCode);
      console.error(
        `error: ${site.source.file}${
          site.source.row ? ` row ${site.source.row}` : ""
        }: ${e.message}`,
      );
      summary.push({ id: site.id ?? label, name: site.name, error: e.message });
      return;
    }
    let base = safeName(site.id ?? site.name);
    while (usedNames.has(base)) base += "-x";
    usedNames.add(base);
    const href = `${base}.${format === "csv" ? "html" : EXT[format]}`;
    summary.push({ row: fleetRow(plan), href });
    if (single && !outIsDir) {
      const text = render(plan, format);
      if (outIsFile) await writeAtomic(out!, text);
      else await writeStdout(text);
      return;
    }
    if (outIsDir) {
      if (format === "csv") await writeAtomic(`${out}/${base}.html`, planHtml(plan));
      else await writeAtomic(`${out}/${href}`, render(plan, format));
    } else if (format === "json") {
      await writeStdout(JSON.stringify(plan) + "\n");
    } else if (format !== "csv") {
      await writeStdout(render(plan, format) + "\n");
    }
  }

  for (const src of sources) {
    if (src.kind === "csv") {
      const text = await readSitesCsvText(src.path);
      for await (const r of streamSitesCsv(text, { file: src.path })) {
        if ("site" in r) await handle(r.site, `${src.path} row ${r.site.source.row}`);
        else {
          await handle(undefined, `${src.path} row ${r.error.row}`, new RowError(r.error.message));
        }
        progress(undefined);
      }
    } else {
      try {
        const site = await readSiteFile(src.path);
        await handle(site, src.path);
      } catch (e) {
        if (!(e instanceof SnellpathError)) throw e;
        await handle(undefined, src.path, e);
      }
      progress(sources.length);
    }
  }

  if (!single || outIsDir) {
    const rows = summary.map((s) => ("row" in s ? s.row : s));
    if (outIsDir) {
      await writeAtomic(`${out}/summary.csv`, fleetCsv(rows));
      if (format === "html" || format === "csv") {
        await writeAtomic(`${out}/index.html`, fleetHtml(summary, "Site plans"));
      }
      if (!quiet) {
        const secs = (performance.now() - started) / 1000;
        console.error(
          `planned ${count - refused} of ${count} sites in ${
            secs.toFixed(2)
          } s; reports in ${out}/` +
            (format === "html" || format === "csv" ? " (open index.html)" : ""),
        );
      }
    } else if (format === "csv") {
      await writeStdout(fleetCsv(rows));
    }
  }
  return worstCode;
}

function render(plan: SitePlan, format: Format): string {
  switch (format) {
    case "json":
      return planJson(plan);
    case "md":
      return planMarkdown(plan);
    case "html":
      return planHtml(plan);
    case "csv":
      return fleetCsv([fleetRow(plan)]);
    case "card":
      return formatCard(plan, { format: "html" });
    default:
      return planText(plan);
  }
}

async function writeStdout(text: string): Promise<void> {
  const data = new TextEncoder().encode(text);
  let off = 0;
  while (off < data.length) off += await Deno.stdout.write(data.subarray(off));
}

if (import.meta.main) await runMain(main);
