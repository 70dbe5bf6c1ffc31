/**
 * Open-addressing hash table from integer cell coordinates (ix, iy, iz) to
 * one or four int32 values: the sparse storage under the 3D occupancy index
 * (worker/index/occupancy-index-3d.ts). Memory is proportional to the number
 * of cells stored, never to the volume covered.
 *
 * Linear probing on a power-of-two table, kept at most half full. Each slot
 * is eight int32 words [ix, iy, iz, v0, v1, v2, v3, unused] (32 bytes, half
 * a cache line), or four [ix, iy, iz, v0] for a table of one value; the
 * empty-slot marker is ix = INT32_MIN, a coordinate no
 * cluster can reach. No deletion (clusters only grow).
 */

export const EMPTY_KEY_3D = -2147483648;

export class CellHashTable3d {
  /** Slots of 2^shift words: [ix, iy, iz, v0, (v1, v2, v3, 0)]. */
  slots: Int32Array;
  /** Slot count − 1 (slot count is a power of two). */
  mask: number;
  /** log2 of the words per slot: 2 (one value) or 3 (four values). */
  private readonly shift: number;
  private used = 0;
  /** The last cell `find` found (lastX = EMPTY_KEY_3D: none) and its slot's offset. */
  private lastX = EMPTY_KEY_3D;
  private lastY = 0;
  private lastZ = 0;
  private lastOffset = -1;

  constructor(expectedEntries = 1024, values: 1 | 4 = 4) {
    this.shift = values === 1 ? 2 : 3;
    let cap = 16;
    while (cap < expectedEntries * 2) cap *= 2;
    this.slots = this.emptySlots(cap);
    this.mask = cap - 1;
  }

  private emptySlots(cap: number): Int32Array {
    const w = 1 << this.shift;
    const s = new Int32Array(cap * w);
    for (let i = 0; i < s.length; i += w) s[i] = EMPTY_KEY_3D;
    return s;
  }

  /** Number of cells stored. */
  get size(): number {
    return this.used;
  }

  /** Bytes held by the table. */
  get bytes(): number {
    return this.slots.byteLength;
  }

  /**
   * Word offset of the slot of (ix, iy, iz), or -1 when the cell is absent. Values are at offset + 3 … offset + 6.
   * The last cell found is remembered (a walker asks about the same brick many times in a row); a present
   * cell's offset only moves when the table grows, which forgets it.
   */
  find(ix: number, iy: number, iz: number): number {
    if (ix === this.lastX && iy === this.lastY && iz === this.lastZ) return this.lastOffset;
    const slots = this.slots;
    const mask = this.mask;
    const shift = this.shift;
    let i = hashCell3d(ix, iy, iz) & mask;
    for (;;) {
      const o = i << shift;
      const k = slots[o];
      if (k === ix && slots[o + 1] === iy && slots[o + 2] === iz) {
        this.lastX = ix;
        this.lastY = iy;
        this.lastZ = iz;
        this.lastOffset = o;
        return o;
      }
      if (k === EMPTY_KEY_3D) return -1;
      i = (i + 1) & mask;
    }
  }

  /**
   * Word offset of the slot of (ix, iy, iz), inserting the cell with values
   * `initial` (all of them) when absent. May reallocate `slots`: read the field
   * after calling.
   */
  slotFor(ix: number, iy: number, iz: number, initial: number): number {
    const mask = this.mask;
    const shift = this.shift;
    let i = hashCell3d(ix, iy, iz) & mask;
    for (;;) {
      const o = i << shift;
      const k = this.slots[o];
      if (k === ix && this.slots[o + 1] === iy && this.slots[o + 2] === iz) return o;
      if (k === EMPTY_KEY_3D) break;
      i = (i + 1) & mask;
    }
    if ((this.used + 1) * 2 > this.mask + 1) {
      this.grow();
      return this.slotFor(ix, iy, iz, initial);
    }
    const o = i << shift;
    const s = this.slots;
    s[o] = ix;
    s[o + 1] = iy;
    s[o + 2] = iz;
    s[o + 3] = initial;
    if (shift === 3) {
      s[o + 4] = initial;
      s[o + 5] = initial;
      s[o + 6] = initial;
    }
    this.used++;
    return o;
  }

  private grow(): void {
    const old = this.slots;
    const cap = (this.mask + 1) * 2;
    const slots = this.emptySlots(cap);
    const mask = cap - 1;
    const shift = this.shift;
    const w = 1 << shift;
    for (let o = 0; o < old.length; o += w) {
      const ix = old[o];
      if (ix === EMPTY_KEY_3D) continue;
      let i = hashCell3d(ix, old[o + 1], old[o + 2]) & mask;
      while (slots[i << shift] !== EMPTY_KEY_3D) i = (i + 1) & mask;
      slots.set(old.subarray(o, o + w), i << shift);
    }
    this.slots = slots;
    this.mask = mask;
    this.lastX = EMPTY_KEY_3D;
  }
}

/** 32-bit mix of three cell coordinates (multiply-xorshift). */
export function hashCell3d(ix: number, iy: number, iz: number): number {
  let h = Math.imul(ix, 0x9e3779b1) ^ Math.imul(iy, 0x85ebca77) ^ Math.imul(iz, 0xc2b2ae3d);
  h ^= h >>> 15;
  h = Math.imul(h, 0x2c1b3c6d);
  h ^= h >>> 13;
  return h;
}
