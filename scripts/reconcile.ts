/**
 * Reconcile readings taken on site with the plan of that site: name the causes that fit, with
 * the size of each, and write the result as text, Markdown, HTML or JSON.
 *
 * @module
 */
import { InputError } from "../lib/errors.ts";
import { readSiteFile } from "../lib/site/read.ts";
import { reconcile } from "../lib/site/reconcile.ts";
import { readReadingsText } from "../lib/site/reconcile_read.ts";
import {
  RECONCILE_FORMATS,
  type ReconcileFormat,
  reconcileReport,
} from "../lib/report/reconcile_report.ts";
import { parseCli, runMain } from "./_cli.ts";

const HELP = `
reconcile — compare readings taken on site with the plan and name the causes that fit

usage:
  reconcile SITE.yaml READINGS.yaml [--format text|md|html|json] [--out FILE]

options:
  --format F    text (default), md, html, json
  --out FILE    write the report there (atomically) instead of standard output
  --json        same as --format json
  --debug       print the stack trace of an error
  -h, --help    this text

The readings file (every field, units, an invented example): docs/readings.md. Read a second
mounting (Z and V, or V and W) on the same pipe to tell a fixed-delay error from a sound-speed
error.

exit codes: 0 ok, 2 bad input, 1 no physical answer.

example (invented site and readings):
  deno task reconcile -- data/demo/02-pump-station-bends.yaml data/demo/readings/twv-02-readings.yaml
`;

function writeAtomic(path: string, text: string): void {
  const slash = path.lastIndexOf("/");
  const dir = slash >= 0 ? path.slice(0, slash) || "/" : ".";
  Deno.mkdirSync(dir, { recursive: true });
  const tmp = `${dir}/.${path.slice(slash + 1)}.${crypto.randomUUID().slice(0, 8)}.tmp`;
  Deno.writeTextFileSync(tmp, text);
  Deno.renameSync(tmp, path);
}

async function main(): Promise<number> {
  const { values, positionals } = parseCli(Deno.args, {
    format: { type: "string" },
    out: { type: "string" },
  }, HELP);
  const format = values.json ? "json" : (values.format as string | undefined) ?? "text";
  if (!(RECONCILE_FORMATS as readonly string[]).includes(format)) {
    throw new InputError("--format", JSON.stringify(format), RECONCILE_FORMATS.join(", "));
  }
  if (positionals.length !== 2) {
    throw new InputError(
      "arguments",
      positionals.length ? positionals.join(" ") : "nothing",
      "a site file and a readings file",
    );
  }
  const [sitePath, readingsPath] = positionals;
  const site = await readSiteFile(sitePath);
  let text: string;
  try {
    text = await Deno.readTextFile(readingsPath);
  } catch (e) {
    if (e instanceof Deno.errors.NotFound) {
      throw new InputError("readings file", JSON.stringify(readingsPath), "an existing file");
    }
    throw e;
  }
  const readings = await readReadingsText(text, readingsPath);
  const report = reconcileReport(reconcile(site, readings), format as ReconcileFormat);
  if (values.out) writeAtomic(values.out as string, report);
  else await Deno.stdout.write(new TextEncoder().encode(report));
  return 0;
}

if (import.meta.main) runMain(main);
