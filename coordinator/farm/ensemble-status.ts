/**
 * An ensemble's status (runs by state, particles, throughput, time left,
 * probes) read from its Redis keys (layout in coordinator/farm/store.ts).
 *
 * Kept apart from the store so that `tendril status`, `list` and `watch`
 * load nothing but this and a Redis connection: the stored spec document is
 * read as written at launch (already validated then), without the schema
 * validator, the model registry or the protobuf code.
 */

/** The few Redis reads a status needs; ioredis's client and coordinator/farm/redis-reader.ts both provide them. */
export interface StatusReader {
  hgetall(key: string): Promise<Record<string, string>>;
  hlen(key: string): Promise<number>;
  hmget(key: string, ...fields: string[]): Promise<Array<string | null>>;
  zrevrange(key: string, start: number, stop: number): Promise<string[]>;
}

/** Key prefix of a farm's keys when none is given. */
export const DEFAULT_PREFIX = 'tendril';
export const RATE_BUCKET_MS = 10_000;
export const RATE_WINDOW_MS = 60_000;
/** A running run whose worker gave no sign of life for this long is counted as queued (workers tick every 2 s by default). */
export const STALE_RUN_MS = 60_000;

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

/** The fields of a stored spec document (specToDocument) a status reads. */
interface StoredSpecFields {
  particles: number;
  probe?: { at_sizes?: number[] };
}

interface StoredAdaptive {
  outcome: string;
  batches: unknown[];
  target: { max_clusters: number };
}

const key = (prefix: string, id: string, part?: string) => (part ? `${prefix}:ensemble:${id}:${part}` : `${prefix}:ensemble:${id}`);

/** Ensemble ids, newest first. */
export function ensembleIds(r: StatusReader, prefix: string, limit = 100): Promise<string[]> {
  return r.zrevrange(`${prefix}:ensembles`, 0, limit - 1);
}

export async function readEnsembleStatus(r: StatusReader, prefix: string, id: string, now = Date.now()): Promise<EnsembleStatus | null> {
  return (await readEnsembleStatuses(r, prefix, [id], now))[0];
}

/**
 * Statuses of many ensembles (null for an unknown id) in two pipelined
 * rounds whatever their number: every read of every ensemble is sent before
 * any reply is awaited, then the running marks are checked against stored
 * results in one more round (only when some are marked). With the id list,
 * /metrics, GET /ensembles and `tendril list` wait for three round trips.
 */
export async function readEnsembleStatuses(r: StatusReader, prefix: string, ids: readonly string[], now = Date.now()): Promise<Array<EnsembleStatus | null>> {
  const reads = await Promise.all(
    ids.map((id) => {
      const k = (part?: string) => key(prefix, id, part);
      return Promise.all([
        r.hgetall(k()),
        r.hlen(k('results')),
        r.hgetall(k('running')),
        r.hgetall(k('progress')),
        r.hgetall(k('failed')),
        r.hgetall(k('rate')),
        r.hlen(k('harmonic')),
        r.hgetall(k('probe-failed')),
        r.hgetall(k('seen')),
      ] as const);
    }),
  );
  const running = reads.map(([, , marked, , , , , , seen]) => {
    // runs whose worker stopped giving signs of life (killed) are waiting to be taken up again, not running
    const live: Record<string, string> = {};
    for (const [i, w] of Object.entries(marked)) if (seen[i] === undefined || now - Number(seen[i]) < STALE_RUN_MS) live[i] = w;
    return live;
  });
  // a run whose result is stored is never running, whatever a stale mark says
  await Promise.all(
    ids.map(async (id, n) => {
      const markedRuns = Object.keys(running[n]);
      if (markedRuns.length === 0 || !reads[n][0].spec) return;
      const stored = await r.hmget(key(prefix, id, 'results'), ...markedRuns);
      markedRuns.forEach((i, j) => {
        if (stored[j] !== null) delete running[n][i];
      });
    }),
  );
  return ids.map((id, n) => {
    const [h, doneN, , progress, failed, rate, harmonicN, probeFailed] = reads[n];
    return h.spec ? statusOf(id, h, { doneN, running: running[n], progress, failed, rate, harmonicN, probeFailed }, now) : null;
  });
}

/** An ensemble's status from its record hash and the reads of its run hashes (running marks already checked). */
function statusOf(
  id: string,
  h: Record<string, string>,
  reads: { doneN: number; running: Record<string, string>; progress: Record<string, string>; failed: Record<string, string>; rate: Record<string, string>; harmonicN: number; probeFailed: Record<string, string> },
  now: number,
): EnsembleStatus {
  const { doneN, running, progress, failed, rate, harmonicN, probeFailed } = reads;
  const spec = JSON.parse(h.spec) as StoredSpecFields;
  const adaptive = h.adaptive ? (JSON.parse(h.adaptive) as StoredAdaptive) : null;
  const createdAtMs = Number(h.created_at_ms ?? 0);
  const cancelled = h.cancelled === '1';
  // probeSizesOf (coordinator/spec): the at_sizes and the final size
  const probeSizes = spec.probe ? (spec.probe.at_sizes?.length ?? 0) + 1 : 0;
  const planned = Number(h.clusters ?? 0);
  const runningN = Object.keys(running).length;
  const failedN = Object.keys(failed).length;
  let particlesDone = doneN * spec.particles;
  // only runs still marked running count (a late progress write may follow a stored result)
  for (const [i, v] of Object.entries(progress)) if (running[i] !== undefined) particlesDone += Number(v);
  const fromBucket = Math.floor((now - RATE_WINDOW_MS) / RATE_BUCKET_MS);
  let recent = 0;
  for (const [b, v] of Object.entries(rate)) if (Number(b) >= fromBucket) recent += Number(v);
  const windowS = Math.min(RATE_WINDOW_MS, Math.max(RATE_BUCKET_MS, now - createdAtMs)) / 1000;
  const throughput = recent / windowS;
  const total = planned * spec.particles;
  const probesPlanned = planned * probeSizes;
  const probeFailedN = Object.keys(probeFailed).length;
  const probesComplete = harmonicN >= probesPlanned;
  let state: EnsembleState = 'running';
  if (cancelled && (doneN < planned || !probesComplete)) state = 'cancelled';
  else if (doneN === planned && adaptive?.outcome === 'running') state = 'running'; // batch complete, awaiting its judgement
  else if (doneN === planned && probesComplete) state = 'done';
  else if (doneN + failedN === planned && harmonicN + probeFailedN >= doneN * probeSizes && (failedN > 0 || probeFailedN > 0)) state = 'failed';
  const remaining = total - particlesDone;
  return {
    id,
    name: h.name ?? '',
    state,
    createdAt: new Date(createdAtMs).toISOString(),
    // a cancelled or finished ensemble has nothing queued (its jobs were dropped), and grows nothing
    runs: { planned, queued: state === 'running' ? Math.max(0, planned - doneN - runningN - failedN) : 0, running: runningN, done: doneN, failed: failedN },
    particles: { done: particlesDone, total },
    throughput: state === 'running' ? throughput : 0,
    etaSeconds: state !== 'running' ? (state === 'done' ? 0 : null) : throughput > 0 ? remaining / throughput : null,
    failures: Object.entries(failed)
      .map(([i, reason]) => ({ runIndex: Number(i), reason }))
      .sort((a, b) => a.runIndex - b.runIndex)
      .slice(0, 20),
    adaptive: adaptive ? { outcome: adaptive.outcome, batches: adaptive.batches.length, maxClusters: adaptive.target.max_clusters } : null,
    probes: spec.probe
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
