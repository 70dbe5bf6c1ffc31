/**
 * Figures of the model observables of an ensemble (statistics.observables,
 * coordinator/stats/observable-bands.ts): lattice anisotropy against N with
 * bootstrap bands (the same measures on off-lattice clusters are the
 * isotropic baseline), and the Eden interface width against the mean radius
 * with its fitted growth exponent beside the KPZ slope 1/3.
 */
import type { ObservableBand, ObservableSection } from '../stats/observable-bands.js';
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
  if (amplitude) {
    // isotropic reference: independent uniform angles give E[A²] = 1/n with n ≈ 3N/4 in the shell of a compact cluster; shown for scale only
    const b = bands[0][1];
    p.line(b.sizes, b.sizes.map((n) => 1 / Math.sqrt(0.75 * n)), { colour: COLOURS.grey, width: 1, dash: '5 4' }, 'scale of pure noise, (3N/4)^{-1/2} (independent angles; for scale only)');
  }
  const caption =
    (amplitude
      ? 'k-fold angular Fourier amplitude of the particles between R_max/2 and R_max (worker/core/anisotropy.ts)'
      : 'mean extent along the k lattice axes over the mean extent along the k diagonals (worker/core/anisotropy.ts)') +
    `: ensemble mean over ${s.clusters} cluster(s) at each recorded size, shaded: ${Math.round(s.level * 100)}% percentile bootstrap band over clusters (${s.resamples} resamples). ` +
    'Off-lattice clusters give the isotropic baseline; lattice clusters whose arms follow the axes rise above it.';
  return { name, title, caption, svg: p.toSvg(), note: null };
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
  return [anisotropyFigure(s, 'fold_amplitude'), anisotropyFigure(s, 'axis_ratio'), interfaceFigure(s)].filter((f): f is Figure => f !== null);
}
