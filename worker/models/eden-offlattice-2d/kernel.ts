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
 *  - Rejection: draw i uniformly, then θ uniformly (one 32-bit draw,
 *    worker/walkers/uniform-direction.ts), accept if no centre other than
 *    c_i is at distance < 1 from the candidate, else draw again. Accepted
 *    pairs are uniform on F in the measure above (uniform proposals on
 *    {1…n} × [0, 2π), conditioned on F).
 *  - i is drawn among the ACTIVE particles only: those not proven fully
 *    blocked. A particle is retired when the open arcs blocked by its
 *    neighbours (centre c_j at distance d < 2 blocks the angles within
 *    arccos(d/2) of the direction to c_j) cover its whole circle, each
 *    junction overlapping by more than 1e-9 rad. A retired particle has an
 *    empty free arc, so it would always be rejected: proposing only among a
 *    superset of the particles with a free arc gives the same accepted law.
 *    (An unproven particle merely stays active.) After each placement the
 *    new particle and the active particles within distance 2 of it are
 *    checked.
 *  - Neighbours come from unit cells (cell (floor x, floor y), sparse tiles,
 *    worker/index/tiled-grids.ts) holding lists of centres in arrival order.
 *
 * Determinism and checkpoints: per attempt one nextBelow(active count) and
 * one direction draw from Random.forRun(ensembleSeed, runIndex,
 * STREAM_GROWTH). The active list is a function of the arrival order, so a
 * checkpoint holds only positions (and generator, counters, records);
 * resuming replays the arrivals.
 *
 * Observables at each record size: R_g, R_max, the centre offset, the planar
 * anisotropy measures (worker/core/anisotropy.ts; this model is isotropic)
 * and the radial interface (worker/core/radial-interface.ts).
 */
import type { Counters, ClusterPositions, GrowthCheckpoint, GrowthKernel, GrowthResult, GrowthTask } from '../../core/growth-kernel.js';
import { ENGINE_VERSION } from '../../core/engine-version.js';
import { Random, STREAM_GROWTH } from '../../core/random.js';
import { StateHasher } from '../../core/state-hash.js';
import { checkCheckpointOf } from '../../core/checkpoint-check.js';
import { recordPlanarAnisotropy } from '../../core/anisotropy.js';
import { recordRadialInterface } from '../../core/radial-interface.js';
import { PlanarCluster } from '../../core/planar-cluster.js';
import { TiledInt32Grid } from '../../index/tiled-grids.js';
import { direction, sampleDirection } from '../../walkers/uniform-direction.js';

/** Junctions of blocked arcs must overlap by more than this (radians) to retire a particle. */
export const COVER_MARGIN = 1e-9;
const MAX_ARCS = 64;

export class OffLatticeEden2d implements GrowthKernel {
  readonly task: GrowthTask;
  readonly dimension = 2;
  readonly counters: Counters;
  private readonly cluster: PlanarCluster;
  /** Unit cell → newest particle in it (-1: none); next[k] is the previous particle of k's cell. */
  private readonly heads: TiledInt32Grid;
  private readonly next: Int32Array;
  private readonly active: Int32Array;
  /** Slot of each particle in `active`, or -1 once retired. */
  private readonly activeSlot: Int32Array;
  private activeCount = 0;
  private readonly rng: Random;
  private readonly arcStart = new Float64Array(2 * MAX_ARCS);
  private readonly arcEnd = new Float64Array(2 * MAX_ARCS);
  private readonly nearby = new Int32Array(MAX_ARCS);
  private readonly nearNew = new Int32Array(MAX_ARCS);

  constructor(task: GrowthTask, checkpoint?: GrowthCheckpoint) {
    this.task = structuredClone(task);
    this.heads = new TiledInt32Grid(-1, Math.max(16, task.particles >> 6));
    this.next = new Int32Array(task.particles);
    this.active = new Int32Array(task.particles);
    this.activeSlot = new Int32Array(task.particles);
    const recordExtra = (extra: Record<string, number[]>, coords: Float64Array, count: number, rMax: number): void => {
      recordPlanarAnisotropy(extra, coords, 2, count, rMax);
      recordRadialInterface(extra, coords, 2, count, rMax);
    };
    if (checkpoint === undefined) {
      this.rng = Random.forRun(task.ensembleSeed, task.runIndex, STREAM_GROWTH);
      this.counters = { rejections: 0 };
      this.cluster = new PlanarCluster(task.particles, task.recordsPerDecade, recordExtra);
      this.add(0, 0, true);
    } else {
      checkCheckpointOf(task, 2, checkpoint);
      if (checkpoint.modelState.length !== 0) throw new RangeError(`checkpoint modelState must be empty for ${task.model.kind}, got ${checkpoint.modelState.length} bytes`);
      this.rng = Random.fromState(checkpoint.rngState);
      this.counters = { rejections: checkpoint.counters.rejections ?? 0 };
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

  /** Particles not yet proven fully blocked. */
  get activeParticles(): number {
    return this.activeCount;
  }

  growTo(target: number): void {
    const goal = Math.min(target, this.task.particles);
    const rng = this.rng;
    const xy = this.cluster.xy;
    let rejections = 0;
    while (this.cluster.n < goal) {
      for (;;) {
        const i = this.active[rng.nextBelow(this.activeCount)];
        sampleDirection(rng);
        const px = xy[2 * i] + direction.x;
        const py = xy[2 * i + 1] + direction.y;
        if (this.isFree(px, py, i)) {
          this.add(px, py, true);
          break;
        }
        rejections++;
      }
    }
    this.counters.rejections += rejections;
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

  /** Add a centre (with a record when `record`), make it active, and retire the particles it blocks completely. */
  private add(px: number, py: number, record: boolean): void {
    const q = this.cluster.n;
    if (record) this.cluster.place(px, py);
    else this.cluster.append(px, py);
    const cx = Math.floor(px);
    const cy = Math.floor(py);
    this.next[q] = this.heads.get(cx, cy);
    this.heads.set(cx, cy, q);
    this.activeSlot[q] = this.activeCount;
    this.active[this.activeCount++] = q;
    // the new particle and every active particle within distance 2 of it
    const m = this.neighboursWithin2(q);
    const nearby = this.nearNew;
    nearby.set(this.nearby.subarray(0, m));
    if (this.isCovered(q)) this.retire(q);
    for (let t = 0; t < m; t++) {
      const k = nearby[t];
      if (this.activeSlot[k] >= 0 && this.isCovered(k)) this.retire(k);
    }
  }

  private retire(k: number): void {
    const slot = this.activeSlot[k];
    const last = this.active[--this.activeCount];
    this.active[slot] = last;
    this.activeSlot[last] = slot;
    this.activeSlot[k] = -1;
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

  /** True when the arcs blocked by the neighbours of particle k cover its contact circle (each junction overlapping by > COVER_MARGIN). */
  private isCovered(k: number): boolean {
    const m = this.neighboursWithin2(k);
    if (m < 3) return false; // each blocked arc is shorter than 2π/3 + (overlap): fewer than 3 cannot cover (2·arccos(d/2) <= 2π/3 for d >= 1)
    const xy = this.cluster.xy;
    const px = xy[2 * k];
    const py = xy[2 * k + 1];
    const s = this.arcStart;
    const e = this.arcEnd;
    for (let t = 0; t < m; t++) {
      const j = this.nearby[t];
      const dx = xy[2 * j] - px;
      const dy = xy[2 * j + 1] - py;
      const d = Math.sqrt(dx * dx + dy * dy);
      const half = Math.acos(Math.min(1, d / 2));
      let a = Math.atan2(dy, dx) - half;
      if (a < 0) a += 2 * Math.PI;
      // insertion sort by start
      let u = t;
      while (u > 0 && s[u - 1] > a) {
        s[u] = s[u - 1];
        e[u] = e[u - 1];
        u--;
      }
      s[u] = a;
      e[u] = a + 2 * half;
    }
    for (let t = 0; t < m; t++) {
      s[m + t] = s[t] + 2 * Math.PI;
      e[m + t] = e[t] + 2 * Math.PI;
    }
    const goal = s[0] + 2 * Math.PI + COVER_MARGIN;
    let reach = e[0];
    for (let t = 1; t < 2 * m; t++) {
      if (reach >= goal) return true;
      if (s[t] > reach - COVER_MARGIN) return false;
      if (e[t] > reach) reach = e[t];
    }
    return reach >= goal;
  }

  positions(): ClusterPositions {
    return this.cluster.positions();
  }

  checkpoint(): GrowthCheckpoint {
    return {
      engineVersion: ENGINE_VERSION,
      task: structuredClone(this.task),
      dimension: 2,
      count: this.cluster.n,
      positions: this.cluster.xy.slice(0, 2 * this.cluster.n),
      rngState: this.rng.state(),
      counters: { ...this.counters },
      series: structuredClone(this.cluster.series),
      modelState: new Uint8Array(0),
    };
  }

  result(): GrowthResult {
    if (!this.done) throw new Error(`run ${this.task.runIndex} is not finished (${this.cluster.n} of ${this.task.particles} particles)`);
    return {
      engineVersion: ENGINE_VERSION,
      model: structuredClone(this.task.model),
      dimension: 2,
      particles: this.task.particles,
      ensembleSeed: this.task.ensembleSeed,
      runIndex: this.task.runIndex,
      series: structuredClone(this.cluster.series),
      massRadius: this.cluster.massRadius(this.task.recordsPerDecade),
      counters: { ...this.counters },
      stateHash: this.stateHash(),
    };
  }

  /** Digest of positions, generator state, count and the rejection counter. */
  stateHash(): string {
    const h = new StateHasher();
    this.cluster.hashPositions(h);
    for (const w of this.rng.state()) h.word(w);
    h.integer(this.counters.rejections);
    return h.digest();
  }
}
