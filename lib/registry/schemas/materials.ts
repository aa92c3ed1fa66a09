/**
 * Schema of the materials (data/materials.yaml).
 *
 * @module
 */
import { z } from "zod";

/** The materials data file. */
export const MaterialsFile = z.looseObject({ kind: z.literal("materials") });
