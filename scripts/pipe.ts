/**
 * Look up or describe a pipe: catalogue size and schedule, or measured outside diameter /
 * circumference and wall, with optional lining; or list what the catalogue holds.
 *
 * @module
 */
import { givenLine, parseCli, runMain } from "./_cli.ts";
import { InputError } from "../lib/errors.ts";
import { inUnitOf, parseQuantity } from "../lib/units.ts";
import { defaultRegistry } from "../lib/registry/mod.ts";
import { defaultStandard, pipe, type PipeLiningLayer, type ResolvedPipe } from "../lib/pipe/mod.ts";

const HELP = `
pipe: look up or describe a pipe (geometry in SI inside, shown in mm).

Catalogue:
  pipe --standard "ASME B36.10M" --nps 4 --schedule 40
  pipe --standard hdpe --nps 8 --schedule "DR 11"
Measured:
  pipe --od "114.3 mm" --wall "6.02 mm" --material carbon-steel
  pipe --circumference "359 mm" [--tape-thickness "0.2 mm"] --wall "6 mm" --material carbon-steel
       [--od-uncertainty "0.3 mm"] [--wall-uncertainty "0.1 mm"] [--tolerance-from carbon-steel]
Lining (either way; replaces a standard's default lining, "none" removes it):
  --lining-material cement-mortar --lining-thickness "8 mm"
Listing:
  pipe --list                                    standards in the catalogue
  pipe --list --standard "ASME B36.10M"          sizes of a standard
  pipe --list --standard "ASME B36.10M" --nps 4  schedules at a size

Options:
  --standard TEXT         standard name, id or alias (ASME B36.10M, B36.19M, D1785, F441, hdpe,
                          AWWA C151, B88)
  --nps SIZE              nominal size: 4, 1-1/2, "1 1/2", 1.5
  --schedule TEXT         schedule, class, DR or type: 40, "Sch 40", STD, XS, 40S, "DR 11", L,
                          "PC 350"
  --material ID           pipe material id (required for a measured pipe)
  --od LENGTH             measured outside diameter ("114.3 mm", "4.5 in")
  --circumference LENGTH  circumference taped round the pipe; OD = C/pi - tape thickness
  --tape-thickness LENGTH thickness of the tape (default 0)
  --wall LENGTH           measured wall thickness
  --od-uncertainty LENGTH, --wall-uncertainty LENGTH   stated ± of the measurements
  --tolerance-from TEXT   manufacturing tolerances of a standard, material or tolerance set
  --lining-material ID    lining material id, or "none"
  --lining-thickness LENGTH
  --list                  list the catalogue (see above)
  --json                  machine-readable output
  --debug                 stack traces on errors
  -h, --help              this text

Exit codes: 0 ok, 2 bad input (a miss names what exists nearby), 1 no physical answer.
Work on live lines is hazardous: see docs/pipe.md before taping or gauging a pipe on site.
`;

const OPTIONS = {
  standard: { type: "string" },
  nps: { type: "string" },
  schedule: { type: "string" },
  material: { type: "string" },
  od: { type: "string" },
  circumference: { type: "string" },
  "tape-thickness": { type: "string" },
  wall: { type: "string" },
  "od-uncertainty": { type: "string" },
  "wall-uncertainty": { type: "string" },
  "tolerance-from": { type: "string" },
  "lining-material": { type: "string" },
  "lining-thickness": { type: "string" },
  list: { type: "boolean" },
} as const;

type Values = Record<string, string | boolean | string[] | undefined>;

function str(v: Values, k: string): string | undefined {
  const x = v[k];
  return typeof x === "string" ? x : undefined;
}

function len(v: Values, k: string): number | undefined {
  const x = str(v, k);
  return x === undefined ? undefined : parseQuantity(x, "length", `--${k}`);
}

function mmText(x: number | undefined, digits = 3): string {
  return x === undefined ? "-" : (x * 1000).toFixed(digits);
}

function lining(v: Values): PipeLiningLayer[] | undefined {
  const m = str(v, "lining-material");
  const t = str(v, "lining-thickness");
  if (m === undefined && t === undefined) return undefined;
  if (m !== undefined && m.toLowerCase() === "none") {
    if (t !== undefined) {
      throw new InputError("--lining-thickness", t, "nothing with --lining-material none");
    }
    return [];
  }
  if (m === undefined) {
    throw new InputError(
      "--lining-material",
      "nothing",
      "a lining material id with --lining-thickness",
    );
  }
  if (t === undefined) {
    throw new InputError(
      "--lining-thickness",
      "nothing",
      "a lining thickness with --lining-material",
    );
  }
  return [{ material: m, thickness: parseQuantity(t, "length", "--lining-thickness") }];
}

function list(v: Values): void {
  const reg = defaultRegistry();
  const std = str(v, "standard");
  const nps = str(v, "nps");
  if (std === undefined) {
    const all = reg.pipeStandards();
    if (v.json) return console.log(JSON.stringify(all, null, 2));
    for (const s of all) {
      console.log(
        `${s.standard.padEnd(30)} ${s.material.padEnd(20)} ${s.basis.padEnd(12)} ` +
          `${s.sizes[0]}…${s.sizes[s.sizes.length - 1]}  ${s.series.flat().join(" ")}`,
      );
    }
    return;
  }
  const info = reg.pipeStandard(std);
  if (nps === undefined) {
    const rows = info.sizes.map((size) => {
      const recs = reg.pipes({ standard: info.id, nps: size });
      return {
        nps: size,
        outsideDiameter: recs[0].outsideDiameter,
        schedules: recs.map((r) => r.schedule),
      };
    });
    if (v.json) return console.log(JSON.stringify({ standard: info, sizes: rows }, null, 2));
    console.log(`${info.standard}: ${info.title} (${info.sizeSystem}; OD in mm)`);
    for (const r of rows) {
      console.log(
        `  ${r.nps.padEnd(7)} ${mmText(r.outsideDiameter, 2).padStart(9)}  ${
          r.schedules.join(" ")
        }`,
      );
    }
    return;
  }
  const recs = reg.pipes({ standard: info.id, nps });
  if (recs.length === 0) {
    // Let the catalogue lookup explain the miss (nearby sizes).
    reg.pipe({ standard: info.id, nps, schedule: info.series[0][0] });
  }
  if (v.json) return console.log(JSON.stringify(recs, null, 2));
  console.log(`${info.standard} ${recs[0].sizeLabel}: OD ${mmText(recs[0].outsideDiameter, 2)} mm`);
  console.log(`  ${"schedule".padEnd(9)} ${"wall mm".padStart(8)} ${"ID mm".padStart(9)}  basis`);
  for (const r of recs) {
    console.log(
      `  ${r.schedule.padEnd(9)} ${mmText(r.wallThickness, 2).padStart(8)} ` +
        `${mmText(r.insideDiameter, 2).padStart(9)}  ${r.provenance.wallThickness.basis}`,
    );
  }
}

/**
 * Show a pipe. Lengths in mm, and beside them in the unit the user wrote a length in when it is
 * not metric (`--od "4.5 in"` → inches), else in inches for catalogue sizes (NPS are inch sizes).
 */
function show(p: ResolvedPipe, written?: string): void {
  const head = p.origin === "catalogue"
    ? `${p.standard} ${p.sizeLabel}, ${p.schedule} (${p.material})`
    : `measured pipe (${p.material})`;
  console.log(head);
  const row = (label: string, value: string) => console.log(`  ${label.padEnd(20)} ${value}`);
  const metric = written === undefined || /(^|\s)(k|c|m|µ|u)?m\s*$/.test(written);
  const echo = (x: number) => {
    if (!metric) {
      const u = inUnitOf(x, written!, "length", 5);
      if (u) return `  (${u})`;
    }
    return p.origin === "catalogue" || !metric ? `  (${(x / 0.0254).toFixed(3)} in)` : "";
  };
  row("outside diameter", `${mmText(p.outsideDiameter)} mm${echo(p.outsideDiameter)}`);
  row("wall thickness", `${mmText(p.wallThickness)} mm${echo(p.wallThickness)}`);
  row("inside diameter", `${mmText(p.insideDiameter)} mm${echo(p.insideDiameter)}`);
  p.lining.forEach((l, i) => row(`lining ${i + 1}`, `${l.material} ${mmText(l.thickness)} mm`));
  if (p.lining.length) row("bore diameter", `${mmText(p.boreDiameter)} mm`);
  const t = p.tolerances;
  if (t) {
    const sides = (s: { plus?: number; minus?: number }) =>
      `+${s.plus === undefined ? "(not limited)" : mmText(s.plus)} / -${
        s.minus === undefined ? "(not limited)" : mmText(s.minus)
      } mm`;
    const from = t.origin === "measurement"
      ? "stated measurement uncertainty"
      : `${t.set}, ${t.source}, ${t.basis}`;
    row("tolerance OD", `${sides(t.outsideDiameter)}  (${from})`);
    row("tolerance wall", sides(t.wallThickness));
  }
  console.log("  trace:");
  for (const e of p.trace) {
    const v = typeof e.value === "number" ? `${mmText(e.value)} mm` : e.value;
    console.log(`    ${e.quantity}: ${v} [${e.source}, ${e.basis}]`);
  }
  for (const w of p.warnings) console.log(`  warning: ${w.message}`);
}

runMain(() => {
  const { values: v, positionals } = parseCli(Deno.args, OPTIONS, HELP);
  if (positionals.length) {
    throw new InputError("arguments", positionals.join(" "), "options only (see --help)");
  }
  if (v.list) return list(v);
  const lin = lining(v);
  const catalogue = ["standard", "nps", "schedule"].some((k) => str(v, k) !== undefined);
  let p: ResolvedPipe;
  if (catalogue) {
    for (const k of ["od", "circumference", "wall", "tape-thickness"]) {
      if (str(v, k) !== undefined) {
        throw new InputError(`--${k}`, str(v, k)!, "nothing with --standard/--nps/--schedule");
      }
    }
    for (const k of ["nps", "schedule"]) {
      if (str(v, k) === undefined) {
        throw new InputError(`--${k}`, "nothing", "--nps and --schedule together");
      }
    }
    // As in a site file: without --standard, the schedule picks B36.19M (…S) or B36.10M.
    let standard = str(v, "standard");
    if (standard === undefined) {
      standard = defaultStandard(str(v, "schedule")!);
      console.error(
        `note: --standard not given; ${standard} assumed from schedule ${str(v, "schedule")}`,
      );
    }
    p = pipe({
      standard,
      nps: str(v, "nps")!,
      schedule: str(v, "schedule")!,
      ...(str(v, "material") ? { material: str(v, "material") } : {}),
      ...(lin ? { lining: lin } : {}),
    });
  } else {
    const od = len(v, "od");
    const c = len(v, "circumference");
    const wall = len(v, "wall");
    if (od === undefined && c === undefined && wall === undefined) {
      throw new InputError(
        "arguments",
        "no pipe",
        "--standard/--nps/--schedule, or --od (or --circumference) with --wall, or --list",
      );
    }
    if (wall === undefined) {
      throw new InputError("--wall", "nothing", 'a wall thickness such as "6.02 mm"');
    }
    const material = str(v, "material");
    if (material === undefined) {
      throw new InputError("--material", "nothing", 'a pipe material id such as "carbon-steel"');
    }
    const odU = len(v, "od-uncertainty");
    const wallU = len(v, "wall-uncertainty");
    const tape = len(v, "tape-thickness");
    p = pipe({
      ...(od !== undefined ? { outsideDiameter: od } : {}),
      ...(c !== undefined ? { circumference: c } : {}),
      ...(tape !== undefined ? { tapeThickness: tape } : {}),
      wallThickness: wall,
      material,
      ...(lin ? { lining: lin } : {}),
      ...(odU !== undefined || wallU !== undefined
        ? {
          uncertainty: {
            ...(odU !== undefined ? { outsideDiameter: odU } : {}),
            ...(wallU !== undefined ? { wallThickness: wallU } : {}),
          },
        }
        : {}),
      ...(str(v, "tolerance-from") ? { toleranceFrom: str(v, "tolerance-from") } : {}),
    });
  }
  if (v.json) return console.log(JSON.stringify(p, null, 2));
  show(p, ["od", "circumference", "wall"].map((k) => str(v, k)).find((x) => x !== undefined));
  const given = givenLine(v, [
    ["od", "length"],
    ["circumference", "length"],
    ["wall", "length"],
    ["tape-thickness", "length"],
  ]);
  if (given) console.log(given);
});
