/**
 * The figures of the ensemble report, built with svg-plot.ts from an
 * EnsembleAnalysis (coordinator/stats) and the per-cluster curves of the runs
 * (extractEnsembleData). Each builder returns a Figure, or a Figure whose
 * `note` says why it could not be drawn (it then still has an SVG panel with
 * that note, so a report never has a hole without an explanation).
 */
import type { EnsembleAnalysis, EstimatorName } from '../stats/analyze-ensemble.js';
import type { EnsembleData, LogLogData } from '../stats/ensemble-data.js';
import type { PointSet } from '../snapshot/cluster-snapshot.js';
import { encodePng, rasterizeCluster, type StridedPoints } from '../render/cluster-picture.js';
import { buildPalette } from '../render/palette.js';
import { AXIS, estimateText, fmt, fmtAbscissa, labelOf, levelPercent, shownInterval, Y_AXIS } from './labels.js';
import { COLOURS, escapeXml, FONT_FAMILY, niceStep, Plot, svgText, type Tick } from './svg-plot.js';

export interface Figure {
  /** File stem, e.g. 'radius-of-gyration' (plots/<name>.svg and .png). */
  name: string;
  title: string;
  caption: string;
  svg: string;
  /** Set when the figure could not show its content; the SVG then carries the note. */
  note: string | null;
}

const FILE_NAMES: Record<EstimatorName, string> = {
  radiusOfGyration: 'radius-of-gyration',
  maxRadius: 'max-radius',
  massRadius: 'mass-radius',
};

/** A panel with only a message in it. */
export function emptyFigure(name: string, title: string, message: string): Figure {
  const p = new Plot({ idPrefix: name, title, x: { label: '', kind: 'linear', domain: [0, 1], ticks: [] }, y: { label: '', kind: 'linear', domain: [0, 1], ticks: [] }, height: 220, legend: 'none' });
  p.text(0.5, 0.5, message.length > 100 ? message.slice(0, 97) + '...' : message, { size: 14, anchor: 'middle', colour: '#a00000' });
  return { name, title, caption: message, svg: p.toSvg(), note: message };
}

function columnStats(d: LogLogData): { gm: number[]; lo: number[]; hi: number[]; sd: number[] } {
  const k = d.rows, s = d.columns;
  const gm: number[] = [], lo: number[] = [], hi: number[] = [], sd: number[] = [];
  for (let j = 0; j < s; j++) {
    const m = d.mean[j];
    let v = 0;
    for (let r = 0; r < k; r++) { const e = d.y[r * s + j] - m; v += e * e; }
    const sdj = k > 1 ? Math.sqrt(v / (k - 1)) : NaN;
    gm.push(Math.exp(m)); sd.push(sdj);
    lo.push(Math.exp(m - sdj)); hi.push(Math.exp(m + sdj));
  }
  return { gm, lo, hi, sd };
}

/** Log-log plot of one estimator's curve with its fitted power law and fit window. */
export function estimatorFigure(analysis: EnsembleAnalysis, data: EnsembleData | null, name: EstimatorName): Figure {
  const est = analysis.estimators[name];
  const lab = labelOf(name);
  const file = FILE_NAMES[name];
  const title = `${lab.rich}: ${name === 'massRadius' ? 'mass against distance from the seed, final clusters' : 'growth of the cluster radius with size'}`;
  const d = data ? (name === 'massRadius' ? data.massRadius : data[name]) : null;
  if (!d || d.columns === 0) {
    return emptyFigure(file, title, `no ${lab.plain} curve to draw: ${!data ? 'the run results could not be read' : est.reason ?? 'no usable points'}`);
  }
  const isMass = name === 'massRadius';
  const p = new Plot({
    idPrefix: file, title,
    x: { label: isMass ? AXIS.radius : AXIS.size, kind: 'log' },
    y: { label: Y_AXIS[name], kind: 'log' },
  });
  const ab = Array.from(d.abscissa);
  const st = columnStats(d);
  const win = est.fitWindow;
  if (win && win.firstUsed !== null && win.lastUsed !== null) {
    p.vspan(win.firstUsed, win.lastUsed, COLOURS.grey, 0.1, `fit window: ${win.variable} = ${fmtAbscissa(win.firstUsed)} to ${fmtAbscissa(win.lastUsed)} (${win.points} points, ${win.source})`);
  }
  if (d.rows > 1) p.band(ab, st.lo, st.hi, lab.colour, `spread across clusters (±1 s.d. of ln ${isMass ? 'M' : 'R'})`, 0.18);
  if (est.available && est.slope !== null && est.amplitude !== null && win && win.firstUsed !== null && win.lastUsed !== null) {
    const A = est.amplitude, s = est.slope;
    const f = (v: number) => A * Math.pow(v, s);
    // dashed continuation over the whole range, solid over the window
    const all = [ab[0], ab[ab.length - 1]];
    p.line(all, all.map(f), { colour: COLOURS.black, width: 1, dash: '5 4', opacity: 0.6 });
    const inside = [win.firstUsed, win.lastUsed];
    const fitLabel = `fit ${isMass ? 'M = A r^{D}' : 'R = A N^{1/D}'}: ${estimateText(est.D, est.interval)}`;
    p.line(inside, inside.map(f), { colour: COLOURS.black, width: 2.4, opacity: 0.85 }, fitLabel);
  } else {
    p.note(`no fit: ${est.reason ?? 'estimator unavailable'}`);
  }
  p.line(ab, st.gm, { colour: lab.colour, width: 1.2, opacity: 0.7 });
  p.points(ab, st.gm, lab.colour, `geometric mean of ${d.rows} cluster${d.rows === 1 ? '' : 's'}`, lab.marker, 2.6);
  if (est.available && !shownInterval(est.interval).range) p.note(`no interval: ${est.interval.notes[0] ?? est.interval.status}`);
  const caption = `${lab.plain} on log-log axes: points are the ensemble geometric mean (mean of the logarithm) over ${d.rows} cluster(s)` +
    (d.rows > 1 ? ', the shaded band the cluster-to-cluster spread (±1 standard deviation of the logarithm)' : '') +
    '. The solid black line is the fitted power law over the fit window (grey), the dashed line its continuation.' +
    (est.available ? ` ${estimateText(est.D, est.interval)}.` : ` Not available: ${est.reason}.`);
  return { name: file, title, caption, svg: p.toSvg(), note: est.available ? null : est.reason };
}

function boundLines(p: Plot, analysis: EnsembleAnalysis, domain: [number, number] | null, horizontal: boolean): string[] {
  const outside: string[] = [];
  const ref = analysis.consistency.reference;
  const inside = (v: number) => !domain || (v >= domain[0] && v <= domain[1]);
  const draw = (v: number, style: { colour: string; width: number; dash: string }, label: string) => {
    if (horizontal) p.hline(v, style, undefined, 'right', true, label);
    else p.vline(v, style, undefined, true, label);
  };
  if (ref) {
    const label = `published D = ${ref.D} (${shortSource(ref.source)}; not a fit input)`;
    if (inside(ref.D)) draw(ref.D, { colour: COLOURS.black, width: 1.5, dash: '8 4' }, label);
    else outside.push(`${label}: off the plotted range`);
  }
  for (const b of analysis.consistency.bounds) {
    const kesten = b.side === 'lower' && b.value === 1.5 && /Kesten/i.test(b.rule);
    const label = kesten ? "Kesten's bound D ≥ 3/2" : `${b.side === 'lower' ? 'lower' : 'upper'} bound D ${b.side === 'lower' ? '≥' : '≤'} ${b.value}`;
    const dash = b.side === 'lower' ? '2 3' : '7 3 1.5 3';
    if (inside(b.value)) draw(b.value, { colour: COLOURS.grey, width: 1.3, dash }, label);
    else outside.push(`${label}: off the plotted range`);
  }
  return outside;
}

/** "Menshutin, Shchur & Vinokur 2008, Physica A ..." -> "Menshutin et al. 2008". */
function shortSource(source: string): string {
  const m = /^([A-Z][^\s,&]+)[^0-9]*?((?:19|20)\d\d)/.exec(source);
  if (!m) return source.length > 40 ? source.slice(0, 37) + '...' : source;
  const many = /,|&| and /.test(source.slice(0, source.indexOf(m[2])));
  return `${m[1]}${many ? ' et al.' : ''} ${m[2]}`;
}

/** Local slopes (effective D) against N or r, with their bootstrap bands. */
export function localSlopesFigure(analysis: EnsembleAnalysis, variable: 'N' | 'r'): Figure {
  const names: EstimatorName[] = variable === 'N' ? ['radiusOfGyration', 'maxRadius'] : ['massRadius'];
  const file = variable === 'N' ? 'local-slopes-size' : 'local-slopes-radius';
  const title = variable === 'N' ? 'Local slopes: effective D against cluster size' : 'Local slope of M(r): effective D against distance';
  const series = names.map((n) => ({ n, est: analysis.estimators[n] })).filter((s) => s.est.available && s.est.localSlopes && s.est.localSlopes.points.some((q) => q.D !== null));
  if (series.length === 0) {
    const why = names.map((n) => `${labelOf(n).plain}: ${analysis.estimators[n].available ? (analysis.options.localSlopes ? 'too few points for a sliding window' : 'local slopes switched off') : analysis.estimators[n].reason}`).join('; ');
    return emptyFigure(file, title, `no local slopes: ${why}`);
  }
  // y range from the point values and the reference lines; bands are clipped to it
  const values: number[] = [];
  for (const s of series) for (const q of s.est.localSlopes!.points) if (q.D !== null) values.push(q.D);
  const ref = analysis.consistency.reference;
  const lines = [...(ref ? [ref.D] : []), ...analysis.consistency.bounds.map((b) => b.value)];
  let lo = Math.min(...values), hi = Math.max(...values);
  for (const v of lines) if (v > lo - 0.35 && v < hi + 0.35) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
  for (const s of series) for (const q of s.est.localSlopes!.points) {
    const r = q.bca ?? q.percentile;
    if (r) { lo = Math.min(lo, Math.max(r[0], lo - 0.15)); hi = Math.max(hi, Math.min(r[1], hi + 0.15)); }
  }
  const padY = Math.max(0.04, (hi - lo) * 0.08);
  const domain: [number, number] = [lo - padY, hi + padY];
  const p = new Plot({ idPrefix: file, title, x: { label: variable === 'N' ? AXIS.size : AXIS.radius, kind: 'log' }, y: { label: AXIS.localD, kind: 'linear', domain }, legend: 'below' });
  let width: number | null = null;
  let bandKind = '';
  for (const s of series) {
    const lab = labelOf(s.n);
    const pts = s.est.localSlopes!.points;
    width = s.est.localSlopes!.widthDecades;
    const xs = pts.map((q) => q.at);
    const ds = pts.map((q) => q.D ?? NaN);
    const withBand = pts.some((q) => q.bca ?? q.percentile);
    if (withBand) {
      const kind = pts.some((q) => q.bca) ? 'BCa' : 'percentile';
      bandKind = kind;
      p.band(xs, pts.map((q) => (q.bca ?? q.percentile)?.[0] ?? NaN), pts.map((q) => (q.bca ?? q.percentile)?.[1] ?? NaN), lab.colour, `${lab.rich}: ${levelPercent(s.est.interval)} ${kind} band`, 0.2);
    }
    p.line(xs, ds, { colour: lab.colour, width: 2 }, `${lab.rich}: local slope`);
    const w = s.est.fitWindow;
    if (s.est.D !== null && w && w.firstUsed !== null && w.lastUsed !== null) {
      p.line([w.firstUsed, w.lastUsed], [s.est.D, s.est.D], { colour: lab.colour, width: 1.3, dash: '1 3' });
    }
    if (!withBand) p.note(`${lab.plain}: no bands (${s.est.interval.notes[0] ?? s.est.interval.status})`);
  }
  const off = boundLines(p, analysis, domain, true);
  for (const t of off) p.note(t);
  const caption = `Effective dimension from OLS fits over a sliding window of ${width ?? '?'} decade(s) of ${variable === 'N' ? 'N' : 'r'}, centred at each point` +
    (bandKind ? `; shaded: ${bandKind} bootstrap band over clusters` : '') +
    '. Dotted coloured segments: D of the global fit, drawn over its fit window.' +
    (ref ? ` Dashed black: the published value ${ref.D}, source: ${ref.source}; shown for comparison and not used in any fit.` : '') +
    (analysis.consistency.bounds.length ? ' Grey dotted (lower) and dash-dotted (upper): rigorous bounds.' : '') + ' A curve that has levelled off at large sizes means D has settled.';
  return { name: file, title, caption, svg: p.toSvg(), note: null };
}

interface ComparisonRow { name: string; D: number | null; percentile: [number, number] | null; bca: [number, number] | null; why: string | null }

/** Dot-and-whisker chart of every estimate with its percentile and BCa intervals. */
export function comparisonFigure(analysis: EnsembleAnalysis): Figure {
  const file = 'estimator-comparison';
  const title = 'Estimators of D side by side';
  const rows: ComparisonRow[] = [];
  for (const n of ['radiusOfGyration', 'maxRadius', 'massRadius'] as const) {
    const e = analysis.estimators[n];
    if (e.reason === 'not requested') continue;
    rows.push({ name: n, D: e.D, percentile: e.interval.percentile, bca: e.interval.bca, why: e.available ? (e.interval.percentile || e.interval.bca ? null : `no interval: ${e.interval.status.replace(/-/g, ' ')}`) : `not available: ${e.reason}` });
  }
  for (const n of ['radiusOfGyration', 'maxRadius'] as const) {
    const c = analysis.corrections[n];
    if (!c) continue;
    rows.push({ name: `${n}Corrected`, D: c.D.value, percentile: c.D.interval.percentile, bca: c.D.interval.bca, why: c.determined ? (c.D.interval.percentile || c.D.interval.bca ? null : `no interval: ${c.D.interval.status.replace(/-/g, ' ')}`) : `${c.available ? 'not determined' : 'not available'}: ${c.reason}` });
  }
  if (rows.length === 0) return emptyFigure(file, title, 'no estimator was requested');
  const values: number[] = [];
  for (const r of rows) { if (r.D !== null) values.push(r.D); for (const iv of [r.percentile, r.bca]) if (iv) values.push(iv[0], iv[1]); }
  const ref = analysis.consistency.reference;
  if (ref) values.push(ref.D);
  let lo = values.length ? Math.min(...values) : 1, hi = values.length ? Math.max(...values) : 2;
  const pad = Math.max(0.01, (hi - lo) * 0.12);
  lo -= pad; hi += pad;
  // bounds close to the data are drawn; far ones are named in a note
  for (const b of analysis.consistency.bounds) if (b.value > lo - 3 * pad && b.value < hi + 3 * pad) { lo = Math.min(lo, b.value - pad / 2); hi = Math.max(hi, b.value + pad / 2); }
  const n = rows.length;
  const ticks: Tick[] = rows.map((r, i) => ({ value: n - i, label: labelOf(r.name).rich, major: true }));
  const p = new Plot({
    idPrefix: file, title, height: Math.max(300, 120 + 62 * n),
    x: { label: AXIS.dimension, kind: 'linear', domain: [lo, hi] },
    y: { label: 'estimator', kind: 'linear', domain: [0.4, n + 0.6], ticks, grid: false },
    legend: 'below',
  });
  const level = analysis.options.level;
  const pct = `${Number((level * 100).toFixed(1))}%`;
  rows.forEach((r, i) => {
    const y = n - i;
    const lab = labelOf(r.name);
    if (r.percentile) p.horizontalErrorBars([y + 0.14], [r.percentile[0]], [r.percentile[1]], COLOURS.grey, 1.6, 4);
    if (r.bca) p.horizontalErrorBars([y - 0.14], [r.bca[0]], [r.bca[1]], lab.colour, 2.6, 5);
    if (r.D !== null) p.points([r.D], [y], lab.colour, undefined, lab.marker, 5);
    if (r.D !== null) p.text(r.D, y + 0.3, fmt(r.D), { size: 12.5, anchor: 'middle', colour: '#222', halo: true });
    if (r.why) p.text((lo + hi) / 2, y - 0.38, r.why.length > 90 ? r.why.slice(0, 87) + '...' : r.why, { size: 12.5, anchor: 'middle', colour: '#a00000', halo: true });
  });
  p.legendOnly(`${pct} percentile interval (grey, upper whisker)`, 'whisker', { colour: COLOURS.grey, width: 1.6 });
  p.legendOnly(`${pct} BCa interval (colour of the estimator, lower whisker)`, 'whisker', { colour: COLOURS.black, width: 2.6 });
  const off = boundLines(p, analysis, [lo, hi], false);
  for (const t of off) p.note(t);
  const caption = `Each row: the point estimate (marker, value above it), its ${pct} percentile interval (grey, upper whisker) and BCa interval (coloured, lower whisker) from the bootstrap over whole clusters.` +
    (ref ? ` Dashed: published value ${ref.D} ± ${ref.uncertainty}, source: ${ref.source}; not a fit input.` : '') +
    (off.length ? ` ${off.join('; ')}.` : '') + (analysis.consistency.bounds.length ? ' Grey dotted (lower) and dash-dotted (upper): rigorous bounds that fall inside the range.' : '');
  return { name: file, title, caption, svg: p.toSvg(), note: null };
}

/**
 * Compensated plot R / (A N^{1/D}) of the corrections-to-scaling fits that
 * are determined: the points (ensemble geometric mean divided by the fitted
 * leading power law) should follow the fitted correction 1 + B N^{-omega}
 * (line) and approach the reference 1 at large N. Fits that are not
 * determined are not drawn (their A and D are not trusted); they are named
 * with the reason.
 */
export function correctionsFigure(analysis: EnsembleAnalysis, data: EnsembleData | null): Figure {
  const file = 'corrections-to-scaling';
  const title = 'Corrections to scaling: R = A N^{1/D} (1 + B N^{−ω})';
  const names = ['radiusOfGyration', 'maxRadius'] as const;
  if (!analysis.options.corrections) return emptyFigure(file, title, 'the corrections-to-scaling fit was switched off');
  const drawn = names.filter((n) => {
    const c = analysis.corrections[n];
    return c?.determined && c.D.value !== null && c.amplitude.value !== null && c.omega.value !== null && c.correctionAmplitude.value !== null && c.window;
  });
  const why = names.filter((n) => !drawn.includes(n)).map((n) => `${labelOf(n).plain}: ${analysis.corrections[n]?.available ? 'not determined' : 'not available'} (${analysis.corrections[n]?.reason ?? 'not fitted'})`);
  if (drawn.length === 0 || !data) return emptyFigure(file, title, data ? `no determined corrections fit: ${why.join('; ')}` : 'the run results could not be read');
  const p = new Plot({ idPrefix: file, title, x: { label: AXIS.size, kind: 'log' }, y: { label: 'R / (A N^{1/D}) (dimensionless)', kind: 'linear' }, legend: 'below' });
  let xMin = Infinity, xMax = -Infinity;
  for (const n of drawn) {
    const c = analysis.corrections[n]!;
    const d = data[n];
    const lab = labelOf(n);
    const D = c.D.value!, A = c.amplitude.value!, om = c.omega.value!, B = c.correctionAmplitude.value!;
    const w = c.window!;
    const xs: number[] = [], ys: number[] = [];
    for (let j = 0; j < d.columns; j++) {
      const N = d.abscissa[j];
      if (N < w.from * (1 - 1e-9) || N > w.to * (1 + 1e-9)) continue;
      xs.push(N); ys.push(Math.exp(d.mean[j]) / (A * Math.pow(N, 1 / D)));
    }
    if (xs.length === 0) continue;
    xMin = Math.min(xMin, xs[0]); xMax = Math.max(xMax, xs[xs.length - 1]);
    p.points(xs, ys, lab.colour, `${lab.rich}: ensemble geometric mean / (A N^{1/D})`, lab.marker, 2.6);
    const omIv = shownInterval(c.omega.interval);
    const curve = xs.map((N) => 1 + B * Math.pow(N, -om));
    p.line(xs, curve, { colour: lab.colour, width: 2 }, `${lab.rich} fit 1 + B N^{−ω}: ${estimateText(D, c.D.interval)}; ω = ${fmt(om, 3)}${omIv.range ? ` [${fmt(omIv.range[0], 3)}, ${fmt(omIv.range[1], 3)}]` : ''}`);
  }
  if (xMin < xMax) p.line([xMin, xMax], [1, 1], { colour: COLOURS.grey, width: 1, dash: '6 4' }, 'reference 1: the pure power law A N^{1/D}');
  for (const t of why) p.note(t.length > 95 ? t.slice(0, 92) + '...' : t);
  const caption = 'Each curve divided by its fitted leading power law A N^{1/D}: the points should follow the fitted correction 1 + B N^{−ω} (solid line) and approach the dashed reference 1 at large N. ' +
    drawn.map((n) => { const c = analysis.corrections[n]!; return `${labelOf(n).plain}: ${estimateText(c.D.value, c.D.interval)}, ω = ${fmt(c.omega.value, 3)}, over N = ${fmtAbscissa(c.window?.from)} to ${fmtAbscissa(c.window?.to)}`; }).join('; ') + '.' +
    (why.length ? ` Not drawn: ${why.join('; ')}.` : '');
  return { name: file, title, caption, svg: p.toSvg(), note: null };
}

export interface SampleClusterPicture {
  figure: Figure;
  /** The bare cluster raster (PNG). */
  png: Buffer;
}

/** A picture of one cluster: the raster from coordinator/render inside an SVG with a scale bar and a colour key. */
export function clusterFigure(points: PointSet | StridedPoints, runIndex: number | null, pixels = 900): SampleClusterPicture {
  const file = 'sample-cluster';
  const count = 'positions' in points ? points.positions.count : points.count;
  const title = `Sample cluster${runIndex !== null ? ` (run ${runIndex})` : ''}: ${count} particles`;
  const raster = rasterizeCluster(points, { size: pixels, background: 'dark' });
  const png = encodePng(raster);
  const W = 760, top = 34, img = 660, keyH = 70;
  const H = top + img + keyH;
  const x0 = (W - img) / 2;
  const s = img / pixels; // svg units per picture pixel
  const extent = pixels / raster.scale; // particle diameters across the picture
  const bar = niceStep(extent / 5, 1);
  const barPx = bar * raster.scale * s;
  const parts: string[] = [];
  parts.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}" font-family="${escapeXml(FONT_FAMILY)}">`);
  parts.push(`<rect x="0" y="0" width="${W}" height="${H}" fill="#ffffff"/>`);
  parts.push(svgText(x0, 24, title, { size: 17, weight: 'bold' }));
  parts.push(`<image x="${x0}" y="${top}" width="${img}" height="${img}" href="data:image/png;base64,${png.toString('base64')}"/>`);
  const by = top + img - 22;
  parts.push(`<path d="M${x0 + 20} ${by}h${barPx.toFixed(2)}" stroke="#ffffff" stroke-width="4"/>`);
  parts.push(`<path d="M${x0 + 20} ${by - 6}v12M${(x0 + 20 + barPx).toFixed(2)} ${by - 6}v12" stroke="#ffffff" stroke-width="2"/>`);
  parts.push(svgText(x0 + 20, by - 10, `${fmtAbscissa(bar)} particle diameters`, { size: 15, colour: '#ffffff' }));
  // colour key: arrival order
  const lut = buildPalette(64, 0, 1);
  const ky = top + img + 16, kw = 360, kx = (W - kw) / 2;
  for (let i = 0; i < 64; i++) {
    const col = `#${[lut[3 * i], lut[3 * i + 1], lut[3 * i + 2]].map((v) => v.toString(16).padStart(2, '0')).join('')}`;
    parts.push(`<rect x="${(kx + (i * kw) / 64).toFixed(2)}" y="${ky}" width="${(kw / 64 + 0.6).toFixed(2)}" height="14" fill="${col}"/>`);
  }
  parts.push(`<rect x="${kx}" y="${ky}" width="${kw}" height="14" fill="none" stroke="#555" stroke-width="0.8"/>`);
  parts.push(svgText(kx - 8, ky + 12, 'first particle', { size: 13.5, anchor: 'end' }));
  parts.push(svgText(kx + kw + 8, ky + 12, `particle ${count}`, { size: 13.5 }));
  parts.push(svgText(W / 2, ky + 36, 'colour: arrival order; every particle drawn as a disk of diameter 1', { size: 13.5, anchor: 'middle', colour: '#333' }));
  parts.push('</svg>');
  const caption = `One cluster of the ensemble${runIndex !== null ? ` (run index ${runIndex})` : ''}, ${count} particles of diameter 1, coloured by arrival order; the picture is ${fmtAbscissa(extent)} particle diameters across, the white bar ${fmtAbscissa(bar)}.`;
  return { figure: { name: file, title, caption, svg: parts.join('\n'), note: null }, png };
}
