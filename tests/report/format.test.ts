import { assert } from "../_assert.ts";
import { InputError } from "../../lib/errors.ts";
import {
  csvTable,
  escapeHtml,
  formatCompact,
  formatNumber,
  formatQuantity,
  htmlPage,
  markdownTable,
  textTable,
} from "../../lib/report/mod.ts";

Deno.test("formatQuantity converts SI to display units", () => {
  assert.equal(formatQuantity(0.00602, "mm", 3), "6.02 mm");
  assert.equal(formatQuantity(0.02, "m^3/h", 4), "72.00 m³/h");
  assert.equal(formatQuantity(0.02, "L/s", 3, true), "20 L/s");
  assert.equal(formatQuantity(1.25e-7, "ns", 3), "125 ns");
  assert.equal(formatQuantity(273.15, "degF", 3), "32.0 °F");
  assert.throws(() => formatQuantity(NaN, "mm"), InputError);
  assert.throws(() => formatQuantity(1, "furlong"), InputError);
  assert.equal(formatNumber(-0.000123456, 3), "-0.000123");
  assert.equal(formatNumber(0, 3), "0.00");
  assert.equal(formatCompact(120, 3), "120");
  assert.equal(formatCompact(1.5e-9, 3), "1.5e-9");
});

Deno.test("textTable aligns columns by display width", () => {
  const t = textTable(["name", "Δt ns"], [["µ-path", 12.5], ["long name here", 3]]);
  const lines = t.split("\n");
  assert.equal(lines.length, 4);
  // Every line has the numeric column ending at the same column.
  const ends = lines.filter((_, i) => i !== 1).map((l) => [...l].length);
  assert.ok(ends.every((e) => e === ends[0]), t);
  assert.ok(lines[2].endsWith(" 12.5"));
  assert.throws(() => textTable(["a", "b"], [["x"]]), InputError);
  assert.throws(() => textTable(["a"], [[Infinity]]), InputError);
});

Deno.test("CSV follows RFC 4180 quoting and CRLF records", () => {
  // RFC 4180 §2: fields with commas, quotes or line breaks are quoted; quotes doubled.
  const csv = csvTable(["a", "b", "c"], [["x,y", 'he said "no"', "two\nlines"], [
    "plain",
    1.5,
    -2,
  ]]);
  assert.equal(
    csv,
    'a,b,c\r\n"x,y","he said ""no""","two\nlines"\r\nplain,1.5,-2\r\n',
  );
  // Parse it back with a minimal RFC 4180 reader and compare.
  const parsed: string[][] = [];
  let row: string[] = [], field = "", quoted = false;
  for (let i = 0; i < csv.length; i++) {
    const ch = csv[i];
    if (quoted) {
      if (ch === '"' && csv[i + 1] === '"') (field += '"', i++);
      else if (ch === '"') quoted = false;
      else field += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === ",") (row.push(field), field = "");
    else if (ch === "\r" && csv[i + 1] === "\n") {
      (row.push(field), parsed.push(row), row = [], field = "", i++);
    } else field += ch;
  }
  assert.deepEqual(parsed[1], ["x,y", 'he said "no"', "two\nlines"]);
});

Deno.test("Markdown tables escape pipes; HTML escaping and page shell", () => {
  const md = markdownTable(["k", "v"], [["a|b", "line\nbreak"]]);
  assert.ok(md.includes("a\\|b") && md.includes("line break"));
  assert.equal(escapeHtml("<svg onload='x'>&"), "&lt;svg onload=&#39;x&#39;&gt;&amp;");
  const page = htmlPage({ title: "T & U", body: "<p>x</p>", css: "p{color:red}" });
  assert.ok(page.includes("<title>T &amp; U</title>"));
  assert.ok(page.includes("default-src 'none'"), "offline: outside resources forbidden");
  assert.ok(!/<script|<link|https?:\/\//i.test(page.replace(/xmlns="[^"]*"/g, "")));
  assert.throws(() => htmlPage({ title: "x", body: "", css: "</style><script>" }), InputError);
});
