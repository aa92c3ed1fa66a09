/**
 * Outside checks against Debian's general-purpose reference libraries (python3-iapws,
 * python3-fluids, python3-gsw), called through /usr/bin/python3. Used only by tests.
 *
 * Where a package is missing, the checks that need it are registered as ignored and a
 * notice naming the packages is printed; `.ci/run` installs them so CI runs the full set.
 *
 * @module
 */

/** The interpreter Debian's packages install into (another python3 may shadow it on PATH). */
export const PYTHON = "/usr/bin/python3";

const cache = new Map<string, boolean>();
const noticed = new Set<string>();

/** Debian package per Python module. */
export const DEBIAN_PACKAGE: Record<string, string> = {
  iapws: "python3-iapws",
  fluids: "python3-fluids",
  gsw: "python3-gsw",
  numpy: "python3-numpy",
  scipy: "python3-scipy",
  uncertainties: "python3-uncertainties",
};

/**
 * True when /usr/bin/python3 can import every module named. Prints a notice once otherwise.
 *
 * @param modules Python module names, for example ["iapws"]
 * @returns whether all import
 */
export function hasPython(...modules: string[]): boolean {
  const key = modules.join(",");
  const known = cache.get(key);
  if (known !== undefined) return known;
  let ok = false;
  try {
    const r = new Deno.Command(PYTHON, {
      args: ["-c", modules.map((m) => `import ${m}`).join("; ")],
      stdout: "null",
      stderr: "null",
    }).outputSync();
    ok = r.success;
  } catch {
    ok = false;
  }
  cache.set(key, ok);
  if (!ok && !noticed.has(key)) {
    noticed.add(key);
    const pkgs = modules.map((m) => DEBIAN_PACKAGE[m] ?? m).join(" ");
    console.warn(
      `NOTICE: outside checks needing ${pkgs} are skipped: install them with ` +
        `'apt-get install ${pkgs}' (${PYTHON}); .ci/run does.`,
    );
  }
  return ok;
}

/**
 * Run a Python script with /usr/bin/python3, send `input` as JSON on stdin, parse stdout as JSON.
 *
 * @param script the Python source; it reads JSON from stdin and prints JSON
 * @param input any JSON-serialisable value
 * @returns the parsed JSON the script printed
 */
export async function runPython<T = unknown>(script: string, input: unknown = null): Promise<T> {
  const child = new Deno.Command(PYTHON, {
    args: ["-c", script],
    stdin: "piped",
    stdout: "piped",
    stderr: "piped",
  }).spawn();
  const w = child.stdin.getWriter();
  await w.write(new TextEncoder().encode(JSON.stringify(input)));
  await w.close();
  const out = await child.output();
  if (!out.success) {
    throw new Error(`python failed: ${new TextDecoder().decode(out.stderr).slice(-2000)}`);
  }
  return JSON.parse(new TextDecoder().decode(out.stdout)) as T;
}

/**
 * Version string of a Debian package, for naming the copy beside a check.
 *
 * @param pkg Debian package name
 * @returns version, or "unknown"
 */
export function debianVersion(pkg: string): string {
  try {
    const r = new Deno.Command("dpkg-query", { args: ["-W", "-f=${Version}", pkg], stderr: "null" })
      .outputSync();
    return r.success ? new TextDecoder().decode(r.stdout).trim() : "unknown";
  } catch {
    return "unknown";
  }
}
