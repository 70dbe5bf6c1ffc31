import { runNode } from './support/run-node.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { PNG } from 'pngjs';
import { chromium, type Browser } from 'playwright-core';
import { decodeSnapshot } from '../coordinator/snapshot/index.js';
import { DARK_BACKGROUND, parseHex } from '../coordinator/render/index.js';
import { clusterPicture3d, VIEWER_MAX_BALLS } from '../coordinator/report/cluster-viewer-3d.js';

// The commands are tested as users run them: the compiled CLI (npm run build first).
const CLI = fileURLToPath(new URL('../dist/coordinator/cli.js', import.meta.url));
/** Headless Chromium from Debian (.ci/run installs it when missing). */
const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

async function tendril(...args: string[]) {
  const r = await runNode([CLI, ...args], { timeout: 120_000 });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

let work: string;
beforeAll(async () => {
  if (!existsSync(CLI)) throw new Error(`${CLI} is missing; run npm run build first`);
  work = mkdtempSync(join(tmpdir(), 'tendril-3d-pictures-'));
});
afterAll(() => {
  if (work !== undefined) rmSync(work, { recursive: true, force: true });
});

/** Pixels that differ from the background, in each quarter of the picture (the four views). */
function panelCounts(file: string): { width: number; height: number; counts: number[] } {
  const png = PNG.sync.read(readFileSync(file));
  const bg = parseHex(DARK_BACKGROUND);
  const counts = [0, 0, 0, 0];
  const half = Math.floor(png.width / 2);
  for (let y = 0; y < png.height; y++)
    for (let x = 0; x < png.width; x++) {
      if (x === half || y === half) continue; // separators
      const o = 4 * (y * png.width + x);
      const d = Math.abs(png.data[o] - bg.r) + Math.abs(png.data[o + 1] - bg.g) + Math.abs(png.data[o + 2] - bg.b);
      if (d > 30) counts[(y < half ? 0 : 2) + (x < half ? 0 : 1)]++;
    }
  return { width: png.width, height: png.height, counts };
}

describe('tendril grow --model dla-offlattice-3d', () => {
  it('writes a 3D run result, a 3D snapshot and a four-view picture with the cluster in every view', async () => {
    const out = join(work, 'grow');
    const r = await tendril('grow', '--model', 'dla-offlattice-3d', '--particles', '1500', '--seed', '5', '--out', out, '--picture-size', '300', '--quiet');
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/grew 1500 particles \(seed 5\): R_g = \d+\.\d\d, R_max = \d+\.\d\d/);
    const rr = JSON.parse(readFileSync(join(out, 'run-result.json'), 'utf8'));
    expect(rr.dimension).toBe(3);
    expect(rr.model.kind).toBe('dla-offlattice-3d');
    const snap = decodeSnapshot(readFileSync(join(out, 'cluster.snapshot')));
    expect(snap.dimension).toBe(3);
    expect(snap.count).toBe(1500);
    expect(snap.z!.some((z) => z !== 0)).toBe(true);
    const pic = panelCounts(join(out, 'cluster.png'));
    expect([pic.width, pic.height]).toEqual([300, 300]);
    // every view shows the cluster: a few hundred pixels at least, and none is blank
    for (const c of pic.counts) expect(c).toBeGreaterThan(300);
  });

  it('tendril probe on the 3D snapshot writes the capacity, τ(q) and per-ball hits', async () => {
    const out = join(work, 'probe');
    const r = await tendril('probe', join(work, 'grow', 'cluster.snapshot'), '--walkers', '3000', '--seed', '2', '--out', out, '--jobs', '3');
    expect(r.status, r.stderr).toBe(0);
    expect(r.stdout).toMatch(/^probed 1500 balls \(3D\) with 3000 walkers in .* capacity = [\d.]+ \+- [\d.]+/);
    const m = JSON.parse(readFileSync(join(out, 'probe-measures.json'), 'utf8'));
    expect(m.dimension).toBe(3);
    // the capacity of the capture balls lies between that of one capture ball (radius 1) and that of the launch ball (monotone under inclusion; exact)
    expect(m.capacity.value).toBeGreaterThan(1);
    expect(m.capacity.value).toBeLessThan(m.capacity.launchRadius);
    const q1 = m.spectrum.q.indexOf(1);
    expect(Math.abs(m.spectrum.tau[q1])).toBeLessThan(1e-9); // τ(1) = 0 (normalised measure; exact)
    const rows = readFileSync(join(out, 'probe-hits.csv'), 'utf8').trim().split('\n');
    expect(rows[0]).toBe('index,x,y,z,r,hits,measure');
    expect(rows.length).toBe(1501);
    const hits = rows.slice(1).reduce((a, row) => a + Number(row.split(',')[5]), 0);
    expect(hits).toBe(m.hits);
  });
});

describe('the 3D view in the HTML report', () => {
  let browser: Browser;
  beforeAll(async () => {
    if (!existsSync(CHROMIUM)) throw new Error(`headless Chromium is missing at ${CHROMIUM}: apt-get install -y chromium (or set CHROMIUM_PATH)`);
    browser = await chromium.launch({ executablePath: CHROMIUM, args: ['--no-sandbox'] });
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('tendril run writes a report whose 3D view loads without console errors, draws the cluster and rotates on drag', async () => {
    const spec = join(work, 'spec3d.toml');
    writeFileSync(spec, 'name = "viewer test"\nmodel = "dla-offlattice-3d"\nparticles = 1500\nclusters = 3\nseed = 8\nrecords_per_decade = 10\n');
    const out = join(work, 'run');
    const r = await tendril('run', spec, '--out', out, '--threads', '1', '--progress', 'none');
    expect(r.status, r.stderr).toBe(0);
    const html = readFileSync(join(out, 'report.html'), 'utf8');
    expect(html).toContain('id="section-cluster-3d"');
    expect(html).toContain('All 1500 balls.');

    const page = await browser.newPage();
    const problems: string[] = [];
    page.on('console', (m) => {
      if (m.type() === 'error') problems.push(m.text());
    });
    page.on('pageerror', (e) => problems.push(e.message));
    await page.goto(pathToFileURL(join(out, 'report.html')).href);
    // page-side code is given as strings (this project compiles without the DOM types)
    const frames = (k: number) => page.waitForFunction(`Number(document.getElementById('viewer3d-canvas')?.getAttribute('data-frames') ?? 0) >= ${k}`);
    await frames(1);
    const litPixels = () =>
      page.evaluate(`(() => {
        const c = document.getElementById('viewer3d-canvas');
        const d = c.getContext('2d').getImageData(0, 0, c.width, c.height).data;
        let lit = 0;
        let sum = 0;
        for (let i = 0; i < d.length; i += 4) {
          const v = d[i] + d[i + 1] + d[i + 2];
          if (v > 14 + 14 + 22 + 30) lit++;
          sum = (sum * 31 + v) % 1000000007;
        }
        return { lit, sum };
      })()`) as Promise<{ lit: number; sum: number }>;
    const before = await litPixels();
    expect(before.lit).toBeGreaterThan(2000);
    // drag across the canvas: the view turns (another frame, other pixels, still the cluster)
    await page.locator('#viewer3d-canvas').scrollIntoViewIfNeeded();
    const box = (await page.locator('#viewer3d-canvas').boundingBox())!;
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width / 2 + 120, box.y + box.height / 2 + 40, { steps: 6 });
    await page.mouse.up();
    await frames(2);
    const after = await litPixels();
    expect(after.sum).not.toBe(before.sum);
    expect(after.lit).toBeGreaterThan(2000);
    expect(problems).toEqual([]);
    await page.close();
  }, 120_000);

  it('a subsampled view of 250,001 balls (every 3rd drawn) loads without errors and draws', async () => {
    const n = 250_001;
    const x = new Float64Array(n), y = new Float64Array(n), z = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      // a thick spherical shell of radius about 60, points spread by a fixed low-discrepancy rule
      const u = ((i * 0.6180339887) % 1) * 2 - 1;
      const phi = i * 2.399963229728653;
      const r = 55 + (i % 11);
      x[i] = r * Math.sqrt(1 - u * u) * Math.cos(phi);
      y[i] = r * Math.sqrt(1 - u * u) * Math.sin(phi);
      z[i] = r * u;
    }
    const pic = clusterPicture3d({ dimension: 3, count: n, x, y, z, diameter: 1 }, 0, 200);
    const file = join(work, 'subsample.html');
    writeFileSync(file, `<!DOCTYPE html><html><head><meta charset="utf-8"><title>viewer</title></head><body>${pic.viewerHtml}</body></html>`);
    const page = await browser.newPage();
    const problems: string[] = [];
    page.on('console', (m) => {
      if (m.type() === 'error') problems.push(m.text());
    });
    page.on('pageerror', (e) => problems.push(e.message));
    await page.goto(pathToFileURL(file).href);
    await page.waitForFunction(`Number(document.getElementById('viewer3d-canvas')?.getAttribute('data-frames') ?? 0) >= 1`);
    const lit = (await page.evaluate(`(() => {
      const c = document.getElementById('viewer3d-canvas');
      const d = c.getContext('2d').getImageData(0, 0, c.width, c.height).data;
      let lit = 0;
      for (let i = 0; i < d.length; i += 4) if (d[i] + d[i + 1] + d[i + 2] > 80) lit++;
      return lit;
    })()`)) as number;
    expect(lit).toBeGreaterThan(10000);
    expect(await page.locator('#viewer3d-note').textContent()).toContain('Showing one ball in every 3');
    expect(problems).toEqual([]);
    await page.close();
  }, 120_000);
});

describe('3D report picture of a large cluster', () => {
  it(`embeds at most ${VIEWER_MAX_BALLS} balls and says that it shows a subsample`, async () => {
    const n = 250_001;
    const x = new Float64Array(n), y = new Float64Array(n), z = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      x[i] = i % 100;
      y[i] = Math.floor(i / 100) % 100;
      z[i] = Math.floor(i / 10000);
    }
    const pic = clusterPicture3d({ dimension: 3, count: n, x, y, z, diameter: 1 }, 0, 200);
    expect(pic.shown).toBeLessThanOrEqual(VIEWER_MAX_BALLS);
    expect(pic.shown).toBe(Math.ceil(n / 3));
    expect(pic.viewerHtml).toContain(`Showing one ball in every 3, in arrival order: ${pic.shown} of ${n}`);
    expect(pic.viewerHtml).toContain(`data-balls="${pic.shown}"`);
  });
});
