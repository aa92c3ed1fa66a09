/**
 * The site plan: one validated site in, a traced plan out.
 *
 * pipe (catalogue or measured) → liquid properties at operating conditions → Snell chain per
 * mounting (spacing, search window, transit times, Δt at each flow, resolvability at minimum
 * flow, wall-borne signal, signal budget) → Reynolds number and profile factor per operating
 * point → straight run, common-practice and model-ranked positions → GUM uncertainty budget at
 * each operating point, Monte Carlo (JCGM 101) beside it → a verdict on the target and what
 * would reach it. Every constant used is listed in `trace` with its source and basis.
 *
 * @module
 */
import { InputError, NoPhysicalAnswerError, type Warning } from "../errors.ts";
import { trace as traceEntry, type TraceEntry } from "../trace.ts";
import { defaultRegistry, type Registry } from "../registry/mod.ts";
import { type ClampOnPath, type SearchWindow, techniqueScreening } from "../acoustics/mod.ts";
import { gumPropagate, monteCarlo, type UncertainInput } from "../uncertainty/mod.ts";
import { flowModel, MODEL_INPUTS } from "./model.ts";
import type { SiteInput } from "./schema.ts";

export { PLAN_ASSUMPTIONS } from "./stages/assumptions.ts";
import { ASSUMPTION_TEXT, PLAN_ASSUMPTIONS } from "./stages/assumptions.ts";
import { planPipe } from "./stages/pipe.ts";
import { planLiquid } from "./stages/liquid.ts";
import { planOperatingPoints } from "./stages/points.ts";
import { planTransducer } from "./stages/transducer.ts";
import { planStraightRun } from "./stages/run.ts";
import { planMountings } from "./stages/mountings.ts";

/** Options of {@link planSite}. */
export interface PlanOptions {
  /** Registry to use (default: the bundled one). */
  readonly registry?: Registry;
  /** Monte Carlo beside GUM: `false` to skip; default 1e5 draws, seed 1. */
  readonly monteCarlo?: false | { readonly draws?: number; readonly seed?: number };
}

/** One operating point of the plan. */
export interface OperatingPoint {
  /** `minimum`, `design` or `maximum`. */
  readonly label: "minimum" | "design" | "maximum";
  /** Volume flow rate, m³/s. */
  readonly flowRate: number;
  /** Area-mean velocity, m/s. */
  readonly meanVelocity: number;
  /** Reynolds number on the bore. */
  readonly reynolds: number;
  /** Flow regime. */
  readonly regime: string;
  /** Profile factor (area mean / path mean), diametral path. */
  readonly profileFactor: number;
  /** Half-width of the spread between profile models. */
  readonly profileFactorSpread: number;
  /** Path-averaged axial velocity, m/s. */
  readonly pathVelocity: number;
  /** Darcy friction factor (Colebrook–White). */
  readonly frictionFactor: number;
}

/** Transit times of one mounting at one operating point. */
export interface MountingTimes {
  /** Operating point label. */
  readonly label: OperatingPoint["label"];
  /** Upstream transit time, s. */
  readonly upstream: number;
  /** Downstream transit time, s. */
  readonly downstream: number;
  /** Δt, s. */
  readonly deltaT: number;
}

/** One mounting (traverse count) of the plan. */
export interface MountingPlan {
  /** Crossings of the bore. */
  readonly traverses: number;
  /** Mounting letter where the trade has one (Z 1, V 2, W 4), else `N-traverse`. */
  readonly name: string;
  /** Spacing between beam entry and exit on the outer surface, m. */
  readonly spacing: number;
  /** Distance between the housings' reference marks, m (when the wedge geometry is known). */
  readonly referenceMarkDistance?: number;
  /** Liquid angle from the wall normal, rad. */
  readonly fluidAngle: number;
  /** Wall angle, rad. */
  readonly wallAngle: number;
  /** Angles in the lining layers, rad. */
  readonly liningAngles: readonly number[];
  /** Wall mode the spacing is for. */
  readonly wallMode: string;
  /** Modes considered, with their role. */
  readonly modes: ClampOnPath["modes"];
  /** Liquid path length, m. */
  readonly fluidPathLength: number;
  /** Zero-flow times: liquid, wall, lining, total, s. */
  readonly fluidTime: number;
  /** Time in the wall, in and out, s. */
  readonly wallTime: number;
  /** Time in the lining, in and out, s. */
  readonly liningTime: number;
  /** Zero-flow arrival time without fixed delays, s. */
  readonly totalTime: number;
  /** Search window. */
  readonly searchWindow: SearchWindow;
  /** Transit times at each operating point. */
  readonly times: readonly MountingTimes[];
  /** Smallest path velocity resolvable for the timing offset, m/s. */
  readonly minimumResolvableVelocity: number;
  /** Timing offset / Δt at minimum flow. */
  readonly offsetFraction: number;
  /** Δt at minimum flow ≥ resolvableMultiple × timing offset. */
  readonly resolvableAtMinimum: boolean;
  /** Wall-borne signal check. */
  readonly wallBorne: { readonly separation: number; readonly overlaps: boolean };
  /** Signal budget: total dB and rating. */
  readonly signal: { readonly totalDb: number; readonly rating: string };
  /** Spacing across the seasonal temperature range (when given). */
  readonly overTemperature?: readonly {
    /** Liquid temperature, K. */
    readonly temperature: number;
    /** Spacing at that temperature, m. */
    readonly spacing: number;
    /** fluidSoundSpeed */
    readonly fluidSoundSpeed: number;
    /** Zero-flow arrival time without fixed delays, s. */
    readonly totalTime: number;
  }[];
  /** Expanded relative uncertainty per operating point (GUM, k = 2). */
  readonly expandedByPoint: readonly number[];
}

/** A budget line in the plan. */
export interface PlanBudgetLine {
  /** Site name. */
  readonly name: string;
  /** Best estimate (SI). */
  readonly value: number;
  /** SI unit of value. */
  readonly unit: string;
  /** Standard uncertainty (SI). */
  readonly standardUncertainty: number;
  /** Distribution assigned. */
  readonly distribution: string;
  /** Sensitivity coefficient ∂Q/∂x. */
  readonly sensitivity: number;
  /** Relative contribution |c·u| / Q. */
  readonly relativeContribution: number;
  /** Share of the variance. */
  readonly share: number;
  /** Source id. */
  readonly source: string;
  /** Basis of the value. */
  readonly basis: string;
  /**
   * Asymmetric tolerance band only: centre of [x − minus, x + plus] minus x, SI. The GUM row
   * keeps x and u = (plus + minus)/√12 (JCGM 100 §4.3.8); the Monte Carlo draws are centred
   * on x + centreOffset (JCGM 101 §6.4.2.1).
   */
  readonly centreOffset?: number;
}

/** The plan of one site. SI throughout. */
export interface SitePlan {
  /** Site name. */
  readonly name: string;
  /** Short id of the site, for fleets. */
  readonly id?: string;
  /** True for an invented scenario (demo). */
  readonly invented: boolean;
  /** SHA-256 content hash of the reference data the plan was computed from. */
  readonly registryHash: string;
  /** The pipe as planned, SI. */
  readonly pipe: {
    /** Outside diameter, m. */
    readonly outsideDiameter: number;
    /** Wall thickness used, m. */
    readonly wallThickness: number;
    /** Inside diameter of the wall, m. */
    readonly insideDiameter: number;
    /** Diameter of the liquid bore (inside the lining), m. */
    readonly boreDiameter: number;
    /** Wall material id. */
    readonly material: string;
    /** Longitudinal sound speed of the wall, m/s. */
    readonly wallSoundSpeed: number;
    /** Shear sound speed of the wall, m/s. */
    readonly wallShearSpeed?: number;
    /** Lining layers: material, thickness (m), sound speed (m/s). */
    readonly lining: readonly { material: string; thickness: number; soundSpeed: number }[];
    /** What the pipe is: catalogue designation or measured. */
    readonly description: string;
    /** Thickness-gauge reading, m, when given. */
    readonly measuredWallThickness?: number;
  };
  /** The liquid at operating conditions, SI. */
  readonly fluid: {
    /** Liquid id. */
    readonly liquid: string;
    /** Site name. */
    readonly name: string;
    /** Liquid temperature, K. */
    readonly temperature: number;
    /** Absolute pressure, Pa. */
    readonly pressure: number;
    /** Liquid sound speed, m/s. */
    readonly soundSpeed: number;
    /** Half-width of the sound-speed spread, m/s. */
    readonly soundSpeedSpread: number;
    /** Liquid density, kg/m³. */
    readonly density: number;
    /** Kinematic viscosity, m²/s. */
    readonly kinematicViscosity: number;
  };
  /** The transducer pair as planned, SI. */
  readonly transducer: {
    /** Wedge sound speed at the operating temperature, m/s. */
    readonly wedgeSoundSpeed: number;
    /** Beam angle in the wedge, rad. */
    readonly wedgeAngle: number;
    /** Centre frequency, Hz. */
    readonly frequency: number;
    /** Timing resolution, s. */
    readonly timingResolution: number;
    /** Zero offset of Δt, s. */
    readonly zeroOffset: number;
  };
  /** Minimum, design and maximum flow. */
  readonly operatingPoints: readonly OperatingPoint[];
  /** Relative change of the profile factor across the flow range. */
  readonly profileFactorChange: number;
  /** Every mounting evaluated. */
  readonly mountings: readonly MountingPlan[];
  /** Traverse count of the mounting the budget is for. */
  readonly recommendedMounting: number;
  /** Straight-run assessment, when a run is described. */
  readonly straightRun?: {
    /** Straight-run verdict: meets, marginal or short. */
    readonly verdict: string;
    /** Meter position from the upstream fitting, m. */
    readonly position: number;
    /** Whether the position was planned by the site or recommended here. */
    readonly positionSource: "planned" | "recommended";
    /** Straight length upstream of the meter, in diameters. */
    readonly upstreamDiameters: number;
    /** Straight length downstream of the meter, in diameters. */
    readonly downstreamDiameters: number | null;
    /** Upstream length common practice asks, in diameters. */
    readonly requiredUpstream: number;
    /** Downstream length common practice asks, in diameters. */
    readonly requiredDownstream: number;
    /** Common-practice position from the upstream fitting, m. */
    readonly commonPracticePosition: number;
    /** Model-ranked position from the upstream fitting, m. */
    readonly recommendedPosition: number;
    /** Model-ranked path-plane angle, rad. */
    readonly recommendedOrientation: number;
    /** Estimated relative error from the disturbed profile (an estimate). */
    readonly estimatedProfileError: number;
    /** Half-width of that estimate. */
    readonly estimatedProfileErrorSpread: number;
    /** Reasons for the verdict. */
    readonly reasons: readonly string[];
    /** Notes of the ranking and the model. */
    readonly notes: readonly string[];
    /** Estimated error along the run: position (m) and relative error. */
    readonly errorAlongRun: readonly { position: number; error: number }[];
    /** Length of the straight run, m. */
    readonly runLength: number;
    /** Upstream fitting id. */
    readonly upstreamFitting: string;
    /** Downstream fitting id. */
    readonly downstreamFitting: string;
    /** True when the site did not name the downstream fitting and the plan assumed one. */
    readonly downstreamAssumed?: boolean;
  };
  /** Uncertainty budget of the recommended mounting. */
  readonly uncertainty: {
    /** Traverse count the budget is for. */
    readonly mounting: number;
    /** Operating point the budget table is for. */
    readonly operatingPoint: OperatingPoint["label"];
    /** Expanded relative uncertainty (k = 2). */
    readonly expanded: number;
    /** Coverage factor. */
    readonly coverageFactor: number;
    /** Expanded relative uncertainty per operating point. */
    readonly expandedByPoint: readonly { label: string; expanded: number }[];
    /** Budget lines, largest first. */
    readonly budget: readonly PlanBudgetLine[];
    /** Monte Carlo check (JCGM 101) beside GUM. */
    readonly monteCarlo?: {
      /** Number of Monte Carlo draws. */
      readonly draws: number;
      /** Seed of the random stream. */
      readonly seed: number;
      /** Expanded relative uncertainty (k = 2). */
      readonly expanded: number;
      /** 95 % coverage interval of the flow rate, m³/s. */
      readonly interval: readonly [number, number];
    };
  };
  /** Verdict on the target uncertainty, when one is stated. */
  readonly target?: {
    /** Target expanded relative uncertainty (k = 2). */
    readonly uncertainty: number;
    /** Whether the worst expanded uncertainty meets the target. */
    readonly reachable: boolean;
    /** Worst expanded relative uncertainty over the operating points. */
    readonly worstExpanded: number;
    /** Operating point where it is worst. */
    readonly worstPoint: string;
    /** What would reach the target. */
    readonly suggestions: readonly string[];
  };
  /** Which technique the stated solids and gas content favours. */
  readonly technique: { readonly favours: string; readonly reasons: readonly string[] };
  /** Largest contributor to the uncertainty budget. */
  readonly mainLimitation: string;
  /** Every constant and formulation used, with source and basis. */
  readonly trace: readonly TraceEntry[];
  /** Safety and interpretation cautions. */
  readonly cautions: readonly string[];
  /** Warnings (defaults assumed, extrapolations, estimates). */
  readonly warnings: readonly Warning[];
}

/**
 * Plan one site.
 *
 * Method: the composition described in the module text. Measurement model for the budget:
 * Q = k·(1 + ε)·(π/4)·D²·c_w·Δt / (2·sin θ_w·τ) (see ./model.ts), propagated by the GUM law of
 * propagation (jcgm-100-2008) at each operating point, and by Monte Carlo (jcgm-101-2008) at the
 * worst one. Assumptions no site file states are in {@link PLAN_ASSUMPTIONS}, each traced as
 * common practice.
 *
 * @param site a validated site from the site-file reader (SI)
 * @param options registry, Monte Carlo settings
 * @returns the plan (SI), with trace, registry hash, cautions and warnings
 * @throws {InputError} on unknown pipe sizes, materials, liquids or fittings
 * @throws {NoPhysicalAnswerError} beyond a critical angle, or for a boiling liquid
 *
 * @example
 * ```ts
 * import { readSiteText } from "./read.ts";
 * import { planSite } from "./plan.ts";
 * const site = await readSiteText(`
 * name: Example line (invented)
 * pipe: { standard: ASME B36.10M, nps: "8", schedule: "40", material: carbon-steel }
 * fluid: { liquid: water, temperature: 12 degC, pressure: 5 bar }
 * flow: { minimum: 20 L/s, design: 60 L/s, maximum: 90 L/s }
 * transducer: { wedgeSoundSpeed: 2720 m/s, wedgeAngle: 38 deg, frequency: 1 MHz }
 * mountings: [1, 2]
 * `);
 * const plan = planSite(site, { monteCarlo: false });
 * if (!(plan.mountings[1].spacing > plan.mountings[0].spacing)) throw new Error("V wider than Z");
 * ```
 */
export function planSite(site: SiteInput, options: PlanOptions = {}): SitePlan {
  const reg = options.registry ?? defaultRegistry();
  const warnings: Warning[] = site.defaults.map((d) => ({ code: "default", message: d.message }));
  const tr: TraceEntry[] = [];
  const addTrace = (entries: readonly TraceEntry[] | undefined) => {
    if (entries) { for (const e of entries) tr.push(e); }
  };

  // --- pipe --------------------------------------------------------------------------
  const sp = site.pipe;
  const pipeStage = planPipe({ pipe: sp, registry: reg });
  warnings.push(...pipeStage.warnings);
  addTrace(pipeStage.trace);
  const { rp, mat, materialId, wallL, wallS, wallThickness, lining, insideDiameter, bore, area } =
    pipeStage;
  const T = site.fluid.temperature;

  // --- fluid ---------------------------------------------------------------------------
  const fl = site.fluid;
  const liquidStage = planLiquid({ fluid: fl });
  warnings.push(...liquidStage.warnings);
  addTrace(liquidStage.trace);
  const { liq, c, rho, nu, cSpread } = liquidStage;

  // --- transducer ----------------------------------------------------------------------
  const td = site.transducer;
  const tdStage = planTransducer({ transducer: td, temperature: T, registry: reg });
  warnings.push(...tdStage.warnings);
  addTrace(tdStage.trace);
  const { cw, dcwdT, cwHalf, wedgeDensity, wedgeAtt, timingResolution, zeroOffset, timingOffset } =
    tdStage;

  for (const [k, v] of Object.entries(PLAN_ASSUMPTIONS)) {
    const [text, unit] = ASSUMPTION_TEXT[k as keyof typeof PLAN_ASSUMPTIONS];
    tr.push(traceEntry(`plan assumption: ${text}`, v, unit, "common-practice", "common-practice"));
  }

  // --- operating points ----------------------------------------------------------------
  const roughness = sp.roughness ?? mat.roughness ?? 0;
  if (sp.roughness === undefined && mat.roughness === undefined) {
    warnings.push({
      code: "roughness",
      message: `no roughness for ${materialId}: smooth bore assumed`,
    });
  }
  const rr = roughness / bore;
  const pointsStage = planOperatingPoints({ flow: site.flow, bore, area, roughness, nu });
  const { points, profileFactorChange } = pointsStage;
  for (const w of pointsStage.warnings) {
    if (!warnings.some((x) => x.message === w.message)) warnings.push(w);
  }
  addTrace(pointsStage.trace);

  // --- mountings -----------------------------------------------------------------------
  const mStage = planMountings({
    mountings: site.mountings,
    rp,
    wallThickness,
    wallL,
    wallS,
    lining,
    c,
    cw,
    td,
    sp,
    mat,
    cSpread,
    cwHalf,
    dcwdT,
    points,
    timingOffset,
    T,
    fl,
    rho,
    wedgeDensity,
    wedgeAtt,
    reg,
  });
  addTrace(mStage.trace);
  const { mountingPlans, wallTolHalf, odHalf, tolOffsets } = mStage;
  const budgetWarnings = mStage.warnings;
  for (const w of budgetWarnings) {
    if (!warnings.some((x) => x.message === w.message)) warnings.push(w);
  }

  // --- straight run --------------------------------------------------------------------
  // the mounting the run is ranked for: the first usable one by the rule below (V by default)
  const provisional = chooseMounting(mountingPlans);
  const runStage = planStraightRun({
    run: site.run,
    bore,
    relativeRoughness: rr,
    points,
    traverses: provisional.traverses,
    fluidAngle: provisional.fluidAngle,
  });
  warnings.push(...runStage.warnings);
  addTrace(runStage.trace);
  const { straightRun, installHalf, installProvenance } = runStage;

  // --- uncertainty ---------------------------------------------------------------------
  const linThick = lining.reduce((s, l) => s + l.thickness, 0);
  const budgetFor = (m: (typeof mountingPlans)[number], pi: number) => {
    const p = points[pi];
    const dt = m.times[pi].deltaT;
    const path = m.path;
    // uncertainty of the liquid time: fixed delay, plus wall and lining times' own uncertainty
    const uWallTime = path.wallTime *
      Math.hypot(wallTolHalf / wallThickness, (mat.longitudinalSpread ?? 0) / wallL) / Math.sqrt(3);
    const uLinTime = path.liningTime *
      Math.hypot(
        PLAN_ASSUMPTIONS.liningThicknessRelative,
        lining.some((l) => !l.overridden) ? PLAN_ASSUMPTIONS.liningSpeedRelative : 0,
      ) /
      Math.sqrt(3);
    const uTau = Math.hypot(
      PLAN_ASSUMPTIONS.fixedDelayHalfWidth / Math.sqrt(3),
      uWallTime,
      uLinTime,
    );
    const inputs: UncertainInput[] = [
      u(
        "outside diameter",
        rp.outsideDiameter,
        odHalf / Math.sqrt(3),
        "rectangular",
        "m",
        rp.tolerances?.source ?? "common-practice",
        rp.tolerances ? rp.tolerances.basis as UncertainInput["basis"] : "common-practice",
        tolOffsets.outsideDiameter,
      ),
      u(
        "wall thickness",
        wallThickness,
        wallTolHalf / Math.sqrt(3),
        "rectangular",
        "m",
        sp.measuredWallThickness !== undefined
          ? "common-practice"
          : rp.tolerances?.source ?? "common-practice",
        sp.measuredWallThickness !== undefined
          ? "measured"
          : rp.tolerances
          ? rp.tolerances.basis as UncertainInput["basis"]
          : "common-practice",
        tolOffsets.wallThickness,
      ),
      u(
        "lining thickness",
        linThick,
        PLAN_ASSUMPTIONS.liningThicknessRelative * linThick / Math.sqrt(3),
        "rectangular",
        "m",
        "common-practice",
        "common-practice",
      ),
      u(
        "wedge sound speed",
        cw,
        Math.hypot(cwHalf, Math.abs(dcwdT) * PLAN_ASSUMPTIONS.wedgeTemperatureHalfWidth) /
          Math.sqrt(3),
        "rectangular",
        "m/s",
        td.wedgeMaterial ? reg.material(td.wedgeMaterial).source : "common-practice",
        td.wedgeMaterial ? "recalled" : "common-practice",
      ),
      u(
        "wedge angle",
        td.wedgeAngle,
        PLAN_ASSUMPTIONS.wedgeAngleHalfWidth / Math.sqrt(3),
        "rectangular",
        "rad",
        "common-practice",
        "common-practice",
      ),
      u(
        "transit-time difference (zero offset, resolution)",
        dt,
        Math.hypot(zeroOffset / Math.sqrt(3), timingResolution / Math.sqrt(12)),
        "normal",
        "s",
        "common-practice",
        "input",
      ),
      u(
        "time in the liquid (fixed delays)",
        path.fluidTime,
        uTau,
        "normal",
        "s",
        "common-practice",
        "common-practice",
      ),
      u(
        "profile factor (model spread)",
        p.profileFactor,
        p.profileFactorSpread / Math.sqrt(3),
        "rectangular",
        "",
        "common-practice",
        "computed",
      ),
      u(
        "installation effect (estimate)",
        0,
        installHalf / Math.sqrt(3),
        "rectangular",
        "",
        installProvenance.source,
        installProvenance.basis,
      ),
    ];
    return { inputs, result: gumPropagate(flowModel, inputs) };
  };
  for (const m of mountingPlans) {
    (m as unknown as { expandedByPoint: number[] }).expandedByPoint = points.map((_p, i) =>
      budgetFor(m, i).result.relativeExpanded ?? Infinity
    );
  }
  const chosen = chooseMounting(mountingPlans);
  const byPoint = chosen.expandedByPoint;
  let worstIdx = 0;
  byPoint.forEach((x, i) => {
    if (x > byPoint[worstIdx]) worstIdx = i;
  });
  const reportIdx = points.findIndex((p) => p.label === "design") >= 0
    ? points.findIndex((p) => p.label === "design")
    : worstIdx;
  const { inputs: repInputs, result: rep } = budgetFor(chosen, reportIdx);
  const Q = rep.value;
  const budget: PlanBudgetLine[] = rep.budget.map((b) => {
    const inp = repInputs.find((x) => x.name === b.name)!;
    return {
      name: b.name,
      value: b.value,
      unit: inp.unit ?? "",
      standardUncertainty: b.standardUncertainty,
      distribution: b.distribution,
      sensitivity: b.sensitivity,
      relativeContribution: b.contribution / Math.abs(Q),
      share: b.share,
      source: inp.source ?? "",
      basis: inp.basis ?? "",
      ...(inp.centreOffset ? { centreOffset: inp.centreOffset } : {}),
    };
  });
  let mc: SitePlan["uncertainty"]["monteCarlo"];
  if (options.monteCarlo !== false) {
    const draws = options.monteCarlo?.draws ?? 100_000;
    const seed = options.monteCarlo?.seed ?? 1;
    const r = monteCarlo(flowModel, repInputs, { draws, seed });
    mc = {
      draws: r.draws,
      seed: r.seed,
      expanded: (r.interval[1] - r.interval[0]) / 2 / Math.abs(Q),
      interval: r.interval,
    };
  }
  tr.push(
    traceEntry(
      "formulation: GUM law of propagation",
      "JCGM 100:2008",
      "",
      "jcgm-100-2008",
      "transcribed",
    ),
  );
  if (mc) {
    tr.push(
      traceEntry(
        "formulation: Monte Carlo propagation",
        "JCGM 101:2008",
        "",
        "jcgm-101-2008",
        "transcribed",
      ),
    );
  }

  // --- verdict -------------------------------------------------------------------------
  let target: SitePlan["target"];
  const worst = byPoint[worstIdx];
  if (site.targetUncertainty !== undefined) {
    const reachable = worst <= site.targetUncertainty;
    const suggestions: string[] = [];
    if (!reachable) {
      const { result: wr } = budgetFor(chosen, worstIdx);
      const top = wr.budget.slice(0, 3).map((b) => b.name);
      for (const name of top) {
        suggestions.push(...suggestionFor(name, straightRun, chosen.traverses));
      }
      for (const m of mountingPlans) {
        if (m !== chosen && Math.max(...m.expandedByPoint) <= site.targetUncertainty) {
          suggestions.push(`the ${m.name} mounting (${m.traverses} traverses) reaches the target`);
        }
      }
      if (suggestions.length === 0) suggestions.push("no single change found: review the budget");
    }
    target = {
      uncertainty: site.targetUncertainty,
      reachable,
      worstExpanded: worst,
      worstPoint: points[worstIdx].label,
      suggestions: [...new Set(suggestions)],
    };
  }
  const technique = techniqueScreening({
    solidsFraction: site.content?.solids,
    gasFraction: site.content?.gas,
  });
  if (technique.favours === "doppler") {
    warnings.push({
      code: "technique",
      message: `transit time is unlikely to work here: ${technique.reasons.join("; ")}`,
    });
  }
  const mainLimitation = budget[0]?.name ?? "";

  // --- cautions ------------------------------------------------------------------------
  const cautions = cautionsFor(T, fl.pressure, fl.liquid, lining.length > 0);

  const { path: _p, inputs: _i, ...chosenRest } = chosen;
  void chosenRest;
  return {
    name: site.name,
    id: site.id,
    invented: site.invented ?? false,
    registryHash: reg.hash,
    pipe: {
      outsideDiameter: rp.outsideDiameter,
      wallThickness,
      insideDiameter,
      boreDiameter: bore,
      material: materialId,
      wallSoundSpeed: wallL,
      wallShearSpeed: wallS,
      lining: lining.map(({ material, thickness, soundSpeed }) => ({
        material,
        thickness,
        soundSpeed,
      })),
      description: rp.origin === "catalogue"
        ? `${rp.standard} NPS ${rp.nps} schedule ${rp.schedule}`
        : "measured pipe",
      measuredWallThickness: sp.measuredWallThickness,
    },
    fluid: {
      liquid: fl.liquid,
      name: liq.name,
      temperature: T,
      pressure: fl.pressure,
      soundSpeed: c,
      soundSpeedSpread: cSpread,
      density: rho,
      kinematicViscosity: nu,
    },
    transducer: {
      wedgeSoundSpeed: cw,
      wedgeAngle: td.wedgeAngle,
      frequency: td.frequency,
      timingResolution,
      zeroOffset,
    },
    operatingPoints: points,
    profileFactorChange,
    mountings: mountingPlans.map(({ path: _x, inputs: _y, ...m }) => m),
    recommendedMounting: chosen.traverses,
    straightRun,
    uncertainty: {
      mounting: chosen.traverses,
      operatingPoint: points[reportIdx].label,
      expanded: rep.relativeExpanded ?? Infinity,
      coverageFactor: rep.coverageFactor,
      expandedByPoint: points.map((p, i) => ({ label: p.label, expanded: byPoint[i] })),
      budget,
      monteCarlo: mc,
    },
    target,
    technique: { favours: technique.favours, reasons: technique.reasons },
    mainLimitation,
    trace: dedupeTrace(tr),
    cautions,
    warnings,
  };
}

function u(
  name: string,
  value: number,
  standardUncertainty: number,
  distribution: UncertainInput["distribution"],
  unit: string,
  source: string,
  basis: UncertainInput["basis"],
  centreOffset = 0,
): UncertainInput {
  const input = { name, value, standardUncertainty, distribution, unit, source, basis };
  return centreOffset === 0 ? input : { ...input, centreOffset };
}

/**
 * The mounting the budget is for (common practice): among mountings whose signal is not weak and
 * whose wall-borne signal does not overlap, those resolvable at minimum flow (else all usable
 * ones) whose worst expanded uncertainty is within 5 % of the lowest; of these, an even traverse
 * count first (both transducers on one side, and the two bore crossings cancel a transverse flow
 * component), then the fewest traverses (the strongest signal). If none is usable, the first given.
 */
function chooseMounting<T extends MountingPlan>(plans: readonly T[]): T {
  if (plans.length === 0) throw new InputError("mountings", "none", "at least one traverse count");
  const usable = plans.filter((m) => m.signal.rating !== "weak" && !m.wallBorne.overlaps);
  if (usable.length === 0) return plans[0];
  const resolvable = usable.filter((m) => m.resolvableAtMinimum);
  const pool = resolvable.length ? resolvable : usable;
  const worst = (m: T) => (m.expandedByPoint.length ? Math.max(...m.expandedByPoint) : 0);
  const lowest = Math.min(...pool.map(worst));
  const good = pool.filter((m) => worst(m) <= lowest * 1.05);
  return [...good].sort((a, b) =>
    (a.traverses % 2) - (b.traverses % 2) || a.traverses - b.traverses
  )[0];
}

function suggestionFor(
  name: string,
  run: SitePlan["straightRun"],
  traverses: number,
): string[] {
  if (name.startsWith("installation")) {
    const s = ["a longer straight run upstream, or a location further from the upstream fitting"];
    if (run && run.position !== run.recommendedPosition) {
      s.push(
        `move to the recommended position ${
          run.recommendedPosition.toFixed(2)
        } m from the upstream fitting`,
      );
    }
    return s;
  }
  if (name.startsWith("wall thickness")) return ["measure the wall with a thickness gauge"];
  if (name.startsWith("outside diameter")) return ["measure the circumference with a tape"];
  if (name.startsWith("lining")) {
    return ["measure the lining thickness (for example at a cut or a fitting)"];
  }
  if (name.startsWith("transit-time difference")) {
    return [`more traverses than ${traverses} (a longer path gives a larger Δt), or finer timing`];
  }
  if (name.startsWith("profile factor")) {
    return ["a multi-path arrangement, or a site with Reynolds number out of transition"];
  }
  if (name.startsWith("wedge")) return ["check the transducers' wedge data and temperature"];
  if (name.startsWith("time in the liquid")) return ["zero the fixed delays on site"];
  return [];
}

function cautionsFor(T: number, p: number, liquid: string, lined: boolean): string[] {
  const out = [
    "Plans are estimates: installation-effect figures come from a model, not a calibration.",
    "Follow the site's permit-to-work system, local codes and licensed practice; they take precedence over this plan.",
  ];
  if (T > 333.15) {
    out.push(
      `Hot line (${
        (T - 273.15).toFixed(0)
      } °C): burn hazard; let lagging and surfaces be checked before contact.`,
    );
  }
  if (T < 273.15 + 5) out.push("Cold line: condensation and ice; frost-burn hazard on bare metal.");
  if (p > 1e6) {
    out.push(
      `Pressurised line (${
        (p / 1e5).toFixed(1)
      } bar absolute): never loosen fittings or tapping points.`,
    );
  }
  out.push(
    "Lifting insulation or lagging may expose hot surfaces or hazardous fibres: have it surveyed first.",
  );
  out.push(
    "Pits, chambers and vaults are confined spaces: gas test, permit and standby person first.",
  );
  if (!["water", "seawater"].includes(liquid)) {
    out.push(
      `Process liquid (${liquid}): check the hazardous-area classification and use certified equipment.`,
    );
  }
  if (lined) {
    out.push("Lined pipe: do not cut or drill to check the lining; use records or a fitting.");
  }
  return out;
}

function dedupeTrace(tr: readonly TraceEntry[]): TraceEntry[] {
  const seen = new Set<string>();
  const out: TraceEntry[] = [];
  for (const t of tr) {
    const k = `${t.quantity}|${t.value}|${t.source}`;
    if (seen.has(k)) continue;
    seen.add(k);
    out.push(t);
  }
  return out;
}

/** Re-exported for reports: the model's input names, in order. */
export const PLAN_MODEL_INPUTS: readonly string[] = MODEL_INPUTS;
void NoPhysicalAnswerError;
