/**
 * One ensemble's k-fold amplitude A_k against an isotropic baseline ensemble
 * (typically a lattice model against off-lattice DLA, whose law is invariant
 * under every rotation): the verdict at the largest cluster size both record.
 *
 * Rule: 'above the baseline' when the lower end of this ensemble's bootstrap
 * band of the mean A_k lies above the upper end of the baseline's band at
 * that size (each band at its own summary's level, percentile bootstrap over
 * whole clusters, coordinator/stats/observable-bands.ts), 'below the
 * baseline' in the mirror case, 'not distinguishable' when the bands
 * overlap. Disjoint bands are a conservative test of a difference of means
 * (common practice, no source).
 *
 * The baseline, not the independent-angle noise (fold-noise.ts), is the
 * right reference for anisotropy: the angles of a DLA cluster are
 * correlated along its branches, so an isotropic model's A_k lies far above
 * √(π/(4n)), and only the comparison with an isotropic model grown to the
 * same N tells lattice anisotropy from the randomness of a few branches.
 *
 * Pure; no I/O.
 */
import type { ObservableSection } from './observable-bands.js';

export const BASELINE_RULE =
  "'above the baseline' when the lower end of this ensemble's bootstrap band of the mean A_k exceeds the upper end of the baseline's band at the largest N both record " +
  "('below the baseline' in the mirror case), 'not distinguishable' when the bands overlap";

export interface BandPoint {
  mean: number;
  lo: number;
  hi: number;
  level: number;
}

export interface AnisotropyComparison {
  fold: number;
  /** The largest size recorded by both ensembles, or null when they share none. */
  size: number | null;
  own: BandPoint | null;
  baseline: BandPoint | null;
  verdict: 'above the baseline' | 'below the baseline' | 'not distinguishable' | 'unknown';
  rule: string;
}

function pointAt(s: ObservableSection, name: string, size: number): BandPoint | null {
  const b = s.bands.find((x) => x.name === name);
  const i = b ? b.sizes.indexOf(size) : -1;
  return b && i >= 0 ? { mean: b.mean[i], lo: b.lo[i], hi: b.hi[i], level: s.level } : null;
}

/** Compare fold_amplitude_<fold> of `own` with that of `baseline` (BASELINE_RULE). */
export function compareWithBaseline(own: ObservableSection, baseline: ObservableSection, fold: number): AnisotropyComparison {
  const name = `fold_amplitude_${fold}`;
  const a = own.bands.find((b) => b.name === name);
  const b = baseline.bands.find((x) => x.name === name);
  const common = a && b ? a.sizes.filter((n) => b.sizes.includes(n)) : [];
  const size = common.length > 0 ? Math.max(...common) : null;
  const o = size === null ? null : pointAt(own, name, size);
  const z = size === null ? null : pointAt(baseline, name, size);
  let verdict: AnisotropyComparison['verdict'] = 'unknown';
  if (o && z && [o.lo, o.hi, z.lo, z.hi].every(Number.isFinite)) {
    verdict = o.lo > z.hi ? 'above the baseline' : o.hi < z.lo ? 'below the baseline' : 'not distinguishable';
  }
  return { fold, size, own: o, baseline: z, verdict, rule: BASELINE_RULE };
}
