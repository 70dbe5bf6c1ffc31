/**
 * The bookkeeping every planar kernel shares: particle centres in arrival
 * order (x0, y0, x1, y1, …; seed at the origin), R_max, the running sums
 * behind R_g and the centre offset, the records at the log-spaced sizes
 * (worker/core/record-sizes.ts), the final mass–radius counts and the
 * positions' part of the state hash. A kernel appends centres; at every
 * record size the standard observables and the kernel's extra observables
 * are recorded.
 */
import type { ClusterPositions, GrowthCheckpoint, GrowthResult, GrowthSeries, GrowthTask, MassRadius } from './growth-kernel.js';
import { ENGINE_VERSION } from './engine-version.js';
import { countCentresWithin, massRadiusRadii, recordSizes } from './record-sizes.js';
import type { StateHasher } from './state-hash.js';

/** Records the model-specific observables of the first `count` centres into `extra`. */
export type ExtraRecorder = (extra: Record<string, number[]>, coords: Float64Array, count: number, rMax: number) => void;

export class PlanarCluster {
  /** Centres, interleaved x, y. */
  readonly xy: Float64Array;
  n = 0;
  rMax = 0;
  private sumX = 0;
  private sumY = 0;
  private sumR2 = 0;
  private readonly sizes: number[];
  private nextRecord = 0;
  readonly series: GrowthSeries;

  constructor(
    capacity: number,
    recordsPerDecade: number,
    private readonly recordExtra: ExtraRecorder,
    series?: GrowthSeries,
  ) {
    this.xy = new Float64Array(2 * capacity);
    this.sizes = recordSizes(capacity, recordsPerDecade);
    this.series = series ? structuredClone(series) : { sizes: [], radiusOfGyration: [], maxRadius: [], centerOffset: [], extra: {} };
  }

  /** After re-appending a checkpoint's centres: skip the records already taken. */
  resumeRecords(): void {
    while (this.nextRecord < this.sizes.length && this.sizes[this.nextRecord] <= this.n) this.nextRecord++;
  }

  /** Add a centre (no record). */
  append(px: number, py: number): void {
    const i = this.n;
    this.xy[2 * i] = px;
    this.xy[2 * i + 1] = py;
    this.n = i + 1;
    const r2 = px * px + py * py;
    if (r2 > this.rMax * this.rMax) this.rMax = Math.sqrt(r2);
    this.sumX += px;
    this.sumY += py;
    this.sumR2 += r2;
  }

  /** Add a centre and take a record if the new size is on the grid. */
  place(px: number, py: number): void {
    this.append(px, py);
    if (this.nextRecord < this.sizes.length && this.n === this.sizes[this.nextRecord]) this.record();
  }

  private record(): void {
    const n = this.n;
    const mx = this.sumX / n;
    const my = this.sumY / n;
    const rg2 = this.sumR2 / n - (mx * mx + my * my);
    this.series.sizes.push(n);
    this.series.radiusOfGyration.push(Math.sqrt(rg2 > 0 ? rg2 : 0));
    this.series.maxRadius.push(this.rMax);
    this.series.centerOffset.push(Math.sqrt(mx * mx + my * my));
    this.recordExtra(this.series.extra, this.xy, n, this.rMax);
    this.nextRecord++;
  }

  positions(): ClusterPositions {
    return { dimension: 2, count: this.n, coords: this.xy };
  }

  massRadius(recordsPerDecade: number): MassRadius {
    const radii = massRadiusRadii(this.rMax, recordsPerDecade);
    return { radii, counts: countCentresWithin(this.xy, 2, this.n, radii) };
  }

  /** The result of a finished run of `task` grown into this cluster, with the kernel's counters and state hash. */
  result(task: GrowthTask, counters: Record<string, number>, stateHash: string): GrowthResult {
    if (this.n < task.particles) throw new Error(`run ${task.runIndex} is not finished (${this.n} of ${task.particles} particles)`);
    return {
      engineVersion: ENGINE_VERSION,
      model: structuredClone(task.model),
      dimension: 2,
      particles: task.particles,
      ensembleSeed: task.ensembleSeed,
      runIndex: task.runIndex,
      series: structuredClone(this.series),
      massRadius: this.massRadius(task.recordsPerDecade),
      counters,
      stateHash,
    };
  }

  /**
   * A checkpoint of `task` at this cluster's size (records copied), with the
   * kernel's generator state, counters and model state. The centres are
   * copied, or with `view` a view of this cluster's own array (no copy;
   * GrowthKernel.checkpointView: valid until the next centre is added), so
   * that a giant cluster's checkpoint is streamed to disk without a second
   * whole-cluster array beside the first.
   */
  checkpoint(task: GrowthTask, rngState: Uint32Array, counters: Record<string, number>, modelState: Uint8Array, view = false): GrowthCheckpoint {
    return {
      engineVersion: ENGINE_VERSION,
      task: structuredClone(task),
      dimension: 2,
      count: this.n,
      positions: view ? this.xy.subarray(0, 2 * this.n) : this.xy.slice(0, 2 * this.n),
      rngState,
      counters,
      series: structuredClone(this.series),
      modelState,
    };
  }

  /** Feed the dimension, count and centres to a state hash. */
  hashPositions(h: StateHasher): void {
    h.word(2).integer(this.n).float64Strided(this.xy, this.n, 2, 0).float64Strided(this.xy, this.n, 2, 1);
  }
}
