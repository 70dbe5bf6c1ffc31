/**
 * The report of a sweep (coordinator/summary/sweep-summary.ts): report.html
 * in the sweep's folder with the D(parameter) plot and the table, beside the
 * members' own folders (each with its ensemble report).
 *
 * The plot (svg-plot.ts): per estimator, the point estimates against the
 * swept value with their bootstrap intervals (markers slightly offset in x
 * so the intervals do not hide each other), the line D = 2 (the plane); for
 * a sweep over the breakdown exponent η also the lower bound (4 − η)/2 on
 * [0, 2) (Losev & Smirnov 2023) and the DLA value at η = 1 (Menshutin,
 * Shchur & Vinokur 2008), and τ(η+2) − τ(η) when the members have it.
 */
import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { SweepSummary } from '../summary/sweep-summary.js';
import { LOCAL_SLOPES_SHOWN } from '../summary/sweep-summary.js';
import { memberFolder } from '../spec/sweep.js';
import { CSS, escapeHtml, figureHtml, fontFaces, richHtml } from './html-report.js';
import { labelOf, fmt, fmtRange, fmtAbscissa } from './labels.js';
import { emptyFigure, type Figure } from './plots.js';
import { pngRenderer } from './png-plot.js';
import { COLOURS, Plot } from './svg-plot.js';

const FIGURE_NAME = 'sweep-dimension';

/** The D(parameter) figure of a sweep. */
export function sweepFigure(s: SweepSummary): Figure {
  // plot text is rich text ("_" starts a subscript): a parameter name is shown with spaces for its underscores
  const p = s.parameter.replace(/[_^]/g, ' ');
  const title = `Fractal dimension D against ${p === 'eta' ? 'η' : p}`;
  const names = s.estimatorNames.filter((k) => s.rows.some((r) => r.estimators[k]?.D !== null && r.estimators[k]?.D !== undefined));
  if (names.length === 0) return emptyFigure(FIGURE_NAME, title, 'no member of the sweep has an estimate of D yet');
  const xs = s.rows.map((r) => r.value);
  const span = Math.max(...xs) - Math.min(...xs) || 1;
  const offset = (i: number) => (i - (names.length - 1) / 2) * span * 0.012;
  const plot = new Plot({
    idPrefix: FIGURE_NAME, title, height: 520,
    // room beside the outermost values for the shifted markers and the labels of the reference lines
    x: { label: p === 'eta' ? 'η (breakdown exponent)' : p, kind: 'linear', domain: [Math.min(...xs) - span * 0.06, Math.max(...xs) + span * 0.06] },
    y: { label: 'fractal dimension D', kind: 'linear' },
    legend: 'below',
  });
  const b = s.breakdown;
  plot.hline(2, { colour: COLOURS.grey, width: 1.2, dash: '2 3' }, 'D = 2', 'right', true);
  if (b) {
    const lo = Math.max(0, Math.min(...xs));
    if (lo < 2) {
      const hi = Math.min(2, Math.max(...xs, 2));
      const bx = [lo, hi - 1e-9];
      plot.line(bx, bx.map((e) => (4 - e) / 2), { colour: COLOURS.black, width: 1.6, dash: '7 4' }, 'lower bound (4 − η)/2, 0 ≤ η < 2 (Losev & Smirnov 2023)');
    }
    if (Math.max(...xs) >= 3) plot.vline(b.transition.etaC, { colour: COLOURS.orange, width: 1.2, dash: '4 4' }, 'η_c ≈ 4', false, 'predicted non-fractal transition η_c ≈ 4 (Hastings 2001)');
  }
  names.forEach((k, i) => {
    const lab = labelOf(k);
    const withD = s.rows.filter((r) => r.estimators[k]?.D !== null && r.estimators[k]?.D !== undefined);
    const px = withD.map((r) => r.value + offset(i));
    const ivRows = withD.filter((r) => r.estimators[k].interval);
    if (ivRows.length > 0) {
      plot.errorBars(ivRows.map((r) => r.value + offset(i)), ivRows.map((r) => r.estimators[k].interval![0]), ivRows.map((r) => r.estimators[k].interval![1]), lab.colour, 1.6, 4);
    }
    plot.line(px, withD.map((r) => r.estimators[k].D!), { colour: lab.colour, width: 1, opacity: 0.5 });
    plot.points(px, withD.map((r) => r.estimators[k].D!), lab.colour, `D from ${lab.rich}`, lab.marker, 4.5);
  });
  // the DLA value last, over the estimates at η = 1
  if (b) plot.points([b.dla.eta], [b.dla.D], COLOURS.purple, `DLA at η = 1: D = ${b.dla.D} (Menshutin, Shchur & Vinokur 2008)`, 'diamond', 8, true);
  const rel = s.rows.filter((r) => r.breakdownRelation?.tauDifference.estimate !== null && r.breakdownRelation?.tauDifference.estimate !== undefined);
  if (rel.length > 0) {
    const rx = rel.map((r) => r.value - span * 0.025);
    const withIv = rel.filter((r) => r.breakdownRelation!.tauDifference.low !== null && r.breakdownRelation!.tauDifference.high !== null);
    if (withIv.length > 0) plot.errorBars(withIv.map((r) => r.value - span * 0.025), withIv.map((r) => r.breakdownRelation!.tauDifference.low!), withIv.map((r) => r.breakdownRelation!.tauDifference.high!), COLOURS.sky, 1.4, 3);
    plot.points(rx, rel.map((r) => r.breakdownRelation!.tauDifference.estimate!), COLOURS.sky, 'τ(η+2) − τ(η) (harmonic measure)', 'triangle', 4.5, true);
  }
  const level = s.rows.flatMap((r) => Object.values(r.estimators)).find((e) => e.level !== null)?.level ?? null;
  const caption =
    `Each marker: D of one member ensemble from one estimator, with its ${level !== null ? `${Number((level * 100).toFixed(1))}% ` : ''}bootstrap interval (BCa when available, else percentile); markers of different estimators are shifted slightly in ${p} so that their intervals stay visible. Dotted grey: D = 2, the plane.` +
    (b
      ? ` Dashed black: the lower bound (4 − η)/2 on 0 ≤ η < 2, ${b.bound.source}. Hollow diamond: DLA at η = 1, D = ${b.dla.D} (${b.dla.source}).` +
        (Math.max(...xs) >= 3 ? ` Dashed orange: the predicted non-fractal transition near η_c ≈ ${b.transition.etaC} (${b.transition.source}), context only.` : '')
      : '') +
    (rel.length > 0 ? ' Hollow triangles: τ(η+2) − τ(η) from the harmonic measure of the same clusters, with its interval.' : '');
  return { name: FIGURE_NAME, title, caption, svg: plot.toSvg(), note: null };
}

function cellNum(v: number | null | undefined, digits = 4): string {
  return v === null || v === undefined || !Number.isFinite(v) ? '<td class="num na">–</td>' : `<td class="num" data-value="${escapeHtml(String(v))}">${escapeHtml(fmt(v, digits))}</td>`;
}

/** The table: one row per value, per estimator D [interval], the last local slope, and the verdicts. */
function sweepTable(s: SweepSummary): string {
  const names = s.estimatorNames;
  const withRel = s.rows.some((r) => r.breakdownRelation !== null);
  const head = [`<th>${escapeHtml(s.parameter)}</th>`, '<th>clusters</th>'];
  for (const k of names) head.push(`<th>D from ${richHtml(labelOf(k).rich)}</th><th>interval</th><th>local slope at the largest size</th>${s.breakdown ? '<th>bound verdict</th>' : ''}`);
  if (s.breakdown) head.push('<th>lower bound (4 − η)/2</th>');
  if (withRel) head.push('<th>τ(η+2) − τ(η)</th><th>interval</th><th>verdict</th>');
  const rows = s.rows.map((r) => {
    const cells = [cellNum(r.value, 3), `<td class="num">${r.clusters}${r.partial ? ` of ${r.clustersPlanned}` : ''}</td>`];
    for (const k of names) {
      const e = r.estimators[k];
      const ls = e?.localSlopes.at(-1);
      cells.push(cellNum(e?.D), e?.interval ? `<td class="num">${escapeHtml(fmtRange(e.interval))}</td>` : `<td class="na">${escapeHtml(e?.reason ?? e?.status ?? '–')}</td>`);
      cells.push(ls ? `<td class="num">${escapeHtml(fmt(ls.D, 3))} ${ls.interval ? `<span class="iv">${escapeHtml(fmtRange(ls.interval, 3))}</span>` : ''} at ${escapeHtml(fmtAbscissa(ls.at))}</td>` : '<td class="na">–</td>');
      if (s.breakdown) cells.push(`<td data-verdict="${escapeHtml(e?.boundVerdict ?? '')}" class="${e?.boundVerdict === 'below bound' ? 'warn' : ''}">${escapeHtml(e?.boundVerdict ?? (r.bound === null ? 'no bound' : '–'))}</td>`);
    }
    if (s.breakdown) cells.push(cellNum(r.bound, 3));
    if (withRel) {
      const b = r.breakdownRelation;
      cells.push(cellNum(b?.tauDifference.estimate), b && b.tauDifference.low !== null && b.tauDifference.high !== null ? `<td class="num">${escapeHtml(fmtRange([b.tauDifference.low, b.tauDifference.high]))}</td>` : '<td class="na">–</td>', `<td>${escapeHtml(b?.verdict ?? '–')}</td>`);
    }
    return `<tr data-value="${escapeHtml(String(r.value))}">${cells.join('')}</tr>`;
  });
  return `<table id="sweep-table"><thead><tr>${head.join('')}</tr></thead><tbody>${rows.join('')}</tbody></table>` +
    `<p class="rule">Local slope: the effective D of a sliding window centred at the largest sizes (the last of the ${LOCAL_SLOPES_SHOWN} kept in sweep.json); far from D, the estimate has not converged.</p>`;
}

function breakdownSection(s: SweepSummary): string {
  const b = s.breakdown;
  if (!b) return '';
  const mono = Object.entries(b.monotonic.byEstimator).map(([k, m]) => `<li data-estimator="${escapeHtml(k)}">${richHtml(labelOf(k).rich)}: <b>${escapeHtml(m.verdict)}</b>${m.steps.length ? ` (${m.steps.map((st) => `${st.from} → ${st.to}: ${st.verdict}`).map(escapeHtml).join('; ')})` : ''}</li>`).join('');
  const near = b.transition.rows.map((r) => `<li>η = ${escapeHtml(String(r.value))}: ${Object.entries(r.estimators).filter(([, e]) => e.D !== null).map(([k, e]) => `${richHtml(labelOf(k).rich)} ${escapeHtml(fmt(e.D))}${e.lastLocalSlope ? ` (local slope ${escapeHtml(fmt(e.lastLocalSlope.D, 3))} at ${escapeHtml(fmtAbscissa(e.lastLocalSlope.at))})` : ''}`).join(', ')}</li>`).join('');
  return '<h2 id="section-breakdown">The breakdown exponent η</h2>' +
    `<p id="bound-rule"><b>Lower bound</b> (4 − η)/2 for 0 ≤ η &lt; 2, ${escapeHtml(b.bound.source)}. Rule: ${escapeHtml(b.bound.rule)}.</p>` +
    `<p><b>D decreasing in η</b>. Rule: ${escapeHtml(b.monotonic.rule)}.</p><ul id="monotonic">${mono}</ul>` +
    `<p id="transition"><b>Context:</b> ${escapeHtml(b.transition.statement)} (${escapeHtml(b.transition.source)}).</p>` +
    (near ? `<ul>${near}</ul>` : `<p class="na">No value at η ≥ 3 in this sweep.</p>`);
}

/** The page (no I/O). */
export function buildSweepReport(s: SweepSummary, hasPng = false, embedFont = true): { html: string; figure: Figure } {
  const figure = sweepFigure(s);
  const title = `Sweep report: ${s.name}${s.partial ? ' (partial)' : ''}`;
  const members = s.rows.map((r) => `<li><a href="${escapeHtml(memberFolder(s.parameter, r.value))}/report.html">${escapeHtml(s.parameter)} = ${escapeHtml(String(r.value))}</a> (ensemble ${escapeHtml(r.ensembleId)})</li>`).join('');
  const html = [
    '<!DOCTYPE html>',
    '<html lang="en"><head><meta charset="utf-8">',
    `<title>${escapeHtml(title)}</title>`,
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    `<style>${embedFont ? fontFaces() : ''}${CSS}</style>`,
    '</head><body>',
    `<h1>${escapeHtml(title)}</h1>`,
    `<p>Model <code>${escapeHtml(s.modelKind)}</code>, ${escapeHtml(s.parameter)} swept over ${s.values.map((v) => escapeHtml(String(v))).join(', ')}; sweep ${escapeHtml(s.sweepId)}, seed ${escapeHtml(s.seed)}. Each value is its own ensemble with a seed derived from the sweep's: ${escapeHtml(s.seedRule)}.</p>`,
    `<h2 id="section-sweep-figure">D against ${escapeHtml(s.parameter)}</h2>`,
    figureHtml(figure, hasPng),
    '<h2 id="section-sweep-table">Table</h2>',
    sweepTable(s),
    breakdownSection(s),
    '<h2 id="section-members">Members</h2>',
    `<ul id="members">${members}</ul>`,
    '</body></html>',
    '',
  ].join('\n');
  return { html, figure };
}

/** Write report.html and plots/sweep-dimension.svg (and .png when a renderer is at hand) into `dir`. */
export async function writeSweepReport(dir: string, s: SweepSummary): Promise<string[]> {
  const { renderer } = pngRenderer();
  const { html, figure } = buildSweepReport(s, renderer !== null);
  await mkdir(join(dir, 'plots'), { recursive: true });
  const written = ['report.html', `plots/${figure.name}.svg`];
  await writeFile(join(dir, 'plots', `${figure.name}.svg`), `<?xml version="1.0" encoding="UTF-8"?>\n${figure.svg}\n`);
  if (renderer) {
    await writeFile(join(dir, 'plots', `${figure.name}.png`), renderer.render(figure.svg, 2));
    written.push(`plots/${figure.name}.png`);
  }
  await writeFile(join(dir, 'report.html'), html);
  return written;
}
