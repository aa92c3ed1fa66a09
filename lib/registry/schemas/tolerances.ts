/**
 * Schema of the manufacturing tolerances (data/pipes/tolerances.yaml).
 *
 * @module
 */
import { z } from "zod";

/** The tolerances data file. */
export const TolerancesFile = z.looseObject({ kind: z.literal("tolerances") });
