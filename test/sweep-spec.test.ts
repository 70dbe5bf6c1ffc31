/** Sweep specs (coordinator/spec/sweep.ts): syntax, one-line errors, derived member seeds. */
import { describe, expect, it } from 'vitest';
import { isSweepDocument, launchDocumentProblems, MAX_SWEEP_VALUES, memberSeed, sweepToDocument, validateLaunch, type SweepSpec } from '../coordinator/spec/sweep.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { Random } from '../worker/core/random.js';
import { problemsOf } from './support/spec-problems.js';

const base = { name: 'nr', model: 'dla-square', particles: 500, clusters: 3, seed: 42 };

function sweepOf(doc: unknown): SweepSpec {
  const l = validateLaunch(doc);
  if (l.kind !== 'sweep') throw new Error('not a sweep');
  return l.sweep;
}

describe('sweep syntax', () => {
  it('a list of values becomes one member per value, each an ordinary spec with the value and a derived seed', () => {
    const s = sweepOf({ ...base, params: { noise_reduction: [1, 2, 4], launch_margin: 10 } });
    expect(s.parameter).toBe('noise_reduction');
    expect(s.values).toEqual([1, 2, 4]);
    expect(s.members.map((m) => m.model.params)).toEqual([1, 2, 4].map((v) => ({ noise_reduction: v, launch_margin: 10 })));
    expect(s.members.map((m) => m.name)).toEqual(['nr (noise_reduction: 1)', 'nr (noise_reduction: 2)', 'nr (noise_reduction: 4)']);
    expect(s.members.map((m) => m.seed)).toEqual([0, 1, 2].map((i) => memberSeed(42, i)));
    // a member is exactly the spec validateSpec makes of its own document
    for (const m of s.members) expect(validateSpec({ ...base, name: m.name, seed: m.seed, params: m.model.params })).toEqual(m);
  });

  it('a range with a step includes both ends and is free of float noise', () => {
    const s = sweepOf({ ...base, model: 'dla-offlattice-2d', params: { min_step: { from: 0.1, to: 0.5, step: 0.1 } } });
    expect(s.values).toEqual([0.1, 0.2, 0.3, 0.4, 0.5]);
    expect(sweepOf({ ...base, params: { noise_reduction: { from: 1, to: 7, step: 2 } } }).values).toEqual([1, 3, 5, 7]);
    // `to` off the grid: the last value is the last step at or below it
    expect(sweepOf({ ...base, params: { noise_reduction: { from: 1, to: 6, step: 2 } } }).values).toEqual([1, 3, 5]);
  });

  it('a spec without a swept parameter is a single ensemble, identical to validateSpec', () => {
    const doc = { ...base, params: { noise_reduction: 2 } };
    expect(isSweepDocument(doc)).toBe(false);
    expect(validateLaunch(doc)).toEqual({ kind: 'single', spec: validateSpec(doc) });
  });

  it('the canonical document validates to the same sweep (list and range)', () => {
    for (const swept of [[1, 2, 4], { from: 1, to: 5, step: 2 }]) {
      const s = sweepOf({ ...base, params: { noise_reduction: swept } });
      const doc = sweepToDocument(s);
      expect((doc.params as Record<string, unknown>).noise_reduction).toEqual(swept);
      expect(doc.seed).toBe('42');
      expect(sweepOf(JSON.parse(JSON.stringify(doc)))).toEqual(s);
    }
  });
});

describe('sweep errors: one line naming the field, the value and what is allowed', () => {
  const cases: Array<[string, unknown, RegExp]> = [
    ['an element out of the parameter range', { noise_reduction: [1, 0, 3] }, /^params\.noise_reduction\[1\]: 0 is out of range; allowed: an integer from 1 to 1000/],
    ['a non-number element', { noise_reduction: [1, 'x'] }, /^params\.noise_reduction\[1\]: "x" is not a number; allowed: an integer from 1 to 1000/],
    ['values not increasing', { noise_reduction: [1, 3, 2] }, /^params\.noise_reduction\[2\]: 2 is not allowed after 3; allowed: values in strictly increasing order$/],
    ['a single value', { noise_reduction: [2] }, /^params\.noise_reduction: a list of 1 value is not allowed; allowed: a list of 2 to 64 numbers/],
    ['too many values', { noise_reduction: Array.from({ length: MAX_SWEEP_VALUES + 1 }, (_, i) => i + 1) }, /^params\.noise_reduction: a list of 65 values is not allowed/],
    ['two swept parameters', { noise_reduction: [1, 2], launch_margin: [4, 8] }, /^params\.launch_margin: a second swept parameter is not allowed \(params\.noise_reduction is swept\); allowed: at most one swept parameter/],
    ['an unknown parameter', { nosie: [1, 2] }, /^params\.nosie: not a parameter of dla-square; allowed: noise_reduction, launch_margin/],
    ['a range without step', { noise_reduction: { from: 1, to: 3 } }, /^params\.noise_reduction\.step: missing; allowed: a number above 0$/],
    ['a range with a zero step', { noise_reduction: { from: 1, to: 3, step: 0 } }, /^params\.noise_reduction\.step: 0 is out of range; allowed: a number above 0$/],
    ['a range going down', { noise_reduction: { from: 3, to: 1, step: 1 } }, /^params\.noise_reduction\.to: 1 is not allowed; allowed: a number above params\.noise_reduction\.from \(3\)$/],
    ['a range end out of range', { noise_reduction: { from: 1, to: 2000, step: 100 } }, /^params\.noise_reduction\.to: 2000 is out of range; allowed: an integer from 1 to 1000/],
    ['a range of too many values', { noise_reduction: { from: 1, to: 1000, step: 1 } }, /^params\.noise_reduction\.step: 1 gives 1000 values from 1 to 1000; allowed: a step giving 2 to 64 values$/],
    ['a fractional step for an integer parameter', { noise_reduction: { from: 1, to: 3, step: 0.5 } }, /^params\.noise_reduction\.step: 0\.5 gives the value 1\.5; allowed: an integer step/],
    ['an unknown range field', { noise_reduction: { from: 1, to: 3, step: 1, by: 2 } }, /^params\.noise_reduction\.by: not a field of a sweep range; allowed: from, to, step/],
  ];
  for (const [what, params, re] of cases) {
    it(what, () => {
      const p = problemsOf({ ...base, params }, validateLaunch);
      expect(p.length).toBeGreaterThan(0);
      expect(p[0]).toMatch(re);
      for (const line of p) expect(line).not.toContain('\n');
      // the HTTP body validator gives the same lines
      expect(launchDocumentProblems({ ...base, params })).toEqual(p);
    });
  }

  it('a member refused by the model size check names its element', () => {
    // dla-offlattice-2d: min_step at least (particles + 1 + launch_margin)·2^-40 (the float spacing), 9.1e-5 for 10^8 particles
    const p = problemsOf({ ...base, model: 'dla-offlattice-2d', particles: 100_000_000, clusters: 1, params: { min_step: [1e-6, 0.5] } }, validateLaunch);
    expect(p).toHaveLength(1);
    expect(p[0]).toMatch(/^params\.min_step\[0\]: 0\.000001 is out of range; allowed: a number from [0-9.e-]+ to 1 for 100000000 particles/);
  });

  it('member names stay within the 100 characters of a name', () => {
    const s = sweepOf({ ...base, name: 'x'.repeat(100), params: { noise_reduction: [1, 1000] } });
    for (const m of s.members) expect(m.name.length).toBeLessThanOrEqual(100);
    expect(s.members[1].name.endsWith(' (noise_reduction: 1000)')).toBe(true);
  });

  it('other fields of the spec are still checked, once', () => {
    expect(problemsOf({ ...base, particles: 1, params: { noise_reduction: [1, 2] } }, validateLaunch)).toEqual([expect.stringMatching(/^particles: 1 is out of range/)]);
  });

  it('the total work of all members counts against the ceiling', () => {
    const p = problemsOf({ ...base, particles: 1000, clusters: 10, params: { noise_reduction: [1, 2, 3] } }, validateLaunch);
    expect(p).toEqual([]);
    expect(() => validateLaunch({ ...base, particles: 1000, clusters: 10, params: { noise_reduction: [1, 2, 3] } }, { maxTotalParticles: 25_000 })).toThrow(
      /^particles × clusters × values of params\.noise_reduction: 1000 × 10 × 3 = 30000 is above the total-work ceiling; allowed: at most 25000/,
    );
  });
});

describe('member seeds', () => {
  it('are a pure function of (sweep seed, index): deterministic, distinct, and different from the sweep seed', () => {
    expect(memberSeed('42', 3)).toBe(memberSeed(42, 3));
    expect(memberSeed(42n, 3)).toBe(memberSeed('42', 3));
    const seeds = Array.from({ length: 2000 }, (_, i) => memberSeed('18446744073709551615', i));
    expect(new Set(seeds).size).toBe(2000);
    expect(seeds).not.toContain('18446744073709551615');
    for (const s of seeds) expect(BigInt(s) < 1n << 64n).toBe(true);
    // different sweep seeds give different members
    expect(memberSeed(1, 0)).not.toBe(memberSeed(2, 0));
    // pinned: the derivation is a documented contract (coordinator/spec/sweep.ts)
    expect([memberSeed(0, 0), memberSeed(42, 1)]).toMatchSnapshot();
    expect(() => memberSeed(1, -1)).toThrow(/index/);
  });

  it('give independent run streams: uniforms of member 0 and member 1 are uncorrelated and uniform', () => {
    // the sample correlation of n independent uniform pairs has standard deviation 1/sqrt(n) (common practice, no source);
    // 4.5 standard deviations keeps the test from failing by chance (two-sided level about 7e-6)
    const n = 20_000;
    for (const [i, j] of [[0, 1], [1, 2], [0, 7]]) {
      const a = Random.forRun(memberSeed(42, i), 0);
      const b = Random.forRun(memberSeed(42, j), 0);
      let sa = 0, sb = 0, sab = 0, saa = 0, sbb = 0;
      for (let k = 0; k < n; k++) {
        const x = a.nextDouble(), y = b.nextDouble();
        sa += x; sb += y; sab += x * y; saa += x * x; sbb += y * y;
      }
      const ma = sa / n, mb = sb / n;
      const r = (sab / n - ma * mb) / Math.sqrt((saa / n - ma * ma) * (sbb / n - mb * mb));
      expect(Math.abs(r)).toBeLessThan(4.5 / Math.sqrt(n));
      // mean of n uniforms: standard deviation sqrt(1/12/n)
      expect(Math.abs(ma - 0.5)).toBeLessThan(4.5 * Math.sqrt(1 / 12 / n));
    }
    // and the same (seed, index) replays the same stream
    const x = Random.forRun(memberSeed(42, 5), 3), y = Random.forRun(memberSeed(42, 5), 3);
    for (let k = 0; k < 100; k++) expect(x.nextDouble()).toBe(y.nextDouble());
  });
});
