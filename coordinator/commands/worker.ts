/**
 * `tendril worker`: serve the farm's run queue with one job per core (worker
 * threads), checkpointing to the artifact directory. SIGTERM/SIGINT:
 * checkpoint active runs, hand them back to the queue, exit within 10 s.
 *
 * Logs: one JSON line per event on stderr (pino), at the level of
 * --log-level (default info, or TENDRIL_LOG_LEVEL): each run's start,
 * resume (particles and seconds of the checkpoint read), checkpoint
 * (particles and seconds of the write), finish, hand-back, cancel and
 * failure at info (failures at
 * warn), with ensembleId, runIndex, particles and workerId; other remarks
 * (queue errors, shutdown) as msg lines.
 *
 * At start the artifact folder must be writable (else one line, exit code 2);
 * temporary files that dead writers left there are removed. With
 * --exit-when-idle S the worker ends by itself (exit code 0) once the run
 * queue has held no pending job for S seconds, as a Slurm array task should
 * (deploy/slurm/tendril-worker.sbatch).
 */
import { availableParallelism } from 'node:os';
import { Option, type Command } from 'commander';
import { pino } from 'pino';
import { advanceAdaptive, startAdaptiveSweeps } from '../farm/adaptive.js';
import { artifactFolderProblem, DirectoryArtifactStore, removeOrphanTemporaries } from '../farm/artifacts.js';
import { watchForIdle } from '../farm/idle-watch.js';
import { UsageError } from '../usage-error.js';
import { FarmProbeHandler, keepFinalAndQueueProbes } from '../farm/probe-jobs.js';
import { ProbeRequestStore } from '../farm/probe-requests.js';
import type { RunSink } from '../../worker/runtime/queue-processor.js';
import { newRegistry, serveMetrics, workerMetrics } from '../metrics/index.js';
import { RunWorker } from '../../worker/runtime/queue-processor.js';
import { addFarmOptions, openFarm, type FarmCliOptions } from './farm-options.js';
import { positiveInt } from './spec-file.js';
import { messageOf } from '../../proto/errors.js';

interface WorkerOptions extends FarmCliOptions {
  concurrency?: number;
  artifacts?: string;
  metricsPort?: number;
  metricsHost: string;
  lockMs?: number;
  stalledMs?: number;
  progressMs?: number;
  adaptiveSweepMs: number;
  logLevel: string;
  exitWhenIdle?: number;
}

export const LOG_LEVELS = ['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent'] as const;

/** Temporary files older than this are orphans of dead writers (a live write takes seconds). */
const ORPHAN_TMP_AGE_MS = 15 * 60_000;

const SHUTDOWN_LIMIT_MS = 9_000;

export function register(program: Command): void {
  addFarmOptions(
    program
      .command('worker')
      .description('grow queued runs: one job per core, checkpoints to the artifact folder, /metrics on request')
      .option('--concurrency <n>', 'jobs at once (default: available cores)', positiveInt('--concurrency', 1024))
      .option('--artifacts <dir>', 'checkpoint folder shared by all workers (default: TENDRIL_ARTIFACTS or ./tendril-artifacts)')
      .option('--metrics-port <port>', 'serve Prometheus /metrics on this port (default: TENDRIL_WORKER_METRICS_PORT, else off)', positiveInt('--metrics-port', 65535))
      .option('--metrics-host <host>', 'address for /metrics', '127.0.0.1')
      .addOption(new Option('--log-level <level>', 'structured log level on stderr (JSON lines)').choices(LOG_LEVELS).default(process.env.TENDRIL_LOG_LEVEL ?? 'info', 'TENDRIL_LOG_LEVEL or info'))
      .option('--exit-when-idle <seconds>', 'exit once the run queue has had no pending job for this long (batch-system array tasks)', positiveInt('--exit-when-idle', 86_400))
      .addOption(new Option('--lock-ms <ms>', 'queue lock duration').argParser(positiveInt('--lock-ms', 3_600_000)).hideHelp())
      .addOption(new Option('--stalled-ms <ms>', 'stalled-job check interval').argParser(positiveInt('--stalled-ms', 3_600_000)).hideHelp())
      .addOption(new Option('--progress-ms <ms>', 'progress report interval').argParser(positiveInt('--progress-ms', 600_000)).hideHelp())
      .addOption(new Option('--adaptive-sweep-ms <ms>', 'how often to check adaptive ensembles for a finished batch').argParser(positiveInt('--adaptive-sweep-ms', 3_600_000)).default(30_000).hideHelp()),
  ).action(async (opts: WorkerOptions) => {
    const artifactRoot = opts.artifacts ?? process.env.TENDRIL_ARTIFACTS ?? 'tendril-artifacts';
    const problem = await artifactFolderProblem(artifactRoot);
    if (problem) throw new UsageError(problem);
    const orphans = await removeOrphanTemporaries(artifactRoot, ORPHAN_TMP_AGE_MS);
    const farm = await openFarm(opts);
    const registry = newRegistry();
    const metrics = workerMetrics(registry);
    const concurrency = opts.concurrency ?? availableParallelism();
    if (!(LOG_LEVELS as readonly string[]).includes(opts.logLevel)) throw new UsageError(`--log-level: "${opts.logLevel}" is not allowed; allowed: ${LOG_LEVELS.join(', ')}`);
    const logger = pino({ level: opts.logLevel, base: { pid: process.pid } }, pino.destination({ fd: 2, sync: true }));
    const log = (line: string) => logger.info(line);
    // adaptive ensembles: the worker that stores the last result of a batch judges it and queues the next
    // batch (coordinator/farm/adaptive.ts: an atomic Redis step, so a batch is never added twice)
    const store = farm.store;
    const artifacts = new DirectoryArtifactStore(artifactRoot);
    if (orphans > 0) log(`removed ${orphans} temporary file(s) left in ${artifacts.root} by writers that died`);
    const probes = new FarmProbeHandler(store, artifacts, concurrency, { onProbed: metrics.onProbed, log }, new ProbeRequestStore(farm.redis, farm.prefix));
    const sink: RunSink = {
      finalPositions: (run, final) => keepFinalAndQueueProbes(store, artifacts, farm.queue, run, final),
      isCancelled: (e) => store.isCancelled(e),
      exists: (e) => store.exists(e),
      hasResult: (e, i) => store.hasResult(e, i),
      runStarted: (e, i, w) => store.runStarted(e, i, w),
      runReleased: (e, i) => store.runReleased(e, i),
      progress: (e, i, c, d) => store.progress(e, i, c, d),
      runFailed: (e, i, r) => store.runFailed(e, i, r),
      saveResult: async (result, bytes) => {
        const counted = await store.saveResult(result, bytes);
        try {
          const step = await advanceAdaptive(store, farm.queue, result.ensembleId);
          if (step === 'extended' || step === 'finished') log(`adaptive ensemble ${result.ensembleId}: batch judged, ${step === 'extended' ? 'next batch queued' : 'stopped'}`);
        } catch (err) {
          log(`adaptive ensemble ${result.ensembleId}: ${messageOf(err)} (the periodic sweep retries)`);
        }
        return counted;
      },
    };
    const stopSweeps = startAdaptiveSweeps(store, farm.queue, opts.adaptiveSweepMs, log);
    const worker = new RunWorker({
      connection: farm.redis,
      prefix: farm.prefix,
      sink,
      checkpoints: artifacts,
      probes,
      concurrency,
      lockDuration: opts.lockMs,
      stalledInterval: opts.stalledMs,
      progressIntervalMs: opts.progressMs,
      log,
      onRunEvent: (e) => {
        const { event, ...fields } = e;
        if (event === 'run failed') logger.warn({ workerId: worker.workerId, ...fields }, event);
        else logger.info({ workerId: worker.workerId, ...fields }, event);
      },
      ...metrics,
    });
    const port = opts.metricsPort ?? (process.env.TENDRIL_WORKER_METRICS_PORT ? Number(process.env.TENDRIL_WORKER_METRICS_PORT) : undefined);
    const server = port ? await serveMetrics(registry, port, opts.metricsHost) : undefined;
    worker.start();
    process.stdout.write(`worker ${worker.workerId} ready: ${concurrency} thread(s), prefix ${farm.prefix}${server ? `, metrics on http://${opts.metricsHost}:${port}/metrics` : ''}\n`);
    await new Promise<void>((resolve) => {
      let stopping = false;
      let stopIdleWatch = () => undefined as void;
      const onSignal = (sig: string) => {
        if (stopping) return;
        stopping = true;
        stopIdleWatch();
        log(sig === 'idle' ? `the run queue had no pending job for ${opts.exitWhenIdle} s: exiting` : `${sig}: checkpointing active runs and handing them back`);
        const hard = setTimeout(() => {
          log('shutdown took too long; exiting');
          process.exit(1);
        }, SHUTDOWN_LIMIT_MS);
        hard.unref();
        void stopSweeps();
        worker
          .shutdown()
          .then(() => probes.close())
          .catch((err: Error) => log(`shutdown: ${err.message}`))
          .finally(() => {
            server?.close();
            void farm.close().finally(resolve);
          });
      };
      process.on('SIGTERM', () => onSignal('SIGTERM'));
      process.on('SIGINT', () => onSignal('SIGINT'));
      if (opts.exitWhenIdle) stopIdleWatch = watchForIdle(farm.queue, opts.exitWhenIdle * 1000, () => onSignal('idle'));
    });
  });
}
