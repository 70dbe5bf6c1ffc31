import { describe, expect, it } from 'vitest';
import { returnToSphere, returned3 } from '../worker/walkers/poisson-return-3d.js';
import { direction3, sampleDirection3d } from '../worker/walkers/uniform-direction-3d.js';
import { Random } from '../worker/core/random.js';
import { ksOneSample, ksTwoSample } from './support/ks.js';
import { yieldToRunner } from './support/grow.js';

// Significance level for the distribution tests below: each must fail only
// once in 10^4 runs by chance (common practice, no source).
const ALPHA = 1e-4;
/** |z-score| limit of the binomial checks: 4.5 sigma, about 7e-6 two-sided (common practice, no source). */
const Z_LIMIT = 4.5;

/**
 * CDF in u = cos θ (θ the polar angle about the walker's direction) of the
 * hit point of a Brownian path from distance r on the sphere of radius R,
 * given that it hits: density ∝ (r² − R²)/|x − y|³ with respect to area
 * (the exterior Poisson kernel of the ball, Kellogg 1929, Foundations of
 * Potential Theory, ch. IX; exact), i.e. ∝ (r² + R² − 2rRu)^(-3/2) in u.
 * Integrated numerically (composite Simpson) so that the check does not
 * reuse the sampler's closed-form inverse.
 */
function hitCdfTable(r: number, R: number, m = 40000): (u: number) => number {
  const density = (u: number) => Math.pow(r * r + R * R - 2 * r * R * u, -1.5);
  const h = 2 / m;
  const cdf = new Float64Array(m + 1);
  for (let i = 0; i < m; i++) {
    const a = -1 + i * h;
    cdf[i + 1] = cdf[i] + (h / 6) * (density(a) + 4 * density(a + h / 2) + density(a + h));
  }
  const total = cdf[m];
  return (u: number) => {
    const t = (u + 1) / h;
    const i = Math.min(m - 1, Math.max(0, Math.floor(t)));
    return (cdf[i] + (t - i) * (cdf[i + 1] - cdf[i])) / total;
  };
}

/** A unit vector from spherical angles (test directions, including ones near the −z pole where the frame changes branch). */
function unit(theta: number, phi: number): [number, number, number] {
  return [Math.sin(theta) * Math.cos(phi), Math.sin(theta) * Math.sin(phi), Math.cos(theta)];
}

const DIRECTIONS: [number, number, number][] = [unit(0.3, 1.1), unit(2.0, -2.5), unit(Math.PI - 1e-9, 0.4), unit(1e-9, 2), [1, 0, 0]];

describe('3D far walkers: escape with probability 1 − R/r, else return by the exterior Poisson kernel', () => {
  for (const [r, R] of [[1.05, 1], [2, 1], [10, 1], [300, 250]] as const) {
    it(`from distance ${r} to the sphere of radius ${R}: return frequency R/r and hit polar angle (KS)`, async () => {
      const rng = Random.forRun(77, Math.round(r * 100));
      const n = 60000;
      const us: number[] = [];
      const az: number[] = [];
      let returnedCount = 0;
      let offSphere = 0;
      for (let i = 0; i < n; i++) {
        if (i % 10000 === 0) await yieldToRunner(); // let the runner report on a busy machine
        const [dx, dy, dz] = DIRECTIONS[i % DIRECTIONS.length];
        if (!returnToSphere(r * dx, r * dy, r * dz, R, rng)) continue;
        returnedCount++;
        const { x, y, z } = returned3;
        // on the sphere (exact, up to rounding)
        offSphere = Math.max(offSphere, Math.abs(Math.hypot(x, y, z) - R));
        us.push((x * dx + y * dy + z * dz) / R);
        if (i % DIRECTIONS.length === 4) az.push(Math.atan2(z, y)); // direction (1,0,0): azimuth in the y–z plane
      }
      expect(offSphere).toBeLessThan(1e-9 * R);
      // P(return) = R/r: the hitting probability of a ball of radius R from distance r in R^3 (exact; R/|x| is harmonic outside the ball)
      const p = R / r;
      const z = (returnedCount - n * p) / Math.sqrt(n * p * (1 - p));
      expect(Math.abs(z)).toBeLessThan(Z_LIMIT);
      expect(ksOneSample(us, hitCdfTable(r, R)).p).toBeGreaterThan(ALPHA);
      // azimuth about the walker's direction is uniform (rotational symmetry; exact)
      expect(ksOneSample(az, (a) => (a + Math.PI) / (2 * Math.PI)).p).toBeGreaterThan(ALPHA);
    });
  }

  it('composes: returning to R via an intermediate sphere R2 gives the same hit law and the same total probability (strong Markov property; exact)', async () => {
    const r = 6, R2 = 3, R = 1;
    const rng = Random.forRun(78, 0);
    const n = 60000;
    const direct: number[] = [];
    const twoStage: number[] = [];
    let twoStageCount = 0;
    for (let i = 0; i < n; i++) {
      if (i % 10000 === 0) await yieldToRunner();
      if (returnToSphere(r, 0, 0, R, rng)) direct.push(returned3.x / R);
      if (!returnToSphere(r, 0, 0, R2, rng)) continue;
      const { x, y, z } = returned3;
      if (!returnToSphere(x, y, z, R, rng)) continue;
      twoStageCount++;
      twoStage.push(returned3.x / R);
    }
    // R2/r · R/R2 = R/r
    const p = R / r;
    expect(Math.abs((twoStageCount - n * p) / Math.sqrt(n * p * (1 - p)))).toBeLessThan(Z_LIMIT);
    expect(ksTwoSample(direct, twoStage).p).toBeGreaterThan(ALPHA);
  });
});

describe('3D walk-on-spheres exits are uniform on the sphere', () => {
  it('every coordinate of sampleDirection3d is uniform on [−1, 1] and the vectors have unit length (Archimedes\' hat-box theorem; exact)', () => {
    const rng = Random.forRun(79, 0);
    const n = 100000;
    const xs = new Float64Array(n);
    const ys = new Float64Array(n);
    const zs = new Float64Array(n);
    let sx = 0, sy = 0, sz = 0;
    let offUnit = 0;
    for (let i = 0; i < n; i++) {
      sampleDirection3d(rng);
      const { x, y, z } = direction3;
      offUnit = Math.max(offUnit, Math.abs(x * x + y * y + z * z - 1));
      xs[i] = x;
      ys[i] = y;
      zs[i] = z;
      sx += x;
      sy += y;
      sz += z;
    }
    expect(offUnit).toBeLessThan(1e-12);
    const uniform = (v: number) => (v + 1) / 2;
    // x and y are not drawn as uniform numbers: their uniformity is a consequence of uniformity on the sphere
    expect(ksOneSample(xs, uniform).p).toBeGreaterThan(ALPHA);
    expect(ksOneSample(ys, uniform).p).toBeGreaterThan(ALPHA);
    expect(ksOneSample(zs, uniform).p).toBeGreaterThan(ALPHA);
    // the mean is 0 with standard error 1/sqrt(3n) per coordinate
    const se = 1 / Math.sqrt(3 * n);
    for (const s of [sx, sy, sz]) expect(Math.abs(s / n)).toBeLessThan(Z_LIMIT * se);
  });

  it('the projection on a fixed oblique axis is uniform on [−1, 1] (exact)', () => {
    const rng = Random.forRun(79, 1);
    const [ax, ay, az] = unit(1.0, 0.7);
    const proj: number[] = [];
    for (let i = 0; i < 100000; i++) {
      sampleDirection3d(rng);
      proj.push(direction3.x * ax + direction3.y * ay + direction3.z * az);
    }
    expect(ksOneSample(proj, (v) => (v + 1) / 2).p).toBeGreaterThan(ALPHA);
  });
});
