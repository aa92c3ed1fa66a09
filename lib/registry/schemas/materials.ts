/**
 * Schema of the materials (data/materials.yaml): pipe walls, linings and transducer wedges,
 * with their sound speeds, density, temperature coefficients, attenuation and wall roughness.
 *
 * Every object is strict: an unknown key (a typo such as `spraed`) is refused, not dropped.
 * Quantities are `{ value, unit, spread?, source?, basis?, copy?, at?, note? }`; the unit must
 * have the field's dimension, and speeds, densities and frequencies must be greater than 0.
 *
 * @module
 */
import { z } from "zod";
import { speedPerKelvinFactor } from "./values.ts";

export { speedPerKelvinFactor };
import { parseQuantity } from "../../units.ts";
import type { Dimension } from "../../units.ts";
import { BasisSchema, EntryId, range, SourceId } from "./common.ts";

/** Roles a material plays in a clamp-on path. */
export const MaterialRole = z.enum(["wall", "lining", "wedge"]);
/** Roles a material plays in a clamp-on path. */
export type MaterialRole = z.infer<typeof MaterialRole>;

const provenanceFields = {
  /** Half-width of the spread between sources or stated uncertainty, same unit as value. */
  spread: z.number().nonnegative().optional(),
  source: SourceId.optional(),
  basis: BasisSchema.optional(),
  copy: z.string().optional(),
  at: z.string().optional(),
  note: z.string().optional(),
};

/**
 * A strict quantity of one dimension; `positive` refuses zero and negative values.
 *
 * @param dimension the dimension its unit must have
 * @param positive whether the value must be greater than 0
 * @returns the zod schema
 */
export function strictQuantity(dimension: Dimension, positive = false) {
  return z.strictObject({
    value: z.number().refine(Number.isFinite, "a finite number"),
    unit: z.string(),
    ...provenanceFields,
  }).superRefine((q, ctx) => {
    if (positive && !(q.value > 0)) {
      ctx.addIssue({ code: "custom", message: "must be greater than 0", path: ["value"] });
    }
    try {
      parseQuantity(`${q.value} ${q.unit}`, dimension, "unit");
    } catch {
      ctx.addIssue({
        code: "custom",
        message: `unit '${q.unit}' is not a ${dimension} unit`,
        path: ["unit"],
      });
    }
  });
}

/** A temperature coefficient of sound speed, such as `{ value: -2.5, unit: "m/s/K" }`. */
export const SpeedPerKelvin = z.strictObject({
  value: z.number().refine(Number.isFinite, "a finite number"),
  unit: z.string(),
  ...provenanceFields,
}).superRefine((q, ctx) => {
  if (speedPerKelvinFactor(q.unit) === undefined) {
    ctx.addIssue({
      code: "custom",
      message: `unit '${q.unit}' is not a speed per temperature unit such as m/s/K`,
      path: ["unit"],
    });
  }
});

/** Temperature coefficients of sound speed and the range over which they hold. */
export const TemperatureCoefficients = z.strictObject({
  longitudinal: SpeedPerKelvin.optional(),
  shear: SpeedPerKelvin.optional(),
  /** Temperatures over which the linear coefficients hold. */
  range: range("temperature"),
  source: SourceId.optional(),
  basis: BasisSchema.optional(),
  copy: z.string().optional(),
  note: z.string().optional(),
});

/** Acoustic attenuation at a stated frequency. */
export const Attenuation = z.strictObject({
  value: z.number().refine((x) => Number.isFinite(x) && x >= 0, "a finite number ≥ 0"),
  unit: z.string(),
  ...provenanceFields,
  mode: z.enum(["longitudinal", "shear"]).default("longitudinal"),
  frequency: strictQuantity("frequency", true),
}).superRefine((q, ctx) => {
  try {
    parseQuantity(`${q.value} ${q.unit}`, "attenuation", "unit");
  } catch {
    ctx.addIssue({
      code: "custom",
      message: `unit '${q.unit}' is not an attenuation unit such as Np/m`,
      path: ["unit"],
    });
  }
});

/** One material. */
export const Material = z.strictObject({
  id: EntryId,
  name: z.string().min(1),
  roles: z.array(MaterialRole).min(1),
  /** Default provenance for every datum of the entry that names none of its own. */
  source: SourceId,
  basis: BasisSchema,
  copy: z.string().optional(),
  note: z.string().optional(),
  /** Temperature at which speeds and density are given. */
  referenceTemperature: strictQuantity("temperature"),
  longitudinal: strictQuantity("speed", true),
  shear: strictQuantity("speed", true).optional(),
  density: strictQuantity("density", true),
  temperatureCoefficient: TemperatureCoefficients.optional(),
  attenuation: z.array(Attenuation).optional(),
  /** Equivalent sand-grain roughness of the bore, new. */
  roughness: strictQuantity("length").optional(),
  /** Equivalent sand-grain roughness after years of service. */
  roughnessAged: strictQuantity("length").optional(),
}).superRefine((m, ctx) => {
  if (m.shear && m.shear.value >= m.longitudinal.value) {
    ctx.addIssue({
      code: "custom",
      message: "shear speed must be lower than longitudinal speed",
      path: ["shear", "value"],
    });
  }
  for (const k of ["roughness", "roughnessAged"] as const) {
    const r = m[k];
    if (r && r.value < 0) {
      ctx.addIssue({ code: "custom", message: "must be 0 or more", path: [k, "value"] });
    }
  }
  if (new Set(m.roles).size !== m.roles.length) {
    ctx.addIssue({ code: "custom", message: "a role is listed twice", path: ["roles"] });
  }
});
/** One material, as written in the data file. */
export type MaterialEntry = z.infer<typeof Material>;

/** The materials data file. */
export const MaterialsFile = z.strictObject({
  kind: z.literal("materials"),
  note: z.string().optional(),
  materials: z.array(Material).min(1),
});
