/**
 * The farm across hosts, simulated with network namespaces the test creates
 * itself: Redis and the coordinator (`tendril serve`) in one namespace, two
 * workers in two others, each joined to the hub by its own veth pair and
 * addresses; the test reaches the hub by a third pair. Mid-ensemble worker A's
 * link goes down for longer than the queue lock; its runs must be taken over
 * by worker B, A's late results (stored once its link is back) must not be
 * counted twice, nothing may be lost, and every per-run hash must equal the
 * embedded mode's. Traffic stays inside the namespaces made here; all of them
 * (and so their links) are deleted at the end.
 * Skipped, with the reason printed, when not root or `ip netns` cannot be used.
 */
import { execFileSync, spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { rmSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { Redis } from 'ioredis';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runEmbedded } from '../coordinator/embedded/index.js';
import { EnsembleStore } from '../coordinator/farm/store.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { CLI, sleep, tempDir, waitFor } from './farm-helpers.js';

const tag = randomBytes(2).toString('hex');
const NS = { hub: `tdl${tag}hub`, a: `tdl${tag}a`, b: `tdl${tag}b` };
// third octet from the tag so that two runs at once do not collide; /30 links
const net = 100 + (parseInt(tag, 16) % 100);
const ADDR = { hubA: `10.231.${net}.1`, a: `10.231.${net}.2`, hubB: `10.231.${net}.5`, b: `10.231.${net}.6`, host: `10.231.${net}.9`, hubHost: `10.231.${net}.10` };
const REDIS_PORT = 6390;
const API_PORT = 8740;
const TOKEN = `netns-test-token-${randomBytes(8).toString('hex')}`;
const PREFIX = 'tendril-netns';
const LOCK_MS = 3000;
const artifacts = tempDir('netns-artifacts');
const redisDir = tempDir('netns-redis');
const procs: ChildProcess[] = [];
let skipReason: string | undefined;
let made = false;
let redis: Redis | undefined;

function ip(...args: string[]): void {
  execFileSync('ip', args, { stdio: ['ignore', 'ignore', 'pipe'] });
}

function inNs(ns: string, cmd: string, args: string[], env: NodeJS.ProcessEnv = process.env): { child: ChildProcess; output: () => string; exited: Promise<number | null> } {
  const child = spawn('ip', ['netns', 'exec', ns, cmd, ...args], { env, stdio: ['ignore', 'pipe', 'pipe'] });
  let out = '';
  child.stdout!.on('data', (d) => (out += d));
  child.stderr!.on('data', (d) => (out += d));
  procs.push(child);
  return { child, output: () => out, exited: new Promise((r) => child.once('exit', (c) => r(c))) };
}

function setUpNetwork(): void {
  for (const ns of Object.values(NS)) {
    ip('netns', 'add', ns);
    ip('-n', ns, 'link', 'set', 'lo', 'up');
  }
  made = true;
  const pair = (hubEnd: string, hubAddr: string, otherEnd: string, otherNs: string | null, otherAddr: string) => {
    ip('link', 'add', hubEnd, 'type', 'veth', 'peer', 'name', otherEnd);
    ip('link', 'set', hubEnd, 'netns', NS.hub);
    ip('-n', NS.hub, 'addr', 'add', `${hubAddr}/30`, 'dev', hubEnd);
    ip('-n', NS.hub, 'link', 'set', hubEnd, 'up');
    if (otherNs) {
      ip('link', 'set', otherEnd, 'netns', otherNs);
      ip('-n', otherNs, 'addr', 'add', `${otherAddr}/30`, 'dev', otherEnd);
      ip('-n', otherNs, 'link', 'set', otherEnd, 'up');
    } else {
      ip('addr', 'add', `${otherAddr}/30`, 'dev', otherEnd);
      ip('link', 'set', otherEnd, 'up');
    }
  };
  pair(`tdl${tag}ha`, ADDR.hubA, `tdl${tag}a`, NS.a, ADDR.a);
  pair(`tdl${tag}hb`, ADDR.hubB, `tdl${tag}b`, NS.b, ADDR.b);
  pair(`tdl${tag}hh`, ADDR.hubHost, `tdl${tag}h`, null, ADDR.host);
}

beforeAll(async () => {
  if (process.getuid?.() !== 0) skipReason = 'network namespaces need root; this process is not root';
  else if (spawnSync('sh', ['-c', 'command -v ip && command -v redis-server'], { stdio: 'ignore' }).status !== 0) skipReason = '`ip` (iproute2) or redis-server is not on PATH';
  else {
    try {
      setUpNetwork();
    } catch (err) {
      skipReason = `cannot create network namespaces here: ${((err as { stderr?: Buffer }).stderr?.toString() || (err as Error).message).trim().split('\n')[0]}`;
    }
  }
  if (skipReason) return;
  inNs(NS.hub, 'redis-server', ['--port', String(REDIS_PORT), '--bind', '127.0.0.1', ADDR.hubA, ADDR.hubB, ADDR.hubHost, '--save', '', '--appendonly', 'no', '--dir', redisDir, '--protected-mode', 'no']);
  redis = new Redis(`redis://${ADDR.hubHost}:${REDIS_PORT}`, { maxRetriesPerRequest: null, lazyConnect: true });
  redis.on('error', () => undefined);
  await waitFor('redis in the hub namespace', async () => {
    try {
      if (redis!.status !== 'ready') await redis!.connect().catch(() => undefined);
      return (await redis!.ping()) === 'PONG';
    } catch {
      return false;
    }
  }, 20_000);
  const serve = inNs(NS.hub, process.execPath, [CLI, 'serve', '--host', ADDR.hubHost, '--port', String(API_PORT), '--redis', `redis://127.0.0.1:${REDIS_PORT}`, '--prefix', PREFIX], { ...process.env, TENDRIL_API_TOKEN: TOKEN });
  await waitFor('coordinator', async () => serve.output().includes('serving on'), 30_000);
});

afterAll(async () => {
  redis?.disconnect();
  for (const p of procs.reverse()) {
    if (p.exitCode !== null || p.signalCode !== null) continue;
    const gone = new Promise((r) => p.once('exit', r));
    p.kill('SIGKILL');
    await gone;
  }
  if (made) for (const ns of Object.values(NS)) spawnSync('ip', ['netns', 'del', ns], { stdio: 'ignore' });
  rmSync(artifacts, { recursive: true, force: true });
  rmSync(redisDir, { recursive: true, force: true });
});

function worker(ns: string, hubAddr: string, concurrency: number) {
  const w = inNs(ns, process.execPath, [CLI, 'worker', '--redis', `redis://${hubAddr}:${REDIS_PORT}`, '--prefix', PREFIX, '--artifacts', artifacts, '--concurrency', String(concurrency), '--lock-ms', String(LOCK_MS), '--stalled-ms', '1000', '--progress-ms', '200']);
  return { ...w, id: async () => `${(await waitFor('worker ready', async () => /worker (\S+) ready:/.exec(w.output())?.[1], 30_000))}` };
}

describe('farm across network namespaces', () => {
  it('a worker cut off for longer than the lock: its runs are taken over, its late results are not counted twice, nothing is lost, hashes equal embedded', async (ctx) => {
    if (skipReason || !redis) {
      console.warn(`farm-netns test skipped: ${skipReason}`);
      ctx.skip();
      return;
    }
    const particles = 400_000;
    const doc = { name: 'netns', model: 'dla-offlattice-2d', particles, clusters: 3, seed: '1618', runs_per_job: 1, checkpoint_every_particles: 20_000 };
    const spec = validateSpec(doc);
    const api = `http://${ADDR.hubHost}:${API_PORT}`;
    const created = await fetch(`${api}/ensembles`, { method: 'POST', headers: { 'content-type': 'application/json', authorization: `Bearer ${TOKEN}` }, body: JSON.stringify(doc) });
    expect(created.status).toBe(201);
    const { id } = (await created.json()) as { id: string };
    const store = new EnsembleStore(redis, PREFIX);
    const running = () => redis!.hgetall(`${PREFIX}:ensemble:${id}:running`);

    // A takes runs 0 and 1; then B (with a free slot) takes run 2
    const a = worker(NS.a, ADDR.hubA, 2);
    const aId = await a.id();
    await waitFor('A holds two runs', async () => Object.values(await running()).filter((w) => w === aId).length === 2, 60_000);
    const b = worker(NS.b, ADDR.hubB, 2);
    const bId = await b.id();
    await waitFor('B holds a run', async () => Object.values(await running()).includes(bId), 60_000);
    const held = Object.entries(await running()).filter(([, w]) => w === aId).map(([i]) => Number(i));
    expect(held).toHaveLength(2);
    await waitFor('a checkpoint of a run of A', async () => {
      const p = await redis!.hgetall(`${PREFIX}:ensemble:${id}:progress`);
      return held.some((i) => Number(p[String(i)] ?? 0) > 20_000);
    }, 60_000);

    // cut A's link (its end and the hub's end) for longer than the lock, until B has taken a run of A over
    const t0 = Date.now();
    ip('-n', NS.a, 'link', 'set', `tdl${tag}a`, 'down');
    ip('-n', NS.hub, 'link', 'set', `tdl${tag}ha`, 'down');
    const takenOver = await waitFor('B takes over a run of A', async () => {
      const r = await running();
      return held.find((i) => r[String(i)] === bId) ?? null;
    }, 120_000).catch((err: Error) => err);
    while (Date.now() - t0 < 2 * LOCK_MS) await sleep(100);
    const downMs = Date.now() - t0;
    ip('-n', NS.hub, 'link', 'set', `tdl${tag}ha`, 'up');
    ip('-n', NS.a, 'link', 'set', `tdl${tag}a`, 'up');
    expect(takenOver).not.toBeInstanceOf(Error);
    expect(downMs).toBeGreaterThan(LOCK_MS);

    const done = await waitFor('ensemble done', async () => {
      const st = await store.status(id);
      return st?.state === 'done' ? st : undefined;
    }, 600_000);
    // A is back: give its late writes (result, progress) time to arrive, then look again
    await waitFor('A reconnected', async () => String(await redis!.client('LIST')).includes(`addr=${ADDR.a}:`), 60_000);
    await sleep(3000);
    const after = (await store.status(id))!;
    for (const s of [done, after]) {
      expect(s.runs).toEqual({ planned: 3, queued: 0, running: 0, done: 3, failed: 0 });
      expect(s.particles.done).toBe(3 * particles); // each run counted once
    }
    const farm = await store.results(id);
    expect(farm.map((r) => r.runIndex)).toEqual([0, 1, 2]);
    expect(await redis.hlen(`${PREFIX}:ensemble:${id}:results`)).toBe(3);
    const local = await runEmbedded(spec, { ensembleId: 'local', threads: 1 });
    expect(farm.map((r) => r.stateHash)).toEqual(local.results.map((r) => r.stateHash));
    // the summary through the coordinator's API counts three clusters
    const summary = (await (await fetch(`${api}/ensembles/${id}/summary?format=json`)).json()) as { clusters_done?: number };
    expect(summary.clusters_done).toBe(3);
    expect(a.child.exitCode).toBeNull(); // the cut-off worker survived the outage
  });
});
