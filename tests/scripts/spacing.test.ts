/**
 * The spacing and transit scripts as a user runs them: exit codes, one-line errors, JSON.
 */
import { assert, closeRel } from "../_assert.ts";
import { clampOnPath } from "../../lib/acoustics/path.ts";
import { STEEL_V, STEEL_V_OPTIONS } from "../acoustics/_fixture.ts";
import { runScript } from "../_run.ts";

Deno.test("spacing: raw figures, three mountings, JSON matches the library", async () => {
  const r = await runScript("spacing.ts", [...STEEL_V_OPTIONS, "--traverses", "1,2,4", "--json"]);
  assert.equal(r.code, 0, r.stderr);
  const j = JSON.parse(r.stdout);
  assert.equal(j.paths.length, 3);
  for (const p of j.paths) {
    const lib = clampOnPath({ ...STEEL_V, traverses: p.traverses });
    closeRel(p.spacing, lib.spacing, 1e-12, `N = ${p.traverses}`);
  }
});

Deno.test("spacing: human table with the search window", async () => {
  const r = await runScript("spacing.ts", [
    ...STEEL_V_OPTIONS,
    "--u-fluid-speed",
    "10 m/s",
    "--u-wall",
    "0.6 mm",
  ]);
  assert.equal(r.code, 0, r.stderr);
  assert.match(r.stdout, /V\s+2\s+85\.73/);
  assert.match(r.stdout, /search window/);
  assert.match(r.stdout, /fluidSoundSpeed .* move further/);
});

Deno.test("spacing: beyond the critical angles exits 1 naming them, one line, no stack", async () => {
  const args = [...STEEL_V_OPTIONS];
  args[args.indexOf("38 deg")] = "62 deg";
  const r = await runScript("spacing.ts", args);
  assert.equal(r.code, 1);
  assert.match(r.stderr, /critical angle 27\.35°/);
  assert.match(r.stderr, /critical angle 57\.36°/);
  assert.equal(r.stderr.trim().split("\n").length, 1);
});

Deno.test("spacing: bad input exits 2 with a one-line message naming the option", async () => {
  const bad = await runScript("spacing.ts", [...STEEL_V_OPTIONS, "--traverses", "2.5"]);
  assert.equal(bad.code, 2);
  assert.match(bad.stderr, /--traverses/);
  const unit = await runScript("spacing.ts", ["--od", "3 kg"]);
  assert.equal(unit.code, 2);
  assert.match(unit.stderr, /--od/);
  const missing = await runScript("spacing.ts", ["--od", "114.3 mm"]);
  assert.equal(missing.code, 2);
  assert.match(missing.stderr, /--wall/);
});

Deno.test("spacing: --help exits 0", async () => {
  const r = await runScript("spacing.ts", ["--help"]);
  assert.equal(r.code, 0);
  assert.match(r.stdout, /--traverses/);
});

Deno.test("spacing: catalogue terms (pipe, water, acrylic) resolve", async () => {
  const r = await runScript("spacing.ts", [
    "--standard",
    "ASME B36.10M",
    "--nps",
    "4",
    "--schedule",
    "40",
    "--material",
    "carbon-steel",
    "--liquid",
    "water",
    "--temperature",
    "20 degC",
    "--wedge-material",
    "acrylic",
    "--wedge-angle",
    "38 deg",
    "--json",
  ]);
  assert.equal(r.code, 0, r.stderr);
  const j = JSON.parse(r.stdout);
  closeRel(j.inputs.outsideDiameter, 0.1143, 1e-9, "OD from the catalogue");
  closeRel(j.inputs.fluidSoundSpeed, 1482.35, 1e-4, "water at 20 °C (IAPWS-95)");
  assert.equal(j.paths[0].wallMode, "shear");
});

Deno.test("transit: velocity range, resolution and wall-borne check", async () => {
  const r = await runScript("transit.ts", [
    ...STEEL_V_OPTIONS,
    "--velocity",
    "0.1 m/s,1 m/s,3 m/s",
    "--timing-resolution",
    "100 ps",
    "--frequency",
    "1 MHz",
    "--json",
  ]);
  assert.equal(r.code, 0, r.stderr);
  const j = JSON.parse(r.stdout);
  assert.equal(j.range.points.length, 3);
  assert.ok(j.range.maximum.deltaT > j.range.minimum.deltaT);
  assert.ok(j.minimumResolvableVelocity > 0 && j.minimumResolvableVelocity < 0.01);
  assert.equal(j.wallBorne.overlaps, false);
  const both = await runScript("transit.ts", [
    ...STEEL_V_OPTIONS,
    "--velocity",
    "1 m/s",
    "--flow",
    "1 L/s",
  ]);
  assert.equal(both.code, 2);
});
