/**
 * The loader's SHA-256 against outside sources: the example messages of FIPS 180-4 (NIST's
 * published example values, recalled; the same run checks them against Python's hashlib) and
 * Python's `hashlib.sha256` (the standard library of Debian's /usr/bin/python3) on messages of
 * every length around the padding boundaries and on the registry's own data files.
 */
import { assert } from "../_assert.ts";
import { PYTHON, runPython } from "../_python.ts";
import { sha256Hex, sha256OfText } from "../../lib/registry/sha256.ts";

const enc = new TextEncoder();
const hasPy = (() => {
  try {
    return new Deno.Command(PYTHON, { args: ["-c", "import hashlib"] }).outputSync().success;
  } catch {
    return false;
  }
})();

Deno.test("FIPS 180-4 examples: one block, two blocks, one million 'a' (recalled values)", () => {
  assert.equal(
    sha256Hex(enc.encode("abc")),
    "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad",
  );
  assert.equal(
    sha256Hex(enc.encode("abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq")),
    "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1",
  );
  assert.equal(
    sha256Hex(enc.encode("a".repeat(1_000_000))),
    "cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0",
  );
});

const PY = `
import hashlib, json, sys
msgs = json.load(sys.stdin)
print(json.dumps([hashlib.sha256(bytes.fromhex(m)).hexdigest() for m in msgs]))
`;
const hex = (b: Uint8Array) => [...b].map((x) => x.toString(16).padStart(2, "0")).join("");

Deno.test({
  name: "Python hashlib: every length 0–200 bytes, block edges to 4 KiB, the data files",
  ignore: !hasPy,
  fn: async () => {
    const msgs: Uint8Array[] = [];
    for (let n = 0; n <= 200; n++) msgs.push(Uint8Array.from({ length: n }, (_, i) => i * 37 + n));
    for (const n of [447, 448, 511, 512, 513, 4095, 4096, 4097]) {
      msgs.push(Uint8Array.from({ length: n }, (_, i) => (i * 131) ^ (i >> 3)));
    }
    const files = ["data/sources.yaml", "data/snapshot.json"];
    for (const f of files) msgs.push(Deno.readFileSync(f));
    const want = await runPython<string[]>(PY, msgs.map(hex));
    msgs.forEach((m, i) => assert.equal(sha256Hex(m), want[i], `message ${i} (${m.length} bytes)`));
    // text in parts (non-ASCII included) hashes as its UTF-8 bytes one after the other
    const parts = ["pipes/é.yaml", "\0", "ø ± µ 𝛼", "\0"];
    const [whole] = await runPython<string[]>(PY, [hex(enc.encode(parts.join("")))]);
    assert.equal(sha256OfText(parts), whole);
  },
});
