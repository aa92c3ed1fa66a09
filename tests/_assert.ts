/**
 * Small assertions on top of node:assert/strict (JSR's @std/assert is unreachable here).
 *
 * @module
 */
import assert from "node:assert/strict";
import { InputError } from "../lib/errors.ts";
export { assert };
/** Strict equality. */
export const equal: typeof assert.equal = assert.equal;
/** Deep strict equality. */
export const deepEqual: typeof assert.deepEqual = assert.deepEqual;
/** Truthiness (a type assertion). */
export const ok: typeof assert.ok = assert.ok;
/** The function throws (optionally an error matching the validator). */
export const throws: typeof assert.throws = assert.throws;
/** The promise rejects. */
export const rejects: typeof assert.rejects = assert.rejects;
/** Strict inequality. */
export const notEqual: typeof assert.notEqual = assert.notEqual;
/** The string matches the pattern. */
export const match: typeof assert.match = assert.match;

/**
 * Assert |actual − expected| ≤ tol·|expected| (relative) and return the relative difference.
 *
 * @param actual computed value
 * @param expected reference value
 * @param relTol relative tolerance
 * @param what label for the message
 * @returns the relative difference
 */
export function closeRel(actual: number, expected: number, relTol: number, what = ""): number {
  assert.ok(Number.isFinite(actual), `${what}: computed ${actual} is not finite`);
  const rel = expected === 0 ? Math.abs(actual) : Math.abs(actual - expected) / Math.abs(expected);
  assert.ok(
    rel <= relTol,
    `${what}: computed ${actual}, expected ${expected}, relative difference ${
      rel.toExponential(3)
    } > ${relTol}`,
  );
  return rel;
}

/**
 * Assert |actual − expected| ≤ tol (absolute).
 *
 * @param actual computed value
 * @param expected reference value
 * @param absTol absolute tolerance
 * @param what label for the message
 */
export function closeAbs(actual: number, expected: number, absTol: number, what = ""): void {
  assert.ok(Number.isFinite(actual), `${what}: computed ${actual} is not finite`);
  assert.ok(
    Math.abs(actual - expected) <= absTol,
    `${what}: computed ${actual}, expected ${expected}, difference ${
      Math.abs(actual - expected)
    } > ${absTol}`,
  );
}

/**
 * The InputError a promise rejects with; fails when it resolves or rejects with something else.
 *
 * @param p the promise
 * @returns the error, for checks on its message
 */
export async function refusal(p: Promise<unknown>): Promise<InputError> {
  try {
    await p;
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error("accepted, expected a refusal");
}
