/**
 * Report primitives: number and quantity formatting, text / Markdown / CSV tables, HTML
 * escaping and an offline HTML page shell, and SVG drawings and charts as strings. Pure
 * functions from plain data; no physics, no file I/O. Re-exports only.
 *
 * @module
 */
export {
  BASE_CSS,
  csvTable,
  displayUnit,
  escapeHtml,
  formatCompact,
  formatNumber,
  formatQuantity,
  formatWithUncertainty,
  htmlPage,
  type HtmlPageOptions,
  markdownTable,
  pipeDesignation,
  type TableCell,
  textTable,
  type TextTableOptions,
} from "./format.ts";
export {
  type Bar,
  type BarChartOptions,
  type LineChartOptions,
  type LineSeries,
  niceTicks,
  svgBarChart,
  svgLineChart,
} from "./svg.ts";
export {
  type AxialPathOptions,
  MOUNTING_COLOURS,
  mountingColour,
  type PipeSectionOptions,
  type RunOptions,
  svgAxialPath,
  svgPipeSection,
  svgRun,
} from "./drawings.ts";
export * from "./plan_report.ts";
export {
  CARD_CSS,
  CARD_SAFETY,
  type CardOptions,
  clockPosition,
  formatCard,
  inchesSixteenths,
  type JobCard,
  jobCard,
  jobCardHtml,
} from "./card.ts";
export {
  FLEET_INDEX_HEADINGS,
  fleetIndexHtml,
  type FleetIndexRefusal,
  type FleetIndexRow,
  VERDICT_CLASSES,
} from "./fleet_index.ts";
