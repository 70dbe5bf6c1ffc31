/**
 * Idle watch for `tendril worker --exit-when-idle`: a worker started as one
 * task of a batch-system job array should end when the farm has nothing left,
 * so that the allocation is given back. "Nothing left" means that the run
 * queue has no job in any state that can still produce work (waiting, active
 * on any worker, delayed for a retry, prioritized, paused, waiting for
 * children) for the whole idle time. Jobs active on other workers count: if
 * such a worker dies, its job comes back, and this worker is still there to
 * take it.
 */
import type { Queue } from 'bullmq';

const PENDING_STATES = ['waiting', 'active', 'delayed', 'prioritized', 'paused', 'waiting-children'] as const;

/** Jobs of the queue that may still need a worker. */
export async function pendingJobs(queue: Queue): Promise<number> {
  const counts = await queue.getJobCounts(...PENDING_STATES);
  return Object.values(counts).reduce((a, b) => a + b, 0);
}

/**
 * Poll the queue every `pollMs`; call `onIdle` once when it has held no
 * pending job for `idleMs` in a row. A failed poll (Redis away) restarts the
 * idle clock: an unreachable farm is not an empty one. Returns a stop function.
 */
export function watchForIdle(queue: Queue, idleMs: number, onIdle: () => void, pollMs = Math.min(5000, Math.max(200, idleMs / 5))): () => void {
  let emptySince: number | null = null;
  let fired = false;
  let busy = false;
  const timer = setInterval(() => {
    if (busy || fired) return;
    busy = true;
    void pendingJobs(queue)
      .then((n) => {
        const now = Date.now();
        if (n > 0) emptySince = null;
        else if (emptySince === null) emptySince = now;
        else if (now - emptySince >= idleMs) {
          fired = true;
          clearInterval(timer);
          onIdle();
        }
      })
      .catch(() => {
        emptySince = null;
      })
      .finally(() => {
        busy = false;
      });
  }, pollMs);
  return () => clearInterval(timer);
}
