/**
 * The data-file kinds the loader knows: each YAML file under data/ names its `kind`.
 *
 * @module
 */
import type { z } from "zod";
import { SourcesFile } from "./sources.ts";
import { CoefficientsFile, TableFile, VerificationFile } from "./tables.ts";
import { PipesFile } from "./pipes.ts";
import { TolerancesFile } from "./tolerances.ts";
import { MaterialsFile } from "./materials.ts";
import { LiquidsFile } from "./liquids.ts";
import { FittingsFile } from "./fittings.ts";

/** Schema per data-file kind. */
export const SCHEMAS: Readonly<Record<string, z.ZodType>> = {
  sources: SourcesFile,
  coefficients: CoefficientsFile,
  verification: VerificationFile,
  table: TableFile,
  pipes: PipesFile,
  tolerances: TolerancesFile,
  materials: MaterialsFile,
  liquids: LiquidsFile,
  fittings: FittingsFile,
};
