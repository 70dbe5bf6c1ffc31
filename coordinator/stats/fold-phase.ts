/**
 * The verdict of the signed k-fold phase P_k = (1/n) Σ cos kθ over the outer
 * shell (worker/core/anisotropy.ts, observables fold_phase_4 and
 * fold_phase_6). For a model whose law is invariant under rotations about
 * the seed (off-lattice DLA, Eden, DBM) E P_k = 0 exactly at every N (the
 * argument is in worker/core/anisotropy.ts: average the rotated cluster over
 * a uniform angle); unlike the amplitude A_k = |Σ e^{ikθ}|/n, which is a
 * modulus and so positive even for an isotropic cluster, the phase needs no
 * noise model: the bootstrap band of its ensemble mean carries the
 * ensemble's own noise (angles along a branch correlated or not), and the
 * verdict is whether that band contains 0. Common practice, no source
 * (a one-sample test of a zero mean by a bootstrap interval). On a lattice
 * the sign says whether the lattice's axes or its diagonals win; without a
 * lattice the same band is a check of the exact value 0 (isotropicPhaseRule).
 *
 * Pure: no I/O.
 */

export type PhaseVerdict =
  | 'aligned with the lattice axes'
  | 'opposite to the lattice axes'
  | 'no k-fold alignment beyond noise'
  | 'consistent with the exact 0'
  | 'departs from the exact 0'
  | 'unknown';

/** The rule on a lattice, where the phase's sign says which way the lattice pulls. */
export const PHASE_RULE =
  'aligned with the lattice axes when the band of the mean of cos kθ lies above 0, opposite (along the diagonals) when it lies below 0, ' +
  'no k-fold alignment beyond noise when it contains 0 (the expectation is exactly 0 for a rotation-invariant model)';

/**
 * The rule for a model with no lattice (lattice null in its descriptor:
 * off-lattice DLA, Eden, DBM), whose law is invariant under rotations:
 * there are no axes to align with, E P_k = 0 exactly, and the band is a
 * check of that exact value. A band at level L misses an exact value in a
 * fraction 1 − L of ensembles by chance (about 1 in 20 at 95 %, so about
 * 1 in 10 for one of the two phases): a single departure is not evidence
 * of a bias; one that persists with more clusters or another seed is.
 */
export function isotropicPhaseRule(level: number): string {
  const miss = Math.round(1 / (1 - level));
  return (
    'the model has no lattice, so E P_k = 0 exactly (invariance under rotations): consistent with the exact 0 when the band of the mean of cos kθ contains 0, ' +
    `departs from the exact 0 when it does not; a ${Math.round(level * 100)}% band misses an exact value by chance in about 1 ensemble in ${miss} per phase, ` +
    'so a single departure is not evidence of a bias: one that persists with more clusters or another seed is'
  );
}

/**
 * Verdict of an ensemble mean of P_k whose bootstrap band is [lo, hi]:
 * PHASE_RULE on a lattice, isotropicPhaseRule for a model without one.
 */
export function phaseVerdict(lo: number, hi: number, onLattice = true): PhaseVerdict {
  if (!Number.isFinite(lo) || !Number.isFinite(hi) || lo > hi) return 'unknown';
  if (!onLattice) return lo <= 0 && hi >= 0 ? 'consistent with the exact 0' : 'departs from the exact 0';
  if (lo > 0) return 'aligned with the lattice axes';
  if (hi < 0) return 'opposite to the lattice axes';
  return 'no k-fold alignment beyond noise';
}
