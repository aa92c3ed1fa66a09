/**
 * `scripts/plan.ts --jobs N`: a generated invented fleet (CSV and a folder of YAML files, with
 * refused rows and files among them) planned on one thread and on several gives the same files,
 * byte for byte, the same standard output and the same error lines in the same order.
 * An invariant of our own (no outside source needed: the two runs must agree).
 */
import { assert } from "../_assert.ts";
import { runScript } from "../_run.ts";
import { inventedFleetCsv, inventedFleetYaml } from "../../bench/_fleet.ts";

function plan(args: string[]) {
  return runScript("plan.ts", args, { permissions: ["--allow-read", "--allow-write"] });
}

async function fleetInput(): Promise<{ csv: string; folder: string }> {
  const dir = await Deno.makeTempDir();
  const csv = `${dir}/fleet.csv`;
  Deno.writeTextFileSync(csv, inventedFleetCsv(45, 8));
  const folder = `${dir}/sites`;
  Deno.mkdirSync(folder);
  for (const [name, text] of inventedFleetYaml(14, 6)) {
    Deno.writeTextFileSync(`${folder}/${name}`, text);
  }
  return { csv, folder };
}

function files(dir: string): Map<string, Uint8Array> {
  const out = new Map<string, Uint8Array>();
  for (const e of Deno.readDirSync(dir)) out.set(e.name, Deno.readFileSync(`${dir}/${e.name}`));
  return out;
}

const errorLines = (stderr: string) => stderr.split("\n").filter((l) => l.startsWith("error:"));

for (const format of ["csv", "html", "json"]) {
  Deno.test(`--jobs 3 = --jobs 1, byte for byte: CSV and folder input, --format ${format}`, async () => {
    const { csv, folder } = await fleetInput();
    const outs: Map<string, Uint8Array>[] = [];
    const errs: string[][] = [];
    for (const jobs of ["1", "3"]) {
      const out = await Deno.makeTempDir();
      const r = await plan([csv, folder, "--format", format, "--out", out, "--jobs", jobs]);
      assert.equal(r.code, 2, "refused sites give exit code 2");
      outs.push(files(out));
      errs.push(errorLines(r.stderr));
    }
    const [one, three] = outs;
    assert.ok(one.size > 50, `${one.size} files`);
    assert.deepEqual([...three.keys()].sort(), [...one.keys()].sort());
    for (const [name, bytes] of one) assert.deepEqual(three.get(name), bytes, name);
    assert.ok(errs[0].length >= 6, "the refused sites are reported");
    assert.deepEqual(errs[1], errs[0]);
    assert.ok(errs[0].some((l) => /row \d+ \(site S\d+\)/.test(l)), "a bad row names its site id");
  });
}

Deno.test("--jobs 2 = --jobs 1 on standard output (JSON lines and the fleet CSV)", async () => {
  const { csv } = await fleetInput();
  for (const format of ["json", "csv"]) {
    const a = await plan([csv, "--format", format, "--jobs", "1", "--quiet"]);
    const b = await plan([csv, "--format", format, "--jobs", "2", "--quiet"]);
    assert.equal(a.code, 2);
    assert.ok(a.stdout.length > 1000);
    assert.equal(b.stdout, a.stdout, format);
    assert.equal(b.stderr, a.stderr);
  }
});

Deno.test("--jobs refuses what is not a count", async () => {
  const { csv } = await fleetInput();
  const r = await plan([csv, "--jobs", "0"]);
  assert.equal(r.code, 2);
  assert.match(r.stderr, /--jobs: got "0"; expected an integer from 1 to 256/);
});
