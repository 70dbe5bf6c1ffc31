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
 */
import { decodeCheckpoint, type RunResultData, type RunTaskData } from '../../proto/convert.js';
import type { ClusterPositions } from '../../worker/core/growth-kernel.js';
import { finalKey, resultKey } from '../../worker/runtime/job-contract.js';
import type { CheckpointStore, RunSink } from '../../worker/runtime/run-lifecycle.js';
import type { ArtifactStore } from '../farm/artifacts.js';
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
  async runStarted(): Promise<void> {}
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
  async finalPositions(run: RunTaskData, finalCheckpoint: Uint8Array): Promise<void> {
    if (this.store) {
      await this.store.put(finalKey(this.ensembleId, run.runIndex), finalCheckpoint);
      this.finals.set(run.runIndex, null);
    } else this.finals.set(run.runIndex, positionsOf(decodeCheckpoint(finalCheckpoint)));
  }
}
