/**
 * The site check (lib/site/schema.ts, hand-written) against zod v4 (npm zod, the reference
 * library the check replaced on the start-up path): the same strict-object schema written in zod
 * here must give the same verdict and the same first issue (path and message: what the reader
 * reports) on every broken site below.
 * The broken sites are the demo sites (invented) with each field in turn replaced by a value of
 * the wrong kind or range, or with an unknown key added.
 */
import { z } from "zod";
import { assert } from "../_assert.ts";
import { MAX_TRAVERSES, SiteInputSchema } from "../../lib/site/schema.ts";
import { readSiteFile } from "../../lib/site/read.ts";

const finite = z.number().finite();
const positive = finite.positive();
const nonNegative = finite.nonnegative();
const fraction = finite.min(0).max(1);
const idText = z.string().regex(/^[a-z0-9][a-z0-9.+-]*$/);

const fitting = z.strictObject({ fitting: idText, orientation: finite.optional() });

const ZodSite = z.strictObject({
  name: z.string().min(1),
  id: z.string().min(1).optional(),
  invented: z.boolean().optional(),
  pipe: z.strictObject({
    geometry: z.enum(["catalogue", "measured"]),
    standard: z.string().min(1).optional(),
    nps: z.string().min(1).optional(),
    schedule: z.string().min(1).optional(),
    outsideDiameter: positive.optional(),
    circumference: positive.optional(),
    tapeThickness: nonNegative.optional(),
    wallThickness: positive.optional(),
    material: idText.optional(),
    wallSoundSpeed: positive.optional(),
    wallShearSpeed: positive.optional(),
    measuredWallThickness: positive.optional(),
    roughness: nonNegative.optional(),
    lining: z.strictObject({
      material: idText,
      thickness: positive,
      soundSpeed: positive.optional(),
    }).optional(),
  }),
  fluid: z.strictObject({
    liquid: idText,
    temperature: positive,
    pressure: positive,
    salinity: nonNegative.optional(),
    temperatureRange: z.strictObject({ min: positive, max: positive }).optional(),
    soundSpeed: positive.optional(),
    density: positive.optional(),
    kinematicViscosity: positive.optional(),
    formulation: idText.optional(),
  }),
  flow: z.strictObject({
    quantity: z.enum(["flowRate", "velocity"]),
    minimum: positive,
    design: positive.optional(),
    maximum: positive,
  }),
  transducer: z.strictObject({
    wedgeMaterial: idText.optional(),
    wedgeSoundSpeed: positive.optional(),
    wedgeAngle: positive,
    frequency: positive,
    timingResolution: positive.optional(),
    zeroOffset: finite.optional(),
    fixedDelay: nonNegative.optional(),
    wedgeTemperatureCoefficient: finite.optional(),
    wedgeReferenceTemperature: positive.optional(),
    elementHeight: positive.optional(),
    indexOffset: finite.optional(),
  }),
  mountings: z.array(z.number().int().min(1).max(MAX_TRAVERSES)).min(1),
  run: z.strictObject({
    length: positive,
    upstream: fitting,
    downstream: fitting.optional(),
    plannedPosition: nonNegative.optional(),
  }).optional(),
  targetUncertainty: finite.gt(0).lt(1).optional(),
  content: z.strictObject({ solids: fraction.optional(), gas: fraction.optional() }).optional(),
  notes: z.string().optional(),
  defaults: z.array(z.strictObject({
    field: z.string(),
    value: z.unknown(),
    message: z.string(),
  })),
  source: z.strictObject({
    file: z.string(),
    format: z.enum(["yaml", "json", "csv"]),
    row: z.number().int().positive().optional(),
  }),
});

const BAD: unknown[] = [
  undefined,
  null,
  "",
  "x",
  "Carbon Steel",
  "a1",
  0,
  -1,
  0.5,
  1,
  1.5,
  2,
  8,
  9,
  -0,
  NaN,
  Infinity,
  -Infinity,
  2 ** 60,
  [],
  [1],
  [0, 9],
  {},
  { x: 1 },
  true,
  new Date(0),
];

type Obj = Record<string, unknown>;
function paths(v: unknown, at: string[] = []): string[][] {
  if (v === null || typeof v !== "object") return [at];
  const out: string[][] = [at];
  for (const [k, x] of Object.entries(v as Obj)) out.push(...paths(x, [...at, k]));
  return out;
}
function setAt(root: Obj, at: string[], value: unknown, addKey = false): Obj {
  const copy = structuredClone(root);
  let o: Obj = copy;
  for (const k of at.slice(0, addKey ? at.length : -1)) o = o[k] as Obj;
  if (addKey) o.unexpectedKey = value;
  else o[at[at.length - 1]] = value;
  return copy;
}
const issues = (
  r: {
    success: boolean;
    error?: { issues: readonly { path: readonly PropertyKey[]; message: string }[] };
  },
) =>
  r.success
    ? "ok"
    : JSON.stringify(r.error!.issues.slice(0, 1).map((i) => [i.path.map(String), i.message]));

Deno.test("site check = zod v4 schema: verdict and first issue on broken demo sites", async () => {
  let compared = 0;
  let refused = 0;
  for (
    const f of [...Deno.readDirSync("data/demo")].map((e) => e.name).filter((n) =>
      n.endsWith(".yaml")
    )
  ) {
    const site = await readSiteFile(`data/demo/${f}`) as unknown as Obj;
    site.defaults = [{ field: "a", value: 1, message: "m" }, ...(site.defaults as unknown[])];
    const cases: Obj[] = [site];
    for (const at of paths(site)) {
      if (at.length) { for (const b of BAD) cases.push(setAt(site, at, b)); }
      const here = at.reduce<unknown>((o, k) => (o as Obj)[k], site);
      if (here && typeof here === "object" && !Array.isArray(here)) {
        cases.push(setAt(site, at, 1, true));
        // each key taken away in turn
        for (const k of Object.keys(here)) {
          const c = structuredClone(site);
          delete (at.reduce<unknown>((o, j) => (o as Obj)[j], c) as Obj)[k];
          cases.push(c);
        }
      }
    }
    for (const c of cases) {
      const ours = issues(SiteInputSchema.safeParse(c));
      assert.equal(ours, issues(ZodSite.safeParse(c)), JSON.stringify(c).slice(0, 300));
      compared++;
      if (ours !== "ok") refused++;
    }
  }
  assert.ok(compared > 1000 && refused > compared / 2, `${compared} compared, ${refused} refused`);
});

Deno.test("site check = zod v4 schema on values that are not sites", () => {
  for (const v of [null, undefined, 1, "x", [], {}, { name: "x" }]) {
    assert.equal(issues(SiteInputSchema.safeParse(v)), issues(ZodSite.safeParse(v)));
  }
});
