import { describe, expect, it } from 'vitest';
import { parseSpec, parseSpecText, SpecError, specToDocument, validateSpec, limitsFromEnv, formatOf } from '../coordinator/spec/index.js';
import { MODEL_KINDS } from '../worker/models/registry.js';

const good = `
name = "demo"
model = "dla-offlattice-2d"
particles = 5000
clusters = 8
seed = 20261202
`;

function problems(fn: () => unknown): string[] {
  try {
    fn();
  } catch (e) {
    if (e instanceof SpecError) return e.problems;
    throw e;
  }
  throw new Error('expected a SpecError');
}

describe('ensemble spec', () => {
  it('parses TOML and fills defaults', () => {
    const s = parseSpec(good, 'toml');
    expect(s.name).toBe('demo');
    expect(s.model.kind).toBe('dla-offlattice-2d');
    expect(s.model.params.min_step).toBeGreaterThan(0);
    expect(s.particles).toBe(5000);
    expect(s.clusters).toBe(8);
    expect(s.seed).toBe('20261202');
    expect(s.recordsPerDecade).toBe(10);
    expect(s.observables).toEqual(['radius_of_gyration', 'max_radius', 'center_offset', 'mass_radius']);
    expect(s.checkpointIntervalSeconds).toBe(300);
    expect(s.runsPerJob).toBe(1); // 8 clusters: one job each, to spread over workers
  });

  it('groups tiny clusters into jobs of at most 10^5 particles, keeping at least 64 jobs', async () => {
    const { defaultRunsPerJob } = await import('../coordinator/spec/index.js');
    expect(defaultRunsPerJob(100, 100000)).toBe(1000);
    expect(defaultRunsPerJob(5000, 100000)).toBe(20);
    expect(defaultRunsPerJob(5000, 640)).toBe(10);
    expect(defaultRunsPerJob(1000000, 100)).toBe(1);
  });

  it('the canonical document re-validates to the same spec (JSON too)', () => {
    const s = parseSpec(good, 'toml');
    const again = parseSpec(JSON.stringify(specToDocument(s)), 'json');
    expect(again).toEqual(s);
  });

  it('reads [analysis] and [target]; the canonical document keeps them; the first batch is derived when clusters is absent', () => {
    const s = parseSpec(
      'model = "dla-offlattice-2d"\nparticles = 100\nseed = 3\n[analysis]\nfit_min_size = 10\nresamples = 500\ncorrections = false\n[target]\nhalf_width = 0.02\nmax_clusters = 300\n',
      'toml',
    );
    expect(s.analysis).toEqual({ fitMinSize: 10, resamples: 500, corrections: false });
    expect(s.target).toEqual({ estimator: 'radius_of_gyration', halfWidth: 0.02, level: 0.95, maxClusters: 300, minBatch: 8, minClusters: 20 });
    expect(s.clusters).toBe(20);
    expect(parseSpec(JSON.stringify(specToDocument(s)), 'json')).toEqual(s);
    const fixed = validateSpec(base);
    expect(fixed.target).toBeNull();
    expect(specToDocument(fixed)).not.toHaveProperty('analysis');
    expect(specToDocument(fixed)).not.toHaveProperty('target');
  });

  it('accepts a 64-bit seed as a string and model parameters', () => {
    const s = validateSpec({ model: 'dla-offlattice-2d', particles: 100, clusters: 2, seed: '18446744073709551615', params: { min_step: 0.5 } });
    expect(s.seed).toBe('18446744073709551615');
    expect(s.model.params.min_step).toBe(0.5);
  });

  const base = { model: 'dla-offlattice-2d', particles: 1000, clusters: 4, seed: 1 };
  const table: Array<[string, unknown, string]> = [
    ['particles too small', { ...base, particles: 0 }, 'particles: 0 is out of range; allowed: an integer from 2 to 100000000'],
    ['particles too large', { ...base, particles: 100000001 }, 'particles: 100000001 is out of range; allowed: an integer from 2 to 100000000'],
    ['particles not an integer', { ...base, particles: 10.5 }, 'particles: 10.5 is not allowed; allowed: an integer from 2 to 100000000'],
    ['particles a string', { ...base, particles: '1000' }, 'particles: "1000" is not allowed; allowed: an integer from 2 to 100000000'],
    ['clusters too many', { ...base, clusters: 100001 }, 'clusters: 100001 is out of range; allowed: an integer from 1 to 100000'],
    // every registered model, quoted, in registry order (a new model needs no edit here)
    ['unknown model', { ...base, model: 'dla-3d' }, `model: "dla-3d" is not allowed; allowed: one of ${MODEL_KINDS.map((k) => `"${k}"`).join(', ')}`],
    ['missing seed', { model: 'dla-offlattice-2d', particles: 10, clusters: 1 }, 'seed: missing; allowed: ensemble seed: an unsigned 64-bit integer (a string of decimal digits, or an integer below 2^53)'],
    ['negative seed', { ...base, seed: -1 }, 'seed: -1 is not allowed; allowed: ensemble seed: an unsigned 64-bit integer (a string of decimal digits, or an integer below 2^53)'],
    ['seed above 2^64', { ...base, seed: '18446744073709551616' }, 'seed: "18446744073709551616" is out of range; allowed: an integer from 0 to 18446744073709551615'],
    ['unknown field', { ...base, particels: 5 }, 'particels: unknown field; allowed fields: name, model, params, particles, clusters, seed, records_per_decade, observables, checkpoint_interval_seconds, checkpoint_every_particles, runs_per_job, analysis, probe, positions, target'],
    ['bad min_step', { ...base, params: { min_step: 0 } }, 'params.min_step: 0 is out of range; allowed: a number above 0 and at most 1 (particle diameters, for dla-offlattice-2d)'],
    ['unknown param', { ...base, params: { step: 1 } }, 'params.step: not a parameter of dla-offlattice-2d; allowed: min_step, launch_margin'],
    ['records per decade', { ...base, records_per_decade: 5 }, 'records_per_decade: 5 is out of range; allowed: an integer from 10 to 100'],
    ['bad observable', { ...base, observables: ['rg'] }, 'observables[0]: "rg" is not allowed; allowed: one of "radius_of_gyration", "max_radius", "center_offset", "mass_radius"'],
    ['repeated observable', { ...base, observables: ['max_radius', 'max_radius'] }, 'observables: ["max_radius","max_radius"] repeats an entry; allowed: a non-empty list of distinct values from "radius_of_gyration", "max_radius", "center_offset", "mass_radius"'],
    ['checkpoint interval', { ...base, checkpoint_interval_seconds: 0.5 }, 'checkpoint_interval_seconds: 0.5 is out of range; allowed: a number from 1 to 86400'],
    ['checkpoint every more than particles', { ...base, checkpoint_every_particles: 2000 }, 'checkpoint_every_particles: 2000 is out of range; allowed: 0 (off) or an integer from 1 to particles (1000)'],
    ['total work', { ...base, particles: 100000000, clusters: 101 }, 'particles × clusters: 100000000 × 101 = 10100000000 is above the total-work ceiling; allowed: at most 10000000000 (the operator may raise it with TENDRIL_MAX_TOTAL_PARTICLES)'],
    ['too few resamples', { ...base, analysis: { resamples: 5 } }, 'analysis.resamples: 5 is out of range; allowed: an integer from 10 to 1000000'],
    ['level of 1', { ...base, analysis: { level: 1 } }, 'analysis.level: 1 is out of range; allowed: a number from 0.5 to 0.999'],
    ['empty fit window', { ...base, analysis: { fit_min_size: 1000, fit_max_size: 100 } }, 'analysis.fit_min_size: 1000 is not allowed; allowed: a number below analysis.fit_max_size (100)'],
    ['positions.at_sizes not below particles', { ...base, positions: { at_sizes: [100, 100000] } }, 'positions.at_sizes[1]: 100000 is out of range; allowed: an integer from 2 to particles - 1 (999)'],
    ['corrections not a boolean', { ...base, analysis: { corrections: 'no' } }, 'analysis.corrections: "no" is not allowed; allowed: true or false'],
    ['unknown analysis field', { ...base, analysis: { window: 3 } }, 'analysis.window: unknown field; allowed fields: fit_min_size, fit_max_size, mass_radius_min_radius, mass_radius_max_radius, resamples, level, corrections, local_slope_width'],
    ['target without half-width', { ...base, target: { max_clusters: 100 } }, 'target.half_width: missing; allowed: a number above 0 up to 1'],
    ['target half-width 0', { ...base, target: { half_width: 0, max_clusters: 100 } }, 'target.half_width: 0 is out of range; allowed: a number above 0 up to 1'],
    ['target unknown estimator', { ...base, target: { half_width: 0.01, max_clusters: 100, estimator: 'rg' } }, 'target.estimator: "rg" is not allowed; allowed: one of "radius_of_gyration", "max_radius", "mass_radius"'],
    ['first batch above the cap', { ...base, clusters: 50, target: { half_width: 0.01, max_clusters: 40 } }, 'clusters: 50 is out of range; allowed: an integer from 1 to target.max_clusters (40)'],
    ['neither clusters nor target', { model: 'dla-offlattice-2d', particles: 10, seed: 1 }, 'clusters: missing; allowed: an integer from 1 to 100000 (or a [target] table with max_clusters)'],
    ['adaptive total work', { ...base, particles: 100000000, target: { half_width: 0.01, max_clusters: 101 } }, 'particles × target.max_clusters: 100000000 × 101 = 10100000000 is above the total-work ceiling; allowed: at most 10000000000 (the operator may raise it with TENDRIL_MAX_TOTAL_PARTICLES)'],
    ['not an object', [1, 2], 'spec: [1,2] is not allowed; allowed: a table (object) of fields'],
  ];
  for (const [name, doc, msg] of table) {
    it(`refuses ${name} with a precise one-line message`, () => {
      const p = problems(() => validateSpec(doc, { maxTotalParticles: 1e10 }));
      expect(p).toEqual([msg]);
      expect(msg).not.toContain('\n');
    });
  }

  it('reports every bad field at once', () => {
    const p = problems(() => validateSpec({ model: 'x', particles: 0, clusters: 0, seed: 1 }));
    expect(p).toHaveLength(3);
    expect(p.map((m) => m.split(':')[0]).sort()).toEqual(['clusters', 'model', 'particles']);
  });

  it('the operator can raise the total-work ceiling', () => {
    const doc = { ...base, particles: 100000000, clusters: 101 };
    expect(() => validateSpec(doc, limitsFromEnv({ TENDRIL_MAX_TOTAL_PARTICLES: '20000000000' }))).not.toThrow();
    expect(() => validateSpec(doc, limitsFromEnv({}))).toThrow(SpecError);
    expect(problems(() => limitsFromEnv({ TENDRIL_MAX_TOTAL_PARTICLES: 'lots' }))).toEqual([
      'TENDRIL_MAX_TOTAL_PARTICLES: "lots" is not allowed; allowed: an integer from 1 to 9007199254740991',
    ]);
  });

  it('TOML and JSON syntax errors name the place', () => {
    expect(problems(() => parseSpecText('particles = = 3', 'toml'))[0]).toMatch(/^spec is not valid TOML \(line 1, column \d+\): invalid value$/);
    expect(problems(() => parseSpecText('{"a":', 'json'))[0]).toMatch(/^spec is not valid JSON: /);
    expect(problems(() => parseSpecText('seed = 9007199254740993', 'toml'))[0]).toMatch(/cannot be represented losslessly/);
    expect(problems(() => formatOf('spec.yaml'))).toEqual(['unknown format; allowed: a name ending in .toml or .json']);
  });
});

describe('example specs', () => {
  it('every spec in examples/ is valid', async () => {
    const { readdirSync, readFileSync } = await import('node:fs');
    const { join } = await import('node:path');
    const dir = join(import.meta.dirname, '..', 'examples');
    const files = readdirSync(dir).filter((f) => /\.(toml|json)$/.test(f));
    expect(files).toContain('demo.toml');
    const { validateLaunch } = await import('../coordinator/spec/sweep.js');
    for (const f of files) {
      // a spec, or a sweep of specs (coordinator/spec/sweep.ts): every member counts
      const l = validateLaunch(parseSpecText(readFileSync(join(dir, f), 'utf8'), formatOf(f)));
      const specs = l.kind === 'single' ? [l.spec] : l.sweep.members;
      expect(specs.reduce((t, s) => t + s.particles * s.clusters, 0)).toBeLessThanOrEqual(1e10);
      if (l.kind === 'single') expect(l.spec).toEqual(parseSpec(readFileSync(join(dir, f), 'utf8'), formatOf(f)));
    }
  });
});

describe('models without a probe or picture', () => {
  it('a [probe] table is refused in one line for a model whose descriptor declares no probe', async () => {
    const { probeProblem } = await import('../coordinator/spec/index.js');
    const { MODELS } = await import('../worker/models/registry.js');
    const unprobed = { ...MODELS[0], kind: 'no-probe-model', probe: null };
    expect(probeProblem(MODELS[0])).toBeNull();
    expect(probeProblem(unprobed, [...MODELS, unprobed])).toBe(
      `probe: no-probe-model has no harmonic-measure probe; allowed: a spec without [probe] for this model (probes apply to ${MODELS.filter((m) => m.probe !== null).map((m) => m.kind).join(', ')})`,
    );
  });
});

describe('the spec schema is built from the model descriptors', () => {
  it('has one params clause per registered model, with each parameter range and default', async () => {
    const { SPEC_SCHEMA } = await import('../coordinator/spec/index.js');
    const { MODELS } = await import('../worker/models/registry.js');
    const clauses = SPEC_SCHEMA.allOf as unknown as Array<{ if: { properties: { model: { const: string } } }; then: { properties: { params: { additionalProperties: boolean; properties: Record<string, Record<string, unknown>> } } } }>;
    expect(clauses.map((c) => c.if.properties.model.const)).toEqual(MODELS.map((m) => m.kind));
    for (const [i, m] of MODELS.entries()) {
      const params = clauses[i].then.properties.params;
      expect(params.additionalProperties).toBe(false);
      expect(Object.keys(params.properties)).toEqual(m.params.map((p) => p.name));
      for (const p of m.params) expect(params.properties[p.name].default).toBe(p.default);
    }
  });

  it('reports every bad parameter at once, each in one line naming params.NAME and the model', () => {
    const p = problems(() => validateSpec({ model: 'dla-offlattice-2d', particles: 100, clusters: 1, seed: 1, params: { min_step: 2, eta: 1 } }));
    expect(p).toEqual([
      'params.eta: not a parameter of dla-offlattice-2d; allowed: min_step, launch_margin',
      'params.min_step: 2 is out of range; allowed: a number above 0 and at most 1 (particle diameters, for dla-offlattice-2d)',
    ]);
  });

  it('params that are not a table are refused in one line', () => {
    expect(problems(() => validateSpec({ model: 'dla-offlattice-2d', particles: 100, clusters: 1, seed: 1, params: 'fast' }))).toEqual([
      'params: "fast" is not allowed; allowed: a table of the parameters of dla-offlattice-2d',
    ]);
  });
});
