/**
 * scripts/plan.ts end to end: the demo, fleets with a bad site, atomic writes, the registry pin,
 * the HTML report in a real headless browser (Debian's chromium).
 */
import { assert } from "../_assert.ts";
import { runScript } from "../_run.ts";
import { hasChromium, renderHtml } from "../_browser.ts";
import { defaultRegistry } from "../../lib/registry/mod.ts";

/** scripts/plan.ts, run from the repository root; it reads sites and writes reports anywhere. */
function plan(args: string[]) {
  return runScript("plan.ts", args, { permissions: ["--allow-read", "--allow-write"] });
}

const GOOD = `name: Fleet site (invented)
pipe: { standard: ASME B36.10M, nps: "4", schedule: "40", material: carbon-steel }
fluid: { liquid: water, temperature: 20 degC }
flow: { minimum: 2 L/s, maximum: 10 L/s }
transducer: { wedgeSoundSpeed: 2720 m/s, wedgeAngle: 38 deg, frequency: 1 MHz }
`;

Deno.test("demo: plans every demo site and writes an index and one page per site", async () => {
  const dir = await Deno.makeTempDir();
  const r = await plan(["data/demo", "--format", "html", "--out", dir, "--quiet"]);
  assert.equal(r.code, 0, r.stderr);
  const names = [...Deno.readDirSync(dir)].map((e) => e.name).sort();
  assert.ok(names.includes("index.html") && names.includes("summary.csv"));
  assert.ok(names.filter((n) => /^twv-\d+\.html$/.test(n)).length >= 4);
  const csv = Deno.readTextFileSync(`${dir}/summary.csv`);
  assert.ok(csv.includes(defaultRegistry().hash), "the summary names the registry hash");
});

Deno.test("one site: JSON on stdout with the required fields, SI, and the hash", async () => {
  const r = await plan(["data/demo/01-reservoir-outlet.yaml", "--json"]);
  assert.equal(r.code, 0, r.stderr);
  const p = JSON.parse(r.stdout);
  for (
    const k of [
      "pipe",
      "fluid",
      "mountings",
      "operatingPoints",
      "straightRun",
      "uncertainty",
      "trace",
      "registryHash",
      "cautions",
      "warnings",
    ]
  ) {
    assert.ok(k in p, `missing ${k}`);
  }
  assert.ok(p.mountings[0].spacing > 0.01 && p.mountings[0].spacing < 1, "spacing in metres");
  assert.ok(p.uncertainty.expanded > 0 && p.uncertainty.expanded < 1, "expanded as a fraction");
  assert.ok(p.uncertainty.monteCarlo.draws >= 100000);
  assert.ok(!r.stdout.includes("NaN"));
});

Deno.test("fleet: one bad site is reported, the others are planned, exit 2", async () => {
  const dir = await Deno.makeTempDir();
  await Deno.writeTextFile(`${dir}/a.yaml`, GOOD);
  await Deno.writeTextFile(`${dir}/b.yaml`, GOOD.replace("carbon-steel", "cheese"));
  await Deno.writeTextFile(`${dir}/c.yaml`, GOOD.replace("Fleet site", "Another site"));
  const out = `${dir}/out`;
  const r = await plan([dir, "--format", "csv", "--out", out, "--quiet"]);
  assert.equal(r.code, 2);
  const lines = r.stderr.trim().split("\n");
  assert.equal(lines.length, 1, r.stderr);
  assert.match(lines[0], /b\.yaml.*cheese/);
  assert.ok(!/\bat \S+:\d+/.test(r.stderr), "no stack trace");
  const csv = Deno.readTextFileSync(`${out}/summary.csv`).trim().split(/\r?\n/);
  assert.equal(csv.length, 4, "header + 3 rows");
  assert.equal(csv.filter((l) => l.includes("refused")).length, 1);
});

Deno.test("atomic: a refused run never truncates an earlier report", async () => {
  const dir = await Deno.makeTempDir();
  await Deno.writeTextFile(`${dir}/s.yaml`, GOOD);
  const target = `${dir}/report.json`;
  assert.equal((await plan([`${dir}/s.yaml`, "--json", "--out", target])).code, 0);
  const before = Deno.readTextFileSync(target);
  await Deno.writeTextFile(`${dir}/s.yaml`, GOOD.replace("20 degC", "20 m"));
  const r = await plan([`${dir}/s.yaml`, "--json", "--out", target]);
  assert.equal(r.code, 2);
  assert.equal(Deno.readTextFileSync(target), before);
  assert.equal([...Deno.readDirSync(dir)].filter((e) => e.name.endsWith(".tmp")).length, 0);
});

Deno.test("registry pin: a mismatching hash is refused, the right one accepted", async () => {
  const bad = await plan([
    "data/demo/01-reservoir-outlet.yaml",
    "--registry-hash",
    "0".repeat(64),
    "--no-monte-carlo",
  ]);
  assert.equal(bad.code, 2);
  assert.match(bad.stderr, /--registry-hash/);
  assert.equal(bad.stdout, "");
  const good = await plan([
    "data/demo/01-reservoir-outlet.yaml",
    "--registry-hash",
    defaultRegistry().hash,
    "--no-monte-carlo",
  ]);
  assert.equal(good.code, 0, good.stderr);
});

Deno.test("beyond the critical angle: exit 1, one line naming the angle", async () => {
  const dir = await Deno.makeTempDir();
  await Deno.writeTextFile(`${dir}/s.yaml`, GOOD.replace("38 deg", "80 deg"));
  const r = await plan([`${dir}/s.yaml`]);
  assert.equal(r.code, 1);
  assert.equal(r.stderr.trim().split("\n").length, 1);
  assert.match(r.stderr, /critical/);
  assert.equal(r.stdout, "");
});

Deno.test("readings: the invented demo readings reconcile to a named cause", async () => {
  const r = await plan([
    "data/demo/02-pump-station-bends.yaml",
    "--readings",
    "data/demo/readings/twv-02-readings.yaml",
    "--json",
  ]);
  assert.equal(r.code, 0, r.stderr);
  const x = JSON.parse(r.stdout);
  assert.ok(x.mountings[0].causes.length > 0);
  assert.ok(Number.isFinite(x.mountings[0].inferredSoundSpeed));
});

Deno.test("readings through plan: the reconcile task's reader and formats, others refused", async () => {
  const args = [
    "data/demo/02-pump-station-bends.yaml",
    "--readings",
    "data/demo/readings/twv-02-readings-zv.yaml", // traverses written as Z and V
  ];
  const md = await plan([...args, "--format", "md"]);
  assert.equal(md.code, 0, md.stderr);
  assert.match(md.stdout, /^# Reconciliation: /);
  const html = await plan([...args, "--format", "html"]);
  assert.equal(html.code, 0, html.stderr);
  assert.match(html.stdout, /^<!DOCTYPE html>/);
  const csv = await plan([...args, "--format", "csv"]);
  assert.equal(csv.code, 2);
  assert.equal(csv.stdout, "");
  assert.match(csv.stderr, /--format: got csv; expected with --readings: text, md, html, json/);
});

Deno.test(
  {
    name: "HTML report renders in headless chromium with no console errors",
    ignore: !hasChromium(),
  },
  async () => {
    const dir = await Deno.makeTempDir();
    const r = await plan([
      "data/demo/03-lined-trunk-main.yaml",
      "--format",
      "html",
      "--out",
      dir,
      "--quiet",
    ]);
    assert.equal(r.code, 0, r.stderr);
    const page = [...Deno.readDirSync(dir)].find((e) => e.name.startsWith("twv-03"))!.name;
    const shown = await renderHtml({ file: `${dir}/${page}` });
    assert.deepEqual(shown.console.filter((c) => /error/i.test(c)), []);
    const svgs = shown.dom.match(/<svg/g)?.length ?? 0;
    assert.ok(svgs >= 6, `expected the drawings, found ${svgs} svg elements`);
    assert.ok(shown.dom.includes(defaultRegistry().hash));
    assert.ok(!shown.dom.includes("NaN"));
  },
);
