/**
 * Probe requests over HTTP (POST /probes): a user's point set probed by a
 * farm worker on a real Redis gives the very measures of `tendril probe`'s
 * embedded path with the same set, seed, walkers and jobs, and bad requests
 * get one-line errors.
 */
import { describe, expect, it } from 'vitest';
import { ProbeRequestStore, validateProbeRequest } from '../coordinator/farm/probe-requests.js';
import { runProbes } from '../coordinator/harmonic/probe-run.js';
import { waitFor } from './farm-helpers.js';
import { farmFixture } from './support/farm-fixture.js';

const TOKEN = 'probe-request-token';
const { prefix, redis, startWorker, api } = farmFixture('probereq');
const app = api({ token: TOKEN, limits: { maxTotalParticles: 1e9 } });
const auth = { authorization: `Bearer ${TOKEN}` };

describe('POST /probes', () => {
  it('refuses bad requests with one line naming the field', async () => {
    const post = async (body: unknown, headers: Record<string, string> = auth) => app.inject({ method: 'POST', url: '/probes', payload: body as object, headers });
    expect((await post({ walkers: 1000, seed: 1, csv: '0,0,1\n' }, {})).statusCode).toBe(401);
    const cases: Array<[unknown, string]> = [
      [{ seed: 1, csv: '0,0,1\n' }, 'walkers: missing; allowed: an integer from 100 to 10000000000'],
      [{ walkers: 1000, seed: -3, csv: '0,0,1\n' }, 'seed: -3 is not allowed; allowed: an unsigned 64-bit integer (a string of decimal digits, or an integer below 2^53)'],
      [{ walkers: 1000, seed: 1 }, 'csv, points: exactly one must be given; allowed: csv (text of x,y,r rows) or points ({x: [...], y: [...], r: number or [...]})'],
      [{ walkers: 1000, seed: 1, csv: '0,0,1\n1,2\n' }, 'csv line 2: expected 3 values x,y,r, got 2'],
      [{ walkers: 1000, seed: 1, points: { x: [0, 1], y: [0, 1], r: -1 } }, 'points.r: -1 is not allowed; allowed: a finite number > 0 (one for all, or one per point)'],
      [{ walkers: 1000, seed: 1, csv: '0,0,1\n', jobs: 5000 }, 'jobs: 5000 is out of range; allowed: an integer from 1 to 4096'],
      [{ walkers: 1000, seed: 1, csv: '0,0,1\n', jobs: 2000 }, 'jobs: 2000 is out of range; allowed: an integer from 1 to walkers (1000)'],
      [{ walkers: 1000, seed: 1, csv: '0,0,1\n', colour: 'red' }, 'colour: unknown field; allowed fields: name, csv, points, walkers, jobs, q, contact_sample, min_step, window, seed'],
      [{ walkers: 1000, seed: 1, csv: '0,0,1\n', window: [0.3, 0.5] }, 'window: [0.3,0.5] is out of range; allowed: two numbers lo, hi with 0 < lo < hi <= 1 and hi >= 2 lo (box sides relative to the set radius R)'],
      [{ walkers: 1000, seed: 1, csv: '0,0,1\n', window: 'wide' }, 'window: "wide" is not allowed; allowed: two numbers lo, hi with 0 < lo < hi <= 1 and hi >= 2 lo (box sides relative to the set radius R)'],
    ];
    // the default job count follows the spec's rule (capped at 4096), so a huge walker count is accepted
    expect(validateProbeRequest({ walkers: 1e10, seed: 1, csv: '0,0,1\n' }).settings.jobs).toBe(4096);
    expect(validateProbeRequest({ walkers: 1000, seed: 1, csv: '0,0,1\n', window: [0.05, 0.5] }).settings.window).toEqual([0.05, 0.5]);
    expect(validateProbeRequest({ walkers: 1000, seed: 1, csv: '0,0,1\n' }).settings.window).toBeNull();
    for (const [body, msg] of cases) {
      const r = await post(body);
      expect(r.statusCode).toBe(400);
      expect(r.json().error).toBe(msg);
    }
    expect((await app.inject({ url: '/probes/nope' })).statusCode).toBe(404);
  });

  it('probes a point set on the farm with the same result as the embedded probe', async () => {
    await startWorker();
    // an L-shaped row of touching disks (our own demo shape)
    const x: number[] = [];
    const y: number[] = [];
    for (let i = 0; i < 40; i++) { x.push(i); y.push(0); }
    for (let i = 1; i < 30; i++) { x.push(0); y.push(i); }
    const body = { name: 'L shape', points: { x, y, r: 0.5 }, walkers: 20000, seed: '123456789', jobs: 4, q: [0, 1, 2, 3], contact_sample: 1000 };
    const r = await app.inject({ method: 'POST', url: '/probes', payload: body, headers: auth });
    expect(r.statusCode).toBe(201);
    const { id } = r.json() as { id: string };
    const done = await waitFor('probe request analysed', async () => {
      const s = await app.inject({ url: `/probes/${id}` });
      const j = s.json();
      return j.state === 'done' ? j : undefined;
    }, 60_000);
    expect(done.jobs).toEqual({ planned: 4, done: 4 });
    const local = await runProbes({ count: x.length, x, y, r: 0.5 }, { walkers: 20000, seed: '123456789', jobs: 4, threads: 1, q: [0, 1, 2, 3], contactSample: 1000 });
    expect(done.measures).toEqual(JSON.parse(JSON.stringify(local.measures)));
    const hits = await app.inject({ url: `/probes/${id}/hits` });
    expect(hits.statusCode).toBe(200);
    const rows = hits.body.trim().split('\n');
    expect(rows[0]).toBe('index,x,y,r,hits,measure');
    expect(rows.slice(1).map((l) => Number(l.split(',')[4]))).toEqual(Array.from(local.counts));
    await new ProbeRequestStore(redis, prefix).purge(id);
  }, 90_000);
});
