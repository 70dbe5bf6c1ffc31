/**
 * What a growth model is, in one object: its exact definition, parameters,
 * counters, observables, the probes and pictures that apply, the published
 * values shown beside its estimates, and how to build its kernel. Every model
 * lives in worker/models/<kind>/ (kernel + descriptor) and is one line of the
 * registry (worker/models/registry.ts); the spec schema, the wire contract,
 * the CLI (`tendril grow --model`, `tendril models`), the metrics and the
 * summary are built from descriptors, so nothing outside a model's folder
 * names its kind.
 */
import type { GrowthCheckpoint, GrowthKernel, GrowthTask } from './growth-kernel.js';
import type { ValueRange } from './value-range.js';

/** One numeric model parameter. */
export interface ParamSpec extends ValueRange {
  /** snake_case, as in specs (`params.NAME`), on the wire and in `--param NAME=VALUE`. */
  name: string;
  /** Unit of the value, e.g. "particle diameters", "lattice spacings", "" for a pure number. */
  unit: string;
  default: number;
  /** One line: what the parameter does. */
  meaning: string;
}

/** A counter or observable a model reports: snake_case name and one line of meaning. */
export interface NamedQuantity {
  name: string;
  meaning: string;
}

/** A published value shown beside an estimate (never used as a fit input). */
export interface PublishedValue {
  value: number;
  /** One-sigma uncertainty as published. */
  uncertainty: number;
  source: string;
}

/** A rigorous bound on the fractal dimension besides D <= embedding dimension. */
export interface DimensionBound {
  /** 'lower' means D >= value, 'upper' means D <= value. */
  side: 'lower' | 'upper';
  value: number;
  rule: string;
  source: string;
}

/** A value shown for context only (e.g. a mean-field prediction): never a check. */
export interface ContextValue {
  label: string;
  value: number;
  source: string;
}

export interface ModelReference {
  /** Published fractal dimension, if any. */
  dimension: PublishedValue | null;
  bounds: DimensionBound[];
  context: ContextValue[];
  /**
   * Known finite-size behaviour: below `belowSize` particles the estimators of D
   * are not expected to agree with each other or with the published asymptotic
   * value; `note` says why (printed under the consistency panel when they disagree).
   */
  finiteSize?: { belowSize: number; note: string };
  /**
   * The parameter that is the dielectric-breakdown exponent η of the model
   * (growth probability proportional to the harmonic measure to the power
   * η), if any. A sweep over it gets the D(η) checks of
   * coordinator/stats/breakdown-exponent.ts (the lower bound (4 − η)/2, D
   * decreasing in η, the predicted non-fractal transition near η = 4). A
   * model that declares nothing here and has a parameter named `eta` is
   * taken to mean that one.
   */
  breakdownExponent?: string;
}

/**
 * How a cluster of this model is probed for its harmonic measure:
 * 'disks-2d' = walkers from infinity onto disks of one particle diameter
 * about the centres (worker/probe/probe-2d.ts); 'balls-3d' = the same in 3D
 * onto balls of one particle diameter, with the Newtonian capacity from the
 * hit rate and no contact sample (worker/probe/probe-3d.ts). Both run through
 * worker/probe/probe-set.ts.
 */
export type ProbeKind = 'disks-2d' | 'balls-3d';
/**
 * How a cluster of this model is drawn: 'disks' = every particle as a disk
 * of its diameter coloured by arrival order (coordinator/render/cluster-picture.ts;
 * 3D clusters projected onto the x-y plane); 'spheres-3d' = balls in 3D,
 * four depth-shaded views (coordinator/render/spheres-picture.ts).
 */
export type PictureKind = 'disks' | 'spheres-3d';

export interface ModelDescriptor {
  /** The model's name in specs, on the CLI and on the wire, e.g. "dla-offlattice-2d". */
  kind: string;
  /** Spatial dimension of the clusters. */
  dimension: 2 | 3;
  /** The lattice, or null off-lattice. */
  lattice: 'square' | 'triangular' | 'cubic' | null;
  /** One-line definition of the process (the exact one is in the kernel's file header). */
  definition: string;
  /** Where the exact definition is (a repository path). */
  definitionFile: string;
  params: readonly ParamSpec[];
  /** Counters in the results, the runs table and the metrics. */
  counters: readonly NamedQuantity[];
  /** The counter that measures walker work (progress lines, metrics), or null when the model has no walkers. */
  workCounter: string | null;
  /** Model-specific observables recorded in GrowthSeries.extra (besides R_g, R_max and the centre offset). */
  observables: readonly NamedQuantity[];
  /** Harmonic-measure probing that applies, or null: a [probe] table for this model is refused at validation. */
  probe: ProbeKind | null;
  /** The cluster picture that applies, or null: no cluster picture is drawn (grow and the report say so in one line). */
  picture: PictureKind | null;
  /** Distance between the centres of two touching particles (the particle diameter or lattice spacing). */
  contactDistance: number;
  reference: ModelReference;
  /**
   * Checks across parameters or against the task (size-dependent limits)
   * after every parameter is inside its own range; throws a RangeError whose
   * message is one line naming `params.NAME`.
   */
  check?(task: GrowthTask): void;
  create(task: GrowthTask, checkpoint?: GrowthCheckpoint): GrowthKernel;
}
