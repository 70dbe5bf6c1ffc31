import { describe, expect, it } from 'vitest';
import { OccupancyIndex2d } from '../worker/index/occupancy-index-2d.js';
import { Random } from '../worker/core/random.js';
import { CORE_MASK, WINDOW_RADIUS, WindowBitGrid } from '../worker/index/window-bit-grid.js';
import { TiledByteGrid, TiledInt32Grid } from '../worker/index/tiled-grids.js';
import { reservedArray } from '../worker/index/pool-growth.js';

// The index must give a lower bound on (nearest-centre distance) − 1
// everywhere, be exact close to the cluster, and list every centre within 2
// of the walker when it scans. Checked against brute force (common practice,
// no source).
function randomCluster(n: number, spread: number, rng: Random): { x: number[]; y: number[] } {
  const x: number[] = [0];
  const y: number[] = [0];
  // a random aggregate: each new disk touches a random earlier one without overlap
  while (x.length < n) {
    const j = rng.nextBelow(x.length);
    const a = 2 * Math.PI * rng.nextDouble();
    const px = x[j] + Math.cos(a);
    const py = y[j] + Math.sin(a);
    if (Math.hypot(px, py) > spread) continue;
    let ok = true;
    for (let i = 0; i < x.length; i++) if ((x[i] - px) ** 2 + (y[i] - py) ** 2 < 1 - 1e-12) { ok = false; break; }
    if (ok) { x.push(px); y.push(py); }
  }
  return { x, y };
}

describe('OccupancyIndex2d', () => {
  it('bounds the free radius from below everywhere and is exact near the cluster', () => {
    const rng = Random.forRun(99, 0);
    const { x, y } = randomCluster(1500, 60, rng);
    const index = new OccupancyIndex2d(16);
    for (let i = 0; i < x.length; i++) index.insert(x[i], y[i]);
    let exactChecks = 0;
    for (let q = 0; q < 6000; q++) {
      // half the probes uniform over a wide box, half within 3 of a random disk
      const j = rng.nextBelow(x.length);
      const near = q % 2 === 0;
      const wx = near ? x[j] + (rng.nextDouble() - 0.5) * 6 : (rng.nextDouble() - 0.5) * 200;
      const wy = near ? y[j] + (rng.nextDouble() - 0.5) * 6 : (rng.nextDouble() - 0.5) * 200;
      let best = Infinity;
      for (let i = 0; i < x.length; i++) best = Math.min(best, Math.hypot(x[i] - wx, y[i] - wy));
      if (best < 1) continue; // inside a disk: not a walker position
      index.query(wx, wy);
      expect(index.free).toBeLessThanOrEqual(best - 1 + 1e-12);
      if (best < 2) {
        expect(index.nearCount).toBeGreaterThanOrEqual(0);
        expect(index.free).toBeCloseTo(best - 1, 12);
        // every centre within 2 is listed
        const listed = new Set<string>();
        for (let j = 0; j < index.nearCount; j++) {
          listed.add(`${index.nearX[j]},${index.nearY[j]}`);
          // ids are arrival indices
          expect(x[index.nearId[j]]).toBe(index.nearX[j]);
          expect(y[index.nearId[j]]).toBe(index.nearY[j]);
        }
        for (let i = 0; i < x.length; i++) if (Math.hypot(x[i] - wx, y[i] - wy) <= 2) expect(listed.has(`${x[i]},${y[i]}`)).toBe(true);
        exactChecks++;
      }
    }
    expect(exactChecks).toBeGreaterThan(100);
  });

  it('keeps the bound below the true free radius at every scale around a cluster (closeness field)', () => {
    // Probes at distances 2 to 200 from random disks exercise the closeness
    // of unmarked cells at levels 0 to 6; the answer must never exceed the
    // brute-force free radius (common practice, no source), and it must beat
    // the bare mark bound DILATION · side somewhere, or the field is unused.
    const rng = Random.forRun(31, 0);
    const { x, y } = randomCluster(600, 30, rng);
    const index = new OccupancyIndex2d(16);
    for (let i = 0; i < x.length; i++) index.insert(x[i], y[i]);
    let worst = -Infinity;
    let aboveMarkBound = 0;
    for (let q = 0; q < 20000; q++) {
      const j = rng.nextBelow(x.length);
      const r = 2 * Math.exp(rng.nextDouble() * Math.log(100));
      const a = 2 * Math.PI * rng.nextDouble();
      const wx = x[j] + r * Math.cos(a);
      const wy = y[j] + r * Math.sin(a);
      let best = Infinity;
      for (let i = 0; i < x.length; i++) best = Math.min(best, Math.hypot(x[i] - wx, y[i] - wy));
      if (best < 1) continue;
      index.query(wx, wy);
      worst = Math.max(worst, index.free - (best - 1));
      if (index.nearCount < 0) {
        // the mark bound: 2 sides + edge distance, at the side the answer implies or below
        const side = 2 ** Math.floor(Math.log2((index.free + 1) / 2));
        if (index.free + 1 > 2 * side + side / 2 + 1e-9) aboveMarkBound++;
      }
    }
    expect(worst).toBeLessThanOrEqual(1e-12);
    expect(aboveMarkBound).toBeGreaterThan(1000);
  });

  it('keeps every centre when its lists and grids outgrow what it was sized for (dense packing, full cells)', () => {
    // a square lattice of spacing 1 fills every side-2 cell with 4 centres,
    // and 22,500 centres in an index sized for 16 make its lists and every
    // reserved grid grow many times
    const index = new OccupancyIndex2d(16);
    const side = 150;
    for (let i = 0; i < side * side; i++) index.insert((i % side) - 75 + 0.5, Math.floor(i / side) - 75 + 0.5);
    const rng = Random.forRun(12, 0);
    for (let q = 0; q < 500; q++) {
      const wx = (rng.nextDouble() - 0.5) * 160;
      const wy = (rng.nextDouble() - 0.5) * 160;
      // centres within 2 by brute force over the lattice
      const expected: string[] = [];
      for (let gx = Math.floor(wx - 3); gx <= wx + 3; gx++)
        for (let gy = Math.floor(wy - 3); gy <= wy + 3; gy++) {
          const px = gx + 0.5, py = gy + 0.5;
          if (px < -74.5 || px > 74.5 || py < -74.5 || py > 74.5) continue;
          if (Math.hypot(px - wx, py - wy) <= 2) expected.push(`${px},${py}`);
        }
      index.query(wx, wy);
      if (expected.length === 0) continue;
      expect(index.nearCount).toBeGreaterThanOrEqual(expected.length);
      const listed = new Set<string>();
      for (let j = 0; j < index.nearCount; j++) {
        listed.add(`${index.nearX[j]},${index.nearY[j]}`);
        const id = index.nearId[j];
        expect(index.nearX[j]).toBe((id % side) - 75 + 0.5);
      }
      for (const e of expected) expect(listed.has(e)).toBe(true);
    }
  });

  it('answers the same whether sized for the whole cluster or grown from a small start', () => {
    // the size given to the constructor only reserves memory: free radii and
    // near lists (same centres, same order) must not depend on it
    const rng = Random.forRun(6, 3);
    const { x, y } = randomCluster(3000, 70, rng);
    const small = new OccupancyIndex2d(16);
    const sized = new OccupancyIndex2d(x.length);
    for (let i = 0; i < x.length; i++) { small.insert(x[i], y[i]); sized.insert(x[i], y[i]); }
    let exact = 0;
    for (let q = 0; q < 3000; q++) {
      const j = rng.nextBelow(x.length);
      const wx = q % 2 === 0 ? x[j] + (rng.nextDouble() - 0.5) * 5 : (rng.nextDouble() - 0.5) * 300;
      const wy = q % 2 === 0 ? y[j] + (rng.nextDouble() - 0.5) * 5 : (rng.nextDouble() - 0.5) * 300;
      small.query(wx, wy);
      sized.query(wx, wy);
      expect(sized.free).toBe(small.free);
      expect(sized.nearCount).toBe(small.nearCount);
      for (let i = 0; i < small.nearCount; i++) expect(sized.nearId[i]).toBe(small.nearId[i]);
      if (small.nearCount > 0) exact++;
    }
    expect(exact).toBeGreaterThan(500);
  });

  it('gives the same answer whatever the order of queries (no hidden state in results)', () => {
    const rng = Random.forRun(5, 1);
    const { x, y } = randomCluster(800, 40, rng);
    const a = new OccupancyIndex2d(16);
    const b = new OccupancyIndex2d(16);
    for (let i = 0; i < x.length; i++) { a.insert(x[i], y[i]); b.insert(x[i], y[i]); }
    const pts = Array.from({ length: 2000 }, () => [(rng.nextDouble() - 0.5) * 300, (rng.nextDouble() - 0.5) * 300]);
    const fa = pts.map(([px, py]) => a.freeRadius(px, py));
    const fb = [...pts].reverse().map(([px, py]) => b.freeRadius(px, py)).reverse();
    expect(fb).toEqual(fa);
  });

  it('answers a walker that stays in one cell as a fresh index does, and sees centres inserted since', () => {
    // The index reuses the last exact scan while the walker stays in its
    // level-0 cell; answers and near lists must equal those of an index that
    // scans afresh (common practice, no source).
    const rng = Random.forRun(8, 2);
    const { x, y } = randomCluster(900, 40, rng);
    const walker = new OccupancyIndex2d(16);
    const fresh = new OccupancyIndex2d(16);
    for (let i = 0; i < x.length; i++) { walker.insert(x[i], y[i]); fresh.insert(x[i], y[i]); }
    let reused = 0;
    for (let q = 0; q < 1000; q++) {
      const j = rng.nextBelow(x.length);
      // a first query, then four more in the same side-2 cell
      const cx = Math.floor((x[j] + (rng.nextDouble() - 0.5) * 4) * 0.5) * 2;
      const cy = Math.floor((y[j] + (rng.nextDouble() - 0.5) * 4) * 0.5) * 2;
      for (let s = 0; s < 5; s++) {
        const wx = cx + rng.nextDouble() * 2;
        const wy = cy + rng.nextDouble() * 2;
        walker.query(wx, wy);
        // move `fresh` to an exact scan in another cell first, so that it scans (wx, wy) anew
        let k = rng.nextBelow(x.length);
        while (Math.floor((x[k] + 1.01) * 0.5) === cx / 2 && Math.floor(y[k] * 0.5) === cy / 2) k = rng.nextBelow(x.length);
        fresh.query(x[k] + 1.01, y[k]);
        if (fresh.nearCount < 0) throw new Error('expected an exact scan next to a disk');
        fresh.query(wx, wy);
        let same = walker.free === fresh.free && walker.nearCount === fresh.nearCount;
        for (let i = 0; i < fresh.nearCount; i++)
          same &&= walker.nearX[i] === fresh.nearX[i] && walker.nearY[i] === fresh.nearY[i] && walker.nearId[i] === fresh.nearId[i];
        if (!same) expect({ wx, wy, free: walker.free, count: walker.nearCount }).toEqual({ wx, wy, free: fresh.free, count: fresh.nearCount });
        if (s > 0 && fresh.nearCount >= 0) reused++;
      }
    }
    expect(reused).toBeGreaterThan(500);
    // an insert next to the walker's cell after a scan there is seen by the next query
    const idx = new OccupancyIndex2d(16);
    idx.insert(0, 0);
    idx.query(1.5, 0.5);
    const before = idx.free;
    idx.insert(2.9, 0.5);
    idx.query(1.5, 0.5);
    expect(idx.free).toBeCloseTo(0.4, 12);
    expect(before).toBeCloseTo(Math.hypot(1.5, 0.5) - 1, 12);
  });

  it('grows with the number of particles, not with the area spanned', () => {
    // 2000 disks on a square lattice of spacing `gap`: the area spanned grows
    // as gap², the index must not (it may grow with log(gap): one mark tile
    // per disk and level until the levels merge).
    const make = (gap: number) => {
      const idx = new OccupancyIndex2d(16);
      for (let i = 0; i < 2000; i++) idx.insert((i % 45) * gap, Math.floor(i / 45) * gap);
      return idx.bytes;
    };
    const wide = make(10000);
    const spannedCells = ((45 * 10000) / 2) ** 2; // level-0 cells a dense grid would need
    expect(wide).toBeLessThan(2000 * 8192); // a few kB per disk
    expect(wide).toBeLessThan(spannedCells / 100);
    // doubling the particle count at the same spacing roughly doubles memory
    const idx = new OccupancyIndex2d(16);
    for (let i = 0; i < 4000; i++) idx.insert((i % 45) * 10000, Math.floor(i / 45) * 10000);
    expect(idx.bytes).toBeLessThan(3 * wide);
  });
});

describe('WindowBitGrid', () => {
  it('reads the window around any cell from the tile owning it, across tile borders and negative coordinates', () => {
    // against a plain set of cells (common practice, no source)
    const rng = Random.forRun(4, 4);
    const grid = new WindowBitGrid(4);
    const set = new Set<string>();
    for (let i = 0; i < 400; i++) {
      const ix = rng.nextBelow(80) - 40;
      const iy = rng.nextBelow(80) - 40;
      grid.set(ix, iy);
      set.add(`${ix},${iy}`);
    }
    let ones = 0;
    for (let iy = -46; iy < 46; iy++)
      for (let ix = -46; ix < 46; ix++) {
        const base = grid.tileOffset(ix, iy);
        for (let dy = -WINDOW_RADIUS; dy <= WINDOW_RADIUS; dy++) {
          const word = base < 0 ? 0 : grid.words[base + (iy & CORE_MASK) + WINDOW_RADIUS + dy];
          for (let dx = -WINDOW_RADIUS; dx <= WINDOW_RADIUS; dx++) {
            const bit = (word >>> ((ix & CORE_MASK) + WINDOW_RADIUS + dx)) & 1;
            const want = set.has(`${ix + dx},${iy + dy}`) ? 1 : 0;
            if (bit !== want) expect({ ix, iy, dx, dy, bit }).toEqual({ ix, iy, dx, dy, bit: want });
            ones += bit;
          }
        }
        expect(grid.get(ix, iy)).toBe(set.has(`${ix},${iy}`));
      }
    expect(ones).toBeGreaterThan(5000);
  });
});

describe('reservedArray', () => {
  it('reserves when it can and falls back to the needed length when the reservation is refused', () => {
    expect(reservedArray((n) => new Uint8Array(n), 64, 4096).length).toBe(4096);
    expect(reservedArray((n) => new Uint8Array(n), 64, 16).length).toBe(64);
    // more than a typed array's 2^32 entries: RangeError, so the needed length
    expect(reservedArray((n) => new Uint8Array(n), 64, 2 ** 33).length).toBe(64);
    // other errors are not swallowed
    expect(() => reservedArray(() => { throw new TypeError('boom'); }, 1, 2)).toThrow(TypeError);
  });

  it('gives grids whose cells read as never written, reserved or not', () => {
    const reserved = new TiledInt32Grid(0, 4, 1000);
    const plain = new TiledInt32Grid(-1, 4);
    for (let i = 0; i < 300; i++) {
      reserved.set(i * 9, -i * 7, i + 1);
      plain.set(i * 9, -i * 7, i + 1);
    }
    for (let i = 0; i < 300; i++) {
      expect(reserved.get(i * 9, -i * 7)).toBe(i + 1);
      expect(reserved.get(i * 9 + 1, -i * 7)).toBe(0);
      expect(plain.get(i * 9 + 1, -i * 7)).toBe(-1);
    }
    const bytes = new TiledByteGrid(4, 1000);
    for (let i = 0; i < 300; i++) bytes.orBits(i * 9, i * 5, 3);
    for (let i = 0; i < 300; i++) expect([bytes.get(i * 9, i * 5), bytes.get(i * 9, i * 5 + 1)]).toEqual([3, 0]);
  });
  it('counts its exact scans, fresh block gathers and ring gathers (benchmark counters)', () => {
    const index = new OccupancyIndex2d(16);
    index.insert(0.5, 0.5);
    index.query(100.5, 100.5); // far away: answered by the marks, no scan
    expect([index.exactScans, index.blockGathers, index.ringGathers]).toEqual([0, 0, 0]);
    index.query(1.5, 0.5); // level-0 cell (0, 0) is marked: exact scan, block gathered; the centre is 1 away, inside the block's reach
    expect([index.exactScans, index.blockGathers, index.ringGathers]).toEqual([1, 1, 0]);
    expect(index.free).toBeCloseTo(0, 12);
    index.query(1.9, 1.9); // same cell: the block is reused
    expect([index.exactScans, index.blockGathers, index.ringGathers]).toEqual([2, 1, 0]);
    index.query(-3.5, 0.5); // cell (-2, 0) is marked (within 2 cells), the centre (4 away) lies in its ring: block and ring gathered
    expect([index.exactScans, index.blockGathers, index.ringGathers]).toEqual([3, 2, 1]);
    expect(index.free).toBeCloseTo(3, 12);
    index.insert(0.7, 3.5); // an insert drops the kept block
    index.query(1.9, 1.9);
    expect([index.exactScans, index.blockGathers]).toEqual([4, 3]);
  });
});
