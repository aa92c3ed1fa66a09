/**
 * Property-based tests of lib/installation (fast-check, seeded): the distorted-profile estimate
 * is finite with a non-negative spread and components that add up; the straight-run verdict
 * never gets worse as the meter moves further from either fitting, and a run at or beyond the
 * requirement meets; junk gives named errors.
 */
import fc from "fast-check";
import { assert } from "../_assert.ts";
import {
  checkStraightRun,
  profileErrorEstimate,
  type StraightRunVerdict,
} from "../../lib/installation/mod.ts";
import { defaultRegistry } from "../../lib/registry/mod.ts";
import { outcome, RUNS, Tally } from "./_check.ts";

const FITTINGS = defaultRegistry().fittings().map((f) => f.id);
const RANK: Record<StraightRunVerdict, number> = { meets: 0, marginal: 1, short: 2 };
const range = (min: number, max: number) => fc.double({ min, max, noNaN: true });

Deno.test("installation property: the profile error estimate is finite and adds up", () => {
  const tally = new Tally();
  fc.assert(
    fc.property(
      fc.record({
        fitting: fc.constantFrom(...FITTINGS),
        distanceDiameters: fc.oneof(range(0, 200), range(0, 5)),
        orientation: range(-2 * Math.PI, 2 * Math.PI),
        traverses: fc.integer({ min: 1, max: 8 }),
        reynolds: range(100, 1e8),
        chordOffset: fc.oneof(fc.constant(0), range(0, 0.95)),
        fluidAngle: range(0.01, 1.39),
        model: fc.constantFrom(undefined, "power-law-nikuradse", "power-law-friction", "log-law"),
      }),
      (input) => {
        const o = tally.add(
          outcome(
            `profileErrorEstimate(${JSON.stringify(input)})`,
            () => profileErrorEstimate(input),
          ),
        );
        if (!o.ok) throw new Error(`valid input refused: ${o.error.message}`);
        const r = o.value;
        const c = r.components;
        const sum = c.axisymmetric + c.secondHarmonic + c.skew + c.swirl + c.crossFlow;
        assert.ok(Math.abs(r.error - sum) <= 1e-12 * Math.max(1, Math.abs(sum)));
        assert.ok(r.spread >= 0 && r.profileFactor > 0.5);
        // Beam angles of clamp-on practice (about 9°–40° in the liquid), from 1 D on: the
        // estimate stays a modest fraction (the cot φ terms grow without bound as φ → 0).
        if (input.fluidAngle > 0.15 && input.fluidAngle < 0.7 && input.distanceDiameters >= 1) {
          assert.ok(Math.abs(r.error) < 0.5, `error ${r.error} at ${input.distanceDiameters} D`);
        }
      },
    ),
    RUNS,
  );
  console.log(tally.line("profileErrorEstimate"));
});

Deno.test("installation property: straight-run verdict never worsens with more distance", () => {
  const side = fc.record({ fitting: fc.constantFrom(...FITTINGS), distance: range(0, 100) });
  fc.assert(
    fc.property(
      range(0.005, 3),
      side,
      fc.option(side, { nil: undefined }),
      range(0, 50),
      fc.boolean(),
      (d, up, down, extra, moveUp) => {
        const a = checkStraightRun({ diameter: d, upstream: up, downstream: down });
        const further = moveUp
          ? { upstream: { ...up, distance: up.distance + extra }, downstream: down }
          : { upstream: up, downstream: down && { ...down, distance: down.distance + extra } };
        const b = checkStraightRun({ diameter: d, ...further });
        assert.ok(RANK[b.verdict] <= RANK[a.verdict], `${a.verdict} → ${b.verdict}`);
        // At or beyond both requirements the run meets.
        const meetsUp = up.distance / d >= a.requiredUpstream;
        const meetsDown = !down || down.distance / d >= a.requiredDownstream;
        if (meetsUp && meetsDown) assert.equal(a.verdict, "meets");
        if (!meetsUp || !meetsDown) assert.notEqual(a.verdict, "meets");
      },
    ),
    RUNS,
  );
});

Deno.test("installation property: junk inputs give named errors", () => {
  const tally = new Tally();
  const junk = fc.oneof(
    fc.double(),
    fc.anything(),
    fc.constantFrom("elbow-90", "Elbow 90", "", "__proto__", "constructor", "pump"),
  );
  const f = <T>(good: fc.Arbitrary<T>) => fc.oneof({ arbitrary: good, weight: 6 }, junk);
  fc.assert(
    fc.property(
      fc.record({
        fitting: f(fc.constantFrom(...FITTINGS)),
        distanceDiameters: f(range(0, 50)),
        orientation: f(range(-7, 7)),
        traverses: f(fc.integer({ min: 0, max: 9 })),
        reynolds: f(range(0, 1e9)),
        chordOffset: f(range(-0.1, 1.1)),
        fluidAngle: f(range(-0.1, 1.6)),
        model: f(fc.constantFrom("log-law", "laminar")),
        relativeRoughness: f(range(0, 0.1)),
      }, { requiredKeys: [] }),
      f(range(-1, 3)),
      f(fc.record({ fitting: f(fc.constantFrom(...FITTINGS)), distance: f(range(-1, 100)) })),
      (input, d, up) => {
        tally.add(outcome("profileErrorEstimate(junk)", () =>
          // deno-lint-ignore no-explicit-any
          profileErrorEstimate(input as any)));
        tally.add(outcome("checkStraightRun(junk)", () =>
          // deno-lint-ignore no-explicit-any
          checkStraightRun({ diameter: d, upstream: up } as any)));
      },
    ),
    RUNS,
  );
  console.log(tally.line("installation over junk"));
  assert.ok(tally.ok > 1000 && tally.refusals > 1000);
});
