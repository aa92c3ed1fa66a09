/**
 * Registry load time (aim: under 50 ms for the whole data folder; the snapshot path is the
 * start-up path, full validation runs when the YAML changed) and catalogue lookups.
 */
import { createRegistry, DATA_DIR, defaultRegistry } from "../lib/registry/mod.ts";
import { loadRegistry } from "../lib/registry/load.ts";
import { pipe } from "../lib/pipe/mod.ts";

Deno.bench("registry: load (validated snapshot when current)", {
  group: "load",
  baseline: true,
}, () => {
  loadRegistry(DATA_DIR);
});

Deno.bench("registry: load with full validation (YAML, zod, provenance, hash)", {
  group: "load",
}, () => {
  loadRegistry(DATA_DIR, { snapshot: false });
});

Deno.bench("registry: load and build the query object", { group: "load" }, () => {
  createRegistry(loadRegistry(DATA_DIR));
});

const reg = defaultRegistry();

Deno.bench("registry.pipe: B36.10M NPS 1-1/2 Sch 40 (text forms)", { group: "lookup" }, () => {
  reg.pipe({ standard: "B36.10M", nps: "1 1/2", schedule: "sch40" });
});

Deno.bench("pipe(): measured circumference with lining", { group: "lookup" }, () => {
  pipe({
    circumference: 0.359,
    wallThickness: 0.006,
    material: "carbon-steel",
    lining: { material: "cement-mortar", thickness: 0.008 },
  }, { registry: reg });
});
