/**
 * The web status page in a real browser: Debian's chromium (/usr/bin/chromium)
 * driven by playwright-core (no browser download). `tendril serve` and a
 * worker run as processes; the page must show progress advancing without a
 * reload, draw the live chart, show the ensemble page's report plots and
 * cluster picture with no console error, and cancel only with the token.
 * Screenshots go to TENDRIL_WEB_SCREENSHOTS when set (for people to look at).
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { Redis } from 'ioredis';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CLI, deleteKeys, freePort, REDIS_URL, startWorker, stopWorker, tempDir, uniquePrefix, waitFor, type WorkerProc } from './farm-helpers.js';

const CHROMIUM = '/usr/bin/chromium';
const prefix = uniquePrefix('web');
const artifacts = tempDir('web-artifacts');
const TOKEN = 'web-status-test-token-0123456789';
const shots = process.env.TENDRIL_WEB_SCREENSHOTS;
const redis = new Redis(REDIS_URL, { maxRetriesPerRequest: null });
let serve: ChildProcess | undefined;
let worker: WorkerProc | undefined;
let browser: Browser | undefined;
let base = '';

beforeAll(async () => {
  if (!existsSync(CHROMIUM)) return;
  const port = await freePort();
  serve = spawn(process.execPath, [CLI, 'serve', '--port', String(port), '--redis', REDIS_URL, '--prefix', prefix], { env: { ...process.env, TENDRIL_API_TOKEN: TOKEN }, stdio: ['ignore', 'pipe', 'pipe'] });
  let out = '';
  serve.stdout!.on('data', (d) => (out += d));
  serve.stderr!.on('data', (d) => (out += d));
  await waitFor('serve', async () => out.includes('serving on'), 30_000);
  base = `http://127.0.0.1:${port}`;
  browser = await chromium.launch({ executablePath: CHROMIUM, args: ['--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage'] });
  if (shots) mkdirSync(shots, { recursive: true });
});

afterAll(async () => {
  await browser?.close();
  await stopWorker(worker);
  if (serve && serve.exitCode === null) {
    const gone = new Promise((r) => serve!.once('exit', r));
    serve.kill('SIGTERM');
    await gone;
  }
  await deleteKeys(redis, prefix);
  redis.disconnect();
  rmSync(artifacts, { recursive: true, force: true });
});

async function create(doc: object): Promise<string> {
  const r = await fetch(`${base}/ensembles`, { method: 'POST', headers: { 'content-type': 'application/json', authorization: `Bearer ${TOKEN}` }, body: JSON.stringify(doc) });
  expect(r.status).toBe(201);
  return ((await r.json()) as { id: string }).id;
}

function watchConsole(page: Page): string[] {
  const errors: string[] = [];
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(m.text());
  });
  page.on('pageerror', (e) => errors.push(`page error: ${e.message}`));
  page.on('request', (r) => {
    const u = r.url();
    if (!u.startsWith(`${base}/`) && !u.startsWith('data:') && !u.startsWith('blob:')) errors.push(`request off this server: ${u}`);
  });
  page.on('response', (r) => {
    if (r.status() >= 400) errors.push(`HTTP ${r.status()} ${new URL(r.url()).pathname}`);
  });
  return errors;
}

describe('web status page (headless chromium)', () => {
  it('list page: progress advances without reload and the chart is drawn; ensemble page: plots, cluster picture, downloads, cancel with the token', async (ctx) => {
    if (!browser) {
      console.warn(`web-status test skipped: ${CHROMIUM} is missing (apt-get install chromium; .ci/run installs it)`);
      ctx.skip();
      return;
    }
    // A grows on the worker; B (5.7·10^6 particles in all, far too much to finish during the test; each cluster small enough for the page's picture) waits behind it and is cancelled from its page
    const a = await create({ name: 'web-a', model: 'dla-offlattice-2d', particles: 60000, clusters: 6, seed: '31', runs_per_job: 1 });
    const b = await create({ name: 'web-b', model: 'dla-offlattice-2d', particles: 190_000, clusters: 30, seed: '32' });
    worker = await startWorker({ prefix, artifacts, concurrency: 1 });

    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    const errors = watchConsole(page);
    await page.goto(`${base}/`);
    const rowA = page.locator(`#ensembles tr[data-id="${a}"]`);
    await rowA.waitFor({ timeout: 30_000 });
    await expect(page.locator(`#ensembles tr[data-id="${b}"]`).count()).resolves.toBe(1);
    const first = Number(await rowA.getAttribute('data-particles-done'));
    // the same page (no reload) shows more particles later
    await page.waitForFunction(`Number(document.querySelector('#ensembles tr[data-id="${a}"]')?.getAttribute('data-particles-done') ?? -1) > ${first}`, null, { timeout: 120_000 });
    await page.waitForFunction(`Number(document.getElementById('chart').dataset.segments ?? 0) >= 1`, null, { timeout: 30_000 });
    expect(await rowA.locator('.state').textContent()).toBe('running');
    expect(await page.locator('#legend span').count()).toBeGreaterThanOrEqual(1);
    if (shots) await page.screenshot({ path: join(shots, 'index.png'), fullPage: true });

    // the ensemble page of A, once two clusters are done (figures need results)
    await page.waitForFunction(`/^[2-6] \\//.test(document.querySelector('#ensembles tr[data-id="${a}"] td.num')?.textContent ?? '')`, null, { timeout: 180_000 });
    await rowA.locator('a').click();
    await page.waitForURL(`${base}/view/${a}`);
    await page.locator('#figures figure img').first().waitFor({ timeout: 60_000 });
    await page.waitForFunction(`(() => {
      const imgs = [...document.querySelectorAll('#figures img, #cluster img')];
      return imgs.length >= 3 && document.querySelector('#cluster img') !== null && imgs.every((i) => i.complete && i.naturalWidth > 0);
    })()`, null, { timeout: 120_000 });
    const figureNames = await page.locator('#figures figure').evaluateAll((fs) => fs.map((f) => f.getAttribute('data-name')));
    expect(figureNames).toContain('radius-of-gyration');
    expect(await page.locator('#figures figcaption sub').count()).toBeGreaterThan(0); // R_g drawn as R with subscript g
    expect(await page.locator('#cluster p').textContent()).toMatch(/^run 0, 60,000 particles, grown again from its task/);
    const links = (await page.locator('#downloads a').evaluateAll((as) => as.map((x) => x.getAttribute('href') ?? ''))).map((h) => new URL(h, base).href);
    expect(links.some((l) => l.endsWith('format=json'))).toBe(true);
    expect(links.some((l) => l.endsWith('format=pb'))).toBe(true);
    for (const l of links) expect((await fetch(l)).status).toBe(200);
    if (shots) await page.screenshot({ path: join(shots, 'view.png'), fullPage: true });
    expect(errors).toEqual([]);

    // routes of the page refuse what they do not serve, with one line
    const notAsset = await fetch(`${base}/web/secret.js`);
    expect(notAsset.status).toBe(404);
    expect(((await notAsset.json()) as { error: string }).error).toMatch(/^GET \/web\/secret\.js: no such file; allowed: index\.html, /);
    const notFigure = await fetch(`${base}/ensembles/${a}/figures/nope.svg`);
    expect(notFigure.status).toBe(404);
    expect(((await notFigure.json()) as { error: string }).error).toMatch(/^figure: "nope\.svg" is not a figure of this ensemble; allowed: .*radius-of-gyration\.svg/);

    // B's page: a wrong token is refused, the right one cancels
    await page.goto(`${base}/view/${b}`);
    await page.locator('#state .state').waitFor();
    await page.fill('#cancel-token', 'not-the-token-of-this-server');
    await page.click('#cancel-button');
    await page.waitForFunction(`document.getElementById('message')?.textContent !== ''`);
    expect(await page.locator('#message').textContent()).toBe('authorization: the bearer token is not valid');
    expect(await page.locator('#state .state').textContent()).toBe('running');
    await page.fill('#cancel-token', TOKEN);
    await page.click('#cancel-button');
    await page.waitForFunction(`document.querySelector('#state .state')?.textContent === 'cancelled'`, null, { timeout: 30_000 });
    expect(await page.locator('#message').textContent()).toMatch(/^cancelled/);
    if (shots) await page.screenshot({ path: join(shots, 'cancelled.png'), fullPage: true });
    // the only console error: the browser's own line for the refused (401) request
    expect(errors.filter((e) => !/status of 401/.test(e) && e !== `HTTP 401 /ensembles/${b}/cancel`)).toEqual([]);
    await page.close();
  }, 600_000);
});
