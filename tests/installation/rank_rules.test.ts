/**
 * Position-ranking rules of rankPositions: the downstream requirement filters first, ties in
 * score prefer a horizontal path plane and then the earlier position, and the recommended path
 * plane carries the transducer clock positions. The straight-run rules and the preference for a
 * horizontal path plane (the beam clear of gas at the crown and sediment at the invert) are
 * common practice (no source). Every case below but the one marked "guard" ranked differently
 * (or had no path plane) before these rules; the guard keeps the tie rule within its tolerance.
 */
import { assert } from "../_assert.ts";
import {
  profileErrorEstimate,
  rankPositions,
  SCORE_TIE_TOLERANCE,
} from "../../lib/installation/mod.ts";

const D = 0.2;

Deno.test("downstream filter: a position leaving the downstream run wins over a marginal one", () => {
  // elbow (10 D up) to control valve (10 D down), 17 D between them. At 8.5 D both sides are
  // marginal (0.85); at 7 D the upstream side is short but the downstream 10 D is kept.
  const r = rankPositions({
    runLength: 17 * D,
    diameter: D,
    upstream: { fitting: "elbow-90" },
    downstream: { fitting: "control-valve" },
    positions: [8.5 * D, 7 * D],
  });
  assert.ok(Math.abs(r.recommendedPosition - 7 * D) < 1e-12, `${r.recommendedPosition / D} D`);
  assert.equal(r.ranking[0].verdict, "short");
  assert.equal(r.ranking[0].meetsDownstream, true);
  // every candidate keeping the downstream run comes before every one breaking it
  const firstBreak = r.ranking.findIndex((c) => !c.meetsDownstream);
  assert.ok(firstBreak > 0);
  assert.ok(r.ranking.slice(firstBreak).every((c) => !c.meetsDownstream));
  assert.ok((17 * D - r.recommendedPosition) / D >= r.requiredDownstream);
});

Deno.test("downstream filter: the lower-scoring spot closer to the valve is not recommended", () => {
  // 18 D: at 8.5 D the elbow's estimate is smaller than at 8 D, but 9.5 D before the control
  // valve breaks its 10 D downstream requirement.
  const positions = [4, 6, 8, 8.5, 9, 10].map((x) => x * D);
  const r = rankPositions({
    runLength: 18 * D,
    diameter: D,
    upstream: { fitting: "elbow-90" },
    downstream: { fitting: "control-valve" },
    positions,
  });
  const best85 = Math.min(
    ...r.ranking.filter((c) => Math.abs(c.position - 8.5 * D) < 1e-12).map((c) => c.score),
  );
  assert.ok(best85 < r.ranking[0].score, "the broken spot scores better, yet is not chosen");
  assert.ok(r.recommendedPosition <= 8 * D + 1e-12, `${r.recommendedPosition / D} D`);
  assert.ok((18 * D - r.recommendedPosition) / D >= 10);
});

Deno.test("downstream filter: with no candidate keeping it, the best breaking one and a note", () => {
  const r = rankPositions({
    runLength: 6 * D,
    diameter: D,
    upstream: { fitting: "elbow-90" },
    downstream: { fitting: "pump" },
  });
  assert.ok(r.ranking.every((c) => !c.meetsDownstream));
  assert.ok(r.notes.some((n) => n.includes("downstream requirement is broken")));
});

Deno.test("ties: equal scores prefer the horizontal path plane", () => {
  // A long straight pipe: every candidate scores 0; vertical listed first.
  const r = rankPositions({
    runLength: 20 * D,
    diameter: D,
    upstream: { fitting: "none" },
    pathOrientations: [0, Math.PI / 4, Math.PI / 2],
  });
  assert.equal(r.recommendedOrientation, Math.PI / 2);
  // axisymmetric fitting: the orientations differ only by rounding
  const red = rankPositions({
    runLength: 20 * D,
    diameter: D,
    upstream: { fitting: "reducer" },
    positions: [12 * D],
    pathOrientations: [Math.PI / 4, 3 * Math.PI / 4, 3 * Math.PI / 2],
  });
  const s = red.ranking.map((c) => c.score);
  assert.ok(Math.max(...s) - Math.min(...s) <= SCORE_TIE_TOLERANCE * Math.max(...s));
  assert.equal(red.recommendedOrientation, 3 * Math.PI / 2); // horizontal, as given
  assert.equal(red.recommendedPathPlane.angleFromVertical, Math.PI / 2);
});

Deno.test("ties: equal scores and planes prefer the earlier position", () => {
  const r = rankPositions({
    runLength: 20 * D,
    diameter: D,
    upstream: { fitting: "none" },
    positions: [15 * D, 5 * D, 10 * D],
    pathOrientations: [Math.PI / 2],
  });
  assert.ok(Math.abs(r.recommendedPosition - 5 * D) < 1e-12);
  assert.deepEqual(r.ranking.map((c) => Math.round(c.position / D)), [5, 10, 15]);
});

Deno.test("ties (guard): beyond the tolerance the lower score wins over a horizontal plane", () => {
  // Behind an elbow the perpendicular (horizontal here) plane reads worst in the model.
  const r = rankPositions({
    runLength: 30 * D,
    diameter: D,
    upstream: { fitting: "elbow-90", orientation: 0 },
    positions: [4 * D],
    pathOrientations: [Math.PI / 2, 0],
  });
  const at = (o: number) =>
    Math.abs(
      profileErrorEstimate({ distanceDiameters: 4, fitting: "elbow-90", orientation: o })
        .error,
    );
  assert.ok(at(0) < at(Math.PI / 2) * (1 - SCORE_TIE_TOLERANCE), `${at(0)} vs ${at(Math.PI / 2)}`);
  assert.equal(r.recommendedOrientation, 0);
});

Deno.test("recommended path plane: clock positions, 12 at the crown, looking downstream", () => {
  const plane = (traverses: number, o: number) =>
    rankPositions({
      runLength: 20 * D,
      diameter: D,
      upstream: { fitting: "none" },
      traverses,
      pathOrientations: [o],
    }).recommendedPathPlane;
  // Z (one crossing): opposite sides; a horizontal plane at 3 and 9 o'clock
  const z = plane(1, Math.PI / 2);
  assert.deepEqual(z.clockHours, [3, 9]);
  assert.equal(z.sameSide, false);
  // V and W: both transducers on one side
  assert.deepEqual(plane(2, Math.PI / 2).clockHours, [3, 3]);
  assert.deepEqual(plane(4, Math.PI / 2).clockHours, [3, 3]);
  assert.equal(plane(2, Math.PI / 2).sameSide, true);
  // 45° planes: half past one and half past seven; 135°: half past four and half past ten
  const z45 = plane(1, Math.PI / 4).clockHours;
  assert.ok(Math.abs(z45[0] - 1.5) < 1e-12 && Math.abs(z45[1] - 7.5) < 1e-12);
  const z135 = plane(1, 3 * Math.PI / 4).clockHours;
  assert.ok(Math.abs(z135[0] - 4.5) < 1e-12 && Math.abs(z135[1] - 10.5) < 1e-12);
  // vertical plane: crown and invert
  assert.deepEqual(plane(1, 0).clockHours, [12, 6]);
  // opposite sides are always six hours apart
  for (const o of [0.1, 1, 2, 3]) {
    const [a, b] = plane(1, o).clockHours;
    assert.ok(Math.abs(Math.abs(a - b) - 6) < 1e-9, `${a} ${b}`);
  }
});
