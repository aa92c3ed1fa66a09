/**
 * From raw parsed data (YAML, JSON or a CSV row) to a validated {@link SiteInput}: every key,
 * every unit, every plausibility limit and the cross-field checks.
 *
 * @module
 */
import { parseQuantityFull } from "../units.ts";
import { InputError } from "../errors.ts";
import { defaultStandard } from "../pipe/resolve.ts";
import {
  type Ctx,
  describe,
  expectRecord,
  fail,
  ident,
  type Limit,
  nps,
  quantity,
  required,
  requiredQuantity,
  schedule,
  text,
  traverses,
} from "./read_fields.ts";
import {
  type SiteDefault,
  type SiteFlow,
  type SiteFluid,
  type SiteInput,
  SiteInputSchema,
  type SitePipe,
  type SiteRun,
  type SiteTransducer,
  WATER_FORMULATIONS,
} from "./schema.ts";

/** Standard atmosphere, Pa: the pressure assumed when a site gives none. */
export const STANDARD_ATMOSPHERE = 101325;

/** Mountings evaluated when a site names none: 1 and 2 traverses (Z and V). */
export const DEFAULT_MOUNTINGS: readonly number[] = [1, 2];

/**
 * Plausibility limits of the reader, SI. They catch slips (a diameter in metres written as
 * millimetres, 1e300) and are far wider than any formulation's validity range, which the plan
 * checks later.
 */
export const LIMITS = {
  outsideDiameter: { min: 1e-3, max: 10, unit: "mm" },
  circumference: { min: Math.PI * 1e-3, max: Math.PI * 10, unit: "mm" },
  tapeThickness: { min: 0, max: 0.01, unit: "mm" },
  wallThickness: { min: 0, max: 0.5, unit: "mm", minOpen: true },
  roughness: { min: 0, max: 0.05, unit: "mm" },
  soundSpeed: { min: 100, max: 20000, unit: "m/s" },
  temperature: { min: 0, max: 1000, unit: "degC", minOpen: true },
  pressure: { min: 0, max: 1e9, unit: "bar", minOpen: true },
  salinity: { min: 0, max: 100, unit: "" },
  density: { min: 1, max: 30000, unit: "kg/m^3" },
  kinematicViscosity: { min: 1e-9, max: 1, unit: "mm^2/s" },
  // Floors far below any real flow: a rate of 1e-320 m³/s would make Re and 64/Re overflow.
  flowRate: { min: 1e-12, max: 1000, unit: "m^3/s", minOpen: true },
  velocity: { min: 1e-9, max: 100, unit: "m/s", minOpen: true },
  wedgeAngle: { min: 0, max: Math.PI / 2, unit: "deg", minOpen: true, maxOpen: true },
  frequency: { min: 1e3, max: 1e8, unit: "kHz" },
  timingResolution: { min: 0, max: 1e-3, unit: "ns", minOpen: true },
  zeroOffset: { min: -1e-3, max: 1e-3, unit: "us" },
  fixedDelay: { min: 0, max: 1e-2, unit: "us" },
  wedgeTemperatureCoefficient: { min: -100, max: 100, unit: "m/s" },
  elementHeight: { min: 0, max: 0.2, unit: "mm", minOpen: true },
  indexOffset: { min: -0.5, max: 0.5, unit: "mm" },
  runLength: { min: 0, max: 10000, unit: "m", minOpen: true },
  position: { min: 0, max: 10000, unit: "m" },
  orientation: { min: -2 * Math.PI, max: 2 * Math.PI, unit: "deg" },
  targetUncertainty: { min: 0, max: 1, unit: "%", minOpen: true, maxOpen: true },
  content: { min: 0, max: 1, unit: "%", maxOpen: true },
} as const satisfies Record<string, Limit>;

function sub(ctx: Ctx, obj: Record<string, unknown>, key: string, path: string) {
  const v = obj[key];
  if (v === undefined) return undefined;
  return expectRecord(ctx, v, path ? `${path}.${key}` : key);
}

async function readPipe(ctx: Ctx, top: Record<string, unknown>, defaults: SiteDefault[]) {
  const raw = top.pipe;
  if (raw === undefined) {
    fail(
      ctx,
      "pipe",
      "nothing",
      "the pipe: nps and schedule, or outsideDiameter and wallThickness",
    );
  }
  const o = expectRecord(ctx, raw, "pipe");
  const p: Partial<SitePipe> = {};
  const sizes = await readPipeSizes(ctx, o, p, defaults);
  const mwt = await readPipeWall(ctx, o, p);
  const lin = await readPipeLining(ctx, o, p);
  checkWallWithinRadius(ctx, o, p, { ...sizes, mwt, linThickness: lin?.thickness });
  return p as SitePipe;
}

/** Catalogue size (standard, nps, schedule) and measured size, and the rules across them. */
async function readPipeSizes(
  ctx: Ctx,
  o: Record<string, unknown>,
  p: Partial<SitePipe>,
  defaults: SiteDefault[],
): Promise<{ od?: number; circ?: number; wall?: number }> {
  const L = LIMITS;
  const standard = text(ctx, o, "standard", "pipe", 40);
  const n = o.nps === undefined ? undefined : nps(ctx, o.nps, "pipe.nps");
  const s = o.schedule === undefined ? undefined : schedule(ctx, o.schedule, "pipe.schedule");
  const od = await quantity(
    ctx,
    o,
    "outsideDiameter",
    "pipe",
    "length",
    L.outsideDiameter,
    "an outside diameter",
  );
  const circ = await quantity(
    ctx,
    o,
    "circumference",
    "pipe",
    "length",
    L.circumference,
    "a circumference",
  );
  const tape = await quantity(
    ctx,
    o,
    "tapeThickness",
    "pipe",
    "length",
    L.tapeThickness,
    "the thickness of the tape round the pipe",
  );
  if (tape !== undefined && circ === undefined) {
    fail(
      ctx,
      "pipe.tapeThickness",
      "a tape thickness without a circumference",
      "pipe.circumference",
    );
  }
  const wall = await quantity(
    ctx,
    o,
    "wallThickness",
    "pipe",
    "length",
    L.wallThickness,
    "a wall thickness",
  );
  const catalogue = n !== undefined || s !== undefined || standard !== undefined;
  const measured = od !== undefined || circ !== undefined || wall !== undefined;
  if (catalogue) {
    if (n === undefined) fail(ctx, "pipe.nps", "nothing", "a nominal pipe size with pipe.schedule");
    if (s === undefined) fail(ctx, "pipe.schedule", "nothing", "a schedule with pipe.nps");
  }
  if (measured) {
    if (od !== undefined && circ !== undefined) {
      fail(ctx, "pipe.circumference", "both outsideDiameter and circumference", "one of them");
    }
    if (od === undefined && circ === undefined) {
      fail(
        ctx,
        "pipe.outsideDiameter",
        "nothing",
        "an outside diameter or circumference with pipe.wallThickness",
      );
    }
    if (wall === undefined) {
      fail(
        ctx,
        "pipe.wallThickness",
        "nothing",
        "the wall thickness with a measured outside diameter or circumference",
      );
    }
  }
  if (!catalogue && !measured) {
    fail(
      ctx,
      "pipe",
      "neither catalogue nor measured sizes",
      "nps and schedule, or outsideDiameter (or circumference) and wallThickness",
    );
  }
  p.geometry = measured ? "measured" : "catalogue";
  if (catalogue) {
    p.nps = n;
    p.schedule = s;
    if (standard !== undefined) p.standard = standard;
    else {
      // Stainless schedules carry an S suffix (ASME B36.19M); the rest are B36.10M. Common practice.
      p.standard = defaultStandard(s!);
      defaults.push({
        field: "pipe.standard",
        value: p.standard,
        message: `pipe standard not given; ${p.standard} assumed from schedule ${s}`,
      });
    }
  }
  if (od !== undefined) p.outsideDiameter = od;
  if (circ !== undefined) p.circumference = circ;
  if (tape !== undefined) p.tapeThickness = tape;
  if (wall !== undefined) p.wallThickness = wall;
  return { od, circ, wall };
}

/** Material, wall sound speeds, the gauged wall and roughness; returns the gauged wall. */
async function readPipeWall(
  ctx: Ctx,
  o: Record<string, unknown>,
  p: Partial<SitePipe>,
): Promise<number | undefined> {
  const L = LIMITS;
  const material = ident(ctx, o, "material", "pipe", "a material");
  if (material !== undefined) p.material = material;
  const ws = await quantity(
    ctx,
    o,
    "wallSoundSpeed",
    "pipe",
    "speed",
    L.soundSpeed,
    "a sound speed",
  );
  if (ws !== undefined) p.wallSoundSpeed = ws;
  const wss = await quantity(
    ctx,
    o,
    "wallShearSpeed",
    "pipe",
    "speed",
    L.soundSpeed,
    "a sound speed",
  );
  if (wss !== undefined) p.wallShearSpeed = wss;
  const mwt = await quantity(
    ctx,
    o,
    "measuredWallThickness",
    "pipe",
    "length",
    L.wallThickness,
    "a wall thickness",
  );
  if (mwt !== undefined) p.measuredWallThickness = mwt;
  const rough = await quantity(ctx, o, "roughness", "pipe", "length", L.roughness, "a roughness");
  if (rough !== undefined) p.roughness = rough;
  return mwt;
}

/** The lining, when given; returns its raw section for messages. */
async function readPipeLining(
  ctx: Ctx,
  o: Record<string, unknown>,
  p: Partial<SitePipe>,
): Promise<Record<string, unknown> | undefined> {
  const L = LIMITS;
  const lin = sub(ctx, o, "lining", "pipe");
  if (lin) {
    const lm = required(
      ctx,
      ident(ctx, lin, "material", "pipe.lining", "a lining material"),
      "pipe.lining.material",
      'a lining material id such as "cement-mortar"',
    );
    const lt = await requiredQuantity(
      ctx,
      lin,
      "thickness",
      "pipe.lining",
      "length",
      L.wallThickness,
      "a lining thickness",
    );
    const lc = await quantity(
      ctx,
      lin,
      "soundSpeed",
      "pipe.lining",
      "speed",
      L.soundSpeed,
      "a sound speed",
    );
    p.lining = lc === undefined
      ? { material: lm, thickness: lt }
      : { material: lm, thickness: lt, soundSpeed: lc };
  }
  return lin;
}

/** Wall (and lining) thinner than the radius, where the outside diameter is known here. */
function checkWallWithinRadius(
  ctx: Ctx,
  o: Record<string, unknown>,
  p: Partial<SitePipe>,
  k: { od?: number; circ?: number; wall?: number; mwt?: number; linThickness?: unknown },
): void {
  const { od, circ, wall, mwt } = k;
  const outer = od ?? (circ !== undefined ? circ / Math.PI : undefined);
  if (outer !== undefined) {
    const liner = p.lining?.thickness ?? 0;
    for (const [key, t] of [["wallThickness", wall], ["measuredWallThickness", mwt]] as const) {
      if (t !== undefined && t + liner >= outer / 2) {
        fail(
          ctx,
          `pipe.${key}`,
          `${describe(o[key])}${liner ? ` plus lining ${describe(k.linThickness)}` : ""}`,
          `less than the outside radius ${fmtMm(outer / 2)} mm`,
        );
      }
    }
  }
}

function fmtMm(x: number): string {
  return String(Number((x * 1000).toPrecision(6)));
}

function salinity(ctx: Ctx, raw: unknown): number {
  const field = "fluid.salinity";
  let x: number | undefined;
  if (typeof raw === "number") x = raw;
  else if (typeof raw === "string" && /^\s*\d+(?:\.\d*)?\s*$/.test(raw)) x = Number(raw);
  const accepted = "a practical salinity (a number on the PSS-78 scale) from 0 to 100, such as 35";
  if (x === undefined || !Number.isFinite(x)) fail(ctx, field, describe(raw), accepted);
  if (x < LIMITS.salinity.min || x > LIMITS.salinity.max) fail(ctx, field, describe(raw), accepted);
  return x;
}

async function readFluid(ctx: Ctx, top: Record<string, unknown>, defaults: SiteDefault[]) {
  const raw = top.fluid;
  if (raw === undefined) fail(ctx, "fluid", "nothing", "the liquid, its temperature and pressure");
  const o = expectRecord(ctx, raw, "fluid");
  const L = LIMITS;
  const liquid = required(
    ctx,
    ident(ctx, o, "liquid", "fluid", "a liquid"),
    "fluid.liquid",
    'a liquid id such as "water"',
  );
  const temperature = await requiredQuantity(
    ctx,
    o,
    "temperature",
    "fluid",
    "temperature",
    L.temperature,
    "a temperature",
  );
  let pressure = await quantity(
    ctx,
    o,
    "pressure",
    "fluid",
    "pressure",
    L.pressure,
    "an absolute pressure",
  );
  if (pressure === undefined) {
    pressure = STANDARD_ATMOSPHERE;
    defaults.push({
      field: "fluid.pressure",
      value: STANDARD_ATMOSPHERE,
      message: "fluid pressure not given; one standard atmosphere (101325 Pa absolute) assumed",
    });
  }
  const f: SiteFluid = { liquid, temperature, pressure };
  const seawater = /^sea-?water$/.test(liquid);
  if (o.salinity !== undefined) {
    if (liquid === "water") {
      fail(
        ctx,
        "fluid.salinity",
        describe(o.salinity),
        "no salinity for fresh water; write liquid: seawater",
      );
    }
    f.salinity = salinity(ctx, o.salinity);
  } else if (seawater) {
    fail(ctx, "fluid.salinity", "nothing", "a practical salinity for seawater, such as 35");
  }
  const tr = sub(ctx, o, "temperatureRange", "fluid");
  if (tr) {
    const min = await requiredQuantity(
      ctx,
      tr,
      "min",
      "fluid.temperatureRange",
      "temperature",
      L.temperature,
      "a temperature",
    );
    const max = await requiredQuantity(
      ctx,
      tr,
      "max",
      "fluid.temperatureRange",
      "temperature",
      L.temperature,
      "a temperature",
    );
    if (min > max) {
      fail(
        ctx,
        "fluid.temperatureRange.min",
        describe(tr.min),
        `a temperature not above max ${describe(tr.max)}`,
      );
    }
    if (temperature < min || temperature > max) {
      fail(
        ctx,
        "fluid.temperatureRange",
        `${describe(tr.min)} to ${describe(tr.max)}`,
        `a range that holds fluid.temperature ${describe(o.temperature)}`,
      );
    }
    f.temperatureRange = { min, max };
  }
  const c = await quantity(ctx, o, "soundSpeed", "fluid", "speed", L.soundSpeed, "a sound speed");
  if (c !== undefined) f.soundSpeed = c;
  const rho = await quantity(ctx, o, "density", "fluid", "density", L.density, "a density");
  if (rho !== undefined) f.density = rho;
  const nu = await quantity(
    ctx,
    o,
    "kinematicViscosity",
    "fluid",
    "kinematicViscosity",
    L.kinematicViscosity,
    "a kinematic viscosity",
  );
  if (nu !== undefined) f.kinematicViscosity = nu;
  const form = ident(ctx, o, "formulation", "fluid", "a formulation");
  if (form !== undefined) {
    if (liquid === "water" && !(WATER_FORMULATIONS as readonly string[]).includes(form)) {
      fail(
        ctx,
        "fluid.formulation",
        describe(o.formulation),
        `one of ${WATER_FORMULATIONS.join(", ")}`,
      );
    }
    f.formulation = form;
  }
  return f;
}

async function readFlow(ctx: Ctx, top: Record<string, unknown>): Promise<SiteFlow> {
  const raw = top.flow;
  if (raw === undefined) {
    fail(ctx, "flow", "nothing", "minimum and maximum flow rates (design optional)");
  }
  const o = expectRecord(ctx, raw, "flow");
  const byVelocity = ["minimumVelocity", "designVelocity", "maximumVelocity"].filter((k) =>
    o[k] !== undefined
  );
  const byRate = ["minimum", "design", "maximum"].filter((k) => o[k] !== undefined);
  if (byVelocity.length && byRate.length) {
    fail(
      ctx,
      `flow.${byVelocity[0]}`,
      `velocities mixed with flow rates (flow.${byRate[0]})`,
      "flow rates only, or velocities only",
    );
  }
  const velocity = byVelocity.length > 0;
  const keys = velocity
    ? ["minimumVelocity", "designVelocity", "maximumVelocity"]
    : ["minimum", "design", "maximum"];
  const dim = velocity ? "speed" : "flowRate";
  const limit = velocity ? LIMITS.velocity : LIMITS.flowRate;
  const what = velocity ? "a mean velocity" : "a flow rate";
  const min = await requiredQuantity(ctx, o, keys[0], "flow", dim, limit, what);
  const design = await quantity(ctx, o, keys[1], "flow", dim, limit, what);
  const max = await requiredQuantity(ctx, o, keys[2], "flow", dim, limit, what);
  if (min > max) {
    fail(
      ctx,
      `flow.${keys[0]}`,
      `${describe(o[keys[0]])} above flow.${keys[2]} ${describe(o[keys[2]])}`,
      `minimum ≤ maximum`,
    );
  }
  if (design !== undefined && (design < min || design > max)) {
    fail(
      ctx,
      `flow.${keys[1]}`,
      describe(o[keys[1]]),
      `a value from flow.${keys[0]} to flow.${keys[2]}`,
    );
  }
  const out: SiteFlow = {
    quantity: velocity ? "velocity" : "flowRate",
    minimum: min,
    maximum: max,
  };
  if (design !== undefined) out.design = design;
  return out;
}

const TEMPERATURE_STEP: Record<string, number> = {
  K: 1,
  degC: 1,
  "°C": 1,
  C: 1,
  degF: 5 / 9,
  "°F": 5 / 9,
  F: 5 / 9,
};

async function wedgeCoefficient(ctx: Ctx, raw: unknown): Promise<number> {
  const field = "transducer.wedgeTemperatureCoefficient";
  const accepted = 'a sound-speed change per kelvin such as "-2.5 m/s/K" (or per degC, degF)';
  if (typeof raw !== "string") fail(ctx, field, describe(raw), accepted);
  const m = /^(.*?)\s*\/\s*(K|degC|°C|C|degF|°F|F)\s*$/.exec(raw);
  if (!m) fail(ctx, field, describe(raw), accepted);
  let speed: number;
  try {
    speed = await parseQuantityFull(m[1], "speed", field);
  } catch (e) {
    if (e instanceof InputError) fail(ctx, field, describe(raw), accepted);
    throw e;
  }
  const value = speed / TEMPERATURE_STEP[m[2]];
  const lim = LIMITS.wedgeTemperatureCoefficient;
  if (!(value >= lim.min && value <= lim.max)) {
    fail(ctx, field, describe(raw), "a value from -100 to 100 m/s/K");
  }
  return value;
}

async function readTransducer(ctx: Ctx, top: Record<string, unknown>): Promise<SiteTransducer> {
  const raw = top.transducer;
  if (raw === undefined) {
    fail(
      ctx,
      "transducer",
      "nothing",
      "the wedge (material or sound speed), wedge angle and frequency",
    );
  }
  const o = expectRecord(ctx, raw, "transducer");
  const P = "transducer";
  const L = LIMITS;
  const wedgeMaterial = ident(ctx, o, "wedgeMaterial", P, "a wedge material");
  const wedgeSoundSpeed = await quantity(
    ctx,
    o,
    "wedgeSoundSpeed",
    P,
    "speed",
    L.soundSpeed,
    "a sound speed",
  );
  if (wedgeMaterial === undefined && wedgeSoundSpeed === undefined) {
    fail(
      ctx,
      "transducer.wedgeSoundSpeed",
      "nothing",
      'the wedge sound speed such as "2720 m/s", or transducer.wedgeMaterial',
    );
  }
  const wedgeAngle = await requiredQuantity(
    ctx,
    o,
    "wedgeAngle",
    P,
    "angle",
    L.wedgeAngle,
    "an angle from the wall normal",
  );
  const frequency = await requiredQuantity(
    ctx,
    o,
    "frequency",
    P,
    "frequency",
    L.frequency,
    "a frequency",
  );
  const t: SiteTransducer = { wedgeAngle, frequency };
  if (wedgeMaterial !== undefined) t.wedgeMaterial = wedgeMaterial;
  if (wedgeSoundSpeed !== undefined) t.wedgeSoundSpeed = wedgeSoundSpeed;
  const opt: [keyof SiteTransducer, "time" | "length" | "temperature", Limit, string][] = [
    ["wedgeReferenceTemperature", "temperature", L.temperature, "a temperature"],
    ["timingResolution", "time", L.timingResolution, "a time"],
    ["zeroOffset", "time", L.zeroOffset, "a time"],
    ["fixedDelay", "time", L.fixedDelay, "a time"],
    ["elementHeight", "length", L.elementHeight, "a length"],
    ["indexOffset", "length", L.indexOffset, "a length"],
  ];
  for (const [key, dim, lim, what] of opt) {
    const v = await quantity(ctx, o, key, P, dim, lim, what);
    if (v !== undefined) (t as unknown as Record<string, unknown>)[key] = v;
  }
  if (o.wedgeTemperatureCoefficient !== undefined) {
    t.wedgeTemperatureCoefficient = await wedgeCoefficient(ctx, o.wedgeTemperatureCoefficient);
  }
  return t;
}

async function readEnd(ctx: Ctx, run: Record<string, unknown>, key: "upstream" | "downstream") {
  const path = `run.${key}`;
  if (run[key] === undefined) {
    fail(ctx, path, "nothing", `the ${key} fitting, such as { fitting: elbow-90 }`);
  }
  const o = expectRecord(ctx, run[key], path);
  const fitting = required(
    ctx,
    ident(ctx, o, "fitting", path, "a fitting"),
    `${path}.fitting`,
    'a fitting id such as "elbow-90"',
  );
  const orientation = await quantity(
    ctx,
    o,
    "orientation",
    path,
    "angle",
    LIMITS.orientation,
    "an angle",
  );
  return orientation === undefined ? { fitting } : { fitting, orientation };
}

async function readRun(ctx: Ctx, top: Record<string, unknown>): Promise<SiteRun | undefined> {
  const o = sub(ctx, top, "run", "");
  if (!o) return undefined;
  const length = await requiredQuantity(
    ctx,
    o,
    "length",
    "run",
    "length",
    LIMITS.runLength,
    "a length",
  );
  const upstream = await readEnd(ctx, o, "upstream");
  // The downstream fitting may be left out: the plan then assumes the most demanding one.
  const run: SiteRun = { length, upstream };
  if (o.downstream !== undefined) run.downstream = await readEnd(ctx, o, "downstream");
  const pos = await quantity(
    ctx,
    o,
    "plannedPosition",
    "run",
    "length",
    LIMITS.position,
    "a distance from the upstream fitting",
  );
  if (pos !== undefined) {
    if (pos > length) {
      fail(
        ctx,
        "run.plannedPosition",
        describe(o.plannedPosition),
        `a distance within run.length ${describe(o.length)}`,
      );
    }
    run.plannedPosition = pos;
  }
  return run;
}

function bool(ctx: Ctx, raw: unknown, field: string): boolean {
  if (typeof raw === "boolean") return raw;
  if (raw === "true") return true;
  if (raw === "false") return false;
  fail(ctx, field, describe(raw), "true or false");
}

/**
 * Validate raw site data (as parsed from YAML, JSON or a CSV row) into a {@link SiteInput}.
 *
 * Checks every key (unknown keys refused with the nearest suggested), every unit (through
 * lib/units.ts, mathjs fallback for expressions), plausibility limits ({@link LIMITS}) and the
 * cross-field rules: catalogue or measured pipe (measured wins when both), wall (plus lining)
 * thinner than the outside radius, 0 < minimum ≤ design ≤ maximum flow, traverses 1–8 once
 * each, planned position within the run, the temperature range holding the operating
 * temperature, target uncertainty in (0, 100 %). Defaults applied are listed in `defaults`.
 *
 * @param raw the parsed data
 * @param source where it came from
 * @param ctx error context (file label for messages)
 * @returns the validated site, SI
 */
export async function buildSite(
  raw: unknown,
  source: SiteInput["source"],
  ctx: Ctx,
): Promise<SiteInput> {
  const top = expectRecord(ctx, raw, "");
  const defaults: SiteDefault[] = [];
  const name = required(ctx, text(ctx, top, "name", "", 200), "name", "a name for the site");
  const id = top.id === undefined ? undefined : text(ctx, top, "id", "", 64);
  if (id !== undefined && !/^[A-Za-z0-9][A-Za-z0-9._-]*$/.test(id)) {
    fail(ctx, "id", describe(top.id), "a short id of letters, digits, dot, hyphen, underscore");
  }
  const pipe = await readPipe(ctx, top, defaults);
  const fluid = await readFluid(ctx, top, defaults);
  const flow = await readFlow(ctx, top);
  const transducer = await readTransducer(ctx, top);
  let mountings: number[];
  if (top.mountings === undefined) {
    mountings = [...DEFAULT_MOUNTINGS];
    defaults.push({
      field: "mountings",
      value: mountings,
      message: "mountings not given; 1 and 2 traverses evaluated",
    });
  } else mountings = traverses(ctx, top.mountings, "mountings");
  const run = await readRun(ctx, top);
  const site: SiteInput = { name, pipe, fluid, flow, transducer, mountings, defaults, source };
  if (id !== undefined) site.id = id;
  if (top.invented !== undefined) site.invented = bool(ctx, top.invented, "invented");
  if (run) site.run = run;
  const tu = await quantity(
    ctx,
    top,
    "targetUncertainty",
    "",
    "ratio",
    LIMITS.targetUncertainty,
    "an expanded (k=2) relative uncertainty",
  );
  if (tu !== undefined) site.targetUncertainty = tu;
  const content = sub(ctx, top, "content", "");
  if (content) {
    site.content = {};
    for (const k of ["solids", "gas"] as const) {
      const v = await quantity(
        ctx,
        content,
        k,
        "content",
        "ratio",
        LIMITS.content,
        "a volume fraction",
      );
      if (v !== undefined) site.content[k] = v;
    }
  }
  const notes = text(ctx, top, "notes", "", 20000);
  if (notes !== undefined) site.notes = notes;
  // Guard: the result must satisfy the published check (a reader bug, not bad input).
  const check = SiteInputSchema.safeParse(site);
  if (!check.success) {
    const issue = check.error.issues[0];
    throw new Error(
      `site reader produced an invalid site at ${issue.path.join(".")}: ${issue.message}`,
    );
  }
  return site;
}
