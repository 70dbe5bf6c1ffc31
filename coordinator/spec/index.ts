/**
 * Ensemble specs: parse TOML or JSON, validate against the shared schema
 * (coordinator/spec/schema.ts) and the operator's limits, fill in defaults.
 *
 * Every problem is reported as one line naming the field, the value found and
 * what is allowed, e.g.
 *   particles: 0 is out of range; allowed: an integer from 2 to 100000000
 * A SpecError carries all problems of a document at once.
 */
import { RECORDS_PER_DECADE } from '../../worker/core/record-sizes.js';
import { parse as parseToml } from 'smol-toml';
import { checkModelForSize, isModelKind, MODEL_KINDS, MODELS, modelDescriptor, modelParamProblems, modelParams } from '../../worker/models/registry.js';
import { compileChecker, type Checker } from './schema-messages.js';
import { quoteValue } from '../../worker/core/value-range.js';
import { defaultProbeJobs, probeSettingsOf, probeSettingsProblems, type ProbeSettings, type ProbeSettingsDocument } from '../harmonic/probe-settings.js';
import type { ModelParams } from '../../worker/core/growth-kernel.js';
import type { ModelDescriptor } from '../../worker/core/model-descriptor.js';
import { probeMinStepFloor } from '../../worker/probe/probe-limits.js';
import { excerpt, MAX_LISTED_PROBLEMS, nestingProblem } from './document-limits.js';
import {
  DEFAULT_MAX_TOTAL_PARTICLES,
  MAX_RUNS_PER_JOB,
  OBSERVABLES,
  SPEC_SCHEMA,
  type TARGET_ESTIMATORS,
} from './schema.js';
import { messageOf, TendrilError } from '../../proto/errors.js';

export { SPEC_SCHEMA } from './schema.js';

export type Observable = (typeof OBSERVABLES)[number];
export type TargetEstimator = (typeof TARGET_ESTIMATORS)[number];

/** The [analysis] table: options of the ensemble statistics; absent fields take the library's defaults. */
export interface AnalysisSettings {
  fitMinSize?: number;
  fitMaxSize?: number;
  massRadiusMinRadius?: number;
  massRadiusMaxRadius?: number;
  resamples?: number;
  level?: number;
  corrections?: boolean;
  localSlopeWidth?: number;
}

/** The [target] table: an adaptive ensemble grows in batches until the interval of D is narrow enough or the cap is reached. */
export interface TargetSpec {
  estimator: TargetEstimator;
  halfWidth: number;
  level: number;
  maxClusters: number;
  minBatch: number;
  minClusters: number;
}

/** The [probe] table: harmonic-measure probing of every cluster at its end and at chosen sizes (settings as in coordinator/harmonic/probe-settings.ts). */
export interface ProbeSpec extends ProbeSettings {
  /** Sizes below `particles` at which clusters are also probed, ascending (may be empty). */
  atSizes: number[];
}

/** Every size at which the clusters of a spec are probed (ascending, the final size last); empty without [probe]. */
export function probeSizesOf(s: EnsembleSpec): number[] {
  return s.probe ? [...s.probe.atSizes, s.particles] : [];
}

/** Most probe jobs one ensemble may queue (probe.jobs × probe sizes × clusters): each is a queue entry. */
export const MAX_PROBE_JOBS_PER_ENSEMBLE = 100_000;

/** Bootstrap resamples when the spec gives none (coordinator/stats/analyze-ensemble.ts). */
export const DEFAULT_BOOTSTRAP_RESAMPLES = 2000;
/**
 * Ceiling on analysis.resamples × clusters above the default: one summary of
 * 10^6 resamples over 40 clusters (4·10^7) took 354 s in the audit of issue
 * #11, and 10^5 resamples over 10 clusters of 300 particles (10^6) about
 * 90 s on a busy shared machine; 2·10^6 keeps one summary within minutes.
 */
export const MAX_BOOTSTRAP_DRAWS = 2_000_000;

/** Default fewest clusters before an adaptive target may count as reached (a bootstrap interval of fewer is too noisy to trust). */
export const DEFAULT_TARGET_MIN_CLUSTERS = 20;
/** Default smallest batch of an adaptive ensemble. */
export const DEFAULT_TARGET_MIN_BATCH = 8;

const ANALYSIS_FIELDS: Array<[keyof AnalysisSettings, string]> = [
  ['fitMinSize', 'fit_min_size'],
  ['fitMaxSize', 'fit_max_size'],
  ['massRadiusMinRadius', 'mass_radius_min_radius'],
  ['massRadiusMaxRadius', 'mass_radius_max_radius'],
  ['resamples', 'resamples'],
  ['level', 'level'],
  ['corrections', 'corrections'],
  ['localSlopeWidth', 'local_slope_width'],
];

/** Most runs an ensemble may ever have: clusters, or max_clusters of an adaptive one. */
export function maxRunsOf(s: EnsembleSpec): number {
  return s.target ? s.target.maxClusters : s.clusters;
}

/** A validated ensemble spec with every default filled in. */
export interface EnsembleSpec {
  name: string;
  model: ModelParams;
  particles: number;
  clusters: number;
  /** Decimal string of an unsigned 64-bit integer. */
  seed: string;
  recordsPerDecade: number;
  observables: Observable[];
  checkpointIntervalSeconds: number;
  checkpointEveryParticles: number;
  runsPerJob: number;
  /** Options of the statistics (the [analysis] table). */
  analysis: AnalysisSettings;
  /** Adaptive target, or null for a fixed count; then `clusters` is the first batch. */
  target: TargetSpec | null;
  /** Harmonic-measure probing, or null. */
  probe: ProbeSpec | null;
  /** Keep final positions of every cluster ([positions]), or null. */
  positions: PositionsSpec | null;
}

export class SpecError extends TendrilError {
  override name = 'SpecError';
  readonly kind = 'spec';
  constructor(readonly problems: string[]) {
    super(problems.length === 1 ? problems[0] : `${problems.length} problems: ${problems.join('; ')}`);
  }
}

export interface SpecLimits {
  /** Ceiling on particles × clusters. */
  maxTotalParticles: number;
}

/** The operator's limits: TENDRIL_MAX_TOTAL_PARTICLES raises (or lowers) the total-work ceiling. */
export function limitsFromEnv(env: NodeJS.ProcessEnv = process.env, override?: number): SpecLimits {
  if (override !== undefined) return { maxTotalParticles: checkCeiling('--max-total-particles', String(override)) };
  const raw = env.TENDRIL_MAX_TOTAL_PARTICLES;
  if (raw === undefined || raw === '') return { maxTotalParticles: DEFAULT_MAX_TOTAL_PARTICLES };
  return { maxTotalParticles: checkCeiling('TENDRIL_MAX_TOTAL_PARTICLES', raw) };
}

function checkCeiling(what: string, raw: string): number {
  const v = Number(raw);
  if (!Number.isSafeInteger(v) || v < 1) throw new SpecError([`${what}: "${raw}" is not allowed; allowed: an integer from 1 to ${Number.MAX_SAFE_INTEGER}`]);
  return v;
}

/**
 * The schema-level problems of a spec document, one line each: the schema is
 * built from the model descriptors (coordinator/spec/schema.ts), and the
 * lines about `params` come from the model registry, so they name
 * `params.NAME`, the model and the allowed range.
 */
export const specDocumentProblems: Checker = compileChecker(SPEC_SCHEMA, {
  path: '/params',
  problems: (doc) => {
    const d = doc as Record<string, unknown>;
    if (!isModelKind(d.model)) return [];
    const given = d.params ?? {};
    const isTable = typeof given === 'object' && given !== null && !Array.isArray(given);
    return modelParamProblems(isTable ? modelParams(d.model, given as Record<string, number>) : { kind: d.model, params: given as Record<string, number> });
  },
});

/** Parse a spec file's text; `format` from the file name (.toml / .json) or given. */
export function parseSpecText(text: string, format: 'toml' | 'json'): unknown {
  if (format === 'json') {
    try {
      return JSON.parse(text);
    } catch (err) {
      throw new SpecError([`spec is not valid JSON: ${oneLine(err)}`]);
    }
  }
  try {
    return parseToml(text);
  } catch (err) {
    const e = err as { line?: number; column?: number };
    const where = e.line !== undefined ? ` (line ${e.line}, column ${e.column ?? 0})` : '';
    const msg = oneLine(err).replace(/^Invalid TOML document: /, '');
    // TOML integers are signed 64-bit: a seed of 2^63 or more must be written as a string
    const hint = /cannot be represented losslessly|integer .*(large|range)/i.test(msg) ? '; an integer of 2^63 or more (e.g. a seed up to 18446744073709551615) must be quoted: seed = "18446744073709551615"' : '';
    throw new SpecError([`spec is not valid TOML${where}: ${msg}${hint}`]);
  }
}

export function formatOf(fileName: string): 'toml' | 'json' {
  if (/\.json$/i.test(fileName)) return 'json';
  if (/\.toml$/i.test(fileName)) return 'toml';
  // the caller names the file (no doubled 'spec file "…": spec file "…"')
  throw new SpecError(['unknown format; allowed: a name ending in .toml or .json']);
}

/** Validate a parsed document and fill in defaults; throws SpecError listing every problem. */
/**
 * `stored`: the document is one specToDocument wrote for a spec validated at
 * launch (the store's copy); the JSON-schema pass is skipped (it loads and
 * compiles ajv), the checks and defaults below still apply.
 */
export function validateSpec(doc: unknown, limits: SpecLimits = limitsFromEnv(), opts: { stored?: boolean } = {}): EnsembleSpec {
  // nesting first: quoting or checking a document nested 10^5 deep would overflow the stack
  const tooDeep = nestingProblem(doc, 'spec');
  if (tooDeep !== null) throw new SpecError([tooDeep]);
  if (typeof doc !== 'object' || doc === null || Array.isArray(doc)) {
    throw new SpecError([`spec: ${excerpt(doc, 60)} is not allowed; allowed: a table (object) of fields`]);
  }
  const d = doc as Record<string, any>;
  const schemaProblems = opts.stored ? [] : specDocumentProblems(doc);
  if (schemaProblems.length > 0) {
    // every problem in one round: the schema's, and a missing cluster count (which the schema cannot require, as [target] may stand in for it)
    // (unless the list is already cut at MAX_LISTED_PROBLEMS: the rest comes in the next round)
    if (d.clusters === undefined && d.target === undefined && schemaProblems.length < MAX_LISTED_PROBLEMS) schemaProblems.push(`clusters: missing; allowed: an integer from 1 to ${SPEC_SCHEMA.properties.clusters.maximum} (or a [target] table with max_clusters)`);
    throw new SpecError(schemaProblems);
  }
  const problems: string[] = [];
  const t = d.target as Record<string, any> | undefined;
  if (d.clusters === undefined && !t) problems.push(`clusters: missing; allowed: an integer from 1 to ${SPEC_SCHEMA.properties.clusters.maximum} (or a [target] table with max_clusters)`);
  const minClusters = t?.min_clusters ?? DEFAULT_TARGET_MIN_CLUSTERS;
  const minBatch = t?.min_batch ?? DEFAULT_TARGET_MIN_BATCH;
  // the first batch of an adaptive ensemble when the spec gives none: enough clusters for a first interval
  const clusters: number = d.clusters ?? (t ? Math.min(t.max_clusters, Math.max(minClusters, minBatch)) : 0);
  if (t && d.clusters !== undefined && d.clusters > t.max_clusters) {
    problems.push(`clusters: ${d.clusters} is out of range; allowed: an integer from 1 to target.max_clusters (${t.max_clusters})`);
  }
  if (t && t.min_clusters !== undefined && t.min_clusters > t.max_clusters) {
    problems.push(`target.min_clusters: ${t.min_clusters} is out of range; allowed: an integer from 2 to target.max_clusters (${t.max_clusters})`);
  }
  const a = (d.analysis ?? {}) as Record<string, any>;
  // a fit window that misses the grown sizes would end in "no statistics" after all the work
  const windowReversed = a.fit_max_size !== undefined && a.fit_min_size !== undefined && !(a.fit_min_size < a.fit_max_size);
  if (a.fit_min_size !== undefined && a.fit_min_size >= d.particles && !windowReversed) problems.push(`analysis.fit_min_size: ${a.fit_min_size} is out of range; allowed: a number from 1 to below particles (${d.particles})`);
  for (const [lo, hi] of [['fit_min_size', 'fit_max_size'], ['mass_radius_min_radius', 'mass_radius_max_radius']]) {
    if (a[lo] !== undefined && a[hi] !== undefined && !(a[lo] < a[hi])) problems.push(`analysis.${lo}: ${a[lo]} is not allowed; allowed: a number below analysis.${hi} (${a[hi]})`);
  }
  const runsMax = t ? t.max_clusters : clusters;
  // the bootstrap's work grows as resamples × clusters: the default is always allowed, more only up to the ceiling
  if (a.resamples !== undefined && a.resamples > DEFAULT_BOOTSTRAP_RESAMPLES && a.resamples * runsMax > MAX_BOOTSTRAP_DRAWS) {
    const most = Math.max(DEFAULT_BOOTSTRAP_RESAMPLES, Math.floor(MAX_BOOTSTRAP_DRAWS / runsMax));
    problems.push(`analysis.resamples: ${a.resamples} is out of range for ${runsMax} clusters; allowed: an integer from 10 to ${most} (resamples × clusters at most ${MAX_BOOTSTRAP_DRAWS}, or the default ${DEFAULT_BOOTSTRAP_RESAMPLES})`);
  }
  const total = d.particles * runsMax;
  if (total > limits.maxTotalParticles) {
    problems.push(
      `particles × ${t ? 'target.max_clusters' : 'clusters'}: ${d.particles} × ${runsMax} = ${total} is above the total-work ceiling; allowed: at most ${limits.maxTotalParticles} (the operator may raise it with TENDRIL_MAX_TOTAL_PARTICLES)`,
    );
  }
  const pw = d.probe as Record<string, any> | undefined;
  if (pw && typeof pw.walkers === 'number') {
    // probe walkers count in the total work (one walker costs about as much as one particle's walk), and queued probe jobs are bounded
    const sizes = (Array.isArray(pw.at_sizes) ? pw.at_sizes.length : 0) + 1;
    const walkersTotal = pw.walkers * sizes * runsMax;
    if (total + walkersTotal > limits.maxTotalParticles) {
      problems.push(
        `probe.walkers: ${pw.walkers} × ${sizes} size${sizes > 1 ? 's' : ''} × ${runsMax} clusters = ${walkersTotal} walkers, plus ${total} particles, is above the total-work ceiling; allowed: at most ${limits.maxTotalParticles} walkers and particles together (the operator may raise it with TENDRIL_MAX_TOTAL_PARTICLES)`,
      );
    }
    const jobsTotal = (pw.jobs ?? defaultProbeJobs(pw.walkers)) * sizes * runsMax;
    if (jobsTotal > MAX_PROBE_JOBS_PER_ENSEMBLE) {
      problems.push(`probe.jobs: ${pw.jobs ?? defaultProbeJobs(pw.walkers)} per size × ${sizes} size${sizes > 1 ? 's' : ''} × ${runsMax} clusters = ${jobsTotal} probe jobs; allowed: at most ${MAX_PROBE_JOBS_PER_ENSEMBLE} probe jobs per ensemble`);
    }
  }
  const every = d.checkpoint_every_particles ?? 0;
  if (every > d.particles) {
    problems.push(`checkpoint_every_particles: ${every} is out of range; allowed: 0 (off) or an integer from 1 to particles (${d.particles})`);
  }
  const po = d.positions as Record<string, any> | undefined;
  if (po) {
    for (const [k, v] of (po.at_sizes ?? []).entries()) {
      if (v >= d.particles) problems.push(`positions.at_sizes[${k}]: ${v} is out of range; allowed: an integer from 2 to particles - 1 (${d.particles - 1})`);
    }
  }
  const pr = d.probe as Record<string, any> | undefined;
  if (pr) {
    for (const [k, v] of (pr.at_sizes ?? []).entries()) {
      if (v >= d.particles) problems.push(`probe.at_sizes[${k}]: ${v} is out of range; allowed: an integer from 2 to particles - 1 (${d.particles - 1})`);
    }
    problems.push(...probeSettingsProblems(pr as ProbeSettingsDocument, 'probe.'));
    // a cluster of N unit-diameter disks spans at most N contact radii from its middle
    const stepFloor = probeMinStepFloor(d.particles + 1);
    if (typeof pr.min_step === 'number' && pr.min_step < stepFloor) problems.push(`probe.min_step: ${pr.min_step} is out of range; allowed: a number from ${stepFloor} to 1 for ${d.particles} particles (a smaller step is lost in the float spacing)`);
  }
  const seed = String(d.seed);
  if (BigInt(seed) >= 1n << 64n) problems.push(`seed: "${seed}" is out of range; allowed: an integer from 0 to 18446744073709551615`);
  const model: ModelParams = modelParams(d.model, (d.params ?? {}) as Record<string, number>);
  const paramProblems = modelParamProblems(model);
  problems.push(...paramProblems);
  // the model's own checks against the cluster size (e.g. the min_step floor set by the float spacing)
  if (paramProblems.length === 0 && Number.isSafeInteger(d.particles)) {
    try {
      checkModelForSize(model, d.particles);
    } catch (err) {
      problems.push((err as Error).message);
    }
  }
  const noProbe = pr ? probeProblem(modelDescriptor(d.model)) : null;
  if (noProbe !== null) problems.push(noProbe);
  const noContact = pr ? contactSampleProblem(modelDescriptor(d.model), pr.contact_sample) : null;
  if (noContact !== null) problems.push(noContact);
  if (problems.length > 0) throw new SpecError(problems);

  const analysis: AnalysisSettings = {};
  for (const [k, f] of ANALYSIS_FIELDS) if (a[f] !== undefined) (analysis as Record<string, unknown>)[k] = a[f];
  return {
    name: d.name ?? 'ensemble',
    model,
    particles: d.particles,
    clusters,
    seed: BigInt(seed).toString(),
    recordsPerDecade: d.records_per_decade ?? RECORDS_PER_DECADE.default,
    observables: d.observables ?? [...OBSERVABLES],
    checkpointIntervalSeconds: d.checkpoint_interval_seconds ?? 300,
    checkpointEveryParticles: every,
    runsPerJob: d.runs_per_job ?? defaultRunsPerJob(d.particles, runsMax),
    analysis,
    target: t
      ? {
          estimator: t.estimator ?? 'radius_of_gyration',
          halfWidth: t.half_width,
          level: t.level ?? 0.95,
          maxClusters: t.max_clusters,
          minBatch,
          minClusters,
        }
      : null,
    probe: pr
      ? {
          ...probeSettingsOf(pr as ProbeSettingsDocument),
          // 3D probes keep no contact points (contactSampleProblem)
          ...(modelDescriptor(d.model).probe === 'balls-3d' ? { contactSample: 0 } : {}),
          atSizes: [...(pr.at_sizes ?? [])].sort((a: number, b: number) => a - b),
        }
      : null,
    positions: po ? { atSizes: [...(po.at_sizes ?? [])].sort((a: number, b: number) => a - b) } : null,
  };
}

/** The [positions] table: keep every cluster's final positions; `atSizes` are the smaller sizes exported too (prefixes). */
export interface PositionsSpec {
  atSizes: number[];
}

/** Every size at which the positions of a spec's clusters are exported (ascending, the final size last); empty without [positions]. */
export function positionSizesOf(s: EnsembleSpec): number[] {
  return s.positions ? [...s.positions.atSizes, s.particles] : [];
}

/** The one line refusing a [probe] table for a model whose descriptor declares no probe, or null when it has one. */
export function probeProblem(d: ModelDescriptor, models: readonly ModelDescriptor[] = MODELS): string | null {
  if (d.probe !== null) return null;
  const probed = models.filter((m) => m.probe !== null).map((m) => m.kind);
  return `probe: ${d.kind} has no harmonic-measure probe; allowed: a spec without [probe] for this model (probes apply to ${probed.join(', ') || 'no model'})`;
}

/** The one line refusing probe.contact_sample for a model probed in 3D (no contact points are kept there), or null. */
export function contactSampleProblem(d: ModelDescriptor, contactSample: unknown): string | null {
  if (d.probe !== 'balls-3d' || contactSample === undefined) return null;
  return `probe.contact_sample: ${quoteValue(contactSample)} is not used by ${d.kind}; allowed: no contact_sample (3D probes keep no contact points: the Newtonian capacity comes from the share of probes that hit)`;
}

/** Parse and validate in one go. */
export function parseSpec(text: string, format: 'toml' | 'json', limits?: SpecLimits): EnsembleSpec {
  return validateSpec(parseSpecText(text, format), limits);
}

/**
 * Clusters per queue job when the spec does not say: one per job unless the
 * clusters are tiny, then up to enough for a job of about 10^5 particles (so
 * that queue overhead stays small), but never fewer than 64 jobs' worth of
 * grouping, so that small ensembles still spread over many workers.
 */
export function defaultRunsPerJob(particles: number, clusters: number): number {
  const bySize = Math.max(1, Math.floor(100_000 / particles));
  const bySpread = Math.max(1, Math.ceil(clusters / 64));
  return Math.min(bySize, bySpread, MAX_RUNS_PER_JOB);
}

/** The canonical document of a validated spec (snake_case, defaults explicit); re-validates to the same spec. */
export function specToDocument(s: EnsembleSpec): Record<string, unknown> {
  return {
    name: s.name,
    model: s.model.kind,
    params: { ...s.model.params },
    particles: s.particles,
    clusters: s.clusters,
    seed: s.seed,
    records_per_decade: s.recordsPerDecade,
    observables: [...s.observables],
    checkpoint_interval_seconds: s.checkpointIntervalSeconds,
    checkpoint_every_particles: s.checkpointEveryParticles,
    runs_per_job: s.runsPerJob,
    ...analysisDocument(s.analysis),
    ...(s.target
      ? {
          target: {
            estimator: s.target.estimator,
            half_width: s.target.halfWidth,
            level: s.target.level,
            max_clusters: s.target.maxClusters,
            min_batch: s.target.minBatch,
            min_clusters: s.target.minClusters,
          },
        }
      : {}),
    ...(s.probe
      ? {
          probe: {
            walkers: s.probe.walkers,
            jobs: s.probe.jobs,
            q: [...s.probe.q],
            ...(modelDescriptor(s.model.kind).probe === 'balls-3d' ? {} : { contact_sample: s.probe.contactSample }),
            min_step: s.probe.minStep,
            ...(s.probe.atSizes.length > 0 ? { at_sizes: [...s.probe.atSizes] } : {}),
            ...(s.probe.window ? { window: [...s.probe.window] } : {}),
          },
        }
      : {}),
    ...(s.positions ? { positions: s.positions.atSizes.length > 0 ? { at_sizes: [...s.positions.atSizes] } : {} } : {}),
  };
}

/** The [analysis] table of a spec document (absent when no option is set, so older documents stay identical). */
function analysisDocument(a: AnalysisSettings): { analysis?: Record<string, unknown> } {
  const out: Record<string, unknown> = {};
  for (const [k, f] of ANALYSIS_FIELDS) if (a[k] !== undefined) out[f] = a[k];
  return Object.keys(out).length > 0 ? { analysis: out } : {};
}

/**
 * Validate analysis options given apart from a spec (CLI overrides) with the
 * same schema and messages as the [analysis] table; returns the merged settings.
 */
export function mergeAnalysisSettings(base: AnalysisSettings, overrideDoc: Record<string, unknown>, ensemble?: { particles: number; clusters: number }): AnalysisSettings {
  const merged = { ...analysisDocument(base).analysis, ...overrideDoc };
  // checked against the ensemble's own size when it is given (a fit window beyond its particles, resamples × clusters),
  // else against a stand-in spec of the largest size
  const probe = { model: MODEL_KINDS[0], particles: ensemble?.particles ?? SPEC_SCHEMA.properties.particles.maximum, clusters: ensemble?.clusters ?? 1, seed: 0, analysis: merged };
  return validateSpec(probe, { maxTotalParticles: Number.MAX_SAFE_INTEGER }).analysis;
}

const oneLine = messageOf;

export { MAX_RUNS_PER_JOB };
