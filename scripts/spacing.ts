/**
 * Transducer spacing per mounting, the Snell chain and the search window, from raw figures or
 * catalogue terms. Run with --help.
 *
 * @module
 */
import { InputError } from "../lib/errors.ts";
import { type Dimension, parseQuantity } from "../lib/units.ts";
import {
  type ClampOnInputs,
  type ClampOnPath,
  clampOnPath,
  criticalAngles,
  type LiningLayer,
  PRIMARY_MODE_RULE,
} from "../lib/acoustics/path.ts";
import { searchWindow, type WindowUncertainties } from "../lib/acoustics/window.ts";
import { givenLine, type OptionSpec, parseCli, runMain } from "./_cli.ts";
import { inchesSixteenths } from "../lib/report/card.ts";

/** Geometry options shared by spacing.ts and transit.ts. */
export const GEOMETRY_OPTIONS: OptionSpec = {
  od: { type: "string" },
  wall: { type: "string" },
  "wall-speed": { type: "string" },
  "wall-shear-speed": { type: "string" },
  "wall-mode": { type: "string" },
  "fluid-speed": { type: "string" },
  "wedge-speed": { type: "string" },
  "wedge-angle": { type: "string" },
  "lining-thickness": { type: "string" },
  "lining-speed": { type: "string" },
  "element-height": { type: "string" },
  "index-offset": { type: "string" },
  standard: { type: "string" },
  nps: { type: "string" },
  schedule: { type: "string" },
  material: { type: "string" },
  liquid: { type: "string" },
  temperature: { type: "string" },
  pressure: { type: "string" },
  "wedge-material": { type: "string" },
};

/** Help text of the geometry options. */
export const GEOMETRY_HELP = `
Raw figures (unit strings; all needed unless the catalogue supplies them):
  --od "114.3 mm"            pipe outside diameter
  --wall "6.02 mm"           wall thickness
  --wall-speed "5920 m/s"    longitudinal speed of the wall
  --wall-shear-speed "3230 m/s"  shear speed of the wall (lets the shear mode be considered)
  --wall-mode auto|longitudinal|shear   force the wall mode (default auto)
  --fluid-speed "1482 m/s"   sound speed of the liquid
  --wedge-speed "2720 m/s"   sound speed of the wedge
  --wedge-angle "38 deg"     beam angle in the wedge from the contact-face normal
  --lining-thickness "8 mm[,2 mm]"  lining layer(s), wall side first
  --lining-speed "4200 m/s[,2500 m/s]"
  --element-height "10 mm"   element centre above the wedge face (adds wedge times)
  --index-offset "12 mm"     index point to the housing's reference mark (adds mark distance)
Catalogue terms (raw figures given as well override them):
  --standard "ASME B36.10M" --nps 4 --schedule 40   pipe from the catalogue
  --material carbon-steel    wall material (default: the catalogue's)
  --liquid water             liquid (water by IAPWS-95; others where the liquids room has them)
  --temperature "20 degC"    operating temperature (liquid and wedge)
  --pressure "5 bar"         absolute pressure (default 1 atm)
  --wedge-material acrylic   wedge material (speed at the temperature)
`;

/** Inputs resolved from the command line, with what the catalogue gave for the window. */
export interface ResolvedGeometry {
  /** Clamp-on inputs less the traverse count. */
  readonly inputs: Omit<ClampOnInputs, "traverses">;
  /** Uncertainties known from the catalogue (material spreads, tolerances), SI. */
  readonly catalogueUncertainties: WindowUncertainties;
  /** Where each figure came from, for the human output. */
  readonly notes: readonly string[];
}

function q(values: Record<string, unknown>, name: string, dim: Dimension): number | undefined {
  const v = values[name];
  if (v === undefined) return undefined;
  if (typeof v !== "string") throw new InputError(`--${name}`, String(v), "a value");
  return parseQuantity(v, dim, `--${name}`);
}

function list(values: Record<string, unknown>, name: string, dim: Dimension): number[] | undefined {
  const v = values[name];
  if (v === undefined) return undefined;
  if (typeof v !== "string" || v.trim() === "") {
    throw new InputError(`--${name}`, JSON.stringify(v), "a comma-separated list of values");
  }
  return v.split(",").map((s) => parseQuantity(s.trim(), dim, `--${name}`));
}

function need(x: number | undefined, name: string, what: string): number {
  if (x === undefined) {
    throw new InputError(`--${name}`, "nothing", `${what} (or catalogue terms that supply it)`);
  }
  return x;
}

/**
 * Resolve the geometry options: raw figures, completed from the catalogue when catalogue terms
 * are given (registry, pipe and water modules are imported only then).
 *
 * @param values parsed option values
 * @returns the clamp-on inputs (no traverses), catalogue uncertainties, notes
 */
export async function resolveGeometry(
  values: Record<string, unknown>,
): Promise<ResolvedGeometry> {
  const d: Draft = {
    od: q(values, "od", "length"),
    wall: q(values, "wall", "length"),
    cL: q(values, "wall-speed", "speed"),
    cS: q(values, "wall-shear-speed", "speed"),
    cf: q(values, "fluid-speed", "speed"),
    cw: q(values, "wedge-speed", "speed"),
    notes: [],
    u: {},
    lining: undefined,
  };
  const angle = q(values, "wedge-angle", "angle");
  const lt = list(values, "lining-thickness", "length");
  const ls = list(values, "lining-speed", "speed");
  const catalogue = ["standard", "nps", "schedule", "material", "liquid", "wedge-material"]
    .some((k) => values[k] !== undefined);
  if (catalogue) await fromRegistry(values, d, lt === undefined);
  if (lt !== undefined || ls !== undefined) d.lining = statedLining(lt, ls);
  const mode = values["wall-mode"];
  if (mode !== undefined && mode !== "auto" && mode !== "longitudinal" && mode !== "shear") {
    throw new InputError("--wall-mode", String(mode), "auto, longitudinal or shear");
  }
  const eh = q(values, "element-height", "length");
  const io = q(values, "index-offset", "length");
  return {
    inputs: {
      outsideDiameter: need(d.od, "od", "the outside diameter"),
      wallThickness: need(d.wall, "wall", "the wall thickness"),
      wallSoundSpeed: need(d.cL, "wall-speed", "the wall's longitudinal speed"),
      wallShearSpeed: d.cS,
      wallMode: mode as ClampOnInputs["wallMode"],
      lining: d.lining,
      fluidSoundSpeed: need(d.cf, "fluid-speed", "the liquid's sound speed"),
      wedgeSoundSpeed: need(d.cw, "wedge-speed", "the wedge's sound speed"),
      wedgeAngle: need(angle, "wedge-angle", "the wedge angle"),
      wedge: eh === undefined && io === undefined
        ? undefined
        : { elementHeight: eh, indexOffset: io },
    },
    catalogueUncertainties: d.u as WindowUncertainties,
    notes: d.notes,
  };
}

/** The geometry being gathered: stated values first, the registry fills the gaps. */
interface Draft {
  od?: number;
  wall?: number;
  cL?: number;
  cS?: number;
  cf?: number;
  cw?: number;
  notes: string[];
  u: Record<string, unknown>;
  lining?: LiningLayer[];
}

/** Fill the gaps from the registry: catalogue pipe, wall and wedge materials, the liquid. */
async function fromRegistry(
  values: Record<string, unknown>,
  d: Draft,
  catalogueLining: boolean,
): Promise<void> {
  const T = q(values, "temperature", "temperature");
  const p = q(values, "pressure", "pressure") ?? 101325;
  const { registry } = await import("../lib/registry/mod.ts");
  let material = typeof values.material === "string" ? values.material : undefined;
  if (values.standard !== undefined || values.nps !== undefined || values.schedule !== undefined) {
    material = await cataloguePipe(values, d, T, catalogueLining) ?? material;
  }
  if (material !== undefined) {
    const m = registry.material(material);
    d.cL ??= T === undefined
      ? m.longitudinal
      : registry.materialSpeedAt(material, T, "longitudinal");
    if (m.shear !== undefined) {
      d.cS ??= T === undefined ? m.shear : registry.materialSpeedAt(material, T, "shear");
      if (m.shearSpread !== undefined) d.u.wallShearSpeed = m.shearSpread;
    }
    if (m.longitudinalSpread !== undefined) d.u.wallSoundSpeed = m.longitudinalSpread;
    d.notes.push(`wall material: ${m.id} (${m.source}, ${m.basis})`);
  }
  if (typeof values["wedge-material"] === "string") {
    const id = values["wedge-material"];
    const m = registry.material(id);
    d.cw ??= T === undefined ? m.longitudinal : registry.materialSpeedAt(id, T, "longitudinal");
    if (m.longitudinalSpread !== undefined) d.u.wedgeSoundSpeed = m.longitudinalSpread;
    d.notes.push(`wedge material: ${m.id} (${m.source}, ${m.basis})`);
  }
  if (typeof values.liquid === "string" && d.cf === undefined) {
    await liquidSpeed(
      values.liquid,
      need(T, "temperature", "the operating temperature for the liquid"),
      p,
      d,
    );
  }
}

/** The catalogue pipe: fills OD, wall, wall tolerance and lining; returns its material. */
async function cataloguePipe(
  values: Record<string, unknown>,
  d: Draft,
  T: number | undefined,
  catalogueLining: boolean,
): Promise<string | undefined> {
  const { registry } = await import("../lib/registry/mod.ts");
  const { pipe } = await import("../lib/pipe/mod.ts");
  const { defaultStandard } = await import("../lib/pipe/mod.ts");
  // As in a site file: without --standard, the schedule picks B36.19M (…S) or B36.10M.
  let standard = values.standard === undefined ? undefined : String(values.standard);
  if (standard === undefined && values.schedule !== undefined) {
    standard = defaultStandard(String(values.schedule));
    d.notes.push(`pipe standard not given; ${standard} assumed from schedule ${values.schedule}`);
  }
  const pp = pipe({
    standard: standard ?? "",
    nps: String(values.nps ?? ""),
    schedule: String(values.schedule ?? ""),
  });
  d.od ??= pp.outsideDiameter;
  d.wall ??= pp.wallThickness;
  const material = typeof values.material === "string" ? values.material : pp.material;
  d.notes.push(`pipe: ${pp.standard} NPS ${pp.nps} schedule ${pp.schedule} (catalogue)`);
  const tw = pp.tolerances?.wallThickness;
  if (tw && (tw.plus !== undefined || tw.minus !== undefined)) {
    d.u.wallThickness = Math.max(tw.plus ?? 0, tw.minus ?? 0);
  }
  if (catalogueLining && pp.lining.length > 0) {
    d.lining = pp.lining.map((l) => {
      const m = registry.material(l.material);
      return {
        thickness: l.thickness,
        soundSpeed: T === undefined
          ? m.longitudinal
          : registry.materialSpeedAt(l.material, T, "longitudinal"),
      };
    });
    d.notes.push(`lining: ${pp.lining.map((l) => l.material).join(", ")} (catalogue)`);
  }
  return material;
}

/** The liquid's sound speed at T (K) and p (Pa): water by IAPWS-95, others from the registry. */
async function liquidSpeed(liquid: string, Tl: number, p: number, d: Draft): Promise<void> {
  if (liquid === "water") {
    const { water } = await import("../lib/water/mod.ts");
    d.cf = water.soundSpeed(Tl, p);
    d.notes.push("liquid: water, IAPWS-95 (iapws-r6-95)");
    return;
  }
  // a literal specifier: the module graph is known ahead, so no read permission on lib/ is needed
  const mod = await import("../lib/liquids/mod.ts");
  const props = mod.liquidProperties(liquid, Tl, p);
  d.cf = props.soundSpeed;
  if (typeof props.soundSpeedSpread === "number") d.u.fluidSoundSpeed = props.soundSpeedSpread;
  d.notes.push(`liquid: ${liquid} (liquids registry)`);
}

/** Lining layers stated on the command line: one speed per thickness. */
function statedLining(lt: number[] | undefined, ls: number[] | undefined): LiningLayer[] {
  if (lt === undefined) {
    throw new InputError("--lining-thickness", "nothing", "the lining thickness");
  }
  if (ls === undefined) {
    throw new InputError("--lining-speed", "nothing", "the lining sound speed");
  }
  if (lt.length !== ls.length) {
    throw new InputError(
      "--lining-speed",
      `${ls.length} values`,
      `${lt.length}, one per layer`,
    );
  }
  return lt.map((x, i) => ({ thickness: x, soundSpeed: ls[i] }));
}

/**
 * Parse `--traverses` "1,2,4" (or the trade letters "Z,V,W").
 *
 * @param v the option value
 * @param fallback default list
 * @returns traverse counts
 */
export function parseTraverses(v: unknown, fallback: number[]): number[] {
  if (v === undefined) return fallback;
  // Trade letters as in site files: Z (1 traverse), V (2), W (4). Common practice.
  const letters: Record<string, number> = { Z: 1, V: 2, W: 4 };
  const out = String(v).split(",").map((s) => letters[s.trim().toUpperCase()] ?? Number(s.trim()));
  for (const n of out) {
    if (!Number.isInteger(n) || n < 1 || n > 8) {
      throw new InputError(
        "--traverses",
        JSON.stringify(v),
        "whole numbers from 1 to 8 or the letters Z, V, W, e.g. 1,2,4 or Z,V",
      );
    }
  }
  return out;
}

/** Trade name of a mounting by traverse count. */
export function mountingName(n: number): string {
  return n === 1 ? "Z" : n === 2 ? "V" : n === 4 ? "W" : `${n}-traverse`;
}

const HELP = `
spacing — transducer spacing per mounting, the Snell chain and the search window

Usage:
  deno task spacing --od "114.3 mm" --wall "6.02 mm" --wall-speed "5920 m/s" \\
    --wall-shear-speed "3230 m/s" --fluid-speed "1482 m/s" --wedge-speed "2720 m/s" \\
    --wedge-angle "38 deg" --traverses 1,2,4
  deno task spacing --standard "ASME B36.10M" --nps 4 --schedule 40 --liquid water \\
    --temperature "20 degC" --wedge-material acrylic --wedge-angle "38 deg"
${GEOMETRY_HELP}
Mounting and window:
  --traverses 1,2,4          crossings of the bore (1 Z, 2 V, 4 W; up to 8; or Z,V,W); default 2
  --u-fluid-speed "10 m/s"   uncertainty of the liquid speed (search window)
  --u-wall "0.6 mm"          uncertainty of the wall thickness
  --u-wall-speed "50 m/s"    uncertainty of the wall speed (of the mode used)
  --u-wedge-speed "20 m/s"   uncertainty of the wedge speed
  --u-wedge-angle "0.5 deg"  uncertainty of the wedge angle
  --u-wedge-temperature "5 K" --wedge-dcdt "-2.5 m/s/K"   wedge temperature and its dc/dT
  --json                     machine-readable output
  --debug                    stack traces on errors
Exit: 0 ok, 2 bad input, 1 no physical answer (beyond a critical angle).
Spacing is the axial distance between the beam's entry and exit points on the outer pipe
surface. Check the figures on site before drilling, lifting lagging or working on hot or
pressurised lines: follow local codes and your site's permit-to-work.
`;

const WINDOW_OPTIONS: OptionSpec = {
  traverses: { type: "string" },
  "u-fluid-speed": { type: "string" },
  "u-wall": { type: "string" },
  "u-wall-speed": { type: "string" },
  "u-wedge-speed": { type: "string" },
  "u-wedge-angle": { type: "string" },
  "u-wedge-temperature": { type: "string" },
  "wedge-dcdt": { type: "string" },
};

function mm(x: number | undefined, d = 2): string {
  return x === undefined ? "—" : (x * 1000).toFixed(d);
}
function us(x: number | undefined): string {
  return x === undefined ? "—" : (x * 1e6).toFixed(3);
}
/** Words of a line wrapped within 100 columns, continuation lines under `indent`. */
function wrap100(text: string, indent: string): string[] {
  const out: string[] = [];
  const lead = /^ */.exec(text)![0];
  let line = lead;
  for (const w of text.slice(lead.length).split(" ")) {
    if (line && line.length + 1 + w.length > 100) {
      out.push(line);
      line = indent + w;
    } else line = line.trim() ? `${line} ${w}` : line + w;
  }
  return [...out, line];
}

function dg(x: number | undefined): string {
  return x === undefined ? "—" : (x * 180 / Math.PI).toFixed(2);
}

/** The half-widths the search window spans: the catalogue's, overridden by the --u-* options. */
function windowUncertainties(
  values: Record<string, unknown>,
  geo: ResolvedGeometry,
  wallMode: ClampOnPath["wallMode"],
): Record<string, unknown> {
  const given: Record<string, number | undefined> = {
    fluidSoundSpeed: q(values, "u-fluid-speed", "speed"),
    wallThickness: q(values, "u-wall", "length"),
    wedgeSoundSpeed: q(values, "u-wedge-speed", "speed"),
    wedgeAngle: q(values, "u-wedge-angle", "angle"),
  };
  const uws = q(values, "u-wall-speed", "speed");
  if (uws !== undefined) {
    given[wallMode === "shear" ? "wallShearSpeed" : "wallSoundSpeed"] = uws;
  }
  const unc: Record<string, unknown> = { ...geo.catalogueUncertainties };
  for (const [k, v] of Object.entries(given)) if (v !== undefined) unc[k] = v;
  const uT = q(values, "u-wedge-temperature", "temperatureDifference");
  if (uT !== undefined) {
    const dcdt = values["wedge-dcdt"];
    if (typeof dcdt !== "string") {
      throw new InputError("--wedge-dcdt", "nothing", 'the wedge\'s dc/dT, e.g. "-2.5 m/s/K"');
    }
    const m = dcdt.trim().match(/^([-+]?[0-9.eE+-]+)\s*m\/s\/K$/);
    if (!m || !Number.isFinite(Number(m[1]))) {
      throw new InputError(
        "--wedge-dcdt",
        JSON.stringify(dcdt),
        "a value in m/s/K, e.g. -2.5 m/s/K",
      );
    }
    unc.wedgeTemperature = { uncertainty: uT, dSoundSpeedDT: Number(m[1]) };
  }
  return unc;
}

/** The text output: Snell chain, critical angles, modes, the spacing table and the windows. */
function spacingText(
  geo: ResolvedGeometry,
  paths: readonly ClampOnPath[],
  crit: ReturnType<typeof criticalAngles>,
  windows: readonly ReturnType<typeof searchWindow>[] | undefined,
): string[] {
  const p0 = paths[0];
  const out: string[] = [];
  for (const n of geo.notes) out.push(`# ${n}`);
  out.push(
    `Snell chain: wedge ${dg(geo.inputs.wedgeAngle)}° → wall ${p0.wallMode} ${dg(p0.wallAngle)}°${
      p0.liningAngles.map((a, i) => ` → lining ${i + 1} ${dg(a)}°`).join("")
    } → liquid ${dg(p0.fluidAngle)}°`,
  );
  out.push(
    `critical wedge angles: wall longitudinal ${dg(crit.wallLongitudinal)}°, wall shear ${
      dg(crit.wallShear)
    }°, liquid ${crit.fluid === undefined ? "none" : `${dg(crit.fluid)}°`}`,
  );
  out.push(...wrap100(`wall mode rule: ${PRIMARY_MODE_RULE}`, "  "));
  for (const m of p0.modes) {
    out.push(
      ...wrap100(
        m.reachesLiquid
          ? `  ${m.wallMode.padEnd(12)} ${m.role.padEnd(9)} wall angle ${dg(m.wallAngle)}°, ` +
            `arrival ${us(m.totalTime)} µs`
          : `  ${m.wallMode.padEnd(12)} blocked   ${m.blockedBy}`,
        " ".repeat(25),
      ),
    );
  }
  out.push(`inside diameter ${mm(p0.insideDiameter)} mm, bore ${mm(p0.boreDiameter)} mm`);
  out.push("");
  const extra = p0.referenceMarkDistance !== undefined;
  out.push(
    "mounting  traverses  spacing mm  spacing in  liquid path mm  zero-flow time µs" +
      (p0.elementSpacing !== undefined ? "  element spacing mm" : "") +
      (extra ? "  mark distance mm" : ""),
  );
  for (const p of paths) {
    const other = p.modes.find((m) => m.role === "secondary");
    out.push(
      `${mountingName(p.traverses).padEnd(10)}${String(p.traverses).padEnd(11)}${
        mm(p.spacing).padStart(10)
      }${inchesSixteenths(p.spacing).replace(/ in$/, "").padStart(12)}${
        mm(p.fluidPathLength).padStart(16)
      }${us(p.totalTime).padStart(19)}` +
        (p.elementSpacing !== undefined ? mm(p.elementSpacing).padStart(20) : "") +
        (extra ? mm(p.referenceMarkDistance).padStart(18) : "") +
        (other ? `   (${other.wallMode}: ${mm(other.spacing)} mm)` : ""),
    );
  }
  if (windows) {
    for (const [i, w] of windows.entries()) {
      out.push("");
      out.push(
        `search window, ${mountingName(paths[i].traverses)}` +
          ` spacing ${mm(w.spacing)} mm: search ${mm(w.range.min)}–${mm(w.range.max)} mm ` +
          `(worst case), ±${mm(w.rss)} mm root-sum-square`,
      );
      for (const c of w.contributions) {
        out.push(
          `  ${c.input.padEnd(18)} moves the spacing by ${mm(Math.abs(c.contribution))} mm: ` +
            (c.ifHigher === "no change"
              ? "no effect on this path"
              : `if the true value is higher, move ${c.ifHigher}`) +
            (c.note ? ` (${c.note})` : ""),
        );
      }
    }
  }
  return out;
}

async function main(): Promise<number> {
  const { values } = parseCli(Deno.args, { ...GEOMETRY_OPTIONS, ...WINDOW_OPTIONS }, HELP);
  const geo = await resolveGeometry(values);
  const traverses = parseTraverses(values.traverses, [2]);
  const paths: ClampOnPath[] = traverses.map((n) => clampOnPath({ ...geo.inputs, traverses: n }));
  const crit = criticalAngles(geo.inputs);

  const unc = windowUncertainties(values, geo, paths[0].wallMode);
  const windows = Object.keys(unc).length === 0
    ? undefined
    : paths.map((p) => searchWindow({ ...geo.inputs, traverses: p.traverses }, unc));

  if (values.json) {
    console.log(JSON.stringify(
      {
        units: "SI (m, s, m/s, rad)",
        inputs: geo.inputs,
        notes: geo.notes,
        criticalAngles: crit,
        primaryModeRule: PRIMARY_MODE_RULE,
        paths,
        searchWindows: windows,
      },
      null,
      2,
    ));
    return 0;
  }
  const out = spacingText(geo, paths, crit, windows);
  const given = givenLine(values, [
    ["od", "length"],
    ["wall", "length"],
    ["temperature", "temperature"],
    ["pressure", "pressure"],
  ]);
  if (given) out.push(given);
  console.log(out.join("\n"));
  return 0;
}

if (import.meta.main) runMain(main);
