/**
 * The 3D near-distance field (worker/index/near-distance-field-3d.ts): its
 * bound never exceeds the distance to the nearest centre, it is within the
 * derived loss of it, it does not depend on the order of inserts nor on the
 * earlier centres handed to an insert to cut its work.
 */
import { describe, expect, it } from 'vitest';
import { createKernel, modelParams } from '../worker/models/registry.js';
import { NearDistanceField3d, NEAR_FIELD_CAP } from '../worker/index/near-distance-field-3d.js';
import { Random } from '../worker/core/random.js';
import { yieldToRunner } from './support/grow.js';

const NONE = new Float64Array(0);

function cluster(n: number, seed: string): Float64Array {
  const k = createKernel({ model: modelParams('dla-offlattice-3d'), particles: n, ensembleSeed: seed, runIndex: 0, recordsPerDecade: 20 });
  k.growTo(n);
  return k.positions().coords.slice(0, 3 * n);
}

/** Query points: near random centres (spread 4) and farther (spread 20). */
function points(c: Float64Array, n: number, count: number, seed: number): number[][] {
  const rng = Random.forRun(seed, 0);
  const pts: number[][] = [];
  for (let q = 0; q < count; q++) {
    const j = rng.nextBelow(n);
    const spread = q % 3 === 0 ? 20 : 4;
    pts.push([c[3 * j] + spread * rng.nextSigned(), c[3 * j + 1] + spread * rng.nextSigned(), c[3 * j + 2] + spread * rng.nextSigned()]);
  }
  return pts;
}

function nearest(c: Float64Array, n: number, x: number, y: number, z: number): number {
  let best = Infinity;
  for (let i = 0; i < n; i++) {
    const dx = c[3 * i] - x;
    const dy = c[3 * i + 1] - y;
    const dz = c[3 * i + 2] - z;
    const d2 = dx * dx + dy * dy + dz * dz;
    if (d2 < best) best = d2;
  }
  return Math.sqrt(best);
}

describe('3D near-distance field', () => {
  it('never exceeds the nearest-centre distance, and loses at most 2√3 + 1/16 of it within the cap (exact, derived in the file header; mean loss measured 0.94)', async () => {
    const n = 2000;
    const c = cluster(n, '3');
    const f = new NearDistanceField3d();
    for (let i = 0; i < n; i++) f.insert(c[3 * i], c[3 * i + 1], c[3 * i + 2], NONE, NONE, NONE, 0);
    let loss = 0;
    let within = 0;
    const pts = points(c, n, 4000, 11);
    for (let q = 0; q < pts.length; q++) {
      if (q % 500 === 0) await yieldToRunner();
      const [x, y, z] = pts[q];
      const d = nearest(c, n, x, y, z);
      f.lowerBound(x, y, z);
      expect(f.bound).toBeLessThanOrEqual(d);
      if (d < NEAR_FIELD_CAP - 2 * Math.sqrt(3)) {
        // the cell's centre is within √3 of the point, so within CAP of a centre
        expect(f.near).toBe(true);
        expect(d - f.bound).toBeLessThanOrEqual(2 * Math.sqrt(3) + 1 / 16 + 1e-9);
        loss += d - f.bound;
        within++;
      }
    }
    expect(within).toBeGreaterThan(2000);
    // cells of side 2: the mean of |x − c| over a cell is 0.96, and the bound loses it once
    // (often twice, never more); a loose bound (e.g. the marks' 3.4 diameters) fails this
    expect(loss / within).toBeLessThan(1.5);
  });

  it('is the same whatever the order of inserts and whatever earlier centres cut an insert (a minimum over centres)', () => {
    const n = 1500;
    const c = cluster(n, '8');
    const plain = new NearDistanceField3d();
    const reversed = new NearDistanceField3d();
    const cut = new NearDistanceField3d();
    for (let i = 0; i < n; i++) plain.insert(c[3 * i], c[3 * i + 1], c[3 * i + 2], NONE, NONE, NONE, 0);
    for (let i = n - 1; i >= 0; i--) reversed.insert(c[3 * i], c[3 * i + 1], c[3 * i + 2], NONE, NONE, NONE, 0);
    // each insert is handed the earlier centres within 3 (those within 2 cut its work)
    const nx = new Float64Array(n);
    const ny = new Float64Array(n);
    const nz = new Float64Array(n);
    let cutting = 0;
    for (let i = 0; i < n; i++) {
      let m = 0;
      for (let j = 0; j < i; j++) {
        if (Math.hypot(c[3 * j] - c[3 * i], c[3 * j + 1] - c[3 * i + 1], c[3 * j + 2] - c[3 * i + 2]) < 3) {
          nx[m] = c[3 * j];
          ny[m] = c[3 * j + 1];
          nz[m] = c[3 * j + 2];
          m++;
        }
      }
      if (m > 0) cutting++;
      cut.insert(c[3 * i], c[3 * i + 1], c[3 * i + 2], nx, ny, nz, m);
    }
    expect(cutting).toBe(n - 1); // every ball but the seed touches an earlier one
    for (const [x, y, z] of points(c, n, 20000, 12)) {
      plain.lowerBound(x, y, z);
      const b = plain.bound;
      reversed.lowerBound(x, y, z);
      expect(reversed.bound).toBe(b);
      cut.lowerBound(x, y, z);
      expect(cut.bound).toBe(b);
    }
    // an insert cut by its neighbours allocates no more bricks than a plain one
    expect(cut.brickTotal).toBeLessThanOrEqual(plain.brickTotal);
  });
});
