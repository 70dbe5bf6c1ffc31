/**
 * A pool of probe threads (worker/runtime/probe-thread.ts). Each thread keeps the
 * geometry of the last set it probed; a job goes preferably to a free thread
 * that already holds its set (by key). Otherwise, for a set whose geometry
 * can be shared (planar disk sets, worker/probe/probe-set.ts), the first
 * thread to need it is sent the set (loaded through the caller's loader)
 * and builds the geometry once, in shared memory; every other thread that
 * needs the same key waits for that build and is given the shared geometry
 * (SharedArrayBuffers: posted without a copy), so the pool holds one copy
 * of a set's geometry however many threads probe it. Sets of other kinds
 * (3D, lattice) are loaded and sent to each thread that needs them, as
 * before. Results do not depend on which thread ran a job, nor on whether
 * its geometry was built or shared: a job is a function of (set, task)
 * only, and a shared geometry is the built one, array for array.
 */
import { Worker } from 'node:worker_threads';
import { compiledWorkerEntry } from './thread-entry.js';
import { ThreadSlots, type ThreadSlot } from './thread-slots.js';
import type { ProbeResult, ProbeTask } from '../probe/probe-2d.js';
import { isShareableProbeSet, type ProbeSet, type SharedProbe } from '../probe/probe-set.js';
import type { FromProbeThread, ToProbeThread } from './probe-thread.js';
import { messageOf, TendrilError } from '../../proto/errors.js';

interface Slot extends ThreadSlot {
  key: string | null;
  lastUsed: number;
}

export class ProbeJobFailed extends TendrilError {
  override name = 'ProbeJobFailed';
  /** 'probe-refused' when the job or its set is invalid, so running it again cannot succeed. */
  readonly kind: 'probe-failed' | 'probe-refused';
  constructor(message: string, readonly refused = false) {
    super(message);
    this.kind = refused ? 'probe-refused' : 'probe-failed';
  }
}

/** The job was stopped by its caller's signal. */
export class ProbeJobCancelled extends Error {
  override name = 'ProbeJobCancelled';
}

/** A key's shared geometry: being built by a thread, built (the geometry), or not shareable (null). */
interface SharedEntry {
  geometry: Promise<SharedProbe | null>;
  building: boolean;
}

export class ProbeThreadPool {
  private readonly pool: ThreadSlots<Slot>;
  private nextId = 1;
  private tick = 0;
  /** Shared geometries by key, kept while a thread holds the key (or one is building it). */
  private readonly shared = new Map<string, SharedEntry>();
  /**
   * What the threads were sent: `sets` (a set to prepare, each a copy of
   * the set and a geometry of its own in that thread), `builds` (among
   * them, those built in shared memory for the other threads) and
   * `sharedGeometries` (a geometry another thread built, no copy).
   */
  readonly sent = { sets: 0, builds: 0, sharedGeometries: 0 };

  constructor(readonly size: number) {
    this.pool = new ThreadSlots(size, 'probe pool');
  }

  /** A free thread holding `key`'s set, else a new thread while fewer than `size` exist, else the free one used longest ago. */
  private async acquire(key: string): Promise<Slot> {
    const slot = await this.pool.acquire(
      (free, canSpawn) => free.find((s) => s.key === key) ?? (canSpawn ? 'spawn' : free.length > 0 ? free.reduce((a, b) => (a.lastUsed <= b.lastUsed ? a : b)) : undefined),
      () => ({ worker: new Worker(compiledWorkerEntry(import.meta.url, 'probe-thread'), { workerData: { role: 'tendril-probe' } }), busy: false, key: null, lastUsed: 0 }),
    );
    slot.lastUsed = ++this.tick;
    return slot;
  }

  private release(slot: Slot, broken: boolean): void {
    this.pool.release(slot, broken);
  }

  /**
   * Run one probe job on the set named `key`; `load` is called only when the
   * chosen thread does not hold that set yet. Rejects with ProbeJobFailed
   * (one-line reason) when the job is refused or the thread dies. When
   * `signal` aborts, the thread is terminated at once (a probe job keeps no
   * state worth saving) and the call rejects with ProbeJobCancelled.
   */
  async run(key: string, load: () => ProbeSet | Promise<ProbeSet>, task: ProbeTask, signal?: AbortSignal): Promise<ProbeResult> {
    if (signal?.aborted) throw new ProbeJobCancelled('probe job cancelled');
    const slot = await this.acquire(key);
    let send: Pick<ToProbeThread, 'set' | 'share' | 'shared'> | null = null;
    /** Set while this job builds the key's shared geometry: settles the waiting jobs. */
    let building: { resolve: (g: SharedProbe | null) => void; reject: (err: Error) => void } | null = null;
    const buildFailed = (err: Error) => {
      if (!building) return;
      this.shared.delete(key);
      building.reject(err);
      building = null;
    };
    try {
      if (slot.key !== key) {
        const entry = this.shared.get(key);
        const ready = entry ? await entry.geometry.catch(() => null) : null;
        if (ready) send = { shared: ready };
        else if (entry) send = { set: await load() }; // not shareable, or its build failed: prepare a copy here
        else {
          const e: SharedEntry = { geometry: new Promise((resolve, reject) => { building = { resolve, reject }; }), building: true };
          e.geometry.catch(() => undefined); // a failed build is seen by the jobs waiting for it
          this.shared.set(key, e);
          const set = await load();
          if (isShareableProbeSet(set)) send = { set, share: true };
          else {
            e.building = false;
            building!.resolve(null);
            building = null;
            send = { set };
          }
        }
      }
    } catch (err) {
      buildFailed(err instanceof Error ? err : new Error(String(err)));
      this.release(slot, false);
      throw err;
    }
    if (send?.set) this.sent.sets++;
    if (send?.share) this.sent.builds++;
    if (send?.shared) this.sent.sharedGeometries++;
    const id = this.nextId++;
    return await new Promise<ProbeResult>((resolve, reject) => {
      const w = slot.worker;
      const finish = (broken: boolean) => {
        w.off('message', onMessage);
        w.off('error', onError);
        w.off('exit', onExit);
        signal?.removeEventListener('abort', onAbort);
        buildFailed(new Error('probe geometry was not built'));
        this.release(slot, broken);
        this.prune();
      };
      const onAbort = () => {
        slot.key = null;
        finish(true);
        reject(new ProbeJobCancelled('probe job cancelled'));
      };
      const onMessage = (m: FromProbeThread) => {
        if (m.id !== id) return;
        if (m.type === 'prepared') {
          const e = this.shared.get(key);
          if (e) e.building = false;
          building?.resolve(m.shared);
          building = null;
          return;
        }
        if (m.type === 'failed' && send) slot.key = null;
        finish(false);
        if (m.type === 'done') resolve(m.result);
        else reject(new ProbeJobFailed(m.message, m.refused));
      };
      const onError = (err: Error) => {
        slot.key = null;
        finish(true);
        reject(new ProbeJobFailed(`probe thread crashed: ${messageOf(err)}`));
      };
      const onExit = (code: number) => {
        slot.key = null;
        finish(true);
        reject(new ProbeJobFailed(`probe thread exited with code ${code}`));
      };
      w.on('message', onMessage);
      w.once('error', onError);
      w.once('exit', onExit);
      signal?.addEventListener('abort', onAbort, { once: true });
      if (send) slot.key = key;
      w.postMessage({ type: 'probe', id, key, ...send, task } satisfies ToProbeThread);
    });
  }

  /** Forget the shared geometries no thread holds (and none is building), so that their memory can go. */
  private prune(): void {
    for (const [k, e] of this.shared) if (!e.building && !this.pool.slots.some((s) => s.key === k)) this.shared.delete(k);
  }

  async close(): Promise<void> {
    this.shared.clear();
    await this.pool.close();
  }
}
