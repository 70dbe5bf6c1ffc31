import { describe, expect, it } from 'vitest';
import { TileDirectory } from '../worker/index/tile-directory.js';
import { Random } from '../worker/core/random.js';

// The directory is a map from tile coordinates to tile numbers in order of
// first addition: a plain Map is the reference (common practice, no source).
describe('TileDirectory', () => {
  // 4: sized far too small (blocks and hash table must grow, most blocks lie outside the
  // dense window around the origin); 40,000: a window of 200 × 200 blocks (±400 tiles) holds
  // the walk's neighbourhood of the origin, the long hops (±2000 tiles) go to the hash table
  it.each([4, 40_000])('numbers tiles in order of first addition and finds them again, across block borders, window edges and negative coordinates (sized for %i tiles)', (expected) => {
    const dir = new TileDirectory(expected);
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

  it('keeps blocks on both sides of each edge of the dense window apart', () => {
    const dir = new TileDirectory(40_000); // window of 200 × 200 blocks: block coordinates −100 … 99, tiles −400 … 399
    const ref = new Map<string, number>();
    const edges = [-404, -401, -400, -399, -1, 0, 395, 396, 399, 400, 403, 404];
    for (const x of edges) for (const y of edges) {
      ref.set(`${x},${y}`, ref.size);
      expect(dir.findOrAdd(x, y)).toBe(ref.get(`${x},${y}`));
    }
    for (const x of edges) for (const y of edges) {
      expect(dir.find(x, y)).toBe(ref.get(`${x},${y}`));
      // the other tiles of each block were never added
      expect(dir.find(x ^ 2, y)).toBe(ref.get(`${x ^ 2},${y}`) ?? -1);
    }
    const copy = new TileDirectory(0, dir.shared());
    for (const x of edges) for (const y of edges) expect(copy.find(x, y)).toBe(ref.get(`${x},${y}`));
  });

  it('fills blocks of 4 × 4 tiles: a compact patch of tiles uses about one block per 16 tiles', () => {
    const dir = new TileDirectory(16);
    for (let y = -32; y < 32; y++) for (let x = -32; x < 32; x++) dir.findOrAdd(x, y);
    expect(dir.count).toBe(64 * 64);
    expect(dir.blocksInUse).toBe((64 * 64) / 16);
  });
});
