/**
 * Run one of the project's scripts the way a user does (`deno run scripts/NAME.ts ARGS`) in a
 * child process and collect its exit code and output, for the end-to-end script tests.
 *
 * @module
 */

/** The repository root (the child's working directory unless told otherwise). */
export const ROOT: URL = new URL("../", import.meta.url);

/** What a script run gave back. */
export interface ScriptResult {
  /** Exit code. */
  readonly code: number;
  /** Standard output, decoded. */
  readonly stdout: string;
  /** Standard error, decoded. */
  readonly stderr: string;
}

/** How to run the script. */
export interface RunOptions {
  /** Permission flags for `deno run` (default `["--allow-read=."]`, read below the cwd). */
  readonly permissions?: readonly string[];
  /** Working directory of the child (default the repository root). */
  readonly cwd?: string | URL;
}

const DECODER = new TextDecoder();

/**
 * Run `scripts/<script>` with `deno run --ignore-env=LOG_TOKENS,LOG_STREAM <permissions>`.
 *
 * @param script file name under scripts/, for example "spacing.ts"
 * @param args the script's arguments
 * @param options permission flags and working directory
 * @returns exit code, stdout and stderr
 */
export async function runScript(
  script: string,
  args: readonly string[] = [],
  options: RunOptions = {},
): Promise<ScriptResult> {
  const out = await new Deno.Command(Deno.execPath(), {
    args: [
      "run",
      "--ignore-env=LOG_TOKENS,LOG_STREAM",
      ...(options.permissions ?? ["--allow-read=."]),
      new URL(`scripts/${script}`, ROOT).pathname,
      ...args,
    ],
    cwd: options.cwd ?? ROOT,
    stdout: "piped",
    stderr: "piped",
  }).output();
  return { code: out.code, stdout: DECODER.decode(out.stdout), stderr: DECODER.decode(out.stderr) };
}
