/**
 * The approximate methods of off-lattice DBM(η)
 * (worker/models/dbm-offlattice-2d/kernel.ts) at their default settings
 * against exact or much less approximate settings, at small N:
 *  - η = 2 and η = 4: the history method (params.method = 1, default
 *    history_extra_gaps and history_headroom) against the exact method
 *    (method = 0, fresh walkers);
 *  - η = 0.5: the default recurrence_cap (1024) against a cap 16 times larger
 *    (16384; its bias is smaller, kernel.ts header);
 *  - power: the same statistics separate η = 2 from η = 3 (history method),
 *    so the tests can fail.
 * Statistics: the final radius of gyration R_g and the final largest centre
 * distance R_max of each cluster, two-sample Kolmogorov–Smirnov test
 * (Kolmogorov 1933, Smirnov 1948; citation from memory) at level 0.001 per
 * comparison. Independent seeds on the two sides.
 * 20.5 minutes wall on the shared 2-core machine at load 22–33 (2026-12-03).
 */
import { describe, expect, it } from 'vitest';
import type { GrowthTask } from '../worker/core/growth-kernel.js';
import { modelParams } from '../worker/models/registry.js';
import { ksTwoSample } from './support/ks.js';
import { growInThreads } from './support/grow-in-thread.js';

const LEVEL = 0.001;

function tasks(params: Record<string, number>, particles: number, runs: number, seed: string): GrowthTask[] {
  return Array.from({ length: runs }, (_, runIndex) => ({ model: modelParams('dbm-offlattice-2d', params), particles, ensembleSeed: seed, runIndex, recordsPerDecade: 10 }));
}

/** Final R_g and R_max of each cluster. */
async function shapes(params: Record<string, number>, particles: number, runs: number, seed: string): Promise<{ rg: number[]; rmax: number[] }> {
  const results = await growInThreads(tasks(params, particles, runs, seed));
  return { rg: results.map((r) => r.series.radiusOfGyration.at(-1) as number), rmax: results.map((r) => r.series.maxRadius.at(-1) as number) };
}

function report(label: string, a: { rg: number[]; rmax: number[] }, b: { rg: number[]; rmax: number[] }): { rg: number; rmax: number } {
  const rg = ksTwoSample(a.rg, b.rg).p;
  const rmax = ksTwoSample(a.rmax, b.rmax).p;
  const mean = (x: number[]) => (x.reduce((s, v) => s + v, 0) / x.length).toFixed(3);
  console.log(`${label}: mean R_g ${mean(a.rg)} vs ${mean(b.rg)} (KS p = ${rg.toPrecision(3)}), mean R_max ${mean(a.rmax)} vs ${mean(b.rmax)} (KS p = ${rmax.toPrecision(3)})`);
  return { rg, rmax };
}

describe('default approximate settings against exact ones (R_g and R_max at fixed N, two-sample KS, level 0.001)', () => {
  it('η = 2, N = 200: history method (default) and exact method agree', async () => {
    const history = await shapes({ eta: 2, method: 1 }, 200, 120, '41');
    const exact = await shapes({ eta: 2, method: 0 }, 200, 120, '42');
    const p = report('eta 2 history vs exact', history, exact);
    expect(p.rg).toBeGreaterThan(LEVEL);
    expect(p.rmax).toBeGreaterThan(LEVEL);
  }, 900_000);

  it('η = 4, N = 50: history method (default) and exact method agree', async () => {
    const history = await shapes({ eta: 4, method: 1 }, 50, 80, '43');
    const exact = await shapes({ eta: 4, method: 0 }, 50, 80, '44');
    const p = report('eta 4 history vs exact', history, exact);
    expect(p.rg).toBeGreaterThan(LEVEL);
    expect(p.rmax).toBeGreaterThan(LEVEL);
  }, 900_000);

  it('η = 0.5, N = 200: recurrence_cap 1024 (default) and 16384 agree', async () => {
    const capped = await shapes({ eta: 0.5 }, 200, 80, '45');
    const wider = await shapes({ eta: 0.5, recurrence_cap: 16384 }, 200, 80, '46');
    const p = report('eta 0.5 cap 1024 vs 16384', capped, wider);
    expect(p.rg).toBeGreaterThan(LEVEL);
    expect(p.rmax).toBeGreaterThan(LEVEL);
  }, 900_000);

  it('power: the same statistics separate η = 2 from η = 3 at N = 200 (history method)', async () => {
    const two = await shapes({ eta: 2, method: 1 }, 200, 120, '47');
    const three = await shapes({ eta: 3, method: 1 }, 200, 120, '48');
    const p = report('eta 2 vs eta 3', two, three);
    expect(p.rg).toBeLessThan(LEVEL);
    expect(p.rmax).toBeLessThan(LEVEL);
  }, 900_000);
});
