/**
 * scripts/bundled/ (what `deno task plan` runs) against the sources it is built from: the
 * committed bundle must equal a fresh `deno bundle`, and the bundled command must write the same
 * bytes as scripts/plan.ts for one site, a fleet on two workers and a reconciliation.
 */
import { assert } from "../_assert.ts";
import { runScript } from "../_run.ts";
import { buildBundle, bundleDifferences, committedBundle } from "../../scripts/bundle.ts";

Deno.test("bundle: scripts/bundled/ equals a fresh build (else run: deno task bundle)", async () => {
  const diff = bundleDifferences(await buildBundle(), await committedBundle());
  assert.deepEqual(diff, [], `scripts/bundled/ is out of date; run: deno task bundle`);
});

Deno.test("bundle: differences name missing, changed and left-over files", () => {
  const a = new Map([["plan.js", "x"], ["chunk-A.js", "1"], ["chunk-B.js", "2"]]);
  const b = new Map([["plan.js", "x"], ["chunk-A.js", "one"], ["chunk-C.js", "3"]]);
  assert.deepEqual(bundleDifferences(a, b), [
    "differs: scripts/bundled/chunk-A.js",
    "left over: scripts/bundled/chunk-C.js",
    "missing: scripts/bundled/chunk-B.js",
  ]);
  assert.deepEqual(bundleDifferences(a, new Map(a)), []);
});

const PERMS = ["--allow-read", "--allow-write"];
const CASES: [string, string[]][] = [
  ["one site, JSON", ["data/demo/01-reservoir-outlet.yaml", "--format", "json"]],
  ["four sites on two workers, Markdown", [
    "data/demo",
    "--format",
    "md",
    "--jobs",
    "2",
    "--quiet",
  ]],
  ["four sites, fleet CSV, one thread", ["data/demo", "--format", "csv", "--jobs", "1", "--quiet"]],
  [
    "reconciliation",
    [
      "data/demo/02-pump-station-bends.yaml",
      "--readings",
      "data/demo/readings/twv-02-readings.yaml",
    ],
  ],
  ["refused input", ["data/demo/no-such-site.yaml"]],
];

for (const [name, args] of CASES) {
  Deno.test(`bundle: the bundled plan command gives the same bytes as the source: ${name}`, async () => {
    const [src, bun] = await Promise.all([
      runScript("plan.ts", args, { permissions: PERMS }),
      runScript("bundled/plan.js", args, { permissions: ["--v8-flags=--no-lazy", ...PERMS] }),
    ]);
    assert.equal(bun.code, src.code, bun.stderr);
    assert.equal(bun.stdout, src.stdout);
    assert.equal(bun.stderr, src.stderr);
    assert.ok(src.stdout.length > 0 || src.stderr.length > 0);
  });
}
