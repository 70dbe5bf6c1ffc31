/**
 * Issue #11 item 5: the CLI never exits before its output is flushed. A
 * summary of ~200 KB piped into a reader that starts late (so the pipe's
 * 64 KiB buffer fills) must arrive whole.
 */
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import { Redis } from 'ioredis';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EnsembleStore } from '../coordinator/farm/store.js';
import { launchEnsemble, runQueue } from '../coordinator/farm/queue.js';
import { runTaskFor } from '../coordinator/plan.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { encodeRunResult } from '../proto/convert.js';
import { runTask } from '../worker/runtime/task-runner.js';
import { CLI, deleteKeys, REDIS_URL, ROOT, uniquePrefix } from './farm-helpers.js';

const sh = promisify(execFile);
const prefix = uniquePrefix('flush');
const redis = new Redis(REDIS_URL, { maxRetriesPerRequest: null });
const store = new EnsembleStore(redis, prefix);
const queue = runQueue(redis, prefix);
let id = '';

beforeAll(async () => {
  const spec = validateSpec({ model: 'dla-offlattice-2d', particles: 300, clusters: 40, seed: 4, analysis: { resamples: 200 } });
  id = await launchEnsemble(store, queue, spec);
  for (let i = 0; i < spec.clusters; i++) {
    const o = await runTask(runTaskFor(id, spec, i));
    if (o.status === 'done') await store.saveResult(o.result, encodeRunResult(o.result));
  }
}, 120_000);

afterAll(async () => {
  await queue.close();
  await deleteKeys(redis, prefix);
  redis.disconnect();
});

/** Run the CLI with its stdout piped into a reader that waits a second before reading. */
async function throughSlowPipe(args: string[]): Promise<string> {
  const quoted = args.map((a) => `'${a}'`).join(' ');
  const r = await sh('sh', ['-c', `'${process.execPath}' '${CLI}' ${quoted} | (sleep 1; cat)`], { cwd: ROOT, env: { ...process.env, REDIS_URL }, maxBuffer: 64 << 20 });
  return r.stdout;
}

describe('CLI output through a pipe', () => {
  it('tendril summary --format json | slow reader delivers the whole document', async () => {
    const out = await throughSlowPipe(['summary', id, '--prefix', prefix, '--format', 'json']);
    expect(out.length).toBeGreaterThan(131_072);
    const doc = JSON.parse(out);
    expect(doc.clusters_done).toBe(40);
  }, 120_000);

  it('tendril summary --format csv --table series | slow reader delivers every row', async () => {
    const out = await throughSlowPipe(['summary', id, '--prefix', prefix, '--format', 'csv', '--table', 'series']);
    expect(out.length).toBeGreaterThan(65_536);
    expect(out.endsWith('\n')).toBe(true);
    const rows = out.trim().split('\n');
    const width = rows[0].split(',').length;
    expect(rows.every((r) => r.split(',').length === width)).toBe(true);
    expect(new Set(rows.slice(1).map((r) => r.split(',')[0])).size).toBe(40);
  }, 120_000);
});
