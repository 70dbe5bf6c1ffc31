/**
 * Grow reference runs on worker threads (the engine's own thread pool), so a
 * test that needs the hash of a large cluster never blocks the test runner's
 * event loop for seconds (vitest's worker then fails to report: 'Timeout
 * calling onTaskUpdate'). Same bits as growing in-process: the thread runs the
 * same kernel on the same task.
 */
import type { RunResultData, RunTaskData } from '../../proto/convert.js';
import type { GrowthTask } from '../../worker/core/growth-kernel.js';
import { ENGINE_VERSION } from '../../worker/core/engine-version.js';
import { TaskThreadPool } from '../../worker/runtime/task-thread.js';

function asRunTask(t: GrowthTask | RunTaskData): RunTaskData {
  if ('ensembleId' in t) return { ...t, checkpointIntervalSeconds: 0, checkpointEveryParticles: 0, keepPositions: false };
  return { ...t, model: { kind: t.model.kind, params: { ...t.model.params } }, ensembleId: 'reference', checkpointIntervalSeconds: 0, checkpointEveryParticles: 0, engineVersion: ENGINE_VERSION } as RunTaskData;
}

/** The results of the tasks, grown `threads` at a time off the main thread, in task order. */
export async function growInThreads(tasks: Array<GrowthTask | RunTaskData>, threads = 2): Promise<RunResultData[]> {
  const pool = new TaskThreadPool(Math.max(1, Math.min(threads, tasks.length)));
  try {
    return await Promise.all(tasks.map(async (t, i) => {
      const o = await pool.run(asRunTask(t)).outcome;
      if (o.status !== 'done') throw new Error(`reference run ${i}: ${o.status === 'failed' ? o.message : 'stopped'}`);
      return o.result;
    }));
  } finally {
    await pool.close();
  }
}
