/**
 * A pool of probe threads (worker/runtime/probe-thread.ts). Each thread keeps the
 * geometry of the last set it probed; a job goes preferably to a free thread
 * that already holds its set (by key), otherwise the set is loaded (through
 * the caller's loader, once per thread that needs it) and sent along.
 * Results do not depend on which thread ran a job: a job is a function of
 * (set, task) only.
 */
import { Worker } from 'node:worker_threads';
import { compiledWorkerEntry } from './thread-entry.js';
import { ThreadSlots, type ThreadSlot } from './thread-slots.js';
import type { ProbeResult, ProbeTask } from '../probe/probe-2d.js';
import type { ProbeSet } from '../probe/probe-set.js';
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

export class ProbeThreadPool {
  private readonly pool: ThreadSlots<Slot>;
  private nextId = 1;
  private tick = 0;

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
    let set: ProbeSet | undefined;
    try {
      if (slot.key !== key) set = await load();
    } catch (err) {
      this.release(slot, false);
      throw err;
    }
    const id = this.nextId++;
    return await new Promise<ProbeResult>((resolve, reject) => {
      const w = slot.worker;
      const finish = (broken: boolean) => {
        w.off('message', onMessage);
        w.off('error', onError);
        w.off('exit', onExit);
        signal?.removeEventListener('abort', onAbort);
        this.release(slot, broken);
      };
      const onAbort = () => {
        slot.key = null;
        finish(true);
        reject(new ProbeJobCancelled('probe job cancelled'));
      };
      const onMessage = (m: FromProbeThread) => {
        if (m.id !== id) return;
        if (m.type === 'failed' && set) slot.key = null;
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
      if (set) slot.key = key;
      w.postMessage({ type: 'probe', id, key, set, task } satisfies ToProbeThread);
    });
  }

  async close(): Promise<void> {
    await this.pool.close();
  }
}
