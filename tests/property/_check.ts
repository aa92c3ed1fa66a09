/**
 * Shared helpers of the property-based tests: run a call, accept a result only when every
 * number in it is finite, accept an error only when it is one of snellpath's named errors.
 *
 * @module
 */
import { SnellpathError } from "../../lib/errors.ts";

/** Seed and run count every property uses unless it says otherwise (reproducible). */
export const RUNS = { seed: 42, numRuns: 10_000 } as const;

/** Outcome of one generated case. */
export type Outcome<T> =
  | { readonly ok: true; readonly value: T }
  | { readonly ok: false; readonly error: SnellpathError };

/**
 * Path of the first non-finite number (NaN, ±Infinity) inside a value, walking objects, arrays
 * and typed arrays; undefined when every number is finite.
 *
 * @param v the value to walk
 * @param path path so far, for the message
 * @param seen objects already walked (cycles)
 * @returns the path of the first non-finite number, or undefined
 */
export function nonFinitePath(
  v: unknown,
  path = "$",
  seen: Set<unknown> = new Set(),
): string | undefined {
  if (typeof v === "number") return Number.isFinite(v) ? undefined : `${path} = ${v}`;
  if (typeof v === "bigint" || v === null || typeof v !== "object") return undefined;
  if (seen.has(v)) return undefined;
  seen.add(v);
  if (ArrayBuffer.isView(v)) {
    const a = v as unknown as ArrayLike<number>;
    for (let i = 0; i < a.length; i++) {
      if (typeof a[i] === "number" && !Number.isFinite(a[i])) return `${path}[${i}] = ${a[i]}`;
    }
    return undefined;
  }
  if (v instanceof Map) {
    for (const [k, x] of v) {
      const p = nonFinitePath(x, `${path}.get(${String(k)})`, seen);
      if (p) return p;
    }
    return undefined;
  }
  for (const [k, x] of Object.entries(v)) {
    const p = nonFinitePath(x, Array.isArray(v) ? `${path}[${k}]` : `${path}.${k}`, seen);
    if (p) return p;
  }
  return undefined;
}

/**
 * Run a call: a result must hold only finite numbers, an error must be a SnellpathError
 * (InputError, OutOfRangeError, NoPhysicalAnswerError, RegistryError and their kin). Anything
 * else (TypeError, RangeError, a plain Error, a non-finite number) throws an Error that names
 * the case, which fast-check then shrinks and reports with its seed.
 *
 * @param what label of the case, for messages
 * @param f the call
 * @returns the outcome
 */
export function outcome<T>(what: string, f: () => T): Outcome<T> {
  let value: T;
  try {
    value = f();
  } catch (e) {
    if (e instanceof SnellpathError) {
      if (typeof e.message !== "string" || e.message.trim().length === 0) {
        throw new Error(`${what}: named error ${e.name} without a message`);
      }
      return { ok: false, error: e };
    }
    const name = e instanceof Error ? e.name : typeof e;
    throw new Error(`${what}: threw ${name} (not a named error): ${String(e)}`);
  }
  const bad = nonFinitePath(value);
  if (bad) throw new Error(`${what}: result holds a non-finite number at ${bad}`);
  return { ok: true, value };
}

/** Tally of outcomes by error class (for the figures in docs/robustness.md). */
export class Tally {
  /** Results accepted. */
  ok = 0;
  /** Refusals by error class name. */
  readonly refused: Record<string, number> = {};
  /**
   * Count one outcome.
   *
   * @param o the outcome
   * @returns the same outcome
   */
  add<T>(o: Outcome<T>): Outcome<T> {
    if (o.ok) this.ok++;
    else this.refused[o.error.name] = (this.refused[o.error.name] ?? 0) + 1;
    return o;
  }
  /** Total refusals. */
  get refusals(): number {
    return Object.values(this.refused).reduce((a, b) => a + b, 0);
  }
  /**
   * One line for the log.
   *
   * @param label family label
   * @returns the line
   */
  line(label: string): string {
    const parts = Object.entries(this.refused).sort().map(([k, n]) => `${k} ${n}`);
    return `${label}: ${this.ok + this.refusals} cases, ${this.ok} results, refused: ${
      parts.join(", ") || "none"
    }`;
  }
}

/**
 * Double generator bounds helper: a log-uniform positive number in [lo, hi] from a unit draw.
 *
 * @param u a number in [0, 1]
 * @param lo lower bound (> 0)
 * @param hi upper bound
 * @returns lo·(hi/lo)^u
 */
export function logUniform(u: number, lo: number, hi: number): number {
  return lo * Math.pow(hi / lo, u);
}
