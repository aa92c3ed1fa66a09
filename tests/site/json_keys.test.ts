/**
 * The JSON reader's repeated-key finder (lib/site/read_text.ts, hand-written so that JSON sites
 * do not load a YAML parser) against npm `yaml` 2 (the reference library it replaced on that
 * path: its JSON-schema parse with unique keys reports DUPLICATE_KEY at the repeated key). Same
 * offset, or none, on random nested JSON with escaped keys, non-ASCII keys and strings full of
 * brackets, commas and quotes.
 */
import { parseDocument } from "yaml";
import { assert } from "../_assert.ts";
import { repeatedJsonKey } from "../../lib/site/read_text.ts";

Deno.test("repeated JSON keys: same offset as npm yaml on 20 000 random documents", () => {
  let seed = 7;
  const rnd = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
  const keys = ["a", "b", "\\u0061", 'c\\"', "é", "a b"];
  const gen = (d: number): string => {
    const r = rnd();
    if (d > 3 || r < 0.3) return rnd() < 0.5 ? '"s,{}[]:\\""' : "1";
    const n = Math.floor(rnd() * 4);
    if (r < 0.6) return "[" + Array.from({ length: n }, () => gen(d + 1)).join(", ") + "]";
    const pair = () => `"${keys[Math.floor(rnd() * keys.length)]}": ${gen(d + 1)}`;
    return "{" + Array.from({ length: n }, pair).join(",\n ") + "}";
  };
  let repeats = 0;
  for (let i = 0; i < 20_000; i++) {
    const t = gen(0);
    JSON.parse(t); // valid JSON, as the finder assumes
    const doc = parseDocument(t, { schema: "json", uniqueKeys: true, strict: true });
    const want = doc.errors.find((e) => e.code === "DUPLICATE_KEY")?.pos[0];
    const got = repeatedJsonKey(t);
    assert.equal(got, want, t);
    if (got !== undefined) repeats++;
  }
  assert.ok(repeats > 1000, `${repeats} documents with a repeated key`);
});
