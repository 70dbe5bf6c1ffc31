/**
 * The consistency panel: the dimension estimators side by side, pairwise
 * agreement, rigorous bounds, and the published value for the model.
 *
 * Rules (stated again in the output):
 *  - a pair agrees when the interval of the paired difference D_a - D_b
 *    (both computed on the same bootstrap resamples, so their correlation is
 *    accounted for; BCa if available, else percentile) contains 0; whether the
 *    two individual intervals overlap is reported as well;
 *  - a bound D >= L (or D <= U) is 'satisfied' if the whole interval is on the
 *    allowed side, 'violated' if the whole interval is on the wrong side, and
 *    'marginal' if the interval contains the bound; without an interval the
 *    point estimate decides (satisfied / violated);
 *  - the published value is displayed with the difference to each estimate
 *    and whether it falls inside our interval (the interval used, BCa else
 *    percentile; the published uncertainty is not added). It is not a fit input;
 *  - two individual intervals overlap when they share a point (shown for
 *    information only: the pair verdict uses the paired difference);
 *  - when the clusters are smaller than the model's known finite-size range
 *    and some estimate disagrees (a pair, or the published value outside an
 *    interval), the model's finite-size note says why that is expected.
 */

import type { IntervalSummary } from './bca.js';
import type { ModelReference } from './reference-values.js';

export interface PanelEstimate {
  name: string;
  D: number | null;
  interval: IntervalSummary;
}

export interface PanelRow {
  name: string;
  D: number | null;
  /** The interval used for the panel's checks: BCa when available, else percentile. */
  interval: [number, number] | null;
  intervalKind: 'bca' | 'percentile' | null;
  /** D - published value, or null. */
  differenceFromReference: number | null;
  /** Published value inside our interval, or null if either is missing. */
  referenceInsideInterval: boolean | null;
}

export interface PanelPair {
  a: string;
  b: string;
  /** D_a - D_b at the full ensemble. */
  difference: number | null;
  differenceInterval: IntervalSummary;
  intervalsOverlap: boolean | null;
  /** Difference interval contains 0 (null if no interval). */
  agree: boolean | null;
}

export type BoundStatus = 'satisfied' | 'marginal' | 'violated' | 'unknown';

export interface PanelBound {
  rule: string;
  source: string;
  side: 'lower' | 'upper';
  value: number;
  /** Status per estimator name. */
  status: Record<string, BoundStatus>;
}

export interface ConsistencyPanel {
  modelKind: string | null;
  reference: { D: number; uncertainty: number; source: string; note: string } | null;
  rows: PanelRow[];
  pairs: PanelPair[];
  bounds: PanelBound[];
  rules: string[];
  /** Why estimates disagree on clusters this small (the model's finite-size note), or null when not applicable. */
  finiteSizeNote: string | null;
}

export function chosenInterval(iv: IntervalSummary): { range: [number, number] | null; kind: 'bca' | 'percentile' | null } {
  if (iv.bca) return { range: iv.bca, kind: 'bca' };
  if (iv.percentile) return { range: iv.percentile, kind: 'percentile' };
  return { range: null, kind: null };
}

function boundStatus(side: 'lower' | 'upper', bound: number, d: number | null, range: [number, number] | null): BoundStatus {
  if (range) {
    const [lo, hi] = range;
    if (side === 'lower') return lo >= bound ? 'satisfied' : hi < bound ? 'violated' : 'marginal';
    return hi <= bound ? 'satisfied' : lo > bound ? 'violated' : 'marginal';
  }
  if (d === null) return 'unknown';
  return side === 'lower' ? (d >= bound ? 'satisfied' : 'violated') : (d <= bound ? 'satisfied' : 'violated');
}

/**
 * Build the panel. `pairs` carries, for each pair of estimators, the
 * difference interval computed from paired replicates by the caller.
 */
export function buildConsistencyPanel(
  modelKind: string | null,
  reference: ModelReference | null,
  embeddingDimension: number | null,
  estimates: PanelEstimate[],
  pairs: { a: string; b: string; difference: number | null; interval: IntervalSummary }[],
  finalSize: number | null = null,
): ConsistencyPanel {
  const ref = reference?.dimension ?? null;
  const rows: PanelRow[] = estimates.map((e) => {
    const { range, kind } = chosenInterval(e.interval);
    return {
      name: e.name, D: e.D, interval: range, intervalKind: kind,
      differenceFromReference: ref && e.D !== null ? e.D - ref.value : null,
      referenceInsideInterval: ref && range ? ref.value >= range[0] && ref.value <= range[1] : null,
    };
  });
  const byName = new Map(rows.map((r) => [r.name, r]));
  const panelPairs: PanelPair[] = pairs.map((p) => {
    const ra = byName.get(p.a)?.interval ?? null, rb = byName.get(p.b)?.interval ?? null;
    const { range } = chosenInterval(p.interval);
    return {
      a: p.a, b: p.b, difference: p.difference, differenceInterval: p.interval,
      intervalsOverlap: ra && rb ? ra[0] <= rb[1] && rb[0] <= ra[1] : null,
      agree: range ? range[0] <= 0 && 0 <= range[1] : null,
    };
  });
  const bounds: PanelBound[] = [];
  const allBounds = [...(reference?.bounds ?? [])];
  if (embeddingDimension !== null) {
    allBounds.push({ side: 'upper', value: embeddingDimension, rule: `D <= d = ${embeddingDimension} (a set cannot fill more than its embedding space)`, source: 'definition of the mass dimension' });
  }
  for (const b of allBounds) {
    const status: Record<string, BoundStatus> = {};
    for (const r of rows) status[r.name] = boundStatus(b.side, b.value, r.D, r.interval);
    bounds.push({ rule: b.rule, source: b.source, side: b.side, value: b.value, status });
  }
  const disagreement = panelPairs.some((p) => p.agree === false) || rows.some((r) => r.referenceInsideInterval === false);
  const fs = reference?.finiteSize ?? null;
  const finiteSizeNote = fs && finalSize !== null && finalSize < fs.belowSize && disagreement
    ? `These clusters have N = ${finalSize} particles, below about ${fs.belowSize}: ${fs.note}`
    : null;
  return {
    modelKind,
    finiteSizeNote,
    reference: ref ? { D: ref.value, uncertainty: ref.uncertainty, source: ref.source, note: 'shown for comparison only; never used as a fit input' } : null,
    rows, pairs: panelPairs, bounds,
    rules: [
      'pair agrees: the interval (BCa, else percentile) of the paired bootstrap difference D_a - D_b contains 0',
      'bound: satisfied if the whole interval is on the allowed side, violated if wholly on the wrong side, marginal otherwise',
      'published value inside our interval: yes when the published D lies within the interval used (BCa, else percentile), its own uncertainty not added; the published value is never a fit input',
      'individual intervals overlap: yes when the two intervals share a point (information only; the pair verdict is the paired-difference rule)',
    ],
  };
}
