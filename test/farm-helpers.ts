/** Helpers for the farm tests: worker processes, free ports, private redis-servers, key cleanup. */
import { spawn, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Redis } from 'ioredis';

export const ROOT = join(import.meta.dirname, '..');
export const CLI = join(ROOT, 'dist', 'coordinator', 'cli.js');
export const REDIS_URL = process.env.REDIS_URL ?? 'redis://127.0.0.1:6379';

export function uniquePrefix(tag: string): string {
  return `tendril-test-${tag}-${process.pid}-${Math.random().toString(36).slice(2, 8)}`;
}

export function tempDir(tag: string): string {
  return mkdtempSync(join(tmpdir(), `tendril-${tag}-`));
}

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const a = s.address();
      const port = typeof a === 'object' && a ? a.port : 0;
      s.close(() => resolve(port));
    });
  });
}

export interface WorkerProc {
  child: ChildProcess;
  output: () => string;
  exited: Promise<number | null>;
}

export async function startWorker(args: { redisUrl?: string; prefix: string; artifacts: string; concurrency?: number; extra?: string[] }): Promise<WorkerProc> {
  const child = spawn(
    process.execPath,
    [CLI, 'worker', '--redis', args.redisUrl ?? REDIS_URL, '--prefix', args.prefix, '--artifacts', args.artifacts, '--concurrency', String(args.concurrency ?? 1), '--lock-ms', '3000', '--stalled-ms', '1000', '--progress-ms', '200', ...(args.extra ?? [])],
    { stdio: ['ignore', 'pipe', 'pipe'] },
  );
  let out = '';
  child.stdout!.on('data', (d) => (out += d));
  child.stderr!.on('data', (d) => (out += d));
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
  // generous: a loaded machine (many engineers' tests on 2 cores) takes tens of seconds to start a node process
  const deadline = Date.now() + 120_000;
  while (!out.includes('ready:')) {
    if (child.exitCode !== null || Date.now() > deadline) {
      // a worker that never said ready must not live on (it would take jobs and CPU after the test)
      if (child.exitCode === null) child.kill('SIGKILL');
      throw new Error(`worker did not start: ${out}`);
    }
    await sleep(50);
  }
  return { child, output: () => out, exited };
}

export async function stopWorker(w: WorkerProc | undefined, signal: NodeJS.Signals = 'SIGKILL'): Promise<void> {
  if (!w || w.child.exitCode !== null || w.child.signalCode !== null) return;
  w.child.kill(signal);
  await w.exited;
}

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export async function waitFor<T>(what: string, fn: () => Promise<T | undefined | null | false>, timeoutMs = 60_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const v = await fn();
    if (v) return v;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await sleep(100);
  }
}

/** Delete every key under a prefix. */
export async function deleteKeys(redis: Redis, prefix: string): Promise<void> {
  let cursor = '0';
  do {
    const [next, keys] = await redis.scan(cursor, 'MATCH', `${prefix}:*`, 'COUNT', 500);
    cursor = next;
    if (keys.length > 0) await redis.del(...keys);
  } while (cursor !== '0');
}

export interface PrivateRedis {
  port: number;
  url: string;
  dir: string;
  start(): Promise<void>;
  stop(): Promise<void>;
  cleanup(): Promise<void>;
}

/** A redis-server of the test's own, with AOF persistence, on a free port in a temp folder. */
export async function privateRedis(opts: { password?: string } = {}): Promise<PrivateRedis> {
  const port = await freePort();
  const dir = tempDir('redis');
  let child: ChildProcess | undefined;
  const self: PrivateRedis = {
    port,
    dir,
    url: opts.password ? `redis://:${encodeURIComponent(opts.password)}@127.0.0.1:${port}` : `redis://127.0.0.1:${port}`,
    async start() {
      child = spawn('redis-server', ['--port', String(port), '--bind', '127.0.0.1', '--dir', dir, '--appendonly', 'yes', '--appendfsync', 'always', '--save', '', ...(opts.password ? ['--requirepass', opts.password] : [])], { stdio: 'ignore' });
      const r = new Redis(self.url, { lazyConnect: true, maxRetriesPerRequest: 0, retryStrategy: () => null });
      r.on('error', () => undefined);
      await waitFor('redis-server', async () => {
        try {
          if (r.status !== 'ready') await r.connect();
          return (await r.ping()) === 'PONG';
        } catch {
          r.disconnect();
          return false;
        }
      }, 20_000);
      r.disconnect();
    },
    async stop() {
      if (!child || child.exitCode !== null) return;
      const c = child;
      const done = new Promise((r) => c.once('exit', r));
      c.kill('SIGTERM');
      await done;
    },
    async cleanup() {
      await self.stop();
      rmSync(dir, { recursive: true, force: true });
    },
  };
  await self.start();
  return self;
}
