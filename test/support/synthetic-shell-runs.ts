/**
 * Synthetic "clusters" for the anisotropy tests: k runs of n points in the
 * shell 0.55 < r <= 1 (plus one point at r = 1 exactly, which sets R_max),
 * with uniform angles or angles mπ/2 + offset + uniform(±spread), recorded
 * through the kernels' own recordPlanarAnisotropy at the sizes
 * floor((n + 1) / d) for each divisor d (1 is the whole set).
 */
import type { GrowthResult } from '../../worker/core/growth-kernel.js';
import { recordPlanarAnisotropy } from '../../worker/core/anisotropy.js';
import { Random } from '../../worker/core/random.js';

export interface ShellAngles {
  offset: number;
  spread: number;
}

export function syntheticShellRuns(k: number, n: number, angles: ShellAngles | null, seed: string, divisors: readonly number[]): GrowthResult[] {
  const runs: GrowthResult[] = [];
  for (let i = 0; i < k; i++) {
    const rng = Random.forRun(seed, i);
    const coords = new Float64Array(2 * (n + 1));
    coords[0] = 1; // r = 1 exactly: R_max
    for (let j = 1; j <= n; j++) {
      const a = angles === null ? 2 * Math.PI * rng.nextDouble() : (Math.PI / 2) * rng.nextBelow(4) + angles.offset + angles.spread * rng.nextSigned();
      const r = 0.55 + 0.45 * rng.nextDouble();
      coords[2 * j] = r * Math.cos(a);
      coords[2 * j + 1] = r * Math.sin(a);
    }
    const extra: Record<string, number[]> = {};
    const sizes = divisors.map((d) => Math.floor((n + 1) / d));
    for (const m of sizes) recordPlanarAnisotropy(extra, coords, 2, m, 1);
    runs.push({
      engineVersion: 'x', model: { kind: 'dla-square', params: {} }, dimension: 2, particles: n + 1, ensembleSeed: seed, runIndex: i,
      series: { sizes, radiusOfGyration: sizes.map(() => 1), maxRadius: sizes.map(() => 1), centerOffset: sizes.map(() => 0), extra },
      massRadius: { radii: [1], counts: [1] }, counters: {}, stateHash: '0',
    });
  }
  return runs;
}
