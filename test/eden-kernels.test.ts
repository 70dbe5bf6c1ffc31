import { describe, expect, it } from 'vitest';
import { createKernel, modelDescriptor, modelParams } from '../worker/models/registry.js';
import type { GrowthCheckpoint, GrowthKernel, GrowthTask } from '../worker/core/growth-kernel.js';
import { EdenLatticeKernel } from '../worker/models/eden-lattice/eden-lattice-kernel.js';
import { OffLatticeEden2d } from '../worker/models/eden-offlattice-2d/kernel.js';
import { SQUARE, TRIANGULAR, siteOf, toSite, type PlanarLattice } from '../worker/lattice/planar-lattice.js';
import { anisotropy, anisotropyOf, recordPlanarAnisotropy } from '../worker/core/anisotropy.js';
import { yieldToRunner } from './support/grow.js';

const EDEN_KINDS = ['eden-square', 'eden-triangular', 'eden-offlattice-2d'] as const;

function edenTask(kind: string, particles: number, runIndex = 0, seed = '11'): GrowthTask {
  return { model: modelParams(kind), particles, ensembleSeed: seed, runIndex, recordsPerDecade: 20 };
}

function grown(task: GrowthTask): GrowthKernel {
  const k = createKernel(task);
  k.growTo(task.particles);
  return k;
}

// Chi-square critical values at significance 0.001 (exact table values of the chi-square distribution).
const CHI2_999 = { 5: 20.515, 7: 24.322 } as const;

function chiSquare(counts: number[], expected: number[]): number {
  let s = 0;
  for (let i = 0; i < counts.length; i++) s += (counts[i] - expected[i]) ** 2 / expected[i];
  return s;
}

describe('Eden lattice kernels: geometry', () => {
  for (const lattice of [SQUARE, TRIANGULAR]) {
    const kind = `eden-${lattice.name}`;
    it(`${kind}: distinct lattice sites, each next to an earlier one (definition: a perimeter site is added)`, () => {
      const k = grown(edenTask(kind, 5000, 3));
      const p = k.positions();
      const seen = new Set<string>();
      for (let n = 0; n < p.count; n++) {
        toSite(lattice, p.coords[2 * n], p.coords[2 * n + 1]);
        const { i, j } = siteOf;
        // positions are exactly the images of integer sites
        if (lattice === SQUARE) expect([p.coords[2 * n], p.coords[2 * n + 1]]).toEqual([i, j]);
        else expect([p.coords[2 * n], p.coords[2 * n + 1]]).toEqual([i + 0.5 * j, (j * Math.sqrt(3)) / 2]);
        const key = `${i},${j}`;
        expect(seen.has(key)).toBe(false);
        if (n > 0) {
          let adjacent = false;
          for (let t = 0; t < lattice.neighbours; t++) if (seen.has(`${i + lattice.di[t]},${j + lattice.dj[t]}`)) adjacent = true;
          expect(adjacent).toBe(true);
        }
        seen.add(key);
      }
      // the perimeter counter equals the number of empty sites next to the cluster
      const perimeter = new Set<string>();
      for (const key of seen) {
        const [i, j] = key.split(',').map(Number);
        for (let t = 0; t < lattice.neighbours; t++) {
          const nk = `${i + lattice.di[t]},${j + lattice.dj[t]}`;
          if (!seen.has(nk)) perimeter.add(nk);
        }
      }
      expect(k.counters.perimeter_sites).toBe(perimeter.size);
    });
  }

  it('storage grows with the sites touched, not the bounding box: under 40 bytes per particle at 2·10^5', () => {
    // 8 × 8 tiles of int32 (4 bytes per site of a compact cluster) plus the perimeter list and the tile hash table
    const k = grown(edenTask('eden-square', 200_000)) as EdenLatticeKernel;
    expect(k.storageBytes / 200_000).toBeLessThan(40);
  });
});

describe('Eden: the growth site is uniform over the perimeter sites (exact small cases)', () => {
  // After the seed and one more site (a domino) the perimeter has 6 sites on the
  // square lattice and 8 on the triangular one (exact, by counting); Eden B picks
  // each with equal probability. Third site relative to the domino, classified up
  // to the domino's own position; chi-square at significance 0.001.
  for (const [lattice, sites] of [[SQUARE, 6], [TRIANGULAR, 8]] as [PlanarLattice, number][]) {
    it(`${lattice.name}: third site uniform over the ${sites} perimeter sites of the domino`, () => {
      const runs = sites * 800;
      const counts = new Map<string, number>();
      for (let r = 0; r < runs; r++) {
        const k = grown(edenTask(`eden-${lattice.name}`, 3, r, '99'));
        const c = k.positions().coords;
        toSite(lattice, c[2], c[3]);
        const a = { ...siteOf };
        toSite(lattice, c[4], c[5]);
        const b = { ...siteOf };
        // direction of the domino (index of a's neighbour offset) and the third site relative to the seed
        let dir = -1;
        for (let t = 0; t < lattice.neighbours; t++) if (lattice.di[t] === a.i && lattice.dj[t] === a.j) dir = t;
        expect(dir).toBeGreaterThanOrEqual(0);
        const key = `${dir}:${b.i},${b.j}`;
        counts.set(key, (counts.get(key) ?? 0) + 1);
      }
      // for each domino direction, exactly `sites` possible third sites, all seen, equally often
      let chi2 = 0;
      for (let t = 0; t < lattice.neighbours; t++) {
        const row = [...counts].filter(([key]) => key.startsWith(`${t}:`)).map(([, v]) => v);
        expect(row.length).toBe(sites);
        const total = row.reduce((x, y) => x + y, 0);
        chi2 += chiSquare(row, row.map(() => total / sites));
      }
      // sum over the directions of independent chi-square(sites − 1): compare its mean and spread
      const dof = lattice.neighbours * (sites - 1);
      // normal approximation of chi-square(dof) at significance 0.001 (one-sided z = 3.09); exact enough for dof >= 30
      expect(chi2).toBeLessThan(dof + 3.09 * Math.sqrt(2 * dof));
    });
  }

  it('off-lattice: second disk at a uniform angle, third uniform over the free 4π/3 arcs of each disk', () => {
    const runs = 4000;
    const bins2 = new Array(8).fill(0);
    const bins3 = new Array(8).fill(0);
    for (let r = 0; r < runs; r++) {
      const k = grown(edenTask('eden-offlattice-2d', 3, r, '5'));
      const c = k.positions().coords;
      const a2 = Math.atan2(c[3], c[2]);
      bins2[Math.min(7, Math.floor(((a2 + Math.PI) / (2 * Math.PI)) * 8))]++;
      // third disk: its parent is the nearer of the two (it touches it); the angle φ between
      // (third − parent) and (other − parent) is uniform on [π/3, π] in |φ| (the blocked arc is |φ| < π/3)
      const d0 = Math.hypot(c[4] - c[0], c[5] - c[1]);
      const d1 = Math.hypot(c[4] - c[2], c[5] - c[3]);
      const [p, o] = d0 < d1 ? [0, 1] : [1, 0];
      expect(Math.min(d0, d1)).toBeCloseTo(1, 12);
      expect(Math.max(d0, d1)).toBeGreaterThanOrEqual(1 - 1e-12);
      const ux = c[4] - c[2 * p];
      const uy = c[5] - c[2 * p + 1];
      const vx = c[2 * o] - c[2 * p];
      const vy = c[2 * o + 1] - c[2 * p + 1];
      const phi = Math.abs(Math.atan2(ux * vy - uy * vx, ux * vx + uy * vy));
      expect(phi).toBeGreaterThanOrEqual(Math.PI / 3 - 1e-9);
      bins3[Math.min(7, Math.floor(((phi - Math.PI / 3) / ((2 * Math.PI) / 3)) * 8))]++;
    }
    const even = new Array(8).fill(runs / 8);
    expect(chiSquare(bins2, even)).toBeLessThan(CHI2_999[7]);
    expect(chiSquare(bins3, even)).toBeLessThan(CHI2_999[7]);
  });
});

describe('off-lattice Eden: geometry and free arcs', () => {
  it('no overlaps, each disk touches an earlier one, and every free arc length matches a fine angular probe', async () => {
    const k = grown(edenTask('eden-offlattice-2d', 1500, 2)) as OffLatticeEden2d;
    const c = k.positions().coords;
    const n = k.count;
    let worst = 0;
    for (let i = 1; i < n; i++) {
      let touches = false;
      for (let j = 0; j < n; j++) {
        if (j === i) continue;
        const d = Math.hypot(c[2 * i] - c[2 * j], c[2 * i + 1] - c[2 * j + 1]);
        worst = Math.max(worst, 1 - d);
        if (j < i && Math.abs(d - 1) < 1e-9) touches = true;
      }
      expect(touches).toBe(true);
    }
    expect(worst).toBeLessThan(1e-9);
    // free arc of each disk: the share of 3600 probe angles whose disk overlaps no other, times 2π;
    // a probe grid of step δ = 2π/3600 misjudges at most one probe per gap end: |error| <= 2δ · (gaps)
    // <= 2δ · 6 (at most 6 gaps: each gap lies between blocked arcs of touching-distance neighbours)
    let blocked = 0;
    for (let i = 0; i < n; i++) {
      if (i % 200 === 0) await yieldToRunner();
      const near: number[] = [];
      for (let j = 0; j < n; j++) if (j !== i && Math.hypot(c[2 * i] - c[2 * j], c[2 * i + 1] - c[2 * j + 1]) < 2) near.push(j);
      let free = 0;
      for (let a = 0; a < 3600; a++) {
        const px = c[2 * i] + Math.cos(((a + 0.5) * Math.PI) / 1800);
        const py = c[2 * i + 1] + Math.sin(((a + 0.5) * Math.PI) / 1800);
        if (near.every((j) => Math.hypot(px - c[2 * j], py - c[2 * j + 1]) >= 1)) free++;
      }
      const probed = (free / 3600) * 2 * Math.PI;
      expect(Math.abs(probed - k.freeArcOf(i))).toBeLessThan(12 * ((2 * Math.PI) / 3600));
      if (k.freeArcOf(i) === 0) blocked++;
    }
    // the interior is closed: most disks have no free place left
    expect(blocked).toBeGreaterThan(n / 3);
  });
});

describe('Eden kernels: determinism, checkpoints, descriptors', () => {
  for (const kind of EDEN_KINDS) {
    it(`${kind}: same task, same bits; a checkpoint resumes to the same state hash and records`, () => {
      const n = kind === 'eden-offlattice-2d' ? 4000 : 20_000;
      const whole = grown(edenTask(kind, n, 4)).result();
      expect(grown(edenTask(kind, n, 4)).result()).toEqual(whole);
      expect(grown(edenTask(kind, n, 5)).result().stateHash).not.toBe(whole.stateHash);
      const first = createKernel(edenTask(kind, n, 4));
      first.growTo(Math.floor(n / 3));
      const cp: GrowthCheckpoint = structuredClone(first.checkpoint());
      const resumed = createKernel(edenTask(kind, n, 4), cp);
      expect(resumed.count).toBe(Math.floor(n / 3));
      resumed.growTo(n);
      expect(resumed.result()).toEqual(whole);
    });

    it(`${kind}: records every declared observable at every record size`, () => {
      const r = grown(edenTask(kind, 2000, 1)).result();
      const d = modelDescriptor(kind);
      expect(Object.keys(r.series.extra).sort()).toEqual(d.observables.map((o) => o.name).sort());
      for (const o of d.observables) expect(r.series.extra[o.name]).toHaveLength(r.series.sizes.length);
      expect(Object.keys(r.counters)).toEqual(d.counters.map((c) => c.name));
    });
  }

  it('a checkpoint whose positions are not a possible Eden history is refused', () => {
    const k = createKernel(edenTask('eden-square', 100));
    k.growTo(10);
    const cp = k.checkpoint();
    cp.positions[2 * 9] += 5;
    expect(() => createKernel(edenTask('eden-square', 100), cp)).toThrow(/checkpoint position 9 is not a perimeter site/);
  });

  it('a checkpoint position that is not a lattice site is refused, not rounded to the nearest site', () => {
    for (const kind of ['eden-square', 'eden-triangular']) {
      const k = createKernel(edenTask(kind, 100));
      k.growTo(10);
      const cp = k.checkpoint();
      cp.positions[2 * 9] += 0.25;
      expect(() => createKernel(edenTask(kind, 100), cp)).toThrow(/^checkpoint position 9 is not a lattice site$/);
    }
  });
});

describe('Eden: mass–radius dimension D = 2 (exact: compact clusters)', () => {
  // M(r), the number of centres within r of the seed, against r inside the cluster
  // (4 <= r <= R_max/2, where Eden clusters are compact apart from rare holes): least-squares slope of
  // log M on log r per cluster, ensemble mean of 8 clusters of 3·10^4. D = 2 exactly for compact
  // growth (Eden 1961, from memory). Tolerance: 3 standard errors of the mean slope plus 0.02 for the
  // lattice discreteness of M(r) at small r (common practice, no source). R_g(N) is not used: the
  // early clusters are elongated, so R_g/√N still drifts by 2% between N = 10^3 and 3·10^4.
  for (const kind of EDEN_KINDS) {
    it(`${kind}: D from M(r) within error of 2`, async () => {
      const slopes: number[] = [];
      const n = kind === 'eden-offlattice-2d' ? 5000 : 30_000;
      for (let r = 0; r < 8; r++) {
        await yieldToRunner();
        const res = grown(edenTask(kind, n, r, '2024')).result();
        const rMax = res.series.maxRadius.at(-1)!;
        const xs: number[] = [];
        const ys: number[] = [];
        res.massRadius.radii.forEach((rad, i) => {
          if (rad >= 4 && rad <= rMax / 2) {
            xs.push(Math.log(rad));
            ys.push(Math.log(res.massRadius.counts[i]));
          }
        });
        const mx = xs.reduce((a, b) => a + b) / xs.length;
        const my = ys.reduce((a, b) => a + b) / ys.length;
        let sxy = 0;
        let sxx = 0;
        xs.forEach((x, i) => {
          sxy += (x - mx) * (ys[i] - my);
          sxx += (x - mx) ** 2;
        });
        slopes.push(sxy / sxx);
      }
      const mean = slopes.reduce((a, b) => a + b) / slopes.length;
      const se = Math.sqrt(slopes.reduce((a, b) => a + (b - mean) ** 2, 0) / (slopes.length - 1) / slopes.length);
      expect(Math.abs(mean - 2)).toBeLessThan(3 * se + 0.02);
    });
  }
});

describe('planar anisotropy records: the one-pass recorder equals two anisotropyOf calls bit for bit', () => {
  it('on Eden, off-lattice Eden and off-lattice DLA clusters of several sizes', () => {
    for (const kind of ['eden-square', 'eden-offlattice-2d', 'dla-offlattice-2d']) {
      for (const n of [5, 60, 2500]) {
        const k = grown({ model: modelParams(kind), particles: n, ensembleSeed: '3', runIndex: 1, recordsPerDecade: 10 });
        const p = k.positions();
        const rMax = k.result().series.maxRadius.at(-1)!;
        const extra: Record<string, number[]> = {};
        recordPlanarAnisotropy(extra, p.coords, 2, n, rMax);
        for (const f of [4, 6]) {
          anisotropyOf(p.coords, 2, n, f, rMax);
          expect(extra[`fold_amplitude_${f}`][0]).toBe(anisotropy.amplitude);
          expect(extra[`axis_ratio_${f}`][0]).toBe(anisotropy.axisRatio);
        }
      }
    }
  });
});
