/**
 * One fleet site's work for scripts/plan.ts: plan it, render its report, take its summary row.
 * `planJob` is a pure function of the site and the options; scripts/plan.ts calls it directly
 * with `--jobs 1` and through Web Workers running this module otherwise, so that both give the
 * same bytes. Files are written by the main thread, in input order.
 *
 * @module
 */
import { SnellpathError } from "../lib/errors.ts";
import { defaultRegistry } from "../lib/registry/mod.ts";
import type { SiteInput } from "../lib/site/schema.ts";
import { planSite, type SitePlan } from "../lib/site/plan.ts";
import {
  fleetCsv,
  fleetRow,
  planHtml,
  planJson,
  planMarkdown,
  planText,
} from "../lib/report/plan_report.ts";
import { formatCard } from "../lib/report/card.ts";

/** Report formats of scripts/plan.ts. */
export const FORMATS = ["text", "json", "md", "html", "csv", "card"] as const;
/** One report format. */
export type Format = typeof FORMATS[number];

/** What every job of a run shares. */
export interface JobOptions {
  /** Monte Carlo draws and seed, or false for none. */
  readonly monteCarlo: { draws: number; seed: number } | false;
  /** Report format. */
  readonly format: Format;
  /** Reports go to a folder (one file per site) rather than standard output. */
  readonly outIsDir: boolean;
}

/** A planned site: its summary row and the text to write (file or standard output), if any. */
export type JobResult =
  | { readonly ok: true; readonly row: (string | number)[]; readonly text?: string }
  | { readonly ok: false; readonly message: string; readonly exitCode: number };

/**
 * Render a plan in a report format.
 *
 * @param plan the plan
 * @param format the format
 * @returns the report text
 */
export function render(plan: SitePlan, format: Format): string {
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

/**
 * Plan one site of a fleet and render what the run writes for it.
 *
 * @param site the site, as read
 * @param options the run's options
 * @returns the row and text, or the refusal (message and exit code)
 */
export function planJob(site: SiteInput, options: JobOptions): JobResult {
  let plan: SitePlan;
  try {
    plan = planSite(site, { registry: defaultRegistry(), monteCarlo: options.monteCarlo });
  } catch (e) {
    if (!(e instanceof SnellpathError)) throw e;
    return { ok: false, message: e.message, exitCode: e.exitCode };
  }
  const row = fleetRow(plan);
  const { format } = options;
  let text: string | undefined;
  if (options.outIsDir) text = format === "csv" ? planHtml(plan) : render(plan, format);
  else if (format === "json") text = JSON.stringify(plan) + "\n";
  else if (format !== "csv") text = render(plan, format) + "\n";
  return { ok: true, row, text };
}

/** A message to a worker: the options once, then sites by sequence number. */
export type ToWorker =
  | { readonly kind: "options"; readonly options: JobOptions }
  | { readonly kind: "site"; readonly seq: number; readonly site: SiteInput };

/** A worker's answer: a result by sequence number, or an unexpected failure. */
export type FromWorker =
  | { readonly kind: "result"; readonly seq: number; readonly result: JobResult }
  | { readonly kind: "crash"; readonly seq: number; readonly message: string };

/**
 * Handle one message from the main thread (the worker entry, scripts/_plan_worker.ts, hands
 * every message here in order): options first, then sites.
 *
 * @param m the message
 * @param reply where answers go
 */
export function handleMessage(m: ToWorker, reply: (a: FromWorker) => void): void {
  if (m.kind === "options") {
    workerOptions = m.options;
    return;
  }
  let answer: FromWorker;
  try {
    answer = { kind: "result", seq: m.seq, result: planJob(m.site, workerOptions!) };
  } catch (e) {
    const message = e instanceof Error ? (e.stack ?? e.message) : String(e);
    answer = { kind: "crash", seq: m.seq, message };
  }
  reply(answer);
}

let workerOptions: JobOptions | undefined;
