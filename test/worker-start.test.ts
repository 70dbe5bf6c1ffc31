import { spawn } from 'node:child_process';
import { existsSync, mkdirSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { Redis } from 'ioredis';
import { afterAll, describe, expect, it } from 'vitest';
import { launchEnsemble, runQueue } from '../coordinator/farm/queue.js';
import { EnsembleStore } from '../coordinator/farm/store.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { CLI, deleteKeys, REDIS_URL, tempDir, uniquePrefix } from './farm-helpers.js';

const prefix = uniquePrefix('wstart');
const dir = tempDir('wstart');
const redis = new Redis(REDIS_URL, { maxRetriesPerRequest: null });
const store = new EnsembleStore(redis, prefix);
const queue = runQueue(redis, prefix);

afterAll(async () => {
  await queue.close();
  await deleteKeys(redis, prefix);
  redis.disconnect();
  rmSync(dir, { recursive: true, force: true });
});

function worker(args: string[]): Promise<{ code: number | null; out: string; err: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [CLI, 'worker', '--redis', REDIS_URL, '--prefix', prefix, '--concurrency', '1', '--stalled-ms', '1000', '--progress-ms', '200', ...args], { stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    let err = '';
    child.stdout.on('data', (d) => (out += d));
    child.stderr.on('data', (d) => (err += d));
    child.once('exit', (code) => resolve({ code, out, err }));
  });
}

describe('worker start and idle exit', () => {
  it('refuses an artifact folder it cannot write, with one line and exit code 2', async () => {
    // a path below a regular file cannot be created, even by root (chmod would not stop root)
    const file = join(dir, 'a-file');
    writeFileSync(file, 'x');
    const r = await worker(['--artifacts', join(file, 'artifacts')]);
    expect(r.code).toBe(2);
    const lines = r.err.trim().split('\n');
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(/^tendril: --artifacts: ".*a-file\/artifacts" is not writable by this worker \((ENOTDIR|EEXIST)\); allowed: /);
    expect(r.out).not.toContain('ready:');
  });

  it('removes stale temporary files (only stale ones) and exits by itself when the queue stays empty', async () => {
    const artifacts = join(dir, 'idle-artifacts');
    mkdirSync(join(artifacts, 'ens-1'), { recursive: true });
    const stale = join(artifacts, 'ens-1', 'run-0.checkpoint.abcd1234.tmp');
    const fresh = join(artifacts, 'ens-1', 'run-1.checkpoint.ef567890.tmp');
    const kept = join(artifacts, 'ens-1', 'run-2.checkpoint');
    for (const f of [stale, fresh, kept]) writeFileSync(f, 'x');
    const hourAgo = new Date(Date.now() - 3600_000);
    utimesSync(stale, hourAgo, hourAgo);
    utimesSync(kept, hourAgo, hourAgo);
    const r = await worker(['--artifacts', artifacts, '--exit-when-idle', '1']);
    expect(r.code).toBe(0);
    expect(r.out).toContain('ready:');
    expect(r.err).toContain('removed 1 temporary file(s)');
    expect(r.err).toContain('the run queue had no pending job for 1 s: exiting');
    expect(existsSync(stale)).toBe(false);
    expect(existsSync(fresh)).toBe(true);
    expect(existsSync(kept)).toBe(true);
  });

  it('with work queued, an idle-exiting worker finishes the ensemble first, then exits 0', async () => {
    const spec = validateSpec({ model: 'dla-offlattice-2d', particles: 3000, clusters: 3, seed: 5, runs_per_job: 1 });
    const id = await launchEnsemble(store, queue, spec);
    const r = await worker(['--artifacts', join(dir, 'work-artifacts'), '--exit-when-idle', '2']);
    expect(r.code).toBe(0);
    const s = await store.status(id);
    expect(s?.state).toBe('done');
    expect(s?.runs.done).toBe(3);
  });
});
