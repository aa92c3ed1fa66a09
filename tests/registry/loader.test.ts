/**
 * The loader refuses bad data with one message naming the file, the entry and the field.
 * Each case edits a temp copy of data/sources.yaml + data/materials.yaml.
 */
import { assert } from "../_assert.ts";
import { RegistryError } from "../../lib/errors.ts";
import { loadRegistry } from "../../lib/registry/load.ts";
import { removeTemp, replaceOnce, tempData } from "./_tempdata.ts";

function refused(
  files: Parameters<typeof tempData>[0],
  expect: { file: string; entry: string; field: string; problem: RegExp },
): void {
  const dir = tempData(files);
  try {
    assert.throws(
      () => loadRegistry(dir),
      (e: unknown) => {
        assert.ok(e instanceof RegistryError, `expected a RegistryError, got ${e}`);
        assert.equal(e.file, expect.file);
        assert.equal(e.entry, expect.entry);
        assert.equal(e.fieldPath, expect.field);
        assert.match(e.message, expect.problem);
        assert.ok(
          e.message.startsWith(`${expect.file}: entry ${expect.entry}, field ${expect.field}:`),
          e.message,
        );
        assert.ok(!e.message.includes("\n"), "one line");
        assert.equal(e.exitCode, 2);
        return true;
      },
    );
  } finally {
    removeTemp(dir);
  }
}

const FIRST_SOURCE = "    source: astm-e494\n    basis: transcribed\n";

Deno.test("the unedited temp copy loads (control for the cases below)", () => {
  const dir = tempData();
  try {
    const reg = loadRegistry(dir);
    assert.equal(reg.docs.length, 2);
  } finally {
    removeTemp(dir);
  }
});

Deno.test("an entry lacking a source is refused", () => {
  refused({ "materials.yaml": replaceOnce(FIRST_SOURCE, "    basis: transcribed\n") }, {
    file: "materials.yaml",
    entry: "carbon-steel",
    field: "materials[0].source",
    problem: /expected string|required/i,
  });
});

Deno.test("an unknown source id is refused", () => {
  refused({
    "materials.yaml": replaceOnce(FIRST_SOURCE, FIRST_SOURCE.replace("e494", "e999")),
  }, {
    file: "materials.yaml",
    entry: "carbon-steel",
    field: "materials[0].source",
    problem: /unknown source id 'astm-e999'/,
  });
  // on a datum of its own, not just on the entry
  refused({
    "materials.yaml": replaceOnce(
      "      source: idelchik-2007\n",
      "      source: idelchick-2007\n",
    ),
  }, {
    file: "materials.yaml",
    entry: "carbon-steel",
    field: "materials[0].roughness.source",
    problem: /unknown source id 'idelchick-2007'/,
  });
});

Deno.test("a duplicate id is refused", () => {
  refused({ "materials.yaml": replaceOnce("id: stainless-steel-316", "id: stainless-steel-304") }, {
    file: "materials.yaml",
    entry: "stainless-steel-304",
    field: "materials[2].id",
    problem: /duplicate id 'stainless-steel-304'/,
  });
});

Deno.test("a bad unit is refused", () => {
  refused({
    "materials.yaml": replaceOnce(
      "longitudinal: { value: 5900, unit: m/s",
      "longitudinal: { value: 5900, unit: kg",
    ),
  }, {
    file: "materials.yaml",
    entry: "carbon-steel",
    field: "materials[0].longitudinal.unit",
    problem: /unit 'kg' is not a speed unit/,
  });
  refused({
    "materials.yaml": replaceOnce("{ value: -0.6, unit: m/s/K", "{ value: -0.6, unit: m/K"),
  }, {
    file: "materials.yaml",
    entry: "carbon-steel",
    field: "materials[0].temperatureCoefficient.longitudinal.unit",
    problem: /not a speed per temperature unit/,
  });
});

Deno.test("non-positive speeds and densities are refused", () => {
  refused({
    "materials.yaml": replaceOnce("{ value: 5900, unit: m/s", "{ value: -5900, unit: m/s"),
  }, {
    file: "materials.yaml",
    entry: "carbon-steel",
    field: "materials[0].longitudinal.value",
    problem: /greater than 0/,
  });
  refused({
    "materials.yaml": replaceOnce(
      "      value: 7850\n      unit: kg/m^3",
      "      value: 0\n      unit: kg/m^3",
    ),
  }, {
    file: "materials.yaml",
    entry: "carbon-steel",
    field: "materials[0].density.value",
    problem: /greater than 0/,
  });
});

Deno.test("an unknown key (a typo) is refused, not dropped", () => {
  refused({
    "materials.yaml": replaceOnce("unit: m/s, spread: 80 }", "unit: m/s, spraed: 80 }"),
  }, {
    file: "materials.yaml",
    entry: "carbon-steel",
    field: "materials[0].longitudinal",
    problem: /spraed/,
  });
});

Deno.test("a YAML syntax error is refused", () => {
  refused({ "materials.yaml": (s) => s + "  - id: [unclosed\n" }, {
    file: "materials.yaml",
    entry: "(file)",
    field: "(root)",
    problem: /not valid YAML/,
  });
});

Deno.test("an unknown kind is refused", () => {
  refused({ "extra/widgets.yaml": "kind: widgets\nwidgets: []\n" }, {
    file: "extra/widgets.yaml",
    entry: "(file)",
    field: "kind",
    problem: /unknown kind "widgets"; expected one of .*materials/,
  });
});
