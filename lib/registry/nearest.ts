/**
 * Suggestions for near misses: the candidates closest to what was asked for.
 *
 * @module
 */

/**
 * Levenshtein edit distance between two strings.
 *
 * @param a first string
 * @param b second string
 * @returns the number of single-character edits
 *
 * @example
 * ```ts
 * import { editDistance } from "./nearest.ts";
 * if (editDistance("kitten", "sitting") !== 3) throw new Error();
 * ```
 */
export function editDistance(a: string, b: string): number {
  const prev = new Array<number>(b.length + 1);
  for (let j = 0; j <= b.length; j++) prev[j] = j;
  for (let i = 1; i <= a.length; i++) {
    let diag = prev[0];
    prev[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const tmp = prev[j];
      prev[j] = Math.min(prev[j] + 1, prev[j - 1] + 1, diag + (a[i - 1] === b[j - 1] ? 0 : 1));
      diag = tmp;
    }
  }
  return prev[b.length];
}

/**
 * The candidates nearest to `wanted`, best first (case-insensitive): those that start with it,
 * then those that contain it or share a hyphen-separated word with it (its family: `steel` →
 * `carbon-steel`, `stainless-steel-316`; `tee` → `tee-branch`, `tee-through`), then the rest by
 * Levenshtein edit distance.
 *
 * @param wanted what was asked for
 * @param candidates what exists
 * @param count how many to return (default 5; more when more share the word, up to 8)
 * @returns up to `count` candidates (or up to 8 members of the family)
 *
 * @example
 * ```ts
 * import { nearest } from "./nearest.ts";
 * if (nearest("carbon-stel", ["pvc", "carbon-steel"])[0] !== "carbon-steel") throw new Error();
 * const t = nearest("tee", ["elbow-90", "tee-branch", "reducer", "tee-through"]);
 * if (t[0] !== "tee-branch" || t[1] !== "tee-through") throw new Error(t.join());
 * ```
 */
export function nearest(wanted: string, candidates: readonly string[], count = 5): string[] {
  const w = wanted.toLowerCase().trim();
  const words = new Set(w.split(/[-_\s]+/).filter((x) => x.length >= 3));
  const tier = (c: string) => {
    const l = c.toLowerCase();
    if (w.length >= 2 && l.startsWith(w)) return 0;
    if (w.length >= 3 && l.includes(w)) return 1;
    if (l.split(/[-_\s]+/).some((x) => words.has(x))) return 2;
    return 3;
  };
  const ranked = [...new Set(candidates)]
    .map((c) => ({ c, t: tier(c), d: editDistance(w, c.toLowerCase()) }))
    .sort((x, y) => x.t - y.t || x.d - y.d || x.c.localeCompare(y.c));
  const family = ranked.filter((x) => x.t < 3).length;
  return ranked.slice(0, Math.max(count, Math.min(family, 8))).map((x) => x.c);
}
