/**
 * A small plotting library of our own that writes SVG: one rectangular panel
 * with a linear or logarithmic x and y axis, nice ticks, axis labels, and
 * layers (shaded bands, lines, points, error bars, horizontal/vertical
 * reference lines with labels, shaded spans) plus a legend.
 *
 * Text may carry sub- and superscripts: "R_g", "R_{max}", "N^{-ω}", "10^{3}".
 * Every piece of text is XML-escaped. The SVG uses only features that both
 * browsers and resvg (png-plot.ts) render the same way: plain shapes, paths,
 * clipPath, text with tspan (dy shifts) and rotate transforms.
 *
 * The font is Roboto (shipped as TTF in an npm package and embedded in the
 * HTML page), falling back to common sans-serif fonts; text widths for layout
 * are estimated from average Roboto advance widths (textWidth below).
 */

export const FONT_FAMILY = "Roboto, 'DejaVu Sans', Helvetica, Arial, sans-serif";

/** Okabe & Ito colour-blind-safe palette (Okabe & Ito 2008, "Color Universal Design"). */
export const COLOURS = {
  blue: '#0072B2',
  vermillion: '#D55E00',
  green: '#009E73',
  purple: '#CC79A7',
  orange: '#E69F00',
  sky: '#56B4E9',
  black: '#000000',
  grey: '#666666',
} as const;

export function escapeXml(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');
}

/** Number to SVG coordinate text (2 decimals, no "-0"). */
function c(v: number): string {
  const r = Math.round(v * 100) / 100;
  return (r === 0 ? 0 : r).toString();
}

// ---------------------------------------------------------------- rich text

interface TextRun { text: string; shift: 0 | 1 | -1 }

/** Split "R_g^{2}" style text into runs: shift -1 = subscript, 1 = superscript. */
export function parseRichText(s: string): TextRun[] {
  const runs: TextRun[] = [];
  let cur = '';
  let i = 0;
  const push = (text: string, shift: 0 | 1 | -1) => { if (text) runs.push({ text, shift }); };
  while (i < s.length) {
    const ch = s[i];
    if ((ch === '_' || ch === '^') && i + 1 < s.length) {
      push(cur, 0); cur = '';
      const shift = ch === '_' ? -1 : 1;
      let body: string;
      if (s[i + 1] === '{') {
        const end = s.indexOf('}', i + 2);
        if (end < 0) { body = s.slice(i + 2); i = s.length; } else { body = s.slice(i + 2, end); i = end + 1; }
      } else {
        // a single "word" character (or one symbol)
        let j = i + 1;
        if (/[A-Za-z0-9]/.test(s[j])) { while (j < s.length && /[A-Za-z0-9]/.test(s[j])) j++; } else j++;
        body = s.slice(i + 1, j); i = j;
      }
      push(body, shift);
      continue;
    }
    cur += ch; i++;
  }
  push(cur, 0);
  return runs;
}

const NARROW = new Set([...'iljtfrI.,:;!|\'()[]{}/ ']);
const WIDE = new Set([...'mwMWω—']);

/** Estimated width in px of plain text at a font size (Roboto-like metrics). */
function plainWidth(s: string, size: number): number {
  let w = 0;
  for (const ch of s) {
    if (NARROW.has(ch)) w += 0.3;
    else if (WIDE.has(ch)) w += 0.85;
    else if (/[A-Z]/.test(ch)) w += 0.65;
    else if (/[0-9]/.test(ch)) w += 0.56;
    else w += 0.53;
  }
  return w * size;
}

/** Estimated width in px of rich text (sub/superscripts at 70 % size). */
export function textWidth(s: string, size: number): number {
  let w = 0;
  for (const r of parseRichText(s)) w += plainWidth(r.text, r.shift === 0 ? size : size * 0.7);
  return w;
}

export interface TextOptions {
  size?: number;
  anchor?: 'start' | 'middle' | 'end';
  colour?: string;
  weight?: 'normal' | 'bold';
  rotate?: number;
  /** dominant-baseline is avoided (resvg and browsers differ); dy in em instead. */
  dyEm?: number;
  italic?: boolean;
  /** Draw a white outline under the glyphs so the text stays legible over lines. */
  halo?: boolean;
}

/** An SVG <text> element for rich text at (x, y) (baseline). */
export function svgText(x: number, y: number, s: string, o: TextOptions = {}): string {
  const size = o.size ?? 14;
  const attrs = [`font-size="${size}"`, `fill="${o.colour ?? '#000'}"`];
  if (o.anchor && o.anchor !== 'start') attrs.push(`text-anchor="${o.anchor}"`);
  if (o.weight === 'bold') attrs.push('font-weight="bold"');
  if (o.italic) attrs.push('font-style="italic"');
  if (o.halo) attrs.push('stroke="#ffffff" stroke-width="3.5" stroke-linejoin="round" paint-order="stroke"');
  let pos: string;
  const dy = o.dyEm ? o.dyEm * size : 0;
  if (o.rotate) pos = `transform="translate(${c(x)},${c(y + dy)}) rotate(${o.rotate})" x="0" y="0"`;
  else pos = `x="${c(x)}" y="${c(y + dy)}"`;
  const runs = parseRichText(s);
  let inner = '';
  let level = 0; // current baseline shift in px
  for (const r of runs) {
    const target = r.shift === -1 ? 0.3 * size : r.shift === 1 ? -0.4 * size : 0;
    const d = target - level;
    level = target;
    const fs = r.shift === 0 ? '' : ` font-size="${c(size * 0.7)}"`;
    inner += `<tspan${d !== 0 ? ` dy="${c(d)}"` : ''}${fs}>${escapeXml(r.text)}</tspan>`;
  }
  return `<text ${pos} ${attrs.join(' ')}>${inner}</text>`;
}

// ---------------------------------------------------------------- scales and ticks

export type ScaleKind = 'linear' | 'log';

export interface Tick { value: number; label: string; major: boolean }

export class Scale {
  private readonly t0: number;
  private readonly t1: number;
  constructor(readonly kind: ScaleKind, readonly domain: [number, number], readonly range: [number, number]) {
    if (!(domain[0] < domain[1])) throw new RangeError(`scale domain must be increasing, got [${domain[0]}, ${domain[1]}]`);
    if (kind === 'log' && !(domain[0] > 0)) throw new RangeError(`log scale domain must be positive, got [${domain[0]}, ${domain[1]}]`);
    this.t0 = this.tr(domain[0]);
    this.t1 = this.tr(domain[1]);
  }
  private tr(v: number): number { return this.kind === 'log' ? Math.log10(v) : v; }
  map(v: number): number {
    return this.range[0] + ((this.tr(v) - this.t0) / (this.t1 - this.t0)) * (this.range[1] - this.range[0]);
  }
  contains(v: number): boolean {
    const eps = 1e-9 * (this.t1 - this.t0);
    const t = this.tr(v);
    return t >= this.t0 - eps && t <= this.t1 + eps;
  }
  ticks(): Tick[] { return this.kind === 'log' ? logTicks(this.domain) : linearTicks(this.domain); }
}

/** Shortest decimal text of v at the precision of step. */
export function formatTick(v: number, step: number): string {
  let decimals = 0;
  while (decimals < 10 && Math.abs(Math.round(step * 10 ** decimals) - step * 10 ** decimals) > 1e-6 * step * 10 ** decimals) decimals++;
  const s = v.toFixed(decimals);
  return s === '-0' || /^-0\.0*$/.test(s) ? s.slice(1) : s.replace('-', '−');
}

/** Nice step (1, 2, 2.5 or 5 times a power of ten) giving about `target` intervals. */
export function niceStep(span: number, target = 5): number {
  const raw = span / target;
  const p = Math.pow(10, Math.floor(Math.log10(raw)));
  const m = raw / p;
  const f = m < 1.5 ? 1 : m < 2.25 ? 2 : m < 3.5 ? 2.5 : m < 7.5 ? 5 : 10;
  return f * p;
}

export function linearTicks([lo, hi]: [number, number], target = 5): Tick[] {
  const step = niceStep(hi - lo, target);
  const out: Tick[] = [];
  const first = Math.ceil(lo / step - 1e-9);
  for (let k = first; k * step <= hi + 1e-9 * step; k++) {
    const v = k * step;
    out.push({ value: Math.abs(v) < 1e-12 * step ? 0 : v, label: formatTick(v, step), major: true });
  }
  // minor ticks halfway
  const minor: Tick[] = [];
  for (let k = first - 1; k * step <= hi; k++) {
    const v = (k + 0.5) * step;
    if (v >= lo && v <= hi) minor.push({ value: v, label: '', major: false });
  }
  return [...out, ...minor];
}

/** Decade label "10^{k}" (or plain for 1, 10, 100, 1000). */
function decadeLabel(k: number): string {
  if (k >= 0 && k <= 3) return String(Math.pow(10, k));
  return `10^{${k < 0 ? '−' + -k : k}}`;
}

export function logTicks([lo, hi]: [number, number]): Tick[] {
  const k0 = Math.floor(Math.log10(lo) + 1e-9);
  const k1 = Math.ceil(Math.log10(hi) - 1e-9);
  const decadesInside: number[] = [];
  for (let k = k0; k <= k1; k++) { const v = Math.pow(10, k); if (v >= lo * (1 - 1e-9) && v <= hi * (1 + 1e-9)) decadesInside.push(k); }
  const out: Tick[] = [];
  const spanDecades = Math.log10(hi / lo);
  if (decadesInside.length >= 2) {
    const every = spanDecades > 10 ? Math.ceil(spanDecades / 8) : 1;
    for (const k of decadesInside) if (k % every === 0) out.push({ value: Math.pow(10, k), label: decadeLabel(k), major: true });
    if (every === 1) {
      const labelled = spanDecades <= 1.6 ? [2, 5] : spanDecades <= 2.6 ? [3] : [];
      for (let k = k0; k <= k1; k++) {
        for (let m = 2; m <= 9; m++) {
          const v = m * Math.pow(10, k);
          if (v < lo || v > hi) continue;
          out.push({ value: v, label: labelled.includes(m) ? formatTick(v, Math.pow(10, k)) : '', major: labelled.includes(m) });
        }
      }
    }
    return out;
  }
  // less than two decades inside: 1-2-5 sequence, then 1..9 if still sparse
  for (const ms of [[1, 2, 5], [1, 2, 3, 4, 5, 6, 7, 8, 9]]) {
    out.length = 0;
    for (let k = k0 - 1; k <= k1; k++) {
      for (const m of ms) {
        const v = m * Math.pow(10, k);
        if (v >= lo * (1 - 1e-9) && v <= hi * (1 + 1e-9)) out.push({ value: v, label: v >= 1e4 || v < 1e-3 ? `${m}·${decadeLabel(k)}` : formatTick(v, Math.pow(10, k)), major: true });
      }
    }
    if (out.length >= 3) break;
  }
  if (out.length < 2) return linearTicks([lo, hi], 3);
  return out;
}

/** Padded domain around finite data values (positive only for log). */
export function autoDomain(values: number[], kind: ScaleKind, pad = 0.05, include: number[] = []): [number, number] {
  const v = [...values, ...include].filter((x) => Number.isFinite(x) && (kind === 'linear' || x > 0));
  if (v.length === 0) return kind === 'log' ? [1, 10] : [0, 1];
  let lo = Math.min(...v), hi = Math.max(...v);
  if (kind === 'log') {
    let a = Math.log10(lo), b = Math.log10(hi);
    if (b - a < 1e-9) { a -= 0.5; b += 0.5; }
    const p = (b - a) * pad;
    return [Math.pow(10, a - p), Math.pow(10, b + p)];
  }
  if (hi - lo < 1e-12 * Math.max(1, Math.abs(hi))) { const d = Math.max(Math.abs(hi) * 0.05, 0.05); lo -= d; hi += d; }
  const p = (hi - lo) * pad;
  return [lo - p, hi + p];
}

// ---------------------------------------------------------------- plot

export interface AxisSpec {
  label: string;
  kind: ScaleKind;
  /** Fixed domain; default from the data. */
  domain?: [number, number];
  /** Replace the automatic ticks (e.g. category labels). */
  ticks?: Tick[];
  /** Draw grid lines at the major ticks; default true. */
  grid?: boolean;
}

export interface LineStyle {
  colour: string;
  width?: number;
  /** SVG dash array, e.g. '6 4'. */
  dash?: string;
  opacity?: number;
}

export type MarkerShape = 'circle' | 'square' | 'diamond' | 'triangle';

interface LegendEntry { label: string; kind: 'line' | 'band' | 'marker' | 'whisker'; style: LineStyle; marker?: MarkerShape; fillOpacity?: number }

/** 'below' puts the legend under the axis label in two columns (for busy panels). */
export type LegendPosition = 'auto' | 'top-left' | 'top-right' | 'bottom-left' | 'bottom-right' | 'below' | 'none';

export interface PlotOptions {
  width?: number;
  height?: number;
  title?: string;
  x: AxisSpec;
  y: AxisSpec;
  /** Prefix of element ids (unique per figure in one HTML page). */
  idPrefix: string;
  legend?: LegendPosition;
  /** Margins in px; defaults fit tick labels and axis labels. */
  margin?: { left?: number; right?: number; top?: number; bottom?: number };
}

type Layer =
  | { type: 'line'; xs: number[]; ys: number[]; style: LineStyle }
  | { type: 'band'; xs: number[]; lo: number[]; hi: number[]; colour: string; opacity: number }
  | { type: 'points'; xs: number[]; ys: number[]; colour: string; shape: MarkerShape; size: number; hollow: boolean }
  | { type: 'errorbars'; xs: number[]; lo: number[]; hi: number[]; colour: string; width: number; cap: number; horizontal: boolean; ys?: number[] }
  | { type: 'hline'; y: number; style: LineStyle; label?: string; labelSide: 'left' | 'right'; labelAbove: boolean }
  | { type: 'vline'; x: number; style: LineStyle; label?: string; labelTop: boolean }
  | { type: 'vspan'; x0: number; x1: number; colour: string; opacity: number; label?: string }
  | { type: 'hspan'; y0: number; y1: number; colour: string; opacity: number }
  | { type: 'text'; x: number; y: number; text: string; options: TextOptions; dataCoords: boolean };

const TICK_FONT = 14;
const LABEL_FONT = 16;
const TITLE_FONT = 17;
const LEGEND_FONT = 13.5;

export class Plot {
  readonly width: number;
  readonly height: number;
  private readonly layers: Layer[] = [];
  private readonly legendEntries: LegendEntry[] = [];
  private readonly notes: string[] = [];
  constructor(readonly options: PlotOptions) {
    this.width = options.width ?? 760;
    this.height = options.height ?? 500;
  }

  line(xs: number[], ys: number[], style: LineStyle, legend?: string): this {
    this.layers.push({ type: 'line', xs, ys, style });
    if (legend) this.legendEntries.push({ label: legend, kind: 'line', style });
    return this;
  }
  band(xs: number[], lo: number[], hi: number[], colour: string, legend?: string, opacity = 0.2): this {
    this.layers.push({ type: 'band', xs, lo, hi, colour, opacity });
    if (legend) this.legendEntries.push({ label: legend, kind: 'band', style: { colour }, fillOpacity: opacity });
    return this;
  }
  points(xs: number[], ys: number[], colour: string, legend?: string, shape: MarkerShape = 'circle', size = 3.2, hollow = false): this {
    this.layers.push({ type: 'points', xs, ys, colour, shape, size, hollow });
    if (legend) this.legendEntries.push({ label: legend, kind: 'marker', style: { colour }, marker: shape });
    return this;
  }
  /** Vertical error bars at xs from lo to hi. */
  errorBars(xs: number[], lo: number[], hi: number[], colour: string, width = 1.5, cap = 4, legend?: string): this {
    this.layers.push({ type: 'errorbars', xs, lo, hi, colour, width, cap, horizontal: false });
    if (legend) this.legendEntries.push({ label: legend, kind: 'whisker', style: { colour, width } });
    return this;
  }
  /** Horizontal error bars at ys from lo to hi (x values). */
  horizontalErrorBars(ys: number[], lo: number[], hi: number[], colour: string, width = 1.5, cap = 4, legend?: string): this {
    this.layers.push({ type: 'errorbars', xs: [], ys, lo, hi, colour, width, cap, horizontal: true });
    if (legend) this.legendEntries.push({ label: legend, kind: 'whisker', style: { colour, width } });
    return this;
  }
  hline(y: number, style: LineStyle, label?: string, labelSide: 'left' | 'right' = 'right', labelAbove = true, legend?: string): this {
    this.layers.push({ type: 'hline', y, style, label, labelSide, labelAbove });
    if (legend) this.legendEntries.push({ label: legend, kind: 'line', style });
    return this;
  }
  vline(x: number, style: LineStyle, label?: string, labelTop = true, legend?: string): this {
    this.layers.push({ type: 'vline', x, style, label, labelTop });
    if (legend) this.legendEntries.push({ label: legend, kind: 'line', style });
    return this;
  }
  vspan(x0: number, x1: number, colour: string, opacity = 0.08, legend?: string, label?: string): this {
    this.layers.push({ type: 'vspan', x0, x1, colour, opacity, label });
    if (legend) this.legendEntries.push({ label: legend, kind: 'band', style: { colour }, fillOpacity: Math.max(opacity, 0.12) });
    return this;
  }
  hspan(y0: number, y1: number, colour: string, opacity = 0.12): this {
    this.layers.push({ type: 'hspan', y0, y1, colour, opacity });
    return this;
  }
  /** Text in data coordinates (or in px from the panel's top-left when dataCoords is false). */
  text(x: number, y: number, text: string, options: TextOptions = {}, dataCoords = true): this {
    this.layers.push({ type: 'text', x, y, text, options, dataCoords });
    return this;
  }
  legendOnly(label: string, kind: LegendEntry['kind'], style: LineStyle, marker?: MarkerShape): this {
    this.legendEntries.push({ label, kind, style, marker });
    return this;
  }
  /** A note printed inside the panel (e.g. "no interval: 1 cluster"). */
  note(text: string): this { this.notes.push(text); return this; }

  private dataValues(axis: 'x' | 'y'): number[] {
    const out: number[] = [];
    for (const l of this.layers) {
      switch (l.type) {
        case 'line': out.push(...(axis === 'x' ? l.xs : l.ys)); break;
        case 'points': out.push(...(axis === 'x' ? l.xs : l.ys)); break;
        case 'band': out.push(...(axis === 'x' ? l.xs : [...l.lo, ...l.hi])); break;
        case 'errorbars':
          if (l.horizontal) out.push(...(axis === 'x' ? [...l.lo, ...l.hi] : l.ys ?? []));
          else out.push(...(axis === 'x' ? l.xs : [...l.lo, ...l.hi]));
          break;
        case 'hline': if (axis === 'y') out.push(l.y); break;
        case 'vline': if (axis === 'x') out.push(l.x); break;
        case 'vspan': if (axis === 'x') out.push(l.x0, l.x1); break;
        case 'hspan': if (axis === 'y') out.push(l.y0, l.y1); break;
        default: break;
      }
    }
    return out;
  }

  toSvg(): string {
    const o = this.options;
    const W = this.width, H = this.height;
    const xDomain = o.x.domain ?? autoDomain(this.dataValues('x'), o.x.kind, o.x.kind === 'log' ? 0.03 : 0.04);
    const yDomain = o.y.domain ?? autoDomain(this.dataValues('y'), o.y.kind, o.y.kind === 'log' ? 0.05 : 0.06);
    // provisional y ticks to size the left margin
    const yTicksProbe = o.y.ticks ?? new Scale(o.y.kind, yDomain, [1, 0]).ticks();
    const maxYLabel = Math.max(0, ...yTicksProbe.filter((t) => t.label).map((t) => textWidth(t.label, TICK_FONT)));
    const left = o.margin?.left ?? Math.ceil(maxYLabel + 12 + LABEL_FONT * 1.9);
    const right = o.margin?.right ?? 22;
    const top = o.margin?.top ?? (o.title ? 38 : 16);
    const bottom = o.margin?.bottom ?? 58;
    const px0 = left, px1 = W - right, py0 = top, py1 = H - bottom;
    const xs = new Scale(o.x.kind, xDomain, [px0, px1]);
    const ys = new Scale(o.y.kind, yDomain, [py1, py0]);
    const clip = `${o.idPrefix}-clip`;
    const parts: string[] = [];
    parts.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}" font-family="${escapeXml(FONT_FAMILY)}">`);
    parts.push(`<defs><clipPath id="${clip}"><rect x="${c(px0)}" y="${c(py0)}" width="${c(px1 - px0)}" height="${c(py1 - py0)}"/></clipPath></defs>`);
    parts.push(`<rect x="0" y="0" width="${W}" height="${H}" fill="#ffffff"/>`);
    if (o.title) parts.push(svgText(px0, 24, o.title, { size: TITLE_FONT, weight: 'bold' }));

    // grid and ticks
    const xTicks = (o.x.ticks ?? xs.ticks()).filter((t) => xs.contains(t.value));
    const yTicks = (o.y.ticks ?? ys.ticks()).filter((t) => ys.contains(t.value));
    const grid: string[] = [];
    const tickMarks: string[] = [];
    const tickLabels: string[] = [];
    for (const t of xTicks) {
      const x = xs.map(t.value);
      if (t.major && o.x.grid !== false) grid.push(`M${c(x)} ${c(py0)}V${c(py1)}`);
      const len = t.major ? 6 : 3.5;
      tickMarks.push(`M${c(x)} ${c(py1)}v${-len}M${c(x)} ${c(py0)}v${len}`);
      if (t.label) tickLabels.push(svgText(x, py1 + 19, t.label, { size: TICK_FONT, anchor: 'middle' }));
    }
    for (const t of yTicks) {
      const y = ys.map(t.value);
      if (t.major && o.y.grid !== false) grid.push(`M${c(px0)} ${c(y)}H${c(px1)}`);
      const len = t.major ? 6 : 3.5;
      tickMarks.push(`M${c(px0)} ${c(y)}h${len}M${c(px1)} ${c(y)}h${-len}`);
      if (t.label) tickLabels.push(svgText(px0 - 8, y, t.label, { size: TICK_FONT, anchor: 'end', dyEm: 0.35 }));
    }
    if (grid.length) parts.push(`<path d="${grid.join('')}" stroke="#e3e3e3" stroke-width="1" fill="none"/>`);

    // layers, clipped to the panel
    const body: string[] = [];
    const labels: string[] = [];
    const okX = (v: number) => Number.isFinite(v) && (o.x.kind === 'linear' || v > 0);
    const okY = (v: number) => Number.isFinite(v) && (o.y.kind === 'linear' || v > 0);
    const markerPts: [number, number][] = [];
    for (const l of this.layers) {
      if (l.type === 'vspan') {
        if (!okX(l.x0) || !okX(l.x1)) continue;
        const a = xs.map(l.x0), b = xs.map(l.x1);
        body.push(`<rect x="${c(Math.min(a, b))}" y="${c(py0)}" width="${c(Math.abs(b - a))}" height="${c(py1 - py0)}" fill="${l.colour}" fill-opacity="${l.opacity}"/>`);
        if (l.label) labels.push(svgText((a + b) / 2, py0 + 15, l.label, { size: LEGEND_FONT - 1, anchor: 'middle', colour: '#444' }));
      } else if (l.type === 'hspan') {
        if (!okY(l.y0) || !okY(l.y1)) continue;
        const a = ys.map(l.y0), b = ys.map(l.y1);
        body.push(`<rect x="${c(px0)}" y="${c(Math.min(a, b))}" width="${c(px1 - px0)}" height="${c(Math.abs(b - a))}" fill="${l.colour}" fill-opacity="${l.opacity}"/>`);
      } else if (l.type === 'band') {
        // split into runs of valid points
        let run: number[] = [];
        const flush = () => {
          if (run.length >= 2) {
            const up = run.map((i) => `${c(xs.map(l.xs[i]))} ${c(ys.map(l.hi[i]))}`);
            const dn = run.slice().reverse().map((i) => `${c(xs.map(l.xs[i]))} ${c(ys.map(l.lo[i]))}`);
            body.push(`<path d="M${up.join('L')}L${dn.join('L')}Z" fill="${l.colour}" fill-opacity="${l.opacity}" stroke="none"/>`);
          }
          run = [];
        };
        for (let i = 0; i < l.xs.length; i++) { if (okX(l.xs[i]) && okY(l.lo[i]) && okY(l.hi[i])) run.push(i); else flush(); }
        flush();
      } else if (l.type === 'line') {
        const segs: string[] = [];
        let open = false;
        for (let i = 0; i < l.xs.length; i++) {
          if (!okX(l.xs[i]) || !okY(l.ys[i])) { open = false; continue; }
          segs.push(`${open ? 'L' : 'M'}${c(xs.map(l.xs[i]))} ${c(ys.map(l.ys[i]))}`);
          open = true;
        }
        if (segs.length) body.push(`<path d="${segs.join('')}" ${strokeAttrs(l.style, 2)} fill="none" stroke-linejoin="round" stroke-linecap="round"/>`);
      } else if (l.type === 'points') {
        for (let i = 0; i < l.xs.length; i++) {
          if (!okX(l.xs[i]) || !okY(l.ys[i])) continue;
          const x = xs.map(l.xs[i]), y = ys.map(l.ys[i]);
          markerPts.push([x, y]);
          body.push(marker(l.shape, x, y, l.size, l.colour, l.hollow));
        }
      } else if (l.type === 'errorbars') {
        const d: string[] = [];
        const n = l.horizontal ? (l.ys ?? []).length : l.xs.length;
        for (let i = 0; i < n; i++) {
          if (l.horizontal) {
            const yv = l.ys![i];
            if (!okY(yv) || !okX(l.lo[i]) || !okX(l.hi[i])) continue;
            const y = ys.map(yv), a = xs.map(l.lo[i]), b = xs.map(l.hi[i]);
            d.push(`M${c(a)} ${c(y)}H${c(b)}M${c(a)} ${c(y - l.cap)}v${c(2 * l.cap)}M${c(b)} ${c(y - l.cap)}v${c(2 * l.cap)}`);
          } else {
            if (!okX(l.xs[i]) || !okY(l.lo[i]) || !okY(l.hi[i])) continue;
            const x = xs.map(l.xs[i]), a = ys.map(l.lo[i]), b = ys.map(l.hi[i]);
            d.push(`M${c(x)} ${c(a)}V${c(b)}M${c(x - l.cap)} ${c(a)}h${c(2 * l.cap)}M${c(x - l.cap)} ${c(b)}h${c(2 * l.cap)}`);
          }
        }
        if (d.length) body.push(`<path d="${d.join('')}" stroke="${l.colour}" stroke-width="${l.width}" fill="none"/>`);
      } else if (l.type === 'hline') {
        if (!okY(l.y) || !ys.contains(l.y)) continue;
        const y = ys.map(l.y);
        body.push(`<path d="M${c(px0)} ${c(y)}H${c(px1)}" ${strokeAttrs(l.style, 1.5)} fill="none"/>`);
        if (l.label) {
          const lx = l.labelSide === 'right' ? px1 - 6 : px0 + 6;
          labels.push(svgText(lx, l.labelAbove ? y - 5 : y + 15, l.label, { size: LEGEND_FONT - 0.5, anchor: l.labelSide === 'right' ? 'end' : 'start', colour: l.style.colour, halo: true }));
        }
      } else if (l.type === 'vline') {
        if (!okX(l.x) || !xs.contains(l.x)) continue;
        const x = xs.map(l.x);
        body.push(`<path d="M${c(x)} ${c(py0)}V${c(py1)}" ${strokeAttrs(l.style, 1.5)} fill="none"/>`);
        if (l.label) labels.push(svgText(x + 4, l.labelTop ? py0 + 15 : py1 - 6, l.label, { size: LEGEND_FONT - 0.5, colour: l.style.colour, halo: true }));
      } else if (l.type === 'text') {
        if (l.dataCoords) {
          if (!okX(l.x) || !okY(l.y)) continue;
          labels.push(svgText(xs.map(l.x), ys.map(l.y), l.text, l.options));
        } else labels.push(svgText(px0 + l.x, py0 + l.y, l.text, l.options));
      }
    }
    parts.push(`<g clip-path="url(#${clip})">${body.join('')}</g>`);
    parts.push(`<rect x="${c(px0)}" y="${c(py0)}" width="${c(px1 - px0)}" height="${c(py1 - py0)}" fill="none" stroke="#222" stroke-width="1.2"/>`);
    parts.push(`<path d="${tickMarks.join('')}" stroke="#222" stroke-width="1.1" fill="none"/>`);
    parts.push(...tickLabels);
    parts.push(...labels);
    // axis labels
    if (o.x.label) parts.push(svgText((px0 + px1) / 2, H - 14, o.x.label, { size: LABEL_FONT, anchor: 'middle' }));
    if (o.y.label) parts.push(svgText(20, (py0 + py1) / 2, o.y.label, { size: LABEL_FONT, anchor: 'middle', rotate: -90, dyEm: 0 }));
    // below the axis label: legend (if 'below') and notes; the picture grows to hold them
    let extra = 0;
    const pos = o.legend ?? 'auto';
    if (pos === 'below' && this.legendEntries.length) {
      const { svg, height } = this.legendBelow(px0, px1, H + 4);
      parts.push(svg);
      extra += height + 4;
    } else if (pos !== 'none' && this.legendEntries.length) parts.push(this.legendSvg(pos, px0, px1, py0, py1, xs, ys));
    for (const n of this.notes) {
      parts.push(svgText(px0, H + extra + 16, n, { size: LEGEND_FONT, colour: '#a00000' }));
      extra += 20;
    }
    if (extra > 0) {
      parts[0] = `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H + extra + 6}" viewBox="0 0 ${W} ${H + extra + 6}" font-family="${escapeXml(FONT_FAMILY)}">`;
      parts[2] = `<rect x="0" y="0" width="${W}" height="${H + extra + 6}" fill="#ffffff"/>`;
    }
    parts.push('</svg>');
    return parts.join('\n');
  }

  private legendSvg(pos: LegendPosition, px0: number, px1: number, py0: number, py1: number, xs: Scale, ys: Scale): string {
    const lineH = 20, pad = 8, sw = 28;
    const w = Math.ceil(Math.max(...this.legendEntries.map((e) => textWidth(e.label, LEGEND_FONT))) + sw + 3 * pad);
    const h = this.legendEntries.length * lineH + pad * 1.2;
    const corners = {
      'top-left': [px0 + 10, py0 + 10], 'top-right': [px1 - 10 - w, py0 + 10],
      'bottom-left': [px0 + 10, py1 - 10 - h], 'bottom-right': [px1 - 10 - w, py1 - 10 - h],
    } as const;
    let chosen: keyof typeof corners;
    if (pos === 'auto') {
      // the corner whose box covers the fewest sampled data points
      const samples = this.samplePoints(xs, ys);
      let best = Infinity;
      chosen = 'top-left';
      for (const k of ['top-left', 'top-right', 'bottom-right', 'bottom-left'] as const) {
        const [bx, by] = corners[k];
        let n = 0;
        for (const [x, y] of samples) if (x >= bx - 4 && x <= bx + w + 4 && y >= by - 4 && y <= by + h + 4) n++;
        if (n < best) { best = n; chosen = k; }
      }
    } else chosen = pos as keyof typeof corners;
    const [bx, by] = corners[chosen];
    const out: string[] = [`<g class="legend"><rect x="${c(bx)}" y="${c(by)}" width="${w}" height="${c(h)}" fill="#ffffff" fill-opacity="0.92" stroke="#999" stroke-width="0.8" rx="3"/>`];
    this.legendEntries.forEach((e, i) => {
      const y = by + pad + i * lineH + lineH / 2;
      const x = bx + pad;
      out.push(legendSymbol(e, x, y, sw));
      out.push(svgText(x + sw + pad, y, e.label, { size: LEGEND_FONT, dyEm: 0.35 }));
    });
    out.push('</g>');
    return out.join('');
  }

  private legendBelow(px0: number, px1: number, y0: number): { svg: string; height: number } {
    const lineH = 20, sw = 28, gap = 8;
    const colW = (px1 - px0) / 2;
    const twoCols = this.legendEntries.every((e) => textWidth(e.label, LEGEND_FONT) + sw + 2 * gap < colW);
    const cols = twoCols ? 2 : 1;
    const rows = Math.ceil(this.legendEntries.length / cols);
    const out: string[] = ['<g class="legend">'];
    this.legendEntries.forEach((e, i) => {
      const col = twoCols ? i % 2 : 0, row = twoCols ? Math.floor(i / 2) : i;
      const x = px0 + col * colW, y = y0 + row * lineH + lineH / 2;
      out.push(legendSymbol(e, x, y, sw));
      out.push(svgText(x + sw + gap, y, e.label, { size: LEGEND_FONT, dyEm: 0.35 }));
    });
    out.push('</g>');
    return { svg: out.join(''), height: rows * lineH };
  }

  private samplePoints(xs: Scale, ys: Scale): [number, number][] {
    const pts: [number, number][] = [];
    const add = (x: number, y: number) => {
      if (!Number.isFinite(x) || !Number.isFinite(y)) return;
      if (xs.kind === 'log' && !(x > 0)) return;
      if (ys.kind === 'log' && !(y > 0)) return;
      pts.push([xs.map(x), ys.map(y)]);
    };
    for (const l of this.layers) {
      if (l.type === 'line' || l.type === 'points') {
        for (let i = 0; i < l.xs.length; i++) {
          add(l.xs[i], l.ys[i]);
          if (l.type === 'line' && i > 0) add((l.xs[i] + l.xs[i - 1]) / 2, (l.ys[i] + l.ys[i - 1]) / 2);
        }
      } else if (l.type === 'band') {
        for (let i = 0; i < l.xs.length; i++) { add(l.xs[i], l.lo[i]); add(l.xs[i], l.hi[i]); add(l.xs[i], (l.lo[i] + l.hi[i]) / 2); }
      } else if (l.type === 'errorbars') {
        const n = l.horizontal ? (l.ys ?? []).length : l.xs.length;
        for (let i = 0; i < n; i++) {
          for (let t = 0; t <= 4; t++) {
            const v = l.lo[i] + (t / 4) * (l.hi[i] - l.lo[i]);
            if (l.horizontal) add(v, l.ys![i]); else add(l.xs[i], v);
          }
        }
      } else if (l.type === 'hline') {
        for (let t = 0; t <= 20; t++) pts.push([xs.range[0] + (t / 20) * (xs.range[1] - xs.range[0]), ys.map(l.y)]);
      } else if (l.type === 'vline') {
        for (let t = 0; t <= 20; t++) pts.push([xs.map(l.x), ys.range[0] + (t / 20) * (ys.range[1] - ys.range[0])]);
      }
    }
    return pts;
  }
}

function legendSymbol(e: LegendEntry, x: number, y: number, sw: number): string {
  if (e.kind === 'line') return `<path d="M${c(x)} ${c(y)}h${sw}" ${strokeAttrs(e.style, 2)} fill="none"/>`;
  if (e.kind === 'band') return `<rect x="${c(x)}" y="${c(y - 6)}" width="${sw}" height="12" fill="${e.style.colour}" fill-opacity="${e.fillOpacity ?? 0.2}"/>`;
  if (e.kind === 'marker') return marker(e.marker ?? 'circle', x + sw / 2, y, 3.6, e.style.colour, false);
  return `<path d="M${c(x)} ${c(y)}h${sw}M${c(x)} ${c(y - 4)}v8M${c(x + sw)} ${c(y - 4)}v8" stroke="${e.style.colour}" stroke-width="${e.style.width ?? 1.5}" fill="none"/>`;
}

function strokeAttrs(s: LineStyle, defaultWidth: number): string {
  let a = `stroke="${s.colour}" stroke-width="${s.width ?? defaultWidth}"`;
  if (s.dash) a += ` stroke-dasharray="${s.dash}"`;
  if (s.opacity !== undefined) a += ` stroke-opacity="${s.opacity}"`;
  return a;
}

function marker(shape: MarkerShape, x: number, y: number, r: number, colour: string, hollow: boolean): string {
  const fill = hollow ? '#ffffff' : colour;
  const st = `fill="${fill}" stroke="${hollow ? colour : '#ffffff'}" stroke-width="${hollow ? 1.4 : 0.8}"`;
  switch (shape) {
    case 'square': return `<rect x="${c(x - r)}" y="${c(y - r)}" width="${c(2 * r)}" height="${c(2 * r)}" ${st}/>`;
    case 'diamond': { const q = r * 1.3; return `<path d="M${c(x)} ${c(y - q)}L${c(x + q)} ${c(y)}L${c(x)} ${c(y + q)}L${c(x - q)} ${c(y)}Z" ${st}/>`; }
    case 'triangle': { const q = r * 1.3; return `<path d="M${c(x)} ${c(y - q)}L${c(x + q)} ${c(y + 0.75 * q)}L${c(x - q)} ${c(y + 0.75 * q)}Z" ${st}/>`; }
    default: return `<circle cx="${c(x)}" cy="${c(y)}" r="${c(r)}" ${st}/>`;
  }
}
