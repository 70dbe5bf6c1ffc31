/**
 * Picture of a cluster of balls in three dimensions: four orthographic views
 * in a 2 × 2 grid, each a depth-shaded rendering with a z-buffer, coloured
 * by arrival order with the "ember" map (palette.ts).
 *
 *   top left:  view along −z (x to the right, y up)
 *   top right: view along +y (x to the right, z up)
 *   bottom left: view along −x (y to the right, z up)
 *   bottom right: oblique view from the direction (1, 1, 1) (z up)
 *
 * All four panels share one scale: the ball of radius (largest centre
 * distance from the centroid + one particle radius) around the centroid
 * fills the panel minus a margin. A small axis key in each panel's lower
 * left corner shows the projected world axes (x red, y green, z blue).
 *
 * Shading: a ball whose projected radius is at least DOT_RADIUS_PX pixels is
 * drawn as a sphere (per-pixel depth sqrt(r² − d²) above its centre, Lambert
 * light from the upper left front, plus ambient); smaller balls are one
 * pixel. Every pixel is then dimmed by depth (the far side of the cluster at
 * 45 % brightness) so that the front reads in front. The z-buffer makes the
 * result independent of drawing order except for exact depth ties, where
 * the later arrival wins.
 */
import type { PointSet } from '../snapshot/cluster-snapshot.js';
import { buildPalette, parseHex, PALETTE_SIZE } from './palette.js';
import { DARK_BACKGROUND, DEFAULT_PICTURE_SIZE, DOT_RADIUS_PX, encodePng, type Raster } from './cluster-picture.js';

export interface SpheresPictureOptions {
  /** Side of the square picture in pixels (each panel is half of it); default 1024. */
  size?: number;
  /** Fraction of each panel left empty on each edge; default 0.04. */
  margin?: number;
}

/** A view: the screen axes right (e1) and up (e2) and the axis towards the viewer (e3), as world unit vectors. */
interface View {
  e1: [number, number, number];
  e2: [number, number, number];
  e3: [number, number, number];
}

const S2 = Math.SQRT1_2;
const S3 = 1 / Math.sqrt(3);
const S6 = 1 / Math.sqrt(6);

export const SPHERE_VIEWS: readonly View[] = [
  { e1: [1, 0, 0], e2: [0, 1, 0], e3: [0, 0, 1] },
  { e1: [1, 0, 0], e2: [0, 0, 1], e3: [0, -1, 0] },
  { e1: [0, 1, 0], e2: [0, 0, 1], e3: [1, 0, 0] },
  { e1: [-S2, S2, 0], e2: [-S6, -S6, 2 * S6], e3: [S3, S3, S3] },
];

/** Light direction in view coordinates (right, up, towards the viewer), unit length. */
const LIGHT = (() => {
  const v = [-0.45, 0.55, 0.7];
  const n = Math.hypot(v[0], v[1], v[2]);
  return v.map((c) => c / n);
})();
const AMBIENT = 0.3;
/** Brightness of the farthest point of the cluster relative to the nearest. */
const FAR_BRIGHTNESS = 0.45;

const AXIS_COLOURS = ['#e8554e', '#5cc96b', '#5b8def'].map(parseHex);

/** Rasterise the four views of a 3D point set. */
export function rasterizeSpheres(points: PointSet, options: SpheresPictureOptions = {}): Raster {
  if (points.dimension !== 3 || points.z === undefined) throw new RangeError('3D picture: the point set must have dimension 3 with z coordinates');
  const size = options.size ?? DEFAULT_PICTURE_SIZE;
  if (!Number.isInteger(size) || size < 2 || size > 16384) throw new RangeError(`picture size must be an integer in [2, 16384], got ${size}`);
  const margin = options.margin ?? 0.04;
  if (!(margin >= 0 && margin < 0.5)) throw new RangeError(`picture margin must be in [0, 0.5), got ${margin}`);
  const n = points.count;
  const xs = points.x;
  const ys = points.y;
  const zs = points.z;
  const radius = 0.5 * points.diameter;

  let cx = 0;
  let cy = 0;
  let cz = 0;
  for (let i = 0; i < n; i++) {
    const x = xs[i];
    const y = ys[i];
    const z = zs[i];
    if (x - x + y - y + z - z !== 0) throw new RangeError('picture: point coordinates must be finite');
    cx += x;
    cy += y;
    cz += z;
  }
  if (n > 0) {
    cx /= n;
    cy /= n;
    cz /= n;
  }
  let reach2 = 0;
  for (let i = 0; i < n; i++) {
    const dx = xs[i] - cx;
    const dy = ys[i] - cy;
    const dz = zs[i] - cz;
    const d2 = dx * dx + dy * dy + dz * dz;
    if (d2 > reach2) reach2 = d2;
  }
  const bound = Math.sqrt(reach2) + radius;

  const panel = Math.floor(size / 2);
  const scale = (panel * (1 - 2 * margin)) / (2 * bound);
  const rPx = radius * scale;
  const lut = buildPalette(PALETTE_SIZE, 0, 1);
  const bg = parseHex(DARK_BACKGROUND);
  const data = Buffer.alloc(size * size * 4);
  for (let p = 0; p < data.length; p += 4) {
    data[p] = bg.r;
    data[p + 1] = bg.g;
    data[p + 2] = bg.b;
    data[p + 3] = 255;
  }
  const depth = new Float32Array(panel * panel);
  const shade = new Float32Array(panel * panel);
  const owner = new Int32Array(panel * panel);
  const colourScale = n > 1 ? (PALETTE_SIZE - 1) / (n - 1) : 0;

  for (let v = 0; v < SPHERE_VIEWS.length; v++) {
    const { e1, e2, e3 } = SPHERE_VIEWS[v];
    const ox = (v % 2) * panel;
    const oy = Math.floor(v / 2) * panel;
    depth.fill(-Infinity);
    owner.fill(-1);
    const half = panel / 2;
    for (let i = 0; i < n; i++) {
      const dx = xs[i] - cx;
      const dy = ys[i] - cy;
      const dz = zs[i] - cz;
      const fx = half + scale * (e1[0] * dx + e1[1] * dy + e1[2] * dz);
      const fy = half - scale * (e2[0] * dx + e2[1] * dy + e2[2] * dz);
      const dc = e3[0] * dx + e3[1] * dy + e3[2] * dz;
      if (rPx < DOT_RADIUS_PX) {
        const px = Math.floor(fx);
        const py = Math.floor(fy);
        if (px < 0 || py < 0 || px >= panel || py >= panel) continue;
        const o = py * panel + px;
        if (dc >= depth[o]) {
          depth[o] = dc;
          shade[o] = AMBIENT + (1 - AMBIENT) * LIGHT[2];
          owner[o] = i;
        }
        continue;
      }
      const x0 = Math.max(0, Math.floor(fx - rPx));
      const x1 = Math.min(panel - 1, Math.floor(fx + rPx));
      const y0 = Math.max(0, Math.floor(fy - rPx));
      const y1 = Math.min(panel - 1, Math.floor(fy + rPx));
      const r2 = rPx * rPx;
      for (let py = y0; py <= y1; py++) {
        const sy = fy - (py + 0.5); // up is positive
        for (let px = x0; px <= x1; px++) {
          const sx = px + 0.5 - fx;
          const h2 = r2 - sx * sx - sy * sy;
          if (h2 < 0) continue;
          const h = Math.sqrt(h2);
          const d = dc + h / scale;
          const o = py * panel + px;
          if (d < depth[o]) continue;
          depth[o] = d;
          const lambert = (sx * LIGHT[0] + sy * LIGHT[1] + h * LIGHT[2]) / rPx;
          shade[o] = AMBIENT + (1 - AMBIENT) * (lambert > 0 ? lambert : 0);
          owner[o] = i;
        }
      }
    }
    for (let py = 0; py < panel; py++) {
      for (let px = 0; px < panel; px++) {
        const o = py * panel + px;
        const i = owner[o];
        if (i < 0) continue;
        const near = bound > 0 ? (depth[o] + bound) / (2 * bound) : 1;
        const k = shade[o] * (FAR_BRIGHTNESS + (1 - FAR_BRIGHTNESS) * Math.min(1, Math.max(0, near)));
        const c = 3 * Math.floor(i * colourScale);
        const q = 4 * ((oy + py) * size + ox + px);
        data[q] = Math.min(255, lut[c] * k + 0.5);
        data[q + 1] = Math.min(255, lut[c + 1] * k + 0.5);
        data[q + 2] = Math.min(255, lut[c + 2] * k + 0.5);
      }
    }
    drawAxisKey(data, size, ox, oy, panel, SPHERE_VIEWS[v]);
  }
  // panel separators
  for (let t = 0; t < size; t++) {
    for (const [x, y] of [
      [panel, t],
      [t, panel],
    ]) {
      if (x >= size || y >= size) continue;
      const q = 4 * (y * size + x);
      data[q] = 60;
      data[q + 1] = 60;
      data[q + 2] = 76;
    }
  }
  return { width: size, height: size, data, scale, originX: size / 4 - scale * cx, originY: size / 4 + scale * cy };
}

/** The projected world axes (x red, y green, z blue) in the lower left corner of a panel. */
function drawAxisKey(data: Buffer, size: number, ox: number, oy: number, panel: number, view: View): void {
  const len = Math.max(6, Math.round(panel * 0.06));
  const bx = ox + Math.round(panel * 0.03) + len;
  const by = oy + panel - Math.round(panel * 0.03) - len;
  for (let a = 0; a < 3; a++) {
    const sx = view.e1[a];
    const sy = -view.e2[a];
    const col = AXIS_COLOURS[a];
    const steps = 2 * len;
    for (let s = 0; s <= steps; s++) {
      const t = (s / steps) * len;
      const px = Math.round(bx + sx * t);
      const py = Math.round(by + sy * t);
      if (px < 0 || py < 0 || px >= size || py >= size) continue;
      const q = 4 * (py * size + px);
      data[q] = col.r;
      data[q + 1] = col.g;
      data[q + 2] = col.b;
    }
  }
}

/** Rasterise and encode in one go. */
export function renderSpheresPng(points: PointSet, options: SpheresPictureOptions = {}): Buffer {
  return encodePng(rasterizeSpheres(points, options));
}
