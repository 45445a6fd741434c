export type {
  ReportInput,
  ReportOptions,
  RenderedReport,
  RenderedPlot,
  ReportDrops,
  ReportRank,
  ReportScatter,
  ReportFit,
  ReportFitTerm,
  ReportSearch,
  ReportCandidate,
  ReportBound,
  ReportBoundResult,
  ReportWitness,
  Interval,
} from './types.ts';
export { renderReport, planReport } from './render.ts';
export { writeReportFiles } from './write.ts';
export { formatNumber, formatCount, formatInterval, formatMaybe } from './format.ts';
export { escapeHtml, escapeMarkdown, markdownFence, slug } from './escape.ts';
export { sampleIndices, largestIndices, bin2d } from './sample.ts';
export type { Bin2d } from './sample.ts';
export { specToSvg, svgToPng, svgToPngAsync, prefixIds, roundGeometry, plotLibraryVersions } from './render-plot.ts';
export type { PlotSpec } from './render-plot.ts';
export { EVIDENCE_SENTENCE } from './summary.ts';
export { attributionSpec } from './plots/attribution.ts';
export { scatterSpec } from './plots/scatter.ts';
export { predictionSpec } from './plots/predictions.ts';
export { residualSpec } from './plots/residuals.ts';
export { boundSpec } from './plots/bound.ts';
