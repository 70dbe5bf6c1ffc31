import { runNode } from './support/run-node.js';
import { describe, expect, it, beforeAll } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const CLI = join(process.cwd(), 'dist/coordinator/cli.js');
function tendril(args: string[]) {
  return runNode([CLI, ...args], { timeout: 60000 });
}

describe('tendril probe', () => {
  let dir: string;
  let csv: string;
  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'tendril-probe-'));
    csv = join(dir, 'disks.csv');
    const rows = ['x,y,r'];
    for (let i = 0; i < 80; i++) rows.push(`${Math.cos(i / 5) * (3 + i / 4)},${Math.sin(i / 5) * (3 + i / 4)},0.5`);
    writeFileSync(csv, rows.join('\n') + '\n');
  });

  it('writes measures, hit counts and a picture; threads do not change the counts', async () => {
    const a = await tendril(['probe', csv, '--walkers', '4000', '--seed', '3', '--out', join(dir, 'a'), '--jobs', '4']);
    expect(a.status, a.stderr).toBe(0);
    const b = await tendril(['probe', csv, '--walkers', '4000', '--seed', '3', '--out', join(dir, 'b'), '--jobs', '4', '--threads', '2']);
    expect(b.status, b.stderr).toBe(0);
    const hitsA = readFileSync(join(dir, 'a', 'probe-hits.csv'), 'utf8');
    expect(hitsA).toBe(readFileSync(join(dir, 'b', 'probe-hits.csv'), 'utf8'));
    const lines = hitsA.trim().split('\n');
    expect(lines[0]).toBe('index,x,y,r,hits,measure');
    expect(lines.length).toBe(81);
    expect(lines.slice(1).reduce((s, l) => s + Number(l.split(',')[4]), 0)).toBe(4000);
    const m = JSON.parse(readFileSync(join(dir, 'a', 'probe-measures.json'), 'utf8'));
    expect(m.walkers).toBe(4000);
    expect(m.spectrum.q.length).toBe(25);
    expect(m.spectrum.tau.length).toBe(25);
    expect(m.capacity.capacity).toBeGreaterThan(0);
    expect(m.converged.length).toBe(25);
    expect(typeof m.maxConcentration.exponent).toBe('number');
    expect(m.boxes.maxMeasure.length).toBe(m.window.scales);
    expect(readFileSync(join(dir, 'a', 'probe-measure.png')).subarray(1, 4).toString()).toBe('PNG');
    // the same picture with a title and its colour key (quantiles of log ω)
    expect(readFileSync(join(dir, 'a', 'probe-measure-figure.png')).subarray(1, 4).toString()).toBe('PNG');
  });

  it('--window sets the fit window relative to R; the contact-radius systematic and its warning are reported', async () => {
    const a = await tendril(['probe', csv, '--walkers', '2000', '--seed', '3', '--out', join(dir, 'w'), '--window', '0.05:0.5', '--q-grid', '0:4:1']);
    expect(a.status, a.stderr).toBe(0);
    const m = JSON.parse(readFileSync(join(dir, 'w', 'probe-measures.json'), 'utf8'));
    expect(m.window.relativeMin).toBeCloseTo(0.05, 12);
    expect(m.window.relativeMax).toBeCloseTo(0.5, 12);
    // R is about 23, so the smallest box (about 1.2) is below 8 contact radii (4): warned, on stderr too
    expect(m.warnings.length).toBe(1);
    expect(a.stderr).toMatch(/warning: smallest box side .* is below 8 contact radii/);
    expect(m.resolutionSystematic.tau[1]).toBe(0); // q = 1: tau(1) = 0 exactly
    expect(m.resolutionSystematic.tau[4]).toBeCloseTo(3 * m.resolutionSystematic.tau[2], 12);
    expect(m.resolutionSystematic.tau[2]).toBeGreaterThan(0.05);
  });

  it('probes a grown snapshot', async () => {
    const g = await tendril(['grow', '--particles', '300', '--seed', '2', '--out', join(dir, 'g'), '--quiet']);
    expect(g.status, g.stderr).toBe(0);
    const p = await tendril(['probe', join(dir, 'g', 'cluster.snapshot'), '--walkers', '3000', '--seed', '1', '--out', join(dir, 'gp'), '--q-grid', '0:3:1']);
    expect(p.status, p.stderr).toBe(0);
    const m = JSON.parse(readFileSync(join(dir, 'gp', 'probe-measures.json'), 'utf8'));
    expect(m.input.kind).toBe('snapshot');
    // no --jobs: the default of a spec's [probe] table and of POST /probes (coordinator/harmonic/probe-settings.ts)
    expect(m.jobs).toBe(2);
    expect(m.spectrum.q).toEqual([0, 1, 2, 3]);
  });

  it.each([
    [['--walkers', '5'], /^tendril: --walkers: 5 is out of range; allowed: an integer from 100 to 10000000000 \(walkers\)$/m],
    [['--walkers', '1000', '--jobs', '0'], /^tendril: --jobs: 0 is out of range; allowed: an integer from 1 to 4096 \(jobs\)$/m],
    [['--walkers', '1000', '--jobs', '2000'], /^tendril: --jobs: 2000 is out of range; allowed: an integer from 1 to --walkers \(1000\)$/m],
    [['--walkers', '1000', '--q-grid', '3:1:1'], /^tendril: --q-grid: "3:1:1" is not allowed; allowed: a:b:step with/m],
    [['--walkers', '1000', '--threads', '99'], /^tendril: --threads: 99 is out of range; allowed: an integer from 1 to 64$/m],
    [['--walkers', '1000', '--min-step', '2'], /^tendril: --min-step: 2 is out of range; allowed: a number above 0 and at most 1 \(largest contact radii\)$/m],
    [['--walkers', '1000', '--window', '0.3:0.5'], /--window: "0.3:0.5" is not allowed; allowed: lo:hi, two numbers lo, hi with 0 < lo < hi <= 1 and hi >= 2 lo/],
    [['--walkers', '1000', '--window', '0.1'], /--window: "0.1" is not allowed; allowed: lo:hi, /],
  ])('refuses %j with one line naming the option', async (extra, re) => {
    const r = await tendril(['probe', csv, '--seed', '1', '--out', join(dir, 'bad'), ...(extra as string[])]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(re as RegExp);
    expect(r.stderr.trim().split('\n').length).toBe(1);
  });

  it('refuses bad inputs with one line', async () => {
    const bad = join(dir, 'bad.csv');
    writeFileSync(bad, 'x,y,r\n1,2,0.5\n3,4,-1\n');
    const r = await tendril(['probe', bad, '--walkers', '1000', '--seed', '1', '--out', join(dir, 'bad2')]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/line 3: r must be a finite number > 0, got "-1"/);
    const missing = await tendril(['probe', join(dir, 'nope.csv'), '--walkers', '1000', '--seed', '1', '--out', join(dir, 'bad3')]);
    expect(missing.status).toBe(2);
    expect(missing.stderr).toMatch(/INPUT .*nope.csv" cannot be read: ENOENT/);
    expect(existsSync(join(dir, 'bad3', 'probe-measures.json'))).toBe(false);
  });
});
