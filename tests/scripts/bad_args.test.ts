/**
 * Bad arguments to every script, as a user would type them: wrong dimensions, words for
 * numbers, bare numbers, zero or negative sizes, NaN/Infinity/huge values, a wall thicker than
 * the radius, unknown sizes, materials and liquids, impossible traverse counts, geometry beyond
 * the critical angles, unknown options. Each must exit 2 (bad input) or 1 (no physical answer),
 * say so in one to three lines on standard error naming the option, print no stack trace, print
 * nothing on standard output, and never print "NaN" (other than echoing what was typed).
 */
import { assert } from "../_assert.ts";
import { STEEL_V_OPTIONS } from "../acoustics/_fixture.ts";

const ROOT = new URL("../../", import.meta.url);

/** One bad invocation. */
interface Case {
  /** Script file under scripts/. */
  readonly script: string;
  /** Arguments. */
  readonly args: readonly string[];
  /** Expected exit code. */
  readonly exit: 1 | 2;
  /** What stderr must mention (the option or field at fault). */
  readonly names: RegExp;
}

const SPACING_OK: readonly string[] = STEEL_V_OPTIONS;

/** SPACING_OK with one option's value replaced (or added). */
function raw(option: string, value: string, base: readonly string[] = SPACING_OK): string[] {
  const a = [...base];
  const i = a.indexOf(option);
  if (i >= 0) a[i + 1] = value;
  else a.push(option, value);
  return a;
}

const SOUND = ["--liquid", "water", "--temperature", "20 degC"];
const REYN = ["--diameter", "200 mm", "--velocity", "1.5 m/s", "--viscosity", "1 cSt"];
const RUN = ["--diameter", "200 mm", "--upstream", "elbow-90", "--run", "6 m"];
const TRANSIT = [...SPACING_OK, "--velocity", "1 m/s"];

function sub(base: readonly string[], option: string, value: string): string[] {
  return raw(option, value, base);
}

const CASES: Case[] = [
  // sound_speed
  {
    script: "sound_speed.ts",
    args: sub(SOUND, "--temperature", "12 m"),
    exit: 2,
    names: /temperature/,
  },
  {
    script: "sound_speed.ts",
    args: sub(SOUND, "--temperature", "twenty degC"),
    exit: 2,
    names: /temperature/,
  },
  {
    script: "sound_speed.ts",
    args: sub(SOUND, "--temperature", "20"),
    exit: 2,
    names: /temperature/,
  },
  {
    script: "sound_speed.ts",
    args: sub(SOUND, "--temperature", "NaN degC"),
    exit: 2,
    names: /temperature/,
  },
  {
    script: "sound_speed.ts",
    args: sub(SOUND, "--temperature", "Infinity K"),
    exit: 2,
    names: /temperature/,
  },
  {
    script: "sound_speed.ts",
    args: sub(SOUND, "--temperature", "1e308 degC"),
    exit: 2,
    names: /temperature/,
  },
  {
    script: "sound_speed.ts",
    args: sub(SOUND, "--temperature", "-300 degC"),
    exit: 2,
    names: /temperature/,
  },
  {
    script: "sound_speed.ts",
    args: sub(SOUND, "--pressure", "-5 bar"),
    exit: 2,
    names: /pressure/,
  },
  { script: "sound_speed.ts", args: sub(SOUND, "--pressure", "5 m/s"), exit: 2, names: /pressure/ },
  {
    script: "sound_speed.ts",
    args: sub(SOUND, "--liquid", "unobtainium"),
    exit: 2,
    names: /liquid/,
  },
  {
    script: "sound_speed.ts",
    args: sub(SOUND, "--formulation", "guess"),
    exit: 2,
    names: /formulation/,
  },
  {
    script: "sound_speed.ts",
    args: [...sub(SOUND, "--liquid", "seawater"), "--salinity", "salty"],
    exit: 2,
    names: /salinity/,
  },
  {
    script: "sound_speed.ts",
    args: sub(SOUND, "--temperature", "150 degC"),
    exit: 1,
    names: /boil/,
  },
  { script: "sound_speed.ts", args: [...SOUND, "--colour", "red"], exit: 2, names: /colour/ },
  // pipe
  {
    script: "pipe.ts",
    args: ["--od", "114.3", "--wall", "6 mm", "--material", "carbon-steel"],
    exit: 2,
    names: /--od/,
  },
  {
    script: "pipe.ts",
    args: ["--od", "0 mm", "--wall", "6 mm", "--material", "carbon-steel"],
    exit: 2,
    names: /od|outside/i,
  },
  {
    script: "pipe.ts",
    args: ["--od", "-114 mm", "--wall", "6 mm", "--material", "carbon-steel"],
    exit: 2,
    names: /od|outside/i,
  },
  {
    script: "pipe.ts",
    args: ["--od", "1e308 m", "--wall", "6 mm", "--material", "carbon-steel"],
    exit: 2,
    names: /od|outside/i,
  },
  {
    script: "pipe.ts",
    args: ["--od", "100 mm", "--wall", "60 mm", "--material", "carbon-steel"],
    exit: 2,
    names: /wall/i,
  },
  {
    script: "pipe.ts",
    args: ["--od", "100 mm", "--wall", "six mm", "--material", "carbon-steel"],
    exit: 2,
    names: /wall/,
  },
  {
    script: "pipe.ts",
    args: ["--od", "100 mm", "--wall", "5 degC", "--material", "carbon-steel"],
    exit: 2,
    names: /wall/,
  },
  {
    script: "pipe.ts",
    args: ["--standard", "ASME B36.10M", "--nps", "7", "--schedule", "40"],
    exit: 2,
    names: /nps/i,
  },
  {
    script: "pipe.ts",
    args: ["--standard", "ASME B36.10M", "--nps", "4", "--schedule", "41"],
    exit: 2,
    names: /schedule/i,
  },
  {
    script: "pipe.ts",
    args: ["--standard", "ASME B99", "--nps", "4", "--schedule", "40"],
    exit: 2,
    names: /standard/i,
  },
  {
    script: "pipe.ts",
    args: [
      "--circumference",
      "359 mm",
      "--tape-thickness",
      "200 mm",
      "--wall",
      "6 mm",
      "--material",
      "carbon-steel",
    ],
    exit: 2,
    names: /tape/i,
  },
  {
    script: "pipe.ts",
    args: [
      "--od",
      "114.3 mm",
      "--wall",
      "6 mm",
      "--material",
      "carbon-steel",
      "--lining-material",
      "cement-mortar",
      "--lining-thickness",
      "60 mm",
    ],
    exit: 2,
    names: /lining/i,
  },
  { script: "pipe.ts", args: ["--od", "114.3 mm", "--wall", "6 mm"], exit: 2, names: /material/ },
  { script: "pipe.ts", args: ["--diameter", "4 in"], exit: 2, names: /diameter/ },
  // spacing
  { script: "spacing.ts", args: raw("--wedge-angle", "62 deg"), exit: 1, names: /critical angle/ },
  { script: "spacing.ts", args: raw("--wedge-angle", "90 deg"), exit: 2, names: /wedge/i },
  { script: "spacing.ts", args: raw("--wedge-angle", "38 mm"), exit: 2, names: /wedge-angle/ },
  { script: "spacing.ts", args: raw("--wedge-angle", "38"), exit: 2, names: /wedge-angle/ },
  { script: "spacing.ts", args: raw("--wall", "60 mm"), exit: 2, names: /wall/i },
  { script: "spacing.ts", args: raw("--wall", "0 mm"), exit: 2, names: /wall/i },
  { script: "spacing.ts", args: raw("--od", "-1 m"), exit: 2, names: /od|outside/i },
  { script: "spacing.ts", args: raw("--od", "NaN m"), exit: 2, names: /--od/ },
  { script: "spacing.ts", args: raw("--fluid-speed", "1482 m"), exit: 2, names: /fluid-speed/ },
  { script: "spacing.ts", args: raw("--fluid-speed", "fast"), exit: 2, names: /fluid-speed/ },
  { script: "spacing.ts", args: raw("--wedge-speed", "0 m/s"), exit: 2, names: /wedge/i },
  { script: "spacing.ts", args: raw("--wedge-speed", "1e400 m/s"), exit: 2, names: /wedge-speed/ },
  { script: "spacing.ts", args: raw("--traverses", "0"), exit: 2, names: /traverse/ },
  { script: "spacing.ts", args: raw("--traverses", "2.5"), exit: 2, names: /traverse/ },
  { script: "spacing.ts", args: raw("--traverses", "9"), exit: 2, names: /traverse/ },
  { script: "spacing.ts", args: raw("--traverses", "two"), exit: 2, names: /traverse/ },
  {
    script: "spacing.ts",
    args: raw("--wall-mode", "sideways"),
    exit: 2,
    names: /wall-mode|wallMode/,
  },
  {
    script: "spacing.ts",
    args: raw("--lining-thickness", "60 mm", [...SPACING_OK, "--lining-speed", "4200 m/s"]),
    exit: 2,
    names: /lining/i,
  },
  {
    script: "spacing.ts",
    args: [
      "--standard",
      "ASME B36.10M",
      "--nps",
      "4",
      "--schedule",
      "40",
      "--liquid",
      "water",
      "--temperature",
      "20 degC",
      "--wedge-material",
      "cheese",
      "--wedge-angle",
      "38 deg",
    ],
    exit: 2,
    names: /wedge|material/i,
  },
  {
    script: "spacing.ts",
    args: [
      "--standard",
      "ASME B36.10M",
      "--nps",
      "4",
      "--schedule",
      "40",
      "--liquid",
      "lava",
      "--temperature",
      "20 degC",
      "--wedge-material",
      "acrylic",
      "--wedge-angle",
      "38 deg",
    ],
    exit: 2,
    names: /liquid/,
  },
  { script: "spacing.ts", args: [...SPACING_OK, "--frobnicate"], exit: 2, names: /frobnicate/ },
  // transit
  { script: "transit.ts", args: sub(TRANSIT, "--velocity", "1 degC"), exit: 2, names: /velocity/ },
  {
    script: "transit.ts",
    args: sub(TRANSIT, "--velocity", "1e308 m/s"),
    exit: 1,
    names: /velocity|sound speed/,
  },
  { script: "transit.ts", args: sub(TRANSIT, "--velocity", "quick"), exit: 2, names: /velocity/ },
  { script: "transit.ts", args: [...SPACING_OK, "--flow", "20"], exit: 2, names: /flow/ },
  { script: "transit.ts", args: sub(TRANSIT, "--traverses", "1,2"), exit: 2, names: /traverse/ },
  {
    script: "transit.ts",
    args: sub(TRANSIT, "--timing-resolution", "100"),
    exit: 2,
    names: /timing/,
  },
  {
    script: "transit.ts",
    args: sub(TRANSIT, "--profile-factor", "NaN"),
    exit: 2,
    names: /profile/,
  },
  {
    script: "transit.ts",
    args: sub(TRANSIT, "--frequency", "1 MHz m"),
    exit: 2,
    names: /frequency/,
  },
  {
    script: "transit.ts",
    args: raw("--wedge-angle", "80 deg", TRANSIT),
    exit: 1,
    names: /critical angle/,
  },
  // reynolds
  { script: "reynolds.ts", args: sub(REYN, "--diameter", "200"), exit: 2, names: /diameter/ },
  { script: "reynolds.ts", args: sub(REYN, "--diameter", "0 mm"), exit: 2, names: /diameter/ },
  { script: "reynolds.ts", args: sub(REYN, "--diameter", "-1 m"), exit: 2, names: /diameter/ },
  {
    script: "reynolds.ts",
    args: sub(REYN, "--velocity", "Infinity m/s"),
    exit: 2,
    names: /velocity/,
  },
  { script: "reynolds.ts", args: sub(REYN, "--viscosity", "1 mm"), exit: 2, names: /viscosity/ },
  { script: "reynolds.ts", args: sub(REYN, "--viscosity", "0 cSt"), exit: 2, names: /viscosity/i },
  { script: "reynolds.ts", args: sub(REYN, "--chord", "1.5"), exit: 2, names: /chord/ },
  { script: "reynolds.ts", args: sub(REYN, "--model", "magic"), exit: 2, names: /model/ },
  {
    script: "reynolds.ts",
    args: sub(REYN, "--material", "unobtainium"),
    exit: 2,
    names: /material/,
  },
  {
    script: "reynolds.ts",
    args: [
      "--diameter",
      "200 mm",
      "--velocity",
      "1 m/s",
      "--liquid",
      "water",
      "--temperature",
      "hot",
    ],
    exit: 2,
    names: /temperature/,
  },
  // straight_run
  {
    script: "straight_run.ts",
    args: sub(RUN, "--upstream", "elbo"),
    exit: 2,
    names: /fitting|upstream/,
  },
  {
    script: "straight_run.ts",
    args: sub(RUN, "--downstream", "wormhole"),
    exit: 2,
    names: /fitting|downstream/,
  },
  { script: "straight_run.ts", args: sub(RUN, "--run", "-6 m"), exit: 2, names: /run/ },
  { script: "straight_run.ts", args: sub(RUN, "--run", "6 degC"), exit: 2, names: /run/ },
  { script: "straight_run.ts", args: sub(RUN, "--diameter", "0 mm"), exit: 2, names: /diameter/ },
  { script: "straight_run.ts", args: sub(RUN, "--position", "10 m"), exit: 2, names: /position/ },
  { script: "straight_run.ts", args: sub(RUN, "--traverses", "2.5"), exit: 2, names: /traverse/ },
  { script: "straight_run.ts", args: sub(RUN, "--reynolds", "lots"), exit: 2, names: /reynolds/ },
  {
    script: "straight_run.ts",
    args: sub(RUN, "--orientation", "12 m"),
    exit: 2,
    names: /orientation/,
  },
  // registry
  { script: "registry.ts", args: ["show", "unobtainium"], exit: 2, names: /id|unobtainium/ },
  { script: "registry.ts", args: ["list", "spaceships"], exit: 2, names: /kind|spaceships/ },
  { script: "registry.ts", args: ["dance"], exit: 2, names: /dance|command/ },
  {
    script: "registry.ts",
    args: ["validate", "no/such/folder"],
    exit: 2,
    names: /folder|no\/such|dir/,
  },
  { script: "registry.ts", args: ["list", "--frobnicate"], exit: 2, names: /frobnicate/ },
  // plan
  { script: "plan.ts", args: [], exit: 2, names: /site file|argument/ },
  {
    script: "plan.ts",
    args: ["tests/bad/no-such-site.yaml"],
    exit: 2,
    names: /no-such-site|site file/,
  },
  {
    script: "plan.ts",
    args: ["data/demo/01-reservoir-outlet.yaml", "--format", "pdf"],
    exit: 2,
    names: /format/,
  },
  {
    script: "plan.ts",
    args: ["data/demo/01-reservoir-outlet.yaml", "--draws", "many"],
    exit: 2,
    names: /draws/,
  },
  {
    script: "plan.ts",
    args: ["data/demo/01-reservoir-outlet.yaml", "--seed", "NaN"],
    exit: 2,
    names: /seed/,
  },
  { script: "plan.ts", args: ["tests/bad/beyond-critical.yaml"], exit: 1, names: /critical angle/ },
  {
    script: "plan.ts",
    args: ["tests/bad/wall-beyond-radius.yaml"],
    exit: 2,
    names: /wallThickness/,
  },
  {
    script: "plan.ts",
    args: ["tests/bad/temperature-as-length.yaml"],
    exit: 2,
    names: /temperature/,
  },
  { script: "plan.ts", args: ["tests/bad/unknown-liquid.yaml"], exit: 2, names: /liquid/ },
  {
    script: "plan.ts",
    args: ["data/demo/01-reservoir-outlet.yaml", "--frobnicate"],
    exit: 2,
    names: /frobnicate/,
  },
];

/** Permissions as the deno.json task for each script gives them. */
function permissions(script: string): string[] {
  return script === "plan.ts" || script === "registry.ts"
    ? ["--allow-read=.", "--allow-write"]
    : ["--allow-read=."];
}

async function run(c: Case) {
  const out = await new Deno.Command(Deno.execPath(), {
    args: [
      "run",
      "--ignore-env=LOG_TOKENS,LOG_STREAM",
      ...permissions(c.script),
      `scripts/${c.script}`,
      ...c.args,
    ],
    cwd: ROOT,
    stdout: "piped",
    stderr: "piped",
  }).output();
  return {
    code: out.code,
    stdout: new TextDecoder().decode(out.stdout),
    stderr: new TextDecoder().decode(out.stderr),
  };
}

/** Check one case; returns the problems found (empty when it behaves). */
async function check(c: Case): Promise<string[]> {
  const r = await run(c);
  const problems: string[] = [];
  const label = `${c.script} ${c.args.map((a) => JSON.stringify(a)).join(" ")}`;
  if (r.code !== c.exit) problems.push(`exit ${r.code}, expected ${c.exit}`);
  const lines = r.stderr.split("\n").filter((l) => l.trim() !== "");
  if (lines.length < 1 || lines.length > 3) problems.push(`${lines.length} lines on stderr`);
  if (lines.some((l) => /^\s+at /.test(l))) problems.push("a stack trace on stderr");
  if (r.stdout.trim() !== "") problems.push(`stdout not empty: ${r.stdout.slice(0, 120)}`);
  if (!c.names.test(r.stderr)) problems.push(`stderr does not name ${c.names}`);
  // "NaN" may appear only where the user typed it (echoed back); nowhere else.
  let rest = r.stdout + r.stderr;
  for (const a of c.args) rest = rest.split(a).join("");
  if (/NaN/.test(rest)) problems.push("NaN in the output");
  return problems.map((p) => `${label}: ${p}\n  stderr: ${r.stderr.trim().slice(0, 300)}`);
}

Deno.test(`scripts: ${CASES.length} bad argument sets are refused cleanly`, async () => {
  const problems: string[] = [];
  let next = 0;
  // Two at a time: each spawn costs 0.1–0.5 s and the machine is shared.
  const worker = async () => {
    while (next < CASES.length) problems.push(...await check(CASES[next++]));
  };
  await Promise.all([worker(), worker()]);
  const byScript = new Map<string, number>();
  for (const c of CASES) byScript.set(c.script, (byScript.get(c.script) ?? 0) + 1);
  console.log(
    `bad arguments: ${CASES.length} cases (` +
      [...byScript].map(([s, n]) => `${s} ${n}`).join(", ") + `), ${problems.length} problems`,
  );
  assert.equal(problems.length, 0, problems.join("\n"));
});
