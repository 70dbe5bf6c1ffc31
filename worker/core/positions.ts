/**
 * Helpers on dimension-strided positions (ClusterPositions of
 * worker/core/growth-kernel.ts): one axis as its own array, and a prefix of
 * the cluster (the cluster as it was when it had n particles).
 */
import type { ClusterPositions } from './growth-kernel.js';

/** A copy of axis k (0 = x, 1 = y, 2 = z) of the first `count` centres. */
export function axisOf(p: ClusterPositions, k: number, count = p.count): Float64Array {
  if (!(k >= 0 && k < p.dimension)) throw new RangeError(`axis ${k} is outside 0..${p.dimension - 1}`);
  const n = Math.min(count, p.count);
  const out = new Float64Array(n);
  const d = p.dimension;
  const c = p.coords;
  for (let i = 0, j = k; i < n; i++, j += d) out[i] = c[j];
  return out;
}

/** The first n centres (a view, not a copy). */
export function prefixOf(p: ClusterPositions, n: number): ClusterPositions {
  if (!Number.isInteger(n) || n < 1 || n > p.count) throw new RangeError(`prefix size ${n} must be an integer from 1 to the cluster's ${p.count} particles`);
  return { dimension: p.dimension, count: n, coords: p.coords.subarray(0, n * p.dimension) };
}
