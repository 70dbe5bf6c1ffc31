/**
 * Corrections-to-scaling fit  R = A N^{1/D} (1 + B N^{-omega}),
 * by nonlinear least squares on the logarithm of the ensemble-mean curve:
 *
 *   y_i = ln R_i = ln A + s x_i + ln(1 + B N_i^{-omega}),   x_i = ln N_i,  s = 1/D.
 *
 * Method: profile over omega. For fixed omega the model is nearly linear in
 * (ln A, s, b) with b = B N_min^{-omega} the relative correction at the
 * smallest size of the window (well scaled, b > -1 keeps the model defined);
 * it is solved by a linear least-squares start (ln(1 + b t) ~ b t) followed by
 * Gauss-Newton steps with step halving. The profile RSS(omega) is scanned on a
 * log-spaced grid over [omegaMin, omegaMax] and its minimum refined by
 * golden-section search in log omega.
 *
 * Omega is reported as undetermined (not an error) when the correction is not
 * detectable: b = 0 within rounding (exact power law: RSS does not depend on
 * omega), or the minimum sits at an end of the omega range. The caller adds the
 * bootstrap criterion (interval of b contains 0).
 */

export interface CorrectionsFitOptions {
  omegaMin: number;
  omegaMax: number;
  /** Grid points of the omega scan. */
  gridPoints: number;
  /** Relative tolerance in omega of the golden-section refinement. */
  tolerance: number;
}

export const DEFAULT_CORRECTIONS_FIT: CorrectionsFitOptions = { omegaMin: 0.05, omegaMax: 4, gridPoints: 32, tolerance: 1e-7 };

export interface CorrectionsFit {
  /** 1/D. */
  inverseDimension: number;
  dimension: number;
  amplitude: number;
  /** B in R = A N^{1/D} (1 + B N^{-omega}). */
  correctionAmplitude: number;
  /** b = B N_min^{-omega}: relative size of the correction at the smallest size fitted. */
  relativeCorrection: number;
  omega: number;
  rss: number;
  /** RSS of the pure power law (B = 0) over the same points. */
  rssPowerLaw: number;
  /** True if the best omega is at an end of the search range. */
  omegaAtBound: boolean;
  /** True if the correction is zero within rounding (omega then meaningless). */
  correctionNegligible: boolean;
  /** Profile RSS at the lower and upper end of the omega search range (for the flat-profile check). */
  rssAtOmegaMin: number;
  rssAtOmegaMax: number;
  points: number;
}

/** Scratch space for repeated fits on the same abscissae (no allocation in the bootstrap loop). */
export class CorrectionsFitter {
  readonly n: number;
  private readonly xc: Float64Array; // centred ln N
  private readonly dx: Float64Array; // ln N - ln N_min
  private readonly xMean: number;
  private readonly xMin: number;
  private readonly t: Float64Array;
  private readonly gridOmega: Float64Array;
  private readonly gridT: Float64Array[];
  private readonly y: Float64Array;
  // solution of the last solveAt
  private a = 0; private s = 0; private b = 0;

  constructor(x: ArrayLike<number>, private readonly opts: CorrectionsFitOptions = DEFAULT_CORRECTIONS_FIT) {
    const n = x.length;
    this.n = n;
    let xm = 0, xmin = Infinity;
    for (let i = 0; i < n; i++) { xm += x[i]; xmin = Math.min(xmin, x[i]); }
    xm /= n;
    this.xMean = xm; this.xMin = xmin;
    this.xc = new Float64Array(n); this.dx = new Float64Array(n);
    for (let i = 0; i < n; i++) { this.xc[i] = x[i] - xm; this.dx[i] = x[i] - xmin; }
    this.t = new Float64Array(n);
    this.y = new Float64Array(n);
    const g = Math.max(3, opts.gridPoints);
    this.gridOmega = new Float64Array(g);
    this.gridT = [];
    for (let k = 0; k < g; k++) {
      const om = opts.omegaMin * Math.pow(opts.omegaMax / opts.omegaMin, k / (g - 1));
      this.gridOmega[k] = om;
      const tk = new Float64Array(n);
      for (let i = 0; i < n; i++) tk[i] = Math.exp(-om * this.dx[i]);
      this.gridT.push(tk);
    }
  }

  /** RSS of the pure power law on the loaded data; leaves (a, s) in place with b = 0. */
  private powerLaw(): number {
    const n = this.n, xc = this.xc, y = this.y;
    let ym = 0, sxx = 0, sxy = 0;
    for (let i = 0; i < n; i++) ym += y[i];
    ym /= n;
    for (let i = 0; i < n; i++) { sxx += xc[i] * xc[i]; sxy += xc[i] * (y[i] - ym); }
    this.s = sxy / sxx; this.a = ym; this.b = 0;
    let rss = 0;
    for (let i = 0; i < n; i++) { const r = y[i] - ym - this.s * xc[i]; rss += r * r; }
    return rss;
  }

  /** Least squares in (a, s, b) at fixed t = exp(-omega dx); returns RSS, leaves the solution in (a, s, b). */
  private solveAt(t: Float64Array, iterations: number): number {
    const n = this.n, xc = this.xc, y = this.y;
    // linear start: y ~ a + s xc + b t
    let s11 = n, s12 = 0, s13 = 0, s22 = 0, s23 = 0, s33 = 0, r1 = 0, r2 = 0, r3 = 0;
    for (let i = 0; i < n; i++) {
      const u = xc[i], v = t[i], w = y[i];
      s12 += u; s13 += v; s22 += u * u; s23 += u * v; s33 += v * v; r1 += w; r2 += u * w; r3 += v * w;
    }
    let sol = solve3(s11, s12, s13, s22, s23, s33, r1, r2, r3);
    if (!sol) return this.powerLaw();
    let a = sol[0], s = sol[1], b = sol[2];
    if (!(b > -0.95)) b = -0.95;
    let rss = this.rssAt(t, a, s, b);
    for (let it = 0; it < iterations; it++) {
      // Gauss-Newton normal equations
      s11 = 0; s12 = 0; s13 = 0; s22 = 0; s23 = 0; s33 = 0; r1 = 0; r2 = 0; r3 = 0;
      for (let i = 0; i < n; i++) {
        const q = 1 + b * t[i];
        const r = y[i] - a - s * xc[i] - Math.log(q);
        const u = xc[i], v = t[i] / q;
        s11 += 1; s12 += u; s13 += v; s22 += u * u; s23 += u * v; s33 += v * v; r1 += r; r2 += u * r; r3 += v * r;
      }
      sol = solve3(s11, s12, s13, s22, s23, s33, r1, r2, r3);
      if (!sol) break;
      let lambda = 1, improved = false;
      for (let h = 0; h < 30; h++) {
        const na = a + lambda * sol[0], ns = s + lambda * sol[1], nb = b + lambda * sol[2];
        if (nb > -1) {
          const nr = this.rssAt(t, na, ns, nb);
          if (nr <= rss) { a = na; s = ns; b = nb; improved = rss - nr > 1e-12 * rss; rss = nr; break; }
        }
        lambda *= 0.5;
      }
      if (!improved) break;
    }
    this.a = a; this.s = s; this.b = b;
    return rss;
  }

  private rssAt(t: Float64Array, a: number, s: number, b: number): number {
    let rss = 0;
    for (let i = 0; i < this.n; i++) {
      const r = this.y[i] - a - s * this.xc[i] - Math.log(1 + b * t[i]);
      rss += r * r;
    }
    return rss;
  }

  private rssOmega(omega: number, iterations: number): number {
    const t = this.t;
    for (let i = 0; i < this.n; i++) t[i] = Math.exp(-omega * this.dx[i]);
    return this.solveAt(t, iterations);
  }

  /**
   * Fit ln R values y (same abscissae as the constructor's x). `tolerance` is
   * the stopping width in ln omega; `gridStride` > 1 scans every stride-th
   * grid point only (used for bootstrap replicates).
   */
  fit(y: ArrayLike<number>, tolerance = this.opts.tolerance, iterations = 12, gridStride = 1): CorrectionsFit {
    const n = this.n;
    for (let i = 0; i < n; i++) this.y[i] = y[i];
    const rss0 = this.powerLaw();
    const s0 = this.s, a0 = this.a;
    let tss = 0;
    for (let i = 0; i < n; i++) tss += (y[i] - a0) * (y[i] - a0);
    const g = this.gridOmega.length;
    let best = -1, bestRss = Infinity, prevK = -1, nextK = -1;
    const ks: number[] = [];
    for (let k = 0; k < g; k += gridStride) ks.push(k);
    if (ks[ks.length - 1] !== g - 1) ks.push(g - 1);
    const fk = new Float64Array(ks.length);
    for (let j = 0; j < ks.length; j++) {
      fk[j] = this.solveAt(this.gridT[ks[j]], iterations);
      if (fk[j] < bestRss) { bestRss = fk[j]; best = j; }
    }
    let omega = this.gridOmega[ks[best]];
    const atBound = best === 0 || best === ks.length - 1;
    if (!atBound) {
      prevK = ks[best - 1]; nextK = ks[best + 1];
      // safeguarded successive parabolic interpolation in ln omega on the bracket
      let l = Math.log(this.gridOmega[prevK]), r = Math.log(this.gridOmega[nextK]), m = Math.log(omega);
      let fl = fk[best - 1], fr = fk[best + 1], fm = bestRss;
      const gr = 0.3819660112501051;
      for (let it = 0; it < 60 && r - l > tolerance; it++) {
        const p1 = (m - l) * (fm - fr), p2 = (m - r) * (fm - fl);
        const den = 2 * (p1 - p2);
        let v = den !== 0 ? m - ((m - l) * p1 - (m - r) * p2) / den : NaN;
        const minStep = 0.25 * tolerance;
        if (!(v > l + minStep && v < r - minStep) || Math.abs(v - m) < minStep) {
          v = m - l > r - m ? m - gr * (m - l) : m + gr * (r - m);
        }
        const fv = this.rssOmega(Math.exp(v), iterations);
        if (fv <= fm) {
          if (v < m) { r = m; fr = fm; } else { l = m; fl = fm; }
          m = v; fm = fv;
        } else if (v < m) { l = v; fl = fv; } else { r = v; fr = fv; }
      }
      omega = Math.exp(m);
      bestRss = fm;
    }
    bestRss = this.rssOmega(omega, iterations);
    let s = this.s, a = this.a, b = this.b;
    // exact power law or a correction lost in rounding: omega carries no information
    const negligible = !(rss0 - bestRss > 1e-10 * rss0 + 1e-20 * Math.max(tss, 1e-300) + 1e-26 * n) || Math.abs(b) < 1e-9;
    if (!(bestRss < rss0) && rss0 <= bestRss) { s = s0; a = a0; b = 0; bestRss = rss0; }
    const lnA = a - s * this.xMean;
    const B = b * Math.exp(omega * this.xMin);
    return {
      inverseDimension: s, dimension: 1 / s, amplitude: Math.exp(lnA), correctionAmplitude: B, relativeCorrection: b,
      omega, rss: bestRss, rssPowerLaw: rss0, omegaAtBound: atBound, correctionNegligible: negligible,
      rssAtOmegaMin: fk[0], rssAtOmegaMax: fk[ks.length - 1], points: n,
    };
  }
}

/** Solve the symmetric 3x3 system by Cramer's rule; null if (nearly) singular. */
function solve3(a11: number, a12: number, a13: number, a22: number, a23: number, a33: number, b1: number, b2: number, b3: number): [number, number, number] | null {
  const c11 = a22 * a33 - a23 * a23;
  const c12 = a13 * a23 - a12 * a33;
  const c13 = a12 * a23 - a13 * a22;
  const det = a11 * c11 + a12 * c12 + a13 * c13;
  const scale = Math.abs(a11 * a22 * a33) + 1e-300;
  if (!(Math.abs(det) > 1e-13 * scale)) return null;
  const c22 = a11 * a33 - a13 * a13;
  const c23 = a12 * a13 - a11 * a23;
  const c33 = a11 * a22 - a12 * a12;
  return [
    (c11 * b1 + c12 * b2 + c13 * b3) / det,
    (c12 * b1 + c22 * b2 + c23 * b3) / det,
    (c13 * b1 + c23 * b2 + c33 * b3) / det,
  ];
}

/** One-shot fit of ln R (y) against ln N (x). */
export function fitScalingCorrections(x: ArrayLike<number>, y: ArrayLike<number>, opts: CorrectionsFitOptions = DEFAULT_CORRECTIONS_FIT): CorrectionsFit {
  return new CorrectionsFitter(x, opts).fit(y);
}
