/**
 * Set-up shared by the tests of the two lattice DBM models (dbm-square and
 * dbm-square-walkers): their growth task, a checkpoint holding a fixed
 * small cluster (so that a kernel resumed from it grows the next site from
 * a known cluster and generator state), and the small clusters used.
 */
import type { GrowthCheckpoint, GrowthTask } from '../../worker/core/growth-kernel.js';
import { ENGINE_VERSION } from '../../worker/core/engine-version.js';
import { modelParams } from '../../worker/models/registry.js';

export type LatticeDbmKind = 'dbm-square' | 'dbm-square-walkers';

export function latticeDbmTask(kind: LatticeDbmKind, particles: number, params: Record<string, number> = {}, runIndex = 0, seed = '31'): GrowthTask {
  return { model: modelParams(kind, params), particles, ensembleSeed: seed, runIndex, recordsPerDecade: 10 };
}

/**
 * A checkpoint of `task` holding exactly the cluster `sites` (grown from the
 * seed in the given order, each a perimeter site of the ones before), with
 * generator state `rng`, no counters or records, and `modelState`.
 */
export function fixedClusterCheckpoint(task: GrowthTask, sites: [number, number][], rng: Uint32Array, modelState = new Uint8Array(0)): GrowthCheckpoint {
  return {
    engineVersion: ENGINE_VERSION,
    task,
    dimension: 2,
    count: sites.length,
    positions: Float64Array.from(sites.flat()),
    rngState: rng,
    counters: {},
    series: { sizes: [], radiusOfGyration: [], maxRadius: [], centerOffset: [], extra: {} },
    modelState,
  };
}

/** The L-tetromino (as in test/dla-square.test.ts; perimeter sites with 1 and 2 cluster neighbours), grown from the seed in this order. */
export const L_TETROMINO: [number, number][] = [[0, 0], [1, 0], [2, 0], [0, 1]];

/** A closed ring round (1, 1), grown from the seed in this order (the last site closes it): its inside is a perimeter site with 4 cluster neighbours, a hole. */
export const RING: [number, number][] = [[0, 0], [1, 0], [2, 0], [2, 1], [2, 2], [1, 2], [0, 2], [0, 1]];
