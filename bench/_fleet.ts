/**
 * Invented fleets for the fleet benchmark (bench/fleet.ts) and the byte-for-byte `--jobs` test
 * (tests/site/fleet_jobs.test.ts): a CSV of n sites and a folder of YAML sites, varied in size,
 * temperature, flow and mountings, with a few rows that are refused on purpose (a bad unit, a
 * size the catalogue lacks). Every site is invented.
 *
 * @module
 */

const NPS = ["2", "3", "4", "6", "8", "10", "12", "16", "20", "24"];
const HEADER =
  "id,name,pipe.nps,pipe.schedule,pipe.material,fluid.liquid,fluid.temperature,flow.minimum," +
  "flow.maximum,transducer.wedgeSoundSpeed,transducer.wedgeAngle,transducer.frequency,mountings";

/**
 * A fleet CSV of n invented sites; every `badEvery`-th row is refused by the reader or the plan.
 *
 * @param n number of sites
 * @param badEvery period of refused rows (0: none)
 * @returns the CSV text
 */
export function inventedFleetCsv(n: number, badEvery = 0): string {
  const lines = ["# invented fleet for benchmarks and tests", HEADER];
  for (let i = 0; i < n; i++) {
    const nps = NPS[i % NPS.length];
    const d = Number(nps);
    const t = 5 + (i * 7) % 60;
    const qMax = Math.round(d * d * 1.5 + (i % 5));
    const mounts = ["1;2", "2", "1;2;4", "1"][i % 4];
    let temp = `${t} degC`;
    let size = nps;
    if (badEvery > 0 && i % badEvery === badEvery - 1) {
      if ((i / badEvery) % 2 < 1) temp = `${t} metre`;
      else size = "7";
    }
    lines.push(
      `S${String(i + 1).padStart(5, "0")},"Line ${i + 1}, block ${i % 17} (invented)",${size},40,` +
        `carbon-steel,water,${temp},${Math.max(1, Math.round(qMax / 6))} L/s,${qMax} L/s,` +
        `2720 m/s,38 deg,${i % 3 === 0 ? "0.5" : "1"} MHz,${mounts}`,
    );
  }
  return lines.join("\n") + "\n";
}

/**
 * The same invented sites as YAML files (name → text), for folder input.
 *
 * @param n number of sites
 * @param badEvery period of refused files (0: none)
 * @returns file name to YAML text
 */
export function inventedFleetYaml(n: number, badEvery = 0): Map<string, string> {
  const out = new Map<string, string>();
  const rows = inventedFleetCsv(n, badEvery).trim().split("\n").slice(2);
  for (const row of rows) {
    const c = row.match(/("[^"]*"|[^,]+)/g)!;
    const [id, name, nps, sch, mat, liq, temp, qmin, qmax, ws, wa, f, m] = c;
    out.set(
      `${id}.yaml`,
      `id: ${id}\nname: ${name}\ninvented: true\n` +
        `pipe: { nps: "${nps}", schedule: "${sch}", material: ${mat} }\n` +
        `fluid: { liquid: ${liq}, temperature: ${temp} }\n` +
        `flow: { minimum: ${qmin}, maximum: ${qmax} }\n` +
        `transducer: { wedgeSoundSpeed: ${ws}, wedgeAngle: ${wa}, frequency: ${f} }\n` +
        `mountings: [${m.split(";").join(", ")}]\n`,
    );
  }
  return out;
}
