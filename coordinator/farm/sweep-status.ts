/**
 * A sweep's status (coordinator/farm/sweeps.ts holds the key layout): its
 * members' statuses and their totals, read through a StatusReader without
 * the spec validator, the queue or ioredis, so that `tendril status`,
 * `list` and `watch` stay light (test/cli-startup.test.ts).
 */
import { readEnsembleStatus, type EnsembleState, type EnsembleStatus, type StatusReader } from './ensemble-status.js';

/** The hash of sweep `id`. */
export function sweepHashKey(prefix: string, id: string): string {
  return `${prefix}:sweep:${id}`;
}

/** A sweep's status: the fields of an ensemble's status over all its members (state by sweepState), and each member's. */
export interface SweepStatus extends Pick<EnsembleStatus, 'id' | 'name' | 'state' | 'createdAt' | 'runs' | 'particles' | 'throughput' | 'etaSeconds'> {
  parameter: string;
  values: number[];
  members: Array<{ value: number; status: EnsembleStatus | null }>;
}

/** Sweep ids, newest first. */
export async function sweepIds(r: StatusReader, prefix: string, limit = 100): Promise<string[]> {
  return r.zrevrange(`${prefix}:sweeps`, 0, limit - 1);
}

/** The state of a sweep from its members': running while any runs; else cancelled, then failed, when any member is; else done. */
export function sweepState(members: ReadonlyArray<EnsembleStatus | null>): EnsembleState {
  const states = members.map((m) => m?.state ?? 'running');
  if (states.includes('running')) return 'running';
  if (states.includes('cancelled')) return 'cancelled';
  if (states.includes('failed')) return 'failed';
  return 'done';
}

/** A sweep's status: its members' statuses and their totals (read as stored, without the spec validator). */
export async function readSweepStatus(r: StatusReader, prefix: string, id: string, now = Date.now()): Promise<SweepStatus | null> {
  const h = await r.hgetall(sweepHashKey(prefix, id));
  if (!h.members || !h.values) return null;
  const memberIds = JSON.parse(h.members) as string[];
  const values = JSON.parse(h.values) as number[];
  const statuses = await Promise.all(memberIds.map((m) => readEnsembleStatus(r, prefix, m, now)));
  const runs = { planned: 0, queued: 0, running: 0, done: 0, failed: 0 };
  const particles = { done: 0, total: 0 };
  let throughput = 0;
  for (const s of statuses) {
    if (!s) continue;
    for (const k of Object.keys(runs) as Array<keyof typeof runs>) runs[k] += s.runs[k];
    particles.done += s.particles.done;
    particles.total += s.particles.total;
    throughput += s.throughput;
  }
  const state = sweepState(statuses);
  return {
    id, name: h.name ?? '', parameter: h.parameter ?? '', values, state, createdAt: new Date(Number(h.created_at_ms ?? 0)).toISOString(), runs, particles,
    throughput: state === 'running' ? throughput : 0,
    etaSeconds: state === 'done' ? 0 : state !== 'running' ? null : throughput > 0 ? (particles.total - particles.done) / throughput : null,
    members: statuses.map((s, i) => ({ value: values[i], status: s })),
  };
}

