/**
 * scripts/pipe.ts: output, --json, exit codes and one-line errors.
 */
import { assert, closeAbs } from "../_assert.ts";

const SCRIPT = new URL("../../scripts/pipe.ts", import.meta.url).pathname;

function run(...args: string[]): { code: number; stdout: string; stderr: string } {
  const out = new Deno.Command(Deno.execPath(), {
    args: ["run", "--ignore-env=LOG_TOKENS,LOG_STREAM", "--allow-read", SCRIPT, ...args],
    stdout: "piped",
    stderr: "piped",
  }).outputSync();
  const d = new TextDecoder();
  return { code: out.code, stdout: d.decode(out.stdout), stderr: d.decode(out.stderr) };
}

Deno.test("script: catalogue lookup as JSON", () => {
  const r = run("--standard", "ASME B36.10M", "--nps", "4", "--schedule", "40", "--json");
  assert.equal(r.code, 0, r.stderr);
  const p = JSON.parse(r.stdout);
  closeAbs(p.outsideDiameter, 0.1143, 1e-12, "OD");
  closeAbs(p.wallThickness, 0.00602, 1e-12, "wall");
});

Deno.test("script: measured circumference with lining, human output", () => {
  const r = run(
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

Deno.test("script: a miss exits 2 with one line naming what exists nearby", () => {
  const r = run("--standard", "B36.10M", "--nps", "7", "--schedule", "40");
  assert.equal(r.code, 2);
  assert.equal(r.stderr.trim().split("\n").length, 1);
  assert.match(r.stderr, /6, 8/);
});

Deno.test("script: a wrong unit and an impossible wall exit 2", () => {
  assert.equal(run("--od", "4 kg", "--wall", "1 mm", "--material", "pvc").code, 2);
  const r = run("--od", "100 mm", "--wall", "60 mm", "--material", "pvc");
  assert.equal(r.code, 2);
  assert.ok(!r.stderr.includes("    at "), "no stack trace without --debug");
});

Deno.test("script: --list at a size lists its schedules", () => {
  const r = run("--list", "--standard", "hdpe", "--nps", "8", "--json");
  assert.equal(r.code, 0, r.stderr);
  const rows = JSON.parse(r.stdout) as { schedule: string }[];
  assert.ok(rows.some((x) => x.schedule === "DR 11"));
});
