import { describe, expect, it } from 'vitest';
import { boxStatistics, logSpaced } from '../coordinator/harmonic/partition-function.js';
import { spectrumFrom } from '../coordinator/harmonic/spectrum.js';
import { capacityJobCheck, logCapacity } from '../coordinator/harmonic/log-capacity.js';
import { ensembleMeanInterval } from '../coordinator/harmonic/ensemble-intervals.js';
import { Random } from '../worker/core/random.js';

const Q = [-1, 0, 0.5, 1, 2, 3, 4];

describe('partition function and spectrum on exact measures', () => {
  it('uniform measure on a circle: tau(q) = q - 1, f(alpha = 1) = 1 (smooth curve; exact)', () => {
    const K = 200000;
    const x = new Float64Array(K);
    const y = new Float64Array(K);
    for (let k = 0; k < K; k++) { x[k] = Math.cos((2 * Math.PI * (k + 0.5)) / K); y[k] = Math.sin((2 * Math.PI * (k + 0.5)) / K); }
    const st = boxStatistics({ count: K, x, y, w: null }, logSpaced(2e-3, 0.1, 10), Q, -1, -1);
    const s = spectrumFrom(st, 1);
    Q.forEach((q, k) => expect(Math.abs(s.tau[k] - (q - 1))).toBeLessThan(0.03));
    const i1 = Q.indexOf(1);
    expect(s.alpha[i1]).toBeCloseTo(1, 1);
    expect(s.f[i1]).toBeCloseTo(1, 1);
    expect(s.maxConcentrationExponent).toBeCloseTo(1, 1);
  });

  it('arcsine measure of a segment: tau(q) = min(q - 1, q/2), max-concentration exponent 1/2 (Beurling saturated)', () => {
    // Harmonic measure of [-1, 1] from infinity has density 1/(pi sqrt(1 - x^2)) (exact, Joukowski
    // map); the Chebyshev nodes cos(pi (k + 1/2)/K) with equal weights are its exact quadrature.
    const K = 400000;
    const x = new Float64Array(K);
    for (let k = 0; k < K; k++) x[k] = Math.cos((Math.PI * (k + 0.5)) / K);
    const y = new Float64Array(K);
    const st = boxStatistics({ count: K, x, y, w: null }, logSpaced(1e-4, 1e-2, 10), Q, -1, -1);
    const s = spectrumFrom(st, 1);
    const want = (q: number): number => Math.min(q - 1, q / 2);
    // q = 2 sits at the crossover and carries a logarithmic correction: looser there
    Q.forEach((q, k) => expect(Math.abs(s.tau[k] - want(q)), `q = ${q}`).toBeLessThan(q === 2 ? 0.15 : 0.06));
    expect(Math.abs(s.maxConcentrationExponent - 0.5)).toBeLessThan(0.03);
    expect(Math.abs(s.informationDimension - 1)).toBeLessThan(0.03);
  });
});

describe('maximum box measure over the four grid offsets', () => {
  it('is the maximum over all boxes of all four grids, not the average of per-grid maxima (exact)', () => {
    // Four equal point masses at (±0.01, ±0.01) about the point (1, 1): with anchor (0, 0) and
    // eps = 0.5 the grid at offset (0, 0) has a corner at (1, 1) and splits them into four boxes
    // (largest box 1/4); the grids at offsets (eps/2, eps/2), (eps/4, 3eps/4), (3eps/4, eps/4) hold
    // them in one box (1). Maximum over all boxes: 1; the average of per-grid maxima would be 13/16.
    const x = [0.99, 1.01, 0.99, 1.01];
    const y = [0.99, 0.99, 1.01, 1.01];
    const st = boxStatistics({ count: 4, x, y, w: null }, [0.5, 0.6], [2], 0, 0);
    expect(st.maxMeasure[0]).toBe(1);
    // Z is averaged over the four grids: (4 x 1/16 + 1 + 1 + 1)/4 = 13/16
    expect(st.z[0][0]).toBeCloseTo(13 / 16, 12);
  });
});

describe('logarithmic capacity from samples of the harmonic measure', () => {
  const rng = Random.forRun('99', 0, 1);
  const M = 3000;
  it('disk of radius 2: capacity 2 (Ransford 1995, Table 5.1)', () => {
    const x: number[] = [], y: number[] = [];
    for (let i = 0; i < M; i++) { const t = 2 * Math.PI * rng.nextDouble(); x.push(2 * Math.cos(t)); y.push(2 * Math.sin(t)); }
    const c = logCapacity(x, y, M);
    expect(Math.abs(c.capacity - 2)).toBeLessThan(4 * c.capacityError);
    expect(c.capacityError).toBeLessThan(0.01);
  });
  it('segment of length 4: capacity L/4 = 1 (same source)', () => {
    const x: number[] = [], y: number[] = [];
    for (let i = 0; i < M; i++) { x.push(2 * Math.cos(Math.PI * rng.nextDouble())); y.push(0); }
    const c = logCapacity(x, y, M);
    expect(Math.abs(c.capacity - 1)).toBeLessThan(4 * c.capacityError);
  });
  it('ellipse a = 3, b = 1: capacity (a + b)/2 = 2 (same source); harmonic measure = uniform theta in (a cos theta, b sin theta) (Joukowski map)', () => {
    const x: number[] = [], y: number[] = [];
    for (let i = 0; i < M; i++) { const t = 2 * Math.PI * rng.nextDouble(); x.push(3 * Math.cos(t)); y.push(Math.sin(t)); }
    const c = logCapacity(x, y, M);
    expect(Math.abs(c.capacity - 2)).toBeLessThan(4 * c.capacityError);
    // a wrong measure is detected: uniform arc length on the same ellipse gives a different energy
    const u: number[] = [], v: number[] = [];
    while (u.length < M) { const t = 2 * Math.PI * rng.nextDouble(); const w = Math.hypot(3 * Math.sin(t), Math.cos(t)) / 3; if (rng.nextDouble() < w) { u.push(3 * Math.cos(t)); v.push(Math.sin(t)); } }
    const d = logCapacity(u, v, M);
    expect(Math.abs(d.capacity - 2)).toBeGreaterThan(4 * d.capacityError);
    // and flagged: the row means of log|z - w| vary (zeta1 > 0, Frostman's theorem fails for it);
    // for the true harmonic measure the excess is noise of order 1 (our rule: beyond 5 is flagged)
    expect(d.frostmanExcess).toBeGreaterThan(10);
    expect(Math.abs(c.frostmanExcess)).toBeLessThan(5);
  });
});

describe('capacity job check', () => {
  it('jobs from the same harmonic measure agree with their stated errors; a job from another set does not', () => {
    const rng = Random.forRun('17', 0, 3);
    const circle = (n: number, r: number, x: number[], y: number[]) => {
      for (let i = 0; i < n; i++) { const t = 2 * Math.PI * rng.nextDouble(); x.push(r * Math.cos(t)); y.push(r * Math.sin(t)); }
    };
    const x: number[] = [], y: number[] = [];
    for (let j = 0; j < 8; j++) circle(300, 1, x, y);
    const ok = capacityJobCheck(x, y, new Array(8).fill(300))!;
    expect(ok.jobs).toBe(8);
    expect(ok.degreesOfFreedom).toBe(7);
    expect(ok.chiSquare).toBeLessThan(24.3); // chi-square, 7 degrees of freedom, p = 0.001
    const u: number[] = [], v: number[] = [];
    circle(300, 1.1, u, v);
    for (let j = 1; j < 8; j++) circle(300, 1, u, v);
    expect(capacityJobCheck(u, v, new Array(8).fill(300))!.chiSquare).toBeGreaterThan(24.3);
    expect(capacityJobCheck(x, y, [2400])).toBeNull();
  });
});

describe('ensemble intervals', () => {
  it('cluster bootstrap of a mean: interval covers the mean with a width near 2 x 1.96 sd/sqrt(K) (common practice, no source)', () => {
    const rng = Random.forRun('5', 0, 2);
    const vals: number[] = [];
    for (let i = 0; i < 40; i++) vals.push(0.5 + 0.1 * Math.sqrt(-2 * Math.log(rng.nextOpen32())) * Math.cos(2 * Math.PI * rng.nextDouble()));
    const r = ensembleMeanInterval(vals, '7');
    expect(r.interval.status).toBe('ok');
    const [lo, hi] = r.interval.bca as [number, number];
    expect(lo).toBeLessThan(r.mean);
    expect(hi).toBeGreaterThan(r.mean);
    expect(hi - lo).toBeGreaterThan(0.03);
    expect(hi - lo).toBeLessThan(0.1);
    expect(ensembleMeanInterval([1, 2], '7').interval.status).toBe('too-few-clusters');
  });
});

describe('ensemble harmonic summary', () => {
  it('gives per-q intervals over clusters and refuses mixed q grids', async () => {
    const { ensembleHarmonicSummary } = await import('../coordinator/harmonic/ensemble-intervals.js');
    const { analyzeProbe } = await import('../coordinator/harmonic/probe-analysis.js');
    const rng = Random.forRun('12', 0, 1);
    const ms: ReturnType<typeof analyzeProbe>[] = [];
    for (let c = 0; c < 6; c++) {
      const M = 600;
      const x: number[] = [], y: number[] = [];
      for (let i = 0; i < M; i++) { const t = 2 * Math.PI * rng.nextDouble(); x.push(Math.cos(t)); y.push(Math.sin(t)); }
      ms.push(analyzeProbe({ count: 1, x: [0], y: [0], r: 1, counts: [M], halves: null, contactX: x, contactY: y, contactCount: M, q: [0, 1, 2] }));
    }
    const s = ensembleHarmonicSummary(ms, '3', 500);
    expect(s.clusters).toBe(6);
    expect(s.tau.length).toBe(3);
    expect(s.tau[1].mean).toBeCloseTo(0, 12);
    expect(Math.abs(s.logCapacity.mean)).toBeLessThan(0.01); // unit disk: log cap = 0 (Ransford 1995)
    expect(s.logCapacity.interval.status).toBe('ok');
    const other = { ...ms[0], spectrum: { ...ms[0].spectrum, q: [0, 1, 3] } };
    expect(() => ensembleHarmonicSummary([ms[0], other], '3')).toThrow(/q grid/);
  });
});
