/**
 * Outside checks of the signal-budget physics.
 *
 * - Fresh-water absorption α/f² = 25.3e-15 s²/m (Np) at 20 °C, Kinsler et al. 2000
 *   (kinsler-2000), recalled; our Fisher & Simmons 1977 term must agree within its stated 4 %.
 * - Classical thermoviscous absorption with bulk viscosity, α/f² = 2π²/(ρc³)·(4/3·μ + μ_B), with
 *   μ, ρ, c of water at 20 °C from Debian's python3-iapws (IAPWS-95 and IAPWS 2008 viscosity)
 *   and μ_B/μ ≈ 2.8 at 20 °C (recalled, from the acoustic literature on bulk viscosity of water):
 *   agreement within 6 %.
 * - Water/steel interface: about 12 % of the intensity is transmitted at normal incidence (88 %
 *   reflected) — recalled from NDT handbooks (krautkramer-1990), ±1 %.
 */
import { closeAbs, closeRel } from "../_assert.ts";
import { debianVersion, hasPython, runPython } from "../_python.ts";
import { intensityTransmission, waterAbsorption } from "../../lib/acoustics/budget.ts";

Deno.test("Fisher & Simmons 1977 at 20 °C vs fresh water 25.3e-15 f² (Kinsler 2000, recalled)", () => {
  const a = waterAbsorption(1e6, 293.15) / 1e12;
  closeRel(a, 25.3e-15, 0.04, "α/f²");
});

Deno.test({
  name: `Fisher & Simmons vs thermoviscous + bulk viscosity (python3-iapws ${
    debianVersion("python3-iapws")
  })`,
  ignore: !hasPython("iapws"),
  fn: async () => {
    const r = await runPython<{ rho: number; w: number; mu: number }>(
      "import json\nfrom iapws import IAPWS95\nw=IAPWS95(T=293.15,P=0.101325)\n" +
        "print(json.dumps({'rho': w.rho, 'w': w.w, 'mu': w.mu}))",
    );
    const classical = 2 * Math.PI ** 2 / (r.rho * r.w ** 3) * (4 / 3 * r.mu + 2.8 * r.mu);
    closeRel(waterAbsorption(1e6, 293.15) / 1e12, classical, 0.06, "α/f²");
  },
});

Deno.test("water/steel normal incidence: about 12 % transmitted (NDT handbooks, recalled)", () => {
  const T = intensityTransmission(998 * 1483, 7850 * 5920);
  closeAbs(T, 0.12, 0.01, "transmission");
});
