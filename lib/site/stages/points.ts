/**
 * Plan stage 4, the operating points: minimum, design (when stated) and maximum flow, each with
 * its mean velocity, Reynolds number, profile factor and Colebrook friction factor.
 *
 * Method: Re = V·D/ν; profile factor {@link profileFactorEstimate} (power law with Nikuradse n,
 * spread over models); friction factor by Colebrook. Both extrapolate with a warning.
 *
 * @module
 */
import type { Warning } from "../../errors.ts";
import { trace as traceEntry, type TraceEntry } from "../../trace.ts";
import { frictionFactor, profileFactorEstimate, reynoldsNumber } from "../../flow/mod.ts";
import type { SiteInput } from "../schema.ts";
import type { OperatingPoint } from "../plan.ts";

/** Input of {@link planOperatingPoints}: lengths m, ν m²/s. */
export interface PointsStageInput {
  /** The site file's flow section (m³/s or m/s). */
  readonly flow: SiteInput["flow"];
  /** Bore, m. */
  readonly bore: number;
  /** Flow area, m². */
  readonly area: number;
  /** Absolute roughness of the bore, m. */
  readonly roughness: number;
  /** Kinematic viscosity, m²/s. */
  readonly nu: number;
}

/** Output of {@link planOperatingPoints}. */
export interface PointsStage {
  /** Operating points, minimum first, maximum last. */
  readonly points: OperatingPoint[];
  /** Relative change of the profile factor over the points, dimensionless. */
  readonly profileFactorChange: number;
  /** Warnings from the flow correlations (may repeat; the caller drops repeats). */
  readonly warnings: Warning[];
  /** Trace entries of this stage. */
  readonly trace: TraceEntry[];
}

/**
 * The operating points of a site.
 *
 * @param input flow section, bore (m), area (m²), roughness (m), ν (m²/s)
 * @returns the points and the relative change of profile factor across them
 * @example
 * ```ts
 * import { planOperatingPoints } from "./points.ts";
 * const D = 0.2;
 * const s = planOperatingPoints({
 *   flow: { quantity: "velocity", minimum: 0.5, maximum: 2 },
 *   bore: D, area: Math.PI / 4 * D * D, roughness: 0, nu: 1e-6,
 * } as unknown as Parameters<typeof planOperatingPoints>[0]);
 * // Re = V·D/ν = 0.5 · 0.2 / 1e-6 = 1e5 (definition)
 * if (Math.abs(s.points[0].reynolds - 1e5) > 1e-6) throw new Error();
 * ```
 */
export function planOperatingPoints(input: PointsStageInput): PointsStage {
  const { flow, bore, area, roughness, nu } = input;
  const rr = roughness / bore;
  const flows: { label: OperatingPoint["label"]; q: number }[] = [];
  const toFlow = (x: number) => flow.quantity === "velocity" ? x * area : x;
  flows.push({ label: "minimum", q: toFlow(flow.minimum) });
  if (flow.design !== undefined) flows.push({ label: "design", q: toFlow(flow.design) });
  flows.push({ label: "maximum", q: toFlow(flow.maximum) });
  const warnings: Warning[] = [];
  const points: OperatingPoint[] = flows.map(({ label, q }) => {
    const V = q / area;
    const re = reynoldsNumber(V, bore, nu);
    const est = profileFactorEstimate(re, {
      relativeRoughness: rr,
      extrapolate: true,
      warnings,
    });
    const f = frictionFactor(re, rr, "colebrook", { extrapolate: true, warnings });
    return {
      label,
      flowRate: q,
      meanVelocity: V,
      reynolds: re,
      regime: est.regime,
      profileFactor: est.factor,
      profileFactorSpread: est.spread,
      pathVelocity: V / est.factor,
      frictionFactor: f,
    };
  });
  const kValues = points.map((p) => p.profileFactor);
  const profileFactorChange = (Math.max(...kValues) - Math.min(...kValues)) /
    ((Math.max(...kValues) + Math.min(...kValues)) / 2);
  const trace = [
    traceEntry(
      "formulation: profile factor (power law, Nikuradse n; spread over models)",
      "lib/flow",
      "",
      "common-practice",
      "computed",
    ),
  ];
  return { points, profileFactorChange, warnings, trace };
}

/** Input of {@link boreRoughness}. */
export interface RoughnessStageInput {
  /** Roughness stated in the site file, m. */
  readonly stated: number | undefined;
  /** Roughness of the wall material in the registry, m. */
  readonly material: number | undefined;
  /** Wall material id (for the warning). */
  readonly materialId: string;
  /** Bore, m. */
  readonly bore: number;
}

/** Output of {@link boreRoughness}. */
export interface RoughnessStage {
  /** Absolute roughness, m. */
  readonly roughness: number;
  /** Relative roughness ε/D. */
  readonly relativeRoughness: number;
  /** A warning when neither the site nor the registry gives one (smooth bore assumed). */
  readonly warnings: Warning[];
  /** Trace of this stage (none). */
  readonly trace: TraceEntry[];
}

/**
 * The bore's roughness: the site's, else the material's, else a smooth bore with a warning.
 *
 * @param input stated and material roughness (m), material id, bore (m)
 * @returns absolute (m) and relative roughness
 * @example
 * ```ts
 * import { boreRoughness } from "./points.ts";
 * const r = boreRoughness({ stated: undefined, material: 4.5e-5, materialId: "x", bore: 0.2 });
 * // ε/D = 45 µm / 200 mm
 * if (Math.abs(r.relativeRoughness - 2.25e-4) > 1e-15 || r.warnings.length) throw new Error();
 * ```
 */
export function boreRoughness(input: RoughnessStageInput): RoughnessStage {
  const roughness = input.stated ?? input.material ?? 0;
  const warnings: Warning[] = [];
  if (input.stated === undefined && input.material === undefined) {
    warnings.push({
      code: "roughness",
      message: `no roughness for ${input.materialId}: smooth bore assumed`,
    });
  }
  return { roughness, relativeRoughness: roughness / input.bore, warnings, trace: [] };
}
