import type { GrowthResult, GrowthTask } from '../../worker/core/growth-kernel.js';
import { createKernel, modelParams } from '../../worker/models/registry.js';

/** A task of off-lattice 2D DLA; `params` overrides parameters by name (e.g. { min_step: 0.1 }). */
export function dlaTask(particles: number, runIndex = 0, seed = '1', params: Record<string, number> = {}): GrowthTask {
  return {
    model: modelParams('dla-offlattice-2d', params),
    particles,
    ensembleSeed: seed,
    runIndex,
    recordsPerDecade: 20,
  };
}

export function growResult(task: GrowthTask): GrowthResult {
  const k = createKernel(task);
  k.growTo(task.particles);
  return k.result();
}

/** Radius of gyration at the final size. */
export function finalRg(r: GrowthResult): number {
  return r.series.radiusOfGyration[r.series.radiusOfGyration.length - 1];
}

/**
 * Let the test runner's messages through during a long computation: vitest's
 * worker reports progress over an RPC channel that times out when a test
 * keeps the event loop busy for a minute.
 */
export function yieldToRunner(): Promise<void> {
  return new Promise((resolve) => setImmediate(resolve));
}
