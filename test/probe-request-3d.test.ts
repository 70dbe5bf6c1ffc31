/**
 * Probe requests of balls in 3D over HTTP (POST /probes with points.z): a
 * small dla-offlattice-3d cluster, probed by a farm worker on a real Redis
 * through the real fastify API, gives the very measures of the embedded
 * probe (coordinator/harmonic/probe-run.ts runProbes, the path of a [probe]
 * table on a 3D model) with the same set, seed, walkers and jobs; bad 3D
 * requests get one-line errors.
 */
import { describe, expect, it } from 'vitest';
import { ProbeRequestStore, validateProbeRequest } from '../coordinator/farm/probe-requests.js';
import { runProbes } from '../coordinator/harmonic/probe-run.js';
import { createKernel, defaultModelParams } from '../worker/models/registry.js';
import { waitFor } from './farm-helpers.js';
import { farmFixture } from './support/farm-fixture.js';

const TOKEN = 'probe-request-3d-token';
const { prefix, redis, startWorker, api } = farmFixture('probereq3d');
const app = api({ token: TOKEN, limits: { maxTotalParticles: 1e9 } });
const auth = { authorization: `Bearer ${TOKEN}` };

/** Centres of a dla-offlattice-3d cluster of n balls (diameter 1), seed 5. */
function cluster3d(n: number): { x: number[]; y: number[]; z: number[] } {
  const k = createKernel({ model: defaultModelParams('dla-offlattice-3d'), particles: n, ensembleSeed: '5', runIndex: 0, recordsPerDecade: 10 });
  k.growTo(n);
  const p = k.positions();
  const x: number[] = [], y: number[] = [], z: number[] = [];
  for (let i = 0; i < p.count; i++) {
    x.push(p.coords[3 * i]);
    y.push(p.coords[3 * i + 1]);
    z.push(p.coords[3 * i + 2]);
  }
  return { x, y, z };
}

describe('POST /probes with balls in 3D', () => {
  it('refuses bad 3D requests with one line naming the field', async () => {
    const post = async (body: unknown) => app.inject({ method: 'POST', url: '/probes', payload: body as object, headers: auth });
    const cases: Array<[unknown, string]> = [
      [{ walkers: 1000, seed: 1, points: { x: [0, 1], y: [0, 0], z: [0], r: 1 } }, 'points.z: 1 values is not allowed; allowed: as many as points.x (2)'],
      [{ walkers: 1000, seed: 1, points: { x: [0, 1], y: [0, 0], z: 'flat', r: 1 } }, 'points.z: "flat" is not allowed; allowed: an array of as many numbers as points.x (2), for balls in 3D'],
      [{ walkers: 1000, seed: 1, points: { x: [0, 1], y: [0, 0], z: [0, 'a'], r: 1 } }, 'points.z[1]: "a" is not allowed; allowed: a finite number'],
      [{ walkers: 1000, seed: 1, points: { x: [0, 1], y: [0, 0], z: [0, 0], r: [1, 1] } }, 'points.r: [1,1] is not allowed; allowed: one number > 0 for balls (points with z): every ball has the same radius'],
      [{ walkers: 1000, seed: 1, contact_sample: 10, points: { x: [0, 1], y: [0, 0], z: [0, 0], r: 1 } }, 'contact_sample: 10 is not used for balls (points with z); allowed: no contact_sample (3D probes keep no contact points: the Newtonian capacity comes from the share of probes that hit)'],
      // the extent counts the z axis: 10^8 radii along z alone is refused
      [{ walkers: 1000, seed: 1, points: { x: [0, 0], y: [0, 0], z: [0, 2e8], r: 1 } }, 'points: the set spans 1.00e+8 largest contact radii from its middle; allowed: at most 10000000 (coordinates and radii in one unit)'],
    ];
    for (const [body, msg] of cases) {
      const r = await post(body);
      expect(r.statusCode).toBe(400);
      expect(r.json().error).toBe(msg);
    }
    // a valid 3D body is a ball set with one radius and no contact points
    const v = validateProbeRequest({ walkers: 1000, seed: 1, points: { x: [0, 1], y: [0, 0], z: [0, 0], r: 1 } });
    expect(v.set).toMatchObject({ count: 2, radius: 1 });
    expect(v.settings.contactSample).toBe(0);
  });

  it('probes a small 3D DLA cluster on the farm with the measures of the embedded probe', async () => {
    await startWorker();
    const { x, y, z } = cluster3d(60);
    // capture balls of radius = the contact distance (1 diameter), as ensemble probing of dla-offlattice-3d does
    const body = { name: 'tiny 3D DLA', points: { x, y, z, r: 1 }, walkers: 6000, seed: '987654321', jobs: 3, q: [0, 1, 2, 3] };
    const r = await app.inject({ method: 'POST', url: '/probes', payload: body, headers: auth });
    expect(r.statusCode).toBe(201);
    const { id } = r.json() as { id: string };
    const done = await waitFor('3D probe request analysed', async () => {
      const s = await app.inject({ url: `/probes/${id}` });
      const j = s.json();
      return j.state === 'done' || j.state === 'failed' ? j : undefined;
    }, 60_000);
    expect(done.failure).toBeNull();
    expect(done.state).toBe('done');
    expect(done.dimension).toBe(3);
    expect(done.disks).toBe(60);
    expect(done.jobs).toEqual({ planned: 3, done: 3 });
    // the farm and the embedded probe run the same plan (planProbeRun) on the same set: equal bit for bit
    const local = await runProbes({ count: x.length, x: Float64Array.from(x), y: Float64Array.from(y), z: Float64Array.from(z), radius: 1 },
      { walkers: 6000, seed: '987654321', jobs: 3, threads: 1, q: [0, 1, 2, 3], contactSample: 0 });
    expect(done.measures).toEqual(JSON.parse(JSON.stringify(local.measures)));
    const m = done.measures;
    expect(m.dimension).toBe(3);
    expect(m.capacity).toBeNull(); // the logarithmic capacity is planar
    // Newtonian capacity: positive and finite, and between that of one capture ball (1) and that of the ball
    // enclosing every capture ball (capacity is monotone under inclusion and a ball of radius a has capacity a;
    // Kellogg 1929, Foundations of Potential Theory, ch. VI), with three standard errors to spare
    const cap = m.newtonianCapacity;
    expect(Number.isFinite(cap.capacity) && cap.capacity > 0).toBe(true);
    let enclosing = 0;
    const cx = x.reduce((a, b) => a + b) / x.length, cy = y.reduce((a, b) => a + b) / y.length, cz = z.reduce((a, b) => a + b) / z.length;
    for (let i = 0; i < x.length; i++) enclosing = Math.max(enclosing, Math.hypot(x[i] - cx, y[i] - cy, z[i] - cz) + 1);
    expect(cap.capacity).toBeGreaterThan(1 - 3 * cap.error);
    expect(cap.capacity).toBeLessThan(enclosing + 3 * cap.error);
    // per-ball harmonic measure: the hits of the embedded probe, shares that sum to 1 (of the probes that hit)
    const hits = await app.inject({ url: `/probes/${id}/hits` });
    expect(hits.statusCode).toBe(200);
    const rows = hits.body.trim().split('\n');
    expect(rows[0]).toBe('index,x,y,z,r,hits,measure');
    expect(rows.length).toBe(61);
    const cells = rows.slice(1).map((l) => l.split(',').map(Number));
    expect(cells.map((c) => c[5])).toEqual(Array.from(local.counts));
    expect(cells.map((c) => c[3])).toEqual(z);
    const total = cells.reduce((a, c) => a + c[6], 0);
    expect(Math.abs(total - 1)).toBeLessThan(1e-9);
    expect(cells.every((c) => c[4] === 1 && c[6] >= 0)).toBe(true);
    await new ProbeRequestStore(redis, prefix).purge(id);
  }, 150_000);
});
