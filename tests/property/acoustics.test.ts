/**
 * Property-based tests of lib/acoustics (fast-check, seeded) over random clamp-on geometry:
 * Snell's law holds layer by layer (sin θ / c is the same in wedge, wall, lining and liquid),
 * the liquid angle does not depend on the wall or lining, the spacing is finite and positive
 * and adds up from its parts; a NoPhysicalAnswerError comes exactly when a layer is beyond its
 * critical angle; transit times and the path velocity invert each other; any junk gives a
 * named error, never a TypeError.
 */
import fc from "fast-check";
import { assert } from "../_assert.ts";
import { InputError, NoPhysicalAnswerError } from "../../lib/errors.ts";
import {
  type ClampOnInputs,
  clampOnPath,
  pathVelocity,
  transitTimes,
} from "../../lib/acoustics/mod.ts";
import { outcome, RUNS, Tally } from "./_check.ts";

const DEG = Math.PI / 180;
const range = (min: number, max: number) => fc.double({ min, max, noNaN: true });

/** Random valid geometry: speeds of real materials' order, any wedge angle, 0–2 linings. */
const geometry: fc.Arbitrary<ClampOnInputs> = fc.record({
  od: range(0.01, 3),
  wallFraction: range(0.005, 0.45),
  cL: range(1500, 6500),
  shearRatio: fc.option(range(0.3, 0.7)),
  cf: range(600, 2500),
  cw: range(900, 3000),
  angle: range(0.5 * DEG, 89.5 * DEG),
  n: fc.integer({ min: 1, max: 8 }),
  lining: fc.array(fc.record({ fraction: range(0.001, 0.1), c: range(1000, 5000) }), {
    maxLength: 2,
  }),
  mode: fc.constantFrom(undefined, "auto", "longitudinal", "shear"),
}).map((g) => {
  const wall = g.od / 2 * g.wallFraction;
  const inner = g.od / 2 - wall;
  const cS = g.shearRatio === null ? undefined : g.cL * g.shearRatio;
  return {
    outsideDiameter: g.od,
    wallThickness: wall,
    wallSoundSpeed: g.cL,
    ...(cS === undefined ? {} : { wallShearSpeed: cS }),
    ...(g.mode === undefined || (g.mode === "shear" && cS === undefined) ? {} : {
      wallMode: g.mode as ClampOnInputs["wallMode"],
    }),
    fluidSoundSpeed: g.cf,
    wedgeSoundSpeed: g.cw,
    wedgeAngle: g.angle,
    traverses: g.n,
    ...(g.lining.length
      ? { lining: g.lining.map((l) => ({ thickness: inner * l.fraction, soundSpeed: l.c })) }
      : {}),
  };
});

function linings(g: ClampOnInputs) {
  return g.lining === undefined ? [] : Array.isArray(g.lining) ? g.lining : [g.lining];
}

/** Whether some wave reaches the liquid, by Snell's law (sin θ = s·c < 1 in every layer). */
function expectReaches(g: ClampOnInputs): boolean {
  const s = Math.sin(g.wedgeAngle) / g.wedgeSoundSpeed;
  if (!(s * g.fluidSoundSpeed < 1)) return false;
  if (linings(g).some((l) => !(s * l.soundSpeed < 1))) return false;
  const lOk = s * g.wallSoundSpeed < 1;
  const sOk = g.wallShearSpeed !== undefined && s * g.wallShearSpeed < 1;
  if (g.wallMode === "longitudinal") return lOk;
  if (g.wallMode === "shear") return sOk;
  return lOk || sOk;
}

Deno.test("acoustics property: Snell chain, spacing and critical angles over random geometry", () => {
  const tally = new Tally();
  let worst = 0;
  fc.assert(
    fc.property(geometry, (g) => {
      const o = tally.add(outcome(`clampOnPath(${JSON.stringify(g)})`, () => clampOnPath(g)));
      const reaches = expectReaches(g);
      if (!o.ok) {
        assert.ok(o.error instanceof NoPhysicalAnswerError, `${o.error.name}: ${o.error.message}`);
        assert.ok(!reaches, `refused a path Snell's law allows: ${o.error.message}`);
        return;
      }
      assert.ok(reaches, "a path beyond a critical angle");
      const p = o.value;
      const s = Math.sin(g.wedgeAngle) / g.wedgeSoundSpeed;
      // Snell's law, layer by layer: sin θ / c is the same everywhere.
      const rel = (a: number) => Math.abs(a / s - 1);
      const checks = [
        rel(Math.sin(p.fluidAngle) / g.fluidSoundSpeed),
        rel(Math.sin(p.wallAngle) / p.wallModeSpeed),
        ...p.liningAngles.map((a, i) => rel(Math.sin(a) / linings(g)[i].soundSpeed)),
      ];
      for (const r of checks) {
        worst = Math.max(worst, r);
        assert.ok(r < 1e-12, `Snell invariant off by ${r}`);
      }
      assert.ok(p.spacing > 0, `spacing ${p.spacing}`);
      // spacing = N·D·tan θ_f + 2·t_wall·tan θ_wall + 2·Σ t_i·tan θ_i (sum of the parts)
      const parts = g.traverses * p.boreDiameter * Math.tan(p.fluidAngle) +
        2 * g.wallThickness * Math.tan(p.wallAngle) +
        2 * linings(g).reduce((a, l, i) => a + l.thickness * Math.tan(p.liningAngles[i]), 0);
      assert.ok(Math.abs(p.spacing / parts - 1) < 1e-9, `spacing ${p.spacing} vs parts ${parts}`);
      assert.ok(p.totalTime > p.fluidTime && p.fluidTime > 0);
      assert.ok(p.fluidPathLength >= g.traverses * p.boreDiameter);
    }),
    RUNS,
  );
  console.log(tally.line("clampOnPath over random geometry"));
  console.log(`worst relative departure from the Snell invariant: ${worst.toExponential(2)}`);
  assert.ok(tally.ok > 1000 && tally.refusals > 100);
});

Deno.test("acoustics property: the liquid angle does not depend on the wall or lining", () => {
  fc.assert(
    fc.property(geometry, geometry, (a, b) => {
      // b's wall and lining under a's wedge and liquid
      const mixed: ClampOnInputs = {
        ...b,
        fluidSoundSpeed: a.fluidSoundSpeed,
        wedgeSoundSpeed: a.wedgeSoundSpeed,
        wedgeAngle: a.wedgeAngle,
      };
      const pa = outcome("a", () => clampOnPath(a));
      const pm = outcome("mixed", () => clampOnPath(mixed));
      if (!pa.ok || !pm.ok) return;
      assert.equal(pm.value.fluidAngle, pa.value.fluidAngle);
      assert.equal(pm.value.snellInvariant, pa.value.snellInvariant);
    }),
    RUNS,
  );
});

Deno.test("acoustics property: transit times and path velocity invert each other", () => {
  let worst = 0;
  fc.assert(
    fc.property(
      geometry,
      fc.oneof(range(-20, 20), range(-0.01, 0.01)),
      fc.option(range(0, 0.05)),
      (g0, v, h) => {
        const g = h === null ? g0 : { ...g0, wedge: { elementHeight: h } };
        const p = outcome("path", () => clampOnPath(g));
        if (!p.ok) return;
        const t = outcome(`transitTimes(v = ${v})`, () => transitTimes(p.value, v));
        if (!t.ok) throw new Error(`transitTimes refused ${v} m/s: ${t.error.message}`);
        const { upstream, downstream, deltaT } = t.value;
        assert.ok(Math.sign(deltaT) === Math.sign(v) || Math.abs(v) < 1e-200, "Δt has v's sign");
        const back = outcome("pathVelocity", () => pathVelocity(p.value, upstream, downstream));
        if (!back.ok) throw new Error(`pathVelocity refused: ${back.error.message}`);
        // Δt is a small difference of two long times: allow their rounding, ε·t/Δt relative.
        const tol = 1e-9 + 64 * Number.EPSILON * upstream / (2 * p.value.fluidTime) *
            (p.value.fluidSoundSpeed / Math.sin(p.value.fluidAngle));
        const err = Math.abs(back.value.velocity - v);
        worst = Math.max(worst, err);
        assert.ok(err <= tol, `v ${v} → ${back.value.velocity} (tol ${tol})`);
        assert.ok(Math.abs(back.value.snellInvariant.velocity - v) <= tol + 1e-9 * Math.abs(v));
        assert.ok(Math.abs(back.value.impliedSoundSpeed / p.value.fluidSoundSpeed - 1) < 1e-9);
      },
    ),
    RUNS,
  );
  console.log(`transit → velocity: worst absolute error ${worst.toExponential(2)} m/s`);
});

Deno.test("acoustics property: junk inputs give InputError or NoPhysicalAnswerError", () => {
  const tally = new Tally();
  const junk = fc.oneof(
    fc.double(),
    fc.constantFrom(0, -1, Number.NaN, Infinity, 1e308, 5e-324, Math.PI / 2),
    fc.anything(),
  );
  const field = (good: fc.Arbitrary<unknown>) => fc.oneof({ arbitrary: good, weight: 12 }, junk);
  const inputs = fc.record({
    outsideDiameter: field(range(0.01, 3)),
    wallThickness: field(range(0.001, 0.05)),
    wallSoundSpeed: field(range(1500, 6500)),
    wallShearSpeed: fc.option(field(range(1000, 3500)), { nil: undefined }),
    wallMode: fc.option(field(fc.constantFrom("auto", "longitudinal", "shear")), {
      nil: undefined,
    }),
    lining: fc.option(
      field(
        fc.array(
          fc.record({ thickness: field(range(0, 0.01)), soundSpeed: field(range(1e3, 5e3)) }),
        ),
      ),
      { nil: undefined },
    ),
    fluidSoundSpeed: field(range(600, 2500)),
    wedgeSoundSpeed: field(range(900, 3000)),
    wedgeAngle: field(range(0, 1.6)),
    traverses: field(fc.integer({ min: 0, max: 9 })),
    wedge: fc.option(
      field(
        fc.record({ elementHeight: field(range(0, 0.05)), indexOffset: field(range(-0.05, 0.05)) }),
      ),
      { nil: undefined },
    ),
  }, { requiredKeys: [] });
  fc.assert(
    fc.property(inputs, field(range(-50, 50)), (g, v) => {
      const o = tally.add(outcome("clampOnPath(junk)", () => clampOnPath(g as ClampOnInputs)));
      if (!o.ok) {
        assert.ok(o.error instanceof InputError || o.error instanceof NoPhysicalAnswerError);
        return;
      }
      const t = tally.add(
        outcome("transitTimes(junk v)", () => transitTimes(o.value, v as number)),
      );
      if (t.ok) {
        tally.add(
          outcome(
            "pathVelocity",
            () => pathVelocity(o.value, t.value.upstream, t.value.downstream),
          ),
        );
      }
    }),
    RUNS,
  );
  console.log(tally.line("acoustics over junk"));
  assert.ok(tally.ok > 0);
});
