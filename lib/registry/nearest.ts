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
 * The candidates nearest to `wanted` by edit distance (case-insensitive), best first.
 *
 * @param wanted what was asked for
 * @param candidates what exists
 * @param count how many to return (default 5)
 * @returns up to `count` candidates
 *
 * @example
 * ```ts
 * import { nearest } from "./nearest.ts";
 * if (nearest("carbon-stel", ["pvc", "carbon-steel"])[0] !== "carbon-steel") throw new Error();
 * ```
 */
export function nearest(wanted: string, candidates: readonly string[], count = 5): string[] {
  const w = wanted.toLowerCase();
  return [...new Set(candidates)]
    .map((c) => ({ c, d: editDistance(w, c.toLowerCase()) }))
    .sort((x, y) => x.d - y.d || x.c.localeCompare(y.c))
    .slice(0, count)
    .map((x) => x.c);
}
