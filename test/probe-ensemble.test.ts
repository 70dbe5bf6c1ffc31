/**
 * Probing inside ensembles ([probe] in the spec): the same per-cluster
 * harmonic records from a direct computation, the embedded mode with one or
 * two threads, a resumed embedded run, and the farm (two worker processes on
 * a real Redis, one of them killed while probing). These are determinism and
 * bookkeeping checks; the physics of the measures is checked in
 * test/probe-kernel.test.ts, test/harmonic-measures.test.ts and
 * test/harmonic-growth.slow.test.ts.
 */
import { rmSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { EmbeddedAborted, runEmbedded, type EmbeddedProgress } from '../coordinator/embedded/index.js';
import { DirectoryArtifactStore } from '../coordinator/farm/artifacts.js';
import { probeResultKey } from '../worker/runtime/job-contract.js';
import { launchEnsemble } from '../coordinator/farm/queue.js';
import { farmSummary } from '../coordinator/farm/summary.js';
import { analyseProbedCluster, clusterPrefix, prefixDigest, probeSeedOf, probeTasksOf } from '../coordinator/harmonic/ensemble-probing.js';
import { runTaskFor } from '../coordinator/plan.js';
import { SpecError, validateSpec, probeSizesOf } from '../coordinator/spec/index.js';
import { harmonicOfSummary, harmonicToCsv, renderSummary } from '../coordinator/summary/index.js';
import { decodeEnsembleSummary, growthTaskOf } from '../proto/convert.js';
import { createKernel } from '../worker/models/registry.js';
import { planProbeJobs, ProbeGeometry, runProbeJob, type DiskSet } from '../worker/probe/probe-2d.js';
import { ProbeJobFailed, ProbeThreadPool } from '../worker/runtime/probe-thread-pool.js';
import { stopWorker, tempDir, waitFor } from './farm-helpers.js';
import { farmFixture } from './support/farm-fixture.js';

const doc = {
  name: 'probe ensemble test', model: 'dla-offlattice-2d', particles: 700, clusters: 3, seed: '31337',
  probe: { walkers: 3000, jobs: 3, at_sizes: [350, 175], q: [-1, 0, 1, 2, 3], contact_sample: 600 },
};
const spec = validateSpec(doc);

const dirs: string[] = [];
afterAll(() => {
  for (const d of dirs) rmSync(d, { recursive: true, force: true });
});

function directRecords(runIndex: number) {
  const k = createKernel(growthTaskOf(runTaskFor('x', spec, runIndex)));
  k.growTo(spec.particles);
  const p = k.positions();
  const final = { dimension: 2, count: p.count, coords: p.coords.slice(0, 2 * p.count) };
  return probeSizesOf(spec).map((size) => {
    const set = clusterPrefix(final, size);
    const g = new ProbeGeometry(set as DiskSet);
    const tasks = probeTasksOf(spec.probe!, spec.seed, runIndex, size, prefixDigest(final, size));
    // jobs run in reverse order: the analysis must not depend on the order
    const results = [...tasks].reverse().map((t) => runProbeJob(g, t));
    return analyseProbedCluster(set, results, spec.probe!, runIndex, size).record;
  });
}

describe('[probe] in the spec', () => {
  it('fills in defaults and keeps the sizes sorted; the canonical document re-validates to the same spec', () => {
    expect(spec.probe).toEqual({ walkers: 3000, jobs: 3, q: [-1, 0, 1, 2, 3], contactSample: 600, minStep: 0.02, atSizes: [175, 350], window: null });
    expect(probeSizesOf(spec)).toEqual([175, 350, 700]);
    const d = validateSpec({ model: 'dla-offlattice-2d', particles: 1000, clusters: 1, seed: 1, probe: { walkers: 600_000 } });
    expect(d.probe).toMatchObject({ jobs: 3, contactSample: 4000, atSizes: [] });
    expect(d.probe!.q).toContain(3);
    expect(d.probe!.q).toContain(1);
    expect(runTaskFor('x', spec, 0).keepPositions).toBe(true);
    expect(runTaskFor('x', d, 0).keepPositions).toBe(true);
    expect(runTaskFor('x', validateSpec({ model: 'dla-offlattice-2d', particles: 10, clusters: 1, seed: 1 }), 0).keepPositions).toBeUndefined();
  });

  it('rejects bad probe fields with one line naming the field, the value and the range', () => {
    const bad = (probe: unknown) => {
      try {
        validateSpec({ model: 'dla-offlattice-2d', particles: 1000, clusters: 1, seed: 1, probe });
      } catch (e) {
        expect(e).toBeInstanceOf(SpecError);
        return (e as SpecError).problems;
      }
      throw new Error('accepted');
    };
    expect(bad({ walkers: 10 })).toEqual(['probe.walkers: 10 is out of range; allowed: an integer from 100 to 10000000000']);
    expect(bad({ walkers: 1000, at_sizes: [10, 1000] })).toEqual(['probe.at_sizes[1]: 1000 is out of range; allowed: an integer from 2 to particles - 1 (999)']);
    expect(bad({ walkers: 1000, jobs: 2000 })).toEqual(['probe.jobs: 2000 is out of range; allowed: an integer from 1 to probe.walkers (1000)']);
    expect(bad({ walkers: 1000, q: [] })[0]).toMatch(/^probe\.q: \[\] is empty/);
    expect(bad({ walkers: 1000, colour: 'red' })[0]).toMatch(/^probe\.colour: unknown field; allowed fields: walkers, jobs, q, contact_sample, min_step, window, at_sizes$/);
    expect(bad({ walkers: 1000, window: [0.3, 0.5] })).toEqual(['probe.window: [0.3,0.5] is out of range; allowed: two numbers lo, hi with 0 < lo < hi <= 1 and hi >= 2 lo (box sides relative to the set radius R)']);
    expect(bad({ walkers: 1000, window: [0, 0.5] }).length).toBe(1);
    expect(validateSpec({ model: 'dla-offlattice-2d', particles: 1000, clusters: 1, seed: 1, probe: { walkers: 1000, window: [0.05, 0.5] } }).probe?.window).toEqual([0.05, 0.5]);
  });

  it('gives every (run, size) its own probe seed', () => {
    const seeds = new Set<string>();
    for (let i = 0; i < 20; i++) for (const n of [175, 350, 700]) seeds.add(probeSeedOf(spec.seed, i, n));
    expect(seeds.size).toBe(60);
  });
});

describe('embedded probing', () => {
  it('gives the direct records bit for bit, with one thread or two, and reuses them when resumed', async () => {
    const direct = [0, 1, 2].flatMap((i) => directRecords(i));
    const events: EmbeddedProgress[] = [];
    const one = await runEmbedded(spec, { ensembleId: 'p1', threads: 1, onProgress: (p) => events.push({ ...p }) });
    expect(one.harmonic).toEqual(direct);
    // growth, then the probing pass as its own phase with its own count of jobs
    const firstProbe = events.findIndex((e) => e.phase === 'probing');
    expect(firstProbe).toBeGreaterThan(0);
    expect(events.slice(0, firstProbe).every((e) => e.phase === 'growing')).toBe(true);
    expect(events[firstProbe - 1].particlesDone).toBe(events[firstProbe - 1].particlesTotal);
    const probing = events.slice(firstProbe).filter((e) => e.phase === 'probing');
    expect(probing[0].probePassDone).toBe(0);
    expect(probing[probing.length - 1].probePassDone).toBe(probing[0].probePassTotal);
    expect(events.every((e) => e.particlesReplayed === 0)).toBe(true);
    const dir = tempDir('probe-embedded');
    dirs.push(dir);
    const store = new DirectoryArtifactStore(dir);
    const two = await runEmbedded(spec, { ensembleId: 'p2', threads: 2, store });
    expect(two.harmonic).toEqual(direct);
    expect(two.picture?.runIndex).toBe(0);
    expect(two.picture?.counts.reduce((a, b) => a + b, 0)).toBe(3000);
    // a second invocation on the same store grows and probes nothing
    const againEvents: EmbeddedProgress[] = [];
    const again = await runEmbedded(spec, { ensembleId: 'p2', threads: 2, store, onProgress: (p) => againEvents.push({ ...p }) });
    expect(again.reused).toBe(3);
    // every particle of a reused run is replayed, not grown; nothing left to probe, so no probing phase
    expect(againEvents.at(-1)!.particlesReplayed).toBe(againEvents.at(-1)!.particlesDone);
    expect(againEvents.some((e) => e.phase === 'probing')).toBe(false);
    expect(again.harmonic).toEqual(direct);
    expect(again.picture?.counts).toEqual(two.picture?.counts);
    // interrupted while probing: the next invocation probes only what is missing, same records
    const dir2 = tempDir('probe-embedded-abort');
    dirs.push(dir2);
    const store2 = new DirectoryArtifactStore(dir2);
    const abort = new AbortController();
    await expect(runEmbedded(spec, {
      ensembleId: 'p3', threads: 2, store: store2, signal: abort.signal,
      onProgress: (pr) => { if (pr.probeJobsDone >= 4) abort.abort(); },
    })).rejects.toBeInstanceOf(EmbeddedAborted);
    const resumed = await runEmbedded(spec, { ensembleId: 'p3', threads: 2, store: store2 });
    expect(resumed.reused).toBe(3);
    expect(resumed.harmonic).toEqual(direct);
    // the summary carries the section and the per-cluster table
    const h = harmonicOfSummary(two.summary)!;
    expect(h.schema).toBe('tendril-harmonic/1');
    expect(h.bySize.map((b) => b.size)).toEqual([175, 350, 700]);
    expect(h.perCluster).toEqual(direct);
    const csv = harmonicToCsv(two.summary).trim().split('\n');
    expect(csv.length).toBe(1 + 9);
    expect(csv[0]).toBe('run_index,size,walkers,log_capacity,log_capacity_error,z3,information_dimension,max_concentration_exponent,radius,tau_q-1,tau_q0,tau_q1,tau_q2,tau_q3');
    // and the protobuf download holds the same statistics
    const pb = decodeEnsembleSummary(renderSummary(two.summary, 'pb'));
    expect(JSON.parse(pb.statisticsJson).harmonic.perCluster).toEqual(direct);
  }, 120_000);
});

describe('probe threads', () => {
  it('report a job they refuse (a task planned for another set) as refused, so the farm does not retry it', async () => {
    const pool = new ProbeThreadPool(1);
    try {
      const set = { count: 3, x: new Float64Array([0, 2, 4]), y: new Float64Array(3), r: 1 };
      const [task] = planProbeJobs('3-00000000', '1', 200, 1, 10);
      const err = await pool.run('k', () => set, task).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(ProbeJobFailed);
      expect((err as ProbeJobFailed).refused).toBe(true);
      expect((err as Error).message).toMatch(/^geometryDigest must match the point set/);
    } finally {
      await pool.close();
    }
  });
});

describe('farm probing (real Redis, two worker processes)', () => {
  const { artifacts, store, queue, workers, startWorker, waitDone } = farmFixture('probe');

  it('stores the embedded records once per (run, size), also when a worker is killed while probing', async () => {
    // bigger probes, so that a job is still running when the worker is killed
    const s = validateSpec({ ...doc, probe: { ...doc.probe, walkers: 60000, jobs: 6 } });
    await startWorker();
    await startWorker();
    const id = await launchEnsemble(store, queue, s);
    const cps = new DirectoryArtifactStore(artifacts);
    // kill one worker as soon as some probe job result is stored
    await waitFor('a stored probe job', async () => {
      for (let i = 0; i < 3; i++) for (const n of probeSizesOf(s)) for (let j = 0; j < 6; j++) if (await cps.get(probeResultKey(id, i, n, j))) return true;
      return false;
    }, 60_000);
    await stopWorker(workers.shift(), 'SIGKILL');
    await startWorker();
    const status = await waitDone(id, 'probed ensemble done', 120_000);
    expect(status.probes).toEqual({ planned: 9, done: 9, failed: 0, failures: [] });
    const local = await runEmbedded(s, { ensembleId: 'local', threads: 2 });
    expect(await store.harmonicRecords(id)).toEqual(local.harmonic);
    const fs = await farmSummary(store, id);
    expect(fs!.summary.partial).toBe(false);
    expect(harmonicOfSummary(fs!.summary)!.perCluster).toEqual(local.harmonic);
  }, 240_000);
});
