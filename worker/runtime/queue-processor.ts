/**
 * The BullMQ side of a worker process. Jobs come from the queue "runs"; each
 * holds one or more run tasks (protobuf, base64). Growth happens in worker
 * threads (worker/runtime/task-thread.ts), so this thread's event loop stays free
 * and BullMQ's lock renewal is never starved.
 *
 * Per run: skip it if its result is stored already (a retry after a crash);
 * resume from the newest checkpoint in the artifact store; checkpoint while
 * growing; store the result (once per run index) and drop the checkpoint.
 *
 * Shutdown (SIGTERM/SIGINT, via `shutdown()`): active runs checkpoint, their
 * jobs are moved back to the waiting list for another worker, and the worker
 * closes; the caller exits within 10 s.
 *
 * A job whose payload cannot be read, or whose task this engine refuses,
 * fails at once without retries (UnrecoverableError) with a one-line reason;
 * the worker goes on with the next job.
 *
 * Storage is injected (RunSink for results and progress, CheckpointStore for
 * checkpoints); the queue name, payloads, their readers and the artifact keys
 * are the job contract (worker/runtime/job-contract.ts).
 *
 * Probe jobs (name "probe", payload ProbeJobData) share the queue and the
 * concurrency: they are handed to the injected ProbeJobHandler (the
 * coordinator's side: coordinator/farm/probe-jobs.ts), which loads the set,
 * runs the job on a probe thread and stores its result. A run whose task
 * keeps positions hands its final state to RunSink.finalPositions before
 * its result is stored, so that a crash in between repeats both (the probe
 * jobs it queues have fixed ids and are queued once).
 */
import { hostname } from 'node:os';
import { UnrecoverableError, WaitingError, Worker, type ConnectionOptions, type Job } from 'bullmq';
import type { Redis } from 'ioredis';
import { ContractError, decodeRunTask, type RunResultData, type RunTaskData } from '../../proto/convert.js';
import { checkRunTask, TaskRejected } from './task-runner.js';
import { QUEUE_NAME, readJobData, readProbeJobData, type ProbeJobData, type RunJobData } from './job-contract.js';
import { runOne, type CheckpointStore, type ProcessorEvents, type RunOutcome, type RunSink } from './run-lifecycle.js';

export type { CheckpointStore, ProcessorEvents, RunSink };
import { TaskThreadPool, type ThreadRun } from './task-thread.js';
import { kindOf, messageOf, TendrilError } from '../../proto/errors.js';

export interface ProbeJobHandler {
  /** Run (or skip, when done before) one probe job; throws ProbeJobRefused for a job that can never succeed. */
  run(job: ProbeJobData): Promise<'done' | 'skipped' | 'cancelled'>;
  /** The job failed for good (refused, or out of attempts): record the reason. */
  failed(job: ProbeJobData, reason: string): Promise<void>;
}

export class ProbeJobRefused extends TendrilError {
  override name = 'ProbeJobRefused';
  readonly kind = 'probe-refused';
}

export interface ProcessorOptions extends ProcessorEvents {
  connection: Redis;
  prefix: string;
  sink: RunSink;
  checkpoints: CheckpointStore;
  /** Runs probe jobs; without it a probe job fails at once with a reason. */
  probes?: ProbeJobHandler;
  /** Jobs (and threads) at once; default 1. */
  concurrency?: number;
  workerId?: string;
  /** BullMQ lock duration (ms); the lock is renewed at half of it. Default 60 s. */
  lockDuration?: number;
  /** How often stalled jobs (of crashed workers) are looked for (ms). Default 30 s. */
  stalledInterval?: number;
  /** Stalls tolerated before a job fails; each crash of a worker is one stall. Default 20. */
  maxStalledCount?: number;
  /** How often progress goes to Redis and cancellation is checked (ms). Default 2 s. */
  progressIntervalMs?: number;
}

export class RunWorker {
  readonly workerId: string;
  readonly worker: Worker<RunJobData>;
  private readonly pool: TaskThreadPool;
  private readonly active = new Set<ThreadRun>();
  private stopping = false;

  constructor(private readonly o: ProcessorOptions) {
    const concurrency = o.concurrency ?? 1;
    this.workerId = o.workerId ?? `${hostname()}:${process.pid}`;
    this.pool = new TaskThreadPool(concurrency);
    this.worker = new Worker<RunJobData>(QUEUE_NAME, (job, token) => (job.name === 'probe' ? this.processProbe(job as unknown as Job<ProbeJobData>) : this.process(job, token)), {
      connection: o.connection as unknown as ConnectionOptions,
      prefix: o.prefix,
      concurrency,
      autorun: false,
      lockDuration: o.lockDuration ?? 60_000,
      stalledInterval: o.stalledInterval ?? 30_000,
      maxStalledCount: o.maxStalledCount ?? 20,
    });
    this.worker.on('failed', (job, err) => {
      if (err instanceof WaitingError) return;
      o.onJobFailed?.(err.message);
      o.log?.(`job ${job?.id ?? '?'} failed: ${err.message}`);
      if (job?.name === 'probe') {
        if (err instanceof UnrecoverableError || job.attemptsMade >= (job.opts.attempts ?? 1)) {
          void (async () => o.probes?.failed(readProbeJobData(job.data), err.message))().catch(() => undefined);
        }
        return;
      }
      // out of attempts: record the reason on its runs so status shows them as failed
      if (job && !(err instanceof UnrecoverableError) && job.attemptsMade >= (job.opts.attempts ?? 1)) {
        void (async () => {
          const { ensembleId, tasks } = readJobData(job.data);
          for (const t of tasks) if (!(await o.sink.hasResult(ensembleId, t.runIndex))) await o.sink.runFailed(ensembleId, t.runIndex, err.message);
        })().catch(() => undefined);
      }
    });
    this.worker.on('error', (err) => o.log?.(`queue error: ${messageOf(err)}`));
  }

  start(): void {
    void this.worker.run();
  }

  /** Checkpoint active runs, hand their jobs back to the queue and close. */
  async shutdown(): Promise<void> {
    if (this.stopping) return;
    this.stopping = true;
    for (const a of this.active) a.stop();
    await this.worker.close();
    await this.pool.close();
  }

  private async process(job: Job<RunJobData>, token?: string): Promise<{ done: number; skipped: number; cancelled: boolean }> {
    let parsed: { ensembleId: string; tasks: RunTaskData[] };
    try {
      parsed = readJobData(job.data);
      for (const t of parsed.tasks) checkRunTask(t);
    } catch (err) {
      const reason = messageOf(err);
      if (err instanceof ContractError || err instanceof TaskRejected) {
        const d = job.data as Partial<RunJobData> | null;
        if (typeof d?.ensembleId === 'string' && (await this.o.sink.exists(d.ensembleId).catch(() => false))) {
          for (let i = 0; i < (Array.isArray(d.tasks) ? d.tasks.length : 0); i++) {
            try {
              const run = decodeRunTask(Buffer.from(String(d.tasks![i]), 'base64'));
              await this.o.sink.runFailed(d.ensembleId, run.runIndex, reason);
            } catch {
              // the run index itself is unreadable
            }
          }
        }
        throw new UnrecoverableError(reason);
      }
      throw err;
    }
    const { ensembleId, tasks } = parsed;
    const sink = this.o.sink;
    let done = 0;
    let skipped = 0;
    for (const run of tasks) {
      if (await sink.isCancelled(ensembleId)) return { done, skipped, cancelled: true };
      if (await sink.hasResult(ensembleId, run.runIndex)) {
        skipped++;
        continue;
      }
      if (this.stopping) {
        await job.moveToWait(token);
        throw new WaitingError();
      }
      const outcome = await this.growOne(run);
      if (outcome === 'released') {
        await job.moveToWait(token);
        throw new WaitingError();
      }
      if (outcome === 'cancelled') return { done, skipped, cancelled: true };
      done++;
    }
    return { done, skipped, cancelled: false };
  }

  private async processProbe(job: Job<ProbeJobData>): Promise<{ outcome: string }> {
    let d: ProbeJobData;
    try {
      d = readProbeJobData(job.data);
    } catch (err) {
      throw new UnrecoverableError(messageOf(err));
    }
    if (!this.o.probes) throw new UnrecoverableError('this worker has no probe handler');
    this.o.onRunStarted?.();
    try {
      return { outcome: await this.o.probes.run(d) };
    } catch (err) {
      if (kindOf(err) === 'probe-refused') throw new UnrecoverableError(messageOf(err));
      throw err;
    } finally {
      this.o.onRunEnded?.();
    }
  }

  private async growOne(run: RunTaskData): Promise<RunOutcome> {
    try {
      return await runOne(run, {
        pool: this.pool,
        sink: this.o.sink,
        checkpoints: this.o.checkpoints,
        workerId: this.workerId,
        progressIntervalMs: this.o.progressIntervalMs ?? 2000,
        events: this.o,
        onStart: (handle) => {
          this.active.add(handle);
          if (this.stopping) handle.stop();
        },
        onEnd: (handle) => this.active.delete(handle),
      });
    } catch (err) {
      if (err instanceof TaskRejected) throw new UnrecoverableError(err.message);
      throw err;
    }
  }
}
