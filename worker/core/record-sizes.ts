/**
 * Log-spaced grids shared by all kernels: the cluster sizes at which
 * observables are recorded, and the radii of the final mass–radius counts.
 */

/**
 * Records per decade of size: the one source of the allowed range and the
 * default, for specs and for `tendril grow` alike.
 */
export const RECORDS_PER_DECADE = { min: 10, max: 100, default: 10 } as const;

/**
 * Sizes round(10^(j/perDecade)) for j = perDecade, perDecade + 1, ... (that
 * is from N = 10), without repeats, below `final`, followed by `final`.
 */
export function recordSizes(final: number, perDecade: number): number[] {
  const out: number[] = [];
  for (let j = perDecade; ; j++) {
    const n = Math.round(10 ** (j / perDecade));
    if (n >= final) break;
    if (out.length === 0 || n > out[out.length - 1]) out.push(n);
  }
  out.push(final);
  return out;
}

/** Radii 10^(j/perDecade), j = 0, 1, ..., up to the first one at or beyond maxRadius + 1. */
export function massRadiusRadii(maxRadius: number, perDecade: number): number[] {
  const out: number[] = [];
  for (let j = 0; ; j++) {
    const r = 10 ** (j / perDecade);
    out.push(r);
    if (r >= maxRadius + 1) break;
  }
  return out;
}

/**
 * M(r) of dimension-strided centres straight from the positions: the number
 * of the first `count` centres whose distance from the origin,
 * sqrt(x² + y² (+ z²)) summed in axis order, is <= r, for each r of an
 * increasing list, without holding the distances (a giant cluster would
 * need 8 bytes per particle for them): each centre is binned at the first
 * radius that holds it (a binary search into the radii), then the bins are
 * summed; the same counts as sorting the distances, in O(n log k) instead
 * of O(n log n). A NaN distance is <= no radius and is not counted.
 */
export function countCentresWithin(coords: Float64Array, dimension: number, count: number, radii: number[]): number[] {
  const m = radii.length;
  const bins = new Float64Array(m);
  for (let i = 0, o = 0; i < count; i++, o += dimension) {
    let s = coords[o] * coords[o];
    for (let k = 1; k < dimension; k++) s += coords[o + k] * coords[o + k];
    const d = Math.sqrt(s);
    if (!(d <= radii[m - 1])) continue;
    let lo = 0;
    let hi = m - 1;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (d <= radii[mid]) hi = mid;
      else lo = mid + 1;
    }
    bins[lo]++;
  }
  const counts: number[] = [];
  let total = 0;
  for (let j = 0; j < m; j++) {
    total += bins[j];
    counts.push(total);
  }
  return counts;
}
