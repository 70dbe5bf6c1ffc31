/**
 * Worker-thread body for probing: a long-lived thread that keeps the last
 * prepared set (disks in 2D or balls in 3D, worker/probe/probe-set.ts) and runs probe jobs on it, so that the
 * many jobs of one large set pay for the geometry once per thread.
 *
 * A set whose geometry can be shared (planar disk sets, see
 * worker/probe/probe-set.ts) is built by one thread only, in shared memory,
 * and the other threads are given that geometry: they read the same index
 * and grid, with no copy of the set or of its geometry.
 *
 * Messages:
 *   main -> thread  { type: 'probe', id, key, set?, share?, shared?, task }
 *                   set: sent when the thread does not hold `key` yet (the
 *                   pool tracks this), share: build it in shared memory and
 *                   post it back; shared: a geometry another thread built,
 *                   used in place of a set
 *   thread -> main  { type: 'prepared', id, shared }   (after a `share` build:
 *                   the shared geometry, or null when the set's kind is not shared)
 *                   { type: 'done', id, result } | { type: 'failed', id, message, refused }
 *                   refused: the job or its set is invalid (a RangeError), so a retry cannot succeed
 */
import { parentPort, workerData } from 'node:worker_threads';
import type { ProbeResult, ProbeTask } from '../probe/probe-2d.js';
import { prepareProbe, prepareSharedProbe, preparedOfShared, type PreparedProbe, type ProbeSet, type SharedProbe } from '../probe/probe-set.js';
import { messageOf } from '../../proto/errors.js';

export type ToProbeThread = { type: 'probe'; id: number; key: string; set?: ProbeSet; share?: boolean; shared?: SharedProbe; task: ProbeTask };
export type FromProbeThread =
  | { type: 'prepared'; id: number; shared: SharedProbe | null }
  | { type: 'done'; id: number; result: ProbeResult }
  | { type: 'failed'; id: number; message: string; refused: boolean };

/** workerData of probe threads (set by probe-thread-pool.ts): another thread importing this file is left alone. */
export const PROBE_THREAD_ROLE = 'tendril-probe';

if (parentPort && (workerData as { role?: string } | null)?.role === PROBE_THREAD_ROLE) {
  const port = parentPort;
  let heldKey: string | null = null;
  let held: PreparedProbe | null = null;
  port.on('message', (m: ToProbeThread) => {
    try {
      if (m.shared) {
        held = null;
        heldKey = null;
        held = preparedOfShared(m.shared);
        heldKey = m.key;
      } else if (m.set) {
        held = null;
        heldKey = null;
        const built = m.share ? prepareSharedProbe(m.set) : null;
        held = built ? built.prepared : prepareProbe(m.set);
        heldKey = m.key;
        if (m.share) port.postMessage({ type: 'prepared', id: m.id, shared: built ? built.shared : null } satisfies FromProbeThread);
      }
      if (held === null || heldKey !== m.key) throw new Error(`probe thread holds no geometry for "${m.key}"`);
      const result = held.run(m.task);
      port.postMessage({ type: 'done', id: m.id, result } satisfies FromProbeThread);
    } catch (err) {
      port.postMessage({ type: 'failed', id: m.id, message: messageOf(err), refused: err instanceof RangeError } satisfies FromProbeThread);
    }
  });
}
