/**
 * Shared command-line conventions for every script: `--help`, `--json`, `--debug`, one-line
 * errors on stderr, exit 2 for bad input, 1 for no physical answer, 0 for success.
 *
 * @module
 */
import { type ArgSpec, ArgumentError, readArgs } from "./_args.ts";
import { InputError, SnellpathError } from "../lib/errors.ts";
import { absolutePressureNote, type Dimension, parseQuantity, SI_UNIT } from "../lib/units.ts";

/** Option spec: type, short letter, whether it repeats, by long name (./_args.ts). */
export type OptionSpec = ArgSpec;

/** Options every script accepts. */
export const COMMON_OPTIONS: OptionSpec = {
  help: { type: "boolean", short: "h" },
  json: { type: "boolean" },
  debug: { type: "boolean" },
};

/**
 * Parse arguments strictly; print help and exit 0 on `--help`. A single leading `--` is dropped:
 * `deno task NAME -- ARGS` hands the separator on to the script.
 *
 * @param args the arguments (Deno.args)
 * @param options the script's options (the common ones are added)
 * @param help the help text
 * @returns parsed values and positionals
 */
export function parseCli(
  args: string[],
  options: OptionSpec,
  help: string,
): { values: Record<string, string | boolean | string[] | undefined>; positionals: string[] } {
  let parsed;
  const all = { ...COMMON_OPTIONS, ...options };
  try {
    parsed = readArgs(joinNegativeValues(args[0] === "--" ? args.slice(1) : args, all), all);
  } catch (e) {
    if (!(e instanceof ArgumentError)) throw e;
    throw new InputError("arguments", e.message, "the options listed by --help");
  }
  if (parsed.values.help) {
    console.log(help.trim());
    Deno.exit(0);
  }
  return parsed as {
    values: Record<string, string | boolean | string[] | undefined>;
    positionals: string[];
  };
}

/**
 * Join a string option and a following negative number into one `--name=value` argument, so
 * that `--temperature "-5 degC"` is read as a value and not as a flag (node:util parseArgs
 * refuses a value that starts with a dash).
 *
 * @param args the arguments
 * @param options the option spec
 * @returns the arguments with such pairs joined
 *
 * @example
 * ```ts
 * import { joinNegativeValues } from "./_cli.ts";
 * const a = joinNegativeValues(["--temperature", "-5 degC", "-h"], {
 *   temperature: { type: "string" }, help: { type: "boolean", short: "h" } });
 * if (a.length !== 2 || a[0] !== "--temperature=-5 degC") throw new Error(a.join("|"));
 * ```
 */
export function joinNegativeValues(args: readonly string[], options: OptionSpec): string[] {
  const out: string[] = [];
  for (let i = 0; i < args.length; i++) {
    const m = /^--([A-Za-z][\w-]*)$/.exec(args[i]);
    const next = args[i + 1];
    if (
      m && options[m[1]]?.type === "string" && next !== undefined &&
      /^-\s*(\d|\.\d|inf|nan)/i.test(next)
    ) {
      out.push(`${args[i]}=${next}`);
      i++;
    } else out.push(args[i]);
  }
  return out;
}

/**
 * Run a script's main function: catch every error at the edge and print one line.
 * Exit 2 for bad input, 1 for no physical answer or an internal fault, 0 on success.
 * `--debug` prints the stack as well.
 *
 * @param main the script body; returns an exit code or nothing for 0
 */
export async function runMain(main: () => Promise<number | void> | number | void): Promise<void> {
  const debug = Deno.args.includes("--debug");
  let code = 0;
  try {
    code = (await main()) ?? 0;
  } catch (e) {
    if (e instanceof SnellpathError) {
      console.error(`error: ${e.message}`);
      code = e.exitCode;
    } else if (e instanceof Deno.errors.NotFound) {
      console.error(`error: ${firstLine(e)}`);
      code = 2;
    } else if (e instanceof Deno.errors.NotCapable || e instanceof Deno.errors.PermissionDenied) {
      console.error(`error: ${permissionHint(firstLine(e))}`);
      code = 2;
    } else {
      console.error(`error: internal fault: ${firstLine(e)} (run with --debug for details)`);
      code = 1;
    }
    if (debug && e instanceof Error) console.error(e.stack);
  }
  Deno.exit(code);
}

/**
 * One line for a denied permission: what was denied, which flag grants it and how.
 *
 * @param message Deno's message, e.g. `Requires read access to "/x/site.yaml", run again with
 *   the --allow-read flag`
 * @returns the line to print, naming the flag and the fix
 * @example
 * ```ts
 * import { permissionHint } from "./_cli.ts";
 * const m = permissionHint('Requires read access to "/srv/a.yaml", run again with the --allow-read flag');
 * if (!m.includes("--allow-read=/srv/a.yaml")) throw new Error(m);
 * ```
 */
export function permissionHint(message: string): string {
  const m = /Requires (read|write|net|env|run) access to "?([^",]+)"?/.exec(message);
  if (!m) return `not permitted: ${message}`;
  const [, kind, what] = m;
  const flag = `--allow-${kind}`;
  const task = kind === "write"
    ? "the tasks write only below out/: choose --out inside out/, or"
    : "the plan and reconcile tasks grant it; with deno run,";
  return `not permitted: ${kind} access to ${what} needs ${flag} (${task} add ${flag}=${what})`;
}

function firstLine(e: unknown): string {
  return (e instanceof Error ? e.message : String(e)).split("\n")[0];
}

/**
 * Read a required string option or throw an {@link InputError} naming it.
 *
 * @param values parsed values
 * @param name option name without dashes
 * @param accepted what is accepted, for the message
 * @returns the option's value
 */
export function requireOption(
  values: Record<string, unknown>,
  name: string,
  accepted: string,
): string {
  const v = values[name];
  if (typeof v !== "string" || v.trim() === "") {
    throw new InputError(`--${name}`, v === undefined ? "nothing" : JSON.stringify(v), accepted);
  }
  return v;
}

/**
 * Options that each take one string value (unit strings, ids, lists).
 *
 * @param names option names without dashes
 * @returns the option spec for {@link parseCli}
 */
export function stringOptions(...names: string[]): OptionSpec {
  return Object.fromEntries(names.map((n) => [n, { type: "string" as const }]));
}

/**
 * Read a required quantity option that must be > 0, in SI, or throw an {@link InputError}
 * naming it.
 *
 * @param values parsed values
 * @param name option name without dashes
 * @param dimension the dimension the option expects
 * @param example a value to show in the message, for example "200 mm"
 * @returns the value in SI units
 */
export function requirePositiveQuantity(
  values: Record<string, unknown>,
  name: string,
  dimension: Dimension,
  example: string,
): number {
  const what = dimension.replace(/[A-Z]/g, (c) => " " + c.toLowerCase());
  const text = requireOption(values, name, `a ${what} such as "${example}"`);
  const x = parseQuantity(text, dimension, `--${name}`);
  if (!(x > 0)) throw new InputError(`--${name}`, String(values[name]), `a ${what} > 0`);
  return x;
}

/**
 * Read an optional quantity option in SI, or give the fallback when it is absent.
 *
 * @param values parsed values
 * @param name option name without dashes
 * @param dimension the dimension the option expects
 * @param fallback the value (SI) when the option is not given
 * @returns the value in SI units
 */
export function optionalQuantity(
  values: Record<string, unknown>,
  name: string,
  dimension: Dimension,
  fallback: number,
): number {
  const v = values[name];
  if (typeof v !== "string") return fallback;
  const x = parseQuantity(v, dimension, `--${name}`);
  const note = dimension === "pressure" ? absolutePressureNote(v) : undefined;
  if (note) console.error(`note: --${name}: ${note}`);
  return x;
}

/**
 * One line echoing the quantity options as the user wrote them, each beside its SI value
 * (`as given: --temperature 68 degF = 293.15 K, --pressure 30 psig = 308168 Pa`), SI units
 * written m³/s, m²/s; lines within 100 columns (continuations indented); empty when none was
 * given.
 *
 * @param values parsed values
 * @param specs option names without dashes and their dimensions
 * @returns the line, or "" when no listed option was given
 *
 * @example
 * ```ts
 * import { givenLine } from "./_cli.ts";
 * const l = givenLine({ temperature: "68 degF" }, [["temperature", "temperature"]]);
 * if (l !== "as given: --temperature 68 degF = 293.15 K") throw new Error(l);
 * ```
 */
export function givenLine(
  values: Record<string, unknown>,
  specs: readonly (readonly [string, Dimension])[],
): string {
  const parts: string[] = [];
  for (const [name, dim] of specs) {
    const v = values[name];
    if (typeof v !== "string") continue;
    const x = parseQuantity(v, dim, `--${name}`);
    const unit = dim === "temperature" ? "K" : dim === "temperatureDifference" ? "K" : SI_UNIT[dim];
    const shown = unit.replace(/\^2/g, "²").replace(/\^3/g, "³");
    parts.push(`--${name} ${v.trim()} = ${Number(x.toPrecision(6))}${shown ? " " + shown : ""}`);
  }
  if (!parts.length) return "";
  // within 100 columns: continuation lines under the first part
  const lines = [`as given: ${parts[0]}`];
  for (const part of parts.slice(1)) {
    const last = lines[lines.length - 1];
    if (last.length + 2 + part.length > 100) {
      lines[lines.length - 1] += ",";
      lines.push(`          ${part}`);
    } else lines[lines.length - 1] = `${last}, ${part}`;
  }
  return lines.join("\n");
}
