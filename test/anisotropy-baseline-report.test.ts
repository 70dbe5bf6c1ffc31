/**
 * `tendril run SPEC --out DIR --baseline BASEDIR` end to end (the built CLI,
 * dist/coordinator/cli.js): an off-lattice DLA ensemble is grown first as the
 * isotropic baseline, then a square-lattice DLA ensemble with --baseline; its
 * report carries the combined figure (A_4 of both ensembles with bands and
 * the noise level √(π/(4n)) on one set of axes), written as SVG and PNG, and
 * the page loads in headless Chromium (playwright-core against
 * /usr/bin/chromium) without errors, with a non-empty figure.
 * TENDRIL_ANISOTROPY_SCREENSHOT=path.png saves a screenshot of the figure.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium } from 'playwright-core';
import { afterAll, describe, expect, it } from 'vitest';
import { CLI, tempDir } from './farm-helpers.js';

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
const dir = tempDir('aniso-baseline');

afterAll(() => rmSync(dir, { recursive: true, force: true }));

function cli(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const r = spawnSync(process.execPath, [CLI, ...args], { encoding: 'utf8', timeout: 180_000 });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

function spec(name: string, model: string, seed: number): string {
  const path = join(dir, `${name}.json`);
  writeFileSync(path, JSON.stringify({ name, model, particles: 2000, clusters: 4, seed, analysis: { resamples: 200 } }));
  return path;
}

describe('tendril run --baseline: lattice anisotropy against an off-lattice baseline in one figure', () => {
  it('refuses an unusable baseline folder in one line before growing anything', () => {
    const r = cli('run', spec('early', 'dla-square', 3), '--out', join(dir, 'never'), '--baseline', join(dir, 'missing'), '--progress', 'none');
    expect(r.status).not.toBe(0);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/--baseline: ".*missing" holds no summary\.pb; allowed: /);
    expect(existsSync(join(dir, 'never'))).toBe(false);
  });

  it('grows both, prints the verdict with its rule and writes the combined figure (SVG, PNG, in report.html)', () => {
    const off = cli('run', spec('off', 'dla-offlattice-2d', 1), '--out', join(dir, 'off'), '--threads', '2', '--progress', 'none');
    expect(off.stderr).toBe('');
    expect(off.status).toBe(0);
    expect(off.stdout).toMatch(/isotropic noise at N = 2000 \(mean shell count n = \d+\): sqrt\(pi\/\(4n\)\) = 0\.0\d+/);
    const sq = cli('run', spec('sq', 'dla-square', 2), '--out', join(dir, 'sq'), '--threads', '2', '--progress', 'none', '--baseline', join(dir, 'off'));
    expect(sq.stderr).toBe('');
    expect(sq.status).toBe(0);
    expect(sq.stdout).toMatch(/fold_amplitude_4 against the baseline dla-offlattice-2d \(.*off\) at N = 2000: [\d.]+ \[[\d.]+, [\d.]+\] against [\d.]+ \[[\d.]+, [\d.]+\]: (above the baseline|below the baseline|not distinguishable) \(rule: the two bands do not overlap\)/);
    const html = readFileSync(join(dir, 'sq', 'report.html'), 'utf8');
    expect(html).toContain('id="figure-anisotropy-against-baseline"');
    expect(html).toMatch(/Verdict at N = 2000: dla-square is (above|below|not distinguishable from) the baseline/);
    expect(html).toContain('Rule: ');
    const svg = readFileSync(join(dir, 'sq', 'plots', 'anisotropy-against-baseline.svg'), 'utf8');
    expect(svg).toContain('dla-offlattice-2d (baseline)');
    expect(svg).toContain('√(π/(4n))');
    expect(readFileSync(join(dir, 'sq', 'plots', 'anisotropy-against-baseline.png')).subarray(1, 4).toString()).toBe('PNG');
    // the per-ensemble figure draws the noise from the shell counts, no longer (3N/4)^-1/2
    const own = readFileSync(join(dir, 'sq', 'plots', 'anisotropy-fold-amplitude.svg'), 'utf8');
    expect(own).toContain('√(π/(4n))');
    expect(own).not.toContain('3N/4');
  });

  it('the report page loads in headless Chromium without errors and the combined figure has content', async (ctx) => {
    if (!existsSync(CHROMIUM)) {
      console.warn(`anisotropy report browser check skipped: ${CHROMIUM} is missing (apt-get install chromium)`);
      ctx.skip();
      return;
    }
    const browser = await chromium.launch({ executablePath: CHROMIUM, args: ['--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage'] });
    try {
      const page = await browser.newPage({ viewport: { width: 1100, height: 900 } });
      const problems: string[] = [];
      page.on('console', (m) => {
        if (m.type() === 'error') problems.push(m.text());
      });
      page.on('pageerror', (e) => problems.push(e.message));
      await page.goto(pathToFileURL(join(dir, 'sq', 'report.html')).href);
      const figure = page.locator('#figure-anisotropy-against-baseline');
      await figure.waitFor();
      const box = await figure.locator('svg').boundingBox();
      expect(box!.width).toBeGreaterThan(300);
      expect(box!.height).toBeGreaterThan(300);
      // drawn data: the two bands and the mean and noise lines are paths with a non-empty extent
      const drawn = await figure.locator('svg path').evaluateAll((ps) => ps.filter((p) => {
        const b = (p as unknown as { getBBox(): { width: number; height: number } }).getBBox();
        return b.width > 50 && b.height > 5;
      }).length);
      expect(drawn).toBeGreaterThanOrEqual(4);
      expect(await figure.locator('figcaption').innerText()).toMatch(/Noise verdicts: dla-square: A4 at N = 2000 (above|within) noise/);
      const shot = process.env.TENDRIL_ANISOTROPY_SCREENSHOT;
      if (shot) await figure.screenshot({ path: shot });
      expect(problems).toEqual([]);
    } finally {
      await browser.close();
    }
  });
});
