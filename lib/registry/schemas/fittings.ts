/**
 * Schema of the fittings: straight-run requirements of a clamp-on transit-time meter and the
 * parameters of the snellpath distorted-profile model (data/fittings.yaml).
 *
 * Lengths are in pipe inside diameters (D); amplitudes are fractions of the bulk velocity.
 *
 * @module
 */
import { z } from "zod";
import { BasisSchema, EntryId, SourceId } from "./common.ts";

const finite = z.number().refine(Number.isFinite, "a finite number");

const prov = {
  source: SourceId.optional(),
  basis: BasisSchema.optional(),
  copy: z.string().optional(),
  note: z.string().optional(),
};

/** A straight length in diameters. */
export const StraightLength = z.strictObject({
  /** Length in inside diameters. */
  diameters: z.number().nonnegative(),
  /** Half-width of the spread between the sources or practices, in diameters. */
  spread: z.number().nonnegative().optional(),
  ...prov,
});

/** One exponentially decaying component of the distorted-profile model. */
export const DisturbanceComponent = z.strictObject({
  /** Amplitude at the fitting (distance 0), a fraction of the bulk velocity (signed). */
  amplitude: finite,
  /** e-folding decay length, in diameters. */
  decay: z.number().positive(),
  ...prov,
});

/** Provenance fields carried by an entry or a datum. */
export interface FittingProvenance {
  /** Source id in data/sources.yaml. */
  readonly source?: string;
  /** How the datum got here. */
  readonly basis?: "transcribed" | "computed" | "common-practice" | "recalled";
  /** Where the copy came from. */
  readonly copy?: string;
  /** Free note. */
  readonly note?: string;
}

/** A straight length in diameters. */
export interface FittingLength extends FittingProvenance {
  /** Length in inside diameters. */
  readonly diameters: number;
  /** Half-width of the spread between practices, diameters. */
  readonly spread?: number;
}

/** One decaying component of the distorted-profile model. */
export interface FittingComponent extends FittingProvenance {
  /** Amplitude at the fitting, fraction of the bulk velocity. */
  readonly amplitude: number;
  /** e-folding decay length, diameters. */
  readonly decay: number;
}

/** One fitting entry of data/fittings.yaml. */
export interface Fitting extends FittingProvenance {
  /** Entry id. */
  readonly id: string;
  /** Human name. */
  readonly name: string;
  /** Other ids resolving to this entry. */
  readonly aliases?: readonly string[];
  /** Whether the fitting has a reference plane. */
  readonly planar: boolean;
  /** Straight-run requirements, diameters. */
  readonly straightRun: FittingProvenance & {
    /** Needed after the fitting (fitting upstream of the meter). */
    readonly upstream: FittingLength;
    /** Needed before the fitting (fitting downstream of the meter). */
    readonly downstream: FittingLength;
  };
  /** Distorted-profile model parameters. */
  readonly disturbance: FittingProvenance & {
    /** Axisymmetric reshaping. */
    readonly axisymmetric: FittingComponent;
    /** cos 2θ component. */
    readonly secondHarmonic: FittingComponent;
    /** Skewed (cos θ) component. */
    readonly skew: FittingComponent;
    /** Swirl. */
    readonly swirl: FittingComponent;
    /** Cross-flow. */
    readonly crossFlow: FittingComponent;
    /** Reading shift when downstream of the meter. */
    readonly downstreamEffect: FittingComponent;
  };
}

/** Schema of one {@link Fitting}. */
export const FittingSchema: z.ZodType<Fitting> = z.strictObject({
  id: EntryId,
  name: z.string().min(3),
  /** Other ids that resolve to this entry. */
  aliases: z.array(EntryId).optional(),
  /** Whether the fitting has a reference plane (an elbow's bend plane, a valve's stem). */
  planar: z.boolean(),
  ...prov,
  straightRun: z.strictObject({
    /** Straight length the meter needs after this fitting (fitting upstream of the meter). */
    upstream: StraightLength,
    /** Straight length the meter needs before this fitting (fitting downstream of the meter). */
    downstream: StraightLength,
    ...prov,
  }),
  disturbance: z.strictObject({
    /** Axisymmetric reshaping: + more peaked, − flatter. Shape (1 − r̂²)(1 − 3r̂²). */
    axisymmetric: DisturbanceComponent,
    /** cos 2θ component, + raises the velocity in the reference plane. Shape r̂²(1 − r̂²). */
    secondHarmonic: DisturbanceComponent,
    /** Asymmetric (skewed) component, cos θ. Shape r̂(1 − r̂²). */
    skew: DisturbanceComponent,
    /** Swirl: tangential velocity Ω R/V · r̂(1 − r̂⁴). */
    swirl: DisturbanceComponent,
    /** Cross-flow along the reference plane seen by a path: C (1 − r̂²). */
    crossFlow: DisturbanceComponent,
    /** Reading shift (magnitude) when this fitting is downstream of the meter. */
    downstreamEffect: DisturbanceComponent,
    ...prov,
  }),
}).superRefine((f, ctx) => {
  if (!f.planar) {
    for (const k of ["secondHarmonic", "skew", "crossFlow"] as const) {
      if (f.disturbance[k].amplitude !== 0) {
        ctx.addIssue({
          code: "custom",
          message: "a fitting without a reference plane has no plane-bound component",
          path: ["disturbance", k, "amplitude"],
        });
      }
    }
  }
});

/** The fittings data file. */
export const FittingsFile: z.ZodType = z.strictObject({
  kind: z.literal("fittings"),
  note: z.string().optional(),
  fittings: z.array(FittingSchema).min(1),
});
