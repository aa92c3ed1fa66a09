/**
 * Outside checks of the site reader: what it turns customary units and NPS designations into.
 *
 * - Unit conversions of a whole site written in US customary units, against scipy.constants
 *   (Debian python3-scipy; its factors follow NIST SP 811 and CODATA) and against the NIST
 *   SP 811 (2008) Appendix B factors (recalled; they agree with scipy.constants above).
 * - NPS designations: every nominal size in the schedule tables of Debian's python3-fluids
 *   (fluids.piping, NPS5 … NPS160, the ASME B36.10M/B36.19M sizes as that library tabulates
 *   them), given as the library's decimal number, is read into a designation of the same value.
 */
import { readSiteText } from "../../lib/site/read.ts";
import { debianVersion, hasPython, runPython } from "../_python.ts";
import { assert, closeRel } from "../_assert.ts";

const SITE = `
name: Customary units (invented)
pipe: { outsideDiameter: 8.625 in, wallThickness: 0.322 in, roughness: 0.0018 in }
fluid: { liquid: water, temperature: 68 degF, pressure: 58 psig,
         temperatureRange: { min: 40 degF, max: 95 degF } }
flow: { minimum: 150 gpm, design: 600 gpm, maximum: 1400 gpm }
transducer: { wedgeSoundSpeed: 8924 ft/s, wedgeAngle: 38 deg, frequency: 1 MHz }
run: { length: 20 ft, upstream: { fitting: tee }, downstream: { fitting: reducer },
       plannedPosition: 12 ft }
`;

Deno.test({
  name: `site units: US customary site vs scipy.constants (python3-scipy ${
    debianVersion("python3-scipy")
  })`,
  ignore: !hasPython("scipy"),
  async fn() {
    const s = await readSiteText(SITE);
    const ref = await runPython<Record<string, number>>(
      `
import json, sys
from scipy import constants as c
print(json.dumps({
  "od": 8.625 * c.inch, "wall": 0.322 * c.inch, "rough": 0.0018 * c.inch,
  "T": float(c.convert_temperature(68, "F", "K")),
  "Tmin": float(c.convert_temperature(40, "F", "K")),
  "Tmax": float(c.convert_temperature(95, "F", "K")),
  "p": 58 * c.psi + c.atm,
  "qmin": 150 * c.gallon / c.minute, "qdes": 600 * c.gallon / c.minute,
  "qmax": 1400 * c.gallon / c.minute,
  "cw": 8924 * c.foot, "run": 20 * c.foot, "pos": 12 * c.foot,
  "angle": 38 * c.degree,
}))
`,
    );
    const pairs: [string, number][] = [
      ["od", s.pipe.outsideDiameter!],
      ["wall", s.pipe.wallThickness!],
      ["rough", s.pipe.roughness!],
      ["T", s.fluid.temperature],
      ["Tmin", s.fluid.temperatureRange!.min],
      ["Tmax", s.fluid.temperatureRange!.max],
      ["p", s.fluid.pressure],
      ["qmin", s.flow.minimum],
      ["qdes", s.flow.design!],
      ["qmax", s.flow.maximum],
      ["cw", s.transducer.wedgeSoundSpeed!],
      ["run", s.run!.length],
      ["pos", s.run!.plannedPosition!],
      ["angle", s.transducer.wedgeAngle],
    ];
    let worst = 0;
    for (const [k, v] of pairs) worst = Math.max(worst, closeRel(v, ref[k], 1e-12, k));
    assert.ok(worst <= 1e-12, `worst relative difference ${worst}`);
    console.log(
      `site units vs scipy.constants: worst relative difference ${worst.toExponential(2)}`,
    );
  },
});

Deno.test("site units: NIST SP 811 (2008) Appendix B factors (recalled)", async () => {
  // psi → Pa 6.894 757 E+03; U.S. gallon → m³ 3.785 412 E-03; foot, inch exact; °F to K
  // T = (t + 459.67)/1.8. The table gives 7 significant digits, hence the tolerance.
  const s = await readSiteText(SITE);
  closeRel(s.fluid.pressure - 101325, 58 * 6.894757e3, 1e-7, "psi");
  closeRel(s.flow.minimum, 150 * 3.785412e-3 / 60, 2e-7, "gpm");
  closeRel(s.run!.length, 20 * 0.3048, 1e-15, "ft");
  closeRel(s.pipe.outsideDiameter!, 8.625 * 0.0254, 1e-15, "in");
  closeRel(s.fluid.temperature, (68 + 459.67) / 1.8, 1e-14, "degF");
});

Deno.test({
  name: `site NPS: every size in fluids.piping schedule tables (python3-fluids ${
    debianVersion("python3-fluids")
  })`,
  ignore: !hasPython("fluids"),
  async fn() {
    const sizes = await runPython<number[]>(
      `
import json
import fluids.piping as p
names = [n for n in dir(p) if n.startswith("NPS") and n[3:].isdigit()]
sizes = sorted({float(x) for n in names for x in getattr(p, n)})
print(json.dumps(sizes))
`,
    );
    assert.ok(sizes.length >= 30, `only ${sizes.length} sizes`);
    const base = {
      name: "NPS check (invented)",
      fluid: { liquid: "water", temperature: "12 degC" },
      flow: { minimum: "1 L/s", maximum: "2 L/s" },
      transducer: { wedgeSoundSpeed: "2720 m/s", wedgeAngle: "38 deg", frequency: "1 MHz" },
    };
    const value = (d: string) => {
      const m = /^(?:(\d+)-)?(\d+)\/(\d+)$/.exec(d);
      return m ? Number(m[1] ?? 0) + Number(m[2]) / Number(m[3]) : Number(d);
    };
    for (const size of sizes) {
      const s = await readSiteText(JSON.stringify({ ...base, pipe: { nps: size, schedule: 40 } }));
      assert.equal(value(s.pipe.nps!), size, `NPS ${size} read as ${s.pipe.nps}`);
      // The designation read back as text gives itself again.
      const t = await readSiteText(
        JSON.stringify({ ...base, pipe: { nps: s.pipe.nps, schedule: 40 } }),
      );
      assert.equal(t.pipe.nps, s.pipe.nps);
    }
  },
});
