/**
 * Installation drawings as self-contained SVG strings: the pipe in cross-section with the beam
 * planes, the pipe along its axis with the zig-zag beam path and the transducer spacing, and
 * the straight run with its admissible zone. Geometry is drawn from the numbers given (a
 * result of lib/acoustics or lib/installation); nothing is computed here beyond placing lines.
 * Inputs are SI (m, rad); labels use a display unit (default mm).
 *
 * @module
 */
import { InputError } from "../errors.ts";
import { formatCompact, formatQuantity } from "./format.ts";

/** A length or angle label: 4 significant digits, trailing zeros dropped. */
const q = (v: number, unit: string, digits = 4) => formatQuantity(v, unit, digits, true);
import {
  arrowHead,
  c,
  dimensionX,
  finite,
  INK,
  line,
  niceTicks,
  points,
  positive,
  svgDocument,
  text,
  textWidth,
} from "./svg.ts";

const WALL_FILL = "#b9b9b9";
const LINING_FILL = "#e3d3a4";
const FLUID_FILL = "#e4eef6";
const BEAM = "#1b5e8c";
const TRANSDUCER_FILL = "#4a4a4a";
const ACCENT = "#8a1c1c";

/**
 * The project's own colour for each mounting, used alike in tables, drawings and charts:
 * Z teal, V raspberry, N violet, W amber; other traverse counts slate.
 */
export const MOUNTING_COLOURS: Readonly<Record<string, string>> = Object.freeze({
  Z: "#0e7c66",
  V: "#b8336a",
  N: "#5b4fa8",
  W: "#c07a00",
});

/**
 * Colour of a mounting by its number of traverses ({@link MOUNTING_COLOURS}; slate otherwise).
 *
 * @param traverses bore crossings (1 Z, 2 V, 4 W)
 * @returns a CSS hex colour
 *
 * @example
 * ```ts
 * import { mountingColour, MOUNTING_COLOURS } from "./drawings.ts";
 * if (mountingColour(2) !== MOUNTING_COLOURS.V) throw new Error();
 * ```
 */
export function mountingColour(traverses: number): string {
  return MOUNTING_COLOURS[mountingName(traverses)] ?? "#4f5b66";
}

/** Trade name of a mounting by its number of traverses (V, Z, W; others by count). */
export function mountingName(traverses: number): string {
  return traverses === 1
    ? "Z"
    : traverses === 2
    ? "V"
    : traverses === 3
    ? "N"
    : traverses === 4
    ? "W"
    : `${traverses}-traverse`;
}

function checkTraverses(v: unknown): number {
  if (!Number.isInteger(v) || (v as number) < 1 || (v as number) > 16) {
    throw new InputError("traverses", String(v), "an integer from 1 to 16");
  }
  return v as number;
}

function checkAngle(field: string, v: unknown): number {
  finite(field, v);
  if (!((v as number) >= 0 && (v as number) < Math.PI / 2)) {
    throw new InputError(field, String(v), "an angle from the wall normal, 0 ≤ θ < π/2 rad");
  }
  return v as number;
}

interface Bore {
  od: number;
  wall: number;
  lining: number;
  id: number;
}

function bore(
  o: { outsideDiameter: unknown; wallThickness: unknown; liningThickness?: unknown },
): Bore {
  const od = positive("outsideDiameter", o.outsideDiameter);
  const wall = positive("wallThickness", o.wallThickness);
  const lining = o.liningThickness === undefined ? 0 : finite("liningThickness", o.liningThickness);
  if (lining < 0) throw new InputError("liningThickness", String(lining), "a thickness ≥ 0 m");
  const id = od - 2 * wall - 2 * lining;
  if (!(id > 0)) {
    throw new InputError(
      "wallThickness",
      `${wall} m (+ lining ${lining} m) on OD ${od} m`,
      "wall and lining thinner than half the outside diameter",
    );
  }
  return { od, wall, lining, id };
}

/** Arguments of {@link svgPipeSection}. */
export interface PipeSectionOptions {
  /** Outside diameter (m). */
  readonly outsideDiameter: number;
  /** Wall thickness (m). */
  readonly wallThickness: number;
  /** Lining thickness (m), if lined. */
  readonly liningThickness?: number;
  /** Traverses per path: odd puts the transducers on opposite sides, even on one side. */
  readonly traverses: number;
  /** Beam angle in the fluid from the wall normal (rad), for the caption. */
  readonly fluidAngle: number;
  /** Number of acoustic paths (beam planes), evenly turned about the axis (default 1). */
  readonly paths?: number;
  /**
   * Angle of the (first) path plane from the vertical, rad, counted clockwise looking
   * downstream (default 0: vertical, transducers at the top). When given, the transducer labels
   * carry their clock positions and the notes state the viewing direction.
   */
  readonly pathPlane?: number;
  /** Clock-position text per transducer end (first end, opposite end), e.g. ["3:00", "9:00"]. */
  readonly clock?: readonly [string, string];
  /** Display unit of lengths (default "mm"). */
  readonly unit?: string;
  /** Title (default "Pipe cross-section"). */
  readonly title?: string;
}

/**
 * The pipe in cross-section: wall, lining and bore as rings, the diametral plane of each beam,
 * and where the transducers sit on the circumference for the mounting (both on one side for an
 * even number of traverses, on opposite sides for an odd one). A wall or lining thinner than
 * 2.5 drawing units is widened and the drawing says so.
 *
 * @param o outside diameter, wall, lining (m), traverses, fluid angle (rad), paths, unit
 * @returns the SVG markup
 * @throws {InputError} on non-finite, negative or inconsistent dimensions
 *
 * @example
 * ```ts
 * import { svgPipeSection } from "./drawings.ts";
 * const svg = svgPipeSection({ outsideDiameter: 0.1143, wallThickness: 0.00602,
 *   traverses: 2, fluidAngle: 0.38 });
 * if (!svg.includes("<circle") || !svg.includes("114.3 mm") || svg.includes("NaN")) {
 *   throw new Error("section");
 * }
 * ```
 */
export function svgPipeSection(o: PipeSectionOptions): string {
  const b = bore(o);
  const n = checkTraverses(o.traverses);
  const theta = checkAngle("fluidAngle", o.fluidAngle);
  const paths = o.paths ?? 1;
  if (!Number.isInteger(paths) || paths < 1 || paths > 8) {
    throw new InputError("paths", String(paths), "an integer from 1 to 8");
  }
  const beam = mountingColour(n);
  const unit = o.unit ?? "mm";
  const title = o.title ?? "Pipe cross-section";
  const W = 700, H = 520, cx = 260, cy = 250, R = 150;
  const k = R / (b.od / 2);
  let wallPx = b.wall * k, liningPx = b.lining * k;
  const exaggerated = wallPx < 2.5 || (b.lining > 0 && liningPx < 2.5);
  wallPx = Math.max(wallPx, 2.5);
  if (b.lining > 0) liningPx = Math.max(liningPx, 2.5);
  const rLining = R - wallPx, rBore = rLining - liningPx;

  let out = text(W / 2, 24, title, { anchor: "middle", size: 15, weight: "600" });
  out += `<circle cx="${cx}" cy="${cy}" r="${
    c(R)
  }" fill="${WALL_FILL}" stroke="${INK}" stroke-width="1.2"/>`;
  if (b.lining > 0) {
    out += `<circle cx="${cx}" cy="${cy}" r="${
      c(rLining)
    }" fill="${LINING_FILL}" stroke="${INK}" stroke-width="0.8"/>`;
  }
  out += `<circle cx="${cx}" cy="${cy}" r="${
    c(rBore)
  }" fill="${FLUID_FILL}" stroke="${INK}" stroke-width="1"/>`;
  // Centre mark.
  out += line(cx - 8, cy, cx + 8, cy, INK, 0.6) + line(cx, cy - 8, cx, cy + 8, INK, 0.6);

  const plane = o.pathPlane === undefined ? 0 : finite("pathPlane", o.pathPlane);
  for (let p = 0; p < paths; p++) {
    // Screen y points down: clockwise from the top is (sin φ, −cos φ), i.e. a = φ − π/2.
    const a = -Math.PI / 2 + plane + p * Math.PI / paths;
    const ux = Math.cos(a), uy = Math.sin(a);
    out += line(
      cx - ux * (R + 26),
      cy - uy * (R + 26),
      cx + ux * (R + 26),
      cy + uy * (R + 26),
      beam,
      1,
      "6 4",
    );
    out += line(cx - ux * rBore, cy - uy * rBore, cx + ux * rBore, cy + uy * rBore, beam, 2.2);
    const sides = n % 2 === 1 ? [1, -1] : [1];
    for (const s of sides) {
      const px = cx + s * ux * (R + 7), py = cy + s * uy * (R + 7);
      const deg = a * 180 / Math.PI + 90;
      out +=
        `<rect x="${c(px - 16)}" y="${
          c(py - 7)
        }" width="32" height="14" rx="2" fill="${TRANSDUCER_FILL}" ` +
        `transform="rotate(${c(deg)} ${c(px)} ${c(py)})"/>`;
      const lx = cx + s * ux * (R + 30), ly = cy + s * uy * (R + 34) + 4;
      const base = n % 2 === 1 ? (s === 1 ? "T1" : "T2") : "T1, T2";
      const label = o.clock && p === 0 ? `${base} at ${o.clock[s === 1 ? 0 : 1]}` : base;
      const anchor = lx < cx - 20 ? "end" : lx > cx + 20 ? "start" : "middle";
      out += text(lx, ly, paths > 1 ? `${label} (path ${p + 1})` : label, { anchor, size: 13 });
    }
  }
  // Dimensions and notes on the right.
  const xNote = 470;
  const yDim = cy + R + 62;
  out += line(cx - R, yDim + 6, cx - R, cy, INK, 0.6, "3 2") +
    line(cx + R, yDim + 6, cx + R, cy, INK, 0.6, "3 2") +
    dimensionX(cx - R, cx + R, yDim, `OD ${q(b.od, unit)}`, 13);
  const notes = [
    `wall ${q(b.wall, unit)}`,
    ...(b.lining > 0 ? [`lining ${q(b.lining, unit)}`] : []),
    `bore ${q(b.id, unit)}`,
    `${mountingName(n)} mounting, ${n} traverse${n > 1 ? "s" : ""}`,
    `beam in a diametral plane`,
    ...(o.pathPlane !== undefined
      ? [`plane ${q(plane, "deg", 3)} from vertical`, "seen looking downstream"]
      : []),
    `fluid angle ${q(theta, "deg", 3)}`,
    ...(paths > 1 ? [`${paths} paths`] : []),
    ...(exaggerated ? ["wall/lining widened to be seen"] : []),
  ];
  notes.forEach((s, i) => (out += text(xNote, 70 + i * 19, s, { size: 13 })));
  // Leader from the wall note to the wall.
  const wa = -Math.PI / 4;
  out += line(
    xNote - 4,
    66,
    cx + Math.cos(wa) * (R - wallPx / 2),
    cy + Math.sin(wa) * (R - wallPx / 2),
    INK,
    0.6,
  );
  // Legend swatches.
  const sw = (y: number, fill: string, s: string) =>
    `<rect x="${xNote}" y="${
      c(y - 10)
    }" width="14" height="12" fill="${fill}" stroke="${INK}" stroke-width="0.6"/>` +
    text(xNote + 20, y, s, { size: 12 });
  let ly = 70 + notes.length * 19 + 16;
  out += sw(ly, WALL_FILL, "wall");
  if (b.lining > 0) out += sw(ly += 18, LINING_FILL, "lining");
  out += sw(ly += 18, FLUID_FILL, "liquid");
  out += line(xNote, (ly += 18) - 4, xNote + 14, ly - 4, beam, 2.2) +
    text(xNote + 20, ly, "beam", { size: 12 });
  return svgDocument(
    W,
    H,
    title,
    `Cross-section of a pipe of outside diameter ${q(b.od, unit)}, wall ` +
      `${q(b.wall, unit)}` +
      (b.lining > 0 ? `, lining ${q(b.lining, unit)}` : "") +
      `, with ${paths} diametral beam plane(s), ${mountingName(n)} mounting.`,
    out,
  );
}

/** Arguments of {@link svgAxialPath}. */
export interface AxialPathOptions {
  /** Outside diameter (m). */
  readonly outsideDiameter: number;
  /** Wall thickness (m). */
  readonly wallThickness: number;
  /** Lining thickness (m), if lined. */
  readonly liningThickness?: number;
  /** Transducer spacing (m), axial distance between beam entry and exit on the outer surface. */
  readonly spacing: number;
  /** Traverses of the bore: 1 (Z), 2 (V), 4 (W), … */
  readonly traverses: number;
  /** Beam angle in the liquid from the wall normal (rad). */
  readonly fluidAngle: number;
  /** Beam angle in the wall from the wall normal (rad). */
  readonly wallAngle: number;
  /** Beam angle in the lining (rad); default the fluid angle. */
  readonly liningAngle?: number;
  /** Transducer length along the pipe (m); default 0.4·OD within 30 … 90 mm. */
  readonly transducerLength?: number;
  /** Display unit of lengths (default "mm"). */
  readonly unit?: string;
  /** Title (default "Beam path along the pipe"). */
  readonly title?: string;
}

/**
 * The pipe along its axis (longitudinal section through the beam plane) with the zig-zag beam
 * path through wall, lining and liquid for the given number of traverses, the two transducers
 * on the outer surface (same side for an even number of traverses, opposite sides for an odd
 * one), the flow direction and the spacing dimensioned with its given value. The path is drawn
 * from the angles (axial advance t·tan θ per layer); when it differs from the given spacing by
 * more than 2 %, the drawing notes it.
 *
 * @param o dimensions (m), angles (rad), traverses, spacing (m), unit
 * @returns the SVG markup
 * @throws {InputError} on non-finite, negative or inconsistent inputs
 *
 * @example
 * ```ts
 * import { svgAxialPath } from "./drawings.ts";
 * const svg = svgAxialPath({ outsideDiameter: 0.1143, wallThickness: 0.00602, spacing: 0.0941,
 *   traverses: 2, fluidAngle: 0.3817, wallAngle: 0.7854 });
 * if (!svg.includes("<polyline") || !svg.includes("94.1 mm") || svg.includes("NaN")) {
 *   throw new Error("axial");
 * }
 * ```
 */
export function svgAxialPath(o: AxialPathOptions): string {
  const b = bore(o);
  const n = checkTraverses(o.traverses);
  const spacing = finite("spacing", o.spacing);
  const tf = Math.tan(checkAngle("fluidAngle", o.fluidAngle));
  const tw = Math.tan(checkAngle("wallAngle", o.wallAngle));
  const tl = Math.tan(checkAngle("liningAngle", o.liningAngle ?? o.fluidAngle));
  const unit = o.unit ?? "mm";
  const title = o.title ?? "Beam path along the pipe";
  const L = o.transducerLength === undefined
    ? Math.min(0.09, Math.max(0.03, 0.4 * b.od))
    : positive("transducerLength", o.transducerLength);

  const { pts, drawn, exitTop } = beamPoints(b, n, tf, tw, tl);

  // Scale: fit the run of pipe into the width and the diameter into the height.
  const W = 720;
  const margin = L + 0.3 * b.od;
  const len = drawn + 2 * margin;
  const k = Math.min((W - 60) / len, 260 / b.od);
  const ox = 30 + ((W - 60) - len * k) / 2 + margin * k; // entry point x in px
  const tH = Math.max(0.35 * L * k, 10); // transducer height px
  const top = 62 + tH + 18; // y of the top outer surface
  const H = top + b.od * k + tH + 96;
  const X = (m: number) => ox + m * k;
  const Y = (m: number) => top + m * k;
  const wallPx = Math.max(b.wall * k, 2), linPx = b.lining > 0 ? Math.max(b.lining * k, 2) : 0;
  const x0 = X(-margin), x1 = X(drawn + margin), yb = Y(b.od);

  let out = text(W / 2, 24, title, { anchor: "middle", size: 15, weight: "600" });
  // Liquid, lining and wall bands.
  out += `<rect x="${c(x0)}" y="${c(top)}" width="${c(x1 - x0)}" height="${
    c(yb - top)
  }" fill="${FLUID_FILL}"/>`;
  for (
    const [y, h, fill] of [
      [top, wallPx, WALL_FILL],
      [yb - wallPx, wallPx, WALL_FILL],
      ...(b.lining > 0
        ? [[top + wallPx, linPx, LINING_FILL], [yb - wallPx - linPx, linPx, LINING_FILL]]
        : []),
    ] as [number, number, string][]
  ) {
    out += `<rect x="${c(x0)}" y="${c(y)}" width="${c(x1 - x0)}" height="${c(h)}" fill="${fill}" ` +
      `stroke="${INK}" stroke-width="0.6"/>`;
  }
  // Break marks at both ends (the pipe continues).
  for (const xe of [x0, x1]) {
    out +=
      `<path d="M ${c(xe)} ${c(top - 4)} l 5 ${c((yb - top) / 4)} l -10 ${c((yb - top) / 2)} ` +
      `l 5 ${c((yb - top) / 4 + 8)}" stroke="${INK}" stroke-width="1"/>`;
  }
  // Axis.
  out += line(x0, (top + yb) / 2, x1, (top + yb) / 2, "#8c8c8c", 0.8, "14 4 2 4");
  // Beam.
  out +=
    `<polyline points="${points(pts.map(([px, py]) => [X(px), Y(py)]))}" stroke="${
      mountingColour(n)
    }" ` +
    `stroke-width="2.2" stroke-linejoin="round"/>`;
  for (const [px, py] of [pts[0], pts[pts.length - 1]]) {
    out += `<circle cx="${c(X(px))}" cy="${c(Y(py))}" r="3" fill="${mountingColour(n)}"/>`;
  }
  // Transducers: the front face is slanted towards the other transducer.
  const transducer = (xm: number, onTop: boolean, facing: 1 | -1, label: string) => {
    const xf = X(xm), ys = onTop ? top : yb, dir = onTop ? -1 : 1, lp = L * k;
    const poly: [number, number][] = [
      [xf + facing * 0.12 * lp, ys],
      [xf - facing * 0.88 * lp, ys],
      [xf - facing * 0.88 * lp, ys + dir * tH],
      [xf - facing * 0.2 * lp, ys + dir * tH],
    ];
    return `<polygon points="${
      points(poly)
    }" fill="${TRANSDUCER_FILL}" stroke="${INK}" stroke-width="0.8"/>` +
      text(xf - facing * 0.38 * lp, ys + dir * (tH + 8) + (onTop ? 0 : 8), label, {
        anchor: "middle",
        size: 12,
      });
  };
  out += transducer(0, true, 1, "T1 upstream");
  out += transducer(drawn, exitTop, -1, "T2 downstream");
  // Spacing dimension above the pipe, with projection lines.
  const yDim = top - tH - 30;
  out += line(X(0), top, X(0), yDim - 4, INK, 0.6, "3 2") +
    line(X(drawn), exitTop ? top : yb, X(drawn), yDim - 4, INK, 0.6, "3 2");
  out += dimensionX(X(0), X(drawn), yDim, `spacing ${q(spacing, unit)}`, 13);
  // Flow arrow in the bore, left part.
  const yFlow = Y(b.od / 2) + 14, xa = x0 + 20, xb = Math.min(x0 + 90, X(0) - 6);
  if (xb - xa > 30) {
    out += line(xa, yFlow, xb, yFlow, INK, 1.4) + arrowHead(xb, yFlow, 0, 8) +
      text(xa, yFlow - 6, "flow", { size: 12 });
  }
  // Caption lines below.
  axialNotes(o, b, n, drawn, spacing, unit).forEach((s, i) => {
    out += text(30, yb + tH + 36 + i * 19, s, { size: 13, fill: i === 2 ? ACCENT : INK });
  });
  return svgDocument(
    W,
    H,
    title,
    `Longitudinal section of the pipe with the beam crossing the bore ${n} time(s) between ` +
      `two transducers ${q(spacing, unit)} apart.`,
    out,
  );
}

/**
 * The beam's corners in metres (x along the axis from the entry point, y down from the top
 * outer surface): through wall, lining, n bore crossings, lining and wall; the axial span drawn
 * and whether the beam leaves on the top surface.
 */
function beamPoints(
  b: ReturnType<typeof bore>,
  n: number,
  tf: number,
  tw: number,
  tl: number,
): { pts: [number, number][]; drawn: number; exitTop: boolean } {
  const pts: [number, number][] = [[0, 0]];
  let x = b.wall * tw;
  pts.push([x, b.wall]);
  const yTopIn = b.wall + b.lining, yBotIn = b.od - b.wall - b.lining;
  if (b.lining > 0) pts.push([x += b.lining * tl, yTopIn]);
  let atTop = true;
  for (let i = 0; i < n; i++) {
    x += b.id * tf;
    atTop = !atTop;
    pts.push([x, atTop ? yTopIn : yBotIn]);
  }
  if (b.lining > 0) pts.push([x += b.lining * tl, atTop ? b.wall : b.od - b.wall]);
  x += b.wall * tw;
  pts.push([x, atTop ? 0 : b.od]);
  return { pts, drawn: x, exitTop: atTop };
}

/** Caption lines of the axial drawing: mounting and sizes, angles, a drawn/given spacing note. */
function axialNotes(
  o: AxialPathOptions,
  b: ReturnType<typeof bore>,
  n: number,
  drawn: number,
  spacing: number,
  unit: string,
): string[] {
  const notes = [
    `${mountingName(n)} mounting, ${n} traverse${n > 1 ? "s" : ""}; OD ${q(b.od, unit)}, ` +
    `wall ${q(b.wall, unit)}` +
    (b.lining > 0 ? `, lining ${q(b.lining, unit)}` : "") +
    `, bore ${q(b.id, unit)}`,
    `angles from the wall normal: liquid ${q(o.fluidAngle, "deg", 3)}, wall ` +
    `${q(o.wallAngle, "deg", 3)}` +
    (b.lining > 0 ? `, lining ${q(o.liningAngle ?? o.fluidAngle, "deg", 3)}` : ""),
  ];
  if (Math.abs(drawn - spacing) > 0.02 * Math.abs(spacing)) {
    notes.push(
      `path drawn from the angles spans ${q(drawn, unit)}; the given spacing is ` +
        q(spacing, unit),
    );
  }
  return notes;
}

/** Arguments of {@link svgRun}. */
export interface RunOptions {
  /** Length of the straight run between the two fittings (m). */
  readonly runLength: number;
  /** Pipe diameter used to express lengths in diameters (m), usually the inside diameter. */
  readonly diameter: number;
  /** Name of the fitting at the upstream end (for example "90° elbow"). */
  readonly upstreamLabel: string;
  /** Name of the fitting at the downstream end (for example "gate valve"). */
  readonly downstreamLabel: string;
  /** Straight length required after the upstream fitting (m). */
  readonly requiredUpstream: number;
  /** Straight length required before the downstream fitting (m). */
  readonly requiredDownstream: number;
  /** Recommended measuring position, distance from the upstream fitting (m). */
  readonly recommendedPosition?: number;
  /** Position by the common rule of the trade, distance from the upstream fitting (m). */
  readonly commonPracticePosition?: number;
  /** Display unit of lengths (default "m"). */
  readonly unit?: string;
  /** Title (default "Straight run"). */
  readonly title?: string;
}

type Anchor = "start" | "middle" | "end";

/** A label to place on a row: where it points, its anchor, text, size and lowest row. */
interface RowLabel {
  readonly x: number;
  readonly anchor: Anchor;
  readonly text: string;
  readonly size: number;
  readonly minRow: number;
}

/**
 * Place labels on rows so that none overprints another: each label, in order, is kept inside
 * [4, width − 4] (its anchor moved to the near edge when it would stick out) and takes the
 * lowest row from its `minRow` up where its extent, widened by 8 units, meets no label already
 * placed. Extents use {@link textWidth} with a 10 % margin.
 */
function stackRows(
  labels: readonly RowLabel[],
  width: number,
): { x: number; anchor: Anchor; row: number }[] {
  const placed: { a: number; b: number; row: number }[] = [];
  return labels.map((l) => {
    const w = textWidth(l.text, l.size) * 1.1;
    let { x, anchor } = l;
    let a = anchor === "start" ? x : anchor === "end" ? x - w : x - w / 2;
    if (a < 4) [x, anchor, a] = [4, "start", 4];
    if (a + w > width - 4) [x, anchor, a] = [width - 4, "end", width - 4 - w];
    let row = l.minRow;
    while (placed.some((p) => p.row === row && a - 8 < p.b && p.a < a + w + 8)) row++;
    placed.push({ a, b: a + w, row });
    return { x, anchor, row };
  });
}

/**
 * The straight run between two fittings, flow left to right: the stretches each fitting needs
 * kept clear, the admissible zone between them (or a marked overlap when the run is too short),
 * and the recommended and common-practice positions, with an axis in pipe diameters. Not to
 * scale across the pipe.
 *
 * @param o run length, diameter, requirements and positions (m), labels
 * @returns the SVG markup
 * @throws {InputError} on non-finite or negative lengths, or positions outside the run
 *
 * @example
 * ```ts
 * import { svgRun } from "./drawings.ts";
 * const svg = svgRun({ runLength: 3, diameter: 0.1, upstreamLabel: "elbow",
 *   downstreamLabel: "valve", requiredUpstream: 1, requiredDownstream: 0.5,
 *   recommendedPosition: 2, commonPracticePosition: 1 });
 * if (!svg.includes("admissible") || !svg.includes("elbow") || svg.includes("NaN")) {
 *   throw new Error("run");
 * }
 * ```
 */
export function svgRun(o: RunOptions): string {
  const run = positive("runLength", o.runLength);
  const d = positive("diameter", o.diameter);
  const up = finite("requiredUpstream", o.requiredUpstream);
  const down = finite("requiredDownstream", o.requiredDownstream);
  if (up < 0) throw new InputError("requiredUpstream", String(up), "a length ≥ 0 m");
  if (down < 0) throw new InputError("requiredDownstream", String(down), "a length ≥ 0 m");
  const pos = (field: string, v: number | undefined) => {
    if (v === undefined) return undefined;
    finite(field, v);
    if (v < 0 || v > run) throw new InputError(field, `${v} m`, `a position within 0 … ${run} m`);
    return v;
  };
  const rec = pos("recommendedPosition", o.recommendedPosition);
  const cp = pos("commonPracticePosition", o.commonPracticePosition);
  const unit = o.unit ?? "m";
  const title = o.title ?? "Straight run";
  if (typeof o.upstreamLabel !== "string" || typeof o.downstreamLabel !== "string") {
    throw new InputError("upstreamLabel/downstreamLabel", "not a text", "fitting names");
  }

  const W = 760, left = 100, right = W - 100, ph = 30;
  const X = (m: number) => left + (m / run) * (right - left);
  const fmtLen = (m: number) => `${q(m, unit, 3)} (${formatCompact(m / d, 3)} D)`;
  const upEnd = Math.min(up, run), downStart = Math.max(run - down, 0);
  // Labels above the pipe: the fittings' names on row 0, the positions from row 1 up; labels
  // below: the keep-clear lengths. Each takes the lowest row where it overprints no other.
  const above: RowLabel[] = [
    { x: left - 24, anchor: "start", text: o.upstreamLabel, size: 12, minRow: 0 },
    { x: right + 24, anchor: "end", text: o.downstreamLabel, size: 12, minRow: 0 },
  ];
  const markAt = (m: number, label: string) => {
    const x = X(m);
    const anchor: Anchor = x < left + 120 ? "start" : x > right - 120 ? "end" : "middle";
    return { x, anchor, text: `${label} ${fmtLen(m)}`, size: 13, minRow: 1 };
  };
  if (rec !== undefined) above.push(markAt(rec, "recommended"));
  if (cp !== undefined) above.push(markAt(cp, "common practice"));
  const below: RowLabel[] = [
    { x: X(upEnd / 2), anchor: "middle", text: `keep clear ${fmtLen(up)}`, size: 12, minRow: 0 },
    {
      x: X((downStart + run) / 2),
      anchor: "middle",
      text: `keep clear ${fmtLen(down)}`,
      size: 12,
      minRow: 0,
    },
  ];
  const rowsAbove = stackRows(above, W), rowsBelow = stackRows(below, W);
  const topRow = Math.max(0, ...rowsAbove.map((r) => r.row));
  const belowRows = Math.max(0, ...rowsBelow.map((r) => r.row));
  const yPipe = Math.max(130, 81 + 16 * topRow);
  const yAbove = (row: number) => yPipe - ph / 2 - 20 - 16 * row;
  const yBelow = (row: number) => yPipe + ph / 2 + 28 + 15 * row;
  let out = text(W / 2, 24, title, { anchor: "middle", size: 15, weight: "600" });

  // Zones.
  const zone = (a: number, z: number, fill: string, opacity = 1) =>
    `<rect x="${c(X(a))}" y="${c(yPipe - ph / 2 - 14)}" width="${c(Math.max(X(z) - X(a), 0))}" ` +
    `height="${c(ph + 28)}" fill="${fill}" fill-opacity="${opacity}"/>`;
  out += `<defs><pattern id="keepclear" width="8" height="8" patternUnits="userSpaceOnUse" ` +
    `patternTransform="rotate(45)"><line x1="0" y1="0" x2="0" y2="8" stroke="#9a9a9a" ` +
    `stroke-width="3"/></pattern></defs>`;
  out += zone(0, upEnd, "url(#keepclear)") + zone(downStart, run, "url(#keepclear)");
  const admissible = up + down <= run;
  if (admissible) out += zone(up, run - down, "#cfe3c4");
  else out += zone(downStart, upEnd, ACCENT, 0.35);
  // Pipe.
  out +=
    `<rect x="${c(left)}" y="${c(yPipe - ph / 2)}" width="${c(right - left)}" height="${ph}" ` +
    `fill="${FLUID_FILL}" fill-opacity="0.6" stroke="${INK}" stroke-width="1.4"/>`;
  out += line(left + 10, yPipe, left + 60, yPipe, INK, 1.2) + arrowHead(left + 60, yPipe, 0, 7) +
    text(left + 10, yPipe - 4, "flow", { size: 12 });
  // Fittings as blocks at both ends.
  const fitting = (xc: number) =>
    `<rect x="${c(xc - 12)}" y="${c(yPipe - ph / 2 - 10)}" width="24" height="${ph + 20}" ` +
    `fill="#6f6f6f" stroke="${INK}"/>`;
  out += fitting(left - 12) + fitting(right + 12);
  // Positions above the pipe: line and arrowhead at the position, label on its row.
  const markLine = (m: number, fill: string) => {
    const x = X(m), yt = yPipe - ph / 2 - 16;
    return line(x, yt - 2, x, yPipe + ph / 2, fill, 1.6) +
      `<polygon points="${points([[x, yt], [x - 7, yt - 11], [x + 7, yt - 11]])}" fill="${fill}"/>`;
  };
  if (cp !== undefined) out += markLine(cp, "#555555");
  if (rec !== undefined) out += markLine(rec, BEAM);
  for (const [i, r] of rowsAbove.entries()) {
    const fill = above[i].text.startsWith("recommended")
      ? BEAM
      : above[i].text.startsWith("common practice")
      ? "#555555"
      : undefined;
    out += text(r.x, yAbove(r.row), above[i].text, {
      anchor: r.anchor,
      size: above[i].size,
      ...(fill ? { fill } : {}),
    });
  }
  for (const [i, r] of rowsBelow.entries()) {
    out += text(r.x, yBelow(r.row), below[i].text, { anchor: r.anchor, size: below[i].size });
  }
  // Axis in diameters.
  const yAxis = yPipe + ph / 2 + 40 + 15 * belowRows;
  out += runAxis(left, right, yAxis, run, d, X);
  // Legend.
  const ly = yAxis + 60;
  const H = ly + 16;
  out += runLegend(left, ly, admissible, { run, up, down }, unit);
  return svgDocument(
    W,
    H,
    title,
    `Straight run of ${fmtLen(run)} from ${o.upstreamLabel} to ${o.downstreamLabel}; ` +
      (admissible
        ? `admissible zone from ${fmtLen(up)} to ${fmtLen(run - down)}`
        : "no admissible zone") +
      (rec !== undefined ? `; recommended position ${fmtLen(rec)}` : "") +
      (cp !== undefined ? `; common-practice position ${fmtLen(cp)}` : "") + ".",
    out,
  );
}

/** The run drawing's axis in pipe diameters, with ticks and its caption. */
function runAxis(
  left: number,
  right: number,
  yAxis: number,
  run: number,
  d: number,
  X: (m: number) => number,
): string {
  let out = line(left, yAxis, right, yAxis, INK, 1);
  const ticks = niceTicks(0, run / d, 8).filter((t) => t <= run / d + 1e-9);
  for (const t of ticks) {
    out += line(X(t * d), yAxis, X(t * d), yAxis + 5, INK, 1) +
      text(X(t * d), yAxis + 18, formatCompact(t, 3), { anchor: "middle", size: 12 });
  }
  out += text(
    right,
    yAxis + 34,
    `distance from the upstream fitting, in diameters (D = ${q(d, "mm", 4)})`,
    { anchor: "end", size: 12 },
  );
  return out;
}

/**
 * The run drawing's legend: keep-clear hatch, and the admissible zone or by how much it is short;
 * the second key starts after the first key's text.
 */
function runLegend(
  left: number,
  ly: number,
  admissible: boolean,
  lengths: { readonly run: number; readonly up: number; readonly down: number },
  unit: string,
): string {
  const { run, up, down } = lengths;
  const firstKey = "straight length each fitting needs";
  const x2 = left + 20 + textWidth(firstKey, 12) + 28;
  let out = `<rect x="${left}" y="${ly - 10}" width="14" height="12" fill="url(#keepclear)" ` +
    `stroke="${INK}" stroke-width="0.5"/>` + text(left + 20, ly, firstKey, { size: 12 });
  out += admissible
    ? `<rect x="${c(x2)}" y="${ly - 10}" width="14" height="12" fill="#cfe3c4" stroke="${INK}" ` +
      `stroke-width="0.5"/>` +
      text(x2 + 20, ly, `admissible zone ${q(run - up - down, unit, 3)}`, { size: 12 })
    : `<rect x="${c(x2)}" y="${ly - 10}" width="14" height="12" fill="${ACCENT}" ` +
      `fill-opacity="0.35" stroke="${INK}" stroke-width="0.5"/>` +
      text(x2 + 20, ly, `no admissible zone: the run is ${q(up + down - run, unit, 3)} short`, {
        size: 12,
        fill: ACCENT,
      });
  return out;
}
