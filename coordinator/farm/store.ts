/**
 * The Redis-backed ensemble store. Key layout (P = prefix, default "tendril"):
 *
 *   P:ensembles                    sorted set: ensemble id, scored by creation time (ms)
 *   P:ensemble:ID                  hash: spec (canonical JSON), name, created_at_ms,
 *                                  clusters (planned so far), particles, jobs (queued so far),
 *                                  cancelled ("1" once cancelled); adaptive ensembles also
 *                                  adaptive (AdaptiveHistory JSON: target, outcome, batches) and
 *                                  queued_through (runs 0..queued_through-1 have their jobs queued)
 *   P:ensemble:ID:results          hash: run index -> RunResult protobuf bytes; written with
 *                                  HSETNX, so a run executed twice is stored (and counted) once
 *   P:ensemble:ID:running          hash: run index -> worker id, while a worker grows it
 *   P:ensemble:ID:progress         hash: run index -> particles placed so far (running runs)
 *   P:ensemble:ID:seen             hash: run index -> last sign of life of its worker (ms; start and
 *                                  every progress tick); a running run unseen for STALE_RUN_MS
 *                                  (its worker was killed) counts as queued, not running
 *   P:ensemble:ID:failed           hash: run index -> reason, for runs that failed for good
 *   P:ensemble:ID:rate             hash: 10-second bucket number -> particles grown in it
 *   P:ensemble:ID:harmonic         hash: "RUN:SIZE" -> ClusterHarmonic JSON of a probed cluster (HSETNX:
 *                                  the first analysis of a (run, size) is the one kept)
 *   P:ensemble:ID:probed:RUN:SIZE  set: probe job indices of (run, size) whose results are stored
 *   P:ensemble:ID:probe-failed     hash: "RUN:SIZE" -> reason, for probes that failed for good
 *   P:runs:*                       the BullMQ queue "runs" (BullMQ's own layout), holding grow
 *                                  and probe jobs
 *
 * Checkpoints are not in Redis but in the artifact store (coordinator/farm/artifacts.ts).
 */
import { Redis } from 'ioredis';
import type { RunResultData } from '../../proto/convert.js';
import type { EnsembleSpec } from '../spec/index.js';
import { DEFAULT_PREFIX, RATE_BUCKET_MS } from './ensemble-status.js';
import { EnsembleReader } from './ensemble-reader.js';
import type { AdaptiveHistory } from '../summary/adaptive.js';
import type { RunSink } from '../../worker/runtime/queue-processor.js';
import type { ClusterHarmonic } from '../harmonic/cluster-harmonic.js';

export { DEFAULT_PREFIX, STALE_RUN_MS, type EnsembleState, type EnsembleStatus } from './ensemble-status.js';
export type { EnsembleRecord } from './ensemble-reader.js';
// the spec validator (ajv, the model registry) loads on first use
const specModule = () => import('../spec/index.js');

/**
 * A Redis connection. `failFast` (the HTTP API): commands fail at once while
 * Redis is unreachable instead of waiting in the offline queue (where a
 * request whose client gave up would still run once Redis is back), and any
 * command fails after `failFast` ms.
 */
export function connectRedis(url: string, opts: { lazy?: boolean; failFast?: number } = {}): Redis {
  return new Redis(url, {
    maxRetriesPerRequest: null,
    lazyConnect: opts.lazy ?? false,
    enableReadyCheck: true,
    ...(opts.failFast ? { enableOfflineQueue: false, commandTimeout: opts.failFast } : {}),
  });
}


/**
 * One atomic step of an adaptive ensemble: only if the ensemble still has
 * `expected` planned clusters and no outcome, write the new planned count,
 * job count and history. Two coordinators judging the same complete batch
 * both try; exactly one succeeds, so a batch is never added twice.
 * KEYS[1] ensemble hash; ARGV expected clusters, new clusters, new jobs, history JSON.
 */
const EXTEND_SCRIPT = `
if redis.call('HGET', KEYS[1], 'clusters') ~= ARGV[1] then return 0 end
local h = redis.call('HGET', KEYS[1], 'adaptive')
if not h then return 0 end
if string.find(h, '"outcome":"running"', 1, true) == nil then return 0 end
redis.call('HSET', KEYS[1], 'clusters', ARGV[2], 'jobs', ARGV[3], 'adaptive', ARGV[4])
return 1
`;

/** Raise queued_through to ARGV[1] (never lower it). */
const QUEUED_SCRIPT = `
local q = tonumber(redis.call('HGET', KEYS[1], 'queued_through') or '0')
if tonumber(ARGV[1]) > q then redis.call('HSET', KEYS[1], 'queued_through', ARGV[1]) end
return 1
`;

/**
 * Mark a run running, unless its result is already stored (another worker
 * finished it, or this job is a retry after its result was saved).
 * KEYS[1] results hash, KEYS[2] running hash; ARGV run index, worker id. 1: marked, 0: has a result.
 */
const RUN_STARTED_SCRIPT = `
if redis.call('HEXISTS', KEYS[1], ARGV[1]) == 1 then return 0 end
redis.call('HSET', KEYS[2], ARGV[1], ARGV[2])
redis.call('HSET', KEYS[3], ARGV[1], ARGV[3])
return 1
`;

/** The ensemble store: the reads of EnsembleReader, and every write (launch, workers, cancel). */
export class EnsembleStore extends EnsembleReader implements RunSink {
  constructor(
    readonly redis: Redis,
    prefix: string = DEFAULT_PREFIX,
  ) {
    super(redis, prefix);
  }

  async create(id: string, spec: EnsembleSpec, jobs: number, createdAtMs = Date.now(), adaptive: AdaptiveHistory | null = null): Promise<void> {
    const { specToDocument } = await specModule();
    const ok = await this.redis.hsetnx(this.k(id), 'spec', JSON.stringify(specToDocument(spec)));
    if (!ok) throw new Error(`ensemble ${id} exists already`);
    const fields: Record<string, string> = {
      name: spec.name, created_at_ms: String(createdAtMs), clusters: String(spec.clusters), particles: String(spec.particles), jobs: String(jobs),
    };
    if (adaptive) {
      fields.adaptive = JSON.stringify(adaptive);
      fields.queued_through = '0';
    }
    await this.redis
      .multi()
      .hset(this.k(id), fields)
      .zadd(`${this.prefix}:ensembles`, createdAtMs, id)
      .exec();
  }

  /** The stored spec document of an ensemble as JSON text (null when there is none), for comparing a repeated launch. */
  async specText(id: string): Promise<string | null> {
    return this.redis.hget(this.k(id), 'spec');
  }

  /** Mark an ensemble's jobs all queued (a launch interrupted before this is completed by its retry). */
  async markLaunched(id: string): Promise<void> {
    await this.redis.hset(this.k(id), 'launched', '1');
  }

  async launched(id: string): Promise<boolean> {
    return (await this.redis.hexists(this.k(id), 'launched')) === 1;
  }

  /** The atomic batch step of an adaptive ensemble (see EXTEND_SCRIPT); true when this call made it. */
  async extendAdaptive(id: string, expectedClusters: number, newClusters: number, newJobs: number, history: AdaptiveHistory): Promise<boolean> {
    const r = await this.redis.eval(EXTEND_SCRIPT, 1, this.k(id), String(expectedClusters), String(newClusters), String(newJobs), JSON.stringify(history));
    return r === 1;
  }

  async resultCount(id: string): Promise<number> {
    return this.redis.hlen(this.k(id, 'results'));
  }

  /** Record that the jobs of runs 0..through-1 are queued. */
  async markQueued(id: string, through: number): Promise<void> {
    await this.redis.eval(QUEUED_SCRIPT, 1, this.k(id), String(through));
  }

  /** Ids of adaptive ensembles still growing (scanning the newest `limit`). */
  async runningAdaptiveIds(limit = 1000): Promise<string[]> {
    const ids = await this.ids(limit);
    if (ids.length === 0) return [];
    const tx = this.redis.multi();
    for (const id of ids) tx.hmget(this.k(id), 'adaptive', 'cancelled');
    const fields = repliesOf<Array<string | null>>(await tx.exec());
    return ids.filter((_, n) => {
      const [a, c] = fields[n];
      return a !== null && c !== '1' && a.includes('"outcome":"running"');
    });
  }

  async cancel(id: string): Promise<boolean> {
    if (!(await this.redis.hexists(this.k(id), 'spec'))) return false;
    await this.redis.hset(this.k(id), 'cancelled', '1');
    return true;
  }

  // ---------------------------------------------------------- RunSink (used by workers)

  async isCancelled(ensembleId: string): Promise<boolean> {
    return (await this.redis.hget(this.k(ensembleId), 'cancelled')) === '1';
  }

  async exists(ensembleId: string): Promise<boolean> {
    return (await this.redis.hexists(this.k(ensembleId), 'spec')) === 1;
  }

  async hasResult(ensembleId: string, runIndex: number): Promise<boolean> {
    return (await this.redis.hexists(this.k(ensembleId, 'results'), String(runIndex))) === 1;
  }

  /** Mark a run running (and seen now); false (and nothing marked) when its result is already stored: it must not be grown again. */
  async runStarted(ensembleId: string, runIndex: number, workerId: string): Promise<boolean> {
    const r = await this.redis.eval(RUN_STARTED_SCRIPT, 3, this.k(ensembleId, 'results'), this.k(ensembleId, 'running'), this.k(ensembleId, 'seen'), String(runIndex), workerId, String(Date.now()));
    return Number(r) === 1;
  }

  async runReleased(ensembleId: string, runIndex: number): Promise<void> {
    await this.redis.multi().hdel(this.k(ensembleId, 'running'), String(runIndex)).hdel(this.k(ensembleId, 'progress'), String(runIndex)).hdel(this.k(ensembleId, 'seen'), String(runIndex)).exec();
  }

  async progress(ensembleId: string, runIndex: number, count: number, delta: number): Promise<void> {
    const bucket = Math.floor(Date.now() / RATE_BUCKET_MS);
    const m = this.redis.multi().hset(this.k(ensembleId, 'progress'), String(runIndex), String(count)).hset(this.k(ensembleId, 'seen'), String(runIndex), String(Date.now()));
    if (delta > 0) m.hincrby(this.k(ensembleId, 'rate'), String(bucket), delta);
    await m.exec();
  }

  /** Store a finished run; false when this run index was stored before (a retry), which then changes nothing. */
  async saveResult(result: RunResultData, bytes: Uint8Array): Promise<boolean> {
    const id = result.ensembleId;
    // one transaction: a stored result and a cleared running mark go together (a connection lost between
    // two separate commands used to leave the run marked running after its result was stored)
    const r = await this.redis
      .multi()
      .hsetnx(this.k(id, 'results'), String(result.runIndex), Buffer.from(bytes))
      .hdel(this.k(id, 'running'), String(result.runIndex))
      .hdel(this.k(id, 'seen'), String(result.runIndex))
      .hdel(this.k(id, 'progress'), String(result.runIndex))
      .hdel(this.k(id, 'failed'), String(result.runIndex))
      .exec();
    if (!r || r[0][0]) throw r?.[0][0] ?? new Error(`run ${result.runIndex}: storing the result failed`);
    return Number(r[0][1]) === 1;
  }

  async runFailed(ensembleId: string, runIndex: number, reason: string): Promise<void> {
    await this.redis
      .multi()
      .hset(this.k(ensembleId, 'failed'), String(runIndex), reason.slice(0, 500))
      .hdel(this.k(ensembleId, 'running'), String(runIndex))
      .hdel(this.k(ensembleId, 'seen'), String(runIndex))
      .hdel(this.k(ensembleId, 'progress'), String(runIndex))
      .exec();
  }

  // ---------------------------------------------------------- probes

  /** Record that probe job j of (run, size) has its result stored; returns how many jobs of it have. */
  async probeJobStored(id: string, runIndex: number, size: number, job: number): Promise<number> {
    const key = this.k(id, `probed:${runIndex}:${size}`);
    const r = await this.redis.multi().sadd(key, String(job)).scard(key).exec();
    return Number(r?.[1]?.[1] ?? 0);
  }

  async hasHarmonic(id: string, runIndex: number, size: number): Promise<boolean> {
    return (await this.redis.hexists(this.k(id, 'harmonic'), `${runIndex}:${size}`)) === 1;
  }

  /** Keep the analysis of a probed (run, size); false when one was kept before. */
  async saveHarmonic(id: string, record: ClusterHarmonic): Promise<boolean> {
    const ok = await this.redis.hsetnx(this.k(id, 'harmonic'), `${record.runIndex}:${record.size}`, JSON.stringify(record));
    await this.redis.hdel(this.k(id, 'probe-failed'), `${record.runIndex}:${record.size}`);
    return ok === 1;
  }

  async probeFailed(id: string, runIndex: number, size: number, reason: string): Promise<void> {
    if (await this.hasHarmonic(id, runIndex, size)) return;
    await this.redis.hset(this.k(id, 'probe-failed'), `${runIndex}:${size}`, reason.slice(0, 500));
  }

  /** Delete every key of an ensemble (tests and operators). */
  async purge(id: string): Promise<void> {
    const probed: string[] = [];
    let cursor = '0';
    do {
      const [next, keys] = await this.redis.scan(cursor, 'MATCH', this.k(id, 'probed:*'), 'COUNT', 1000);
      cursor = next;
      probed.push(...keys);
    } while (cursor !== '0');
    await this.redis
      .multi()
      .del(this.k(id), this.k(id, 'results'), this.k(id, 'running'), this.k(id, 'seen'), this.k(id, 'progress'), this.k(id, 'failed'), this.k(id, 'rate'), this.k(id, 'harmonic'), this.k(id, 'probe-failed'), ...probed)
      .zrem(`${this.prefix}:ensembles`, id)
      .exec();
  }
}

/** The replies of a MULTI … EXEC, in order; throws the first command error (or when the transaction was discarded). */
function repliesOf<T>(exec: Array<[Error | null, unknown]> | null): T[] {
  if (exec === null) throw new Error('Redis discarded the transaction');
  return exec.map(([err, v]) => {
    if (err) throw err;
    return v as T;
  });
}
