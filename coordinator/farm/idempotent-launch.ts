/**
 * Launching an ensemble at most once per idempotency key. A client that
 * sends `Idempotency-Key: K` with POST /ensembles may repeat the request
 * (after a timeout, a 503 while Redis was down, a lost answer) and gets the
 * same ensemble, never a second one:
 *
 *  - the ensemble id is derived from the key (sha256 of prefix and key), so
 *    every repeat names the same ensemble;
 *  - a repeat with the same spec returns that ensemble; if the first launch
 *    was cut short before all its jobs were queued, the repeat queues them
 *    (jobs have fixed ids, so none is queued twice, and runs with a stored
 *    result are skipped by workers);
 *  - a repeat with a different spec is refused (IdempotencyConflict).
 */
import { createHash } from 'node:crypto';
import type { Queue } from 'bullmq';
import { specToDocument, type EnsembleSpec } from '../spec/index.js';
import { jobsOfPlan, launchEnsemble } from './queue.js';
import { planEnsemble } from '../plan.js';
import type { EnsembleStore } from './store.js';

/** Allowed idempotency keys: 1 to 128 printable ASCII characters. */
export const IDEMPOTENCY_KEY_PATTERN = /^[\x21-\x7e]{1,128}$/;

export class IdempotencyConflict extends Error {
  override name = 'IdempotencyConflict';
}

export function idempotentEnsembleId(prefix: string, key: string): string {
  return `k${createHash('sha256').update(`${prefix}\0${key}`).digest('hex').slice(0, 30)}`;
}

/** Launch (or find) the ensemble of this key; `created` is false for a repeat. */
export async function launchIdempotent(store: EnsembleStore, queue: Queue, spec: EnsembleSpec, key: string): Promise<{ id: string; created: boolean }> {
  const id = idempotentEnsembleId(store.prefix, key);
  const doc = JSON.stringify(specToDocument(spec));
  const existing = await store.specText(id);
  if (existing === null) {
    try {
      await launchEnsemble(store, queue, spec, { ensembleId: id });
      await store.markLaunched(id);
      return { id, created: true };
    } catch (err) {
      // a concurrent request with the same key created it first: fall through to the repeat path
      if (!/exists already/.test((err as Error).message)) throw err;
    }
  }
  if ((await store.specText(id)) !== doc) throw new IdempotencyConflict('idempotency-key: used before with a different spec; allowed: a new key for a new spec');
  if (!(await store.launched(id))) {
    const rec = await store.get(id);
    if (rec && !rec.cancelled) {
      // finish a launch that was cut short: same ensemble id, same job ids
      await launchRemainder(store, queue, spec, id);
    }
    await store.markLaunched(id);
  }
  return { id, created: false };
}

/** Queue the jobs of an ensemble whose launch was cut short (fixed job ids: none is queued twice). */
export async function launchRemainder(store: EnsembleStore, queue: Queue, spec: EnsembleSpec, id: string): Promise<void> {
  const plan = planEnsemble(id, spec);
  const jobs = jobsOfPlan(id, plan.jobs);
  for (let i = 0; i < jobs.length; i += 500) await queue.addBulk(jobs.slice(i, i + 500));
  if (spec.target) await store.markQueued(id, spec.clusters);
}
