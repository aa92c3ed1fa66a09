/**
 * Helpers that turn registry coefficient tables into straight-line polynomial code (used by the
 * TEOS-10 evaluations in gibbs.ts and seawater.ts). Only finite numbers ever reach the generated
 * code.
 *
 * @module
 */
import { RegistryError } from "../errors.ts";

/**
 * A number as a JavaScript literal that reads back to the same double; refuses anything but a
 * finite number (the tables come from the registry, validated or read from the snapshot).
 *
 * @param x the coefficient
 * @returns its literal
 * @throws {RegistryError} for a non-number or a non-finite value
 *
 * @example
 * ```ts
 * import { lit } from "./codegen.ts";
 * if (lit(-0.5) !== "(-0.5)" || Number(lit(0.1)) !== 0.1) throw new Error();
 * ```
 */
export function lit(x: number): string {
  if (typeof x !== "number" || !Number.isFinite(x)) {
    throw new RegistryError(
      "seawater coefficients",
      "(table)",
      "value",
      `not a finite number: ${typeof x}`,
    );
  }
  return x < 0 || Object.is(x, -0) ? `(${x})` : String(x);
}

/**
 * A polynomial as one expression by Estrin's scheme (halves joined by v², v⁴, v⁸, so that the
 * products run side by side instead of in one long Horner chain): `terms` from the highest power
 * down, in the variable v; the generated code defines the powers with {@link powers}.
 *
 * @param terms term expressions, highest power first (at most 16)
 * @param v the variable's name
 * @param where file and entry named when there are too many terms
 * @returns the expression
 *
 * @example
 * ```ts
 * import { polyExpr, powers } from "./codegen.ts";
 * const f = new Function("x", `${powers("x")} return ${polyExpr(["2", "3", "4"], "x")};`);
 * if (f(2) !== 2 * 4 + 3 * 2 + 4) throw new Error();
 * ```
 */
export function polyExpr(
  terms: string[],
  v: string,
  where: { file: string; entry: string } = { file: "data", entry: "(table)" },
): string {
  if (terms.length > 16) {
    throw new RegistryError(
      where.file,
      where.entry,
      "coefficients",
      "more than 16 powers in one sum",
    );
  }
  const power = (m: number): string => (m === 1 ? v : `${v}_${m}`);
  const build = (c: string[]): string => {
    if (c.length === 1) return c[0];
    let m = 1;
    while (2 * m < c.length) m *= 2;
    return `(${build(c.slice(0, m))}) + ${power(m)} * (${build(c.slice(m))})`;
  };
  return build([...terms].reverse());
}

/**
 * Code defining v_2 = v², v_4 = v⁴ and v_8 = v⁸ for {@link polyExpr}.
 *
 * @param v the variable's name
 * @returns the declaration
 */
export function powers(v: string): string {
  return `const ${v}_2 = ${v} * ${v}, ${v}_4 = ${v}_2 * ${v}_2, ${v}_8 = ${v}_4 * ${v}_4;`;
}
