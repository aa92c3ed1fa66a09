import { assert } from "../_assert.ts";
import {
  checkStraightRun,
  profileErrorEstimate,
  profileErrorSweep,
  rankPositions,
} from "../../lib/installation/mod.ts";
import { InputError, NotFoundError } from "../../lib/errors.ts";

Deno.test("model: error shrinks with distance for every fitting", () => {
  for (
    const f of ["elbow-90", "double-elbow-out-of-plane", "butterfly-valve", "pump", "expander"]
  ) {
    let prev = Infinity;
    for (const d of [1, 3, 6, 10, 20, 40]) {
      const e = Math.abs(
        profileErrorEstimate({ distanceDiameters: d, fitting: f, orientation: 0.3 }).error,
      );
      assert.ok(e < prev, `${f} at ${d} D: ${e} !< ${prev}`);
      prev = e;
    }
  }
});

Deno.test("model: a diametral path is blind to swirl, an off-centre chord is not", () => {
  const base = { distanceDiameters: 5, fitting: "double-elbow-out-of-plane", traverses: 1 };
  const diam = profileErrorEstimate({ ...base, chordOffset: 0 });
  assert.equal(diam.components.swirl, 0);
  const chord = profileErrorEstimate({ ...base, chordOffset: 0.5 });
  assert.ok(Math.abs(chord.components.swirl) > 0.01, `chord swirl ${chord.components.swirl}`);
});

Deno.test("model: V and W paths cancel the cross-flow a Z path sees", () => {
  const base = { distanceDiameters: 3, fitting: "elbow-90", orientation: 0 };
  const z = profileErrorEstimate({ ...base, traverses: 1 }).components.crossFlow;
  const v = profileErrorEstimate({ ...base, traverses: 2 }).components.crossFlow;
  const w = profileErrorEstimate({ ...base, traverses: 4 }).components.crossFlow;
  assert.ok(Math.abs(z) > 0.005, `Z cross-flow ${z}`);
  assert.ok(Math.abs(v) < Math.abs(z) / 5 && Math.abs(w) < Math.abs(z) / 5);
  // a path perpendicular to the bend plane sees no cross-flow at all
  const perp = profileErrorEstimate({ ...base, traverses: 1, orientation: Math.PI / 2 });
  assert.ok(Math.abs(perp.components.crossFlow) < 1e-15);
});

Deno.test("model: straight pipe gives no error; results say they are estimates", () => {
  const r = profileErrorEstimate({ distanceDiameters: 2, fitting: "straight" });
  assert.equal(r.error, 0);
  assert.match(r.note, /estimate/);
  assert.throws(
    () => profileErrorEstimate({ distanceDiameters: -1, fitting: "elbow-90" }),
    InputError,
  );
  assert.throws(
    () => profileErrorEstimate({ distanceDiameters: 1, fitting: "elbow-9" }),
    NotFoundError,
  );
  assert.throws(
    () => profileErrorEstimate({ distanceDiameters: 1, fitting: "elbow-90", traverses: 3.5 }),
    InputError,
  );
});

Deno.test("sweep over min/design/max flow gives one row per case and varies with Re", () => {
  const rows = profileErrorSweep({ fitting: "elbow-90" }, {
    distances: [4],
    reynolds: [5e3, 1e5, 2e6],
  });
  assert.equal(rows.length, 3);
  assert.notEqual(rows[0].error, rows[2].error);
});

Deno.test("checkStraightRun: marginal band, downstream, unknown fitting names nearest ids", () => {
  const m = checkStraightRun({ diameter: 0.1, upstream: { fitting: "elbow-90", distance: 0.85 } });
  assert.equal(m.verdict, "marginal");
  const d = checkStraightRun({
    diameter: 0.1,
    upstream: { fitting: "elbow-90", distance: 1.5 },
    downstream: { fitting: "pump", distance: 0.5 },
  });
  assert.equal(d.verdict, "short");
  assert.ok(d.reasons.some((r) => r.startsWith("downstream")));
  try {
    checkStraightRun({ diameter: 0.1, upstream: { fitting: "elbw-90", distance: 1 } });
    assert.fail("expected NotFoundError");
  } catch (e) {
    assert.ok(e instanceof NotFoundError && e.nearby.includes("elbow-90"));
  }
  assert.throws(
    () => checkStraightRun({ diameter: 0.1, upstream: { fitting: "elbow-90", distance: -1 } }),
    InputError,
  );
});

Deno.test("rankPositions: recommends far from the upstream fitting, meeting the rule", () => {
  const D = 0.2;
  const r = rankPositions({
    runLength: 25 * D,
    diameter: D,
    upstream: { fitting: "elbow-90", orientation: 0 },
    downstream: { fitting: "control-valve" },
    reynolds: [2e4, 1e5, 4e5],
  });
  assert.ok(r.recommendedPosition / D >= r.requiredUpstream);
  assert.ok((25 * D - r.recommendedPosition) / D >= r.requiredDownstream);
  assert.equal(r.ranking[0].verdict, "meets");
  const meets = r.ranking.filter((x) => x.verdict === "meets");
  assert.ok(meets[0].score <= meets[meets.length - 1].score);
  assert.equal(r.ranking[0].errors.length, 3);
  // the least favourable orientation in the model is perpendicular to the bend plane
  assert.notEqual(r.recommendedOrientation, Math.PI / 2);
  assert.throws(
    () =>
      rankPositions({
        runLength: 1,
        diameter: 0.1,
        upstream: { fitting: "elbow-90" },
        positions: [2],
      }),
    InputError,
  );
});
