/**
 * Issue #11 item 10, the smaller findings: each with the input that showed it.
 */
import { join } from 'node:path';
import { Worker } from 'node:worker_threads';
import { describe, expect, it } from 'vitest';
import { cancelEnsemble, launchEnsemble } from '../coordinator/farm/queue.js';
import { STALE_RUN_MS } from '../coordinator/farm/store.js';
import { validateProbeRequest } from '../coordinator/farm/probe-requests.js';
import { parseSpecText, validateSpec } from '../coordinator/spec/index.js';
import { openFarm } from '../coordinator/commands/farm-options.js';
import { privateRedis, ROOT } from './farm-helpers.js';
import { problemsOf } from './support/spec-problems.js';
import { farmFixture } from './support/farm-fixture.js';

const TOKEN = 'hardening-small-token';
const { store, queue, api } = farmFixture('hardsmall');
const app = api({ token: TOKEN, limits: { maxTotalParticles: 1e9 } });
const auth = { authorization: `Bearer ${TOKEN}` };

describe('smaller findings', () => {
  it('{"toml": ...} sent as JSON is an unknown field, not parsed as TOML', async () => {
    const r = await app.inject({ method: 'POST', url: '/ensembles', headers: auth, payload: { toml: 'model = "dla-offlattice-2d"\nparticles = 10\nclusters = 1\nseed = 1' } });
    expect(r.statusCode).toBe(400);
    expect(r.json().problems.some((p: string) => /^toml: unknown field; allowed fields: /.test(p))).toBe(true);
    const t = await app.inject({ method: 'POST', url: '/ensembles', headers: { ...auth, 'content-type': 'application/toml' }, payload: 'model = "dla-offlattice-2d"\nparticles = 10\nclusters = 1\nseed = 1' });
    expect(t.statusCode).toBe(201);
  });

  it('a __proto__ body is refused for what it is', async () => {
    const r = await app.inject({ method: 'POST', url: '/ensembles', headers: { ...auth, 'content-type': 'application/json' }, payload: '{"__proto__": {"x": 1}, "particles": 10}' });
    expect(r.statusCode).toBe(400);
    expect(r.json().error).toBe('body: a "__proto__" or "constructor" key is not allowed; allowed: a JSON object of the documented fields');
    const escaped = await app.inject({ method: 'POST', url: '/probes', headers: { ...auth, 'content-type': 'application/json' }, payload: '{"walkers": 100, "seed": 1, "points": {"\\u005f_proto__": {"x": 1}}}' });
    expect(escaped.json().error).toBe('body: a "__proto__" or "constructor" key is not allowed; allowed: a JSON object of the documented fields');
    const ctor = await app.inject({ method: 'POST', url: '/ensembles', headers: { ...auth, 'content-type': 'application/json' }, payload: '{"constructor": {"prototype": {"x": 1}}}' });
    expect(ctor.json().error).toBe('body: a "__proto__" or "constructor" key is not allowed; allowed: a JSON object of the documented fields');
  });

  it('probe request fields set to null are refused, not defaulted', () => {
    expect(() => validateProbeRequest({ walkers: 1000, seed: 1, csv: '0,0,1\n', jobs: null })).toThrow('jobs: null is not allowed; allowed: leave the field out to take its default');
    expect(() => validateProbeRequest({ walkers: 1000, seed: 1, csv: '0,0,1\n', min_step: null })).toThrow('min_step: null is not allowed');
  });

  it('contradictions are refused before any work: min_clusters above max_clusters, a fit window beyond the particles', () => {
    expect(problemsOf({ model: 'dla-offlattice-2d', particles: 100, seed: 1, target: { half_width: 0.05, max_clusters: 10, min_clusters: 20 } })).toContain(
      'target.min_clusters: 20 is out of range; allowed: an integer from 2 to target.max_clusters (10)',
    );
    expect(problemsOf({ model: 'dla-offlattice-2d', particles: 100, clusters: 4, seed: 1, analysis: { fit_min_size: 500 } })).toEqual([
      'analysis.fit_min_size: 500 is out of range; allowed: a number from 1 to below particles (100)',
    ]);
  });

  it('NaN and infinities are quoted as such, not as null', () => {
    expect(problemsOf(parseSpecText('model = "dla-offlattice-2d"\nparticles = inf\nclusters = 1\nseed = 1', 'toml'))).toEqual(['particles: Infinity is not allowed; allowed: an integer from 2 to 100000000']);
    expect(problemsOf(parseSpecText('model = "dla-offlattice-2d"\nparticles = 10\nclusters = 1\nseed = 1\n[analysis]\nlevel = -inf', 'toml'))).toEqual(['analysis.level: -Infinity is not allowed; allowed: a number from 0.5 to 0.999']);
    expect(problemsOf(parseSpecText('model = "dla-offlattice-2d"\nparticles = 10\nclusters = 1\nseed = 1\n[params]\nmin_step = nan', 'toml'))[0]).toMatch(/^params\.min_step: NaN /);
  });

  it('a cancelled ensemble lists nothing queued', async () => {
    const id = await launchEnsemble(store, queue, validateSpec({ model: 'dla-offlattice-2d', particles: 100, clusters: 50, seed: 1 }));
    expect((await store.status(id))!.runs.queued).toBe(50);
    await cancelEnsemble(store, queue, id);
    const s = (await store.status(id))!;
    expect(s.state).toBe('cancelled');
    expect(s.runs.queued).toBe(0);
  });

  it('a run whose worker was killed stops counting as running once it gives no sign of life', async () => {
    const id = await launchEnsemble(store, queue, validateSpec({ model: 'dla-offlattice-2d', particles: 100, clusters: 4, seed: 2 }));
    await store.runStarted(id, 0, 'killed-worker');
    await store.runStarted(id, 1, 'live-worker');
    const t = Date.now();
    expect((await store.status(id, t))!.runs).toEqual({ planned: 4, queued: 2, running: 2, done: 0, failed: 0 });
    // within the staleness window both count as running; past it, with no tick since, neither does
    expect((await store.status(id, t + STALE_RUN_MS / 2))!.runs.running).toBe(2);
    expect((await store.status(id, Date.now() + STALE_RUN_MS + 1000))!.runs).toEqual({ planned: 4, queued: 4, running: 0, done: 0, failed: 0 });
  });

  it('a thread of another kind that imports the task thread module is not turned into a task thread', async () => {
    // a plain worker thread (no task-thread role) loading task-thread.js registers no listener and exits on its own
    const w = new Worker(new URL(`file://${join(ROOT, 'dist', 'worker', 'runtime', 'task-thread.js')}`));
    const code = await new Promise<number | string>((resolve) => {
      const t = setTimeout(() => resolve('still running after 30 s'), 30_000);
      w.once('exit', (c) => {
        clearTimeout(t);
        resolve(c);
      });
    });
    if (code !== 0) await w.terminate();
    expect(code).toBe(0);
  }, 40_000);

  it('a wrong Redis password is reported as such, not as "Connection is closed"', async () => {
    const server = await privateRedis({ password: 'right-password' });
    try {
      await expect(openFarm({ redis: `redis://:wrong@127.0.0.1:${server.port}`, prefix: 'x' } as never)).rejects.toThrow(/^--redis: cannot reach redis:\/\/\*\*\*@127\.0\.0\.1:\d+: WRONGPASS/);
    } finally {
      await server.cleanup();
    }
  }, 60_000);
});
