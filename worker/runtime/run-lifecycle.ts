/**
 * The life of one run, from start or checkpoint to stored result: the one
 * per-run logic of the farm (worker/runtime/queue-processor.ts, with Redis
 * and the artifact store behind RunSink and CheckpointStore) and of the
 * embedded mode (coordinator/embedded/, with in-memory implementations and
 * the directory store).
 *
 *   resume from the newest checkpoint (CheckpointStore; a store in a folder
 *   has the thread read and write the checkpoint file itself, streamed),
 *   grow in a thread,
 *   checkpoint while growing, report progress and watch for cancellation
 *   every progressIntervalMs; when done: hand over the final positions if
 *   the task keeps them, store the result once, drop the checkpoint; when
 *   stopped (shutdown or interruption): keep the checkpoint and release the
 *   run; when cancelled: drop the checkpoint.
 *
 * A task the engine refuses throws TaskRejected (its run marked failed); any
 * other failure throws an Error with the thread's one-line reason.
 */
import type { CheckpointData, RunResultData, RunTaskData } from '../../proto/convert.js';
import { firstLine, messageOf } from '../../proto/errors.js';
import { checkpointKey } from './job-contract.js';
import { TaskRejected } from './task-runner.js';
import type { TaskThreadPool, ThreadRun } from './task-thread.js';

export interface RunSink {
  exists(ensembleId: string): Promise<boolean>;
  isCancelled(ensembleId: string): Promise<boolean>;
  hasResult(ensembleId: string, runIndex: number): Promise<boolean>;
  /** Mark the run running; false when its result is already stored (then it is not grown). */
  runStarted(ensembleId: string, runIndex: number, workerId: string): Promise<boolean>;
  /** The run was handed back (shutdown or cancel) without a result. */
  runReleased(ensembleId: string, runIndex: number): Promise<void>;
  progress(ensembleId: string, runIndex: number, count: number, delta: number): Promise<void>;
  /** Store a finished run; false when it was stored before. */
  saveResult(result: RunResultData, bytes: Uint8Array): Promise<boolean>;
  runFailed(ensembleId: string, runIndex: number, reason: string): Promise<void>;
  /**
   * Keep the final state of a run that keeps positions (and queue its
   * probes); called before saveResult. Its positions are the kernel's own
   * array, moved from the growth thread: the sink may keep them (no copy).
   */
  finalPositions?(run: RunTaskData, final: CheckpointData): Promise<void>;
}

export interface CheckpointStore {
  put(key: string, bytes: Uint8Array): Promise<void>;
  get(key: string): Promise<Uint8Array | null>;
  delete(key: string): Promise<void>;
  /**
   * Stores kept in a folder: the local file of `key` (its folder created)
   * and whether it exists. The growth thread then writes every checkpoint of
   * the run straight into it and resumes by reading it, streamed in chunks
   * (proto/checkpoint-file.ts), so no checkpoint crosses between the threads
   * as a buffer. Stores without it (in memory) get and put whole buffers.
   */
  checkpointFile?(key: string): Promise<{ path: string; exists: boolean }>;
}

/** One event in the life of a run on this worker (for structured logs: one line each). */
export interface RunEvent {
  event: 'run started' | 'run resumed' | 'run checkpointed' | 'run finished' | 'run handed back' | 'run cancelled' | 'run failed';
  ensembleId: string;
  runIndex: number;
  /** Particles of the run at the event (for 'run started': 0, or null when it resumes from a checkpoint). */
  particles: number | null;
  /** 'run started': whether it resumes from a checkpoint. */
  resumed?: boolean;
  /** 'run finished': state hash, whether it was counted (false: stored before by another worker), wall seconds. */
  stateHash?: string;
  counted?: boolean;
  /** 'run finished': wall seconds of the run here; 'run checkpointed' and 'run resumed' of a checkpoint file: seconds its write or read took. */
  seconds?: number;
  /** 'run failed': why. */
  reason?: string;
}

export interface ProcessorEvents {
  /** Each start, checkpoint, finish, hand-back, cancel and failure of a run. */
  onRunEvent?: (e: RunEvent) => void;
  /** Particles grown and counter increments (by the names of the model's descriptor) since the last call, for metrics. */
  onGrowth?: (model: string, particles: number, counters: Record<string, number>) => void;
  onRunDone?: (result: RunResultData, counted: boolean) => void;
  onRunStarted?: () => void;
  onRunEnded?: () => void;
  onJobFailed?: (reason: string) => void;
  log?: (line: string) => void;
}

export interface RunLifecycleOptions {
  pool: TaskThreadPool;
  sink: RunSink;
  checkpoints: CheckpointStore;
  workerId: string;
  /** How often progress goes to the sink and cancellation is checked (ms). */
  progressIntervalMs: number;
  events?: ProcessorEvents;
  /** The run is in a thread: the owner may stop it (shutdown, interruption). */
  onStart?: (handle: ThreadRun) => void;
  onEnd?: (handle: ThreadRun) => void;
}

/** 'done': result stored; 'released': stopped with its checkpoint kept; 'cancelled': its ensemble was cancelled; 'skipped': its result was already stored (not grown again). */
export type RunOutcome = 'done' | 'released' | 'cancelled' | 'skipped';

/** Run one task through its whole life (see the file header). */
export async function runOne(run: RunTaskData, o: RunLifecycleOptions): Promise<RunOutcome> {
  const { sink, checkpoints } = o;
  const ev = o.events ?? {};
  const key = checkpointKey(run.ensembleId, run.runIndex);
  // atomic with the result check: a run another worker has just finished is not marked running nor grown again
  if (!(await sink.runStarted(run.ensembleId, run.runIndex, o.workerId))) return 'skipped';
  // a store in a folder: the thread reads and writes the file itself (streamed); else whole buffers pass through here
  const file = checkpoints.checkpointFile ? await checkpoints.checkpointFile(key) : null;
  const checkpoint = file ? undefined : ((await checkpoints.get(key)) ?? undefined);
  const resumed = file ? file.exists : checkpoint !== undefined;
  const event = (e: Omit<RunEvent, 'ensembleId' | 'runIndex'>) => ev.onRunEvent?.({ ensembleId: run.ensembleId, runIndex: run.runIndex, ...e });
  const t0 = Date.now();
  event({ event: 'run started', particles: resumed ? null : 0, resumed });
  ev.onRunStarted?.();
  let lastCount = -1;
  /** Counters at the last progress report; null before the first (growth is counted from there). */
  let lastCounters: Record<string, number> | null = null;
  let reported = -1;
  let writes: Promise<void> = Promise.resolve();
  let cancelled = false;
  const handle = o.pool.run(run, {
    checkpoint,
    ...(file ? { checkpointFile: { path: file.path, resume: file.exists } } : {}),
    workerId: o.workerId,
    onProgress: (p) => {
      if (lastCounters !== null) {
        const deltas: Record<string, number> = {};
        for (const [k, v] of Object.entries(p.counters)) deltas[k] = Math.max(0, v - (lastCounters[k] ?? 0));
        ev.onGrowth?.(run.model.kind, Math.max(0, p.count - lastCount), deltas);
      }
      else if (reported < 0) reported = p.count;
      lastCount = p.count;
      lastCounters = p.counters;
    },
    onResumed: (count, seconds) => {
      // the kernel rebuilds its index next (minutes for a giant cluster, before its first progress report):
      // meanwhile the ticks report the resumed count, which is also the run's sign of life (store.ts, STALE_RUN_MS)
      if (lastCount < 0) {
        lastCount = count;
        reported = count;
      }
      event({ event: 'run resumed', particles: count, seconds });
    },
    onCheckpoint: (bytes, count, seconds) => {
      if (bytes === null) {
        // written and renamed into place by the thread already
        event({ event: 'run checkpointed', particles: count, ...(seconds !== undefined ? { seconds } : {}) });
        return;
      }
      writes = writes
        .then(() => checkpoints.put(key, bytes))
        .then(() => event({ event: 'run checkpointed', particles: count }))
        .catch((err) => ev.log?.(`checkpoint of run ${run.runIndex} not stored: ${messageOf(err)}`));
    },
    onCheckpointFailed: (message) => ev.log?.(`checkpoint of run ${run.runIndex} not stored: ${message}`),
  });
  o.onStart?.(handle);
  let tick: Promise<void> = Promise.resolve();
  const timer = setInterval(() => {
    tick = (async () => {
      // every tick, changed or not: the progress write is also the run's sign of life (store.ts, STALE_RUN_MS)
      if (lastCount >= 0) {
        const delta = reported >= 0 ? lastCount - reported : 0;
        reported = lastCount;
        await sink.progress(run.ensembleId, run.runIndex, lastCount, delta);
      }
      if (!cancelled && (await sink.isCancelled(run.ensembleId))) {
        cancelled = true;
        handle.stop();
      }
    })().catch((err) => ev.log?.(`progress of run ${run.runIndex} not stored: ${messageOf(err)}`));
  }, o.progressIntervalMs);
  try {
    const outcome = await handle.outcome;
    clearInterval(timer);
    await tick;
    await writes;
    if (outcome.status === 'done') {
      if (lastCount >= 0 && reported >= 0 && lastCount > reported) await sink.progress(run.ensembleId, run.runIndex, lastCount, lastCount - reported);
      if (run.keepPositions) {
        if (!outcome.final) throw new Error(`run ${run.runIndex}: the thread returned no final positions`);
        if (!sink.finalPositions) throw new TaskRejected(`run ${run.runIndex} keeps positions but this worker cannot store them`);
        await sink.finalPositions(run, outcome.final);
      }
      const counted = await sink.saveResult(outcome.result, outcome.resultBytes);
      await checkpoints.delete(key);
      ev.onRunDone?.(outcome.result, counted);
      event({ event: 'run finished', particles: outcome.result.particles, stateHash: outcome.result.stateHash, counted, seconds: (Date.now() - t0) / 1000 });
      return 'done';
    }
    if (outcome.status === 'unstarted') {
      // stopped before it got a thread: nothing ran, any earlier checkpoint stays as it is
      await sink.runReleased(run.ensembleId, run.runIndex);
      return cancelled ? 'cancelled' : 'released';
    }
    if (outcome.status === 'stopped') {
      if (cancelled) {
        await checkpoints.delete(key);
        await sink.runReleased(run.ensembleId, run.runIndex);
        event({ event: 'run cancelled', particles: lastCount >= 0 ? lastCount : null });
        return 'cancelled';
      }
      if (outcome.checkpoint) await checkpoints.put(key, outcome.checkpoint); // else written by the thread
      await sink.runReleased(run.ensembleId, run.runIndex);
      event({ event: 'run handed back', particles: lastCount >= 0 ? lastCount : null });
      return 'released';
    }
    event({ event: 'run failed', particles: lastCount >= 0 ? lastCount : null, reason: firstLine(outcome.message) });
    if (outcome.rejected) {
      await sink.runFailed(run.ensembleId, run.runIndex, outcome.message);
      throw new TaskRejected(outcome.message);
    }
    throw new Error(`run ${run.runIndex}: ${outcome.message}`);
  } finally {
    clearInterval(timer);
    o.onEnd?.(handle);
    ev.onRunEnded?.();
  }
}
