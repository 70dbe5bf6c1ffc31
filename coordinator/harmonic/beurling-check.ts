/**
 * The Beurling check of a measured maximum-concentration exponent.
 *
 * Beurling's estimate: for a connected compact set K of radius R, every box
 * (or disk) B of side ε has harmonic measure μ(B) ≤ C (ε/R)^{1/2}
 * (Garnett & Marshall 2005, Harmonic Measure, ch. III), so the exponent a of
 * M(ε) = max_B μ(B) ~ (ε/R)^a is at least 1/2 as ε/R → 0. It says nothing
 * about the slope of log M over a finite window: the constant C, the
 * crossover to the smooth (exponent 1) regime below the contact radius, and
 * the lattice noise of the boxes all tilt a finite-window slope, which can
 * lie below 1/2 on a set that is certainly connected (a disk with a radial
 * slit of disks gives about 0.45 at a few hundred disk diameters, where the
 * exact measure of the same union of disks gives the same). So a theorem is
 * never declared violated. The verdict (our rule):
 *   'not applicable: the set is not connected' when the union of contact
 *       disks is not connected (Beurling's estimate needs a connected set);
 *   'consistent' when a ≥ 1/2 − 2σ, σ² = fit error² + window systematic² +
 *       contact-radius systematic² (the three errors stated beside a);
 *   'not resolved at this size' otherwise: the slope is not yet in the
 *       asymptotic regime at this size and contact radius; probe a larger
 *       set, or use a window further above the contact radius.
 */
/** 'not applicable in 3D': Beurling's estimate is planar (set by probe-analysis.ts for ball sets). */
export type BeurlingVerdict = 'consistent' | 'not resolved at this size' | 'not applicable: the set is not connected' | 'not applicable in 3D';

export const BEURLING_BOUND = 0.5;

export function beurlingVerdict(exponent: number, errors: { fit: number; window: number; resolution: number }, connected: boolean): BeurlingVerdict {
  if (!connected) return 'not applicable: the set is not connected';
  const fin = (v: number): number => (Number.isFinite(v) ? v : 0);
  const sigma = Math.sqrt(fin(errors.fit) ** 2 + fin(errors.window) ** 2 + fin(errors.resolution) ** 2);
  return exponent >= BEURLING_BOUND - 2 * sigma ? 'consistent' : 'not resolved at this size';
}
