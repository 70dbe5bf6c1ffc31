/**
 * Issue #11 item 9: /health is liveness, /ready reports Redis; while Redis
 * is down, Redis-backed routes answer 503 at once (no hang, no request run
 * later); POST /ensembles with an Idempotency-Key never creates a second
 * ensemble, and completes a launch that was cut short.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { InjectOptions, LightMyRequestResponse } from 'fastify';
import { runQueue } from '../coordinator/farm/queue.js';
import { connectRedis, EnsembleStore } from '../coordinator/farm/store.js';
import { idempotentEnsembleId } from '../coordinator/farm/idempotent-launch.js';
import { buildApi } from '../coordinator/http/server.js';
import { planEnsemble } from '../coordinator/plan.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { privateRedis, waitFor, type PrivateRedis } from './farm-helpers.js';

const TOKEN = 'hardening-outage-token';
const auth = { authorization: `Bearer ${TOKEN}` };
const spec = { name: 'outage', model: 'dla-offlattice-2d', particles: 200, clusters: 3, seed: 2 };
let server: PrivateRedis;
let app: ReturnType<typeof buildApi>;
let store: EnsembleStore;
let queue: ReturnType<typeof runQueue>;
let redis: ReturnType<typeof connectRedis>;

beforeAll(async () => {
  server = await privateRedis();
  redis = connectRedis(server.url, { failFast: 1000 });
  redis.on('error', () => undefined);
  await waitFor('redis ready', async () => redis.status === 'ready', 10_000);
  store = new EnsembleStore(redis, 'outage');
  queue = runQueue(redis, 'outage');
  queue.on('error', () => undefined);
  app = buildApi({ store, queue, token: TOKEN, limits: { maxTotalParticles: 1e9 } });
}, 60_000);

afterAll(async () => {
  await app.close();
  await queue.close().catch(() => undefined);
  redis.disconnect();
  await server.cleanup();
});

/** The answer, or 'hang' when none comes within 15 s. */
async function answer(o: InjectOptions): Promise<LightMyRequestResponse | 'hang'> {
  let timer: NodeJS.Timeout | undefined;
  const r = await Promise.race([app.inject(o), new Promise<'hang'>((res) => (timer = setTimeout(() => res('hang'), 15_000)))]);
  clearTimeout(timer);
  return r;
}

describe('Redis down', () => {
  it('/health stays 200, /ready and every Redis-backed route answer 503 with one line', async () => {
    expect((await app.inject({ url: '/ready' })).json()).toEqual({ ok: true, redis: 'ok' });
    await server.stop();
    await waitFor('client sees the outage', async () => redis.status !== 'ready', 10_000);
    expect((await app.inject({ url: '/health' })).statusCode).toBe(200);
    const ready = await answer({ url: '/ready' });
    expect(ready).not.toBe('hang');
    expect((ready as LightMyRequestResponse).statusCode).toBe(503);
    for (const o of [
      { url: '/ensembles' },
      { url: '/ensembles/e123' },
      { url: '/ensembles/e123/summary' },
      { method: 'POST', url: '/ensembles', headers: { ...auth, 'idempotency-key': 'outage-1' }, payload: spec },
      { url: '/probes/p123' },
    ] as InjectOptions[]) {
      const r = await answer(o);
      expect(r, JSON.stringify(o)).not.toBe('hang');
      const res = r as LightMyRequestResponse;
      expect(res.statusCode, o.url as string).toBe(503);
      expect(res.json().error).toMatch(/^redis: unavailable \(.*\); allowed: retry once GET \/ready answers 200$/);
      expect(res.json().error).not.toContain('\n');
    }
  }, 60_000);

  it('after Redis is back, the request refused during the outage created nothing, and a repeat creates exactly one ensemble', async () => {
    await server.start();
    await waitFor('ready again', async () => (await app.inject({ url: '/ready' })).statusCode === 200, 30_000);
    // give a late command the chance to run if one had been queued
    await new Promise((r) => setTimeout(r, 500));
    expect(await store.ids()).toEqual([]);
    const first = await app.inject({ method: 'POST', url: '/ensembles', headers: { ...auth, 'idempotency-key': 'outage-1' }, payload: spec });
    expect(first.statusCode).toBe(201);
    const again = await app.inject({ method: 'POST', url: '/ensembles', headers: { ...auth, 'idempotency-key': 'outage-1' }, payload: spec });
    expect(again.statusCode).toBe(200);
    expect(again.json().id).toBe(first.json().id);
    expect(await store.ids()).toEqual([first.json().id]);
    expect((await queue.getJobCounts('waiting')).waiting).toBe(3);
    const other = await app.inject({ method: 'POST', url: '/ensembles', headers: { ...auth, 'idempotency-key': 'outage-1' }, payload: { ...spec, seed: 3 } });
    expect(other.statusCode).toBe(422);
    expect(other.json().error).toBe('idempotency-key: used before with a different spec; allowed: a new key for a new spec');
    const bad = await app.inject({ method: 'POST', url: '/ensembles', headers: { ...auth, 'idempotency-key': 'has space' }, payload: spec });
    expect(bad.statusCode).toBe(400);
    expect(bad.json().error).toBe('idempotency-key: "has space" is not allowed; allowed: 1 to 128 printable characters without spaces');
  }, 60_000);

  it('a launch cut short (record stored, jobs not queued) is completed by its repeat', async () => {
    const s = validateSpec({ ...spec, seed: 9 });
    const id = idempotentEnsembleId('outage', 'cut-short');
    await store.create(id, s, planEnsemble(id, s).jobs.length);
    const before = (await queue.getJobCounts('waiting')).waiting;
    const r = await app.inject({ method: 'POST', url: '/ensembles', headers: { ...auth, 'idempotency-key': 'cut-short' }, payload: { ...spec, seed: 9 } });
    expect(r.statusCode).toBe(200);
    expect(r.json().id).toBe(id);
    expect((await queue.getJobCounts('waiting')).waiting).toBe(before + 3);
    // and a further repeat queues nothing more
    await app.inject({ method: 'POST', url: '/ensembles', headers: { ...auth, 'idempotency-key': 'cut-short' }, payload: { ...spec, seed: 9 } });
    expect((await queue.getJobCounts('waiting')).waiting).toBe(before + 3);
  }, 60_000);
});
