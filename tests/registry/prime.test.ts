/**
 * The primed quick path (`primeSnapshot`: native SHA-256 digests, the content parsed while the
 * digest runs) must give what the synchronous path and full validation give, and must refuse a
 * snapshot whose content is not what its head records.
 */
import { assert } from "../_assert.ts";
import {
  buildSnapshot,
  loadRegistry,
  primeSnapshot,
  SNAPSHOT_FILE,
  snapshotFresh,
} from "../../lib/registry/load_snapshot.ts";
import "../../lib/registry/load.ts";
import { removeTemp, tempData } from "./_tempdata.ts";

function frozenThroughout(v: unknown): boolean {
  if (v === null || typeof v !== "object") return true;
  return Object.isFrozen(v) && Object.values(v).every(frozenThroughout);
}

Deno.test("a primed snapshot load equals the synchronous and the full loads", async () => {
  // "µ" puts a character of more than one UTF-8 byte into the content.
  const dir = tempData();
  try {
    const materials = Deno.readTextFileSync(`${dir}/materials.yaml`);
    const i = materials.indexOf("name: ");
    Deno.writeTextFileSync(
      `${dir}/materials.yaml`,
      materials.slice(0, i + 6) + "µ-" + materials.slice(i + 6),
    );
    Deno.writeTextFileSync(`${dir}/${SNAPSHOT_FILE}`, buildSnapshot(dir));
    assert.ok(await primeSnapshot(dir), "primed as fresh");
    const primed = loadRegistry(dir);
    assert.ok(primed.fromSnapshot, "primed load used the snapshot");
    assert.ok(primed.docs.some((d) => JSON.stringify(d.data).includes("µ-")), "edit present");
    assert.ok(snapshotFresh(dir), "fresh on the synchronous path");
    const sync = loadRegistry(dir);
    const full = loadRegistry(dir, { snapshot: false });
    assert.ok(!full.fromSnapshot);
    for (const other of [sync, full]) {
      assert.equal(primed.hash, other.hash);
      assert.deepEqual(primed.docs, other.docs);
      assert.deepEqual([...primed.sources.keys()], [...other.sources.keys()]);
    }
    for (const r of [primed, sync, full]) {
      assert.ok(r.docs.every((d) => frozenThroughout(d.data)), "documents frozen throughout");
    }
  } finally {
    removeTemp(dir);
  }
});

Deno.test("a primed snapshot whose content differs from its recorded hash is not used", async () => {
  const dir = tempData();
  try {
    const snap = buildSnapshot(dir);
    // Same length and layout, one datum changed: the head still matches the YAML bytes.
    const at = snap.indexOf('"density":{') + 1;
    const damaged = snap.slice(0, at) + "D" + snap.slice(at + 1);
    Deno.writeTextFileSync(`${dir}/${SNAPSHOT_FILE}`, damaged);
    assert.equal(await primeSnapshot(dir), false, "primed as stale");
    const r = loadRegistry(dir);
    assert.equal(r.fromSnapshot, false, "validated in full");
    assert.equal(snapshotFresh(dir), false, "stale on the synchronous path too");
    // Bytes that are not UTF-8 inside the content: refused the same way.
    const bytes = new TextEncoder().encode(snap);
    bytes[bytes.length - 10] = 0xff;
    Deno.writeFileSync(`${dir}/${SNAPSHOT_FILE}`, bytes);
    assert.equal(await primeSnapshot(dir), false, "not UTF-8: primed as stale");
    assert.equal(loadRegistry(dir).fromSnapshot, false);
  } finally {
    removeTemp(dir);
  }
});
