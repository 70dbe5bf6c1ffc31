/**
 * The signed k-fold phase P_k = (1/n) Σ cos kθ of the outer shell (worker/core/anisotropy.ts,
 * fold_phase_4 and fold_phase_6) and its verdict against 0 (coordinator/stats/fold-phase.ts,
 * observable-bands.ts foldPhase).
 *
 * Physics checked: a model whose law is invariant under rotations about the seed has E P_k = 0
 * exactly at every N (average over a uniform rotation angle; the exact argument is in
 * worker/core/anisotropy.ts, our own derivation, no source), so the bootstrap band of the
 * ensemble mean of an off-lattice ensemble should contain 0 (checked with a 99.9% band, which
 * misses an exact 0 for about 1 seed in 1000; fixed seeds). Angles clustered along the square
 * axes give P_4 > 0, along the diagonals P_4 < 0.
 */
import { describe, expect, it } from 'vitest';
import type { GrowthResult } from '../worker/core/growth-kernel.js';
import { recordPlanarAnisotropy } from '../worker/core/anisotropy.js';
import { createKernel, modelParams } from '../worker/models/registry.js';
import { observableSection } from '../coordinator/stats/observable-bands.js';
import { syntheticShellRuns, type ShellAngles } from './support/synthetic-shell-runs.js';
import { PHASE_RULE, isotropicPhaseRule, phaseVerdict } from '../coordinator/stats/fold-phase.js';

/** K synthetic clusters (test/support/synthetic-shell-runs.ts) recorded at sizes (n + 1)/2 and n + 1. */
function syntheticRuns(k: number, n: number, angles: ShellAngles | null, seed: string): GrowthResult[] {
  return syntheticShellRuns(k, n, angles, seed, [2, 1]);
}

const options = { seed: '7', resamples: 1000, level: 0.95 };

function phaseOf(runs: GrowthResult[], name: string, level = options.level) {
  const v = observableSection(runs, { ...options, level })!.foldPhase!.verdicts.find((x) => x.name === name)!;
  expect(v.lo).toBeLessThanOrEqual(v.mean);
  expect(v.mean).toBeLessThanOrEqual(v.hi);
  return v;
}

describe('signed fold phase: values and verdict', () => {
  it('the rule: band above 0, below 0, containing 0, not finite', () => {
    expect(phaseVerdict(0.01, 0.2)).toBe('aligned with the lattice axes');
    expect(phaseVerdict(-0.2, -0.01)).toBe('opposite to the lattice axes');
    expect(phaseVerdict(-0.01, 0.01)).toBe('no k-fold alignment beyond noise');
    expect(phaseVerdict(0, 0.3)).toBe('no k-fold alignment beyond noise');
    expect(phaseVerdict(NaN, 1)).toBe('unknown');
  });

  it('the rule without a lattice: a check of the exact 0, whatever the sign', () => {
    expect(phaseVerdict(0.01, 0.2, false)).toBe('departs from the exact 0');
    expect(phaseVerdict(-0.2, -0.01, false)).toBe('departs from the exact 0');
    expect(phaseVerdict(-0.01, 0.01, false)).toBe('consistent with the exact 0');
    expect(phaseVerdict(0, 0.3, false)).toBe('consistent with the exact 0');
    expect(phaseVerdict(-0.3, 0, false)).toBe('consistent with the exact 0');
    expect(phaseVerdict(1, NaN, false)).toBe('unknown');
    expect(isotropicPhaseRule(0.95)).toContain('about 1 ensemble in 20 per phase');
    expect(isotropicPhaseRule(0.9)).toContain('a 90% band misses an exact value by chance in about 1 ensemble in 10');
  });

  it('points exactly on the axes give P_4 = 1 (and P_6 = cos 6θ), on the diagonals P_4 = −1', () => {
    const axes = Float64Array.from([1, 0, 0, 1, -1, 0, 0, -1, 0.7, 0, 0, -0.8]);
    const e: Record<string, number[]> = {};
    recordPlanarAnisotropy(e, axes, 2, 6, 1);
    expect(e.fold_phase_4[0]).toBeCloseTo(1, 14);
    // cos 6θ at θ = 0, π/2, π, 3π/2: 1, −1, 1, −1, 1, −1
    expect(e.fold_phase_6[0]).toBeCloseTo(0, 14);
    const h = Math.SQRT1_2;
    const diag = Float64Array.from([h, h, -h, h, -h, -h, h, -h]);
    const d: Record<string, number[]> = {};
    recordPlanarAnisotropy(d, diag, 2, 4, 1 + 1e-12); // h² + h² may round above 1
    expect(d.fold_phase_4[0]).toBeCloseTo(-1, 14);
    // the triangular axes (multiples of π/3) give P_6 = 1
    const tri: number[] = [];
    for (let m = 0; m < 6; m++) tri.push(Math.cos((Math.PI * m) / 3), Math.sin((Math.PI * m) / 3));
    const t: Record<string, number[]> = {};
    recordPlanarAnisotropy(t, Float64Array.from(tri), 2, 6, 1);
    expect(t.fold_phase_6[0]).toBeCloseTo(1, 14);
  });

  it('synthetic ensembles: uniform angles contain 0; 4-fold along the axes is aligned; along the diagonals opposite', () => {
    const iso = syntheticRuns(24, 2000, null, '31');
    for (const name of ['fold_phase_4', 'fold_phase_6']) expect(phaseOf(iso, name).verdict).toBe('no k-fold alignment beyond noise');
    const along = phaseOf(syntheticRuns(24, 2000, { offset: 0, spread: 0.5 }, '32'), 'fold_phase_4');
    expect(along.verdict).toBe('aligned with the lattice axes');
    // E cos 4(θ + u), u uniform on ±s: sin(4s)/(4s) = sin 2 / 2 for s = 0.5
    expect(Math.abs(along.mean - Math.sin(2) / 2)).toBeLessThan(0.02);
    expect(phaseOf(syntheticRuns(24, 2000, { offset: Math.PI / 4, spread: 0.5 }, '33'), 'fold_phase_4').verdict).toBe('opposite to the lattice axes');
  });

  it('the phases come last in the bands: the older observables draw the same bootstrap resamples as without them', () => {
    const runs = syntheticRuns(12, 500, null, '34');
    const without = runs.map((r) => {
      const { fold_phase_4: _a, fold_phase_6: _b, ...extra } = r.series.extra;
      return { ...r, series: { ...r.series, extra } };
    });
    const a = observableSection(runs, options)!;
    const b = observableSection(without, options)!;
    expect(a.bands.slice(0, b.bands.length)).toEqual(b.bands);
    expect(a.bands.slice(b.bands.length).map((x) => x.name)).toEqual(['fold_phase_4', 'fold_phase_6']);
    expect(b.foldPhase).toBeNull();
    expect(a.foldNoise).toEqual(b.foldNoise);
  });
});

describe('signed fold phase in the kernels\' records and across checkpoints', () => {
  for (const kind of ['dla-square', 'dla-offlattice-2d', 'eden-triangular']) {
    it(`${kind}: one value per record, |P_k| <= A_k; a checkpoint from before the phases resumes without them`, () => {
      const task = { model: modelParams(kind), particles: 3000, ensembleSeed: '15', runIndex: 0, recordsPerDecade: 10 };
      const whole = createKernel(task);
      whole.growTo(3000);
      const w = whole.result();
      for (const name of ['fold_phase_4', 'fold_phase_6']) {
        expect(w.series.extra[name]).toHaveLength(w.series.sizes.length);
        w.series.extra[name].forEach((v, i) => {
          expect(Math.abs(v)).toBeLessThanOrEqual(w.series.extra[name.replace('phase', 'amplitude')][i] * (1 + 1e-12));
        });
      }
      const first = createKernel(task);
      first.growTo(1000);
      const old = structuredClone(first.checkpoint());
      delete old.series.extra.fold_phase_4;
      delete old.series.extra.fold_phase_6;
      const legacy = createKernel(task, old);
      legacy.growTo(3000);
      const r = legacy.result();
      expect(r.stateHash).toBe(w.stateHash);
      expect(r.series.extra.fold_phase_4).toBeUndefined();
      expect(r.series.extra.fold_phase_6).toBeUndefined();
      const { fold_phase_4: _a, fold_phase_6: _b, ...older } = w.series.extra;
      expect(r.series.extra).toEqual(older);
    });
  }
});

describe('signed fold phase of grown ensembles (24 clusters of 3000 particles)', () => {
  // Measured before writing this test (other seeds, 100-200 clusters of 3000, 2026-12-03): off-lattice DLA
  // P_4 = −0.002 ± 0.015 and 0.015 ± 0.014 (mean ± standard error), off-lattice Eden 0.000 ± 0.004;
  // square-lattice DLA P_4 = 0.174 ± 0.020 and 0.177 ± 0.020, so 24 clusters (standard error about 0.04)
  // put the square band above 0 by about 4 standard errors. A 95% band misses 0 for 1 seed in 20 even
  // for an exact zero (an earlier try with seed 99 at 24 × 2000 gave −0.10 ± 0.035, a 2.9σ excursion),
  // so the zero check uses a 99.9% band (a false alarm for about 1 seed in 1000); the alignment check
  // keeps 95% (about 4.4σ expected). The seed is fixed; it was not chosen by its result.
  function ensemble(kind: string, seed: string): GrowthResult[] {
    const runs: GrowthResult[] = [];
    for (let i = 0; i < 24; i++) {
      const k = createKernel({ model: modelParams(kind), particles: 3000, ensembleSeed: seed, runIndex: i, recordsPerDecade: 10 });
      k.growTo(3000);
      runs.push(k.result());
    }
    return runs;
  }

  it('dla-offlattice-2d (no lattice): both phases consistent with the exact 0 (99.9% band), judged by the rule without a lattice', () => {
    const runs = ensemble('dla-offlattice-2d', '14');
    for (const name of ['fold_phase_4', 'fold_phase_6']) expect(phaseOf(runs, name, 0.999).verdict).toBe('consistent with the exact 0');
    expect(observableSection(runs, { ...options, level: 0.999 })!.foldPhase!.rule).toBe(isotropicPhaseRule(0.999));
  });

  it('dla-square: 4-fold phase aligned with the lattice axes, by the lattice rule', () => {
    const runs = ensemble('dla-square', '14');
    expect(phaseOf(runs, 'fold_phase_4').verdict).toBe('aligned with the lattice axes');
    expect(observableSection(runs, options)!.foldPhase!.rule).toBe(PHASE_RULE);
  });

  it('an off-lattice ensemble never gets a lattice verdict, even when its band misses 0', () => {
    // the same bands, once labelled as the square lattice and once as off-lattice DLA: the verdicts
    // differ only in their wording, and a band that misses 0 off-lattice is a departure, not an alignment
    const square = syntheticRuns(24, 2000, { offset: 0, spread: 0.5 }, '32');
    const off = square.map((r) => ({ ...r, model: { kind: 'dla-offlattice-2d', params: {} } }));
    expect(phaseOf(square, 'fold_phase_4').verdict).toBe('aligned with the lattice axes');
    expect(phaseOf(off, 'fold_phase_4').verdict).toBe('departs from the exact 0');
    const a = observableSection(square, options)!.foldPhase!.verdicts;
    const b = observableSection(off, options)!.foldPhase!.verdicts;
    expect(b.map((v) => [v.mean, v.lo, v.hi])).toEqual(a.map((v) => [v.mean, v.lo, v.hi]));
  });
});
