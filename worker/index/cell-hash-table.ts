/**
 * Open-addressing hash table from integer cell coordinates (ix, iy) to an
 * int32 value. It is the sparse storage under the occupancy index: memory is
 * proportional to the number of cells stored, never to the area covered.
 *
 * Linear probing on a power-of-two table, kept at most half full. Each slot
 * is four int32 words [ix, iy, value, unused] in one Int32Array, so a lookup
 * touches one cache line; the empty-slot marker is ix = INT32_MIN, a
 * coordinate no cluster can reach. No deletion (clusters only grow).
 */

import { sharedInt32 } from '../core/shared-arrays.js';

export const EMPTY_KEY = -2147483648;

/** A table's contents in shared memory (CellHashTable.shared), for a read-only copy in another thread. */
export interface SharedCellHashTable {
  slots: Int32Array;
  used: number;
}

export class CellHashTable {
  /** Slots, 4 words each: [ix, iy, value, 0]. Read directly by hot loops via `lookup`. */
  slots: Int32Array;
  /** Slot count − 1 (slot count is a power of two). */
  mask: number;
  private used = 0;

  /** With `from`, the table reads that shared state (read only: it must not be written). */
  constructor(expectedEntries = 1024, from?: SharedCellHashTable) {
    if (from) {
      this.slots = from.slots;
      this.mask = (from.slots.length >> 2) - 1;
      this.used = from.used;
      return;
    }
    let cap = 16;
    while (cap < expectedEntries * 2) cap *= 2;
    this.slots = CellHashTable.emptySlots(cap);
    this.mask = cap - 1;
  }

  /** A copy of the table in shared memory (the same slots, so the same look-ups). */
  shared(): SharedCellHashTable {
    return { slots: sharedInt32(this.slots), used: this.used };
  }

  private static emptySlots(cap: number): Int32Array {
    const s = new Int32Array(cap * 4);
    for (let i = 0; i < s.length; i += 4) s[i] = EMPTY_KEY;
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

  /** The value stored for (ix, iy), or `missing` when the cell is absent. */
  get(ix: number, iy: number, missing: number): number {
    const slots = this.slots;
    const mask = this.mask;
    let i = hashCell(ix, iy) & mask;
    for (;;) {
      const o = i << 2;
      const k = slots[o];
      if (k === ix && slots[o + 1] === iy) return slots[o + 2];
      if (k === EMPTY_KEY) return missing;
      i = (i + 1) & mask;
    }
  }

  /** Store value for (ix, iy), replacing any previous one. */
  set(ix: number, iy: number, value: number): void {
    // slotFor may reallocate `slots`: find the slot before reading the field
    const o = this.slotFor(ix, iy) + 2;
    this.slots[o] = value;
  }

  /** Bitwise-or `bits` into the value of (ix, iy) (absent cells count as 0); returns the old value. */
  orBits(ix: number, iy: number, bits: number): number {
    const o = this.slotFor(ix, iy) + 2;
    const old = this.slots[o];
    this.slots[o] = old | bits;
    return old;
  }

  /** Word offset of the slot holding (ix, iy), inserting the key with value 0 when absent. */
  private slotFor(ix: number, iy: number): number {
    const mask = this.mask;
    let i = hashCell(ix, iy) & mask;
    for (;;) {
      const o = i << 2;
      const k = this.slots[o];
      if (k === ix && this.slots[o + 1] === iy) return o;
      if (k === EMPTY_KEY) break;
      i = (i + 1) & mask;
    }
    if ((this.used + 1) * 2 > this.mask + 1) {
      this.grow();
      return this.slotFor(ix, iy);
    }
    const o = i << 2;
    this.slots[o] = ix;
    this.slots[o + 1] = iy;
    this.slots[o + 2] = 0;
    this.used++;
    return o;
  }

  private grow(): void {
    const old = this.slots;
    const cap = (this.mask + 1) * 2;
    const slots = CellHashTable.emptySlots(cap);
    const mask = cap - 1;
    for (let o = 0; o < old.length; o += 4) {
      const ix = old[o];
      if (ix === EMPTY_KEY) continue;
      const iy = old[o + 1];
      let i = hashCell(ix, iy) & mask;
      while (slots[i << 2] !== EMPTY_KEY) i = (i + 1) & mask;
      slots[i << 2] = ix;
      slots[(i << 2) + 1] = iy;
      slots[(i << 2) + 2] = old[o + 2];
    }
    this.slots = slots;
    this.mask = mask;
  }
}

/** 32-bit mix of two cell coordinates (multiply-xorshift). */
export function hashCell(ix: number, iy: number): number {
  let h = Math.imul(ix, 0x9e3779b1) ^ Math.imul(iy, 0x85ebca77);
  h ^= h >>> 15;
  h = Math.imul(h, 0x2c1b3c6d);
  h ^= h >>> 13;
  return h;
}
