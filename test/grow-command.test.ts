import { runNode } from './support/run-node.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { defaultModelParams, MODEL_KINDS } from '../worker/models/registry.js';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { PNG } from 'pngjs';
import { decodeSnapshot } from '../coordinator/snapshot/index.js';
import { DARK_BACKGROUND, parseHex } from '../coordinator/render/index.js';
import { createProgress, formatDuration, formatRate, rateText, ThroughputWindow } from '../coordinator/progress/index.js';
import { clusterRadii } from '../coordinator/commands/grow.js';

// The command is tested as users run it: the compiled CLI (`npx tsc` first).
const CLI = fileURLToPath(new URL('../dist/coordinator/cli.js', import.meta.url));

interface Ran {
  status: number | null;
  stdout: string;
  stderr: string;
}

async function tendril(...args: string[]): Promise<Ran> {
  const r = await runNode([CLI, ...args], { timeout: 60_000 });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

let work: string;

beforeAll(async () => {
  if (!existsSync(CLI)) throw new Error(`${CLI} is missing; run npx tsc -p tsconfig.json first`);
  work = mkdtempSync(join(tmpdir(), 'tendril-grow-test-'));
});

afterAll(() => {
  if (work !== undefined) rmSync(work, { recursive: true, force: true });
});

describe('tendril grow, end to end', () => {
  const N = 2000;
  let first: Ran;
  let dirA: string;

  beforeAll(async () => {
    dirA = join(work, 'a', 'nested'); // parent folders do not exist yet
    first = await tendril('grow', '--particles', String(N), '--seed', '42', '--out', dirA, '--picture-size', '256');
  });

  it('succeeds and prints the three paths and a summary line', async () => {
    expect(first.stderr).toMatch(/^grow: 2000\/2000 particles \(100\.0%\), .* particles\/s on average, .* elapsed\n$/);
    expect(first.status).toBe(0);
    const lines = first.stdout.trimEnd().split('\n');
    expect(lines.slice(0, 4)).toEqual([join(dirA, 'run-result.json'), join(dirA, 'cluster.snapshot'), join(dirA, 'cluster.png'), join(dirA, 'cluster-figure.png')]);
    expect(lines[4]).toMatch(/^grew 2000 particles \(seed 42\): R_g = \d+\.\d\d, R_max = \d+\.\d\d, [\d,.]+ particles\/s over \d+\.\d s$/);
  });

  it('writes a figure of the cluster with a scale bar and a colour key beside the bare picture', async () => {
    const fig = PNG.sync.read(readFileSync(join(dirA, 'cluster-figure.png')));
    // the figure is the report's sample-cluster SVG (760 wide, at twice its size): title, picture, scale bar, key
    expect(fig.width).toBe(2 * 760);
    expect(fig.height).toBeGreaterThan(fig.width);
  });

  it('writes a run result with the GrowthResult and a separate timing field', async () => {
    const rr = JSON.parse(readFileSync(join(dirA, 'run-result.json'), 'utf8'));
    expect(rr.particles).toBe(N);
    expect(rr.ensembleSeed).toBe('42');
    expect(rr.runIndex).toBe(0);
    expect(rr.model).toEqual(defaultModelParams('dla-offlattice-2d'));
    expect(rr.stateHash).toMatch(/^[0-9a-f]{8,}$/);
    expect(rr.counters.jumps).toBeGreaterThan(N);
    expect(rr.series.sizes.length).toBeGreaterThan(20);
    expect(Math.max(...rr.series.sizes)).toBeLessThanOrEqual(N);
    for (const k of ['growSeconds', 'writeSeconds', 'wallSeconds', 'particlesPerSecond']) {
      expect(typeof rr.timing[k]).toBe('number');
      expect(rr.timing[k]).toBeGreaterThan(0);
    }
    expect(rr.timing.particlesPerSecond).toBeCloseTo(N / rr.timing.growSeconds, 6);
    expect(Number.isNaN(Date.parse(rr.timing.startedAt))).toBe(false);
  });

  it('writes a snapshot of touching, non-overlapping disks that matches the summary', async () => {
    const s = decodeSnapshot(readFileSync(join(dirA, 'cluster.snapshot')));
    expect(s.dimension).toBe(2);
    expect(s.count).toBe(N);
    expect(s.diameter).toBe(1);
    expect(s.arrivalOrder).toBe(true);
    expect([s.x[0], s.y[0]]).toEqual([0, 0]); // the seed sits at the origin (worker/models/dla-offlattice-2d/kernel.ts)
    // Model definition (worker/models/dla-offlattice-2d/kernel.ts header): each arrival touches an earlier disk and overlaps none.
    // Tolerance 1e-9 diameters allows for floating-point rounding of the contact point.
    let worstOverlap = 0;
    let worstGap = 0;
    for (let i = 1; i < N; i++) {
      let nearest = Infinity;
      for (let j = 0; j < i; j++) {
        const d = Math.hypot(s.x[i] - s.x[j], s.y[i] - s.y[j]);
        if (d < nearest) nearest = d;
      }
      worstOverlap = Math.max(worstOverlap, 1 - nearest);
      worstGap = Math.max(worstGap, nearest - 1);
    }
    expect(worstOverlap).toBeLessThan(1e-9);
    expect(worstGap).toBeLessThan(1e-9);
    const coords = new Float64Array(2 * s.count);
    for (let i = 0; i < s.count; i++) [coords[2 * i], coords[2 * i + 1]] = [s.x[i], s.y[i]];
    const radii = clusterRadii({ dimension: 2, count: s.count, coords });
    const summary = first.stdout.trimEnd().split('\n')[4];
    expect(summary).toContain(`R_g = ${radii.radiusOfGyration.toFixed(2)}`);
    expect(summary).toContain(`R_max = ${radii.maxRadius.toFixed(2)}`);
  });

  it('writes a picture of the requested size that is not blank', async () => {
    const png = PNG.sync.read(readFileSync(join(dirA, 'cluster.png')));
    expect(png.width).toBe(256);
    expect(png.height).toBe(256);
    const bg = parseHex(DARK_BACKGROUND);
    let painted = 0;
    const colours = new Set<number>();
    for (let o = 0; o < png.data.length; o += 4) {
      const r = png.data[o];
      const g = png.data[o + 1];
      const b = png.data[o + 2];
      if (r !== bg.r || g !== bg.g || b !== bg.b) {
        painted++;
        colours.add((r << 16) | (g << 8) | b);
      }
    }
    expect(painted).toBeGreaterThan(0.02 * 256 * 256);
    expect(colours.size).toBeGreaterThan(50);
    // corners are background
    expect([png.data[0], png.data[1], png.data[2]]).toEqual([bg.r, bg.g, bg.b]);
  });

  it('is deterministic: the same seed gives the same state hash and snapshot bytes; another seed does not', async () => {
    const dirB = join(work, 'b');
    const dirC = join(work, 'c');
    const again = await tendril('grow', '--particles', String(N), '--seed', '042', '--out', dirB, '--picture-size', '64', '--quiet');
    expect(again.status).toBe(0);
    expect(again.stderr).toBe(''); // --quiet: no progress at all
    const other = await tendril('grow', '--particles', String(N), '--seed', '43', '--out', dirC, '--picture-size', '64', '--quiet');
    expect(other.status).toBe(0);
    const a = JSON.parse(readFileSync(join(dirA, 'run-result.json'), 'utf8'));
    const b = JSON.parse(readFileSync(join(dirB, 'run-result.json'), 'utf8'));
    const c = JSON.parse(readFileSync(join(dirC, 'run-result.json'), 'utf8'));
    expect(b.stateHash).toBe(a.stateHash);
    delete a.timing;
    delete b.timing;
    expect(b).toEqual(a);
    expect(Buffer.compare(readFileSync(join(dirA, 'cluster.snapshot')), readFileSync(join(dirB, 'cluster.snapshot')))).toBe(0);
    expect(c.stateHash).not.toBe(a.stateHash);
    expect(Buffer.compare(readFileSync(join(dirA, 'cluster.snapshot')), readFileSync(join(dirC, 'cluster.snapshot')))).not.toBe(0);
  });

  it('passes model options through to the result', async () => {
    const dir = join(work, 'opts');
    const r = await tendril('grow', '--particles', '300', '--seed', '18446744073709551615', '--out', dir, '--model', 'dla-offlattice-2d', '--param', 'min_step=0.5',
      '--param', 'launch_margin=7.5', '--records-per-decade', '10', '--picture-size', '64', '--quiet');
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const rr = JSON.parse(readFileSync(join(dir, 'run-result.json'), 'utf8'));
    expect(rr.model).toEqual({ kind: 'dla-offlattice-2d', params: { min_step: 0.5, launch_margin: 7.5 } });
    expect(rr.ensembleSeed).toBe('18446744073709551615');
    expect(rr.particles).toBe(300);
  });
});

describe('tendril grow, bad options', () => {
  const ok = ['--seed', '1', '--out'];
  const R = 'an integer from';
  const cases: Array<[string, string[], string]> = [
    ['particles not a number', ['--particles', 'abc'], `tendril: --particles: "abc" is not a number; allowed: ${R} 2 to 1000000000`],
    ['particles too small', ['--particles', '1'], `tendril: --particles: 1 is out of range; allowed: ${R} 2 to 1000000000`],
    ['particles too large', ['--particles', '1000000001'], `tendril: --particles: 1000000001 is out of range; allowed: ${R} 2 to 1000000000`],
    ['particles fractional', ['--particles', '2.5'], `tendril: --particles: 2.5 is out of range; allowed: ${R} 2 to 1000000000`],
    ['particles missing', [], 'tendril: --particles: missing; allowed: an integer from 2 to 1000000000'],
    ['seed negative', ['--particles', '10', '--seed', '-1'], 'tendril: --seed: "-1" is not allowed; allowed: an unsigned 64-bit integer from 0 to 18446744073709551615 in decimal'],
    ['seed 2^64', ['--particles', '10', '--seed', '18446744073709551616'], 'tendril: --seed: "18446744073709551616" is not allowed; allowed: an unsigned 64-bit integer from 0 to 18446744073709551615 in decimal'],
    ['seed hex', ['--particles', '10', '--seed', '0x10'], 'tendril: --seed: "0x10" is not allowed; allowed: an unsigned 64-bit integer from 0 to 18446744073709551615 in decimal'],
    ['min_step zero', ['--particles', '10', '--param', 'min_step=0'], 'tendril: --param min_step: 0 is out of range; allowed: a number above 0 and at most 1 (particle diameters, for dla-offlattice-2d)'],
    ['min_step above 1', ['--particles', '10', '--param', 'min_step=1.01'], 'tendril: --param min_step: 1.01 is out of range; allowed: a number above 0 and at most 1 (particle diameters, for dla-offlattice-2d)'],
    ['min_step not a number', ['--particles', '10', '--param', 'min_step=NaN'], 'tendril: --param min_step: "NaN" is not a number; allowed: a number above 0 and at most 1 (particle diameters, for dla-offlattice-2d)'],
    ['launch_margin zero', ['--particles', '10', '--param', 'launch_margin=0'], 'tendril: --param launch_margin: 0 is out of range; allowed: a number above 0 and at most 1000 (particle diameters, for dla-offlattice-2d)'],
    ['launch_margin too large', ['--particles', '10', '--param', 'launch_margin=1e4'], 'tendril: --param launch_margin: 10000 is out of range; allowed: a number above 0 and at most 1000 (particle diameters, for dla-offlattice-2d)'],
    ['unknown parameter', ['--particles', '10', '--param', 'eta=2'], 'tendril: --param eta: not a parameter of dla-offlattice-2d; allowed: min_step, launch_margin'],
    ['parameter without a value', ['--particles', '10', '--param', 'min_step'], 'tendril: --param: "min_step" is not allowed; allowed: NAME=VALUE with NAME one of min_step, launch_margin'],
    // every registered model in registry order (a new model needs no edit here)
    ['unknown model', ['--particles', '10', '--model', 'dla-3d-foo'], `tendril: --model: "dla-3d-foo" is not a model; allowed: one of ${MODEL_KINDS.join(', ')} (see tendril models)`],
    ['picture-size too small', ['--particles', '10', '--picture-size', '63'], `tendril: --picture-size: 63 is out of range; allowed: ${R} 64 to 8192 (pixels)`],
    ['picture-size too large', ['--particles', '10', '--picture-size', '8193'], `tendril: --picture-size: 8193 is out of range; allowed: ${R} 64 to 8192 (pixels)`],
    ['records-per-decade too small', ['--particles', '10', '--records-per-decade', '9'], `tendril: --records-per-decade: 9 is out of range; allowed: ${R} 10 to 100`],
    ['records-per-decade too large', ['--particles', '10', '--records-per-decade', '101'], `tendril: --records-per-decade: 101 is out of range; allowed: ${R} 10 to 100`],
    ['records-per-decade empty', ['--particles', '10', '--records-per-decade', ''], `tendril: --records-per-decade: "" is not a number; allowed: ${R} 10 to 100`],
  ];

  it.each(cases)('%s', async (_name, args, expected) => {
    const out = join(work, 'never-' + _name.replace(/\W+/g, '-'));
    const full = args.includes('--seed') ? ['grow', ...args, '--out', out] : ['grow', ...args, ...ok, out];
    const r = await tendril(...full);
    expect(r.stderr).toBe(expected + '\n');
    expect(r.stdout).toBe('');
    expect(r.status).toBe(2);
    expect(existsSync(out)).toBe(false);
  });

  it('a missing --out and an --out that is a file are one-line errors', async () => {
    const noOut = await tendril('grow', '--particles', '10', '--seed', '1');
    expect(noOut.stderr).toBe('tendril: --out: missing; allowed: a folder name (created if missing)\n');
    expect(noOut.status).toBe(2);
    const file = join(work, 'a-file');
    writeFileSync(file, 'x');
    const onFile = await tendril('grow', '--particles', '10', '--seed', '1', '--out', file);
    expect(onFile.stderr).toBe(`tendril: --out: "${file}" is an existing file; allowed: a folder, or a path that does not exist yet\n`);
    expect(onFile.status).toBe(2);
  });

  it('an unknown option is refused by the parser with one line', async () => {
    const r = await tendril('grow', '--particles', '10', '--seed', '1', '--out', join(work, 'x'), '--sparkle');
    expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/unknown option '--sparkle'/);
    expect(r.status).not.toBe(0);
  });
});

describe('progress display without a terminal', () => {
  function fakeStream(): { stream: NodeJS.WritableStream & { isTTY?: boolean }; text: () => string } {
    let text = '';
    const stream = { isTTY: false, write: (s: string) => { text += s; return true; } } as unknown as NodeJS.WritableStream;
    return { stream, text: () => text };
  }

  it('prints plain lines at most every interval and one at the end', async () => {
    let t = 0;
    const out = fakeStream();
    const p = createProgress({ total: 1000, unit: 'particles', label: 'grow', stream: out.stream, lineIntervalSeconds: 10, now: () => t });
    expect(p.mode).toBe('lines');
    t = 5000;
    p.update(100); // too early for a line
    t = 10_000;
    p.update(200);
    t = 15_000;
    p.update(300); // 5 s after the last line: none
    t = 20_000;
    p.update(400);
    t = 25_000;
    p.update(1000);
    p.stop();
    p.stop();
    expect(out.text().split('\n')).toEqual([
      // the first update is the baseline; the rate is over the samples since (30 s window)
      'grow: 200/1000 particles (20.0%), 20.0 particles/s, about 40 s left',
      'grow: 400/1000 particles (40.0%), 20.0 particles/s, about 30 s left',
      'grow: 1000/1000 particles (100.0%), 36.0 particles/s on average, 25 s elapsed',
      '',
    ]);
  });

  it('rates: work done before the start and replayed work never count; the rate is over a recent window; nothing is guessed before it is known', async () => {
    let t = 0;
    // watching a finished ensemble: the whole count was there at the start
    const out = fakeStream();
    const w = createProgress({ total: 320000, unit: 'particles', label: 'demo', stream: out.stream, now: () => t });
    w.update(320000);
    t = 40;
    w.update(320000);
    w.stop();
    expect(out.text()).toBe('demo: 320000/320000 particles (100.0%), 0 s elapsed\n');

    // a resumed run: 6000 particles of results reused and 1000 from a checkpoint, then 100 particles/s grown
    t = 0;
    const out2 = fakeStream();
    const r = createProgress({ total: 20000, unit: 'particles', label: 'run', stream: out2.stream, lineIntervalSeconds: 12, now: () => t });
    r.update(6000, { replayed: 6000 }); // reused results appear at once
    t = 1000; r.update(7100, { replayed: 7000 }); // a run resumes from its checkpoint at 1000 and grows 100 in the first second
    for (let s = 2; s <= 12; s++) { t = s * 1000; r.update(7100 + (s - 1) * 100, { replayed: 7000 }); }
    expect(out2.text()).toBe('run: 8200/20000 particles (41.0%), 100 particles/s, about 1 min 58 s left\n');

    // the window: 1000/s for a minute, then 10/s; after 30 s more the rate is the recent one
    expect(new ThroughputWindow(30_000).rate()).toBeNull();
    const win = new ThroughputWindow(30_000);
    for (let s = 0; s <= 95; s++) win.add(s * 1000, s <= 60 ? s * 1000 : 60000 + (s - 60) * 10);
    expect(win.rate()).toBeCloseTo(10, 10);

    // before a rate is known: no "?", no "0 s left", no stray separators
    expect(rateText(null, 500, 'particles')).toBe('');
    t = 0;
    const out4 = fakeStream();
    const e = createProgress({ total: 100, unit: 'particles', label: 'e', stream: out4.stream, lineIntervalSeconds: 0, now: () => t });
    e.update(0);
    t = 1000; e.update(0);
    expect(out4.text()).toBe('e: 0/100 particles (0.0%)\ne: 0/100 particles (0.0%)\n');
    expect(out4.text()).not.toMatch(/\?|0 s left|;/);
  });

  it('prints nothing in none mode and formats durations and rates', async () => {
    const out = fakeStream();
    const p = createProgress({ total: 10, unit: 'particles', stream: out.stream, mode: 'none' });
    p.update(5);
    p.stop();
    expect(out.text()).toBe('');
    expect(formatDuration(59.4)).toBe('59 s');
    expect(formatDuration(125)).toBe('2 min 05 s');
    expect(formatDuration(7260)).toBe('2 h 01 min');
    expect(formatDuration(NaN)).toBe('?');
    expect(formatRate(12345.6)).toBe('12,346');
    expect(formatRate(12.345)).toBe('12.3');
  });
});
