/**
 * The JSON schema of an ensemble spec, shared by the CLI (TOML or JSON files)
 * and the HTTP API (JSON bodies). Field names are snake_case in files and
 * bodies; coordinator/spec/index.ts turns a valid document into an
 * EnsembleSpec with defaults filled in.
 *
 * Limits that depend on the operator (the total-work ceiling) are checked in
 * coordinator/spec/index.ts, not here. The models and their parameters come
 * from the model registry (worker/models/registry.ts): `model` is one of the
 * registered kinds, and `params` holds the numeric parameters of that model:
 * one `if model = KIND then params is that model's table` clause per
 * descriptor (paramsSchemaOf), so an unknown, misplaced or out-of-range
 * parameter fails the schema itself; coordinator/spec/index.ts words those
 * failures with the registry's one line naming params.NAME, the model and
 * the allowed range.
 */
import { MODEL_KINDS, MODELS } from '../../worker/models/registry.js';
import type { ModelDescriptor } from '../../worker/core/model-descriptor.js';
import { describeRange, rangeSchema } from '../../worker/core/value-range.js';
import { PROBE_SETTINGS_PROPERTIES } from '../harmonic/probe-settings.js';

export { MODEL_KINDS };

export const MAX_PARTICLES = 100_000_000;
export const MIN_PARTICLES = 2;
export const MAX_CLUSTERS = 100_000;
export const MAX_RUNS_PER_JOB = 1000;
/** Default ceiling on particles × clusters; raise it with TENDRIL_MAX_TOTAL_PARTICLES or --max-total-particles. */
export const DEFAULT_MAX_TOTAL_PARTICLES = 10_000_000_000;

export const TARGET_ESTIMATORS = ['radius_of_gyration', 'max_radius', 'mass_radius'] as const;
export const OBSERVABLES = ['radius_of_gyration', 'max_radius', 'center_offset', 'mass_radius'] as const;
/** Most sizes at which a cluster may be probed besides its final size. */
export const MAX_PROBE_SIZES = 24;

/** The JSON schema of one model's `params` table, from its descriptor (every parameter optional: absent ones take their defaults). */
export function paramsSchemaOf(d: ModelDescriptor) {
  const properties: Record<string, object> = {};
  for (const p of d.params) {
    properties[p.name] = { ...rangeSchema(p), default: p.default, description: `${p.meaning}; ${describeRange(p, p.unit)}` };
  }
  return { type: 'object', additionalProperties: false, properties, description: `parameters of ${d.kind}` } as const;
}

/** One clause per model: when `model` is its kind, `params` must be its table. */
function modelParamsClauses() {
  return MODELS.map((d) => ({
    if: { properties: { model: { const: d.kind } }, required: ['model'] },
    then: { properties: { params: paramsSchemaOf(d) } },
  }));
}

/** A label for people (specs and probe requests). */
export const NAME_SCHEMA = {
  type: 'string', minLength: 1, maxLength: 100, pattern: '^[A-Za-z0-9][A-Za-z0-9 _.,:()+-]*$',
  $comment: '1 to 100 letters, digits, spaces or _.,:()+-, starting with a letter or digit',
  description: 'a label for people',
} as const;
/** A 64-bit seed (specs and probe requests); values from 2^64 up are refused after the schema. */
export const SEED_SCHEMA = {
  description: 'an unsigned 64-bit integer (a string of decimal digits, or an integer below 2^53)',
  anyOf: [
    { type: 'integer', minimum: 0, maximum: Number.MAX_SAFE_INTEGER },
    { type: 'string', pattern: '^[0-9]{1,20}$' },
  ],
} as const;

export const SPEC_SCHEMA = {
  $id: 'tendril/ensemble-spec',
  title: 'tendril ensemble spec',
  type: 'object',
  additionalProperties: false,
  required: ['model', 'particles', 'seed'],
  allOf: modelParamsClauses(),
  properties: {
    name: NAME_SCHEMA,
    model: { type: 'string', enum: [...MODEL_KINDS], description: 'growth model' },
    params: {
      type: 'object',
      description: 'model parameters by name (see `tendril models`: each model has its own, with defaults and ranges)',
    },
    particles: { type: 'integer', minimum: MIN_PARTICLES, maximum: MAX_PARTICLES, description: 'particles per cluster, seed included' },
    clusters: { type: 'integer', minimum: 1, maximum: MAX_CLUSTERS, description: 'number of clusters (runs); with [target], the size of the first batch' },
    seed: { ...SEED_SCHEMA, description: `ensemble seed: ${SEED_SCHEMA.description}` },
    records_per_decade: { type: 'integer', minimum: 10, maximum: 100, description: 'observables recorded at this many sizes per decade' },
    observables: {
      type: 'array',
      minItems: 1,
      uniqueItems: true,
      items: { type: 'string', enum: [...OBSERVABLES] },
      description: 'observables kept in the results and tables',
    },
    checkpoint_interval_seconds: { type: 'number', minimum: 1, maximum: 86_400, description: 'checkpoint a running cluster at least this often' },
    checkpoint_every_particles: { type: 'integer', minimum: 0, maximum: MAX_PARTICLES, description: 'also checkpoint every this many particles (0 = off)' },
    runs_per_job: { type: 'integer', minimum: 1, maximum: MAX_RUNS_PER_JOB, description: 'clusters grown by one queue job (default: chosen from the cluster size)' },
    analysis: {
      type: 'object',
      additionalProperties: false,
      description: 'options of the ensemble statistics (defaults: see docs/summary-schema.md)',
      properties: {
        fit_min_size: { type: 'number', minimum: 1, maximum: MAX_PARTICLES, description: 'smallest N of the R_g and R_max fits' },
        fit_max_size: { type: 'number', minimum: 1, maximum: MAX_PARTICLES, description: 'largest N of the R_g and R_max fits' },
        mass_radius_min_radius: { type: 'number', minimum: 0, maximum: 1e6, description: 'smallest r of the M(r) fit, in particle diameters' },
        mass_radius_max_radius: { type: 'number', minimum: 0, maximum: 1e6, description: 'largest r of the M(r) fit, in particle diameters' },
        resamples: { type: 'integer', minimum: 10, maximum: 1_000_000, description: 'bootstrap resamples' },
        level: { type: 'number', minimum: 0.5, maximum: 0.999, description: 'confidence level of the intervals' },
        corrections: { type: 'boolean', description: 'run the corrections-to-scaling fit' },
        local_slope_width: { type: 'number', minimum: 0.05, maximum: 3, description: 'full width of the local-slope window in decades' },
      },
    },
    probe: {
      type: 'object',
      additionalProperties: false,
      required: ['walkers'],
      description: 'probe every cluster with walkers at its end (and at at_sizes) to measure its harmonic measure',
      properties: {
        ...PROBE_SETTINGS_PROPERTIES,
        at_sizes: {
          type: 'array', minItems: 1, maxItems: MAX_PROBE_SIZES, uniqueItems: true,
          items: { type: 'integer', minimum: 2, maximum: MAX_PARTICLES },
          description: 'also probe each cluster when it had these many particles (each below particles)',
        },
      },
    },
    target: {
      type: 'object',
      additionalProperties: false,
      required: ['half_width', 'max_clusters'],
      description: 'adaptive ensemble: add clusters in batches until the interval of D is this narrow or max_clusters is reached',
      properties: {
        estimator: { type: 'string', enum: [...TARGET_ESTIMATORS], description: 'estimator whose interval of D is watched' },
        half_width: { type: 'number', exclusiveMinimum: 0, maximum: 1, description: 'largest allowed half-width of the interval of D' },
        level: { type: 'number', minimum: 0.5, maximum: 0.999, description: 'confidence level of the watched interval' },
        max_clusters: { type: 'integer', minimum: 1, maximum: MAX_CLUSTERS, description: 'most clusters the ensemble may grow to' },
        min_batch: { type: 'integer', minimum: 1, maximum: MAX_CLUSTERS, description: 'smallest batch of clusters added at once' },
        min_clusters: { type: 'integer', minimum: 2, maximum: MAX_CLUSTERS, description: 'fewest clusters before the target may count as reached' },
      },
    },
  },
} as const;
