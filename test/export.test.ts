import { runNode } from './support/run-node.js';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import h5wasm from 'h5wasm/node';
import { Redis } from 'ioredis';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DirectoryArtifactStore } from '../coordinator/farm/artifacts.js';
import { finalKey } from '../worker/runtime/job-contract.js';
import { runQueue } from '../coordinator/farm/queue.js';
import { EnsembleStore } from '../coordinator/farm/store.js';
import { buildApi } from '../coordinator/http/server.js';
import { runTaskFor } from '../coordinator/plan.js';
import { decodeSnapshot, encodeSnapshot } from '../coordinator/snapshot/index.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { encodeCheckpoint, growthTaskOf } from '../proto/convert.js';
import { createKernel } from '../worker/models/registry.js';
import { runTask } from '../worker/runtime/task-runner.js';
import { deleteKeys, REDIS_URL, uniquePrefix } from './farm-helpers.js';

// Positions out: a spec with [positions] keeps every cluster's final state;
// `tendril export` writes them as CSV and HDF5 (read back here with h5wasm),
// and the HTTP API serves a run's .snapshot. The reference positions are the
// kernel's own, grown directly (400 particles: milliseconds).

const CLI = join(__dirname, '..', 'dist', 'coordinator', 'cli.js');
const dir = mkdtempSync(join(tmpdir(), 'tendril-export-'));
const cli = (...args: string[]) => runNode([CLI, ...args], { timeout: 120_000 });
const SPEC = { name: 'export test', model: 'dla-offlattice-2d', particles: 400, clusters: 3, seed: 123, positions: { at_sizes: [100] } };

function directPositions(runIndex: number): Float64Array {
  const k = createKernel(growthTaskOf(runTaskFor('x', validateSpec(SPEC), runIndex)));
  k.growTo(400);
  const p = k.positions();
  return p.coords.slice(0, p.count * p.dimension);
}

afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('tendril export', () => {
  beforeAll(async () => {
    writeFileSync(join(dir, 'spec.json'), JSON.stringify(SPEC));
    const r = await cli('run', join(dir, 'spec.json'), '--out', join(dir, 'run'), '--no-report', '--progress', 'none');
    expect(r.status, r.stderr).toBe(0);
  });

  it('writes every cluster to CSV at the spec sizes; the cluster at 100 is the first 100 particles', async () => {
    const r = await cli('export', join(dir, 'run'), '--format', 'csv', '--out', join(dir, 'p.csv'));
    expect(r.status, r.stderr).toBe(0);
    expect(r.stdout).toBe(`wrote ${join(dir, 'p.csv')}: 3 clusters at sizes 100, 400\n`);
    const rows = readFileSync(join(dir, 'p.csv'), 'utf8').trim().split('\n');
    expect(rows[0]).toBe('run_index,size,particle,x,y');
    expect(rows.length).toBe(1 + 3 * (100 + 400));
    const of = (run: number, size: number) => rows.slice(1).map((l) => l.split(',')).filter((c) => c[0] === String(run) && c[1] === String(size));
    const direct = directPositions(1);
    const final = of(1, 400);
    expect(final.map((c) => [Number(c[3]), Number(c[4])]).flat()).toEqual(Array.from(direct));
    expect(of(1, 100).map((c) => c.slice(2))).toEqual(final.slice(0, 100).map((c) => c.slice(2)));
  });

  it('writes HDF5 that h5wasm reads back: one group per run, float64 [N, 2] positions, metadata', async () => {
    const r = await cli('export', join(dir, 'run'), '--format', 'hdf5', '--out', join(dir, 'p.h5'));
    expect(r.status, r.stderr).toBe(0);
    await h5wasm.ready;
    const f = new h5wasm.File(join(dir, 'p.h5'), 'r');
    try {
      expect(f.attrs.format.value).toBe('tendril-positions/1');
      expect(f.attrs.model.value).toBe('dla-offlattice-2d');
      expect(f.attrs.seed.value).toBe('123');
      expect(Array.from(f.attrs.sizes.value as Float64Array)).toEqual([100, 400]);
      const runs = f.get('runs') as InstanceType<typeof h5wasm.Group>;
      expect(runs.keys()).toEqual(['run-000000', 'run-000001', 'run-000002']);
      const summary = JSON.parse(readFileSync(join(dir, 'run', 'summary.json'), 'utf8'));
      for (let i = 0; i < 3; i++) {
        const g = f.get(`runs/run-00000${i}`) as InstanceType<typeof h5wasm.Group>;
        const ds = f.get(`runs/run-00000${i}/positions`) as InstanceType<typeof h5wasm.Dataset>;
        expect(ds.shape).toEqual([400, 2]);
        expect(ds.dtype).toBe('<d');
        expect(Array.from(ds.value as Float64Array)).toEqual(Array.from(directPositions(i)));
        expect(g.attrs.state_hash.value).toBe(summary.runs[i].state_hash);
      }
    } finally {
      f.close();
    }
  });

  it('converts a .snapshot; refuses a run without [positions] and a bad format with one line', async () => {
    const snap = join(dir, 'one.snapshot');
    writeFileSync(snap, encodeSnapshot({ dimension: 2, count: 3, x: new Float64Array([0, 1, 2]), y: new Float64Array([0, 0, 0.5]), diameter: 1 }));
    const r = await cli('export', snap, '--out', join(dir, 'one.csv'));
    expect(r.status, r.stderr).toBe(0);
    expect(readFileSync(join(dir, 'one.csv'), 'utf8')).toBe('run_index,size,particle,x,y\n,3,0,0,0\n,3,1,1,0\n,3,2,2,0.5\n');
    writeFileSync(join(dir, 'plain.json'), JSON.stringify({ ...SPEC, positions: undefined, particles: 50, clusters: 1 }));
    expect((await cli('run', join(dir, 'plain.json'), '--out', join(dir, 'plain'), '--no-report', '--progress', 'none')).status).toBe(0);
    const no = await cli('export', join(dir, 'plain'), '--out', join(dir, 'x.csv'));
    expect(no.status).toBe(2);
    expect(no.stderr).toMatch(/^tendril: source: the spec of ".*plain" has no \[positions\] table, so no positions were kept; allowed: .*\n$/);
    const fmt = await cli('export', snap, '--format', 'xlsx', '--out', join(dir, 'x.xlsx'));
    expect(fmt.stderr).toBe('tendril: --format: "xlsx" is not allowed; allowed: csv, hdf5\n');
  });
});

describe('HTTP snapshot download', () => {
  const prefix = uniquePrefix('snapshot');
  const redis = new Redis(REDIS_URL, { maxRetriesPerRequest: null });
  const store = new EnsembleStore(redis, prefix);
  const queue = runQueue(redis, prefix);
  const artifacts = new DirectoryArtifactStore(join(dir, 'artifacts'));
  const app = buildApi({ store, queue, limits: { maxTotalParticles: 1e9 }, artifacts });
  afterAll(async () => {
    await queue.close();
    await deleteKeys(redis, prefix);
    redis.disconnect();
  });

  it('serves a finished run as a .snapshot (whole or a prefix), and says why when it cannot', async () => {
    const spec = validateSpec(SPEC);
    await store.create('esnap1', spec, 1);
    const out = await runTask(runTaskFor('esnap1', spec, 2));
    if (out.status !== 'done' || !out.final) throw new Error('no final state');
    await artifacts.put(finalKey('esnap1', 2), encodeCheckpoint(out.final));
    const res = await app.inject({ url: '/ensembles/esnap1/runs/2/snapshot' });
    expect(res.statusCode).toBe(200);
    expect(res.headers['content-disposition']).toBe('attachment; filename="esnap1-run-2.snapshot"');
    const set = decodeSnapshot(res.rawPayload);
    expect(set.count).toBe(400);
    const direct = directPositions(2);
    expect(Array.from(set.x.subarray(0, 400))).toEqual(Array.from({ length: 400 }, (_, i) => direct[2 * i]));
    const pre = decodeSnapshot((await app.inject({ url: '/ensembles/esnap1/runs/2/snapshot?size=100' })).rawPayload);
    expect(pre.count).toBe(100);
    expect(Array.from(pre.y.subarray(0, 100))).toEqual(Array.from(set.y.subarray(0, 100)));
    const notYet = await app.inject({ url: '/ensembles/esnap1/runs/1/snapshot' });
    expect([notYet.statusCode, notYet.json().error]).toEqual([404, 'run 1: no positions are kept for it (not finished yet)']);
    const bad = await app.inject({ url: '/ensembles/esnap1/runs/2/snapshot?size=401' });
    expect([bad.statusCode, bad.json().error]).toEqual([400, 'size: "401" is not allowed; allowed: an integer from 1 to 400']);
    await store.create('esnap2', validateSpec({ ...SPEC, positions: undefined }), 1);
    const none = await app.inject({ url: '/ensembles/esnap2/runs/0/snapshot' });
    expect([none.statusCode, none.json().error]).toEqual([404, 'run 0: its ensemble keeps no positions; allowed: ensembles whose spec has a [positions] table']);
  });
});
