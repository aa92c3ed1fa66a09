/**
 * registry: look into the sourced reference data, check a data folder, export it.
 *
 * ```
 * deno task registry list [kind]
 * deno task registry show <id>
 * deno task registry validate [dir]
 * deno task registry export [--out FILE]
 * deno task registry export --schema [--out FILE]
 * ```
 *
 * @module
 */
import { z } from "zod";
import { InputError, NotFoundError } from "../lib/errors.ts";
import {
  createRegistry,
  DATA_DIR,
  type DataDoc,
  defaultRegistry,
  nearest,
  type Registry,
  SNAPSHOT_FILE,
} from "../lib/registry/mod.ts";
import { buildSnapshot, loadRegistry } from "../lib/registry/load.ts";
import { SCHEMAS } from "../lib/registry/schemas/mod.ts";
import type { MaterialProperties } from "../lib/registry/q_materials.ts";
import { parseCli, runMain } from "./_cli.ts";

const HELP = `
registry — the sourced reference data: list, show, validate, export

usage:
  registry list [kind]                 kinds and their entry counts, or the entries of one kind
  registry show <id>                   one entry: a material, a source, a coefficient set,
                                       a verification table, a table or any entry with that id
  registry validate [dir]              load a data folder (default: the bundled data/) and
                                       report OK with its content hash, or the first problem
  registry export [--out FILE]         the whole registry as JSON: hash, sources, every file
  registry export --schema [--out FILE]
                                       a JSON Schema of the data files, one definition per kind
  registry snapshot [dir]              validate a data folder in full and write its validated
                                       snapshot (dir/snapshot.json), which the loader uses while
                                       the YAML files are byte-for-byte unchanged

options:
  --out FILE   write to FILE instead of standard output (export only)
  --schema     export the JSON Schema instead of the data
  --json       machine-readable output (list, show, validate)
  --debug      print the stack trace of an error
  -h, --help   this text

exit codes: 0 ok, 2 bad input or invalid data.

examples:
  deno task registry list materials
  deno task registry show acrylic --json
  deno task registry validate data
  deno task registry export --schema --out out/snellpath-data.schema.json
`;

const OPTIONS = {
  out: { type: "string" as const },
  schema: { type: "boolean" as const },
};

/** An entry found anywhere in the data: its file, kind, list key and content. */
interface Located {
  readonly file: string;
  readonly kind: string;
  readonly list?: string;
  // deno-lint-ignore no-explicit-any
  readonly data: any;
}

/** Label of a list item for `list`: its id, else its nps/name, else its index. */
// deno-lint-ignore no-explicit-any
function itemLabel(item: any, i: number): string {
  if (item && typeof item === "object") {
    for (const k of ["id", "nps", "name"]) {
      if (typeof item[k] === "string" || typeof item[k] === "number") return String(item[k]);
    }
  }
  return `#${i}`;
}

/** The entries of a data file: the file itself when it has an id, else its listed items. */
function entriesOf(doc: DataDoc): Located[] {
  if (typeof doc.data.id === "string") return [{ file: doc.file, kind: doc.kind, data: doc.data }];
  const out: Located[] = [];
  for (const [key, v] of Object.entries(doc.data)) {
    if (!Array.isArray(v)) continue;
    for (const item of v) out.push({ file: doc.file, kind: doc.kind, list: key, data: item });
  }
  return out;
}

function kindsSummary(reg: Registry): { kind: string; files: number; entries: number }[] {
  return Object.keys(SCHEMAS).map((kind) => {
    const docs = reg.documents(kind);
    return {
      kind,
      files: docs.length,
      entries: docs.reduce((n, d) => n + entriesOf(d).length, 0),
    };
  });
}

function list(reg: Registry, kind: string | undefined, json: boolean): void {
  if (kind === undefined) {
    const rows = kindsSummary(reg);
    if (json) {
      console.log(JSON.stringify({ hash: reg.hash, kinds: rows }, null, 2));
      return;
    }
    console.log(`registry ${reg.hash}`);
    for (const r of rows) {
      console.log(
        `  ${r.kind.padEnd(14)} ${String(r.files).padStart(3)} file(s) ${r.entries} entr${
          r.entries === 1 ? "y" : "ies"
        }`,
      );
    }
    return;
  }
  if (!(kind in SCHEMAS)) {
    throw new NotFoundError("kind", kind, nearest(kind, Object.keys(SCHEMAS), 3));
  }
  const rows = reg.documents(kind).flatMap((d) =>
    entriesOf(d).map((e, i) => ({
      id: itemLabel(e.data, i),
      file: e.file,
      ...(typeof e.data?.name === "string" ? { name: e.data.name } : {}),
      ...(typeof e.data?.title === "string" ? { name: e.data.title } : {}),
      ...(typeof e.data?.formulation === "string" ? { name: e.data.formulation } : {}),
      ...(Array.isArray(e.data?.roles) ? { roles: e.data.roles } : {}),
    }))
  );
  if (json) {
    console.log(JSON.stringify({ kind, entries: rows }, null, 2));
    return;
  }
  const width = Math.max(4, ...rows.map((r) => r.id.length));
  for (const r of rows) {
    const extra = [r.name, r.roles ? `[${r.roles.join(", ")}]` : undefined]
      .filter((x) => x !== undefined).join("  ");
    console.log(`${r.id.padEnd(width)}  ${extra ? extra + "  " : ""}(${r.file})`);
  }
}

function fmtNum(x: number): string {
  return String(Number(x.toPrecision(6)));
}

function describeMaterial(m: MaterialProperties): string {
  const lines = [`${m.id}: ${m.name}  [${m.roles.join(", ")}]`];
  const row = (label: string, v: number | undefined, unit: string, spread?: number) => {
    if (v === undefined) return;
    lines.push(
      `  ${label.padEnd(28)} ${fmtNum(v)}${
        spread !== undefined ? ` ± ${fmtNum(spread)}` : ""
      } ${unit}`,
    );
  };
  row("reference temperature", m.referenceTemperature, "K");
  row("longitudinal speed", m.longitudinal, "m/s", m.longitudinalSpread);
  row("shear speed", m.shear, "m/s", m.shearSpread);
  row("density", m.density, "kg/m^3", m.densitySpread);
  row("d(longitudinal)/dT", m.dLongitudinalDT, "m/s/K");
  row("d(shear)/dT", m.dShearDT, "m/s/K");
  if (m.temperatureRange) {
    lines.push(
      `  ${"coefficients valid".padEnd(28)} ${fmtNum(m.temperatureRange[0])}–${
        fmtNum(m.temperatureRange[1])
      } K`,
    );
  }
  for (const a of m.attenuations) {
    row(`${a.mode} attenuation @ ${fmtNum(a.frequency / 1e6)} MHz`, a.value, "Np/m", a.spread);
  }
  row("roughness, new", m.roughness, "m", m.roughnessSpread);
  row("roughness, aged", m.roughnessAged, "m", m.roughnessAgedSpread);
  lines.push("  trace:");
  for (const t of m.trace) {
    lines.push(
      `    ${t.quantity}: ${typeof t.value === "number" ? fmtNum(t.value) : t.value} ${t.unit}` +
        `  [${t.source}, ${t.basis}]`,
    );
  }
  return lines.join("\n");
}

function show(reg: Registry, id: string, json: boolean): void {
  // A material first (SI, with trace), then a source, then any entry with that id.
  try {
    const m = reg.material(id);
    console.log(json ? JSON.stringify({ kind: "materials", ...m }, null, 2) : describeMaterial(m));
    return;
  } catch (e) {
    if (!(e instanceof NotFoundError)) throw e;
  }
  const source = reg.loaded.sources.get(id);
  if (source) {
    if (json) console.log(JSON.stringify({ kind: "source", ...source }, null, 2));
    else {
      console.log(`${source.id} (${source.type})\n  ${source.citation}`);
      if (source.url) console.log(`  url: ${source.url}`);
      if (source.copy) console.log(`  copy: ${source.copy}`);
      if (source.note) console.log(`  note: ${source.note}`);
    }
    return;
  }
  const all = reg.loaded.docs.filter((d) => d.kind !== "sources").flatMap(entriesOf);
  const found = all.filter((e) => e.data?.id === id);
  if (found.length === 0) {
    const ids = [
      ...reg.loaded.sources.keys(),
      ...all.map((e) => e.data?.id).filter((x): x is string => typeof x === "string"),
    ];
    throw new NotFoundError("id", id, nearest(id, ids, 5));
  }
  const out = found.map((e) => ({ file: e.file, kind: e.kind, entry: e.data }));
  if (json) {
    console.log(JSON.stringify(out.length === 1 ? out[0] : out, null, 2));
    return;
  }
  for (const e of out) {
    console.log(`${id} (kind ${e.kind}, ${e.file})`);
    console.log(JSON.stringify(e.entry, null, 2).replace(/^/gm, "  "));
  }
}

/**
 * A JSON Schema (draft 2020-12) of every data-file kind, generated from the zod schemas.
 *
 * @returns the schema document
 */
export function dataJsonSchema(): Record<string, unknown> {
  const defs: Record<string, unknown> = {};
  for (const [kind, schema] of Object.entries(SCHEMAS)) {
    const s = z.toJSONSchema(schema, { io: "input", unrepresentable: "any" }) as Record<
      string,
      unknown
    >;
    delete s.$schema;
    defs[kind] = s;
  }
  return {
    $schema: "https://json-schema.org/draft/2020-12/schema",
    title: "snellpath reference data file",
    description: "A YAML file under data/; its top-level `kind` selects one definition. " +
      "Units, provenance coverage and cross-file rules (unknown source ids, duplicate ids) " +
      "are checked by the loader, not by this schema.",
    oneOf: Object.keys(defs).map((k) => ({ $ref: `#/$defs/${k}` })),
    $defs: defs,
  };
}

/**
 * The whole registry as one JSON value: hash, sources and every data file.
 *
 * @param reg the registry
 * @returns the export document
 */
export function registryExport(reg: Registry): Record<string, unknown> {
  return {
    hash: reg.hash,
    sources: reg.sources(),
    documents: reg.loaded.docs.map((d) => ({ file: d.file, kind: d.kind, data: d.data })),
  };
}

async function writeOut(text: string, out: string | undefined): Promise<void> {
  if (out === undefined) {
    console.log(text);
    return;
  }
  if (out.trim() === "") throw new InputError("--out", '""', "a file path");
  await Deno.writeTextFile(out, text + "\n");
  console.error(`wrote ${out}`);
}

async function main(): Promise<number> {
  const { values, positionals } = parseCli(Deno.args, OPTIONS, HELP);
  const json = values.json === true;
  const out = values.out as string | undefined;
  const [command, ...rest] = positionals;
  const tooMany = (max: number) => {
    if (rest.length > max) {
      throw new InputError(
        "arguments",
        JSON.stringify(rest.slice(max).join(" ")),
        `at most ${max} argument(s) after '${command}' (see --help)`,
      );
    }
  };
  if (command !== "export" && (out !== undefined || values.schema)) {
    throw new InputError(
      values.schema ? "--schema" : "--out",
      `with '${command ?? ""}'`,
      "--out and --schema only with export",
    );
  }
  switch (command) {
    case "list":
      tooMany(1);
      list(defaultRegistry(), rest[0], json);
      return 0;
    case "show":
      tooMany(1);
      if (rest[0] === undefined) throw new InputError("show", "no id", "an id, such as acrylic");
      show(defaultRegistry(), rest[0], json);
      return 0;
    case "validate": {
      tooMany(1);
      const dir = rest[0] ?? DATA_DIR;
      const reg = createRegistry(loadRegistry(dir, { snapshot: false }));
      const files = reg.loaded.docs.length;
      if (json) {
        console.log(JSON.stringify({ ok: true, dir: reg.loaded.dir, files, hash: reg.hash }));
      } else console.log(`OK ${reg.hash} (${files} files, ${reg.loaded.sources.size} sources)`);
      return 0;
    }
    case "snapshot": {
      tooMany(1);
      const dir = rest[0] ?? DATA_DIR;
      const text = buildSnapshot(dir);
      const target = new URL(SNAPSHOT_FILE, loadRegistry(dir, { snapshot: false }).dir);
      Deno.writeTextFileSync(target, text);
      const hash = JSON.parse(text).hash;
      console.log(
        json
          ? JSON.stringify({ ok: true, file: target.pathname, hash })
          : `wrote ${target.pathname} (${hash})`,
      );
      return 0;
    }
    case "export":
      tooMany(0);
      await writeOut(
        JSON.stringify(
          values.schema ? dataJsonSchema() : registryExport(defaultRegistry()),
          null,
          2,
        ),
        out,
      );
      return 0;
    default:
      throw new InputError(
        "command",
        command === undefined ? "nothing" : JSON.stringify(command),
        "one of: list, show, validate, snapshot, export (see --help)",
      );
  }
}

if (import.meta.main) await runMain(main);
