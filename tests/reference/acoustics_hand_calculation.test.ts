/**
 * Outside check: a hand calculation, step by step, of a V mounting on NPS 4 schedule 40 steel
 * pipe with water at 20 °C behind a 38° acrylic-class wedge (2720 m/s). Each step's figure was
 * worked by hand (calculator, 6 significant figures) from the inputs below, not taken from our
 * code.
 *
 * Inputs and their sources:
 * - OD 114.3 mm, wall 6.02 mm: ASME B36.10M-2018 (asme-b36.10m-2018), NPS 4 Sch 40.
 * - Water at 20 °C, 0.101325 MPa: w = 1482.35 m/s by IAPWS-95 (iapws-r6-95), as computed by
 *   Debian's python3-iapws 1.5.3 (`IAPWS95(T=293.15, P=0.101325).w` = 1482.346…); the second
 *   test checks that figure live when the package is present.
 * - Steel shear speed 3230 m/s: recalled handbook value (asm-handbook-17), recalled.
 */
import { assert, closeAbs, closeRel } from "../_assert.ts";
import { debianVersion, hasPython, runPython } from "../_python.ts";
import { clampOnPath } from "../../lib/acoustics/path.ts";
import { pathVelocity, transitTimes } from "../../lib/acoustics/transit.ts";

const DEG = Math.PI / 180;

Deno.test("hand calculation: NPS 4 Sch 40 steel, water 20 °C, 38° wedge at 2720 m/s, V mounting", () => {
  const p = clampOnPath({
    outsideDiameter: 0.1143,
    wallThickness: 0.00602,
    wallSoundSpeed: 5920,
    wallShearSpeed: 3230,
    fluidSoundSpeed: 1482.35,
    wedgeSoundSpeed: 2720,
    wedgeAngle: 38 * DEG,
    traverses: 2,
  });
  // Step 1: Snell invariant s = sin 38° / 2720 = 0.615661 / 2720 = 2.26346e-4 s/m.
  closeRel(p.snellInvariant, 2.26346e-4, 2e-6, "step 1: s");
  // Step 2: the steel longitudinal wave: s·5920 = 1.340 > 1 → beyond the first critical angle.
  //         shear: sin θ_s = s·3230 = 0.731098 → θ_s = 46.9785°.
  assert.equal(p.wallMode, "shear");
  closeAbs(p.wallAngle / DEG, 46.9785, 1e-4, "step 2: wall angle");
  // Step 3: water: sin θ_f = s·1482.35 = 0.335524 → θ_f = 19.6044°; tan θ_f = 0.356171.
  closeAbs(p.fluidAngle / DEG, 19.6044, 1e-4, "step 3: liquid angle");
  // Step 4: bore D = 114.3 − 2·6.02 = 102.26 mm.
  closeAbs(p.boreDiameter, 0.10226, 1e-12, "step 4: bore");
  // Step 5: liquid term 2·D·tan θ_f = 2·102.26·0.356171 = 72.8441 mm;
  //         wall term 2·t·tan θ_s = 2·6.02·1.07156 = 12.9016 mm; spacing = 85.7457 mm.
  closeAbs(p.spacing * 1000, 85.7457, 2e-4, "step 5: spacing");
  // Step 6: liquid path L = 2·D / cos θ_f = 204.52 / 0.942032 = 217.105 mm;
  //         liquid time L / c = 146.460 µs; wall time 2·t / (3230·cos θ_s) = 5.46344 µs.
  closeAbs(p.fluidPathLength * 1000, 217.105, 1e-3, "step 6: L");
  closeAbs(p.fluidTime * 1e6, 146.460, 1e-3, "step 6: liquid time");
  closeAbs(p.wallTime * 1e6, 5.46344, 1e-5, "step 6: wall time");
  // Step 7: at 1 m/s, Δt ≈ 2·L·v·sin θ_f / c² = 2·0.217105·0.335524/1482.35² = 66.3014 ns.
  const t = transitTimes(p, 1);
  closeAbs(t.deltaTLinear * 1e9, 66.3014, 1e-3, "step 7: Δt");
  // Step 8: the inverse gives 1 m/s back.
  closeAbs(pathVelocity(p, t.upstream, t.downstream).velocity, 1, 1e-9, "step 8");
});

Deno.test({
  name: `hand calculation input: water at 20 °C by python3-iapws ${debianVersion("python3-iapws")}`,
  ignore: !hasPython("iapws"),
  fn: async () => {
    const w = await runPython<number>(
      "import json,sys\nfrom iapws import IAPWS95\nprint(json.dumps(IAPWS95(T=293.15,P=0.101325).w))",
    );
    closeAbs(w, 1482.35, 0.005, "IAPWS-95 sound speed at 20 °C");
  },
});
