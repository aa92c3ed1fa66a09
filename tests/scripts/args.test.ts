/**
 * The scripts' argument reader (scripts/_args.ts) against `node:util` `parseArgs`, the reference
 * it follows (Node's built-in argument parser, run here in Deno's Node compatibility, strict mode
 * with positionals allowed): on generated argument lists, either both refuse the list or both give
 * the same values and positionals.
 */
import fc from "fast-check";
import { parseArgs } from "node:util";
import { assert } from "../_assert.ts";
import { type ArgSpec, ArgumentError, readArgs } from "../../scripts/_args.ts";

const SPEC: ArgSpec = {
  help: { type: "boolean", short: "h" },
  quiet: { type: "boolean", short: "q" },
  json: { type: "boolean" },
  format: { type: "string", short: "f" },
  out: { type: "string" },
  tag: { type: "string", multiple: true },
  flag: { type: "boolean", multiple: true },
};

const TOKENS = [
  "--help",
  "--quiet",
  "--json",
  "--json=1",
  "--format",
  "--format=json",
  "--format=",
  "--out",
  "--out=-5",
  "--tag",
  "--tag=a",
  "--flag",
  "--nope",
  "--nope=1",
  "--=x",
  "--",
  "-",
  "-h",
  "-q",
  "-hq",
  "-qh",
  "-f",
  "-fjson",
  "-hfx",
  "-qfh",
  "-x",
  "-hx",
  "-5",
  "-5 degC",
  "site.yaml",
  "json",
  "a=b",
  "",
  "--help=",
  "---x",
  "-f=1",
  "--Help",
];

/** Both readers on one list: "refused", or the values and positionals as canonical text. */
function both(args: string[]): [string, string] {
  let node: string;
  try {
    const r = parseArgs({ args, options: SPEC, strict: true, allowPositionals: true });
    node = show(r.values, r.positionals);
  } catch {
    node = "refused";
  }
  let ours: string;
  try {
    const r = readArgs(args, SPEC);
    ours = show(r.values, r.positionals);
  } catch (e) {
    if (!(e instanceof ArgumentError)) throw e;
    ours = "refused";
  }
  return [node, ours];
}

function show(values: Record<string, unknown>, positionals: string[]): string {
  const keys = Object.keys(values).sort();
  return JSON.stringify([keys.map((k) => [k, values[k]]), positionals]);
}

Deno.test("argument reader: the same as node:util parseArgs on hand-picked lists", () => {
  const cases = [
    ["site.yaml", "--format", "json", "-h"],
    ["--format=-5", "x"],
    ["--format", "-5"],
    ["--format"],
    ["-fjson", "--", "--help"],
    ["-hfjson"],
    ["-hf", "json"],
    ["--tag", "a", "--tag=b", "--tag", "-"],
    ["--json=1"],
    ["--nope"],
    ["-", "--", "-h"],
    ["--flag", "--flag"],
  ];
  let refused = 0;
  for (const args of cases) {
    const [node, ours] = both(args);
    assert.equal(ours, node, args.join(" "));
    if (node === "refused") refused++;
  }
  assert.ok(refused >= 4 && refused < cases.length, `${refused} refused`);
});

Deno.test("argument reader: the same as node:util parseArgs on generated lists", () => {
  let refused = 0, accepted = 0;
  fc.assert(
    fc.property(fc.array(fc.constantFrom(...TOKENS), { maxLength: 7 }), (args) => {
      const [node, ours] = both(args);
      if (node === "refused") refused++;
      else accepted++;
      return node === ours;
    }),
    { numRuns: 5000, seed: 20261203 },
  );
  assert.ok(refused > 500 && accepted > 500, `refused ${refused}, accepted ${accepted}`);
});

Deno.test("argument reader: refusals say what was found", () => {
  const msg = (args: string[]) => {
    try {
      readArgs(args, SPEC);
    } catch (e) {
      return (e as Error).message;
    }
    return "accepted";
  };
  assert.equal(msg(["--nope"]), "an unknown option --nope");
  assert.equal(msg(["--format"]), "--format without its value");
  assert.equal(msg(["--json=1"]), "a value for the flag --json");
  assert.match(msg(["--format", "-5"]), /--format=-5/);
  assert.equal(msg(["-x"]), "an unknown option -x");
});
