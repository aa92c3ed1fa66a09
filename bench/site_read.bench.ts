/**
 * The site reader: one YAML site, one JSON site, a fleet CSV of 100 rows (invented sites).
 */
import { readSitesCsv, readSiteText } from "../lib/site/read.ts";

const YAML = `
name: Filter outlet (invented)
pipe: { nps: "8", schedule: "40", material: carbon-steel }
fluid: { liquid: water, temperature: 12 degC, pressure: 5 bar }
flow: { minimum: 20 L/s, design: 60 L/s, maximum: 90 L/s }
transducer: { wedgeSoundSpeed: 2720 m/s, wedgeAngle: 38 deg, frequency: 1 MHz }
mountings: [1, 2, 4]
run: { length: 6 m, upstream: { fitting: elbow-90 }, downstream: { fitting: gate-valve } }
targetUncertainty: 2 %
`;
const JSON_TEXT = JSON.stringify({
  name: "Filter outlet (invented)",
  pipe: { nps: "8", schedule: "40" },
  fluid: { liquid: "water", temperature: "12 degC", pressure: "5 bar" },
  flow: { minimum: "20 L/s", maximum: "90 L/s" },
  transducer: { wedgeSoundSpeed: "2720 m/s", wedgeAngle: "38 deg", frequency: "1 MHz" },
});
const CSV = [
  "id,name,pipe.nps,pipe.schedule,fluid.liquid,fluid.temperature,flow.minimum,flow.maximum," +
  "transducer.wedgeSoundSpeed,transducer.wedgeAngle,transducer.frequency,mountings",
  ...Array.from(
    { length: 100 },
    (_, i) =>
      `S${i},Site ${i} (invented),6,40,water,15 degC,5 L/s,40 L/s,2720 m/s,38 deg,1 MHz,1;2`,
  ),
].join("\n");

Deno.bench("site: readSiteText, YAML site", async () => {
  await readSiteText(YAML);
});
Deno.bench("site: readSiteText, JSON site", async () => {
  await readSiteText(JSON_TEXT, { format: "json" });
});
Deno.bench("site: readSitesCsv, 100 rows", async () => {
  const r = await readSitesCsv(CSV);
  if (r.sites.length !== 100) throw new Error("fleet");
});
