/**
 * Names, units and number formats shared by the figures and the HTML page, so
 * that a value reads the same everywhere.
 */
import type { IntervalSummary } from '../stats/bca.js';
import type { EstimatorName } from '../stats/analyze-ensemble.js';

/** Rich-text name (svg-plot.ts syntax) and plain name of each estimator or panel row. */
export const ESTIMATOR_LABELS: Record<string, { rich: string; plain: string; colour: string; marker: 'circle' | 'square' | 'diamond' | 'triangle' }> = {
  radiusOfGyration: { rich: 'R_g(N)', plain: 'R_g(N)', colour: '#0072B2', marker: 'circle' },
  maxRadius: { rich: 'R_{max}(N)', plain: 'R_max(N)', colour: '#D55E00', marker: 'square' },
  massRadius: { rich: 'M(r)', plain: 'M(r)', colour: '#009E73', marker: 'diamond' },
  radiusOfGyrationCorrected: { rich: 'R_g(N) with correction', plain: 'R_g(N) with corrections to scaling', colour: '#56B4E9', marker: 'triangle' },
  maxRadiusCorrected: { rich: 'R_{max}(N) with correction', plain: 'R_max(N) with corrections to scaling', colour: '#E69F00', marker: 'triangle' },
};

export function labelOf(name: string): { rich: string; plain: string; colour: string; marker: 'circle' | 'square' | 'diamond' | 'triangle' } {
  return ESTIMATOR_LABELS[name] ?? { rich: name, plain: name, colour: '#666666', marker: 'circle' };
}

export const AXIS = {
  size: 'cluster size N (particles)',
  radius: 'distance r from the seed (particle diameters)',
  radiusOfGyration: 'radius of gyration R_g (particle diameters)',
  maxRadius: 'maximum radius R_{max} (particle diameters)',
  massRadius: 'particles M(r) within distance r',
  localD: 'effective dimension D_{eff} (local slope)',
  dimension: 'fractal dimension D',
} as const;

export const Y_AXIS: Record<EstimatorName, string> = {
  radiusOfGyration: AXIS.radiusOfGyration,
  maxRadius: AXIS.maxRadius,
  massRadius: AXIS.massRadius,
};

/** Fixed-point text with `digits` decimals, a true minus sign, or "–" for null. */
export function fmt(v: number | null | undefined, digits = 4): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '–';
  const s = v.toFixed(digits);
  return (/^-0\.?0*$/.test(s) ? s.slice(1) : s).replace('-', '−');
}

/** Compact text of a size or radius (integers stay integers, else 3 significant digits). */
export function fmtAbscissa(v: number | null | undefined): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '–';
  if (Number.isInteger(v)) return v >= 1e6 ? v.toExponential(2).replace('e+', '·10^') : String(v);
  return Number(v.toPrecision(3)).toString();
}

export function fmtRange(r: [number, number] | null | undefined, digits = 4): string {
  return r ? `[${fmt(r[0], digits)}, ${fmt(r[1], digits)}]` : '–';
}

export function levelPercent(iv: IntervalSummary): string {
  return `${Number((iv.level * 100).toFixed(1))}%`;
}

/** The interval a figure shows for an estimate: BCa when present, else percentile. */
export function shownInterval(iv: IntervalSummary): { range: [number, number] | null; kind: 'BCa' | 'percentile' | null } {
  if (iv.bca) return { range: iv.bca, kind: 'BCa' };
  if (iv.percentile) return { range: iv.percentile, kind: 'percentile' };
  return { range: null, kind: null };
}

/** "D = 1.7100 [1.69, 1.73] (95% BCa)" or "D = 1.7100 (no interval: ...)". */
export function estimateText(D: number | null, iv: IntervalSummary, symbol = 'D'): string {
  if (D === null) return `${symbol} not available`;
  const { range, kind } = shownInterval(iv);
  if (!range) return `${symbol} = ${fmt(D)} (no interval: ${iv.status})`;
  return `${symbol} = ${fmt(D)}, ${levelPercent(iv)} ${kind} ${fmtRange(range)}`;
}

/** Axis labels of the harmonic-measure figures (rich text; units or "dimensionless"). */
export const HARMONIC_AXIS = {
  q: 'moment order q',
  tau: 'mass exponent τ(q) (dimensionless)',
  alpha: 'singularity strength α (local exponent of the measure)',
  f: 'f(α): dimension of the points of exponent α',
  capacity: 'logarithmic capacity cap (particle diameters)',
  z3: 'growth moment Z(3) = Σ p_{i}^{3} (particle scale, dimensionless)',
  increment: 'mean Δ ln cap / ΔN (per particle)',
  exponent: 'exponent value (dimensionless)',
} as const;

/** A finite number (JSON turns NaN into null, so values read back may be null). */
export function isFiniteNumber(v: unknown): v is number {
  return typeof v === 'number' && Number.isFinite(v);
}

/** Estimate text for a value whose interval may be missing: "τ(3) = 1.7000, 95% BCa [1.65, 1.75]". */
export function valueText(symbol: string, v: number | null | undefined, iv: IntervalSummary | null | undefined, digits = 4): string {
  if (!isFiniteNumber(v)) return `${symbol} not available`;
  if (!iv) return `${symbol} = ${fmt(v, digits)} (no interval)`;
  const { range, kind } = shownInterval(iv);
  if (!range) return `${symbol} = ${fmt(v, digits)} (no interval: ${iv.notes[0] ?? iv.status})`;
  return `${symbol} = ${fmt(v, digits)}, ${levelPercent(iv)} ${kind} ${fmtRange(range, digits)}`;
}
