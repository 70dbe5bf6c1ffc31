import { describe, expect, it } from 'vitest';
import { anisotropy, anisotropyOf } from '../worker/core/anisotropy.js';
import { Random } from '../worker/core/random.js';
import { createKernel } from '../worker/models/registry.js';
import { dlaTask } from './support/grow.js';

const pack = (pts: Array<[number, number]>) => Float64Array.from(pts.flat());

describe('planar anisotropy measures (worker/core/anisotropy.ts)', () => {
  it('a plus sign along the axes: 4-fold amplitude 1 and axis/diagonal extent ratio √2 (exact geometry)', () => {
    const pts: Array<[number, number]> = [[0, 0]];
    for (let r = 1; r <= 10; r++) pts.push([r, 0], [-r, 0], [0, r], [0, -r]);
    const c = pack(pts);
    anisotropyOf(c, 2, pts.length, 4, 10);
    expect(anisotropy.amplitude).toBeCloseTo(1, 12);
    expect(anisotropy.shellCount).toBe(20); // r = 6..10 on four arms
    // extent along an axis is 10; along a diagonal it is 10·cos 45° (exact)
    expect(anisotropy.axisRatio).toBeCloseTo(Math.SQRT2, 12);
    // the same points seen 6-fold: angles 0, 90°, 180°, 270° give exp(6iθ) = 1, −1, 1, −1: amplitude 0
    anisotropyOf(c, 2, pts.length, 6, 10);
    expect(anisotropy.amplitude).toBeCloseTo(0, 12);
  });

  it('a regular polygon of 360 points on a circle: amplitude 0 for k = 4 and 6, extent ratio 1 (exact symmetry)', () => {
    const pts: Array<[number, number]> = [[0, 0]];
    for (let j = 0; j < 360; j++) pts.push([5 * Math.cos((2 * Math.PI * j) / 360), 5 * Math.sin((2 * Math.PI * j) / 360)]);
    for (const k of [4, 6]) {
      anisotropyOf(pack(pts), 2, pts.length, k, 5 * (1 + 1e-12));
      expect(anisotropy.shellCount).toBe(360);
      expect(anisotropy.amplitude).toBeLessThan(1e-12);
      expect(anisotropy.axisRatio).toBeCloseTo(1, 12);
    }
  });

  it('uniform random angles: the mean of n·A_k² is 1 (exact: a sum of n independent mean-zero unit vectors)', () => {
    // 2000 sets of n = 400 uniform angles in the shell; n·A² has mean 1 and (for large n, an exponential law) sd ≈ 1,
    // so its mean over 2000 sets has sd ≈ 1/√2000 ≈ 0.022: require |mean − 1| < 4 sd (common practice, no source).
    const rng = Random.forRun('77', 0, 9);
    const n = 400;
    const c = new Float64Array(2 * n);
    let sum = 0;
    for (let t = 0; t < 2000; t++) {
      for (let i = 0; i < n; i++) {
        const a = 2 * Math.PI * rng.nextDouble();
        const r = 0.6 + 0.4 * rng.nextDouble();
        c[2 * i] = r * Math.cos(a);
        c[2 * i + 1] = r * Math.sin(a);
      }
      anisotropyOf(c, 2, n, 4, 1);
      expect(anisotropy.shellCount).toBe(n);
      sum += n * anisotropy.amplitude ** 2;
    }
    expect(Math.abs(sum / 2000 - 1)).toBeLessThan(4 * 0.022);
  });

  it('off-lattice DLA records the four measures at every record size, and the last ones match a direct computation', () => {
    const k = createKernel(dlaTask(3000, 0, '11'));
    k.growTo(3000);
    const r = k.result();
    for (const name of ['fold_amplitude_4', 'axis_ratio_4', 'fold_amplitude_6', 'axis_ratio_6']) expect(r.series.extra[name]).toHaveLength(r.series.sizes.length);
    const p = k.positions();
    anisotropyOf(p.coords, 2, p.count, 4, r.series.maxRadius.at(-1)!);
    expect(r.series.extra.fold_amplitude_4.at(-1)).toBe(anisotropy.amplitude);
    expect(r.series.extra.axis_ratio_4.at(-1)).toBe(anisotropy.axisRatio);
  });
});
