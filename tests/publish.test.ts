/**
 * The package can be published: a licence is declared and `deno publish --dry-run` passes
 * (JSR's rules: a `license` field or LICENSE file, no slow types in the public API).
 */
import { assert } from "./_assert.ts";

const root = new URL("../", import.meta.url);

Deno.test("deno.json declares the licence the LICENSE file carries", async () => {
  const cfg = JSON.parse(await Deno.readTextFile(new URL("deno.json", root)));
  const text = await Deno.readTextFile(new URL("LICENSE", root));
  assert.equal(cfg.license, "MIT");
  assert.match(text.split("\n")[0], /^MIT License$/);
  assert.match(text, /Copyright \(c\) \d{4} the snellpath authors/);
});

Deno.test("deno publish --dry-run succeeds and publishes no tests, benches or output", async () => {
  const out = await new Deno.Command(Deno.execPath(), {
    args: ["publish", "--dry-run", "--allow-dirty"],
    cwd: root,
    env: { NO_COLOR: "1", DENO_NO_UPDATE_CHECK: "1" },
    stdout: "piped",
    stderr: "piped",
  }).output();
  const text = new TextDecoder().decode(out.stdout) + new TextDecoder().decode(out.stderr);
  assert.equal(out.code, 0, text.slice(-2000));
  assert.match(text, /Dry run complete/);
  assert.ok(!/^error/m.test(text), text.slice(-2000));
  const files = [...text.matchAll(/file:\/\/\S+/g)].map((m) => m[0]);
  assert.ok(files.some((f) => f.endsWith("/LICENSE")), "LICENSE is published");
  assert.ok(files.some((f) => f.endsWith("/mod.ts")), "mod.ts is published");
  for (const f of files) {
    assert.ok(!/\/(tests|bench|out|\.ci)\//.test(f), `should not be published: ${f}`);
  }
});
