/**
 * The cluster bootstrap: every replicate draws K whole clusters with
 * replacement out of K (never points within a cluster, which are strongly
 * correlated along the growth history). A replicate is represented by its
 * multiplicity vector (how often each cluster was drawn), so that any
 * statistic that is a function of cluster averages is a weighted average.
 *
 * Randomness: one generator, Random.forRun(seed, 0, STREAM_BOOTSTRAP), drawn
 * in a fixed order (replicate after replicate, K draws each), so the same
 * seed and the same clusters give the same replicates bit for bit. A draw in
 * [0, K) uses Lemire's unbiased multiply-and-reject method on one 32-bit word
 * (Lemire 2019, ACM Trans. Model. Comput. Simul. 29, 3): index = floor(u K / 2^32),
 * rejecting u when (u K mod 2^32) < (2^32 mod K); exact in doubles for K <= 2^21,
 * beyond which Random.nextBelow is used.
 */

import { Random, STREAM_BOOTSTRAP } from '../../worker/core/random.js';

/** The bootstrap generator for an analysis seed. */
export function bootstrapRandom(seed: string | number | bigint): Random {
  return Random.forRun(seed, 0, STREAM_BOOTSTRAP);
}

/**
 * Fill `counts` (length K, reused) with the multiplicities of one resample of
 * K clusters out of K, `drawn` with the indices of clusters drawn at least
 * once (ascending) and `weights` (optional) with their multiplicities as
 * doubles; returns how many entries of `drawn` are used.
 */
export function drawResample(rng: Random, counts: Int32Array, drawn: Int32Array, weights?: Float64Array): number {
  const k = counts.length;
  counts.fill(0);
  if (k <= 2097152) {
    const threshold = 4294967296 % k;
    for (let i = 0; i < k; i++) {
      let m = rng.nextUint32() * k;
      let hi = Math.floor(m * 2.3283064365386963e-10); // m / 2^32, exact
      while (m - hi * 4294967296 < threshold) {
        m = rng.nextUint32() * k;
        hi = Math.floor(m * 2.3283064365386963e-10);
      }
      counts[hi]++;
    }
  } else {
    for (let i = 0; i < k; i++) counts[rng.nextBelow(k)]++;
  }
  let m = 0;
  if (weights) {
    for (let i = 0; i < k; i++) if (counts[i] !== 0) { drawn[m] = i; weights[m++] = counts[i]; }
  } else {
    for (let i = 0; i < k; i++) if (counts[i] !== 0) drawn[m++] = i;
  }
  return m;
}

/** Mean of `values` (length K) weighted by resample multiplicities. */
export function weightedMean(values: Float64Array, counts: Int32Array, drawn: Int32Array, used: number): number {
  let s = 0;
  for (let j = 0; j < used; j++) {
    const c = drawn[j];
    s += counts[c] * values[c];
  }
  return s / counts.length;
}

/**
 * Column means of the row-major K x S matrix `y` under a resample given by
 * (drawn, weights, used) from drawResample, into out[0..S). Hot loop: no
 * allocation; eight rows per pass, which V8 runs about twice as fast as one.
 */
export function weightedColumnMeans(
  y: Float64Array, columns: number, k: number, drawn: Int32Array, weights: Float64Array, used: number, out: Float64Array,
): void {
  const cols = columns;
  for (let s = 0; s < cols; s++) out[s] = 0;
  let j = 0;
  for (; j + 7 < used; j += 8) {
    const b0 = drawn[j] * cols, b1 = drawn[j + 1] * cols, b2 = drawn[j + 2] * cols, b3 = drawn[j + 3] * cols;
    const b4 = drawn[j + 4] * cols, b5 = drawn[j + 5] * cols, b6 = drawn[j + 6] * cols, b7 = drawn[j + 7] * cols;
    const w0 = weights[j], w1 = weights[j + 1], w2 = weights[j + 2], w3 = weights[j + 3];
    const w4 = weights[j + 4], w5 = weights[j + 5], w6 = weights[j + 6], w7 = weights[j + 7];
    for (let s = 0; s < cols; s++) {
      out[s] += w0 * y[b0 + s] + w1 * y[b1 + s] + w2 * y[b2 + s] + w3 * y[b3 + s]
        + w4 * y[b4 + s] + w5 * y[b5 + s] + w6 * y[b6 + s] + w7 * y[b7 + s];
    }
  }
  for (; j < used; j++) {
    const b0 = drawn[j] * cols, w0 = weights[j];
    for (let s = 0; s < cols; s++) out[s] += w0 * y[b0 + s];
  }
  const inv = 1 / k;
  for (let s = 0; s < cols; s++) out[s] *= inv;
}

/**
 * Generic bootstrap of a scalar statistic of n observations: `stat(counts)`
 * gets the multiplicity vector of each replicate. Returns the B replicates.
 */
export function bootstrapScalar(
  n: number, resamples: number, rng: Random, stat: (counts: Int32Array, drawn: Int32Array, used: number) => number,
): Float64Array {
  const counts = new Int32Array(n);
  const drawn = new Int32Array(n);
  const out = new Float64Array(resamples);
  for (let b = 0; b < resamples; b++) {
    const used = drawResample(rng, counts, drawn);
    out[b] = stat(counts, drawn, used);
  }
  return out;
}

/** Leave-one-out jackknife values of a statistic: statWithout(i) for i < n. */
export function jackknifeScalar(n: number, statWithout: (i: number) => number): Float64Array {
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = statWithout(i);
  return out;
}

/** Leave-one-out means of `values` (exact, O(K)). */
export function jackknifeMeans(values: Float64Array): Float64Array {
  const k = values.length;
  let s = 0;
  for (let i = 0; i < k; i++) s += values[i];
  const out = new Float64Array(k);
  for (let i = 0; i < k; i++) out[i] = (s - values[i]) / (k - 1);
  return out;
}
