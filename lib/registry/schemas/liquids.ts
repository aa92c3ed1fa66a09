/**
 * Schema of the liquids other than water (data/liquids.yaml).
 *
 * @module
 */
import { z } from "zod";

/** The liquids data file. */
export const LiquidsFile = z.looseObject({ kind: z.literal("liquids") });
