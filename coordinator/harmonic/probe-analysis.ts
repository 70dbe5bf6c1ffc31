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
 *
 * Sets of balls in 3D (input with a z axis; worker/probe/probe-3d.ts). The
 * same partition function over cubes of side ε (partition-function.ts), with
 * the measure at the ball centres (no contact points are kept in 3D); R is
 * the radius of the smallest sphere about the bounding-box centre enclosing
 * the balls; the same default window and fit-window systematic. What differs:
 *  - capacity: the Newtonian capacity (units: a ball of radius a has
 *    capacity a) = R_L · hits / walkers, R_L the launch radius, with its
 *    binomial standard error (exact relation, probe-3d.ts header); the
 *    logarithmic capacity is planar and is null;
 *  - the contact-radius systematic was calibrated on planar sets
 *    (κ of resolution-systematic.ts); it is not given in 3D (null), and a
 *    warning says so;
 *  - Beurling's estimate is a planar theorem: the verdict is 'not applicable
 *    in 3D' and connectivity is not computed (null).
 */
import { boxStatistics, logSpaced, type BoxStatistics, type WeightedPoints } from './partition-function.js';
import { spectrumFrom, type Spectrum } from './spectrum.js';
import { capacityJobCheck, logCapacity, type CapacityEstimate, type CapacityJobCheck } from './log-capacity.js';
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
  /** Third axis of ball centres (3D); absent for planar disks. */
  z?: ArrayLike<number>;
  r: number | ArrayLike<number>;
  /** 3D only: probes launched, per job, from the sphere of radius launchRadius (for the Newtonian capacity). */
  launched?: { launchRadius: number; walkers: number[] };
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
}

export interface HarmonicMeasures {
  convention: string;
  walkers: number;
  disks: number;
  /** 2 for disks in the plane, 3 for balls. */
  dimension: 2 | 3;
  measureSource: 'disk-centres' | 'contact-points' | 'ball-centres';
  radius: number;
  window: { epsMin: number; epsMax: number; scales: number; relativeMin: number; relativeMax: number };
  spectrum: Spectrum;
  /** The box statistics behind the fits: per box side, Z(q, eps) for each q, sum mu log mu, and max mu. */
  boxes: { eps: number[]; z: number[][]; entropy: number[]; maxMeasure: number[] };
  tauHalves: [number[], number[]] | null;
  /** Half the difference of the fits over the lower and upper half of the window (see the file header). */
  windowSystematic: { tau: number[]; informationDimension: number } | null;
  /** Finite-contact-radius systematic (see the file header); null in 3D (not calibrated there). */
  resolutionSystematic: ResolutionSystematic | null;
  /** Warnings for people (e.g. smallest box too close to the contact radius). */
  warnings: string[];
  converged: Array<boolean | null>;
  maxConcentration: {
    exponent: number;
    fitError: number;
    /** Half the difference of the fits over the lower and upper half of the window (null with fewer than 4 scales). */
    windowSystematic: number | null;
    /** Contact-radius systematic of the exponent (see the file header); null in 3D. */
    resolutionSystematic: number | null;
    beurlingBound: number;
    /** Whether the union of contact disks is connected (Beurling's estimate needs it); null in 3D (not computed). */
    connected: boolean | null;
    beurling: BeurlingVerdict;
  };
  /** jobCheck: the stated error checked against the spread of the jobs' own estimates (log-capacity.ts); null with one job. */
  capacity: (CapacityEstimate & { set: string; jobCheck: CapacityJobCheck | null }) | null;
  /** 3D: Newtonian capacity of the union of balls and its binomial standard error (see the file header); null in 2D. */
  newtonianCapacity: NewtonianCapacity | null;
}

export interface NewtonianCapacity {
  capacity: number;
  error: number;
  walkers: number;
  hits: number;
  launchRadius: number;
  set: string;
}

/** Newtonian capacity from probes launched on a sphere of radius R_L (units: a ball of radius a has capacity a). */
export function newtonianCapacityOf(hits: number, walkers: number, launchRadius: number): NewtonianCapacity {
  const p = hits / walkers;
  return {
    capacity: launchRadius * p, error: launchRadius * Math.sqrt((p * (1 - p)) / walkers),
    walkers, hits, launchRadius, set: 'union of the contact balls',
  };
}

function radiusAt(r: number | ArrayLike<number>, i: number): number {
  return typeof r === 'number' ? r : r[i];
}

export function analyzeProbe(inp: ProbeAnalysisInput): HarmonicMeasures {
  const n = inp.count;
  const iz = inp.z;
  const dimension: 2 | 3 = iz ? 3 : 2;
  if (dimension === 3 && !inp.launched) throw new RangeError('a 3D probe analysis needs the launch radius and walkers of its jobs');
  let minX = Infinity, maxX = -Infinity, minY = Infinity, maxY = -Infinity, minZ = 0, maxZ = 0;
  for (let i = 0; i < n; i++) {
    if (inp.x[i] < minX) minX = inp.x[i];
    if (inp.x[i] > maxX) maxX = inp.x[i];
    if (inp.y[i] < minY) minY = inp.y[i];
    if (inp.y[i] > maxY) maxY = inp.y[i];
  }
  if (iz) {
    minZ = Infinity;
    maxZ = -Infinity;
    for (let i = 0; i < n; i++) {
      if (iz[i] < minZ) minZ = iz[i];
      if (iz[i] > maxZ) maxZ = iz[i];
    }
  }
  const cx = 0.5 * (minX + maxX);
  const cy = 0.5 * (minY + maxY);
  const cz = 0.5 * (minZ + maxZ);
  let radius = 0;
  const rs: number[] = [];
  for (let i = 0; i < n; i++) {
    const ri = radiusAt(inp.r, i);
    rs.push(ri);
    const e = (iz ? Math.hypot(inp.x[i] - cx, inp.y[i] - cy, iz[i] - cz) : Math.hypot(inp.x[i] - cx, inp.y[i] - cy)) + ri;
    if (e > radius) radius = e;
  }
  rs.sort((a, b) => a - b);
  const rMed = rs[rs.length >> 1];
  const source: HarmonicMeasures['measureSource'] = dimension === 3 ? 'ball-centres' : n >= 64 ? 'disk-centres' : 'contact-points';
  let walkers = 0;
  for (let i = 0; i < n; i++) walkers += inp.counts[i];
  const hi0 = radius / 2;
  let lo0 = source === 'contact-points' ? radius / 64 : Math.max(8 * rMed, radius / 32);
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
  const oz = cz - radius;

  const measureOf = (part: 'all' | 0 | 1): WeightedPoints => {
    if (source !== 'contact-points') {
      const w = part === 'all' ? inp.counts : (inp.halves as [ArrayLike<number>, ArrayLike<number>])[part];
      return { count: n, x: inp.x, y: inp.y, ...(iz ? { z: iz } : {}), w };
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
  const stats = boxStatistics(measureOf('all'), eps, inp.q, ox, oy, oz);
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
    const a = spectrumFrom(boxStatistics(measureOf(0), eps, inp.q, ox, oy, oz), radius).tau;
    const b = spectrumFrom(boxStatistics(measureOf(1), eps, inp.q, ox, oy, oz), radius).tau;
    tauHalves = [a, b];
    converged = inp.q.map((_, k) => Math.abs(a[k] - b[k]) <= 0.05 + 0.05 * Math.abs(spectrum.tau[k]));
  }
  const capacity = dimension === 2 && inp.contactCount >= 4
    ? {
      ...logCapacity(inp.contactX, inp.contactY, inp.contactCount), set: 'union of the contact disks',
      jobCheck: inp.contactJobSizes ? capacityJobCheck(inp.contactX, inp.contactY, inp.contactJobSizes) : null,
    }
    : null;
  const launchedWalkers = inp.launched ? inp.launched.walkers.reduce((a, b) => a + b, 0) : 0;
  const newtonianCapacity = inp.launched && launchedWalkers > 0 ? newtonianCapacityOf(walkers, launchedWalkers, inp.launched.launchRadius) : null;
  const connected = dimension === 2 ? diskUnionConnected(n, inp.x, inp.y, inp.r) : null;
  const resolution = dimension === 2 ? resolutionSystematic(stats.eps, inp.q, rMed) : null;
  const warnings: string[] = [];
  const warn = dimension === 2 ? resolutionWarning(stats.eps, rMed) : null;
  if (warn) warnings.push(warn);
  if (dimension === 3) warnings.push('contact-radius systematic not given: it was calibrated on planar sets only');
  const maxResolution = resolution ? resolution.maxConcentration : null;
  const beurling: BeurlingVerdict = connected === null
    ? 'not applicable in 3D'
    : beurlingVerdict(spectrum.maxConcentrationExponent,
      { fit: spectrum.maxConcentrationFitError, window: maxConcentrationWindow ?? 0, resolution: maxResolution ?? 0 }, connected);
  return {
    convention: SIGN_CONVENTION,
    walkers,
    disks: n,
    dimension,
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
      beurling,
    },
    capacity,
    newtonianCapacity,
  };
}
