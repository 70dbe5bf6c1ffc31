/**
 * The sweep table (coordinator/summary/sweep-summary.ts) and the D(η)
 * knowledge (coordinator/stats/breakdown-exponent.ts) on synthetic member
 * summaries: bound verdicts, the monotonicity rule, the breakdownRelation
 * column, CSV and text.
 */
import { describe, expect, it } from 'vitest';
import { buildSweepSummary, describeSweep, sweepToCsv } from '../coordinator/summary/sweep-summary.js';
import { syntheticMember as member, type Iv } from './support/sweep-members.js';
import { boundVerdict, DLA_AT_ETA_ONE, isBreakdownExponent, isBreakdownExponentOf, lowerBound, monotonicity } from '../coordinator/stats/breakdown-exponent.js';
import { modelDescriptor } from '../worker/models/registry.js';

const base = { sweepId: 'sx', name: 'sweep', modelKind: 'dla-square', parameter: 'eta', seed: '1', document: {} };

describe('the D(η) knowledge', () => {
  it('bound (4 − η)/2 on [0, 2) only (Losev & Smirnov 2023, arXiv 2307.14931)', () => {
    expect(lowerBound(0)).toBe(2);
    expect(lowerBound(1)).toBe(1.5);
    expect(lowerBound(1.5)).toBe(1.25);
    expect(lowerBound(2)).toBeNull();
    expect(lowerBound(-0.1)).toBeNull();
  });

  it('bound verdicts follow the stated rule', () => {
    expect(boundVerdict(1.5, [1.6, 1.8])).toBe('above bound');
    expect(boundVerdict(1.5, [1.2, 1.4])).toBe('below bound');
    expect(boundVerdict(1.5, [1.4, 1.6])).toBe('not resolved');
    expect(boundVerdict(1.5, null)).toBe('not resolved');
  });

  it('the monotonicity rule: separated intervals only', () => {
    const pts = (ivs: Iv[]) => ivs.map((interval, i) => ({ eta: i, interval }));
    expect(monotonicity(pts([[1.9, 2.0], [1.7, 1.8], [1.5, 1.6]])).verdict).toBe('decreasing');
    expect(monotonicity(pts([[1.9, 2.0], [1.85, 1.95], [1.5, 1.6]])).verdict).toBe('consistent with decreasing');
    const up = monotonicity(pts([[1.5, 1.6], [1.7, 1.8]]));
    expect(up.verdict).toBe('not decreasing');
    expect(up.steps).toEqual([{ from: 0, to: 1, verdict: 'increasing' }]);
    expect(monotonicity(pts([[1.5, 1.6], null])).verdict).toBe('not judged');
    // unordered input is sorted by η
    expect(monotonicity([{ eta: 2, interval: [1, 1.1] }, { eta: 0, interval: [1.9, 2] }]).verdict).toBe('decreasing');
  });

  it('applies to the declared parameter, or to one named eta when none is declared; never to other parameters', () => {
    const withEta = { params: [{ name: 'eta', unit: '', default: 1, min: 0, max: 6, meaning: '' }], reference: { dimension: null, bounds: [], context: [] } };
    expect(isBreakdownExponentOf(withEta, 'eta')).toBe(true);
    expect(isBreakdownExponentOf(withEta, 'other')).toBe(false);
    const declared = { params: [{ name: 'power', unit: '', default: 1, min: 0, max: 6, meaning: '' }], reference: { dimension: null, bounds: [], context: [], breakdownExponent: 'power' } };
    expect(isBreakdownExponentOf(declared, 'power')).toBe(true);
    // a declaration overrides the name
    expect(isBreakdownExponentOf({ ...withEta, reference: { ...withEta.reference, breakdownExponent: 'none-here' } }, 'eta')).toBe(false);
    // the registered models without an eta parameter
    expect(isBreakdownExponent('dla-square', 'noise_reduction')).toBe(false);
    expect(isBreakdownExponent('dla-square', 'eta')).toBe(false);
    expect(isBreakdownExponent('not-a-model', 'eta')).toBe(false);
  });

  it('the DLA value at η = 1 is the one the off-lattice DLA descriptor publishes, with its source', () => {
    const ref = modelDescriptor('dla-offlattice-2d').reference.dimension!;
    expect(DLA_AT_ETA_ONE.D).toBe(ref.value);
    expect(ref.source.startsWith(DLA_AT_ETA_ONE.source)).toBe(true);
  });
});

describe('sweep summary', () => {
  const members = [
    member(0, { radiusOfGyration: { D: 1.99, iv: [1.97, 2.01] }, maxRadius: { D: 1.98, iv: [1.9, 2.06] } }),
    member(0.5, { radiusOfGyration: { D: 1.85, iv: [1.8, 1.9] }, maxRadius: { D: 1.8, iv: [1.7, 1.9] } }),
    member(1, { radiusOfGyration: { D: 1.71, iv: [1.68, 1.74] }, maxRadius: { D: 1.6, iv: [1.4, 1.8] } }, { estimate: 1.69, low: 1.62, high: 1.77, verdict: 'consistent' }),
    // below its bound 1.25 on purpose
    member(1.5, { radiusOfGyration: { D: 1.1, iv: [1.05, 1.15] }, maxRadius: { D: 1.5, iv: [1.2, 1.9] } }),
    member(3, { radiusOfGyration: { D: 1.2, iv: [1.16, 1.25] }, maxRadius: { D: null, iv: null } }),
  ];
  const s = buildSweepSummary({ ...base, members, breakdownExponent: true });

  it('one row per value with every estimator, its interval and local slopes at the largest sizes', () => {
    expect(s.rows.map((r) => r.value)).toEqual([0, 0.5, 1, 1.5, 3]);
    expect(s.estimatorNames).toEqual(['radiusOfGyration', 'maxRadius']);
    const r = s.rows[1].estimators.radiusOfGyration;
    expect(r.D).toBe(1.85);
    expect(r.interval).toEqual([1.8, 1.9]);
    expect(r.intervalKind).toBe('BCa');
    expect(r.localSlopes.map((p) => p.at)).toEqual([300, 1000, 3000]);
    expect(s.rows[4].estimators.maxRadius.reason).toBe('too few sizes');
  });

  it('bound verdicts per row and estimator, by the stated rule', () => {
    expect(s.rows.map((r) => r.bound)).toEqual([2, 1.75, 1.5, 1.25, null]);
    expect(s.rows.map((r) => r.estimators.radiusOfGyration.boundVerdict)).toEqual(['not resolved', 'above bound', 'above bound', 'below bound', undefined]);
    expect(s.rows[3].estimators.maxRadius.boundVerdict).toBe('not resolved');
    expect(s.breakdown!.bound.source).toMatch(/Losev & Smirnov 2023, arXiv 2307\.14931/);
  });

  it('monotonicity: an increase between separated intervals is stated as not decreasing', () => {
    const m = s.breakdown!.monotonic.byEstimator;
    // R_g rises from 1.5 to 3 with separated intervals
    expect(m.radiusOfGyration.verdict).toBe('not decreasing');
    expect(m.radiusOfGyration.steps.at(-1)).toEqual({ from: 1.5, to: 3, verdict: 'increasing' });
    expect(m.maxRadius.verdict).toBe('consistent with decreasing');
  });

  it('the transition near η_c ≈ 4 is context with the local slopes (Hastings 2001)', () => {
    const t = s.breakdown!.transition;
    expect(t.source).toBe('Hastings 2001, Phys. Rev. Lett. 87, 175502');
    expect(t.rows.map((r) => r.value)).toEqual([3]);
    expect(t.rows[0].estimators.radiusOfGyration.lastLocalSlope?.at).toBe(3000);
  });

  it('the breakdownRelation column appears when a member has one', () => {
    expect(s.rows[2].breakdownRelation?.tauDifference).toEqual({ estimate: 1.69, low: 1.62, high: 1.77 });
    expect(s.rows[0].breakdownRelation).toBeNull();
    const csv = sweepToCsv(s).trim().split('\n');
    const head = csv[0].split(',');
    expect(head).toContain('tau_difference');
    expect(head).toContain('bound_verdict_radiusOfGyration');
    const row = Object.fromEntries(head.map((h, i) => [h, csv[3].split(',')[i]]));
    expect(row.eta).toBe('1');
    expect(row.tau_difference).toBe('1.69');
    expect(row.tau_difference_verdict).toBe('consistent');
    expect(row.lower_bound).toBe('1.5');
    expect(row.bound_verdict_radiusOfGyration).toBe('above bound');
    expect(csv).toHaveLength(6);
  });

  it('the text names the rules and the sources', () => {
    const t = describeSweep(s);
    expect(t).toMatch(/eta = 1: 8 clusters, bound 1\.500: R_g 1\.7100 \[1\.6800, 1\.7400\] \(local 1\.710 at 3000\) above bound/);
    expect(t).toMatch(/tau\(eta\+2\) - tau\(eta\) 1\.6900 \[1\.6200, 1\.7700\] \(consistent\)/);
    expect(t).toMatch(/D decreasing in eta: R_g not decreasing, R_max consistent with decreasing \(rule: /);
    expect(t).toMatch(/Hastings 2001/);
  });

  it('a sweep over another parameter has the table without the η statements', () => {
    const o = buildSweepSummary({ ...base, parameter: 'noise_reduction', members: members.slice(0, 2).map((m, i) => ({ ...m, value: i + 1 })) });
    expect(o.breakdown).toBeNull();
    expect(o.rows.every((r) => r.bound === null && r.estimators.radiusOfGyration.boundVerdict === undefined)).toBe(true);
    expect(sweepToCsv(o)).not.toContain('bound');
    expect(describeSweep(o)).not.toMatch(/bound|Hastings/);
  });
});
