/**
 * Field readers for the site reader: strict mappings with nearest-key suggestions, quantities
 * through lib/units.ts with plausibility limits, identifiers, texts, traverse lists, NPS and
 * schedule designations. Every refusal is a one-line {@link SiteInputError} naming the field.
 *
 * @module
 */
import { InputError } from "../errors.ts";
import { ACCEPTED, type Dimension, parseQuantityFull, toUnit } from "../units.ts";
import { editDistance } from "../registry/nearest.ts";
import { MAX_TRAVERSES, SITE_KEYS } from "./schema.ts";

/**
 * Bad site input: an {@link InputError} whose message starts with the file (and CSV row) when
 * known, then the field path, what was given and what is accepted. Exit code 2.
 *
 * @example
 * ```ts
 * import { SiteInputError } from "./read_fields.ts";
 * const e = new SiteInputError("fluid.temperature", '"12 m"', "a temperature", "a.yaml");
 * if (!e.message.startsWith("a.yaml: fluid.temperature: got")) throw new Error(e.message);
 * ```
 */
export class SiteInputError extends InputError {
  /** The file, when known. */
  readonly file: string | undefined;
  /**
   * Make the error; the message is one line, prefixed with the file when known.
   *
   * @param field the key path, for example `fluid.temperature`
   * @param given what was given
   * @param accepted what is accepted
   * @param file the file (and row) the site came from, when known
   */
  constructor(field: string, given: string, accepted: string, file?: string) {
    super(field, oneLine(given), oneLine(accepted, 320));
    this.name = "SiteInputError";
    this.file = file;
    if (file) this.message = `${oneLine(file)}: ${this.message}`;
  }
}

/** Error context: the file label put in front of messages. */
export interface Ctx {
  /** File name (and row), or undefined. */
  readonly file: string | undefined;
}

/**
 * Throw a {@link SiteInputError}.
 *
 * @param ctx error context
 * @param field the key path
 * @param given what was given
 * @param accepted what is accepted
 * @returns never
 */
export function fail(ctx: Ctx, field: string, given: string, accepted: string): never {
  throw new SiteInputError(field, given, accepted, ctx.file);
}

/** Collapse whitespace and cap the length, so every message stays one short line. */
export function oneLine(s: string, max = 160): string {
  // deno-lint-ignore no-control-regex
  const t = s.replace(/[\u0000-\u001f\u007f\u2028\u2029]+/g, " ").replace(/\s+/g, " ").trim();
  return t.length > max ? t.slice(0, max - 1) + "…" : t;
}

/**
 * Describe a raw value for a message: strings quoted, bare numbers named as such.
 *
 * @param v the raw value
 * @returns a short description
 */
export function describe(v: unknown): string {
  if (v === undefined) return "nothing";
  if (v === null) return "an empty value";
  if (typeof v === "string") return JSON.stringify(v.length > 60 ? v.slice(0, 59) + "…" : v);
  if (typeof v === "number") return `bare number ${String(v)}`;
  if (typeof v === "boolean") return `${v}`;
  if (Array.isArray(v)) return "a list";
  if (typeof v === "object") return "a mapping";
  return typeof v;
}

function join(path: string, key: string): string {
  return path ? `${path}.${key}` : key;
}

function squash(s: string): string {
  return s.toLowerCase().replace(/[_\s-]/g, "");
}

/**
 * The nearest valid key to a wrong one: the one valid key a shortened key begins (4 characters
 * or more), else the nearest by edit distance when it is near enough to be a likely typo.
 *
 * @param key the key given
 * @param valid the valid keys
 * @returns the suggestion, or undefined
 */
export function suggestKey(key: string, valid: readonly string[]): string | undefined {
  const k = squash(key);
  // a shortened key (`target` for `targetUncertainty`): the one valid key it begins
  const starts = k.length >= 4 ? valid.filter((v) => squash(v).startsWith(k)) : [];
  if (starts.length === 1) return starts[0];
  let best: string | undefined;
  let bestD = Infinity;
  for (const v of valid) {
    const d = editDistance(k, squash(v));
    if (d < bestD) {
      bestD = d;
      best = v;
    }
  }
  if (best === undefined) return undefined;
  const limit = Math.max(2, Math.floor(Math.min(k.length, best.length) / 3));
  return bestD <= limit ? best : undefined;
}

/**
 * Require a mapping at `path` and refuse keys not in {@link SITE_KEYS}, suggesting the nearest.
 *
 * @param ctx error context
 * @param v the raw value
 * @param path the object's key path (`""` for the top level)
 * @returns the mapping
 */
export function expectRecord(ctx: Ctx, v: unknown, path: string): Record<string, unknown> {
  if (v === null || typeof v !== "object" || Array.isArray(v)) {
    fail(ctx, path || "site", describe(v), "a mapping of keys to values");
  }
  const valid = SITE_KEYS[path] ?? [];
  for (const key of Object.keys(v)) {
    if (valid.includes(key)) continue;
    const hint = suggestKey(key, valid);
    fail(
      ctx,
      join(path, key),
      "an unknown key",
      hint
        ? `a key of ${path || "the site"}; did you mean "${hint}"?`
        : `one of the keys of ${path || "the site"}: ${valid.join(", ")}`,
    );
  }
  return v as Record<string, unknown>;
}

/** Plausibility limits of a quantity, in SI, with the unit used to print them. */
export interface Limit {
  /** Lower limit, SI. */
  readonly min: number;
  /** Upper limit, SI. */
  readonly max: number;
  /** Display unit of the fast table, for the message. */
  readonly unit: string;
  /** The lower limit itself is refused (default: allowed). */
  readonly minOpen?: boolean;
  /** The upper limit itself is refused (default: allowed). */
  readonly maxOpen?: boolean;
}

function range(limit: Limit): string {
  const lo = `${toUnit(limit.min, limit.unit, 6)} ${limit.unit}`.trim();
  const hi = `${toUnit(limit.max, limit.unit, 6)} ${limit.unit}`.trim();
  if (limit.minOpen && limit.maxOpen) return `between ${lo} and ${hi}, both excluded`;
  if (limit.minOpen) return `above ${lo}, up to ${hi}`;
  if (limit.maxOpen) return `from ${lo}, below ${hi}`;
  return `from ${lo} to ${hi}`;
}

/**
 * Check a value against plausibility limits.
 *
 * @param ctx error context
 * @param field key path
 * @param value SI value
 * @param raw what was written, for the message
 * @param limit the limits
 * @param what the quantity's name, for the message
 * @returns the value
 */
export function within(
  ctx: Ctx,
  field: string,
  value: number,
  raw: unknown,
  limit: Limit,
  what: string,
): number {
  const lowOk = limit.minOpen ? value > limit.min : value >= limit.min;
  const highOk = limit.maxOpen ? value < limit.max : value <= limit.max;
  if (!Number.isFinite(value) || !lowOk || !highOk) {
    fail(ctx, field, describe(raw), `${what} ${range(limit)}`);
  }
  return value;
}

/** Readers of the ratio fields refuse bare numbers: "2" could mean 2 % or 200 %. */
const RATIO_TEXT = /^\s*[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?\s*(?:%|percent|ppm)\s*$/;

/**
 * Read an optional quantity `obj[key]` written with a unit, check its plausibility.
 *
 * @param ctx error context
 * @param obj the enclosing mapping
 * @param key the key
 * @param path the enclosing key path
 * @param dimension the dimension the key fixes
 * @param limit plausibility limits
 * @param what the quantity's name, for messages
 * @returns the SI value, or undefined when the key is absent
 */
export async function quantity(
  ctx: Ctx,
  obj: Record<string, unknown>,
  key: string,
  path: string,
  dimension: Dimension,
  limit: Limit,
  what: string,
): Promise<number | undefined> {
  const raw = obj[key];
  if (raw === undefined) return undefined;
  const field = join(path, key);
  if (dimension === "ratio" && (typeof raw !== "string" || !RATIO_TEXT.test(raw))) {
    fail(ctx, field, describe(raw), `${what} with % or ppm, for example "2 %"`);
  }
  if (typeof raw !== "string") {
    fail(ctx, field, describe(raw), `the number with its unit: ${ACCEPTED[dimension]}`);
  }
  let value: number;
  try {
    value = await parseQuantityFull(raw, dimension, field);
  } catch (e) {
    if (e instanceof InputError) fail(ctx, field, describe(raw), e.accepted);
    throw e;
  }
  return within(ctx, field, value, raw, limit, what);
}

/**
 * Read a required quantity (see {@link quantity}).
 *
 * @param ctx error context
 * @param obj the enclosing mapping
 * @param key the key
 * @param path the enclosing key path
 * @param dimension the dimension the key fixes
 * @param limit plausibility limits
 * @param what the quantity's name, for messages
 * @returns the SI value
 */
export async function requiredQuantity(
  ctx: Ctx,
  obj: Record<string, unknown>,
  key: string,
  path: string,
  dimension: Dimension,
  limit: Limit,
  what: string,
): Promise<number> {
  const v = await quantity(ctx, obj, key, path, dimension, limit, what);
  if (v === undefined) {
    fail(ctx, join(path, key), "nothing", `${what} (this key is required)`);
  }
  return v;
}

/**
 * Read an optional free text (numbers are taken as their text); control characters refused.
 *
 * @param ctx error context
 * @param obj the enclosing mapping
 * @param key the key
 * @param path the enclosing key path
 * @param maxLength longest text accepted
 * @returns the trimmed text, or undefined when absent
 */
export function text(
  ctx: Ctx,
  obj: Record<string, unknown>,
  key: string,
  path: string,
  maxLength: number,
): string | undefined {
  const raw = obj[key];
  if (raw === undefined) return undefined;
  const field = join(path, key);
  let s: string;
  if (typeof raw === "string") s = raw.trim();
  else if (typeof raw === "number" && Number.isFinite(raw)) s = String(raw);
  else fail(ctx, field, describe(raw), "a text");
  if (s.length === 0) fail(ctx, field, "an empty text", "a text");
  if (s.length > maxLength) {
    fail(ctx, field, `a text of ${s.length} characters`, `at most ${maxLength}`);
  }
  // deno-lint-ignore no-control-regex
  if (/[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/.test(s)) {
    fail(ctx, field, "a text with control characters", "printable text");
  }
  return s;
}

/**
 * Read an optional registry identifier (liquid, material, fitting, formulation): lower-cased,
 * spaces and underscores turned into hyphens, then `[a-z0-9][a-z0-9.+-]*`.
 *
 * @param ctx error context
 * @param obj the enclosing mapping
 * @param key the key
 * @param path the enclosing key path
 * @param what the kind of id, for messages
 * @returns the normalised id, or undefined when absent
 */
export function ident(
  ctx: Ctx,
  obj: Record<string, unknown>,
  key: string,
  path: string,
  what: string,
): string | undefined {
  const raw = obj[key];
  if (raw === undefined) return undefined;
  const field = join(path, key);
  if (typeof raw !== "string") fail(ctx, field, describe(raw), `${what} id such as "carbon-steel"`);
  const id = raw.trim().toLowerCase().replace(/[\s_]+/g, "-");
  if (!/^[a-z0-9][a-z0-9.+-]*$/.test(id) || id.length > 64) {
    fail(
      ctx,
      field,
      describe(raw),
      `${what} id: letters, digits and hyphens, such as "carbon-steel"`,
    );
  }
  return id;
}

/**
 * Require a value to be present.
 *
 * @param ctx error context
 * @param v the value read
 * @param field key path
 * @param accepted what is accepted
 * @returns the value
 */
export function required<T>(ctx: Ctx, v: T | undefined, field: string, accepted: string): T {
  if (v === undefined) fail(ctx, field, "nothing", `${accepted} (this key is required)`);
  return v;
}

/** Trade names of the common mountings: Z (1 traverse), V (2), W (4). Common practice. */
const MOUNTING_NAMES: Record<string, number> = { Z: 1, V: 2, W: 4 };

/**
 * Read the traverse list: integers 1 to 8, or the trade letters Z, V, W; no duplicates.
 * A single value stands for a list of one. Returned sorted ascending.
 *
 * @param ctx error context
 * @param raw the raw value
 * @param field key path
 * @returns the traverse counts
 */
export function traverses(ctx: Ctx, raw: unknown, field: string): number[] {
  const list = Array.isArray(raw) ? raw : [raw];
  const accepted = `whole traverse counts 1 to ${MAX_TRAVERSES} (or Z, V, W), each once, ` +
    `for example [1, 2, 4]`;
  if (list.length === 0) fail(ctx, field, "an empty list", accepted);
  if (list.length > MAX_TRAVERSES) fail(ctx, field, `a list of ${list.length}`, accepted);
  const out: number[] = [];
  list.forEach((item, i) => {
    const f = Array.isArray(raw) ? `${field}[${i}]` : field;
    let n: number | undefined;
    if (typeof item === "number") n = item;
    else if (typeof item === "string") {
      const s = item.trim();
      if (/^\d+$/.test(s)) n = Number(s);
      else n = MOUNTING_NAMES[s.toUpperCase()];
    }
    if (n === undefined || !Number.isInteger(n) || n < 1 || n > MAX_TRAVERSES) {
      fail(ctx, f, describe(item), accepted);
    }
    if (out.includes(n)) fail(ctx, f, `${describe(item)} a second time`, accepted);
    out.push(n);
  });
  return out.sort((a, b) => a - b);
}

const FRACTIONS: Record<string, string> = {
  "0.125": "1/8",
  "0.25": "1/4",
  "0.375": "3/8",
  "0.5": "1/2",
  "0.75": "3/4",
};

/**
 * Read a nominal pipe size: `8`, `"8"`, `"1-1/2"`, `"1 1/2"`, `1.5`, `"NPS 8"` → `"8"`,
 * `"1-1/2"`. Whether the size exists is the catalogue's question, not the reader's.
 *
 * @param ctx error context
 * @param raw the raw value
 * @param field key path
 * @returns the canonical designation
 */
export function nps(ctx: Ctx, raw: unknown, field: string): string {
  const accepted = 'a nominal pipe size such as 8, "1-1/2" or 1.5';
  let s: string;
  if (typeof raw === "number") s = String(raw);
  else if (typeof raw === "string") s = raw.trim().replace(/^nps\s*/i, "");
  else fail(ctx, field, describe(raw), accepted);
  const mixed = /^(\d{1,3})(?:[\s-]+(\d)\/(\d))?$/.exec(s) ?? /^()(\d)\/(\d)$/.exec(s);
  if (mixed) {
    const whole = mixed[1] ? Number(mixed[1]) : 0;
    if (mixed[2] === undefined) {
      if (whole > 0) return String(whole);
    } else {
      const frac = `${Number(mixed[2])}/${Number(mixed[3])}`;
      if (Object.values(FRACTIONS).includes(frac)) return whole > 0 ? `${whole}-${frac}` : frac;
    }
    fail(ctx, field, describe(raw), accepted);
  }
  if (/^\d{0,3}\.\d+$/.test(s)) {
    const x = Number(s);
    const whole = Math.floor(x);
    const frac = FRACTIONS[String(Number((x - whole).toFixed(6)))];
    if (frac) return whole > 0 ? `${whole}-${frac}` : frac;
  }
  fail(ctx, field, describe(raw), accepted);
}

/**
 * Read a schedule designation: `40`, `"40"`, `"Sch 40"`, `"std"`, `"10s"` → `"40"`, `"STD"`,
 * `"10S"`. Whether it exists for the size is the catalogue's question.
 *
 * @param ctx error context
 * @param raw the raw value
 * @param field key path
 * @returns the canonical designation
 */
export function schedule(ctx: Ctx, raw: unknown, field: string): string {
  const accepted =
    'a schedule or class such as 40, "80", "STD", "XS", "10S", "DR 17", "PC 350", "K"';
  let s: string | undefined;
  if (typeof raw === "number" && Number.isInteger(raw) && raw > 0) s = String(raw);
  else if (typeof raw === "string") {
    s = raw.trim().toUpperCase().replace(/^SCH(?:EDULE)?\.?\s*/, "").replace(/\s+/g, " ");
    // pressure classes (AWWA C151), dimension ratios (HDPE), copper tube types (ASTM B88)
    s = s.replace(/^(PC|DR)\s*(\d)/, "$1 $2");
  }
  if (
    s === undefined ||
    !/^(?:\d{1,3}S?|STD|XS|XXS|PC \d{2,3}|DR \d{1,2}(?:\.\d)?|[KLM])$/.test(s) ||
    /^0+S?$/.test(s)
  ) {
    fail(ctx, field, describe(raw), accepted);
  }
  return s;
}
