/**
 * In-process implementations of the farm's storage interfaces
 * (worker/runtime/run-lifecycle.ts: RunSink and CheckpointStore), so the
 * embedded mode runs every cluster through the very lifecycle of the farm
 * (runOne) instead of a copy of it.
 *
 *   MemoryCheckpointStore   checkpoints in a Map (no artifact store given)
 *   EmbeddedRunSink         results in a Map, optionally also in an artifact
 *                           store under the farm's keys; progress to a
 *                           callback; final positions kept for probing
 *   MemoryBatchStore        the ensemble's record (planned clusters, jobs,
 *                           adaptive history) for the farm's batch loop
 *                           (coordinator/farm/batch-contract.ts BatchStore),
 *                           its results read from the sink
 */
import type { CheckpointData, RunResultData, RunTaskData } from '../../proto/convert.js';
import type { ClusterPositions } from '../../worker/core/growth-kernel.js';
import { resultKey } from '../../worker/runtime/job-contract.js';
import type { CheckpointStore, RunSink } from '../../worker/runtime/run-lifecycle.js';
import type { ArtifactStore } from '../farm/artifacts.js';
import { putFinalState } from '../farm/final-positions.js';
import type { BatchStore } from '../farm/batch-contract.js';
import type { EnsembleRecord } from '../farm/store.js';
import type { EnsembleSpec } from '../spec/index.js';
import type { AdaptiveHistory } from '../summary/adaptive.js';
import { positionsOf } from '../harmonic/ensemble-probing.js';

/** Checkpoints kept in memory for the life of the process. */
export class MemoryCheckpointStore implements CheckpointStore {
  private readonly map = new Map<string, Uint8Array>();
  async put(key: string, bytes: Uint8Array): Promise<void> {
    this.map.set(key, bytes);
  }
  async get(key: string): Promise<Uint8Array | null> {
    return this.map.get(key) ?? null;
  }
  async delete(key: string): Promise<void> {
    this.map.delete(key);
  }
}

/** The sink of one embedded ensemble. Nothing is ever cancelled: an interruption stops runs, which keeps their checkpoints. */
export class EmbeddedRunSink implements RunSink {
  /** Finished results by run index. */
  readonly results = new Map<number, RunResultData>();
  /** Particles of the runs in progress. */
  readonly live = new Map<number, number>();
  /** Final positions of clusters to probe (null: they wait in the artifact store). */
  readonly finals = new Map<number, ClusterPositions | null>();
  /** Runs that failed, one line each. */
  readonly failures: string[] = [];

  constructor(
    private readonly ensembleId: string,
    private readonly store: ArtifactStore | undefined,
    private readonly onChange: () => void,
  ) {}

  async exists(ensembleId: string): Promise<boolean> {
    return ensembleId === this.ensembleId;
  }
  async isCancelled(): Promise<boolean> {
    return false;
  }
  async hasResult(_ensembleId: string, runIndex: number): Promise<boolean> {
    return this.results.has(runIndex);
  }
  async runStarted(): Promise<boolean> {
    return true;
  }
  async runReleased(_ensembleId: string, runIndex: number): Promise<void> {
    this.live.delete(runIndex);
  }
  async progress(_ensembleId: string, runIndex: number, count: number, _delta?: number): Promise<void> {
    this.live.set(runIndex, count);
    this.onChange();
  }
  async saveResult(result: RunResultData, bytes: Uint8Array): Promise<boolean> {
    if (this.results.has(result.runIndex)) return false;
    this.results.set(result.runIndex, result);
    this.live.delete(result.runIndex);
    if (this.store) await this.store.put(resultKey(this.ensembleId, result.runIndex), bytes);
    this.onChange();
    return true;
  }
  async runFailed(_ensembleId: string, runIndex: number, reason: string): Promise<void> {
    this.failures.push(`run ${runIndex}: ${reason}`);
  }
  async finalPositions(run: RunTaskData, final: CheckpointData): Promise<void> {
    if (this.store) {
      // streamed into the store from the moved array, which is then dropped
      await putFinalState(this.store, this.ensembleId, run.runIndex, final);
      this.finals.set(run.runIndex, null);
    } else this.finals.set(run.runIndex, positionsOf(final)); // the array moved from the growth thread, kept as it is
  }
}

/**
 * The record of one embedded ensemble, with the semantics of the farm's
 * Redis EnsembleStore for what the batch loop uses (the batch step changes
 * nothing unless the planned count is the expected one and the outcome is
 * still running; queued_through never goes down). Results are the sink's.
 */
export class MemoryBatchStore implements BatchStore {
  private readonly records = new Map<string, EnsembleRecord>();

  constructor(private readonly sink: EmbeddedRunSink) {}

  async create(id: string, spec: EnsembleSpec, jobs: number, createdAtMs = Date.now(), adaptive: AdaptiveHistory | null = null): Promise<void> {
    if (this.records.has(id)) throw new Error(`ensemble ${id} exists already`);
    this.records.set(id, {
      id, name: spec.name, spec, createdAtMs, jobs, cancelled: false, plannedClusters: spec.clusters, adaptive: adaptive ? structuredClone(adaptive) : null, queuedThrough: adaptive ? 0 : spec.clusters,
    });
  }

  async get(id: string): Promise<EnsembleRecord | null> {
    return this.recordOf(id);
  }

  /** The record as it is now (a copy), or null. */
  recordOf(id: string): EnsembleRecord | null {
    const r = this.records.get(id);
    return r ? { ...r, adaptive: r.adaptive ? structuredClone(r.adaptive) : null } : null;
  }

  async resultCount(_id: string): Promise<number> {
    return this.sink.results.size;
  }

  async results(_id: string): Promise<RunResultData[]> {
    return [...this.sink.results.values()].sort((a, b) => a.runIndex - b.runIndex);
  }

  async extendAdaptive(id: string, expectedClusters: number, newClusters: number, newJobs: number, history: AdaptiveHistory): Promise<boolean> {
    const r = this.records.get(id);
    if (!r || r.plannedClusters !== expectedClusters || !r.adaptive || r.adaptive.outcome !== 'running') return false;
    r.plannedClusters = newClusters;
    r.jobs = newJobs;
    r.adaptive = structuredClone(history);
    return true;
  }

  async markQueued(id: string, through: number): Promise<void> {
    const r = this.records.get(id);
    if (r && through > r.queuedThrough) r.queuedThrough = through;
  }
}
