/** Public surface of the ensemble statistics library (pure functions, no I/O). */
export { analyzeEnsemble, ESTIMATOR_NAMES, DEFAULT_SIZE_WINDOW_RULE, DEFAULT_RADIUS_WINDOW_RULE, DEFAULT_CORRECTIONS_WINDOW_RULE } from './analyze-ensemble.js';
export type { AnalysisOptions, EnsembleAnalysis, EstimatorName, EstimatorSummary, CorrectionsSummary, LocalSlopePoint, FitWindowSummary, SizeWindow, RadiusWindow, ValueWithInterval } from './analyze-ensemble.js';
export { bootstrapInterval, sortedQuantile, jackknifeAcceleration, halfWidth, type IntervalSummary, type IntervalStatus } from './bca.js';
export { bootstrapRandom, drawResample, bootstrapScalar, jackknifeScalar, jackknifeMeans } from './bootstrap.js';
export { buildConsistencyPanel, type ConsistencyPanel } from './consistency-panel.js';
export { extractEnsembleData, StatsInputError } from './ensemble-data.js';
export { fitLine, slopeWeights } from './log-log-fit.js';
export { localWindows } from './local-slopes.js';
export { referenceFor, type ModelReference } from './reference-values.js';
export { fitScalingCorrections, CorrectionsFitter, type CorrectionsFit } from './scaling-corrections-fit.js';
export { decideStopping, EnsembleStoppingMonitor, type StoppingDecision, type StoppingInput, type MonitorOptions, type MonitorReport } from './adaptive-stopping.js';
export { syntheticEnsemble, logSpacedSizes, type SyntheticEnsembleSpec } from './synthetic-ensemble.js';
export { normalCdf, normalQuantile, erfc } from './special-functions.js';
