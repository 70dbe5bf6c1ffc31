/**
 * The summary of a sweep over one model parameter (coordinator/spec/sweep.ts):
 * one row per value, built from the members' own ensemble summaries (each
 * is an ordinary summary, coordinator/summary/index.ts), with
 *
 *  - every D estimator of the single-ensemble summary (R_g(N), R_max(N),
 *    M(r), and the corrections-to-scaling fits when determined), each with
 *    its bootstrap interval (BCa when present, else percentile);
 *  - the local slopes at the largest sizes (the last LOCAL_SLOPES_SHOWN
 *    points of each estimator's sliding window): how far from converged;
 *  - τ(η+2) − τ(η) beside D when a member's harmonic section carries a
 *    `breakdownRelation`;
 *  - when the swept parameter is the model's breakdown exponent η
 *    (coordinator/stats/breakdown-exponent.ts): the lower bound (4 − η)/2
 *    with a verdict per row and estimator, the monotonicity statement and
 *    the predicted transition near η = 4 as context.
 *
 * Output: JSON (schema 'tendril.sweep/1', docs/summary-schema.md), one CSV
 * table (sweep.csv) and lines of text for the CLI.
 */
import type { EnsembleSummaryData } from '../../proto/convert.js';
import { analysisOf, harmonicOfSummary } from './index.js';
import type { IntervalSummary } from '../stats/bca.js';
import {
  BOUND_RULE, BOUND_SOURCE, boundVerdict, DLA_AT_ETA_ONE, isBreakdownExponent, lowerBound, MONOTONIC_RULE, monotonicity,
  TRANSITION, TRANSITION_FROM, type BoundVerdict, type MonotonicStep, type MonotonicVerdict,
} from '../stats/breakdown-exponent.js';

/** Local-slope points shown per estimator: the ones centred at the largest sizes. */
export const LOCAL_SLOPES_SHOWN = 3;

export interface SweepMemberInput {
  value: number;
  ensembleId: string;
  summary: EnsembleSummaryData;
}

export interface SweepInput {
  sweepId: string;
  name: string;
  modelKind: string;
  parameter: string;
  /** The sweep's own seed and the canonical sweep document (for the record). */
  seed: string;
  document: Record<string, unknown>;
  /** One per value, in increasing order of value. */
  members: SweepMemberInput[];
  /** Whether the parameter is the breakdown exponent η; default isBreakdownExponent(modelKind, parameter). */
  breakdownExponent?: boolean;
}

export interface SweepLocalSlope {
  at: number;
  D: number | null;
  interval: [number, number] | null;
}

export interface SweepEstimate {
  /** Label of the quantity fitted, e.g. 'R_g(N)'. */
  quantity: string;
  D: number | null;
  interval: [number, number] | null;
  intervalKind: 'BCa' | 'percentile' | null;
  level: number | null;
  status: string;
  /** Why there is no D, or null. */
  reason: string | null;
  /** Local slopes at the largest sizes (ascending `at`); empty when none. */
  localSlopes: SweepLocalSlope[];
  /** Breakdown sweeps with 0 ≤ η < 2: the verdict of BOUND_RULE. */
  boundVerdict?: BoundVerdict;
}

/** τ(η+2) − τ(η) of a member's harmonic section (the model's harmonic analysis adds it). */
export interface BreakdownRelationRow {
  eta: number;
  tauDifference: { estimate: number | null; low: number | null; high: number | null };
  massDimension: { estimate: number | null; low: number | null; high: number | null } | null;
  verdict: string;
  rule: string;
}

export interface SweepRow {
  value: number;
  ensembleId: string;
  name: string;
  clusters: number;
  clustersPlanned: number;
  partial: boolean;
  finalSize: number | null;
  /** Why the member has no statistics, or null. */
  reason: string | null;
  estimators: Record<string, SweepEstimate>;
  /** Breakdown sweeps: (4 − η)/2 for 0 ≤ η < 2, else null. */
  bound: number | null;
  breakdownRelation: BreakdownRelationRow | null;
}

export interface SweepBreakdown {
  parameter: string;
  bound: { formula: '(4 - eta)/2'; range: [0, 2]; source: string; rule: string };
  monotonic: { rule: string; byEstimator: Record<string, { verdict: MonotonicVerdict; steps: MonotonicStep[] }> };
  transition: {
    etaC: number;
    source: string;
    statement: string;
    /** Rows with η ≥ TRANSITION_FROM: D and the last local slope of each estimator. */
    rows: Array<{ value: number; estimators: Record<string, { D: number | null; lastLocalSlope: SweepLocalSlope | null }> }>;
  };
  dla: { eta: number; D: number; source: string };
}

export interface SweepSummary {
  schema: 'tendril.sweep/1';
  sweepId: string;
  name: string;
  modelKind: string;
  parameter: string;
  values: number[];
  seed: string;
  seedRule: string;
  spec: Record<string, unknown>;
  /** Some member is unfinished. */
  partial: boolean;
  /** Estimators with a column, in order. */
  estimatorNames: string[];
  rows: SweepRow[];
  /** Present when the swept parameter is the model's breakdown exponent η, else null. */
  breakdown: SweepBreakdown | null;
}

export const SEED_RULE = 'member i has the ensemble seed mix64((seed XOR mix64(0x53574550 · 2^32 + i + 1)) + 0x9E3779B97F4A7C15 mod 2^64) (coordinator/spec/sweep.ts memberSeed)';

function shown(iv: IntervalSummary): { interval: [number, number] | null; kind: 'BCa' | 'percentile' | null } {
  if (iv.bca) return { interval: [iv.bca[0], iv.bca[1]], kind: 'BCa' };
  if (iv.percentile) return { interval: [iv.percentile[0], iv.percentile[1]], kind: 'percentile' };
  return { interval: null, kind: null };
}

/** The estimates of one member summary, by estimator name (corrections fits included when present). */
function estimatesOf(s: EnsembleSummaryData): { estimates: Record<string, SweepEstimate>; finalSize: number | null; reason: string | null } {
  const a = analysisOf(s);
  if (!a) {
    let reason = 'no statistics';
    if (s.statisticsJson !== '') {
      const x = JSON.parse(s.statisticsJson) as { reason?: string };
      if (x.reason) reason = x.reason;
    }
    return { estimates: {}, finalSize: null, reason };
  }
  const out: Record<string, SweepEstimate> = {};
  for (const e of Object.values(a.estimators)) {
    if (e.reason === 'not requested') continue;
    const iv = shown(e.interval);
    const pts = [...(e.localSlopes?.points ?? [])].sort((x, y) => x.at - y.at).slice(-LOCAL_SLOPES_SHOWN);
    out[e.name] = {
      quantity: e.quantity, D: e.D, interval: iv.interval, intervalKind: iv.kind, level: e.interval.level, status: e.interval.status, reason: e.available ? null : e.reason,
      localSlopes: pts.map((p) => ({ at: p.at, D: p.D, interval: p.bca ? [p.bca[0], p.bca[1]] : p.percentile ? [p.percentile[0], p.percentile[1]] : null })),
    };
  }
  for (const c of [a.corrections.radiusOfGyration, a.corrections.maxRadius]) {
    if (!c) continue;
    const iv = shown(c.D.interval);
    out[`${c.estimator}Corrected`] = {
      quantity: `${c.estimator === 'radiusOfGyration' ? 'R_g' : 'R_max'}(N) with corrections to scaling`, D: c.determined ? c.D.value : null, interval: c.determined ? iv.interval : null, intervalKind: c.determined ? iv.kind : null,
      level: c.D.interval.level, status: c.D.interval.status, reason: c.determined ? null : c.reason, localSlopes: [],
    };
  }
  return { estimates: out, finalSize: a.finalSize, reason: null };
}

/** The breakdownRelation of a member's harmonic section, or null when it has none. */
function breakdownRelationOf(s: EnsembleSummaryData): BreakdownRelationRow | null {
  const h = harmonicOfSummary(s) as unknown as { breakdownRelation?: BreakdownRelationRow } | null;
  const r = h?.breakdownRelation;
  if (!r || typeof r !== 'object' || !r.tauDifference) return null;
  return { eta: r.eta, tauDifference: r.tauDifference, massDimension: r.massDimension ?? null, verdict: r.verdict, rule: r.rule };
}

export function buildSweepSummary(input: SweepInput): SweepSummary {
  const members = [...input.members].sort((a, b) => a.value - b.value);
  const breakdownOn = input.breakdownExponent ?? isBreakdownExponent(input.modelKind, input.parameter);
  const rows: SweepRow[] = members.map((m) => {
    const { estimates, finalSize, reason } = estimatesOf(m.summary);
    const bound = breakdownOn ? lowerBound(m.value) : null;
    if (bound !== null) for (const e of Object.values(estimates)) e.boundVerdict = boundVerdict(bound, e.interval);
    return {
      value: m.value, ensembleId: m.ensembleId, name: m.summary.name, clusters: m.summary.clustersDone, clustersPlanned: m.summary.clustersPlanned, partial: m.summary.partial,
      finalSize, reason, estimators: estimates, bound, breakdownRelation: breakdownRelationOf(m.summary),
    };
  });
  const estimatorNames: string[] = [];
  for (const r of rows) for (const k of Object.keys(r.estimators)) if (!estimatorNames.includes(k)) estimatorNames.push(k);
  let breakdown: SweepBreakdown | null = null;
  if (breakdownOn) {
    const byEstimator: SweepBreakdown['monotonic']['byEstimator'] = {};
    for (const k of estimatorNames) byEstimator[k] = monotonicity(rows.map((r) => ({ eta: r.value, interval: r.estimators[k]?.interval ?? null })));
    breakdown = {
      parameter: input.parameter,
      bound: { formula: '(4 - eta)/2', range: [0, 2], source: BOUND_SOURCE, rule: BOUND_RULE },
      monotonic: { rule: MONOTONIC_RULE, byEstimator },
      transition: {
        etaC: TRANSITION.etaC, source: TRANSITION.source, statement: TRANSITION.statement,
        rows: rows.filter((r) => r.value >= TRANSITION_FROM).map((r) => ({
          value: r.value,
          estimators: Object.fromEntries(Object.entries(r.estimators).map(([k, e]) => [k, { D: e.D, lastLocalSlope: e.localSlopes.at(-1) ?? null }])),
        })),
      },
      dla: { ...DLA_AT_ETA_ONE },
    };
  }
  return {
    schema: 'tendril.sweep/1', sweepId: input.sweepId, name: input.name, modelKind: input.modelKind, parameter: input.parameter,
    values: rows.map((r) => r.value), seed: input.seed, seedRule: SEED_RULE, spec: input.document,
    partial: rows.some((r) => r.partial), estimatorNames, rows, breakdown,
  };
}

export function sweepToJson(s: SweepSummary): string {
  return JSON.stringify(s, null, 2) + '\n';
}

/** One row per value: D, interval and last local slope of each estimator; bound and verdicts, and τ(η+2) − τ(η), when they apply. */
export function sweepToCsv(s: SweepSummary): string {
  const head = [s.parameter, 'ensemble_id', 'clusters', 'partial', 'final_size'];
  for (const k of s.estimatorNames) head.push(`D_${k}`, `low_${k}`, `high_${k}`, `interval_${k}`, `local_slope_at_${k}`, `local_slope_${k}`, `local_slope_low_${k}`, `local_slope_high_${k}`);
  if (s.breakdown) {
    head.push('lower_bound');
    for (const k of s.estimatorNames) head.push(`bound_verdict_${k}`);
  }
  const withRelation = s.rows.some((r) => r.breakdownRelation !== null);
  if (withRelation) head.push('tau_difference', 'tau_difference_low', 'tau_difference_high', 'tau_difference_verdict');
  const lines = [head.join(',')];
  for (const r of s.rows) {
    const cells: Array<string | number> = [r.value, r.ensembleId, r.clusters, String(r.partial), opt(r.finalSize)];
    for (const k of s.estimatorNames) {
      const e = r.estimators[k];
      const ls = e?.localSlopes.at(-1);
      cells.push(opt(e?.D), opt(e?.interval?.[0]), opt(e?.interval?.[1]), e?.intervalKind ?? (e ? e.status : ''), opt(ls?.at), opt(ls?.D), opt(ls?.interval?.[0]), opt(ls?.interval?.[1]));
    }
    if (s.breakdown) {
      cells.push(opt(r.bound));
      for (const k of s.estimatorNames) cells.push(r.estimators[k]?.boundVerdict ?? '');
    }
    if (withRelation) {
      const b = r.breakdownRelation;
      cells.push(opt(b?.tauDifference.estimate), opt(b?.tauDifference.low), opt(b?.tauDifference.high), csvText(b?.verdict ?? ''));
    }
    lines.push(cells.join(','));
  }
  return lines.join('\n') + '\n';
}

const SHORT: Record<string, string> = {
  radiusOfGyration: 'R_g', maxRadius: 'R_max', massRadius: 'M(r)', radiusOfGyrationCorrected: 'R_g corr', maxRadiusCorrected: 'R_max corr',
};

/** The D(parameter) table and the statements, as lines of text for the CLI. */
export function describeSweep(s: SweepSummary): string {
  const lines: string[] = [];
  const f = (v: number | null | undefined, d = 4) => (v === null || v === undefined || !Number.isFinite(v) ? 'n/a' : v.toFixed(d));
  const level = s.rows.flatMap((r) => Object.values(r.estimators)).find((e) => e.level !== null)?.level;
  lines.push(`sweep over ${s.parameter} (${s.rows.length} values${s.partial ? '; partial: some members unfinished' : ''}); D with ${level ? `${Math.round(level * 1000) / 10}% ` : ''}bootstrap intervals, last local slope at N or r:`);
  for (const r of s.rows) {
    const parts = s.estimatorNames
      .filter((k) => r.estimators[k] && r.estimators[k].D !== null)
      .map((k) => {
        const e = r.estimators[k];
        const ls = e.localSlopes.at(-1);
        return `${SHORT[k] ?? k} ${f(e.D)}${e.interval ? ` [${f(e.interval[0])}, ${f(e.interval[1])}]` : ' (no interval)'}${ls ? ` (local ${f(ls.D, 3)} at ${Number(ls.at.toPrecision(3))})` : ''}${e.boundVerdict ? ` ${e.boundVerdict}` : ''}`;
      });
    const rel = r.breakdownRelation;
    if (rel) parts.push(`tau(eta+2) - tau(eta) ${f(rel.tauDifference.estimate)}${rel.tauDifference.low !== null && rel.tauDifference.high !== null ? ` [${f(rel.tauDifference.low)}, ${f(rel.tauDifference.high)}]` : ''} (${rel.verdict})`);
    const head = `  ${s.parameter} = ${r.value}: ${r.clusters} cluster${r.clusters === 1 ? '' : 's'}${r.partial ? ` of ${r.clustersPlanned}` : ''}${r.bound !== null ? `, bound ${f(r.bound, 3)}` : ''}`;
    lines.push(`${head}: ${parts.length > 0 ? parts.join('; ') : r.reason ?? 'no estimate'}`);
  }
  const b = s.breakdown;
  if (b) {
    lines.push(`lower bound (4 - ${s.parameter})/2 on [0, 2), ${b.bound.source}; rule: ${b.bound.rule}`);
    lines.push(`D decreasing in ${s.parameter}: ${Object.entries(b.monotonic.byEstimator).map(([k, m]) => `${SHORT[k] ?? k} ${m.verdict}`).join(', ')} (rule: ${b.monotonic.rule})`);
    const near = b.transition.rows.map((r) => `${s.parameter} = ${r.value}: ${Object.entries(r.estimators).filter(([, e]) => e.D !== null).map(([k, e]) => `${SHORT[k] ?? k} ${f(e.D)}${e.lastLocalSlope ? ` (local ${f(e.lastLocalSlope.D, 3)})` : ''}`).join(', ')}`);
    lines.push(`context: ${b.transition.statement} (${b.transition.source})${near.length > 0 ? `; ${near.join('; ')}` : `; no value at ${s.parameter} >= ${TRANSITION_FROM} in this sweep`}`);
  }
  return lines.map((l) => l + '\n').join('');
}

function opt(v: number | null | undefined): string {
  return v === null || v === undefined || !Number.isFinite(v) ? '' : String(v);
}

function csvText(t: string): string {
  return /[",\n]/.test(t) ? `"${t.replace(/"/g, '""')}"` : t;
}
