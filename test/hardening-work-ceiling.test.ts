/**
 * Issue #11 item 8: probe walkers and probe jobs count in the total-work
 * ceiling of a spec (and of a probe request on the API).
 */
import { describe, expect, it } from 'vitest';
import { validateSpec } from '../coordinator/spec/index.js';
import { farmFixture } from './support/farm-fixture.js';
import { problemsOf } from './support/spec-problems.js';

const { api } = farmFixture('hardwork');
const app = api({ token: 't0k3n', limits: { maxTotalParticles: 1e9 } });

const sizes24 = Array.from({ length: 24 }, (_, i) => 2 + i);

const problems = (doc: unknown, max = 1e10): string[] => problemsOf(doc, (d) => validateSpec(d, { maxTotalParticles: max }));

describe('probe work is inside the total-work ceiling', () => {
  it('the audit spec (10^10 walkers at 25 sizes, 102,400 jobs) is refused with one line per problem', () => {
    const p = problems({ model: 'dla-offlattice-2d', particles: 100, clusters: 1, seed: 1, probe: { walkers: 1e10, at_sizes: sizes24 } });
    expect(p).toEqual([
      'probe.walkers: 10000000000 × 25 sizes × 1 clusters = 250000000000 walkers, plus 100 particles, is above the total-work ceiling; allowed: at most 10000000000 walkers and particles together (the operator may raise it with TENDRIL_MAX_TOTAL_PARTICLES)',
      'probe.jobs: 4096 per size × 25 sizes × 1 clusters = 102400 probe jobs; allowed: at most 100000 probe jobs per ensemble',
    ]);
  });

  it('walkers of many clusters add up', () => {
    const p = problems({ model: 'dla-offlattice-2d', particles: 1000, clusters: 10_000, seed: 1, probe: { walkers: 1_000_000, jobs: 2 } });
    expect(p).toEqual([
      'probe.walkers: 1000000 × 1 size × 10000 clusters = 10000000000 walkers, plus 10000000 particles, is above the total-work ceiling; allowed: at most 10000000000 walkers and particles together (the operator may raise it with TENDRIL_MAX_TOTAL_PARTICLES)',
    ]);
    expect(problems({ model: 'dla-offlattice-2d', particles: 1000, clusters: 100, seed: 1, probe: { walkers: 1_000_000, jobs: 2 } })).toEqual([]);
  });

  it('a probe request above the server ceiling is a 400', async () => {
    const r = await app.inject({ method: 'POST', url: '/probes', headers: { authorization: 'Bearer t0k3n' }, payload: { walkers: 2e9, seed: 1, csv: '0,0,1\n' } });
    expect(r.statusCode).toBe(400);
    expect(r.json().error).toBe('walkers: 2000000000 is above the total-work ceiling; allowed: at most 1000000000 (a walker counts as one particle; the operator may raise it with TENDRIL_MAX_TOTAL_PARTICLES)');
  });
});
