/**
 * Command-line habits: negative option values, unit case and gauge marks, the note for bare
 * psi, family suggestions in unknown-name errors, unknown materials refused by `pipe`, every
 * registry liquid in `reynolds`.
 */
import { assert, closeRel } from "../_assert.ts";
import { runScript } from "../_run.ts";
import { joinNegativeValues } from "../../scripts/_cli.ts";
import { parseQuantity } from "../../lib/units.ts";
import { defaultRegistry } from "../../lib/registry/mod.ts";
import { NotFoundError } from "../../lib/errors.ts";

const RO = ["--allow-read=data"];

/** Arguments written as one string, separated by "|". */
const args = (s: string) => s.split("|");

Deno.test("negative values: joined to their option, never read as flags", async () => {
  const spec = { temperature: { type: "string" as const }, quiet: { type: "boolean" as const } };
  assert.deepEqual(joinNegativeValues(["--temperature", "-5 degC", "--quiet"], spec), [
    "--temperature=-5 degC",
    "--quiet",
  ]);
  // a boolean option never swallows the next argument
  assert.deepEqual(joinNegativeValues(["--quiet", "-5"], spec), ["--quiet", "-5"]);
  const r = await runScript(
    "sound_speed.ts",
    args("--liquid|ethylene-glycol-30|--temperature|-5 degC"),
    { permissions: RO },
  );
  assert.equal(r.code, 0, r.stderr);
  assert.match(r.stdout, /-5\.00 °C/);
});

Deno.test("unit case and gauge marks: GPM, bar(g), BARG, PSIA accepted; MM stays refused", () => {
  // US gallon = 231 in³ = 3.785411784 L exactly (NIST Handbook 44, appendix C)
  closeRel(parseQuantity("300 GPM", "flowRate", "f"), 300 * 3.785411784e-3 / 60, 1e-12);
  // gauge: + one standard atmosphere, 101 325 Pa (definition)
  closeRel(parseQuantity("3 bar(g)", "pressure", "p"), 3e5 + 101325, 1e-12);
  closeRel(parseQuantity("3 BARG", "pressure", "p"), 3e5 + 101325, 1e-12);
  // psi = 6894.757293168 Pa (NIST SP 811, appendix B)
  closeRel(parseQuantity("40 PSIA", "pressure", "p"), 40 * 6894.757293168, 1e-9);
  closeRel(parseQuantity("40 psig", "pressure", "p"), 40 * 6894.757293168 + 101325, 1e-9);
  // MM could be megametre or millimetre: refused rather than guessed
  assert.throws(() => parseQuantity("5 MM", "length", "l"));
});

Deno.test("bare psi: a note on standard error that it is read as absolute", async () => {
  const r = await runScript("sound_speed.ts", args("--temperature|20 degC|--pressure|60 psi"), {
    permissions: RO,
  });
  assert.equal(r.code, 0, r.stderr);
  assert.match(r.stderr, /note: --pressure: .*absolute.*psig/);
  const g = await runScript("sound_speed.ts", args("--temperature|20 degC|--pressure|60 psig"), {
    permissions: RO,
  });
  assert.equal(g.stderr, "");
});

Deno.test("suggestions by family: glycol, steel, tee", () => {
  const reg = defaultRegistry();
  const said = (f: () => unknown) => {
    try {
      f();
    } catch (e) {
      assert.ok(e instanceof NotFoundError);
      return (e as Error).message;
    }
    throw new Error("expected a refusal");
  };
  const steel = said(() => reg.material("steel"));
  for (const id of ["carbon-steel", "stainless-steel-304", "stainless-steel-316"]) {
    assert.ok(steel.includes(id), steel);
  }
  const tee = said(() => reg.fitting("tee"));
  assert.ok(tee.includes("tee-branch") && tee.includes("tee-through"), tee);
});

Deno.test("glycol in the liquid error lists the glycol mixtures", async () => {
  const r = await runScript("sound_speed.ts", args("--liquid|glycol|--temperature|5 degC"), {
    permissions: RO,
  });
  assert.equal(r.code, 2);
  for (const id of ["ethylene-glycol-30", "propylene-glycol-50"]) assert.ok(r.stderr.includes(id));
});

Deno.test("pipe script: an unknown material is refused with suggestions, exit 2", async () => {
  const r = await runScript(
    "pipe.ts",
    args("--standard|ASME B36.10M|--nps|4|--schedule|40|--material|steel"),
    { permissions: RO },
  );
  assert.equal(r.code, 2);
  assert.equal(r.stdout, "");
  assert.match(r.stderr, /material: got "steel".*carbon-steel/);
});

Deno.test("reynolds: a registry liquid other than water by its site-file name", async () => {
  const r = await runScript(
    "reynolds.ts",
    args("--diameter|100 mm|--velocity|1 m/s|--liquid|propylene-glycol-30|--temperature|20 degC"),
    { permissions: RO },
  );
  assert.equal(r.code, 0, r.stderr);
  assert.match(r.stdout, /registry liquid propylene-glycol-30/);
});

Deno.test("spacing: a registry liquid below 0 °C, as site files take it", async () => {
  const r = await runScript(
    "spacing.ts",
    args(
      "--od|88.9 mm|--wall|3 mm|--material|stainless-steel-316|--liquid|propylene-glycol-30|" +
        "--temperature|-5 degC|--wedge-speed|2700 m/s|--wedge-angle|40 deg|--json",
    ),
    { permissions: RO },
  );
  assert.equal(r.code, 0, r.stderr);
  assert.ok(JSON.stringify(JSON.parse(r.stdout)).includes("propylene-glycol-30"));
});

Deno.test("results echo the quantities as the user wrote them, beside SI", async () => {
  const r = await runScript(
    "sound_speed.ts",
    args("--temperature|68 degF|--pressure|30 psig"),
    { permissions: RO },
  );
  assert.equal(r.code, 0, r.stderr);
  // 68 °F = 20 °C = 293.15 K; 30 psig = 30 × 6894.757293168 + 101325 Pa = 308167.7 Pa
  assert.match(
    r.stdout,
    /as given: --temperature 68 degF = 293\.15 K, --pressure 30 psig = 308168 Pa/,
  );
});

Deno.test("scripts take the site file's forms: default standard from the schedule, Z/V/W letters", async () => {
  // pipe: without --standard, schedule 40 means ASME B36.10M and 10S means B36.19M, as the site
  // reader assumes (common practice); the note says so on stderr.
  for (const [sch, std] of [["40", "ASME B36.10M"], ["10S", "ASME B36.19M"]]) {
    const bare = await runScript("pipe.ts", args(`--nps|4|--schedule|${sch}|--json`), {
      permissions: RO,
    });
    const full = await runScript(
      "pipe.ts",
      args(`--standard|${std}|--nps|4|--schedule|${sch}|--json`),
      { permissions: RO },
    );
    assert.equal(bare.code, 0, bare.stderr);
    assert.equal(bare.stdout, full.stdout, `schedule ${sch}`);
    assert.match(bare.stderr, new RegExp(`note: --standard not given; ${std} assumed`));
  }
  // spacing: Z,V reads as 1,2, and the catalogue pipe needs no --standard either.
  const common = "--nps|4|--schedule|40|--liquid|water|--temperature|20 degC|" +
    "--wedge-speed|2720 m/s|--wedge-angle|38 deg|--json|--traverses|";
  const letters = await runScript("spacing.ts", args(common + "Z,V"), { permissions: RO });
  const numbers = await runScript(
    "spacing.ts",
    args("--standard|ASME B36.10M|" + common + "1,2"),
    { permissions: RO },
  );
  assert.equal(letters.code, 0, letters.stderr);
  const a = JSON.parse(letters.stdout), b = JSON.parse(numbers.stdout);
  assert.equal(a.paths.length, 2);
  assert.deepEqual(a.paths, b.paths);
  assert.ok(a.notes.some((n: string) => n.includes("ASME B36.10M assumed from schedule 40")));
});
