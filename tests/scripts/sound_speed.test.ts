import { assert } from "../_assert.ts";
import { runScript } from "../_run.ts";

Deno.test("sound_speed: water at 20 °C, JSON", async () => {
  const r = await runScript("sound_speed.ts", [
    "--liquid",
    "water",
    "--temperature",
    "20 degC",
    "--json",
  ]);
  assert.equal(r.code, 0, r.stderr);
  const j = JSON.parse(r.stdout);
  // Source: IAPWS-95 gives 1482.35 m/s at 20 °C, 1 atm (value recalled, widely quoted).
  assert.ok(Math.abs(j.soundSpeed - 1482.35) < 0.05, String(j.soundSpeed));
});

Deno.test("sound_speed: --compare for seawater lists three formulations and a spread", async () => {
  const r = await runScript("sound_speed.ts", [
    "--liquid",
    "seawater",
    "--salinity",
    "35",
    "--temperature",
    "10 degC",
    "--pressure",
    "100 bar",
    "--compare",
    "--json",
  ]);
  assert.equal(r.code, 0, r.stderr);
  const j = JSON.parse(r.stdout);
  assert.equal(j.formulations.length, 3);
  assert.ok(j.spread > 0 && j.spread < 1, String(j.spread));
});

Deno.test("sound_speed: exit codes and one-line errors", async () => {
  const boil = await runScript("sound_speed.ts", ["--temperature", "120 degC"]);
  assert.equal(boil.code, 1);
  assert.equal(boil.stderr.trim().split("\n").length, 1);
  const bad = await runScript("sound_speed.ts", [
    "--liquid",
    "metanol",
    "--temperature",
    "20 degC",
  ]);
  assert.equal(bad.code, 2);
  assert.match(bad.stderr, /methanol/);
  const unit = await runScript("sound_speed.ts", ["--temperature", "20 m"]);
  assert.equal(unit.code, 2);
  assert.ok(!unit.stderr.includes("    at "), "no stack trace");
});

Deno.test("verify: every published table passes", async () => {
  const r = await runScript("verify.ts", ["--json"]);
  assert.equal(r.code, 0, r.stdout.slice(-2000) + r.stderr);
  const j = JSON.parse(r.stdout);
  const ids = j.tables.map((t: { id: string }) => t.id);
  assert.ok(
    ids.includes("seawater-unesco1983-check") && ids.includes("seawater-gsw-cv-sound-speed"),
  );
  assert.ok(j.tables.every((t: { status: string }) => t.status !== "fail"));
});
