/**
 * Runs growth off the main thread. The main thread of a worker process (or
 * of `tendril run`) keeps its event loop free for queue lock renewal, Redis,
 * metrics and signals, while each worker thread runs one task at a time with
 * worker/runtime/task-runner.ts.
 *
 * Messages (all payloads are protobuf bytes of proto/tendril.proto):
 *   main -> thread  { type: 'run', id, task, checkpoint?, checkpointFile?, stop }
 *                                                             start a run (stop: the shared
 *                                                             flag of worker/core/stop-signal.ts)
 *                   { type: 'stop', id }                      checkpoint and stop
 *   thread -> main  { type: 'progress', id, count, particles, counters }
 *                   { type: 'resumed', id, count, seconds }   read checkpointFile (seconds: the read)
 *                   { type: 'checkpoint', id, bytes?, count, seconds? }  store it (no reply needed); without
 *                                                             bytes: written to checkpointFile already,
 *                                                             in `seconds`
 *                   { type: 'checkpoint-failed', id, message } the file could not be written (growth goes on)
 *                   { type: 'done', id, result, final? }      final: the end state when the task keeps positions,
 *                                                             { header, positions }: the Checkpoint header (protobuf,
 *                                                             no positions) and the kernel's own positions array,
 *                                                             its buffer *transferred* (moved, not copied)
 *                   { type: 'stopped', id, checkpoint? }      without checkpoint: written to checkpointFile
 *                   { type: 'failed', id, message, rejected }
 *
 * With checkpointFile { path, resume } (a checkpoint store in a folder) the
 * thread resumes by reading that file and writes every checkpoint into it,
 * streamed in chunks of 1 MiB straight from the kernel's positions with a
 * temporary file renamed into place (proto/checkpoint-file.ts): a giant
 * cluster's checkpoint never exists as one buffer in either thread.
 *
 * This one file is both the pool (imported on the main thread) and the
 * thread's entry point (when loaded as a Worker).
 */
import { isMainThread, parentPort, Worker, workerData } from 'node:worker_threads';
import { compiledWorkerEntry } from './thread-entry.js';
import { ThreadSlots, type ThreadSlot } from './thread-slots.js';
import {
  checkpointFromHeader,
  decodeCheckpoint,
  decodeRunResult,
  decodeRunTask,
  encodeCheckpoint,
  encodeCheckpointHeader,
  encodeRunResult,
  encodeRunTask,
  type CheckpointData,
  type RunResultData,
  type RunTaskData,
} from '../../proto/convert.js';
import { readCheckpointFile, writeCheckpointFile } from '../../proto/checkpoint-file.js';
import { runTask, type RunProgress } from './task-runner.js';
import { createStopSignal, raiseStop, type StopSignal } from '../core/stop-signal.js';
import { kindOf, messageOf } from '../../proto/errors.js';

/** The checkpoint file of a run: where the thread writes its checkpoints, and whether it resumes from it. */
export interface CheckpointFile {
  path: string;
  resume: boolean;
}

type ToThread = { type: 'run'; id: number; task: Uint8Array; checkpoint?: Uint8Array; checkpointFile?: CheckpointFile; workerId: string; stop: StopSignal } | { type: 'stop'; id: number };
type FromThread =
  | { type: 'progress'; id: number; count: number; particles: number; counters: Record<string, number> }
  | { type: 'resumed'; id: number; count: number; seconds: number }
  | { type: 'checkpoint'; id: number; bytes?: Uint8Array; count: number; seconds?: number }
  | { type: 'checkpoint-failed'; id: number; message: string }
  | { type: 'done'; id: number; result: Uint8Array; final?: FinalState }
  | { type: 'stopped'; id: number; checkpoint?: Uint8Array }
  | { type: 'failed'; id: number; message: string; rejected: boolean };

/** The final state of a run that keeps positions, as it crosses from the thread: the header message and the positions (count × dimension values). */
interface FinalState {
  header: Uint8Array;
  positions: Float64Array;
}

/**
 * The final state to post, and the buffers to transfer with it. The
 * positions are the kernel's own (a view, GrowthKernel.checkpointView): their
 * buffer is moved to the receiver, not cloned, so a giant cluster's positions
 * exist once at the end of a run. The kernel is dropped after this, and
 * nothing in the thread reads the moved buffer again. A buffer that cannot be
 * moved (shared) is copied once into one that can.
 */
function finalStateOf(c: CheckpointData): { final: FinalState; transfer: ArrayBuffer[] } {
  const values = c.state.count * c.state.dimension;
  let positions = c.state.positions.subarray(0, values);
  if (!(positions.buffer instanceof ArrayBuffer)) positions = positions.slice();
  const header = encodeCheckpointHeader(c).slice(); // a buffer of its own
  return { final: { header, positions }, transfer: [header.buffer, positions.buffer as ArrayBuffer] };
}

/** The final state as received: the checkpoint, its positions the array moved from the thread. */
function finalStateFrom(f: FinalState): CheckpointData {
  return checkpointFromHeader(f.header, f.positions);
}

// ------------------------------------------------------------ thread side

function threadMain(): void {
  const port = parentPort!;
  const stops = new Set<number>();
  port.on('message', (m: ToThread) => {
    if (m.type === 'stop') {
      stops.add(m.id);
      return;
    }
    void (async () => {
      try {
        const run = decodeRunTask(m.task);
        const file = m.checkpointFile;
        // room for the whole run: the kernel keeps the decoded positions as its own (no second copy)
        let checkpoint: CheckpointData | undefined;
        if (file?.resume) {
          const r0 = performance.now();
          checkpoint = readCheckpointFile(file.path, run.particles);
          port.postMessage({ type: 'resumed', id: m.id, count: checkpoint.state.count, seconds: (performance.now() - r0) / 1000 } satisfies FromThread);
        } else if (m.checkpoint) checkpoint = decodeCheckpoint(m.checkpoint, run.particles);
        let lastProgress = 0;
        const outcome = await runTask(run, {
          checkpoint,
          workerId: m.workerId,
          viewCheckpoints: true, // each checkpoint is encoded at once, below
          shouldStop: () => stops.has(m.id),
          stopSignal: m.stop,
          onProgress: (p: RunProgress) => {
            const t = Date.now();
            if (t - lastProgress < 250 && p.count < p.particles) return;
            lastProgress = t;
            port.postMessage({ type: 'progress', id: m.id, count: p.count, particles: p.particles, counters: p.counters } satisfies FromThread);
          },
          onCheckpoint: (c: CheckpointData) => {
            if (file) {
              // streamed from the kernel's own positions into a temporary file, renamed into place
              try {
                const w0 = performance.now();
                writeCheckpointFile(file.path, c);
                port.postMessage({ type: 'checkpoint', id: m.id, count: c.state.count, seconds: (performance.now() - w0) / 1000 } satisfies FromThread);
              } catch (err) {
                // the newest stored checkpoint stays the one before; growth goes on
                port.postMessage({ type: 'checkpoint-failed', id: m.id, message: messageOf(err) } satisfies FromThread);
              }
              return;
            }
            const bytes = encodeCheckpoint(c); // a buffer of its own: transferred, not copied
            port.postMessage({ type: 'checkpoint', id: m.id, bytes, count: c.state.count } satisfies FromThread, [bytes.buffer]);
          },
        });
        if (outcome.status === 'done') {
          const result = encodeRunResult(outcome.result).slice();
          if (outcome.final) {
            const { final, transfer } = finalStateOf(outcome.final);
            port.postMessage({ type: 'done', id: m.id, result, final } satisfies FromThread, [result.buffer, ...transfer]);
          } else port.postMessage({ type: 'done', id: m.id, result } satisfies FromThread, [result.buffer]);
        } else if (file) {
          writeCheckpointFile(file.path, outcome.checkpoint); // a failure fails the run (retried): the stop must not lose its state silently
          port.postMessage({ type: 'stopped', id: m.id } satisfies FromThread);
        } else {
          const cp = encodeCheckpoint(outcome.checkpoint);
          port.postMessage({ type: 'stopped', id: m.id, checkpoint: cp } satisfies FromThread, [cp.buffer]);
        }
      } catch (err) {
        // a refused task (other engine, invalid task, unreadable message) or a stuck walker fails for good; anything else may be retried
        const kind = kindOf(err);
        const rejected = kind === 'task-rejected' || kind === 'contract' || (err as Error)?.name === 'WalkerStuck';
        port.postMessage({ type: 'failed', id: m.id, message: messageOf(err), rejected } satisfies FromThread);
      } finally {
        stops.delete(m.id);
      }
    })();
  });
}

/** workerData of task threads: a thread of any other kind (summary, probe) that imports this file stays what it is. */
const TASK_THREAD_ROLE = 'tendril-task';
if (!isMainThread && parentPort && (workerData as { role?: string } | null)?.role === TASK_THREAD_ROLE) threadMain();

// ------------------------------------------------------------ main side

export interface ThreadRunHandlers {
  /** Resume from this checkpoint (decoded, or protobuf bytes as stored). */
  checkpoint?: CheckpointData | Uint8Array;
  onProgress?: (p: RunProgress) => void;
  /** The run's checkpoint file: the thread resumes from it (when `resume`) and writes every checkpoint into it, streamed. */
  checkpointFile?: CheckpointFile;
  /** Each checkpoint taken (count: its particles): framed bytes to store, or null when written to checkpointFile already (in `seconds`). */
  onCheckpoint?: (bytes: Uint8Array | null, count: number, seconds?: number) => void;
  /** The run resumed from checkpointFile at `count` particles; `seconds`: the read. */
  onResumed?: (count: number, seconds: number) => void;
  /** A checkpoint could not be written to checkpointFile (one line); the run goes on. */
  onCheckpointFailed?: (message: string) => void;
  workerId?: string;
}

export type ThreadOutcome =
  | {
      status: 'done';
      result: RunResultData;
      resultBytes: Uint8Array;
      /** Final state when the task keeps positions; its positions are the kernel's own array, moved from the thread (no copy). */
      final?: CheckpointData;
    }
  /** checkpoint: the state to store, absent when the thread wrote it to checkpointFile. */
  | { status: 'stopped'; checkpoint?: Uint8Array }
  /** Stopped before it got a thread: nothing ran and nothing changed (keep any earlier checkpoint as it is). */
  | { status: 'unstarted' }
  | { status: 'failed'; message: string; rejected: boolean };

/** A handle on a run in a thread. */
export interface ThreadRun {
  readonly outcome: Promise<ThreadOutcome>;
  /** Ask the run to checkpoint and stop; `outcome` then resolves with status 'stopped' (or 'done' if it just finished). */
  stop(): void;
}

export class TaskThreadPool {
  private readonly pool: ThreadSlots<ThreadSlot>;
  private nextId = 1;

  constructor(readonly size: number) {
    this.pool = new ThreadSlots(size, 'thread pool');
  }

  /** A free thread (the first one, or a new one while fewer than `size` exist). */
  private acquire(): Promise<ThreadSlot> {
    return this.pool.acquire(
      (free, canSpawn) => free[0] ?? (canSpawn ? 'spawn' : undefined),
      () => ({ worker: new Worker(compiledWorkerEntry(import.meta.url, 'task-thread'), { workerData: { role: TASK_THREAD_ROLE } }), busy: false }),
    );
  }

  private release(slot: ThreadSlot, broken: boolean): void {
    this.pool.release(slot, broken);
  }

  /** Start a run as soon as a thread is free. */
  run(task: RunTaskData, h: ThreadRunHandlers = {}): ThreadRun {
    const id = this.nextId++;
    let stopRequested = false;
    let slotRef: ThreadSlot | undefined;
    // raised by stop(): the kernel reads it inside its walker loop, so a stop lands within milliseconds however long a particle takes
    const stopSignal = createStopSignal();
    const outcome = (async (): Promise<ThreadOutcome> => {
      const slot = await this.acquire();
      if (stopRequested) {
        // stopped while waiting for a thread: no checkpoint to write, no resume to count
        this.release(slot, false);
        return { status: 'unstarted' };
      }
      slotRef = slot;
      return await new Promise<ThreadOutcome>((resolve) => {
        const w = slot.worker;
        const finish = (o: ThreadOutcome, broken: boolean) => {
          w.off('message', onMessage);
          w.off('error', onError);
          w.off('exit', onExit);
          this.release(slot, broken);
          resolve(o);
        };
        const onMessage = (m: FromThread) => {
          if (m.id !== id) return;
          switch (m.type) {
            case 'progress':
              h.onProgress?.({ runIndex: task.runIndex, count: m.count, particles: m.particles, counters: m.counters });
              break;
            case 'checkpoint':
              h.onCheckpoint?.(m.bytes ?? null, m.count, m.seconds);
              break;
            case 'resumed':
              h.onResumed?.(m.count, m.seconds);
              break;
            case 'checkpoint-failed':
              h.onCheckpointFailed?.(m.message);
              break;
            case 'done':
              try {
                finish({ status: 'done', result: decodeRunResult(m.result), resultBytes: m.result, ...(m.final ? { final: finalStateFrom(m.final) } : {}) }, false);
              } catch (err) {
                finish({ status: 'failed', message: (err as Error).message, rejected: false }, false);
              }
              break;
            case 'stopped':
              finish(m.checkpoint ? { status: 'stopped', checkpoint: m.checkpoint } : { status: 'stopped' }, false);
              break;
            case 'failed':
              finish({ status: 'failed', message: m.message, rejected: m.rejected }, false);
              break;
          }
        };
        const onError = (err: Error) => finish({ status: 'failed', message: `thread crashed: ${messageOf(err)}`, rejected: false }, true);
        const onExit = (code: number) => finish({ status: 'failed', message: `thread exited with code ${code}`, rejected: false }, true);
        w.on('message', onMessage);
        w.once('error', onError);
        w.once('exit', onExit);
        const msg: ToThread = {
          type: 'run',
          id,
          task: encodeRunTask(task),
          checkpoint: h.checkpoint instanceof Uint8Array ? h.checkpoint : h.checkpoint ? encodeCheckpoint(h.checkpoint) : undefined,
          ...(h.checkpointFile ? { checkpointFile: h.checkpointFile } : {}),
          workerId: h.workerId ?? 'embedded',
          stop: stopSignal,
        };
        w.postMessage(msg);
        if (stopRequested) w.postMessage({ type: 'stop', id } satisfies ToThread);
      });
    })();
    return {
      outcome,
      stop: () => {
        stopRequested = true;
        raiseStop(stopSignal);
        slotRef?.worker.postMessage({ type: 'stop', id } satisfies ToThread);
      },
    };
  }

  /** Terminate all threads (running runs are lost; stop them first to keep their checkpoints). */
  async close(): Promise<void> {
    await this.pool.close();
  }
}
