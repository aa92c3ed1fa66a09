/**
 * The registry loader's quick path: list and hash the YAML files under data/, and when the
 * validated snapshot (`data/snapshot.json`) was built from exactly those bytes, use its documents
 * (no YAML parsing, no zod). Full validation lives in `load.ts`, which registers itself here when
 * imported; `lib/registry/mod.ts` imports it on start only when the bundled snapshot is stale, so
 * a normal run never loads `yaml` or zod.
 *
 * This module, `load.ts` and `site` are the only places in lib/ that read files.
 *
 * @module
 */
import { RegistryError } from "../errors.ts";
import type { SourceEntry as Source } from "./schemas/sources.ts";
import { sha256Hex, sha256OfText } from "./sha256.ts";

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

/** Options of {@link loadRegistry}. */
export interface LoadOptions {
  /**
   * Use the validated snapshot (`data/snapshot.json`) when it was built from exactly these
   * YAML files (same bytes: SHA-256 over names and contents). Default true. A stale or absent
   * snapshot falls back to full validation.
   */
  readonly snapshot?: boolean;
}

/** Largest data file the loader reads, in bytes. */
export const MAX_DATA_FILE_BYTES = 4 * 1024 * 1024;

/** Name of the validated snapshot inside the data folder (built by `deno task registry snapshot`). */
export const SNAPSHOT_FILE = "snapshot.json";
/** Version of the snapshot's layout. */
export const SNAPSHOT_VERSION = 2;

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

/**
 * A data folder as a file URL ending in a slash.
 *
 * @param dir path (relative to the working folder) or file URL
 * @returns the folder URL
 */
export function toDirUrl(dir: string | URL): URL {
  if (dir instanceof URL) return dir.href.endsWith("/") ? dir : new URL(dir.href + "/");
  const abs = dir.startsWith("/") ? dir : `${Deno.cwd()}/${dir}`;
  return new URL(`file://${abs.endsWith("/") ? abs : abs + "/"}`);
}

/**
 * Canonical JSON: keys sorted at every level, no whitespace.
 *
 * @param value plain data
 * @returns the text
 *
 * @example
 * ```ts
 * import { canonicalJson } from "./load_snapshot.ts";
 * if (canonicalJson({ b: 1, a: [2, { d: 3, c: 4 }] }) !== '{"a":[2,{"c":4,"d":3}],"b":1}') {
 *   throw new Error("order");
 * }
 * ```
 */
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

/**
 * Freeze an object and every object below it (children first; a frozen one is taken as frozen
 * throughout). The data are trees (JSON or validated YAML), never cyclic.
 */
function deepFreeze(v: object): void {
  if (Array.isArray(v)) {
    for (let i = 0; i < v.length; i++) {
      const x = v[i];
      if (typeof x === "object" && x !== null && !Object.isFrozen(x)) deepFreeze(x);
    }
  } else {
    const o = v as Record<string, unknown>;
    const keys = Object.keys(o);
    for (let i = 0; i < keys.length; i++) {
      const x = o[keys[i]];
      if (typeof x === "object" && x !== null && !Object.isFrozen(x)) deepFreeze(x);
    }
  }
  Object.freeze(v);
}

/** The YAML files of a data folder, their bytes and the SHA-256 over names and bytes. */
export interface DataSources {
  /** Paths relative to the folder, sorted. */
  readonly files: string[];
  /** Their bytes, in the same order. */
  readonly bytes: Uint8Array[];
  /** SHA-256 (hex) over `name \0 bytes \0` of every file in order (names in UTF-8). */
  readonly rawHash: string;
}

/** What {@link readSources} read, before hashing: the files and the message to hash. */
interface RawSources {
  readonly files: string[];
  readonly bytes: Uint8Array[];
  /** `name \0 bytes \0` of every file in order. */
  readonly message: Uint8Array<ArrayBuffer>;
}

function readRaw(dir: URL): RawSources {
  const files = listYaml(dir);
  const bytes: Uint8Array[] = [];
  const enc = new TextEncoder();
  const names = files.map((f) => enc.encode(f));
  let total = 0;
  for (let i = 0; i < files.length; i++) {
    const url = new URL(files[i], dir);
    const size = Deno.statSync(url).size;
    if (size > MAX_DATA_FILE_BYTES) {
      throw new RegistryError(
        files[i],
        "(file)",
        "(root)",
        `larger than ${MAX_DATA_FILE_BYTES} bytes`,
      );
    }
    const b = Deno.readFileSync(url);
    bytes.push(b);
    total += names[i].length + b.length + 2;
  }
  const message = new Uint8Array(total);
  let n = 0;
  for (let i = 0; i < files.length; i++) {
    message.set(names[i], n);
    n += names[i].length + 1; // the 0 separator is already there
    message.set(bytes[i], n);
    n += bytes[i].length + 1;
  }
  return { files, bytes, message };
}

/**
 * Read the YAML files of a data folder (not demo/) and hash them.
 *
 * @param dir the data folder URL
 * @returns files, bytes and their hash
 * @throws {RegistryError} for a file larger than {@link MAX_DATA_FILE_BYTES}
 */
export function readSources(dir: URL): DataSources {
  const { files, bytes, message } = readRaw(dir);
  return { files, bytes, rawHash: sha256Hex(message) };
}

/**
 * The texts of the files read (UTF-8; invalid sequences become U+FFFD, a leading byte-order mark
 * is dropped), for full validation.
 *
 * @param read what {@link readSources} read
 * @returns the texts, in file order
 */
export function sourceTexts(read: DataSources): string[] {
  const dec = new TextDecoder();
  return read.bytes.map((b) => dec.decode(b));
}

/** A snapshot whose recorded YAML hash matched: its content text and that text's SHA-256. */
interface SnapshotContent {
  /** The canonical JSON of `[file, data]` pairs, as stored. */
  readonly content: string;
  /** SHA-256 (hex) of `content`: the registry's content hash. */
  readonly hash: string;
  /** The documents of `content` (frozen), when already parsed. */
  readonly docs?: DataDoc[];
}

/**
 * The head of a snapshot: layout version, SHA-256 of the YAML bytes, content hash; the canonical
 * content follows, then `}` and a newline.
 */
const SNAPSHOT_HEAD =
  /^\{"version":(\d+),"rawHash":"([0-9a-f]{64})","hash":"([0-9a-f]{64})","content":/;

/** A snapshot text split at its head. */
interface SnapshotSplit {
  /** The content text. */
  readonly content: string;
  /** Where it starts and ends in the text. */
  readonly start: number;
  readonly end: number;
  /** The SHA-256 of the YAML bytes it records. */
  readonly rawHash: string;
  /** The content hash it records. */
  readonly recorded: string;
}

/**
 * Split a snapshot text into its head and content; undefined when it is of another layout or
 * version, or is cut short.
 */
function snapshotSplit(text: string): SnapshotSplit | undefined {
  const m = SNAPSHOT_HEAD.exec(text.slice(0, 200));
  if (!m || Number(m[1]) !== SNAPSHOT_VERSION) return undefined;
  const end = text.endsWith("}\n") ? text.length - 2 : text.endsWith("}") ? text.length - 1 : -1;
  if (end <= m[0].length) return undefined;
  return {
    content: text.slice(m[0].length, end),
    start: m[0].length,
    end,
    rawHash: m[2],
    recorded: m[3],
  };
}

/**
 * Split a snapshot text whose recorded YAML hash is `rawHash` into its content; undefined when
 * it is of another layout or version, records another YAML hash, or is cut short.
 */
function snapshotParts(
  text: string,
  rawHash: string,
): { content: string; recorded: string } | undefined {
  const parts = snapshotSplit(text);
  return parts?.rawHash === rawHash ? parts : undefined;
}

function readSnapshotText(dir: URL): string | undefined {
  try {
    return Deno.readTextFileSync(new URL(SNAPSHOT_FILE, dir));
  } catch {
    return undefined;
  }
}

/**
 * The snapshot's text as {@link readSnapshotText} reads it, and its bytes when they are well-formed
 * UTF-8 (then the text is their decoding, a byte-order mark kept as a character).
 */
function readSnapshotFile(dir: URL): { text: string; bytes?: Uint8Array<ArrayBuffer> } | undefined {
  let bytes: Uint8Array<ArrayBuffer>;
  try {
    bytes = Deno.readFileSync(new URL(SNAPSHOT_FILE, dir));
  } catch {
    return undefined;
  }
  try {
    return {
      text: new TextDecoder("utf-8", { fatal: true, ignoreBOM: true }).decode(bytes),
      bytes,
    };
  } catch {
    // not UTF-8: read as text, as the synchronous path does
    const text = readSnapshotText(dir);
    return text === undefined ? undefined : { text };
  }
}

function readSnapshot(dir: URL, rawHash: string): SnapshotContent | undefined {
  const text = readSnapshotText(dir);
  const parts = text === undefined ? undefined : snapshotParts(text, rawHash);
  if (!parts) return undefined;
  const hash = sha256OfText([parts.content]);
  // A content that is not what its head records (edited by hand, damaged): not used.
  return hash === parts.recorded ? { content: parts.content, hash } : undefined;
}

/** The documents of a snapshot's content, frozen; undefined when it is not the expected shape. */
function snapshotDocs(content: string): DataDoc[] | undefined {
  let pairs: unknown;
  try {
    pairs = JSON.parse(content);
  } catch {
    return undefined;
  }
  if (!Array.isArray(pairs)) return undefined;
  const docs: DataDoc[] = [];
  for (const p of pairs) {
    if (!Array.isArray(p) || p.length !== 2 || typeof p[0] !== "string") return undefined;
    const data = p[1];
    if (data === null || typeof data !== "object" || typeof data.kind !== "string") {
      return undefined;
    }
    docs.push({ file: p[0], kind: data.kind, data });
  }
  for (const d of docs) deepFreeze(d.data);
  return docs;
}

/**
 * The bibliography of validated documents, by id.
 *
 * @param docs the documents
 * @returns sources by id
 * @throws {RegistryError} for a repeated source id or no bibliography
 */
export function collectSources(docs: readonly DataDoc[]): Map<string, Source> {
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

/**
 * The content hash: SHA-256 over the canonical JSON of `[file, content]` pairs in path order.
 *
 * @param docs the documents
 * @returns the hash, hex
 */
export function contentHash(docs: readonly DataDoc[]): string {
  return sha256OfText([canonicalJson(docs.map((d) => [d.file, d.data]))]);
}

/** Full validation of YAML texts (registered by `load.ts`). */
export type FullValidation = (files: string[], texts: string[]) => DataDoc[];

let fullValidation: FullValidation | undefined;

/**
 * Register the full validator (called by `load.ts` when it is evaluated).
 *
 * @param fn the validator
 */
export function registerFullValidation(fn: FullValidation): void {
  fullValidation = fn;
}

/**
 * Whether the full validator (yaml and zod, `load.ts`) is loaded.
 *
 * @returns true once `load.ts` was imported
 */
export function fullValidationLoaded(): boolean {
  return fullValidation !== undefined;
}

function needFull(): FullValidation {
  if (fullValidation) return fullValidation;
  throw new RegistryError(
    SNAPSHOT_FILE,
    "(file)",
    "(root)",
    "stale or absent, and the full validator is not loaded: import lib/registry/load.ts, or " +
      "call loadRegistryAsync",
  );
}

/** What a first look at a data folder found, kept for the next load of the same folder. */
interface Primed {
  readonly href: string;
  readonly read: DataSources;
  /** The fresh snapshot's content, or undefined when it is stale, absent or damaged. */
  readonly snap: SnapshotContent | undefined;
}

/** What {@link snapshotFresh} or {@link primeSnapshot} found (used once, by the next load). */
let primed: Primed | undefined;

function takePrimed(base: URL): Primed | undefined {
  const p = primed;
  primed = undefined;
  return p?.href === base.href ? p : undefined;
}

/**
 * Whether a data folder's snapshot was built from exactly its YAML bytes (the quick path).
 *
 * @param dir the data folder (path or file URL)
 * @returns true when {@link loadRegistry} would use the snapshot
 */
export function snapshotFresh(dir: string | URL): boolean {
  const base = toDirUrl(dir);
  const read = readSources(base);
  const snap = readSnapshot(base, read.rawHash);
  primed = { href: base.href, read, snap };
  return snap !== undefined;
}

async function sha256Native(data: Uint8Array<ArrayBuffer>): Promise<string> {
  const d = new Uint8Array(await crypto.subtle.digest("SHA-256", data));
  let s = "";
  for (let i = 0; i < d.length; i++) s += d[i].toString(16).padStart(2, "0");
  return s;
}

/**
 * {@link snapshotFresh}, hashing with the Web Crypto API (native SHA-256, the same digests): the
 * default registry is primed this way when `lib/registry/mod.ts` is first imported, so that the
 * synchronous first load only parses the snapshot.
 *
 * @param dir the data folder (path or file URL)
 * @returns true when the next {@link loadRegistry} of that folder will use the snapshot
 *
 * @example
 * ```ts
 * import { loadRegistry, primeSnapshot } from "./load_snapshot.ts";
 * const dir = new URL("../../data/", import.meta.url);
 * if (!(await primeSnapshot(dir))) throw new Error("stale snapshot");
 * if (!loadRegistry(dir).fromSnapshot) throw new Error("snapshot not used");
 * ```
 */
export async function primeSnapshot(dir: string | URL): Promise<boolean> {
  const base = toDirUrl(dir);
  const { files, bytes, message } = readRaw(base);
  // Each digest runs off the main thread while the main thread reads the snapshot, then parses
  // its content; the documents are kept only when both digests match.
  const rawDigest = sha256Native(message);
  rawDigest.catch(() => {}); // awaited below; a failure surfaces there
  const file = readSnapshotFile(base);
  const split = file === undefined ? undefined : snapshotSplit(file.text);
  const read: DataSources = { files, bytes, rawHash: await rawDigest };
  let snap: SnapshotContent | undefined;
  if (split && split.rawHash === read.rawHash) {
    // The content's UTF-8 bytes: a slice of the file's (the head and the tail are ASCII).
    const contentBytes = file!.bytes
      ? file!.bytes.subarray(split.start, file!.bytes.length - (file!.text.length - split.end))
      : new TextEncoder().encode(split.content);
    const contentDigest = sha256Native(contentBytes);
    contentDigest.catch(() => {});
    const docs = snapshotDocs(split.content);
    const hash = await contentDigest;
    if (hash === split.recorded) {
      snap = { content: split.content, hash, ...(docs ? { docs } : {}) };
    }
  }
  primed = { href: base.href, read, snap };
  return snap !== undefined;
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
 * it stale and the loader validates in full (the validator in `load.ts`, which
 * `lib/registry/mod.ts` imports on start when the bundled snapshot is stale; for another folder
 * import `load.ts` or use {@link loadRegistryAsync}). The content hash is recomputed from the
 * documents either way.
 *
 * The hash is SHA-256 (FIPS 180-4) over the canonical JSON (sorted keys) of `[file, content]`
 * pairs in path order: it is the same on every machine for the same data.
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
  const p = takePrimed(base);
  const read = p?.read ?? readSources(base);
  const snap = options?.snapshot === false
    ? undefined
    : p
    ? p.snap
    : readSnapshot(base, read.rawHash);
  const fromSnap = snap ? snap.docs ?? snapshotDocs(snap.content) : undefined;
  const docs: DataDoc[] = fromSnap ?? needFull()(read.files, sourceTexts(read));
  const sources = collectSources(docs);
  // From the snapshot, the hash is that of the very text the documents were parsed from.
  const hash = fromSnap ? snap!.hash : contentHash(docs);
  if (!fromSnap) { for (const d of docs) if (!Object.isFrozen(d.data)) deepFreeze(d.data); }
  return Object.freeze({
    dir: base.href,
    docs: Object.freeze(docs),
    sources,
    hash,
    fromSnapshot: fromSnap !== undefined,
  });
}

/**
 * {@link loadRegistry}, first importing the full validator if it is not loaded yet (so that a
 * stale or absent snapshot is validated in full instead of refused).
 *
 * @param dir the data folder (path or file URL)
 * @param options snapshot use
 * @returns the validated registry data
 *
 * @example
 * ```ts
 * import { loadRegistryAsync } from "./load_snapshot.ts";
 * const reg = await loadRegistryAsync(new URL("../../data/", import.meta.url), { snapshot: false });
 * if (reg.fromSnapshot) throw new Error("validated in full");
 * ```
 */
export async function loadRegistryAsync(
  dir: string | URL,
  options?: LoadOptions,
): Promise<LoadedRegistry> {
  if (!fullValidation) await import("./load.ts");
  return loadRegistry(dir, options);
}

/**
 * Build the validated snapshot of a data folder: full validation, then the validated
 * documents as JSON with the SHA-256 of the YAML bytes they came from and the content hash.
 * Needs the full validator (import `load.ts`).
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
  const read = readSources(base);
  const docs = needFull()(read.files, sourceTexts(read));
  const content = canonicalJson(docs.map((d) => [d.file, d.data]));
  const hash = sha256OfText([content]);
  return `{"version":${SNAPSHOT_VERSION},"rawHash":"${read.rawHash}","hash":"${hash}",` +
    `"content":${content}}\n`;
}
