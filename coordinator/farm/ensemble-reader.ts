/**
 * The reads of the ensemble store (key layout in coordinator/farm/store.ts):
 * an ensemble's record, its stored results, its harmonic records and its
 * status. Kept apart from the writes so that `tendril summary` reads through
 * the small RESP client (coordinator/farm/redis-reader.ts) without loading
 * ioredis; EnsembleStore extends it with ioredis. The spec module and the
 * protobuf code load on first use.
 */
import type { RunResultData } from '../../proto/convert.js';
import type { EnsembleSpec } from '../spec/index.js';
import type { AdaptiveHistory } from '../summary/adaptive.js';
import type { ClusterHarmonic } from '../harmonic/cluster-harmonic.js';
import { DEFAULT_PREFIX, ensembleIds, readEnsembleStatus, readEnsembleStatuses, type EnsembleStatus, type StatusReader } from './ensemble-status.js';

const specModule = () => import('../spec/index.js');
const protoModule = () => import('../../proto/convert.js');

/** The Redis reads of the store: ioredis's client and RedisReader both provide them. */
export interface StoreReads extends StatusReader {
  hgetallBuffer(key: string): Promise<Record<string, Buffer>>;
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

export class EnsembleReader {
  constructor(
    readonly reads: StoreReads,
    readonly prefix: string = DEFAULT_PREFIX,
  ) {}

  protected k(id: string, part?: string): string {
    return part ? `${this.prefix}:ensemble:${id}:${part}` : `${this.prefix}:ensemble:${id}`;
  }

  async get(id: string): Promise<EnsembleRecord | null> {
    const h = await this.reads.hgetall(this.k(id));
    if (!h.spec) return null;
    const { validateSpec } = await specModule();
    return {
      id,
      name: h.name ?? '',
      spec: validateSpec(JSON.parse(h.spec), { maxTotalParticles: Number.MAX_SAFE_INTEGER }, { stored: true }),
      createdAtMs: Number(h.created_at_ms ?? 0),
      jobs: Number(h.jobs ?? 0),
      cancelled: h.cancelled === '1',
      plannedClusters: Number(h.clusters ?? 0),
      adaptive: h.adaptive ? (JSON.parse(h.adaptive) as AdaptiveHistory) : null,
      queuedThrough: h.queued_through !== undefined ? Number(h.queued_through) : Number(h.clusters ?? 0),
    };
  }

  /** Ensemble ids, newest first. */
  async ids(limit = 100): Promise<string[]> {
    return ensembleIds(this.reads, this.prefix, limit);
  }

  /** The kept harmonic records, in (run, size) order. */
  async harmonicRecords(id: string): Promise<ClusterHarmonic[]> {
    const h = await this.reads.hgetall(this.k(id, 'harmonic'));
    return Object.values(h)
      .map((v) => JSON.parse(v) as ClusterHarmonic)
      .sort((a, b) => a.runIndex - b.runIndex || a.size - b.size);
  }

  /** Stored results in run-index order (one per run index by construction). */
  async results(id: string): Promise<RunResultData[]> {
    const h = await this.reads.hgetallBuffer(this.k(id, 'results'));
    const { decodeRunResult } = await protoModule();
    return Object.values(h)
      .map((b) => decodeRunResult(b))
      .sort((a, b) => a.runIndex - b.runIndex);
  }

  async status(id: string, now = Date.now()): Promise<EnsembleStatus | null> {
    return readEnsembleStatus(this.reads, this.prefix, id, now);
  }

  /** Statuses of many ensembles in two pipelined rounds whatever their number (null for an unknown id). */
  async statuses(ids: readonly string[], now = Date.now()): Promise<Array<EnsembleStatus | null>> {
    return readEnsembleStatuses(this.reads, this.prefix, ids, now);
  }

  /** Statuses of the newest `limit` ensembles, newest first, in three round trips whatever `limit`. */
  async recentStatuses(limit = 100, now = Date.now()): Promise<EnsembleStatus[]> {
    return (await this.statuses(await this.ids(limit), now)).filter((s): s is EnsembleStatus => s !== null);
  }
}
