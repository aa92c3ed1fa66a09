/**
 * Registry queries for fittings: registry.fitting(), registry.fittings(), registry.fittingIds().
 *
 * @module
 */
import { NotFoundError } from "../errors.ts";
import type { LoadedRegistry } from "./load.ts";
import { nearest } from "./nearest.ts";
import type { Fitting } from "./schemas/fittings.ts";

/** The fitting queries merged into `registry`. */
export interface FittingQueries {
  /**
   * A fitting by id (`elbow-90`) or alias (`straight`), case-insensitive; NotFoundError listing
   * the nearest ids otherwise.
   */
  fitting(id: string): Fitting;
  /** Every fitting of data/fittings.yaml, in file order. */
  fittings(): readonly Fitting[];
  /** Every fitting id (without aliases), in file order. */
  fittingIds(): string[];
}

/**
 * Queries over the fittings data (kind `fittings`), bound to one loaded registry.
 *
 * @param loaded the loaded registry
 * @returns `fitting(idOrAlias)`, `fittings()`, `fittingIds()`
 *
 * @example
 * ```ts
 * import { loadRegistry } from "./load.ts";
 * import { fittingQueries } from "./q_fittings.ts";
 * const q = fittingQueries(loadRegistry(new URL("../../data/", import.meta.url)));
 * if (q.fitting("elbow-90").straightRun.upstream.diameters !== 10) throw new Error();
 * if (q.fitting("straight").id !== "none") throw new Error("alias");
 * ```
 */
export function fittingQueries(loaded: LoadedRegistry): FittingQueries {
  const list: Fitting[] = [];
  for (const d of loaded.docs) if (d.kind === "fittings") list.push(...d.data.fittings);
  const byName = new Map<string, Fitting>();
  for (const f of list) {
    byName.set(f.id, f);
    for (const a of f.aliases ?? []) byName.set(a, f);
  }
  return {
    /**
     * A fitting by id or alias; NotFoundError listing the nearest ids otherwise.
     *
     * @param id fitting id such as `elbow-90`, or an alias such as `straight`
     * @returns the fitting entry
     */
    fitting(id: string): Fitting {
      const f = byName.get(String(id).trim().toLowerCase());
      if (!f) throw new NotFoundError("fitting", id, nearest(String(id), [...byName.keys()]));
      return f;
    },
    /** Every fitting, in file order. */
    fittings(): readonly Fitting[] {
      return list;
    },
    /** Every fitting id (without aliases). */
    fittingIds(): string[] {
      return list.map((f) => f.id);
    },
  };
}
