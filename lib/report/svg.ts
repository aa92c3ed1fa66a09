/**
 * SVG building blocks and charts as self-contained strings: a viewBox, a `<title>` and
 * `<desc>`, inline presentation attributes (no CSS classes, no scripts, no outside fonts), a
 * neutral palette that stays readable in grey-scale print (series differ by dash pattern and
 * marker too). Every number written is checked finite first: an input that would put NaN in
 * a drawing is refused with an InputError.
 *
 * @module
 */
import { InputError } from "../errors.ts";
import { escapeHtml, formatCompact, formatNumber } from "./format.ts";

/** Font stack used in every drawing. */
export const SVG_FONT = "DejaVu Sans, Liberation Sans, Arial, sans-serif";
/** Ink colour for outlines and text. */
export const INK = "#1d1d1d";
/** Series colours (dark blue, burnt orange, green, purple, grey), distinguishable in grey too. */
export const PALETTE = ["#1b5e8c", "#b35a1f", "#3f7f2a", "#6b4a94", "#707070"];
/** Dash patterns paired with the palette, for grey-scale print. */
export const DASHES = ["", "7 4", "2 3", "10 3 2 3", "4 4"];

/** Require a finite number, naming the field. */
export function finite(field: string, v: unknown): number {
  if (typeof v !== "number" || !Number.isFinite(v)) {
    throw new InputError(field, String(v), "a finite number");
  }
  return v;
}

/** Require a finite number > 0. */
export function positive(field: string, v: unknown): number {
  finite(field, v);
  if (!((v as number) > 0)) throw new InputError(field, String(v), "a finite number > 0");
  return v as number;
}

/** A coordinate for SVG text: rounded to 0.01, never NaN (checked). */
export function c(v: number): string {
  if (!Number.isFinite(v)) throw new InputError("drawing coordinate", String(v), "finite");
  const r = Math.round(v * 100) / 100;
  return String(Object.is(r, -0) ? 0 : r);
}

/** Escape text for SVG. */
export const esc = escapeHtml;

/** Approximate text width in user units for the drawing font. */
export function textWidth(text: string, size: number): number {
  return [...text].length * size * 0.58;
}

/**
 * Open and close an SVG document with title, description and viewBox.
 *
 * @param w viewBox width
 * @param h viewBox height
 * @param title accessible title (plain text)
 * @param desc accessible description (plain text)
 * @param content inner SVG markup
 * @returns the SVG element as a string
 */
export function svgDocument(w: number, h: number, title: string, desc: string, content: string) {
  const id = "t" + hashId(title + desc);
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${c(w)} ${c(h)}" ` +
    `width="${c(w)}" height="${c(h)}" role="img" aria-labelledby="${id}-title ${id}-desc" ` +
    `font-family="${SVG_FONT}" font-size="13" fill="none" stroke="none">` +
    `<title id="${id}-title">${esc(title)}</title><desc id="${id}-desc">${esc(desc)}</desc>` +
    `<rect x="0" y="0" width="${c(w)}" height="${c(h)}" fill="#ffffff"/>` +
    content + "</svg>";
}

function hashId(s: string): string {
  let h = 2166136261;
  for (let i = 0; i < s.length; i++) h = Math.imul(h ^ s.charCodeAt(i), 16777619);
  return (h >>> 0).toString(36);
}

/** A text element. */
export function text(
  x: number,
  y: number,
  s: string,
  opts: {
    anchor?: "start" | "middle" | "end";
    size?: number;
    weight?: string;
    fill?: string;
    rotate?: number;
  } = {},
): string {
  const rot = opts.rotate ? ` transform="rotate(${c(opts.rotate)} ${c(x)} ${c(y)})"` : "";
  return `<text x="${c(x)}" y="${c(y)}" fill="${opts.fill ?? INK}"` +
    (opts.anchor && opts.anchor !== "start" ? ` text-anchor="${opts.anchor}"` : "") +
    (opts.size ? ` font-size="${c(opts.size)}"` : "") +
    (opts.weight ? ` font-weight="${opts.weight}"` : "") + rot + `>${esc(s)}</text>`;
}

/** A line element. */
export function line(
  x1: number,
  y1: number,
  x2: number,
  y2: number,
  stroke = INK,
  width = 1,
  dash = "",
): string {
  return `<line x1="${c(x1)}" y1="${c(y1)}" x2="${c(x2)}" y2="${c(y2)}" stroke="${stroke}" ` +
    `stroke-width="${c(width)}"${dash ? ` stroke-dasharray="${dash}"` : ""}/>`;
}

/** Points attribute of a polyline or polygon. */
export function points(pts: readonly (readonly [number, number])[]): string {
  return pts.map(([x, y]) => `${c(x)},${c(y)}`).join(" ");
}

/** An arrowhead (filled triangle) at (x, y) pointing along angle a (radians). */
export function arrowHead(x: number, y: number, a: number, size = 7, fill = INK): string {
  const p1: [number, number] = [
    x - size * Math.cos(a) + size * 0.45 * Math.sin(a),
    y - size * Math.sin(a) - size * 0.45 * Math.cos(a),
  ];
  const p2: [number, number] = [
    x - size * Math.cos(a) - size * 0.45 * Math.sin(a),
    y - size * Math.sin(a) + size * 0.45 * Math.cos(a),
  ];
  return `<polygon points="${points([[x, y], p1, p2])}" fill="${fill}"/>`;
}

/** A dimension line between two x positions at height y, arrows both ends, label above. */
export function dimensionX(x1: number, x2: number, y: number, label: string, size = 12): string {
  const lo = Math.min(x1, x2), hi = Math.max(x1, x2);
  return line(lo, y, hi, y, INK, 1) + arrowHead(lo, y, Math.PI, 6) + arrowHead(hi, y, 0, 6) +
    text((lo + hi) / 2, y - 5, label, { anchor: "middle", size });
}

/**
 * "Nice" axis ticks covering [min, max]: steps of 1, 2, 2.5 or 5 × 10ⁿ.
 *
 * @param min lower data bound
 * @param max upper data bound
 * @param count wanted number of intervals (about)
 * @returns tick values, first ≤ min, last ≥ max
 *
 * @example
 * ```ts
 * import { niceTicks } from "./svg.ts";
 * const t = niceTicks(0.3, 9.2, 5);
 * if (t[0] !== 0 || t[t.length - 1] !== 10 || t[1] !== 2) throw new Error(String(t));
 * ```
 */
export function niceTicks(min: number, max: number, count = 5): number[] {
  finite("axis minimum", min);
  finite("axis maximum", max);
  if (max < min) [min, max] = [max, min];
  if (max === min) {
    const pad = min === 0 ? 1 : Math.abs(min) * 0.1;
    min -= pad;
    max += pad;
  }
  const raw = (max - min) / Math.max(1, count);
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 2.5, 5, 10].map((f) => f * mag).find((s) => s >= raw * 0.999) ?? 10 * mag;
  const start = Math.floor(min / step + 1e-9) * step;
  const ticks: number[] = [];
  for (let v = start; v < max + step * 0.999; v += step) {
    ticks.push(Number((Math.round(v / step) * step).toPrecision(12)));
    if (ticks.length > 50) break;
  }
  return ticks;
}

function tickLabel(v: number, ticks: number[]): string {
  const step = ticks.length > 1 ? Math.abs(ticks[1] - ticks[0]) : Math.abs(v) || 1;
  if (Math.abs(v) >= 1e6 || (Math.abs(v) < 1e-4 && v !== 0)) return formatNumber(v, 3);
  const e = Math.floor(Math.log10(step) + 1e-9);
  const mantissa = step / 10 ** e;
  const decimals = Math.min(10, Math.max(0, -e + (Math.abs(mantissa - 2.5) < 1e-9 ? 1 : 0)));
  return (Math.abs(v) < step * 1e-9 ? 0 : v).toFixed(decimals);
}

/** One series of a line chart. */
export interface LineSeries {
  /** Legend name. */
  readonly name: string;
  /** Points [x, y] in display units, in drawing order. */
  readonly points: readonly (readonly [number, number])[];
  /** Line colour (CSS); default from the chart palette by series index. */
  readonly colour?: string;
}

/** Arguments of {@link svgLineChart}. */
export interface LineChartOptions {
  /** Chart title (plain text). */
  readonly title: string;
  /** x-axis label, with its unit. */
  readonly xLabel: string;
  /** y-axis label, with its unit. */
  readonly yLabel: string;
  /** One or more series. */
  readonly series: readonly LineSeries[];
  /** viewBox width (default 720). */
  readonly width?: number;
  /** viewBox height (default 400). */
  readonly height?: number;
  /** Optional horizontal reference lines (for example a limit), with labels. */
  readonly hLines?: readonly { readonly y: number; readonly label: string }[];
  /** Optional vertical reference lines (for example a chosen position), with labels. */
  readonly vLines?: readonly { readonly x: number; readonly label: string }[];
}

/**
 * A line chart as a self-contained SVG: axes with nice ticks, light grid, one polyline per
 * series (colour, dash and marker differ), legend, optional reference lines.
 *
 * Used for the estimated profile error along the run and the spacing against temperature.
 * Values are drawn as given (display units); the report layer converts. Source: none.
 *
 * @param options title, axis labels, series, size, reference lines
 * @returns the SVG markup
 * @throws {InputError} for no series, an empty series, or a non-finite value
 *
 * @example
 * ```ts
 * import { svgLineChart } from "./svg.ts";
 * const svg = svgLineChart({ title: "Spacing", xLabel: "T (°C)", yLabel: "s (mm)",
 *   series: [{ name: "V", points: [[5, 120.1], [25, 121.4], [45, 123]] }] });
 * if (!svg.startsWith("<svg") || svg.includes("NaN") || !svg.includes("<polyline")) {
 *   throw new Error("chart");
 * }
 * ```
 */
export function svgLineChart(options: LineChartOptions): string {
  const { title, xLabel, yLabel, series } = options;
  const W = options.width === undefined ? 720 : positive("width", options.width);
  const H = options.height === undefined ? 400 : positive("height", options.height);
  if (!Array.isArray(series as unknown) || series.length === 0) {
    throw new InputError("series", String(series), "at least one series of points");
  }
  let xmin = Infinity, xmax = -Infinity, ymin = Infinity, ymax = -Infinity;
  series.forEach((s, i) => {
    if (!Array.isArray(s?.points as unknown) || s.points.length === 0) {
      throw new InputError(`series[${i}].points`, "no points", "at least one [x, y] point");
    }
    s.points.forEach((p, j) => {
      const x = finite(`series[${i}].points[${j}][0]`, p?.[0]);
      const y = finite(`series[${i}].points[${j}][1]`, p?.[1]);
      xmin = Math.min(xmin, x);
      xmax = Math.max(xmax, x);
      ymin = Math.min(ymin, y);
      ymax = Math.max(ymax, y);
    });
  });
  for (const [k, h] of (options.hLines ?? []).entries()) {
    const y = finite(`hLines[${k}].y`, h.y);
    ymin = Math.min(ymin, y);
    ymax = Math.max(ymax, y);
  }
  for (const [k, v] of (options.vLines ?? []).entries()) {
    const x = finite(`vLines[${k}].x`, v.x);
    xmin = Math.min(xmin, x);
    xmax = Math.max(xmax, x);
  }
  const xt = niceTicks(xmin, xmax, 6);
  const yt = niceTicks(ymin, ymax, 5);
  const x0 = xt[0], x1 = xt[xt.length - 1], y0 = yt[0], y1 = yt[yt.length - 1];
  const yLabelW = Math.max(...yt.map((v) => textWidth(tickLabel(v, yt), 12)));
  const left = 28 + yLabelW + 8, right = W - 20, top = 42;
  const legendRows = Math.ceil(series.length / 3);
  const bottom = H - 46 - legendRows * 18;
  if (bottom - top < 60 || right - left < 100) {
    throw new InputError("width/height", `${W}×${H}`, "a chart at least about 300×250");
  }
  const X = (v: number) => left + (v - x0) / (x1 - x0) * (right - left);
  const Y = (v: number) => bottom - (v - y0) / (y1 - y0) * (bottom - top);

  let out = text(W / 2, 24, title, { anchor: "middle", size: 15, weight: "600" });
  for (const v of yt) {
    out += line(left, Y(v), right, Y(v), "#dddddd", 1) +
      text(left - 6, Y(v) + 4, tickLabel(v, yt), { anchor: "end", size: 12 });
  }
  for (const v of xt) {
    out += line(X(v), top, X(v), bottom, "#eeeeee", 1) +
      text(X(v), bottom + 16, tickLabel(v, xt), { anchor: "middle", size: 12 });
  }
  out += `<rect x="${c(left)}" y="${c(top)}" width="${c(right - left)}" ` +
    `height="${c(bottom - top)}" stroke="${INK}" stroke-width="1"/>`;
  out += text((left + right) / 2, bottom + 34, xLabel, { anchor: "middle", size: 13 });
  out += text(14, (top + bottom) / 2, yLabel, { anchor: "middle", size: 13, rotate: -90 });
  for (const h of options.hLines ?? []) {
    out += line(left, Y(h.y), right, Y(h.y), "#8a1c1c", 1.2, "5 3") +
      text(right - 4, Y(h.y) - 4, h.label, { anchor: "end", size: 11, fill: "#8a1c1c" });
  }
  for (const v of options.vLines ?? []) {
    out += line(X(v.x), top, X(v.x), bottom, "#8a1c1c", 1.2, "5 3") +
      text(X(v.x) + 4, top + 12, v.label, { size: 11, fill: "#8a1c1c" });
  }
  series.forEach((s, i) => {
    const col = s.colour ?? PALETTE[i % PALETTE.length], dash = DASHES[i % DASHES.length];
    const pts = s.points.map(([x, y]) => [X(x), Y(y)] as [number, number]);
    out += `<polyline points="${points(pts)}" stroke="${col}" stroke-width="2"` +
      (dash ? ` stroke-dasharray="${dash}"` : "") + ` stroke-linejoin="round"/>`;
    if (pts.length <= 40) out += pts.map(([x, y]) => marker(i, x, y, col)).join("");
    const lx = left + (i % 3) * ((right - left) / 3);
    const ly = H - 14 - (legendRows - 1 - Math.floor(i / 3)) * 18;
    out += line(lx, ly - 4, lx + 28, ly - 4, col, 2, dash) + marker(i, lx + 14, ly - 4, col) +
      text(lx + 34, ly, s.name, { size: 12 });
  });
  return svgDocument(
    W,
    H,
    title,
    `Line chart: ${yLabel} against ${xLabel}; series ` +
      series.map((s) => s.name).join(", ") + ".",
    out,
  );
}

function marker(i: number, x: number, y: number, col: string): string {
  switch (i % 4) {
    case 0:
      return `<circle cx="${c(x)}" cy="${c(y)}" r="3" fill="${col}"/>`;
    case 1:
      return `<rect x="${c(x - 3)}" y="${c(y - 3)}" width="6" height="6" fill="${col}"/>`;
    case 2:
      return `<polygon points="${
        points([[x, y - 4], [x + 4, y + 3], [x - 4, y + 3]])
      }" fill="${col}"/>`;
    default:
      return `<polygon points="${
        points([[x, y - 4], [x + 4, y], [x, y + 4], [x - 4, y]])
      }" fill="${col}"/>`;
  }
}

/** One bar of a bar chart. */
export interface Bar {
  /** Label shown left of the bar. */
  readonly label: string;
  /** Value in the chart's unit. */
  readonly value: number;
}

/** Arguments of {@link svgBarChart}. */
export interface BarChartOptions {
  /** Chart title (plain text). */
  readonly title: string;
  /** The bars, drawn top to bottom in the order given. */
  readonly bars: readonly Bar[];
  /** Unit of the values, printed after each value and on the axis (for example "%"). */
  readonly unit: string;
  /** Significant digits of the value labels (default 3). */
  readonly digits?: number;
  /** viewBox width (default 720). */
  readonly width?: number;
}

/**
 * A horizontal bar chart as a self-contained SVG (for an uncertainty budget: one bar per input,
 * largest first as given). Bars start at zero; negative values extend left. Source: none.
 *
 * @param options title, bars, unit, digits, width
 * @returns the SVG markup
 * @throws {InputError} for no bars or a non-finite value
 *
 * @example
 * ```ts
 * import { svgBarChart } from "./svg.ts";
 * const svg = svgBarChart({ title: "Budget", unit: "%", bars: [
 *   { label: "inside diameter", value: 0.62 }, { label: "timing", value: 0.21 }] });
 * if ((svg.match(/<rect /g) ?? []).length < 3 || svg.includes("NaN")) throw new Error();
 * ```
 */
export function svgBarChart(options: BarChartOptions): string {
  const { title, bars, unit } = options;
  const digits = options.digits ?? 3;
  const W = options.width === undefined ? 720 : positive("width", options.width);
  if (!Array.isArray(bars as unknown) || bars.length === 0) {
    throw new InputError("bars", String(bars), "at least one { label, value }");
  }
  bars.forEach((b, i) => finite(`bars[${i}].value`, b?.value));
  const values = bars.map((b) => b.value);
  const vmin = Math.min(0, ...values), vmax = Math.max(0, ...values);
  const ticks = niceTicks(vmin, vmax === vmin ? vmin + 1 : vmax, 5);
  const t0 = ticks[0], t1 = ticks[ticks.length - 1];
  const labelW = Math.min(W * 0.4, Math.max(...bars.map((b) => textWidth(String(b.label), 12))));
  const valueW = Math.max(
    ...bars.map((b) => textWidth(formatCompact(b.value, digits) + " " + unit, 12)),
  );
  const left = 16 + labelW + 10, right = W - 16 - valueW - 6, top = 44, rowH = 26;
  if (right - left < 80) throw new InputError("width", String(W), "a wider chart for these labels");
  const bottom = top + bars.length * rowH;
  const X = (v: number) => left + (v - t0) / (t1 - t0) * (right - left);
  let out = text(W / 2, 24, title, { anchor: "middle", size: 15, weight: "600" });
  for (const v of ticks) {
    out += line(X(v), top - 4, X(v), bottom, "#e2e2e2", 1) +
      text(X(v), bottom + 16, tickLabel(v, ticks), { anchor: "middle", size: 12 });
  }
  bars.forEach((b, i) => {
    const y = top + i * rowH;
    const a = X(Math.min(0, b.value)), z = X(Math.max(0, b.value));
    out += text(left - 10, y + rowH / 2 + 4, String(b.label), { anchor: "end", size: 12 });
    out += `<rect x="${c(a)}" y="${c(y + 4)}" width="${c(Math.max(z - a, 0.5))}" ` +
      `height="${c(rowH - 8)}" fill="${PALETTE[0]}" stroke="${INK}" stroke-width="0.5"/>`;
    out += text(z + 6, y + rowH / 2 + 4, `${formatCompact(b.value, digits)} ${unit}`.trim(), {
      size: 12,
    });
  });
  out += line(X(0), top - 4, X(0), bottom, INK, 1.2);
  out += line(left, bottom, right, bottom, INK, 1);
  out += text((left + right) / 2, bottom + 34, unit ? `(${unit})` : "", {
    anchor: "middle",
    size: 12,
  });
  const H = bottom + 46;
  return svgDocument(
    W,
    H,
    title,
    `Bar chart of ${bars.length} values in ${unit}: ` +
      bars.map((b) => `${b.label} ${formatCompact(b.value, digits)}`).join("; ") + ".",
    out,
  );
}
