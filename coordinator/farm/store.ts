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
import { decodeRunResult, type RunResultData } from '../../proto/convert.js';
import { probeSizesOf, specToDocument, validateSpec, type EnsembleSpec } from '../spec/index.js';
import type { AdaptiveHistory } from '../summary/adaptive.js';
import type { RunSink } from '../../worker/runtime/queue-processor.js';
import type { ClusterHarmonic } from '../harmonic/cluster-harmonic.js';

export const DEFAULT_PREFIX = 'tendril';
const RATE_BUCKET_MS = 10_000;
const RATE_WINDOW_MS = 60_000;
/** A running run whose worker gave no sign of life for this long is counted as queued (workers tick every 2 s by default). */
export const STALE_RUN_MS = 60_000;

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

export interface EnsembleRecord {
  id: string;
  name: string;
  spec: EnsembleSpec;
  createdAtMs: number;
  jobs: number;
  cancelled: boolean;
  /** Clusters planned so far: spec.clusters, or the sum of the batches of an adaptive ensemble. */
  plannedClusters: number;
  /** Batch history of an adaptive ensemble; null for a fixed count. */
  adaptive: AdaptiveHistory | null;
  /** Runs whose jobs are known to be queued (adaptive ensembles; = plannedClusters otherwise). */
  queuedThrough: number;
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

export type EnsembleState = 'running' | 'done' | 'failed' | 'cancelled';

export interface EnsembleStatus {
  id: string;
  name: string;
  state: EnsembleState;
  createdAt: string;
  runs: { planned: number; queued: number; running: number; done: number; failed: number };
  particles: { done: number; total: number };
  /** Particles per second over the last minute. */
  throughput: number;
  /** Seconds until done at the current throughput; null when unknown. */
  etaSeconds: number | null;
  failures: Array<{ runIndex: number; reason: string }>;
  /** Adaptive ensembles: the outcome so far, batches planned, and the cluster cap; null for a fixed count. */
  adaptive: { outcome: string; batches: number; maxClusters: number } | null;
  /** Probed ensembles: (run, size) probes planned for the planned clusters, analysed, failed; null without [probe]. */
  probes: { planned: number; done: number; failed: number; failures: Array<{ runIndex: number; size: number; reason: string }> } | null;
}

/** The record stored in an ensemble's hash; null when it holds no spec (unknown or purged). */
function recordOf(id: string, h: Record<string, string>): EnsembleRecord | null {
  if (!h.spec) return null;
    return {
      id,
      name: h.name ?? '',
      spec: validateSpec(JSON.parse(h.spec), { maxTotalParticles: Number.MAX_SAFE_INTEGER }),
      createdAtMs: Number(h.created_at_ms ?? 0),
      jobs: Number(h.jobs ?? 0),
      cancelled: h.cancelled === '1',
      plannedClusters: Number(h.clusters ?? 0),
      adaptive: h.adaptive ? (JSON.parse(h.adaptive) as AdaptiveHistory) : null,
      queuedThrough: h.queued_through !== undefined ? Number(h.queued_through) : Number(h.clusters ?? 0),
    };
}

export class EnsembleStore implements RunSink {
  constructor(
    readonly redis: Redis,
    readonly prefix: string = DEFAULT_PREFIX,
  ) {}

  private k(id: string, part?: string): string {
    return part ? `${this.prefix}:ensemble:${id}:${part}` : `${this.prefix}:ensemble:${id}`;
  }

  async create(id: string, spec: EnsembleSpec, jobs: number, createdAtMs = Date.now(), adaptive: AdaptiveHistory | null = null): Promise<void> {
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

  async get(id: string): Promise<EnsembleRecord | null> {
    return recordOf(id, await this.redis.hgetall(this.k(id)));
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

  /** Ensemble ids, newest first. */
  async ids(limit = 100): Promise<string[]> {
    return this.redis.zrevrange(`${this.prefix}:ensembles`, 0, limit - 1);
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

  /** The kept harmonic records, in (run, size) order. */
  async harmonicRecords(id: string): Promise<ClusterHarmonic[]> {
    const h = await this.redis.hgetall(this.k(id, 'harmonic'));
    return Object.values(h)
      .map((v) => JSON.parse(v) as ClusterHarmonic)
      .sort((a, b) => a.runIndex - b.runIndex || a.size - b.size);
  }

  // ---------------------------------------------------------- reading

  /** Stored results in run-index order (one per run index by construction). */
  async results(id: string): Promise<RunResultData[]> {
    const h = await this.redis.hgetallBuffer(this.k(id, 'results'));
    return Object.values(h)
      .map((b) => decodeRunResult(b))
      .sort((a, b) => a.runIndex - b.runIndex);
  }

  async status(id: string, now = Date.now()): Promise<EnsembleStatus | null> {
    return (await this.statuses([id], now))[0];
  }

  /** Statuses of the newest `limit` ensembles, newest first (at most three Redis round trips, whatever `limit`). */
  async recentStatuses(limit = 100, now = Date.now()): Promise<EnsembleStatus[]> {
    return (await this.statuses(await this.ids(limit), now)).filter((s): s is EnsembleStatus => s !== null);
  }

  /**
   * Statuses of many ensembles in at most two Redis round trips, whatever
   * their number: one MULTI reads every hash of every ensemble (a consistent
   * snapshot), a second checks the running marks against stored results
   * (only when some are marked). null for an unknown id.
   */
  async statuses(ids: readonly string[], now = Date.now()): Promise<Array<EnsembleStatus | null>> {
    if (ids.length === 0) return [];
    const tx = this.redis.multi();
    for (const id of ids) {
      tx.hgetall(this.k(id))
        .hlen(this.k(id, 'results'))
        .hgetall(this.k(id, 'running'))
        .hgetall(this.k(id, 'progress'))
        .hgetall(this.k(id, 'failed'))
        .hgetall(this.k(id, 'rate'))
        .hlen(this.k(id, 'harmonic'))
        .hgetall(this.k(id, 'probe-failed'))
        .hgetall(this.k(id, 'seen'));
    }
    const replies = repliesOf<unknown>(await tx.exec());
    const reads = ids.map((id, n): StatusReads | null => {
      const at = STATUS_READS * n;
      const rec = recordOf(id, replies[at] as Record<string, string>);
      if (!rec) return null;
      const [doneN, marked, progress, failed, rate, harmonicN, probeFailed, seen] = replies.slice(at + 1, at + STATUS_READS) as [
        number,
        Record<string, string>,
        Record<string, string>,
        Record<string, string>,
        Record<string, string>,
        number,
        Record<string, string>,
        Record<string, string>,
      ];
      // runs whose worker stopped giving signs of life (killed) are waiting to be taken up again, not running
      const running: Record<string, string> = {};
      for (const [i, w] of Object.entries(marked)) if (seen[i] === undefined || now - Number(seen[i]) < STALE_RUN_MS) running[i] = w;
      return { rec, doneN, running, progress, failed, rate, harmonicN, probeFailed };
    });
    // a run whose result is stored is never running, whatever a stale mark says
    const marks = reads.flatMap((r, n) => (r && Object.keys(r.running).length > 0 ? [{ n, runs: Object.keys(r.running) }] : []));
    if (marks.length > 0) {
      const check = this.redis.multi();
      for (const m of marks) check.hmget(this.k(ids[m.n], 'results'), ...m.runs);
      const stored = repliesOf<Array<Buffer | string | null>>(await check.exec());
      marks.forEach((m, j) => m.runs.forEach((i, q) => { if (stored[j][q] !== null) delete reads[m.n]!.running[i]; }));
    }
    return reads.map((r, n) => (r ? statusOf(ids[n], r, now) : null));
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

/** Replies per ensemble in statuses()' MULTI: its record hash, then the eight reads of its run hashes. */
const STATUS_READS = 9;

/** What statuses() read for one ensemble (running marks already cleared of silent workers). */
interface StatusReads {
  rec: EnsembleRecord;
  doneN: number;
  running: Record<string, string>;
  progress: Record<string, string>;
  failed: Record<string, string>;
  rate: Record<string, string>;
  harmonicN: number;
  probeFailed: Record<string, string>;
}

/** The replies of a MULTI … EXEC, in order; throws the first command error (or when the transaction was discarded). */
function repliesOf<T>(exec: Array<[Error | null, unknown]> | null): T[] {
  if (exec === null) throw new Error('Redis discarded the transaction');
  return exec.map(([err, v]) => {
    if (err) throw err;
    return v as T;
  });
}

/** An ensemble's status from what statuses() read. */
function statusOf(id: string, reads: StatusReads, now: number): EnsembleStatus {
  const { rec, doneN, running, progress, failed, rate, harmonicN, probeFailed } = reads;
  const probeSizes = probeSizesOf(rec.spec).length;
  const planned = rec.plannedClusters;
  const runningN = Object.keys(running).length;
  const failedN = Object.keys(failed).length;
  let particlesDone = doneN * rec.spec.particles;
  // only runs still marked running count (a late progress write may follow a stored result)
  for (const [i, v] of Object.entries(progress)) if (running[i] !== undefined) particlesDone += Number(v);
  const fromBucket = Math.floor((now - RATE_WINDOW_MS) / RATE_BUCKET_MS);
  let recent = 0;
  for (const [b, v] of Object.entries(rate)) if (Number(b) >= fromBucket) recent += Number(v);
  const windowS = Math.min(RATE_WINDOW_MS, Math.max(RATE_BUCKET_MS, now - rec.createdAtMs)) / 1000;
  const throughput = recent / windowS;
  const total = planned * rec.spec.particles;
  const probesPlanned = planned * probeSizes;
  const probeFailedN = Object.keys(probeFailed).length;
  const probesComplete = harmonicN >= probesPlanned;
  let state: EnsembleState = 'running';
  if (rec.cancelled && (doneN < planned || !probesComplete)) state = 'cancelled';
  else if (doneN === planned && rec.adaptive?.outcome === 'running') state = 'running'; // batch complete, awaiting its judgement
  else if (doneN === planned && probesComplete) state = 'done';
  else if (doneN + failedN === planned && harmonicN + probeFailedN >= doneN * probeSizes && (failedN > 0 || probeFailedN > 0)) state = 'failed';
  const remaining = total - particlesDone;
  return {
    id,
    name: rec.name,
    state,
    createdAt: new Date(rec.createdAtMs).toISOString(),
    // a cancelled or finished ensemble has nothing queued (its jobs were dropped), and grows nothing
    runs: { planned, queued: state === 'running' ? Math.max(0, planned - doneN - runningN - failedN) : 0, running: runningN, done: doneN, failed: failedN },
    particles: { done: particlesDone, total },
    throughput: state === 'running' ? throughput : 0,
    etaSeconds: state !== 'running' ? (state === 'done' ? 0 : null) : throughput > 0 ? remaining / throughput : null,
    failures: Object.entries(failed)
      .map(([i, reason]) => ({ runIndex: Number(i), reason }))
      .sort((a, b) => a.runIndex - b.runIndex)
      .slice(0, 20),
    adaptive: rec.adaptive ? { outcome: rec.adaptive.outcome, batches: rec.adaptive.batches.length, maxClusters: rec.adaptive.target.max_clusters } : null,
    probes: rec.spec.probe
      ? {
          planned: probesPlanned,
          done: harmonicN,
          failed: probeFailedN,
          failures: Object.entries(probeFailed)
            .map(([k, reason]) => ({ runIndex: Number(k.split(':')[0]), size: Number(k.split(':')[1]), reason }))
            .sort((a, b) => a.runIndex - b.runIndex || a.size - b.size)
            .slice(0, 20),
        }
      : null,
  };
}
