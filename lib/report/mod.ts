/**
 * Report primitives: number and quantity formatting, text / Markdown / CSV tables, HTML
 * escaping and an offline HTML page shell, and SVG drawings and charts as strings. Pure
 * functions from plain data; no physics, no file I/O. Re-exports only.
 *
 * @module
 */
export * from "./format.ts";
export {
  type Bar,
  type BarChartOptions,
  type LineChartOptions,
  type LineSeries,
  niceTicks,
  svgBarChart,
  svgLineChart,
} from "./svg.ts";
export * from "./drawings.ts";
