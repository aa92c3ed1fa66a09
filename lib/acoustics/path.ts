/**
 * The acoustic path of a clamp-on transit-time mounting: Snell's law through wedge → pipe wall
 * → lining(s) → liquid, critical angles, which wall modes reach the liquid, and the geometry of
 * the path (spacing per mounting, path lengths, times in each layer).
 *
 * Conventions (DESIGN.md): angles from the pipe-wall normal, radians; `spacing` is the axial
 * distance between the beam's entry and exit points on the OUTER pipe surface; `traverses`
 * counts crossings of the bore (1 = Z, 2 = V, 4 = W, up to 8; odd counts put the transducers on
 * opposite sides). The wall and each lining are crossed twice per mounting (in and out),
 * whatever the traverse count.
 *
 * @module
 */
import { InputError, NoPhysicalAnswerError, requireFinite } from "../errors.ts";

/** Which bulk wave the pipe wall carries. */
export type WallMode = "longitudinal" | "shear";

/** One lining layer: thickness (m) and longitudinal sound speed (m/s). */
export interface LiningLayer {
  /** Layer thickness, m (> 0). */
  readonly thickness: number;
  /** Longitudinal sound speed in the layer, m/s (> 0). */
  readonly soundSpeed: number;
}

/** Optional transducer (wedge) geometry. */
export interface WedgeGeometry {
  /** Height of the element's centre above the wedge's contact face, m (≥ 0). */
  readonly elementHeight?: number;
  /**
   * Axial distance from the beam's index point (where it leaves the wedge) to the housing's
   * reference mark, m; positive when the mark lies further from the other transducer.
   */
  readonly indexOffset?: number;
}

/** Inputs of {@link clampOnPath}, all SI. */
export interface ClampOnInputs {
  /** Pipe outside diameter, m. */
  readonly outsideDiameter: number;
  /** Pipe wall thickness, m (less than the outside radius). */
  readonly wallThickness: number;
  /** Longitudinal sound speed of the wall, m/s. */
  readonly wallSoundSpeed: number;
  /** Shear sound speed of the wall, m/s (needed to consider the shear mode). */
  readonly wallShearSpeed?: number;
  /** Force a wall mode; default `"auto"` (see {@link PRIMARY_MODE_RULE}). */
  readonly wallMode?: WallMode | "auto";
  /** Lining layer(s) from the wall inwards. */
  readonly lining?: LiningLayer | readonly LiningLayer[];
  /** Sound speed of the liquid, m/s. */
  readonly fluidSoundSpeed: number;
  /** Longitudinal sound speed of the wedge, m/s. */
  readonly wedgeSoundSpeed: number;
  /** Beam angle in the wedge from the contact-face normal, rad, in (0, π/2). */
  readonly wedgeAngle: number;
  /** Crossings of the bore: integer 1…8. */
  readonly traverses: number;
  /** Optional wedge geometry, for wedge times and reference-mark distance. */
  readonly wedge?: WedgeGeometry;
}

/** One wall mode's path, whether or not it reaches the liquid. */
export interface ModePath {
  /** Wall mode. */
  readonly wallMode: WallMode;
  /** Wall speed of this mode, m/s. */
  readonly wallSoundSpeed: number;
  /** Does this mode carry sound into the liquid? */
  readonly reachesLiquid: boolean;
  /** `primary` (the spacing is for it), `secondary` (also arrives), `blocked`. */
  readonly role: "primary" | "secondary" | "blocked";
  /** Why blocked, when blocked. */
  readonly blockedBy?: string;
  /** Refraction angle in the wall, rad (when the mode propagates in the wall). */
  readonly wallAngle?: number;
  /** Spacing for this mode, m (when it reaches the liquid). */
  readonly spacing?: number;
  /** Time in the wall, in and out, s. */
  readonly wallTime?: number;
  /** Arrival time at zero flow (wall + lining + liquid + wedge when known), s. */
  readonly totalTime?: number;
}

/** Result of {@link clampOnPath}, SI. */
export interface ClampOnPath {
  /** Axial distance between the beam's entry and exit points on the outer pipe surface, m. */
  readonly spacing: number;
  /** Refraction angle in the liquid, rad. */
  readonly fluidAngle: number;
  /** Refraction angle in the wall for the primary mode, rad. */
  readonly wallAngle: number;
  /** Wall mode the spacing is for. */
  readonly wallMode: WallMode;
  /** Wall speed of that mode, m/s. */
  readonly wallModeSpeed: number;
  /** Refraction angles in the lining layers, rad. */
  readonly liningAngles: readonly number[];
  /** Inside diameter of the wall (OD − 2·wall), m. */
  readonly insideDiameter: number;
  /** Diameter of the liquid bore (inside diameter − 2·Σ lining), m. */
  readonly boreDiameter: number;
  /** Length of the path in the liquid, N·D_bore / cos θ_f, m. */
  readonly fluidPathLength: number;
  /** Time in the liquid at zero flow, s. */
  readonly fluidTime: number;
  /** Time in the wall, in and out, s. */
  readonly wallTime: number;
  /** Time in the lining layers, in and out, s. */
  readonly liningTime: number;
  /** Time in both wedges, s (when the element height is given). */
  readonly wedgeTime?: number;
  /** Arrival time at zero flow: wall + lining + liquid (+ wedge when known), s. */
  readonly totalTime: number;
  /** Crossings of the bore. */
  readonly traverses: number;
  /** Every wall mode considered, with its role. */
  readonly modes: readonly ModePath[];
  /** Distance between the housings' reference marks, m (when `wedge.indexOffset` is given). */
  readonly referenceMarkDistance?: number;
  /** Axial distance between the element centres, m (when `wedge.elementHeight` is given). */
  readonly elementSpacing?: number;
  /** Snell invariant sin θ / c, s/m. */
  readonly snellInvariant: number;
  /** Liquid sound speed used, m/s. */
  readonly fluidSoundSpeed: number;
  /** Wedge sound speed used, m/s. */
  readonly wedgeSoundSpeed: number;
  /** Wedge angle used, rad. */
  readonly wedgeAngle: number;
  /** Outside diameter used, m. */
  readonly outsideDiameter: number;
  /** Wall thickness used, m. */
  readonly wallThickness: number;
  /** Longitudinal wall speed given, m/s. */
  readonly wallSoundSpeed: number;
  /** Lining layers used. */
  readonly lining: readonly LiningLayer[];
}

/**
 * The rule that picks the wall mode the spacing is for, when `wallMode` is `"auto"`
 * (common practice, source id `common-practice`): the longitudinal mode when it reaches the
 * liquid and its wall angle is at most {@link GRAZING_LIMIT} (70°); otherwise the shear mode when
 * it reaches the liquid; otherwise the longitudinal mode even near grazing. Beyond the first
 * critical angle (steel behind an acrylic-class wedge at about 38°) only shear remains.
 */
export const PRIMARY_MODE_RULE: string =
  "longitudinal when it reaches the liquid at a wall angle of at most 70°, otherwise shear " +
  "(common practice)";

/** Wall angle (rad) above which a longitudinal wall wave is taken as too near grazing. */
export const GRAZING_LIMIT: number = 70 * Math.PI / 180;
const SIN_GRAZING = Math.sin(GRAZING_LIMIT);

const EMPTY: readonly LiningLayer[] = Object.freeze([]);
const DEG = 180 / Math.PI;

/**
 * Critical angle in a first medium against a faster second medium, by Snell's law:
 * θ_c = asin(c₁ / c₂). Returns `undefined` when c₂ ≤ c₁ (no critical angle).
 *
 * @param incidentSpeed c₁, sound speed of the incident wave, m/s (> 0)
 * @param refractedSpeed c₂, sound speed of the refracted wave, m/s (> 0)
 * @returns the critical angle in rad, or undefined
 *
 * Sources: Snell's law (any acoustics text); values checked against NDT handbooks in
 * tests/reference/acoustics_critical_angles.test.ts.
 *
 * @example
 * ```ts
 * import { criticalAngle } from "./path.ts";
 * const first = criticalAngle(2730, 5920)!; // acrylic wedge on steel, longitudinal
 * if (Math.abs(first * 180 / Math.PI - 27.46) > 0.01) throw new Error();
 * if (criticalAngle(2730, 1480) !== undefined) throw new Error();
 * ```
 */
export function criticalAngle(incidentSpeed: number, refractedSpeed: number): number | undefined {
  requireFinite("incidentSpeed", incidentSpeed, "m/s", true);
  requireFinite("refractedSpeed", refractedSpeed, "m/s", true);
  return refractedSpeed > incidentSpeed ? Math.asin(incidentSpeed / refractedSpeed) : undefined;
}

/** Critical wedge angles of a mounting, rad; `undefined` where there is none. */
export interface CriticalAngles {
  /** First critical angle: longitudinal wave in the wall goes evanescent. */
  readonly wallLongitudinal?: number;
  /** Second critical angle: shear wave in the wall goes evanescent. */
  readonly wallShear?: number;
  /** Per lining layer. */
  readonly lining: readonly (number | undefined)[];
  /** The liquid goes evanescent. */
  readonly fluid?: number;
}

/**
 * Critical wedge angles for every layer of a mounting, by Snell's law (θ_c = asin(c_wedge /
 * c_layer) in the wedge). Because sin θ / c is invariant along the chain, each layer's critical
 * angle depends only on the wedge speed and that layer's speed.
 *
 * @param inputs wedge speed and the layer speeds, m/s (as in {@link ClampOnInputs})
 * @returns the critical angles, rad
 *
 * Source: Snell's law; handbook values compared in tests/reference/acoustics_critical_angles.test.ts.
 *
 * @example
 * ```ts
 * import { criticalAngles } from "./path.ts";
 * const c = criticalAngles({ wedgeSoundSpeed: 2730, wallSoundSpeed: 5920, wallShearSpeed: 3240,
 *   fluidSoundSpeed: 1482 });
 * if (!(c.wallShear! > c.wallLongitudinal!)) throw new Error();
 * if (c.fluid !== undefined) throw new Error("water is slower than acrylic");
 * ```
 */
export function criticalAngles(inputs: {
  readonly wedgeSoundSpeed: number;
  readonly wallSoundSpeed: number;
  readonly wallShearSpeed?: number;
  readonly lining?: LiningLayer | readonly LiningLayer[];
  readonly fluidSoundSpeed: number;
}): CriticalAngles {
  const cw = inputs.wedgeSoundSpeed;
  const layers = liningList(inputs.lining);
  return {
    wallLongitudinal: criticalAngle(cw, inputs.wallSoundSpeed),
    wallShear: inputs.wallShearSpeed === undefined
      ? undefined
      : criticalAngle(cw, inputs.wallShearSpeed),
    lining: layers.map((l) => criticalAngle(cw, l.soundSpeed)),
    fluid: criticalAngle(cw, inputs.fluidSoundSpeed),
  };
}

function liningList(l: ClampOnInputs["lining"]): readonly LiningLayer[] {
  if (l === undefined) return EMPTY;
  return Array.isArray(l) ? l as readonly LiningLayer[] : [l as LiningLayer];
}

function positive(field: string, v: unknown, unit: string): number {
  if (typeof v !== "number" || !Number.isFinite(v) || !(v > 0)) {
    throw new InputError(field, String(v), `a finite number greater than 0 (${unit})`);
  }
  return v;
}

/**
 * Validate the inputs of {@link clampOnPath}; throws an InputError naming the field.
 *
 * @param p inputs, SI
 * @returns the lining layers as a list
 *
 * @example
 * ```ts
 * import { validateClampOnInputs } from "./path.ts";
 * let threw = false;
 * try {
 *   validateClampOnInputs({ outsideDiameter: 0.1, wallThickness: 0.06, wallSoundSpeed: 5900,
 *     fluidSoundSpeed: 1480, wedgeSoundSpeed: 2700, wedgeAngle: 0.6, traverses: 2 });
 * } catch { threw = true; }
 * if (!threw) throw new Error("wall beyond radius");
 * ```
 */
export function validateClampOnInputs(p: ClampOnInputs): readonly LiningLayer[] {
  if (p === null || typeof p !== "object") {
    throw new InputError("inputs", String(p), "an object of clamp-on inputs");
  }
  const od = positive("outsideDiameter", p.outsideDiameter, "m");
  const wall = positive("wallThickness", p.wallThickness, "m");
  positive("wallSoundSpeed", p.wallSoundSpeed, "m/s");
  if (p.wallShearSpeed !== undefined) positive("wallShearSpeed", p.wallShearSpeed, "m/s");
  positive("fluidSoundSpeed", p.fluidSoundSpeed, "m/s");
  positive("wedgeSoundSpeed", p.wedgeSoundSpeed, "m/s");
  const a = positive("wedgeAngle", p.wedgeAngle, "rad");
  if (!(a < Math.PI / 2)) {
    throw new InputError("wedgeAngle", String(a), "an angle between 0 and 90 deg (in rad)");
  }
  const n = p.traverses;
  if (typeof n !== "number" || !Number.isInteger(n) || n < 1 || n > 8) {
    throw new InputError("traverses", String(n), "a whole number from 1 to 8");
  }
  if (!(wall < od / 2)) {
    throw new InputError(
      "wallThickness",
      `${wall} m`,
      `less than the outside radius ${od / 2} m`,
    );
  }
  if (
    p.wallMode !== undefined && p.wallMode !== "auto" && p.wallMode !== "longitudinal" &&
    p.wallMode !== "shear"
  ) {
    throw new InputError("wallMode", String(p.wallMode), "auto, longitudinal or shear");
  }
  if (p.wallMode === "shear" && p.wallShearSpeed === undefined) {
    throw new InputError("wallShearSpeed", "nothing", "the wall's shear speed for wallMode shear");
  }
  const layers = liningList(p.lining);
  let sum = 0;
  layers.forEach((l, i) => {
    if (l === null || typeof l !== "object") {
      throw new InputError(`lining[${i}]`, String(l), "{ thickness, soundSpeed }");
    }
    sum += positive(`lining[${i}].thickness`, l.thickness, "m");
    positive(`lining[${i}].soundSpeed`, l.soundSpeed, "m/s");
  });
  if (sum > 0 && !(sum < od / 2 - wall)) {
    throw new InputError("lining.thickness", `${sum} m in total`, `less than the inside radius`);
  }
  if (p.wedge !== undefined) {
    if (p.wedge === null || typeof p.wedge !== "object") {
      throw new InputError("wedge", String(p.wedge), "{ elementHeight?, indexOffset? } (m)");
    }
    const h = p.wedge.elementHeight;
    if (h !== undefined && (typeof h !== "number" || !Number.isFinite(h) || h < 0)) {
      throw new InputError("wedge.elementHeight", String(h), "a length of 0 m or more");
    }
    const o = p.wedge.indexOffset;
    if (o !== undefined && (typeof o !== "number" || !Number.isFinite(o))) {
      throw new InputError("wedge.indexOffset", String(o), "a finite length in m");
    }
  }
  return layers;
}

/**
 * The acoustic path of a clamp-on mounting.
 *
 * Method: Snell's law with the invariant s = sin θ_wedge / c_wedge; in each layer sin θ = s·c,
 * and a layer with s·c ≥ 1 is beyond its critical angle (evanescent, no propagating wave; thin
 * evanescent layers are not tunnelled through). The wall may carry a longitudinal or a shear
 * (mode-converted) wave; each is evaluated, and {@link PRIMARY_MODE_RULE} picks the one the
 * spacing is for. The liquid angle depends only on s and c_f, not on the wall.
 *
 * - spacing = N·D_bore·tan θ_f + 2·(t_wall·tan θ_wall + Σ t_lining·tan θ_lining)
 * - liquid path L = N·D_bore / cos θ_f; times t = thickness / (c·cos θ), wall and lining ×2
 * - wedge time 2·h / (c_w·cos θ_w); element spacing = spacing + 2·h·tan θ_w;
 *   reference-mark distance = spacing + 2·indexOffset
 *
 * @param inputs geometry and speeds, SI (see {@link ClampOnInputs}): diameters and thicknesses
 *   in m, speeds in m/s, wedge angle in rad (0, π/2), traverses 1…8
 * @returns the path, SI (see {@link ClampOnPath})
 * @throws {InputError} on a missing, non-finite, non-positive or inconsistent input
 * @throws {NoPhysicalAnswerError} when no wave reaches the liquid; names the critical angle(s)
 *
 * Validity: straight rays through flat layers (the wall curvature over the beam is neglected;
 * fine while the wall is thin against the diameter); bulk waves only. Sources: Snell's law;
 * rule of mode choice `common-practice`.
 *
 * @example
 * ```ts
 * import { clampOnPath } from "./path.ts";
 * const p = clampOnPath({ outsideDiameter: 0.1143, wallThickness: 0.00602,
 *   wallSoundSpeed: 5920, wallShearSpeed: 3230, fluidSoundSpeed: 1482,
 *   wedgeSoundSpeed: 2720, wedgeAngle: 38 * Math.PI / 180, traverses: 2 });
 * if (p.wallMode !== "shear") throw new Error("steel behind 38 deg acrylic carries shear");
 * if (Math.abs(p.spacing - 0.0857) > 0.0005) throw new Error(String(p.spacing));
 * ```
 */
export function clampOnPath(inputs: ClampOnInputs): ClampOnPath {
  const layers = validateClampOnInputs(inputs);
  const {
    outsideDiameter: od,
    wallThickness: wall,
    wallSoundSpeed: cL,
    wallShearSpeed: cS,
    fluidSoundSpeed: cf,
    wedgeSoundSpeed: cw,
    wedgeAngle: aw,
    traverses: n,
  } = inputs;
  const s = Math.sin(aw) / cw;

  // Liquid
  const sf = s * cf;
  if (!(sf < 1)) {
    throw new NoPhysicalAnswerError(
      `no wave reaches the liquid: wedge angle ${deg(aw)}° is at or beyond the critical ` +
        `angle ${deg(Math.asin(cw / cf))}° for the liquid (${cf} m/s behind a ${cw} m/s wedge)`,
    );
  }
  const cosf = Math.sqrt(1 - sf * sf);
  const tanf = sf / cosf;

  const { liningAngles, liningShift, liningTime, liningThickness } = liningPath(layers, s, aw, cw);

  const id = od - 2 * wall;
  const bore = id - 2 * liningThickness;
  const fluidPathLength = n * bore / cosf;
  const fluidTime = fluidPathLength / cf;
  const liquidShift = n * bore * tanf;

  let wedgeTime: number | undefined;
  let elementShift = 0;
  const h = inputs.wedge?.elementHeight;
  if (h !== undefined) {
    const cosw = Math.cos(aw);
    wedgeTime = 2 * h / (cw * cosw);
    elementShift = 2 * h * Math.tan(aw);
  }
  const fixed = liningTime + (wedgeTime ?? 0) + fluidTime;

  // Wall modes: pick the primary one from the refraction sines, then build each record once.
  const primary = primaryWallMode(inputs.wallMode ?? "auto", cL, cS, s, wall, aw, cw);
  const inner = liquidShift + liningShift;
  const lmode = wallModePath(
    "longitudinal",
    cL,
    s,
    wall,
    inner,
    fixed,
    aw,
    cw,
    primary === "longitudinal" ? "primary" : "secondary",
  );
  const smode = cS === undefined ? undefined : wallModePath(
    "shear",
    cS,
    s,
    wall,
    inner,
    fixed,
    aw,
    cw,
    primary === "shear" ? "primary" : "secondary",
  );
  const modes: ModePath[] = smode ? [lmode, smode] : [lmode];
  const pm = primary === "longitudinal" ? lmode : smode!;

  const spacing = pm.spacing!;
  const out: ClampOnPath = {
    spacing,
    fluidAngle: Math.asin(sf),
    wallAngle: pm.wallAngle!,
    wallMode: primary,
    wallModeSpeed: pm.wallSoundSpeed,
    liningAngles,
    insideDiameter: id,
    boreDiameter: bore,
    fluidPathLength,
    fluidTime,
    wallTime: pm.wallTime!,
    liningTime,
    wedgeTime,
    totalTime: pm.totalTime!,
    traverses: n,
    modes,
    referenceMarkDistance: inputs.wedge?.indexOffset === undefined
      ? undefined
      : spacing + 2 * inputs.wedge.indexOffset,
    elementSpacing: h === undefined ? undefined : spacing + elementShift,
    snellInvariant: s,
    fluidSoundSpeed: cf,
    wedgeSoundSpeed: cw,
    wedgeAngle: aw,
    outsideDiameter: od,
    wallThickness: wall,
    wallSoundSpeed: cL,
    lining: layers,
  };
  if (!finitePath(out)) {
    // Sizes and speeds each finite and positive can still overflow or divide to ±Infinity
    // (a speed of 1e-320 m/s, a diameter of 1e308 m): refuse rather than return them.
    throw new InputError(
      "inputs",
      "sizes and speeds whose path times or spacing are not finite numbers",
      "the sizes (m) and sound speeds (m/s) of a real mounting",
    );
  }
  return out;
}

/** Angles, axial shift (in and out), time (in and out) and total thickness of the lining. */
function liningPath(
  layers: readonly LiningLayer[],
  s: number,
  aw: number,
  cw: number,
): { liningAngles: number[]; liningShift: number; liningTime: number; liningThickness: number } {
  const nl = layers.length;
  const liningAngles: number[] = new Array(nl);
  let liningShift = 0;
  let liningTime = 0;
  let liningThickness = 0;
  for (let i = 0; i < nl; i++) {
    const l = layers[i];
    const sl = s * l.soundSpeed;
    if (!(sl < 1)) {
      throw new NoPhysicalAnswerError(
        `no wave reaches the liquid: wedge angle ${deg(aw)}° is at or beyond the critical ` +
          `angle ${deg(Math.asin(cw / l.soundSpeed))}° for lining layer ${i + 1} ` +
          `(${l.soundSpeed} m/s)`,
      );
    }
    const cl = Math.sqrt(1 - sl * sl);
    liningAngles[i] = Math.asin(sl);
    liningShift += l.thickness * sl / cl;
    liningTime += l.thickness / (l.soundSpeed * cl);
    liningThickness += l.thickness;
  }
  liningShift *= 2;
  liningTime *= 2;
  return { liningAngles, liningShift, liningTime, liningThickness };
}

/**
 * The wall mode the spacing is for ({@link PRIMARY_MODE_RULE}): the forced one if it propagates;
 * else longitudinal below grazing, else shear, else longitudinal; none throws.
 */
function primaryWallMode(
  forced: NonNullable<ClampOnInputs["wallMode"]>,
  cL: number,
  cS: number | undefined,
  s: number,
  wall: number,
  aw: number,
  cw: number,
): WallMode {
  const sL = s * cL;
  const sS = cS === undefined ? 2 : s * cS;
  const lOk = sL < 1;
  const sOk = sS < 1;
  if (forced === "longitudinal" || forced === "shear") {
    if (!(forced === "longitudinal" ? lOk : sOk)) {
      const m = wallModePath(
        forced,
        forced === "longitudinal" ? cL : cS!,
        s,
        wall,
        0,
        0,
        aw,
        cw,
        "blocked",
      );
      throw new NoPhysicalAnswerError(`no ${forced} wave in the wall: ${m.blockedBy}`);
    }
    return forced;
  }
  if (lOk && sL <= SIN_GRAZING) return "longitudinal";
  if (sOk) return "shear";
  if (lOk) return "longitudinal";
  const why = [
    wallModePath("longitudinal", cL, s, wall, 0, 0, aw, cw, "blocked").blockedBy,
    cS === undefined
      ? "shear speed of the wall not given"
      : wallModePath("shear", cS, s, wall, 0, 0, aw, cw, "blocked").blockedBy,
  ];
  throw new NoPhysicalAnswerError(`no wave reaches the liquid: ${why.join("; ")}`);
}

function finitePath(p: ClampOnPath): boolean {
  const f = Number.isFinite;
  if (
    !f(p.spacing) || !f(p.fluidPathLength) || !f(p.fluidTime) || !f(p.wallTime) ||
    !f(p.liningTime) || !f(p.totalTime) || !f(p.wedgeTime ?? 0) ||
    !f(p.elementSpacing ?? 0) || !f(p.referenceMarkDistance ?? 0)
  ) return false;
  for (const m of p.modes) {
    if (m.reachesLiquid && (!f(m.spacing!) || !f(m.wallTime!) || !f(m.totalTime!))) return false;
  }
  return true;
}

function wallModePath(
  mode: WallMode,
  c: number,
  s: number,
  wall: number,
  innerShift: number,
  innerTime: number,
  aw: number,
  cw: number,
  role: "primary" | "secondary" | "blocked",
): ModePath {
  const sw = s * c;
  if (!(sw < 1)) {
    return {
      wallMode: mode,
      wallSoundSpeed: c,
      reachesLiquid: false,
      role: "blocked",
      // Built on demand: message formatting is the costliest part of a blocked mode.
      get blockedBy(): string {
        const which = mode === "longitudinal" ? "first" : "second";
        return `wall ${mode} wave beyond the ${which} critical angle ` +
          `${deg(Math.asin(cw / c))}° (wedge angle ${deg(aw)}°, wall ${c} m/s)`;
      },
    };
  }
  const cosw = Math.sqrt(1 - sw * sw);
  const wallTime = 2 * wall / (c * cosw);
  return {
    wallMode: mode,
    wallSoundSpeed: c,
    reachesLiquid: true,
    role,
    wallAngle: Math.asin(sw),
    spacing: innerShift + 2 * wall * sw / cosw,
    wallTime,
    totalTime: innerTime + wallTime,
  };
}

function deg(rad: number): string {
  return String(Number((rad * DEG).toFixed(2)));
}
