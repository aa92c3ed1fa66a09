/**
 * scripts/pipe.ts: output, --json, exit codes and one-line errors.
 */
import { assert, closeAbs } from "../_assert.ts";
import { runScript } from "../_run.ts";

function run(...args: string[]) {
  return runScript("pipe.ts", args, { permissions: ["--allow-read"] });
}

Deno.test("script: catalogue lookup as JSON", async () => {
  const r = await run("--standard", "ASME B36.10M", "--nps", "4", "--schedule", "40", "--json");
  assert.equal(r.code, 0, r.stderr);
  const p = JSON.parse(r.stdout);
  closeAbs(p.outsideDiameter, 0.1143, 1e-12, "OD");
  closeAbs(p.wallThickness, 0.00602, 1e-12, "wall");
});

Deno.test("script: measured circumference with lining, human output", async () => {
  const r = await run(
    "--circumference",
    "359 mm",
    "--wall",
    "6.02 mm",
    "--material",
    "carbon-steel",
    "--lining-material",
    "cement-mortar",
    "--lining-thickness",
    "8 mm",
  );
  assert.equal(r.code, 0, r.stderr);
  assert.match(r.stdout, /bore diameter\s+8\d\.\d{3} mm/);
});

Deno.test("script: a miss exits 2 with one line naming what exists nearby", async () => {
  const r = await run("--standard", "B36.10M", "--nps", "7", "--schedule", "40");
  assert.equal(r.code, 2);
  assert.equal(r.stderr.trim().split("\n").length, 1);
  assert.match(r.stderr, /6, 8/);
});

Deno.test("script: a wrong unit and an impossible wall exit 2", async () => {
  assert.equal((await run("--od", "4 kg", "--wall", "1 mm", "--material", "pvc")).code, 2);
  const r = await run("--od", "100 mm", "--wall", "60 mm", "--material", "pvc");
  assert.equal(r.code, 2);
  assert.ok(!r.stderr.includes("    at "), "no stack trace without --debug");
});

Deno.test("script: --list at a size lists its schedules", async () => {
  const r = await run("--list", "--standard", "hdpe", "--nps", "8", "--json");
  assert.equal(r.code, 0, r.stderr);
  const rows = JSON.parse(r.stdout) as { schedule: string }[];
  assert.ok(rows.some((x) => x.schedule === "DR 11"));
});
