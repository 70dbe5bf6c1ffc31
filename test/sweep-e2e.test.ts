/**
 * Sweeps end to end: `tendril run` of a sweep spec (embedded), and the same
 * sweep on the farm with real Redis, launched by `tendril launch` and by POST
 * /ensembles, grown by a worker process: identical member results (state
 * hashes) and identical sweep tables. A member is an ordinary ensemble: its
 * runs equal those of a single spec with the member's seed.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { chromium } from 'playwright-core';
import { join } from 'node:path';
import { Redis } from 'ioredis';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runEmbedded } from '../coordinator/embedded/index.js';
import { runQueue } from '../coordinator/farm/queue.js';
import { EnsembleStore } from '../coordinator/farm/store.js';
import { buildApi } from '../coordinator/http/server.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { memberSeed, validateLaunch } from '../coordinator/spec/sweep.js';
import type { SweepSummary } from '../coordinator/summary/sweep-summary.js';
import { CLI, deleteKeys, REDIS_URL, startWorker, stopWorker, tempDir, uniquePrefix, waitFor, type WorkerProc } from './farm-helpers.js';

const TOKEN = 'sweep-test-token-0123456789';
const prefix = uniquePrefix('sweep');
const artifacts = tempDir('sweep-artifacts');
const out = tempDir('sweep-run');
const redis = new Redis(REDIS_URL, { maxRetriesPerRequest: null });
const store = new EnsembleStore(redis, prefix);
const queue = runQueue(redis, prefix);
const app = buildApi({ store, queue, token: TOKEN, limits: { maxTotalParticles: 1e9 } });
let worker: WorkerProc | undefined;
let httpSweep = '';
const CHROMIUM = '/usr/bin/chromium';

const doc = { name: 'nr sweep', model: 'dla-square', particles: 300, clusters: 6, seed: '20261203', params: { noise_reduction: [1, 2, 3] }, analysis: { resamples: 200 } };

afterAll(async () => {
  await stopWorker(worker);
  await app.close();
  await queue.close();
  await deleteKeys(redis, prefix);
  redis.disconnect();
  for (const d of [artifacts, out]) rmSync(d, { recursive: true, force: true });
});

function cli(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const r = spawnSync(process.execPath, [CLI, ...args], { encoding: 'utf8', timeout: 120_000 });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** What must agree between two summaries of the same sweep: everything but the ids. */
function comparable(s: SweepSummary): unknown {
  return { ...s, sweepId: '', rows: s.rows.map((r) => ({ ...r, ensembleId: '' })) };
}

let embedded: SweepSummary;
const embeddedHashes: string[][] = [];

describe('embedded sweep (tendril run)', () => {
  it('grows one ensemble per value into its own folder and writes the sweep table, CSV and report', () => {
    const specPath = join(out, 'sweep.json');
    writeFileSync(specPath, JSON.stringify(doc));
    const r = cli('run', specPath, '--out', join(out, 'run'), '--threads', '2', '--progress', 'none');
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/sweep over noise_reduction \(3 values\)/);
    expect(r.stdout).toMatch(/noise_reduction = 2: 6 clusters: R_g \d\.\d{4} \[/);
    embedded = JSON.parse(readFileSync(join(out, 'run', 'sweep.json'), 'utf8')) as SweepSummary;
    expect(embedded.values).toEqual([1, 2, 3]);
    expect(embedded.breakdown).toBeNull();
    expect(readFileSync(join(out, 'run', 'sweep.csv'), 'utf8').trim().split('\n')).toHaveLength(4);
    expect(readFileSync(join(out, 'run', 'report.html'), 'utf8')).toContain('figure-sweep-dimension');
    for (const v of [1, 2, 3]) {
      const s = JSON.parse(readFileSync(join(out, 'run', `noise_reduction-${v}`, 'summary.json'), 'utf8')) as { spec: { params: Record<string, number>; seed: string }; runs: Array<{ state_hash: string }> };
      expect(s.spec.params.noise_reduction).toBe(v);
      expect(s.spec.seed).toBe(memberSeed('20261203', v - 1));
      embeddedHashes.push(s.runs.map((x) => x.state_hash));
    }
    // members draw different streams
    expect(new Set(embeddedHashes.flat()).size).toBe(18);
  });

  it('a member equals a single ensemble of the same spec and seed (same hashes)', async () => {
    const l = validateLaunch(doc);
    if (l.kind !== 'sweep') throw new Error('not a sweep');
    const single = validateSpec({ ...doc, name: 'single', seed: memberSeed(doc.seed, 1), params: { noise_reduction: 2 } });
    const got = await runEmbedded(single, { ensembleId: 'single', threads: 2 });
    expect(got.results.map((r) => r.stateHash)).toEqual(embeddedHashes[1]);
  });

  it('running the same command again reuses every member', () => {
    const specPath = join(out, 'again.json');
    writeFileSync(specPath, JSON.stringify(doc));
    const r = cli('run', specPath, '--out', join(out, 'run'), '--threads', '2', '--progress', 'none', '--no-report');
    expect(r.status).toBe(0);
    expect(r.stdout.match(/\(6 taken from an earlier run\)/g)).toHaveLength(3);
    const again = JSON.parse(readFileSync(join(out, 'run', 'sweep.json'), 'utf8')) as SweepSummary;
    expect(comparable(again)).toEqual(comparable(embedded));
  });
});

describe('farm sweep (real Redis, one worker process)', () => {
  beforeAll(async () => {
    worker = await startWorker({ prefix, artifacts, concurrency: 2 });
  });

  async function waitDone(id: string): Promise<void> {
    await waitFor(`sweep ${id} done`, async () => {
      const r = cli('status', id, '--json', '--redis', REDIS_URL, '--prefix', prefix);
      if (r.status !== 0) throw new Error(r.stderr);
      return (JSON.parse(r.stdout) as { state: string }).state === 'done' ? true : undefined;
    }, 120_000);
  }

  it('tendril launch → status → summary: the same sweep table as embedded', async () => {
    const specPath = join(out, 'farm.json');
    writeFileSync(specPath, JSON.stringify(doc));
    const l = cli('launch', specPath, '--redis', REDIS_URL, '--prefix', prefix);
    expect(l.stderr).toBe('');
    const id = l.stdout.trim();
    expect(id).toMatch(/^s[a-z0-9]+$/);
    await waitDone(id);
    const st = cli('status', id, '--redis', REDIS_URL, '--prefix', prefix);
    expect(st.stdout).toMatch(new RegExp(`^${id}  done +nr sweep  sweep over noise_reduction \\(3 values\\)  runs 18/18 done`));
    expect(st.stdout).toMatch(/\n {2}noise_reduction = 3: \S+-2  done/);
    const list = cli('list', '--redis', REDIS_URL, '--prefix', prefix);
    expect(list.stdout).toMatch(new RegExp(`\\n${id}  done +nr sweep  sweep over noise_reduction`));
    const w = cli('watch', id, '--redis', REDIS_URL, '--prefix', prefix, '--progress', 'none');
    expect(w.status).toBe(0);
    expect(w.stdout).toContain('sweep over noise_reduction');
    const sum = cli('summary', id, '--redis', REDIS_URL, '--prefix', prefix);
    expect(sum.status).toBe(0);
    const farm = JSON.parse(sum.stdout) as SweepSummary;
    expect(comparable(farm)).toEqual(comparable(embedded));
    for (const [i, mid] of farm.rows.map((r) => r.ensembleId).entries()) {
      expect((await store.results(mid)).map((r) => r.stateHash)).toEqual(embeddedHashes[i]);
    }
    const csv = cli('summary', id, '--format', 'csv', '--redis', REDIS_URL, '--prefix', prefix);
    expect(csv.stdout.split('\n')[0]).toMatch(/^noise_reduction,ensemble_id,clusters,partial,final_size,D_radiusOfGyration,/);
    const html = cli('summary', id, '--format', 'html', '--out', join(out, 'farm-html'), '--redis', REDIS_URL, '--prefix', prefix);
    expect(html.status).toBe(0);
    expect(readFileSync(join(out, 'farm-html', 'report.html'), 'utf8')).toContain('figure-sweep-dimension');
    expect(readFileSync(join(out, 'farm-html', 'noise_reduction-2', 'report.html'), 'utf8')).toContain('<html');
  });

  it('POST /ensembles with a sweep → GET /sweeps/:id → its summary; the same table; a repeat with the key gives the same sweep', async () => {
    const auth = { authorization: `Bearer ${TOKEN}`, 'idempotency-key': 'sweep-key-1' };
    const res = await app.inject({ method: 'POST', url: '/ensembles', headers: auth, payload: doc });
    expect(res.statusCode).toBe(201);
    const { id, status, ensembles } = res.json() as { id: string; status: string; ensembles: string[] };
    expect(status).toBe(`/sweeps/${id}`);
    expect(ensembles).toEqual([0, 1, 2].map((i) => `${id}-${i}`));
    const again = await app.inject({ method: 'POST', url: '/ensembles', headers: auth, payload: doc });
    expect(again.statusCode).toBe(200);
    expect(again.json().id).toBe(id);
    const other = await app.inject({ method: 'POST', url: '/ensembles', headers: auth, payload: { ...doc, seed: '1' } });
    expect(other.statusCode).toBe(422);
    await waitFor('http sweep done', async () => {
      const s = await app.inject({ method: 'GET', url: status });
      return s.json().state === 'done' ? true : undefined;
    }, 120_000);
    const s = (await app.inject({ method: 'GET', url: status })).json() as { runs: { done: number }; members: Array<{ value: number; status: { id: string } }> };
    expect(s.runs.done).toBe(18);
    expect(s.members.map((m) => m.value)).toEqual([1, 2, 3]);
    const sum = await app.inject({ method: 'GET', url: `${status}/summary` });
    expect(sum.statusCode).toBe(200);
    expect(comparable(sum.json() as SweepSummary)).toEqual(comparable(embedded));
    const csv = await app.inject({ method: 'GET', url: `${status}/summary?format=csv` });
    expect(csv.body.split('\n')).toHaveLength(5);
    httpSweep = id;
  });

  it('the web page of a sweep (headless Chromium): members with links, the D(parameter) figure, and the sweep listed on the index page', async (ctx) => {
    if (!existsSync(CHROMIUM) || !httpSweep) {
      console.warn(`sweep web page check skipped: ${CHROMIUM} is missing (apt-get install chromium) or the HTTP sweep did not run`);
      ctx.skip();
      return;
    }
    const figure = await app.inject({ method: 'GET', url: `/sweeps/${httpSweep}/figure.svg` });
    expect(figure.statusCode).toBe(200);
    expect(figure.body).toContain('<svg');
    const base = await app.listen({ port: 0, host: '127.0.0.1' });
    const browser = await chromium.launch({ executablePath: CHROMIUM, args: ['--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage'] });
    try {
      const page = await browser.newPage({ viewport: { width: 1100, height: 900 } });
      await page.goto(`${base}/sweep/${httpSweep}`);
      await page.locator('#members tbody tr').nth(2).waitFor();
      expect(await page.locator('#members tbody tr[data-state="done"]').count()).toBe(3);
      expect(await page.locator('#members tbody a').first().getAttribute('href')).toBe(`/view/${httpSweep}-0`);
      await page.waitForFunction("document.getElementById('figure').naturalWidth > 0");
      expect(await page.locator('#figure').evaluate((i) => (i as unknown as { naturalWidth: number }).naturalWidth)).toBeGreaterThan(500);
      if (process.env.TENDRIL_SWEEP_SCREENSHOT) await page.screenshot({ path: process.env.TENDRIL_SWEEP_SCREENSHOT.replace(/\.png$/, '-web.png'), fullPage: true });
      await page.goto(`${base}/`);
      await page.locator(`#sweeps li[data-id="${httpSweep}"] a`).waitFor();
      expect(await page.locator('#sweeps-card').isHidden()).toBe(false);
    } finally {
      await browser.close();
    }
  });

  it('a bad sweep over HTTP is one line naming the field', async () => {
    const res = await app.inject({ method: 'POST', url: '/ensembles', headers: { authorization: `Bearer ${TOKEN}` }, payload: { ...doc, params: { noise_reduction: [1, 0] } } });
    expect(res.statusCode).toBe(400);
    expect(res.json().error).toMatch(/^params\.noise_reduction\[1\]: 0 is out of range; allowed: an integer from 1 to 1000/);
    expect((await app.inject({ method: 'GET', url: '/sweeps/nope' })).statusCode).toBe(404);
  });
});
