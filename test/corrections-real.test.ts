import { runNode } from './support/run-node.js';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

// A short real DLA series (8 clusters of 3000 particles: under three decades of N,
// far from the asymptotic regime) must not give a headline D from the
// corrections-to-scaling fit: the fit is reported as not determined, with the
// rule that failed, and stays out of the consistency panel. The clusters grow in
// a child process (the CLI), so this test never blocks the runner's event loop.

const CLI = join(__dirname, '..', 'dist', 'coordinator', 'cli.js');
const dir = mkdtempSync(join(tmpdir(), 'tendril-corrections-real-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function run(args: string[]) {
  return runNode([CLI, ...args], { timeout: 300_000 });
}

describe('corrections-to-scaling fit on a short real series', () => {
  writeFileSync(join(dir, 'short.toml'), 'name = "short"\nmodel = "dla-offlattice-2d"\nparticles = 3000\nclusters = 8\nseed = 20261202\nrecords_per_decade = 10\n');

  it('is off by default, and when asked for it is refused (not determined) and kept out of the panel', async () => {
    const off = await run(['run', join(dir, 'short.toml'), '--out', join(dir, 'off'), '--resamples', '200']);
    expect(off.status, off.stderr).toBe(0);
    const offSummary = JSON.parse(readFileSync(join(dir, 'off', 'summary.json'), 'utf8'));
    expect(offSummary.statistics.options.corrections).toBe(false);
    expect(readFileSync(join(dir, 'off', 'report.html'), 'utf8')).toContain('The corrections-to-scaling fit was switched off.');

    const on = await run(['run', join(dir, 'short.toml'), '--out', join(dir, 'on'), '--resamples', '200', '--corrections']);
    expect(on.status, on.stderr).toBe(0);
    const s = JSON.parse(readFileSync(join(dir, 'on', 'summary.json'), 'utf8'));
    expect(s.statistics.options.corrections).toBe(true);
    for (const n of ['radiusOfGyration', 'maxRadius']) {
      const c = s.statistics.corrections[n];
      expect(c.determined).toBe(false);
      expect(c.D.value).toBeNull();
      expect(c.omega.value).toBeNull();
      expect(c.correctionAmplitude.value).toBeNull();
      expect(typeof c.reason).toBe('string');
    }
    const panel = s.statistics.consistency.rows.map((r: { name: string }) => r.name);
    expect(panel).toEqual(['radiusOfGyration', 'maxRadius', 'massRadius']);
    const html = readFileSync(join(dir, 'on', 'report.html'), 'utf8');
    expect(html).toMatch(/data-estimator="radiusOfGyrationCorrected"[^]*?not determined: /);
    expect(html).toContain('A fit gives D, ω, A and B only when every rule holds');
    const csv = readFileSync(join(dir, 'on', 'estimators.csv'), 'utf8').split('\n').find((l) => l.startsWith('radiusOfGyrationCorrected,'))!;
    expect(csv.split(',')[2]).toBe('false');
    expect(csv.split(',')[3]).toBe('');
  });
});
