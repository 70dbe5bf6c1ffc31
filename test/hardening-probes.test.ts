/**
 * Issue #11 items 2 and 3: probe geometry that float arithmetic cannot
 * handle is refused with one line (worker/probe/probe-limits.ts), probe
 * requests can be cancelled (a running job stops within seconds), and the
 * token is checked before a body is read.
 */
import { request } from 'node:http';
import { describe, expect, it } from 'vitest';
import { ProbeRequestStore, validateProbeRequest } from '../coordinator/farm/probe-requests.js';
import { FarmProbeHandler } from '../coordinator/farm/probe-jobs.js';
import { DirectoryArtifactStore } from '../coordinator/farm/artifacts.js';
import { validateSpec, SpecError } from '../coordinator/spec/index.js';
import { ProbeGeometry } from '../worker/probe/probe-2d.js';
import type { ProbeJobData } from '../worker/runtime/job-contract.js';
import { farmFixture } from './support/farm-fixture.js';

const TOKEN = 'hardening-probe-token';
const { prefix, artifacts: artifactsDir, redis, store, queue, api } = farmFixture('hardprobe');
const app = api({ token: TOKEN, limits: { maxTotalParticles: 1e9 } });
const auth = { authorization: `Bearer ${TOKEN}` };

const post = (body: unknown, headers: Record<string, string> = auth) => app.inject({ method: 'POST', url: '/probes', payload: body as object, headers });

describe('probe geometry is bounded', () => {
  const cases: Array<[string, unknown, RegExp]> = [
    ['x = [0, 1e300]', { walkers: 100, seed: 1, jobs: 2, points: { x: [0, 1e300], y: [0, 0], r: 1 } }, /^points: the set spans 5\.00e\+299 largest contact radii from its middle; allowed: at most 10000000 \(coordinates and radii in one unit\)$/],
    ['x = [0, 1e15]', { walkers: 100, seed: 1, jobs: 2, points: { x: [0, 1e15], y: [0, 0], r: 1 } }, /^points: the set spans 5\.00e\+14 largest contact radii/],
    ['r = 1e-300', { walkers: 100, seed: 1, jobs: 2, points: { x: [0, 1], y: [0, 0], r: 1e-300 } }, /^points: the set spans 5\.00e\+299 largest contact radii/],
    ['x = ±1e308 (overflowing extent)', { walkers: 100, seed: 1, points: { x: [-1e308, 1e308], y: [0, 0], r: 1 } }, /^points: the set spans 1\.00e\+308 largest contact radii/],
    ['radius ratio', { walkers: 100, seed: 1, points: { x: [0, 3], y: [0, 0], r: [1, 1e-9] } }, /^points: the smallest contact radius is 1\.00e-9 of the largest; allowed: at least 0\.000001$/],
    ['min_step below the floor', { walkers: 100, seed: 1, csv: '0,0,1\n3,0,1\n', min_step: 1e-300 }, /^min_step: 1e-300 is out of range; allowed: a number from 0\.000001 to 1 for this set/],
    ['too many points (checked before reading them)', { walkers: 100, seed: 1, points: { x: new Array(2_000_001).fill(0), y: [0], r: 1 } }, /^points\.x: 2000001 values is out of range; allowed: at most 2000000$/],
  ];
  it.each(cases)('%s: 400 with one line naming the field', async (_name, body, msg) => {
    const r = await post(body);
    expect(r.statusCode).toBe(400);
    expect(r.json().error).toMatch(msg);
    expect(r.json().error).not.toContain('\n');
  });

  it('the geometry refuses such sets even when built directly (tasks from elsewhere)', () => {
    expect(() => new ProbeGeometry({ count: 2, x: Float64Array.of(0, 1e300), y: Float64Array.of(0, 0), r: 1 })).toThrow(/^point set: the set spans/);
  });

  it('an ordinary set and the default min_step stay allowed', () => {
    expect(validateProbeRequest({ walkers: 100, seed: 1, points: { x: [0, 2, 4], y: [0, 0, 1], r: 1 } }).set.count).toBe(3);
  });

  it('a spec probe.min_step below the float floor of its clusters is refused', () => {
    let problems: string[] = [];
    try {
      validateSpec({ model: 'dla-offlattice-2d', particles: 1000, clusters: 1, seed: 1, probe: { walkers: 1000, min_step: 1e-300 } });
    } catch (err) {
      problems = (err as SpecError).problems;
    }
    expect(problems).toEqual(['probe.min_step: 1e-300 is out of range; allowed: a number from 0.000001 to 1 for 1000 particles (a smaller step is lost in the float spacing)']);
  });
});

describe('probe requests can be cancelled', () => {
  it('POST /probes/ID/cancel needs the token, marks the request cancelled and stops its running job within seconds', async () => {
    const r = await post({ walkers: 1_000_000_000, seed: 1, jobs: 2, points: { x: [0, 2, 4, 6], y: [0, 0, 0, 0], r: 1 } });
    expect(r.statusCode).toBe(201);
    const id = r.json().id as string;
    expect((await app.inject({ method: 'POST', url: `/probes/${id}/cancel` })).statusCode).toBe(401);
    expect((await app.inject({ method: 'DELETE', url: `/probes/nope-${id}`, headers: auth })).statusCode).toBe(404);

    const job = await queue.getJob(`${id}-0`);
    const handler = new FarmProbeHandler(store, new DirectoryArtifactStore(artifactsDir), 1, { cancelPollMs: 100 }, new ProbeRequestStore(redis, prefix));
    try {
      const running = handler.run(job!.data as unknown as ProbeJobData);
      // a job of 10^9 walkers runs for minutes; cancel it once it has started
      await new Promise((res) => setTimeout(res, 500));
      const c = await app.inject({ method: 'DELETE', url: `/probes/${id}`, headers: auth });
      expect(c.statusCode).toBe(200);
      expect(c.json()).toEqual({ id, cancelled: true });
      const outcome = await Promise.race([running, new Promise((res) => setTimeout(() => res('still running after 10 s'), 10_000))]);
      expect(outcome).toBe('cancelled');
      expect((await app.inject({ url: `/probes/${id}` })).json().state).toBe('cancelled');
      // queued jobs of a cancelled request are skipped at once
      const other = await queue.getJob(`${id}-1`);
      expect(await handler.run(other!.data as unknown as ProbeJobData)).toBe('cancelled');
    } finally {
      await handler.close();
    }
  }, 60_000);
});

describe('the token is checked before the body is read', () => {
  it('a large unauthenticated body gets 401 before it is sent', async () => {
    await app.listen({ port: 0, host: '127.0.0.1' });
    const port = (app.server.address() as { port: number }).port;
    const answer = await new Promise<string>((resolve) => {
      const req = request({ host: '127.0.0.1', port, method: 'POST', path: '/probes', headers: { 'content-type': 'application/json', 'content-length': String(100_000_000) } });
      const timer = setTimeout(() => {
        req.destroy();
        resolve('no answer within 5 s');
      }, 5000);
      req.on('response', (res) => {
        clearTimeout(timer);
        resolve(`${res.statusCode}`);
        req.destroy();
      });
      req.on('error', () => undefined);
      // only the first kilobyte of the announced 100 MB is ever sent
      req.write('{"walkers": 100, "seed": 1, "csv": "' + 'x'.repeat(1000));
    });
    expect(answer).toBe('401');
  }, 20_000);
});
