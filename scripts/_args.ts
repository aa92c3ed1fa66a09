/**
 * A strict reader of command-line arguments for the scripts: long options (`--name value`,
 * `--name=value`), short options (`-h`, grouped booleans `-hq`, `-o value`, `-ovalue`), boolean
 * and string options (string options may repeat into a list), positionals anywhere and `--`
 * ending the options. It accepts what `node:util` `parseArgs` accepts in strict mode with
 * positionals allowed, refuses what it refuses and gives the same values (its messages are our
 * own): tests/scripts/args.test.ts compares the two on generated argument lists. It exists because importing `node:util` starts Node compatibility
 * in Deno, about 5 ms of every script's start-up.
 *
 * @module
 */

/** One option: its type, an optional one-letter short name, and whether it may repeat. */
export interface ArgOption {
  /** `boolean` (a flag) or `string` (takes a value). */
  readonly type: "string" | "boolean";
  /** One-letter short name, used as `-x`. */
  readonly short?: string;
  /** Whether a string option may be given several times (its value is then a list). */
  readonly multiple?: boolean;
}

/** Options by long name. */
export type ArgSpec = Readonly<Record<string, ArgOption>>;

/** What {@link readArgs} gives: option values by long name (given options only), positionals. */
export interface ReadArgs {
  /** Values of the options given: true for a flag, the text (or list) for a string option. */
  readonly values: Record<string, string | boolean | (string | boolean)[] | undefined>;
  /** Arguments that are not options, in order. */
  readonly positionals: string[];
}

/** A refused argument list; the message says what was found, as an InputError's "got". */
export class ArgumentError extends Error {
  /** Name of the error class. */
  override name = "ArgumentError";
}

/**
 * Read an argument list strictly against an option spec.
 *
 * Rules (those of `node:util` `parseArgs` with `strict: true, allowPositionals: true`): an
 * unknown option, a flag given a value (`--flag=x`), a string option without a value, or a
 * string option whose separate value starts with `-` (and is not `-` alone; write
 * `--name=-value`) is refused; the last value of a repeated option wins unless it is
 * `multiple`; everything after the first `--` is positional; `-` alone is positional.
 *
 * @param args the arguments (without the program name)
 * @param spec the options
 * @returns the values and positionals
 * @throws {ArgumentError} for a refused argument
 *
 * @example
 * ```ts
 * import { readArgs } from "./_args.ts";
 * const r = readArgs(["site.yaml", "--format=json", "-h", "--", "--x"], {
 *   format: { type: "string" }, help: { type: "boolean", short: "h" } });
 * if (r.values.format !== "json" || r.values.help !== true) throw new Error("values");
 * if (r.positionals.join(" ") !== "site.yaml --x") throw new Error("positionals");
 * ```
 */
export function readArgs(args: readonly string[], spec: ArgSpec): ReadArgs {
  const values: ReadArgs["values"] = Object.create(null);
  const positionals: string[] = [];
  const set = (name: string, value: string | boolean) => {
    if (spec[name].multiple) {
      const list = values[name];
      if (Array.isArray(list)) list.push(value);
      else values[name] = [value];
    } else values[name] = value;
  };
  /** The value of string option `name` given as the next argument `next`. */
  const separateValue = (shown: string, next: string | undefined): string => {
    if (next === undefined) throw new ArgumentError(`${shown} without its value`);
    if (next.length > 1 && next[0] === "-") {
      throw new ArgumentError(
        `${shown} followed by ${next} (write ${shown}=${next} for a value that starts with a dash)`,
      );
    }
    return next;
  };
  for (let i = 0; i < args.length; i++) {
    const arg = args[i];
    if (arg === "--") {
      positionals.push(...args.slice(i + 1));
      break;
    }
    if (arg.startsWith("--")) {
      const eq = arg.indexOf("=");
      const name = eq < 0 ? arg.slice(2) : arg.slice(2, eq);
      const opt = Object.hasOwn(spec, name) ? spec[name] : undefined;
      if (!opt) throw new ArgumentError(`an unknown option --${name}`);
      if (opt.type === "boolean") {
        if (eq >= 0) throw new ArgumentError(`a value for the flag --${name}`);
        set(name, true);
      } else if (eq >= 0) set(name, arg.slice(eq + 1));
      else set(name, separateValue(`--${name}`, args[++i]));
      continue;
    }
    if (arg.length > 1 && arg[0] === "-") {
      // -x, -xyz (grouped flags), -ovalue or -o value: a string option takes the rest of the
      // group as its value, or the next argument when it ends the group
      for (let c = 1; c < arg.length; c++) {
        const letter = arg[c];
        const name = shortName(spec, letter);
        if (name === undefined) throw new ArgumentError(`an unknown option -${letter}`);
        if (spec[name].type === "boolean") {
          set(name, true);
          continue;
        }
        set(name, c + 1 < arg.length ? arg.slice(c + 1) : separateValue(`-${letter}`, args[++i]));
        break;
      }
      continue;
    }
    positionals.push(arg);
  }
  return { values, positionals };
}

/** The long name of a short option letter, or undefined. */
function shortName(spec: ArgSpec, letter: string): string | undefined {
  for (const name in spec) if (spec[name].short === letter) return name;
  return undefined;
}
