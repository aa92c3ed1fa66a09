/**
 * Cause fitting for field reconciliation: a forward model of the zero-flow total transit time
 * per traverse count, one-parameter candidate causes (temperature, fixed delay, wedge data,
 * wall, lining, deposits, gas), each fitted to every reading at once and ranked by misfit
 * plus plausibility.
 *
 * Why two traverse counts help: the zero-flow total time of an N-traverse path is
 * t_N = a + N·b, with a = fixed delay + wall + lining (+ wedge) times, independent of N, and
 * b = D / (c·cos θ) the time per crossing of the bore. A fixed-delay error moves a only; a
 * liquid sound-speed error (temperature, gas, another liquid) moves b only; a wall or wedge
 * error moves both in a ratio fixed by the geometry. One reading cannot tell them apart; two
 * traverse counts (Z and V, or V and W) can. See docs/readings.md.
 *
 * @module
 */
import { clampOnPath, type LiningLayer, type WedgeGeometry } from "../acoustics/mod.ts";

/** The planned geometry and media, SI; the base every cause perturbs. */
export interface ForwardSetup {
  /** Outside diameter, m. */
  readonly outsideDiameter: number;
  /** Wall thickness, m. */
  readonly wallThickness: number;
  /** Wall longitudinal sound speed, m/s. */
  readonly wallSoundSpeed: number;
  /** Wall shear sound speed, m/s. */
  readonly wallShearSpeed?: number;
  /** Lining layers, outermost first. */
  readonly lining: readonly LiningLayer[];
  /** Liquid sound speed at the planned temperature, m/s. */
  readonly fluidSoundSpeed: number;
  /** Wedge sound speed, m/s. */
  readonly wedgeSoundSpeed: number;
  /** Wedge angle from the wall normal, rad. */
  readonly wedgeAngle: number;
  /** Wedge geometry, when known. */
  readonly wedge?: WedgeGeometry;
  /** Change of the wedge sound speed with temperature, m/s/K. */
  readonly wedgeSpeedPerKelvin: number;
  /** Liquid sound speed at the planned temperature + dT (K), m/s; throws outside its range. */
  readonly soundSpeedAt: (dT: number) => number;
}

/** One zero-flow reading, SI. */
export interface TimeReading {
  /** Crossings of the bore. */
  readonly traverses: number;
  /** Measured total transit time, s. */
  readonly totalTime: number;
  /** Fixed delay stated for the transducer pair, s. */
  readonly fixedDelay: number;
}

/** Names of the causes considered within the declared liquid. */
export type CauseName =
  | "temperature"
  | "fixed-delay"
  | "wedge"
  | "wall"
  | "lining"
  | "deposits"
  | "gas"
  | "other-liquid"
  | "zero-offset";

/** A perturbation of the setup: the changed setup and an extra delay, s. */
export interface Perturbed {
  readonly setup: ForwardSetup;
  readonly delay: number;
}

/** A one-parameter cause. */
export interface CauseModel {
  /** Cause name. */
  readonly cause: CauseName;
  /** SI unit of the parameter. */
  readonly unit: string;
  /** Finite-difference step, in the parameter's unit. */
  readonly step: number;
  /** Plausible size of the change (about two standard deviations), in the parameter's unit. */
  readonly bound: number;
  /** Extra score for causes that are less likely a priori (common practice). */
  readonly penalty: number;
  /** Smallest allowed value. */
  readonly min: number;
  /** Largest allowed value. */
  readonly max: number;
  /** The setup with the change applied. */
  readonly apply: (base: ForwardSetup, p: number) => Perturbed;
}

/** A fitted cause. */
export interface FittedCause {
  /** Cause name. */
  readonly cause: CauseName;
  /** Fitted change, SI (see unit). */
  readonly value: number;
  /** SI unit of value. */
  readonly unit: string;
  /** Root-mean-square time residual after the fit, s (Infinity when no path exists). */
  readonly rmsResidual: number;
  /** χ² of the residuals against the reading's standard deviation. */
  readonly chiSquare: number;
  /** |value| / plausible bound. */
  readonly relativeSize: number;
  /** Ranking score: χ² + (2·value/bound)² + penalty; smaller is likelier. */
  readonly score: number;
  /** The residuals fit the readings (rms ≤ 2 standard deviations) and the size is plausible. */
  readonly plausible: boolean;
}

/**
 * Assumptions of the fit (common practice, project choices): the standard deviation of one
 * zero-flow total-time reading, and the sound speed of a deposit layer.
 */
export const FIT_ASSUMPTIONS = {
  /** Standard deviation of one total-time reading, s (averaged readings resolve tens of ns). */
  readingTimeSd: 30e-9,
  /** Longitudinal sound speed of a scale or deposit layer, m/s (assumed, order of magnitude). */
  depositSoundSpeed: 2000,
} as const;

/**
 * Zero-flow total times predicted for the readings: stated fixed delay + extra delay + the
 * clamp-on path's total time (wall, lining, wedge when its geometry is known, liquid).
 *
 * @param p the perturbed setup
 * @param readings the readings (traverse counts and stated delays)
 * @returns predicted times, s (throws where no path exists)
 *
 * @example
 * ```ts
 * import { predictTimes } from "./reconcile_fit.ts";
 * const setup = { outsideDiameter: 0.1683, wallThickness: 0.00711, wallSoundSpeed: 5900,
 *   wallShearSpeed: 3230,
 *   lining: [], fluidSoundSpeed: 1482, wedgeSoundSpeed: 2720, wedgeAngle: 0.66,
 *   wedgeSpeedPerKelvin: 0, soundSpeedAt: () => 1482 };
 * const [z, v] = predictTimes({ setup, delay: 0 }, [
 *   { traverses: 1, totalTime: 0, fixedDelay: 0 }, { traverses: 2, totalTime: 0, fixedDelay: 0 }]);
 * if (!(v > z)) throw new Error("a V path is longer than a Z path");
 * ```
 */
export function predictTimes(
  p: { readonly setup: ForwardSetup; readonly delay: number },
  readings: readonly TimeReading[],
): number[] {
  const s = p.setup;
  const cache = new Map<number, number>();
  return readings.map((r) => {
    let t = cache.get(r.traverses);
    if (t === undefined) {
      t = clampOnPath({
        outsideDiameter: s.outsideDiameter,
        wallThickness: s.wallThickness,
        wallSoundSpeed: s.wallSoundSpeed,
        wallShearSpeed: s.wallShearSpeed,
        lining: s.lining,
        fluidSoundSpeed: s.fluidSoundSpeed,
        wedgeSoundSpeed: s.wedgeSoundSpeed,
        wedgeAngle: s.wedgeAngle,
        traverses: r.traverses,
        wedge: s.wedge,
      }).totalTime;
      cache.set(r.traverses, t);
    }
    return r.fixedDelay + p.delay + t;
  });
}

/**
 * The candidate causes within the declared liquid, with their plausible bounds.
 *
 * @param base the planned setup
 * @param bounds plausible sizes: temperature (K), fixed delay (s), relative wedge speed,
 *   wall (m), relative lining, deposit (m), relative gas speed drop
 * @returns the cause models (lining only when the pipe is lined)
 *
 * @example
 * ```ts
 * import { causeModels } from "./reconcile_fit.ts";
 * const setup = { outsideDiameter: 0.1683, wallThickness: 0.00711, wallSoundSpeed: 5900,
 *   wallShearSpeed: 3230,
 *   lining: [], fluidSoundSpeed: 1482, wedgeSoundSpeed: 2720, wedgeAngle: 0.66,
 *   wedgeSpeedPerKelvin: 0, soundSpeedAt: () => 1482 };
 * const names = causeModels(setup, { temperature: 15, fixedDelay: 5e-6, wedgeRelative: 0.03,
 *   wall: 0.002, liningRelative: 0.5, deposit: 0.003, gasRelative: 0.05 }).map((c) => c.cause);
 * if (names.includes("lining") || !names.includes("wall")) throw new Error();
 * ```
 */
export function causeModels(
  base: ForwardSetup,
  bounds: {
    readonly temperature: number;
    readonly fixedDelay: number;
    readonly wedgeRelative: number;
    readonly wall: number;
    readonly liningRelative: number;
    readonly deposit: number;
    readonly gasRelative: number;
  },
): CauseModel[] {
  const same = (setup: ForwardSetup): Perturbed => ({ setup, delay: 0 });
  const out: CauseModel[] = [
    {
      cause: "temperature",
      unit: "K",
      step: 0.05,
      bound: bounds.temperature,
      penalty: 0,
      min: -60,
      max: 60,
      apply: (b, p) =>
        same({
          ...b,
          fluidSoundSpeed: b.fluidSoundSpeed + b.soundSpeedAt(p) - b.soundSpeedAt(0),
          wedgeSoundSpeed: b.wedgeSoundSpeed + b.wedgeSpeedPerKelvin * p,
        }),
    },
    {
      cause: "fixed-delay",
      unit: "s",
      step: 1e-9,
      bound: bounds.fixedDelay,
      penalty: 0,
      min: -1e-3,
      max: 1e-3,
      apply: (b, p) => ({ setup: b, delay: p }),
    },
    {
      cause: "wedge",
      unit: "m/s",
      step: 0.1,
      bound: bounds.wedgeRelative * base.wedgeSoundSpeed,
      penalty: 0,
      min: -0.5 * base.wedgeSoundSpeed,
      max: 0.5 * base.wedgeSoundSpeed,
      apply: (b, p) => same({ ...b, wedgeSoundSpeed: b.wedgeSoundSpeed + p }),
    },
    {
      cause: "wall",
      unit: "m",
      step: 1e-6,
      bound: bounds.wall,
      penalty: 0,
      min: -0.95 * base.wallThickness,
      max: 0.4 * (base.outsideDiameter / 2 - base.wallThickness),
      apply: (b, p) => same({ ...b, wallThickness: b.wallThickness + p }),
    },
  ];
  if (base.lining.length > 0) {
    const l0 = base.lining[0];
    out.push({
      cause: "lining",
      unit: "m",
      step: 1e-6,
      bound: bounds.liningRelative * l0.thickness,
      penalty: 0,
      min: -0.99 * l0.thickness,
      max: 0.3 * base.outsideDiameter / 2,
      apply: (b, p) =>
        same({ ...b, lining: [{ ...l0, thickness: l0.thickness + p }, ...b.lining.slice(1)] }),
    });
  }
  out.push(
    {
      cause: "deposits",
      unit: "m",
      step: 1e-6,
      bound: bounds.deposit,
      // a layer inside needs a water chemistry or a process that lays it down
      penalty: 1,
      min: 0,
      max: 0.3 * (base.outsideDiameter / 2 - base.wallThickness),
      apply: (b, p) =>
        same(
          p > 0
            ? {
              ...b,
              lining: [...b.lining, {
                thickness: p,
                soundSpeed: FIT_ASSUMPTIONS.depositSoundSpeed,
              }],
            }
            : b,
        ),
    },
    {
      cause: "gas",
      unit: "1",
      step: 1e-5,
      bound: bounds.gasRelative,
      // gas also weakens the signal: a named liquid at its stated state is the first guess
      penalty: 1,
      min: -0.5,
      max: 0,
      apply: (b, p) => same({ ...b, fluidSoundSpeed: b.fluidSoundSpeed * (1 + p) }),
    },
  );
  return out;
}

/**
 * Fit one cause to all readings at once: Gauss–Newton on the single parameter (central
 * differences), clamped to the cause's allowed interval.
 *
 * Method: minimise χ²(p) = Σ ((t_i − t̂_i(p)) / σ)² with σ = {@link FIT_ASSUMPTIONS}
 * `readingTimeSd`; score = χ² + (2p / bound)² + penalty (the bound read as two standard
 * deviations of a normal prior; common practice, project choice).
 *
 * @param model the cause
 * @param base the planned setup
 * @param readings the readings
 * @returns the fitted cause
 *
 * @example
 * ```ts
 * import { causeModels, fitCause, predictTimes } from "./reconcile_fit.ts";
 * const setup = { outsideDiameter: 0.1683, wallThickness: 0.00711, wallSoundSpeed: 5900,
 *   wallShearSpeed: 3230,
 *   lining: [], fluidSoundSpeed: 1482, wedgeSoundSpeed: 2720, wedgeAngle: 0.66,
 *   wedgeSpeedPerKelvin: 0, soundSpeedAt: () => 1482 };
 * const rs = [1, 2].map((n) => ({ traverses: n, totalTime: 0, fixedDelay: 0 }));
 * const t = predictTimes({ setup, delay: 3e-6 }, rs);
 * const readings = rs.map((r, i) => ({ ...r, totalTime: t[i] }));
 * const delay = causeModels(setup, { temperature: 15, fixedDelay: 5e-6, wedgeRelative: 0.03,
 *   wall: 0.002, liningRelative: 0.5, deposit: 0.003, gasRelative: 0.05 })[1];
 * const f = fitCause(delay, setup, readings);
 * if (Math.abs(f.value - 3e-6) > 1e-12) throw new Error();
 * ```
 */
export function fitCause(
  model: CauseModel,
  base: ForwardSetup,
  readings: readonly TimeReading[],
): FittedCause {
  const sd = FIT_ASSUMPTIONS.readingTimeSd;
  const residuals = (p: number): number[] | undefined => {
    try {
      const t = predictTimes(model.apply(base, p), readings);
      const r = readings.map((x, i) => x.totalTime - t[i]);
      return r.every(Number.isFinite) ? r : undefined;
    } catch {
      return undefined;
    }
  };
  const clamp = (p: number) => Math.min(model.max, Math.max(model.min, p));
  let p = 0;
  let r = residuals(p);
  for (let it = 0; it < 40 && r; it++) {
    const h = model.step;
    const up = residuals(clamp(p + h)), dn = residuals(clamp(p - h));
    if (!up || !dn) break;
    const span = clamp(p + h) - clamp(p - h);
    if (!(span > 0)) break;
    let jj = 0, jr = 0;
    for (let i = 0; i < r.length; i++) {
      const j = (dn[i] - up[i]) / span; // d t̂ / dp
      jj += j * j;
      jr += j * r[i];
    }
    if (!(jj > 0)) break;
    let next = clamp(p + jr / jj);
    let rn = residuals(next);
    // halve the step until the misfit does not grow (or give up)
    const ss = (x: number[]) => x.reduce((a, v) => a + v * v, 0);
    for (let k = 0; k < 30 && (!rn || ss(rn) > ss(r)); k++) {
      next = clamp(0.5 * (p + next));
      rn = residuals(next);
    }
    if (!rn) break;
    const moved = Math.abs(next - p);
    p = next;
    r = rn;
    if (moved < 1e-4 * h) break;
  }
  if (!r) {
    return {
      cause: model.cause,
      value: p,
      unit: model.unit,
      rmsResidual: Infinity,
      chiSquare: Infinity,
      relativeSize: Math.abs(p) / model.bound,
      score: Infinity,
      plausible: false,
    };
  }
  const chi = r.reduce((a, v) => a + (v / sd) ** 2, 0);
  const rms = Math.sqrt(r.reduce((a, v) => a + v * v, 0) / r.length);
  const rel = Math.abs(p) / model.bound;
  return {
    cause: model.cause,
    value: p,
    unit: model.unit,
    rmsResidual: rms,
    chiSquare: chi,
    relativeSize: rel,
    score: chi + (2 * rel) ** 2 + model.penalty,
    plausible: rms <= 2 * sd && rel <= 1,
  };
}

/**
 * Straight-line fit t − fixed delay = a + N·b over the readings (least squares), the Z/V/W
 * agreement: a is the time outside the bore (delay, wall, lining, wedge), b the time per
 * crossing of the bore.
 *
 * @param readings readings with at least two distinct traverse counts
 * @returns a (s) and b (s per traverse), or undefined with fewer than two traverse counts
 *
 * @example
 * ```ts
 * import { traverseLine } from "./reconcile_fit.ts";
 * const l = traverseLine([{ traverses: 1, totalTime: 150e-6, fixedDelay: 10e-6 },
 *   { traverses: 2, totalTime: 250e-6, fixedDelay: 10e-6 }])!;
 * if (Math.abs(l.perTraverse - 100e-6) > 1e-15 || Math.abs(l.offset - 40e-6) > 1e-15) {
 *   throw new Error();
 * }
 * ```
 */
export function traverseLine(
  readings: readonly TimeReading[],
): { readonly offset: number; readonly perTraverse: number } | undefined {
  if (new Set(readings.map((r) => r.traverses)).size < 2) return undefined;
  const n = readings.length;
  const mx = readings.reduce((a, r) => a + r.traverses, 0) / n;
  const my = readings.reduce((a, r) => a + r.totalTime - r.fixedDelay, 0) / n;
  let sxy = 0, sxx = 0;
  for (const r of readings) {
    sxy += (r.traverses - mx) * (r.totalTime - r.fixedDelay - my);
    sxx += (r.traverses - mx) ** 2;
  }
  const b = sxy / sxx;
  return { offset: my - b * mx, perTraverse: b };
}
