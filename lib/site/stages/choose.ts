/**
 * Which mounting a plan's budget is for (common practice), shared by the straight-run stage (a
 * provisional choice before any budget) and the budget stage.
 *
 * @module
 */
import { InputError } from "../../errors.ts";
import type { MountingPlan } from "../plan.ts";

/**
 * The mounting the budget is for (common practice): among mountings whose signal is not weak and
 * whose wall-borne signal does not overlap, those resolvable at minimum flow (else all usable
 * ones) whose worst expanded uncertainty is within 5 % of the lowest; of these, an even traverse
 * count first (both transducers on one side, and the two bore crossings cancel a transverse flow
 * component), then the fewest traverses (the strongest signal). If none is usable, the first given.
 *
 * @param plans the mountings planned, with `expandedByPoint` (empty before the budget: all tie)
 * @returns one of `plans`
 * @throws {InputError} when no mounting is given
 * @example
 * ```ts
 * import { chooseMounting } from "./choose.ts";
 * const m = (traverses: number) => ({
 *   traverses, signal: { rating: "good" }, wallBorne: { overlaps: false },
 *   resolvableAtMinimum: true, expandedByPoint: [],
 * }) as unknown as Parameters<typeof chooseMounting>[0][number];
 * // all equal before the budget: V (2 traverses) before Z (1) and W (4)
 * if (chooseMounting([m(1), m(2), m(4)]).traverses !== 2) throw new Error();
 * ```
 */
export function chooseMounting<T extends MountingPlan>(plans: readonly T[]): T {
  if (plans.length === 0) throw new InputError("mountings", "none", "at least one traverse count");
  const usable = plans.filter((m) => m.signal.rating !== "weak" && !m.wallBorne.overlaps);
  if (usable.length === 0) return plans[0];
  const resolvable = usable.filter((m) => m.resolvableAtMinimum);
  const pool = resolvable.length ? resolvable : usable;
  const worst = (m: T) => (m.expandedByPoint.length ? Math.max(...m.expandedByPoint) : 0);
  const lowest = Math.min(...pool.map(worst));
  const good = pool.filter((m) => worst(m) <= lowest * 1.05);
  return [...good].sort((a, b) =>
    (a.traverses % 2) - (b.traverses % 2) || a.traverses - b.traverses
  )[0];
}
