/** Options and connections shared by the commands that talk to the farm (Redis). */
import type { Command } from 'commander';
import type { Queue } from 'bullmq';
import type { Redis } from 'ioredis';
import { connectRedis, DEFAULT_PREFIX, EnsembleStore } from '../farm/store.js';
import { UsageError } from '../usage-error.js';
import { firstLine, messageOf } from '../../proto/errors.js';

export interface FarmCliOptions {
  redis?: string;
  prefix?: string;
}

export function addFarmOptions(cmd: Command): Command {
  return cmd
    .option('--redis <url>', 'Redis URL, e.g. redis://:password@host:6379/0 or rediss://... (default: REDIS_URL or redis://127.0.0.1:6379)')
    .option('--prefix <name>', 'key prefix of this farm in Redis (default: TENDRIL_PREFIX or "tendril")');
}

export interface Farm {
  redis: Redis;
  store: EnsembleStore;
  queue: Queue;
  prefix: string;
  close(): Promise<void>;
}

export function farmSettings(o: FarmCliOptions): { url: string; prefix: string } {
  const url = o.redis ?? process.env.REDIS_URL ?? 'redis://127.0.0.1:6379';
  if (!/^rediss?:\/\//.test(url)) throw new UsageError(`--redis: "${url}" is not allowed; allowed: a redis:// or rediss:// URL`);
  const prefix = o.prefix ?? process.env.TENDRIL_PREFIX ?? DEFAULT_PREFIX;
  if (!/^[A-Za-z0-9_.-]{1,64}$/.test(prefix)) throw new UsageError(`--prefix: "${prefix}" is not allowed; allowed: 1 to 64 letters, digits, _ . -`);
  return { url, prefix };
}

/** Connect to Redis (failing with one line after a few seconds if it does not answer). */
export async function openFarm(o: FarmCliOptions, failFastMs?: number): Promise<Farm> {
  const { url, prefix } = farmSettings(o);
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
    const reason = /Connection is closed/.test(messageOf(err)) && lastError ? firstLine(lastError.message) : messageOf(err);
    throw new UsageError(`--redis: cannot reach ${url.replace(/\/\/[^@]*@/, '//***@')}: ${reason}`);
  }
  const store = new EnsembleStore(redis, prefix);
  const { runQueue } = await import('../farm/queue.js');
  const queue = runQueue(redis, prefix);
  return {
    redis,
    store,
    queue,
    prefix,
    close: async () => {
      await queue.close();
      redis.disconnect();
    },
  };
}
