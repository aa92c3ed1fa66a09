/**
 * The corpus of bad site files in tests/site/bad/: each must be refused with an InputError
 * (exit code 2) whose message is one line, names the file and names the expected field.
 *
 * Each case is stored as `<name>.<ext>.sample` (so that formatters leave the broken files
 * alone) and read under its real name `<name>.<ext>` from a temporary copy. The expected field
 * is on the file's first line (`# field: fluid.temperature`) or, for files that cannot hold a
 * comment (empty, binary, JSON), in a sidecar `<name>.<ext>.sample.expect`.
 */
import { InputError } from "../../lib/errors.ts";
import { MAX_SITE_BYTES } from "../../lib/site/schema.ts";
import { readSiteFile, readSiteText, SiteInputError } from "../../lib/site/read.ts";
import { assert, refusal } from "../_assert.ts";

const BAD = new URL("./bad/", import.meta.url);
/** Temporary folder holding the cases under their real names; removed by the last test. */
const BAD_DIR = Deno.makeTempDirSync({ prefix: "snellpath-bad-sites-" }) + "/";

interface Case {
  file: string;
  field: string;
  what: string;
}

function cases(): Case[] {
  const out: Case[] = [];
  for (const e of Deno.readDirSync(BAD)) {
    if (!e.isFile || !e.name.endsWith(".sample")) continue;
    const name = e.name.slice(0, -".sample".length);
    const bytes = Deno.readFileSync(new URL(e.name, BAD));
    Deno.writeFileSync(BAD_DIR + name, bytes);
    let head: string;
    try {
      head = Deno.readTextFileSync(new URL(e.name + ".expect", BAD));
    } catch {
      head = new TextDecoder().decode(bytes).split("\n").slice(0, 2)
        .map((l) => l.replace(/^#\s*/, "")).join("\n");
    }
    const field = /^field:\s*(.+)$/m.exec(head)?.[1]?.trim();
    const what = /^case:\s*(.+)$/m.exec(head)?.[1]?.trim() ?? e.name;
    if (!field) throw new Error(`${e.name}: no expected field (first line or .expect sidecar)`);
    out.push({ file: name, field, what });
  }
  return out.sort((a, b) => a.file.localeCompare(b.file));
}

const ALL = cases();

Deno.test("bad corpus: the corpus is there and covers the required kinds", () => {
  assert.ok(ALL.length >= 80, `only ${ALL.length} cases`);
  const names = ALL.map((c) => c.file).join(" ");
  for (
    const needed of [
      "wrong-dimension",
      "in-words",
      "bare-number",
      "negative",
      "zero",
      "nan",
      "overflow",
      "huge",
      "thicker-than-radius",
      "traverse-zero",
      "traverse-fraction",
      "minimum-above-maximum",
      "typo",
      "empty",
      "binary",
      "syntax",
      "alias-bomb",
    ]
  ) assert.ok(names.includes(needed), `no case for ${needed}`);
});

for (const c of ALL) {
  Deno.test(`bad corpus: ${c.file} (${c.what}) → ${c.field}`, async () => {
    let caught: unknown;
    try {
      await readSiteFile(BAD_DIR + c.file);
    } catch (e) {
      caught = e;
    }
    assert(caught instanceof InputError, `${c.file}: not an InputError: ${caught}`);
    assert(caught instanceof SiteInputError, `${c.file}: not a SiteInputError`);
    const msg = caught.message;
    assert.equal(caught.exitCode, 2);
    assert.ok(!msg.includes("\n"), `${c.file}: message spans lines: ${msg}`);
    assert.ok(msg.length < 400, `${c.file}: message too long (${msg.length})`);
    assert.ok(
      msg.startsWith(BAD_DIR + c.file + ": "),
      `${c.file}: message does not name the file: ${msg}`,
    );
    assert.ok(
      caught.field === c.field || caught.field.startsWith(c.field),
      `${c.file}: field ${caught.field}, expected ${c.field} (${msg})`,
    );
    assert.ok(/got .+; expected .+/.test(msg), `${c.file}: not "got …; expected …": ${msg}`);
  });
}

Deno.test("bad corpus: typos suggest the nearest key", async () => {
  const expect: Record<string, string> = {
    "typo-top-level.yaml": '"fluid"',
    "typo-nested.yaml": '"schedule"',
    "typo-snake-case.yaml": '"wallThickness"',
    "typo-deep.yaml": '"fitting"',
    "json-typo.json": '"wedgeAngle"',
  };
  for (const [file, hint] of Object.entries(expect)) {
    const e = await refusal(readSiteFile(BAD_DIR + file));
    assert.ok(e.message.includes(`did you mean ${hint}`), `${file}: ${e.message}`);
  }
});

Deno.test("bad corpus: an unrelated unknown key lists the valid keys instead of guessing", async () => {
  const e = await refusal(readSiteFile(BAD_DIR + "unknown-key.yaml"));
  assert.ok(!e.message.includes("did you mean"), e.message);
  assert.ok(e.message.includes("wallThickness") && e.message.includes("lining"), e.message);
});

Deno.test("bad corpus: syntax errors name the line of the fault", async () => {
  const lines: Record<string, number> = {
    "syntax-tab-indent.yaml": 5,
    "duplicate-key.yaml": 16,
    "json-duplicate-key.json": 3,
  };
  for (const [file, line] of Object.entries(lines)) {
    const e = await refusal(readSiteFile(BAD_DIR + file));
    assert.ok(e.field.startsWith(`line ${line},`), `${file}: ${e.message}`);
  }
  const dup = await refusal(readSiteFile(BAD_DIR + "duplicate-key.yaml"));
  assert.match(dup.message, /"minimum" a second time/);
});

Deno.test("bad corpus: the alias bomb is refused quickly and says why", async () => {
  await assert.rejects(readSiteFile(BAD_DIR + "alias-bomb.yaml"), /alias/);
});

Deno.test("size limit: a file over 256 KiB is refused before it is read", async () => {
  const dir = await Deno.makeTempDir();
  try {
    const path = `${dir}/big.yaml`;
    const filler = "# " + "x".repeat(98) + "\n";
    const text = "name: Big (invented)\n" + filler.repeat(Math.ceil(MAX_SITE_BYTES / 100) + 10);
    await Deno.writeTextFile(path, text);
    const e = await refusal(readSiteFile(path));
    assert.equal(e.field, "file");
    assert.ok(e.message.includes(`at most ${MAX_SITE_BYTES} bytes`), e.message);
    // A sparse file far larger than memory would allow is refused by its size alone.
    const sparse = `${dir}/sparse.yaml`;
    const f = await Deno.open(sparse, { write: true, create: true });
    await f.truncate(8 * 1024 * 1024 * 1024);
    f.close();
    await assert.rejects(readSiteFile(sparse), /8589934592 bytes/);
    // The text entry point has the same limit.
    await assert.rejects(readSiteText(text), /at most 262144 bytes/);
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});

Deno.test("missing file and folder are one-line input errors", async () => {
  const e = await refusal(readSiteFile(BAD_DIR + "no-such-site.yaml"));
  assert.ok(e.message.includes("no such file"), e.message);
  const dir = await Deno.makeTempDir({ suffix: ".yaml" });
  try {
    await assert.rejects(readSiteFile(dir), /a folder or special file/);
  } finally {
    await Deno.remove(dir);
  }
});

Deno.test("bad corpus: clean up the temporary copies", async () => {
  await Deno.remove(BAD_DIR, { recursive: true });
});
