import { describe, expect, it } from 'vitest';
import { CellHashTable } from '../worker/index/cell-hash-table.js';

describe('CellHashTable', () => {
  it('keeps every entry across many reallocations (compared with a Map)', () => {
    const t = new CellHashTable(1);
    const ref = new Map<string, number>();
    let seed = 12345;
    const next = () => (seed = (Math.imul(seed, 1103515245) + 12345) | 0);
    for (let i = 0; i < 20000; i++) {
      const ix = next() % 300;
      const iy = next() % 300;
      if (i % 3 === 0) {
        t.orBits(ix, iy, 1 << (i % 5));
        ref.set(`${ix},${iy}`, (ref.get(`${ix},${iy}`) ?? 0) | (1 << (i % 5)));
      } else {
        t.set(ix, iy, i);
        ref.set(`${ix},${iy}`, i);
      }
    }
    expect(t.size).toBe(ref.size);
    for (const [k, v] of ref) {
      const [ix, iy] = k.split(',').map(Number);
      expect(t.get(ix, iy, -7)).toBe(v);
    }
    expect(t.get(100000, -100000, -7)).toBe(-7);
  });
});
