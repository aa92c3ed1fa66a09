/**
 * Sound speed, density and viscosity of a liquid at operating conditions; `--compare` shows every
 * applicable formulation side by side with their spread.
 *
 * @module
 */
import { InputError } from "../lib/errors.ts";
import { parseQuantity } from "../lib/units.ts";
import { liquidProperties, liquids, type LiquidState } from "../lib/liquids/mod.ts";
import { givenLine, optionalQuantity, parseCli, requireOption, runMain } from "./_cli.ts";

const HELP = `
sound_speed — sound speed, density and viscosity of a liquid at operating conditions

Usage:
  deno task sound-speed --liquid water --temperature "20 degC" [--pressure "3 bar"]
  deno task sound-speed --liquid seawater --salinity 35 --temperature "10 degC" --compare
  deno task sound-speed --list

Options:
  --liquid ID          water (default), seawater, or a registry liquid (see --list)
  --temperature T      temperature with unit: "20 degC", "68 degF", "293.15 K"
  --pressure P         absolute pressure (default 1 atm): "3 bar", "4 barg", "500 kPa", "72 psi"
  --salinity S         practical salinity for seawater (for example 35)
  --formulation F      water: iapws95 (default) | if97 | del-grosso-mader | marczak
                       seawater: teos10 (default) | teos10-gibbs | unesco1983
  --compare            every applicable formulation side by side, with the spread
  --extrapolate        evaluate outside a validity range (a warning is printed)
  --list               list the liquids
  --json               machine-readable output
  --debug              stack trace on errors
  -h, --help           this help

Exit codes: 0 ok, 1 no physical answer (for example the liquid boils at that pressure),
2 bad input (unknown liquid, bad unit, outside the validity range).
`;

const FORMS: Record<string, string[]> = {
  water: ["iapws95", "if97", "del-grosso-mader", "marczak"],
  seawater: ["teos10", "teos10-gibbs", "unesco1983"],
};

function fmtState(s: LiquidState, T: number, p: number): string {
  const lines = [
    `${s.name} at ${(T - 273.15).toFixed(2)} °C, ${(p / 1e3).toFixed(3)} kPa absolute`,
    `  sound speed        ${s.soundSpeed.toFixed(2)} m/s  (spread ±${
      s.soundSpeedSpread.toFixed(2)
    } m/s)`,
    `  density            ${s.density.toFixed(2)} kg/m³`,
    `  dynamic viscosity  ${(s.dynamicViscosity * 1e3).toPrecision(5)} mPa·s`,
    `  kinematic visc.    ${(s.kinematicViscosity * 1e6).toPrecision(5)} mm²/s`,
    `  sources:           ${
      [...new Set(s.trace.map((t) => `${t.source} (${t.basis})`))].join(", ")
    }`,
  ];
  for (const w of s.warnings) lines.push(`  warning: ${w.message}`);
  return lines.join("\n");
}

runMain(() => {
  const { values } = parseCli(Deno.args, {
    liquid: { type: "string" },
    temperature: { type: "string" },
    pressure: { type: "string" },
    salinity: { type: "string" },
    formulation: { type: "string" },
    compare: { type: "boolean" },
    extrapolate: { type: "boolean" },
    list: { type: "boolean" },
  }, HELP);
  if (values.list) {
    const list = liquids();
    if (values.json) console.log(JSON.stringify(list, null, 2));
    else {
      for (const l of list) {
        console.log(
          `${l.id.padEnd(22)} ${(l.temperatureRange[0] - 273.15).toFixed(0).padStart(4)} to ${
            (l.temperatureRange[1] - 273.15).toFixed(0).padStart(4)
          } °C  ${l.basis.padEnd(11)} ${l.name}`,
        );
      }
    }
    return 0;
  }
  const id = typeof values.liquid === "string" ? values.liquid : "water";
  const T = parseQuantity(
    requireOption(values, "temperature", "a temperature such as 20 degC"),
    "temperature",
    "--temperature",
  );
  const p = optionalQuantity(values, "pressure", "pressure", 101325);
  let salinity: number | undefined;
  if (typeof values.salinity === "string") {
    salinity = Number(values.salinity);
    if (values.salinity.trim() === "" || !Number.isFinite(salinity)) {
      throw new InputError(
        "--salinity",
        JSON.stringify(values.salinity),
        "a practical salinity such as 35",
      );
    }
  }
  if (id === "seawater" && salinity === undefined) {
    throw new InputError("--salinity", "nothing", "a practical salinity for seawater, such as 35");
  }
  const formulation = typeof values.formulation === "string" ? values.formulation : undefined;
  const base = { salinity, extrapolate: values.extrapolate === true };

  if (values.compare) {
    const forms = FORMS[id] ?? [undefined];
    const rows: { formulation: string; soundSpeed?: number; error?: string }[] = [];
    let firstError: unknown;
    for (const f of forms) {
      try {
        const s = liquidProperties(id, T, p, { ...base, formulation: f });
        rows.push({ formulation: f ?? "registry data", soundSpeed: s.soundSpeed });
      } catch (e) {
        firstError ??= e;
        rows.push({ formulation: f ?? "registry data", error: (e as Error).message });
      }
    }
    const ok = rows.filter((r) => r.soundSpeed !== undefined).map((r) => r.soundSpeed as number);
    if (ok.length === 0) throw firstError;
    const max = Math.max(...ok), min = Math.min(...ok);
    const mean = ok.reduce((a, b) => a + b, 0) / ok.length;
    const single = forms.length === 1
      ? liquidProperties(id, T, p, { ...base, formulation }).soundSpeedSpread
      : undefined;
    if (values.json) {
      console.log(JSON.stringify(
        {
          liquid: id,
          temperature: T,
          pressure: p,
          salinity,
          formulations: rows,
          spread: max - min,
          relativeSpread: (max - min) / mean,
          statedSpread: single,
        },
        null,
        2,
      ));
    } else {
      console.log(`${id} at ${(T - 273.15).toFixed(2)} °C, ${(p / 1e3).toFixed(3)} kPa absolute`);
      for (const r of rows) {
        console.log(
          `  ${r.formulation.padEnd(18)} ${
            r.soundSpeed !== undefined
              ? `${r.soundSpeed.toFixed(3)} m/s`
              : `not applicable: ${r.error}`
          }`,
        );
      }
      if (ok.length > 1) {
        console.log(
          `  spread (max − min) ${(max - min).toFixed(3)} m/s = ${
            ((max - min) / mean * 100).toFixed(4)
          } % over ${ok.length} formulations`,
        );
      } else if (single !== undefined) {
        console.log(`  stated spread      ±${single.toFixed(2)} m/s (one data model only)`);
      }
    }
    return 0;
  }

  const s = liquidProperties(id, T, p, { ...base, formulation });
  if (values.json) {
    console.log(JSON.stringify({ temperature: T, pressure: p, salinity, ...s }, null, 2));
  } else {
    console.log(fmtState(s, T, p));
    const given = givenLine(values, [["temperature", "temperature"], ["pressure", "pressure"]]);
    if (given) console.log(`  ${given}`);
  }
  return 0;
});
