/**
 * The contract every growth kernel fulfils, whatever its model and dimension.
 * A kernel is pure: it is built from a task (and optionally a checkpoint),
 * grows when asked, and hands back checkpoints and a result. It does no I/O
 * and knows nothing of queues, files or HTTP, so the same kernel serves the
 * farm, the embedded mode, the benchmarks and the tests.
 *
 * What a model is (its parameters, counters, observables, references) is
 * declared by its descriptor (worker/core/model-descriptor.ts); the registry
 * (worker/models/registry.ts) builds kernels from tasks.
 */
import type { StopSignal } from './stop-signal.js';

/** A model and its numeric parameters by name (snake_case, as in specs and on the wire). */
export interface ModelParams {
  kind: string;
  params: Record<string, number>;
}

export interface GrowthTask {
  model: ModelParams;
  /** Number of particles in the finished cluster, seed included. */
  particles: number;
  /** Ensemble seed as a decimal string of an unsigned 64-bit integer. */
  ensembleSeed: string;
  /** Index of this run within its ensemble (0-based). */
  runIndex: number;
  /** Observables are recorded at sizes spaced this many per decade (>= 10). */
  recordsPerDecade: number;
}

/** Observables recorded while growing, at log-spaced cluster sizes (worker/core/record-sizes.ts). */
export interface GrowthSeries {
  /** Cluster size N (particles, seed included) at each record. */
  sizes: number[];
  /** Radius of gyration about the centre of mass. */
  radiusOfGyration: number[];
  /** Largest distance of a particle centre from the seed centre. */
  maxRadius: number[];
  /** Distance of the centre of mass from the seed centre. */
  centerOffset: number[];
  /** Model-specific observables at the same sizes, by the names the descriptor declares (empty for most models). */
  extra: Record<string, number[]>;
}

/** Mass–radius counts of the final cluster: M(r) = number of centres within r of the seed. */
export interface MassRadius {
  radii: number[];
  counts: number[];
}

/** Work counters by the names the descriptor declares; deterministic (they depend only on the task). */
export type Counters = Record<string, number>;

export interface GrowthResult {
  engineVersion: string;
  model: ModelParams;
  /** Spatial dimension of the cluster (2 or 3). */
  dimension: number;
  particles: number;
  ensembleSeed: string;
  runIndex: number;
  series: GrowthSeries;
  massRadius: MassRadius;
  counters: Counters;
  /** Hex digest of the final state (positions, generator state, counters). */
  stateHash: string;
}

/** Particle centres in arrival order, dimension-strided: centre i is coords[i·dimension … i·dimension + dimension − 1]. */
export interface ClusterPositions {
  dimension: number;
  count: number;
  /** At least count·dimension entries (extra ones are ignored). */
  coords: Float64Array;
}

/** Everything needed to continue a run; acceleration structures are rebuilt from positions (and modelState). */
export interface GrowthCheckpoint {
  engineVersion: string;
  task: GrowthTask;
  dimension: number;
  /** Particles placed so far (seed included). */
  count: number;
  /**
   * Centres in arrival order, dimension-strided, at least count·dimension
   * entries (extra ones ignored). A kernel resumed from a checkpoint whose
   * array has room for every particle of its task (particles·dimension
   * entries) may keep that array as its own positions: the caller must not
   * use it afterwards (readers of giant checkpoints allocate it so, to
   * avoid a second copy of the cluster).
   */
  positions: Float64Array;
  /** Random generator state (see worker/core/random.ts). */
  rngState: Uint32Array;
  counters: Counters;
  /** Records taken so far. */
  series: GrowthSeries;
  /** State of the model that positions cannot rebuild, in the model's own layout (empty for most models). */
  modelState: Uint8Array;
}

export interface GrowthKernel {
  readonly task: GrowthTask;
  readonly dimension: number;
  /** Particles placed so far, seed included. */
  readonly count: number;
  /** True once count === task.particles. */
  readonly done: boolean;
  /**
   * Grow until count reaches min(target, task.particles), or return early
   * when `stop` is raised (worker/core/stop-signal.ts): the kernel reads it
   * inside its walker loop and leaves the state exactly as after the last
   * whole particle. Throws WalkerStuck when a walker makes no progress.
   */
  growTo(target: number, stop?: StopSignal): void;
  /** Snapshot of the full state; the arrays are copies. */
  checkpoint(): GrowthCheckpoint;
  /**
   * The same state with `positions` a view of the kernel's own array (no
   * copy), valid until the next growTo: for writing a giant cluster's
   * checkpoint in chunks straight to disk. Optional: kernels without it are
   * checkpointed through checkpoint().
   */
  checkpointView?(): GrowthCheckpoint;
  /** A view (not a copy) of the particle centres, valid until the next growTo. */
  positions(): ClusterPositions;
  /** Counters so far (live; copy to keep). */
  readonly counters: Readonly<Counters>;
  /** The run result; only valid when done. */
  result(): GrowthResult;
}
