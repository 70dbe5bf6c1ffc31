/**
 * A sweep over η with the dielectric breakdown models, once they are
 * registered (worker/models/registry.ts): members grown embedded, the sweep
 * table with the η statements (bound verdicts at η < 2, the monotonicity
 * statement, the transition context). Skipped, saying so, for a model kind
 * that is not registered in this tree.
 */
import { describe, expect, it } from 'vitest';
import { runEmbedded } from '../coordinator/embedded/index.js';
import { validateLaunch } from '../coordinator/spec/sweep.js';
import { buildSweepSummary, sweepToCsv } from '../coordinator/summary/sweep-summary.js';
import { isBreakdownExponent } from '../coordinator/stats/breakdown-exponent.js';
import { isModelKind, modelDescriptor } from '../worker/models/registry.js';

for (const kind of ['dbm-square', 'dbm-offlattice-2d']) {
  describe(`sweep over eta with ${kind}`, () => {
    it('grows one ensemble per η and states the bound, the trend and the transition context', async (ctx) => {
      if (!isModelKind(kind)) {
        console.warn(`sweep over eta with ${kind} skipped: the model is not registered in this tree`);
        ctx.skip();
        return;
      }
      expect(isBreakdownExponent(kind, 'eta')).toBe(true);
      const l = validateLaunch({ name: 'eta sweep', model: kind, particles: 200, clusters: 5, seed: 4, params: { eta: [0.5, 1, 3] }, analysis: { resamples: 200 } });
      if (l.kind !== 'sweep') throw new Error('not a sweep');
      const members = [];
      for (const [i, m] of l.sweep.members.entries()) {
        const got = await runEmbedded(m, { ensembleId: `eta-${i}`, threads: 2 });
        members.push({ value: l.sweep.values[i], ensembleId: `eta-${i}`, summary: got.summary });
      }
      const s = buildSweepSummary({ sweepId: 'eta', name: l.sweep.name, modelKind: kind, parameter: 'eta', seed: l.sweep.seed, document: {}, members });
      expect(s.breakdown).not.toBeNull();
      expect(s.rows.map((r) => r.bound)).toEqual([1.75, 1.5, null]);
      for (const r of s.rows.slice(0, 2)) expect(['above bound', 'below bound', 'not resolved']).toContain(r.estimators.radiusOfGyration.boundVerdict);
      expect(['decreasing', 'consistent with decreasing', 'not decreasing', 'not judged']).toContain(s.breakdown!.monotonic.byEstimator.radiusOfGyration.verdict);
      expect(s.breakdown!.transition.rows.map((r) => r.value)).toEqual([3]);
      expect(s.rows.every((r) => r.estimators.radiusOfGyration.D !== null)).toBe(true);
    }, 600_000);

    it('with [probe]: τ(η+2) − τ(η) of each member stands beside D in the table and the CSV', async (ctx) => {
      if (!isModelKind(kind) || modelDescriptor(kind).probe === null) {
        console.warn(`probed sweep over eta with ${kind} skipped: the model is not registered in this tree or has no probe`);
        ctx.skip();
        return;
      }
      const l = validateLaunch({ name: 'probed eta sweep', model: kind, particles: 200, clusters: 5, seed: 6, params: { eta: [0.5, 1] }, probe: { walkers: 2000, at_sizes: [100, 150] }, analysis: { resamples: 200 } });
      if (l.kind !== 'sweep') throw new Error('not a sweep');
      const members = [];
      for (const [i, m] of l.sweep.members.entries()) {
        const got = await runEmbedded(m, { ensembleId: `peta-${i}`, threads: 2 });
        members.push({ value: l.sweep.values[i], ensembleId: `peta-${i}`, summary: got.summary });
      }
      const s = buildSweepSummary({ sweepId: 'peta', name: l.sweep.name, modelKind: kind, parameter: 'eta', seed: l.sweep.seed, document: {}, members });
      for (const r of s.rows) {
        expect(r.breakdownRelation?.eta).toBe(r.value);
        expect(Number.isFinite(r.breakdownRelation?.tauDifference.estimate)).toBe(true);
      }
      expect(sweepToCsv(s).split('\n')[0]).toContain('tau_difference');
    }, 600_000);
  });
}
