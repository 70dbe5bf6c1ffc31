/**
 * The planar anisotropy records (worker/core/anisotropy.ts) and the radial
 * interface records (worker/core/radial-interface.ts) of a growing planar
 * cluster, kept up to date particle by particle so that a record costs
 * O(R_max + particles near the two shell radii) instead of a pass over all
 * particles. Used by the Eden lattice kernels, where growth is cheap and the
 * full passes dominated (about 5 N particle visits at 10 records per decade).
 *
 * Radial bins. Particle p (seed at the origin) goes to bin
 * b(p) = floor(fl(√r²_p)), with r²_p = x² + y² computed as everywhere else.
 * fl(√·) is correctly rounded, hence monotone, so b(p) < b(q) implies
 * r²_p < r²_q: the bins order the particles by distance exactly, and a
 * threshold test on r² splits the bins into those wholly below, wholly above,
 * and the one bin that holds the threshold. Each bin keeps the list of its
 * particles (newest first) and the sums of cos 4θ, sin 4θ, cos 6θ, sin 6θ of
 * its particles, added in arrival order.
 *
 * What is identical to the full passes, bit for bit:
 *  - the extents along the 8 + 12 directions (axis_ratio_4, axis_ratio_6):
 *    maxima of the same projections (raiseExtents) over all particles,
 *    taken at each record over the outer bins down to the skip distance
 *    below which no particle can raise an extent; maxima are order-free;
 *  - the shell count n (the shell R_max/2 < r ≤ R_max is decided by the same
 *    r² comparisons, per particle in the two bins that hold a threshold);
 *  - interface_radius and interface_width: the sector heights are the same
 *    maxima of the same √r² over the same particles (bins scanned from the
 *    outside in, stopping once every sector holds a particle, after which no
 *    particle of a lower bin can be higher), and the same final sums
 *    (interfaceOfHeights).
 * What changes in the last bits (floating-point reassociation):
 *  - fold_amplitude_4 and fold_amplitude_6. Their shell sums of cos kθ and
 *    sin kθ are summed here bin by bin (bins in increasing radius; inside a
 *    bin that lies wholly in the shell, its particles in arrival order; the
 *    two threshold bins particle by particle, newest first) instead of over
 *    all shell particles in arrival order. The terms are the same bits
 *    (foldTermsOf); only the order of the additions differs, so the sums
 *    agree to within the rounding of n additions of terms of size ≤ 1
 *    (|Δ| ≤ n·2^−52 or so, relative to values of order √n), far below the
 *    statistical error. The order is a function of the arrival order and the
 *    record sizes alone, so runs stay deterministic and resumes identical.
 */
import { foldTerms, foldTermsOf, pushPlanarAnisotropy, raiseExtents } from './anisotropy.js';
import { interfaceOfHeights, pushRadialInterface, sectorCount, sectorIndex } from './radial-interface.js';

/** Sums per bin: cos 4θ, sin 4θ, cos 6θ, sin 6θ. */
const SUMS = 4;

export class IncrementalPlanarRecords {
  /** next[p]: the particle added before p to the same bin (−1 ends the list). */
  private readonly next: Int32Array;
  private head: Int32Array;
  private binSize: Int32Array;
  private binSums: Float64Array;
  private topBin = -1;
  private count = 0;
  private readonly far4 = new Float64Array(8).fill(-Infinity);
  private readonly far6 = new Float64Array(12).fill(-Infinity);
  private skip2 = -1;
  private heights = new Float64Array(64);

  constructor(capacity: number) {
    this.next = new Int32Array(capacity);
    this.head = new Int32Array(64).fill(-1);
    this.binSize = new Int32Array(64);
    this.binSums = new Float64Array(64 * SUMS);
  }

  /** Bytes held (for benchmarks). */
  get bytes(): number {
    return this.next.byteLength + this.head.byteLength + this.binSize.byteLength + this.binSums.byteLength + this.heights.byteLength;
  }

  /** Take in the next particle, at (x, y) relative to the seed. */
  add(x: number, y: number): void {
    const p = this.count++;
    const r2 = x * x + y * y;
    const b = Math.floor(Math.sqrt(r2));
    if (b >= this.head.length) this.growBins(b);
    if (b > this.topBin) this.topBin = b;
    this.next[p] = this.head[b];
    this.head[b] = p;
    this.binSize[b]++;
    if (r2 > 0) {
      foldTermsOf(x, y, r2);
      const s = this.binSums;
      const o = b * SUMS;
      s[o] += foldTerms.c4;
      s[o + 1] += foldTerms.s4;
      s[o + 2] += foldTerms.c6;
      s[o + 3] += foldTerms.s6;
    }
  }

  private growBins(b: number): void {
    let size = this.head.length;
    while (size <= b) size *= 2;
    const head = new Int32Array(size).fill(-1);
    head.set(this.head);
    const binSize = new Int32Array(size);
    binSize.set(this.binSize);
    const binSums = new Float64Array(size * SUMS);
    binSums.set(this.binSums);
    this.head = head;
    this.binSize = binSize;
    this.binSums = binSums;
  }

  /**
   * Append the anisotropy and interface records of the particles added so
   * far (coords: their centres, x at 2p, y at 2p + 1; rMax their largest
   * distance from the seed) to a series' extra records.
   */
  record(extra: Record<string, number[]>, coords: Float64Array, rMax: number): void {
    this.raiseExtentsFromBins(coords);
    this.recordAnisotropy(extra, coords, rMax);
    this.recordInterface(coords, rMax);
    pushRadialInterface(extra);
  }

  /**
   * Raise the extents to the particles added since the last record: bins
   * from the outermost inward, each particle through raiseExtents unless it
   * is below its skip distance, stopping at the first bin whose particles
   * all are (r² < (b + 1)² <= skip distance²): no particle there or lower
   * can raise an extent, now or later (extents only grow). Particles seen at
   * an earlier record are projected again, which changes nothing (maxima).
   */
  private raiseExtentsFromBins(coords: Float64Array): void {
    for (let b = this.topBin; b >= 0 && !((b + 1) * (b + 1) <= this.skip2); b--) {
      for (let p = this.head[b]; p >= 0; p = this.next[p]) {
        const x = coords[2 * p];
        const y = coords[2 * p + 1];
        if (!(x * x + y * y < this.skip2)) this.skip2 = raiseExtents(x, y, this.far4, this.far6);
      }
    }
  }

  private recordAnisotropy(extra: Record<string, number[]>, coords: Float64Array, rMax: number): void {
    const inner2 = 0.25 * rMax * rMax;
    const outer2 = rMax * rMax;
    // bins below bI lie wholly inside R_max/2, bins strictly between bI and bO wholly in the shell
    const bI = Math.floor(Math.sqrt(inner2));
    const bO = Math.floor(Math.sqrt(outer2));
    const s = this.binSums;
    let sc4 = 0;
    let ss4 = 0;
    let sc6 = 0;
    let ss6 = 0;
    let n = 0;
    for (let b = bI; b <= this.topBin; b++) {
      if (b === bI || b >= bO) {
        for (let p = this.head[b]; p >= 0; p = this.next[p]) {
          const x = coords[2 * p];
          const y = coords[2 * p + 1];
          const r2 = x * x + y * y;
          if (r2 > inner2 && r2 <= outer2) {
            foldTermsOf(x, y, r2);
            sc4 += foldTerms.c4;
            ss4 += foldTerms.s4;
            sc6 += foldTerms.c6;
            ss6 += foldTerms.s6;
            n++;
          }
        }
      } else {
        const o = b * SUMS;
        sc4 += s[o];
        ss4 += s[o + 1];
        sc6 += s[o + 2];
        ss6 += s[o + 3];
        n += this.binSize[b];
      }
    }
    pushPlanarAnisotropy(extra, n, sc4, ss4, sc6, ss6, this.far4, this.far6);
  }

  /** Sector heights over R_max/2 < r (radial-interface.ts), from the outermost bin inward; result in radialInterface. */
  private recordInterface(coords: Float64Array, rMax: number): void {
    const m = sectorCount(rMax);
    if (this.heights.length < m) this.heights = new Float64Array(2 * m);
    const h = this.heights;
    h.fill(-1, 0, m);
    const perRadian = m / (2 * Math.PI);
    const inner2 = 0.25 * rMax * rMax;
    const bI = Math.floor(Math.sqrt(inner2));
    let filled = 0;
    for (let b = this.topBin; b >= bI && filled < m; b--) {
      for (let p = this.head[b]; p >= 0; p = this.next[p]) {
        const x = coords[2 * p];
        const y = coords[2 * p + 1];
        const r2 = x * x + y * y;
        if (r2 <= inner2) continue;
        const sector = sectorIndex(x, y, perRadian, m);
        const r = Math.sqrt(r2);
        if (h[sector] < 0) filled++;
        if (r > h[sector]) h[sector] = r;
      }
    }
    interfaceOfHeights(h, m);
  }
}
