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

const GL = gaussLegendre(200);

export function potentialKernel(x1: number, x2: number): number {
  if (x1 === 0 && x2 === 0) return 0;
  const ax = Math.abs(x1);
  let s = 0;
  for (let i = 0; i < GL.x.length; i++) {
    const th = (Math.PI / 2) * (GL.x[i] + 1);
    const t = Math.acosh(2 - Math.cos(th));
    s += GL.w[i] * ((1 - Math.cos(x2 * th) * Math.exp(-ax * t)) / Math.sinh(t));
  }
  return (2 / Math.PI) * (Math.PI / 2) * s;
}

/**
 * The potential kernel of the triangular lattice in axial coordinates
 * (neighbours (±1, 0), (0, ±1), (1, −1), (−1, 1)): with
 * φ(θ) = (cos θ1 + cos θ2 + cos(θ1 − θ2))/3, for fixed θ2 one has
 * 1 − φ = (ρ/3)(c − cos(θ1 − θ2/2)), ρ = √(2 + 2 cos θ2), c = (3 − cos θ2)/ρ,
 * so integrating θ1 in closed form (our derivation, as for the square lattice):
 *   a(x1, x2) = (1/π) ∫_0^π (3/ρ) (1 − cos((x1/2 + x2) θ) e^{−|x1| t}) / sinh t dθ,  cosh t = c.
 * Δa = δ_0 gives a = 1 at the six neighbours (checked in the tests).
 */
export function triangularPotentialKernel(x1: number, x2: number): number {
  if (x1 === 0 && x2 === 0) return 0;
  const ax = Math.abs(x1);
  let s = 0;
  for (let i = 0; i < GL.x.length; i++) {
    const th = (Math.PI / 2) * (GL.x[i] + 1);
    const rho = Math.sqrt(2 + 2 * Math.cos(th));
    const t = Math.acosh((3 - Math.cos(th)) / rho);
    s += GL.w[i] * ((3 / rho) * (1 - Math.cos((x1 / 2 + x2) * th) * Math.exp(-ax * t)) / Math.sinh(t));
  }
  return (1 / Math.PI) * (Math.PI / 2) * s;
}

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
