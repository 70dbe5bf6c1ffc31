/**
 * Exact first-passage (exit) laws of the simple random walk on the square
 * lattice from the centre of a lattice square, for jumps of lattice DLA.
 *
 * The square of half-width L centred on the walker: the sites (x, y) with
 * max(|x|, |y|) <= L (walker at the origin). The walk started at the centre
 * first reaches the boundary max(|x|, |y|) = L at a site (±L, k) or (k, ±L)
 * with |k| <= L − 1 (a corner can only be reached from a boundary site, so
 * never first). By symmetry each side gets 1/4, and along a side the law
 * p_L(k) is even in k.
 *
 * p_L(k) is the value at the centre of the discrete harmonic function with
 * boundary value 1 at (L, k) and 0 elsewhere (exact; the discrete Dirichlet
 * problem solved by separation of variables). With box coordinates
 * 0 … 2L (centre L, the side at x = 2L, site j = k + L):
 *   p_L(k) = Σ_{q=1}^{2L−1} (1/L) sin(qπj/(2L)) sin(qπ/2) / (2 cosh(μ_q L)),
 *   cosh μ_q = 2 − cos(qπ/(2L)),
 * from h(x, y) = Σ_q (2/(2L)) sin(qπj/(2L)) sin(qπy/(2L)) sinh(μ_q x)/sinh(2Lμ_q)
 * at x = y = L, using sinh(μ_q L)/sinh(2Lμ_q) = 1/(2 cosh(μ_q L)). Only odd q
 * contribute. Computed in double precision: exact up to rounding (the four
 * sides sum to 1 within 1e-12 for L <= 64 and 1e-10 up to L = 1024; checked,
 * with chi-square tests against plain step-by-step walks, in
 * test/dla-square.test.ts).
 *
 * Tables for L = 2^e, e = 0 … MAX_EXIT_LEVEL, are built on first use and
 * cached; sampling picks a side from 2 random bits and k as the first entry
 * of the cumulative table above one 53-bit uniform (found from a guide
 * table: the same index a binary search gives; L = 1 is the plain step).
 */
import type { Random } from '../core/random.js';

export const MAX_EXIT_LEVEL = 10;

/** Exit law along one side of the square of half-width L: probabilities of k = −(L−1) … L−1, summing to 1/4. */
export function sideExitLaw(halfWidth: number): Float64Array {
  const L = halfWidth;
  const p = new Float64Array(2 * L - 1);
  const weights: number[] = [];
  for (let q = 1; q <= 2 * L - 1; q += 2) {
    const mu = Math.acosh(2 - Math.cos((q * Math.PI) / (2 * L)));
    const sq = q % 4 === 1 ? 1 : -1; // sin(qπ/2)
    weights.push((sq / L) / (2 * Math.cosh(mu * L)));
  }
  for (let j = 1; j <= 2 * L - 1; j++) {
    let s = 0;
    let t = 0;
    for (let q = 1; q <= 2 * L - 1; q += 2, t++) s += weights[t] * Math.sin((q * Math.PI * j) / (2 * L));
    p[j - 1] = s;
  }
  return p;
}

/** Cumulative exit tables (normalised to 1 along a side), by level e (L = 2^e). */
const cumulative: (Float64Array | undefined)[] = [];

function tableOf(e: number): Float64Array {
  let c = cumulative[e];
  if (c === undefined) {
    const p = sideExitLaw(2 ** e);
    c = new Float64Array(p.length);
    let s = 0;
    for (let i = 0; i < p.length; i++) {
      s += Math.max(0, p[i]);
      c[i] = s;
    }
    for (let i = 0; i < c.length; i++) c[i] /= s;
    c[c.length - 1] = 1;
    cumulative[e] = c;
    // guide[b]: the smallest index with c > b / G (G = c.length), a starting point for the search
    const G = c.length;
    const g = new Int32Array(G);
    for (let b = 0, i = 0; b < G; b++) {
      while (i < G - 1 && c[i] <= b / G) i++;
      g[b] = i;
    }
    guides[e] = g;
  }
  return c;
}

/** Guide tables of the cumulative tables, by level (see tableOf). */
const guides: (Int32Array | undefined)[] = [];

/**
 * The smallest index i with c[i] > u (c nondecreasing, last entry 1, 0 <= u < 1):
 * start at the guide entry of u and walk up while c[i] <= u, then down while
 * c[i − 1] > u. The two walks make the result exactly that of a binary
 * search whatever the starting point (rounding in u·G cannot change it);
 * the guide makes them short (about one step).
 */
function firstAbove(c: Float64Array, g: Int32Array, u: number): number {
  let i = g[Math.min(g.length - 1, Math.floor(u * g.length))];
  while (c[i] <= u && i < c.length - 1) i++;
  while (i > 0 && c[i - 1] > u) i--;
  return i;
}

/** Offset of the exit site from the centre, written by `sampleExit`. */
export const exit = { dx: 0, dy: 0 };

/** Sample the exit site of the square of half-width 2^e from its centre into `exit`. */
export function sampleExit(e: number, rng: Random): void {
  const L = 1 << e; // 2^e, e <= MAX_EXIT_LEVEL
  const side = rng.nextInt32() & 3;
  let k = 0;
  if (L > 1) {
    const c = tableOf(e);
    const u = rng.nextDouble();
    k = firstAbove(c, guides[e]!, u) - (L - 1);
  }
  switch (side) {
    case 0:
      exit.dx = L;
      exit.dy = k;
      break;
    case 1:
      exit.dx = -L;
      exit.dy = k;
      break;
    case 2:
      exit.dx = k;
      exit.dy = L;
      break;
    default:
      exit.dx = k;
      exit.dy = -L;
  }
}
