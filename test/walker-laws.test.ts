import { describe, expect, it } from 'vitest';
import { returnToCircle, returned, sampleReturnAngle } from '../worker/walkers/poisson-return-2d.js';
import { Random } from '../worker/core/random.js';
import { direction, sampleDirection } from '../worker/walkers/uniform-direction.js';
import { ksOneSample } from './support/ks.js';

// Significance level for the distribution tests below: each must fail only
// once in 10^4 runs by chance (common practice, no source).
const ALPHA = 1e-4;

/**
 * CDF of the exterior Poisson kernel, obtained by integrating the density
 * (r² − R²) / (2π (r² + R² − 2rR cos θ)) numerically (composite Simpson), so
 * the check does not reuse the sampler's closed form. Density: the Poisson
 * kernel for the exterior of a disk (any complex-analysis text, e.g. Ahlfors,
 * Complex Analysis, 3rd ed. 1979, ch. 6; from memory).
 */
function poissonCdfTable(r: number, R: number, m = 20000): (theta: number) => number {
  const density = (t: number) => (r * r - R * R) / (2 * Math.PI * (r * r + R * R - 2 * r * R * Math.cos(t)));
  const h = (2 * Math.PI) / m;
  const cdf = new Float64Array(m + 1);
  for (let i = 0; i < m; i++) {
    const a = -Math.PI + i * h;
    cdf[i + 1] = cdf[i] + (h / 6) * (density(a) + 4 * density(a + h / 2) + density(a + h));
  }
  return (theta: number) => {
    const u = (theta + Math.PI) / h;
    const i = Math.min(m - 1, Math.max(0, Math.floor(u)));
    return cdf[i] + (u - i) * (cdf[i + 1] - cdf[i]);
  };
}

describe('exact return of far walkers (exterior Poisson kernel)', () => {
  for (const [r, R] of [[1.05, 1], [2, 1], [10, 1], [300, 250]] as const) {
    it(`hit angles from distance ${r} on the circle of radius ${R} follow the Poisson kernel (KS test)`, () => {
      const rng = Random.forRun(2024, Math.round(r * 100));
      const n = 40000;
      const angles = new Float64Array(n);
      for (let i = 0; i < n; i++) angles[i] = sampleReturnAngle(r, R, rng);
      const { p } = ksOneSample(angles, poissonCdfTable(r, R));
      expect(p).toBeGreaterThan(ALPHA);
    });
  }

  it('lands exactly on the circle and is rotation-equivariant', () => {
    const rng = Random.forRun(3, 0);
    for (let i = 0; i < 1000; i++) {
      const a = 2 * Math.PI * rng.nextDouble();
      const r = 5 + 100 * rng.nextDouble();
      returnToCircle(r * Math.cos(a), r * Math.sin(a), 4, rng);
      expect(Math.hypot(returned.x, returned.y)).toBeCloseTo(4, 12);
    }
    // the same random stream from two start directions gives points rotated by the same angle
    const s1 = Random.forRun(8, 0);
    const s2 = Random.forRun(8, 0);
    returnToCircle(7, 0, 3, s1);
    const [x1, y1] = [returned.x, returned.y];
    returnToCircle(0, 7, 3, s2);
    expect(returned.x).toBeCloseTo(-y1, 12);
    expect(returned.y).toBeCloseTo(x1, 12);
  });

  it('a test with the wrong concentration fails (the check has power)', () => {
    const rng = Random.forRun(2025, 0);
    const angles = Array.from({ length: 40000 }, () => sampleReturnAngle(2, 1, rng));
    expect(ksOneSample(angles, poissonCdfTable(2.2, 1)).p).toBeLessThan(ALPHA);
  });
});

describe('walk-on-spheres jumps', () => {
  it('jump directions are uniform on the circle (KS test against the uniform CDF)', () => {
    const rng = Random.forRun(77, 0);
    const n = 100000;
    const angles = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      sampleDirection(rng);
      expect(Math.abs(direction.x * direction.x + direction.y * direction.y - 1)).toBeLessThan(1e-12);
      angles[i] = Math.atan2(direction.y, direction.x);
    }
    expect(ksOneSample(angles, (t) => (t + Math.PI) / (2 * Math.PI)).p).toBeGreaterThan(ALPHA);
  });

  it('chained walk-on-spheres exits of a disk follow the interior Poisson kernel', () => {
    // Brownian motion from z0 inside the unit disk exits at angle θ with density
    // (1 − |z0|²) / (2π |e^{iθ} − z0|²) (Poisson kernel of the disk; any
    // complex-analysis text). Chaining uniform exits of inscribed disks with
    // the kernel's direction sampler, stopping within 1e-6 of the boundary,
    // must reproduce it: this checks that the jumps compose to Brownian exits.
    const rng = Random.forRun(78, 0);
    const x0 = 0.6;
    const n = 20000;
    const angles = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      let x = x0;
      let y = 0;
      for (;;) {
        const d = 1 - Math.hypot(x, y);
        if (d < 1e-6) break;
        sampleDirection(rng);
        x += d * direction.x;
        y += d * direction.y;
      }
      angles[i] = Math.atan2(y, x);
    }
    const R = 1 / x0; // interior kernel at x0 equals the exterior one seen from 1/x0, rescaled
    const cdf = poissonCdfTable(R, 1);
    expect(ksOneSample(angles, cdf).p).toBeGreaterThan(ALPHA);
  });
});
