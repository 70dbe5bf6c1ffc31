/**
 * The checks every kernel makes of a checkpoint before resuming from it:
 * same engine, same task, a count inside the task's size, positions for
 * that count in the kernel's dimension, a generator state of the right size.
 * Each failure is a RangeError with one line.
 */
import { canonicalJson } from './canonical-json.js';
import { ENGINE_VERSION } from './engine-version.js';
import type { GrowthCheckpoint, GrowthTask } from './growth-kernel.js';

export function checkCheckpointOf(task: GrowthTask, dimension: number, cp: GrowthCheckpoint): void {
  if (cp.engineVersion !== ENGINE_VERSION) throw new RangeError(`checkpoint engine_version must be ${ENGINE_VERSION}, got ${cp.engineVersion}`);
  if (canonicalJson(cp.task) !== canonicalJson(task)) throw new RangeError(`checkpoint task does not match the run task (run ${task.runIndex})`);
  if (cp.dimension !== dimension) throw new RangeError(`checkpoint dimension must be ${dimension} for ${task.model.kind}, got ${cp.dimension}`);
  if (!Number.isSafeInteger(cp.count) || cp.count < 1 || cp.count > task.particles)
    throw new RangeError(`checkpoint count must be an integer in [1, ${task.particles}], got ${cp.count}`);
  if (cp.positions.length < cp.count * dimension)
    throw new RangeError(`checkpoint holds ${Math.floor(cp.positions.length / dimension)} positions, fewer than its count ${cp.count}`);
  if (cp.rngState.length !== 4) throw new RangeError(`checkpoint rng_state must have 4 words, got ${cp.rngState.length}`);
}
