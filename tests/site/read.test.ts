/**
 * The site reader on good input: the full shape, JSON, measured pipes, velocities, defaults,
 * unit conversions, expressions, fleets in CSV, folder listing. Sites here are invented.
 */
import {
  readSiteFile,
  readSitesCsv,
  readSitesCsvFile,
  readSiteText,
  siteFiles,
} from "../../lib/site/read.ts";
import { SiteInputSchema } from "../../lib/site/schema.ts";
import { assert, closeRel, refusal } from "../_assert.ts";

const FULL = `
name: Filter outlet (invented test site)
id: FO-1
invented: true
pipe:
  standard: ASME B36.10M
  nps: "8"
  schedule: "40"
  material: carbon-steel
  wallSoundSpeed: 3230 m/s
  wallShearSpeed: 3200 m/s
  measuredWallThickness: 7.9 mm
  roughness: 0.045 mm
  lining: { material: cement-mortar, thickness: 8 mm, soundSpeed: 3800 m/s }
fluid:
  liquid: water
  temperature: 12 degC
  pressure: 5 bar
  temperatureRange: { min: 4 degC, max: 22 degC }
  formulation: iapws95
flow: { minimum: 20 L/s, design: 60 L/s, maximum: 90 L/s }
transducer:
  wedgeSoundSpeed: 2720 m/s
  wedgeAngle: 38 deg
  frequency: 1 MHz
  timingResolution: 100 ps
  zeroOffset: -50 ps
  fixedDelay: 8 us
  wedgeTemperatureCoefficient: -2.5 m/s/K
  elementHeight: 12 mm
  indexOffset: 10 mm
mountings: [4, 1, 2]
run:
  length: 6 m
  upstream: { fitting: elbow-90, orientation: 90 deg }
  downstream: { fitting: gate-valve }
  plannedPosition: 4 m
targetUncertainty: 2 %
content: { solids: 0.1 %, gas: 0 % }
notes: |
  Access from the east walkway.
`;

const DEG = Math.PI / 180;

Deno.test("full shape: every key read into SI", async () => {
  const s = await readSiteText(FULL, { file: "full.yaml" });
  assert.ok(SiteInputSchema.safeParse(s).success);
  assert.equal(s.name, "Filter outlet (invented test site)");
  assert.equal(s.id, "FO-1");
  assert.equal(s.invented, true);
  assert.deepEqual(s.source, { file: "full.yaml", format: "yaml" });
  assert.equal(s.pipe.geometry, "catalogue");
  assert.equal(s.pipe.nps, "8");
  assert.equal(s.pipe.schedule, "40");
  assert.equal(s.pipe.standard, "ASME B36.10M");
  closeRel(s.pipe.measuredWallThickness!, 0.0079, 1e-12, "measured wall");
  closeRel(s.pipe.roughness!, 4.5e-5, 1e-12, "roughness");
  assert.equal(s.pipe.lining?.material, "cement-mortar");
  closeRel(s.pipe.lining!.thickness, 0.008, 1e-12, "lining");
  assert.equal(s.pipe.lining?.soundSpeed, 3800);
  closeRel(s.fluid.temperature, 285.15, 1e-14, "T");
  assert.equal(s.fluid.pressure, 5e5);
  closeRel(s.fluid.temperatureRange!.min, 277.15, 1e-14, "Tmin");
  closeRel(s.fluid.temperatureRange!.max, 295.15, 1e-14, "Tmax");
  assert.equal(s.flow.quantity, "flowRate");
  closeRel(s.flow.minimum, 0.02, 1e-12, "min");
  closeRel(s.flow.design!, 0.06, 1e-12, "design");
  closeRel(s.flow.maximum, 0.09, 1e-12, "max");
  closeRel(s.transducer.wedgeAngle, 38 * DEG, 1e-14, "angle");
  assert.equal(s.transducer.frequency, 1e6);
  closeRel(s.transducer.timingResolution!, 1e-10, 1e-12, "resolution");
  closeRel(s.transducer.zeroOffset!, -5e-11, 1e-12, "zero offset keeps its sign");
  closeRel(s.transducer.fixedDelay!, 8e-6, 1e-12, "delay");
  assert.equal(s.transducer.wedgeTemperatureCoefficient, -2.5);
  assert.deepEqual(s.mountings, [1, 2, 4]);
  closeRel(s.run!.upstream.orientation!, Math.PI / 2, 1e-14, "orientation");
  assert.equal(s.run!.downstream?.fitting, "gate-valve");
  assert.equal(s.run!.plannedPosition, 4);
  closeRel(s.targetUncertainty!, 0.02, 1e-14, "target");
  closeRel(s.content!.solids!, 0.001, 1e-12, "solids");
  assert.equal(s.content!.gas, 0);
  assert.equal(s.notes, "Access from the east walkway.");
  assert.deepEqual(s.defaults, []);
});

Deno.test("defaults: pressure, mountings and standard are listed when assumed", async () => {
  const s = await readSiteText(`
name: Minimal (invented)
pipe: { nps: 4, schedule: 10s }
fluid: { liquid: water, temperature: 20 degC }
flow: { minimum: 1 L/s, maximum: 10 L/s }
transducer: { wedgeMaterial: acrylic, wedgeAngle: 37 deg, frequency: 2 MHz }
`);
  assert.equal(s.fluid.pressure, 101325);
  assert.deepEqual(s.mountings, [1, 2]);
  assert.equal(s.pipe.schedule, "10S");
  assert.equal(s.pipe.standard, "ASME B36.19M");
  assert.deepEqual(s.defaults.map((d) => d.field).sort(), [
    "fluid.pressure",
    "mountings",
    "pipe.standard",
  ]);
  assert.equal(s.source.file, "<text>");
  assert.equal(s.run, undefined);
});

Deno.test("US customary units and gauge pressure", async () => {
  const s = await readSiteText(`
name: Customary units (invented)
pipe: { circumference: 27.1 in, wallThickness: 0.322 in }
fluid: { liquid: water, temperature: 68 degF, pressure: 58 psig }
flow: { minimum: 150 gpm, maximum: 1400 gpm }
transducer: { wedgeSoundSpeed: 8924 ft/s, wedgeAngle: 0.66 rad, frequency: 500 kHz }
run: { length: 20 ft, upstream: { fitting: tee }, downstream: { fitting: reducer }, plannedPosition: 15 ft }
`);
  assert.equal(s.pipe.geometry, "measured");
  closeRel(s.pipe.circumference!, 27.1 * 0.0254, 1e-12, "circumference");
  closeRel(s.fluid.temperature, 293.15, 1e-12, "68 degF");
  // 58 psig is 58 psi above one standard atmosphere.
  closeRel(s.fluid.pressure, 58 * 6894.757293168361 + 101325, 1e-9, "58 psig");
  closeRel(s.flow.minimum, 150 * 3.785411784e-3 / 60, 1e-12, "gpm");
  closeRel(s.transducer.wedgeSoundSpeed!, 8924 * 0.3048, 1e-12, "ft/s");
  closeRel(s.run!.length, 20 * 0.3048, 1e-12, "ft");
});

Deno.test("expressions go through the mathjs fallback", async () => {
  const s = await readSiteText(`
name: Expressions (invented)
pipe: { outsideDiameter: 8 in + 0.625 in, wallThickness: 0.25 in + 2 mm }
fluid: { liquid: water, temperature: 12 degC }
flow: { minimum: 0.5 m^3/min, maximum: 2 * 40 L/s }
transducer: { wedgeSoundSpeed: 2720 m/s, wedgeAngle: 38 deg, frequency: 1 MHz }
`);
  closeRel(s.pipe.outsideDiameter!, 8.625 * 0.0254, 1e-12, "8.625 in");
  closeRel(s.pipe.wallThickness!, 0.25 * 0.0254 + 0.002, 1e-12, "wall");
  closeRel(s.flow.minimum, 0.5 / 60, 1e-12, "m^3/min");
  closeRel(s.flow.maximum, 0.08, 1e-12, "2 * 40 L/s");
});

Deno.test("measured geometry wins over catalogue when both are given", async () => {
  const s = await readSiteText(`
name: Both (invented)
pipe: { nps: "8", schedule: STD, outsideDiameter: 219.0 mm, wallThickness: 8.0 mm }
fluid: { liquid: water, temperature: 12 degC }
flow: { minimum: 20 L/s, maximum: 90 L/s }
transducer: { wedgeSoundSpeed: 2720 m/s, wedgeAngle: 38 deg, frequency: 1 MHz }
`);
  assert.equal(s.pipe.geometry, "measured");
  assert.equal(s.pipe.nps, "8");
  assert.equal(s.pipe.schedule, "STD");
  closeRel(s.pipe.outsideDiameter!, 0.219, 1e-12, "od");
});

Deno.test("velocities instead of flows, seawater with salinity, trade mounting letters", async () => {
  const s = await readSiteText(`
name: Intake (invented)
pipe: { nps: 1 1/2, schedule: Sch 80 }
fluid: { liquid: Seawater, temperature: 18 degC, pressure: 2 barg, salinity: 35 }
flow: { minimumVelocity: 0.3 m/s, designVelocity: 1.2 m/s, maximumVelocity: 3 m/s }
transducer: { wedgeSoundSpeed: 2720 m/s, wedgeAngle: 38 deg, frequency: 1 MHz }
mountings: [W, z, V]
`);
  assert.equal(s.pipe.nps, "1-1/2");
  assert.equal(s.pipe.schedule, "80");
  assert.equal(s.fluid.liquid, "seawater");
  assert.equal(s.fluid.salinity, 35);
  assert.equal(s.fluid.pressure, 2e5 + 101325);
  assert.deepEqual(s.flow, { quantity: "velocity", minimum: 0.3, design: 1.2, maximum: 3 });
  assert.deepEqual(s.mountings, [1, 2, 4]);
});

Deno.test("NPS designations in their usual spellings", async () => {
  const cases: [unknown, string][] = [
    [8, "8"],
    ["8", "8"],
    ["NPS 8", "8"],
    [1.5, "1-1/2"],
    ["1.5", "1-1/2"],
    ["1 1/2", "1-1/2"],
    ["1-1/2", "1-1/2"],
    [0.5, "1/2"],
    ["3/4", "3/4"],
    [2.5, "2-1/2"],
    [0.125, "1/8"],
  ];
  for (const [given, want] of cases) {
    const s = await readSiteText(JSON.stringify({
      name: "NPS (invented)",
      pipe: { nps: given, schedule: 40 },
      fluid: { liquid: "water", temperature: "12 degC" },
      flow: { minimum: "1 L/s", maximum: "2 L/s" },
      transducer: { wedgeSoundSpeed: "2720 m/s", wedgeAngle: "38 deg", frequency: "1 MHz" },
    }));
    assert.equal(s.pipe.nps, want, `nps ${JSON.stringify(given)}`);
    assert.equal(s.source.format, "json");
  }
  for (const bad of [0, -2, 1.3, "8.3", "2/3", "1-1/3", "eight", true]) {
    const e = await refusal(readSiteText(JSON.stringify({
      name: "NPS (invented)",
      pipe: { nps: bad, schedule: 40 },
    })));
    assert.equal(e.field, "pipe.nps", `nps ${JSON.stringify(bad)}`);
  }
});

Deno.test("format: JSON by extension or by a leading brace, YAML otherwise", async () => {
  const json = JSON.stringify({ name: "x", pipe: 1 });
  const e1 = await refusal(readSiteText(json));
  assert.equal(e1.field, "pipe");
  const e2 = await refusal(readSiteText(json, { file: "a.json" }));
  assert.ok(e2.message.startsWith("a.json: pipe:"), e2.message);
  // JSON is read by the JSON grammar: a YAML-only form is refused when the format is json.
  const e3 = await refusal(readSiteText("{ name: x }", { format: "json" }));
  assert.ok(e3.field.startsWith("line 1"), e3.message);
});

Deno.test("the first error is the one reported, with the file in front", async () => {
  const e = await refusal(
    readSiteText(FULL.replace("12 degC", "12 m").replace("38 deg", "38 m"), { file: "f.yaml" }),
  );
  assert.equal(e.field, "fluid.temperature");
  assert.ok(e.message.startsWith('f.yaml: fluid.temperature: got "12 m"; expected'), e.message);
});

Deno.test("every numeric field refuses a bare number (the key does not fix the unit)", async () => {
  const quantities: [string, string][] = [
    ["  wallSoundSpeed: 3230 m/s", "pipe.wallSoundSpeed"],
    ["  measuredWallThickness: 7.9 mm", "pipe.measuredWallThickness"],
    ["  temperature: 12 degC", "fluid.temperature"],
    ["  pressure: 5 bar", "fluid.pressure"],
    ["  frequency: 1 MHz", "transducer.frequency"],
    ["  timingResolution: 100 ps", "transducer.timingResolution"],
    ["  elementHeight: 12 mm", "transducer.elementHeight"],
    ["  length: 6 m", "run.length"],
    ["  plannedPosition: 4 m", "run.plannedPosition"],
    ["targetUncertainty: 2 %", "targetUncertainty"],
  ];
  for (const [line, field] of quantities) {
    assert.ok(FULL.includes(line), line);
    const bare = line.replace(/^(\s*\w+: )([\d.]+) .*$/, "$1$2");
    const e = await refusal(readSiteText(FULL.replace(line, bare)));
    assert.equal(e.field, field, `${line} → ${e.message}`);
    assert.ok(e.message.includes("bare number"), e.message);
  }
});

const HEADER = "id,name,pipe.nps,pipe.schedule,fluid.liquid,fluid.temperature,fluid.pressure," +
  "flow.minimum,flow.maximum,transducer.wedgeSoundSpeed,transducer.wedgeAngle," +
  "transducer.frequency,mountings,notes";

Deno.test("CSV fleet: good rows read, bad rows reported by line, others kept", async () => {
  const csv = [
    "# Fleet of invented sites",
    HEADER,
    'P1,"Pump house, north (invented)",6,40,water,15 degC,4 barg,5 L/s,40 L/s,2720 m/s,38 deg,1 MHz,1;2;4,',
    "P2,Tank inlet (invented),4,40,water,15 m,,5 L/s,20 L/s,2720 m/s,38 deg,1 MHz,2,",
    "",
    'P3,Return (invented),10,STD,water,30 degC,,50 L/s,200 L/s,2720 m/s,38 deg,1 MHz,V,"two\nlines"',
    "P1,Duplicate (invented),10,STD,water,30 degC,,50 L/s,200 L/s,2720 m/s,38 deg,1 MHz,V,",
    "P5,Typo (invented),10,STD,water,30 degC,,50 L/s,20 L/s,2720 m/s,38 deg,1 MHz,2.5,",
  ].join("\r\n");
  const { sites, errors } = await readSitesCsv(csv, { file: "fleet.csv" });
  assert.deepEqual(sites.map((s) => s.id), ["P1", "P3"]);
  assert.equal(sites[0].name, "Pump house, north (invented)");
  assert.deepEqual(sites[0].mountings, [1, 2, 4]);
  assert.equal(sites[0].fluid.pressure, 4e5 + 101325);
  assert.deepEqual(sites[0].source, { file: "fleet.csv", format: "csv", row: 3 });
  assert.equal(sites[1].notes, "two\nlines");
  assert.equal(sites[1].source.row, 6);
  assert.deepEqual(sites[1].defaults.map((d) => d.field), ["pipe.standard", "fluid.pressure"]);
  assert.deepEqual(errors.map((e) => e.row), [4, 8, 9]);
  assert.ok(
    errors[0].message.startsWith("fleet.csv row 4 (site P2): fluid.temperature: got"),
    errors[0].message,
  );
  assert.ok(errors[1].message.includes('id: got "P1"') && errors[1].message.includes("row 3"));
  assert.ok(errors[2].message.includes("flow.minimum"), errors[2].message);
  for (const e of errors) assert.ok(!e.message.includes("\n"), e.message);
});

Deno.test("CSV fleet: header faults refuse the whole file", async () => {
  const bad: [string, RegExp][] = [
    ["id,name,pipe.shedule", /column 3: .*did you mean "pipe.schedule"/],
    ["id,name,pipe", /column 3: .*one column per key inside it/],
    ["id,name,name", /column 3: got "name" a second time/],
    ["name,pipe.nps", /header: got no id column/],
    ["id,name,fluids.temperature", /column 3: .*did you mean "fluid"/],
  ];
  for (const [header, re] of bad) {
    const e = await refusal(readSitesCsv(header + "\nA,b,c\n"));
    assert.match(e.message, re);
  }
  const e = await refusal(readSitesCsv(HEADER + '\nP1,"unclosed\n'));
  assert.match(e.message, /line 2: got a quoted cell that never closes/);
  await refusal(readSitesCsv(""));
  const ragged = await readSitesCsv("id,name\nA,b,c\n");
  assert.match(ragged.errors[0].message, /row: got 3 cells; expected at most 2/);
});

Deno.test("files: readSiteFile, readSitesCsvFile and siteFiles on a folder", async () => {
  const dir = await Deno.makeTempDir();
  try {
    await Deno.writeTextFile(`${dir}/b.yml`, FULL);
    await Deno.writeTextFile(`${dir}/a.json`, "\uFEFF" + JSON.stringify({ name: "x" }));
    await Deno.writeTextFile(`${dir}/fleet.csv`, HEADER + "\n");
    await Deno.writeTextFile(`${dir}/.hidden.yaml`, FULL);
    await Deno.mkdir(`${dir}/sub.yaml`);
    const files = await siteFiles(dir);
    assert.deepEqual(files, [`${dir}/a.json`, `${dir}/b.yml`]);
    assert.deepEqual(await siteFiles(`${dir}/b.yml`), [`${dir}/b.yml`]);
    const s = await readSiteFile(`${dir}/b.yml`);
    assert.deepEqual(s.source, { file: `${dir}/b.yml`, format: "yaml" });
    const e = await refusal(readSiteFile(`${dir}/a.json`));
    assert.equal(e.field, "pipe", "the byte-order mark is skipped and the JSON read");
    const fleet = await readSitesCsvFile(`${dir}/fleet.csv`);
    assert.deepEqual(fleet, { sites: [], errors: [] });
    const missing = await refusal(siteFiles(`${dir}/nothing`));
    assert.equal(missing.field, "path");
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});

Deno.test("CSV row errors name the site id and give the column to fill, not YAML syntax", async () => {
  const { readSitesCsv } = await import("../../lib/site/read.ts");
  const csv = "id,name,pipe.nps,pipe.schedule,pipe.material,fluid.liquid,fluid.temperature," +
    "flow.minimum,flow.maximum,transducer.wedgeMaterial,transducer.wedgeAngle," +
    "transducer.frequency,mountings,run.length,run.downstream.fitting\n" +
    "s1,A (invented),4,40,carbon-steel,water,20 degC,2 L/s,10 L/s,acrylic,38 deg,1 MHz,V,5 m," +
    "gate-valve\n";
  const { errors } = await readSitesCsv(csv, { file: "f.csv" });
  assert.equal(errors.length, 1);
  assert.match(errors[0].message, /^f\.csv row 2 \(site s1\): run\.upstream: got nothing/);
  assert.match(errors[0].message, /column run\.upstream\.fitting/);
  assert.ok(!errors[0].message.includes("{"), errors[0].message);
});

Deno.test("a fleet CSV may leave out the downstream fitting", async () => {
  const { readSitesCsv } = await import("../../lib/site/read.ts");
  const csv = "id,name,pipe.nps,pipe.schedule,pipe.material,fluid.liquid,fluid.temperature," +
    "flow.minimum,flow.maximum,transducer.wedgeMaterial,transducer.wedgeAngle," +
    "transducer.frequency,mountings,run.length,run.upstream.fitting,run.downstream.fitting\n" +
    "s1,A (invented),4,40,carbon-steel,water,20 degC,2 L/s,10 L/s,acrylic,38 deg,1 MHz,V,5 m," +
    "elbow-90,\n" +
    "s2,B (invented),4,40,carbon-steel,water,20 degC,2 L/s,10 L/s,acrylic,38 deg,1 MHz,V,5 m," +
    "elbow-90,gate-valve\n";
  const { sites, errors } = await readSitesCsv(csv, { file: "f.csv" });
  assert.deepEqual(errors, []);
  assert.equal(sites[0].run?.downstream, undefined);
  assert.equal(sites[1].run?.downstream?.fitting, "gate-valve");
});

Deno.test("a shortened key is pointed at the one key it begins (target → targetUncertainty)", async () => {
  const base = await Deno.readTextFile("data/demo/01-reservoir-outlet.yaml");
  let msg = "";
  try {
    await readSiteText(base + "\ntarget: 2 %\n");
  } catch (e) {
    msg = (e as Error).message;
  }
  assert.match(
    msg,
    /target: got an unknown key; expected a key of the site; did you mean "targetUncertainty"\?/,
  );
});
