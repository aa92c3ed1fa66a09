/**
 * Fully developed velocity profiles and the profile factor (area-mean velocity over the mean
 * velocity along an acoustic chord).
 *
 * Profiles, each normalised to an area-mean velocity of 1, with r̂ = r/R:
 * - laminar (Hagen–Poiseuille): u = 2(1 − r̂²);
 * - turbulent power law: u = C_n (1 − r̂)^(1/n), C_n = (n+1)(2n+1)/(2n²), with n from the
 *   Nikuradse measurements as tabulated by Schlichting (interpolated in ln Re; model
 *   "power-law-nikuradse") or from the friction factor, n = 1/√f with the Darcy f from
 *   Colebrook–White (model "power-law-friction");
 * - logarithmic law (Prandtl–von Kármán) in velocity-defect form: u = 1 + (u_τ/V)[ln(1 − r̂)/κ
 *   + 3/(2κ)] with u_τ/V = √(f/8) (model "log-law"); the constant 3/(2κ) makes the area mean 1.
 *   The roughness enters through f.
 *
 * Transition (2000 ≤ Re < 1e4, common practice limits): the profile is blended linearly in ln Re
 * from laminar (weight 1 at Re 2000) to the turbulent model (weight 1 at Re 1e4), whose
 * parameters are taken at max(Re, 4000). This is the least certain region; estimates widen
 * their spread there.
 *
 * @module
 */
import {
  checkRange,
  InputError,
  requireFinite,
  type ValidityOptions,
  type Warning,
} from "../errors.ts";
import { flowConstants } from "./constants.ts";
import { frictionFactor } from "./friction.ts";
import { halfChordRule } from "./quadrature.ts";
import type { FlowRegime } from "./reynolds.ts";

/** Velocity-profile models. */
export type ProfileModel = "power-law-nikuradse" | "power-law-friction" | "log-law" | "laminar";

/** The models {@link profileFactorEstimate} compares in turbulent flow. */
export const TURBULENT_MODELS: readonly ProfileModel[] = Object.freeze([
  "power-law-nikuradse",
  "power-law-friction",
  "log-law",
]);

/** Options of {@link profileFactor}. */
export interface ProfileOptions extends ValidityOptions {
  /** Profile model; default "power-law-nikuradse". */
  readonly model?: ProfileModel;
  /** Chord offset h/R in [0, 1); 0 (default) is the diametral path. */
  readonly chord?: number;
  /** Relative roughness ε/D for the friction-based models; default 0 (smooth). */
  readonly relativeRoughness?: number;
}

/**
 * A resolved fully developed profile shape (normalised to area mean 1). Plain data; evaluate
 * with {@link profileVelocity}.
 */
export interface ProfileShape {
  /** The model asked for. */
  readonly model: ProfileModel;
  /** Weight of the laminar profile: 1 laminar, 0 turbulent, between in transition. */
  readonly laminarWeight: number;
  /** Turbulent part: "power" or "log". */
  readonly turbulentKind: "power" | "log";
  /** Power-law exponent n (power kind), else 0. */
  readonly n: number;
  /** C_n = (n+1)(2n+1)/(2n²) (power kind), else 0. */
  readonly cn: number;
  /** u_τ/V = √(f/8) (log kind), else 0. */
  readonly beta: number;
  /** von Kármán constant (log kind). */
  readonly kappa: number;
}

const RULE = halfChordRule(48);

/**
 * Power-law exponent n from Nikuradse's smooth-pipe data as tabulated by Schlichting
 * (data/flow/nikuradse-power-law-n.yaml, source `schlichting-1979`, basis recalled),
 * interpolated linearly in ln Re.
 *
 * Validity: 4e3 ≤ Re ≤ 3.2e6 (the table); outside, OutOfRangeError unless
 * `options.extrapolate`, in which case n is held at the end value and a warning pushed.
 *
 * @param reynolds Reynolds number, dimensionless
 * @param options extrapolation opt-in and warning sink
 * @returns n, dimensionless
 *
 * @example
 * ```ts
 * import { powerLawExponent } from "./profile.ts";
 * if (Math.abs(powerLawExponent(1.1e5) - 7) > 1e-12) throw new Error("n at 1.1e5");
 * ```
 */
export function powerLawExponent(reynolds: number, options?: ValidityOptions): number {
  requireFinite("reynolds", reynolds, "1", true);
  const c = flowConstants();
  const lx = c.nTableLnRe;
  const ny = c.nTableN;
  const last = lx.length - 1;
  checkRange(
    "reynolds",
    reynolds,
    [Math.exp(lx[0]), Math.exp(lx[last])],
    "1",
    "power-law exponent table (Nikuradse via Schlichting)",
    options,
  );
  const l = Math.log(reynolds);
  if (l <= lx[0]) return ny[0];
  if (l >= lx[last]) return ny[last];
  let i = 0;
  while (l > lx[i + 1]) i++;
  const t = (l - lx[i]) / (lx[i + 1] - lx[i]);
  return ny[i] + t * (ny[i + 1] - ny[i]);
}

/**
 * Power-law exponent from the Darcy friction factor, n = 1/√f (a widely used approximation
 * linking the power-law profile to the friction law; basis common-practice, stated in
 * data/flow/regimes.yaml).
 *
 * @param darcyFrictionFactor Darcy friction factor, > 0
 * @returns n, dimensionless
 *
 * @example
 * ```ts
 * import { powerLawExponentFromFriction } from "./profile.ts";
 * if (Math.abs(powerLawExponentFromFriction(0.02) - 7.0711) > 1e-4) throw new Error();
 * ```
 */
export function powerLawExponentFromFriction(darcyFrictionFactor: number): number {
  requireFinite("frictionFactor", darcyFrictionFactor, "1", true);
  return 1 / Math.sqrt(darcyFrictionFactor);
}

/**
 * The flow regime by the common-practice limits (source `common-practice`,
 * data/flow/regimes.yaml): laminar below Re 2000, transition up to 1e4, turbulent above.
 *
 * @param reynolds Reynolds number, dimensionless
 * @returns "laminar" | "transition" | "turbulent"
 *
 * @example
 * ```ts
 * import { flowRegime } from "./profile.ts";
 * if (flowRegime(5000) !== "transition") throw new Error();
 * ```
 */
export function flowRegime(reynolds: number): FlowRegime {
  const c = flowConstants();
  if (reynolds < c.laminarLimit) return "laminar";
  if (reynolds < c.turbulentLimit) return "transition";
  return "turbulent";
}

/**
 * Resolve the fully developed profile shape at a Reynolds number (see the module text for
 * the models and the transition blend).
 *
 * Validity: 0 < Re ≤ 1e8; the Nikuradse model needs Re ≤ 3.2e6 (else OutOfRangeError unless
 * `options.extrapolate`); ε/D ≤ 0.05. Sources: `schlichting-1979`, `nikuradse-1932`,
 * `colebrook-1939`, `white-fluid-mechanics-2011` (κ), `common-practice` (limits).
 *
 * @param reynolds Reynolds number, dimensionless
 * @param options model, roughness, validity options
 * @returns the shape
 *
 * @example
 * ```ts
 * import { profileShape } from "./profile.ts";
 * const s = profileShape(1.1e5);
 * if (s.laminarWeight !== 0 || Math.abs(s.n - 7) > 1e-12) throw new Error("shape");
 * ```
 */
export function profileShape(reynolds: number, options?: ProfileOptions): ProfileShape {
  requireFinite("reynolds", reynolds, "1", true);
  const c = flowConstants();
  checkRange("reynolds", reynolds, [0, c.reynoldsMax], "1", "velocity profile", options);
  const model = options?.model ?? "power-law-nikuradse";
  const rr = options?.relativeRoughness ?? 0;
  requireFinite("relativeRoughness", rr, "1");
  if (rr < 0) throw new InputError("relativeRoughness", String(rr), "a ratio ε/D ≥ 0");
  const base = { model, turbulentKind: "power" as const, n: 0, cn: 0, beta: 0, kappa: c.kappa };
  if (model === "laminar" || reynolds < c.laminarLimit) {
    if (!["laminar", ...TURBULENT_MODELS].includes(model)) badModel(model);
    return Object.freeze({ ...base, laminarWeight: 1 });
  }
  const reT = Math.max(reynolds, c.colebrookLimit);
  const laminarWeight = reynolds >= c.turbulentLimit
    ? 0
    : 1 - Math.log(reynolds / c.laminarLimit) / Math.log(c.turbulentLimit / c.laminarLimit);
  if (laminarWeight > 0) {
    options?.warnings?.push({
      code: "transition",
      message: `Re ${Math.round(reynolds)} is in the transition region ` +
        `(${c.laminarLimit}–${c.turbulentLimit}): profile blended laminar→turbulent, least certain`,
    });
  }
  switch (model) {
    case "power-law-nikuradse": {
      const n = powerLawExponent(reT, options);
      return Object.freeze({ ...base, laminarWeight, n, cn: cn(n) });
    }
    case "power-law-friction": {
      const n = 1 / Math.sqrt(frictionFactor(reT, rr, "colebrook", options));
      return Object.freeze({ ...base, laminarWeight, n, cn: cn(n) });
    }
    case "log-law": {
      const beta = Math.sqrt(frictionFactor(reT, rr, "colebrook", options) / 8);
      return Object.freeze({ ...base, laminarWeight, turbulentKind: "log" as const, beta });
    }
    default:
      return badModel(model);
  }
}

function badModel(model: unknown): never {
  throw new InputError(
    "model",
    String(model),
    "power-law-nikuradse, power-law-friction, log-law or laminar",
  );
}

function cn(n: number): number {
  return (n + 1) * (2 * n + 1) / (2 * n * n);
}

/**
 * Axial velocity of a fully developed profile at a radius, over the area-mean velocity.
 * Takes 1 − r̂ and 1 − r̂² (accurate near the wall) to avoid cancellation.
 *
 * @param shape from {@link profileShape}
 * @param oneMinusR 1 − r/R, in (0, 1]
 * @param oneMinusR2 1 − (r/R)², in (0, 1]
 * @returns u/V
 *
 * @example
 * ```ts
 * import { profileShape, profileVelocity } from "./profile.ts";
 * const lam = profileShape(1000);
 * if (profileVelocity(lam, 1, 1) !== 2) throw new Error("laminar centre is twice the mean");
 * ```
 */
export function profileVelocity(
  shape: ProfileShape,
  oneMinusR: number,
  oneMinusR2: number,
): number {
  const wl = shape.laminarWeight;
  let u = wl > 0 ? wl * 2 * oneMinusR2 : 0;
  if (wl < 1) {
    const ut = shape.turbulentKind === "power"
      ? shape.cn * Math.pow(oneMinusR, 1 / shape.n)
      : 1 + shape.beta * (Math.log(oneMinusR) + 1.5) / shape.kappa;
    u += (1 - wl) * ut;
  }
  return u;
}

/**
 * Mean of u/V along a chord at offset h/R (closed forms on the diameter and for the laminar
 * part; otherwise the half-chord Gauss–Legendre rule with 48 precomputed nodes).
 *
 * @param shape from {@link profileShape}
 * @param chord offset h/R in [0, 1)
 * @returns the chord mean of u/V
 *
 * @example
 * ```ts
 * import { chordMeanVelocity, profileShape } from "./profile.ts";
 * const m = chordMeanVelocity(profileShape(1000), 0);
 * if (Math.abs(m - 4 / 3) > 1e-15) throw new Error("laminar diameter mean 4/3");
 * ```
 */
export function chordMeanVelocity(shape: ProfileShape, chord: number): number {
  requireFinite("chord", chord, "1");
  if (chord < 0 || chord >= 1) {
    throw new InputError("chord", String(chord), "an offset h/R from 0 up to (not incl.) 1");
  }
  const wl = shape.laminarWeight;
  const h2 = chord * chord;
  let m = wl > 0 ? wl * (4 / 3) * (1 - h2) : 0;
  if (wl < 1) {
    let mt = 0;
    if (chord === 0) {
      mt = shape.turbulentKind === "power"
        ? shape.cn * shape.n / (shape.n + 1)
        : 1 + shape.beta * 0.5 / shape.kappa;
    } else {
      const g = 1 - h2;
      const { s, oneMinusS2, w } = RULE;
      for (let i = 0; i < s.length; i++) {
        const omr2 = g * oneMinusS2[i];
        const r = Math.sqrt(h2 + g * s[i] * s[i]);
        const omr = omr2 / (1 + r);
        mt += w[i] *
          (shape.turbulentKind === "power"
            ? shape.cn * Math.pow(omr, 1 / shape.n)
            : 1 + shape.beta * (Math.log(omr) + 1.5) / shape.kappa);
      }
    }
    m += (1 - wl) * mt;
  }
  return m;
}

/**
 * Profile factor k = area-mean velocity / mean axial velocity along the acoustic path, for
 * fully developed flow. Diametral path (default): laminar 3/4 exactly, power law 2n/(2n+1),
 * log law 1/(1 + √(f/8)/(2κ)); an off-centre chord (`options.chord` = h/R) by quadrature.
 *
 * Models, sources and the transition treatment: see the module text and
 * {@link profileShape}. Validity: 0 < Re ≤ 1e8 (Nikuradse model ≤ 3.2e6), 0 ≤ h/R < 1.
 *
 * @param reynolds Reynolds number, dimensionless
 * @param options model, chord, relative roughness, validity options
 * @returns the profile factor, dimensionless
 *
 * @example
 * ```ts
 * import { profileFactor } from "./profile.ts";
 * if (profileFactor(1000) !== 0.75) throw new Error("laminar 3/4");
 * if (Math.abs(profileFactor(1.1e5) - 14 / 15) > 1e-12) throw new Error("n = 7 gives 14/15");
 * ```
 */
export function profileFactor(reynolds: number, options?: ProfileOptions): number {
  const shape = profileShape(reynolds, options);
  const k = 1 / chordMeanVelocity(shape, options?.chord ?? 0);
  return requireFinite("profileFactor", k, "1", true);
}

/** Result of {@link profileFactorEstimate}. */
export interface ProfileFactorEstimate {
  /** Profile factor of the chosen model (default power-law-nikuradse). */
  readonly factor: number;
  /** Half-width of the spread between the models (widened in transition), dimensionless. */
  readonly spread: number;
  /** Factor per model evaluated. */
  readonly byModel: Readonly<Partial<Record<ProfileModel, number>>>;
  /** The model whose factor is reported. */
  readonly model: ProfileModel;
  /** Flow regime. */
  readonly regime: FlowRegime;
  /** Warnings: transition, extrapolation, models left out. */
  readonly warnings: readonly Warning[];
}

/**
 * Profile factor with the spread between models: evaluates the power law with Nikuradse's n,
 * the power law with n = 1/√f and the log law (laminar: 3/4 only). The spread is the
 * half-width (max − min)/2 of the models, at least the effect of the n table's stated
 * spread; in transition it is widened to half the difference between the laminar and
 * turbulent factors, since the blend there is the least certain part. Above Re 3.2e6 the
 * Nikuradse model is left out (with a warning) unless `options.extrapolate`.
 *
 * Sources as {@link profileFactor}.
 *
 * @param reynolds Reynolds number, dimensionless
 * @param options model (reported), chord, relative roughness, validity options
 * @returns factor, spread, byModel, regime, warnings
 *
 * @example
 * ```ts
 * import { profileFactorEstimate } from "./profile.ts";
 * const e = profileFactorEstimate(1e5);
 * if (e.regime !== "turbulent" || !(e.spread > 0 && e.spread < 0.02)) throw new Error();
 * ```
 */
export function profileFactorEstimate(
  reynolds: number,
  options?: ProfileOptions,
): ProfileFactorEstimate {
  requireFinite("reynolds", reynolds, "1", true);
  // An unknown model name is refused (it used to fall back silently to power-law-friction).
  if (options?.model !== undefined && !["laminar", ...TURBULENT_MODELS].includes(options.model)) {
    badModel(options.model);
  }
  const c = flowConstants();
  const warnings: Warning[] = [];
  const regime = flowRegime(reynolds);
  const chord = options?.chord ?? 0;
  const base = {
    chord,
    relativeRoughness: options?.relativeRoughness ?? 0,
    extrapolate: options?.extrapolate,
  };
  if (regime === "laminar") {
    const k = profileFactor(reynolds, { ...base, model: "laminar", warnings });
    options?.warnings?.push(...warnings);
    return Object.freeze({
      factor: k,
      spread: 0,
      byModel: Object.freeze({ laminar: k }),
      model: "laminar" as const,
      regime,
      warnings: Object.freeze(warnings),
    });
  }
  const byModel: Partial<Record<ProfileModel, number>> = {};
  const nMax = Math.exp(c.nTableLnRe[c.nTableLnRe.length - 1]);
  for (const m of TURBULENT_MODELS) {
    if (m === "power-law-nikuradse" && reynolds > nMax && !options?.extrapolate) {
      warnings.push({
        code: "model-left-out",
        message: `power-law-nikuradse left out: Re ${reynolds.toExponential(2)} is beyond the ` +
          `table's ${nMax.toExponential(2)}`,
      });
      continue;
    }
    const w: Warning[] = [];
    byModel[m] = profileFactor(reynolds, { ...base, model: m, warnings: w });
    for (const x of w) if (!warnings.some((y) => y.message === x.message)) warnings.push(x);
  }
  let model: ProfileModel = options?.model ?? "power-law-nikuradse";
  if (model === "laminar") {
    byModel.laminar = profileFactor(reynolds, { ...base, model: "laminar" });
  }
  if (byModel[model] === undefined) model = "power-law-friction";
  const vals = TURBULENT_MODELS.map((m) => byModel[m]).filter((v): v is number => v !== undefined);
  let spread = (Math.max(...vals) - Math.min(...vals)) / 2;
  if (byModel["power-law-nikuradse"] !== undefined) {
    const n = powerLawExponent(Math.max(reynolds, c.colebrookLimit), { extrapolate: true });
    // dk/dn for k = 2n/(2n+1) on the diameter, times the table's spread on n
    spread = Math.max(spread, 2 / (2 * n + 1) ** 2 * c.nSpread);
  }
  if (regime === "transition") {
    const kl = profileFactor(reynolds, { ...base, model: "laminar" });
    const kt = profileFactor(Math.max(reynolds, c.turbulentLimit), {
      ...base,
      model: model === "laminar" ? "power-law-nikuradse" : model,
    });
    spread = Math.max(spread, Math.abs(kt - kl) / 2);
  }
  options?.warnings?.push(...warnings);
  return Object.freeze({
    factor: byModel[model]!,
    spread,
    byModel: Object.freeze(byModel),
    model,
    regime,
    warnings: Object.freeze(warnings),
  });
}

/** Result of {@link profileFactorRange}. */
export interface ProfileFactorRange {
  /** Factor at the lowest and highest Reynolds number. */
  readonly atMin: number;
  /** The at max. */
  readonly atMax: number;
  /** Smallest and largest factor over the range (sampled). */
  readonly min: number;
  /** The max. */
  readonly max: number;
  /** (max − min) / mean of max and min: how much the factor changes over the range. */
  readonly relativeChange: number;
  /** Regimes crossed. */
  readonly regimes: readonly FlowRegime[];
  /** Log-spaced samples (25 points, plus the regime limits inside the range). */
  readonly samples: readonly { reynolds: number; factor: number; regime: FlowRegime }[];
}

/**
 * How much the profile factor changes over a site's flow range: {@link profileFactor} on 25
 * log-spaced Reynolds numbers (plus the regime limits that fall inside). Sources as
 * {@link profileFactor}.
 *
 * @param reynoldsMin lowest Reynolds number, > 0
 * @param reynoldsMax highest Reynolds number, ≥ reynoldsMin
 * @param options as {@link profileFactor}
 * @returns extremes, relative change, regimes crossed, samples
 *
 * @example
 * ```ts
 * import { profileFactorRange } from "./profile.ts";
 * const r = profileFactorRange(2e4, 2e5);
 * if (!(r.relativeChange > 0 && r.relativeChange < 0.03)) throw new Error();
 * ```
 */
export function profileFactorRange(
  reynoldsMin: number,
  reynoldsMax: number,
  options?: ProfileOptions,
): ProfileFactorRange {
  requireFinite("reynoldsMin", reynoldsMin, "1", true);
  requireFinite("reynoldsMax", reynoldsMax, "1", true);
  if (reynoldsMax < reynoldsMin) {
    throw new InputError(
      "reynoldsMax",
      String(reynoldsMax),
      `a value ≥ reynoldsMin ${reynoldsMin}`,
    );
  }
  const c = flowConstants();
  const res: number[] = [];
  const N = 25;
  for (let i = 0; i < N; i++) {
    res.push(reynoldsMin * Math.pow(reynoldsMax / reynoldsMin, i / (N - 1)));
  }
  for (const lim of [c.laminarLimit, c.turbulentLimit]) {
    if (lim > reynoldsMin && lim < reynoldsMax) res.push(lim);
  }
  res.sort((a, b) => a - b);
  const samples = res.map((re) => ({
    reynolds: re,
    factor: profileFactor(re, options),
    regime: flowRegime(re),
  }));
  const ks = samples.map((s) => s.factor);
  const min = Math.min(...ks);
  const max = Math.max(...ks);
  return Object.freeze({
    atMin: ks[0],
    atMax: ks[ks.length - 1],
    min,
    max,
    relativeChange: (max - min) / ((max + min) / 2),
    regimes: Object.freeze([...new Set(samples.map((s) => s.regime))]),
    samples: Object.freeze(samples),
  });
}
