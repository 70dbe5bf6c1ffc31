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
 * (a one-sample test of a zero mean by a bootstrap interval).
 *
 * Pure: no I/O.
 */

export type PhaseVerdict = 'aligned with the lattice axes' | 'opposite to the lattice axes' | 'no k-fold alignment beyond noise' | 'unknown';

export const PHASE_RULE =
  'aligned with the lattice axes when the band of the mean of cos kθ lies above 0, opposite (along the diagonals) when it lies below 0, ' +
  'no k-fold alignment beyond noise when it contains 0 (the expectation is exactly 0 for a rotation-invariant model)';

/** Verdict of an ensemble mean of P_k whose bootstrap band is [lo, hi] (PHASE_RULE). */
export function phaseVerdict(lo: number, hi: number): PhaseVerdict {
  if (!Number.isFinite(lo) || !Number.isFinite(hi) || lo > hi) return 'unknown';
  if (lo > 0) return 'aligned with the lattice axes';
  if (hi < 0) return 'opposite to the lattice axes';
  return 'no k-fold alignment beyond noise';
}
