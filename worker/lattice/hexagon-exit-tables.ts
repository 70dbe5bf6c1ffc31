/**
 * Exact first-passage (exit) laws of the simple random walk on the
 * triangular lattice from the centre of a lattice hexagon, for jumps of
 * triangular-lattice DLA.
 *
 * Axial site coordinates (i, j) (worker/lattice/planar-lattice.ts), 6
 * neighbours; the hex distance of (i, j) from the origin is
 * max(|i|, |j|, |i + j|). The hexagon of radius L: sites at hex distance
 * <= L; its boundary ring: the 6L sites at distance exactly L. The walk
 * from the centre first reaches the ring at site b with probability
 *   P(b) = Σ_{a inside, a ~ b} G(a) / 6,
 * G(a) the expected number of visits to the interior site a before exit:
 * the solution of (I − P) G = δ_0 on the interior (hex distance < L), the
 * discrete Dirichlet problem. It is solved by conjugate gradients (I − P is
 * symmetric positive definite on the interior) until the residual is below
 * 1e-14; the ring probabilities then sum to 1 within 1e-12 (checked, with
 * chi-square tests against plain step-by-step walks, in
 * test/dla-triangular.test.ts). Tables for L = 2^e, e = 1 … MAX_HEX_LEVEL,
 * are built on first use and cached.
 */
import type { Random } from '../core/random.js';
import { TRIANGULAR } from './planar-lattice.js';

export const MAX_HEX_LEVEL = 6;

function hexDistance(i: number, j: number): number {
  return Math.max(Math.abs(i), Math.abs(j), Math.abs(i + j));
}

/** The ring of radius L as axial offsets in a fixed order, and the exit probability of each. */
export function hexagonExitLaw(radius: number): { di: Int32Array; dj: Int32Array; p: Float64Array } {
  const L = radius;
  // interior sites, indexed
  const index = new Map<number, number>();
  const key = (i: number, j: number) => (i + 4096) * 8192 + (j + 4096);
  const si: number[] = [];
  const sj: number[] = [];
  for (let i = -L; i <= L; i++) {
    for (let j = -L; j <= L; j++) {
      if (hexDistance(i, j) < L) {
        index.set(key(i, j), si.length);
        si.push(i);
        sj.push(j);
      }
    }
  }
  const n = si.length;
  const nb = new Int32Array(6 * n).fill(-1);
  for (let a = 0; a < n; a++) {
    for (let t = 0; t < 6; t++) nb[6 * a + t] = index.get(key(si[a] + TRIANGULAR.di[t], sj[a] + TRIANGULAR.dj[t])) ?? -1;
  }
  const apply = (x: Float64Array, out: Float64Array): void => {
    for (let a = 0; a < n; a++) {
      let s = x[a];
      for (let t = 0; t < 6; t++) {
        const b = nb[6 * a + t];
        if (b >= 0) s -= x[b] / 6;
      }
      out[a] = s;
    }
  };
  // conjugate gradients for (I − P) G = δ_centre
  const g = new Float64Array(n);
  const r = new Float64Array(n);
  r[index.get(key(0, 0))!] = 1;
  const d = Float64Array.from(r);
  const q = new Float64Array(n);
  let rr = 1;
  for (let it = 0; it < 20 * n && rr > 1e-28; it++) {
    apply(d, q);
    let dq = 0;
    for (let a = 0; a < n; a++) dq += d[a] * q[a];
    const alpha = rr / dq;
    let next = 0;
    for (let a = 0; a < n; a++) {
      g[a] += alpha * d[a];
      r[a] -= alpha * q[a];
      next += r[a] * r[a];
    }
    const beta = next / rr;
    rr = next;
    for (let a = 0; a < n; a++) d[a] = r[a] + beta * d[a];
  }
  // the ring, in order of angle-free enumeration (i, then j)
  const di: number[] = [];
  const dj: number[] = [];
  const p: number[] = [];
  for (let i = -L; i <= L; i++) {
    for (let j = -L; j <= L; j++) {
      if (hexDistance(i, j) !== L) continue;
      let s = 0;
      for (let t = 0; t < 6; t++) {
        const a = index.get(key(i + TRIANGULAR.di[t], j + TRIANGULAR.dj[t]));
        if (a !== undefined) s += g[a] / 6;
      }
      di.push(i);
      dj.push(j);
      p.push(s);
    }
  }
  return { di: Int32Array.from(di), dj: Int32Array.from(dj), p: Float64Array.from(p) };
}

const tables: ({ di: Int32Array; dj: Int32Array; cumulative: Float64Array } | undefined)[] = [];

function tableOf(e: number): { di: Int32Array; dj: Int32Array; cumulative: Float64Array } {
  let t = tables[e];
  if (t === undefined) {
    const law = hexagonExitLaw(2 ** e);
    const c = new Float64Array(law.p.length);
    let s = 0;
    for (let k = 0; k < c.length; k++) {
      s += Math.max(0, law.p[k]);
      c[k] = s;
    }
    for (let k = 0; k < c.length; k++) c[k] /= s;
    c[c.length - 1] = 1;
    t = { di: law.di, dj: law.dj, cumulative: c };
    tables[e] = t;
  }
  return t;
}

/** Axial offset of the exit site, written by `sampleHexExit`. */
export const hexExit = { di: 0, dj: 0 };

/** Sample the exit site of the hexagon of radius 2^e (e >= 1) from its centre into `hexExit`. */
export function sampleHexExit(e: number, rng: Random): void {
  const t = tableOf(e);
  const c = t.cumulative;
  const u = rng.nextDouble();
  let lo = 0;
  let hi = c.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (c[mid] > u) hi = mid;
    else lo = mid + 1;
  }
  hexExit.di = t.di[lo];
  hexExit.dj = t.dj[lo];
}
