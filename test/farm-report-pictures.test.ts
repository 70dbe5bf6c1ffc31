import { execFile } from 'node:child_process';
import { existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { Redis } from 'ioredis';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { reportPictures, REGROW_MAX_PARTICLES } from '../coordinator/commands/report-pictures.js';
import { DirectoryArtifactStore } from '../coordinator/farm/artifacts.js';
import { EnsembleStore } from '../coordinator/farm/store.js';
import { parseSpec } from '../coordinator/spec/index.js';
import { hitsKey } from '../worker/runtime/job-contract.js';
import { CLI, deleteKeys, REDIS_URL, ROOT, startWorker, stopWorker, tempDir, uniquePrefix, waitFor, type WorkerProc } from './farm-helpers.js';

// Farm reports (`tendril summary ID --format html`) picture a sample cluster
// and, for probed ensembles, a cluster coloured by harmonic measure, drawn
// from the workers' artifact folder; where a picture cannot be drawn, the
// report's notes say why (coordinator/commands/report-pictures.ts).

const run = promisify(execFile);
const dir = tempDir('report-pictures');
const artifacts = join(dir, 'artifacts');
const prefix = uniquePrefix('pictures');
const redis = new Redis(REDIS_URL, { maxRetriesPerRequest: null });
let worker: WorkerProc | undefined;
let id = '';

async function cli(...args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  try {
    const r = await run(process.execPath, [CLI, ...args, '--prefix', prefix], { cwd: ROOT, env: { ...process.env, REDIS_URL, TENDRIL_ARTIFACTS: '' } });
    return { code: 0, stdout: r.stdout, stderr: r.stderr };
  } catch (e) {
    const err = e as { code: number; stdout: string; stderr: string };
    return { code: err.code, stdout: err.stdout, stderr: err.stderr };
  }
}

const notesOf = (html: string) => [...html.matchAll(/<li>([^<]*)<\/li>/g)].map((m) => m[1].replace(/&#39;/g, "'"));

beforeAll(async () => {
  worker = await startWorker({ prefix, artifacts, concurrency: 2 });
  const spec = join(dir, 'probed.json');
  writeFileSync(spec, JSON.stringify({ name: 'pictures', model: 'dla-offlattice-2d', particles: 400, clusters: 3, seed: 11, probe: { walkers: 4000 } }));
  const launched = await cli('launch', spec);
  expect(launched.code).toBe(0);
  id = launched.stdout.trim();
  await waitFor('probed ensemble done', async () => JSON.parse((await cli('status', id, '--json')).stdout).state === 'done', 120_000);
}, 180_000);

afterAll(async () => {
  await stopWorker(worker);
  await deleteKeys(redis, prefix);
  redis.disconnect();
  rmSync(dir, { recursive: true, force: true });
});

describe('farm report pictures', () => {
  it('draws the sample cluster and the harmonic-measure picture from the artifact folder', async () => {
    const out = join(dir, 'with-artifacts');
    const r = await cli('summary', id, '--format', 'html', '--out', out, '--artifacts', artifacts);
    expect(r.code).toBe(0);
    const html = readFileSync(join(out, 'report.html'), 'utf8');
    expect(html).toContain('id="figure-sample-cluster"');
    expect(html).toContain('id="figure-harmonic-measure"');
    expect(existsSync(join(out, 'plots', 'sample-cluster-raster.png'))).toBe(true);
    expect(existsSync(join(out, 'plots', 'harmonic-measure-raster.png'))).toBe(true);
    expect(notesOf(html).filter((n) => /picture/.test(n))).toEqual([]);
  }, 60_000);

  it('without the artifact folder: run 0 is grown again (hash checked), the measure picture is missing with the reason', async () => {
    const out = join(dir, 'without');
    const r = await cli('summary', id, '--format', 'html', '--out', out);
    expect(r.code).toBe(0);
    const html = readFileSync(join(out, 'report.html'), 'utf8');
    expect(html).toContain('id="figure-sample-cluster"');
    expect(html).not.toContain('id="figure-harmonic-measure"');
    expect(notesOf(html)).toContain("no harmonic measure picture: the probed clusters' positions and hits are in the artifact store (no artifact store was given: give the workers' artifact folder with --artifacts DIR or TENDRIL_ARTIFACTS)");
    const missing = await cli('summary', id, '--format', 'html', '--out', join(dir, 'missing'), '--artifacts', join(dir, 'nowhere'));
    expect(missing.code).toBe(2);
    expect(missing.stderr).toBe(`tendril: --artifacts: "${join(dir, 'nowhere')}" does not exist; allowed: the workers' artifact folder\n`);
  }, 60_000);

  it('says why when the hits are gone, and when a large cluster kept no positions', async () => {
    const store = new EnsembleStore(redis, prefix);
    const rec = (await store.get(id))!;
    const results = await store.results(id);
    const art = new DirectoryArtifactStore(artifacts);
    const hits = new Map<number, Uint8Array>();
    for (const r of results) {
      const b = await art.get(hitsKey(id, r.runIndex));
      if (b) hits.set(r.runIndex, b);
      await art.delete(hitsKey(id, r.runIndex));
    }
    try {
      const p = await reportPictures({ ensembleId: id, spec: rec.spec, results, artifacts: art });
      expect(p.sampleCluster).toBeDefined();
      expect(p.measurePicture).toBeUndefined();
      expect(p.notes.measurePicture).toMatch(/^no harmonic measure picture: no run has both its final positions and its probe hits in the artifact store/);
    } finally {
      for (const [run, b] of hits) await art.put(hitsKey(id, run), b);
    }
    // a spec too large to grow again, whose store keeps no positions (no [positions], no [probe]): nothing is grown, the note says why
    const big = parseSpec(JSON.stringify({ model: 'dla-offlattice-2d', particles: REGROW_MAX_PARTICLES + 1, clusters: 2, seed: 3 }), 'json');
    const p = await reportPictures({ ensembleId: 'ebig', spec: big, results: [{ ...results[0], runIndex: 0 }], artifacts: null, noStoreHint: 'give --artifacts DIR' });
    expect(p.sampleCluster).toBeUndefined();
    expect(p.notes.sampleCluster).toBe(
      `no sample cluster picture: run 0's positions are not in the artifact store (no artifact store was given: give --artifacts DIR) (final positions are kept for specs with [positions] or [probe]), and clusters of ${REGROW_MAX_PARTICLES + 1} particles are not grown again for a picture (at most ${REGROW_MAX_PARTICLES})`,
    );
  }, 60_000);
});
