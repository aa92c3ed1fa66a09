/**
 * Schema of data/sources.yaml: the bibliography.
 *
 * @module
 */
import { z } from "zod";
import { SourceId } from "./common.ts";

/** One bibliography entry: a standard, paper, handbook, data set or practice. */
export interface SourceEntry {
  /** Stable id, for example `iapws-r6-95`. */
  readonly id: string;
  /** Kind of document. */
  readonly type:
    | "standard"
    | "paper"
    | "book"
    | "handbook"
    | "dataset"
    | "software"
    | "report"
    | "practice";
  /** Full citation. */
  readonly citation: string;
  /** Where the document can be found. */
  readonly url?: string;
  /** Where our copy came from (a document at hand, a data table inside a Debian package). */
  readonly copy?: string;
  /** Anything an auditor should know. */
  readonly note?: string;
}

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
/** One bibliography entry (the schema's output type). */
export type Source = SourceEntry;

/** The bibliography file. */
export const SourcesFile = z.strictObject({
  kind: z.literal("sources"),
  sources: z.array(Source).min(1),
});
