/**
 * The off-lattice Eden model in the plane.
 *
 * The model (exact definition)
 *  - Particles are disks of diameter 1; the seed is centred at the origin.
 *  - The free contact set of a cluster of centres c_1 … c_n is
 *      F = { (i, θ) : the point c_i + (cos θ, sin θ) is at distance >= 1 from
 *                     every centre c_j, j ≠ i },
 *    the places where a new disk touching disk i overlaps no disk.
 *  - At every step a pair (i, θ) is drawn UNIFORMLY FROM F in the measure
 *    (counting measure on i) × (Lebesgue measure on θ), i.e. uniformly in
 *    arc length over the free parts of the circles of radius 1 around the
 *    centres (a place touching two disks lies on two circles but is a set of
 *    measure zero), and the new disk is centred at c_i + (cos θ, sin θ).
 *
 * How it is simulated (exactly; no approximation beyond floating point)
 *  - Every particle k carries the length ℓ_k of its free arc: 2π minus the
 *    length of the union of the open arcs its neighbours block (a centre
 *    c_j at distance d < 2 blocks the angles within arccos(d/2) of the
 *    direction to c_j); ℓ_k = 0 for a fully blocked particle. After each
 *    placement ℓ is recomputed for the new particle and every particle
 *    within distance 2 of it (no other changes).
 *  - A pair (i, θ) is drawn by choosing i with probability ℓ_i / Σ ℓ (a
 *    Fenwick tree of the ℓ_k, one 53-bit uniform) and then θ uniformly on
 *    i's free arcs (a second 53-bit uniform, mapped through the sorted free
 *    gaps): exactly the uniform law on F in the measure above.
 *  - The candidate is still checked against every centre within distance 1
 *    (unit cells, sparse tiles, worker/index/tiled-grids.ts); a candidate
 *    that fails only through rounding at an arc end (a null set) is drawn
 *    again and counted in `redraws`.
 * Determinism and checkpoints: per attempt two nextDouble draws from
 * Random.forRun(ensembleSeed, runIndex, STREAM_GROWTH). The free arcs and
 * the Fenwick tree are functions of the arrival order, so a checkpoint holds
 * only positions (and generator, counters, records); resuming replays the
 * arrivals with the same updates in the same order.
 *
 * Observables at each record size: R_g, R_max, the centre offset, the planar
 * anisotropy measures (worker/core/anisotropy.ts; this model is isotropic)
 * and the radial interface (worker/core/radial-interface.ts).
 */
import type { Counters, ClusterPositions, GrowthCheckpoint, GrowthKernel, GrowthResult, GrowthTask } from '../../core/growth-kernel.js';
import { Random, STREAM_GROWTH } from '../../core/random.js';
import { StateHasher } from '../../core/state-hash.js';
import { checkCheckpointOf } from '../../core/checkpoint-check.js';
import { recordPlanarAnisotropy } from '../../core/anisotropy.js';
import { recordRadialInterface } from '../../core/radial-interface.js';
import { PlanarCluster } from '../../core/planar-cluster.js';
import { STOP_CHECK_EVERY, stopRaised, type StopSignal } from '../../core/stop-signal.js';
import { TiledInt32Grid } from '../../index/tiled-grids.js';

const MAX_ARCS = 64;
const TWO_PI = 2 * Math.PI;

export class OffLatticeEden2d implements GrowthKernel {
  readonly task: GrowthTask;
  readonly dimension = 2;
  readonly counters: Counters;
  private readonly cluster: PlanarCluster;
  /** Unit cell → newest particle in it (-1: none); next[k] is the previous particle of k's cell. */
  private readonly heads: TiledInt32Grid;
  private readonly next: Int32Array;
  /** Free arc length of each particle. */
  private readonly freeLength: Float64Array;
  /** Fenwick tree (1-based) of the free arc lengths. */
  private readonly tree: Float64Array;
  private readonly rng: Random;
  private readonly arcStart = new Float64Array(2 * MAX_ARCS);
  private readonly arcEnd = new Float64Array(2 * MAX_ARCS);
  /** Free gaps of the last freeArcs call: [gapStart[g], gapEnd[g]) in [0, 2π). */
  private readonly gapStart = new Float64Array(2 * MAX_ARCS + 1);
  private readonly gapEnd = new Float64Array(2 * MAX_ARCS + 1);
  private gapCount = 0;
  private readonly nearby = new Int32Array(MAX_ARCS);
  private readonly nearNew = new Int32Array(MAX_ARCS);

  constructor(task: GrowthTask, checkpoint?: GrowthCheckpoint) {
    this.task = structuredClone(task);
    this.heads = new TiledInt32Grid(-1, Math.max(16, task.particles >> 6));
    this.next = new Int32Array(task.particles);
    this.freeLength = new Float64Array(task.particles);
    this.tree = new Float64Array(task.particles + 1);
    const recordExtra = (extra: Record<string, number[]>, coords: Float64Array, count: number, rMax: number): void => {
      recordPlanarAnisotropy(extra, coords, 2, count, rMax);
      recordRadialInterface(extra, coords, 2, count, rMax);
    };
    if (checkpoint === undefined) {
      this.rng = Random.forRun(task.ensembleSeed, task.runIndex, STREAM_GROWTH);
      this.counters = { redraws: 0 };
      this.cluster = new PlanarCluster(task.particles, task.recordsPerDecade, recordExtra);
      this.add(0, 0, true);
    } else {
      checkCheckpointOf(task, 2, checkpoint);
      if (checkpoint.modelState.length !== 0) throw new RangeError(`checkpoint modelState must be empty for ${task.model.kind}, got ${checkpoint.modelState.length} bytes`);
      this.rng = Random.fromState(checkpoint.rngState);
      this.counters = { redraws: checkpoint.counters.redraws ?? 0 };
      this.cluster = new PlanarCluster(task.particles, task.recordsPerDecade, recordExtra, checkpoint.series);
      const p = checkpoint.positions;
      for (let k = 0; k < checkpoint.count; k++) this.add(p[2 * k], p[2 * k + 1], false);
      this.cluster.resumeRecords();
    }
  }

  get count(): number {
    return this.cluster.n;
  }

  get done(): boolean {
    return this.cluster.n >= this.task.particles;
  }

  /** Free arc length of particle k (0 when fully blocked). */
  freeArcOf(k: number): number {
    return this.freeLength[k];
  }

  /** A stop (read every STOP_CHECK_EVERY particles) leaves the state after a whole particle: no draw of the next one has been made. */
  growTo(target: number, stop?: StopSignal): void {
    const goal = Math.min(target, this.task.particles);
    const rng = this.rng;
    const xy = this.cluster.xy;
    let redraws = 0;
    let untilCheck = STOP_CHECK_EVERY;
    while (this.cluster.n < goal) {
      if (--untilCheck === 0) {
        untilCheck = STOP_CHECK_EVERY;
        if (stopRaised(stop)) break;
      }
      for (;;) {
        const i = this.findByWeight(rng.nextDouble() * this.totalWeight());
        let v = rng.nextDouble() * this.freeLength[i];
        this.freeArcs(i);
        let theta = -1;
        for (let g = 0; g < this.gapCount; g++) {
          const w = this.gapEnd[g] - this.gapStart[g];
          if (v < w) {
            theta = this.gapStart[g] + v;
            break;
          }
          v -= w;
        }
        if (theta >= 0) {
          const px = xy[2 * i] + Math.cos(theta);
          const py = xy[2 * i + 1] + Math.sin(theta);
          if (this.isFree(px, py, i)) {
            this.add(px, py, true);
            break;
          }
        }
        redraws++;
      }
    }
    this.counters.redraws += redraws;
  }

  private totalWeight(): number {
    let s = 0;
    for (let k = this.cluster.n; k > 0; k -= k & -k) s += this.tree[k];
    return s;
  }

  /** The particle i (0-based) with prefix(i) <= u < prefix(i + 1), by Fenwick descent (clamped to the last particle). */
  private findByWeight(u: number): number {
    const n = this.cluster.n;
    let pos = 0;
    let step = 1;
    while (step * 2 <= n) step *= 2;
    for (; step > 0; step >>= 1) {
      const next = pos + step;
      if (next <= n && this.tree[next] <= u) {
        pos = next;
        u -= this.tree[next];
      }
    }
    return pos < n ? pos : n - 1;
  }

  private setWeight(k: number, w: number): void {
    const delta = w - this.freeLength[k];
    this.freeLength[k] = w;
    if (delta === 0) return;
    for (let t = k + 1; t <= this.tree.length - 1; t += t & -t) this.tree[t] += delta;
  }

  /** True when no centre other than particle `skip` is at distance < 1 from (px, py). */
  private isFree(px: number, py: number, skip: number): boolean {
    const xy = this.cluster.xy;
    const cx = Math.floor(px);
    const cy = Math.floor(py);
    for (let gy = cy - 1; gy <= cy + 1; gy++) {
      for (let gx = cx - 1; gx <= cx + 1; gx++) {
        for (let k = this.heads.get(gx, gy); k >= 0; k = this.next[k]) {
          if (k === skip) continue;
          const dx = xy[2 * k] - px;
          const dy = xy[2 * k + 1] - py;
          if (dx * dx + dy * dy < 1) return false;
        }
      }
    }
    return true;
  }

  /** Add a centre (with a record when `record`) and update the free arcs it changes. */
  private add(px: number, py: number, record: boolean): void {
    const q = this.cluster.n;
    if (record) this.cluster.place(px, py);
    else this.cluster.append(px, py);
    const cx = Math.floor(px);
    const cy = Math.floor(py);
    this.next[q] = this.heads.get(cx, cy);
    this.heads.set(cx, cy, q);
    // the new particle and every particle within distance 2 of it
    const m = this.neighboursWithin2(q);
    const nearby = this.nearNew;
    nearby.set(this.nearby.subarray(0, m));
    this.setWeight(q, this.freeArcs(q));
    for (let t = 0; t < m; t++) {
      const k = nearby[t];
      if (this.freeLength[k] > 0) this.setWeight(k, this.freeArcs(k));
    }
  }

  /** Indices of the centres within distance < 2 of centre q (q excluded) into `nearby`; returns their count. */
  private neighboursWithin2(q: number): number {
    const xy = this.cluster.xy;
    const px = xy[2 * q];
    const py = xy[2 * q + 1];
    const cx = Math.floor(px);
    const cy = Math.floor(py);
    let m = 0;
    for (let gy = cy - 2; gy <= cy + 2; gy++) {
      for (let gx = cx - 2; gx <= cx + 2; gx++) {
        for (let k = this.heads.get(gx, gy); k >= 0; k = this.next[k]) {
          if (k === q) continue;
          const dx = xy[2 * k] - px;
          const dy = xy[2 * k + 1] - py;
          if (dx * dx + dy * dy < 4) {
            if (m === MAX_ARCS) throw new Error(`more than ${MAX_ARCS} centres within distance 2 of particle ${q}: disks overlap`);
            this.nearby[m++] = k;
          }
        }
      }
    }
    return m;
  }

  /**
   * The free gaps of particle k's contact circle into gapStart/gapEnd
   * (sorted, in [0, 2π)); returns their total length.
   */
  private freeArcs(k: number): number {
    const m = this.neighboursWithin2(k);
    const xy = this.cluster.xy;
    const px = xy[2 * k];
    const py = xy[2 * k + 1];
    const s = this.arcStart;
    const e = this.arcEnd;
    let count = 0;
    const insert = (a: number, b: number): void => {
      let u = count++;
      while (u > 0 && s[u - 1] > a) {
        s[u] = s[u - 1];
        e[u] = e[u - 1];
        u--;
      }
      s[u] = a;
      e[u] = b;
    };
    for (let t = 0; t < m; t++) {
      const j = this.nearby[t];
      const dx = xy[2 * j] - px;
      const dy = xy[2 * j + 1] - py;
      const d = Math.sqrt(dx * dx + dy * dy);
      const half = Math.acos(Math.min(1, d / 2));
      let a = Math.atan2(dy, dx) - half;
      if (a < 0) a += TWO_PI;
      const b = a + 2 * half;
      // split an arc that wraps past 2π into [a, 2π) and [0, b − 2π)
      if (b > TWO_PI) {
        insert(a, TWO_PI);
        insert(0, b - TWO_PI);
      } else insert(a, b);
    }
    // gaps between the merged blocked intervals
    let gaps = 0;
    let total = 0;
    let reach = 0;
    for (let t = 0; t < count; t++) {
      if (s[t] > reach) {
        this.gapStart[gaps] = reach;
        this.gapEnd[gaps] = s[t];
        total += s[t] - reach;
        gaps++;
      }
      if (e[t] > reach) reach = e[t];
    }
    if (reach < TWO_PI) {
      this.gapStart[gaps] = reach;
      this.gapEnd[gaps] = TWO_PI;
      total += TWO_PI - reach;
      gaps++;
    }
    this.gapCount = gaps;
    return total;
  }

  positions(): ClusterPositions {
    return this.cluster.positions();
  }

  checkpoint(): GrowthCheckpoint {
    return this.cluster.checkpoint(this.task, this.rng.state(), { ...this.counters }, new Uint8Array(0));
  }

  checkpointView(): GrowthCheckpoint {
    return this.cluster.checkpoint(this.task, this.rng.state(), { ...this.counters }, new Uint8Array(0), true);
  }

  result(): GrowthResult {
    return this.cluster.result(this.task, { ...this.counters }, this.stateHash());
  }

  /** Digest of positions, generator state, count and the redraw counter. */
  stateHash(): string {
    const h = new StateHasher();
    this.cluster.hashPositions(h);
    for (const w of this.rng.state()) h.word(w);
    h.integer(this.counters.redraws);
    return h.digest();
  }
}
