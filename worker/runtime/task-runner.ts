/**
 * The chunked driver of one run: build the kernel (fresh or from a
 * checkpoint), grow it in chunks, and between chunks report progress, take
 * checkpoints when due and react to a stop request. The kernel guarantees
 * that chunking and resuming do not change a single bit of the result.
 *
 * Chunks are sized adaptively to take about `chunkSeconds` of wall-clock time
 * each, and are cut at multiples of `checkpointEveryParticles` so that
 * particle-count checkpoints land exactly where asked.
 *
 * This file does no I/O itself: checkpoints and progress go to callbacks.
 * It runs inside a worker thread (worker/runtime/task-thread.ts) in both the farm and
 * the embedded mode.
 */
import { hostname } from 'node:os';
import { growthTaskOf, type CheckpointData, type RunResultData, type RunTaskData } from '../../proto/convert.js';
import { ENGINE_VERSION } from '../core/engine-version.js';
import type { Counters, GrowthCheckpoint } from '../core/growth-kernel.js';
import { checkTask, createKernel } from '../models/registry.js';
import { stopRaised, type StopSignal } from '../core/stop-signal.js';
import { TendrilError } from '../../proto/errors.js';

export interface RunProgress {
  runIndex: number;
  count: number;
  particles: number;
  /** The kernel's counters so far (names from the model's descriptor). */
  counters: Counters;
}

export interface RunOptions {
  /** Resume from this checkpoint (ignored with a note if it belongs to another run). */
  checkpoint?: CheckpointData;
  onProgress?: (p: RunProgress) => void;
  /** Called with each checkpoint taken; awaited before growing on. */
  onCheckpoint?: (c: CheckpointData) => void | Promise<void>;
  /** Checked between chunks; when set the run checkpoints and stops. */
  shouldStop?: () => boolean;
  /**
   * Read by the kernel inside its walker loop (worker/core/stop-signal.ts):
   * once raised, the chunk ends within a few thousand steps, however stuck the
   * walk, and the run checkpoints and stops.
   */
  stopSignal?: StopSignal;
  /**
   * Hand checkpoints over with positions that are views of the kernel's own
   * array (GrowthKernel.checkpointView), not copies: valid only until
   * onCheckpoint's promise settles (or, for the stopped and final states,
   * until the caller drops them). For callers that encode or write each
   * checkpoint at once, so a giant cluster is never copied whole.
   */
  viewCheckpoints?: boolean;
  /** Target wall-clock length of a chunk (default 0.1 s). */
  chunkSeconds?: number;
  /** Called between chunks so the host can receive messages (default: yield to the event loop). */
  yieldNow?: () => Promise<void>;
  /** Identifier written into the result's timings (default host:pid). */
  workerId?: string;
  now?: () => number;
}

export type RunOutcome =
  | { status: 'done'; result: RunResultData; /** The final state, when the task asks to keep positions. */ final?: CheckpointData }
  | { status: 'stopped'; checkpoint: CheckpointData };

export class TaskRejected extends TendrilError {
  override name = 'TaskRejected';
  readonly kind = 'task-rejected';
}

/** Check that a task can be run by this engine; throws TaskRejected with a one-line reason. */
export function checkRunTask(run: RunTaskData): void {
  if (run.engineVersion !== ENGINE_VERSION) {
    throw new TaskRejected(`task engine_version "${run.engineVersion}" differs from this worker's "${ENGINE_VERSION}"`);
  }
  try {
    checkTask(growthTaskOf(run));
  } catch (err) {
    throw new TaskRejected(`task of run ${run.runIndex} is invalid: ${err instanceof Error ? err.message : String(err)}`);
  }
}

/** True when a checkpoint belongs to exactly this run (same ensemble, index, seed, model, size). */
export function checkpointMatches(run: RunTaskData, c: CheckpointData): boolean {
  const a = growthTaskOf(run);
  const b = c.state.task;
  return (
    c.run.ensembleId === run.ensembleId &&
    c.state.engineVersion === ENGINE_VERSION &&
    JSON.stringify(a) === JSON.stringify(b) &&
    c.state.count <= run.particles
  );
}

const yieldToLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

export async function runTask(run: RunTaskData, opts: RunOptions = {}): Promise<RunOutcome> {
  checkRunTask(run);
  const now = opts.now ?? Date.now;
  const yieldNow = opts.yieldNow ?? yieldToLoop;
  const chunkSeconds = opts.chunkSeconds ?? 0.1;
  const task = growthTaskOf(run);
  const resume = opts.checkpoint && checkpointMatches(run, opts.checkpoint) ? opts.checkpoint : undefined;
  const kernel = createKernel(task, resume?.state as GrowthCheckpoint | undefined);
  const startedAtMs = resume?.startedAtMs || now();
  const resumes = resume ? resume.resumes + 1 : 0;
  let spentBefore = resume?.growSeconds ?? 0;
  let growStart = now();
  const every = run.checkpointEveryParticles;
  const intervalMs = run.checkpointIntervalSeconds * 1000;
  let lastCheckpointAt = now();
  let chunk = 256;

  const grown = () => spentBefore + (now() - growStart) / 1000;
  const takeCheckpoint = (): CheckpointData => ({
    run,
    state: opts.viewCheckpoints && kernel.checkpointView ? kernel.checkpointView() : kernel.checkpoint(),
    growSeconds: grown(),
    startedAtMs,
    resumes,
  });
  const report = () => opts.onProgress?.({ runIndex: run.runIndex, count: kernel.count, particles: run.particles, counters: { ...kernel.counters } });

  report();
  while (!kernel.done) {
    if (opts.shouldStop?.() || stopRaised(opts.stopSignal)) return { status: 'stopped', checkpoint: takeCheckpoint() };
    let target = kernel.count + chunk;
    if (every > 0) target = Math.min(target, (Math.floor(kernel.count / every) + 1) * every);
    const t0 = now();
    kernel.growTo(target, opts.stopSignal);
    if (kernel.count < target && !kernel.done) return { status: 'stopped', checkpoint: takeCheckpoint() };
    const dt = (now() - t0) / 1000;
    // adapt the chunk so that one takes about chunkSeconds
    if (dt < chunkSeconds / 2) chunk = Math.min(chunk * 2, 1 << 20);
    else if (dt > chunkSeconds * 2) chunk = Math.max(16, chunk >> 1);
    report();
    if (kernel.done) break;
    const dueByCount = every > 0 && kernel.count % every === 0;
    const dueByTime = intervalMs > 0 && now() - lastCheckpointAt >= intervalMs;
    if (dueByCount || dueByTime) {
      const c = takeCheckpoint();
      // time spent storing the checkpoint is not growth time
      const pauseStart = now();
      await opts.onCheckpoint?.(c);
      spentBefore += (pauseStart - growStart) / 1000;
      growStart = now();
      lastCheckpointAt = now();
    }
    await yieldNow();
  }
  const r = kernel.result();
  const result: RunResultData = {
    ...r,
    ensembleId: run.ensembleId,
    timings: {
      growSeconds: grown(),
      startedAtMs,
      finishedAtMs: now(),
      resumes,
      finishedBy: opts.workerId ?? `${hostname()}:${process.pid}`,
    },
  };
  return run.keepPositions ? { status: 'done', result, final: takeCheckpoint() } : { status: 'done', result };
}
