/**
 * Figures of the model observables of an ensemble (statistics.observables,
 * coordinator/stats/observable-bands.ts): lattice anisotropy against N with
 * bootstrap bands and the isotropic noise level of the k-fold amplitude
 * (coordinator/stats/fold-noise.ts), the Eden interface width against the
 * mean radius with its fitted growth exponent beside the KPZ slope 1/3, and,
 * when the report is given an isotropic baseline ensemble (`tendril run
 * --baseline`), one figure with this ensemble's k-fold amplitude and the
 * baseline's on the same axes (coordinator/stats/anisotropy-comparison.ts).
 */
import type { FoldNoise, ObservableBand, ObservableSection } from '../stats/observable-bands.js';
import { compareWithBaseline, type AnisotropyComparison } from '../stats/anisotropy-comparison.js';
import { ABOVE_NOISE_RULE, NOISE_CAVEAT } from '../stats/fold-noise.js';
import { PHASE_RULE } from '../stats/fold-phase.js';
import type { Figure } from './plots.js';
import { COLOURS, Plot } from './svg-plot.js';

const FOLD_COLOUR: Record<string, string> = { '4': COLOURS.blue, '6': COLOURS.vermillion };

function bandOf(s: ObservableSection, name: string): ObservableBand | undefined {
  return s.bands.find((b) => b.name === name && b.sizes.length > 0);
}

function anisotropyFigure(s: ObservableSection, kind: 'fold_amplitude' | 'axis_ratio'): Figure | null {
  const bands = ['4', '6'].map((k) => [k, bandOf(s, `${kind}_${k}`)] as const).filter(([, b]) => b !== undefined) as [string, ObservableBand][];
  if (bands.length === 0) return null;
  const amplitude = kind === 'fold_amplitude';
  const name = amplitude ? 'anisotropy-fold-amplitude' : 'anisotropy-axis-ratio';
  const title = amplitude ? 'Lattice anisotropy: k-fold amplitude A_{k} of the outer shell against N' : 'Lattice anisotropy: axis/diagonal extent ratio Q_{k} against N';
  const p = new Plot({
    idPrefix: name,
    title,
    x: { label: 'cluster size N', kind: 'log' },
    y: { label: amplitude ? 'A_{k} = |Σ e^{ikθ}| / n' : 'Q_{k}', kind: amplitude ? 'log' : 'linear' },
  });
  if (!amplitude) p.hline(1, { colour: COLOURS.grey, width: 1, dash: '4 4' }, 'isotropic (disk): 1');
  for (const [k, b] of bands) {
    const keep = b.sizes.map((_, i) => !amplitude || (b.lo[i] > 0 && b.mean[i] > 0));
    const xs = b.sizes.filter((_, i) => keep[i]);
    p.band(xs, b.lo.filter((_, i) => keep[i]), b.hi.filter((_, i) => keep[i]), FOLD_COLOUR[k], undefined, 0.18);
    p.line(xs, b.mean.filter((_, i) => keep[i]), { colour: FOLD_COLOUR[k], width: 1.6 }, `k = ${k} (${k === '4' ? 'square' : 'triangular'} lattice axes): mean, ${Math.round(s.level * 100)}% band`);
  }
  const noise = amplitude ? s.foldNoise ?? null : null;
  if (noise) noiseLines(p, noise, COLOURS.grey, '');
  const caption =
    (amplitude
      ? 'k-fold angular Fourier amplitude of the particles between R_max/2 and R_max (worker/core/anisotropy.ts)'
      : 'mean extent along the k lattice axes over the mean extent along the k diagonals (worker/core/anisotropy.ts)') +
    `: ensemble mean over ${s.clusters} cluster(s) at each recorded size, shaded: ${Math.round(s.level * 100)}% percentile bootstrap band over clusters (${s.resamples} resamples). ` +
    (amplitude ? noiseCaption(s) : '') +
    'Off-lattice clusters give the isotropic baseline; lattice clusters whose arms follow the axes rise above it.';
  return { name, title, caption, svg: p.toSvg(), note: null };
}

/** The signed phases P_k = mean cos kθ of the outer shell against N, with the line 0 (the exact expectation of a rotation-invariant model) and the verdicts of the summary's rule (PHASE_RULE on a lattice, isotropicPhaseRule without one). */
function phaseFigure(s: ObservableSection): Figure | null {
  const bands = ['4', '6'].map((k) => [k, bandOf(s, `fold_phase_${k}`)] as const).filter(([, b]) => b !== undefined) as [string, ObservableBand][];
  if (bands.length === 0) return null;
  const name = 'anisotropy-fold-phase';
  const title = 'Lattice anisotropy: signed k-fold phase P_{k} = mean cos kθ of the outer shell against N';
  const p = new Plot({ idPrefix: name, title, x: { label: 'cluster size N', kind: 'log' }, y: { label: 'P_{k} = Σ cos kθ / n', kind: 'linear' } });
  p.hline(0, { colour: COLOURS.grey, width: 1, dash: '4 4' }, 'rotation-invariant model: exactly 0');
  for (const [k, b] of bands) {
    p.band(b.sizes, b.lo, b.hi, FOLD_COLOUR[k], undefined, 0.18);
    p.line(b.sizes, b.mean, { colour: FOLD_COLOUR[k], width: 1.6 }, `k = ${k} (${k === '4' ? 'square' : 'triangular'} lattice axes): mean, ${Math.round(s.level * 100)}% band`);
  }
  const ph = s.foldPhase;
  const verdicts =
    ph === undefined || ph === null
      ? `no verdict (${ph === undefined ? 'the summary predates' : 'some run lacks'} the recorded phases)`
      : ph.verdicts.map((v) => `P_{${v.name.replace('fold_phase_', '')}} at N = ${v.size}: ${fmt(v.mean)} [${fmt(v.lo)}, ${fmt(v.hi)}], ${v.verdict}`).join('; ');
  const caption =
    'mean of cos kθ over the particles between R_max/2 and R_max, θ from the lattice x axis (worker/core/anisotropy.ts): ' +
    `ensemble mean over ${s.clusters} cluster(s) at each recorded size, shaded: ${Math.round(s.level * 100)}% percentile bootstrap band over clusters (${s.resamples} resamples). ` +
    'Its expectation is exactly 0 at every N for a model invariant under rotations (off-lattice DLA, Eden, DBM), so the band carries the ensemble\'s own noise and needs no noise model. ' +
    `Verdict: ${verdicts}. Rule: ${ph?.rule ?? PHASE_RULE}.`;
  return { name, title, caption, svg: p.toSvg(), note: null };
}

/** The noise level √(π/(4n)) (dashed) and its 95% quantile (dotted), n the shell count of each cluster, averaged over clusters. */
function noiseLines(p: Plot, noise: FoldNoise, colour: string, whose: string): void {
  p.line(noise.sizes, noise.mean, { colour, width: 1.2, dash: '6 4' }, `isotropic noise, mean √(π/(4n)) (n: shell count${whose})`);
  p.line(noise.sizes, noise.threshold, { colour, width: 1.2, dash: '1.5 3' }, `isotropic noise, ${Math.round(noise.quantile * 100)}% quantile √(ln 20 / n)`);
}

const NOISE_DEFINITION =
  'the isotropic noise level for n independent uniform angles, n the recorded number of particles in the outer shell of each cluster: ' +
  'mean √(π/(4n)) (dashed) and 95% quantile √(ln 20 / n) (dotted) of the Rayleigh law of A_{k}, averaged over clusters (Mardia & Jupp 2000, Directional Statistics, §6.3.1)';

/** The noise verdicts of one ensemble (only fold `fold` when given), or why there are none. */
function noiseVerdicts(s: ObservableSection, fold?: number): string {
  const noise = s.foldNoise;
  if (noise === undefined || noise === null) return `no noise level (${noise === undefined ? 'the summary predates' : 'some run lacks'} the recorded shell count n)`;
  return noise.verdicts
    .filter((v) => fold === undefined || v.name === `fold_amplitude_${fold}`)
    .map((v) => `A_{${v.name.replace('fold_amplitude_', '')}} at N = ${v.size} ${v.verdict} (band low ${fmt(v.bandLow)} vs ${fmt(v.threshold)})`)
    .join('; ');
}

function noiseCaption(s: ObservableSection): string {
  return `Grey: ${NOISE_DEFINITION}. Verdict: ${noiseVerdicts(s)}. Rule: ${ABOVE_NOISE_RULE}. ${NOISE_CAVEAT} `;
}

function fmt(v: number): string {
  return Number.isFinite(v) ? v.toPrecision(3) : 'n/a';
}

/** The baseline's own noise level at the largest size both record, beside the drawn one. */
function baselineNoiseNote(own: FoldNoise, base: FoldNoise, label: string): string {
  const common = own.sizes.filter((n) => base.sizes.includes(n));
  if (common.length === 0) return '';
  const n = common[common.length - 1];
  const a = own.mean[own.sizes.indexOf(n)];
  const b = base.mean[base.sizes.indexOf(n)];
  return `The noise level from the shell counts of ${label} (not drawn) is ${fmt(b)} at N = ${n} against ${fmt(a)} drawn (${((b / a - 1) * 100).toFixed(1)}%). `;
}

const VERDICT_PHRASE: Record<AnisotropyComparison['verdict'], string> = {
  'above the baseline': 'above',
  'below the baseline': 'below',
  'not distinguishable': 'not distinguishable from',
  unknown: 'not comparable with',
};

/** A labelled ensemble for the combined figure. */
export interface LabelledObservables {
  /** Shown in the legend, e.g. the model kind. */
  label: string;
  observables: ObservableSection;
}

/**
 * The k-fold amplitude A_k of this ensemble and of an isotropic baseline
 * ensemble on the same axes, each with its bootstrap band and its noise
 * level, and the verdict of compareWithBaseline in the caption; null when
 * either lacks fold_amplitude_<fold>.
 */
export function anisotropyComparisonFigure(own: LabelledObservables, baseline: LabelledObservables, fold: number): { figure: Figure; comparison: AnisotropyComparison } | null {
  const name = `fold_amplitude_${fold}`;
  const a = bandOf(own.observables, name);
  const b = bandOf(baseline.observables, name);
  if (!a || !b) return null;
  const comparison = compareWithBaseline(own.observables, baseline.observables, fold);
  const figName = 'anisotropy-against-baseline';
  const title = `${fold}-fold amplitude A_{${fold}} against N: ${own.label} and the baseline ${baseline.label}`;
  const p = new Plot({
    idPrefix: figName,
    title,
    x: { label: 'cluster size N', kind: 'log' },
    y: { label: `A_{${fold}} = |Σ e^{${fold}iθ}| / n (outer shell)`, kind: 'log' },
    legend: 'below',
    height: 560,
  });
  const draw = (band: ObservableBand, section: ObservableSection, colour: string, label: string) => {
    const keep = band.sizes.map((_, i) => band.lo[i] > 0 && band.mean[i] > 0);
    const xs = band.sizes.filter((_, i) => keep[i]);
    p.band(xs, band.lo.filter((_, i) => keep[i]), band.hi.filter((_, i) => keep[i]), colour, undefined, 0.2);
    p.line(xs, band.mean.filter((_, i) => keep[i]), { colour, width: 2 }, `${label}: mean over ${section.clusters} clusters, ${Math.round(section.level * 100)}% band`);
  };
  draw(a, own.observables, COLOURS.blue, own.label);
  draw(b, baseline.observables, COLOURS.vermillion, `${baseline.label} (baseline)`);
  // one grey noise pair, from this ensemble's shell counts; the baseline's is quoted in the caption
  const ownNoise = own.observables.foldNoise ?? null;
  const baseNoise = baseline.observables.foldNoise ?? null;
  if (ownNoise) noiseLines(p, ownNoise, COLOURS.grey, ` of ${own.label}`);
  const noiseNote = baseNoise && ownNoise ? baselineNoiseNote(ownNoise, baseNoise, baseline.label) : '';
  const c = comparison;
  const verdict =
    c.size === null || !c.own || !c.baseline
      ? `Verdict: unknown (the two ensembles share no recorded size). `
      : `Verdict at N = ${c.size}: ${own.label} is ${VERDICT_PHRASE[c.verdict]} the baseline ` +
        `(A_{${fold}} = ${fmt(c.own.mean)} [${fmt(c.own.lo)}, ${fmt(c.own.hi)}] against ${fmt(c.baseline.mean)} [${fmt(c.baseline.lo)}, ${fmt(c.baseline.hi)}]). Rule: ${c.rule}. `;
  const caption =
    `Lattice anisotropy against an isotropic baseline: the ${fold}-fold angular Fourier amplitude of the particles between R_max/2 and R_max (worker/core/anisotropy.ts) ` +
    `of ${own.label} (blue) and ${baseline.label} (vermillion), ensemble means with percentile bootstrap bands over whole clusters. ` +
    verdict +
    `Grey: ${NOISE_DEFINITION}, n of the ${own.label} clusters. ` +
    noiseNote +
    `Noise verdicts: ${own.label}: ${noiseVerdicts(own.observables, fold)}; ${baseline.label}: ${noiseVerdicts(baseline.observables, fold)}. Rule: ${ABOVE_NOISE_RULE}. ` +
    NOISE_CAVEAT;
  return { figure: { name: figName, title, caption, svg: p.toSvg(), note: null }, comparison };
}

function interfaceFigure(s: ObservableSection): Figure | null {
  const g = s.interfaceGrowth;
  const w = bandOf(s, 'interface_width');
  const r = bandOf(s, 'interface_radius');
  if (!g || !w || !r) return null;
  const name = 'interface-width';
  const title = 'Eden interface: width w against mean radius R_{mean}';
  const keep = w.sizes.map((_, i) => w.mean[i] > 0 && r.mean[i] > 0 && w.lo[i] > 0);
  const xs = r.mean.filter((_, i) => keep[i]);
  const p = new Plot({ idPrefix: name, title, x: { label: 'mean interface radius R_{mean}', kind: 'log' }, y: { label: 'interface width w', kind: 'log' } });
  p.band(xs, w.lo.filter((_, i) => keep[i]), w.hi.filter((_, i) => keep[i]), COLOURS.green, undefined, 0.18);
  p.points(xs, w.mean.filter((_, i) => keep[i]), COLOURS.green, `ensemble mean, ${Math.round(s.level * 100)}% band`);
  const x0 = g.meanRadius[0];
  const x1 = g.meanRadius[g.meanRadius.length - 1];
  const y0 = g.meanWidth[0];
  const iv = g.interval.bca ?? g.interval.percentile;
  const fitY = (x: number) => y0 * Math.pow(x / x0, g.beta);
  p.line([x0, x1], [fitY(x0), fitY(x1)], { colour: COLOURS.black, width: 2.2 }, `fit over N = ${g.window.fromSize}..${g.window.toSize}: β = ${g.beta.toFixed(3)}${iv ? ` [${iv[0].toFixed(3)}, ${iv[1].toFixed(3)}]` : ''}`);
  p.line([x0, x1], [y0, y0 * Math.pow(x1 / x0, 1 / 3)], { colour: COLOURS.vermillion, width: 1.4, dash: '6 4' }, 'KPZ slope β = 1/3 (Kardar, Parisi & Zhang 1986)');
  const caption =
    `Radial roughness of the outer interface (worker/core/radial-interface.ts) against its mean radius, ${s.clusters} cluster(s). ` +
    `Black: least-squares power law over ${g.window.rule}; dashed: the KPZ slope 1/3 through the first fitted point. ` +
    `Verdict: ${g.verdict} (${g.rule}).`;
  return { name, title, caption, svg: p.toSvg(), note: null };
}

/** The figures that apply to the section (none when it has no anisotropy or interface observables). */
export function observableFigures(s: ObservableSection | null | undefined): Figure[] {
  if (!s || s.schema !== 'tendril.observables/1') return [];
  return [anisotropyFigure(s, 'fold_amplitude'), phaseFigure(s), anisotropyFigure(s, 'axis_ratio'), interfaceFigure(s)].filter((f): f is Figure => f !== null);
}
