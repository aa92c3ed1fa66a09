/**
 * From bytes or text to a raw value: size limit, binary refusal, YAML (core schema, unique
 * keys, string keys, few aliases, no custom or YAML 1.1 tags, one document) and strict JSON.
 * Syntax errors become one line naming the line and column.
 *
 * @module
 */
import { parseDocument } from "yaml";
import { type Ctx, fail, oneLine } from "./read_fields.ts";

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
 * Parse YAML text strictly into plain data.
 *
 * @param ctx error context
 * @param text the YAML text
 * @returns the data
 */
export function parseYamlText(ctx: Ctx, text: string): unknown {
  const doc = parseDocument(text, {
    schema: "core",
    uniqueKeys: true,
    stringKeys: true,
    merge: false,
    resolveKnownTags: false,
    strict: true,
    prettyErrors: true,
    customTags: [],
  });
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
  // JSON.parse keeps the last of repeated keys silently; the YAML parser, which reads JSON,
  // finds them.
  const doc = parseDocument(text, { schema: "json", uniqueKeys: true, strict: true });
  const dup = doc.errors.find((e) => e.code === "DUPLICATE_KEY");
  if (dup) {
    const pos = dup.linePos?.[0] ?? lineCol(text, dup.pos[0]);
    const key = /^"(?:[^"\\]|\\.)*"/.exec(text.slice(dup.pos[0], dup.pos[0] + 80));
    fail(
      ctx,
      `line ${pos.line}, column ${pos.col}`,
      `the key ${key ? key[0] + " " : ""}a second time`,
      "each key once",
    );
  }
  return data;
}
