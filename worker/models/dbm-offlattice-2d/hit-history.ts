/**
 * The hit history of dbm-offlattice-2d's history method (kernel.ts header,
 * "η > 1, history method"): a walker clock, and per particle the clock of its
 * birth (or last reset) and of its last k + 1 hits since then, in typed
 * arrays (no allocation per walker). Every walker the kernel releases is
 * recorded. Writes made while a particle is being built go to an undo journal
 * so that a stop can put the history back where that particle began.
 *
 * Serialised form (the checkpoint's modelState): float64 words
 * [clock, the kernel's normaliser and its two sums, then per particle: hits,
 * birth, k + 1 ring slots].
 */
import type { StateHasher } from '../../core/state-hash.js';

/** Words before the per-particle part: the clock and the kernel's three numbers. */
const HEAD = 4;

export class HitHistory {
  /** Walkers released so far (the clock of the last one). */
  clock = 0;
  /** Ring slots per particle: the last `gaps` + 1 hits. */
  readonly ring: number;
  /** Hits on each particle since its birth or last reset (kept below 2·ring; only its value mod ring and min(·, ring) matter). */
  readonly hits: Uint32Array;
  /** Clock at each particle's birth or last reset. */
  readonly birth: Float64Array;
  /** Clock of hit number r since birth at times[ring·i + r mod ring]. */
  readonly times: Float64Array;
  private journal = new Float64Array(3 * 1024);
  private journalLength = 0;
  private clockAtMark = 0;

  constructor(capacity: number, readonly gaps: number) {
    this.ring = gaps + 1;
    this.hits = new Uint32Array(capacity);
    this.birth = new Float64Array(capacity);
    this.times = new Float64Array(capacity * this.ring);
  }

  /** Record one walker that touched particle i first (advances the clock). */
  record(i: number): void {
    const t = ++this.clock;
    const r = this.ring;
    const old = this.hits[i];
    const slot = r * i + (old % r);
    if (3 * this.journalLength + 3 > this.journal.length) {
      const bigger = new Float64Array(2 * this.journal.length);
      bigger.set(this.journal);
      this.journal = bigger;
    }
    const j = 3 * this.journalLength++;
    this.journal[j] = i;
    this.journal[j + 1] = old;
    this.journal[j + 2] = this.times[slot];
    this.times[slot] = t;
    this.hits[i] = old + 1 >= 2 * r ? old + 1 - r : old + 1;
  }

  /** Particle i is new, or its history is forgotten: no hits, born now. */
  restart(i: number): void {
    this.hits[i] = 0;
    this.birth[i] = this.clock;
  }

  /** Start of a particle's building: later `record`s can be undone back to here. */
  mark(): void {
    this.journalLength = 0;
    this.clockAtMark = this.clock;
  }

  /** Undo every `record` since `mark` (a stop abandoned the particle). */
  undo(): void {
    const r = this.ring;
    for (let n = this.journalLength - 1; n >= 0; n--) {
      const j = 3 * n;
      const i = this.journal[j];
      const old = this.journal[j + 1];
      this.hits[i] = old;
      this.times[r * i + (old % r)] = this.journal[j + 2];
    }
    this.journalLength = 0;
    this.clock = this.clockAtMark;
  }

  /**
   * The window of particle i's hits that ends at its latest hit: the number of
   * whole recurrence gaps it spans (at most `gaps`; the birth counts as the
   * start of the first gap), with its length in walkers left in `span`.
   */
  window(i: number): number {
    const h = this.hits[i];
    const t = this.times[this.ring * i + ((h + this.ring - 1) % this.ring)];
    if (h > this.gaps) {
      this.span = t - this.times[this.ring * i + ((h - 1 - this.gaps) % this.ring)];
      return this.gaps;
    }
    this.span = t - this.birth[i];
    return h;
  }

  /** Length in walkers of the last `window`. */
  span = 0;

  /** Serialise the first n particles' history and the kernel's EXTRA_WORDS numbers (normaliser and its sums). */
  serialise(n: number, extra: [number, number, number]): Uint8Array {
    const r = this.ring;
    const out = new Float64Array(HEAD + n * (2 + r));
    out[0] = this.clock;
    out.set(extra, 1);
    for (let i = 0; i < n; i++) {
      const o = HEAD + i * (2 + r);
      out[o] = this.hits[i];
      out[o + 1] = this.birth[i];
      for (let s = 0; s < r; s++) out[o + 2 + s] = this.times[r * i + s];
    }
    return new Uint8Array(out.buffer);
  }

  /** Load what `serialise` wrote for n particles; returns the kernel's numbers. Throws one line when the size does not fit. */
  load(bytes: Uint8Array, n: number): [number, number, number] {
    const r = this.ring;
    const words = HEAD + n * (2 + r);
    if (bytes.length !== 8 * words) throw new RangeError(`checkpoint modelState must hold the hit history of ${n} particles with ${this.gaps} recurrence gaps (${8 * words} bytes), got ${bytes.length} bytes`);
    const w = new Float64Array(bytes.slice().buffer);
    this.clock = w[0];
    for (let i = 0; i < n; i++) {
      const o = HEAD + i * (2 + r);
      this.hits[i] = w[o];
      this.birth[i] = w[o + 1];
      for (let s = 0; s < r; s++) this.times[r * i + s] = w[o + 2 + s];
    }
    this.clockAtMark = this.clock;
    return [w[1], w[2], w[3]];
  }

  /** Feed the first n particles' history into a state hash. */
  hashInto(h: StateHasher, n: number): void {
    h.float64(this.clock);
    for (let i = 0; i < n; i++) {
      h.integer(this.hits[i]).float64(this.birth[i]);
      for (let s = 0; s < this.ring; s++) h.float64(this.times[this.ring * i + s]);
    }
  }
}
