/**
 * Schema of the pipe catalogue (data/pipes/*.yaml); owned by the pipe catalogue work.
 *
 * @module
 */
import { z } from "zod";

/** The pipes data file. */
export const PipesFile = z.looseObject({ kind: z.literal("pipes") });
