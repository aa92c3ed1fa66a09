/**
 * The sample page with every drawing renders in headless Chromium (Debian package chromium)
 * with no console message, and its SVG drawings are in the DOM. A strict XML parse of the same
 * drawings (as XHTML) catches malformed markup that the HTML parser would forgive.
 */
import { assert } from "../_assert.ts";
import { hasChromium, renderHtml } from "../_browser.ts";
import { sampleDrawings, samplePage } from "./_sample.ts";

Deno.test({
  name: "sample page renders with no console messages and all drawings in the DOM",
  ignore: !hasChromium(),
  fn: async () => {
    const dir = await Deno.makeTempDir();
    const shot = `${dir}/sample.png`;
    const r = await renderHtml(samplePage(), { screenshot: shot, width: 1000, height: 2000 });
    assert.deepEqual(r.console, [], "console messages");
    const n = Object.keys(sampleDrawings()).length;
    assert.equal((r.dom.match(/<svg /g) ?? []).length, n, "svg elements in the DOM");
    const png = await Deno.readFile(shot);
    assert.deepEqual(Array.from(png.slice(1, 4)), [0x50, 0x4e, 0x47], "PNG screenshot");
    assert.ok(png.length > 20_000, "screenshot is not blank");
    await Deno.remove(dir, { recursive: true });
  },
});

Deno.test({
  name: "the drawings are well-formed XML (strict XHTML parse shows no parser error)",
  ignore: !hasChromium(),
  fn: async () => {
    const dir = await Deno.makeTempDir();
    const file = `${dir}/page.xhtml`;
    const body = Object.values(sampleDrawings()).join("\n");
    await Deno.writeTextFile(
      file,
      `<?xml version="1.0" encoding="UTF-8"?>\n<html xmlns="http://www.w3.org/1999/xhtml">` +
        `<head><title>xml</title></head><body>${body}</body></html>`,
    );
    const r = await renderHtml({ file });
    assert.ok(!r.dom.includes("parsererror"), "XML parser error");
    assert.ok((r.dom.match(/<svg /g) ?? []).length >= 5);
    // The check can fail: a broken drawing is reported.
    await Deno.writeTextFile(
      file,
      `<?xml version="1.0"?><html xmlns="http://www.w3.org/1999/xhtml"><body><svg></body></html>`,
    );
    const bad = await renderHtml({ file });
    assert.ok(bad.dom.includes("parsererror"), "a malformed page is detected");
    await Deno.remove(dir, { recursive: true });
  },
});

Deno.test({
  name: "console capture works: a page that logs is caught",
  ignore: !hasChromium(),
  fn: async () => {
    const r = await renderHtml(
      '<!DOCTYPE html><html><body><svg viewBox="0 0 10 10"><path d="M 0 NaN"/></svg></body></html>',
    );
    assert.ok(r.console.length > 0, "an invalid SVG attribute logs an error");
  },
});
