/**
 * scripts/_cli.ts argument handling: `deno task NAME -- ARGS` hands the `--` separator on to the
 * script, so a single leading `--` must be dropped while a later one keeps its usual meaning
 * (everything after it is positional: POSIX utility syntax guideline 10, recalled).
 */
import { deepEqual, equal, throws } from "../_assert.ts";
import { parseCli } from "../../scripts/_cli.ts";
import { InputError } from "../../lib/errors.ts";

const OPTIONS = { od: { type: "string" as const } };

Deno.test("a leading -- (as deno task passes it) is dropped", () => {
  const { values, positionals } = parseCli(["--", "--od", "114.3 mm"], OPTIONS, "help");
  equal(values.od, "114.3 mm");
  deepEqual(positionals, []);
});

Deno.test("a later -- still ends the options", () => {
  const { values, positionals } = parseCli(["--od", "1 m", "--", "--json"], OPTIONS, "help");
  equal(values.od, "1 m");
  equal(values.json, undefined);
  deepEqual(positionals, ["--json"]);
});

Deno.test("only one leading -- is dropped; unknown options are still refused", () => {
  const { positionals } = parseCli(["--", "--", "--od"], OPTIONS, "help");
  deepEqual(positionals, ["--od"]);
  throws(() => parseCli(["--", "--wedge", "1"], OPTIONS, "help"), InputError);
});
