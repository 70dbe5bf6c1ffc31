/**
 * The model registry: one entry per model kind. `createKernel` is the only
 * way the farm, the embedded mode, the benchmarks and the tests build a
 * kernel. To add a model: write worker/<model>.ts implementing GrowthKernel
 * (exact definition in its header), add its parameter type to ModelParams in
 * worker/core/growth-kernel.ts, and register it here.
 */

import type { GrowthCheckpoint, GrowthKernel, GrowthTask, ModelParams } from '../core/growth-kernel.js';
import { DEFAULT_DLA_OFFLATTICE_2D, OffLatticeDla2d, checkDlaOffLattice2dTask } from './dla-offlattice-2d/kernel.js';

interface ModelEntry {
  /** Spatial dimension of the clusters. */
  dimension: 2 | 3;
  defaults: ModelParams;
  /** Throws a RangeError naming the first bad field. */
  check(task: GrowthTask): void;
  create(task: GrowthTask, checkpoint?: GrowthCheckpoint): GrowthKernel;
}

const MODELS: Record<ModelParams['kind'], ModelEntry> = {
  'dla-offlattice-2d': {
    dimension: 2,
    defaults: DEFAULT_DLA_OFFLATTICE_2D,
    check: checkDlaOffLattice2dTask,
    create: (task, cp) => new OffLatticeDla2d(task, cp),
  },
};

export const MODEL_KINDS = Object.keys(MODELS) as ModelParams['kind'][];

function entry(kind: string): ModelEntry {
  const e = (MODELS as Record<string, ModelEntry | undefined>)[kind];
  if (e === undefined) throw new RangeError(`model.kind must be one of ${MODEL_KINDS.join(', ')}, got "${kind}"`);
  return e;
}

export function createKernel(task: GrowthTask, checkpoint?: GrowthCheckpoint): GrowthKernel {
  return entry(task.model.kind).create(task, checkpoint);
}

/** Throws a RangeError naming the first bad field of the task. */
export function checkTask(task: GrowthTask): void {
  entry(task.model.kind).check(task);
}

export function defaultModelParams(kind: ModelParams['kind']): ModelParams {
  return structuredClone(entry(kind).defaults);
}

export function modelDimension(kind: ModelParams['kind']): 2 | 3 {
  return entry(kind).dimension;
}
