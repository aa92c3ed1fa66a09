/**
 * Results echoed in the user's units beside SI: straight-run positions in feet when the run is
 * given in feet, transit flows in the user's flow unit, pipe dimensions in inches, and an
 * "as given" line for the quantity options. Conversion factors: ft = 0.3048 m and in = 0.0254 m
 * exactly (NIST SP 811, appendix B); US gallon = 3.785411784 L (NIST Handbook 44, appendix C).
 */
import { assert, closeRel } from "../_assert.ts";
import { runScript } from "../_run.ts";
import { inUnitOf } from "../../lib/units.ts";

const RO = ["--allow-read=data"];
const args = (s: string) => s.split("|");

Deno.test("inUnitOf: the user's unit as the parser reads it, offsets included", () => {
  assert.equal(inUnitOf(0.3048 * 20, "3 ft", "length"), "20 ft");
  assert.equal(inUnitOf(300 * 3.785411784e-3 / 60, "1 GPM", "flowRate"), "300 GPM");
  assert.equal(inUnitOf(101325 + 3e5, "1 bar(g)", "pressure"), "3 bar(g)");
  assert.equal(inUnitOf(268.15, "-5 degC", "temperature"), "-5 degC");
  assert.equal(inUnitOf(1, "1 m", "length"), undefined, "SI: nothing to echo");
  assert.equal(inUnitOf(1, "12", "length"), undefined, "no unit written");
});

Deno.test("straight-run: positions in m and in the feet the run was given in", async () => {
  const r = await runScript(
    "straight_run.ts",
    args("--diameter|8 in|--upstream|elbow-90|--run|20 ft|--position|4 ft"),
    { permissions: RO },
  );
  assert.equal(r.code, 0, r.stderr);
  const m = [...r.stdout.matchAll(/(\d+(?:\.\d+)?) m \((\d+(?:\.\d+)?) ft, /g)];
  assert.ok(m.length >= 3, r.stdout);
  for (const [, metres, feet] of m) closeRel(Number(feet), Number(metres) / 0.3048, 0.005);
  assert.match(r.stdout, /Straight run at 1\.22 m \(4 ft, 6 D\)/);
  assert.match(r.stdout, /as given: --diameter 8 in = 0\.2032 m/);
});

Deno.test("transit: flows echoed in GPM beside L/s", async () => {
  const r = await runScript(
    "transit.ts",
    args(
      "--standard|ASME B36.10M|--nps|4|--schedule|40|--liquid|water|--temperature|68 degF|" +
        "--wedge-material|acrylic|--wedge-angle|38 deg|--flow|50 GPM,100 GPM",
    ),
    { permissions: RO },
  );
  assert.equal(r.code, 0, r.stderr);
  assert.match(r.stdout, /^given GPM +flow L\/s/m);
  const rows = [...r.stdout.matchAll(/^(\d+) +(\d+\.\d+) /gm)];
  assert.equal(rows.length, 2);
  for (const [, gpm, ls] of rows) closeRel(Number(ls), Number(gpm) * 3.785411784 / 60, 2e-4);
  assert.match(r.stdout, /as given: --temperature 68 degF = 293\.15 K/);
  assert.doesNotMatch(r.stdout, / us\b/, "microseconds written µs");
});

Deno.test("pipe: a pipe measured in inches is shown in inches beside mm", async () => {
  const r = await runScript(
    "pipe.ts",
    args("--od|4.5 in|--wall|0.237 in|--material|carbon-steel"),
    { permissions: RO },
  );
  assert.equal(r.code, 0, r.stderr);
  const id = r.stdout.match(/inside diameter +(\d+\.\d+) mm +\((\d+\.\d+) in\)/);
  assert.ok(id, r.stdout);
  closeRel(Number(id![2]), Number(id![1]) / 25.4, 1e-4);
  closeRel(Number(id![1]), (4.5 - 2 * 0.237) * 25.4, 1e-5, "ID to the 0.001 mm shown");
  assert.match(r.stdout, /as given: --od 4\.5 in = 0\.1143 m, --wall 0\.237 in = 0\.0060198 m/);
});
