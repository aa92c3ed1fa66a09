/**
 * What the technician needs on site: the spacing range to search from the stated input
 * uncertainties, and the spacing and transit times across an operating temperature range.
 *
 * @module
 */
import { InputError, NoPhysicalAnswerError, requireFinite, SnellpathError } from "../errors.ts";
import { type ClampOnInputs, clampOnPath, type LiningLayer, type WallMode } from "./path.ts";

/** Inputs of the search window that can carry an uncertainty (SI, same unit as the input). */
export type WindowInput =
  | "fluidSoundSpeed"
  | "wallThickness"
  | "wallSoundSpeed"
  | "wallShearSpeed"
  | "wedgeSoundSpeed"
  | "wedgeAngle"
  | "outsideDiameter"
  | "liningThickness"
  | "liningSoundSpeed";

/** Stated uncertainties (half-widths or standard uncertainties; the result says which). */
export type WindowUncertainties =
  & { readonly [K in WindowInput]?: number }
  & {
    /** Wedge temperature uncertainty, K, with the wedge's dc/dT, m/s/K. */
    readonly wedgeTemperature?: { readonly uncertainty: number; readonly dSoundSpeedDT: number };
  };

/** One input's contribution to the spacing. */
export interface WindowContribution {
  /** The input. */
  readonly input: WindowInput | "wedgeTemperature";
  /** Its uncertainty, SI (K for the wedge temperature). */
  readonly uncertainty: number;
  /** ∂spacing/∂x, m per SI unit (central secant over ±u). */
  readonly sensitivity: number;
  /** Signed spacing change if the true value is higher by u: ∂spacing/∂x · u, m. */
  readonly contribution: number;
  /** If the true value is higher than stated: move the transducers `further` apart or `closer`. */
  readonly ifHigher: "further" | "closer" | "no change";
  /** When ±u crosses a critical angle, what happened (one-sided secant used, or none). */
  readonly note?: string;
}

/** Result of {@link searchWindow}. */
export interface SearchWindow {
  /** Nominal spacing, m. */
  readonly spacing: number;
  /** Wall mode held fixed while varying the inputs. */
  readonly wallMode: WallMode;
  /** Per input, largest |contribution| first. */
  readonly contributions: readonly WindowContribution[];
  /** Root-sum-square of the contributions, m. */
  readonly rss: number;
  /** Sum of |contributions|, m (worst case, linear). */
  readonly worstCase: number;
  /** Spacing range to search: spacing ± worst case, m. */
  readonly range: { readonly min: number; readonly max: number };
  /** Spacing range at ± root-sum-square, m. */
  readonly rssRange: { readonly min: number; readonly max: number };
}

function withInput(p: ClampOnInputs, key: WindowInput, delta: number): ClampOnInputs {
  if (key === "liningThickness" || key === "liningSoundSpeed") {
    const list: readonly LiningLayer[] = p.lining === undefined
      ? []
      : Array.isArray(p.lining)
      ? p.lining as readonly LiningLayer[]
      : [p.lining as LiningLayer];
    const f = key === "liningThickness" ? "thickness" : "soundSpeed";
    return { ...p, lining: list.map((l) => ({ ...l, [f]: l[f] + delta })) };
  }
  return { ...p, [key]: (p[key] as number) + delta };
}

/**
 * The spacing range to search when no signal comes, from stated input uncertainties.
 *
 * Method: for each input x with uncertainty u, the signed contribution
 * c = [S(x+u) − S(x−u)] / 2 ≈ ∂S/∂x·u (central secant, exact for linear behaviour; one-sided
 * when one side crosses a critical angle), holding the wall mode of the nominal path fixed.
 * Combined: worst case Σ|c| and root-sum-square √Σc² (GUM law of propagation for uncorrelated
 * inputs, jcgm-100-2008, when the u are standard uncertainties). The wedge temperature enters as
 * u_c = |dc/dT|·u_T on the wedge speed.
 *
 * @param inputs the nominal clamp-on inputs (SI; see {@link clampOnPath})
 * @param uncertainties per input, SI, ≥ 0: speeds m/s, lengths m, angle rad
 * @returns the contributions (largest first), combined range and the direction to move
 * @throws {InputError} on a bad input or negative uncertainty
 * @throws {NoPhysicalAnswerError} when the nominal path has no answer
 *
 * Sources: jcgm-100-2008 (combination); Snell chain as in {@link clampOnPath}.
 *
 * @example
 * ```ts
 * import { searchWindow } from "./window.ts";
 * const w = searchWindow({ outsideDiameter: 0.1143, wallThickness: 0.00602,
 *   wallSoundSpeed: 5920, wallShearSpeed: 3230, fluidSoundSpeed: 1482,
 *   wedgeSoundSpeed: 2720, wedgeAngle: 38 * Math.PI / 180, traverses: 2 },
 *   { fluidSoundSpeed: 10, wallThickness: 0.0006 });
 * const c = w.contributions.find((x) => x.input === "fluidSoundSpeed")!;
 * if (c.ifHigher !== "further") throw new Error("faster liquid bends the beam further");
 * if (!(w.range.min < w.spacing && w.spacing < w.range.max)) throw new Error();
 * ```
 */
export function searchWindow(
  inputs: ClampOnInputs,
  uncertainties: WindowUncertainties,
): SearchWindow {
  const nominal = clampOnPath(inputs);
  const base: ClampOnInputs = { ...inputs, wallMode: nominal.wallMode };
  const S0 = nominal.spacing;
  const items: {
    key: WindowInput;
    label: WindowInput | "wedgeTemperature";
    u: number;
    uIn: number;
  }[] = [];
  if (uncertainties === null || typeof uncertainties !== "object") {
    throw new InputError("uncertainties", String(uncertainties), "an object of uncertainties");
  }
  for (const [k, v] of Object.entries(uncertainties)) {
    if (k === "wedgeTemperature") continue;
    const u = requireFinite(`uncertainties.${k}`, v as number, "SI");
    if (u < 0) throw new InputError(`uncertainties.${k}`, String(u), "0 or more");
    if (!KEYS.has(k as WindowInput)) {
      throw new InputError("uncertainties", k, `one of ${[...KEYS].join(", ")}, wedgeTemperature`);
    }
    if (k === "wallShearSpeed" && inputs.wallShearSpeed === undefined) continue;
    if ((k === "liningThickness" || k === "liningSoundSpeed") && inputs.lining === undefined) {
      continue;
    }
    items.push({ key: k as WindowInput, label: k as WindowInput, u, uIn: u });
  }
  const wt = uncertainties.wedgeTemperature;
  if (wt !== undefined) {
    const uT = requireFinite("uncertainties.wedgeTemperature.uncertainty", wt.uncertainty, "K");
    const d = requireFinite(
      "uncertainties.wedgeTemperature.dSoundSpeedDT",
      wt.dSoundSpeedDT,
      "m/s/K",
    );
    if (uT < 0) {
      throw new InputError("uncertainties.wedgeTemperature.uncertainty", String(uT), "0 or more");
    }
    items.push({ key: "wedgeSoundSpeed", label: "wedgeTemperature", u: Math.abs(d) * uT, uIn: uT });
  }
  const contributions: WindowContribution[] = items.map(({ key, label, u, uIn }) => {
    if (u === 0) {
      return {
        input: label,
        uncertainty: uIn,
        sensitivity: 0,
        contribution: 0,
        ifHigher: "no change",
      };
    }
    const hi = trySpacing(withInput(base, key, u));
    const lo = trySpacing(withInput(base, key, -u));
    let c: number;
    let note: string | undefined;
    if (hi !== undefined && lo !== undefined) c = (hi - lo) / 2;
    else if (hi !== undefined) {
      c = hi - S0;
      note = `at ${key} − u the path has no answer (critical angle); one-sided`;
    } else if (lo !== undefined) {
      c = S0 - lo;
      note = `at ${key} + u the path has no answer (critical angle); one-sided`;
    } else {
      c = 0;
      note = `at ${key} ± u the path has no answer (critical angle)`;
    }
    // For the wedge temperature, "higher" means a warmer wedge: speed changes by dc/dT·u_T.
    const sign = label === "wedgeTemperature" ? Math.sign(wt!.dSoundSpeedDT) : 1;
    const signed = c * sign;
    return {
      input: label,
      uncertainty: uIn,
      sensitivity: label === "wedgeTemperature" ? signed / uIn : c / u,
      contribution: signed,
      ifHigher: signed > 0 ? "further" : signed < 0 ? "closer" : "no change",
      note,
    };
  });
  contributions.sort((a, b) => Math.abs(b.contribution) - Math.abs(a.contribution));
  let worst = 0;
  let ss = 0;
  for (const c of contributions) {
    worst += Math.abs(c.contribution);
    ss += c.contribution * c.contribution;
  }
  const rss = Math.sqrt(ss);
  return {
    spacing: S0,
    wallMode: nominal.wallMode,
    contributions,
    rss,
    worstCase: worst,
    range: { min: S0 - worst, max: S0 + worst },
    rssRange: { min: S0 - rss, max: S0 + rss },
  };
}

const KEYS = new Set<WindowInput>([
  "fluidSoundSpeed",
  "wallThickness",
  "wallSoundSpeed",
  "wallShearSpeed",
  "wedgeSoundSpeed",
  "wedgeAngle",
  "outsideDiameter",
  "liningThickness",
  "liningSoundSpeed",
]);

function trySpacing(p: ClampOnInputs): number | undefined {
  try {
    return clampOnPath(p).spacing;
  } catch (e) {
    if (e instanceof NoPhysicalAnswerError) return undefined;
    if (e instanceof SnellpathError) return undefined;
    throw e;
  }
}

/** One row of {@link spacingOverTemperature}. */
export interface TemperatureRow {
  /** Temperature, K. */
  readonly temperature: number;
  /** Liquid sound speed, m/s. */
  readonly fluidSoundSpeed: number;
  /** Wedge sound speed, m/s. */
  readonly wedgeSoundSpeed: number;
  /** Spacing, m. */
  readonly spacing: number;
  /** Liquid angle, rad. */
  readonly fluidAngle: number;
  /** Zero-flow arrival, s. */
  readonly totalTime: number;
  /** Time in the liquid, s. */
  readonly fluidTime: number;
}

/**
 * Spacing and transit times across an operating temperature range.
 *
 * Method: at each temperature T the liquid speed is c_f(T) from the supplied function and the
 * wedge speed is c_w(T) = c_w0 + dc_w/dT·(T − T0) (linear, as the material entries give it); the
 * wall speeds likewise when `wall.dSoundSpeedDT` / `wall.dShearSpeedDT` are given; then
 * {@link clampOnPath} with the wall mode of the first temperature held. The wedge is taken at the
 * liquid temperature (a clamp-on wedge on a bare pipe follows it; common practice).
 *
 * @param inputs the clamp-on inputs less the two speeds that vary (SI)
 * @param options `temperatures` (K, 1…1000 of them), `fluidSoundSpeed(T)` (m/s), `wedge`
 *   `{ soundSpeed (m/s at T0), dSoundSpeedDT (m/s/K), referenceTemperature T0 (K) }`, optional
 *   `wall` `{ dSoundSpeedDT?, dShearSpeedDT?, referenceTemperature }`
 * @returns one row per temperature, and the spacing span (max − min), m
 * @throws {InputError} on bad inputs (non-finite speed returned by the function, …)
 * @throws {NoPhysicalAnswerError} when some temperature has no path
 *
 * Source: Snell chain ({@link clampOnPath}); linear temperature coefficients from the material
 * entries.
 *
 * @example
 * ```ts
 * import { spacingOverTemperature } from "./window.ts";
 * const r = spacingOverTemperature({ outsideDiameter: 0.1143, wallThickness: 0.00602,
 *   wallSoundSpeed: 5920, wallShearSpeed: 3230, wedgeAngle: 38 * Math.PI / 180, traverses: 2 },
 *   { temperatures: [283.15, 323.15], fluidSoundSpeed: (T) => 1482 + 2.4 * (T - 293.15),
 *     wedge: { soundSpeed: 2720, dSoundSpeedDT: -2.5, referenceTemperature: 293.15 } });
 * if (!(r.rows[1].spacing > r.rows[0].spacing)) throw new Error("warmer: longer spacing");
 * ```
 */
export function spacingOverTemperature(
  inputs: Omit<ClampOnInputs, "fluidSoundSpeed" | "wedgeSoundSpeed">,
  options: {
    readonly temperatures: readonly number[];
    readonly fluidSoundSpeed: (temperature: number) => number;
    readonly wedge: {
      readonly soundSpeed: number;
      readonly dSoundSpeedDT: number;
      readonly referenceTemperature: number;
    };
    readonly wall?: {
      readonly dSoundSpeedDT?: number;
      readonly dShearSpeedDT?: number;
      readonly referenceTemperature: number;
    };
  },
): { readonly rows: readonly TemperatureRow[]; readonly spacingSpan: number } {
  const Ts = options?.temperatures;
  if (!Array.isArray(Ts) || Ts.length === 0 || Ts.length > 1000) {
    throw new InputError("temperatures", String(Ts), "1 to 1000 temperatures in K");
  }
  if (typeof options.fluidSoundSpeed !== "function") {
    throw new InputError("fluidSoundSpeed", typeof options.fluidSoundSpeed, "a function c(T)");
  }
  const w = options.wedge;
  requireFinite("wedge.soundSpeed", w?.soundSpeed, "m/s", true);
  requireFinite("wedge.dSoundSpeedDT", w.dSoundSpeedDT, "m/s/K");
  requireFinite("wedge.referenceTemperature", w.referenceTemperature, "K", true);
  let mode: WallMode | undefined = inputs.wallMode === "auto" ? undefined : inputs.wallMode;
  const rows: TemperatureRow[] = Ts.map((T, i) => {
    requireFinite(`temperatures[${i}]`, T, "K", true);
    const cf = options.fluidSoundSpeed(T);
    requireFinite(`fluidSoundSpeed(${T} K)`, cf, "m/s", true);
    const cw = w.soundSpeed + w.dSoundSpeedDT * (T - w.referenceTemperature);
    requireFinite(`wedge sound speed at ${T} K`, cw, "m/s", true);
    let wallL = inputs.wallSoundSpeed;
    let wallS = inputs.wallShearSpeed;
    if (options.wall) {
      const dT = T - options.wall.referenceTemperature;
      if (options.wall.dSoundSpeedDT !== undefined) wallL += options.wall.dSoundSpeedDT * dT;
      if (wallS !== undefined && options.wall.dShearSpeedDT !== undefined) {
        wallS += options.wall.dShearSpeedDT * dT;
      }
    }
    const p = clampOnPath({
      ...inputs,
      wallSoundSpeed: wallL,
      wallShearSpeed: wallS,
      wallMode: mode,
      fluidSoundSpeed: cf,
      wedgeSoundSpeed: cw,
    });
    mode ??= p.wallMode;
    return {
      temperature: T,
      fluidSoundSpeed: cf,
      wedgeSoundSpeed: cw,
      spacing: p.spacing,
      fluidAngle: p.fluidAngle,
      totalTime: p.totalTime,
      fluidTime: p.fluidTime,
    };
  });
  let lo = Infinity;
  let hi = -Infinity;
  for (const r of rows) {
    lo = Math.min(lo, r.spacing);
    hi = Math.max(hi, r.spacing);
  }
  return { rows, spacingSpan: hi - lo };
}
