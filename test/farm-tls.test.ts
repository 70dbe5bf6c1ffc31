import { execFile, spawn, type ChildProcess } from 'node:child_process';
import { readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CLI, ROOT, freePort, sleep, startWorker, stopWorker, tempDir, waitFor, type WorkerProc } from './farm-helpers.js';

const run = promisify(execFile);

// A test-owned redis-server that speaks only TLS (self-signed certificate
// made with openssl), with a password: the farm commands must work through a
// rediss:// URL. The certificate is trusted through NODE_EXTRA_CA_CERTS, the
// standard Node.js way to add a CA (common practice, no source).
describe('farm over a TLS Redis URL', () => {
  const dir = tempDir('tls');
  const password = 'tls-secret';
  let port = 0;
  let server: ChildProcess | undefined;
  let worker: WorkerProc | undefined;
  let env: NodeJS.ProcessEnv = {};
  let url = '';

  beforeAll(async () => {
    await run('openssl', ['req', '-x509', '-newkey', 'rsa:2048', '-nodes', '-keyout', join(dir, 'key.pem'), '-out', join(dir, 'cert.pem'),
      '-days', '2', '-subj', '/CN=localhost', '-addext', 'subjectAltName=DNS:localhost,IP:127.0.0.1']);
    port = await freePort();
    server = spawn('redis-server', ['--port', '0', '--tls-port', String(port), '--bind', '127.0.0.1', '--tls-cert-file', join(dir, 'cert.pem'),
      '--tls-key-file', join(dir, 'key.pem'), '--tls-ca-cert-file', join(dir, 'cert.pem'), '--tls-auth-clients', 'no',
      '--requirepass', password, '--save', '', '--dir', dir], { stdio: 'ignore' });
    env = { ...process.env, NODE_EXTRA_CA_CERTS: join(dir, 'cert.pem') };
    url = `rediss://:${password}@127.0.0.1:${port}`;
    await waitFor('TLS redis-server', async () => (await cli('list', '--redis', url)).code === 0, 20_000);
  }, 60_000);

  afterAll(async () => {
    await stopWorker(worker);
    server?.kill('SIGTERM');
    await sleep(200);
    rmSync(dir, { recursive: true, force: true });
  });

  async function cli(...args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
    try {
      const r = await run(process.execPath, [CLI, ...args], { cwd: ROOT, env });
      return { code: 0, stdout: r.stdout, stderr: r.stderr };
    } catch (e) {
      const err = e as { code: number; stdout: string; stderr: string };
      return { code: err.code, stdout: err.stdout, stderr: err.stderr };
    }
  }

  it('launches, serves and summarises an ensemble through rediss://', async () => {
    const spec = join(dir, 'tls.json');
    writeFileSync(spec, JSON.stringify({ model: 'dla-offlattice-2d', particles: 300, clusters: 2, seed: 5 }));
    const launched = await cli('launch', spec, '--redis', url);
    expect(launched.code).toBe(0);
    const id = launched.stdout.trim();
    const prev = process.env.NODE_EXTRA_CA_CERTS;
    process.env.NODE_EXTRA_CA_CERTS = env.NODE_EXTRA_CA_CERTS;
    try {
      worker = await startWorker({ redisUrl: url, prefix: 'tendril', artifacts: join(dir, 'artifacts') });
    } finally {
      if (prev === undefined) delete process.env.NODE_EXTRA_CA_CERTS;
      else process.env.NODE_EXTRA_CA_CERTS = prev;
    }
    await waitFor('ensemble done', async () => {
      const s = await cli('status', id, '--redis', url);
      return s.code === 0 && /done|complete|finished/i.test(s.stdout);
    }, 60_000);
    const out = join(dir, 'summary.json');
    const summary = await cli('summary', id, '--format', 'json', '--out', out, '--redis', url);
    expect(summary.code).toBe(0);
    const doc = JSON.parse(readFileSync(out, 'utf8')) as { clusters_done: number; runs: Array<{ run_index: number; state_hash: string }> };
    expect(doc.clusters_done).toBe(2);
    expect(doc.runs.map((r) => r.run_index)).toEqual([0, 1]);
    // without the CA the same URL is refused with one line
    const untrusted = await run(process.execPath, [CLI, 'list', '--redis', url], { cwd: ROOT, env: { ...process.env, NODE_EXTRA_CA_CERTS: '' } }).then(
      () => ({ code: 0, stderr: '' }),
      (e: { code: number; stderr: string }) => e,
    );
    expect(untrusted.code).not.toBe(0);
    expect(untrusted.stderr.trim().split('\n')).toHaveLength(1);
  }, 120_000);
});
