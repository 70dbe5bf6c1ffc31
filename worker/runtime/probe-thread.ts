/**
 * Worker-thread body for probing: a long-lived thread that keeps the last
 * prepared set (disks in 2D or balls in 3D, worker/probe/probe-set.ts) and runs probe jobs on it, so that the
 * many jobs of one large set pay for the geometry once per thread.
 *
 * Messages:
 *   main -> thread  { type: 'probe', id, key, set?, task }   set: sent when the
 *                   thread does not hold `key` yet (the pool tracks this)
 *   thread -> main  { type: 'done', id, result } | { type: 'failed', id, message, refused }
 *                   refused: the job or its set is invalid (a RangeError), so a retry cannot succeed
 */
import { parentPort, workerData } from 'node:worker_threads';
import type { ProbeResult, ProbeTask } from '../probe/probe-2d.js';
import { prepareProbe, type PreparedProbe, type ProbeSet } from '../probe/probe-set.js';
import { messageOf } from '../../proto/errors.js';

export type ToProbeThread = { type: 'probe'; id: number; key: string; set?: ProbeSet; task: ProbeTask };
export type FromProbeThread = { type: 'done'; id: number; result: ProbeResult } | { type: 'failed'; id: number; message: string; refused: boolean };

/** workerData of probe threads (set by probe-thread-pool.ts): another thread importing this file is left alone. */
export const PROBE_THREAD_ROLE = 'tendril-probe';

if (parentPort && (workerData as { role?: string } | null)?.role === PROBE_THREAD_ROLE) {
  const port = parentPort;
  let heldKey: string | null = null;
  let held: PreparedProbe | null = null;
  port.on('message', (m: ToProbeThread) => {
    try {
      if (m.set) {
        held = null;
        heldKey = null;
        held = prepareProbe(m.set);
        heldKey = m.key;
      }
      if (held === null || heldKey !== m.key) throw new Error(`probe thread holds no geometry for "${m.key}"`);
      const result = held.run(m.task);
      port.postMessage({ type: 'done', id: m.id, result } satisfies FromProbeThread);
    } catch (err) {
      port.postMessage({ type: 'failed', id: m.id, message: messageOf(err), refused: err instanceof RangeError } satisfies FromProbeThread);
    }
  });
}
