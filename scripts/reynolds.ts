/**
 * Reynolds number, regime, Darcy friction factor and profile factor (with its spread between
 * models) for pipe flow. See docs/flow.md.
 *
 * @module
 */
import {
  givenLine,
  optionalQuantity,
  parseCli,
  requirePositiveQuantity,
  runMain,
  stringOptions,
} from "./_cli.ts";
import { parseQuantity } from "../lib/units.ts";
import { InputError } from "../lib/errors.ts";
import { frictionFactor, type ProfileModel, reynoldsNumber } from "../lib/flow/mod.ts";
import { profileFactorEstimate } from "../lib/flow/profile.ts";
import { defaultRegistry } from "../lib/registry/mod.ts";

const HELP = `
reynolds — Reynolds number, regime, friction factor and profile factor of pipe flow

Usage:
  deno task reynolds --diameter "200 mm" --velocity "1.5 m/s" --viscosity "1.0 mm^2/s"
  deno task reynolds --diameter "8 in" --flow "30 L/s" --liquid water --temperature "15 degC"

Options:
  --diameter <length>       inside diameter (required)
  --velocity <speed>        bulk velocity, or
  --flow <flow rate>        volume flow rate
  --viscosity <kin. visc.>  kinematic viscosity (e.g. "1.0 mm^2/s", "1 cSt"), or
  --liquid water            with --temperature (and --pressure, default 1 atm): IAPWS viscosity
  --temperature <temp>      liquid temperature
  --pressure <pressure>     absolute pressure (default 101325 Pa)
  --roughness <length>      equivalent sand-grain roughness of the bore (default 0, smooth), or
  --material <id>           take the roughness of a registry material (carbon-steel, pvc, …)
  --chord <ratio>           chord offset h/R of the path (default 0, diametral)
  --model <name>            power-law-nikuradse (default) | power-law-friction | log-law
  --json                    machine-readable output
  --debug                   stack traces on errors
`;

runMain(async () => {
  const { values: v } = parseCli(
    Deno.args,
    stringOptions(
      "diameter",
      "velocity",
      "flow",
      "viscosity",
      "liquid",
      "temperature",
      "pressure",
      "roughness",
      "material",
      "chord",
      "model",
    ),
    HELP,
  );
  const D = requirePositiveQuantity(v, "diameter", "length", "200 mm");
  let V: number;
  if (typeof v.velocity === "string" && typeof v.flow === "string") {
    throw new InputError("--velocity/--flow", "both", "one of --velocity or --flow");
  } else if (typeof v.velocity === "string") {
    V = parseQuantity(v.velocity, "speed", "--velocity");
  } else if (typeof v.flow === "string") {
    V = parseQuantity(v.flow, "flowRate", "--flow") / (Math.PI * D * D / 4);
  } else {
    throw new InputError("--velocity", "nothing", 'a velocity ("1.5 m/s") or --flow ("30 L/s")');
  }
  let nu: number;
  let nuSource = "input";
  if (typeof v.viscosity === "string") {
    nu = parseQuantity(v.viscosity, "kinematicViscosity", "--viscosity");
  } else if (typeof v.temperature === "string") {
    const liquid = typeof v.liquid === "string" ? v.liquid : "water";
    const T = parseQuantity(v.temperature, "temperature", "--temperature");
    const p = optionalQuantity(v, "pressure", "pressure", 101325);
    if (liquid === "water") {
      const { water } = await import("../lib/water/mod.ts");
      nu = water.kinematicViscosity(T, p);
      nuSource = "iapws-r12-08";
    } else {
      // every registry liquid, by the same names the site files take
      const { liquidProperties } = await import("../lib/liquids/mod.ts");
      const st = liquidProperties(liquid, T, p);
      nu = st.kinematicViscosity;
      nuSource = `registry liquid ${liquid}`;
    }
  } else {
    throw new InputError(
      "--viscosity",
      "nothing",
      'a kinematic viscosity ("1.0 mm^2/s") or --liquid water --temperature "15 degC"',
    );
  }
  let eps = 0;
  let epsSource = "smooth (default)";
  if (typeof v.roughness === "string") {
    eps = parseQuantity(v.roughness, "length", "--roughness");
    if (eps < 0) throw new InputError("--roughness", v.roughness, "a roughness ≥ 0");
    epsSource = "input";
  } else if (typeof v.material === "string") {
    // deno-lint-ignore no-explicit-any
    const reg = defaultRegistry() as any;
    if (typeof reg.material !== "function") {
      throw new InputError("--material", v.material, "--roughness (materials not available)");
    }
    const m = reg.material(v.material);
    if (typeof m.roughness !== "number") {
      throw new InputError("--material", v.material, "a material with a roughness, or --roughness");
    }
    eps = m.roughness;
    epsSource = `material ${v.material}`;
  }
  const chord = optionalQuantity(v, "chord", "ratio", 0);
  const model = (typeof v.model === "string" ? v.model : "power-law-nikuradse") as ProfileModel;
  const re = reynoldsNumber(V, D, nu);
  const rr = eps / D;
  const f = frictionFactor(re, rr, "colebrook", { warnings: [] });
  const est = profileFactorEstimate(re, { chord, relativeRoughness: rr, model });
  const out = {
    diameter: D,
    velocity: V,
    kinematicViscosity: nu,
    kinematicViscositySource: nuSource,
    roughness: eps,
    roughnessSource: epsSource,
    relativeRoughness: rr,
    reynolds: re,
    regime: est.regime,
    frictionFactor: f,
    frictionMethod: re < 2000
      ? "laminar 64/Re"
      : re < 4000
      ? "transition (interpolated)"
      : "Colebrook–White",
    profileFactor: est.factor,
    profileFactorSpread: est.spread,
    profileModel: est.model,
    chord,
    byModel: est.byModel,
    warnings: est.warnings,
  };
  if (v.json) {
    console.log(JSON.stringify(out, null, 2));
    return 0;
  }
  const g = (x: number, d = 4) => Number(x.toPrecision(d)).toString();
  console.log(`Reynolds number   ${g(re, 5)}  (${est.regime})`);
  console.log(`  velocity ${g(V)} m/s, diameter ${g(D)} m, ν ${g(nu)} m²/s (${nuSource})`);
  const given = givenLine(v, [
    ["diameter", "length"],
    ["velocity", "speed"],
    ["flow", "flowRate"],
    ["temperature", "temperature"],
    ["pressure", "pressure"],
    ["viscosity", "kinematicViscosity"],
  ]);
  if (given) console.log(`  ${given}`);
  console.log(
    `friction factor   ${g(f, 5)}  Darcy, ${out.frictionMethod}, ε/D ${g(rr, 3)} (${epsSource})`,
  );
  console.log(
    `profile factor    ${est.factor.toFixed(4)} ± ${est.spread.toFixed(4)}  ` +
      `(${est.model}, ${chord === 0 ? "diametral path" : `chord h/R ${chord}`})`,
  );
  for (const [m, k] of Object.entries(est.byModel)) {
    console.log(`  ${m.padEnd(20)} ${(k as number).toFixed(4)}`);
  }
  for (const w of est.warnings) console.log(`note: ${w.message}`);
  return 0;
});
