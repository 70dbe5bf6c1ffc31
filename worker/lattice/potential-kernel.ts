/**
 * The potential kernel a(x) of the simple random walk on the square and the
 * triangular lattice (spacing 1): a(x) = Σ_n [P(S_n = 0) − P(S_n = x)],
 * a(0) = 0, Δa = δ_0, so a = 1 at every nearest neighbour (Lawler & Limic
 * 2010, Random Walk: A Modern Introduction, ch. 4; from memory).
 *
 * Exact values by quadrature (our derivation from the Fourier integral
 * a(x) = (2π)^-2 ∫∫ (1 − cos(x·θ)) / (1 − φ(θ)) dθ, integrating θ1 in closed
 * form with ∫ cos(nθ)/(c − cos θ) dθ/2π = e^{−|n|t}/sinh t, cosh t = c):
 *  - square, φ = (cos θ1 + cos θ2)/2:
 *      a(x1, x2) = (2/π) ∫_0^π (1 − cos(x2 θ) e^{−|x1| t}) / sinh t dθ,  cosh t = 2 − cos θ;
 *  - triangular in axial coordinates (neighbours (±1, 0), (0, ±1), (1, −1),
 *    (−1, 1)), φ = (cos θ1 + cos θ2 + cos(θ1 − θ2))/3, with
 *    ρ = √(2 + 2 cos θ2), c = (3 − cos θ2)/ρ:
 *      a(x1, x2) = (1/π) ∫_0^π (3/ρ) (1 − cos((x1/2 + x2) θ) e^{−|x1| t}) / sinh t dθ,  cosh t = c;
 * analytic integrands on [0, π], integrated by 200-point Gauss–Legendre.
 *
 * Far away (Stöhr 1950; Fukai & Uchiyama 1996; from memory, and checked
 * numerically in test/lattice-probe.test.ts against the quadrature):
 *   a(x) = C ln|x| + κ + O(|x|^−2),  |x| the distance in the plane,
 * with C = 2/π (square) and C = √3/π (triangular: the walk's covariance is
 * 1/2 per coordinate on both lattices, and the triangular lattice has √3/2
 * of a unit of area per site), κ = (2γ + ln 8)/π on the square lattice
 * (γ Euler's constant; from memory, checked against the quadrature) and, on
 * the triangular lattice, measured here: the mean of a(x) − C ln|x| over
 * the sites with 48 <= |x| <= 64 (its own O(|x|^−2) term averages out over
 * the directions; the test bounds the error).
 *
 * LatticePotential answers a(x) from a table for |x1|, |x2| <= 64 (lattice
 * coordinates; quadrature, built once per lattice) and from C ln|x| + κ
 * beyond (error below 10^-4 there, checked in the test).
 */
import { HALF_SQRT3 } from './planar-lattice.js';

const EULER_GAMMA = 0.5772156649015329;
const TABLE_HALF = 64;

function gaussLegendre(n: number): { x: Float64Array; w: Float64Array } {
  const x = new Float64Array(n);
  const w = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let z = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let dp = 0;
    for (let it = 0; it < 100; it++) {
      let p0 = 1;
      let p1 = z;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * z * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      dp = (n * (z * p1 - p0)) / (z * z - 1);
      const dz = p1 / dp;
      z -= dz;
      if (Math.abs(dz) < 1e-16) break;
    }
    x[i] = z;
    w[i] = 2 / ((1 - z * z) * dp * dp);
  }
  return { x, w };
}

let nodes: { x: Float64Array; w: Float64Array } | null = null;
function gl(): { x: Float64Array; w: Float64Array } {
  return (nodes ??= gaussLegendre(200));
}

/** a(x1, x2) of the square lattice, by quadrature. */
export function squarePotential(x1: number, x2: number): number {
  if (x1 === 0 && x2 === 0) return 0;
  const { x, w } = gl();
  const ax = Math.abs(x1);
  let s = 0;
  for (let i = 0; i < x.length; i++) {
    const th = (Math.PI / 2) * (x[i] + 1);
    const t = Math.acosh(2 - Math.cos(th));
    s += w[i] * ((1 - Math.cos(x2 * th) * Math.exp(-ax * t)) / Math.sinh(t));
  }
  return s; // (2/π)·(π/2)·Σ
}

/** a(x1, x2) of the triangular lattice in axial coordinates, by quadrature. */
export function triangularPotential(x1: number, x2: number): number {
  if (x1 === 0 && x2 === 0) return 0;
  const { x, w } = gl();
  const ax = Math.abs(x1);
  let s = 0;
  for (let i = 0; i < x.length; i++) {
    const th = (Math.PI / 2) * (x[i] + 1);
    const rho = Math.sqrt(2 + 2 * Math.cos(th));
    const t = Math.acosh((3 - Math.cos(th)) / rho);
    s += w[i] * (((3 / rho) * (1 - Math.cos((x1 / 2 + x2) * th) * Math.exp(-ax * t))) / Math.sinh(t));
  }
  return 0.5 * s; // (1/π)·(π/2)·Σ
}

export class LatticePotential {
  /** C of a(x) ≈ C ln|x| + κ. */
  readonly slope: number;
  /** κ of a(x) ≈ C ln|x| + κ. */
  readonly constant: number;
  private readonly table: Float64Array;
  private readonly triangular: boolean;

  private constructor(lattice: 'square' | 'triangular') {
    this.triangular = lattice === 'triangular';
    const side = 2 * TABLE_HALF + 1;
    this.table = new Float64Array(side * side);
    const f = this.triangular ? triangularPotential : squarePotential;
    for (let j = -TABLE_HALF; j <= TABLE_HALF; j++) {
      for (let i = -TABLE_HALF; i <= TABLE_HALF; i++) this.table[(j + TABLE_HALF) * side + i + TABLE_HALF] = f(i, j);
    }
    this.slope = this.triangular ? Math.sqrt(3) / Math.PI : 2 / Math.PI;
    if (!this.triangular) this.constant = (2 * EULER_GAMMA + Math.log(8)) / Math.PI;
    else {
      let s = 0;
      let n = 0;
      for (let j = -TABLE_HALF; j <= TABLE_HALF; j++) {
        for (let i = -TABLE_HALF; i <= TABLE_HALF; i++) {
          const r = this.distance(i, j);
          if (r < 48 || r > TABLE_HALF) continue;
          s += this.table[(j + TABLE_HALF) * side + i + TABLE_HALF] - this.slope * Math.log(r);
          n++;
        }
      }
      this.constant = s / n;
    }
  }

  private static cache = new Map<string, LatticePotential>();

  /** The kernel of a lattice (its table is built on first use, about 10^7 operations). */
  static of(lattice: 'square' | 'triangular'): LatticePotential {
    let p = LatticePotential.cache.get(lattice);
    if (!p) {
      p = new LatticePotential(lattice);
      LatticePotential.cache.set(lattice, p);
    }
    return p;
  }

  /** Plane distance of the lattice vector (i, j). */
  distance(i: number, j: number): number {
    return this.triangular ? Math.hypot(i + 0.5 * j, j * HALF_SQRT3) : Math.hypot(i, j);
  }

  /** a(i, j), lattice coordinates. */
  at(i: number, j: number): number {
    if (i >= -TABLE_HALF && i <= TABLE_HALF && j >= -TABLE_HALF && j <= TABLE_HALF) return this.table[(j + TABLE_HALF) * (2 * TABLE_HALF + 1) + i + TABLE_HALF];
    return this.slope * Math.log(this.distance(i, j)) + this.constant;
  }

  /** a of the lattice vector whose plane components are (dx, dy) (rounded to the lattice). */
  atPlane(dx: number, dy: number): number {
    if (!this.triangular) return this.at(Math.round(dx), Math.round(dy));
    const j = Math.round(dy / HALF_SQRT3);
    return this.at(Math.round(dx - 0.5 * j), j);
  }
}
