import { runNode } from './support/run-node.js';
import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

// One-line messages naming the flag or field, the value and what is allowed,
// for the cases a new user tripped over (issue: raw ENOTDIR texts, a doubled
// "spec file" prefix, a corrupt snapshot called a wrong extension, a seed of
// 2^64 or more without the hint to quote it, validation in two rounds, an
// unusable --out found only after growing, Ctrl-C on grow leaving a folder).

const CLI = join(__dirname, '..', 'dist', 'coordinator', 'cli.js');
const dir = mkdtempSync(join(tmpdir(), 'tendril-messages-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const cli = (...args: string[]) => runNode([CLI, ...args], { cwd: dir, timeout: 60_000 });

describe('CLI messages', () => {
  writeFileSync(join(dir, 'afile'), 'x');
  writeFileSync(join(dir, 'demo.toml'), 'model = "dla-offlattice-2d"\nparticles = 2000000\nclusters = 4\nseed = 1\n');

  it('an --out below a file is refused before any growth, in one line without raw error codes', async () => {
    for (const [cmd, args] of [['grow', ['--particles', '10', '--seed', '1']], ['run', ['demo.toml']]] as const) {
      const t0 = Date.now();
      const r = await cli(cmd, ...args, '--out', 'afile/sub');
      expect(r.status).toBe(2);
      expect(r.stderr).toBe(`tendril: --out: "afile/sub" cannot be created: "${join(dir, 'afile')}" is a file, not a folder\n`);
      expect(r.stderr).not.toMatch(/ENOTDIR|EEXIST/);
      expect(Date.now() - t0).toBeLessThan(60_000); // refused before growing 4 clusters of 2·10^6 (no timing claim beyond that)
    }
    const f = await cli('grow', '--particles', '10', '--seed', '1', '--out', 'afile');
    expect(f.stderr).toBe('tendril: --out: "afile" is an existing file; allowed: a folder, or a path that does not exist yet\n');
  });

  it('spec files: one prefix, every problem in one round, and the hint to quote a large seed', async () => {
    writeFileSync(join(dir, 'two.toml'), 'model = "dla-offlattice-2d"\nparticles = 1\nseed = 3\n');
    const two = await cli('run', 'two.toml', '--out', 'o2');
    expect(two.stderr).toBe('tendril: spec file "two.toml": 2 problems: particles: 1 is out of range; allowed: an integer from 2 to 100000000; clusters: missing; allowed: an integer from 1 to 100000 (or a [target] table with max_clusters)\n');
    writeFileSync(join(dir, 'big.toml'), 'model = "dla-offlattice-2d"\nparticles = 100\nclusters = 1\nseed = 18446744073709551615\n');
    const big = await cli('run', 'big.toml', '--out', 'o3');
    expect(big.stderr).toMatch(/^tendril: spec file "big\.toml": spec is not valid TOML \(line 4, column \d+\): .*; an integer of 2\^63 or more .* must be quoted: seed = "18446744073709551615"\n$/);
    writeFileSync(join(dir, 'spec.yaml'), 'model: x\n');
    expect((await cli('run', 'spec.yaml', '--out', 'o4')).stderr).toBe('tendril: spec file "spec.yaml": unknown format; allowed: a name ending in .toml or .json\n');
    expect(existsSync(join(dir, 'o2'))).toBe(false);
  });

  it('a damaged .snapshot is called damaged, not a wrong extension', async () => {
    writeFileSync(join(dir, 'bad.snapshot'), 'garbage');
    const r = await cli('probe', 'bad.snapshot', '--walkers', '100', '--seed', '1', '--out', 'pr');
    expect(r.status).not.toBe(0);
    expect(r.stderr).toMatch(/^tendril: INPUT "bad\.snapshot" is not a valid snapshot: .+\n$/);
  });

  it('Ctrl-C while grow grows leaves no empty output folder', async () => {
    const out = join(dir, 'interrupted');
    const child = spawn(process.execPath, [CLI, 'grow', '--particles', '5000000', '--seed', '1', '--out', out], { stdio: ['ignore', 'ignore', 'pipe'] });
    let err = '';
    child.stderr!.on('data', (d) => (err += d));
    // wait until it is growing (its first progress line or a second), then interrupt
    await new Promise((r) => setTimeout(r, 1500));
    child.kill('SIGINT');
    await new Promise((r) => child.once('exit', r));
    expect(existsSync(out), err).toBe(false);
  });
});
