/**
 * Plan stage 10, the trace: the plan assumptions as trace entries, and the collection of every
 * stage's warnings and trace in stage order into the plan's lists.
 *
 * @module
 */
import type { Warning } from "../../errors.ts";
import { trace as traceEntry, type TraceEntry } from "../../trace.ts";
import { ASSUMPTION_TEXT, PLAN_ASSUMPTIONS } from "./assumptions.ts";

/** What every stage returns beside its results. */
export interface StageNotes {
  /** Warnings of the stage. */
  readonly warnings: readonly Warning[];
  /** Trace entries of the stage. */
  readonly trace: readonly TraceEntry[];
}

/**
 * Every plan assumption (../stages/assumptions.ts) as a trace entry, basis common practice.
 *
 * @returns one entry per assumption, in the order of PLAN_ASSUMPTIONS
 * @example
 * ```ts
 * import { assumptionTrace } from "./trace.ts";
 * import { PLAN_ASSUMPTIONS } from "./assumptions.ts";
 * const t = assumptionTrace();
 * if (t.length !== Object.keys(PLAN_ASSUMPTIONS).length) throw new Error();
 * if (!t.every((e) => e.basis === "common-practice")) throw new Error();
 * ```
 */
export function assumptionTrace(): TraceEntry[] {
  return Object.entries(PLAN_ASSUMPTIONS).map(([k, v]) => {
    const [text, unit] = ASSUMPTION_TEXT[k as keyof typeof PLAN_ASSUMPTIONS];
    return traceEntry(`plan assumption: ${text}`, v, unit, "common-practice", "common-practice");
  });
}

/** The running lists of {@link planNotes}. */
export interface PlanNotes {
  /** Warnings so far, in stage order. */
  readonly warnings: Warning[];
  /** Append a stage's notes; `dedupe` drops warnings whose message is already listed. */
  add<S extends StageNotes>(stage: S, dedupe?: boolean): S;
  /** The trace so far with repeats (same quantity, value and source) dropped, first kept. */
  trace(): TraceEntry[];
}

/**
 * Collect the stages' warnings and trace in stage order, starting from the site file's default
 * warnings.
 *
 * @param defaults the reader's notes on defaults assumed
 * @returns the collector
 * @example
 * ```ts
 * import { planNotes } from "./trace.ts";
 * const notes = planNotes([]);
 * const w = { code: "x", message: "same" };
 * const e = { quantity: "q", value: 1, unit: "", source: "s", basis: "recalled" } as const;
 * notes.add({ warnings: [w], trace: [e] });
 * notes.add({ warnings: [w], trace: [e] }, true);
 * if (notes.warnings.length !== 1 || notes.trace().length !== 1) throw new Error();
 * ```
 */
export function planNotes(defaults: readonly { readonly message: string }[]): PlanNotes {
  const warnings: Warning[] = defaults.map((d) => ({ code: "default", message: d.message }));
  const tr: TraceEntry[] = [];
  return {
    warnings,
    add(stage, dedupe = false) {
      for (const w of stage.warnings) {
        if (!dedupe || !warnings.some((x) => x.message === w.message)) warnings.push(w);
      }
      for (const e of stage.trace) tr.push(e);
      return stage;
    },
    trace: () => dedupeTrace(tr),
  };
}

function dedupeTrace(tr: readonly TraceEntry[]): TraceEntry[] {
  const seen = new Set<string>();
  const out: TraceEntry[] = [];
  for (const t of tr) {
    const k = `${t.quantity}|${t.value}|${t.source}`;
    if (seen.has(k)) continue;
    seen.add(k);
    out.push(t);
  }
  return out;
}
