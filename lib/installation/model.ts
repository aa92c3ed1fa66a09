/**
 * The snellpath distorted-profile model: the reading shift of a clamp-on transit-time path
 * behind a fitting.
 *
 * Velocity field (normalised by the bulk velocity V, radius R = 1, polar angle θ measured in
 * the section from the fitting's reference plane, x the axial distance from the fitting in D):
 *
 *   u = u_fd(r) + A(x)(1 − r²)(1 − 3r²) + B(x) r²(1 − r²) cos 2θ + S(x) r(1 − r²) cos θ
 *   tangential (swirl) w_θ = W(x) r (1 − r⁴);  cross-flow along the reference plane C(x)(1 − r²)
 *
 * where u_fd is the fully developed profile (lib/flow) and each amplitude decays as
 * a₀ exp(−x/L) with a₀, L per fitting (data/fittings.yaml). Each axial term has zero area
 * mean, so V stays 1. The acoustic path is followed chord by chord: traverse k runs along a
 * chord at offset h (0 on the diameter), successive traverses reflected at the wall (on the
 * diameter, back along the same line: the V and W paths cross the section in the same plane in
 * opposite directions); every point sits at its own axial distance, the path advancing
 * √(1 − h²)·tan φ diameters per traverse (φ the beam angle in the liquid from the wall normal).
 * The path sees u + v_t·cot φ, v_t the in-section velocity along its direction; the meter
 * turns the path mean into a bulk velocity with the fully developed profile factor of the same
 * chord. The relative error is that reading over V, minus 1.
 *
 * Consequences, tested: a diametral path is blind to swirl (solid-body rotation projects to
 * zero along any diameter) and to the skewed component; an off-centre chord is not; V and W
 * paths cancel the cross-flow a Z path sees; errors decay with distance.
 *
 * It is an estimate from a simple model, not a calibration: every result says so.
 *
 * @module
 */
import { InputError, NoPhysicalAnswerError, requireFinite } from "../errors.ts";
import { halfChordRule } from "../flow/quadrature.ts";
import {
  chordMeanVelocity,
  type ProfileModel,
  type ProfileShape,
  profileShape,
} from "../flow/profile.ts";
import { type Fitting, resolveFitting } from "./fittings.ts";

/** Default beam angle in the liquid from the wall normal, rad (20°, common practice). */
export const DEFAULT_FLUID_ANGLE = 20 * Math.PI / 180;

/**
 * Spread of a fitted fitting (terms fitted to published data, basis `computed`): this fraction of
 * the estimated error. Judgement: the published bounds it is fitted to (synowiec-2021-abstract)
 * give the envelope, not the value at every angle.
 */
export const MODEL_RELATIVE_SPREAD = 0.5;

/**
 * Spread of a fitting whose terms are engineering judgement (basis `recalled`, no published
 * measurements reached): this fraction of the estimated error, wider because the data are absent.
 */
export const JUDGEMENT_RELATIVE_SPREAD = 1.0;

/** The note every model result carries. */
export const MODEL_NOTE: string = "estimate from the snellpath distorted-profile model (simple, " +
  "exponentially decaying components; only the single-elbow terms are fitted to published " +
  "bounds); not a calibration";

/** Where a fitting's model terms come from: source id and basis, for traces and budgets. */
export interface ModelProvenance {
  /** Source id in data/sources.yaml. */
  readonly source: string;
  /** `computed` (fitted to published data) or `recalled` (engineering judgement). */
  readonly basis: "transcribed" | "computed" | "common-practice" | "recalled";
  /** Relative spread applied to this fitting's estimates. */
  readonly relativeSpread: number;
}

/**
 * Provenance of a fitting's distorted-profile terms, read from its `disturbance` entry in
 * data/fittings.yaml: for the single elbow the published data it is fitted to
 * (`synowiec-2021-abstract`, basis computed, spread {@link MODEL_RELATIVE_SPREAD}); for the
 * others `snellpath-installation-model`, basis recalled, spread {@link JUDGEMENT_RELATIVE_SPREAD}.
 *
 * @param fitting fitting id, alias or entry
 * @returns source id, basis and the relative spread used
 *
 * @example
 * ```ts
 * import { modelProvenance } from "./model.ts";
 * if (modelProvenance("elbow-90").source !== "synowiec-2021-abstract") throw new Error();
 * if (modelProvenance("pump").basis !== "recalled") throw new Error();
 * ```
 */
export function modelProvenance(fitting: string | Fitting): ModelProvenance {
  const d = resolveFitting(fitting).disturbance;
  const basis = d.basis ?? "recalled";
  return Object.freeze({
    source: d.source ?? "snellpath-installation-model",
    basis,
    relativeSpread: basis === "recalled" ? JUDGEMENT_RELATIVE_SPREAD : MODEL_RELATIVE_SPREAD,
  });
}

const RULE = halfChordRule(24);

/** Input of {@link profileErrorEstimate}. */
export interface ProfileErrorInput {
  /** Axial distance from the fitting to the middle of the acoustic path, in diameters (≥ 0). */
  readonly distanceDiameters: number;
  /** Upstream fitting id or entry. */
  readonly fitting: string | Fitting;
  /** Angle from the fitting's reference plane to the path plane, rad; default 0. */
  readonly orientation?: number;
  /** Bore crossings: 1 (Z), 2 (V), 4 (W), any integer 1–8; default 2. */
  readonly traverses?: number;
  /** Reynolds number; default 1e5. */
  readonly reynolds?: number;
  /** Chord offset h/R in [0, 1), default 0 (diametral, the clamp-on case). */
  readonly chordOffset?: number;
  /** Beam angle in the liquid from the wall normal, rad, in (0, 1.4); default 20°. */
  readonly fluidAngle?: number;
  /** Fully developed profile model; default power-law-nikuradse. */
  readonly model?: ProfileModel;
  /** Relative roughness ε/D; default 0. */
  readonly relativeRoughness?: number;
}

/** Contribution of each model component to the relative error. */
export interface ErrorComponents {
  /** The axisymmetric. */
  readonly axisymmetric: number;
  /** The second harmonic. */
  readonly secondHarmonic: number;
  /** The skew. */
  readonly skew: number;
  /** The swirl. */
  readonly swirl: number;
  /** The cross flow. */
  readonly crossFlow: number;
}

/** Result of {@link profileErrorEstimate}. */
export interface ProfileErrorResult {
  /** Estimated relative error of the reading (reading/true − 1); negative reads low. */
  readonly error: number;
  /**
   * Half-width of the model's own uncertainty on `error`: 50 % of it for a fitting fitted to
   * published data, 100 % for one resting on judgement ({@link modelProvenance}).
   */
  readonly spread: number;
  /** Source id of the model terms used (data/sources.yaml). */
  readonly source: string;
  /** Basis of the model terms used. */
  readonly basis: ModelProvenance["basis"];
  /** Per component. */
  readonly components: ErrorComponents;
  /** Fully developed profile factor the meter applies. */
  readonly profileFactor: number;
  /** The fitting. */
  readonly fitting: string;
  /** The distance diameters. */
  readonly distanceDiameters: number;
  /** The orientation. */
  readonly orientation: number;
  /** The traverses. */
  readonly traverses: number;
  /** The reynolds. */
  readonly reynolds: number;
  /** The note. */
  readonly note: string;
}

function amp(c: { amplitude: number; decay: number }, x: number): number {
  return c.amplitude === 0 ? 0 : c.amplitude * Math.exp(-Math.max(x, 0) / c.decay);
}

/**
 * Estimated relative error of a clamp-on transit-time reading at a distance behind a fitting,
 * by the snellpath distorted-profile model (see the module text). Sources: model parameters
 * in data/fittings.yaml (`synowiec-2021-abstract` for the single elbow, fitted to its published
 * bounds, basis computed; `snellpath-installation-model` otherwise, basis recalled); the result
 * carries that `source` and `basis`; profiles from lib/flow.
 *
 * Validity: distance ≥ 0 D (the model is meant from about 1 D on; nearer, it extrapolates a
 * smooth decay into the fitting's own flow), traverses 1–8, Re as lib/flow, h/R in [0, 1).
 *
 * @param input distance (D), fitting, orientation (rad), traverses, Re, chord offset, beam angle
 * @returns error, spread, components, profile factor used, and a note that it is an estimate
 *
 * @example
 * ```ts
 * import { profileErrorEstimate } from "./model.ts";
 * const near = profileErrorEstimate({ distanceDiameters: 2, fitting: "elbow-90" });
 * const far = profileErrorEstimate({ distanceDiameters: 20, fitting: "elbow-90" });
 * if (!(near.error < 0 && Math.abs(far.error) < Math.abs(near.error))) throw new Error();
 * ```
 */
export function profileErrorEstimate(input: ProfileErrorInput): ProfileErrorResult {
  const error = profileError(input);
  // profileError left its fitting, inputs and factor in last*, its path means in MEMO
  const fit = lastFit!, k = lastK, comp = MEMO;
  const components: ErrorComponents = Object.freeze({
    axisymmetric: k * comp[0],
    secondHarmonic: k * comp[1],
    skew: k * comp[2],
    swirl: k * comp[3],
    crossFlow: k * comp[4],
  });
  if (fit !== provFit) {
    provLast = modelProvenance(fit);
    provFit = fit;
  }
  const prov = provLast!;
  return Object.freeze({
    error,
    spread: prov.relativeSpread * Math.abs(error),
    source: prov.source,
    basis: prov.basis,
    components,
    profileFactor: k,
    fitting: fit.id,
    distanceDiameters: lastX0,
    orientation: lastAlpha,
    traverses: lastTrav,
    reynolds: lastRe,
    note: MODEL_NOTE,
  });
}

// What the last profileError resolved: its fitting, inputs and fully developed factor.
let lastFit: Fitting | undefined;
let lastX0 = NaN, lastAlpha = NaN, lastTrav = NaN, lastRe = NaN, lastK = NaN;

/**
 * The `error` of {@link profileErrorEstimate} alone, with the same checks and errors and the
 * same number, without building the result (components, spread, provenance): for rankings and
 * sweeps that read the error only.
 *
 * @param input as {@link profileErrorEstimate}
 * @returns estimated relative error of the reading (reading/true − 1)
 *
 * @example
 * ```ts
 * import { profileError, profileErrorEstimate } from "./model.ts";
 * const input = { distanceDiameters: 5, fitting: "elbow-90", orientation: 0.4 };
 * if (profileError(input) !== profileErrorEstimate(input).error) throw new Error();
 * ```
 */
export function profileError(input: ProfileErrorInput): number {
  const fit = resolveFitting(input.fitting);
  const x0 = requireFinite("distanceDiameters", input.distanceDiameters, "D");
  if (x0 < 0) {
    throw new InputError("distanceDiameters", String(x0), "a distance ≥ 0 D from the fitting");
  }
  const alpha = requireFinite("orientation", input.orientation ?? 0, "rad");
  const nTrav = input.traverses ?? 2;
  if (!Number.isInteger(nTrav) || nTrav < 1 || nTrav > 8) {
    throw new InputError("traverses", String(nTrav), "an integer from 1 to 8 (1 Z, 2 V, 4 W)");
  }
  const re = requireFinite("reynolds", input.reynolds ?? 1e5, "1", true);
  const h = requireFinite("chordOffset", input.chordOffset ?? 0, "1");
  if (h < 0 || h >= 1) throw new InputError("chordOffset", String(h), "h/R from 0 up to 1");
  const phi = requireFinite("fluidAngle", input.fluidAngle ?? DEFAULT_FLUID_ANGLE, "rad");
  // A denormal angle passes phi > 0 but its cot φ overflows: refuse it with the rest.
  if (!(phi > 0 && phi < 1.4) || !Number.isFinite(1 / Math.tan(phi))) {
    throw new InputError("fluidAngle", String(phi), "a beam angle in the liquid in (0, 1.4) rad");
  }
  const k = developedFactor(re, input.model, input.relativeRoughness, h);
  const comp = memoPathIntegral(fit, x0, alpha, nTrav, h, phi);
  // the sum of the components k·comp[i], in their order
  const error = k * comp[0] + k * comp[1] + k * comp[2] + k * comp[3] + k * comp[4];
  if (!Number.isFinite(error)) {
    throw new NoPhysicalAnswerError(
      `the distorted-profile model gives no finite estimate at ${x0} D, beam ${phi} rad`,
    );
  }
  lastFit = fit;
  lastX0 = x0;
  lastAlpha = alpha;
  lastTrav = nTrav;
  lastRe = re;
  lastK = k;
  return error;
}

// The provenance of the last fitting estimated (rankings ask for one fitting many times).
let provFit: Fitting | undefined;
let provLast: ModelProvenance | undefined;

// The fully developed factor k = 1 / chord mean of u/V for the last few (Re, model, ε/D, h):
// a ranking asks for the same few Reynolds numbers at every candidate, and k depends on nothing
// else, so each is resolved once and the same number used again.
const K_SLOTS = 4;
const kKeys: [number, ProfileModel | undefined, number | undefined, number][] = [];
const kValues: number[] = [];
let kNext = 0;

function developedFactor(
  re: number,
  model: ProfileModel | undefined,
  relativeRoughness: number | undefined,
  h: number,
): number {
  for (let i = 0; i < kKeys.length; i++) {
    const key = kKeys[i];
    if (key[0] === re && key[1] === model && key[2] === relativeRoughness && key[3] === h) {
      return kValues[i];
    }
  }
  const shape: ProfileShape = profileShape(re, { model, relativeRoughness, extrapolate: true });
  const k = 1 / chordMeanVelocity(shape, h);
  kKeys[kNext] = [re, model, relativeRoughness, h];
  kValues[kNext] = k;
  kNext = (kNext + 1) % K_SLOTS;
  return k;
}

const OUT = new Float64Array(5);
const NODES = 2 * RULE.s.length;
/** Per quadrature point (both sides): t and weight, precomputed once. */
const T_NODE = new Float64Array(NODES);
const W_NODE = new Float64Array(NODES);
for (let i = 0; i < RULE.s.length; i++) {
  T_NODE[2 * i] = -RULE.s[i];
  T_NODE[2 * i + 1] = RULE.s[i];
  W_NODE[2 * i] = W_NODE[2 * i + 1] = RULE.w[i];
}
/** Scratch: exp(−step·(t+1)/2 / decay) per component and node, reused between calls. */
const DECAY_ALONG = new Float64Array(5 * NODES);
let cachedStep = NaN;
let cachedDist: Fitting["disturbance"] | undefined;

function componentsOf(dist: Fitting["disturbance"]) {
  return [dist.axisymmetric, dist.secondHarmonic, dist.skew, dist.swirl, dist.crossFlow] as const;
}

/** The last path integral's inputs and result: ranking calls it for several Reynolds numbers
 * in a row with the same geometry, and the components do not depend on Re. */
const MEMO = new Float64Array(5);
let memoFit: Fitting | undefined;
let memoKey = [NaN, NaN, NaN, NaN, NaN];

function memoPathIntegral(
  fit: Fitting,
  xMid: number,
  alpha: number,
  nTrav: number,
  h: number,
  phi: number,
): Float64Array {
  if (
    fit === memoFit && xMid === memoKey[0] && alpha === memoKey[1] && nTrav === memoKey[2] &&
    h === memoKey[3] && phi === memoKey[4]
  ) {
    return MEMO;
  }
  MEMO.set(pathIntegral(fit, xMid, alpha, nTrav, h, phi));
  memoFit = fit;
  memoKey = [xMid, alpha, nTrav, h, phi];
  return MEMO;
}

/** The quadrature nodes of a path's chords: what does not depend on the axial position. */
interface ChordGeometry {
  readonly alpha: number;
  readonly nTrav: number;
  readonly h: number;
  /** Node weight W/2/nTrav, per node of one chord. */
  readonly wt: Float64Array;
  /** Travel direction's x component, per traverse. */
  readonly ex: Float64Array;
  /** Per traverse and node (index kk·NODES + j): x, 1 − r², 1 − 3r², x² − y², 1 − r⁴. */
  readonly px: Float64Array;
  readonly om: Float64Array;
  readonly q0: Float64Array;
  readonly q1: Float64Array;
  readonly q3: Float64Array;
}

// The last few chord geometries: a ranking scores each position in a few path planes in turn,
// and the run's error profile keeps one plane; each is worked out once and reused as it is.
const GEO_SLOTS = 4;
const geoCache: ChordGeometry[] = [];
let geoNext = 0;

/** Node geometry of the chords of a path at plane angle alpha (the same numbers each time). */
function chordGeometry(
  alpha: number,
  nTrav: number,
  h: number,
  g: number,
  gamma: number,
): ChordGeometry {
  for (const c of geoCache) {
    if (c.alpha === alpha && c.nTrav === nTrav && c.h === h) return c;
  }
  const size = nTrav * NODES;
  const geo: ChordGeometry = {
    alpha,
    nTrav,
    h,
    wt: new Float64Array(NODES),
    ex: new Float64Array(nTrav),
    px: new Float64Array(size),
    om: new Float64Array(size),
    q0: new Float64Array(size),
    q1: new Float64Array(size),
    q3: new Float64Array(size),
  };
  for (let j = 0; j < NODES; j++) geo.wt[j] = W_NODE[j] / 2 / nTrav;
  for (let kk = 0; kk < nTrav; kk++) {
    const beta = alpha - Math.PI / 2 + 2 * kk * gamma; // chord normal angle
    const nx = Math.cos(beta);
    const ny = Math.sin(beta);
    const ex = -ny; // travel direction: normal turned +90°
    const ey = nx;
    geo.ex[kk] = ex;
    for (let j = 0; j < NODES; j++) {
      const t = T_NODE[j];
      const px = h * nx + t * g * ex;
      const py = h * ny + t * g * ey;
      const r2 = px * px + py * py;
      const n = kk * NODES + j;
      geo.px[n] = px;
      geo.om[n] = 1 - r2;
      geo.q0[n] = 1 - 3 * r2;
      geo.q1[n] = px * px - py * py;
      geo.q3[n] = 1 - r2 * r2;
    }
  }
  geoCache[geoNext] = geo;
  geoNext = (geoNext + 1) % GEO_SLOTS;
  return geo;
}

/**
 * Path means of the five distortion terms (already multiplied out by the transverse cot φ).
 *
 * Each component decays as A·exp(−x/L). Along one traverse x = x₀ + step·(t+1)/2, so the
 * exponential factors into exp(−x₀/L) (one per traverse) times exp(−step·(t+1)/(2L)) (one per
 * node, cached while the fitting and the step stay the same): the same sums as point by point,
 * with far fewer exponentials. Where part of the path lies before the fitting (x < 0, clamped to
 * 0) the point-by-point form is used.
 */
function pathIntegral(
  fit: Fitting,
  xMid: number,
  alpha: number,
  nTrav: number,
  h: number,
  phi: number,
): Float64Array {
  OUT.fill(0);
  const dist = fit.disturbance;
  const comps = componentsOf(dist);
  const g = Math.sqrt(1 - h * h);
  const step = g * Math.tan(phi); // axial advance per traverse, D
  const cot = 1 / Math.tan(phi);
  const gamma = Math.acos(h);
  const xStart = xMid - nTrav * step / 2;
  const factored = xStart >= 0;
  if (factored && (step !== cachedStep || dist !== cachedDist)) {
    for (let c = 0; c < 5; c++) {
      const d = comps[c].decay;
      for (let j = 0; j < NODES; j++) {
        DECAY_ALONG[c * NODES + j] = Math.exp(-step * (T_NODE[j] + 1) / 2 / d);
      }
    }
    cachedStep = step;
    cachedDist = dist;
  }
  const a0 = comps[0].amplitude, a1 = comps[1].amplitude, a2 = comps[2].amplitude;
  const a3 = comps[3].amplitude, a4 = comps[4].amplitude;
  const geo = chordGeometry(alpha, nTrav, h, g, gamma);
  const WT = geo.wt, OM = geo.om, Q0 = geo.q0, Q1 = geo.q1, PX = geo.px, Q3 = geo.q3;
  for (let kk = 0; kk < nTrav; kk++) {
    const ex = geo.ex[kk];
    const x0 = xStart + step * kk;
    const e0 = factored && a0 !== 0 ? a0 * Math.exp(-x0 / comps[0].decay) : 0;
    const e1 = factored && a1 !== 0 ? a1 * Math.exp(-x0 / comps[1].decay) : 0;
    const e2 = factored && a2 !== 0 ? a2 * Math.exp(-x0 / comps[2].decay) : 0;
    const e3 = factored && a3 !== 0 ? a3 * Math.exp(-x0 / comps[3].decay) : 0;
    const e4 = factored && a4 !== 0 ? a4 * Math.exp(-x0 / comps[4].decay) : 0;
    for (let j = 0; j < NODES; j++) {
      const n = kk * NODES + j;
      const wt = WT[j], om = OM[n];
      let m0: number, m1: number, m2: number, m3: number, m4: number;
      if (factored) {
        m0 = e0 * DECAY_ALONG[j];
        m1 = e1 * DECAY_ALONG[NODES + j];
        m2 = e2 * DECAY_ALONG[2 * NODES + j];
        m3 = e3 * DECAY_ALONG[3 * NODES + j];
        m4 = e4 * DECAY_ALONG[4 * NODES + j];
      } else {
        const x = x0 + step * (T_NODE[j] + 1) / 2;
        m0 = amp(comps[0], x);
        m1 = amp(comps[1], x);
        m2 = amp(comps[2], x);
        m3 = amp(comps[3], x);
        m4 = amp(comps[4], x);
      }
      // the products in the order of wt·m0·om·(1 − 3r²), wt·m1·(x² − y²)·om, wt·m2·x·om,
      // wt·m3·h·(1 − r⁴)·cot φ and wt·m4·om·e_x·cot φ, the position-free factors from geo
      OUT[0] += wt * m0 * om * Q0[n];
      OUT[1] += wt * m1 * Q1[n] * om;
      OUT[2] += wt * m2 * PX[n] * om;
      OUT[3] += wt * m3 * h * Q3[n] * cot;
      OUT[4] += wt * m4 * om * ex * cot;
    }
  }
  return OUT;
}

/** One row of {@link profileErrorSweep}. */
export interface SweepRow {
  /** The distance diameters. */
  readonly distanceDiameters: number;
  /** The orientation. */
  readonly orientation: number;
  /** The reynolds. */
  readonly reynolds: number;
  /** The error. */
  readonly error: number;
}

/**
 * {@link profileErrorEstimate} over a grid of distances, orientations and Reynolds numbers
 * (for example the minimum, design and maximum flow of a site).
 *
 * @param base the fixed inputs (fitting, traverses, chord, beam angle, model)
 * @param grid distances (D), orientations (rad, default [0]), Reynolds numbers (default [1e5])
 * @returns one row per combination
 *
 * @example
 * ```ts
 * import { profileErrorSweep } from "./model.ts";
 * const rows = profileErrorSweep({ fitting: "elbow-90" }, {
 *   distances: [5, 10], reynolds: [2e4, 1e5, 5e5],
 * });
 * if (rows.length !== 6) throw new Error();
 * ```
 */
export function profileErrorSweep(
  base: Omit<ProfileErrorInput, "distanceDiameters" | "orientation" | "reynolds">,
  grid: {
    /** The distances. */
    readonly distances: readonly number[];
    /** The orientations. */
    readonly orientations?: readonly number[];
    /** The reynolds. */
    readonly reynolds?: readonly number[];
  },
): SweepRow[] {
  const rows: SweepRow[] = [];
  for (const d of grid.distances) {
    for (const o of grid.orientations ?? [0]) {
      for (const re of grid.reynolds ?? [1e5]) {
        const r = profileErrorEstimate({
          ...base,
          distanceDiameters: d,
          orientation: o,
          reynolds: re,
        });
        rows.push({ distanceDiameters: d, orientation: o, reynolds: re, error: r.error });
      }
    }
  }
  return rows;
}
