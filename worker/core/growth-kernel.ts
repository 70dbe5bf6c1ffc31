/**
 * The contract every growth kernel fulfils. A kernel is pure: it is built from
 * a task (and optionally a checkpoint), grows when asked, and hands back
 * checkpoints and a result. It does no I/O and knows nothing of queues, files
 * or HTTP, so the same kernel serves the farm, the embedded mode, the
 * benchmarks and the tests.
 */

/** Model parameters; one variant per model, discriminated by `kind`. */
export type ModelParams = OffLatticeDla2dParams;

/** Off-lattice DLA in the plane; see worker/models/dla-offlattice-2d/kernel.ts for the exact definition. */
export interface OffLatticeDla2dParams {
  kind: 'dla-offlattice-2d';
  /**
   * Step length (in particle diameters) of the straight final steps taken
   * once the walker is closer than this to contact; 0 < minStep <= 1.
   */
  minStep: number;
  /** Launch circle radius = maximum radius + 1 + launchMargin; launchMargin > 0. */
  launchMargin: number;
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

/** Observables recorded while growing, at log-spaced cluster sizes. */
export interface GrowthSeries {
  /** Cluster size N (particles, seed included) at each record. */
  sizes: number[];
  /** Radius of gyration about the centre of mass. */
  radiusOfGyration: number[];
  /** Largest distance of a particle centre from the seed centre. */
  maxRadius: number[];
  /** Distance of the centre of mass from the seed centre. */
  centerOffset: number[];
}

/** Mass–radius counts of the final cluster: M(r) = number of centres within r of the seed. */
export interface MassRadius {
  radii: number[];
  counts: number[];
}

/** Work counters; deterministic (they depend only on the task). */
export interface GrowthCounters {
  /** Walk-on-spheres jumps (each uniform exit from a free disk). */
  jumps: number;
  /** Short straight steps taken next to the cluster. */
  shortSteps: number;
  /** Returns of far walkers to the launch circle by the exact Poisson kernel. */
  returns: number;
}

export interface GrowthResult {
  engineVersion: string;
  model: ModelParams;
  particles: number;
  ensembleSeed: string;
  runIndex: number;
  series: GrowthSeries;
  massRadius: MassRadius;
  counters: GrowthCounters;
  /** Hex digest of the final state (positions, generator state, counters). */
  stateHash: string;
}

/** Everything needed to continue a run; the acceleration index is rebuilt from positions. */
export interface GrowthCheckpoint {
  engineVersion: string;
  task: GrowthTask;
  /** Particles placed so far (seed included). */
  count: number;
  /** Particle centres in arrival order, length >= count (extra entries ignored). */
  x: Float64Array;
  y: Float64Array;
  /** Random generator state (see worker/core/random.ts). */
  rngState: Uint32Array;
  counters: GrowthCounters;
  /** Records taken so far. */
  series: GrowthSeries;
}

export interface GrowthKernel {
  readonly task: GrowthTask;
  /** Particles placed so far, seed included. */
  readonly count: number;
  /** True once count === task.particles. */
  readonly done: boolean;
  /** Grow until count reaches min(target, task.particles). */
  growTo(target: number): void;
  /** Snapshot of the full state; the arrays are copies. */
  checkpoint(): GrowthCheckpoint;
  /** Views (not copies) of the particle centres, valid until the next growTo. */
  positions(): { x: Float64Array; y: Float64Array; count: number };
  readonly counters: GrowthCounters;
  /** The run result; only valid when done. */
  result(): GrowthResult;
}
