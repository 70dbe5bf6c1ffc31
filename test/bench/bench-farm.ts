/**
 * The farm a benchmark runs its workers on: a Redis key prefix of its own,
 * the ensemble store and run queue under it, and a temporary artifact
 * folder; `close()` removes all of them (every key under the prefix, the
 * folder) and disconnects.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Redis } from 'ioredis';
import { runQueue } from '../../coordinator/farm/queue.js';
import { EnsembleStore } from '../../coordinator/farm/store.js';

export interface BenchFarm {
  prefix: string;
  artifacts: string;
  redis: Redis;
  store: EnsembleStore;
  queue: ReturnType<typeof runQueue>;
  close(): Promise<void>;
}

/** `name` tags the prefix (tendril-bench-NAME-PID-TIME) and the folder (tendril-bench-NAME-…). */
export function openBenchFarm(redisUrl: string, name: string): BenchFarm {
  const prefix = `tendril-bench-${name}-${process.pid}-${Date.now().toString(36)}`;
  const artifacts = mkdtempSync(join(tmpdir(), `tendril-bench-${name}-`));
  const redis = new Redis(redisUrl, { maxRetriesPerRequest: null });
  const store = new EnsembleStore(redis, prefix);
  const queue = runQueue(redis, prefix);
  const close = async (): Promise<void> => {
    await queue.close();
    let cursor = '0';
    do {
      const [next, keys] = await redis.scan(cursor, 'MATCH', `${prefix}:*`, 'COUNT', 500);
      cursor = next;
      if (keys.length) await redis.del(...keys);
    } while (cursor !== '0');
    redis.disconnect();
    rmSync(artifacts, { recursive: true, force: true });
  };
  return { prefix, artifacts, redis, store, queue, close };
}
