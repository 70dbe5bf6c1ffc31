import { describe, expect, it } from 'vitest';
import { analyzeEnsemble } from '../coordinator/stats/analyze-ensemble.js';
import { referenceFor } from '../coordinator/stats/reference-values.js';
import { syntheticEnsemble } from '../coordinator/stats/synthetic-ensemble.js';
import type { GrowthResult } from '../worker/core/growth-kernel.js';

const sizes = Array.from({ length: 40 }, (_, i) => Math.round(1000 * Math.pow(10, i / 20)));
const radii = Array.from({ length: 25 }, (_, i) => 5 * Math.pow(10, i / 20));
const ensemble = (D: number, seed = 4): GrowthResult[] => syntheticEnsemble({ clusters: 60, sizes, radii, dimension: D, seed, walkSigma: 0.05 });

describe('consistency panel', () => {
  it('shows the published 2D off-lattice DLA value (Menshutin, Shchur & Vinokur 2008, Physica A 387, 6299) and checks the bounds', () => {
    // level 0.999: estimators with the same true D then disagree by chance in only ~0.1% of cases per pair
    const a = analyzeEnsemble(ensemble(1.71), { resamples: 2000, level: 0.999, localSlopes: false, corrections: true });
    const p = a.consistency;
    expect(p.reference!.D).toBe(1.71);
    expect(p.reference!.uncertainty).toBe(0.0002);
    expect(p.reference!.source).toMatch(/Menshutin, Shchur & Vinokur 2008, Physica A 387, 6299/);
    // a pure power law over under two decades: the corrections fits are refused, so they stay out of the panel
    expect(a.corrections.radiusOfGyration!.determined).toBe(false);
    expect(p.rows.map((r) => r.name)).toEqual(['radiusOfGyration', 'maxRadius', 'massRadius']);
    for (const r of p.rows) expect(r.differenceFromReference!).toBeCloseTo(r.D! - 1.71, 12);
    // Kesten 1987, Stoch. Proc. Appl. 25, 165: D >= 3/2; and D <= d = 2
    expect(p.bounds.map((b) => b.value)).toEqual([1.5, 2]);
    for (const b of p.bounds) for (const s of Object.values(b.status)) expect(s).toBe('satisfied');
    expect(p.pairs).toHaveLength(3);
    for (const pair of p.pairs) expect(pair.agree).toBe(true);
  });

  it('flags a dimension below Kesten\'s bound and one above the embedding dimension', () => {
    const low = analyzeEnsemble(ensemble(1.3), { resamples: 300, localSlopes: false, corrections: false }).consistency;
    expect(low.bounds[0].rule).toMatch(/Kesten/);
    expect(Object.values(low.bounds[0].status)).toEqual(['violated', 'violated', 'violated']);
    const high = analyzeEnsemble(ensemble(2.4), { resamples: 300, localSlopes: false, corrections: false }).consistency;
    expect(Object.values(high.bounds[1].status)).toEqual(['violated', 'violated', 'violated']);
    // D near a bound, within its interval: marginal
    const edge = analyzeEnsemble(syntheticEnsemble({ clusters: 20, sizes: sizes.slice(0, 10), radii, dimension: 1.5, seed: 9, walkSigma: 0.3 }), { resamples: 300, localSlopes: false, corrections: false, estimators: ['radiusOfGyration'] }).consistency;
    expect(edge.bounds[0].status.radiusOfGyration).toBe('marginal');
  });

  it('detects disagreeing estimators through the paired difference', () => {
    const runs = ensemble(1.71);
    // give M(r) a different exponent (1.71 + 0.1)
    for (const r of runs) r.massRadius.counts = r.massRadius.counts.map((m, i) => m * Math.pow(r.massRadius.radii[i], 0.1));
    const p = analyzeEnsemble(runs, { resamples: 400, localSlopes: false, corrections: false }).consistency;
    const pair = (a: string, b: string) => p.pairs.find((q) => q.a === a && q.b === b)!;
    expect(pair('radiusOfGyration', 'maxRadius').agree).toBe(true);
    expect(pair('radiusOfGyration', 'massRadius').agree).toBe(false);
    expect(pair('maxRadius', 'massRadius').agree).toBe(false);
    expect(pair('radiusOfGyration', 'massRadius').difference!).toBeLessThan(-0.05);
    // clusters of under 10^5 particles, below the DLA finite-size range: the disagreement is explained
    expect(p.finiteSizeNote).toMatch(/^These clusters have N = \d+ particles, below about 1000000: .*not expected to agree/);
  });

  it('explains disagreement by finite size only below the model\'s finite-size range and only when something disagrees', () => {
    const agreeing = analyzeEnsemble(ensemble(1.71), { resamples: 400, level: 0.999, localSlopes: false }).consistency;
    expect(agreeing.pairs.every((q) => q.agree) && agreeing.rows.every((r) => r.referenceInsideInterval)).toBe(true);
    expect(agreeing.finiteSizeNote).toBeNull();
    const big = syntheticEnsemble({ clusters: 30, sizes: sizes.map((n) => n * 100), radii, dimension: 1.3, seed: 2, walkSigma: 0.05 });
    const p = analyzeEnsemble(big, { resamples: 200, localSlopes: false }).consistency;
    expect(p.rows.some((r) => r.referenceInsideInterval === false)).toBe(true);
    expect(p.finiteSizeNote).toBeNull();
    // every verdict column has its rule
    expect(p.rules.map((r) => r.split(':')[0])).toEqual(['pair agrees', 'bound', 'published value inside our interval', 'individual intervals overlap']);
  });

  it('never uses the reference value as input: estimates are identical for a model kind without a reference', () => {
    const runs = ensemble(1.71);
    const other = runs.map((r) => ({ ...r, model: { ...r.model, kind: 'no-reference-model' } as unknown as GrowthResult['model'] }));
    const a = analyzeEnsemble(runs, { resamples: 200, localSlopes: false });
    const b = analyzeEnsemble(other, { resamples: 200, localSlopes: false, embeddingDimension: 2 });
    expect(JSON.stringify(b.estimators)).toBe(JSON.stringify(a.estimators));
    expect(JSON.stringify(b.corrections)).toBe(JSON.stringify(a.corrections));
    expect(b.consistency.reference).toBeNull();
    expect(b.consistency.bounds).toHaveLength(1); // only D <= d
    expect(referenceFor('dla-offlattice-2d')?.dimension?.value).toBe(1.71);
  });
});
