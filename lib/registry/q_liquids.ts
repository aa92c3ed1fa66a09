/**
 * Registry queries for liquids: registry.liquid(), registry.liquids().
 *
 * @module
 */
import { NotFoundError } from "../errors.ts";
import type { LoadedRegistry } from "./load.ts";
import { nearest } from "./nearest.ts";
import type { LiquidEntry } from "./schemas/liquids.ts";

/** The liquid queries merged into `registry`. */
export interface LiquidQueries {
  /** A liquid of data/liquids.yaml by id; NotFoundError listing the nearest ids otherwise. */
  liquid(id: string): LiquidEntry;
  /** Every liquid of data/liquids.yaml, in file order. */
  liquids(): readonly LiquidEntry[];
}

/**
 * Queries over the liquids data (data/liquids.yaml), bound to one loaded registry. Water and
 * seawater are computed by formulations (lib/water, lib/liquids) and are not entries here.
 *
 * @param loaded the loaded registry
 * @returns `liquid(id)` (NotFoundError with the nearest ids when unknown) and `liquids()`
 *
 * @example
 * ```ts
 * import { loadRegistry } from "./load.ts";
 * import { liquidQueries } from "./q_liquids.ts";
 * const q = liquidQueries(loadRegistry(new URL("../../data/", import.meta.url)));
 * if (q.liquid("methanol").name !== "Methanol") throw new Error();
 * if (q.liquids().length < 10) throw new Error();
 * ```
 */
export function liquidQueries(loaded: LoadedRegistry): LiquidQueries {
  const all: LiquidEntry[] = [];
  for (const d of loaded.docs) {
    if (d.kind === "liquids") all.push(...(d.data.liquids as LiquidEntry[]));
  }
  const byId = new Map(all.map((l) => [l.id, l]));
  return {
    /** A liquid of data/liquids.yaml by id. */
    liquid(id: string): LiquidEntry {
      const l = byId.get(id);
      if (!l) throw new NotFoundError("liquid", id, nearest(id, [...byId.keys()]));
      return l;
    },
    /** Every liquid of data/liquids.yaml. */
    liquids(): readonly LiquidEntry[] {
      return all;
    },
  };
}
