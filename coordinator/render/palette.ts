/**
 * The arrival-order colour map used for cluster pictures ("ember"): five sRGB
 * control colours chosen by us, indigo -> violet -> rose -> orange -> pale
 * yellow, whose CIE L* lightness rises monotonically (27.6, 37.1, 48.2, 64.0,
 * 90.0). Each control colour sits at the parameter value proportional to its
 * L*, t_k = (L_k - L_0) / (L_4 - L_0), so lightness grows roughly linearly
 * with t; between control points the sRGB components are interpolated
 * linearly. The map is sampled into a 1024-entry lookup table.
 *
 * On a dark background the map is used as is (first arrivals darkest, the
 * newest tips brightest). On a white background it is run backwards over
 * t in [0, 0.7] so that the newest particles are the darkest and the pale
 * end, which would vanish on white, is not used.
 */

export interface Rgb {
  r: number;
  g: number;
  b: number;
}

export const EMBER_CONTROL_COLOURS: readonly string[] = ['#3b2f9a', '#7a36a8', '#c2408a', '#f07a3a', '#fbe27a'];

export const PALETTE_SIZE = 1024;

export function parseHex(hex: string): Rgb {
  const m = /^#([0-9a-fA-F]{6})$/.exec(hex);
  if (m === null) throw new RangeError(`colour must be #rrggbb, got "${hex}"`);
  const v = parseInt(m[1], 16);
  return { r: (v >> 16) & 0xff, g: (v >> 8) & 0xff, b: v & 0xff };
}

function srgbToLinear(c8: number): number {
  const c = c8 / 255;
  return c <= 0.04045 ? c / 12.92 : Math.pow((c + 0.055) / 1.055, 2.4);
}

/** CIE L* (D65 white) of an 8-bit sRGB colour. */
export function cieLightness(c: Rgb): number {
  const y = 0.2126 * srgbToLinear(c.r) + 0.7152 * srgbToLinear(c.g) + 0.0722 * srgbToLinear(c.b);
  return y > 216 / 24389 ? 116 * Math.cbrt(y) - 16 : (24389 / 27) * y;
}

/** Build a lookup table of `size` RGB triples (packed r,g,b bytes) for t in [t0, t1] of the ember map. */
export function buildPalette(size = PALETTE_SIZE, t0 = 0, t1 = 1): Uint8Array {
  const ctrl = EMBER_CONTROL_COLOURS.map(parseHex);
  const light = ctrl.map(cieLightness);
  const pos = light.map((l) => (l - light[0]) / (light[light.length - 1] - light[0]));
  const out = new Uint8Array(size * 3);
  for (let i = 0; i < size; i++) {
    const s = size === 1 ? 0 : i / (size - 1);
    const t = t0 + (t1 - t0) * s;
    let k = 0;
    while (k < pos.length - 2 && t > pos[k + 1]) k++;
    const a = ctrl[k];
    const b = ctrl[k + 1];
    const f = Math.min(1, Math.max(0, (t - pos[k]) / (pos[k + 1] - pos[k])));
    out[3 * i] = Math.round(a.r + (b.r - a.r) * f);
    out[3 * i + 1] = Math.round(a.g + (b.g - a.g) * f);
    out[3 * i + 2] = Math.round(a.b + (b.b - a.b) * f);
  }
  return out;
}
