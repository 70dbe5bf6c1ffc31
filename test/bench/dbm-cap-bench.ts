/**
 * How far the capped recurrence estimator of dbm-offlattice-2d (η < 1,
 * params.recurrence_cap T) moves the growth law on a realistic cluster: one
 * η = 0.5 cluster of 2000 disks (seed 77, run 0), ω_i from 3·10^5 DLA walkers
 * (the kernel's η = 1 attempts on the frozen cluster), then for each T the
 * exact selection law of the capped method, w_i = ω_i E[g(min(G, T))]/g(T)
 * (kernel.ts header), against ω_i^η. It prints the total variation distance
 * between the two laws over the particles the walkers hit; particles never
 * hit are left out, so the distance is a lower bound. One JSON line per T.
 */
import { createKernel, modelParams } from '../../worker/models/registry.js';
import { OffLatticeDbm2d } from '../../worker/models/dbm-offlattice-2d/kernel.js';

export interface DbmCapRow {
  bench: 'dbm-cap';
  particles: number;
  walkers: number;
  eta: number;
  cap: number;
  particlesHit: number;
  totalVariation: number;
}

export function runDbmCapBenchmark(particles = 2000, walkers = 300_000, eta = 0.5, caps = [64, 256, 1024, 4096]): DbmCapRow[] {
  const task = (e: number, runIndex: number) => ({ model: modelParams('dbm-offlattice-2d', { eta: e }), particles, ensembleSeed: '77', runIndex, recordsPerDecade: 10 });
  const grown = createKernel(task(eta, 0));
  grown.growTo(particles);
  const t1 = task(1, 5);
  const probe = new OffLatticeDbm2d(t1, { ...grown.checkpoint(), task: structuredClone(t1) });
  const hits = new Float64Array(particles);
  for (let s = 0; s < walkers; s++) hits[probe.sampleGrowthParticle()]++;
  const rows: DbmCapRow[] = [];
  const a = 1 - eta;
  for (const cap of caps) {
    const g = new Float64Array(cap + 1);
    g[1] = 1;
    for (let k = 1; k < cap; k++) g[k + 1] = (g[k] * (k + a)) / k;
    const exact = new Float64Array(particles);
    const capped = new Float64Array(particles);
    let se = 0;
    let sc = 0;
    let hit = 0;
    for (let i = 0; i < particles; i++) {
      if (hits[i] === 0) continue;
      hit++;
      const w = hits[i] / walkers;
      // E[g(min(G, T))] = Σ_{k<T} g(k) w (1 − w)^(k−1) + g(T) (1 − w)^(T−1)
      let e = 0;
      let q = 1;
      for (let k = 1; k < cap; k++) {
        e += g[k] * w * q;
        q *= 1 - w;
      }
      e += g[cap] * q;
      exact[i] = w ** eta;
      capped[i] = (w * e) / g[cap];
      se += exact[i];
      sc += capped[i];
    }
    let tv = 0;
    for (let i = 0; i < particles; i++) tv += Math.abs(exact[i] / se - capped[i] / sc);
    const row: DbmCapRow = { bench: 'dbm-cap', particles, walkers, eta, cap, particlesHit: hit, totalVariation: tv / 2 };
    rows.push(row);
    process.stdout.write(`dbm-cap: eta=${eta}, N = ${particles}, recurrence_cap = ${cap}: total variation ${row.totalVariation.toFixed(4)} from the exact law over ${hit} particles hit\n`);
    process.stdout.write(JSON.stringify(row) + '\n');
  }
  return rows;
}
