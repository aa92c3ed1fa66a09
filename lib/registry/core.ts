/**
 * Core queries over the loaded registry: sources, documents by kind, coefficient sets,
 * verification tables and generic tables.
 *
 * @module
 */
import { NotFoundError } from "../errors.ts";
import type { DataDoc, LoadedRegistry } from "./load.ts";
import type { SourceEntry as Source } from "./schemas/sources.ts";
import { nearest } from "./nearest.ts";

/** Core queries: hash, sources, documents by kind, coefficient sets, tables. */
export interface CoreQueries {
  /** SHA-256 of the canonical serialisation of the data. */
  readonly hash: string;
  /** The loaded data, for advanced use. */
  readonly loaded: LoadedRegistry;
  /** A bibliography entry by id. */
  source(id: string): Source;
  /** Every bibliography entry. */
  sources(): Source[];
  /** Every data file of a kind. */
  documents(kind: string): readonly DataDoc[];
  /** A coefficient set by id (data files of kind `coefficients`). */
  // deno-lint-ignore no-explicit-any
  coefficients(id: string): any;
  /** A published verification table by id (kind `verification`). */
  // deno-lint-ignore no-explicit-any
  verification(id: string): any;
  /** Every published verification table. */
  // deno-lint-ignore no-explicit-any
  verificationTables(): any[];
  /** A generic sourced table by id (kind `table`). */
  // deno-lint-ignore no-explicit-any
  table(id: string): any;
}

/**
 * Core queries bound to one loaded registry.
 *
 * @param loaded the loaded registry
 * @returns query functions
 *
 * @example
 * ```ts
 * import { loadRegistry } from "./load.ts";
 * import { coreQueries } from "./core.ts";
 * const q = coreQueries(loadRegistry(new URL("../../data/", import.meta.url)));
 * if (q.sources().length === 0) throw new Error("sources");
 * ```
 */
export function coreQueries(loaded: LoadedRegistry): CoreQueries {
  const byKind = new Map<string, DataDoc[]>();
  for (const d of loaded.docs) {
    const list = byKind.get(d.kind) ?? [];
    list.push(d);
    byKind.set(d.kind, list);
  }
  const byId = (kind: string, id: string, field: string): DataDoc => {
    const list = byKind.get(kind) ?? [];
    const d = list.find((x) => x.data.id === id);
    if (!d) throw new NotFoundError(field, id, nearest(id, list.map((x) => x.data.id as string)));
    return d;
  };
  return {
    /** SHA-256 of the canonical serialisation of the data. */
    hash: loaded.hash,
    /** The loaded data, for advanced use. */
    loaded,
    /** A bibliography entry by id. */
    source(id: string): Source {
      const s = loaded.sources.get(id);
      if (!s) throw new NotFoundError("source", id, nearest(id, [...loaded.sources.keys()]));
      return s;
    },
    /** Every bibliography entry. */
    sources(): Source[] {
      return [...loaded.sources.values()];
    },
    /** Every data file of a kind. */
    documents(kind: string): readonly DataDoc[] {
      return byKind.get(kind) ?? [];
    },
    /** A coefficient set by id (data files of kind `coefficients`). */
    // deno-lint-ignore no-explicit-any
    coefficients(id: string): any {
      return byId("coefficients", id, "coefficient set").data;
    },
    /** A published verification table by id (kind `verification`). */
    // deno-lint-ignore no-explicit-any
    verification(id: string): any {
      return byId("verification", id, "verification table").data;
    },
    /** Every published verification table. */
    // deno-lint-ignore no-explicit-any
    verificationTables(): any[] {
      return (byKind.get("verification") ?? []).map((d) => d.data);
    },
    /** A generic sourced table by id (kind `table`). */
    // deno-lint-ignore no-explicit-any
    table(id: string): any {
      return byId("table", id, "table").data;
    },
  };
}
