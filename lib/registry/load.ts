/**
 * The registry loader with full validation: parses every YAML file under data/ (except
 * data/demo/), validates it against the zod schema of its `kind`, checks that every number is
 * covered by a resolvable source and a basis, and refuses duplicate ids. Importing this module
 * registers the validator with the quick path (`load_snapshot.ts`), which uses it whenever the
 * validated snapshot is stale or absent; the exports are those of the quick path, so
 * `loadRegistry` from here always validates in full when it has to.
 *
 * @module
 */
import { parse as parseYaml } from "yaml";
import type { z } from "zod";
import { RegistryError } from "../errors.ts";
import { SCHEMAS } from "./schemas/mod.ts";
import type { SourceEntry as Source } from "./schemas/sources.ts";
import { collectSources, type DataDoc, registerFullValidation } from "./load_snapshot.ts";

export {
  buildSnapshot,
  canonicalJson,
  loadRegistry,
  loadRegistryAsync,
  MAX_DATA_FILE_BYTES,
  SNAPSHOT_FILE,
} from "./load_snapshot.ts";
export type { DataDoc, LoadedRegistry, LoadOptions } from "./load_snapshot.ts";

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

function fullValidation(files: string[], texts: string[]): DataDoc[] {
  const docs = validateAll(files, texts);
  const sources = collectSources(docs);
  for (const d of docs) if (d.kind !== "sources") checkProvenance(d.file, d.data, sources);
  checkDuplicateIds(docs);
  return docs;
}

registerFullValidation(fullValidation);
