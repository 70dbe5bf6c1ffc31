import { describe, expect, it } from 'vitest';
import { createKernel, modelParams } from '../worker/models/registry.js';
import type { GrowthResult } from '../worker/core/growth-kernel.js';
import { observableSection } from '../coordinator/stats/observable-bands.js';
import { observableFigures } from '../coordinator/report/observable-plots.js';
import { buildSummary } from '../coordinator/summary/index.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { checkXml } from './report-xml-check.js';

function runs(kind: string, particles: number, clusters: number): GrowthResult[] {
  return Array.from({ length: clusters }, (_, r) => {
    const k = createKernel({ model: modelParams(kind), particles, ensembleSeed: '4', runIndex: r, recordsPerDecade: 10 });
    k.growTo(particles);
    return k.result();
  });
}

describe('report and summary: model observables', () => {
  it('an Eden ensemble gets anisotropy-against-N figures with bands and the interface-width figure with its β fit', () => {
    const s = observableSection(runs('eden-square', 5000, 6), { seed: '1', resamples: 200, level: 0.95 });
    const figs = observableFigures(s);
    expect(figs.map((f) => f.name)).toEqual(['anisotropy-fold-amplitude', 'anisotropy-fold-phase', 'anisotropy-axis-ratio', 'interface-width']);
    for (const f of figs) {
      expect(f.note).toBeNull();
      checkXml(f.svg);
      expect(f.svg).toContain('<path'); // the bands and lines are drawn
    }
    expect(figs[3].caption).toMatch(/Verdict: (consistent|differs)/);
    expect(figs[1].caption).toMatch(/P_\{4\} at N = 5000: \S+ \[\S+, \S+\], (aligned with the lattice axes|opposite to the lattice axes|no k-fold alignment beyond noise); P_\{6\} at N = 5000/);
    expect(figs[1].caption).toContain('Rule: aligned with the lattice axes when the band');
  });

  it('off-lattice DLA (the isotropic baseline) gets the anisotropy figures but no interface figure', () => {
    const figs = observableFigures(observableSection(runs('dla-offlattice-2d', 300, 4), { seed: '1', resamples: 100, level: 0.9 }));
    expect(figs.map((f) => f.name)).toEqual(['anisotropy-fold-amplitude', 'anisotropy-fold-phase', 'anisotropy-axis-ratio']);
    // no lattice: the phase is a check of the exact 0, never an alignment with axes the model does not have
    expect(figs[1].caption).toMatch(/P_\{4\} at N = 300: \S+ \[\S+, \S+\], (consistent with the exact 0|departs from the exact 0); P_\{6\} at N = 300/);
    expect(figs[1].caption).toContain('Rule: the model has no lattice, so E P_k = 0 exactly');
    expect(figs[1].caption).not.toContain('lattice axes when');
  });

  it('a summary without the phases (runs resumed from older checkpoints) draws the phase figure with no verdict, or none without bands', () => {
    const s = observableSection(runs('dla-offlattice-2d', 300, 4), { seed: '1', resamples: 100, level: 0.9 })!;
    const noPhase = observableFigures({ ...s, foldPhase: undefined }).find((f) => f.name === 'anisotropy-fold-phase')!;
    expect(noPhase.caption).toContain('no verdict (the summary predates the recorded phases)');
    const older = { ...s, bands: s.bands.filter((b) => !b.name.startsWith('fold_phase_')), foldPhase: null };
    expect(observableFigures(older).map((f) => f.name)).toEqual(['anisotropy-fold-amplitude', 'anisotropy-axis-ratio']);
  });

  it('the ensemble summary carries statistics.observables for a lattice model', () => {
    const spec = validateSpec({ name: 'eden-sum', model: 'eden-triangular', particles: 3000, clusters: 5, seed: 9, records_per_decade: 10 });
    const summary = buildSummary({ ensembleId: 'e1', spec, createdAtMs: 0, results: runs('eden-triangular', 3000, 5).map((r) => ({ ...r, ensembleSeed: '9', ensembleId: 'e1', timings: { growSeconds: 0, startedAtMs: 0, finishedAtMs: 0, resumes: 0, finishedBy: 'test' } })) });
    const st = JSON.parse(summary.statisticsJson) as { observables: { schema: string; bands: { name: string }[]; interfaceGrowth: { beta: number } | null } };
    expect(st.observables.schema).toBe('tendril.observables/1');
    expect(st.observables.bands.map((b) => b.name)).toContain('fold_amplitude_6');
    expect(st.observables.interfaceGrowth!.beta).toBeGreaterThan(0);
  });
});
