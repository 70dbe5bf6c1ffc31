/**
 * The potential kernel a(x) of the simple random walk on Z² (exact values by
 * numerical quadrature; Lawler & Limic 2010, Random Walk: A Modern
 * Introduction, ch. 4, from memory): a(x) = Σ_n [P(S_n = 0) − P(S_n = x)],
 * with a(0) = 0, a(±1, 0) = 1, a(1, 1) = 4/π, and Δa = δ_0.
 *
 * From the Fourier integral a(x) = (2π)^-2 ∫∫ (1 − cos(x·θ)) / (1 − (cos θ1 + cos θ2)/2) dθ,
 * integrating θ1 in closed form (∫ cos(nθ)/(c − cos θ) dθ/2π = e^{−|n|t}/sinh t, cosh t = c):
 *   a(x1, x2) = (2/π) ∫_0^π (1 − cos(x2 θ) e^{−|x1| t(θ)}) / sinh t(θ) dθ,  cosh t = 2 − cos θ,
 * an analytic integrand on [0, π], integrated by Gauss–Legendre quadrature.
 *
 * The harmonic measure from infinity of a finite set A (the law of the first
 * site of A a walk from far away visits) is the equilibrium measure: the
 * unique H >= 0 with Σ H = 1 such that Σ_{z∈A} a(x − z) H(z) is the same for
 * every x ∈ A (Lawler & Limic 2010, section 6.6, from memory).
 */

import { squarePotential, triangularPotential } from '../../worker/lattice/potential-kernel.js';

/** a(x1, x2) on the square lattice (worker/lattice/potential-kernel.ts, by quadrature). */
export const potentialKernel = squarePotential;
/** a(x1, x2) on the triangular lattice in axial coordinates (worker/lattice/potential-kernel.ts). */
export const triangularPotentialKernel = triangularPotential;

/** Harmonic measure from infinity of the sites of A (given as [x, y] pairs), by solving the equilibrium equations. */
export function harmonicMeasureFromInfinity(a: [number, number][], kernel: (x1: number, x2: number) => number = potentialKernel): number[] {
  const n = a.length;
  // unknowns H_0 … H_{n−1}, C: Σ_z a(x − z) H_z − C = 0 for x ∈ A; Σ H_z = 1
  const m: number[][] = [];
  for (let i = 0; i < n; i++) {
    const row: number[] = [];
    for (let j = 0; j < n; j++) row.push(kernel(a[i][0] - a[j][0], a[i][1] - a[j][1]));
    row.push(-1, 0);
    m.push(row);
  }
  m.push([...new Array(n).fill(1), 0, 1]);
  // Gaussian elimination with partial pivoting on the (n + 1) × (n + 2) augmented matrix
  const k = n + 1;
  for (let c = 0; c < k; c++) {
    let p = c;
    for (let r = c + 1; r < k; r++) if (Math.abs(m[r][c]) > Math.abs(m[p][c])) p = r;
    [m[c], m[p]] = [m[p], m[c]];
    for (let r = 0; r < k; r++) {
      if (r === c) continue;
      const f = m[r][c] / m[c][c];
      for (let q = c; q <= k; q++) m[r][q] -= f * m[c][q];
    }
  }
  return Array.from({ length: n }, (_, i) => m[i][k] / m[i][i]);
}

/**
 * The Green's function of the square-lattice walk with pole at infinity for the
 * finite set A, at the sites `at`: u(s) = Σ_z a(s − z) H(z) − κ, H the harmonic
 * measure from infinity of A and κ the (constant) value of the sum on A
 * (Lawler & Limic 2010, ch. 6; from memory). u = 0 on A, u is harmonic off A
 * and grows like (2/π) ln|s|; it is the R_far → ∞ limit of the lattice DBM
 * potential up to a factor.
 */
export function greenWithPoleAtInfinity(a: [number, number][], at: [number, number][]): number[] {
  const h = harmonicMeasureFromInfinity(a);
  const field = ([x, y]: [number, number]): number => a.reduce((s, [zx, zy], k) => s + potentialKernel(x - zx, y - zy) * h[k], 0);
  const kappa = field(a[0]);
  return at.map((s) => field(s) - kappa);
}
