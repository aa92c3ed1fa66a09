/**
 * `deno task verify`, installation section: every line within 100 columns (every point printed
 * with --all-rows), one header per published statement, and the count line agrees with the
 * checks the library runs.
 */
import { assert } from "../_assert.ts";
import { runScript } from "../_run.ts";
import { checkInstallationData } from "../../lib/installation/mod.ts";

Deno.test("verify: installation section within 100 columns, counts as the library's", async () => {
  const r = await runScript("verify.ts", ["--all-rows"], { permissions: ["--allow-read=data"] });
  assert.equal(r.code, 0, r.stderr);
  const at = r.stdout.indexOf("installation model against published data");
  assert.ok(at >= 0, "installation section printed");
  const lines = r.stdout.slice(at).split("\n");
  const long = lines.filter((l) => [...l].length > 100);
  assert.deepEqual(long, []);
  const checks = checkInstallationData();
  assert.ok(lines.includes(`${checks.length} passed, 0 failed (installation)`));
  // --all-rows: one line per check
  assert.equal(lines.filter((l) => /^ {8}(pass|FAIL) /.test(l)).length, checks.length);
  const statements = new Set(checks.map((c) => `${c.table}: ${c.statement}`));
  for (const s of statements) assert.ok(lines.some((l) => l.endsWith(s)), s);
});
