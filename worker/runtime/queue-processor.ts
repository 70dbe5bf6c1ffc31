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
 * checkpoints), so this file knows no key layout.
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
import { checkProbeTask, type ProbeTask } from '../probe/probe-2d.js';
import { TaskThreadPool, type ThreadRun } from './task-thread.js';

export const QUEUE_NAME = 'runs';
export const JOB_PAYLOAD_VERSION = 1;

export interface RunJobData {
  v: number;
  ensembleId: string;
  /** Base64 protobuf RunTask messages. */
  tasks: string[];
}

/** Payload of a probe job (version 1): one job of the probe of (run, size) of an ensemble. */
export interface ProbeJobData {
  v: number;
  kind: 'probe';
  /** What is probed: a cluster of an ensemble (default) or the point set of a probe request. */
  source?: 'cluster' | 'request';
  /** The ensemble id, or the probe request id. */
  ensembleId: string;
  runIndex: number;
  size: number;
  /** The probe task (worker/probe/probe-2d.ts ProbeTask), plain JSON. */
  task: ProbeTask;
}

export interface ProbeJobHandler {
  /** Run (or skip, when done before) one probe job; throws ProbeJobRefused for a job that can never succeed. */
  run(job: ProbeJobData): Promise<'done' | 'skipped' | 'cancelled'>;
  /** The job failed for good (refused, or out of attempts): record the reason. */
  failed(job: ProbeJobData, reason: string): Promise<void>;
}

export class ProbeJobRefused extends Error {
  override name = 'ProbeJobRefused';
}

/** Read a probe job payload; throws ContractError naming what is wrong. */
export function readProbeJobData(data: unknown): ProbeJobData {
  const d = data as Partial<ProbeJobData> | null;
  if (typeof d !== 'object' || d === null) throw new ContractError('probe job payload is not an object');
  if (d.v !== JOB_PAYLOAD_VERSION) throw new ContractError(`probe job payload v is ${JSON.stringify(d.v)}, this worker reads only version ${JOB_PAYLOAD_VERSION}`);
  if (typeof d.ensembleId !== 'string' || d.ensembleId === '') throw new ContractError('probe job payload ensembleId is missing');
  if (!Number.isSafeInteger(d.runIndex) || (d.runIndex as number) < 0) throw new ContractError(`probe job payload runIndex is ${JSON.stringify(d.runIndex)}, must be a non-negative integer`);
  if (!Number.isSafeInteger(d.size) || (d.size as number) < 1) throw new ContractError(`probe job payload size is ${JSON.stringify(d.size)}, must be a positive integer`);
  if (typeof d.task !== 'object' || d.task === null) throw new ContractError('probe job payload task is missing');
  if (d.source !== undefined && d.source !== 'cluster' && d.source !== 'request') throw new ContractError(`probe job payload source is ${JSON.stringify(d.source)}, must be "cluster" or "request"`);
  try {
    checkProbeTask(d.task);
  } catch (err) {
    throw new ContractError(`probe job payload task: ${(err as Error).message}`);
  }
  return d as ProbeJobData;
}

export interface RunSink {
  exists(ensembleId: string): Promise<boolean>;
  isCancelled(ensembleId: string): Promise<boolean>;
  hasResult(ensembleId: string, runIndex: number): Promise<boolean>;
  runStarted(ensembleId: string, runIndex: number, workerId: string): Promise<void>;
  /** The run was handed back (shutdown or cancel) without a result. */
  runReleased(ensembleId: string, runIndex: number): Promise<void>;
  progress(ensembleId: string, runIndex: number, count: number, delta: number): Promise<void>;
  /** Store a finished run; false when it was stored before. */
  saveResult(result: RunResultData, bytes: Uint8Array): Promise<boolean>;
  runFailed(ensembleId: string, runIndex: number, reason: string): Promise<void>;
  /** Keep the final state of a run that keeps positions (and queue its probes); called before saveResult. */
  finalPositions?(run: RunTaskData, finalCheckpoint: Uint8Array): Promise<void>;
}

export interface CheckpointStore {
  put(key: string, bytes: Uint8Array): Promise<void>;
  get(key: string): Promise<Uint8Array | null>;
  delete(key: string): Promise<void>;
}

export interface ProcessorEvents {
  /** Particles grown and counter increments (by the names of the model's descriptor) since the last call, for metrics. */
  onGrowth?: (model: string, particles: number, counters: Record<string, number>) => void;
  onRunDone?: (result: RunResultData, counted: boolean) => void;
  onRunStarted?: () => void;
  onRunEnded?: () => void;
  onJobFailed?: (reason: string) => void;
  log?: (line: string) => void;
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

export function checkpointKey(ensembleId: string, runIndex: number): string {
  return `${ensembleId}/run-${runIndex}.checkpoint`;
}

/** Read a job payload; throws ContractError naming what is wrong. */
export function readJobData(data: unknown): { ensembleId: string; tasks: RunTaskData[] } {
  const d = data as Partial<RunJobData> | null;
  if (typeof d !== 'object' || d === null) throw new ContractError('job payload is not an object');
  if (d.v !== JOB_PAYLOAD_VERSION) throw new ContractError(`job payload v is ${JSON.stringify(d.v)}, this worker reads only version ${JOB_PAYLOAD_VERSION}`);
  if (typeof d.ensembleId !== 'string' || d.ensembleId === '') throw new ContractError('job payload ensembleId is missing');
  if (!Array.isArray(d.tasks) || d.tasks.length === 0) throw new ContractError('job payload tasks is not a non-empty list');
  const tasks = d.tasks.map((t, i) => {
    if (typeof t !== 'string' || !/^[A-Za-z0-9+/]*={0,2}$/.test(t)) throw new ContractError(`job payload tasks[${i}] is not base64 text`);
    const run = decodeRunTask(Buffer.from(t, 'base64'));
    if (run.ensembleId !== d.ensembleId) throw new ContractError(`job payload tasks[${i}] belongs to ensemble ${run.ensembleId}, not ${d.ensembleId}`);
    return run;
  });
  return { ensembleId: d.ensembleId, tasks };
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
      if (err instanceof WaitingError || err?.name === 'WaitingError') return;
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
    this.worker.on('error', (err) => o.log?.(`queue error: ${err.message.split('\n')[0]}`));
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
      const reason = (err as Error).message.split('\n')[0];
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
      throw new UnrecoverableError((err as Error).message.split('\n')[0]);
    }
    if (!this.o.probes) throw new UnrecoverableError('this worker has no probe handler');
    this.o.onRunStarted?.();
    try {
      return { outcome: await this.o.probes.run(d) };
    } catch (err) {
      if (err instanceof ProbeJobRefused || (err as Error)?.name === 'ProbeJobRefused') throw new UnrecoverableError((err as Error).message.split('\n')[0]);
      throw err;
    } finally {
      this.o.onRunEnded?.();
    }
  }

  private async growOne(run: RunTaskData): Promise<'done' | 'released' | 'cancelled'> {
    const { sink, checkpoints } = this.o;
    const key = checkpointKey(run.ensembleId, run.runIndex);
    const checkpoint = (await checkpoints.get(key)) ?? undefined;
    await sink.runStarted(run.ensembleId, run.runIndex, this.workerId);
    this.o.onRunStarted?.();
    let lastCount = -1;
    let lastCounters: Record<string, number> = {};
    let reported = -1;
    let writes: Promise<void> = Promise.resolve();
    let cancelled = false;
    const handle = this.pool.run(run, {
      checkpoint,
      workerId: this.workerId,
      onProgress: (p) => {
        if (lastCount >= 0) {
          const deltas: Record<string, number> = {};
          for (const [k, v] of Object.entries(p.counters)) deltas[k] = Math.max(0, v - (lastCounters[k] ?? 0));
          this.o.onGrowth?.(run.model.kind, Math.max(0, p.count - lastCount), deltas);
        }
        else if (reported < 0) reported = p.count;
        lastCount = p.count;
        lastCounters = p.counters;
      },
      onCheckpoint: (bytes) => {
        writes = writes.then(() => checkpoints.put(key, bytes)).catch((err) => this.o.log?.(`checkpoint of run ${run.runIndex} not stored: ${(err as Error).message}`));
      },
    });
    this.active.add(handle);
    if (this.stopping) handle.stop();
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
      })().catch((err) => this.o.log?.(`progress of run ${run.runIndex} not stored: ${(err as Error).message}`));
    }, this.o.progressIntervalMs ?? 2000);
    try {
      const outcome = await handle.outcome;
      clearInterval(timer);
      await tick;
      await writes;
      if (outcome.status === 'done') {
        if (lastCount >= 0 && reported >= 0 && lastCount > reported) await sink.progress(run.ensembleId, run.runIndex, lastCount, lastCount - reported);
        if (run.keepPositions) {
          if (!outcome.final) throw new Error(`run ${run.runIndex}: the thread returned no final positions`);
          if (!sink.finalPositions) throw new UnrecoverableError(`run ${run.runIndex} keeps positions but this worker cannot store them`);
          await sink.finalPositions(run, outcome.final);
        }
        const counted = await sink.saveResult(outcome.result, outcome.resultBytes);
        await checkpoints.delete(key);
        this.o.onRunDone?.(outcome.result, counted);
        return 'done';
      }
      if (outcome.status === 'unstarted') {
        await sink.runReleased(run.ensembleId, run.runIndex);
        return cancelled ? 'cancelled' : 'released';
      }
      if (outcome.status === 'stopped') {
        if (cancelled) {
          await checkpoints.delete(key);
          await sink.runReleased(run.ensembleId, run.runIndex);
          return 'cancelled';
        }
        await checkpoints.put(key, outcome.checkpoint);
        await sink.runReleased(run.ensembleId, run.runIndex);
        return 'released';
      }
      if (outcome.rejected) {
        await sink.runFailed(run.ensembleId, run.runIndex, outcome.message);
        throw new UnrecoverableError(outcome.message);
      }
      throw new Error(`run ${run.runIndex}: ${outcome.message}`);
    } finally {
      clearInterval(timer);
      this.active.delete(handle);
      this.o.onRunEnded?.();
    }
  }
}
