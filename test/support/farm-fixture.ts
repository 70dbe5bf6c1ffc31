/**
 * The set-up the farm tests share: a key prefix of their own on the shared
 * Redis (test/farm-helpers.ts uniquePrefix), an artifact folder, the ensemble
 * store and run queue on that prefix, optionally the HTTP API on them, and
 * the worker processes the test starts (the connection is opened when the
 * store, queue or API is first asked for). farmFixture registers an afterAll
 * hook in the file or describe block it is called from, which stops the
 * workers, closes the API and the queue, deletes the prefix's keys,
 * disconnects and removes the artifact folder.
 */
import { rmSync } from 'node:fs';
import type { FastifyInstance } from 'fastify';
import { Redis } from 'ioredis';
import { afterAll } from 'vitest';
import type { EnsembleStatus } from '../../coordinator/farm/ensemble-status.js';
import { runQueue } from '../../coordinator/farm/queue.js';
import { EnsembleStore } from '../../coordinator/farm/store.js';
import { buildApi, type ApiOptions } from '../../coordinator/http/server.js';
import { deleteKeys, REDIS_URL, startWorker, stopWorker, tempDir, uniquePrefix, waitFor, type WorkerProc } from '../farm-helpers.js';

export interface FarmFixture {
  readonly prefix: string;
  /** A fresh temporary folder: the workers' artifact store (or any file the test writes). */
  readonly artifacts: string;
  readonly redis: Redis;
  readonly store: EnsembleStore;
  readonly queue: ReturnType<typeof runQueue>;
  /** The workers started so far (killed after the tests; a test may stop or replace one itself). */
  readonly workers: WorkerProc[];
  /** Start a worker process on this prefix and artifact folder (test/farm-helpers.ts startWorker). */
  startWorker(o?: { concurrency?: number; extra?: string[] }): Promise<WorkerProc>;
  /** The status of ensemble `id` once it is done (waits up to timeoutMs). */
  waitDone(id: string, what?: string, timeoutMs?: number): Promise<EnsembleStatus>;
  /** The HTTP API on this store and queue (closed after the tests). */
  api(o: Omit<ApiOptions, 'store' | 'queue'>): FastifyInstance;
}

export function farmFixture(tag: string): FarmFixture {
  const prefix = uniquePrefix(tag);
  const artifacts = tempDir(`${tag}-artifacts`);
  // the connection, store and queue are made when first used (a describe block whose tests are all filtered out connects to nothing)
  let conn: { redis: Redis; store: EnsembleStore; queue: ReturnType<typeof runQueue> } | undefined;
  const connection = () => {
    if (!conn) {
      const redis = new Redis(REDIS_URL, { maxRetriesPerRequest: null });
      conn = { redis, store: new EnsembleStore(redis, prefix), queue: runQueue(redis, prefix) };
    }
    return conn;
  };
  const workers: WorkerProc[] = [];
  const apps: FastifyInstance[] = [];
  afterAll(async () => {
    for (const w of workers) await stopWorker(w);
    for (const app of apps) await app.close();
    if (conn) {
      await conn.queue.close();
      await deleteKeys(conn.redis, prefix);
      conn.redis.disconnect();
    }
    rmSync(artifacts, { recursive: true, force: true });
  });
  return {
    prefix,
    artifacts,
    get redis() {
      return connection().redis;
    },
    get store() {
      return connection().store;
    },
    get queue() {
      return connection().queue;
    },
    workers,
    async startWorker(o = {}) {
      const w = await startWorker({ prefix, artifacts, ...o });
      workers.push(w);
      return w;
    },
    waitDone(id, what = 'ensemble done', timeoutMs = 60_000) {
      return waitFor(what, async () => {
        const s = await connection().store.status(id);
        return s?.state === 'done' ? s : undefined;
      }, timeoutMs);
    },
    api(o) {
      const { store, queue } = connection();
      const app = buildApi({ store, queue, ...o });
      apps.push(app);
      return app;
    },
  };
}
