/**
 * Temp copies of the bibliography and the pipe catalogue (data/pipes/) for schema tests;
 * other rooms' files are left out since they change concurrently.
 *
 * @module
 */

const DATA = new URL("../../data/", import.meta.url);

/**
 * Make a temp data folder with sources.yaml and pipes/*.yaml, applying edits by relative path.
 *
 * @param edits functions of the original text, by relative path (for example
 *   "pipes/astm-d1785.yaml")
 * @returns the folder path
 */
export function tempPipeData(edits: Record<string, (s: string) => string> = {}): string {
  const dir = Deno.makeTempDirSync({ prefix: "snellpath-pipes-" });
  Deno.mkdirSync(`${dir}/pipes`);
  const names = ["sources.yaml"];
  for (const e of Deno.readDirSync(new URL("pipes/", DATA))) {
    if (e.isFile && e.name.endsWith(".yaml")) names.push(`pipes/${e.name}`);
  }
  for (const name of names) {
    let text = Deno.readTextFileSync(new URL(name, DATA));
    if (edits[name]) text = edits[name](text);
    Deno.writeTextFileSync(`${dir}/${name}`, text);
  }
  for (const name of Object.keys(edits)) {
    if (!names.includes(name)) throw new Error(`test setup: no data file ${name}`);
  }
  return dir;
}

export { replaceOnce } from "../registry/_tempdata.ts";
