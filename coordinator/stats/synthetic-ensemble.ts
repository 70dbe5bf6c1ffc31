/**
 * Synthetic ensembles with a known exponent, for tests, benchmarks and dry
 * runs of the farm's bookkeeping. Not physics: each "cluster" is a power law
 * with multiplicative, size-correlated noise,
 *
 *   ln R_c(N_i) = ln A + ln N_i / D + ln(1 + B N_i^-omega) + s0 g_c + sigma W_c(i),
 *   W_c(i) = sum_{j <= i} g_cj sqrt(delta log10 N_j)   (a random walk in log N),
 *
 * with independent standard normal g (Box-Muller on Random.forRun(seed, run,
 * STREAM_GROWTH)); the mass-radius counts follow ln M_c(r) = ln C + D ln r +
 * the same kind of noise. The ensemble mean of ln R then has slope exactly
 * 1/D in expectation (zero-mean noise), so intervals must cover 1/D.
 */

import type { GrowthResult } from '../../worker/core/growth-kernel.js';
import { Random, STREAM_GROWTH } from '../../worker/core/random.js';
import { MODEL_KINDS, modelParams } from '../../worker/models/registry.js';

export interface SyntheticEnsembleSpec {
  /** Model kind written into the results (default: the first registered model); parameters at their defaults. */
  modelKind?: string;
  clusters: number;
  /** Recorded sizes (ascending). */
  sizes: number[];
  /** Mass-radius radii (ascending); empty -> no mass-radius counts. */
  radii?: number[];
  dimension: number;
  seed?: string | number;
  /** First run index (to build an ensemble in batches). */
  firstRunIndex?: number;
  /** Random-walk amplitude per sqrt(decade) of ln R. */
  walkSigma?: number;
  /** Per-cluster constant offset of ln R. */
  offsetSigma?: number;
  rgAmplitude?: number;
  maxRadiusAmplitude?: number;
  massAmplitude?: number;
  /** Correction to scaling (same for R_g and R_max). */
  correction?: { amplitude: number; omega: number };
}

/** Sizes spaced perDecade per decade from first, count of them (rounded to integers, duplicates removed). */
export function logSpacedSizes(first: number, perDecade: number, count: number): number[] {
  const out: number[] = [];
  for (let i = 0; out.length < count; i++) {
    const v = Math.round(first * Math.pow(10, i / perDecade));
    if (out.length === 0 || v > out[out.length - 1]) out.push(v);
  }
  return out;
}

function gaussian(rng: Random): number {
  const u = rng.nextOpen32(), v = rng.nextDouble();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
}

function noisyPowerLaw(rng: Random, xs: number[], lnA: number, slope: number, walk: number, offset: number, corr?: { amplitude: number; omega: number }): number[] {
  const out: number[] = [];
  let w = offset * gaussian(rng);
  for (let i = 0; i < xs.length; i++) {
    const dlog = i === 0 ? 1 : Math.log10(xs[i] / xs[i - 1]);
    w += walk * gaussian(rng) * Math.sqrt(dlog);
    const c = corr ? Math.log(1 + corr.amplitude * Math.pow(xs[i], -corr.omega)) : 0;
    out.push(Math.exp(lnA + slope * Math.log(xs[i]) + c + w));
  }
  return out;
}

export function syntheticEnsemble(spec: SyntheticEnsembleSpec): GrowthResult[] {
  const seed = spec.seed ?? 1;
  const first = spec.firstRunIndex ?? 0;
  const walk = spec.walkSigma ?? 0.05, offset = spec.offsetSigma ?? 0.03;
  const radii = spec.radii ?? [];
  const out: GrowthResult[] = [];
  for (let c = 0; c < spec.clusters; c++) {
    const runIndex = first + c;
    const rng = Random.forRun(seed, runIndex, STREAM_GROWTH);
    const rg = noisyPowerLaw(rng, spec.sizes, Math.log(spec.rgAmplitude ?? 0.6), 1 / spec.dimension, walk, offset, spec.correction);
    const rmax = noisyPowerLaw(rng, spec.sizes, Math.log(spec.maxRadiusAmplitude ?? 1.6), 1 / spec.dimension, walk, offset, spec.correction);
    const mass = radii.length ? noisyPowerLaw(rng, radii, Math.log(spec.massAmplitude ?? 1.2), spec.dimension, walk, offset) : [];
    out.push({
      engineVersion: 'synthetic',
      model: modelParams(spec.modelKind ?? MODEL_KINDS[0]),
      dimension: 2,
      particles: spec.sizes[spec.sizes.length - 1],
      ensembleSeed: String(seed),
      runIndex,
      series: { sizes: spec.sizes.slice(), radiusOfGyration: rg, maxRadius: rmax, centerOffset: spec.sizes.map(() => 0), extra: {} },
      massRadius: { radii: radii.slice(), counts: mass },
      counters: {},
      stateHash: `synthetic-${seed}-${runIndex}`,
    });
  }
  return out;
}
