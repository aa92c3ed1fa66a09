/**
 * The straight-run script prints the transducer clock positions of the recommended path plane,
 * as rankPositions gives them (12 o'clock at the crown, read looking downstream): Z on opposite
 * sides, V on one side. Common practice (no source): a crew is told where round the pipe to clamp.
 */
import { assert } from "../_assert.ts";
import { runScript } from "../_run.ts";
import { rankPositions } from "../../lib/installation/mod.ts";

const clock = (h: number) => `${Math.floor(h) === 0 ? 12 : Math.floor(h)}:${h % 1 ? "30" : "00"}`;

for (const traverses of [1, 2]) {
  Deno.test(`straight-run: clock positions of the recommended plane, ${traverses} traverse(s)`, async () => {
    const r = await runScript(
      "straight_run.ts",
      [
        "--diameter",
        "200 mm",
        "--upstream",
        "elbow-90",
        "--run",
        "6 m",
        "--traverses",
        String(traverses),
      ],
      { permissions: ["--allow-read=data"] },
    );
    assert.equal(r.code, 0, r.stderr);
    const rank = rankPositions({
      runLength: 6,
      diameter: 0.2,
      upstream: { fitting: "elbow-90" },
      downstream: { fitting: "none" },
      traverses,
    });
    const [a, b] = rank.recommendedPathPlane.clockHours;
    const want = traverses === 1
      ? `${clock(a)} and ${clock(b)} o'clock`
      : `both at ${clock(a)} o'clock`;
    assert.ok(r.stdout.includes(`transducers               ${want}`), r.stdout);
    if (traverses === 1) assert.equal(Math.abs(b - a), 6, "Z: opposite sides, six hours apart");
    else assert.equal(a, b, "V: one side");
  });
}
