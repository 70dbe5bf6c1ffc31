/**
 * The JSON schema of an ensemble spec, shared by the CLI (TOML or JSON files)
 * and the HTTP API (JSON bodies). Field names are snake_case in files and
 * bodies; coordinator/spec/index.ts turns a valid document into an
 * EnsembleSpec with defaults filled in.
 *
 * Limits that depend on the operator (the total-work ceiling) are checked in
 * coordinator/spec/index.ts, not here. The models and their parameters come
 * from the model registry (worker/models/registry.ts): `model` is one of the
 * registered kinds, and `params` holds the numeric parameters of that model
 * (checked against its descriptor in coordinator/spec/index.ts, with one line
 * naming params.NAME, the model and the allowed range).
 */
import { RECORDS_PER_DECADE } from '../../worker/core/record-sizes.js';
import { MODEL_KINDS } from '../../worker/models/registry.js';

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

export const SPEC_SCHEMA = {
  $id: 'tendril/ensemble-spec',
  title: 'tendril ensemble spec',
  type: 'object',
  additionalProperties: false,
  required: ['model', 'particles', 'seed'],
  properties: {
    name: { type: 'string', minLength: 1, maxLength: 100, pattern: '^[A-Za-z0-9][A-Za-z0-9 _.,:()+-]*$', description: 'a label for people' },
    model: { type: 'string', enum: [...MODEL_KINDS], description: 'growth model' },
    params: {
      type: 'object',
      additionalProperties: { type: 'number' },
      description: 'model parameters by name (see `tendril models`: each model has its own, with defaults and ranges)',
    },
    particles: { type: 'integer', minimum: MIN_PARTICLES, maximum: MAX_PARTICLES, description: 'particles per cluster, seed included' },
    clusters: { type: 'integer', minimum: 1, maximum: MAX_CLUSTERS, description: 'number of clusters (runs); with [target], the size of the first batch' },
    seed: {
      description: 'ensemble seed: an unsigned 64-bit integer (a string of decimal digits, or an integer below 2^53)',
      anyOf: [
        { type: 'integer', minimum: 0, maximum: Number.MAX_SAFE_INTEGER },
        { type: 'string', pattern: '^[0-9]{1,20}$' },
      ],
    },
    records_per_decade: { type: 'integer', minimum: RECORDS_PER_DECADE.min, maximum: RECORDS_PER_DECADE.max, description: `observables recorded at this many sizes per decade (default ${RECORDS_PER_DECADE.default})` },
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
        corrections: { type: 'boolean', description: 'run the corrections-to-scaling fit (default false)' },
        local_slope_width: { type: 'number', minimum: 0.05, maximum: 3, description: 'full width of the local-slope window in decades' },
      },
    },
    probe: {
      type: 'object',
      additionalProperties: false,
      required: ['walkers'],
      description: 'probe every cluster with walkers at its end (and at at_sizes) to measure its harmonic measure',
      properties: {
        walkers: { type: 'integer', minimum: 100, maximum: 10_000_000_000, description: 'probe walkers per cluster and size' },
        jobs: { type: 'integer', minimum: 1, maximum: 4096, description: 'independent probe jobs per cluster and size (default: one per 250000 walkers, at least 2)' },
        q: {
          type: 'array', minItems: 1, maxItems: 401, uniqueItems: true,
          items: { type: 'number', minimum: -50, maximum: 50 },
          description: 'q values of the partition function (default -1 to 5 in steps of 0.25)',
        },
        contact_sample: { type: 'integer', minimum: 3, maximum: 20_000, description: 'contact points kept for the capacity (default 4000)' },
        min_step: { type: 'number', exclusiveMinimum: 0, maximum: 1, description: 'probes take straight steps of this length (in contact radii) where two disks are this close, exact lens steps elsewhere (default 0.02)' },
        window: {
          type: 'array', minItems: 2, maxItems: 2,
          items: { type: 'number', exclusiveMinimum: 0, maximum: 1 },
          description: 'fit window [lo, hi]: smallest and largest box side relative to the set radius R, hi >= 2 lo (default: see the README)',
        },
        at_sizes: {
          type: 'array', minItems: 1, maxItems: MAX_PROBE_SIZES, uniqueItems: true,
          items: { type: 'integer', minimum: 2, maximum: MAX_PARTICLES },
          description: 'also probe each cluster when it had these many particles (each below particles)',
        },
      },
    },
    positions: {
      type: 'object',
      additionalProperties: false,
      description: 'keep the final particle positions of every cluster (the cluster at any smaller size is the first n of them), for tendril export and the HTTP snapshot download',
      properties: {
        at_sizes: {
          type: 'array', minItems: 1, maxItems: MAX_PROBE_SIZES, uniqueItems: true,
          items: { type: 'integer', minimum: 2, maximum: MAX_PARTICLES },
          description: 'also export each cluster at these sizes (each below particles): the first n positions',
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
