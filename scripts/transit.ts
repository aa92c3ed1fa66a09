/**
 * Transit times and Δt over a velocity or flow range, the smallest resolvable velocity and the
 * wall-borne signal check. Run with --help.
 *
 * @module
 */
import { InputError } from "../lib/errors.ts";
import { inUnitOf, parseQuantity } from "../lib/units.ts";
import { clampOnPath } from "../lib/acoustics/path.ts";
import {
  flowRangeTimes,
  minimumResolvableVelocity,
  wallBorneSignal,
} from "../lib/acoustics/transit.ts";
import { givenLine, type OptionSpec, parseCli, runMain } from "./_cli.ts";
import {
  GEOMETRY_HELP,
  GEOMETRY_OPTIONS,
  mountingName,
  parseTraverses,
  resolveGeometry,
} from "./spacing.ts";

const HELP = `
transit — transit times and Δt over a velocity or flow range

Usage:
  deno task transit --od "114.3 mm" --wall "6.02 mm" --wall-speed "5920 m/s" \\
    --wall-shear-speed "3230 m/s" --fluid-speed "1482 m/s" --wedge-speed "2720 m/s" \\
    --wedge-angle "38 deg" --traverses 2 --velocity "0.1 m/s,1 m/s,3 m/s" \\
    --timing-resolution "100 ps"
  deno task transit --standard "ASME B36.10M" --nps 4 --schedule 40 --liquid water \\
    --temperature "20 degC" --wedge-material acrylic --wedge-angle "38 deg" --flow "2 L/s,20 L/s,40 L/s"
${GEOMETRY_HELP}
Flow:
  --traverses 2              crossings of the bore (one value; default 2)
  --velocity "0.1 m/s,1 m/s" area-mean velocities, or
  --flow "20 L/s,90 L/s"     volume flow rates (through the bore)
  --profile-factor 0.93      area-mean / path-mean velocity (default 1: velocities are path means)
  --timing-resolution "100 ps"  timing resolution or zero offset: smallest resolvable velocity
                             and the fraction of the minimum-flow Δt it represents
  --frequency "1 MHz"        transducer frequency: checks the wall-borne signal
  --periods 3                margin of the wall-borne check, in signal periods (default 3)
  --json                     machine-readable output
Exit: 0 ok, 2 bad input, 1 no physical answer.
`;

const FLOW_OPTIONS: OptionSpec = {
  traverses: { type: "string" },
  velocity: { type: "string" },
  flow: { type: "string" },
  "profile-factor": { type: "string" },
  "timing-resolution": { type: "string" },
  frequency: { type: "string" },
  periods: { type: "string" },
};

function numberOption(v: unknown, name: string, accepted: string): number | undefined {
  if (v === undefined) return undefined;
  const x = Number(v);
  if (typeof v !== "string" || v.trim() === "" || !Number.isFinite(x)) {
    throw new InputError(`--${name}`, JSON.stringify(v), accepted);
  }
  return x;
}

async function main(): Promise<number> {
  const { values } = parseCli(Deno.args, { ...GEOMETRY_OPTIONS, ...FLOW_OPTIONS }, HELP);
  const geo = await resolveGeometry(values);
  const tr = parseTraverses(values.traverses, [2]);
  if (tr.length !== 1) {
    throw new InputError("--traverses", String(values.traverses), "one traverse count");
  }
  if ((values.velocity === undefined) === (values.flow === undefined)) {
    throw new InputError(
      "--velocity/--flow",
      values.velocity === undefined ? "neither" : "both",
      "one of --velocity or --flow",
    );
  }
  const isFlow = values.flow !== undefined;
  const raw = String(isFlow ? values.flow : values.velocity);
  const xs = raw.split(",").map((s) =>
    parseQuantity(s.trim(), isFlow ? "flowRate" : "speed", isFlow ? "--flow" : "--velocity")
  );
  const k = numberOption(values["profile-factor"], "profile-factor", "a number such as 0.93");
  const res = values["timing-resolution"] === undefined
    ? undefined
    : parseQuantity(String(values["timing-resolution"]), "time", "--timing-resolution");
  const f = values.frequency === undefined
    ? undefined
    : parseQuantity(String(values.frequency), "frequency", "--frequency");
  const periods = numberOption(values.periods, "periods", "a number of periods such as 3");

  const path = clampOnPath({ ...geo.inputs, traverses: tr[0] });
  const range = flowRangeTimes(path, {
    flowRates: isFlow ? xs : undefined,
    velocities: isFlow ? undefined : xs,
    profileFactor: k,
    timingOffset: res,
  });
  const vmin = res === undefined ? undefined : minimumResolvableVelocity(path, res);
  const wall = f === undefined ? undefined : wallBorneSignal(path, { frequency: f, periods });

  if (values.json) {
    console.log(JSON.stringify(
      {
        units: "SI (m, s, m/s, m^3/s, rad)",
        inputs: geo.inputs,
        notes: geo.notes,
        path,
        range,
        minimumResolvableVelocity: vmin,
        wallBorne: wall,
      },
      null,
      2,
    ));
    return 0;
  }
  const out: string[] = [];
  for (const n of geo.notes) out.push(`# ${n}`);
  out.push(
    `${mountingName(path.traverses)} mounting, ${path.traverses} ${
      path.traverses === 1 ? "traverse" : "traverses"
    }: spacing ${(path.spacing * 1000).toFixed(2)} mm, liquid path ${
      (path.fluidPathLength * 1000).toFixed(2)
    } mm, liquid angle ${
      (path.fluidAngle * 180 / Math.PI).toFixed(2)
    }°, wall mode ${path.wallMode}`,
  );
  out.push(
    `profile factor ${range.profileFactor}; bore area ${(range.area * 1e4).toFixed(3)} cm²`,
  );
  out.push("");
  // the flows or velocities as the user wrote them, in their unit, when it is not the table's
  const first = raw.split(",")[0].trim();
  const echoOf = (p: (typeof range.points)[number]) =>
    inUnitOf(isFlow ? p.flowRate : p.areaVelocity, first, isFlow ? "flowRate" : "speed", 5);
  const echoUnit = range.points.length
    ? echoOf(range.points[0])?.split(" ").slice(1).join(" ")
    : "";
  const showEcho = echoUnit !== undefined && echoUnit !== "" &&
    !["L/s", "l/s", "m/s"].includes(echoUnit);
  out.push(
    (showEcho ? `given ${echoUnit}`.padEnd(13) : "") +
      "flow L/s   area v m/s  path v m/s  upstream µs    downstream µs  Δt ns       Δt linear ns",
  );
  for (const p of range.points) {
    out.push(
      [
        showEcho ? (echoOf(p)?.split(" ")[0] ?? "").padEnd(13) : "",
        (p.flowRate * 1000).toFixed(3).padEnd(11),
        p.areaVelocity.toFixed(4).padEnd(12),
        p.velocity.toFixed(4).padEnd(12),
        (p.upstream * 1e6).toFixed(6).padEnd(14),
        (p.downstream * 1e6).toFixed(6).padEnd(15),
        (p.deltaT * 1e9).toFixed(4).padEnd(12),
        (p.deltaTLinear * 1e9).toFixed(4),
      ].join(""),
    );
  }
  out.push("");
  out.push(
    `Δt at minimum ${(range.minimum.deltaT * 1e9).toFixed(4)} ns, design ${
      (range.design.deltaT * 1e9).toFixed(4)
    } ns, maximum ${(range.maximum.deltaT * 1e9).toFixed(4)} ns`,
  );
  if (vmin !== undefined && res !== undefined) {
    out.push(
      `timing resolution ${(res * 1e12).toFixed(1)} ps ↔ path velocity ${
        vmin.toPrecision(3)
      } m/s; ${((range.offsetFraction ?? 0) * 100).toPrecision(3)} % of the minimum-flow Δt`,
    );
  }
  if (wall) {
    out.push(
      `wall-borne signal at ${(wall.wallArrival * 1e6).toFixed(3)} µs, liquid at ${
        (wall.liquidArrival * 1e6).toFixed(3)
      } µs (separation ${(wall.separation * 1e6).toFixed(3)} µs, margin ${
        (wall.margin * 1e6).toFixed(3)
      } µs): ${
        wall.overlaps ? "too close: the wall signal may mask the liquid one" : "well apart"
      }`,
    );
  }
  const given = givenLine(values, [
    ["temperature", "temperature"],
    ["pressure", "pressure"],
    ["timing-resolution", "time"],
    ["frequency", "frequency"],
  ]);
  if (given) out.push(given);
  console.log(out.join("\n"));
  return 0;
}

if (import.meta.main) runMain(main);
