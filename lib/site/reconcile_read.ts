/**
 * The readings file: what a technician records on site, in YAML or JSON with unit strings,
 * read into {@link FieldReadings} (SI). Every field is described in docs/readings.md.
 *
 * @module
 */
import { readYamlSubset } from "./yaml_subset.ts";
import { InputError } from "../errors.ts";
import { type Dimension, parseQuantityFull } from "../units.ts";
import type { FieldReadings, MountingReading } from "./reconcile.ts";

/** Largest readings file read, bytes. */
export const MAX_READINGS_BYTES = 64 * 1024;

/** Top-level fields of a readings file and their dimensions (mountings: a list). */
const TOP: Record<string, Dimension | "list"> = {
  temperature: "temperature",
  wallThickness: "length",
  mountings: "list",
};

/** Fields of one mounting's readings and their dimensions (traverses: a count or a letter). */
const PER_MOUNTING: Record<string, Dimension | "count"> = {
  traverses: "count",
  totalTime: "time",
  fixedDelay: "time",
  deltaT: "time",
  indicatedVelocity: "speed",
  zeroFlowDeltaT: "time",
};

/** Mounting letters of the trade and their traverse counts. */
const LETTERS: Record<string, number> = { Z: 1, V: 2, W: 4 };

function unknownKeys(obj: object, allowed: Record<string, unknown>, where: string): void {
  for (const k of Object.keys(obj)) {
    if (!(k in allowed)) {
      throw new InputError(`${where}${k}`, "an unknown key", Object.keys(allowed).join(", "));
    }
  }
}

function traverseCount(v: unknown, field: string): number {
  const n = typeof v === "string" && v.trim().toUpperCase() in LETTERS
    ? LETTERS[v.trim().toUpperCase()]
    : typeof v === "number"
    ? v
    : NaN;
  if (!Number.isInteger(n) || n < 1 || n > 8) {
    throw new InputError(field, JSON.stringify(v), "an integer from 1 to 8, or Z, V or W");
  }
  return n;
}

/**
 * Read a readings file's text (YAML or JSON; an optional top-level `readings:` wrapper).
 *
 * @param text the file's text
 * @param where the file's name, for messages
 * @returns the readings in SI
 * @throws {InputError} naming the field for unknown keys, missing or malformed quantities
 *
 * @example
 * ```ts
 * import { readReadingsText } from "./reconcile_read.ts";
 * const r = await readReadingsText(`
 * temperature: 14.5 degC
 * mountings:
 *   - { traverses: V, totalTime: 234.1 us, fixedDelay: 6.2 us }
 * `);
 * if (r.mountings[0].traverses !== 2 || Math.abs(r.temperature! - 287.65) > 1e-9) {
 *   throw new Error();
 * }
 * ```
 */
export async function readReadingsText(text: string, where = "readings"): Promise<FieldReadings> {
  if (text.length > MAX_READINGS_BYTES) {
    throw new InputError(where, "a file over 64 KiB", "a readings file");
  }
  // The plain subset is read by our own reader; anything else by npm yaml, loaded only then.
  const quick = readYamlSubset(text);
  let raw: unknown = quick?.value;
  if (!quick) {
    const { parse: parseYaml } = await import("yaml");
    try {
      raw = parseYaml(text, { maxAliasCount: 10, uniqueKeys: true });
    } catch (e) {
      const first = (e as Error).message.split("\n")[0];
      throw new InputError(
        where,
        `text that is neither YAML nor JSON (${first})`,
        "a readings file",
      );
    }
  }
  const body = raw && typeof raw === "object" && "readings" in raw
    ? (raw as { readings: unknown }).readings
    : raw;
  if (!body || typeof body !== "object" || Array.isArray(body)) {
    throw new InputError(
      `${where}: readings`,
      "nothing",
      "a readings object (see docs/readings.md)",
    );
  }
  const top = body as Record<string, unknown>;
  unknownKeys(top, TOP, "readings.");
  if (!Array.isArray(top.mountings) || top.mountings.length === 0) {
    throw new InputError(
      "readings.mountings",
      "nothing",
      "a list of one mounting's readings or more",
    );
  }
  const mountings: MountingReading[] = [];
  for (const [i, m] of (top.mountings as unknown[]).entries()) {
    const f = `readings.mountings[${i}]`;
    if (!m || typeof m !== "object") throw new InputError(f, JSON.stringify(m), "an object");
    const rec = m as Record<string, unknown>;
    unknownKeys(rec, PER_MOUNTING, `${f}.`);
    const got: Record<string, number> = {};
    for (const [k, dim] of Object.entries(PER_MOUNTING)) {
      if (rec[k] === undefined) continue;
      got[k] = dim === "count"
        ? traverseCount(rec[k], `${f}.${k}`)
        : await parseQuantityFull(rec[k] as string, dim, `${f}.${k}`);
    }
    if (got.traverses === undefined) {
      throw new InputError(`${f}.traverses`, "nothing", "an integer from 1 to 8, or Z, V or W");
    }
    if (got.totalTime === undefined) {
      throw new InputError(`${f}.totalTime`, "nothing", 'a time such as "234.1 us"');
    }
    mountings.push(got as unknown as MountingReading);
  }
  const q = async (k: string) =>
    top[k] === undefined
      ? undefined
      : await parseQuantityFull(top[k] as string, TOP[k] as Dimension, `readings.${k}`);
  return {
    temperature: await q("temperature"),
    wallThickness: await q("wallThickness"),
    mountings,
  };
}
