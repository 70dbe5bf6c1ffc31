/**
 * From probe hits to the harmonic measures of one set: the partition
 * function and τ(q), D_q, f(α), the information dimension τ'(1), the
 * maximum-concentration exponent against the Beurling bound, and the
 * logarithmic capacity of the union of contact disks.
 *
 * Where the measure sits: when the set has at least 64 disks, each disk's
 * hit count is placed at its centre (boxes much larger than a disk then see
 * the right measure); for fewer disks the contact sample itself is used
 * (weight 1 per contact point).
 *
 * Fit window (stated in the output): 10 log-spaced box sides from ε_lo to
 * ε_hi = R/2, R = radius of the smallest circle about the bounding-box
 * centre enclosing the disks. ε_lo = max(8 r_med, R/32) for disk centres
 * (r_med = median contact radius; if that leaves less than a factor 8, ε_lo =
 * ε_hi/8), and R/64 for contact points. A user window overrides both:
 * `relativeWindow` [lo, hi] gives ε_lo = lo·R, ε_hi = hi·R (the CLI's
 * --window, the API's and the spec's `window`; rule in fit-window.ts).
 *
 * Contact-radius systematic (resolution-systematic.ts): κ |q − 1| G, G the
 * least-squares slope of r_med/ε over the window, reported beside the window
 * systematic for τ(q), τ′(1) and the maximum-concentration exponent; a
 * warning is added when ε_lo < 8 r_med.
 *
 * Convergence per q: τ(q) is also fitted from the two halves of the probes
 * (even and odd jobs; first and second half of the contact sample for the
 * contact source); q is flagged converged when the halves agree within
 * 0.05 + 0.05 |τ(q)| (our rule, no source).
 *
 * Capacity: of K = the union of the contact disks, exactly the set the
 * probes touch; no correction is applied. For a snapshot that is the union
 * of capture disks of radius d (one particle diameter) about the centres —
 * the set the growth walker's centre sees — which is larger than the union
 * of the physical particles (radius d/2). When a union of disks stands for
 * a continuum (a segment drawn as a row of touching disks), the continuum's
 * capacity is bracketed by exact inclusions, tested in
 * test/probe-kernel.test.ts: the row of n touching disks of radius ρ contains
 * the segment of length 2nρ (capacity nρ/2) and lies in the enclosing
 * rectangle, hence in ellipses of capacity (A + B)/2; two tangent disks of
 * radius ρ have capacity πρ/2 exactly (inversion onto a strip).
 *
 * Fit-window systematic: the same fits over the lower and the upper half of
 * the box sides (the first and the last ⌈S/2⌉ of the S scales, sharing the
 * middle one when S is odd); windowSystematic is half the difference of the
 * two, for τ(q) and τ'(1). It measures the curvature of the log–log plots
 * inside the window, an error the fit's own scatter does not show (common
 * practice, no source).
 *
 * Beurling: the maximum box measure M(ε) ~ (ε/R)^a has a ≥ 1/2 for a
 * connected set as ε → 0 (Garnett & Marshall 2005, Harmonic Measure). A
 * finite window does not resolve that limit, so the verdict is
 * 'consistent', 'not resolved at this size' or 'not applicable: the set is
 * not connected', never a violation; the rule is in beurling-check.ts.
 */
import { boxStatistics, logSpaced, type BoxStatistics, type WeightedPoints } from './partition-function.js';
import { spectrumFrom, type Spectrum } from './spectrum.js';
import { capacityJobCheck, latticePairValue, logCapacity, type CapacityEstimate, type CapacityJobCheck } from './log-capacity.js';
import { beurlingVerdict, BEURLING_BOUND, type BeurlingVerdict } from './beurling-check.js';
import { diskUnionConnected } from './disk-union-connected.js';
import { resolutionSystematic, resolutionWarning, type ResolutionSystematic } from './resolution-systematic.js';
import { windowProblem } from './fit-window.js';

export const SIGN_CONVENTION =
  'Z(q,eps) = sum over boxes of side eps of mu(box)^q ~ (eps/R)^tau(q); tau(1) = 0, D_q = tau(q)/(q-1), alpha = tau\'(q), f = q alpha - tau';

export interface ProbeAnalysisInput {
  count: number;
  x: ArrayLike<number>;
  y: ArrayLike<number>;
  r: number | ArrayLike<number>;
  /** Total hits per disk. */
  counts: ArrayLike<number>;
  /** Hits per disk of the two halves of the probes, or null (one job). */
  halves: [ArrayLike<number>, ArrayLike<number>] | null;
  contactX: ArrayLike<number>;
  contactY: ArrayLike<number>;
  contactCount: number;
  /** Contact points per job, in order (the contact arrays are the jobs' samples concatenated); for the capacity's job check. */
  contactJobSizes?: number[];
  q: number[];
  /** Absolute box sides [lo, hi]; default: the rule in the file header. */
  window?: [number, number];
  /** Box sides relative to R, [lo, hi] (fit-window.ts); overrides the default, not `window`. */
  relativeWindow?: [number, number] | null;
  scales?: number;
  /** Set for lattice sets (the points are perimeter sites): the capacity is the lattice one (log-capacity.ts, latticePairValue). */
  lattice?: 'square' | 'triangular';
}

export interface HarmonicMeasures {
  convention: string;
  walkers: number;
  disks: number;
  measureSource: 'disk-centres' | 'contact-points';
  radius: number;
  window: { epsMin: number; epsMax: number; scales: number; relativeMin: number; relativeMax: number };
  spectrum: Spectrum;
  /** The box statistics behind the fits: per box side, Z(q, eps) for each q, sum mu log mu, and max mu. */
  boxes: { eps: number[]; z: number[][]; entropy: number[]; maxMeasure: number[] };
  tauHalves: [number[], number[]] | null;
  /** Half the difference of the fits over the lower and upper half of the window (see the file header). */
  windowSystematic: { tau: number[]; informationDimension: number } | null;
  /** Finite-contact-radius systematic (see the file header). */
  resolutionSystematic: ResolutionSystematic;
  /** Warnings for people (e.g. smallest box too close to the contact radius). */
  warnings: string[];
  converged: Array<boolean | null>;
  maxConcentration: {
    exponent: number;
    fitError: number;
    /** Half the difference of the fits over the lower and upper half of the window (null with fewer than 4 scales). */
    windowSystematic: number | null;
    /** Contact-radius systematic of the exponent (see the file header). */
    resolutionSystematic: number;
    beurlingBound: number;
    /** Whether the union of contact disks is connected (Beurling's estimate needs it). */
    connected: boolean;
    beurling: BeurlingVerdict;
  };
  /** jobCheck: the stated error checked against the spread of the jobs' own estimates (log-capacity.ts); null with one job. */
  capacity: (CapacityEstimate & { set: string; jobCheck: CapacityJobCheck | null }) | null;
}

function radiusAt(r: number | ArrayLike<number>, i: number): number {
  return typeof r === 'number' ? r : r[i];
}

export function analyzeProbe(inp: ProbeAnalysisInput): HarmonicMeasures {
  const n = inp.count;
  let minX = Infinity, maxX = -Infinity, minY = Infinity, maxY = -Infinity;
  for (let i = 0; i < n; i++) {
    if (inp.x[i] < minX) minX = inp.x[i];
    if (inp.x[i] > maxX) maxX = inp.x[i];
    if (inp.y[i] < minY) minY = inp.y[i];
    if (inp.y[i] > maxY) maxY = inp.y[i];
  }
  const cx = 0.5 * (minX + maxX);
  const cy = 0.5 * (minY + maxY);
  let radius = 0;
  const rs: number[] = [];
  for (let i = 0; i < n; i++) {
    const ri = radiusAt(inp.r, i);
    rs.push(ri);
    const e = Math.hypot(inp.x[i] - cx, inp.y[i] - cy) + ri;
    if (e > radius) radius = e;
  }
  rs.sort((a, b) => a - b);
  const rMed = rs[rs.length >> 1];
  const source: HarmonicMeasures['measureSource'] = n >= 64 ? 'disk-centres' : 'contact-points';
  let walkers = 0;
  for (let i = 0; i < n; i++) walkers += inp.counts[i];
  const hi0 = radius / 2;
  let lo0 = source === 'disk-centres' ? Math.max(8 * rMed, radius / 32) : radius / 64;
  if (lo0 > hi0 / 8) lo0 = hi0 / 8;
  if (inp.relativeWindow) {
    const bad = windowProblem(inp.relativeWindow);
    if (bad) throw new RangeError(`window: ${JSON.stringify(inp.relativeWindow)} ${bad}`);
  }
  const [lo, hi] = inp.window ?? (inp.relativeWindow ? [inp.relativeWindow[0] * radius, inp.relativeWindow[1] * radius] : [lo0, hi0]);
  const scales = inp.scales ?? 10;
  const eps = logSpaced(lo, hi, scales);
  const ox = cx - radius;
  const oy = cy - radius;

  const measureOf = (part: 'all' | 0 | 1): WeightedPoints => {
    if (source === 'disk-centres') {
      const w = part === 'all' ? inp.counts : (inp.halves as [ArrayLike<number>, ArrayLike<number>])[part];
      return { count: n, x: inp.x, y: inp.y, w };
    }
    const m = inp.contactCount;
    const h = m >> 1;
    const from = part === 1 ? h : 0;
    const to = part === 0 ? h : m;
    return {
      count: to - from,
      x: Array.prototype.slice.call(inp.contactX, from, to) as number[],
      y: Array.prototype.slice.call(inp.contactY, from, to) as number[],
      w: null,
    };
  };
  const stats = boxStatistics(measureOf('all'), eps, inp.q, ox, oy);
  const spectrum = spectrumFrom(stats, radius);
  const ns = stats.eps.length;
  let windowSystematic: HarmonicMeasures['windowSystematic'] = null;
  let maxConcentrationWindow: number | null = null;
  if (ns >= 4) {
    const h = Math.ceil(ns / 2);
    const part = (from: number, to: number): BoxStatistics => ({
      eps: stats.eps.slice(from, to), q: stats.q, z: stats.z.slice(from, to), entropy: stats.entropy.slice(from, to),
      maxMeasure: stats.maxMeasure.slice(from, to), occupied: stats.occupied.slice(from, to),
    });
    const lower = spectrumFrom(part(0, h), radius);
    const upper = spectrumFrom(part(ns - h, ns), radius);
    windowSystematic = {
      tau: lower.tau.map((t, k) => Math.abs(t - upper.tau[k]) / 2),
      informationDimension: Math.abs(lower.informationDimension - upper.informationDimension) / 2,
    };
    maxConcentrationWindow = Math.abs(lower.maxConcentrationExponent - upper.maxConcentrationExponent) / 2;
  }
  const canHalve = source === 'contact-points' ? inp.contactCount >= 200 : inp.halves !== null;
  let tauHalves: [number[], number[]] | null = null;
  let converged: Array<boolean | null> = inp.q.map(() => null);
  if (canHalve) {
    const a = spectrumFrom(boxStatistics(measureOf(0), eps, inp.q, ox, oy), radius).tau;
    const b = spectrumFrom(boxStatistics(measureOf(1), eps, inp.q, ox, oy), radius).tau;
    tauHalves = [a, b];
    converged = inp.q.map((_, k) => Math.abs(a[k] - b[k]) <= 0.05 + 0.05 * Math.abs(spectrum.tau[k]));
  }
  const pair = inp.lattice ? latticePairValue(inp.lattice) : undefined;
  const capacity = inp.contactCount >= 4
    ? {
      ...logCapacity(inp.contactX, inp.contactY, inp.contactCount, pair),
      set: inp.lattice ? `the ${inp.lattice}-lattice sites and their perimeter sites (continuum-equivalent capacity from the lattice potential kernel)` : 'union of the contact disks',
      jobCheck: inp.contactJobSizes ? capacityJobCheck(inp.contactX, inp.contactY, inp.contactJobSizes, pair) : null,
    }
    : null;
  const connected = diskUnionConnected(n, inp.x, inp.y, inp.r);
  const resolution = resolutionSystematic(stats.eps, inp.q, rMed);
  const warnings: string[] = [];
  const warn = resolutionWarning(stats.eps, rMed);
  if (warn) warnings.push(warn);
  const maxResolution = resolution.maxConcentration;
  return {
    convention: SIGN_CONVENTION,
    walkers,
    disks: n,
    measureSource: source,
    radius,
    window: { epsMin: lo, epsMax: hi, scales, relativeMin: lo / radius, relativeMax: hi / radius },
    spectrum,
    boxes: { eps: stats.eps, z: stats.z, entropy: stats.entropy, maxMeasure: stats.maxMeasure },
    tauHalves,
    windowSystematic,
    resolutionSystematic: resolution,
    warnings,
    converged,
    maxConcentration: {
      exponent: spectrum.maxConcentrationExponent,
      fitError: spectrum.maxConcentrationFitError,
      windowSystematic: maxConcentrationWindow,
      resolutionSystematic: maxResolution,
      beurlingBound: BEURLING_BOUND,
      connected,
      beurling: beurlingVerdict(spectrum.maxConcentrationExponent,
        { fit: spectrum.maxConcentrationFitError, window: maxConcentrationWindow ?? 0, resolution: maxResolution }, connected),
    },
    capacity,
  };
}
