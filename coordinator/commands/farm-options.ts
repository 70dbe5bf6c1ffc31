/** Options and connections shared by the commands that talk to the farm (Redis). */
import type { Command } from 'commander';
import type { Queue } from 'bullmq';
import type { Redis } from 'ioredis';
import type { EnsembleStore } from '../farm/store.js';
import { DEFAULT_PREFIX } from '../farm/ensemble-status.js';
import type { RedisReader } from '../farm/redis-reader.js';
import { UsageError } from '../usage-error.js';
import { firstLine, messageOf } from '../../proto/errors.js';
// ioredis, BullMQ and the store load only in the commands that open them: `status`, `list` and `watch` read through RedisReader

export interface FarmCliOptions {
  redis?: string;
  prefix?: string;
}

export function addFarmOptions(cmd: Command): Command {
  return cmd
    .option('--redis <url>', 'Redis URL, e.g. redis://:password@host:6379/0 or rediss://... (default: REDIS_URL or redis://127.0.0.1:6379)')
    .option('--prefix <name>', 'key prefix of this farm in Redis (default: TENDRIL_PREFIX or "tendril")');
}

export interface FarmStore {
  redis: Redis;
  store: EnsembleStore;
  prefix: string;
  close(): Promise<void>;
}

export interface Farm extends FarmStore {
  queue: Queue;
}

/** A read-only connection for status, list and watch. */
export interface FarmReader {
  reader: RedisReader;
  prefix: string;
  close(): void;
}

export function farmSettings(o: FarmCliOptions): { url: string; prefix: string } {
  const url = o.redis ?? process.env.REDIS_URL ?? 'redis://127.0.0.1:6379';
  if (!/^rediss?:\/\//.test(url)) throw new UsageError(`--redis: "${url}" is not allowed; allowed: a redis:// or rediss:// URL`);
  const prefix = o.prefix ?? process.env.TENDRIL_PREFIX ?? DEFAULT_PREFIX;
  if (!/^[A-Za-z0-9_.-]{1,64}$/.test(prefix)) throw new UsageError(`--prefix: "${prefix}" is not allowed; allowed: 1 to 64 letters, digits, _ . -`);
  return { url, prefix };
}

function cannotReach(url: string, reason: string): UsageError {
  return new UsageError(`--redis: cannot reach ${url.replace(/\/\/[^@]*@/, '//***@')}: ${reason}`);
}

/** Connect to Redis with ioredis and open the ensemble store, no queue (failing with one line after a few seconds if it does not answer). */
export async function openStore(o: FarmCliOptions, failFastMs?: number): Promise<FarmStore> {
  const { url, prefix } = farmSettings(o);
  const { connectRedis, EnsembleStore } = await import('../farm/store.js');
  const redis = connectRedis(url, { lazy: true, failFast: failFastMs });
  // the connection's own error (a wrong password, an untrusted certificate) says more than "Connection is closed"
  let lastError: Error | undefined;
  redis.on('error', (err: Error) => {
    lastError = err;
  });
  try {
    await Promise.race([
      redis.connect(),
      new Promise((_, reject) => setTimeout(() => reject(new Error('no answer within 5 s')), 5000).unref()),
    ]);
  } catch (err) {
    redis.disconnect();
    throw cannotReach(url, /Connection is closed/.test(messageOf(err)) && lastError ? firstLine(lastError.message) : messageOf(err));
  }
  return { redis, store: new EnsembleStore(redis, prefix), prefix, close: async () => redis.disconnect() };
}

/** The store and the BullMQ queue: the commands that launch, cancel or grow. */
export async function openFarm(o: FarmCliOptions, failFastMs?: number): Promise<Farm> {
  const opened = await openStore(o, failFastMs);
  const { runQueue } = await import('../farm/queue.js');
  const queue = runQueue(opened.redis, opened.prefix);
  return {
    ...opened,
    queue,
    close: async () => {
      await queue.close();
      await opened.close();
    },
  };
}

/** A read-only connection (coordinator/farm/redis-reader.ts), for the commands that only look. */
export async function openReader(o: FarmCliOptions): Promise<FarmReader> {
  const { url, prefix } = farmSettings(o);
  const { RedisReader } = await import('../farm/redis-reader.js');
  try {
    const reader = await RedisReader.open(url);
    return { reader, prefix, close: () => reader.close() };
  } catch (err) {
    throw cannotReach(url, messageOf(err));
  }
}
