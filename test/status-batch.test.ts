/**
 * Issue #11 item 10: /metrics, GET /ensembles and `tendril list` read the
 * statuses of many ensembles in a bounded number of Redis round trips
 * (EnsembleReader.statuses, coordinator/farm/ensemble-status.ts: every read of
 * every ensemble pipelined at once, then one pipelined round for the
 * running marks), where they used to make round trips per ensemble. Checked
 * on a real redis-server of the test's own: the statuses equal what each
 * ensemble's contents imply, and a client that counts round trips (a command
 * sent while none waits for its reply starts one) sees three per scrape, for
 * 10 ensembles as for 60.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Redis } from 'ioredis';
import { EnsembleStore, STALE_RUN_MS } from '../coordinator/farm/store.js';
import { runQueue } from '../coordinator/farm/queue.js';
import { coordinatorMetrics, newRegistry } from '../coordinator/metrics/index.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { privateRedis, type PrivateRedis } from './farm-helpers.js';

const PLANNED = 10;

/** What ensemble i holds, by construction (see fill). */
function expectedRuns(i: number): { planned: number; queued: number; running: number; done: number; failed: number; cancelled: boolean } {
  const done = i % 5;
  const running = i % 3; // fresh marks on runs without results
  const failed = i % 4 === 0 ? 1 : 0;
  const cancelled = i % 11 === 10;
  // the stale mark (i % 7 === 0) and the mark beside a stored result (odd i) do not count as running
  return { planned: PLANNED, queued: cancelled ? 0 : PLANNED - done - running - failed, running, done, failed, cancelled };
}

async function fill(store: EnsembleStore, redis: Redis, prefix: string, i: number): Promise<string> {
  const id = `e${String(i).padStart(3, '0')}`;
  const spec = validateSpec({ name: id, model: 'dla-offlattice-2d', particles: 100, clusters: PLANNED, seed: i + 1 });
  await store.create(id, spec, PLANNED, Date.now() - 1000 * i);
  await redis.zadd(`${prefix}:ensembles`, Date.now() + i, id);
  const k = (part: string) => `${prefix}:ensemble:${id}:${part}`;
  const e = expectedRuns(i);
  for (let r = 0; r < e.done; r++) await redis.hset(k('results'), String(r), Buffer.from([1, 2, 3]));
  for (let r = 0; r < e.running; r++) {
    await store.runStarted(id, 5 + r, 'w1');
    await store.progress(id, 5 + r, 40, 40);
  }
  if (e.failed) await store.runFailed(id, 9, 'boom');
  if (i % 7 === 0) {
    await redis.hset(k('running'), '8', 'gone');
    await redis.hset(k('seen'), '8', String(Date.now() - STALE_RUN_MS - 5000));
  }
  // a mark left beside a stored result (a late write): never running
  if (i % 2 === 1 && e.done > 0) await redis.hset(k('running'), '0', 'late');
  if (e.cancelled) await store.cancel(id);
  return id;
}

/**
 * A client that counts round trips: a command sent while no other is
 * waiting for its reply starts a new one (pipelined commands share it).
 * Reads go through it; everything else passes straight to the client.
 */
function countingClient(redis: Redis): { client: Redis; counts: { trips: number; commands: number } } {
  const counts = { trips: 0, commands: 0 };
  let inFlight = 0;
  const counted = new Set(['hgetall', 'hlen', 'hmget', 'zrevrange', 'hgetallBuffer']);
  const client = new Proxy(redis, {
    get(target, prop) {
      const v = Reflect.get(target, prop, target) as unknown;
      if (typeof v !== 'function') return v;
      if (!counted.has(String(prop))) return (v as (...a: unknown[]) => unknown).bind(target);
      return (...args: unknown[]) => {
        if (inFlight === 0) counts.trips++;
        inFlight++;
        counts.commands++;
        return ((v as (...a: unknown[]) => Promise<unknown>).apply(target, args)).finally(() => inFlight--);
      };
    },
  });
  return { client, counts };
}

describe('ensemble statuses in bounded Redis round trips', () => {
  let server: PrivateRedis;
  let redis: Redis;
  const prefix = 'batch';
  beforeAll(async () => {
    server = await privateRedis();
    redis = new Redis(server.url, { maxRetriesPerRequest: null });
  }, 30_000);
  afterAll(async () => {
    redis?.disconnect();
    await server?.cleanup();
  });

  it('statuses of 60 ensembles equal their contents, one by one and all at once, and /metrics sums them', async () => {
    const store = new EnsembleStore(redis, prefix);
    const ids: string[] = [];
    for (let i = 0; i < 60; i++) ids.push(await fill(store, redis, prefix, i));
    const all = await store.statuses([...ids, 'unknown']);
    expect(all[60]).toBeNull();
    for (let i = 0; i < 60; i++) {
      const e = expectedRuns(i);
      const s = all[i]!;
      expect(s.id).toBe(ids[i]);
      expect(s.runs).toEqual({ planned: e.planned, queued: e.queued, running: e.running, done: e.done, failed: e.failed });
      expect(s.state).toBe(e.cancelled ? 'cancelled' : 'running');
      expect(s.particles.done).toBe(e.done * 100 + e.running * 40);
      // the single-ensemble path gives the same answer (throughput aside, which depends on the clock)
      const one = await store.status(ids[i], Date.now());
      expect({ ...one!, throughput: 0, etaSeconds: null }).toEqual({ ...s, throughput: 0, etaSeconds: null });
    }
    const recent = await store.recentStatuses(100);
    expect(recent.map((s) => s.id)).toEqual([...ids].reverse());

    const registry = newRegistry(false);
    const queue = runQueue(redis, prefix);
    try {
      coordinatorMetrics(registry, store, queue);
      const text = await registry.metrics();
      const sum = (f: (e: ReturnType<typeof expectedRuns>) => number) => ids.reduce((t, _, i) => t + f(expectedRuns(i)), 0);
      for (const state of ['queued', 'running', 'done', 'failed'] as const) {
        expect(text).toContain(`tendril_runs{state="${state}"} ${sum((e) => e[state])}`);
      }
    } finally {
      await queue.close();
    }
  }, 60_000);

  it('a scrape waits for the same three round trips for 10 ensembles as for 60', async () => {
    const trips: number[] = [];
    for (const n of [10, 60]) {
      const p = `trips${n}`;
      const filler = new EnsembleStore(redis, p);
      for (let i = 0; i < n; i++) await fill(filler, redis, p, i);
      const { client, counts } = countingClient(redis);
      const store = new EnsembleStore(client, p);
      const registry = newRegistry(false);
      // the queue on a connection of its own, so only the store's reads are counted
      const queueConn = new Redis(server.url, { maxRetriesPerRequest: null });
      const queue = runQueue(queueConn, p);
      try {
        coordinatorMetrics(registry, store, queue);
        await registry.metrics();
        // ZREVRANGE for the ids, every hash of every ensemble at once, the running marks at once
        expect(counts.trips).toBe(3);
        // and every ensemble was read (9 reads each in the second round)
        expect(counts.commands).toBeGreaterThan(9 * n);
        trips.push(counts.trips);
        counts.trips = 0;
        expect((await store.recentStatuses(100)).length).toBe(n);
        expect(counts.trips).toBe(3);
      } finally {
        await queue.close();
        queueConn.disconnect();
      }
    }
    expect(trips[1]).toBe(trips[0]);
  }, 60_000);
});
