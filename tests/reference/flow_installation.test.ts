/**
 * Outside checks of the installation room: published trends behind a single bend
 * (Synowiec et al., Sensors 21 (2021) 868 — source synowiec-2021-abstract: the bounds printed in
 * its abstract, copy recorded in data/sources.yaml; its figures not at hand) and rules of the
 * trade (common practice, no source). The point-by-point checks against the transcribed bounds
 * are in installation_published.test.ts.
 */
import { assert } from "../_assert.ts";
import {
  checkStraightRun,
  profileErrorEstimate,
  rankPositions,
} from "../../lib/installation/mod.ts";

const ORIENTS = [0, Math.PI / 8, Math.PI / 4, 3 * Math.PI / 8, Math.PI / 2];

Deno.test("synowiec-2021-abstract: behind a single bend clamp-on reads low, ≤ about 2 % from 8 D on", () => {
  for (const traverses of [1, 2]) {
    for (const o of ORIENTS) {
      for (const d of [8, 10, 15, 20, 30]) {
        for (const re of [7e4, 1e5]) {
          const e = profileErrorEstimate({
            distanceDiameters: d,
            fitting: "elbow-90",
            orientation: o,
            traverses,
            reynolds: re,
          }).error;
          assert.ok(e < 0, `reads low: ${e} at ${d} D`);
          assert.ok(e > -0.022, `≤ about 2 % at ${d} D, orientation ${o}: ${e}`);
        }
      }
    }
  }
});

Deno.test("synowiec-2021-abstract: closer in, up to about 10 % low", () => {
  let worst = 0;
  for (const o of ORIENTS) {
    for (const d of [1, 2, 3, 5]) {
      const e = profileErrorEstimate({ distanceDiameters: d, fitting: "elbow-90", orientation: o })
        .error;
      assert.ok(e < 0);
      worst = Math.min(worst, e);
    }
  }
  assert.ok(worst < -0.08 && worst > -0.12, `worst near the bend ${worst}`);
});

Deno.test("common practice: single elbow, 10 D upstream and 5 D downstream meets; 6 D does not", () => {
  const D = 0.3;
  const ok = checkStraightRun({
    diameter: D,
    upstream: { fitting: "elbow-90", distance: 10 * D },
    downstream: { fitting: "gate-valve", distance: 5 * D },
  });
  assert.equal(ok.verdict, "meets");
  const short = checkStraightRun({
    diameter: D,
    upstream: { fitting: "elbow-90", distance: 6 * D },
    downstream: { fitting: "gate-valve", distance: 5 * D },
  });
  assert.notEqual(short.verdict, "meets");
  assert.equal(short.verdict, "short");
});

Deno.test("common practice: on a short run the position is three quarters of the way along", () => {
  const D = 0.15;
  const r = rankPositions({
    runLength: 8 * D,
    diameter: D,
    upstream: { fitting: "elbow-90" },
    downstream: { fitting: "gate-valve" },
  });
  assert.equal(r.meetsCommonPractice, false);
  assert.ok(Math.abs(r.commonPracticePosition - 6 * D) < 1e-12);
  const long = rankPositions({
    runLength: 30 * D,
    diameter: D,
    upstream: { fitting: "elbow-90" },
    downstream: { fitting: "gate-valve" },
  });
  assert.equal(long.meetsCommonPractice, true);
  assert.ok(Math.abs(long.commonPracticePosition - 10 * D) < 1e-12);
});

Deno.test("common practice: longer runs after pumps, control valves and out-of-plane elbows", () => {
  const need = (f: string) =>
    checkStraightRun({ diameter: 0.1, upstream: { fitting: f, distance: 0 } }).requiredUpstream;
  for (const f of ["pump", "control-valve", "double-elbow-out-of-plane"]) {
    assert.ok(need(f) > need("elbow-90"), f);
  }
});
