/**
 * Temp copies of the bundled data for loader, hash and materials tests: only the
 * bibliography and the materials file (other rooms' files are edited concurrently).
 *
 * @module
 */

/** The bundled data folder. */
export const DATA = new URL("../../data/", import.meta.url);

/**
 * Make a temp data folder holding copies of sources.yaml and materials.yaml, with optional
 * edits: `files` maps a relative path to new text (or a function of the original text).
 *
 * @param files replacements or additions, by relative path
 * @returns the temp folder path
 */
export function tempData(
  files: Record<string, string | ((original: string) => string)> = {},
): string {
  const dir = Deno.makeTempDirSync({ prefix: "snellpath-data-" });
  for (const name of ["sources.yaml", "materials.yaml"]) {
    Deno.writeTextFileSync(`${dir}/${name}`, Deno.readTextFileSync(new URL(name, DATA)));
  }
  for (const [name, edit] of Object.entries(files)) {
    const path = `${dir}/${name}`;
    let original = "";
    try {
      original = Deno.readTextFileSync(path);
    } catch {
      original = "";
    }
    const text = typeof edit === "function" ? edit(original) : edit;
    const slash = name.lastIndexOf("/");
    if (slash > 0) Deno.mkdirSync(`${dir}/${name.slice(0, slash)}`, { recursive: true });
    Deno.writeTextFileSync(path, text);
  }
  return dir;
}

/**
 * Replace the first occurrence of `from` (which must occur) in a text.
 *
 * @param from text to find
 * @param to replacement
 * @returns an edit function for {@link tempData}
 */
export function replaceOnce(from: string, to: string): (s: string) => string {
  return (s) => {
    const i = s.indexOf(from);
    if (i < 0) throw new Error(`test setup: '${from}' not found`);
    return s.slice(0, i) + to + s.slice(i + from.length);
  };
}

/**
 * Remove a temp folder made by {@link tempData}.
 *
 * @param dir the folder
 */
export function removeTemp(dir: string): void {
  Deno.removeSync(dir, { recursive: true });
}
