/**
 * The site-file reader: YAML, JSON or a fleet CSV, written with unit strings, into validated
 * {@link SiteInput} objects in SI. This module and the registry loader are the only places in
 * lib/ that read files.
 *
 * Method: strict parsing (YAML core schema, unique keys, few aliases, no tags; strict JSON),
 * strict keys (unknown keys refused with the nearest valid key suggested), unit strings read by
 * lib/units.ts (`parseQuantityFull`, mathjs fallback for expressions), plausibility limits and
 * cross-field checks. No physics and no registry lookups: whether an NPS, material, liquid or
 * fitting exists is the plan's question. Sources: none needed beyond the units table
 * (lib/units.ts); the Z/V/W names and the S-suffix rule for stainless schedules are common
 * practice.
 *
 * @module
 */
import { SnellpathError } from "../errors.ts";
import { buildSite } from "./read_build.ts";
import { checkHeader, csvHint, nestRow, splitCsv } from "./read_csv.ts";
import { type Ctx, fail, oneLine } from "./read_fields.ts";
import { checkText, decodeText, parseJsonText, parseYamlText } from "./read_text.ts";
import { MAX_SITE_BYTES, MAX_SITES_CSV_BYTES, type SiteInput } from "./schema.ts";

export { SiteInputError } from "./read_fields.ts";
export { DEFAULT_MOUNTINGS, LIMITS as SITE_LIMITS, STANDARD_ATMOSPHERE } from "./read_build.ts";

/** Options of {@link readSiteText}. */
export interface ReadSiteOptions {
  /** File name for messages and for `source.file` (default `"<text>"`). */
  readonly file?: string;
  /** Format; by default from the file's extension, else JSON when the text starts with `{`, else YAML. */
  readonly format?: "yaml" | "json";
}

function formatOf(file: string | undefined, text: string): "yaml" | "json" {
  if (file && /\.json$/i.test(file)) return "json";
  if (file && /\.ya?ml$/i.test(file)) return "yaml";
  return text.trimStart().startsWith("{") ? "json" : "yaml";
}

/**
 * Read one site from YAML or JSON text.
 *
 * Method: strict parse, then key, unit, limit and cross-field checks (see the module doc and
 * docs/site-file.md). Units: any the units table reads (mm, inch, ft; degC, degF, K; bar, psi,
 * kPa, MPa absolute, barg, psig gauge; L/s, m^3/h, gpm; m/s, ft/s; deg, rad; ps, ns, us; kHz,
 * MHz; %). Validity: the plausibility limits {@link SITE_LIMITS}; text at most 256 KiB.
 * Sources: none (a reader); the result is SI.
 *
 * @param text the site file's text
 * @param options file name (for messages) and format
 * @returns the validated site, SI; `defaults` lists what was assumed
 * @throws {SiteInputError} (an InputError) naming the field, what was given, what is accepted
 *
 * @example
 * ```ts
 * import { readSiteText } from "./read.ts";
 * const site = await readSiteText(`
 * name: Example line (invented)
 * pipe: { nps: "8", schedule: "40", material: carbon-steel }
 * fluid: { liquid: water, temperature: 12 degC }
 * flow: { minimum: 20 L/s, maximum: 90 L/s }
 * transducer: { wedgeSoundSpeed: 2720 m/s, wedgeAngle: 38 deg, frequency: 1 MHz }
 * `);
 * if (Math.abs(site.fluid.temperature - 285.15) > 1e-9) throw new Error("temperature");
 * if (site.fluid.pressure !== 101325) throw new Error("default pressure");
 * if (site.mountings.join() !== "1,2") throw new Error("default mountings");
 * ```
 */
export async function readSiteText(
  text: string,
  options: ReadSiteOptions = {},
): Promise<SiteInput> {
  const ctx: Ctx = { file: options.file };
  const t = checkText(ctx, text, MAX_SITE_BYTES);
  return await parseAndBuild(ctx, t, options.file, options.format);
}

async function parseAndBuild(
  ctx: Ctx,
  text: string,
  file: string | undefined,
  format: "yaml" | "json" | undefined,
): Promise<SiteInput> {
  const fmt = format ?? formatOf(file, text);
  if (fmt !== "yaml" && fmt !== "json") fail(ctx, "format", JSON.stringify(fmt), "yaml or json");
  const raw = fmt === "json" ? parseJsonText(ctx, text) : await parseYamlText(ctx, text);
  return await buildSite(raw, { file: file ?? "<text>", format: fmt }, ctx);
}

async function readBytes(ctx: Ctx, path: string, limit: number): Promise<Uint8Array> {
  let info: Deno.FileInfo;
  try {
    info = await Deno.stat(path);
  } catch (e) {
    if (e instanceof Deno.errors.NotFound) {
      fail(ctx, "file", "no such file", "an existing site file");
    }
    throw e;
  }
  if (!info.isFile) fail(ctx, "file", "a folder or special file", "a regular file");
  if (info.size > limit) {
    fail(ctx, "file", `${info.size} bytes`, `a file of at most ${limit} bytes`);
  }
  const f = await Deno.open(path, { read: true });
  try {
    // Read at most limit + 1 bytes, whatever the size said (the file may grow).
    const buf = new Uint8Array(limit + 1);
    let n = 0;
    for (;;) {
      const got = await f.read(buf.subarray(n));
      if (got === null) break;
      n += got;
      if (n > limit) {
        fail(ctx, "file", `more than ${limit} bytes`, `a file of at most ${limit} bytes`);
      }
    }
    return buf.subarray(0, n);
  } finally {
    f.close();
  }
}

/**
 * Read one site file (`.yaml`, `.yml` or `.json`). The size (at most 256 KiB) is checked
 * before reading; binary content (NUL bytes, invalid UTF-8) and empty files are refused.
 * Needs read permission for the file.
 *
 * Method, units, validity and sources: as {@link readSiteText}.
 *
 * @param path the file's path
 * @returns the validated site, SI, with `source.file` = path
 * @throws {SiteInputError} naming the file and field
 *
 * @example
 * ```ts
 * import { readSiteFile } from "./read.ts";
 * const dir = await Deno.makeTempDir();
 * await Deno.writeTextFile(`${dir}/a.json`, JSON.stringify({
 *   name: "Example (invented)",
 *   pipe: { outsideDiameter: "219.1 mm", wallThickness: "8.18 mm" },
 *   fluid: { liquid: "water", temperature: "20 degC", pressure: "3 barg" },
 *   flow: { minimumVelocity: "0.3 m/s", maximumVelocity: "3 m/s" },
 *   transducer: { wedgeMaterial: "acrylic", wedgeAngle: "37 deg", frequency: "1 MHz" },
 * }));
 * const site = await readSiteFile(`${dir}/a.json`);
 * await Deno.remove(dir, { recursive: true });
 * if (site.source.format !== "json" || site.pipe.geometry !== "measured") throw new Error();
 * ```
 */
export async function readSiteFile(path: string): Promise<SiteInput> {
  const ctx: Ctx = { file: path };
  const ext = /\.([^./\\]+)$/.exec(path)?.[1]?.toLowerCase();
  if (ext !== "yaml" && ext !== "yml" && ext !== "json") {
    fail(
      ctx,
      "file",
      ext ? `extension .${ext}` : "no extension",
      ".yaml, .yml or .json (a fleet .csv: readSitesCsvFile)",
    );
  }
  const bytes = await readBytes(ctx, path, MAX_SITE_BYTES);
  const text = decodeText(ctx, bytes, MAX_SITE_BYTES);
  return await parseAndBuild(ctx, text, path, ext === "json" ? "json" : "yaml");
}

/** Result of a fleet CSV: the good sites and one message per bad row. */
export interface SitesCsvResult {
  /** Sites read, in row order; `source.row` is the file line. */
  readonly sites: SiteInput[];
  /** Bad rows: file line and a one-line message naming the field. */
  readonly errors: { row: number; message: string }[];
}

/**
 * Read a fleet from CSV text: a header of dotted site keys including `id`, then one site a
 * row. A bad row is reported with its line number and the others are still returned; a bad
 * header or a CSV syntax error refuses the whole file. Ids must be unique.
 *
 * Method, units, validity and sources: as {@link readSiteText}; text at most 4 MiB.
 *
 * @param text the CSV text
 * @param options file name for messages
 * @returns sites and row errors
 * @throws {SiteInputError} for a bad header, a CSV syntax error, an empty or oversized text
 *
 * @example
 * ```ts
 * import { readSitesCsv } from "./read.ts";
 * const csv = [
 *   "id,name,pipe.nps,pipe.schedule,fluid.liquid,fluid.temperature,flow.minimum,flow.maximum," +
 *     "transducer.wedgeSoundSpeed,transducer.wedgeAngle,transducer.frequency,mountings",
 *   "A1,Pump house (invented),6,40,water,15 degC,5 L/s,40 L/s,2720 m/s,38 deg,1 MHz,1;2",
 *   "A2,Tank inlet (invented),4,40,water,15 m,5 L/s,20 L/s,2720 m/s,38 deg,1 MHz,2",
 * ].join("\n");
 * const { sites, errors } = await readSitesCsv(csv);
 * if (sites.length !== 1 || errors[0].row !== 3) throw new Error("row 3 bad");
 * if (!errors[0].message.includes("fluid.temperature")) throw new Error("field named");
 * ```
 */
export async function readSitesCsv(
  text: string,
  options: { file?: string } = {},
): Promise<SitesCsvResult> {
  const sites: SiteInput[] = [];
  const errors: { row: number; message: string }[] = [];
  for await (const r of streamSitesCsv(text, options)) {
    if ("site" in r) sites.push(r.site);
    else errors.push(r.error);
  }
  return { sites, errors };
}

/** One row of {@link streamSitesCsv}: a site, or a refused row. */
export type SitesCsvRow =
  | { readonly site: SiteInput }
  | { readonly error: { row: number; message: string } };

/**
 * Read a fleet from CSV text one row at a time, so that a large fleet is planned without
 * holding every site: yields each site (or a refused row with its line and message) in row
 * order. Same rules as {@link readSitesCsv}; a bad header or a CSV syntax error throws before
 * the first row.
 *
 * @param text the CSV text
 * @param options file name for messages
 * @returns an async iterator of rows
 * @throws {SiteInputError} for a bad header, a CSV syntax error, an empty or oversized text
 *
 * @example
 * ```ts
 * import { streamSitesCsv } from "./read.ts";
 * const csv = "id,name,pipe.nps,pipe.schedule,fluid.liquid,fluid.temperature,flow.minimum," +
 *   "flow.maximum,transducer.wedgeSoundSpeed,transducer.wedgeAngle,transducer.frequency\n" +
 *   "A1,Pump house (invented),6,40,water,15 degC,5 L/s,40 L/s,2720 m/s,38 deg,1 MHz\n";
 * let n = 0;
 * for await (const r of streamSitesCsv(csv)) if ("site" in r) n++;
 * if (n !== 1) throw new Error();
 * ```
 */
export async function* streamSitesCsv(
  text: string,
  options: { file?: string } = {},
): AsyncGenerator<SitesCsvRow> {
  const label = options.file ?? "<csv>";
  const ctx: Ctx = { file: options.file };
  const t = checkText(ctx, text, MAX_SITES_CSV_BYTES);
  const records = splitCsv(ctx, t);
  if (records.length === 0) fail(ctx, "file", "no header", "a header of dotted site keys");
  const paths = checkHeader(ctx, records[0].cells);
  const idCol = paths.findIndex((p) => p.length === 1 && p[0] === "id");
  const ids = new Map<string, number>();
  for (let i = 1; i < records.length; i++) {
    const rec = records[i];
    const rowCtx: Ctx = { file: `${label} row ${rec.line}` };
    let site: SiteInput;
    try {
      if (rec.cells.length > paths.length) {
        fail(rowCtx, "row", `${rec.cells.length} cells`, `at most ${paths.length}, one per column`);
      }
      const id = (rec.cells[idCol] ?? "").trim();
      if (id === "") fail(rowCtx, "id", "an empty cell", "an id naming the site");
      const first = ids.get(id);
      if (first !== undefined) {
        fail(rowCtx, "id", JSON.stringify(id), `an id not used before (row ${first})`);
      }
      ids.set(id, rec.line);
      const raw = nestRow(paths, rec.cells);
      const siteCtx: Ctx = { file: `${label} row ${rec.line} (site ${oneLine(id, 40)})` };
      site = await buildSite(raw, { file: label, format: "csv", row: rec.line }, siteCtx);
    } catch (e) {
      if (!(e instanceof SnellpathError)) throw e;
      yield { error: { row: rec.line, message: csvHint(e.message) } };
      continue;
    }
    yield { site };
  }
}

/**
 * Read a fleet CSV file (at most 4 MiB, size checked before reading); see
 * {@link readSitesCsv}.
 *
 * @param path the file's path
 * @returns sites and row errors
 * @throws {SiteInputError} for a missing, oversized, binary or malformed file
 *
 * @example
 * ```ts
 * import { readSitesCsvFile } from "./read.ts";
 * const dir = await Deno.makeTempDir();
 * await Deno.writeTextFile(`${dir}/f.csv`, "id,name\nX,only a name\n");
 * const r = await readSitesCsvFile(`${dir}/f.csv`);
 * await Deno.remove(dir, { recursive: true });
 * if (r.sites.length !== 0 || r.errors.length !== 1) throw new Error();
 * ```
 */
export async function readSitesCsvFile(path: string): Promise<SitesCsvResult> {
  return await readSitesCsv(await readSitesCsvText(path), { file: path });
}

/**
 * Read the text of a fleet CSV file (at most 4 MiB, size checked before reading; binary
 * refused), for {@link streamSitesCsv}.
 *
 * @param path the file's path
 * @returns the text
 * @throws {SiteInputError} for a missing, oversized or binary file
 */
export async function readSitesCsvText(path: string): Promise<string> {
  const ctx: Ctx = { file: path };
  const bytes = await readBytes(ctx, path, MAX_SITES_CSV_BYTES);
  return decodeText(ctx, bytes, MAX_SITES_CSV_BYTES);
}

/**
 * The site files a path names: the path itself when it is a file, else the `.yaml`, `.yml`
 * and `.json` files directly in the folder (not hidden, not in subfolders), sorted by name.
 *
 * @param pathOrDir a site file or a folder of them
 * @returns paths, sorted
 * @throws {SiteInputError} when the path does not exist
 *
 * @example
 * ```ts
 * import { siteFiles } from "./read.ts";
 * const dir = await Deno.makeTempDir();
 * for (const f of ["b.yaml", "a.json", "c.txt", ".d.yml"]) await Deno.writeTextFile(`${dir}/${f}`, "");
 * const files = await siteFiles(dir);
 * await Deno.remove(dir, { recursive: true });
 * if (files.map((f) => f.slice(dir.length + 1)).join() !== "a.json,b.yaml") throw new Error();
 * ```
 */
export async function siteFiles(pathOrDir: string): Promise<string[]> {
  const ctx: Ctx = { file: pathOrDir };
  let info: Deno.FileInfo;
  try {
    info = await Deno.stat(pathOrDir);
  } catch (e) {
    if (e instanceof Deno.errors.NotFound) {
      fail(ctx, "path", "no such file or folder", "a site file or a folder of them");
    }
    throw e;
  }
  if (info.isFile) return [pathOrDir];
  const out: string[] = [];
  for await (const e of Deno.readDir(pathOrDir)) {
    if (!e.isFile || e.name.startsWith(".") || !/\.(ya?ml|json)$/i.test(e.name)) continue;
    out.push(pathOrDir.endsWith("/") ? pathOrDir + e.name : `${pathOrDir}/${e.name}`);
  }
  return out.sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
}

export type { SiteInput } from "./schema.ts";
