import { execFile } from 'node:child_process';
import { existsSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { describe, expect, it } from 'vitest';
import { checkpointKey } from '../worker/runtime/job-contract.js';
import { CLI, REDIS_URL, ROOT, startWorker, waitFor } from './farm-helpers.js';
import { farmFixture } from './support/farm-fixture.js';

const run = promisify(execFile);

// The time-based checkpoint trigger: with checkpoint_interval_seconds = 1, a
// run that lasts several seconds leaves a checkpoint in the artifact folder
// while it is still running (the particle-count trigger is off).
describe('checkpoints every few seconds', () => {
  const { prefix, artifacts: dir, redis, workers } = farmFixture('ckpt-interval');

  it('a long run is checkpointed by time before it finishes', async () => {
    const spec = join(dir, 'long.json');
    writeFileSync(spec, JSON.stringify({ model: 'dla-offlattice-2d', particles: 3_000_000, clusters: 1, seed: 9, checkpoint_interval_seconds: 1 }));
    const launched = await run(process.execPath, [CLI, 'launch', spec, '--redis', REDIS_URL, '--prefix', prefix], { cwd: ROOT });
    const id = launched.stdout.trim();
    const artifacts = join(dir, 'artifacts');
    workers.push(await startWorker({ prefix, artifacts }));
    const file = join(artifacts, checkpointKey(id, 0));
    await waitFor('a time-based checkpoint', async () => existsSync(file), 30_000);
    // still running: the result is not stored yet
    expect(await redis.hlen(`${prefix}:ensemble:${id}:results`)).toBe(0);
    await run(process.execPath, [CLI, 'cancel', id, '--redis', REDIS_URL, '--prefix', prefix], { cwd: ROOT });
  }, 90_000);
});
