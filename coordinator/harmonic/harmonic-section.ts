/**
 * The harmonic section of an ensemble summary (shape: harmonic-section-types.ts)
 * from the ClusterHarmonic records of the probed clusters: one record per
 * (run, size), any order. Pure and deterministic: the same records (in any
 * order) and the same seed give the same section bit for bit. Thin data
 * never throws: whatever cannot be formed is null with a `reason` (or an
 * interval with status 'too-few-clusters' and a note). Only inconsistent
 * input (records of one ensemble on different q grids) and invalid options
 * throw, with one line naming the field.
 *
 * Rules (ours where no source is named)
 *  - Records are grouped by size; within a size they are ordered by run
 *    index, and a second record of the same (run, size) is ignored (probes
 *    of a (run, size) are deterministic, so duplicates are copies).
 *  - Per size, every scalar is an ensemble mean over clusters with its
 *    cluster-bootstrap interval (ensembleMeanInterval: whole clusters
 *    resampled, percentile and BCa; at least 3 clusters). Non-finite
 *    per-cluster values (and null capacities or Z(3)) are left out of that
 *    quantity only; EnsembleValue.clusters says how many entered. Every
 *    interval uses the same seed, so quantities with the same clusters share
 *    the same resamples (their intervals are jointly consistent).
 *  - D_q, α and f(α) of a size are those of the ensemble-mean τ̄(q), not
 *    means of the per-cluster values: D_q = τ̄(q)/(q − 1) (null at q = 1);
 *    α = dτ̄/dq by finite differences over the q grid sorted by value
 *    (central inside, one-sided at the ends), and at q = 1 the ensemble mean
 *    of the fitted τ'(1) (the information dimension), as
 *    coordinator/harmonic/spectrum.ts does for one cluster; f = qα − τ̄.
 *    A grid of one q ≠ 1 has no α (NaN, null in JSON).
 *  - convergedFraction(q) = share of the clusters judged at q (two probe
 *    halves compared, see probe-analysis.ts) whose halves agree; converged
 *    when that share is at least 0.9; convergedRange is the longest run of
 *    consecutive converged q on the sorted grid, preferring the run that
 *    holds q = 1 (the q-range to quote); the rest are flagged.
 *  - Fit-window systematic (probe-analysis.ts: half the difference of the
 *    fits over the two halves of the ε window, per cluster): its ensemble
 *    mean is reported beside each statistical interval, and the interval
 *    widened by it on both sides (linear addition, conservative; our rule)
 *    is what the Makarov and electrostatic checks "with systematic" use.
 *  - Beurling: the maximum box measure M(ε) ~ (ε/R)^a of a connected set has
 *    a ≥ 1/2 (Beurling's estimate; Garnett & Marshall 2005, Harmonic
 *    Measure). beurlingRespected: the upper end of the 95% interval of the
 *    ensemble-mean exponent (BCa, else percentile) is at least 1/2; null
 *    without an interval. false is reported as "not resolved at this size",
 *    never as a violation: the estimate bounds the ε → 0 limit only (see
 *    beurling-check.ts).
 *  - Growth relations use the clusters probed at every size present in the
 *    records ("complete" clusters) with a finite log capacity (and, for the
 *    increments, a Z(3)) at every size; sizes are all sizes present.
 *    clustersAtAllSizes counts the clusters with a record at every size.
 *
 * Capacity growth. cap(N) ~ N^{1/D_cap}: the OLS slope of the ensemble mean
 * of log cap against log N over the sizes. The OLS slope is linear in the
 * ordinates, so the slope of the mean curve is the mean of the per-cluster
 * slopes, and the cluster bootstrap of the slope (resample complete
 * clusters, recompute the means and the slope) is exactly the bootstrap of
 * the mean of per-cluster slopes (ensembleMeanInterval). D_cap = 1/slope;
 * its interval inverts the slope interval's ends (null if it reaches 0).
 * For a set of diameter R the capacity is between R/4 and R (Ransford
 * 1995, Potential Theory in the Complex Plane, ch. 5), so D_cap is the mass
 * dimension measured with the capacity as the radius.
 *
 * Capacity increment, and why it is the electrostatic scaling law. Let g be
 * the Green function of the exterior of the cluster K with pole at ∞,
 * g(z) = log|z| − log cap K + o(1), and h = |∇g| on ∂K, so that h ds/(2π)
 * is the harmonic measure. Hadamard's variational formula: pushing ∂K out by
 * δn(s) changes Robin's constant −log cap by −(1/2π) ∫ h² δn ds, so
 *   δ log cap = (1/2π) ∫ h² δn ds.
 * A particle of fixed size a attached at s is a bump of area ∝ a² there,
 * so it raises log cap by c a² h(s)², c a shape constant (the capture disks
 * all have the same shape). In DLA it lands at s with the harmonic measure,
 * probability h(s) ds/(2π). Hence the mean increment per particle is
 *   ⟨Δ log cap⟩ = (c a²/4π²) ∫ h³ ds.
 * At particle scale the harmonic measure of particle i is p_i ≈ h a/(2π), so
 * ∫ h³ ds ≈ Σ_i h_i³ a = (2π)³ Σ p_i³ / a², and
 *   ⟨d log cap / dN⟩ = 2π c Σ_i p_i³ = 2π c Z(3, a).
 * With cap ~ N^{1/D}, the left side is 1/(D N); with Z(3, ε) ~ (ε/R)^τ(3)
 * and R ~ N^{1/D}, the right side is ∝ N^{−τ(3)/D}; so τ(3) = D, the
 * electrostatic scaling law (Halsey 1987, Phys. Rev. Lett. 59, 2067;
 * citation from memory). The relation tested here is the proportionality
 * itself, size by size, without fitting τ(3):
 *   meanIncrement_k = mean over complete clusters of
 *     (log cap(N_{k+1}) − log cap(N_k)) / (N_{k+1} − N_k),
 *   z3_k = √(Z̄3(N_k) Z̄3(N_{k+1})) (Z̄3: mean over the same clusters of the
 *     unbiased particle-scale Σ p³, cluster-harmonic.ts),
 * and the OLS slope of log meanIncrement against log z3 over the intervals
 * is 1 if they are proportional. The geometric mean is the right interval
 * value for a power law Z3 ∝ N^{−β}: the average of N^{−β} over [N_k, N_{k+1}]
 * is N_k^{−β} times a function of N_{k+1}/N_k only, so for geometrically
 * spaced sizes it is a constant multiple of the geometric mean, which leaves
 * the slope unchanged (for other spacings the error is second order in
 * log(N_{k+1}/N_k)). The slope's interval: cluster bootstrap (resample
 * complete clusters, recompute all means and the slope; BCa acceleration from
 * leave-one-cluster-out slopes); it needs at least 3 sizes and 3 complete
 * clusters, and every mean increment and z3 positive. proportional: the
 * interval (BCa, else percentile) contains 1.
 *
 * Electrostatic check: the ensemble τ(3) at the largest size beside the
 * mass dimension of the same clusters (given by the caller, with its
 * estimator named); consistent when the two intervals overlap (BCa, else
 * percentile, for τ(3)); null when either is missing.
 *
 * Three dimensions (option dimension = 3; records of ball sets,
 * cluster-harmonic.ts). The same argument with the Newtonian capacity C
 * (units: a ball of radius a has capacity a; potential u = 1 on K,
 * u ~ C/|x| at infinity, charge ∝ C, h = |∇u| on ∂K, harmonic measure
 * h dS/(4πC)). Hadamard's formula for the Newtonian case: pushing ∂K out by
 * δn raises C by (1/4π) ∫ h² δn dS. A particle of volume ∝ a³ at s raises C
 * by c a³ h(s)² and lands there with probability h dS/(4πC); at particle
 * scale p_i ≈ h a²/(4πC). Hence
 *   ⟨ΔC⟩ ∝ a³ ∫ h³ dS / C ∝ C² Σ p_i³ / a,   i.e.  ⟨Δ(−1/C)⟩ ∝ Z(3, a)/a.
 * So the increment variable is −1/C where 2D has log cap: meanIncrement_k
 * is the mean over complete clusters of (1/C(N_k) − 1/C(N_{k+1}))/(N_{k+1} − N_k),
 * and its proportionality to Z(3) is tested exactly as in 2D. With
 * C ~ N^{1/D} and Z(3, a) ~ (a/R)^τ(3): 1/D − 1 = (2 − τ(3))/D, so
 *   τ(3) = D + 1 in 3D  (in d dimensions the same steps give τ(3) = D + d − 2).
 * Check of the relation on an exact case: a compact ball (D = 3) has the
 * uniform measure on its surface, Z(3, ε) ∝ (ε/R)^{−2}(ε/R)^6 = (ε/R)^4, so
 * τ(3) = 4 = D + 1. This 3D form is derived here, not quoted: no published
 * statement of it was checked (the 2D law is Halsey 1987, citation from
 * memory). What the section reports in 3D:
 *  - dimensionFromTau3 = τ(3) − (d − 2) with the τ(3) interval shifted
 *    (and the same widened by the fit-window systematic);
 *  - consistent: that interval overlaps the mass-D interval;
 *  - particle scale: −slope of log Z(3) against log N is τ(3)/D, which the
 *    relation puts at 1 + (d − 2)/D; consistent when the ratio's interval
 *    overlaps [1 + (d − 2)/D_hi, 1 + (d − 2)/D_lo] from the mass-D interval
 *    (null without it).
 * The contact-radius systematic is not given in 3D (calibrated in 2D only).
 */
import { bootstrapRandom, drawResample, weightedColumnMeans } from '../stats/bootstrap.js';
import { fitLine, slopeWeights } from '../stats/log-log-fit.js';
import { checkRange } from '../../worker/core/value-range.js';
import { bootstrapInterval, type IntervalSummary } from '../stats/bca.js';
import type { ClusterHarmonic } from './cluster-harmonic.js';
import { ensembleMeanInterval, type EnsembleValue } from './ensemble-intervals.js';
import type {
  BreakdownRelation, CapacityGrowth, CapacityIncrement, ElectrostaticCheck, EstimateWithInterval, HarmonicAtSize, HarmonicSection,
} from './harmonic-section-types.js';
import { SIGN_CONVENTION } from './probe-analysis.js';

export const HARMONIC_CONVERGED_SHARE = 0.9;
export const ELECTROSTATIC_SOURCE =
  'electrostatic scaling law tau(3) = D: Halsey 1987, Phys. Rev. Lett. 59, 2067 (citation from memory)';
export const ELECTROSTATIC_SOURCE_3D =
  'tau(3) = D + 1 in 3D: derived in coordinator/harmonic/harmonic-section.ts by the argument of the 2D law (Halsey 1987, Phys. Rev. Lett. 59, 2067, citation from memory) applied to the Newtonian capacity; exact on a compact ball (tau(3) = 4, D = 3); no published 3D statement was checked';

export interface HarmonicSectionOptions {
  probe: HarmonicSection['probe'];
  massDimension: { estimator: string; value: number | null; interval: [number, number] | null } | null;
  seed: string | number;
  /** Bootstrap resamples; default 2000, allowed 10..1000000. */
  resamples?: number;
  /** Confidence level; default 0.95, allowed 0.5..0.999. */
  level?: number;
  /** Spatial dimension of the clusters (default 2); 3 switches to the Newtonian relations of the file header. */
  dimension?: 2 | 3;
}

function checkOption(field: string, v: number, lo: number, hi: number, integer: boolean): number {
  return checkRange(`harmonic section ${field}`, v, { min: lo, max: hi, integer });
}

/** The interval of a summary: BCa when available, else percentile, else null. */
export function intervalEnds(iv: IntervalSummary | null | undefined): [number, number] | null {
  if (!iv) return null;
  return iv.bca ?? iv.percentile ?? null;
}

function sameGrid(a: readonly number[], b: readonly number[]): boolean {
  return a.length === b.length && a.every((v, k) => v === b[k]);
}

const isOne = (q: number): boolean => Math.abs(q - 1) < 1e-12;

function finite(values: Array<number | null | undefined>): number[] {
  const out: number[] = [];
  for (const v of values) if (typeof v === 'number' && Number.isFinite(v)) out.push(v);
  return out;
}

function atSize(size: number, group: readonly ClusterHarmonic[], q: readonly number[], seed: string | number, resamples: number, level: number): HarmonicAtSize {
  const emi = (v: number[]): EnsembleValue => ensembleMeanInterval(v, seed, resamples, level);
  const tau = q.map((_, k) => emi(finite(group.map((c) => c.tau[k]))));
  const informationDimension = emi(finite(group.map((c) => c.informationDimension)));
  const maxConcentrationExponent = emi(finite(group.map((c) => c.maxConcentrationExponent)));
  const logCapacity = emi(finite(group.map((c) => c.logCapacity)));
  const capacity = group.some((c) => c.dimension === 3) ? emi(finite(group.map((c) => c.capacity))) : null;
  const z3 = emi(finite(group.map((c) => c.z3)));
  const tauMean = tau.map((t) => t.mean);
  const dq = q.map((qk, k) => (isOne(qk) ? null : tauMean[k] / (qk - 1)));
  // Legendre transform over the grid sorted by q value
  const order = q.map((_, k) => k).sort((a, b) => q[a] - q[b]);
  const alpha = new Array<number>(q.length).fill(NaN);
  for (let j = 0; j < order.length; j++) {
    const k = order[j];
    if (isOne(q[k])) { alpha[k] = informationDimension.mean; continue; }
    if (order.length < 2) continue;
    const a = order[j === 0 ? 0 : j - 1];
    const b = order[j === order.length - 1 ? j : j + 1];
    alpha[k] = (tauMean[b] - tauMean[a]) / (q[b] - q[a]);
  }
  const f = q.map((qk, k) => qk * alpha[k] - tauMean[k]);
  const convergedFraction = q.map((_, k) => {
    let judged = 0, agree = 0;
    for (const c of group) {
      const v = c.converged[k];
      if (v === null || v === undefined) continue;
      judged++;
      if (v) agree++;
    }
    return judged > 0 ? agree / judged : null;
  });
  const converged = convergedFraction.map((s) => s !== null && s >= HARMONIC_CONVERGED_SHARE);
  // the converged q-range: the longest run of consecutive converged q (in ascending q), preferring the one holding q = 1
  let best: [number, number] | null = null;
  let bestHasOne = false;
  for (let i = 0; i < order.length; ) {
    if (!converged[order[i]]) { i++; continue; }
    let j = i;
    while (j + 1 < order.length && converged[order[j + 1]]) j++;
    const hasOne = order.slice(i, j + 1).some((k) => Math.abs(q[k] - 1) < 1e-12);
    const len = j - i;
    if (best === null || (hasOne && !bestHasOne) || (hasOne === bestHasOne && len > best[1] - best[0])) { best = [i, j]; bestHasOne = hasOne; }
    i = j + 1;
  }
  const convergedRange: [number, number] | null = best ? [q[order[best[0]]], q[order[best[1]]]] : null;
  const mx = intervalEnds(maxConcentrationExponent.interval);
  const k3 = q.findIndex((v) => Math.abs(v - 3) < 1e-12);
  // fit-window systematic: the ensemble mean of the per-cluster half-differences (null where no cluster has one)
  const meanOf = (v: number[]): number | null => (v.length > 0 ? v.reduce((a, b) => a + b, 0) / v.length : null);
  const systematic = {
    tau: q.map((_, k) => meanOf(finite(group.map((c) => c.tauSystematic?.[k])))),
    informationDimension: meanOf(finite(group.map((c) => c.informationDimensionSystematic))),
  };
  // contact-radius systematic: the ensemble mean of the per-cluster values (reported beside the window systematic)
  const resolutionSystematic = {
    tau: q.map((_, k) => meanOf(finite(group.map((c) => c.tauResolutionSystematic?.[k])))),
    informationDimension: meanOf(finite(group.map((c) => c.informationDimensionResolutionSystematic))),
  };
  const widen = (iv: [number, number] | null, sys: number | null): [number, number] | null => (iv && sys !== null ? [iv[0] - sys, iv[1] + sys] : null);
  return {
    systematic,
    resolutionSystematic,
    informationDimensionWithSystematic: widen(intervalEnds(informationDimension.interval), systematic.informationDimension),
    tau3WithSystematic: k3 >= 0 ? widen(intervalEnds(tau[k3].interval), systematic.tau[k3]) : null,
    size,
    clusters: group.length,
    walkers: group.reduce((s, c) => s + c.walkers, 0) / group.length,
    q: [...q],
    tau,
    dq,
    alpha,
    f,
    convergedFraction,
    converged,
    convergedRange,
    informationDimension,
    maxConcentrationExponent,
    beurlingRespected: mx ? mx[1] >= 0.5 : null,
    logCapacity,
    capacity,
    z3,
    tau3: k3 >= 0 ? tau[k3] : null,
  };
}

/** Per complete cluster (ascending run index), the values of `pick` at every size (row-major K × S). */
function completeRows(
  bySizeGroups: ReadonlyArray<readonly ClusterHarmonic[]>, pick: (c: ClusterHarmonic) => Array<number | null>,
): { runs: number[]; rows: number[][] } {
  const s = bySizeGroups.length;
  const maps = bySizeGroups.map((g) => new Map(g.map((c) => [c.runIndex, c])));
  const runs: number[] = [];
  const rows: number[][] = [];
  for (const c0 of bySizeGroups[0] ?? []) {
    const row: number[] = [];
    let ok = true;
    for (let j = 0; j < s && ok; j++) {
      const c = maps[j].get(c0.runIndex);
      if (!c) { ok = false; break; }
      for (const v of pick(c)) {
        if (typeof v !== 'number' || !Number.isFinite(v)) { ok = false; break; }
        row.push(v);
      }
    }
    if (ok) { runs.push(c0.runIndex); rows.push(row); }
  }
  return { runs, rows };
}

function capacityGrowthOf(sizes: number[], groups: ReadonlyArray<readonly ClusterHarmonic[]>, seed: string | number, resamples: number, level: number): CapacityGrowth {
  const empty = (reason: string, meanLogCapacity: number[] = []): CapacityGrowth => ({
    sizes: [...sizes], meanLogCapacity, exponent: null, exponentInterval: null, dimension: null, dimensionInterval: null, reason,
  });
  if (sizes.length < 2) return empty(`${sizes.length} probed size${sizes.length === 1 ? '' : 's'}; the capacity growth needs at least 2`);
  const { rows } = completeRows(groups, (c) => [c.logCapacity]);
  const k = rows.length;
  if (k === 0) return empty('no cluster has a log capacity at every probed size');
  const meanLogCapacity = sizes.map((_, j) => rows.reduce((s, r) => s + r[j], 0) / k);
  if (k < 3) return empty(`${k} cluster${k === 1 ? '' : 's'} with a log capacity at every probed size; at least 3 are needed`, meanLogCapacity);
  const w = slopeWeights(Float64Array.from(sizes, Math.log), 0, sizes.length);
  if (w === null) return empty('the probed sizes have no spread', meanLogCapacity);
  const perCluster = rows.map((r) => r.reduce((s, v, j) => s + w[j] * v, 0));
  const ev = ensembleMeanInterval(perCluster, seed, resamples, level);
  const exponent = ev.mean; // = the OLS slope of meanLogCapacity (linearity of OLS)
  const ends = intervalEnds(ev.interval);
  return {
    sizes: [...sizes],
    meanLogCapacity,
    exponent,
    exponentInterval: ev.interval,
    dimension: exponent > 0 ? 1 / exponent : null,
    dimensionInterval: ends && ends[0] > 0 ? [1 / ends[1], 1 / ends[0]] : null,
    reason: exponent > 0 ? null : `the mean log capacity does not grow with N (slope ${exponent.toPrecision(3)}): no D_cap`,
  };
}

/** The capacity variable whose growth per particle is proportional to Z(3): ln cap in 2D, −1/C in 3D (file header). */
function incrementVariable(logCapacity: number | null, dimension: 2 | 3): number | null {
  if (logCapacity === null) return null;
  return dimension === 3 ? -Math.exp(-logCapacity) : logCapacity;
}

function capacityIncrementOf(
  sizes: number[], groups: ReadonlyArray<readonly ClusterHarmonic[]>, seed: string | number, resamples: number, level: number,
  dimension: 2 | 3, moment: (c: ClusterHarmonic) => number | null = (c) => c.z3, label = 'Z(3)',
): CapacityIncrement {
  const m = sizes.length - 1;
  const base = {
    fromSize: sizes.slice(0, Math.max(m, 0)),
    toSize: sizes.slice(1),
  };
  const empty = (reason: string, partial?: Pick<CapacityIncrement, 'meanIncrement' | 'z3' | 'ratio'>): CapacityIncrement => ({
    ...base, meanIncrement: partial?.meanIncrement ?? [], z3: partial?.z3 ?? [], ratio: partial?.ratio ?? [],
    slope: null, slopeInterval: null, proportional: null, reason,
  });
  if (m < 1) return empty(`${sizes.length} probed size${sizes.length === 1 ? '' : 's'}; increments need at least 2`);
  // per complete cluster: the capacity variable (ln cap; −1/C in 3D) at every size, then the moment at every size
  const { rows: raw } = completeRows(groups, (c) => [incrementVariable(c.logCapacity, dimension), moment(c)]);
  const k = raw.length;
  if (k === 0) return empty(`no cluster has a log capacity and ${label} at every probed size`);
  const s = sizes.length;
  const cols = m + s;
  // matrix K × (m increments, s Z(3) values)
  const y = new Float64Array(k * cols);
  for (let c = 0; c < k; c++) {
    const r = raw[c];
    for (let j = 0; j < m; j++) y[c * cols + j] = (r[2 * (j + 1)] - r[2 * j]) / (sizes[j + 1] - sizes[j]);
    for (let j = 0; j < s; j++) y[c * cols + m + j] = r[2 * j + 1];
  }
  const means = new Float64Array(cols);
  for (let c = 0; c < k; c++) for (let j = 0; j < cols; j++) means[j] += y[c * cols + j];
  for (let j = 0; j < cols; j++) means[j] /= k;
  const meanIncrement = Array.from(means.subarray(0, m));
  const z3 = meanIncrement.map((_, j) => Math.sqrt(means[m + j] * means[m + j + 1]));
  const ratio = meanIncrement.map((v, j) => v / z3[j]);
  const partial = { meanIncrement, z3, ratio };
  if (m < 2) return empty(`${sizes.length} probed sizes give ${m} increment; the slope needs at least 3 sizes`, partial);
  if (k < 3) return empty(`${k} cluster${k === 1 ? '' : 's'} with a log capacity and ${label} at every probed size; at least 3 are needed`, partial);
  const slopeOf = (mu: ArrayLike<number>): number => {
    const lx = new Float64Array(m);
    const ly = new Float64Array(m);
    for (let j = 0; j < m; j++) {
      const inc = mu[j];
      const zz = Math.sqrt(mu[m + j] * mu[m + j + 1]);
      if (!(inc > 0) || !(zz > 0)) return NaN;
      lx[j] = Math.log(zz);
      ly[j] = Math.log(inc);
    }
    return fitLine(lx, ly).slope;
  };
  const slope = slopeOf(means);
  if (!Number.isFinite(slope)) {
    const bad = meanIncrement.findIndex((v, j) => !(v > 0) || !(z3[j] > 0));
    return empty(`interval ${sizes[bad]}..${sizes[bad + 1]}: mean increment ${meanIncrement[bad].toPrecision(3)} and ${label} ${z3[bad].toPrecision(3)} must both be positive for the log-log slope`, partial);
  }
  const rng = bootstrapRandom(seed);
  const counts = new Int32Array(k);
  const drawn = new Int32Array(k);
  const weights = new Float64Array(k);
  const mu = new Float64Array(cols);
  const reps = new Float64Array(resamples);
  for (let b = 0; b < resamples; b++) {
    const used = drawResample(rng, counts, drawn, weights);
    weightedColumnMeans(y, cols, k, drawn, weights, used, mu);
    reps[b] = slopeOf(mu);
  }
  const jack = new Float64Array(k);
  for (let c = 0; c < k; c++) {
    for (let j = 0; j < cols; j++) mu[j] = (means[j] * k - y[c * cols + j]) / (k - 1);
    jack[c] = slopeOf(mu);
  }
  const slopeInterval = bootstrapInterval(slope, reps, jack, level);
  const ends = intervalEnds(slopeInterval);
  return {
    ...base, meanIncrement, z3, ratio, slope, slopeInterval,
    proportional: ends ? ends[0] <= 1 && 1 <= ends[1] : null,
    reason: ends ? null : `no interval for the slope (${slopeInterval.status}: ${slopeInterval.notes.join('; ')})`,
  };
}

/**
 * τ(3)/D at particle scale: per complete cluster the OLS slope of log Z(3)
 * (unbiased particle-scale Σp³) against log N over the probed sizes; the
 * ratio is minus the ensemble mean of those slopes, with its cluster-bootstrap
 * interval (ensembleMeanInterval). Clusters with a Z(3) ≤ 0 at some size
 * (fewer than 3 hits on every particle) are left out.
 */
function particleScaleOf(
  sizes: number[], groups: ReadonlyArray<readonly ClusterHarmonic[]>, seed: string | number, resamples: number, level: number,
  dimension: 2 | 3, mass: HarmonicSectionOptions['massDimension'],
): ElectrostaticCheck['particleScale'] {
  const empty = (reason: string, clusters = 0): ElectrostaticCheck['particleScale'] => ({ sizes: [...sizes], clusters, ratio: null, ratioInterval: null, expected: null, consistent: null, reason });
  if (sizes.length < 2) return empty(`${sizes.length} probed size${sizes.length === 1 ? '' : 's'}; the particle-scale check needs at least 2`);
  const { rows } = completeRows(groups, (c) => [c.z3 !== null && c.z3 > 0 ? Math.log(c.z3) : null]);
  const k = rows.length;
  if (k < 3) return empty(`${k} cluster${k === 1 ? '' : 's'} with a positive Z(3) at every probed size; at least 3 are needed`, k);
  const w = slopeWeights(Float64Array.from(sizes, Math.log), 0, sizes.length);
  if (w === null) return empty('the probed sizes have no spread', k);
  const perCluster = rows.map((r) => -r.reduce((s, v, j) => s + w[j] * v, 0));
  const ev = ensembleMeanInterval(perCluster, seed, resamples, level);
  const ends = intervalEnds(ev.interval);
  // the relation's value of tau(3)/D: 1 in 2D; 1 + (d - 2)/D otherwise, an interval from the mass-D interval
  const d = mass?.interval ?? null;
  const expected: [number, number] | null = dimension === 2 ? [1, 1] : d && d[0] > 0 ? [1 + (dimension - 2) / d[1], 1 + (dimension - 2) / d[0]] : null;
  const reason = !ends ? `no interval (${ev.interval.status})` : !expected ? 'no mass-dimension interval: the 3D relation needs D' : null;
  return {
    sizes: [...sizes], clusters: k, ratio: ev.mean, ratioInterval: ev.interval, expected,
    consistent: ends && expected ? ends[0] <= expected[1] && expected[0] <= ends[1] : null, reason,
  };
}

function electrostaticOf(bySize: HarmonicAtSize[], mass: HarmonicSectionOptions['massDimension'], particleScale: ElectrostaticCheck['particleScale'], dimension: 2 | 3): ElectrostaticCheck {
  const last = bySize.length > 0 ? bySize[bySize.length - 1] : null;
  const tau3 = last ? last.tau3 : null;
  const shift = dimension - 2;
  const t = intervalEnds(tau3?.interval);
  const a: [number, number] | null = t ? [t[0] - shift, t[1] - shift] : null;
  const sys: [number, number] | null = last?.tau3WithSystematic ? [last.tau3WithSystematic[0] - shift, last.tau3WithSystematic[1] - shift] : null;
  const b = mass?.interval ?? null;
  return {
    size: last ? last.size : 0,
    dimension,
    relation: dimension === 2 ? 'tau(3) = D' : `tau(3) = D + ${shift}`,
    tau3,
    dimensionFromTau3: tau3 && Number.isFinite(tau3.mean) ? { value: tau3.mean - shift, interval: a, withSystematic: sys } : null,
    massDimension: mass ? { estimator: mass.estimator, value: mass.value, interval: mass.interval ? [mass.interval[0], mass.interval[1]] : null } : null,
    consistent: a && b ? a[0] <= b[1] && b[0] <= a[1] : null,
    consistentWithSystematic: sys && b ? sys[0] <= b[1] && b[0] <= sys[1] : null,
    particleScale,
    source: dimension === 2 ? ELECTROSTATIC_SOURCE : ELECTROSTATIC_SOURCE_3D,
  };
}

export const BREAKDOWN_SOURCE =
  'DBM form of the electrostatic scaling law, tau(eta + 2) - tau(eta) = D: Halsey 1987, Phys. Rev. Lett. 59, 2067 (citation from memory); the capacity-increment argument: coordinator/harmonic/harmonic-section.ts, with the growth density h^eta';
export const BREAKDOWN_RULE =
  'tau(eta+2) - tau(eta) per cluster = minus the OLS slope of log(Z(eta+2)/Z(eta)) against log(set radius) over the probed sizes; D per cluster = the OLS slope of log N against log(set radius); both ensemble means with cluster-bootstrap intervals (BCa, else percentile); consistent when the two intervals overlap, inconsistent when they do not, undetermined without both intervals';
export const BREAKDOWN_CAPACITY_RULE =
  'mean increment of log capacity per particle against the geometric mean of the ensemble-mean Z(eta+2)/Z(eta) at the ends of each interval between probed sizes; proportional when the cluster-bootstrap interval (BCa, else percentile) of the log-log slope contains 1, not proportional when it does not, undetermined without an interval';

/**
 * The dielectric breakdown relations (records with `breakdown` moments):
 *  - τ(η + 2) − τ(η) = D. With Z(q, a) ∝ (a/R)^τ(q) at particle scale a and
 *    set radius R, log(Z(η+2)/Z(η)) = −(τ(η+2) − τ(η)) log R + const; the
 *    mass dimension of the same prefixes is the slope of log N against log R.
 *    Both per complete cluster (a record at every size, positive moments),
 *    then ensemble means with intervals (ensembleMeanInterval). BREAKDOWN_RULE
 *    is the verdict's rule. At η = 1 this is the τ(3) = D check with the
 *    set radius as the length (Z(1) = 1).
 *  - Capacity increment: with growth density ∝ h^η (h = |∇g| on the
 *    boundary, as in the file header), a particle lands at s with probability
 *    h^η ds / ∫ h^η and raises log cap by c a² h(s)², so the mean increment is
 *    ∝ ∫ h^(η+2) / ∫ h^η ∝ Z(η + 2)/Z(η) at particle scale (the a factors
 *    cancel up to a constant). capacityIncrementOf with that moment ratio;
 *    BREAKDOWN_CAPACITY_RULE is the verdict's rule.
 */
function breakdownRelationOf(sizes: number[], groups: ReadonlyArray<readonly ClusterHarmonic[]>, seed: string | number, resamples: number, level: number): BreakdownRelation | undefined {
  const first = groups.flat().find((c) => c.breakdown !== undefined);
  if (first === undefined || first.breakdown === undefined) return undefined;
  const eta = first.breakdown.eta;
  const ratioOf = (c: ClusterHarmonic): number | null => {
    const b = c.breakdown;
    return b && b.zEta !== null && b.zEtaPlus2 !== null && b.zEta > 0 && b.zEtaPlus2 > 0 ? b.zEtaPlus2 / b.zEta : null;
  };
  const none: EstimateWithInterval = { estimate: null, low: null, high: null };
  const inc = capacityIncrementOf(sizes, groups, seed, resamples, level, 2, ratioOf, 'Z(eta+2)/Z(eta)'); // the breakdown model is planar
  const incEnds = intervalEnds(inc.slopeInterval);
  const capacityIncrement: BreakdownRelation['capacityIncrement'] = {
    meanIncrement: inc.meanIncrement,
    momentRatio: inc.z3,
    slope: { estimate: inc.slope, low: incEnds ? incEnds[0] : null, high: incEnds ? incEnds[1] : null },
    verdict: inc.proportional === null ? 'undetermined' : inc.proportional ? 'proportional' : 'not proportional',
    rule: BREAKDOWN_CAPACITY_RULE,
    reason: inc.reason,
  };
  const result = (clusters: number, tauDifference: EstimateWithInterval, massDimension: EstimateWithInterval, reason: string | null): BreakdownRelation => {
    const both = tauDifference.low !== null && tauDifference.high !== null && massDimension.low !== null && massDimension.high !== null;
    const verdict = !both ? 'undetermined' : tauDifference.low! <= massDimension.high! && massDimension.low! <= tauDifference.high! ? 'consistent' : 'inconsistent';
    return { eta, sizes: [...sizes], clusters, tauDifference, massDimension, verdict, rule: BREAKDOWN_RULE, capacityIncrement, source: BREAKDOWN_SOURCE, reason };
  };
  if (sizes.length < 2) return result(0, none, none, `${sizes.length} probed size${sizes.length === 1 ? '' : 's'}; the relation needs at least 2`);
  const { rows } = completeRows(groups, (c) => {
    const r = ratioOf(c);
    return [r === null ? null : Math.log(r), c.radius > 0 ? Math.log(c.radius) : null, Math.log(c.size)];
  });
  const k = rows.length;
  if (k < 3) return result(k, none, none, `${k} cluster${k === 1 ? '' : 's'} with positive Z(eta) and Z(eta+2) at every probed size; at least 3 are needed`);
  const s = sizes.length;
  const tauDiff: number[] = [];
  const mass: number[] = [];
  for (const r of rows) {
    const lr = Float64Array.from({ length: s }, (_, j) => r[3 * j + 1]);
    const lz = Float64Array.from({ length: s }, (_, j) => r[3 * j]);
    const ln = Float64Array.from({ length: s }, (_, j) => r[3 * j + 2]);
    const a = fitLine(lr, lz).slope;
    const b = fitLine(lr, ln).slope;
    if (Number.isFinite(a) && Number.isFinite(b)) {
      tauDiff.push(-a);
      mass.push(b);
    }
  }
  if (tauDiff.length < 3) return result(tauDiff.length, none, none, 'the set radius does not change over the probed sizes: no slope');
  const of = (v: number[]): EstimateWithInterval => {
    const ev = ensembleMeanInterval(v, seed, resamples, level);
    const ends = intervalEnds(ev.interval);
    return { estimate: ev.mean, low: ends ? ends[0] : null, high: ends ? ends[1] : null };
  };
  return result(tauDiff.length, of(tauDiff), of(mass), null);
}

/** The harmonic section of an ensemble summary from its per-(run, size) records (see the file header). */
export function harmonicSection(clusters: readonly ClusterHarmonic[], o: HarmonicSectionOptions): HarmonicSection {
  const resamples = checkOption('resamples', o.resamples ?? 2000, 10, 1_000_000, true);
  const level = checkOption('level', o.level ?? 0.95, 0.5, 0.999, false);
  const dimension = o.dimension ?? 2;
  if (dimension !== 2 && dimension !== 3) throw new RangeError(`harmonic section dimension: ${String(dimension)} is out of range; allowed: 2 or 3`);
  for (const c of clusters)
    if ((c.dimension ?? 2) !== dimension) throw new RangeError(`harmonic record of run ${c.runIndex} at size ${c.size}: dimension ${c.dimension ?? 2} differs from the section's ${dimension}`);
  const q = clusters.length > 0 ? clusters[0].q : o.probe.q;
  for (const c of clusters)
    if (!sameGrid(c.q, q)) throw new RangeError(`harmonic record of run ${c.runIndex} at size ${c.size}: q grid [${c.q.join(', ')}] differs from [${q.join(', ')}]`);
  const groupsMap = new Map<number, ClusterHarmonic[]>();
  for (const c of clusters) {
    let g = groupsMap.get(c.size);
    if (!g) groupsMap.set(c.size, (g = []));
    g.push(c);
  }
  const sizes = [...groupsMap.keys()].sort((a, b) => a - b);
  const groups = sizes.map((n) => {
    const sorted = [...groupsMap.get(n)!].sort((a, b) => a.runIndex - b.runIndex);
    return sorted.filter((c, i) => i === 0 || c.runIndex !== sorted[i - 1].runIndex);
  });
  const bySize = sizes.map((n, j) => atSize(n, groups[j], q, o.seed, resamples, level));
  const runSets = groups.map((g) => new Set(g.map((c) => c.runIndex)));
  const clustersAtAllSizes = groups.length === 0 ? 0 : groups[0].filter((c) => runSets.every((s) => s.has(c.runIndex))).length;
  const breakdown = breakdownRelationOf(sizes, groups, o.seed, resamples, level);
  return {
    schema: 'tendril-harmonic/1',
    dimension,
    convention: SIGN_CONVENTION,
    probe: { ...o.probe, q: [...o.probe.q], sizes: [...o.probe.sizes] },
    bySize,
    capacityGrowth: capacityGrowthOf(sizes, groups, o.seed, resamples, level),
    capacityIncrement: capacityIncrementOf(sizes, groups, o.seed, resamples, level, dimension),
    electrostatic: electrostaticOf(bySize, o.massDimension, particleScaleOf(sizes, groups, o.seed, resamples, level, dimension, o.massDimension), dimension),
    ...(breakdown ? { breakdownRelation: breakdown } : {}),
    clustersAtAllSizes,
  };
}

