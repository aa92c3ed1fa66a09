/**
 * Schema of the fittings and straight-run requirements (data/fittings.yaml).
 *
 * @module
 */
import { z } from "zod";

/** The fittings data file. */
export const FittingsFile = z.looseObject({ kind: z.literal("fittings") });
