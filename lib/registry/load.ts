/**
 * The registry loader: reads every YAML file under data/ (except data/demo/), validates it
 * against the schema of its `kind`, checks that every number is covered by a resolvable
 * source and a basis, refuses duplicate ids, freezes the result and hashes it.
 *
 * This module and `site` are the only places in lib/ that read files.
 *
 * @module
 */
import { parse as parseYaml } from "yaml";
import { createHash } from "node:crypto";
import type { z } from "zod";
import { RegistryError } from "../errors.ts";
import { SCHEMAS } from "./schemas/mod.ts";
import type { SourceEntry as Source } from "./schemas/sources.ts";

/** One validated data file. */
export interface DataDoc {
  /** Path relative to the data folder, with forward slashes. */
  readonly file: string;
  /** The file's kind. */
  readonly kind: string;
  /** The validated, frozen content. */
  // deno-lint-ignore no-explicit-any
  readonly data: any;
}

/** Everything the loader read, validated and frozen. */
export interface LoadedRegistry {
  /** Data folder it was read from. */
  readonly dir: string;
  /** Every data file, sorted by path. */
  readonly docs: readonly DataDoc[];
  /** The bibliography by id. */
  readonly sources: ReadonlyMap<string, Source>;
  /** SHA-256 (hex) of the canonical serialisation of every data file. */
  readonly hash: string;
  /** Whether the validated snapshot was used (the YAML bytes matched it). */
  readonly fromSnapshot: boolean;
}

/** Largest data file the loader reads, in bytes. */
export const MAX_DATA_FILE_BYTES = 4 * 1024 * 1024;

function listYaml(dir: URL, rel = ""): string[] {
  const out: string[] = [];
  for (const e of Deno.readDirSync(new URL(rel, dir))) {
    const path = rel + e.name;
    if (e.isDirectory) {
      if (rel === "" && e.name === "demo") continue;
      out.push(...listYaml(dir, path + "/"));
    } else if (e.isFile && /\.ya?ml$/.test(e.name)) {
      out.push(path);
    }
  }
  return out.sort();
}

function toDirUrl(dir: string | URL): URL {
  if (dir instanceof URL) return dir.href.endsWith("/") ? dir : new URL(dir.href + "/");
  const abs = dir.startsWith("/") ? dir : `${Deno.cwd()}/${dir}`;
  return new URL(`file://${abs.endsWith("/") ? abs : abs + "/"}`);
}

/** Canonical JSON: keys sorted at every level, no whitespace. */
export function canonicalJson(value: unknown): string {
  // Built by appending to one string (no intermediate arrays): the registry is hashed this way on
  // every load. Array holes and undefined elements give nothing, as Array#join would.
  if (value === null || typeof value !== "object") return JSON.stringify(value);
  if (Array.isArray(value)) {
    let s = "[";
    for (let i = 0; i < value.length; i++) {
      if (i > 0) s += ",";
      if (i in value) {
        const c = canonicalJson(value[i]);
        if (c !== undefined) s += c;
      }
    }
    return s + "]";
  }
  const o = value as Record<string, unknown>;
  const keys = Object.keys(o).sort();
  let s = "{";
  for (let i = 0; i < keys.length; i++) {
    if (i > 0) s += ",";
    s += JSON.stringify(keys[i]) + ":" + canonicalJson(o[keys[i]]);
  }
  return s + "}";
}

function deepFreeze<T>(v: T): T {
  if (v !== null && typeof v === "object" && !Object.isFrozen(v)) {
    Object.freeze(v);
    for (const k of Object.keys(v as object)) deepFreeze((v as Record<string, unknown>)[k]);
  }
  return v;
}

// deno-lint-ignore no-explicit-any
function entryName(data: any, path: readonly PropertyKey[]): string {
  if (path.length >= 2 && typeof path[1] === "number") {
    const item = data?.[path[0] as string]?.[path[1]];
    if (item && typeof item === "object") {
      const name = item.id ?? item.nps ?? item.name;
      if (name !== undefined) return `${String(name)}`;
    }
    return `${String(path[0])}[${path[1]}]`;
  }
  return data?.id ?? "(file)";
}

function issuePath(path: readonly PropertyKey[]): string {
  return path.length
    ? path.map((p) => typeof p === "number" ? `[${p}]` : String(p)).join(".")
      .replace(/\.\[/g, "[")
    : "(root)";
}

/**
 * Walk a document and require every number to sit under an object carrying `source`
 * and `basis` (itself or an ancestor), and every `source` to resolve.
 */
function checkProvenance(
  file: string,
  // deno-lint-ignore no-explicit-any
  data: any,
  sources: ReadonlyMap<string, Source>,
): void {
  const walk = (
    node: unknown,
    path: (string | number)[],
    hasSource: boolean,
    hasBasis: boolean,
  ): void => {
    if (Array.isArray(node)) {
      node.forEach((x, i) => walk(x, [...path, i], hasSource, hasBasis));
      return;
    }
    if (node !== null && typeof node === "object") {
      const o = node as Record<string, unknown>;
      if ("source" in o) {
        if (typeof o.source !== "string" || !sources.has(o.source)) {
          throw new RegistryError(
            file,
            entryName(data, path),
            issuePath([...path, "source"]),
            `unknown source id '${String(o.source)}' (not in data/sources.yaml)`,
          );
        }
      }
      const hs = hasSource || typeof o.source === "string";
      const hb = hasBasis || typeof o.basis === "string";
      for (const [k, v] of Object.entries(o)) {
        if (k === "source" || k === "basis") continue;
        walk(v, [...path, k], hs, hb);
      }
      return;
    }
    if (typeof node === "number" && (!hasSource || !hasBasis)) {
      throw new RegistryError(
        file,
        entryName(data, path),
        issuePath(path),
        `a datum without ${!hasSource ? "a source" : "a basis"}: every number needs ` +
          "`source` and `basis` on itself or an enclosing entry",
      );
    }
  };
  walk(data, [], false, false);
}

/** Refuse two entries with the same id in the same kind and list key. */
function checkDuplicateIds(docs: readonly DataDoc[]): void {
  const seen = new Map<string, string>();
  for (const d of docs) {
    const note = (key: string, id: string, where: string) => {
      const k = `${d.kind}/${key}/${id}`;
      const prev = seen.get(k);
      if (prev) {
        throw new RegistryError(d.file, id, where, `duplicate id '${id}' (also in ${prev})`);
      }
      seen.set(k, d.file);
    };
    if (typeof d.data.id === "string") note("", d.data.id, "id");
    for (const [key, v] of Object.entries(d.data)) {
      if (!Array.isArray(v)) continue;
      v.forEach((item, i) => {
        if (item && typeof item === "object" && typeof item.id === "string") {
          note(key, item.id, `${key}[${i}].id`);
        }
      });
    }
  }
}

/** Name of the validated snapshot inside the data folder (built by `deno task registry snapshot`). */
export const SNAPSHOT_FILE = "snapshot.json";
const SNAPSHOT_VERSION = 1;

/** Options of {@link loadRegistry}. */
export interface LoadOptions {
  /**
   * Use the validated snapshot (`data/snapshot.json`) when it was built from exactly these
   * YAML files (same bytes: SHA-256 over names and contents). Default true. A stale or absent
   * snapshot falls back to full validation.
   */
  readonly snapshot?: boolean;
}

function readSources(dir: URL): { files: string[]; texts: string[]; rawHash: string } {
  const files = listYaml(dir);
  const texts: string[] = [];
  const h = createHash("sha256");
  for (const file of files) {
    const url = new URL(file, dir);
    const size = Deno.statSync(url).size;
    if (size > MAX_DATA_FILE_BYTES) {
      throw new RegistryError(file, "(file)", "(root)", `larger than ${MAX_DATA_FILE_BYTES} bytes`);
    }
    const text = Deno.readTextFileSync(url);
    texts.push(text);
    h.update(file).update("\0").update(text).update("\0");
  }
  return { files, texts, rawHash: h.digest("hex") };
}

function validateAll(files: string[], texts: string[]): DataDoc[] {
  const docs: DataDoc[] = [];
  files.forEach((file, i) => {
    let raw: unknown;
    try {
      raw = parseYaml(texts[i], { maxAliasCount: 50, uniqueKeys: true });
    } catch (e) {
      const msg = e instanceof Error ? e.message.split("\n")[0] : String(e);
      throw new RegistryError(file, "(file)", "(root)", `not valid YAML: ${msg}`);
    }
    const kind = (raw as { kind?: unknown } | null)?.kind;
    const schema = typeof kind === "string" ? SCHEMAS[kind] : undefined;
    if (!schema) {
      throw new RegistryError(
        file,
        "(file)",
        "kind",
        `unknown kind ${JSON.stringify(kind)}; expected one of ${Object.keys(SCHEMAS).join(", ")}`,
      );
    }
    const r = (schema as z.ZodType).safeParse(raw);
    if (!r.success) {
      const issue = r.error.issues[0];
      throw new RegistryError(
        file,
        entryName(raw, issue.path),
        issuePath(issue.path),
        issue.message,
      );
    }
    docs.push({ file, kind: kind as string, data: r.data });
  });
  return docs;
}

function collectSources(docs: readonly DataDoc[]): Map<string, Source> {
  const sources = new Map<string, Source>();
  for (const d of docs.filter((d) => d.kind === "sources")) {
    for (const [i, s] of (d.data.sources as Source[]).entries()) {
      if (sources.has(s.id)) {
        throw new RegistryError(d.file, s.id, `sources[${i}].id`, `duplicate source id '${s.id}'`);
      }
      sources.set(s.id, s);
    }
  }
  if (sources.size === 0) {
    throw new RegistryError("sources.yaml", "(file)", "(root)", "no bibliography found");
  }
  return sources;
}

function contentHash(docs: readonly DataDoc[]): string {
  return createHash("sha256")
    .update(canonicalJson(docs.map((d) => [d.file, d.data])))
    .digest("hex");
}

function fullValidation(files: string[], texts: string[]): DataDoc[] {
  const docs = validateAll(files, texts);
  const sources = collectSources(docs);
  for (const d of docs) if (d.kind !== "sources") checkProvenance(d.file, d.data, sources);
  checkDuplicateIds(docs);
  return docs;
}

/**
 * Build the validated snapshot of a data folder: full validation, then the validated
 * documents as JSON with the SHA-256 of the YAML bytes they came from and the content hash.
 *
 * @param dir the data folder
 * @returns the snapshot's JSON text
 *
 * @example
 * ```ts
 * import { buildSnapshot } from "./load.ts";
 * const snap = JSON.parse(buildSnapshot(new URL("../../data/", import.meta.url)));
 * if (snap.hash.length !== 64) throw new Error();
 * ```
 */
export function buildSnapshot(dir: string | URL): string {
  const base = toDirUrl(dir);
  const { files, texts, rawHash } = readSources(base);
  const docs = fullValidation(files, texts);
  return JSON.stringify({ version: SNAPSHOT_VERSION, rawHash, hash: contentHash(docs), docs }) +
    "\n";
}

// deno-lint-ignore no-explicit-any
function readSnapshot(dir: URL, rawHash: string): any | undefined {
  let text: string;
  try {
    text = Deno.readTextFileSync(new URL(SNAPSHOT_FILE, dir));
  } catch {
    return undefined;
  }
  try {
    const snap = JSON.parse(text);
    if (
      snap?.version === SNAPSHOT_VERSION && snap.rawHash === rawHash && Array.isArray(snap.docs)
    ) {
      return snap;
    }
  } catch {
    // a broken snapshot is ignored: full validation follows
  }
  return undefined;
}

/**
 * Load, validate, freeze and hash the reference data in a folder.
 *
 * Reads every `*.yaml` below `dir` except `demo/`. Each file names its `kind`, one of the
 * schemas in `schemas/mod.ts`. Refuses, with a {@link RegistryError} naming the file, the
 * entry and the field: YAML syntax errors, an unknown kind, a schema violation (bad unit,
 * impossible row), a number without source and basis, an unknown source id, a duplicate id.
 *
 * Full validation (YAML parsing and zod) takes long on a slow machine, so a validated
 * snapshot (`snapshot.json`, built by `deno task registry snapshot`) is used when its
 * recorded SHA-256 of the YAML bytes matches the files on disk; any edit to a YAML file makes
 * it stale and the loader validates in full. The content hash is recomputed from the
 * documents either way.
 *
 * The hash is SHA-256 over the canonical JSON (sorted keys) of `[file, content]` pairs in
 * path order: it is the same on every machine for the same data.
 *
 * @param dir the data folder (path or file URL)
 * @param options snapshot use
 * @returns the validated registry data
 *
 * @example
 * ```ts
 * import { loadRegistry } from "./load.ts";
 * const reg = loadRegistry(new URL("../../data/", import.meta.url));
 * if (!/^[0-9a-f]{64}$/.test(reg.hash)) throw new Error("hash");
 * ```
 */
export function loadRegistry(dir: string | URL, options?: LoadOptions): LoadedRegistry {
  const base = toDirUrl(dir);
  const { files, texts, rawHash } = readSources(base);
  const snap = options?.snapshot === false ? undefined : readSnapshot(base, rawHash);
  const docs: DataDoc[] = snap ? snap.docs : fullValidation(files, texts);
  const sources = collectSources(docs);
  const hash = contentHash(docs);
  for (const d of docs) deepFreeze(d.data);
  return Object.freeze({
    dir: base.href,
    docs: Object.freeze(docs),
    sources,
    hash,
    fromSnapshot: snap !== undefined,
  });
}
