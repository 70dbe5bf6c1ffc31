/** Public surface of the ensemble report: HTML page, SVG figures and their PNG renderings. */
export { writeEnsembleReport, buildEnsembleReport, escapeHtml, richHtml, type ReportInput, type ReportAnalysis, type ReportFiles, type SampleClusterInput } from './html-report.js';
export { estimatorFigure, localSlopesFigure, comparisonFigure, correctionsFigure, clusterFigure, emptyFigure, type Figure } from './plots.js';
export { tauFigure, fAlphaFigure, capacityFigure, capacityIncrementFigure, electrostaticFigure, measurePictureFigure, harmonicFigures, type MeasurePictureInput } from './harmonic-plots.js';
export { pngRenderer, fontFiles, type PngRenderer } from './png-plot.js';
export { Plot, Scale, linearTicks, logTicks, niceStep, autoDomain, parseRichText, svgText, textWidth, escapeXml, COLOURS, FONT_FAMILY, type AxisSpec, type Tick } from './svg-plot.js';
