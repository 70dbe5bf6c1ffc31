/**
 * The figures of the report's "Harmonic measure" section, drawn from the
 * summary's HarmonicSection (coordinator/harmonic/harmonic-section-types.ts):
 *
 *   harmonic-tau                 τ(q) at the largest probed size with its band, the bounds
 *   harmonic-f-alpha             f(α) per size with the lines f = α and α = 1/2
 *   harmonic-capacity            capacity against N (log–log) with the fitted power law
 *   harmonic-capacity-increment  mean Δ ln cap/ΔN against Z(3) (log–log), fitted slope and slope 1
 *   harmonic-electrostatic       τ(3) beside the mass-based D
 *   harmonic-measure             a cluster coloured by harmonic measure (log scale)
 *
 * Sign convention (coordinator/harmonic/spectrum.ts): Z(q, ε) = Σ_B μ(B)^q ~
 * (ε/R)^τ(q), so τ is concave, τ(1) = 0, D_q = τ(q)/(q − 1), α = τ′(q),
 * f = qα − τ. The bound lines follow from it:
 *
 *   τ(q) ≤ q − 1. For q > 1: D_q ≤ dim ω (a general property of D_q for
 *     q > 1; from memory) and dim ω ≤ 1 for the harmonic measure ω of any
 *     planar set (Jones & Wolff 1988, Acta Math. 161, 131; from memory). For
 *     q < 1: D_q ≥ dim ω (general, from memory) and dim ω = 1 for a
 *     connected set (Makarov 1985, Proc. London Math. Soc. 51, 369). The
 *     line is the tangent at q = 1; a smooth curve has τ(q) = q − 1 exactly.
 *   τ(q) ≥ (q − 1)/2 for q ≥ 1 only: Σ μ^q ≤ (max μ)^{q−1} Σ μ = (max μ)^{q−1}
 *     and Beurling's estimate max μ(B) ≤ C (ε/R)^{1/2} (Garnett & Marshall
 *     2005, Harmonic Measure) give Z ≤ C^{q−1} (ε/R)^{(q−1)/2}; as ε/R → 0
 *     that is τ(q) ≥ (q − 1)/2. (For q < 1 the same step gives τ(q) ≤ (q − 1)/2,
 *     weaker than the line above, so it is not drawn.)
 *   f(α) ≤ α, equality at α = τ′(1): f − α = (q − 1)α − τ(q) ≤ 0 because
 *     the chord of the concave τ from 1 to q has slope τ(q)/(q − 1) ≥ τ′(q)
 *     for q > 1 and ≤ τ′(q) for q < 1.
 *   α ≥ 1/2: τ′ decreases, and its limit α_min = lim τ(q)/q ≥ 1/2 (Beurling).
 *
 * Every builder returns a Figure; thin data (one size, no intervals, a
 * reason in the section) gives a note on the panel or an empty figure with
 * the reason, never an exception.
 */
import type { HarmonicAtSize, HarmonicSection } from '../harmonic/harmonic-section-types.js';
import type { EnsembleValue } from '../harmonic/ensemble-intervals.js';
import type { IntervalSummary } from '../stats/bca.js';
import { buildPalette } from '../render/palette.js';
import { emptyFigure, type Figure } from './plots.js';
import { fmt, fmtAbscissa, fmtRange, HARMONIC_AXIS, isFiniteNumber, labelOf, levelPercent, shownInterval, valueText } from './labels.js';
import { autoDomain, COLOURS, escapeXml, FONT_FAMILY, logTicks, niceStep, Plot, svgText, type AxisSpec, type Tick } from './svg-plot.js';

/** Colours of the probed sizes, largest first. */
const SIZE_COLOURS = [COLOURS.blue, COLOURS.vermillion, COLOURS.green, COLOURS.purple, COLOURS.orange, COLOURS.sky];
const NOT_CONVERGED = '#9a9a9a';

const num = (v: unknown): number => (isFiniteNumber(v) ? v : NaN);

/** Tick text of m·10^k: plain, or "m·10^{k}" (`powers`: the axis has values below 10^-3 or from 10^5). */
function logTickLabel(m: number, k: number, powers: boolean): string {
  const v = m * Math.pow(10, k);
  if (!powers) return String(Number(v.toPrecision(3)));
  const e = k < 0 ? `−${-k}` : String(k);
  return m === 1 ? `10^{${e}}` : `${m}·10^{${e}}`;
}

/**
 * A log axis over `values` whose labels cover the whole range: where fewer
 * than two decades fall inside (svg-plot then labels only one end of the
 * axis), nice values m·10^k are labelled, nicest first, at least a seventh of
 * the axis apart.
 */
export function logAxis(label: string, values: number[], pad: number): AxisSpec {
  const domain = autoDomain(values, 'log', pad);
  const [lo, hi] = domain;
  const k0 = Math.floor(Math.log10(lo)), k1 = Math.ceil(Math.log10(hi));
  let decades = 0;
  for (let k = k0; k <= k1; k++) { const v = Math.pow(10, k); if (v >= lo && v <= hi) decades++; }
  if (decades >= 2) return { label, kind: 'log', domain };
  const span = Math.log10(hi / lo);
  const nice = [1, 5, 2, 3, 1.5, 2.5, 4, 6, 8, 7, 9];
  const chosen: { v: number; m: number; k: number }[] = [];
  for (const m of nice) {
    for (let k = k0 - 1; k <= k1; k++) {
      const v = m * Math.pow(10, k);
      if (v < lo || v > hi) continue;
      if (chosen.every((c) => Math.abs(Math.log10(v / c.v)) >= span / 7)) chosen.push({ v, m, k });
    }
  }
  const powers = chosen.some((c) => c.v < 1e-3 || c.v >= 1e5);
  const ticks: Tick[] = chosen.map((c) => ({ value: c.v, label: logTickLabel(c.m, c.k, powers), major: true }));
  for (const t of logTicks(domain)) if (!chosen.some((c) => Math.abs(c.v / t.value - 1) < 1e-9)) ticks.push({ value: t.value, label: '', major: false });
  return { label, kind: 'log', domain, ticks };
}

/** The probed sizes with a q grid, largest first. */
export function sizesLargestFirst(h: HarmonicSection): HarmonicAtSize[] {
  return (h.bySize ?? []).filter((s) => Array.isArray(s.q) && s.q.length > 0).slice().sort((a, b) => b.size - a.size);
}

/** The interval shown for an ensemble value (BCa, else percentile), or nulls. */
export function evRange(v: EnsembleValue | null | undefined): { range: [number, number] | null; kind: 'BCa' | 'percentile' | null } {
  return v && v.interval ? shownInterval(v.interval) : { range: null, kind: null };
}

/** "95% BCa" style text for the intervals of a list of values, or null when none has one. */
function intervalKind(values: Array<EnsembleValue | null | undefined>): { text: string; any: boolean; missing: number; why: string | null } {
  let kind: string | null = null, level: IntervalSummary | null = null, missing = 0, why: string | null = null;
  for (const v of values) {
    const r = evRange(v);
    if (r.range) { kind = kind && kind !== r.kind ? 'BCa or percentile' : r.kind; level = v!.interval; } else {
      missing++;
      why ??= v?.interval ? (v.interval.notes[0] ?? v.interval.status) : 'no interval';
    }
  }
  return { text: level ? `${levelPercent(level)} ${kind}` : '', any: level !== null, missing, why };
}

function sizeLabel(s: HarmonicAtSize): string {
  return `N = ${fmtAbscissa(s.size)} (${s.clusters} cluster${s.clusters === 1 ? '' : 's'})`;
}

/** Converged, not converged, not judged (convergedFraction null) per q of one size. */
function convergence(s: HarmonicAtSize): Array<'yes' | 'no' | 'unjudged'> {
  return s.q.map((_, k) => {
    const f = s.convergedFraction?.[k];
    if (f === null || f === undefined) return s.converged?.[k] ? 'yes' : 'unjudged';
    return s.converged?.[k] ? 'yes' : 'no';
  });
}

/** Points of the largest size: converged filled in the size colour, the rest grey (legend says which). */
function markedPoints(p: Plot, xs: number[], ys: number[], conv: Array<'yes' | 'no' | 'unjudged'>, colour: string, what: string): { no: number; unjudged: number } {
  const pick = (c: 'yes' | 'no' | 'unjudged') => {
    const ix = conv.flatMap((v, k) => (v === c && isFiniteNumber(xs[k]) && isFiniteNumber(ys[k]) ? [k] : []));
    return { x: ix.map((k) => xs[k]), y: ix.map((k) => ys[k]) };
  };
  const yes = pick('yes'), no = pick('no'), un = pick('unjudged');
  if (yes.x.length) p.points(yes.x, yes.y, colour, `${what}: converged`, 'circle', 3.6);
  if (no.x.length) p.points(no.x, no.y, NOT_CONVERGED, `${what}: not converged (probe halves disagree in over 10% of clusters)`, 'square', 3.8);
  if (un.x.length) p.points(un.x, un.y, NOT_CONVERGED, `${what}: convergence not judged (one probe job)`, 'triangle', 3.8);
  return { no: no.x.length, unjudged: un.x.length };
}

// ---------------------------------------------------------------- (a) τ(q)

export function tauFigure(h: HarmonicSection): Figure {
  const file = 'harmonic-tau';
  const sizes = sizesLargestFirst(h);
  const top = sizes[0];
  const title = `Mass exponents τ(q) of the harmonic measure${top ? `, N = ${fmtAbscissa(top.size)}` : ''}`;
  if (!top) return emptyFigure(file, title, 'no probed size with a q grid: no τ(q) to draw');
  const q = top.q;
  const tau = q.map((_, k) => num(top.tau[k]?.mean));
  if (!tau.some(isFiniteNumber)) return emptyFigure(file, title, `τ(q) at N = ${fmtAbscissa(top.size)} is not finite at any q`);
  const p = new Plot({ idPrefix: file, title, x: { label: HARMONIC_AXIS.q, kind: 'linear' }, y: { label: HARMONIC_AXIS.tau, kind: 'linear' }, legend: 'below' });
  const qMin = Math.min(...q), qMax = Math.max(...q);
  const iv = intervalKind(top.tau);
  if (iv.any) {
    p.band(q, q.map((_, k) => evRange(top.tau[k]).range?.[0] ?? NaN), q.map((_, k) => evRange(top.tau[k]).range?.[1] ?? NaN), SIZE_COLOURS[0], `${sizeLabel(top)}: ${iv.text} interval`, 0.22);
  }
  if (iv.missing > 0) p.note(`${iv.any ? `${iv.missing} of ${q.length} q without` : 'no'} interval: ${iv.why}`);
  // bounds (see the file header)
  p.line([qMin, qMax], [qMin - 1, qMax - 1], { colour: COLOURS.black, width: 1.6, dash: '7 4' }, 'τ(q) = q − 1: upper bound (smooth curve: equality)');
  if (qMax > 1) {
    const a = Math.max(1, qMin);
    p.line([a, qMax], [(a - 1) / 2, (qMax - 1) / 2], { colour: COLOURS.grey, width: 1.6, dash: '9 3 2 3' }, 'τ(q) = (q − 1)/2, q ≥ 1: Beurling lower bound');
  }
  sizes.slice(1).forEach((s, i) => {
    p.line(s.q, s.q.map((_, k) => num(s.tau[k]?.mean)), { colour: SIZE_COLOURS[(i + 1) % SIZE_COLOURS.length], width: 1.3, opacity: 0.9 }, `${sizeLabel(s)}: ensemble mean`);
  });
  p.line(q, tau, { colour: SIZE_COLOURS[0], width: 2 });
  const marks = markedPoints(p, q, tau, convergence(top), SIZE_COLOURS[0], `${sizeLabel(top)}`);
  const caption = `τ(q) of the ensemble mean over ${top.clusters} cluster(s) at N = ${fmtAbscissa(top.size)}, the largest probed size (line and points)` +
    (iv.any ? `, with the ${iv.text} interval of the cluster bootstrap (shaded)` : ', without intervals') + '.' +
    (marks.no ? ` Grey squares: q where fewer than 90% of the clusters' two probe halves agree (not converged).` : ' Every q is converged (the two probe halves agree in at least 90% of the clusters).') +
    (marks.unjudged ? ' Grey triangles: convergence not judged (one probe job).' : '') +
    (sizes.length > 1 ? ` Thin lines: the other probed sizes (${sizes.slice(1).map((s) => fmtAbscissa(s.size)).join(', ')}).` : ' Only one size was probed.') +
    ' Convention: Z(q, ε) = Σ μ(B)^{q} ~ (ε/R)^{τ(q)}, so τ(0) = −D_{0}, τ(1) = 0 and D_{q} = τ(q)/(q − 1).' +
    ' Black dashed: τ(q) = q − 1, the value for a smooth curve and an upper bound. For q > 1 because D_{q} ≤ dim ω ≤ 1 for the harmonic measure ω of any planar set (Jones & Wolff 1988, Acta Math. 161, 131); for q < 1 because D_{q} ≥ dim ω = 1 for a connected set (Makarov 1985); the line is the tangent at q = 1, where τ′(1) = dim ω = 1.' +
    (qMax > 1 ? ' Grey dash-dotted, for q ≥ 1 only: τ(q) = (q − 1)/2, a lower bound, since Σ μ^{q} ≤ (max μ)^{q−1} and Beurling\'s estimate max μ(B) ≤ C (ε/R)^{1/2} holds for a connected set.' : '') +
    ' The bounds are limits ε → 0 for the continuum set; the fitted τ(q) covers a finite range of box sides.';
  return { name: file, title, caption, svg: p.toSvg(), note: null };
}

// ---------------------------------------------------------------- (b) f(α)

export function fAlphaFigure(h: HarmonicSection): Figure {
  const file = 'harmonic-f-alpha';
  const sizes = sizesLargestFirst(h);
  const top = sizes[0];
  const title = `Multifractal spectrum f(α) of the harmonic measure${top ? `, N = ${fmtAbscissa(top.size)}` : ''}`;
  if (!top) return emptyFigure(file, title, 'no probed size with a q grid: no f(α) to draw');
  const alpha = top.q.map((_, k) => num(top.alpha?.[k]));
  const f = top.q.map((_, k) => num(top.f?.[k]));
  const ok = alpha.map((a, k) => isFiniteNumber(a) && isFiniteNumber(f[k]));
  if (!ok.some(Boolean)) return emptyFigure(file, title, `α and f(α) at N = ${fmtAbscissa(top.size)} are not finite at any q`);
  // domains from the spectra (the reference lines are clipped to them)
  const av: number[] = [], fv: number[] = [];
  for (const s of sizes) s.q.forEach((_, k) => { const a = num(s.alpha?.[k]), b = num(s.f?.[k]); if (isFiniteNumber(a) && isFiniteNumber(b)) { av.push(a); fv.push(b); } });
  let a0 = Math.min(...av, 0.5), a1 = Math.max(...av);
  let f0 = Math.min(...fv), f1 = Math.max(...fv);
  if (a1 - a0 < 0.05) { a0 -= 0.05; a1 += 0.05; }
  if (f1 - f0 < 0.05) { f0 -= 0.05; f1 += 0.05; }
  const ax = (a1 - a0) * 0.05, fy = (f1 - f0) * 0.08;
  const p = new Plot({
    idPrefix: file, title,
    x: { label: HARMONIC_AXIS.alpha, kind: 'linear', domain: [a0 - ax, a1 + ax] },
    y: { label: HARMONIC_AXIS.f, kind: 'linear', domain: [f0 - fy, f1 + fy] },
    legend: 'below',
  });
  p.line([a0 - ax, a1 + ax], [a0 - ax, a1 + ax], { colour: COLOURS.black, width: 1.6, dash: '7 4' }, 'f(α) = α: f(α) ≤ α, equal at α = τ′(1)');
  p.vline(0.5, { colour: COLOURS.grey, width: 1.6, dash: '2 3' }, undefined, true, 'α = 1/2: Beurling, α ≥ 1/2');
  sizes.slice(1).forEach((s, i) => {
    p.line(s.q.map((_, k) => num(s.alpha?.[k])), s.q.map((_, k) => num(s.f?.[k])), { colour: SIZE_COLOURS[(i + 1) % SIZE_COLOURS.length], width: 1.3, opacity: 0.9 }, `${sizeLabel(s)}`);
  });
  p.line(alpha, f, { colour: SIZE_COLOURS[0], width: 2 });
  const marks = markedPoints(p, alpha, f, convergence(top), SIZE_COLOURS[0], sizeLabel(top));
  const caption = `f(α) = qα − τ(q) with α = τ′(q), the Legendre transform of the ensemble-mean τ(q) (finite differences on the q grid; at q = 1 the fitted τ′(1)), at N = ${fmtAbscissa(top.size)} (line and points)` +
    (sizes.length > 1 ? ` and at the other probed sizes (thin lines)` : '') + '.' +
    (marks.no || marks.unjudged ? ' Grey markers: q where τ(q) is not converged (squares) or not judged (triangles).' : '') +
    ' Black dashed: f(α) = α; every spectrum of this kind obeys f(α) ≤ α (τ concave with τ(1) = 0) and touches the line at α = τ′(1), which Makarov\'s theorem (1985) puts at 1 for a connected planar set.' +
    ' Grey dotted: α = 1/2; Beurling\'s estimate gives α ≥ 1/2 for a connected set. The peak, f = −τ(0) = D_{0}, is the box dimension of the support of the measure. No intervals are drawn: α and f are derived from the ensemble mean.';
  return { name: file, title, caption, svg: p.toSvg(), note: null };
}

// ---------------------------------------------------------------- (c) capacity against N

export function capacityFigure(h: HarmonicSection): Figure {
  const file = 'harmonic-capacity';
  const d3 = h.dimension === 3;
  const title = d3 ? 'Newtonian capacity against cluster size' : 'Logarithmic capacity against cluster size';
  const sizes = sizesLargestFirst(h).slice().reverse();
  const pts = sizes.filter((s) => isFiniteNumber(s.logCapacity?.mean));
  const g = h.capacityGrowth;
  if (pts.length === 0) return emptyFigure(file, title, `no capacity at any probed size${g?.reason ? `: ${g.reason}` : ''}`);
  const xs = pts.map((s) => s.size), ys = pts.map((s) => Math.exp(s.logCapacity.mean));
  const withIv = pts.filter((s) => evRange(s.logCapacity).range);
  const yValues = [...ys, ...withIv.flatMap((s) => evRange(s.logCapacity).range!.map(Math.exp))];
  const p = new Plot({ idPrefix: file, title, x: logAxis('cluster size N (particles)', xs, 0.06), y: logAxis(HARMONIC_AXIS.capacity, yValues, 0.08), legend: 'below' });
  const ivk = intervalKind(pts.map((s) => s.logCapacity));
  if (withIv.length) {
    p.errorBars(withIv.map((s) => s.size), withIv.map((s) => Math.exp(evRange(s.logCapacity).range![0])), withIv.map((s) => Math.exp(evRange(s.logCapacity).range![1])), COLOURS.blue, 1.6, 5, `${ivk.text} interval of exp(mean ln cap)`);
  }
  if (ivk.missing) p.note(`${withIv.length ? `${ivk.missing} of ${pts.length} sizes without` : 'no'} interval: ${ivk.why}`);
  // the fit input (clusters probed at every size), when it differs from the per-size means
  const gs = (g?.sizes ?? []).map((n, k) => ({ n, y: num(g.meanLogCapacity?.[k]) })).filter((v) => isFiniteNumber(v.y) && v.n > 0);
  const differs = gs.some((v) => { const s = pts.find((t) => t.size === v.n); return !s || Math.abs(s.logCapacity.mean - v.y) > 1e-9 * Math.max(1, Math.abs(v.y)); });
  let fitText = '', fitValues = '';
  if (g && isFiniteNumber(g.exponent) && gs.length >= 2) {
    const lx = gs.map((v) => Math.log(v.n)), ly = gs.map((v) => v.y);
    const mx = lx.reduce((a, b) => a + b, 0) / lx.length, my = ly.reduce((a, b) => a + b, 0) / ly.length;
    const ends = [Math.min(...gs.map((v) => v.n)), Math.max(...gs.map((v) => v.n))];
    const beta = g.exponent;
    const dText = isFiniteNumber(g.dimension) ? `D_{cap} = 1/β = ${fmt(g.dimension, 3)}${g.dimensionInterval ? ` ${fmtRange(g.dimensionInterval, 3)}` : ''}` : 'D_{cap} not available';
    fitValues = `${valueText('β', beta, g.exponentInterval, 4)}; ${dText}`;
    fitText = `fit cap = A N^{β}: ${fitValues}`;
    p.line(ends, ends.map((n) => Math.exp(my + beta * (Math.log(n) - mx))), { colour: COLOURS.black, width: 1.8, dash: '6 3' }, fitText);
    if (g.reason) p.note(g.reason);
  } else {
    p.note(`no power-law fit: ${g?.reason ?? (pts.length < 2 ? 'one size probed' : 'exponent not available')}`);
  }
  p.points(xs, ys, COLOURS.blue, `exp(mean ln cap) over the clusters at each size`, 'circle', 4);
  if (differs && gs.length) p.points(gs.map((v) => v.n), gs.map((v) => Math.exp(v.y)), COLOURS.vermillion, `fit input: clusters probed at every size (${h.clustersAtAllSizes})`, 'diamond', 3.6, true);
  const caption = (d3
    ? 'Newtonian capacity of the union of contact balls (in particle diameters; a ball of radius a has capacity a), from the share of probes that hit: exp of the ensemble mean of ln cap at each probed size (points)'
    : 'Logarithmic capacity of the union of contact disks (in particle diameters): exp of the ensemble mean of ln cap at each probed size (points)') +
    (withIv.length ? `, with the ${ivk.text} interval of that mean (whiskers)` : ', no intervals') + '.' +
    (fitText ? ` Dashed: the power law cap ∝ N^{β} fitted to the mean ln cap of the ${h.clustersAtAllSizes} cluster(s) probed at every size, drawn through the centroid of those points; ${fitValues}.` : ` No power-law fit: ${g?.reason ?? 'too few sizes'}.`) +
    ' Capacity scales like a length (cap(tK) = t cap(K)), so for statistically self-similar growth cap ∝ R ∝ N^{1/D} and D_{cap} = 1/β estimates the fractal dimension D.';
  return { name: file, title, caption, svg: p.toSvg(), note: fitText ? null : `no capacity fit: ${g?.reason ?? 'too few sizes'}` };
}

// ---------------------------------------------------------------- (d) capacity increment against Z(3)

export function capacityIncrementFigure(h: HarmonicSection): Figure {
  const file = 'harmonic-capacity-increment';
  const title = 'Capacity increment per particle against Z(3)';
  const c = h.capacityIncrement;
  const n = c ? Math.min(c.fromSize?.length ?? 0, c.toSize?.length ?? 0, c.meanIncrement?.length ?? 0, c.z3?.length ?? 0) : 0;
  if (!c || n === 0) return emptyFigure(file, title, `no capacity increments: ${c?.reason ?? 'fewer than two probed sizes'}`);
  const rows = Array.from({ length: n }, (_, k) => ({ from: c.fromSize[k], to: c.toSize[k], y: num(c.meanIncrement[k]), x: num(c.z3[k]) }));
  const drawn = rows.filter((r) => r.x > 0 && r.y > 0);
  if (drawn.length === 0) return emptyFigure(file, title, `no capacity increment can go on log axes (${rows.length} interval(s), none with both Δ ln cap/ΔN > 0 and Z(3) > 0)`);
  const lx = drawn.map((r) => Math.log(r.x)), ly = drawn.map((r) => Math.log(r.y));
  const mx = lx.reduce((a, b) => a + b, 0) / lx.length, my = ly.reduce((a, b) => a + b, 0) / ly.length;
  let xs = [Math.min(...drawn.map((r) => r.x)), Math.max(...drawn.map((r) => r.x))];
  if (xs[1] / xs[0] < 1.2) xs = [xs[0] / 1.1, xs[1] * 1.1];
  const line = (s: number) => xs.map((x) => Math.exp(my + s * (Math.log(x) - mx)));
  const slopes = [1, ...(isFiniteNumber(c.slope) && drawn.length >= 2 ? [c.slope] : [])];
  const xAxis = logAxis(HARMONIC_AXIS.z3, xs, 0.08);
  const p = new Plot({
    idPrefix: file, title, legend: 'below', x: xAxis,
    y: logAxis(HARMONIC_AXIS.increment, [...drawn.map((r) => r.y), ...slopes.flatMap(line)], 0.1),
  });
  p.line(xs, line(1), { colour: COLOURS.grey, width: 1.6, dash: '2 3' }, 'slope 1: increment = c Z(3) (through the centroid)');
  let fitText = '';
  if (isFiniteNumber(c.slope) && drawn.length >= 2) {
    fitText = valueText('fitted slope', c.slope, c.slopeInterval, 3);
    p.line(xs, line(c.slope), { colour: COLOURS.black, width: 1.8, dash: '6 3' }, `${fitText}${c.proportional === null ? '' : c.proportional ? ': contains 1' : ': excludes 1'}`);
    if (c.reason) p.note(c.reason.length > 100 ? c.reason.slice(0, 97) + '...' : c.reason);
  } else p.note(`no slope: ${c.reason ?? (drawn.length < 2 ? 'one interval of sizes' : 'slope not available')}`);
  p.points(drawn.map((r) => r.x), drawn.map((r) => r.y), COLOURS.blue, 'mean over clusters between successive sizes', 'circle', 4);
  // size labels off the lines (which rise through the points): lower right in the left half, upper left in the right half
  const [d0, d1] = xAxis.domain!;
  const shift = Math.pow(d1 / d0, 0.015), middle = Math.sqrt(d0 * d1);
  for (const r of drawn) {
    const left = r.x < middle;
    p.text(left ? r.x * shift : r.x / shift, r.y, `N = ${fmtAbscissa(r.from)}–${fmtAbscissa(r.to)}`, { size: 12.5, colour: '#333', halo: true, anchor: left ? 'start' : 'end', dyEm: left ? 1.25 : -0.7 });
  }
  const hidden = rows.length - drawn.length;
  if (hidden) p.note(`${hidden} interval(s) with Δ ln cap/ΔN ≤ 0 or Z(3) ≤ 0 not drawn (log axes)`);
  const d3 = h.dimension === 3;
  const caption = (d3 ? 'Mean over clusters of (1/C(N_{k}) − 1/C(N_{k+1}))/(N_{k+1} − N_{k}), C the Newtonian capacity (in 3D the variable whose growth is proportional to Z(3); coordinator/harmonic/harmonic-section.ts),' : 'Mean over clusters of (ln cap(N_{k+1}) − ln cap(N_{k}))/(N_{k+1} − N_{k})') + ' between successive probed sizes (points, labelled with the sizes) against the particle-scale growth moment Z(3) = Σ p_{i}^{3} at the interval (geometric mean of the ensemble-mean Z(3) at its two ends), on log–log axes.' +
    (fitText ? ` Dashed: the fitted log–log slope, ${fitText}${c.proportional === null ? '' : c.proportional ? ' (contains 1: proportional)' : ' (excludes 1: not proportional)'}.` : ` No slope: ${c.reason ?? 'too few intervals'}.`) +
    ` Dotted grey: slope 1 through the centroid of the points, i.e. an increment proportional to Z(3); proportionality (ratio constant in N) is what makes ${d3 ? 'τ(3) = D + 1 in 3D' : 'τ(3) = D'}. The points carry no intervals.` +
    (hidden ? ` ${hidden} interval(s) could not be drawn on log axes.` : '');
  return { name: file, title, caption, svg: p.toSvg(), note: fitText ? null : `no capacity-increment slope: ${c.reason ?? 'too few intervals'}` };
}

// ---------------------------------------------------------------- (e) τ(3) beside D

interface Row { label: string; value: number | null; range: [number, number] | null; colour: string; marker: 'circle' | 'square' | 'diamond'; why: string | null }

export function electrostaticFigure(h: HarmonicSection): Figure {
  const file = 'harmonic-electrostatic';
  const e = h.electrostatic;
  const judged = e?.consistent === true || e?.consistent === false;
  // in 3D the law is tau(3) = D + 1: the rows show tau(3) - 1 beside D
  const shift = (h.dimension ?? 2) - 2;
  const t3 = shift ? `τ(3) − ${shift}` : 'τ(3)';
  const law = shift ? `τ(3) = D + ${shift}` : 'τ(3) = D';
  const sh = (v: number | null): number | null => (v === null ? null : v - shift);
  const shr = (r: [number, number] | null): [number, number] | null => (r ? [r[0] - shift, r[1] - shift] : null);
  const title = `Electrostatic scaling law ${law}${judged ? ` at N = ${fmtAbscissa(e.size)}: ${e.consistent ? 'consistent' : 'not consistent'}` : ': τ(3) beside the mass-based D'}`;
  const rows: Row[] = [];
  const md = e?.massDimension ?? null;
  if (md) rows.push({ label: `D from ${labelOf(md.estimator).rich}`, value: isFiniteNumber(md.value) ? md.value : null, range: md.interval ?? null, colour: COLOURS.vermillion, marker: 'square', why: !isFiniteNumber(md.value) ? 'not available' : md.interval ? null : 'no interval' });
  const sizes = sizesLargestFirst(h);
  const withTau3 = sizes.filter((s) => s.tau3);
  for (const s of withTau3) {
    const main = s.size === e?.size;
    const v = sh(isFiniteNumber(s.tau3!.mean) ? s.tau3!.mean : null);
    const r = evRange(s.tau3);
    rows.push({ label: `${t3}, N = ${fmtAbscissa(s.size)}`, value: v, range: shr(r.range), colour: main ? COLOURS.blue : COLOURS.sky, marker: 'circle', why: v === null ? 'not available' : r.range ? null : `no interval: ${s.tau3!.interval?.notes[0] ?? s.tau3!.interval?.status ?? 'none'}` });
  }
  if (e?.tau3 && !withTau3.some((s) => s.size === e.size)) {
    const r = evRange(e.tau3);
    rows.push({ label: `${t3}, N = ${fmtAbscissa(e.size)}`, value: sh(isFiniteNumber(e.tau3.mean) ? e.tau3.mean : null), range: shr(r.range), colour: COLOURS.blue, marker: 'circle', why: r.range ? null : 'no interval' });
  }
  if (rows.every((r) => r.value === null)) {
    return emptyFigure(file, title, `nothing to compare: ${withTau3.length || e?.tau3 ? '' : 'q = 3 is not on the q grid (no τ(3)); '}${md ? 'D not available' : 'no mass-based D'}`);
  }
  const values: number[] = [];
  for (const r of rows) { if (r.value !== null) values.push(r.value); if (r.range) values.push(...r.range); }
  let lo = Math.min(...values), hi = Math.max(...values);
  const pad = Math.max(0.02, (hi - lo) * 0.15);
  lo -= pad; hi += pad;
  const n = rows.length;
  const ticks: Tick[] = rows.map((r, i) => ({ value: n - i, label: r.label, major: true }));
  const p = new Plot({
    idPrefix: file, title, height: Math.max(260, 150 + 56 * n),
    x: { label: HARMONIC_AXIS.exponent, kind: 'linear', domain: [lo, hi] },
    y: { label: '', kind: 'linear', domain: [0.4, n + 0.6], ticks, grid: false },
    legend: 'below',
  });
  if (md && md.interval) p.vspan(md.interval[0], md.interval[1], COLOURS.vermillion, 0.1, 'interval of D, carried down the rows');
  rows.forEach((r, i) => {
    const y = n - i;
    if (r.range) p.horizontalErrorBars([y], [r.range[0]], [r.range[1]], r.colour, 2.4, 5);
    if (r.value !== null) {
      p.points([r.value], [y], r.colour, undefined, r.marker, 5);
      p.text(r.value, y + 0.28, fmt(r.value, 3), { size: 12.5, anchor: 'middle', colour: '#222', halo: true });
    }
    if (r.why) p.text((lo + hi) / 2, y - 0.36, r.why.length > 80 ? r.why.slice(0, 77) + '...' : r.why, { size: 12.5, anchor: 'middle', colour: '#a00000', halo: true });
  });
  const tk = intervalKind([...withTau3.map((s) => s.tau3), ...(e?.tau3 ? [e.tau3] : [])]);
  p.legendOnly(`τ(3): ${tk.any ? tk.text : 'no'} interval (cluster bootstrap)`, 'whisker', { colour: COLOURS.blue, width: 2.4 });
  if (md) p.legendOnly('D: interval of the analysis', 'whisker', { colour: COLOURS.vermillion, width: 2.4 });
  const verdict = e?.consistent === null || e?.consistent === undefined ? 'not judged' : e.consistent ? `intervals overlap: consistent with ${law}` : `intervals do not overlap: ${law.replace('=', '≠')} at this precision`;
  if (!e?.consistent) p.note(`N = ${fmtAbscissa(e?.size)}: ${verdict}`);
  const caption = `${t3}${shift ? ' (τ(3) of the harmonic measure minus d − 2)' : ' of the harmonic measure'} at each probed size (circles; the size compared, N = ${fmtAbscissa(e?.size)}, in dark blue) beside the mass-based fractal dimension D of the same clusters` +
    (md ? ` (from ${labelOf(md.estimator).rich}, square; its interval shaded down the rows)` : ' (not available)') +
    `. The electrostatic scaling law says ${law} (${e?.source ?? 'source not given'}). Whiskers: intervals (τ(3): BCa where available, else percentile). Verdict at N = ${fmtAbscissa(e?.size)}: ${verdict}.`;
  return { name: file, title, caption, svg: p.toSvg(), note: null };
}

// ---------------------------------------------------------------- (f) the measure picture

export interface MeasurePictureInput {
  runIndex: number;
  size: number;
  png: Uint8Array;
  /** Overrides the title (a point set that is not a run of an ensemble). */
  title?: string;
  /** Pixels of the PNG per unit length (measurePictureGeometry), and the unit's name: a scale bar is drawn when given. */
  scale?: { pixelsPerUnit: number; unit: string };
}

/** Width and height from a PNG's IHDR chunk, or null when the bytes are not a PNG. */
export function pngSize(png: Uint8Array): [number, number] | null {
  const sig = [137, 80, 78, 71, 13, 10, 26, 10];
  if (png.length < 24 || sig.some((b, i) => png[i] !== b)) return null;
  const u32 = (o: number) => ((png[o] << 24) | (png[o + 1] << 16) | (png[o + 2] << 8) | png[o + 3]) >>> 0;
  const w = u32(16), h = u32(20);
  return w > 0 && h > 0 ? [w, h] : null;
}

/** The picture of renderMeasurePng (coordinator/harmonic/measure-picture.ts) inside an SVG with a colour key, and a scale bar when its scale is given. */
export function measurePictureFigure(pic: MeasurePictureInput): Figure {
  const file = 'harmonic-measure';
  const title = pic.title ?? `Harmonic measure on cluster run ${pic.runIndex} at N = ${fmtAbscissa(pic.size)} particles`;
  const dims = pngSize(pic.png);
  if (!dims) return emptyFigure(file, title, 'the harmonic measure picture is not a PNG');
  const W = 760, top = 34, img = 660, keyH = 100;
  const iw = dims[0] >= dims[1] ? img : (img * dims[0]) / dims[1];
  const ih = dims[0] >= dims[1] ? (img * dims[1]) / dims[0] : img;
  const H = top + ih + keyH;
  const x0 = (W - iw) / 2;
  const b64 = Buffer.from(pic.png.buffer, pic.png.byteOffset, pic.png.byteLength).toString('base64');
  const parts: string[] = [];
  parts.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H.toFixed(0)}" viewBox="0 0 ${W} ${H.toFixed(0)}" font-family="${escapeXml(FONT_FAMILY)}">`);
  parts.push(`<rect x="0" y="0" width="${W}" height="${H.toFixed(0)}" fill="#ffffff"/>`);
  parts.push(svgText((W - img) / 2, 24, title, { size: 17, weight: 'bold' }));
  parts.push(`<image x="${x0.toFixed(2)}" y="${top}" width="${iw.toFixed(2)}" height="${ih.toFixed(2)}" href="data:image/png;base64,${b64}"/>`);
  // scale bar, as on the sample cluster (coordinator/report/plots.ts clusterFigure)
  let scaleText = '';
  if (pic.scale && pic.scale.pixelsPerUnit > 0) {
    const s = iw / dims[0]; // svg units per picture pixel
    const extent = dims[0] / pic.scale.pixelsPerUnit; // units across the picture
    const bar = niceStep(extent / 5, 1);
    const barPx = bar * pic.scale.pixelsPerUnit * s;
    const by = top + ih - 22;
    parts.push(`<path d="M${(x0 + 20).toFixed(2)} ${by.toFixed(2)}h${barPx.toFixed(2)}" stroke="#ffffff" stroke-width="4"/>`);
    parts.push(`<path d="M${(x0 + 20).toFixed(2)} ${(by - 6).toFixed(2)}v12M${(x0 + 20 + barPx).toFixed(2)} ${(by - 6).toFixed(2)}v12" stroke="#ffffff" stroke-width="2"/>`);
    parts.push(svgText(x0 + 20, by - 10, `${fmtAbscissa(bar)} ${pic.scale.unit}`, { size: 15, colour: '#ffffff' }));
    scaleText = ` The picture is ${fmtAbscissa(extent)} ${pic.scale.unit} across, the white bar ${fmtAbscissa(bar)}.`;
  }
  // colour key: the same palette and quantile mapping as renderMeasurePng
  const lut = buildPalette(64, 0, 1);
  const ky = top + ih + 16, kw = 360, kx = (W - kw) / 2;
  for (let i = 0; i < 64; i++) {
    const col = `#${[lut[3 * i], lut[3 * i + 1], lut[3 * i + 2]].map((v) => v.toString(16).padStart(2, '0')).join('')}`;
    parts.push(`<rect x="${(kx + (i * kw) / 64).toFixed(2)}" y="${ky.toFixed(2)}" width="${(kw / 64 + 0.6).toFixed(2)}" height="14" fill="${col}"/>`);
  }
  parts.push(`<rect x="${kx}" y="${ky.toFixed(2)}" width="${kw}" height="14" fill="none" stroke="#555" stroke-width="0.8"/>`);
  parts.push(svgText(kx - 8, ky + 12, 'lowest share (≥ 1 hit)', { size: 13.5, anchor: 'end' }));
  parts.push(svgText(kx + kw + 8, ky + 12, 'highest share', { size: 13.5 }));
  for (const [f, t] of [[0.25, '25%'], [0.5, 'median'], [0.75, '75%']] as const) {
    parts.push(`<line x1="${(kx + f * kw).toFixed(2)}" y1="${(ky + 14).toFixed(2)}" x2="${(kx + f * kw).toFixed(2)}" y2="${(ky + 19).toFixed(2)}" stroke="#333" stroke-width="1"/>`);
    parts.push(svgText(kx + f * kw, ky + 30, t, { size: 11.5, anchor: 'middle', colour: '#333' }));
  }
  parts.push(`<rect x="${(W / 2 - 150).toFixed(2)}" y="${(ky + 36).toFixed(2)}" width="14" height="14" fill="#3c3c42" stroke="#555" stroke-width="0.8"/>`);
  parts.push(svgText(W / 2 - 130, ky + 48, 'never hit by a probe walker', { size: 13.5 }));
  parts.push(svgText(W / 2, ky + 70, 'colour: quantile of the share of walkers whose first contact is the particle (quantiles of log ω)', { size: 13.5, anchor: 'middle', colour: '#333' }));
  parts.push('</svg>');
  const caption = `Cluster of run ${pic.runIndex} at N = ${fmtAbscissa(pic.size)} particles, each particle coloured by its harmonic measure (the share of probe walkers from far away whose first contact is that particle) by quantiles: the particles hit at least once are ranked by their share, and equal stretches of the colour key hold equal numbers of them, from the smallest share (dark) through the median to the largest (bright), so the measure's whole range of decades shows; dark grey particles were never hit.${scaleText}`;
  return { name: file, title, caption, svg: parts.join('\n'), note: null };
}

/** All figures of the section, in page order. */
export function harmonicFigures(h: HarmonicSection): Figure[] {
  return [tauFigure(h), fAlphaFigure(h), capacityFigure(h), capacityIncrementFigure(h), electrostaticFigure(h)];
}
