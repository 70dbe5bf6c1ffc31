import { describe, expect, it } from 'vitest';
import { PNG } from 'pngjs';
import {
  buildPalette,
  cieLightness,
  DARK_BACKGROUND,
  EMBER_CONTROL_COLOURS,
  parseHex,
  rasterizeCluster,
  renderClusterPng,
  WHITE_BACKGROUND,
  type Raster,
} from '../coordinator/render/index.js';

function pixel(r: Raster, px: number, py: number): [number, number, number] {
  const o = 4 * (py * r.width + px);
  return [r.data[o], r.data[o + 1], r.data[o + 2]];
}

function countNonBackground(r: Raster, bgHex: string): number {
  const bg = parseHex(bgHex);
  let n = 0;
  for (let o = 0; o < r.data.length; o += 4) {
    if (r.data[o] !== bg.r || r.data[o + 1] !== bg.g || r.data[o + 2] !== bg.b) n++;
  }
  return n;
}

describe('ember palette', () => {
  it('control colours have rising CIE L*', () => {
    const l = EMBER_CONTROL_COLOURS.map((h) => cieLightness(parseHex(h)));
    for (let i = 1; i < l.length; i++) expect(l[i]).toBeGreaterThan(l[i - 1]);
  });

  it('the sampled table is ordered in lightness (rounding tolerance 0.3 L*)', () => {
    const lut = buildPalette(1024);
    let prev = -Infinity;
    for (let i = 0; i < 1024; i++) {
      const l = cieLightness({ r: lut[3 * i], g: lut[3 * i + 1], b: lut[3 * i + 2] });
      expect(l).toBeGreaterThan(prev - 0.3);
      prev = Math.max(prev, l);
    }
    expect([lut[0], lut[1], lut[2]]).toEqual([0x3b, 0x2f, 0x9a]);
    expect([lut[3069], lut[3070], lut[3071]]).toEqual([0xfb, 0xe2, 0x7a]);
  });

  it('the reversed table for white backgrounds gets darker', () => {
    const lut = buildPalette(256, 0.7, 0);
    const first = cieLightness({ r: lut[0], g: lut[1], b: lut[2] });
    const last = cieLightness({ r: lut[765], g: lut[766], b: lut[767] });
    expect(first).toBeGreaterThan(last + 30);
  });
});

describe('cluster picture', () => {
  it('places disks where the scale says and colours them by arrival order', () => {
    // Three particles in a row; the picture must fit x in [-10.5, 10.5] into 1000 px minus 3 % margins.
    const x = Float64Array.of(-10, 0, 10);
    const y = Float64Array.of(0, 0, 0);
    const r = rasterizeCluster({ dimension: 2, count: 3, x, y, diameter: 1 }, { size: 1000 });
    expect(r.width).toBe(1000);
    expect(r.height).toBe(1000);
    expect(r.scale).toBeCloseTo((1000 * 0.94) / 21, 9);
    const lut = buildPalette(1024);
    const at = (xx: number, yy: number): [number, number, number] =>
      pixel(r, Math.floor(r.originX + r.scale * xx), Math.floor(r.originY - r.scale * yy));
    expect(at(-10, 0)).toEqual([lut[0], lut[1], lut[2]]);
    expect(at(10, 0)).toEqual([lut[3069], lut[3070], lut[3071]]);
    const mid = 3 * Math.floor(0.5 * 1023);
    expect(at(0, 0)).toEqual([lut[mid], lut[mid + 1], lut[mid + 2]]);
    // Between the disks and in the corners: background.
    const bg = parseHex(DARK_BACKGROUND);
    expect(at(-5, 0)).toEqual([bg.r, bg.g, bg.b]);
    expect(pixel(r, 0, 0)).toEqual([bg.r, bg.g, bg.b]);
    // Painted pixels cover about 3 disk areas of radius 0.5 * scale.
    const area = 3 * Math.PI * (0.5 * r.scale) ** 2;
    const painted = countNonBackground(r, DARK_BACKGROUND);
    expect(painted).toBeGreaterThan(0.95 * area);
    expect(painted).toBeLessThan(1.1 * area + 3 * 2 * Math.PI * 0.5 * r.scale);
    // The leftmost painted column sits at the margin (30 px).
    let left = r.width;
    for (let py = 0; py < r.height; py++) {
      for (let px = 0; px < r.width; px++) {
        if (pixel(r, px, py)[0] !== bg.r) { left = Math.min(left, px); break; }
      }
    }
    expect(Math.abs(left - 30)).toBeLessThanOrEqual(1);
  });

  it('puts +y at the top and later arrivals over earlier ones', () => {
    const x = Float64Array.of(0, 0, 0.3);
    const y = Float64Array.of(0, 5, 5);
    const r = rasterizeCluster({ dimension: 2, count: 3, x, y, diameter: 1 }, { size: 200 });
    const lut = buildPalette(1024);
    const topY = Math.floor(r.originY - r.scale * 5);
    const bottomY = Math.floor(r.originY);
    expect(topY).toBeLessThan(bottomY);
    // pixel at the centre of particle 1 lies inside particle 2 too, which was painted later
    expect(pixel(r, Math.floor(r.originX + 0.05 * r.scale), topY)).toEqual([lut[3069], lut[3070], lut[3071]]);
  });

  it('draws a single particle centred on a white background', () => {
    const r = rasterizeCluster({ dimension: 2, count: 1, x: Float64Array.of(3), y: Float64Array.of(-4), diameter: 1 }, { size: 64, background: 'white' });
    const bg = parseHex(WHITE_BACKGROUND);
    expect(pixel(r, 0, 0)).toEqual([bg.r, bg.g, bg.b]);
    expect(pixel(r, 32, 32)).not.toEqual([bg.r, bg.g, bg.b]);
    const painted = countNonBackground(r, WHITE_BACKGROUND);
    expect(painted).toBeGreaterThan(0.9 * Math.PI * 30 ** 2);
  });

  it('projects 3D point sets onto the x-y plane', () => {
    const pts = { dimension: 3 as const, count: 2, x: Float64Array.of(0, 4), y: Float64Array.of(0, 0), z: Float64Array.of(-100, 100), diameter: 1 };
    const r = rasterizeCluster(pts, { size: 100 });
    expect(r.scale).toBeCloseTo(94 / 5, 9);
  });

  it('writes a PNG that decodes to the raster', () => {
    const n = 500;
    const x = new Float64Array(n);
    const y = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      x[i] = Math.sqrt(i) * Math.cos(i * 2.4);
      y[i] = Math.sqrt(i) * Math.sin(i * 2.4);
    }
    const pts = { dimension: 2 as const, count: n, x, y, diameter: 1 };
    const png = PNG.sync.read(renderClusterPng(pts, { size: 300 }));
    expect(png.width).toBe(300);
    expect(png.height).toBe(300);
    const r = rasterizeCluster(pts, { size: 300 });
    expect(Buffer.compare(png.data, r.data)).toBe(0);
  });

  it('rasterises 10^6 sub-pixel particles quickly, one pixel each', () => {
    const n = 1_000_000;
    const x = new Float64Array(n);
    const y = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const rad = 3 * Math.sqrt(i);
      x[i] = rad * Math.cos(i * 2.39996);
      y[i] = rad * Math.sin(i * 2.39996);
    }
    const t0 = performance.now();
    const png = renderClusterPng({ dimension: 2, count: n, x, y, diameter: 1 }, { size: 1024 });
    const seconds = (performance.now() - t0) / 1000;
    // Budget of the task: "a couple of seconds" for 10^6 particles; allow headroom for a shared machine.
    expect(seconds).toBeLessThan(4);
    const back = PNG.sync.read(png);
    const raster = { width: back.width, height: back.height, data: back.data, scale: 0, originX: 0, originY: 0 };
    // The disk of radius ~3000 fills most of the inner circle of the picture.
    expect(countNonBackground(raster, DARK_BACKGROUND)).toBeGreaterThan(0.5 * Math.PI * 480 ** 2);
  });

  it('rejects bad sizes and non-finite coordinates with one-line errors', () => {
    const pts = { dimension: 2 as const, count: 1, x: Float64Array.of(NaN), y: Float64Array.of(0), diameter: 1 };
    expect(() => rasterizeCluster(pts)).toThrow(/^picture: point coordinates must be finite$/);
    const late = { dimension: 2 as const, count: 3, x: Float64Array.of(0, 1, Infinity), y: Float64Array.of(0, 0, 0), diameter: 1 };
    expect(() => rasterizeCluster(late)).toThrow(/^picture: point coordinates must be finite$/);
    expect(() => rasterizeCluster({ ...pts, x: Float64Array.of(0) }, { size: 0 })).toThrow(/picture size must be an integer in \[1, 16384\], got 0/);
  });
});
