/**
 * The registry's content hash pins a result to the data it came from: it must not move when
 * nothing changed (two loads, keys written in another order, comments) and must move when
 * one value changes.
 */
import { parse, stringify } from "yaml";
import { assert } from "../_assert.ts";
import { loadRegistry } from "../../lib/registry/load.ts";
import { removeTemp, replaceOnce, tempData } from "./_tempdata.ts";

/** The same data with the keys of every mapping in reverse order (lists keep their order). */
function reverseKeys(v: unknown): unknown {
  if (Array.isArray(v)) return v.map(reverseKeys);
  if (v !== null && typeof v === "object") {
    const out: Record<string, unknown> = {};
    for (const k of Object.keys(v).reverse()) {
      out[k] = reverseKeys((v as Record<string, unknown>)[k]);
    }
    return out;
  }
  return v;
}

function hashOf(files: Parameters<typeof tempData>[0] = {}): string {
  const dir = tempData(files);
  try {
    return loadRegistry(dir).hash;
  } finally {
    removeTemp(dir);
  }
}

Deno.test("the hash is stable across two loads", () => {
  const dir = tempData();
  try {
    const a = loadRegistry(dir).hash;
    const b = loadRegistry(dir).hash;
    assert.match(a, /^[0-9a-f]{64}$/);
    assert.equal(a, b);
  } finally {
    removeTemp(dir);
  }
});

Deno.test("the hash ignores key order and comments", () => {
  const base = hashOf();
  const reordered = (s: string) => {
    const text = stringify(reverseKeys(parse(s)), { aliasDuplicateObjects: false });
    assert.notEqual(text.trim(), s.trim());
    return "# reordered copy\n" + text;
  };
  // the reordered copy really has another key order
  const sample = reordered("kind: materials\nmaterials: []\n");
  assert.ok(sample.indexOf("materials:") < sample.indexOf("kind:"), "keys reversed");
  assert.equal(
    hashOf({ "materials.yaml": reordered, "sources.yaml": reordered }),
    base,
    "same data, keys in another order",
  );
  assert.equal(hashOf({ "materials.yaml": (s) => "# a comment\n" + s + "\n# end\n" }), base);
});

Deno.test("changing one value changes the hash", () => {
  const base = hashOf();
  const changed = hashOf({
    "materials.yaml": replaceOnce("{ value: 5900, unit: m/s", "{ value: 5901, unit: m/s"),
  });
  assert.notEqual(changed, base);
  // a unit spelled differently is a different datum as written, so it changes the hash too
  const respelled = hashOf({
    "materials.yaml": replaceOnce(
      "      value: 7850\n      unit: kg/m^3",
      "      value: 7.85\n      unit: g/cm^3",
    ),
  });
  assert.notEqual(respelled, base);
});
