/**
 * Plan stage 1, the pipe: resolve the site's pipe (catalogue or measured), its material, the
 * wall actually used (a thickness-gauge reading wins over the nominal), any lining, and the bore
 * and flow area that the rest of the plan works on.
 *
 * Method: {@link resolvePipe} for the catalogue and tolerances; D_bore = OD − 2·t_wall − 2·Σ t_lining.
 *
 * @module
 */
import { InputError, type Warning } from "../../errors.ts";
import { trace as traceEntry, type TraceEntry } from "../../trace.ts";
import type { Registry } from "../../registry/mod.ts";
import { pipe as resolvePipe, type PipeSpec, type ResolvedPipe } from "../../pipe/mod.ts";
import type { SiteInput } from "../schema.ts";
import { fmtMm, halfWidthTol, PLAN_ASSUMPTIONS } from "./assumptions.ts";

/** Input of {@link planPipe}. */
export interface PipeStageInput {
  /** The site file's pipe section (SI). */
  readonly pipe: SiteInput["pipe"];
  /** The registry the pipe and its materials are read from. */
  readonly registry: Registry;
}

/** A lining layer as the plan uses it: thickness m, sound speed m/s. */
export interface PlannedLining {
  /** Registry material id. */
  readonly material: string;
  /** Thickness, m. */
  readonly thickness: number;
  /** Longitudinal sound speed, m/s. */
  readonly soundSpeed: number;
  /** True when the site file states the sound speed. */
  readonly overridden: boolean;
}

/** Output of {@link planPipe}: every length in m, speeds in m/s. */
export interface PipeStage {
  /** The resolved catalogue or measured pipe. */
  readonly rp: ResolvedPipe;
  /** The wall material's registry record. */
  readonly mat: ReturnType<Registry["material"]>;
  /** The wall material id. */
  readonly materialId: string;
  /** Wall longitudinal sound speed, m/s. */
  readonly wallL: number;
  /** Wall shear sound speed, m/s (undefined when the material has none). */
  readonly wallS: number | undefined;
  /** Wall thickness used, m. */
  readonly wallThickness: number;
  /** Lining layers, innermost last. */
  readonly lining: PlannedLining[];
  /** Inside diameter of the wall, m. */
  readonly insideDiameter: number;
  /** Bore inside any lining, m. */
  readonly bore: number;
  /** Flow area π/4·D_bore², m². */
  readonly area: number;
  /** Warnings raised by this stage, in order. */
  readonly warnings: Warning[];
  /** Trace entries of this stage, in order. */
  readonly trace: TraceEntry[];
}

/**
 * Resolve the site's pipe into the geometry and wall the plan uses.
 *
 * @param input the pipe section of a site (SI) and the registry
 * @returns the resolved pipe, wall, lining, bore (m) and area (m²) with warnings and trace
 * @throws {InputError} a measured pipe without material, a wall beyond the outside radius, or a
 *   lining that fills the bore
 * @example
 * ```ts
 * import { planPipe } from "./pipe.ts";
 * import { defaultRegistry } from "../../registry/mod.ts";
 * const s = planPipe({
 *   pipe: { geometry: "catalogue", standard: "ASME B36.10M", nps: "8", schedule: "40", material: "carbon-steel" },
 *   registry: defaultRegistry(),
 * } as unknown as Parameters<typeof planPipe>[0]);
 * // NPS 8 Sch 40: OD 219.1 mm, wall 8.18 mm (ASME B36.10M)
 * if (Math.abs(s.bore - 0.20274) > 1e-5) throw new Error(String(s.bore));
 * ```
 */
export function planPipe(input: PipeStageInput): PipeStage {
  const sp = input.pipe;
  const reg = input.registry;
  const warnings: Warning[] = [];
  const tr: TraceEntry[] = [];
  const addTrace = (entries: readonly TraceEntry[] | undefined) => {
    if (entries) { for (const e of entries) tr.push(e); }
  };
  const liningIn = sp.lining
    ? [{ material: sp.lining.material, thickness: sp.lining.thickness }]
    : undefined;
  let spec: PipeSpec;
  if (sp.geometry === "measured") {
    if (!sp.material) {
      throw new InputError("pipe.material", "nothing", "a material id for a measured pipe");
    }
    spec = {
      outsideDiameter: sp.outsideDiameter,
      circumference: sp.circumference,
      tapeThickness: sp.tapeThickness,
      wallThickness: sp.wallThickness!,
      material: sp.material,
      lining: liningIn,
      uncertainty: {
        outsideDiameter: sp.outsideDiameter !== undefined
          ? PLAN_ASSUMPTIONS.caliperHalfWidth
          : undefined,
        circumference: sp.circumference !== undefined ? PLAN_ASSUMPTIONS.tapeHalfWidth : undefined,
        wallThickness: PLAN_ASSUMPTIONS.gaugeHalfWidth,
      },
    };
  } else {
    spec = {
      standard: sp.standard!,
      nps: sp.nps!,
      schedule: sp.schedule!,
      material: sp.material,
      lining: liningIn,
    };
  }
  const pipeWarnings: Warning[] = [];
  const rp: ResolvedPipe = resolvePipe(spec, { registry: reg, warnings: pipeWarnings });
  warnings.push(...pipeWarnings);
  addTrace(rp.trace);
  const materialId = sp.material ?? rp.material;
  const mat = reg.material(materialId);
  addTrace(mat.trace);
  const wallL = sp.wallSoundSpeed ?? mat.longitudinal;
  const wallS = sp.wallShearSpeed ?? mat.shear;
  if (sp.wallSoundSpeed !== undefined) {
    tr.push(
      traceEntry("wall longitudinal sound speed (site override)", wallL, "m/s", "site", "input"),
    );
  }
  if (sp.wallShearSpeed !== undefined) {
    tr.push(traceEntry("wall shear sound speed (site override)", wallS!, "m/s", "site", "input"));
  }
  let wallThickness = rp.wallThickness;
  if (sp.measuredWallThickness !== undefined) {
    const tolerance = halfWidthTol(rp.tolerances?.wallThickness);
    const diff = sp.measuredWallThickness - rp.wallThickness;
    if (tolerance !== undefined && Math.abs(diff) > tolerance) {
      warnings.push({
        code: "wall-differs",
        message: `measured wall ${fmtMm(sp.measuredWallThickness)} differs from the nominal ` +
          `${fmtMm(rp.wallThickness)} by more than its tolerance: the measured value is used`,
      });
    }
    wallThickness = sp.measuredWallThickness;
    tr.push(
      traceEntry(
        "wall thickness (thickness-gauge reading)",
        wallThickness,
        "m",
        "site",
        "measured",
      ),
    );
  }
  if (!(wallThickness < rp.outsideDiameter / 2)) {
    throw new InputError(
      "pipe.measuredWallThickness",
      fmtMm(wallThickness),
      "less than the outside radius",
    );
  }
  const lining = rp.lining.map((l, i) => {
    const override = i === 0 ? sp.lining?.soundSpeed : undefined;
    let c = override;
    if (c === undefined) {
      const lm = reg.material(l.material);
      addTrace(lm.trace);
      c = lm.longitudinal;
    } else tr.push(traceEntry("lining sound speed (site override)", c, "m/s", "site", "input"));
    return {
      material: l.material,
      thickness: l.thickness,
      soundSpeed: c,
      overridden: override !== undefined,
    };
  });
  const insideDiameter = rp.outsideDiameter - 2 * wallThickness;
  const bore = insideDiameter - 2 * lining.reduce((s, l) => s + l.thickness, 0);
  if (!(bore > 0)) {
    throw new InputError(
      "pipe.lining.thickness",
      fmtMm(lining[0]?.thickness ?? 0),
      "a lining thinner than the inside radius",
    );
  }
  const area = Math.PI / 4 * bore * bore;
  return {
    rp,
    mat,
    materialId,
    wallL,
    wallS,
    wallThickness,
    lining,
    insideDiameter,
    bore,
    area,
    warnings,
    trace: tr,
  };
}
