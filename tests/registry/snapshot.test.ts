/**
 * The validated snapshot (data/snapshot.json) must match the YAML files it was built from, and
 * any edit to a YAML file must make the loader validate in full.
 */
import { assert, equal, ok, throws } from "../_assert.ts";
import { buildSnapshot, loadRegistry, SNAPSHOT_FILE } from "../../lib/registry/load.ts";
import { RegistryError } from "../../lib/errors.ts";

const DATA = new URL("../../data/", import.meta.url);

function copyData(): string {
  const dir = Deno.makeTempDirSync({ prefix: "snellpath-snap-" });
  const copy = (rel: string) => {
    for (const e of Deno.readDirSync(new URL(rel, DATA))) {
      const path = rel + e.name;
      if (e.isDirectory) {
        Deno.mkdirSync(`${dir}/${path}`, { recursive: true });
        copy(path + "/");
      } else Deno.copyFileSync(new URL(path, DATA), `${dir}/${path}`);
    }
  };
  copy("");
  return dir;
}

Deno.test("committed snapshot is fresh: built from the YAML files as they are", () => {
  const committed = JSON.parse(Deno.readTextFileSync(new URL(SNAPSHOT_FILE, DATA)));
  const fresh = JSON.parse(buildSnapshot(DATA));
  assert.equal(
    committed.rawHash,
    fresh.rawHash,
    "data/snapshot.json is stale: run `deno task registry snapshot` after editing data/",
  );
  equal(committed.hash, fresh.hash);
});

Deno.test("snapshot and full validation give the same content hash", () => {
  const a = loadRegistry(DATA);
  const b = loadRegistry(DATA, { snapshot: false });
  ok(a.fromSnapshot);
  ok(!b.fromSnapshot);
  equal(a.hash, b.hash);
  equal(a.docs.length, b.docs.length);
});

Deno.test("an edited YAML value bypasses the snapshot and changes the hash", () => {
  const dir = copyData();
  const before = loadRegistry(dir);
  ok(before.fromSnapshot);
  const f = `${dir}/materials.yaml`;
  const text = Deno.readTextFileSync(f);
  const edited = text.replace(/value: (\d+)/, (_m, n) => `value: ${Number(n) + 1}`);
  assert.notEqual(edited, text);
  Deno.writeTextFileSync(f, edited);
  const after = loadRegistry(dir);
  ok(!after.fromSnapshot);
  assert.notEqual(after.hash, before.hash);
});

Deno.test("a tampered file with a source removed is refused even with a snapshot present", () => {
  const dir = copyData();
  const f = `${dir}/materials.yaml`;
  const text = Deno.readTextFileSync(f);
  // drop every source line: the numbers lose their provenance
  Deno.writeTextFileSync(f, text.replace(/^\s*source: .*$/gm, ""));
  throws(
    () => loadRegistry(dir),
    (e: unknown) => e instanceof RegistryError && /materials\.yaml/.test((e as Error).message),
  );
});

Deno.test("snapshot layout 2: the stored content is canonical JSON and its hash is checked", async () => {
  const { canonicalJson, primeSnapshot } = await import("../../lib/registry/load_snapshot.ts");
  const text = Deno.readTextFileSync(new URL(SNAPSHOT_FILE, DATA));
  const head = /^\{"version":2,"rawHash":"[0-9a-f]{64}","hash":"[0-9a-f]{64}","content":/.exec(
    text,
  );
  assert.ok(head, "data/snapshot.json does not start with the layout-2 head");
  const content = text.slice(head[0].length, text.trimEnd().length - 1);
  // the content is stored as canonical JSON, so hashing the stored text hashes the data
  equal(canonicalJson(JSON.parse(content)), content);
  // a content edited without its hash is not used: the loader validates the YAML in full
  const dir = copyData();
  const at = text.indexOf('"value":', head[0].length) + 8;
  Deno.writeTextFileSync(`${dir}/${SNAPSHOT_FILE}`, text.slice(0, at) + "9" + text.slice(at));
  ok(!(await primeSnapshot(dir)));
  const loaded = loadRegistry(dir);
  ok(!loaded.fromSnapshot);
  equal(loaded.hash, loadRegistry(DATA).hash);
});
