/**
 * From bytes or text to a raw value: size limit, binary refusal, YAML (core schema, unique
 * keys, string keys, few aliases, no custom or YAML 1.1 tags, one document) and strict JSON.
 * Syntax errors become one line naming the line and column. A YAML text in the plain subset that
 * site files are written in is read by our own reader (./yaml_subset.ts), with the same result;
 * npm `yaml` is imported only for a YAML text outside it (and gives the errors): JSON sites
 * (and their duplicate-key check) and most YAML sites need none of it.
 *
 * @module
 */
import { type Ctx, fail, oneLine } from "./read_fields.ts";
import { readYamlSubset } from "./yaml_subset.ts";

/** Most aliases a site file may expand; site files need few, alias bombs need many. */
export const MAX_ALIASES = 20;

/**
 * Decode bytes as UTF-8, refusing binary content (NUL bytes, invalid UTF-8) and empty files.
 *
 * @param ctx error context
 * @param bytes the file's content
 * @param limit largest size accepted, bytes
 * @returns the text, without a leading byte-order mark
 */
export function decodeText(ctx: Ctx, bytes: Uint8Array, limit: number): string {
  if (bytes.length > limit) {
    fail(ctx, "file", `${bytes.length} bytes`, `a file of at most ${limit} bytes`);
  }
  if (bytes.includes(0)) fail(ctx, "file", "binary content (NUL bytes)", "a UTF-8 text file");
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    fail(ctx, "file", "bytes that are not UTF-8", "a UTF-8 text file");
  }
  return checkText(ctx, text, limit);
}

/**
 * Check a text before parsing: size, NUL characters, emptiness. Strips a byte-order mark.
 *
 * @param ctx error context
 * @param text the text
 * @param limit largest size accepted, in UTF-16 code units (about bytes for site files)
 * @returns the text, without a leading byte-order mark
 */
export function checkText(ctx: Ctx, text: string, limit: number): string {
  if (typeof text !== "string") fail(ctx, "file", typeof text, "text");
  if (text.length > limit) {
    fail(ctx, "file", `${text.length} characters`, `a file of at most ${limit} bytes`);
  }
  if (text.includes("\u0000")) {
    fail(ctx, "file", "binary content (NUL characters)", "a UTF-8 text file");
  }
  const t = text.startsWith("\uFEFF") ? text.slice(1) : text;
  if (t.trim() === "") {
    fail(ctx, "file", "an empty file", "a site description (see docs/site-file.md)");
  }
  return t;
}

function lineCol(text: string, pos: number): { line: number; col: number } {
  let line = 1;
  let last = -1;
  for (let i = 0; i < pos && i < text.length; i++) {
    if (text.charCodeAt(i) === 10) {
      line++;
      last = i;
    }
  }
  return { line, col: pos - last };
}

function firstSentence(msg: string): string {
  return oneLine(msg.split("\n")[0].replace(/ at line \d+, column \d+:?$/, "").replace(/:$/, ""));
}

/**
 * Options of npm `yaml` for site and readings text beyond our subset: YAML 1.2 core schema,
 * unique string keys, no merge keys, strict (pass `customTags: []` beside them: no custom tags).
 */
export const YAML_OPTIONS = Object.freeze(
  {
    schema: "core",
    uniqueKeys: true,
    stringKeys: true,
    merge: false,
    resolveKnownTags: false,
    strict: true,
    prettyErrors: true,
  } as const,
);

/**
 * Parse YAML text strictly into plain data: by the subset reader when the text is in its subset,
 * else by the full YAML parser (loaded on first use), which gives the same values and the errors.
 *
 * @param ctx error context
 * @param text the YAML text
 * @returns the data (a promise: the YAML parser is loaded on first use)
 */
export async function parseYamlText(ctx: Ctx, text: string): Promise<unknown> {
  const quick = readYamlSubset(text);
  if (quick) return quick.value;
  const { parseDocument } = await import("yaml");
  const doc = parseDocument(text, { ...YAML_OPTIONS, customTags: [] });
  const problem = doc.errors[0] ?? doc.warnings[0];
  if (problem) {
    const pos = problem.linePos?.[0] ?? lineCol(text, problem.pos[0]);
    let what = firstSentence(problem.message);
    if (problem.code === "DUPLICATE_KEY") {
      const key = /^[^\s:#]+/.exec(text.slice(problem.pos[0], problem.pos[0] + 80));
      what = `the key ${key ? `"${key[0]}" ` : ""}a second time`;
    } else if (problem.code === "TAG_RESOLVE_FAILED") {
      what = `a tag (${what.replace(/^Unresolved tag:\s*/, "")})`;
    } else if (problem.code === "MULTIPLE_DOCS") {
      what = "a second YAML document";
    }
    fail(
      ctx,
      `line ${pos.line}, column ${pos.col}`,
      what,
      "YAML of plain mappings, lists and scalars (core schema, each key once, no tags, one document)",
    );
  }
  try {
    return doc.toJS({ maxAliasCount: MAX_ALIASES });
  } catch (e) {
    const msg = e instanceof Error ? e.message : String(e);
    if (/alias/i.test(msg)) {
      fail(ctx, "file", "too many YAML aliases", `at most ${MAX_ALIASES} alias expansions`);
    }
    fail(ctx, "file", firstSentence(msg), "valid YAML");
  }
}

/**
 * Parse JSON text strictly (the JSON grammar, each key once) into plain data.
 *
 * @param ctx error context
 * @param text the JSON text
 * @returns the data
 */
export function parseJsonText(ctx: Ctx, text: string): unknown {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (e) {
    const msg = e instanceof Error ? e.message : String(e);
    const m = /line (\d+) column (\d+)/.exec(msg);
    const p = /position (\d+)/.exec(msg);
    const pos = m
      ? { line: Number(m[1]), col: Number(m[2]) }
      : p
      ? lineCol(text, Number(p[1]))
      : undefined;
    fail(
      ctx,
      pos ? `line ${pos.line}, column ${pos.col}` : "file",
      oneLine(
        msg.replace(/\s*\(line \d+ column \d+\)/, "").replace(/ in JSON at position \d+/, ""),
      ),
      "valid JSON",
    );
  }
  // JSON.parse keeps the last of repeated keys silently: find them.
  const dup = repeatedJsonKey(text);
  if (dup !== undefined) {
    const pos = lineCol(text, dup);
    const key = /^"(?:[^"\\]|\\.)*"/.exec(text.slice(dup, dup + 80));
    fail(
      ctx,
      `line ${pos.line}, column ${pos.col}`,
      `the key ${key ? key[0] + " " : ""}a second time`,
      "each key once",
    );
  }
  return data;
}

/**
 * The offset of the first key that repeats an earlier key of the same object (compared after
 * decoding escapes, as JSON.parse would), in a text that JSON.parse accepted.
 *
 * @param text valid JSON text
 * @returns the offset of the repeated key's opening quote, or undefined
 *
 * @example
 * ```ts
 * import { repeatedJsonKey } from "./read_text.ts";
 * const t = '{"a": {"b": 1, "c": [{"b": 2}]}, "\\u0061": 3}';
 * if (repeatedJsonKey(t) !== t.lastIndexOf('"\\u0061"')) throw new Error("escaped repeat");
 * if (repeatedJsonKey('{"a": {"a": 1}}') !== undefined) throw new Error("nested is no repeat");
 * ```
 */
export function repeatedJsonKey(text: string): number | undefined {
  // One frame per open bracket: the keys seen so far (objects only) and a repeated key waiting
  // for its value to end. A repeat is reported when its value ends, so a repeat inside that value
  // comes first (the order in which a parser that builds values before keys finds them).
  const stack: { keys: Set<string> | null; repeat: number | undefined }[] = [];
  let expectKey = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 0x22) {
      const start = i;
      let escaped = false;
      for (i++; i < text.length; i++) {
        const d = text.charCodeAt(i);
        if (d === 0x5c) {
          escaped = true;
          i++;
        } else if (d === 0x22) break;
      }
      if (expectKey) {
        const raw = text.slice(start, i + 1);
        const key = escaped ? JSON.parse(raw) as string : raw.slice(1, -1);
        const top = stack[stack.length - 1];
        if (top.keys!.has(key)) top.repeat ??= start;
        top.keys!.add(key);
        expectKey = false;
      }
    } else if (c === 0x7b || c === 0x5b) {
      stack.push({ keys: c === 0x7b ? new Set() : null, repeat: undefined });
      expectKey = c === 0x7b;
    } else if (c === 0x7d || c === 0x5d || c === 0x2c) {
      const top = stack[stack.length - 1];
      if (top?.repeat !== undefined) return top.repeat;
      if (c === 0x2c) expectKey = top?.keys != null;
      else {
        stack.pop();
        expectKey = false;
      }
    }
  }
  return undefined;
}
