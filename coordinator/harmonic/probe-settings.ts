/**
 * The probe settings, in one place for the three ways of asking for a probe:
 * the [probe] table of a spec, the body of POST /probes and the options of
 * `tendril probe`. Same names (snake_case in documents, --kebab-case on the
 * CLI), same ranges, same defaults and the same words for their units.
 *
 *   walkers         probe walkers per cluster and size (per set for a request)
 *   jobs            independent seeded jobs they are split into; default
 *                   defaultProbeJobs(walkers), at most walkers
 *   q               q values of the partition function; default -1 to 5 in
 *                   steps of 0.25
 *   contact_sample  contact points kept for the capacity; default 4000 (at
 *                   most walkers are used)
 *   min_step        straight-step length of the final approach, in largest
 *                   contact radii; default DEFAULT_PROBE_MIN_STEP (worker/probe/probe-2d.ts)
 *   window          fit window [lo, hi] of box sides relative to the set
 *                   radius R (coordinator/harmonic/fit-window.ts); default null
 */
import { DEFAULT_PROBE_MIN_STEP } from '../../worker/probe/probe-2d.js';
import { describeRange, quoteValue, rangeSchema, type ValueRange } from '../../worker/core/value-range.js';
import { WINDOW_RULE, windowProblem } from './fit-window.js';

/** A numeric probe setting: its range, unit, default (null: computed or required) and meaning. */
export interface ProbeSettingSpec extends ValueRange {
  unit: string;
  default: number | null;
  meaning: string;
}

export const PROBE_WALKERS: ProbeSettingSpec = { min: 100, max: 10_000_000_000, integer: true, unit: 'walkers', default: null, meaning: 'probe walkers per cluster and size' };
export const PROBE_JOBS: ProbeSettingSpec = { min: 1, max: 4096, integer: true, unit: 'jobs', default: null, meaning: 'independent seeded probe jobs the walkers are split into (default: one per 250000 walkers, at least 2, at most walkers)' };
export const PROBE_CONTACT_SAMPLE: ProbeSettingSpec = { min: 3, max: 20_000, integer: true, unit: 'contact points', default: 4000, meaning: 'contact points kept for the capacity (at most walkers are used)' };
export const PROBE_MIN_STEP: ProbeSettingSpec = { min: 0, minOpen: true, max: 1, unit: 'largest contact radii', default: DEFAULT_PROBE_MIN_STEP, meaning: 'final approach: probes take straight steps of this length where two disks are this close, exact lens steps elsewhere' };
/** Each q value, and how many there may be. */
export const PROBE_Q_VALUE: ValueRange = { min: -50, max: 50 };
export const PROBE_Q_MAX_VALUES = 401;

/** Default q grid: -1 to 5 in steps of 0.25 (contains 0, 1, 2 and 3). */
export const DEFAULT_PROBE_Q: readonly number[] = Array.from({ length: 25 }, (_, k) => -1 + 0.25 * k);
/** Walkers per job when no job count is given. */
export const DEFAULT_PROBE_WALKERS_PER_JOB = 250_000;

/** Probe jobs when none are asked for: one per DEFAULT_PROBE_WALKERS_PER_JOB walkers, at least 2 (for the convergence halves), at most 4096 and at most one per walker. */
export function defaultProbeJobs(walkers: number): number {
  return Math.min(walkers, PROBE_JOBS.max, Math.max(2, Math.ceil(walkers / DEFAULT_PROBE_WALKERS_PER_JOB)));
}

function numberSchema(s: ProbeSettingSpec) {
  return { ...rangeSchema(s), description: `${s.meaning}; ${describeRange(s, s.unit)}${s.default !== null ? `; default ${s.default}` : ''}` };
}

/** JSON-schema properties of the settings (the spec's [probe] table and the POST /probes body add their own fields). */
export const PROBE_SETTINGS_PROPERTIES = {
  walkers: numberSchema(PROBE_WALKERS),
  jobs: numberSchema(PROBE_JOBS),
  q: {
    type: 'array', minItems: 1, maxItems: PROBE_Q_MAX_VALUES, uniqueItems: true,
    items: { type: 'number', minimum: PROBE_Q_VALUE.min, maximum: PROBE_Q_VALUE.max },
    description: `q values of the partition function, 1 to ${PROBE_Q_MAX_VALUES} distinct numbers from ${PROBE_Q_VALUE.min} to ${PROBE_Q_VALUE.max} (default -1 to 5 in steps of 0.25)`,
  },
  contact_sample: numberSchema(PROBE_CONTACT_SAMPLE),
  min_step: numberSchema(PROBE_MIN_STEP),
  window: {
    type: 'array', minItems: 2, maxItems: 2,
    items: { type: 'number', exclusiveMinimum: 0, maximum: 1 },
    $comment: WINDOW_RULE,
    description: `fit window [lo, hi]: ${WINDOW_RULE} (default: see the README)`,
  },
} as const;

/** Settings with every default filled in. */
export interface ProbeSettings {
  walkers: number;
  jobs: number;
  q: number[];
  contactSample: number;
  minStep: number;
  /** Fit window relative to the set radius R (coordinator/harmonic/fit-window.ts); null: the default rule. */
  window: [number, number] | null;
}

/** The settings document as given (snake_case, schema-checked). */
export interface ProbeSettingsDocument {
  walkers: number;
  jobs?: number;
  q?: number[];
  contact_sample?: number;
  min_step?: number;
  window?: [number, number];
}

/** The problems the schema cannot see (jobs above walkers), one line each; `prefix` is e.g. "probe." in a spec. */
export function probeSettingsProblems(d: ProbeSettingsDocument, prefix = ''): string[] {
  const out: string[] = [];
  if (d.window !== undefined) {
    const bad = windowProblem(d.window);
    if (bad !== null) out.push(`${prefix}window: ${quoteValue(d.window)} ${bad}`);
  }
  if (d.jobs !== undefined && d.jobs > d.walkers) out.push(`${prefix}jobs: ${d.jobs} is out of range; allowed: an integer from 1 to ${prefix}walkers (${d.walkers})`);
  return out;
}

/** Fill in the defaults of a checked settings document. */
export function probeSettingsOf(d: ProbeSettingsDocument): ProbeSettings {
  return {
    walkers: d.walkers,
    jobs: d.jobs ?? defaultProbeJobs(d.walkers),
    q: d.q ? [...d.q] : [...DEFAULT_PROBE_Q],
    contactSample: Math.min(d.walkers, d.contact_sample ?? (PROBE_CONTACT_SAMPLE.default as number)),
    minStep: d.min_step ?? (PROBE_MIN_STEP.default as number),
    window: d.window ? [d.window[0], d.window[1]] : null,
  };
}
