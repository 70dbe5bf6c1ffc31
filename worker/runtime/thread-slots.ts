/**
 * The bookkeeping both thread pools share: a bounded set of worker-thread
 * slots, each busy or free. `acquire` hands out a slot chosen by the pool's
 * own rule, marked busy before it is returned (so two jobs never share a
 * thread), and waits while every slot is busy and no new one may be made;
 * `release` frees a slot (dropping and terminating a broken one) and wakes
 * one waiter; `close` terminates every thread and wakes every waiter.
 */
import { Worker } from 'node:worker_threads';

export interface ThreadSlot {
  worker: Worker;
  busy: boolean;
}

export class ThreadSlots<S extends ThreadSlot> {
  readonly slots: S[] = [];
  private readonly waiting: Array<() => void> = [];
  private closed = false;

  constructor(readonly size: number, private readonly what: string) {
    if (!Number.isInteger(size) || size < 1) throw new RangeError(`${what} size ${size} must be an integer >= 1`);
  }

  /**
   * A slot for one job: `pick(free, canSpawn)` returns one of the free slots,
   * or 'spawn' (only when canSpawn) for a new one made by `spawn`, or
   * undefined to wait for a release.
   */
  async acquire(pick: (free: S[], canSpawn: boolean) => S | 'spawn' | undefined, spawn: () => S): Promise<S> {
    for (;;) {
      if (this.closed) throw new Error(`${this.what} is closed`);
      const choice = pick(this.slots.filter((s) => !s.busy), this.slots.length < this.size);
      const slot = choice === 'spawn' ? spawn() : choice;
      if (choice === 'spawn') this.slots.push(slot as S);
      if (slot) {
        slot.busy = true;
        return slot;
      }
      await new Promise<void>((resolve) => this.waiting.push(resolve));
    }
  }

  release(slot: S, broken: boolean): void {
    slot.busy = false;
    if (broken) {
      this.slots.splice(this.slots.indexOf(slot), 1);
      void slot.worker.terminate();
    }
    this.waiting.shift()?.();
  }

  async close(): Promise<void> {
    this.closed = true;
    for (const resolve of this.waiting.splice(0)) resolve();
    await Promise.all(this.slots.splice(0).map((s) => s.worker.terminate()));
  }
}
