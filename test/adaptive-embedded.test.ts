/**
 * Adaptive ensembles in the embedded mode, end to end with real (small) DLA
 * clusters: the wiring of the stopping rule (the rule itself is tested in
 * stats-adaptive-stopping.test.ts). A loose target stops after the second
 * batch; an unreachable one stops at the cap; the runs equal those of a fixed
 * ensemble of the same size; the summary says what happened.
 */
import { rmSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { runEmbedded } from '../coordinator/embedded/index.js';
import { DirectoryArtifactStore } from '../coordinator/farm/artifacts.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { batchesToCsv, summaryToJsonObject } from '../coordinator/summary/index.js';
import { tempDir } from './farm-helpers.js';

const dir = tempDir('adaptive-embedded');
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const base = { model: 'dla-offlattice-2d', particles: 400, clusters: 8, seed: 5 };

describe('adaptive ensembles, embedded mode', () => {
  it('a loose target stops after the second batch, with the runs of a fixed ensemble of that size', async () => {
    // 8 clusters are below min_clusters (12), so a second batch is needed before the target may count
    const spec = validateSpec({ ...base, target: { half_width: 0.2, max_clusters: 64, min_clusters: 12, min_batch: 4 } });
    const o = await runEmbedded(spec, { ensembleId: 'loose', threads: 2 });
    expect(o.adaptive?.outcome).toBe('target-reached');
    expect(o.adaptive?.batches.map((b) => [b.fromRun, b.toRun, b.judged?.action])).toEqual([
      [0, 8, 'continue'],
      [8, 12, 'target-reached'],
    ]);
    expect(o.adaptive!.batches[1].judged!.halfWidth!).toBeLessThanOrEqual(0.2);
    expect(o.results.map((r) => r.runIndex)).toEqual([...Array(12).keys()]);
    const fixed = await runEmbedded(validateSpec({ ...base, clusters: 12 }), { ensembleId: 'fixed', threads: 2 });
    expect(o.results.map((r) => r.stateHash)).toEqual(fixed.results.map((r) => r.stateHash));
    // the summary: not partial, the history, and the analysis of all 12 clusters
    const j = summaryToJsonObject(o.summary) as any;
    expect(j.partial).toBe(false);
    expect(j.clusters_planned).toBe(12);
    expect(j.adaptive.outcome).toBe('target-reached');
    expect(j.statistics.clusters).toBe(12);
    expect(j.statistics.estimators.radiusOfGyration.D).toBeGreaterThan(1.5);
    const rows = batchesToCsv(o.summary).trim().split('\n');
    expect(rows[0]).toBe('batch,from_run,to_run,clusters_after,D,half_width,interval_low,interval_high,decision,reason');
    expect(rows.slice(1).map((r) => r.split(',').slice(0, 4).join(','))).toEqual(['0,0,8,8', '1,8,12,12']);
  }, 60_000);

  it('an unreachable target stops at the cap; a second invocation replays the same batches from the stored results', async () => {
    const spec = validateSpec({ ...base, target: { half_width: 0.001, max_clusters: 20, min_clusters: 12, min_batch: 4 } });
    const store = new DirectoryArtifactStore(dir);
    const o = await runEmbedded(spec, { ensembleId: 'capped', threads: 2, store });
    expect(o.adaptive?.outcome).toBe('cap-reached');
    expect(o.results.length).toBe(20);
    const last = o.adaptive!.batches.at(-1)!;
    expect(last.toRun).toBe(20);
    expect(last.judged?.action).toBe('cap-reached');
    expect(last.judged!.halfWidth!).toBeGreaterThan(0.001);
    // batches never overlap and cover 0..19
    const b = o.adaptive!.batches;
    for (let i = 1; i < b.length; i++) expect(b[i].fromRun).toBe(b[i - 1].toRun);
    const again = await runEmbedded(spec, { ensembleId: 'capped', threads: 2, store });
    expect(again.reused).toBe(20);
    expect(again.adaptive).toEqual(o.adaptive);
    expect(again.results.map((r) => r.stateHash)).toEqual(o.results.map((r) => r.stateHash));
  }, 60_000);
});
