import { PNG } from 'pngjs';
import { describe, expect, it } from 'vitest';
import { measurePictureGeometry, renderMeasurePng } from '../coordinator/harmonic/measure-picture.js';
import { measurePictureFigure } from '../coordinator/report/harmonic-plots.js';
import { buildPalette, PALETTE_SIZE } from '../coordinator/render/palette.js';

// The harmonic-measure picture colours hit disks by the quantile of their
// share (quantiles of log ω), so a measure spanning many decades still uses
// the whole colour map: the median disk gets the middle colour, whatever the
// largest share is (exact, by construction of the mapping).

describe('harmonic-measure picture colours', () => {
  it('maps the median share to the middle of the colour map, even beside one huge share', () => {
    const n = 52, size = 512, r = 4;
    const x = Float64Array.from({ length: n }, (_, i) => 10 * i);
    const y = new Float64Array(n);
    // 50 disks with 1..50 hits, one with 10^9 hits, one never hit
    const counts = Float64Array.from({ length: n }, (_, i) => (i < 50 ? i + 1 : i === 50 ? 1e9 : 0));
    const png = PNG.sync.read(renderMeasurePng(n, x, y, r, counts, size));
    const extent = 10 * (n - 1) + 2 * r;
    const scale = (size * 0.94) / extent;
    const pixel = (i: number) => {
      const px = Math.floor(size / 2 + scale * (x[i] - 0.5 * 10 * (n - 1))), py = Math.floor(size / 2);
      const o = 4 * (py * size + px);
      return [png.data[o], png.data[o + 1], png.data[o + 2]];
    };
    const lut = buildPalette(PALETTE_SIZE, 0, 1);
    const colour = (q: number) => { const c = 3 * Math.floor(q * (PALETTE_SIZE - 1) + 0.5); return [lut[c], lut[c + 1], lut[c + 2]]; };
    // 51 hit disks: the one with 26 hits has mid-rank 25 of 0..50, quantile 0.5
    expect(pixel(25)).toEqual(colour(0.5));
    expect(pixel(0)).toEqual(colour(0));
    expect(pixel(50)).toEqual(colour(1));
    expect(pixel(51)).toEqual([60, 60, 66]); // never hit: dark grey
    // the 50 ordinary disks use most of the map (a log-linear scale squeezed them into its bottom fifth)
    expect(new Set(Array.from({ length: 50 }, (_, i) => pixel(i).join(','))).size).toBeGreaterThan(40);
  });
});

// The probe figure's scale bar: two disks whose centres are 100 units apart,
// found in the rendered PNG (leftmost and rightmost lit pixels of their row),
// fix the pixels per unit independently of measurePictureGeometry; the bar
// drawn in the SVG must be its stated length at that scale.
describe('harmonic-measure figure scale bar', () => {
  it('draws a bar of the stated length at the picture\'s scale', () => {
    const size = 1024, r = 0.5;
    const x = Float64Array.from([0, 100]), y = Float64Array.from([0, 0]), counts = Float64Array.from([3, 5]);
    const png = renderMeasurePng(2, x, y, r, counts, size);
    const img = PNG.sync.read(png);
    const row = Math.floor(size / 2);
    const bg = [img.data[0], img.data[1], img.data[2]];
    const lit: number[] = [];
    for (let px = 0; px < size; px++) {
      const o = 4 * (row * size + px);
      if (Math.abs(img.data[o] - bg[0]) + Math.abs(img.data[o + 1] - bg[1]) + Math.abs(img.data[o + 2] - bg[2]) > 60) lit.push(px);
    }
    // centres: the middle of each disk's lit run
    const split = lit.findIndex((p, i) => i > 0 && p - lit[i - 1] > 1);
    const left = (lit[0] + lit[split - 1] + 1) / 2, right = (lit[split] + lit[lit.length - 1] + 1) / 2;
    const pixelsPerUnit = (right - left) / 100;
    expect(measurePictureGeometry(2, x, y, r, size).scale).toBeCloseTo(pixelsPerUnit, 1);
    const fig = measurePictureFigure({ runIndex: 0, size: 2, png, scale: { pixelsPerUnit: measurePictureGeometry(2, x, y, r, size).scale, unit: 'particle diameters' } });
    const m = /<path d="M[\d.]+ [\d.]+h([\d.]+)" stroke="#ffffff" stroke-width="4"\/>/.exec(fig.svg);
    const label = /(\d+) particle diameters</.exec(fig.svg);
    expect(m).not.toBeNull();
    expect(label).not.toBeNull();
    const svgPerPixel = 660 / size; // the figure draws the 1024-px picture 660 units wide
    expect(Number(m![1])).toBeCloseTo(Number(label![1]) * pixelsPerUnit * svgPerPixel, 0);
    expect(fig.caption).toContain(`the white bar ${label![1]}.`);
    // without a scale: no bar
    expect(measurePictureFigure({ runIndex: 0, size: 2, png }).svg).not.toContain('particle diameters');
  });
});
