/**
 * Picture of a cluster: every particle drawn as a filled disk of its true
 * diameter, coloured by arrival order with the "ember" map (palette.ts), later
 * arrivals painted over earlier ones, written as an 8-bit RGB PNG (pngjs).
 *
 * Geometry: the bounding box of the centres, grown by one radius on each
 * side, is scaled uniformly to fill the square picture minus a margin
 * (default 3 % of the side on each edge) and centred; +y points up. 3D point
 * sets are projected orthographically onto the x-y plane.
 *
 * Disks whose radius is at least 0.75 px are drawn with an antialiased edge
 * (coverage approximated by clamp(r + 0.5 - d, 0, 1) for a pixel centre at
 * distance d). Smaller disks are drawn as one opaque pixel at the centre so
 * that a large cluster in a small picture stays visible.
 *
 * Everything is rasterised straight into one RGBA buffer: no allocation per
 * particle or pixel.
 */
import { PNG } from 'pngjs';
import type { PointSet } from '../snapshot/cluster-snapshot.js';
import type { ClusterPositions } from '../../worker/core/growth-kernel.js';
import { buildPalette, parseHex, PALETTE_SIZE } from './palette.js';

export type Background = 'dark' | 'white';

export interface PictureOptions {
  /** Side of the square picture in pixels; default 1024. */
  size?: number;
  /** Default 'dark'. */
  background?: Background;
  /** Fraction of the side left empty on each edge; default 0.03. */
  margin?: number;
}

export const DEFAULT_PICTURE_SIZE = 1024;
export const DARK_BACKGROUND = '#0e0e16';
export const WHITE_BACKGROUND = '#ffffff';
/** Disks smaller than this radius (in pixels) are drawn as a single pixel. */
export const DOT_RADIUS_PX = 0.75;

export interface Raster {
  width: number;
  height: number;
  /** RGBA, row-major, top row first. */
  data: Buffer;
  /** Pixels per length unit. */
  scale: number;
  /** Pixel position of the point (0, 0): px = originX + scale*x, py = originY - scale*y. */
  originX: number;
  originY: number;
}

/**
 * A cluster's centres read in place from its dimension-strided positions
 * (x at coords[i·d], y at coords[i·d + 1]; a 3D cluster is projected), so a
 * giant cluster is drawn without a copy of its coordinates.
 */
export interface StridedPoints {
  positions: ClusterPositions;
  /** Contact distance between centres (particle diameter). */
  diameter: number;
}

/** Rasterise a point set (or a kernel's positions, read in place) into a fresh RGBA buffer. */
export function rasterizeCluster(points: PointSet | StridedPoints, options: PictureOptions = {}): Raster {
  const size = options.size ?? DEFAULT_PICTURE_SIZE;
  if (!Number.isInteger(size) || size < 1 || size > 16384) throw new RangeError(`picture size must be an integer in [1, 16384], got ${size}`);
  const margin = options.margin ?? 0.03;
  if (!(margin >= 0 && margin < 0.5)) throw new RangeError(`picture margin must be in [0, 0.5), got ${margin}`);
  const background = options.background ?? 'dark';
  const bg = parseHex(background === 'dark' ? DARK_BACKGROUND : WHITE_BACKGROUND);
  const lut = background === 'dark' ? buildPalette(PALETTE_SIZE, 0, 1) : buildPalette(PALETTE_SIZE, 0.7, 0);

  // centre i is (xs[xo + i·stride], ys[yo + i·stride])
  const strided = 'positions' in points;
  const n = strided ? points.positions.count : points.count;
  const xs = strided ? points.positions.coords : points.x;
  const ys = strided ? points.positions.coords : points.y;
  const stride = strided ? points.positions.dimension : 1;
  const xo = 0;
  const yo = strided ? 1 : 0;
  const radius = 0.5 * points.diameter;

  let minX = Infinity;
  let maxX = -Infinity;
  let minY = Infinity;
  let maxY = -Infinity;
  for (let i = 0; i < n; i++) {
    const x = xs[xo + i * stride];
    const y = ys[yo + i * stride];
    // x - x + y - y is NaN exactly when a coordinate is NaN or infinite
    if (x - x + y - y !== 0) throw new RangeError('picture: point coordinates must be finite');
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
  }
  if (n === 0) {
    minX = maxX = minY = maxY = 0;
  }
  const extent = Math.max(maxX - minX, maxY - minY) + 2 * radius;
  const usable = size * (1 - 2 * margin);
  const scale = usable / extent;
  const cx = 0.5 * (minX + maxX);
  const cy = 0.5 * (minY + maxY);
  const originX = size / 2 - scale * cx;
  const originY = size / 2 + scale * cy;

  const data = Buffer.alloc(size * size * 4);
  for (let p = 0; p < data.length; p += 4) {
    data[p] = bg.r;
    data[p + 1] = bg.g;
    data[p + 2] = bg.b;
    data[p + 3] = 255;
  }

  const rPx = radius * scale;
  const colourScale = n > 1 ? (PALETTE_SIZE - 1) / (n - 1) : 0;
  if (rPx < DOT_RADIUS_PX) {
    for (let i = 0; i < n; i++) {
      const px = Math.floor(originX + scale * xs[xo + i * stride]);
      const py = Math.floor(originY - scale * ys[yo + i * stride]);
      if (px < 0 || py < 0 || px >= size || py >= size) continue;
      const c = 3 * Math.floor(i * colourScale);
      const o = 4 * (py * size + px);
      data[o] = lut[c];
      data[o + 1] = lut[c + 1];
      data[o + 2] = lut[c + 2];
    }
  } else {
    const reach = rPx + 0.5;
    for (let i = 0; i < n; i++) {
      const fx = originX + scale * xs[xo + i * stride];
      const fy = originY - scale * ys[yo + i * stride];
      const c = 3 * Math.floor(i * colourScale);
      const cr = lut[c];
      const cg = lut[c + 1];
      const cb = lut[c + 2];
      const x0 = Math.max(0, Math.floor(fx - reach));
      const x1 = Math.min(size - 1, Math.floor(fx + reach));
      const y0 = Math.max(0, Math.floor(fy - reach));
      const y1 = Math.min(size - 1, Math.floor(fy + reach));
      for (let py = y0; py <= y1; py++) {
        const dy = py + 0.5 - fy;
        const row = py * size;
        for (let px = x0; px <= x1; px++) {
          const dx = px + 0.5 - fx;
          const d = Math.sqrt(dx * dx + dy * dy);
          const a = rPx + 0.5 - d;
          if (a <= 0) continue;
          const o = 4 * (row + px);
          if (a >= 1) {
            data[o] = cr;
            data[o + 1] = cg;
            data[o + 2] = cb;
          } else {
            data[o] = data[o] + (cr - data[o]) * a + 0.5;
            data[o + 1] = data[o + 1] + (cg - data[o + 1]) * a + 0.5;
            data[o + 2] = data[o + 2] + (cb - data[o + 2]) * a + 0.5;
          }
        }
      }
    }
  }
  return { width: size, height: size, data, scale, originX, originY };
}

/** Encode an RGBA raster as an 8-bit RGB PNG. */
export function encodePng(raster: Raster): Buffer {
  const png = new PNG({ width: raster.width, height: raster.height, inputHasAlpha: true });
  png.data = raster.data;
  return PNG.sync.write(png, { colorType: 2, inputColorType: 6, deflateLevel: 6 });
}

/** Rasterise and encode in one go. */
export function renderClusterPng(points: PointSet | StridedPoints, options: PictureOptions = {}): Buffer {
  return encodePng(rasterizeCluster(points, options));
}
