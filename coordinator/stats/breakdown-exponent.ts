/**
 * What is known about D(η) of the dielectric breakdown model (growth
 * probability ∝ harmonic measure^η), in one place, for the summary of a
 * sweep over η (coordinator/summary/sweep-summary.ts). It applies when the
 * swept parameter is the model's breakdown exponent: the one its descriptor
 * declares in `reference.breakdownExponent`, or, when it declares none, a
 * parameter named `eta` (worker/core/model-descriptor.ts). Nothing here
 * names a model kind.
 *
 *  - Lower bound D(η) ≥ (4 − η)/2 for 0 ≤ η < 2, proven on the square
 *    lattice (Losev & Smirnov 2023, arXiv 2307.14931). Verdict per row and
 *    estimator by BOUND_RULE.
 *  - D decreasing in η (the trend of every published DBM study; a
 *    statement, not a theorem), judged by MONOTONIC_RULE.
 *  - The predicted non-fractal transition near η_c ≈ 4 (Hastings 2001,
 *    Phys. Rev. Lett. 87, 175502): context only, shown with the local
 *    slopes of the rows near it.
 *  - The DLA value at η = 1 for the plot: D = 1.71 (Menshutin, Shchur &
 *    Vinokur 2008, Physica A 387, 6299), the published value the off-lattice
 *    DLA descriptor shows (a test keeps the two equal).
 */
import { isModelKind, modelDescriptor } from '../../worker/models/registry.js';
import type { ModelDescriptor } from '../../worker/core/model-descriptor.js';

export const BOUND_SOURCE = 'Losev & Smirnov 2023, arXiv 2307.14931 (proven on the square lattice)';
export const BOUND_RULE =
  'lower bound (4 − η)/2 for 0 ≤ η < 2: "above bound" when the lower end of the interval of D lies above it, "below bound" when the upper end lies below it, "not resolved" when the interval contains it or there is no interval';
export const MONOTONIC_RULE =
  'for each estimator, consecutive values η_i < η_{i+1}: "decreasing" when the interval of D(η_{i+1}) lies wholly below that of D(η_i), "increasing" when wholly above, otherwise "not resolved"; ' +
  'overall "decreasing" when every step is decreasing, "consistent with decreasing" when no step is increasing, "not decreasing" when any step is increasing, "not judged" with fewer than two intervals';
export const TRANSITION = {
  etaC: 4,
  source: 'Hastings 2001, Phys. Rev. Lett. 87, 175502',
  statement: 'predicted transition to non-fractal growth (D → 1) near η_c ≈ 4; shown for context with the local slopes at the largest sizes (how far the estimates are from converged), never judged',
} as const;
/** Rows at or above this η are shown beside the transition (within one unit of η_c). */
export const TRANSITION_FROM = 3;
export const DLA_AT_ETA_ONE = { eta: 1, D: 1.71, source: 'Menshutin, Shchur & Vinokur 2008, Physica A 387, 6299' } as const;

export type BoundVerdict = 'above bound' | 'below bound' | 'not resolved';
export type StepVerdict = 'decreasing' | 'increasing' | 'not resolved';
export type MonotonicVerdict = 'decreasing' | 'consistent with decreasing' | 'not decreasing' | 'not judged';

/** True when `parameter` of the model is its dielectric-breakdown exponent (see the file header). */
export function isBreakdownExponent(modelKind: string, parameter: string): boolean {
  return isModelKind(modelKind) && isBreakdownExponentOf(modelDescriptor(modelKind), parameter);
}

/** The same for a descriptor at hand. */
export function isBreakdownExponentOf(d: Pick<ModelDescriptor, 'params' | 'reference'>, parameter: string): boolean {
  const declared = d.reference.breakdownExponent;
  if (declared !== undefined) return declared === parameter;
  return parameter === 'eta' && d.params.some((p) => p.name === 'eta');
}

/** (4 − η)/2 on 0 ≤ η < 2, else null (no bound). */
export function lowerBound(eta: number): number | null {
  return eta >= 0 && eta < 2 ? (4 - eta) / 2 : null;
}

/** The verdict of BOUND_RULE for an interval of D against the bound. */
export function boundVerdict(bound: number, interval: [number, number] | null): BoundVerdict {
  if (!interval) return 'not resolved';
  if (interval[0] > bound) return 'above bound';
  if (interval[1] < bound) return 'below bound';
  return 'not resolved';
}

/** One estimator's D against η, as MONOTONIC_RULE reads it. */
export interface CurvePoint {
  eta: number;
  interval: [number, number] | null;
}

export interface MonotonicStep {
  from: number;
  to: number;
  verdict: StepVerdict;
}

/** MONOTONIC_RULE on one estimator's points (any order; sorted by η here). */
export function monotonicity(points: readonly CurvePoint[]): { verdict: MonotonicVerdict; steps: MonotonicStep[] } {
  const withIv = [...points].filter((p) => p.interval !== null).sort((a, b) => a.eta - b.eta);
  const steps: MonotonicStep[] = [];
  for (let i = 1; i < withIv.length; i++) {
    const a = withIv[i - 1].interval!, b = withIv[i].interval!;
    steps.push({ from: withIv[i - 1].eta, to: withIv[i].eta, verdict: b[1] < a[0] ? 'decreasing' : b[0] > a[1] ? 'increasing' : 'not resolved' });
  }
  if (steps.length === 0) return { verdict: 'not judged', steps };
  if (steps.some((s) => s.verdict === 'increasing')) return { verdict: 'not decreasing', steps };
  return { verdict: steps.every((s) => s.verdict === 'decreasing') ? 'decreasing' : 'consistent with decreasing', steps };
}
