/**
 * The loader refuses impossible or unsourced pipe data, naming file, entry and field.
 */
import { assert } from "../_assert.ts";
import { RegistryError } from "../../lib/errors.ts";
import { loadRegistry } from "../../lib/registry/load.ts";
import { replaceOnce, tempPipeData } from "./_data.ts";

function refused(edits: Record<string, (s: string) => string>, ...parts: string[]): void {
  const dir = tempPipeData(edits);
  try {
    assert.throws(() => loadRegistry(dir), (e: unknown) => {
      assert.ok(e instanceof RegistryError, `expected a RegistryError, got ${e}`);
      for (const p of parts) {
        assert.ok(e.message.includes(p), `message '${e.message}' lacks '${p}'`);
      }
      return true;
    });
  } finally {
    Deno.removeSync(dir, { recursive: true });
  }
}

Deno.test("the unedited copy of the catalogue loads", () => {
  const dir = tempPipeData();
  try {
    const reg = loadRegistry(dir);
    assert.ok(reg.docs.filter((d) => d.kind === "pipes").length >= 7);
  } finally {
    Deno.removeSync(dir, { recursive: true });
  }
});

Deno.test("a wall at or beyond the radius is refused, naming file, entry and field", () => {
  refused(
    {
      "pipes/asme-b36-10m.yaml": replaceOnce(
        'nps: "4",\n      outsideDiameterMm: 114.3,\n      wallMm: {\n        "5": 2.11,',
        'nps: "4",\n      outsideDiameterMm: 114.3,\n      wallMm: {\n        "5": 57.15,',
      ),
    },
    "pipes/asme-b36-10m.yaml",
    "entry 4",
    "wallMm.5",
    "radius",
  );
});

Deno.test("a lining that fills the bore is refused", () => {
  refused(
    {
      "pipes/awwa-c151.yaml": replaceOnce(
        "{ npsMin: 3, npsMax: 12, thicknessMm: 1.6 }",
        "{ npsMin: 3, npsMax: 12, thicknessMm: 45 }",
      ),
    },
    "pipes/awwa-c151.yaml",
    "entry 3",
    "fills the bore",
  );
});

Deno.test("a non-positive outside diameter is refused", () => {
  refused(
    {
      "pipes/astm-f441.yaml": replaceOnce(
        'nps: "1", outsideDiameterMm: 33.401',
        'nps: "1", outsideDiameterMm: -33.401',
      ),
    },
    "pipes/astm-f441.yaml",
    "entry 1",
    "outsideDiameterMm",
  );
});

Deno.test("an unknown source id is refused, naming file and entry", () => {
  refused(
    { "pipes/astm-d1785.yaml": replaceOnce("source: astm-d1785", "source: astm-d9999") },
    "pipes/astm-d1785.yaml",
    "entry astm-d1785",
    "unknown source id 'astm-d9999'",
  );
});

Deno.test("an unknown source id on one wall override is refused", () => {
  refused(
    {
      "pipes/asme-b36-10m.yaml": replaceOnce(
        "valueMm: 17.48,\n",
        "valueMm: 17.48,\n          source: nowhere-1999,\n",
      ),
    },
    "pipes/asme-b36-10m.yaml",
    "entry 30",
    "nowhere-1999",
  );
});

Deno.test("a pipe file lacking a source is refused, naming file and entry", () => {
  refused(
    { "pipes/astm-f441.yaml": replaceOnce("source: astm-f441\n", "") },
    "pipes/astm-f441.yaml",
    "entry astm-f441",
    "field source",
  );
});

Deno.test("a tolerance set lacking a source is refused, naming file and entry", () => {
  refused(
    { "pipes/tolerances.yaml": replaceOnce("    source: astm-b88\n", "") },
    "pipes/tolerances.yaml",
    "entry copper-b88",
    "source",
  );
});

Deno.test("a duplicate size within a standard is refused, whatever way it is written", () => {
  refused(
    {
      "pipes/asme-b36-19m.yaml": (s) =>
        s + '  - { nps: "1.5", outsideDiameterMm: 48.3, wallMm: { "40S": 3.68 } }\n',
    },
    "pipes/asme-b36-19m.yaml",
    "duplicate size 1.5",
  );
});

Deno.test("a schedule outside the declared series is refused", () => {
  refused(
    {
      "pipes/astm-d1785.yaml": replaceOnce(
        'nps: "4", outsideDiameterMm: 114.3, wallMm: { "40"',
        'nps: "4", outsideDiameterMm: 114.3, wallMm: { "45"',
      ),
    },
    "pipes/astm-d1785.yaml",
    "entry 4",
    "'45' is not in any declared series",
  );
});
