/**
 * The shape of the "harmonic" section of an ensemble summary (under
 * statistics.harmonic in the JSON; inside statistics_json of the protobuf):
 * ensemble-level harmonic measures with cluster-bootstrap intervals, built
 * by coordinator/harmonic/harmonic-section.ts from the ClusterHarmonic
 * records of the probed clusters, and drawn by the report.
 */
import type { IntervalSummary } from '../stats/bca.js';
import type { EnsembleValue } from './ensemble-intervals.js';
import type { ClusterHarmonic } from './cluster-harmonic.js';

/** Ensemble values of the clusters probed at one size. */
export interface HarmonicAtSize {
  size: number;
  clusters: number;
  /** Walkers per cluster (mean). */
  walkers: number;
  q: number[];
  tau: EnsembleValue[];
  /** D_q of the ensemble-mean τ: τ̄(q)/(q − 1); null at q = 1 (see informationDimension). */
  dq: Array<number | null>;
  /** Legendre transform of the ensemble-mean τ̄(q): α = dτ̄/dq, f = qα − τ̄. */
  alpha: number[];
  f: number[];
  /** Per q: fraction of clusters whose two probe halves agree; null where no cluster was judged. */
  convergedFraction: Array<number | null>;
  /** Per q: true when convergedFraction ≥ 0.9 (our rule). */
  converged: boolean[];
  /** [q_lo, q_hi]: the longest run of consecutive converged q (preferring the one holding q = 1); null when none. */
  convergedRange: [number, number] | null;
  informationDimension: EnsembleValue;
  /** Fit-window systematic (ensemble mean of the per-cluster half-differences of the fits over the two halves of the ε window). */
  systematic: { tau: Array<number | null>; informationDimension: number | null };
  /** Contact-radius systematic (ensemble mean of the per-cluster values; coordinator/harmonic/resolution-systematic.ts). */
  resolutionSystematic: { tau: Array<number | null>; informationDimension: number | null };
  /** The statistical interval of τ'(1) (BCa, else percentile) widened by the systematic on both sides; null without either. */
  informationDimensionWithSystematic: [number, number] | null;
  /** The same for τ(3), when 3 is on the grid. */
  tau3WithSystematic: [number, number] | null;
  maxConcentrationExponent: EnsembleValue;
  /** Beurling: exponent ≥ 1/2 (interval upper end at least 0.5). */
  beurlingRespected: boolean | null;
  /** Mean ln cap: of the logarithmic capacity in 2D, of the Newtonian capacity in 3D. */
  logCapacity: EnsembleValue;
  /** 3D: the Newtonian capacity (units: a ball of radius a has capacity a), ensemble mean; null in 2D. */
  capacity?: EnsembleValue | null;
  /** Unbiased particle-scale Σ p³ (ensemble mean). */
  z3: EnsembleValue;
  /** τ(3) of this size's ensemble, when 3 is on the q grid. */
  tau3: EnsembleValue | null;
}

/** cap(N) ~ N^{1/D_cap}: fit of mean log capacity against log N over the probed sizes. */
export interface CapacityGrowth {
  sizes: number[];
  meanLogCapacity: number[];
  /** Slope of log cap against log N, with its cluster-bootstrap interval. */
  exponent: number | null;
  exponentInterval: IntervalSummary | null;
  /** D_cap = 1/exponent and its interval (the exponent's ends inverted). */
  dimension: number | null;
  dimensionInterval: [number, number] | null;
  reason: string | null;
}

/**
 * The capacity-increment relation: the mean growth of log capacity (in 3D:
 * of −1/C, C the Newtonian capacity; harmonic-section.ts) per added
 * particle between successive probed sizes, against the particle-scale growth
 * moment Z(3) at those sizes. Proportionality (ratio constant in N, log–log
 * slope 1) is what makes τ(3) = D.
 */
export interface CapacityIncrement {
  /** Per interval [N_k, N_{k+1}]: */
  fromSize: number[];
  toSize: number[];
  /** Mean over clusters of (log cap(N_{k+1}) − log cap(N_k)) / (N_{k+1} − N_k). */
  meanIncrement: number[];
  /** Z(3) at the interval: geometric mean of the ensemble-mean Z(3) at its two ends. */
  z3: number[];
  /** meanIncrement / z3 per interval. */
  ratio: number[];
  /** Slope of log meanIncrement against log z3 over the intervals (1 if proportional), with interval. */
  slope: number | null;
  slopeInterval: IntervalSummary | null;
  /** Whether the slope interval contains 1. */
  proportional: boolean | null;
  reason: string | null;
}

/** τ(3) beside the mass-based D of the same clusters (the electrostatic scaling law τ(3) = D in 2D, τ(3) = D + 1 in 3D). */
export interface ElectrostaticCheck {
  size: number;
  /** Absent in sections made before 3D probing (then 2). */
  dimension?: 2 | 3;
  /** The relation checked, e.g. "tau(3) = D + 1"; absent in older sections (then "tau(3) = D"). */
  relation?: string;
  tau3: EnsembleValue | null;
  /** D from τ(3): τ(3) − (d − 2), its interval (τ(3)'s shifted) and the same widened by the fit-window systematic. */
  dimensionFromTau3?: { value: number; interval: [number, number] | null; withSystematic: [number, number] | null } | null;
  massDimension: { estimator: string; value: number | null; interval: [number, number] | null } | null;
  /** Whether the intervals overlap. */
  consistent: boolean | null;
  /** Whether τ(3)'s interval widened by its fit-window systematic overlaps D's interval. */
  consistentWithSystematic: boolean | null;
  /**
   * The same law at particle scale, where it is derived: Z(3, a) ∝ N^{−τ(3)/D},
   * so ratio = τ(3)/D = −(slope of log Z(3) against log N), the mean over the
   * clusters probed at every size of their OLS slopes, with its interval; the law
   * says ratio = 1.
   */
  particleScale: {
    sizes: number[]; clusters: number; ratio: number | null; ratioInterval: IntervalSummary | null;
    /** The relation's value of τ(3)/D: [1, 1] in 2D; in 3D [1 + 1/D_hi, 1 + 1/D_lo] from the mass-D interval (null without it). */
    expected?: [number, number] | null;
    consistent: boolean | null; reason: string | null;
  };
  source: string;
}

/** An estimate with its interval (ends null when there is none). */
export interface EstimateWithInterval {
  estimate: number | null;
  low: number | null;
  high: number | null;
}

/**
 * The dielectric breakdown relations for a model with a growth exponent η
 * (harmonic-section.ts states the rules): τ(η + 2) − τ(η) beside the mass
 * dimension of the same probed clusters, and the capacity increment against
 * Z(η + 2)/Z(η). At η = 1, Z(1) = 1 and these are the τ(3) = D checks.
 */
export interface BreakdownRelation {
  eta: number;
  /** Probed sizes and clusters (probed at every size, with positive moments) that enter. */
  sizes: number[];
  clusters: number;
  tauDifference: EstimateWithInterval;
  massDimension: EstimateWithInterval;
  /** 'consistent' | 'inconsistent' | 'undetermined' (no interval). */
  verdict: 'consistent' | 'inconsistent' | 'undetermined';
  rule: string;
  capacityIncrement: {
    /** Per interval: mean increment of log capacity per particle, and the geometric mean of Z(η + 2)/Z(η) at its ends. */
    meanIncrement: number[];
    momentRatio: number[];
    /** Slope of log meanIncrement against log(Z(η + 2)/Z(η)) (1 when proportional). */
    slope: EstimateWithInterval;
    verdict: 'proportional' | 'not proportional' | 'undetermined';
    rule: string;
    reason: string | null;
  };
  source: string;
  reason: string | null;
}

export interface HarmonicSection {
  schema: 'tendril-harmonic/1';
  /** 2 for planar clusters, 3 for 3D ones (the capacity is then Newtonian; harmonic-section.ts); absent in older sections (then 2). */
  dimension?: 2 | 3;
  convention: string;
  /** Probe settings of the spec. */
  probe: { walkers: number; jobs: number; q: number[]; sizes: number[]; contactSample: number; minStep: number };
  bySize: HarmonicAtSize[];
  capacityGrowth: CapacityGrowth;
  capacityIncrement: CapacityIncrement;
  electrostatic: ElectrostaticCheck;
  /** Present for a model with a growth exponent η (the dielectric breakdown model). */
  breakdownRelation?: BreakdownRelation;
  /** Clusters probed at every size (the ones the growth relations use). */
  clustersAtAllSizes: number;
  /** The per-cluster records behind it (run, then size order); attached by the summary builder. */
  perCluster?: ClusterHarmonic[];
}
