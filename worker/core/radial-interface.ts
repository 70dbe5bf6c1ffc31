/**
 * Radial interface of a compact planar cluster grown from a seed (Eden
 * growth), and its roughness: the observables behind the KPZ growth exponent.
 *
 * Definition (ours; common practice, no source for the exact coarse-graining):
 *  - The plane around the seed is cut into M equal angular sectors,
 *    M = max(8, floor(2π R_max / SECTOR_ARC)), so each sector is about
 *    SECTOR_ARC = 4 particle diameters (lattice spacings) wide at the rim.
 *  - The interface height of sector b, h_b, is the largest distance from the
 *    seed of a particle centre whose polar angle lies in
 *    [2πb/M, 2π(b+1)/M). Only particles beyond R_max/2 are scanned: a
 *    sector whose outermost particle lies inside R_max/2 is left out (none
 *    is, in compact growth, past the first few particles).
 *  - Mean radius R̄ = mean of h_b over the sectors; interface width
 *    w = sqrt(mean of (h_b − R̄)²) (radial roughness about the mean radius).
 * In radial KPZ growth (radial Eden: Ferreira & Alves 2006, J. Stat. Mech.
 * P11007; citation from memory) the radius grows linearly in time, so
 * w ∝ R̄^β with β = 1/3 (Kardar, Parisi & Zhang 1986, Phys. Rev. Lett. 56,
 * 889). The sector maximum adds an intrinsic width of order one spacing
 * (overhangs), the main correction to scaling at small sizes.
 */

export const SECTOR_ARC = 4;

/** Result of interfaceOf (reused). */
export const radialInterface = { width: 0, meanRadius: 0, sectors: 0 };

let heights = new Float64Array(64);

/** Sector (0 .. m − 1) of the polar angle of (x, y), with perRadian = m / 2π. */
export function sectorIndex(x: number, y: number, perRadian: number, m: number): number {
  let a = Math.atan2(y, x);
  if (a < 0) a += 2 * Math.PI;
  const b = Math.floor(a * perRadian);
  return b >= m ? m - 1 : b;
}

/**
 * Sector heights h_b of the centres beyond distance sqrt(inner2) into
 * heights[0 .. m); returns the number of sectors left empty.
 */
function sectorHeights(coords: Float64Array, stride: number, count: number, m: number, inner2: number): number {
  const h = heights;
  h.fill(-1, 0, m);
  const perRadian = m / (2 * Math.PI);
  for (let i = 0, j = 0; i < count; i++, j += stride) {
    const x = coords[j];
    const y = coords[j + 1];
    const r2 = x * x + y * y;
    if (r2 <= inner2) continue;
    const b = sectorIndex(x, y, perRadian, m);
    const r = Math.sqrt(r2);
    if (r > h[b]) h[b] = r;
  }
  let empty = 0;
  for (let b = 0; b < m; b++) if (h[b] < 0) empty++;
  return empty;
}

/** Interface width and mean radius of the first `count` centres (dimension-strided, seed at the origin). */
export function interfaceOf(coords: Float64Array, stride: number, count: number, rMax: number): void {
  const m = sectorCount(rMax);
  if (heights.length < m) heights = new Float64Array(2 * m);
  // first only the centres beyond 0.9 R_max (fewer angles to compute); when
  // every sector has one there, its height is the same as over R_max/2 < r
  if (sectorHeights(coords, stride, count, m, 0.81 * rMax * rMax) > 0) sectorHeights(coords, stride, count, m, 0.25 * rMax * rMax);
  interfaceOfHeights(heights, m);
}

/**
 * Interface width and mean radius from sector heights h[0 .. m) (−1 marks an
 * empty sector, left out), into `radialInterface`. Shared by interfaceOf and
 * the incremental recorder (worker/core/incremental-planar-records.ts), so
 * both give the same bits from the same heights.
 */
export function interfaceOfHeights(h: Float64Array, m: number): void {
  let n = 0;
  let s = 0;
  for (let b = 0; b < m; b++) {
    if (h[b] < 0) continue;
    n++;
    s += h[b];
  }
  const mean = n > 0 ? s / n : 0;
  let v = 0;
  for (let b = 0; b < m; b++) {
    if (h[b] < 0) continue;
    const d = h[b] - mean;
    v += d * d;
  }
  radialInterface.sectors = n;
  radialInterface.meanRadius = mean;
  radialInterface.width = n > 0 ? Math.sqrt(v / n) : 0;
}

/** The number of angular sectors of the interface of a cluster of radius rMax. */
export function sectorCount(rMax: number): number {
  return Math.max(8, Math.floor((2 * Math.PI * rMax) / SECTOR_ARC));
}

export const RADIAL_INTERFACE_OBSERVABLES = [
  { name: 'interface_radius', meaning: 'mean over angular sectors (about 4 spacings wide at the rim) of the outermost particle distance from the seed' },
  { name: 'interface_width', meaning: 'standard deviation over the sectors of the outermost particle distance (radial roughness; KPZ: grows as interface_radius^(1/3))' },
] as const;

/** Append interface_radius and interface_width of the first `count` centres to a series' extra records. */
export function recordRadialInterface(extra: Record<string, number[]>, coords: Float64Array, stride: number, count: number, rMax: number): void {
  interfaceOf(coords, stride, count, rMax);
  pushRadialInterface(extra);
}

/** Append the current `radialInterface` to a series' extra records. */
export function pushRadialInterface(extra: Record<string, number[]>): void {
  (extra.interface_radius ??= []).push(radialInterface.meanRadius);
  (extra.interface_width ??= []).push(radialInterface.width);
}
