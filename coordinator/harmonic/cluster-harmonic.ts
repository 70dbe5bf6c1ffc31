/**
 * The harmonic measures of one probed cluster at one size, in the compact
 * form an ensemble keeps (the farm stores one per (run, size) in Redis; the
 * embedded mode keeps them beside the run results). Per-disk hit counts are
 * reduced here to what the ensemble statistics need, so nothing per disk
 * has to travel further.
 *
 * "At size n" means the first n particles of the finished cluster: particles
 * are stored in arrival order and never move, so that prefix is exactly the
 * cluster as it was when it had n particles. Probing at sizes during growth
 * is therefore probing prefixes of the final snapshot (an exact identity,
 * not an approximation).
 *
 * Z(3) at particle scale is Σ_i p_i³ over the particles (boxes of one
 * particle), p_i the harmonic measure of particle i. From hit counts c_i of
 * W walkers it is estimated without bias by the multinomial factorial
 * moment Σ c_i(c_i − 1)(c_i − 2) / (W(W − 1)(W − 2)) (E[c(c−1)(c−2)] =
 * W(W−1)(W−2) p³ for one cell of a multinomial; common practice, no
 * source). The plain plug-in Σ (c_i/W)³ is biased upward by ≈ 3 Σ p_i²/W.
 *
 * 3D clusters (dimension 3): `walkers` counts the probes that hit (in 3D a
 * probe may escape; the measure is normalised over the hits, and given their
 * number the counts are multinomial, so the Z(3) estimator above stays
 * unbiased); `capacity` is the Newtonian capacity (units: a ball of radius a
 * has capacity a) with its binomial error, and `logCapacity` is ln of it
 * (error = error/capacity), so that the ensemble's capacity growth
 * cap ~ N^{1/D_cap} is fitted the same way in both dimensions. In 2D
 * `logCapacity` is the log of the logarithmic capacity.
 *
 * For a model with a growth exponent η (the dielectric breakdown model,
 * parameter `eta`), the record also keeps Z(η) and Z(η + 2) at particle
 * scale, for the relation τ(η + 2) − τ(η) = D (harmonic-section.ts). An
 * integer order q gets the unbiased factorial moment
 * Σ c(c−1)…(c−q+1) / (W(W−1)…(W−q+1)); a non-integer order the plug-in
 * Σ (c_i/W)^q over the particles hit (biased: upward for q > 1, and for
 * q < 1 it misses the particles no walker hit; the bias shrinks as W grows).
 */
import type { HarmonicMeasures } from './probe-analysis.js';

export interface ClusterHarmonic {
  runIndex: number;
  /** Particles in the probed prefix. */
  size: number;
  walkers: number;
  q: number[];
  tau: number[];
  tauFitError: number[];
  /** D_q = τ(q)/(q − 1), null where undefined. */
  dq: Array<number | null>;
  alpha: number[];
  f: number[];
  /** Per q: whether the two halves of the probes agree (null: not judged). */
  converged: Array<boolean | null>;
  informationDimension: number;
  /** Fit-window systematic of τ(q) and τ'(1) (probe-analysis.ts); null with fewer than 4 box sides. */
  tauSystematic: number[] | null;
  informationDimensionSystematic: number | null;
  /** Contact-radius systematic of τ(q) and τ'(1) (resolution-systematic.ts); absent in records made before it existed. */
  tauResolutionSystematic?: number[];
  informationDimensionResolutionSystematic?: number;
  maxConcentrationExponent: number;
  /** Fit window of τ(q), as fractions of the set's radius. */
  window: { relativeMin: number; relativeMax: number };
  /** Radius of the set (smallest circle about the bounding-box centre enclosing the disks). */
  radius: number;
  /** 3 for ball sets; absent (2) for planar ones. */
  dimension?: 3;
  /** 3D: Newtonian capacity of the union of contact balls and its standard error. */
  capacity?: number | null;
  capacityError?: number | null;
  /** Log capacity of the union of contact disks, its standard error; null when too few contact points. In 3D: ln of the Newtonian capacity. */
  logCapacity: number | null;
  logCapacityError: number | null;
  /** Unbiased Σ p_i³ over the particles (see the file header); null when W < 3. */
  z3: number | null;
  /** Same with the plug-in estimator Σ (c_i/W)^q for q = 2, 3 (for comparison). */
  z2Plugin: number;
  z3Plugin: number;
  /** Z(η) and Z(η + 2) at particle scale for a model with a growth exponent η (see the file header); absent otherwise. */
  breakdown?: { eta: number; zEta: number | null; zEtaPlus2: number | null };
}

/** Σ p_i^q at particle scale from multinomial counts: unbiased for integer q, plug-in otherwise (file header); null when W < q. */
export function particleMoment(counts: ArrayLike<number>, walkers: number, q: number): number | null {
  if (Number.isInteger(q)) {
    if (walkers < q || walkers < 1) return null;
    let den = 1;
    for (let j = 0; j < q; j++) den *= walkers - j;
    let s = 0;
    for (let i = 0; i < counts.length; i++) {
      const c = counts[i];
      if (c < q || c <= 0) continue;
      let t = 1;
      for (let j = 0; j < q; j++) t *= c - j;
      s += t;
    }
    return s / den;
  }
  if (walkers < 1) return null;
  let s = 0;
  for (let i = 0; i < counts.length; i++) if (counts[i] > 0) s += (counts[i] / walkers) ** q;
  return s;
}

/** Unbiased Σ p_i^3 from multinomial counts (see the file header). */
export function growthMomentZ3(counts: ArrayLike<number>, walkers: number): number | null {
  if (walkers < 3) return null;
  let s = 0;
  for (let i = 0; i < counts.length; i++) {
    const c = counts[i];
    if (c >= 3) s += c * (c - 1) * (c - 2);
  }
  return s / (walkers * (walkers - 1) * (walkers - 2));
}

/** `breakdownEta`: the model's growth exponent η (parameter `eta`), or null for a model without one. */
export function clusterHarmonicOf(runIndex: number, size: number, m: HarmonicMeasures, counts: ArrayLike<number>, breakdownEta: number | null = null): ClusterHarmonic {
  const w = m.walkers;
  let z2 = 0;
  let z3 = 0;
  for (let i = 0; i < counts.length; i++) {
    const p = counts[i] / w;
    z2 += p * p;
    z3 += p * p * p;
  }
  return {
    runIndex,
    size,
    walkers: w,
    q: [...m.spectrum.q],
    tau: [...m.spectrum.tau],
    tauFitError: [...m.spectrum.tauFitError],
    dq: [...m.spectrum.dq],
    alpha: [...m.spectrum.alpha],
    f: [...m.spectrum.f],
    converged: [...m.converged],
    informationDimension: m.spectrum.informationDimension,
    tauSystematic: m.windowSystematic ? [...m.windowSystematic.tau] : null,
    informationDimensionSystematic: m.windowSystematic ? m.windowSystematic.informationDimension : null,
    ...(m.resolutionSystematic
      ? { tauResolutionSystematic: [...m.resolutionSystematic.tau], informationDimensionResolutionSystematic: m.resolutionSystematic.informationDimension }
      : {}),
    maxConcentrationExponent: m.maxConcentration.exponent,
    window: { relativeMin: m.window.relativeMin, relativeMax: m.window.relativeMax },
    radius: m.radius,
    ...(m.dimension === 3
      ? {
        dimension: 3 as const,
        capacity: m.newtonianCapacity ? m.newtonianCapacity.capacity : null,
        capacityError: m.newtonianCapacity ? m.newtonianCapacity.error : null,
        logCapacity: m.newtonianCapacity && m.newtonianCapacity.capacity > 0 ? Math.log(m.newtonianCapacity.capacity) : null,
        logCapacityError: m.newtonianCapacity && m.newtonianCapacity.capacity > 0 ? m.newtonianCapacity.error / m.newtonianCapacity.capacity : null,
      }
      : {
        logCapacity: m.capacity ? m.capacity.logCapacity : null,
        logCapacityError: m.capacity ? m.capacity.logCapacityError : null,
      }),
    z3: growthMomentZ3(counts, w),
    z2Plugin: z2,
    z3Plugin: z3,
    ...(breakdownEta === null
      ? {}
      : { breakdown: { eta: breakdownEta, zEta: particleMoment(counts, w, breakdownEta), zEtaPlus2: particleMoment(counts, w, breakdownEta + 2) } }),
  };
}
