/**
 * Named errors and warnings shared by every module.
 *
 * Exit codes follow the project rule: 2 for bad input, 1 when a valid input has no
 * physical answer (for example a beam beyond a critical angle), 0 otherwise.
 *
 * @module
 */

/** Exit code carried by an error: 2 bad input, 1 no physical answer. */
export type ExitCode = 1 | 2;

/**
 * Base class of every error snellpath throws on purpose.
 *
 * @example
 * ```ts
 * import { SnellpathError } from "./errors.ts";
 * const e = new SnellpathError("bad", 2);
 * if (e.exitCode !== 2) throw new Error("exit code");
 * ```
 */
export class SnellpathError extends Error {
  /** Process exit code a script should use for this error. */
  readonly exitCode: ExitCode;
  /**
   * Create the error.
   *
   * @param message one-line message: which input, what was given, what is accepted
   * @param exitCode 2 for bad input, 1 for no physical answer
   */
  constructor(message: string, exitCode: ExitCode = 2) {
    super(message);
    this.name = "SnellpathError";
    this.exitCode = exitCode;
  }
}

/**
 * Bad input: names the field, what was given and what is accepted. Exit code 2.
 *
 * @example
 * ```ts
 * import { InputError } from "./errors.ts";
 * const e = new InputError("temperature", "12 m", "a temperature such as 12 degC");
 * if (!e.message.includes("temperature")) throw new Error("message");
 * ```
 */
export class InputError extends SnellpathError {
  /** Name of the offending input (option, key path or parameter). */
  readonly field: string;
  /** What was given, as text. */
  readonly given: string;
  /** What is accepted, as text. */
  readonly accepted: string;
  /**
   * Create the error.
   *
   * @param field the input's name
   * @param given what was given
   * @param accepted what is accepted
   */
  constructor(field: string, given: string, accepted: string) {
    super(`${field}: got ${given}; expected ${accepted}`, 2);
    this.name = "InputError";
    this.field = field;
    this.given = given;
    this.accepted = accepted;
  }
}

/**
 * A unit string with the wrong dimension or an unknown unit. Exit code 2.
 *
 * @example
 * ```ts
 * import { UnitError } from "./errors.ts";
 * const e = new UnitError("temperature", "12 m", "temperature (degC, degF, K)");
 * if (e.exitCode !== 2) throw new Error("exit");
 * ```
 */
export class UnitError extends InputError {
  /**
   * Create the error.
   *
   * @param field the input's name
   * @param given the text given
   * @param accepted the accepted dimension and units
   */
  constructor(field: string, given: string, accepted: string) {
    super(field, given, accepted);
    this.name = "UnitError";
  }
}

/**
 * A lookup that found nothing; the message lists what exists nearby. Exit code 2.
 *
 * @example
 * ```ts
 * import { NotFoundError } from "./errors.ts";
 * const e = new NotFoundError("nps", "7", ["6", "8"]);
 * if (!e.message.includes("6, 8")) throw new Error("nearby");
 * ```
 */
export class NotFoundError extends InputError {
  /** Nearby candidates that do exist. */
  readonly nearby: readonly string[];
  /**
   * Create the error.
   *
   * @param field the input's name
   * @param given what was asked for
   * @param nearby what exists nearby
   */
  constructor(field: string, given: string, nearby: readonly string[]) {
    super(
      field,
      JSON.stringify(given),
      nearby.length ? `one of: ${nearby.join(", ")}` : "an entry that exists in the registry",
    );
    this.name = "NotFoundError";
    this.nearby = nearby;
  }
}

/**
 * A formulation asked for outside its validity range. Exit code 2.
 *
 * @example
 * ```ts
 * import { OutOfRangeError } from "./errors.ts";
 * const e = new OutOfRangeError("temperature", 423.15, [273.15, 368.15], "K", "Del Grosso-Mader 1972");
 * if (e.range[1] !== 368.15) throw new Error("range");
 * ```
 */
export class OutOfRangeError extends SnellpathError {
  /** The quantity checked. */
  readonly quantity: string;
  /** The value given, in SI units. */
  readonly value: number;
  /** The validity range [min, max], in SI units. */
  readonly range: readonly [number, number];
  /** SI unit of value and range. */
  readonly unit: string;
  /** The formulation whose range was exceeded. */
  readonly formulation: string;
  /**
   * Create the error.
   *
   * @param quantity the quantity checked
   * @param value the value, SI
   * @param range the validity range, SI
   * @param unit the SI unit
   * @param formulation the formulation's name
   */
  constructor(
    quantity: string,
    value: number,
    range: readonly [number, number],
    unit: string,
    formulation: string,
  ) {
    super(
      `${quantity}: ${fmt(value)} ${unit} is outside the validity range ` +
        `${fmt(range[0])}–${fmt(range[1])} ${unit} of ${formulation}`,
      2,
    );
    this.name = "OutOfRangeError";
    this.quantity = quantity;
    this.value = value;
    this.range = range;
    this.unit = unit;
    this.formulation = formulation;
  }
}

/**
 * A valid input with no physical answer (beyond a critical angle, boiling liquid). Exit code 1.
 *
 * @example
 * ```ts
 * import { NoPhysicalAnswerError } from "./errors.ts";
 * const e = new NoPhysicalAnswerError("wedge angle 60 deg is beyond the critical angle 33.4 deg");
 * if (e.exitCode !== 1) throw new Error("exit");
 * ```
 */
export class NoPhysicalAnswerError extends SnellpathError {
  /**
   * Create the error.
   *
   * @param message what has no answer and why
   */
  constructor(message: string) {
    super(message, 1);
    this.name = "NoPhysicalAnswerError";
  }
}

/**
 * Reference data that failed validation: names the file, the entry and the field. Exit code 2.
 *
 * @example
 * ```ts
 * import { RegistryError } from "./errors.ts";
 * const e = new RegistryError("data/materials.yaml", "pvc", "source", "unknown source id 'x'");
 * if (!e.message.startsWith("data/materials.yaml")) throw new Error("message");
 * ```
 */
export class RegistryError extends SnellpathError {
  /** The data file. */
  readonly file: string;
  /** The entry id or index. */
  readonly entry: string;
  /** The field path within the entry. */
  readonly fieldPath: string;
  /**
   * Create the error.
   *
   * @param file data file path
   * @param entry entry id or index
   * @param fieldPath field path
   * @param problem what is wrong
   */
  constructor(file: string, entry: string, fieldPath: string, problem: string) {
    super(`${file}: entry ${entry}, field ${fieldPath}: ${problem}`, 2);
    this.name = "RegistryError";
    this.file = file;
    this.entry = entry;
    this.fieldPath = fieldPath;
  }
}

/** A warning recorded in a result when the caller opted to go on (for example extrapolation). */
export interface Warning {
  /** Stable short code, for example `extrapolated`. */
  readonly code: string;
  /** One-line human message. */
  readonly message: string;
}

/** Options for functions with a validity range. */
export interface ValidityOptions {
  /** Evaluate outside the validity range instead of throwing; a warning is recorded. */
  readonly extrapolate?: boolean;
  /** Sink that receives warnings (for example extrapolation) when `extrapolate` is set. */
  readonly warnings?: Warning[];
}

/**
 * Check a value against a validity range. Throws {@link OutOfRangeError} unless
 * `options.extrapolate`, in which case a warning is pushed to `options.warnings`.
 * Non-finite values always throw an {@link InputError}.
 *
 * @param quantity quantity name, for messages
 * @param value value in SI units
 * @param range inclusive [min, max] in SI units
 * @param unit SI unit, for messages
 * @param formulation formulation name, for messages
 * @param options extrapolation opt-in and warning sink
 * @returns nothing; throws on a violation
 *
 * @example
 * ```ts
 * import { checkRange } from "./errors.ts";
 * checkRange("temperature", 300, [273.15, 373.15], "K", "demo");
 * const warnings: { code: string; message: string }[] = [];
 * checkRange("temperature", 400, [273.15, 373.15], "K", "demo", { extrapolate: true, warnings });
 * if (warnings.length !== 1) throw new Error("warning expected");
 * ```
 */
export function checkRange(
  quantity: string,
  value: number,
  range: readonly [number, number],
  unit: string,
  formulation: string,
  options?: ValidityOptions,
): void {
  if (!Number.isFinite(value)) {
    throw new InputError(quantity, show(value), `a finite number in ${unit}`);
  }
  if (value >= range[0] && value <= range[1]) return;
  const err = new OutOfRangeError(quantity, value, range, unit, formulation);
  if (!options?.extrapolate) throw err;
  options.warnings?.push({ code: "extrapolated", message: err.message + " (extrapolated)" });
}

/**
 * Require a finite number (and optionally a positive one), else an {@link InputError}.
 *
 * @param field the input's name
 * @param value the value
 * @param unit SI unit, for the message
 * @param positive require value > 0
 * @returns the value
 *
 * @example
 * ```ts
 * import { requireFinite } from "./errors.ts";
 * if (requireFinite("diameter", 0.1, "m", true) !== 0.1) throw new Error("value");
 * ```
 */
export function requireFinite(
  field: string,
  value: number,
  unit: string,
  positive = false,
): number {
  if (typeof value !== "number" || !Number.isFinite(value) || (positive && !(value > 0))) {
    throw new InputError(
      field,
      show(value),
      positive ? `a finite number greater than 0 (${unit})` : `a finite number (${unit})`,
    );
  }
  return value;
}

/** String(v), or a plain description when v's own toString is broken (`{ toString: 1 }`). */
function show(v: unknown): string {
  try {
    return String(v);
  } catch {
    return Array.isArray(v) ? "a list" : `a value of type ${typeof v}`;
  }
}

function fmt(x: number): string {
  return Number.isFinite(x) ? String(Number(x.toPrecision(6))) : String(x);
}
