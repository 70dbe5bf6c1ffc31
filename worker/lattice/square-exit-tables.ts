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
 *   cosh μ_q = 2 − cos(qπ/(2L)), i.e. μ_q = 2 asinh(sin(qπ/(4L))),
 * from h(x, y) = Σ_q (2/(2L)) sin(qπj/(2L)) sin(qπy/(2L)) sinh(μ_q x)/sinh(2Lμ_q)
 * at x = y = L, using sinh(μ_q L)/sinh(2Lμ_q) = 1/(2 cosh(μ_q L)). Only odd q
 * contribute. Truncation (exact bound, derived here): cos(qπ/(2L)) falls
 * as q grows on 1 … 2L − 1, so μ_q and cosh(μ_q L) rise and the weights
 * 1/(2 cosh(μ_q L)) fall; the sum stops at the first odd q whose weight is
 * below 10^-40, so the dropped terms (fewer than L, each at most
 * 10^-40 · (1/L) in size) change p_L(k) by less than 10^-40 — far below the
 * smallest exit probability (of order L^-3 beside a corner, > 10^-14 for
 * L <= 32768) and below the 2^-53 resolution of the sampler. About 30 terms
 * remain whatever L, so a table costs O(L) to build instead of O(L²).
 * Computed in double precision: exact up to rounding (the four sides sum to
 * 1 within 1e-14 up to L = 32768, with μ_q from the asinh form above; the
 * acosh form used before lost up to 1e-7 relative at large L; checked, with
 * chi-square tests against plain step-by-step walks, in
 * test/dla-square.test.ts).
 *
 * Half-widths. Jumps use any half-width of the ladder HALF_WIDTHS: every L
 * from 1 to 32, then L_{i+1} = ceil(L_i · 17/16) up to MAX_HALF_WIDTH =
 * 32768 (a walker whose free distance allows L takes the largest ladder
 * entry <= L, at most 6% below it). Tables are built on first use and
 * cached, folded (p_L is even: |k| from a table of L entries, its sign from
 * one bit) with a guide of one int32 per 4 entries: 9 bytes per unit of L,
 * 0.3 MB for L = 32768, about 5 MB for the whole ladder. Sampling picks the
 * side and the sign from 3 bits of one 32-bit word and |k| as the first
 * entry of the folded cumulative table above one 53-bit uniform (found from
 * the guide: the same index a binary search gives; L = 1 is the plain
 * step). A cumulative entry rounds the law to the 53-bit grid of the
 * uniform: the total variation distance from the exact law is at most
 * L·2^-53 < 10^-11 per jump.
 */
import type { Random } from '../core/random.js';

/** Largest power-of-two level of the marks and of sampleExit (L = 2^e). */
export const MAX_EXIT_LEVEL = 10;
/** Largest half-width of a jump. */
export const MAX_HALF_WIDTH = 32768;
/** Weights below this end the series (see the header). */
const WEIGHT_CUT = 1e-40;

/**
 * Exit law along one side of the square of half-width L: probabilities of
 * k = −(L−1) … L−1, summing to 1/4. `truncated` (the default, used by the
 * tables) stops the series once the weights fall below 10^-40 (see the
 * header); false sums all L terms (O(L²), for tests).
 */
export function sideExitLaw(halfWidth: number, truncated = true): Float64Array {
  const L = halfWidth;
  const p = new Float64Array(2 * L - 1);
  const weights: number[] = [];
  for (let q = 1; q <= 2 * L - 1; q += 2) {
    // cosh μ = 2 − cos t = 1 + 2 sin²(t/2), i.e. sinh(μ/2) = sin(t/2): this form keeps full
    // precision for small t, where acosh(2 − cos t) loses digits (1e-7 relative at L = 32768)
    const mu = 2 * Math.asinh(Math.sin((q * Math.PI) / (4 * L)));
    const w = 1 / (2 * Math.cosh(mu * L));
    if (truncated && w < WEIGHT_CUT) break;
    const sq = q % 4 === 1 ? 1 : -1; // sin(qπ/2)
    weights.push((sq / L) * w);
  }
  for (let j = 1; j <= 2 * L - 1; j++) {
    let s = 0;
    for (let t = 0; t < weights.length; t++) {
      const q = 2 * t + 1;
      s += weights[t] * Math.sin((q * Math.PI * j) / (2 * L));
    }
    p[j - 1] = s;
  }
  return p;
}

/** The ladder of jump half-widths: 1 … 32, then ceil(L · 17/16) up to MAX_HALF_WIDTH. */
export const HALF_WIDTHS: Int32Array = (() => {
  const out: number[] = [];
  for (let L = 1; L <= 32; L++) out.push(L);
  for (let L = 32; L < MAX_HALF_WIDTH; ) {
    L = Math.min(MAX_HALF_WIDTH, Math.ceil((L * 17) / 16));
    out.push(L);
  }
  return Int32Array.from(out);
})();

/** ladderBelow[d]: the largest ladder half-width <= d (d = 1 … MAX_HALF_WIDTH; 0 at d = 0). */
const ladderBelow: Int32Array = (() => {
  const t = new Int32Array(MAX_HALF_WIDTH + 1);
  let i = 0;
  for (let d = 1; d <= MAX_HALF_WIDTH; d++) {
    while (i + 1 < HALF_WIDTHS.length && HALF_WIDTHS[i + 1] <= d) i++;
    t[d] = HALF_WIDTHS[i];
  }
  return t;
})();

/** The largest ladder half-width <= d, for an integer d >= 1 (capped at MAX_HALF_WIDTH). */
export function halfWidthAtMost(d: number): number {
  return ladderBelow[d < MAX_HALF_WIDTH ? d : MAX_HALF_WIDTH];
}

/**
 * Folded cumulative exit tables by half-width L: entry m (0 … L − 1) is the
 * probability, given the side, that |k| <= m (p_L(0) + 2 Σ_{0<k<=m} p_L(k),
 * normalised to end at exactly 1); the sign of k is drawn from one bit.
 * p_L is even in k, so this samples the same law as the unfolded table with
 * half the memory (which matters: a jump reads a table at random, and the
 * tables of the whole ladder must stay in cache).
 */
const cumulative: (Float64Array | undefined)[] = [];
/** guides[L][b]: the smallest m with c[m] > b·GUIDE_SPAN / L, a starting point for the search. */
const guides: (Int32Array | undefined)[] = [];
/** One guide entry per GUIDE_SPAN table entries. */
const GUIDE_SPAN = 4;

/** The folded cumulative table of half-width L (built on first use). */
export function foldedTable(L: number): Float64Array {
  return cumulative[L] ?? buildTable(L);
}

function buildTable(L: number): Float64Array {
  const p = sideExitLaw(L);
  const c = new Float64Array(L);
  let s = 0;
  for (let m = 0; m < L; m++) {
    const v = Math.max(0, p[L - 1 + m]);
    s += m === 0 ? v : 2 * v;
    c[m] = s;
  }
  for (let m = 0; m < L; m++) c[m] /= s;
  c[L - 1] = 1;
  cumulative[L] = c;
  const G = Math.ceil(L / GUIDE_SPAN);
  const g = new Int32Array(G);
  for (let b = 0, i = 0; b < G; b++) {
    while (i < L - 1 && c[i] <= b / G) i++;
    g[b] = i;
  }
  guides[L] = g;
  return c;
}

/**
 * The smallest index i with c[i] > u (c nondecreasing, last entry 1, 0 <= u < 1):
 * start at the guide entry of u and walk up while c[i] <= u, then down while
 * c[i − 1] > u. The two walks make the result exactly that of a binary
 * search whatever the starting point (rounding in u·G cannot change it);
 * the guide makes them short (a few entries of one or two cache lines).
 */
function firstAbove(c: Float64Array, g: Int32Array, u: number): number {
  let i = g[Math.min(g.length - 1, Math.floor(u * g.length))];
  while (c[i] <= u && i < c.length - 1) i++;
  while (i > 0 && c[i - 1] > u) i--;
  return i;
}

/** Offset of the exit site from the centre, written by `sampleExit` and `sampleExitOf`. */
export const exit = { dx: 0, dy: 0 };

/**
 * Sample the exit site of the square of half-width L (any L from 1 to
 * MAX_HALF_WIDTH; jumps use ladder entries) from its centre into `exit`.
 * Draws: one 32-bit word w (side: w & 3; sign of k: bit 2 of w), then, when
 * L > 1, one 53-bit uniform u for |k| (the first folded entry above u).
 */
export function sampleExitOf(L: number, rng: Random): void {
  const w = rng.nextInt32();
  const side = w & 3;
  let k = 0;
  if (L > 1) {
    const c = cumulative[L] ?? buildTable(L);
    const u = rng.nextDouble();
    k = firstAbove(c, guides[L]!, u);
    if ((w & 4) !== 0) k = -k;
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

/** Sample the exit site of the square of half-width 2^e (e <= 15) from its centre into `exit`. */
export function sampleExit(e: number, rng: Random): void {
  sampleExitOf(1 << e, rng);
}
