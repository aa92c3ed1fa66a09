/**
 * scripts/reconcile.ts: every format it offers is written, the JSON agrees with the library
 * call, a format it cannot write is refused in one line with exit 2.
 */
import { assert } from "../_assert.ts";
import { runScript } from "../_run.ts";
import { readSiteFile } from "../../lib/site/read.ts";
import { reconcile } from "../../lib/site/reconcile.ts";
import { readReadingsText } from "../../lib/site/reconcile_read.ts";

const SITE = "data/demo/02-pump-station-bends.yaml";
const READINGS = "data/demo/readings/twv-02-readings.yaml";

Deno.test("reconcile script: json agrees with the library; md, html and text written", async () => {
  const j = await runScript("reconcile.ts", [SITE, READINGS, "--format", "json"]);
  assert.equal(j.code, 0, j.stderr);
  const got = JSON.parse(j.stdout);
  const site = await readSiteFile(SITE);
  const want = reconcile(site, await readReadingsText(await Deno.readTextFile(READINGS)));
  assert.equal(got.causes[0].cause, want.causes[0].cause);
  assert.equal(got.summary, want.summary);
  const md = await runScript("reconcile.ts", [SITE, READINGS, "--format", "md"]);
  assert.equal(md.code, 0, md.stderr);
  assert.match(md.stdout, /^# Reconciliation: /);
  assert.match(md.stdout, /## Causes, likeliest first/);
  const html = await runScript("reconcile.ts", [SITE, READINGS, "--format", "html"]);
  assert.equal(html.code, 0, html.stderr);
  assert.ok(html.stdout.startsWith("<!DOCTYPE html>"));
  assert.match(html.stdout, /Caution/);
  const text = await runScript("reconcile.ts", [SITE, READINGS]);
  assert.equal(text.code, 0, text.stderr);
  assert.ok(text.stdout.includes(want.causes[0].explanation));
});

Deno.test("reconcile script: a format it cannot write is refused in one line", async () => {
  const r = await runScript("reconcile.ts", [SITE, READINGS, "--format", "pdf"]);
  assert.equal(r.code, 2);
  assert.equal(r.stdout, "");
  assert.equal(r.stderr.trim().split("\n").length, 1);
  assert.match(r.stderr, /--format.*text, md, html, json/);
});
