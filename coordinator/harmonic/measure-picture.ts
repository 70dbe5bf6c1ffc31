/**
 * Picture of a set coloured by harmonic measure: each disk drawn at its
 * physical radius, colour from the "ember" map (coordinator/render/palette.ts)
 * by the quantile (mid-rank) of its share of hits among the disks hit at
 * least once, i.e. by quantiles of log ω: every colour of the map covers the
 * same number of hit disks, so the measure's whole range shows even when it
 * spans many decades (a linear scale in log ω left a 10^5-particle cluster
 * almost uniformly dark); disks never hit are dark grey.
 * Disks are painted in order of increasing measure, so the most exposed
 * ones stay visible. Geometry as in coordinator/render/cluster-picture.ts
 * (bounding box grown by one radius, 3 % margin, +y up); disks smaller than
 * 0.75 px become one pixel.
 */
import { buildPalette, PALETTE_SIZE } from '../render/palette.js';
import { encodePng, DARK_BACKGROUND, type Raster } from '../render/cluster-picture.js';
import { parseHex } from '../render/palette.js';

/** Where renderMeasurePng puts the set: `scale` pixels per unit of x and y (for a scale bar), and the centre's offset. */
export function measurePictureGeometry(
  n: number, x: ArrayLike<number>, y: ArrayLike<number>, radius: number | ArrayLike<number>, size = 1024,
): { scale: number; minX: number; maxX: number; minY: number; maxY: number } {
  let minX = Infinity, maxX = -Infinity, minY = Infinity, maxY = -Infinity, rMax = 0;
  for (let i = 0; i < n; i++) {
    minX = Math.min(minX, x[i]); maxX = Math.max(maxX, x[i]);
    minY = Math.min(minY, y[i]); maxY = Math.max(maxY, y[i]);
    rMax = Math.max(rMax, typeof radius === 'number' ? radius : radius[i]);
  }
  const extent = Math.max(maxX - minX, maxY - minY) + 2 * rMax;
  return { scale: (size * 0.94) / extent, minX, maxX, minY, maxY };
}

export function renderMeasurePng(
  n: number, x: ArrayLike<number>, y: ArrayLike<number>, radius: number | ArrayLike<number>, counts: ArrayLike<number>, size = 1024,
): Buffer {
  const rad = (i: number): number => (typeof radius === 'number' ? radius : radius[i]);
  const { scale, minX, maxX, minY, maxY } = measurePictureGeometry(n, x, y, radius, size);
  const originX = size / 2 - scale * 0.5 * (minX + maxX);
  const originY = size / 2 + scale * 0.5 * (minY + maxY);
  const bg = parseHex(DARK_BACKGROUND);
  const data = Buffer.alloc(size * size * 4);
  for (let p = 0; p < data.length; p += 4) { data[p] = bg.r; data[p + 1] = bg.g; data[p + 2] = bg.b; data[p + 3] = 255; }
  const lut = buildPalette(PALETTE_SIZE, 0, 1);
  const hit: number[] = [];
  for (let i = 0; i < n; i++) if (counts[i] > 0) hit.push(counts[i]);
  const sorted = Float64Array.from(hit).sort();
  const m = sorted.length;
  /** Mid-rank quantile in [0, 1] of a positive count among the hit disks (ties share one colour). */
  const quantile = (c: number): number => {
    if (m <= 1) return 1;
    let a = 0, b = m;
    while (a < b) { const h = (a + b) >>> 1; if (sorted[h] < c) a = h + 1; else b = h; }
    let e = a, f = m;
    while (e < f) { const h = (e + f) >>> 1; if (sorted[h] <= c) e = h + 1; else f = h; }
    return (a + e - 1) / 2 / (m - 1);
  };
  const order = Array.from({ length: n }, (_, i) => i).sort((a, b) => counts[a] - counts[b]);
  for (const i of order) {
    let cr = 60, cg = 60, cb = 66;
    if (counts[i] > 0) {
      const c = 3 * Math.min(PALETTE_SIZE - 1, Math.floor(quantile(counts[i]) * (PALETTE_SIZE - 1) + 0.5));
      cr = lut[c]; cg = lut[c + 1]; cb = lut[c + 2];
    }
    const fx = originX + scale * x[i];
    const fy = originY - scale * y[i];
    const rPx = rad(i) * scale;
    if (rPx < 0.75) {
      const px = Math.floor(fx), py = Math.floor(fy);
      if (px < 0 || py < 0 || px >= size || py >= size) continue;
      const o = 4 * (py * size + px);
      data[o] = cr; data[o + 1] = cg; data[o + 2] = cb;
      continue;
    }
    const reach = rPx + 0.5;
    for (let py = Math.max(0, Math.floor(fy - reach)); py <= Math.min(size - 1, Math.floor(fy + reach)); py++) {
      for (let px = Math.max(0, Math.floor(fx - reach)); px <= Math.min(size - 1, Math.floor(fx + reach)); px++) {
        const d = Math.hypot(px + 0.5 - fx, py + 0.5 - fy);
        const a = Math.min(1, rPx + 0.5 - d);
        if (a <= 0) continue;
        const o = 4 * (py * size + px);
        data[o] = data[o] + (cr - data[o]) * a + 0.5;
        data[o + 1] = data[o + 1] + (cg - data[o + 1]) * a + 0.5;
        data[o + 2] = data[o + 2] + (cb - data[o + 2]) * a + 0.5;
      }
    }
  }
  const raster: Raster = { width: size, height: size, data, scale, originX, originY };
  return encodePng(raster);
}
