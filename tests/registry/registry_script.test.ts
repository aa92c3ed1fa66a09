/**
 * scripts/registry.ts end to end: list, show, validate, export and export --schema, with the
 * project's exit codes (0 ok, 2 bad input or invalid data) and one-line errors.
 */
import { assert } from "../_assert.ts";
import { runScript } from "../_run.ts";
import { SCHEMAS } from "../../lib/registry/schemas/mod.ts";
import { removeTemp, replaceOnce, tempData } from "./_tempdata.ts";

function run(...args: string[]) {
  return runScript("registry.ts", args, { permissions: ["--allow-read", "--allow-write"] });
}

Deno.test("validate: OK with the hash, or the loader's one-line error and exit 2", async () => {
  const good = tempData();
  const bad = tempData({ "materials.yaml": replaceOnce("id: stainless-steel-316", "id: copper") });
  try {
    const ok = await run("validate", good, "--json");
    assert.equal(ok.code, 0, ok.stderr);
    const res = JSON.parse(ok.stdout);
    assert.equal(res.ok, true);
    assert.match(res.hash, /^[0-9a-f]{64}$/);
    const human = await run("validate", good);
    assert.ok(human.stdout.startsWith(`OK ${res.hash}`), human.stdout);
    const ko = await run("validate", bad);
    assert.equal(ko.code, 2);
    const lines = ko.stderr.trim().split("\n");
    assert.equal(lines.length, 1, "one line, no stack");
    assert.match(lines[0], /^error: materials\.yaml: entry copper, field .*duplicate id 'copper'/);
  } finally {
    removeTemp(good);
    removeTemp(bad);
  }
});

Deno.test("show and list a material, a source; a miss suggests ids", async () => {
  const show = await run("show", "acrylic", "--json");
  assert.equal(show.code, 0, show.stderr);
  const m = JSON.parse(show.stdout);
  assert.equal(m.id, "acrylic");
  assert.ok(m.longitudinal > 2000 && m.trace.length > 0);
  const src = await run("show", "idelchik-2007");
  assert.equal(src.code, 0);
  assert.match(src.stdout, /Handbook of Hydraulic Resistance/);
  const list = await run("list", "materials", "--json");
  assert.equal(list.code, 0);
  assert.ok(JSON.parse(list.stdout).entries.some((e: { id: string }) => e.id === "peek"));
  const miss = await run("show", "acrylik");
  assert.equal(miss.code, 2);
  assert.match(miss.stderr, /acrylic/);
  const bad = await run("frobnicate");
  assert.equal(bad.code, 2);
  assert.match(bad.stderr, /^error: command: got "frobnicate"/);
});

Deno.test("export: the whole registry, and a JSON Schema with one definition per kind", async () => {
  const dir = await Deno.makeTempDir();
  try {
    const out = `${dir}/registry.json`;
    const r = await run("export", "--out", out);
    assert.equal(r.code, 0, r.stderr);
    const data = JSON.parse(await Deno.readTextFile(out));
    assert.match(data.hash, /^[0-9a-f]{64}$/);
    assert.ok(data.sources.length > 5);
    assert.ok(data.documents.some((d: { kind: string }) => d.kind === "materials"));
    const s = await run("export", "--schema");
    assert.equal(s.code, 0, s.stderr);
    const schema = JSON.parse(s.stdout);
    assert.deepEqual(Object.keys(schema.$defs).sort(), Object.keys(SCHEMAS).sort());
    const mat = schema.$defs.materials;
    assert.equal(mat.properties.kind.const, "materials");
    assert.equal(mat.properties.materials.items.additionalProperties, false, "strict entries");
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});
