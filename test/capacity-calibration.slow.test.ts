// Calibration of the capacity error (coordinator/harmonic/log-capacity.ts): over S independent
// probes (seeds) of a set with an exact capacity, the stated error must match the observed
// seed-to-seed spread, and the nominal 95% coverage must hold.
//
// Exact capacities: a disk of radius a has capacity a (Ransford 1995, Potential Theory in the
// Complex Plane, Table 5.1); two tangent disks of radius rho have capacity pi rho / 2 (exact, by
// inversion about the touching point onto a strip, see test/probe-kernel.test.ts).
// Slow file: 400 probes and 400 U-statistics of 1000 points (about 20 s on one core).
//
// Tolerances (our rule, derived here). With S = 200 seeds the sample variance s^2 of the
// estimates has relative standard deviation sqrt(2/(S-1) + k/S), k the excess kurtosis of one
// estimate: k = 0 for a normal estimate (chi-square with S - 1 degrees of freedom); our estimator
// is a degenerate U-statistic whose limit law is a weighted sum of chi-squares dominated by one
// exponential-like term, k about 2.4 for the circle, giving about 0.15. The test asks for
// (rms stated error) / (observed spread) in [0.7, 1.4], i.e. s^2/sigma^2 in [0.51, 2.04]: more
// than 3.3 standard deviations of s^2 below and 7 above, so a calibrated error fails with
// probability below 1e-3; the old conservative error (about 1.7 times the spread) fails it.
// Coverage: with true coverage 0.95 the count of the S = 200 estimates within 1.96 stated errors
// of the exact value is binomial (mean 190, sd 3.1); at least 180 (one-sided p < 1e-3) is asked,
// and at most 199 (all 200 would be p = 3.5e-5 for a calibrated error).
// Job check (log-capacity.ts capacityJobCheck): the 8 jobs of each probe give their own estimates
// and stated errors; summed over the 200 seeds chi-square/dof (1400 degrees of freedom) must lie in
// [0.75, 1.33]: the sd of chi2/dof is sqrt(2/1400) = 0.04 for normal estimates, about twice that
// with the kurtosis above, so the band is more than 3 sd wide on both sides.
import { describe, expect, it } from 'vitest';
import { ProbeGeometry, planProbeJobs, runProbeJob, type DiskSet } from '../worker/probe/probe-2d.js';
import { capacityJobCheck, logCapacity } from '../coordinator/harmonic/log-capacity.js';

const SEEDS = 200;
const M = 1000;

function calibration(set: DiskSet, exact: number): { ratio: number; covered: number; meanExcess: number; jobChi2PerDof: number } {
  const g = new ProbeGeometry(set);
  const est: number[] = [];
  const err: number[] = [];
  let covered = 0;
  let excess = 0;
  let chi2 = 0;
  let dof = 0;
  for (let s = 0; s < SEEDS; s++) {
    const results = planProbeJobs(g, String(7000 + s), M, 8, M).map((t) => runProbeJob(g, t));
    const cx = results.flatMap((r) => r.contactX);
    const cy = results.flatMap((r) => r.contactY);
    const c = logCapacity(cx, cy, cx.length);
    est.push(c.capacity);
    err.push(c.capacityError);
    if (Math.abs(c.capacity - exact) <= 1.96 * c.capacityError) covered++;
    excess += c.frostmanExcess / SEEDS;
    const jc = capacityJobCheck(cx, cy, results.map((r) => r.contactX.length))!;
    chi2 += jc.chiSquare;
    dof += jc.degreesOfFreedom;
  }
  const mean = est.reduce((a, b) => a + b, 0) / SEEDS;
  const sd = Math.sqrt(est.reduce((a, b) => a + (b - mean) ** 2, 0) / (SEEDS - 1));
  const rms = Math.sqrt(err.reduce((a, b) => a + b * b, 0) / SEEDS);
  return { ratio: rms / sd, covered, meanExcess: excess, jobChi2PerDof: chi2 / dof };
}

describe('capacity error calibration over 200 seeds', () => {
  it('single disk of radius 2.5 (capacity 2.5, exact)', () => {
    const c = calibration({ count: 1, x: [1], y: [-3], r: 2.5 }, 2.5);
    console.log(`disk: stated/observed ${c.ratio.toFixed(3)}, covered ${c.covered}/${SEEDS}, mean frostmanExcess ${c.meanExcess.toFixed(2)}, job check chi2/dof ${c.jobChi2PerDof.toFixed(3)}`);
    expect(c.ratio).toBeGreaterThan(0.7);
    expect(c.ratio).toBeLessThan(1.4);
    expect(c.covered).toBeGreaterThanOrEqual(180);
    expect(c.covered).toBeLessThanOrEqual(199);
    expect(c.jobChi2PerDof).toBeGreaterThan(0.75);
    expect(c.jobChi2PerDof).toBeLessThan(1.33);
  });

  it('two tangent disks of radius 1 (capacity pi/2, exact)', () => {
    const c = calibration({ count: 2, x: [-1, 1], y: [0, 0], r: 1 }, Math.PI / 2);
    console.log(`tangent disks: stated/observed ${c.ratio.toFixed(3)}, covered ${c.covered}/${SEEDS}, mean frostmanExcess ${c.meanExcess.toFixed(2)}, job check chi2/dof ${c.jobChi2PerDof.toFixed(3)}`);
    expect(c.ratio).toBeGreaterThan(0.7);
    expect(c.ratio).toBeLessThan(1.4);
    expect(c.covered).toBeGreaterThanOrEqual(180);
    expect(c.covered).toBeLessThanOrEqual(199);
    expect(c.jobChi2PerDof).toBeGreaterThan(0.75);
    expect(c.jobChi2PerDof).toBeLessThan(1.33);
  });
});
