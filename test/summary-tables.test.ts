/**
 * Summary tables and downloads: every CSV table of a real (small) DLA
 * ensemble loads as a rectangular table whose numbers equal the JSON
 * analysis; `tendril summary` writes the tables and the HTML report for a
 * farm ensemble, honours analysis overrides, and refuses bad ones in one line.
 */
import { execFile, spawn } from 'node:child_process';
import { existsSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { Redis } from 'ioredis';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runEmbedded, type EmbeddedOutcome } from '../coordinator/embedded/index.js';
import { launchEnsemble, runQueue } from '../coordinator/farm/queue.js';
import { EnsembleStore } from '../coordinator/farm/store.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { analysisOf, CSV_TABLES, summaryToJsonObject } from '../coordinator/summary/index.js';
import { encodeRunResult } from '../proto/convert.js';
import { CLI, deleteKeys, REDIS_URL, tempDir, uniquePrefix, waitFor } from './farm-helpers.js';

const run = promisify(execFile);
const dir = tempDir('summary-tables');
const prefix = uniquePrefix('summary');
const redis = new Redis(REDIS_URL, { maxRetriesPerRequest: null });
const spec = validateSpec({ name: 'tables', model: 'dla-offlattice-2d', particles: 600, clusters: 10, seed: 31, analysis: { resamples: 400 } });
let outcome: EmbeddedOutcome;

beforeAll(async () => {
  outcome = await runEmbedded(spec, { ensembleId: 'tables', threads: 2 });
}, 60_000);

afterAll(async () => {
  await deleteKeys(redis, prefix);
  redis.disconnect();
  rmSync(dir, { recursive: true, force: true });
});

/** A minimal CSV reader (our tables quote only text with commas or quotes). */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  for (const line of text.trimEnd().split('\n')) {
    const cells: string[] = [];
    let cur = '', quoted = false;
    for (let i = 0; i < line.length; i++) {
      const c = line[i];
      if (quoted) {
        if (c === '"' && line[i + 1] === '"') { cur += '"'; i++; } else if (c === '"') quoted = false; else cur += c;
      } else if (c === '"') quoted = true;
      else if (c === ',') { cells.push(cur); cur = ''; } else cur += c;
    }
    cells.push(cur);
    rows.push(cells);
  }
  return rows;
}

async function cli(...args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  try {
    const r = await run(process.execPath, [CLI, ...args], { env: { ...process.env, REDIS_URL } });
    return { code: 0, stdout: r.stdout, stderr: r.stderr };
  } catch (err) {
    const e = err as { code: number; stdout: string; stderr: string };
    return { code: e.code, stdout: e.stdout, stderr: e.stderr };
  }
}

describe('summary tables', () => {
  it('every CSV table is rectangular, and its numbers are those of the JSON summary', () => {
    const s = outcome.summary;
    const a = analysisOf(s)!;
    expect(a.clusters).toBe(10);
    expect(a.options.resamples).toBe(400); // from the spec's [analysis] table
    for (const [name, render] of Object.entries(CSV_TABLES)) {
      const rows = parseCsv(render(s));
      expect(rows.length, name).toBeGreaterThanOrEqual(1);
      for (const r of rows) expect(r.length, `${name}: ${r.join(',')}`).toBe(rows[0].length);
    }
    const series = parseCsv(CSV_TABLES.series(s));
    expect(series.length - 1).toBe(outcome.results.reduce((n, r) => n + r.series.sizes.length, 0));
    const est = parseCsv(CSV_TABLES.estimators(s));
    const col = (n: string) => est[0].indexOf(n);
    for (const name of ['radiusOfGyration', 'maxRadius', 'massRadius'] as const) {
      const row = est.find((r) => r[0] === name)!;
      const e = a.estimators[name];
      expect(Number(row[col('D')])).toBe(e.D);
      expect(Number(row[col('percentile_low')])).toBe(e.interval.percentile![0]);
      expect(Number(row[col('bca_high')])).toBe(e.interval.bca![1]);
      expect(Number(row[col('first_used')])).toBe(e.fitWindow!.firstUsed);
    }
    const local = parseCsv(CSV_TABLES['local-slopes'](s));
    const points = Object.values(a.estimators).reduce((n, e) => n + (e.localSlopes?.points.length ?? 0), 0);
    expect(points).toBeGreaterThan(0);
    expect(local.length - 1).toBe(points);
    const rg = a.estimators.radiusOfGyration.localSlopes!.points[0];
    const first = local.find((r) => r[0] === 'radiusOfGyration')!;
    expect([Number(first[1]), Number(first[2])]).toEqual([rg.at, rg.D]);
    expect(parseCsv(CSV_TABLES.batches(s))).toHaveLength(1); // fixed count: header only
    expect((summaryToJsonObject(s) as any).statistics.estimators.massRadius.fitWindow.variable).toBe('r');
  });

  it('tendril summary writes the tables and the report for a farm ensemble, with analysis overrides', async () => {
    const store = new EnsembleStore(redis, prefix);
    const queue = runQueue(redis, prefix);
    const id = await launchEnsemble(store, queue, spec);
    await queue.obliterate({ force: true }); // no worker here: the results are stored directly
    await queue.close();
    for (const r of outcome.results) {
      const mine = { ...r, ensembleId: id };
      await store.saveResult(mine, encodeRunResult(mine));
    }
    const out = join(dir, 'report');
    const r = await cli('summary', id, '--prefix', prefix, '--format', 'html', '--out', out, '--fit-window', '100:600', '--resamples', '200');
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^D from R_g\(N\): 1\.\d{4} \[1\.\d{4}, 1\.\d{4}\] \(95% BCa\), fit over N = 100\.\.600$/m);
    for (const f of ['report.html', 'summary.json', 'estimators.csv', 'local-slopes.csv', 'series.csv']) expect(existsSync(join(out, f)), f).toBe(true);
    const j = JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8'));
    expect(j.statistics.options.resamples).toBe(200);
    expect(j.statistics.estimators.radiusOfGyration.fitWindow.source).toBe('user');
    const tables = join(dir, 'tables');
    expect((await cli('summary', id, '--prefix', prefix, '--format', 'tables', '--out', tables)).code).toBe(0);
    expect(existsSync(join(tables, 'report.html'))).toBe(false);
    expect(readFileSync(join(tables, 'estimators.csv'), 'utf8').split('\n')[0]).toMatch(/^estimator,quantity,available,D,/);
    const one = await cli('summary', id, '--prefix', prefix, '--format', 'csv', '--table', 'local-slopes');
    expect(one.stdout.split('\n')[0]).toBe('estimator,at,D,percentile_low,percentile_high,bca_low,bca_high,interval_status');
    const bad = await cli('summary', id, '--prefix', prefix, '--level', '2');
    expect(bad.code).toBe(2);
    expect(bad.stderr).toBe('tendril: --level: 2 is out of range; allowed: a number from 0.5 to 0.999\n');
    const badWindow = await cli('summary', id, '--prefix', prefix, '--fit-window', '5000:100');
    expect(badWindow.stderr).toBe('tendril: --fit-window FROM: 5000 is not allowed; allowed: a number below --fit-window TO (100)\n');
    const noOut = await cli('summary', id, '--prefix', prefix, '--format', 'html');
    expect(noOut.stderr).toBe('tendril: --out: missing; allowed: a folder name (--format html writes several files)\n');
  }, 90_000);

  it('an interrupted tendril run leaves a partial summary of the runs finished so far', async () => {
    const specFile = join(dir, 'long.toml');
    writeFileSync(specFile, 'name = "long"\nmodel = "dla-offlattice-2d"\nparticles = 4000\nclusters = 200\nseed = 8\n');
    const out = join(dir, 'interrupted');
    const child = spawn(process.execPath, [CLI, 'run', specFile, '--out', out, '--threads', '1', '--progress', 'none'], { stdio: ['ignore', 'pipe', 'pipe'] });
    let err = '';
    child.stderr.on('data', (d) => (err += d));
    const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
    await waitFor('three stored results', async () => existsSync(join(out, 'state', 'tendril-run')) || (existsSync(join(out, 'state')) && JSON.stringify(readdirSync(join(out, 'state'), { recursive: true })).split('.result').length > 3), 60_000);
    child.kill('SIGINT');
    expect(await exited).toBe(130);
    expect(err).toMatch(/interrupted with \d+ of 200 runs done; checkpoints kept; wrote a partial summary; run the same command again to continue/);
    const j = JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8'));
    expect(j.partial).toBe(true);
    expect(j.clusters_planned).toBe(200);
    expect(j.clusters_done).toBeGreaterThanOrEqual(3);
    expect(j.clusters_done).toBeLessThan(200);
    expect(j.statistics.clusters).toBe(j.clusters_done);
  }, 90_000);
});
