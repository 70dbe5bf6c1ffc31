/**
 * The self-contained HTML report of an ensemble: one report.html that opens
 * in a browser with no network (the SVG figures are inline, the font is
 * embedded as a data: URI, no script), plus plots/<figure>.svg and
 * plots/<figure>.png beside it.
 *
 * Contents: a header with the spec and the engine version, the estimates
 * table (value, percentile and BCa intervals, method, fit window, status),
 * the consistency panel (pair agreement, bounds, published value beside
 * ours), the corrections-to-scaling fit, the notes of the analysis, and the
 * figures of plots.ts. Every text is HTML-escaped. Degenerate analyses
 * (estimator unavailable, no interval, a single cluster) give a note in place
 * of the missing number or figure, never an exception.
 */
import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { GrowthResult } from '../../worker/core/growth-kernel.js';
import { ENGINE_VERSION } from '../../worker/core/engine-version.js';
import { CORRECTIONS_DETERMINED_RULES, type EnsembleAnalysis } from '../stats/analyze-ensemble.js';
import type { HarmonicAtSize, HarmonicSection } from '../harmonic/harmonic-section-types.js';
import type { IntervalSummary } from '../stats/bca.js';
import { extractEnsembleData, type EnsembleData } from '../stats/ensemble-data.js';
import { decodeSnapshot, type PointSet } from '../snapshot/cluster-snapshot.js';
import { specToDocument, type EnsembleSpec } from '../spec/index.js';
import { fmt, fmtAbscissa, fmtRange, isFiniteNumber, labelOf, levelPercent, shownInterval, valueText } from './labels.js';
import { clusterFigure, comparisonFigure, correctionsFigure, estimatorFigure, localSlopesFigure, type Figure } from './plots.js';
import { evRange, harmonicFigures, measurePictureFigure, sizesLargestFirst, type MeasurePictureInput } from './harmonic-plots.js';
import { embeddableFonts, pngRenderer } from './png-plot.js';
import { clusterPicture3d } from './cluster-viewer-3d.js';
import { anisotropyComparisonFigure, observableFigures } from './observable-plots.js';
import type { ObservableSection } from '../stats/observable-bands.js';
import { escapeXml, FONT_FAMILY, parseRichText } from './svg-plot.js';

export type SampleClusterInput = PointSet | Uint8Array | { points: PointSet | Uint8Array; runIndex?: number };

/** The statistics of a summary: the ensemble analysis, with the harmonic section when clusters were probed. */
export type ReportAnalysis = EnsembleAnalysis & { harmonic?: HarmonicSection | null; observables?: ObservableSection | null };

export interface ReportInput {
  analysis: ReportAnalysis;
  /** The run results the analysis was made from (for the curves of the log-log plots). */
  runs: readonly GrowthResult[];
  spec?: EnsembleSpec;
  /** One cluster to picture: a point set, snapshot bytes (coordinator/snapshot), or either with its run index. */
  sampleCluster?: SampleClusterInput;
  /**
   * A cluster coloured by harmonic measure (PNG from renderMeasurePng of
   * coordinator/harmonic/measure-picture.ts), shown in the harmonic section.
   */
  measurePicture?: MeasurePictureInput;
  /** Why a picture is missing (coordinator/commands/report-pictures.ts), said in the notes instead of "was not given". */
  pictureNotes?: { sampleCluster?: string; measurePicture?: string };
  /**
   * An isotropic baseline ensemble (`tendril run --baseline`): its k-fold
   * amplitude is drawn with this ensemble's in one figure.
   */
  baseline?: { own: string; label: string; fold: number; observables: ObservableSection };
  /** Page title; default from the spec name or the model kind. */
  title?: string;
  /** Ensemble id, shown in the header when given. */
  ensembleId?: string;
  /** Render PNG copies of the figures; default true. */
  png?: boolean;
  /** Scale of the PNGs relative to the SVG size; default 2. */
  pngScale?: number;
  /** Embed the Roboto font in the page (about 0.4 MB); default true. */
  embedFont?: boolean;
}

export interface ReportFiles {
  html: string;
  svgs: string[];
  pngs: string[];
  /** Figure names in page order. */
  figures: string[];
  /** Remarks of the report itself (missing renderer, unreadable cluster, ...). */
  notes: string[];
}

export const escapeHtml = escapeXml;

/** Rich text (svg-plot syntax) as HTML with <sub>/<sup>. */
export function richHtml(s: string): string {
  return parseRichText(s).map((r) => (r.shift === -1 ? `<sub>${escapeHtml(r.text)}</sub>` : r.shift === 1 ? `<sup>${escapeHtml(r.text)}</sup>` : escapeHtml(r.text))).join('');
}

const STATUS_TEXT: Record<IntervalSummary['status'], string> = {
  ok: 'computed',
  degenerate: 'degenerate (all replicates equal)',
  'too-few-clusters': 'too few clusters for an interval',
  unstable: 'unstable (too many non-finite replicates)',
  unavailable: 'unavailable',
};

function num(v: number | null | undefined, digits = 4): string {
  return v === null || v === undefined ? '<td class="num na">–</td>' : `<td class="num" data-value="${escapeHtml(String(v))}">${escapeHtml(fmt(v, digits))}</td>`;
}

function range(r: [number, number] | null, digits = 4): string {
  return r ? `<td class="num" data-lo="${escapeHtml(String(r[0]))}" data-hi="${escapeHtml(String(r[1]))}">${escapeHtml(fmtRange(r, digits))}</td>` : '<td class="num na">–</td>';
}

function statusCell(iv: IntervalSummary): string {
  const cls = iv.status === 'ok' ? 'ok' : 'warn';
  const extra = iv.status !== 'ok' && iv.notes.length ? `: ${iv.notes.join('; ')}` : '';
  return `<td class="${cls}" data-status="${escapeHtml(iv.status)}">${escapeHtml(STATUS_TEXT[iv.status] + extra)}</td>`;
}

function estimatesTable(a: EnsembleAnalysis): string {
  const rows: string[] = [];
  for (const n of ['radiusOfGyration', 'maxRadius', 'massRadius'] as const) {
    const e = a.estimators[n];
    const w = e.fitWindow;
    const win = w ? `${w.variable} = ${fmtAbscissa(w.firstUsed)} to ${fmtAbscissa(w.lastUsed)} (${w.points} points; ${w.source}${w.source === 'default' ? ': ' + w.rule : ''})` : '–';
    if (!e.available) {
      rows.push(`<tr data-estimator="${n}"><th>${richHtml(labelOf(n).rich)}</th><td colspan="3" class="warn">not available: ${escapeHtml(e.reason ?? 'unknown reason')}</td><td>${escapeHtml(e.method)}</td><td>${escapeHtml(win)}</td><td class="warn" data-status="unavailable">unavailable</td></tr>`);
      continue;
    }
    rows.push(`<tr data-estimator="${n}"><th>${richHtml(labelOf(n).rich)}</th>${num(e.D)}${range(e.interval.percentile)}${range(e.interval.bca)}<td>${escapeHtml(e.method)}</td><td>${escapeHtml(win)}</td>${statusCell(e.interval)}</tr>`);
  }
  for (const n of ['radiusOfGyration', 'maxRadius'] as const) {
    const c = a.corrections[n];
    if (!c) continue;
    const key = `${n}Corrected`;
    const win = c.window ? `N = ${fmtAbscissa(c.window.from)} to ${fmtAbscissa(c.window.to)} (${c.window.points} points; ${c.window.source})` : '–';
    if (!c.determined) {
      const what = c.available ? 'not determined' : 'not available';
      rows.push(`<tr data-estimator="${key}"><th>${richHtml(labelOf(key).rich)}</th><td colspan="3" class="warn">${what}: ${escapeHtml(c.reason ?? 'unknown reason')}</td><td>${escapeHtml(c.method)}</td><td>${escapeHtml(win)}</td><td class="warn" data-status="${c.available ? 'not-determined' : 'unavailable'}">${what}</td></tr>`);
      continue;
    }
    rows.push(`<tr data-estimator="${key}"><th>${richHtml(labelOf(key).rich)}</th>${num(c.D.value)}${range(c.D.interval.percentile)}${range(c.D.interval.bca)}<td>${escapeHtml(c.method)}</td><td>${escapeHtml(win)}</td>${statusCell(c.D.interval)}</tr>`);
  }
  const lvl = `${Number((a.options.level * 100).toFixed(1))}%`;
  const fs = a.consistency.finiteSizeNote;
  return `<table id="estimates"><thead><tr><th>estimator</th><th>D</th><th>${lvl} percentile interval</th><th>${lvl} BCa interval</th><th>method</th><th>fit window</th><th>interval</th></tr></thead><tbody>${rows.join('')}</tbody></table>` +
    '<p class="rule" id="estimates-rule">Column “interval”: <i>computed</i> when the bootstrap gave an interval (enough clusters, finite and not all equal replicates); it is not a verdict on D. Whether estimates agree with each other or with the published value is judged in the consistency panel, by the rules stated there.</p>' +
    (fs ? `<p class="note" id="finite-size-note"><b>Why the estimates differ:</b> ${escapeHtml(fs)}</p>` : '');
}

function yesNo(v: boolean | null, yes = 'yes', no = 'no'): string {
  return v === null ? '<td class="na">–</td>' : `<td class="${v ? 'ok' : 'warn'}">${v ? yes : no}</td>`;
}

function consistencySection(a: EnsembleAnalysis): string {
  const p = a.consistency;
  const out: string[] = [];
  if (p.reference) {
    out.push(`<p class="reference">Published value for ${escapeHtml(p.modelKind ?? '')}: <b>D = ${escapeHtml(String(p.reference.D))} ± ${escapeHtml(String(p.reference.uncertainty))}</b>, source: ${escapeHtml(p.reference.source)}; ${escapeHtml(p.reference.note)}.</p>`);
  } else {
    out.push(`<p class="reference">No published value is on record for model ${escapeHtml(p.modelKind ?? '(unknown)')}.</p>`);
  }
  const rule = (prefix: string) => p.rules.filter((r) => r.startsWith(prefix)).map((r) => `<p class="rule">Rule: ${escapeHtml(r)}.</p>`).join('');
  const seeNote = p.finiteSizeNote ? '<p class="note" data-note="finite-size">Disagreement on clusters this small is expected: see “Why the estimates differ” under the estimates table.</p>' : '';
  const rows = p.rows.map((r) => `<tr><th>${richHtml(labelOf(r.name).rich)}</th>${num(r.D)}${range(r.interval)}<td>${escapeHtml(r.intervalKind ?? '–')}</td>${num(r.differenceFromReference)}${yesNo(r.referenceInsideInterval)}</tr>`);
  out.push(`<h3>Estimates beside the published value</h3><table id="panel-rows"><thead><tr><th>estimator</th><th>D</th><th>interval used</th><th>kind</th><th>D − published</th><th>published value inside our interval</th></tr></thead><tbody>${rows.join('') || '<tr><td colspan="6" class="na">no estimate</td></tr>'}</tbody></table>` + rule('published value inside') + (p.rows.some((r) => r.referenceInsideInterval === false) ? seeNote : ''));
  const pairs = p.pairs.map((q) => {
    const sh = shownInterval(q.differenceInterval);
    return `<tr><th>${richHtml(labelOf(q.a).rich)} − ${richHtml(labelOf(q.b).rich)}</th>${num(q.difference)}${range(sh.range)}<td>${escapeHtml(sh.kind ?? '–')}</td>${yesNo(q.intervalsOverlap)}${yesNo(q.agree, 'agree', 'disagree')}</tr>`;
  });
  out.push(`<h3>Agreement of pairs</h3><table id="panel-pairs"><thead><tr><th>pair</th><th>difference</th><th>interval of the paired difference</th><th>kind</th><th>individual intervals overlap</th><th>verdict (0 inside the difference interval)</th></tr></thead><tbody>${pairs.join('') || '<tr><td colspan="6" class="na">fewer than two estimators: no pairs</td></tr>'}</tbody></table>` + rule('pair agrees') + rule('individual intervals') + (p.pairs.some((q) => q.agree === false) ? seeNote : ''));
  const names = p.rows.map((r) => r.name);
  const bounds = p.bounds.map((b) => `<tr><th>${escapeHtml(b.rule)}</th><td>${escapeHtml(b.source)}</td>${names.map((n) => { const s = b.status[n] ?? 'unknown'; return `<td class="${s === 'satisfied' ? 'ok' : s === 'unknown' ? 'na' : 'warn'}">${escapeHtml(s)}</td>`; }).join('')}</tr>`);
  out.push(`<h3>Bounds</h3><table id="panel-bounds"><thead><tr><th>bound</th><th>source</th>${names.map((n) => `<th>${richHtml(labelOf(n).rich)}</th>`).join('')}</tr></thead><tbody>${bounds.join('') || `<tr><td colspan="${2 + names.length}" class="na">no bounds known for this model</td></tr>`}</tbody></table>` + rule('bound:'));
  return out.join('\n');
}

function correctionsSection(a: EnsembleAnalysis): string {
  if (!a.options.corrections) return '<p class="na">The corrections-to-scaling fit was switched off.</p>';
  const rows: string[] = [];
  for (const n of ['radiusOfGyration', 'maxRadius'] as const) {
    const c = a.corrections[n];
    if (!c) continue;
    const win = c.window ? `N = ${fmtAbscissa(c.window.from)} to ${fmtAbscissa(c.window.to)}, ${c.window.points} points (${c.window.source})` : '–';
    if (!c.determined) { rows.push(`<tr data-estimator="${n}"><th>${richHtml(labelOf(n).rich)}</th><td colspan="5" class="warn">${c.available ? 'not determined' : 'not available'}: ${escapeHtml(c.reason ?? '')}</td><td>${escapeHtml(win)}</td><td class="num">${escapeHtml(c.rss === null ? '–' : c.rss.toExponential(3))} / ${escapeHtml(c.rssPowerLaw === null ? '–' : c.rssPowerLaw.toExponential(3))}</td></tr>`); continue; }
    const cell = (v: { value: number | null; interval: IntervalSummary }, d = 4) => {
      const sh = shownInterval(v.interval);
      return v.value === null ? '<td class="na">–</td>' : `<td class="num" data-value="${escapeHtml(String(v.value))}">${escapeHtml(fmt(v.value, d))}${sh.range ? ` <span class="iv">${escapeHtml(fmtRange(sh.range, d))} ${escapeHtml(sh.kind ?? '')}</span>` : ''}</td>`;
    };
    rows.push(`<tr data-estimator="${n}"><th>${richHtml(labelOf(n).rich)}</th>${cell(c.D)}${cell(c.omega, 3)}${cell(c.amplitude)}${cell(c.correctionAmplitude)}${cell(c.relativeCorrection)}<td>${escapeHtml(win)}</td><td class="num">${escapeHtml(c.rss === null ? '–' : c.rss.toExponential(3))} / ${escapeHtml(c.rssPowerLaw === null ? '–' : c.rssPowerLaw.toExponential(3))}</td></tr>`);
  }
  const method = a.corrections.radiusOfGyration?.method ?? a.corrections.maxRadius?.method ?? '';
  return `<table id="corrections"><thead><tr><th>curve</th><th>D</th><th>ω</th><th>A</th><th>B</th><th>B N<sub>min</sub><sup>−ω</sup></th><th>window</th><th>residual sum of squares: with correction / pure power law</th></tr></thead><tbody>${rows.join('') || '<tr><td colspan="8" class="na">no corrections fit</td></tr>'}</tbody></table><p class="method">${escapeHtml(method)}</p>` +
    `<p class="rules-head">A fit gives D, ω, A and B only when every rule holds; otherwise it is reported as not determined, with the first rule that failed, and it stays out of the consistency panel:</p><ul class="rules">${CORRECTIONS_DETERMINED_RULES.map((r) => `<li>${escapeHtml(r)}</li>`).join('')}</ul>`;
}

function evCell(v: { mean: number; interval: IntervalSummary } | null | undefined, digits = 4): string {
  if (!v || !isFiniteNumber(v.mean)) return '<td class="num na">–</td>';
  const sh = evRange(v as Parameters<typeof evRange>[0]);
  return `<td class="num" data-value="${escapeHtml(String(v.mean))}">${escapeHtml(fmt(v.mean, digits))}${sh.range ? ` <span class="iv">${escapeHtml(fmtRange(sh.range, digits))} ${escapeHtml(sh.kind ?? '')}</span>` : ' <span class="iv">no interval</span>'}</td>`;
}

function verdictItem(key: string, text: string, verdict: boolean | null, yes: string, no: string, unknown: string): string {
  const cls = verdict === null ? 'na' : verdict ? 'ok' : 'warn';
  const v = verdict === null ? unknown : verdict ? yes : no;
  return `<li data-check="${key}">${richHtml(text)} <span class="${cls}" data-verdict="${verdict === null ? 'none' : verdict ? 'yes' : 'no'}">${escapeHtml(v)}</span></li>`;
}

function qIndex(s: HarmonicAtSize, q: number): number {
  return s.q.findIndex((v) => Math.abs(v - q) < 1e-9);
}

/** A q value as written on the grid (typographic minus). */
function qText(v: number): string {
  return `${v < 0 ? '−' : ''}${Math.abs(v)}`;
}

/** The checks of the harmonic section as a list: τ(1), τ′(1) against Makarov, Beurling, D_cap, the increment slope, τ(3) against D. */
function harmonicPanel(h: HarmonicSection, top: HarmonicAtSize | undefined): string {
  const items: string[] = [];
  const d3 = h.dimension === 3;
  if (top) {
    const cr = top.convergedRange;
    items.push(cr
      ? `<li data-check="q-range">${richHtml(`τ(q) converged (the two halves of the probes agree in at least 90% of the clusters) for q from ${qText(cr[0])} to ${qText(cr[1])} at N = ${fmtAbscissa(top.size)}; quote τ(q), D_{q} and f(α) only there.`)}</li>`
      : `<li data-check="q-range" class="na">${richHtml(`No q has converged τ(q) at N = ${fmtAbscissa(top.size)} (or convergence was not judged: a single probe job).`)}</li>`);
    const k1 = qIndex(top, 1);
    const t1 = k1 >= 0 ? top.tau[k1] : null;
    if (t1 && isFiniteNumber(t1.mean)) {
      const r = evRange(t1).range;
      items.push(verdictItem('tau1', `${valueText('τ(1)', t1.mean, t1.interval)} at N = ${fmtAbscissa(top.size)}: 0 by the normalisation Σ μ = 1, so this checks the fit.`, r ? r[0] <= 0 && r[1] >= 0 : null, 'contains 0', 'excludes 0', 'no interval'));
    } else items.push(`<li data-check="tau1" class="na">τ(1): q = 1 is not on the q grid or τ(1) is not finite.</li>`);
    const d1 = top.informationDimension;
    if (d3) {
      items.push(`<li data-check="makarov" class="na">${richHtml(`Information dimension: ${valueText('τ′(1) = D_{1}', d1?.mean, d1?.interval)}; Makarov's theorem (exactly 1) is planar: not judged in 3D.`)}</li>`);
    } else if (d1 && isFiniteNumber(d1.mean)) {
      const r = evRange(d1).range;
      items.push(verdictItem('makarov', `Information dimension: ${valueText('τ′(1) = D_{1}', d1.mean, d1.interval)}; Makarov (1985): exactly 1 for a connected planar set.`, r ? r[0] <= 1 && r[1] >= 1 : null, 'agrees (1 inside the interval)', 'disagrees (1 outside the interval)', 'no interval: not judged'));
    } else items.push('<li data-check="makarov" class="na">τ′(1) is not available.</li>');
    const ws = top.informationDimensionWithSystematic;
    if (!d3 && ws && top.systematic?.informationDimension !== null && top.systematic?.informationDimension !== undefined) {
      items.push(verdictItem('makarov-sys', `With the fit-window systematic (half the difference of the fits over the two halves of the ε window, ±${fmt(top.systematic.informationDimension, 3)}): τ′(1) in ${fmtRange(ws)}.`, ws[0] <= 1 && ws[1] >= 1, 'agrees with 1', 'disagrees with 1', 'not judged'));
    }
    const mc = top.maxConcentrationExponent;
    if (d3) items.push(`<li data-check="beurling" class="na">${richHtml(`Maximum concentration: ${valueText('α_{min}', mc?.mean, mc?.interval)}; Beurling's estimate is planar: not judged in 3D.`)}</li>`);
    else items.push(verdictItem('beurling', `Maximum concentration (max μ(B) scales as (ε/R) to the power α_{min}): ${valueText('α_{min}', mc?.mean, mc?.interval)}; Beurling: α_{min} ≥ 1/2 for a connected set as ε → 0, which a finite window does not resolve (coordinator/harmonic/beurling-check.ts).`, top.beurlingRespected ?? null, 'respected', 'not resolved at this size', 'not judged'));
  } else items.push('<li class="na">No probed size with a q grid.</li>');
  const g = h.capacityGrowth;
  if (g && isFiniteNumber(g.exponent)) {
    const dim = isFiniteNumber(g.dimension) ? `D_{cap} = 1/β = ${fmt(g.dimension)}${g.dimensionInterval ? ` ${fmtRange(g.dimensionInterval)}` : ' (no interval)'}` : 'D_{cap} not available';
    items.push(`<li data-check="capacity">${richHtml(`${d3 ? 'Newtonian capacity' : 'Capacity'} growth cap ∝ N^{β} over N = ${(g.sizes ?? []).map((n) => fmtAbscissa(n)).join(', ')}: ${valueText('β', g.exponent, g.exponentInterval)};`)} <b>${richHtml(dim)}</b>.</li>`);
  } else items.push(`<li data-check="capacity" class="na">Capacity growth: no fit (${escapeHtml(g?.reason ?? 'not available')}).</li>`);
  const c = h.capacityIncrement;
  if (c && isFiniteNumber(c.slope)) {
    items.push(verdictItem('increment', `Capacity increment: log–log slope of mean ${d3 ? 'Δ(−1/C)/ΔN (C Newtonian; the 3D form)' : 'Δ ln cap/ΔN'} against Z(3), ${valueText('slope', c.slope, c.slopeInterval, 3)}; proportional means slope 1.`, c.proportional ?? null, 'proportional (1 inside the interval)', 'not proportional (1 outside the interval)', 'not judged'));
  } else items.push(`<li data-check="increment" class="na">Capacity increment: no slope (${escapeHtml(c?.reason ?? 'not available')}).</li>`);
  const e = h.electrostatic;
  if (e) {
    const md = e.massDimension;
    const est = md ? labelOf(md.estimator).rich : '';
    const dText = md ? (isFiniteNumber(md.value) ? `D from ${est} = ${fmt(md.value)}${md.interval ? ` ${fmtRange(md.interval)}` : ' (no interval)'}` : `D from ${est} not available`) : 'no mass-based D';
    const fromTau3 = d3 && e.dimensionFromTau3 ? `; D from τ(3) = τ(3) − 1 = ${fmt(e.dimensionFromTau3.value)}${e.dimensionFromTau3.interval ? ` ${fmtRange(e.dimensionFromTau3.interval)}` : ' (no interval)'}` : '';
    items.push(verdictItem('electrostatic', `Electrostatic scaling law ${(e.relation ?? 'tau(3) = D').replace('tau', 'τ')} at N = ${fmtAbscissa(e.size)}, τ(3) from the box fit: ${valueText('τ(3)', e.tau3?.mean, e.tau3?.interval)}${fromTau3}; ${dText} (${e.source}).`, e.consistent ?? null, 'consistent (intervals overlap)', 'inconsistent (intervals do not overlap)', 'not judged'));
    if (e.consistentWithSystematic !== null && e.consistentWithSystematic !== undefined) {
      items.push(verdictItem('electrostatic-sys', `τ(3) with its fit-window systematic against the same D.`, e.consistentWithSystematic, 'consistent', 'inconsistent', 'not judged'));
    }
    const ps = e.particleScale;
    if (ps && isFiniteNumber(ps.ratio)) {
      const says = d3 ? (ps.expected ? `the law says 1 + 1/D, in ${fmtRange(ps.expected, 3)} from the interval of D` : 'the law says 1 + 1/D; no interval of D') : 'the law says 1';
      items.push(verdictItem('electrostatic-particle', `The same law at particle scale, Z(3) ∝ N^{−τ(3)/D} over N = ${ps.sizes.map((n) => fmtAbscissa(n)).join(', ')} (${ps.clusters} clusters): ${valueText('τ(3)/D', ps.ratio, ps.ratioInterval, 3)}; ${says}.`, ps.consistent ?? null, d3 ? 'consistent (intervals overlap)' : 'consistent (1 inside the interval)', d3 ? 'inconsistent (intervals do not overlap)' : 'inconsistent (1 outside the interval)', 'not judged'));
    } else if (ps) items.push(`<li data-check="electrostatic-particle" class="na">Particle-scale form of τ(3) = D: not available (${escapeHtml(ps.reason ?? 'no ratio')}).</li>`);
  }
  const b = h.breakdownRelation;
  if (b) {
    const ivText = (v: { estimate: number | null; low: number | null; high: number | null }, digits = 3): string =>
      isFiniteNumber(v.estimate) ? `${fmt(v.estimate, digits)}${isFiniteNumber(v.low) && isFiniteNumber(v.high) ? ` ${fmtRange([v.low, v.high])}` : ' (no interval)'}` : 'not available';
    const verdict = b.verdict === 'undetermined' ? null : b.verdict === 'consistent';
    items.push(verdictItem('breakdown', `Dielectric breakdown relation τ(η + 2) − τ(η) = D at η = ${fmt(b.eta, 3)}, particle scale, over N = ${b.sizes.map((n) => fmtAbscissa(n)).join(', ')} (${b.clusters} clusters): τ(η + 2) − τ(η) = ${ivText(b.tauDifference)}; D of the same sets = ${ivText(b.massDimension)}${b.reason ? ` (${b.reason})` : ''}. Rule: ${b.rule}. Source: ${b.source}.`, verdict, 'consistent (intervals overlap)', 'inconsistent (intervals do not overlap)', 'undetermined'));
    const ci = b.capacityIncrement;
    const civ = ci.verdict === 'undetermined' ? null : ci.verdict === 'proportional';
    items.push(verdictItem('breakdown-increment', `Capacity increment at η = ${fmt(b.eta, 3)}: log–log slope of mean Δ ln cap/ΔN against Z(η + 2)/Z(η), slope = ${ivText(ci.slope)}${ci.reason ? ` (${ci.reason})` : ''}; proportional means slope 1. Rule: ${ci.rule}.`, civ, 'proportional (1 inside the interval)', 'not proportional (1 outside the interval)', 'undetermined'));
  }
  return `<ul id="harmonic-panel">${items.join('')}</ul>`;
}

function harmonicTauTable(top: HarmonicAtSize): string {
  const rows = top.q.map((q, k) => {
    const t = top.tau[k];
    const dq = top.dq?.[k];
    const frac = top.convergedFraction?.[k];
    const conv = frac === null || frac === undefined ? '<td class="na" data-converged="none">not judged</td>' : `<td class="${top.converged[k] ? 'ok' : 'warn'}" data-converged="${top.converged[k] ? 'yes' : 'no'}">${top.converged[k] ? 'yes' : 'no'}</td>`;
    return `<tr data-q="${escapeHtml(String(q))}"${top.converged[k] ? '' : ' class="not-converged"'}><td class="num">${escapeHtml(fmt(q, 2))}</td>${evCell(t)}${isFiniteNumber(dq) ? num(dq) : `<td class="num na">${Math.abs(q - 1) < 1e-9 ? 'see τ′(1)' : '–'}</td>`}${isFiniteNumber(frac) ? `<td class="num">${escapeHtml((frac * 100).toFixed(0))}%</td>` : '<td class="num na">–</td>'}${conv}</tr>`;
  });
  return `<h3>τ(q) and D<sub>q</sub> at N = ${escapeHtml(fmtAbscissa(top.size))} (${top.clusters} cluster(s), ${escapeHtml(fmtAbscissa(top.walkers))} walkers each)</h3>` +
    `<table id="harmonic-tau"><thead><tr><th>q</th><th>τ(q), interval</th><th>D<sub>q</sub> = τ(q)/(q − 1)</th><th>clusters whose probe halves agree</th><th>converged (≥ 90%)</th></tr></thead><tbody>${rows.join('')}</tbody></table>`;
}

function harmonicSizesTable(sizes: HarmonicAtSize[], d3: boolean): string {
  const rows = sizes.map((s) => {
    const nc = s.converged.filter(Boolean).length;
    const cap = d3 ? (s.capacity ? evCell(s.capacity) : '<td class="num na">–</td>') : evCell(s.logCapacity);
    return `<tr data-size="${s.size}"><td class="num">${escapeHtml(fmtAbscissa(s.size))}</td><td class="num">${s.clusters}</td><td class="num">${escapeHtml(fmtAbscissa(s.walkers))}</td>${evCell(s.informationDimension)}${evCell(s.maxConcentrationExponent)}${cap}${s.z3 && isFiniteNumber(s.z3.mean) ? `<td class="num">${escapeHtml(s.z3.mean.toExponential(3))}</td>` : '<td class="num na">–</td>'}${evCell(s.tau3)}<td class="num">${nc} of ${s.q.length}</td></tr>`;
  });
  return `<h3>By probed size</h3><table id="harmonic-sizes"><thead><tr><th>N</th><th>clusters</th><th>${d3 ? 'probes that hit, per cluster' : 'walkers per cluster'}</th><th>τ′(1)</th><th>α<sub>min</sub></th><th>${d3 ? 'Newtonian capacity C' : 'mean ln cap'}</th><th>Z(3)</th><th>τ(3)</th><th>q converged</th></tr></thead><tbody>${rows.join('')}</tbody></table>`;
}

/** The "Harmonic measure" section: settings, checks, tables and figures. */
function harmonicSection(h: HarmonicSection, figures: Figure[], hasPng: boolean): string {
  const sizes = sizesLargestFirst(h);
  const top = sizes[0];
  const pr = h.probe;
  const out: string[] = [];
  out.push(`<p class="method" id="harmonic-settings">Probes: ${escapeHtml(String(pr?.walkers ?? '–'))} walkers in ${escapeHtml(String(pr?.jobs ?? '–'))} job(s) per cluster and size; sizes N = ${escapeHtml((pr?.sizes ?? []).map((n) => fmtAbscissa(n)).join(', ') || '–')}; q from ${escapeHtml(fmt(pr?.q?.length ? Math.min(...pr.q) : null, 2))} to ${escapeHtml(fmt(pr?.q?.length ? Math.max(...pr.q) : null, 2))} (${pr?.q?.length ?? 0} values); contact sample ${escapeHtml(String(pr?.contactSample ?? '–'))}; minimum step ${escapeHtml(String(pr?.minStep ?? '–'))}. Clusters probed at every size: ${h.clustersAtAllSizes}. Convention: ${escapeHtml(h.convention)}.</p>`);
  out.push('<h3>Checks</h3>', harmonicPanel(h, top));
  if (top) out.push(harmonicTauTable(top));
  if (sizes.length) out.push(harmonicSizesTable(sizes, h.dimension === 3));
  if (sizes.length === 1) out.push('<p class="na" id="harmonic-one-size">One size was probed: no capacity growth, no capacity increments and no other sizes in the figures.</p>');
  out.push(...figures.map((f) => figureHtml(f, hasPng)));
  return out.join('\n');
}

function notesSection(a: EnsembleAnalysis, own: string[]): string {
  const items: string[] = [];
  for (const n of a.notes) items.push(n);
  for (const n of ['radiusOfGyration', 'maxRadius', 'massRadius'] as const) {
    const e = a.estimators[n];
    for (const t of e.interval.notes) items.push(`${labelOf(n).plain}: ${t}`);
  }
  for (const n of own) items.push(n);
  const uniq = [...new Set(items)];
  return uniq.length ? `<ul id="notes">${uniq.map((t) => `<li>${escapeHtml(t)}</li>`).join('')}</ul>` : '<p id="notes" class="na">No remarks.</p>';
}

function headerSection(input: ReportInput, title: string): string {
  const a = input.analysis;
  const engines = [...new Set(input.runs.map((r) => r.engineVersion))];
  const facts: [string, string][] = [];
  if (input.ensembleId) facts.push(['ensemble', input.ensembleId]);
  facts.push(['model', a.modelKind ?? '(unknown)']);
  facts.push(['clusters analysed', `${a.clusters}${a.duplicatesDropped ? ` (${a.duplicatesDropped} duplicate result(s) counted once)` : ''}`]);
  facts.push(['final cluster size N', String(a.finalSize)]);
  facts.push(['engine version of the runs', engines.length ? engines.join(', ') : '(no runs)']);
  facts.push(['engine version of this coordinator', ENGINE_VERSION]);
  facts.push(['bootstrap', `${a.options.resamples} resamples of whole clusters, level ${levelPercent({ level: a.options.level } as IntervalSummary)}, seed ${a.options.seed}; ${a.options.generator}`]);
  facts.push(['averaging', a.averaging]);
  const factRows = facts.map(([k, v]) => `<tr><th>${escapeHtml(k)}</th><td>${escapeHtml(v)}</td></tr>`).join('');
  let spec = '';
  if (input.spec) {
    const doc = specToDocument(input.spec);
    spec = `<h3>Ensemble spec</h3><table id="spec"><tbody>${Object.entries(doc).map(([k, v]) => `<tr><th>${escapeHtml(k)}</th><td><code>${escapeHtml(typeof v === 'string' ? v : JSON.stringify(v))}</code></td></tr>`).join('')}</tbody></table>`;
  } else spec = '<p class="na">No spec was given to the report.</p>';
  // headline: D from R_g (the primary estimator) with its interval
  const rg = a.estimators.radiusOfGyration;
  const sh = shownInterval(rg.interval);
  const headline = rg.available && rg.D !== null
    ? `<p class="headline">D from R<sub>g</sub>(N) = <b>${escapeHtml(fmt(rg.D))}</b>${sh.range ? `, ${escapeHtml(levelPercent(rg.interval))} ${escapeHtml(sh.kind ?? '')} interval <b>${escapeHtml(fmtRange(sh.range))}</b>` : ` <span class="warn">(no interval: ${escapeHtml(STATUS_TEXT[rg.interval.status])})</span>`}${a.consistency.reference ? `; published ${escapeHtml(String(a.consistency.reference.D))}` : ''}.</p>`
    : `<p class="headline warn">D from R<sub>g</sub>(N) is not available: ${escapeHtml(rg.reason ?? 'unknown reason')}.</p>`;
  const mismatch = engines.length > 1 ? `<p class="warn">Runs of different engine versions are mixed: ${escapeHtml(engines.join(', '))}.</p>` : '';
  return `<header><h1>${escapeHtml(title)}</h1>${headline}${mismatch}<table id="facts"><tbody>${factRows}</tbody></table>${spec}</header>`;
}

export const CSS = `
body { font-family: ${FONT_FAMILY}; margin: 24px auto; max-width: 1120px; padding: 0 16px; color: #111; line-height: 1.4; }
h1 { font-size: 26px; margin-bottom: 6px; } h2 { margin-top: 34px; border-bottom: 1px solid #ccc; padding-bottom: 4px; } h3 { margin-bottom: 6px; }
table { border-collapse: collapse; margin: 8px 0 14px; font-size: 14px; display: block; max-width: 100%; overflow-x: auto; }
td:not(.num) { overflow-wrap: anywhere; } td[data-status] { overflow-wrap: normal; white-space: nowrap; } td code { white-space: pre-wrap; overflow-wrap: anywhere; }
th, td { border: 1px solid #d0d0d0; padding: 4px 8px; text-align: left; vertical-align: top; }
thead th { background: #f2f2f2; } td.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
td.ok { color: #05620f; } .warn { color: #a00000; } .na { color: #777; }
.rule { color: #444; font-size: 13px; margin: -8px 0 12px; } .note { background: #fff8e1; border-left: 3px solid #e0a800; padding: 6px 10px; font-size: 14px; }
.headline { font-size: 19px; } .iv { color: #555; font-size: 12px; } .method { color: #444; font-size: 13px; }
figure { margin: 18px 0 28px; } figure svg { max-width: 100%; height: auto; border: 1px solid #eee; }
figcaption { font-size: 14px; color: #333; max-width: 860px; } figcaption a { margin-right: 10px; }
code, pre { font-family: 'DejaVu Sans Mono', Menlo, Consolas, monospace; font-size: 12.5px; } pre { background: #f7f7f7; padding: 8px; overflow-x: auto; }
`;

export function fontFaces(): string {
  return embeddableFonts().map((f) => `@font-face { font-family: 'Roboto'; font-style: ${f.style}; font-weight: ${f.weight === 'bold' ? 700 : 400}; src: url(data:font/ttf;base64,${f.base64}) format('truetype'); }`).join('\n');
}

export function figureHtml(f: Figure, hasPng: boolean): string {
  const links = `<a href="plots/${escapeHtml(f.name)}.svg">SVG</a>${hasPng ? `<a href="plots/${escapeHtml(f.name)}.png">PNG</a>` : ''}`;
  return `<figure id="figure-${escapeHtml(f.name)}">${f.svg}<figcaption>${richHtml(f.caption)} ${links}</figcaption></figure>`;
}

function resolveSample(s: SampleClusterInput): { points: PointSet; runIndex: number | null } {
  if (s instanceof Uint8Array) return { points: decodeSnapshot(s), runIndex: null };
  if ('points' in s) return { points: s.points instanceof Uint8Array ? decodeSnapshot(s.points) : s.points, runIndex: s.runIndex ?? null };
  return { points: s, runIndex: null };
}

/** Build the figures and the page (no I/O). */
export function buildEnsembleReport(input: ReportInput): { html: string; figures: Figure[]; extraPngs: { name: string; png: Buffer }[]; notes: string[] } {
  const a = input.analysis;
  const notes: string[] = [];
  let data: EnsembleData | null = null;
  try {
    data = extractEnsembleData(input.runs);
    if (data.clusters !== a.clusters) notes.push(`the runs given to the report hold ${data.clusters} cluster(s), the analysis ${a.clusters}: curves are drawn from the runs`);
  } catch (e) {
    notes.push(`the run results could not be read for the curves: ${(e as Error).message}`);
  }
  if (a.clusters === 1) notes.push('a single cluster: no spread across clusters and no bootstrap intervals');
  const figures: Figure[] = [];
  figures.push(comparisonFigure(a));
  for (const n of ['radiusOfGyration', 'maxRadius', 'massRadius'] as const) {
    if (a.estimators[n].reason === 'not requested') continue;
    figures.push(estimatorFigure(a, data, n));
  }
  figures.push(localSlopesFigure(a, 'N'));
  if (a.estimators.massRadius.reason !== 'not requested') figures.push(localSlopesFigure(a, 'r'));
  if (a.options.corrections) figures.push(correctionsFigure(a, data));
  figures.push(...observableFigures(a.observables));
  if (input.baseline) {
    const base = input.baseline;
    const combined = a.observables ? anisotropyComparisonFigure({ label: base.own, observables: a.observables }, { label: base.label, observables: base.observables }, base.fold) : null;
    if (combined) figures.push(combined.figure);
    else notes.push(`no figure against the baseline ${base.label}: this ensemble has no fold_amplitude_${base.fold} observable`);
  }
  const extraPngs: { name: string; png: Buffer }[] = [];
  let viewer3d: string | null = null;
  if (input.sampleCluster !== undefined) {
    try {
      const s = resolveSample(input.sampleCluster);
      if (s.points.count === 0) throw new Error('the sample cluster has no particles');
      if (s.points.dimension === 3) {
        const pic = clusterPicture3d(s.points, s.runIndex);
        figures.push(pic.figure);
        extraPngs.push({ name: 'sample-cluster-raster', png: pic.png });
        viewer3d = pic.viewerHtml;
      } else {
        const pic = clusterFigure(s.points, s.runIndex);
        figures.push(pic.figure);
        extraPngs.push({ name: 'sample-cluster-raster', png: pic.png });
      }
    } catch (e) {
      notes.push(`no sample cluster picture: ${(e as Error).message}`);
    }
  } else notes.push(input.pictureNotes?.sampleCluster ?? 'no sample cluster was given: no cluster picture');
  const harmonic = a.harmonic ?? null;
  const harmonicFigs: Figure[] = [];
  if (harmonic) {
    harmonicFigs.push(...harmonicFigures(harmonic));
    if (input.measurePicture) {
      const pic = measurePictureFigure(input.measurePicture);
      harmonicFigs.push(pic);
      if (!pic.note) extraPngs.push({ name: 'harmonic-measure-raster', png: Buffer.from(input.measurePicture.png) });
    } else notes.push(harmonic.dimension === 3 ? 'no harmonic measure picture: it is drawn for planar clusters only' : input.pictureNotes?.measurePicture ?? 'no harmonic measure picture was given');
  } else if (input.measurePicture) notes.push('a harmonic measure picture was given but the statistics have no harmonic section: not shown');
  for (const f of [...figures, ...harmonicFigs]) if (f.note) notes.push(`figure ${f.name}: ${f.note}`);

  const title = input.title ?? `Ensemble report: ${input.spec?.name ?? a.modelKind ?? 'unnamed ensemble'}`;
  const wantPng = input.png ?? true;
  const hasPng = wantPng && pngRenderer().renderer !== null;
  const html = [
    '<!DOCTYPE html>',
    '<html lang="en"><head><meta charset="utf-8">',
    `<title>${escapeHtml(title)}</title>`,
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    `<style>${input.embedFont ?? true ? fontFaces() : ''}${CSS}</style>`,
    '</head><body>',
    headerSection(input, title),
    '<h2 id="section-estimates">Estimates of the fractal dimension</h2>',
    estimatesTable(a),
    '<h2 id="section-consistency">Consistency</h2>',
    consistencySection(a),
    '<h2 id="section-corrections">Corrections to scaling</h2>',
    correctionsSection(a),
    '<h2 id="section-notes">Notes</h2>',
    notesSection(a, notes),
    '<h2 id="section-figures">Figures</h2>',
    ...figures.map((f) => figureHtml(f, hasPng)),
    ...(viewer3d !== null ? ['<h2 id="section-cluster-3d">The sample cluster in 3D</h2>', viewer3d] : []),
    ...(harmonic ? ['<h2 id="section-harmonic">Harmonic measure</h2>', harmonicSection(harmonic, harmonicFigs, hasPng)] : []),
    '<h2 id="section-options">Analysis options</h2>',
    `<pre id="options">${escapeHtml(JSON.stringify(a.options, null, 2))}</pre>`,
    '</body></html>',
    '',
  ].join('\n');
  return { html, figures: [...figures, ...harmonicFigs], extraPngs, notes };
}

/**
 * Write report.html, plots/*.svg and plots/*.png into `dir` (created if
 * missing). Returns the paths written and the report's own remarks.
 */
export async function writeEnsembleReport(dir: string, input: ReportInput): Promise<ReportFiles> {
  const { renderer, reason } = input.png ?? true ? pngRenderer() : { renderer: null, reason: null };
  const built = buildEnsembleReport(input);
  const notes = [...built.notes];
  if (reason) notes.push(reason);
  const plots = join(dir, 'plots');
  await mkdir(plots, { recursive: true });
  const svgs: string[] = [], pngs: string[] = [];
  for (const f of built.figures) {
    const svgPath = join(plots, `${f.name}.svg`);
    await writeFile(svgPath, `<?xml version="1.0" encoding="UTF-8"?>\n${f.svg}\n`);
    svgs.push(svgPath);
    if (renderer) {
      try {
        const pngPath = join(plots, `${f.name}.png`);
        await writeFile(pngPath, renderer.render(f.svg, input.pngScale ?? 2));
        pngs.push(pngPath);
      } catch (e) {
        notes.push(`PNG of ${f.name} failed: ${(e as Error).message}`);
      }
    }
  }
  for (const x of built.extraPngs) {
    const p = join(plots, `${x.name}.png`);
    await writeFile(p, x.png);
    pngs.push(p);
  }
  // remarks that arose while writing (renderer missing, a PNG failed) go on the page too
  const late = notes.filter((n) => !built.notes.includes(n));
  const page = late.length
    ? built.html.replace('<h2 id="section-figures">', `<ul class="warn" id="file-notes">${late.map((n) => `<li>${escapeHtml(n)}</li>`).join('')}</ul>\n<h2 id="section-figures">`)
    : built.html;
  const html = join(dir, 'report.html');
  await writeFile(html, page);
  return { html, svgs, pngs, figures: built.figures.map((f) => f.name), notes };
}
