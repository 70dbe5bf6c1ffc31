/**
 * The sweep report (coordinator/report/sweep-report.ts): the D(η) plot with
 * the bound, D = 2, the DLA value and τ(η+2) − τ(η), and the table; rendered
 * in headless Chromium (playwright-core against /usr/bin/chromium, as
 * test/web-status.test.ts does). TENDRIL_SWEEP_SCREENSHOT=path keeps a
 * screenshot of the page.
 */
import { existsSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { chromium } from 'playwright-core';
import { buildSweepSummary } from '../coordinator/summary/sweep-summary.js';
import { buildSweepReport, sweepFigure } from '../coordinator/report/sweep-report.js';
import { writeSweepFiles } from '../coordinator/commands/sweep-files.js';
import { syntheticMember as member } from './support/sweep-members.js';
import { tempDir } from './farm-helpers.js';

const CHROMIUM = '/usr/bin/chromium';
const dir = tempDir('sweep-report');
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const rel = (e: number) => ({ estimate: e, low: e - 0.06, high: e + 0.06, verdict: 'consistent' });
const members = [
  member(0, { radiusOfGyration: { D: 1.99, iv: [1.96, 2.0] }, maxRadius: { D: 1.97, iv: [1.92, 2.02] }, massRadius: { D: 1.95, iv: [1.9, 1.99] } }),
  member(0.5, { radiusOfGyration: { D: 1.86, iv: [1.82, 1.9] }, maxRadius: { D: 1.83, iv: [1.76, 1.9] }, massRadius: { D: 1.84, iv: [1.8, 1.88] } }, rel(1.85)),
  member(1, { radiusOfGyration: { D: 1.72, iv: [1.69, 1.75] }, maxRadius: { D: 1.75, iv: [1.7, 1.8] }, massRadius: { D: 1.68, iv: [1.65, 1.71] } }, rel(1.7)),
  member(2, { radiusOfGyration: { D: 1.45, iv: [1.4, 1.5] }, maxRadius: { D: 1.47, iv: [1.4, 1.55] }, massRadius: { D: 1.42, iv: [1.38, 1.46] } }, rel(1.43)),
  member(4, { radiusOfGyration: { D: 1.12, iv: [1.06, 1.18] }, maxRadius: { D: 1.1, iv: [1.02, 1.18] }, massRadius: { D: 1.15, iv: [1.1, 1.2] } }),
];
const summary = buildSweepSummary({ sweepId: 'stest', name: 'eta sweep', modelKind: 'dla-square', parameter: 'eta', seed: '9', document: {}, members, breakdownExponent: true });

describe('sweep report', () => {
  it('the D(η) figure holds the estimates with intervals, the bound, D = 2, the DLA value and τ(η+2) − τ(η)', () => {
    const f = sweepFigure(summary);
    expect(f.note).toBeNull();
    for (const text of ['lower bound (4 − η)/2', 'D = 2', 'DLA at η = 1: D = 1.71', 'Menshutin, Shchur', 'η_c', 'τ(η+2) − τ(η)', 'D from R']) expect(f.svg).toContain(text.replace(/_c/, ''));
    expect(f.caption).toMatch(/Losev & Smirnov 2023, arXiv 2307\.14931/);
    expect(f.caption).toMatch(/Hastings 2001/);
    // a sweep over another parameter: no bound, no DLA point
    const other = sweepFigure(buildSweepSummary({ ...summary, sweepId: 'o', document: {}, parameter: 'noise_reduction', modelKind: 'dla-square', seed: '1', members: members.slice(0, 2).map((m, i) => ({ ...m, value: i + 1 })) }));
    expect(other.svg).not.toContain('lower bound');
    expect(other.svg).not.toContain('DLA at');
    // an underscore of a parameter name is not read as a subscript
    expect(other.title).toBe('Fractal dimension D against noise reduction');
  });

  it('the page has the figure, the table with verdicts and the stated rules', () => {
    const { html } = buildSweepReport(summary, false, false);
    expect(html).toContain('id="figure-sweep-dimension"');
    expect(html).toMatch(/<table id="sweep-table">/);
    expect(html).toContain('data-verdict="above bound"');
    expect(html).toMatch(/id="bound-rule"/);
    expect(html).toMatch(/id="monotonic"/);
  });

  it('renders in headless Chromium: the plot is drawn with its points', async (ctx) => {
    const written = await writeSweepFiles(dir, summary);
    expect(written).toEqual(expect.arrayContaining(['sweep.json', 'sweep.csv', 'report.html', 'plots/sweep-dimension.svg']));
    expect(JSON.parse(readFileSync(join(dir, 'sweep.json'), 'utf8')).schema).toBe('tendril.sweep/1');
    if (!existsSync(CHROMIUM)) {
      console.warn(`sweep report browser check skipped: ${CHROMIUM} is missing (apt-get install chromium)`);
      ctx.skip();
      return;
    }
    const browser = await chromium.launch({ executablePath: CHROMIUM, args: ['--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage'] });
    try {
      const page = await browser.newPage({ viewport: { width: 1200, height: 900 } });
      await page.goto(`file://${join(dir, 'report.html')}`);
      const box = await page.locator('#figure-sweep-dimension svg').boundingBox();
      expect(box!.width).toBeGreaterThan(500);
      expect(box!.height).toBeGreaterThan(300);
      // markers of three estimators at five values, and the DLA diamond
      expect(await page.locator('#figure-sweep-dimension svg path, #figure-sweep-dimension svg circle').count()).toBeGreaterThan(15);
      expect(await page.locator('#sweep-table tbody tr').count()).toBe(5);
      const shot = process.env.TENDRIL_SWEEP_SCREENSHOT;
      if (shot) await page.screenshot({ path: shot, fullPage: true });
    } finally {
      await browser.close();
    }
  });
});
