/**
 * Probing on the farm. A run of a spec with [probe] keeps its positions:
 * before its result is stored, the worker writes the final state to the
 * artifact store (`ID/run-I.final`, a Checkpoint at count = particles) and
 * queues the probe jobs of every size of probeSizesOf(spec) (job id
 * "ID-pI-N-J", so a repeated run queues nothing twice).
 *
 * A probe job (ProbeJobData): skip if (run, size) is analysed already; else
 * run the job on a probe thread unless its result is stored already
 * (`ID/probe/run-I-size-N/job-J.json`), store the result, and mark it in
 * Redis. The job that finds all K results stored analyses them (the same
 * analysis as the embedded mode, coordinator/harmonic/ensemble-probing.ts)
 * and keeps the record with HSETNX; for the final size it also keeps the
 * summed hit counts (`ID/run-I.hits`, float64) for pictures. A job acks
 * only after this, so a crash at any point is repaired by the retry, and
 * nothing is counted twice.
 */
import type { Queue } from 'bullmq';
import type { CheckpointData, RunTaskData } from '../../proto/convert.js';
import type { ProbeResult } from '../../worker/probe/probe-2d.js';
import { ProbeJobCancelled, ProbeJobFailed, ProbeThreadPool } from '../../worker/runtime/probe-thread-pool.js';
import { ProbeJobRefused, type ProbeJobHandler } from '../../worker/runtime/queue-processor.js';
import { finalKey, hitsKey, JOB_PAYLOAD_VERSION, probeResultKey, requestResultKey, type ProbeJobData } from '../../worker/runtime/job-contract.js';
import { analyseProbedCluster, breakdownEtaOf, clusterPrefix, positionsOf, probeTasksOfSet } from '../harmonic/ensemble-probing.js';
import { probeSizesOf, type EnsembleSpec } from '../spec/index.js';
import type { ArtifactStore } from './artifacts.js';
import { finalPositionsIn, putFinalState } from './final-positions.js';
import type { EnsembleStore } from './store.js';
import type { ProbeRequestStore } from './probe-requests.js';
import { analyseResults } from '../harmonic/probe-run.js';
import type { DiskSet } from '../../worker/probe/probe-2d.js';
import type { ProbeSet } from '../../worker/probe/probe-set.js';
import type { ClusterPositions } from '../../worker/core/growth-kernel.js';


/** BullMQ job descriptions of the probes of one finished run. */
export function probeJobsOf(id: string, spec: EnsembleSpec, runIndex: number, final: ClusterPositions, attempts = 5) {
  const p = spec.probe;
  if (!p) return [];
  return probeSizesOf(spec).flatMap((size) =>
    probeTasksOfSet(p, spec.seed, runIndex, size, clusterPrefix(final, size, spec.model.kind)).map((task) => ({
      name: 'probe',
      data: { v: JOB_PAYLOAD_VERSION, kind: 'probe', ensembleId: id, runIndex, size, task } satisfies ProbeJobData,
      opts: {
        jobId: `${id}-p${runIndex}-${size}-${task.jobIndex}`,
        attempts,
        backoff: { type: 'exponential' as const, delay: 5000 },
        removeOnComplete: { age: 7 * 86400, count: 10000 },
        removeOnFail: { age: 30 * 86400 },
      },
    })),
  );
}

/** RunSink.finalPositions of a farm worker: keep the final state, then queue the run's probes. */
export async function keepFinalAndQueueProbes(store: EnsembleStore, artifacts: ArtifactStore, queue: Queue, run: RunTaskData, final: CheckpointData): Promise<void> {
  const rec = await store.get(run.ensembleId);
  if (!rec?.spec.probe && !rec?.spec.positions) return;
  // streamed from the positions moved from the growth thread (no whole-cluster buffer)
  await putFinalState(artifacts, run.ensembleId, run.runIndex, final);
  if (!rec.spec.probe) return; // [positions] only: kept for export and download
  const jobs = probeJobsOf(run.ensembleId, rec.spec, run.runIndex, positionsOf(final));
  for (let i = 0; i < jobs.length; i += 500) await queue.addBulk(jobs.slice(i, i + 500));
}

export interface FarmProbeEvents {
  /** Walkers probed by a job this process ran. */
  onProbed?: (walkers: number) => void;
  /** How often a running probe job checks whether its request or ensemble was cancelled (ms; default 2000). */
  cancelPollMs?: number;
  log?: (line: string) => void;
}

/** The ProbeJobHandler of a farm worker process. */
export class FarmProbeHandler implements ProbeJobHandler {
  readonly pool: ProbeThreadPool;
  /** The last final state read (jobs of one cluster tend to come together). */
  private cached: { key: string; final: ClusterPositions } | null = null;

  private cachedRequest: { id: string; set: DiskSet } | null = null;
  /** The spec of the last ensemble seen (a spec never changes; reading and validating it once per job was wasted work). */
  private cachedSpec: { id: string; spec: EnsembleSpec } | null = null;

  constructor(
    private readonly store: EnsembleStore,
    private readonly artifacts: ArtifactStore,
    threads: number,
    private readonly events: FarmProbeEvents = {},
    private readonly requests?: ProbeRequestStore,
  ) {
    this.pool = new ProbeThreadPool(threads);
  }

  private async requestSet(id: string): Promise<DiskSet> {
    if (this.cachedRequest?.id === id) return this.cachedRequest.set;
    const set = await this.requests!.set(id);
    if (!set) throw new ProbeJobRefused(`probe request ${id} has no point set`);
    this.cachedRequest = { id, set };
    return set;
  }

  /**
   * One job on a probe thread; a job the thread refuses (invalid task or set)
   * fails for good, not by retries. `cancelled` is polled every
   * cancelPollMs while the job runs; once true the thread is stopped and the
   * result is null.
   */
  private async runOnThread(key: string, load: () => ProbeSet | Promise<ProbeSet>, task: ProbeJobData['task'], cancelled: () => Promise<boolean>): Promise<ProbeResult | null> {
    const abort = new AbortController();
    const timer = setInterval(() => {
      void cancelled().then((c) => c && abort.abort(), () => undefined);
    }, this.events.cancelPollMs ?? 2000);
    try {
      return await this.pool.run(key, load, task, abort.signal);
    } catch (err) {
      if (err instanceof ProbeJobCancelled) return null;
      if (err instanceof ProbeJobFailed && err.refused) throw new ProbeJobRefused(err.message);
      throw err;
    } finally {
      clearInterval(timer);
    }
  }

  /** A job of a probe request (a user's point set; see probe-requests.ts). */
  private async runRequest(d: ProbeJobData): Promise<'done' | 'skipped' | 'cancelled'> {
    const req = this.requests;
    if (!req) throw new ProbeJobRefused('this worker has no probe-request store');
    const id = d.ensembleId;
    if (await req.hasMeasures(id)) return 'skipped';
    if (await req.isCancelled(id)) return 'cancelled';
    const s = await req.settings(id);
    if (!s) throw new ProbeJobRefused(`probe job of unknown probe request ${id}`);
    const j = d.task.jobIndex;
    if (!(j >= 0 && j < s.jobs)) throw new ProbeJobRefused(`probe job index ${j} is outside 0..${s.jobs - 1}`);
    const key = requestResultKey(id, j);
    if (!(await this.artifacts.get(key))) {
      const result = await this.runOnThread(`${id}:request`, () => this.requestSet(id), d.task, () => req.isCancelled(id));
      if (result === null) return 'cancelled';
      await this.artifacts.put(key, Buffer.from(JSON.stringify(result)));
      this.events.onProbed?.(result.walkers);
    }
    if ((await req.jobStored(id, j)) >= s.jobs) {
      const results: ProbeResult[] = [];
      for (let k = 0; k < s.jobs; k++) {
        const b = await this.artifacts.get(requestResultKey(id, k));
        if (!b) throw new Error(`probe request ${id}: result of job ${k} is marked stored but missing`);
        results.push(JSON.parse(Buffer.from(b).toString('utf8')) as ProbeResult);
      }
      const set = await this.requestSet(id);
      const a = analyseResults(set, results.sort((x, y) => x.jobIndex - y.jobIndex), s.q, s.window ?? null);
      if (await req.saveMeasures(id, a.measures, a.counts)) this.events.log?.(`probe request ${id}: analysed`);
    }
    return 'done';
  }

  private async finalOf(id: string, run: number): Promise<ClusterPositions> {
    const key = finalKey(id, run);
    if (this.cached?.key === key) return this.cached.final;
    // read in chunks straight into one positions array
    const final = await finalPositionsIn(this.artifacts, id, run);
    if (!final) throw new ProbeJobRefused(`probe of run ${run}: its final positions (${key}) are not in the artifact store`);
    this.cached = { key, final };
    return final;
  }

  async run(d: ProbeJobData): Promise<'done' | 'skipped' | 'cancelled'> {
    if (d.source === 'request') return this.runRequest(d);
    const { ensembleId: id, runIndex, size } = d;
    const j = d.task.jobIndex;
    if (await this.store.isCancelled(id)) return 'cancelled';
    if (await this.store.hasHarmonic(id, runIndex, size)) return 'skipped';
    if (this.cachedSpec?.id !== id) {
      const rec = await this.store.get(id);
      if (!rec) throw new ProbeJobRefused(`probe job of unknown ensemble ${id}`);
      this.cachedSpec = { id, spec: rec.spec };
    }
    const spec = this.cachedSpec.spec;
    const p = spec.probe;
    if (!p) throw new ProbeJobRefused(`ensemble ${id} has no [probe] table`);
    if (!probeSizesOf(spec).includes(size)) throw new ProbeJobRefused(`probe size ${size} is not one of the ensemble's sizes`);
    if (!(j >= 0 && j < p.jobs)) throw new ProbeJobRefused(`probe job index ${j} is outside 0..${p.jobs - 1}`);
    const rkey = probeResultKey(id, runIndex, size, j);
    if (!(await this.artifacts.get(rkey))) {
      const final = await this.finalOf(id, runIndex);
      if (size > final.count) throw new ProbeJobRefused(`probe size ${size} exceeds the cluster's ${final.count} particles`);
      const result = await this.runOnThread(`${id}:${runIndex}:${size}`, () => clusterPrefix(final, size, spec.model.kind), d.task, () => this.store.isCancelled(id));
      if (result === null) return 'cancelled';
      await this.artifacts.put(rkey, Buffer.from(JSON.stringify(result)));
      this.events.onProbed?.(result.walkers);
    }
    const stored = await this.store.probeJobStored(id, runIndex, size, j);
    if (stored >= p.jobs) await this.analyse(id, spec, runIndex, size);
    return 'done';
  }

  /** Analyse a (run, size) whose job results are all stored, and keep the record. */
  private async analyse(id: string, spec: EnsembleSpec, runIndex: number, size: number): Promise<void> {
    const p = spec.probe!;
    const results: ProbeResult[] = [];
    for (let j = 0; j < p.jobs; j++) {
      const bytes = await this.artifacts.get(probeResultKey(id, runIndex, size, j));
      if (!bytes) throw new Error(`probe of run ${runIndex} at size ${size}: result of job ${j} is marked stored but missing`);
      results.push(JSON.parse(Buffer.from(bytes).toString('utf8')) as ProbeResult);
    }
    const final = await this.finalOf(id, runIndex);
    const { record, counts } = analyseProbedCluster(clusterPrefix(final, size, spec.model.kind), results, p, runIndex, size, breakdownEtaOf(spec.model));
    if (size === spec.particles) await this.artifacts.put(hitsKey(id, runIndex), new Uint8Array(counts.buffer, counts.byteOffset, counts.byteLength));
    if (await this.store.saveHarmonic(id, record)) this.events.log?.(`ensemble ${id}: run ${runIndex} probed at size ${size}`);
  }

  async failed(d: ProbeJobData, reason: string): Promise<void> {
    if (d.source === 'request') {
      await this.requests?.failed(d.ensembleId, `job ${d.task.jobIndex}: ${reason}`);
      return;
    }
    await this.store.probeFailed(d.ensembleId, d.runIndex, d.size, `job ${d.task.jobIndex}: ${reason}`);
  }

  async close(): Promise<void> {
    await this.pool.close();
  }
}
