import { execFile } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { describe, expect, it } from 'vitest';
import { EnsembleStore } from '../coordinator/farm/store.js';
import { parseSpec } from '../coordinator/spec/index.js';
import { runTaskFor } from '../coordinator/plan.js';
import { growthTaskOf } from '../proto/convert.js';
import { createKernel } from '../worker/models/registry.js';
import { privateRedis, CLI, REDIS_URL, ROOT, startWorker, waitFor } from './farm-helpers.js';
import { farmFixture } from './support/farm-fixture.js';

const run = promisify(execFile);
const { prefix, artifacts: dir, redis, workers } = farmFixture('cli');

async function cli(...args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  try {
    const r = await run(process.execPath, [CLI, ...args], { cwd: ROOT, env: { ...process.env, REDIS_URL } });
    return { code: 0, stdout: r.stdout, stderr: r.stderr };
  } catch (e) {
    const err = e as { code: number; stdout: string; stderr: string };
    return { code: err.code, stdout: err.stdout, stderr: err.stderr };
  }
}

describe('tendril CLI (farm and embedded commands)', () => {
  it('tendril run grows the demo spec and writes the summary files', async () => {
    const out = join(dir, 'demo');
    const r = await cli('run', 'examples/demo.toml', '--out', out, '--threads', '2', '--progress', 'none');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^coral-reef-demo: 8 clusters of 5000 particles in [\d.]+ s$/m);
    expect(r.stdout).toMatch(/^D from R_g\(N\): 1\.\d{4} \[1\.\d{4}, 1\.\d{4}\] \(95% BCa\), fit over N = 200\.\.5000$/m);
    const summary = JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8'));
    expect(summary.clusters_done).toBe(8);
    expect(summary.partial).toBe(false);
    // the analysis is in the summary, and the same numbers are in the estimator table and the report
    const rg = summary.statistics.estimators.radiusOfGyration;
    expect(rg.available).toBe(true);
    expect(rg.interval.bca[0]).toBeLessThan(rg.D);
    expect(rg.interval.bca[1]).toBeGreaterThan(rg.D);
    const est = readFileSync(join(out, 'estimators.csv'), 'utf8').trim().split('\n').map((l) => l.split(','));
    const row = est.find((c) => c[0] === 'radiusOfGyration')!;
    expect(Number(row[est[0].indexOf('D')])).toBe(rg.D);
    expect(Number(row[est[0].indexOf('bca_low')])).toBe(rg.interval.bca[0]);
    expect(readFileSync(join(out, 'report.html'), 'utf8')).toContain('<svg');
    const spec = parseSpec(readFileSync(join(ROOT, 'examples/demo.toml'), 'utf8'), 'toml');
    const k = createKernel(growthTaskOf(runTaskFor('x', spec, 5)));
    k.growTo(spec.particles);
    expect(summary.runs[5].state_hash).toBe(k.result().stateHash);
    expect(readFileSync(join(out, 'runs.csv'), 'utf8').split('\n')[0]).toBe('run_index,particles,state_hash,jumps,short_steps,returns,grow_seconds,resumes,finished_by');
    // a second run with the same output folder reuses the stored results
    const again = await cli('run', 'examples/demo.toml', '--out', out, '--progress', 'none');
    expect(again.stdout).toMatch(/\(8 taken from an earlier run\)/);
  }, 120_000);

  it('a bad spec is refused at the CLI with one line and exit code 2, before anything is queued', async () => {
    const bad = join(dir, 'bad.toml');
    writeFileSync(bad, 'model = "dla-offlattice-2d"\nparticles = 1000000000\nclusters = 3\nseed = 1\n');
    const r = await cli('launch', bad, '--prefix', prefix);
    expect(r.code).toBe(2);
    expect(r.stderr).toBe(`tendril: spec file "${bad}": particles: 1000000000 is out of range; allowed: an integer from 2 to 100000000\n`);
    expect(await new EnsembleStore(redis, prefix).ids()).toEqual([]);
  });

  it('launch, status, summary and cancel work against Redis; errors are one line', async () => {
    const spec = join(dir, 'small.json');
    writeFileSync(spec, JSON.stringify({ model: 'dla-offlattice-2d', particles: 800, clusters: 3, seed: '5' }));
    const launched = await cli('launch', spec, '--prefix', prefix);
    expect(launched.code).toBe(0);
    const id = launched.stdout.trim();
    const st = await cli('status', id, '--prefix', prefix, '--json');
    expect(JSON.parse(st.stdout).runs.planned).toBe(3);
    workers.push(await startWorker({ prefix, artifacts: join(dir, 'artifacts') }));
    await waitFor('done', async () => JSON.parse((await cli('status', id, '--prefix', prefix, '--json')).stdout).state === 'done');
    const csvFile = join(dir, 'summary.csv');
    expect((await cli('summary', id, '--prefix', prefix, '--format', 'csv', '--out', csvFile)).code).toBe(0);
    expect(readFileSync(csvFile, 'utf8').split('\n')[0]).toBe('run_index,state_hash,size,radius_of_gyration,max_radius,center_offset,fold_amplitude_4,axis_ratio_4,fold_amplitude_6,axis_ratio_6,shell_count,fold_phase_4,fold_phase_6');
    const watch = await cli('watch', id, '--prefix', prefix, '--progress', 'lines');
    expect(watch.stdout).toMatch(new RegExp(`^${id}  done +.*runs 3/3 done, 0 running, 0 queued, 0 failed; 2400/2400 particles\n$`));
    // a finished ensemble grows nothing while watched: no rate, no time left
    expect(watch.stderr).toMatch(/^.*: 2400\/2400 particles \(100\.0%\), \d+ s elapsed\n$/);
    const list = await cli('list', '--prefix', prefix);
    expect(list.stdout).toContain(id);
    const unknown = await cli('status', 'enope', '--prefix', prefix);
    expect(unknown.code).toBe(2);
    expect(unknown.stderr).toBe('tendril: ensemble id: "enope" is not known to this farm\n');
    const fmt = await cli('summary', id, '--prefix', prefix, '--format', 'xml');
    expect(fmt.stderr).toBe('tendril: --format: "xml" is not allowed; allowed: json, csv, pb, tables, html\n');
    const noRedis = await cli('list', '--redis', 'redis://127.0.0.1:1');
    expect(noRedis.code).toBe(2);
    expect(noRedis.stderr).toMatch(/^tendril: --redis: cannot reach redis:\/\/127\.0\.0\.1:1: .*\n$/);
    const cancel = await cli('cancel', id, '--prefix', prefix);
    expect(cancel.code).toBe(1);
    expect(cancel.stdout).toBe('');
    expect(cancel.stderr).toBe(`tendril: ensemble ${id} has already finished (state done); nothing was cancelled\n`);
    expect(JSON.parse((await cli('status', id, '--prefix', prefix, '--json')).stdout).state).toBe('done');
  }, 120_000);

  it('a Redis URL with a password works; a wrong password is one line', async () => {
    const server = await privateRedis({ password: 'pa ss/word' });
    try {
      const spec = join(dir, 'pw.json');
      writeFileSync(spec, JSON.stringify({ model: 'dla-offlattice-2d', particles: 100, clusters: 1, seed: 1 }));
      const launched = await cli('launch', spec, '--redis', server.url);
      expect(launched.code).toBe(0);
      const list = await cli('list', '--redis', server.url);
      expect(list.stdout).toContain(launched.stdout.trim());
      const wrong = await cli('list', '--redis', `redis://:nope@127.0.0.1:${server.port}`);
      expect(wrong.code).toBe(2);
      expect(wrong.stderr).toMatch(/^tendril: --redis: cannot reach redis:\/\/\*\*\*@127\.0\.0\.1:\d+: .*\n$/);
    } finally {
      await server.cleanup();
    }
  });

  it('serve refuses a non-loopback address without a token', async () => {
    const r = await cli('serve', '--host', '0.0.0.0', '--prefix', prefix);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/^tendril: --host: "0\.0\.0\.0" is reachable from other machines; allowed without an API token/);
  });
});
