/**
 * Schema of data/sources.yaml: the bibliography.
 *
 * @module
 */
import { z } from "zod";
import { SourceId } from "./common.ts";

/** One bibliography entry. */
export const Source = z.strictObject({
  id: SourceId,
  type: z.enum([
    "standard",
    "paper",
    "book",
    "handbook",
    "dataset",
    "software",
    "report",
    "practice",
  ]),
  citation: z.string().min(10),
  url: z.string().optional(),
  /** Where our copy came from (a document at hand, a data table inside a Debian package). */
  copy: z.string().optional(),
  note: z.string().optional(),
});
/** One bibliography entry. */
export type Source = z.infer<typeof Source>;

/** The bibliography file. */
export const SourcesFile = z.strictObject({
  kind: z.literal("sources"),
  sources: z.array(Source).min(1),
});
