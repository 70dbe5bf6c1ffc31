import { describe, expect, it } from 'vitest';
import { TileDirectory } from '../worker/index/tile-directory.js';
import { Random } from '../worker/core/random.js';

// The directory is a map from tile coordinates to tile numbers in order of
// first addition: a plain Map is the reference (common practice, no source).
describe('TileDirectory', () => {
  it('numbers tiles in order of first addition and finds them again, across block borders and negative coordinates', () => {
    const dir = new TileDirectory(4); // sized far too small: blocks and hash table must grow
    const ref = new Map<string, number>();
    const rng = Random.forRun('5', 0, 0);
    let tx = 0;
    let ty = 0;
    for (let step = 0; step < 60_000; step++) {
      // a walk with occasional long hops: mostly neighbouring tiles, sometimes far ones
      if (rng.nextDouble() < 0.02) {
        tx = Math.floor((rng.nextDouble() - 0.5) * 4000);
        ty = Math.floor((rng.nextDouble() - 0.5) * 4000);
      } else {
        tx += rng.nextBelow(3) - 1;
        ty += rng.nextBelow(3) - 1;
      }
      const key = `${tx},${ty}`;
      if (rng.nextDouble() < 0.5) {
        expect(dir.find(tx, ty)).toBe(ref.get(key) ?? -1);
      } else {
        if (!ref.has(key)) ref.set(key, ref.size);
        expect(dir.findOrAdd(tx, ty)).toBe(ref.get(key));
      }
    }
    expect(dir.count).toBe(ref.size);
    expect(ref.size).toBeGreaterThan(10_000);
    // every tile again, in another order, and never-added neighbours
    for (const [key, t] of ref) {
      const [x, y] = key.split(',').map(Number);
      expect(dir.find(x, y)).toBe(t);
      if (!ref.has(`${x + 5000},${y}`)) expect(dir.find(x + 5000, y)).toBe(-1);
    }
    // a copy in shared memory answers the same
    const copy = new TileDirectory(0, dir.shared());
    expect(copy.count).toBe(dir.count);
    for (const [key, t] of ref) {
      const [x, y] = key.split(',').map(Number);
      expect(copy.find(x, y)).toBe(t);
    }
    expect(copy.find(-3_000_000, 7)).toBe(-1);
  });

  it('fills blocks of 4 × 4 tiles: a compact patch of tiles uses about one block per 16 tiles', () => {
    const dir = new TileDirectory(16);
    for (let y = -32; y < 32; y++) for (let x = -32; x < 32; x++) dir.findOrAdd(x, y);
    expect(dir.count).toBe(64 * 64);
    expect(dir.blocksInUse).toBe((64 * 64) / 16);
  });
});
