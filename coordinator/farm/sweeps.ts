/**
 * Sweeps on the farm: a parent record over ordinary member ensembles, one per
 * value (coordinator/spec/sweep.ts). Members are launched, grown, counted,
 * summarised and cancelled exactly like any ensemble; the sweep only records
 * which they are. Key layout (P = prefix):
 *
 *   P:sweeps          sorted set: sweep id, scored by creation time (ms)
 *   P:sweep:ID        hash: spec (canonical sweep document, JSON), name, created_at_ms, parameter,
 *                     values (JSON array), members (JSON array of member ensemble ids, in order of value)
 *
 * Status, list and watch read a sweep through the small Redis reader
 * (StatusReader) without the spec validator; the summary validates the
 * stored document (getSweep).
 *
 * Member i of sweep ID is the ensemble "ID-i". A launch with an idempotency
 * key derives the sweep id from the key (as a single ensemble's would be) and
 * launches each member at most once; a repeat completes members that a cut-
 * short launch left unqueued (their job ids are fixed).
 */
import type { Queue } from 'bullmq';
import type { EnsembleSummaryData } from '../../proto/convert.js';
import { newEnsembleId } from '../plan.js';
import { sweepHashKey } from './sweep-status.js';
import { sweepToDocument, validateLaunch, type SweepSpec } from '../spec/sweep.js';
import { buildSweepSummary, type SweepSummary } from '../summary/sweep-summary.js';
import { defaultSummaryOptions, type SummaryOptions } from '../summary/index.js';
import { farmSummary, type FarmSummary } from './summary.js';
import { IdempotencyConflict, idempotentEnsembleId, launchRemainder } from './idempotent-launch.js';
import { cancelEnsemble, launchEnsemble, type CancelOutcome } from './queue.js';
import type { EnsembleStore } from './store.js';
import type { EnsembleReader } from './ensemble-reader.js';
export { readSweepStatus, sweepIds, sweepState, type SweepStatus } from './sweep-status.js';

export interface SweepRecord {
  id: string;
  name: string;
  sweep: SweepSpec;
  createdAtMs: number;
  memberIds: string[];
}

function sweepKey(store: { prefix: string }, id: string): string {
  return sweepHashKey(store.prefix, id);
}

/** A fresh sweep id: like an ensemble id, starting with "s". */
export function newSweepId(now = Date.now()): string {
  return newEnsembleId(now).replace(/^e/, 's');
}

/** The ensemble id of member i of a sweep. */
export function memberId(sweepId: string, index: number): string {
  return `${sweepId}-${index}`;
}

export async function sweepExists(store: EnsembleStore, id: string): Promise<boolean> {
  return (await store.redis.hexists(sweepKey(store, id), 'spec')) === 1;
}

/**
 * Record the sweep and launch its members; returns the sweep id. With
 * `idempotencyKey`, a repeat with the same sweep returns the same id (and
 * completes any member not yet launched); another spec under the key is an
 * IdempotencyConflict.
 */
export async function launchSweep(store: EnsembleStore, queue: Queue, sweep: SweepSpec, opts: { sweepId?: string; idempotencyKey?: string } = {}): Promise<{ id: string; memberIds: string[]; created: boolean }> {
  const id = opts.idempotencyKey !== undefined ? idempotentEnsembleId(store.prefix, opts.idempotencyKey) : opts.sweepId ?? newSweepId();
  const doc = JSON.stringify(sweepToDocument(sweep));
  const memberIds = sweep.members.map((_, i) => memberId(id, i));
  if (opts.idempotencyKey !== undefined && (await store.specText(id)) !== null) throw new IdempotencyConflict('idempotency-key: used before for a single ensemble; allowed: a new key for a sweep');
  const created = (await store.redis.hsetnx(sweepKey(store, id), 'spec', doc)) === 1;
  if (!created) {
    if ((await store.redis.hget(sweepKey(store, id), 'spec')) !== doc) {
      if (opts.idempotencyKey !== undefined) throw new IdempotencyConflict('idempotency-key: used before with a different spec; allowed: a new key for a new spec');
      throw new Error(`sweep ${id} exists already`);
    }
  } else {
    const now = Date.now();
    await store.redis.multi()
      .hset(sweepKey(store, id), { name: sweep.name, created_at_ms: String(now), parameter: sweep.parameter, values: JSON.stringify(sweep.values), members: JSON.stringify(memberIds) })
      .zadd(`${store.prefix}:sweeps`, now, id)
      .exec();
  }
  for (const [i, member] of sweep.members.entries()) {
    const mid = memberIds[i];
    if ((await store.specText(mid)) === null) {
      try {
        await launchEnsemble(store, queue, member, { ensembleId: mid });
      } catch (err) {
        if (!/exists already/.test((err as Error).message)) throw err;
      }
    } else if (!(await store.launched(mid))) {
      // a launch cut short before this member's jobs were all queued: same job ids, none queued twice
      const rec = await store.get(mid);
      if (rec && !rec.cancelled) await launchRemainder(store, queue, member, mid);
    }
    await store.markLaunched(mid);
  }
  return { id, memberIds, created };
}

export async function getSweep(store: EnsembleReader, id: string): Promise<SweepRecord | null> {
  const h = await store.reads.hgetall(sweepKey(store, id));
  if (!h.spec || !h.members) return null;
  const launchable = validateLaunch(JSON.parse(h.spec), { maxTotalParticles: Number.MAX_SAFE_INTEGER });
  if (launchable.kind !== 'sweep') return null;
  return { id, name: h.name ?? launchable.sweep.name, sweep: launchable.sweep, createdAtMs: Number(h.created_at_ms ?? 0), memberIds: JSON.parse(h.members) as string[] };
}

/**
 * The sweep's summary from its members' summaries, each given by `memberSummary`
 * (the HTTP API passes its cache, which builds them on a thread).
 */
export async function sweepSummaryOf(
  store: EnsembleReader,
  id: string,
  memberSummary: (memberId: string) => Promise<{ summary: EnsembleSummaryData } | null>,
): Promise<{ record: SweepRecord; summary: SweepSummary } | null> {
  const record = await getSweep(store, id);
  if (!record) return null;
  const summaries: EnsembleSummaryData[] = [];
  for (const mid of record.memberIds) {
    const got = await memberSummary(mid);
    if (!got) throw new Error(`sweep ${id}: member ensemble ${mid} is missing from this farm`);
    summaries.push(got.summary);
  }
  const summary = buildSweepSummary({
    sweepId: id, name: record.name, modelKind: record.sweep.members[0].model.kind, parameter: record.sweep.parameter, seed: record.sweep.seed, document: sweepToDocument(record.sweep),
    members: summaries.map((s, i) => ({ value: record.sweep.values[i], ensembleId: record.memberIds[i], summary: s })),
  });
  return { record, summary };
}

/** The sweep's summary from its members' farm summaries (partial while any runs), with those summaries. */
export async function farmSweepSummary(store: EnsembleReader, id: string, opts: SummaryOptions = defaultSummaryOptions()): Promise<{ record: SweepRecord; summary: SweepSummary; members: FarmSummary[] } | null> {
  const members: FarmSummary[] = [];
  const got = await sweepSummaryOf(store, id, async (mid) => {
    const m = await farmSummary(store, mid, opts);
    if (m) members.push(m);
    return m;
  });
  return got && { ...got, members };
}

/** Cancel every member; the outcome of each, in order of value. */
export async function cancelSweep(store: EnsembleStore, queue: Queue, id: string): Promise<CancelOutcome[] | null> {
  const rec = await getSweep(store, id);
  if (!rec) return null;
  const out: CancelOutcome[] = [];
  for (const m of rec.memberIds) out.push(await cancelEnsemble(store, queue, m));
  return out;
}
