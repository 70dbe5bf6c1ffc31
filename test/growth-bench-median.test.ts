import { describe, expect, it } from 'vitest';
import { median, medianRow, repeatFromArgs, type GrowthBenchRow } from './bench/growth-bench.js';

// The growth bench's --repeat summary: the median is the middle value of the
// sorted runs (common practice, no source).
describe('growth bench median', () => {
  it('takes the middle run, or the mean of the middle two', () => {
    expect(median([3, 1, 2])).toBe(2);
    expect(median([150_000, 120_000, 161_000, 90_000, 140_000])).toBe(140_000);
    expect(median([4, 1, 3, 2])).toBe(2.5);
    expect(() => median([])).toThrow(RangeError);
  });

  it('summarises the runs of one size and flags differing state hashes', () => {
    const row = (rate: number, cpu: number, hash: string): GrowthBenchRow => ({
      bench: 'growth', model: 'dla-offlattice-2d', engineVersion: 'x', particles: 1000, seed: '1', particlesPerSecond: rate,
      jumpsPerParticle: 1, shortStepsPerParticle: 1, returnsPerParticle: 1, wallSeconds: 1, cpuSeconds: cpu, peakRssMB: 1, stateHash: hash, nodeVersion: 'v20',
    });
    const m = medianRow([row(100, 9, 'a'), row(300, 3, 'a'), row(200, 5, 'a')]);
    expect(m).toMatchObject({ runs: 3, particlesPerSecondMedian: 200, cpuSecondsMedian: 5, sameStateHash: true, particlesPerSecondRuns: [100, 300, 200] });
    expect(medianRow([row(1, 1, 'a'), row(2, 2, 'b')]).sameStateHash).toBe(false);
  });

  it('reads --repeat and refuses values out of range in one line naming the option', () => {
    expect(repeatFromArgs([])).toBe(1);
    expect(repeatFromArgs(['--repeat', '5'])).toBe(5);
    expect(repeatFromArgs(['--repeat=3'])).toBe(3);
    for (const bad of ['0', '16', '2.5', 'x', '']) expect(() => repeatFromArgs(['--repeat', bad])).toThrow(/--repeat must be an integer in \[1, 15\], got/);
  });
});
