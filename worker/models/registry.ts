/**
 * The model registry: one line per model (its descriptor, from
 * worker/models/<kind>/descriptor.ts). Everything that builds, checks,
 * lists or validates a model goes through here: the farm, the embedded mode,
 * the spec schema, the CLI, the benchmarks and the tests. To add a model,
 * write its folder (kernel with the exact definition in its header, and
 * descriptor) and add one line to MODELS; DEVELOPERS.md says what else.
 */
import type { GrowthCheckpoint, GrowthKernel, GrowthTask, ModelParams } from '../core/growth-kernel.js';
import type { ModelDescriptor } from '../core/model-descriptor.js';
import { checkRange, describeRange, quoteValue, rangeProblem } from '../core/value-range.js';
import { dlaOffLattice2d } from './dla-offlattice-2d/descriptor.js';
import { edenSquare } from './eden-square/descriptor.js';
import { edenTriangular } from './eden-triangular/descriptor.js';
import { edenOffLattice2d } from './eden-offlattice-2d/descriptor.js';
import { dlaSquare } from './dla-square/descriptor.js';
import { dlaTriangular } from './dla-triangular/descriptor.js';
import { dlaOffLattice3d } from './dla-offlattice-3d/descriptor.js';
import { dbmOffLattice2d } from './dbm-offlattice-2d/descriptor.js';
import { dbmSquare } from './dbm-square/descriptor.js';
import { dbmSquareWalkers } from './dbm-square-walkers/descriptor.js';

export const MODELS: readonly ModelDescriptor[] = [
  dlaOffLattice2d,
  edenSquare,
  edenTriangular,
  edenOffLattice2d,
  dlaSquare,
  dlaTriangular,
  dlaOffLattice3d,
  dbmOffLattice2d,
  dbmSquare,
  dbmSquareWalkers,
];

export const MODEL_KINDS: readonly string[] = MODELS.map((m) => m.kind);

const BY_KIND = new Map(MODELS.map((m) => [m.kind, m]));

/** Limits every task shares, whatever its model. */
export const PARTICLES_RANGE = { min: 1, max: 100_000_000, integer: true } as const;
export const RECORDS_PER_DECADE_RANGE = { min: 10, max: 100, integer: true } as const;

/** The descriptor of a model kind; throws a RangeError naming the allowed kinds. */
export function modelDescriptor(kind: unknown): ModelDescriptor {
  const d = typeof kind === 'string' ? BY_KIND.get(kind) : undefined;
  if (d === undefined) throw new RangeError(`model: ${quoteValue(kind)} is not a model; allowed: one of ${MODEL_KINDS.join(', ')}`);
  return d;
}

/** True when the kind is registered. */
export function isModelKind(kind: unknown): kind is string {
  return typeof kind === 'string' && BY_KIND.has(kind);
}

/** The model with every parameter at its default, overridden by `given` (not checked: see checkModelParams). */
export function modelParams(kind: string, given: Record<string, number> = {}): ModelParams {
  const d = modelDescriptor(kind);
  const params: Record<string, number> = {};
  for (const p of d.params) params[p.name] = p.default;
  return { kind, params: { ...params, ...given } };
}

/** The model with every parameter at its default. */
export function defaultModelParams(kind: string): ModelParams {
  return modelParams(kind);
}

/**
 * Every problem of a model's parameters, one line each naming `params.NAME`,
 * the model and the allowed range (an unknown, missing or out-of-range
 * parameter); empty when they are all fine.
 */
export function modelParamProblems(model: ModelParams): string[] {
  const d = modelDescriptor(model.kind);
  const params = model.params as Record<string, unknown> | undefined;
  if (typeof params !== 'object' || params === null || Array.isArray(params)) return [`params: ${quoteValue(params)} is not allowed; allowed: a table of the parameters of ${d.kind}`];
  const problems: string[] = [];
  for (const name of Object.keys(params)) {
    if (!d.params.some((p) => p.name === name)) {
      const known = d.params.map((p) => p.name).join(', ');
      // a key name is printed escaped and bounded: no raw newlines or terminal escapes in messages
      const shown = /^[A-Za-z0-9_]{1,64}$/.test(name) ? name : JSON.stringify(name.slice(0, 40)).replace(/[\u007f-\uffff]/g, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
      problems.push(`params.${shown}: not a parameter of ${d.kind}; allowed: ${known || 'none'}`);
    }
  }
  for (const p of d.params) {
    if (params[p.name] === undefined) problems.push(`params.${p.name}: missing for ${d.kind}; allowed: ${describeRange(p, p.unit ? `${p.unit}, for ${d.kind}` : `for ${d.kind}`)}`);
    else {
      const problem = rangeProblem(`params.${p.name}`, params[p.name], p, p.unit ? `${p.unit}, for ${d.kind}` : `for ${d.kind}`);
      if (problem !== null) problems.push(problem);
    }
  }
  return problems;
}

/** Throws a RangeError with the first line of modelParamProblems. */
export function checkModelParams(model: ModelParams): void {
  const problems = modelParamProblems(model);
  if (problems.length > 0) throw new RangeError(problems[0]);
}

/**
 * checkModelParams, then the model's own checks against the cluster size
 * (e.g. a step floor set by the float spacing at the largest radius); for
 * specs and the CLI, before any task exists.
 */
export function checkModelForSize(model: ModelParams, particles: number): void {
  checkModelParams(model);
  modelDescriptor(model.kind).check?.({ model, particles, ensembleSeed: '0', runIndex: 0, recordsPerDecade: RECORDS_PER_DECADE_RANGE.min });
}

/** Throws a RangeError naming the first bad field of a task (parameters, size, records, run index, model checks). */
export function checkTask(task: GrowthTask): void {
  const d = modelDescriptor(task.model?.kind);
  checkModelParams(task.model);
  checkRange('particles', task.particles, PARTICLES_RANGE);
  checkRange('records_per_decade', task.recordsPerDecade, RECORDS_PER_DECADE_RANGE);
  if (!Number.isSafeInteger(task.runIndex) || task.runIndex < 0) throw new RangeError(`run_index: ${quoteValue(task.runIndex)} is out of range; allowed: a non-negative integer`);
  d.check?.(task);
}

/** Build the kernel of a task (checked first), fresh or from a checkpoint. */
export function createKernel(task: GrowthTask, checkpoint?: GrowthCheckpoint): GrowthKernel {
  checkTask(task);
  return modelDescriptor(task.model.kind).create(task, checkpoint);
}

export function modelDimension(kind: string): 2 | 3 {
  return modelDescriptor(kind).dimension;
}
