/**
 * Site files anywhere: the plan task reads any path the user names (read permission on what
 * the user gives), writes stay confined to out/, and a denied permission is one line naming the
 * flag and the fix.
 */
import { assert } from "../_assert.ts";

const root = new URL("../../", import.meta.url);
const cfg = JSON.parse(await Deno.readTextFile(new URL("deno.json", root)));

/** The plan task's own `deno run` flags, as deno.json states them. */
const taskFlags = (name: string): string[] => {
  const words = (cfg.tasks[name] as string).split(/\s+/);
  return words.slice(2, words.findIndex((w) => w.startsWith("scripts/")));
};

async function run(flags: string[], args: string[]) {
  const out = await new Deno.Command(Deno.execPath(), {
    args: ["run", ...flags, "scripts/plan.ts", ...args],
    cwd: root,
    env: { NO_COLOR: "1", DENO_NO_UPDATE_CHECK: "1" },
    stdout: "piped",
    stderr: "piped",
  }).output();
  const d = new TextDecoder();
  return { code: out.code, stdout: d.decode(out.stdout), stderr: d.decode(out.stderr) };
}

Deno.test("a site file outside the repository plans through the plan task's flags", async () => {
  const dir = await Deno.makeTempDir({ prefix: "snellpath-outside-" });
  try {
    const site = `${dir}/site.yaml`;
    await Deno.copyFile(new URL("data/demo/01-reservoir-outlet.yaml", root), site);
    const flags = taskFlags("plan");
    assert.ok(flags.includes("--allow-read"), "the plan task reads what the user names");
    assert.ok(flags.includes("--allow-write=out"), "writes stay confined to out/");
    const r = await run(flags, [site, "--no-monte-carlo", "--format", "json"]);
    assert.equal(r.code, 0, r.stderr);
    assert.equal(
      JSON.parse(r.stdout).name,
      "Tarnwick Valley Water — reservoir outlet main (invented)",
    );
    // Writing beside it is refused, in one line naming --allow-write and the way out.
    const w = await run(flags, [site, "--no-monte-carlo", "--out", `${dir}/plan.txt`]);
    assert.equal(w.code, 2);
    assert.equal(w.stderr.trim().split("\n").length, 1, w.stderr);
    assert.match(w.stderr, /^error: not permitted: write access to .* needs --allow-write/);
    assert.match(w.stderr, /--out inside out\//);
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});

Deno.test("a denied read names the permission and the fix in one line", async () => {
  const dir = await Deno.makeTempDir({ prefix: "snellpath-denied-" });
  try {
    const site = `${dir}/site.yaml`;
    await Deno.copyFile(new URL("data/demo/01-reservoir-outlet.yaml", root), site);
    const r = await run(["--no-prompt", "--allow-read=.", "--ignore-env=LOG_TOKENS,LOG_STREAM"], [
      site,
    ]);
    assert.equal(r.code, 2);
    assert.equal(r.stdout, "");
    assert.equal(r.stderr.trim().split("\n").length, 1, r.stderr);
    assert.match(r.stderr, /^error: not permitted: read access to .*site\.yaml needs --allow-read/);
    assert.ok(r.stderr.includes(`--allow-read=${site}`), r.stderr);
    assert.ok(!/expected an existing file or folder/.test(r.stderr));
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});
