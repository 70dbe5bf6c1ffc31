/**
 * The ensemble summary: per-run tables, a plain least-squares fit of log R_g
 * against log N, and the full ensemble analysis (coordinator/stats:
 * estimators with bootstrap intervals, local slopes, corrections to scaling,
 * consistency panel), written as JSON, CSV tables or protobuf
 * (EnsembleSummary of proto/tendril.proto). The same builder serves the farm,
 * the embedded mode, the CLI and the HTTP API; docs/summary-schema.md
 * documents the result.
 *
 * The analysis plugs in through `SummaryOptions.enrich`; defaultSummaryOptions()
 * runs analyzeEnsemble with the spec's [analysis] settings (plus any CLI
 * overrides) and adds `observables` (coordinator/stats/observable-bands.ts:
 * the model-specific observables against N with bootstrap bands, and the
 * Eden interface growth exponent). Its result lands under "statistics" in the JSON and in
 * `statistics_json` of the protobuf summary. A summary of an unfinished
 * ensemble is marked partial and analyses the runs stored so far.
 */
import { CSV_TABLE_NAMES, type CsvTableName, type SummaryFormat } from './formats.js';
import { fitLine } from '../stats/log-log-fit.js';
import {
  encodeEnsembleSummary,
  type EnsembleSummaryData,
  type PowerLawFitData,
  type RunResultData,
} from '../../proto/convert.js';
import { ENGINE_VERSION } from '../../worker/core/engine-version.js';
import { specToDocument, type AnalysisSettings, type EnsembleSpec, type Observable } from '../spec/index.js';
import type { EnsembleAnalysis } from '../stats/analyze-ensemble.js';
import { analysisOptionsOf, safeAnalysis, type AdaptiveHistory } from './adaptive.js';
import type { ClusterHarmonic } from '../harmonic/cluster-harmonic.js';
import { harmonicSection } from '../harmonic/harmonic-section.js';
import type { HarmonicSection } from '../harmonic/harmonic-section-types.js';
import { probeSizesOf } from '../spec/index.js';
import { modelDescriptor } from '../../worker/models/registry.js';
import { observableSection } from '../stats/observable-bands.js';

export { analysisOptionsOf, judgeBatch, newAdaptiveHistory, safeAnalysis, type AdaptiveBatch, type AdaptiveHistory, type AdaptiveOutcome } from './adaptive.js';

export interface SummaryInput {
  ensembleId: string;
  spec: EnsembleSpec;
  createdAtMs: number;
  /** Results in any order; a run index present more than once is counted once (the first wins). */
  results: Iterable<RunResultData>;
  /** Clusters planned so far (an adaptive ensemble's grows batch by batch); default spec.clusters. */
  clustersPlanned?: number;
  /**
   * Whether the ensemble has ended (all planned runs stored and, when
   * adaptive, the stopping rule has said stop). Default: every planned run
   * is stored. An unfinished summary is marked partial.
   */
  finished?: boolean;
  /** Batch history of an adaptive ensemble. */
  adaptive?: AdaptiveHistory | null;
  /** Harmonic records of the probed clusters (spec with [probe]); any order, one per (run, size). */
  harmonic?: readonly ClusterHarmonic[];
}

export type SummaryEnricher = (runs: RunResultData[], spec: EnsembleSpec) => unknown;

export interface SummaryOptions {
  enrich?: SummaryEnricher;
  /** Smallest cluster size used in the R_g fit (default 100: the first decades are dominated by the seed). */
  fitMinSize?: number;
}

/** Ordinary least squares (fitLine) of log y on log x over the points with x >= minX and x, y > 0. */
export function logLogFit(xs: number[], ys: number[], minX = 0): PowerLawFitData | null {
  const lx: number[] = [];
  const ly: number[] = [];
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < xs.length; i++) {
    const x = xs[i];
    const y = ys[i];
    if (!(x >= minX && x > 0 && y > 0) || !Number.isFinite(y)) continue;
    lx.push(Math.log(x));
    ly.push(Math.log(y));
    lo = Math.min(lo, x);
    hi = Math.max(hi, x);
  }
  if (lx.length < 2 || !(hi > lo)) return null;
  const line = fitLine(lx, ly);
  return {
    exponent: line.slope,
    prefactor: Math.exp(line.intercept),
    rSquared: line.rSquared,
    points: line.points,
    minX: lo,
    maxX: hi,
  };
}

/** Deduplicate by run index (first wins) and sort by run index. */
export function uniqueRuns(results: Iterable<RunResultData>): RunResultData[] {
  const byIndex = new Map<number, RunResultData>();
  for (const r of results) if (!byIndex.has(r.runIndex)) byIndex.set(r.runIndex, r);
  return [...byIndex.values()].sort((a, b) => a.runIndex - b.runIndex);
}

/**
 * The options every summary of the farm, the embedded mode, the CLI and the
 * HTTP API is built with: the one place to plug the statistics library in,
 * e.g. `return { enrich: (runs) => analyzeEnsemble(runs) };`.
 */
export function defaultSummaryOptions(overrides: AnalysisSettings = {}): SummaryOptions {
  return {
    enrich: (runs, spec) => {
      const analysis = safeAnalysis(runs, analysisOptionsOf({ ...spec.analysis, ...overrides }));
      const settings = { ...spec.analysis, ...overrides };
      // model observables against N with bands, and the Eden interface growth exponent (coordinator/stats/observable-bands.ts)
      const observables = runs.length > 0 ? observableSection(runs, { seed: spec.seed, resamples: settings.resamples ?? 2000, level: settings.level ?? 0.95 }) : null;
      return observables !== null && typeof analysis === 'object' && analysis !== null ? { ...analysis, observables } : analysis;
    },
  };
}

export function buildSummary(input: SummaryInput, opts: SummaryOptions = defaultSummaryOptions()): EnsembleSummaryData {
  const runs = uniqueRuns(input.results);
  // mean of log R_g over runs at each recorded size (all runs share the size grid)
  const sums = new Map<number, { s: number; n: number }>();
  for (const r of runs) {
    const { sizes, radiusOfGyration } = r.series;
    for (let i = 0; i < sizes.length; i++) {
      if (!(radiusOfGyration[i] > 0)) continue;
      const e = sums.get(sizes[i]) ?? { s: 0, n: 0 };
      e.s += Math.log(radiusOfGyration[i]);
      e.n++;
      sums.set(sizes[i], e);
    }
  }
  const meanSizes = [...sums.keys()].sort((a, b) => a - b);
  const meanLog = meanSizes.map((n) => sums.get(n)!.s / sums.get(n)!.n);
  const wantRg = input.spec.observables.includes('radius_of_gyration');
  const fit = wantRg
    ? logLogFit(
        meanSizes,
        meanLog.map((v) => Math.exp(v)),
        opts.fitMinSize ?? 100,
      )
    : null;
  let statistics = opts.enrich ? opts.enrich(runs, input.spec) : undefined;
  if (input.spec.probe) {
    const section = harmonicOf(input, runs, statistics);
    statistics = typeof statistics === 'object' && statistics !== null ? { ...statistics, harmonic: section } : { harmonic: section };
  }
  return {
    ensembleId: input.ensembleId,
    name: input.spec.name,
    engineVersion: ENGINE_VERSION,
    specJson: JSON.stringify(specToDocument(input.spec)),
    clustersPlanned: input.clustersPlanned ?? input.spec.clusters,
    clustersDone: runs.length,
    runs,
    radiusOfGyrationFit: fit,
    fractalDimension: fit && fit.exponent > 0 ? 1 / fit.exponent : null,
    createdAtMs: input.createdAtMs,
    meanSizes,
    meanLogRadiusOfGyration: meanLog,
    statisticsJson: statistics === undefined ? '' : JSON.stringify(statistics),
    partial: !(input.finished ?? runs.length >= (input.clustersPlanned ?? input.spec.clusters)),
    adaptiveJson: input.adaptive ? JSON.stringify(input.adaptive) : '',
  };
}

/**
 * The harmonic section of a probed ensemble: the records of the runs in the
 * summary (one per (run, size), first wins), with the mass-based D from the
 * R_g estimator of the same analysis for the τ(3) = D check (τ(3) = D + 1
 * for 3D models; harmonic-section.ts).
 */
function harmonicOf(input: SummaryInput, runs: RunResultData[], statistics: unknown): HarmonicSection {
  const p = input.spec.probe!;
  const inRuns = new Set(runs.map((r) => r.runIndex));
  const seen = new Set<string>();
  const records: ClusterHarmonic[] = [];
  for (const r of [...(input.harmonic ?? [])].sort((a, b) => a.runIndex - b.runIndex || a.size - b.size)) {
    const k = `${r.runIndex}:${r.size}`;
    if (!inRuns.has(r.runIndex) || seen.has(k)) continue;
    seen.add(k);
    records.push(r);
  }
  const a = statistics as Partial<EnsembleAnalysis> | undefined;
  const rg = a?.schema === 'tendril.ensemble-statistics/1' ? a.estimators?.radiusOfGyration : undefined;
  const iv = rg?.interval;
  const section = harmonicSection(records, {
    probe: { walkers: p.walkers, jobs: p.jobs, q: [...p.q], sizes: probeSizesOf(input.spec), contactSample: p.contactSample, minStep: p.minStep },
    massDimension: rg ? { estimator: 'radiusOfGyration', value: rg.D ?? null, interval: iv?.bca ?? iv?.percentile ?? null } : null,
    dimension: modelDescriptor(input.spec.model.kind).dimension,
    seed: input.spec.seed,
    resamples: input.spec.analysis.resamples,
    level: input.spec.analysis.level,
  });
  return { ...section, perCluster: records };
}

/** The analysis inside a summary, or null when it is absent or could not be made. */
export function analysisOf(s: EnsembleSummaryData): EnsembleAnalysis | null {
  if (s.statisticsJson === '') return null;
  const a = JSON.parse(s.statisticsJson) as { schema?: string };
  return a.schema === 'tendril.ensemble-statistics/1' ? (a as EnsembleAnalysis) : null;
}

const SERIES_COLUMNS: Array<[Observable, 'radiusOfGyration' | 'maxRadius' | 'centerOffset']> = [
  ['radius_of_gyration', 'radiusOfGyration'],
  ['max_radius', 'maxRadius'],
  ['center_offset', 'centerOffset'],
];

function observablesOf(s: EnsembleSummaryData): Observable[] {
  try {
    return (JSON.parse(s.specJson) as { observables: Observable[] }).observables;
  } catch {
    return SERIES_COLUMNS.map(([o]) => o);
  }
}

/** The summary as a JSON document (snake_case keys; only the spec's observables in the per-run tables). */
export function summaryToJsonObject(s: EnsembleSummaryData): Record<string, unknown> {
  const obs = observablesOf(s);
  return {
    ensemble_id: s.ensembleId,
    name: s.name,
    engine_version: s.engineVersion,
    created_at: new Date(s.createdAtMs).toISOString(),
    spec: JSON.parse(s.specJson),
    clusters_planned: s.clustersPlanned,
    clusters_done: s.clustersDone,
    partial: s.partial,
    adaptive: s.adaptiveJson === '' ? null : JSON.parse(s.adaptiveJson),
    radius_of_gyration_fit: s.radiusOfGyrationFit && {
      exponent: s.radiusOfGyrationFit.exponent,
      prefactor: s.radiusOfGyrationFit.prefactor,
      r_squared: s.radiusOfGyrationFit.rSquared,
      points: s.radiusOfGyrationFit.points,
      min_size: s.radiusOfGyrationFit.minX,
      max_size: s.radiusOfGyrationFit.maxX,
    },
    fractal_dimension: s.fractalDimension,
    mean_log_radius_of_gyration: s.meanSizes.map((n, i) => ({ size: n, mean_log_radius_of_gyration: s.meanLogRadiusOfGyration[i] })),
    runs: s.runs.map((r) => {
      const series: Record<string, number[]> = { sizes: r.series.sizes };
      for (const [o, k] of SERIES_COLUMNS) if (obs.includes(o)) series[o] = r.series[k];
      for (const [name, values] of Object.entries(r.series.extra)) series[name] = values;
      return {
        run_index: r.runIndex,
        particles: r.particles,
        state_hash: r.stateHash,
        counters: { ...r.counters },
        timings: {
          grow_seconds: r.timings.growSeconds,
          started_at: new Date(r.timings.startedAtMs).toISOString(),
          finished_at: new Date(r.timings.finishedAtMs).toISOString(),
          resumes: r.timings.resumes,
          finished_by: r.timings.finishedBy,
        },
        series,
        ...(obs.includes('mass_radius') ? { mass_radius: { radii: r.massRadius.radii, counts: r.massRadius.counts } } : {}),
      };
    }),
    statistics: s.statisticsJson === '' ? null : JSON.parse(s.statisticsJson),
  };
}

export function summaryToJson(s: EnsembleSummaryData): string {
  return JSON.stringify(summaryToJsonObject(s), null, 2) + '\n';
}

/** Names of a keyed field over all runs, in order of first appearance (every run of an ensemble has the same ones). */
function namesOver(s: EnsembleSummaryData, of: (r: RunResultData) => Record<string, unknown>): string[] {
  const names = new Set<string>();
  for (const r of s.runs) for (const k of Object.keys(of(r))) names.add(k);
  return [...names];
}

/** One row per (run, recorded size): the per-run observable table in long format (model-specific observables last). */
export function summaryToCsv(s: EnsembleSummaryData): string {
  const obs = observablesOf(s);
  const cols = SERIES_COLUMNS.filter(([o]) => obs.includes(o));
  const extra = namesOver(s, (r) => r.series.extra);
  const lines = [['run_index', 'state_hash', 'size', ...cols.map(([o]) => o), ...extra].join(',')];
  for (const r of s.runs) {
    for (let i = 0; i < r.series.sizes.length; i++) {
      lines.push([r.runIndex, r.stateHash, r.series.sizes[i], ...cols.map(([, k]) => num(r.series[k][i])), ...extra.map((k) => opt(r.series.extra[k]?.[i]))].join(','));
    }
  }
  return lines.join('\n') + '\n';
}

/** The final mass–radius counts M(r), one row per (run, radius). */
export function massRadiusToCsv(s: EnsembleSummaryData): string {
  const lines = ['run_index,radius,count'];
  for (const r of s.runs) for (let i = 0; i < r.massRadius.radii.length; i++) lines.push(`${r.runIndex},${num(r.massRadius.radii[i])},${r.massRadius.counts[i]}`);
  return lines.join('\n') + '\n';
}

/** Per-run totals: one row per run; one column per counter of the model. */
export function runsToCsv(s: EnsembleSummaryData): string {
  const counters = namesOver(s, (r) => r.counters);
  const lines = [['run_index', 'particles', 'state_hash', ...counters, 'grow_seconds', 'resumes', 'finished_by'].join(',')];
  for (const r of s.runs) {
    lines.push(
      [r.runIndex, r.particles, r.stateHash, ...counters.map((k) => opt(r.counters[k])), num(r.timings.growSeconds), r.timings.resumes, csvText(r.timings.finishedBy)].join(','),
    );
  }
  return lines.join('\n') + '\n';
}

/** Per-estimator results (and the corrected D of the corrections fits): one row per estimator. */
export function estimatorsToCsv(s: EnsembleSummaryData): string {
  const lines = [
    'estimator,quantity,available,D,percentile_low,percentile_high,bca_low,bca_high,level,interval_status,fit_variable,fit_from,fit_to,first_used,last_used,points,window_source,clusters,partial,reason',
  ];
  const a = analysisOf(s);
  if (a) {
    for (const e of Object.values(a.estimators)) {
      const iv = e.interval;
      const w = e.fitWindow;
      lines.push(
        [
          e.name, e.quantity, e.available, opt(e.D), opt(iv.percentile?.[0]), opt(iv.percentile?.[1]), opt(iv.bca?.[0]), opt(iv.bca?.[1]), iv.level, iv.status,
          w?.variable ?? '', opt(w?.from), opt(w?.to), opt(w?.firstUsed), opt(w?.lastUsed), w?.points ?? '', w?.source ?? '', a.clusters, s.partial, csvText(e.reason ?? ''),
        ].join(','),
      );
    }
    for (const c of [a.corrections.radiusOfGyration, a.corrections.maxRadius]) {
      if (!c) continue;
      const iv = c.D.interval;
      lines.push(
        [
          `${c.estimator}Corrected`, `${c.estimator === 'radiusOfGyration' ? 'R_g' : 'R_max'}(N) with corrections to scaling`, c.determined, opt(c.D.value),
          opt(iv.percentile?.[0]), opt(iv.percentile?.[1]), opt(iv.bca?.[0]), opt(iv.bca?.[1]), iv.level, iv.status,
          'N', opt(c.window?.from), opt(c.window?.to), '', '', c.points, c.window?.source ?? '', a.clusters, s.partial, csvText(c.reason ?? ''),
        ].join(','),
      );
    }
  }
  return lines.join('\n') + '\n';
}

/** Local slopes: one row per (estimator, centre of the sliding window). */
export function localSlopesToCsv(s: EnsembleSummaryData): string {
  const lines = ['estimator,at,D,percentile_low,percentile_high,bca_low,bca_high,interval_status'];
  const a = analysisOf(s);
  if (a) {
    for (const e of Object.values(a.estimators)) {
      for (const p of e.localSlopes?.points ?? []) {
        lines.push([e.name, p.at, opt(p.D), opt(p.percentile?.[0]), opt(p.percentile?.[1]), opt(p.bca?.[0]), opt(p.bca?.[1]), p.status].join(','));
      }
    }
  }
  return lines.join('\n') + '\n';
}

/** Batches of an adaptive ensemble: one row per batch (header only for a fixed count). */
export function batchesToCsv(s: EnsembleSummaryData): string {
  const lines = ['batch,from_run,to_run,clusters_after,D,half_width,interval_low,interval_high,decision,reason'];
  if (s.adaptiveJson !== '') {
    const h = JSON.parse(s.adaptiveJson) as AdaptiveHistory;
    for (const b of h.batches) {
      const j = b.judged;
      lines.push([b.batch, b.fromRun, b.toRun, j?.clusters ?? '', opt(j?.D), opt(j?.halfWidth), opt(j?.interval?.[0]), opt(j?.interval?.[1]), j?.action ?? 'pending', csvText(j?.reason ?? '')].join(','));
    }
  }
  return lines.join('\n') + '\n';
}

/** The harmonic section of a summary, or null (no [probe], or not computed). */
export function harmonicOfSummary(s: EnsembleSummaryData): HarmonicSection | null {
  if (s.statisticsJson === '') return null;
  const h = (JSON.parse(s.statisticsJson) as { harmonic?: HarmonicSection }).harmonic;
  return h && h.schema === 'tendril-harmonic/1' ? h : null;
}

/** Probed clusters: one row per (run, size), τ(q) as one column per q (header only without [probe]). */
export function harmonicToCsv(s: EnsembleSummaryData): string {
  const h = harmonicOfSummary(s);
  const q = h?.probe.q ?? [];
  const lines = [['run_index', 'size', 'walkers', 'log_capacity', 'log_capacity_error', 'z3', 'information_dimension', 'max_concentration_exponent', 'radius', ...q.map((v) => `tau_q${v}`)].join(',')];
  for (const r of h?.perCluster ?? []) {
    lines.push([r.runIndex, r.size, r.walkers, opt(r.logCapacity), opt(r.logCapacityError), opt(r.z3), opt(r.informationDimension), opt(r.maxConcentrationExponent), opt(r.radius), ...r.tau.map((t) => opt(t))].join(','));
  }
  return lines.join('\n') + '\n';
}

/** Every CSV table of a summary, by file name; each is one plain table with a header row. */
export const CSV_TABLES: Record<CsvTableName, (s: EnsembleSummaryData) => string> = {
  series: summaryToCsv,
  runs: runsToCsv,
  'mass-radius': massRadiusToCsv,
  estimators: estimatorsToCsv,
  'local-slopes': localSlopesToCsv,
  batches: batchesToCsv,
  harmonic: harmonicToCsv,
};
export { CSV_TABLE_NAMES, SUMMARY_FORMATS, type CsvTableName, type SummaryFormat } from './formats.js';

export function summaryToProtobuf(s: EnsembleSummaryData): Uint8Array {
  return encodeEnsembleSummary(s);
}


/** One download: JSON, protobuf, or one CSV table (default the per-run series). */
export function renderSummary(s: EnsembleSummaryData, format: SummaryFormat, table = 'series'): Uint8Array {
  if (format === 'pb') return summaryToProtobuf(s);
  if (format === 'json') return Buffer.from(summaryToJson(s), 'utf8');
  const t = (CSV_TABLES as Record<string, ((s: EnsembleSummaryData) => string) | undefined>)[table];
  if (!t) throw new RangeError(`table: "${table}" is not allowed; allowed: ${CSV_TABLE_NAMES.join(', ')}`);
  return Buffer.from(t(s), 'utf8');
}

function num(v: number): string {
  return Number.isFinite(v) ? String(v) : '';
}

function opt(v: number | null | undefined): string {
  return v === null || v === undefined || !Number.isFinite(v) ? '' : String(v);
}

function csvText(t: string): string {
  return /[",\n]/.test(t) ? `"${t.replace(/"/g, '""')}"` : t;
}
