/**
 * The lattice walker of lattice DLA (worker/models/dla-lattice/dla-lattice-kernel.ts),
 * with the sparse storage it walks on: the cluster sites and the multi-level
 * cell distances (square lattice) or occupancy marks (triangular lattice). Shared by the growth kernel and by the lattice probe
 * (worker/probe/probe-lattice.ts), so growth and probing sample the same
 * law with the same exact jumps, launch and return.
 *
 * One walk: a walker started on the launch circle (radius R_max +
 * launchMargin about the seed site, rounded to a site) performs the
 * lattice's simple random walk, accelerated by exact jumps where no cluster
 * site is near, until it stands on a perimeter site (an empty site with a
 * cluster site among its nearest neighbours); that site is left in
 * (atI, atJ). The exact definition of the jumps, the launch and the return
 * (and the two stated approximations, launch and return) is in the kernel's
 * file header.
 */
import type { Random } from '../core/random.js';
import { STOP_CHECK_EVERY, stopRaised, type StopSignal } from '../core/stop-signal.js';
import { TiledByteGrid } from '../index/tiled-grids.js';
import { returnToCircle, returned } from '../walkers/poisson-return-2d.js';
import { direction, sampleDirection } from '../walkers/uniform-direction.js';
import { exit, halfWidthAtMost, sampleExitOf } from './square-exit-tables.js';
import { MAX_HEX_LEVEL, hexExit, sampleHexExit } from './hexagon-exit-tables.js';
import { HALF_SQRT3, type PlanarLattice, siteOf, toSite } from './planar-lattice.js';

const MARKED = 1;
const HOLDS = 2;
const SQRT1_2 = Math.SQRT1_2;
/** Distance-map levels on the square lattice: cells of side 2 … 4096. */
const SQUARE_MARK_LEVELS = 12;
/**
 * Cap C of the square lattice's cell distances: a cell stores C − c, with c
 * the Chebyshev distance in cells to the nearest cell holding a cluster
 * site, when c < C, and 0 (never written) when c >= C; C itself means the
 * cell holds a site.
 */
const DIST_CAP = 8;
/** raiseBlock values of the (2C − 1)² block around a newly held cell: C − max(|dx|, |dy|). */
const DIST_BLOCK: Uint8Array = (() => {
  const r = DIST_CAP - 1;
  const w = 2 * r + 1;
  const v = new Uint8Array(w * w);
  for (let dy = -r; dy <= r; dy++) for (let dx = -r; dx <= r; dx++) v[(dy + r) * w + dx + r] = DIST_CAP - Math.max(Math.abs(dx), Math.abs(dy));
  return v;
})();

/**
 * Lower bound on the L∞ distance from site (x, y) to every cluster site in
 * a cell of side s = 2^e at Chebyshev cell distance >= c from the walker's
 * cell (exact, derived here): such a site differs from the walker's cell by
 * at least c cells along x or along y; along x, a cell c to the right
 * starts c·s − ox sites away (ox = x mod s), one c to the left ends
 * ox + (c − 1)·s + 1 away; the same along y. So the distance is at least
 * (c − 1)·s + min(s − ox, ox + 1, s − oy, oy + 1).
 */
function cellBound(e: number, c: number, x: number, y: number): number {
  const s = 1 << e;
  const ox = x & (s - 1);
  const oy = y & (s - 1);
  let m = s - ox;
  if (ox + 1 < m) m = ox + 1;
  if (s - oy < m) m = s - oy;
  if (oy + 1 < m) m = oy + 1;
  return (c - 1) * s + m;
}

export class LatticeWalk {
  readonly lattice: PlanarLattice;
  private readonly triangular: boolean;
  /** Number of mark levels (triangular: also the largest hexagon jump level, radius 2^e). */
  private readonly maxLevel: number;
  /** 1 for cluster sites. */
  private readonly sites: TiledByteGrid;
  /** marks[e − 1]: cells of side 2^e. */
  private readonly marks: TiledByteGrid[] = [];
  private guess = 1;
  /** The perimeter site where the last walk stopped. */
  atI = 0;
  atJ = 0;
  /** Exact jumps, single steps and returns of the last walk. */
  jumps = 0;
  steps = 0;
  returns = 0;
  /** Walker moves (jumps, steps, returns) until the stop signal is read next (carried across walks). */
  private untilCheck = STOP_CHECK_EVERY;

  /** `expectedSites`: a size hint for the storage. */
  constructor(lattice: PlanarLattice, expectedSites: number) {
    this.lattice = lattice;
    this.triangular = lattice.name === 'triangular';
    this.maxLevel = this.triangular ? MAX_HEX_LEVEL : SQUARE_MARK_LEVELS;
    const expect = Math.max(16, expectedSites >> 4);
    this.sites = new TiledByteGrid(expect);
    for (let e = 1; e <= this.maxLevel; e++) this.marks.push(new TiledByteGrid(Math.max(4, expect >> (e + 1))));
  }

  /** Bytes held by the site grid and the marks. */
  get bytes(): number {
    let b = this.sites.bytes;
    for (const g of this.marks) b += g.bytes;
    return b;
  }

  /**
   * Run one walker from the launch circle of radius rMax + launchMargin to
   * its first perimeter site (left in atI, atJ); rMax is the largest plane
   * distance of a cluster site from the seed site (0, 0). The stop signal
   * is read every STOP_CHECK_EVERY moves; when it is raised the walk ends
   * at once and returns false (the caller puts its generator back to where
   * the walk began; nothing else here has changed but the move counts).
   */
  walk(rng: Random, rMax: number, launchMargin: number, stop?: StopSignal): boolean {
    return this.run(rng, rMax, launchMargin, stop, false);
  }

  /**
   * The one walk loop behind walk() and walkToCluster(): launch, exact
   * return of far walkers, exact jumps, single steps. It ends at the first
   * perimeter site (intoCluster false) or on the last site before a step
   * onto the cluster (intoCluster true); the random draws are the same
   * either way up to that end. A jump's square (hexagon) holds no site
   * within distance 1 of the cluster, so it is exact for both ends.
   */
  private run(rng: Random, rMax: number, launchMargin: number, stop: StopSignal | undefined, intoCluster: boolean): boolean {
    let untilCheck = this.untilCheck;
    const sites = this.sites;
    const lattice = this.lattice;
    const tri = this.triangular;
    const maxLevel = this.maxLevel;
    const launch = rMax + launchMargin;
    const far = 2 * launch + 64;
    const far2 = far * far;
    // lattice distance (L∞ square, hex triangular) per unit of plane distance, at least
    const perUnit = tri ? 1 : SQRT1_2;
    let jumps = 0;
    let steps = 0;
    let returns = 0;
    sampleDirection(rng);
    toSite(lattice, launch * direction.x, launch * direction.y);
    let x = siteOf.i;
    let y = siteOf.j;
    for (;;) {
      if (--untilCheck === 0) {
        untilCheck = STOP_CHECK_EVERY;
        if (stopRaised(stop)) {
          this.untilCheck = STOP_CHECK_EVERY;
          return false;
        }
      }
      const px = tri ? x + 0.5 * y : x;
      const py = tri ? y * HALF_SQRT3 : y;
      const r2 = px * px + py * py;
      if (r2 > far2) {
        returnToCircle(px, py, launch, rng);
        toSite(lattice, returned.x, returned.y);
        x = siteOf.i;
        y = siteOf.j;
        returns++;
        continue;
      }
      if (!tri) {
        // square lattice: d, a lower bound on the L∞ distance from the walker to the cluster (see the header)
        let d = this.distanceBound(x, y);
        const byRadius = Math.floor((Math.sqrt(r2) - rMax) * SQRT1_2);
        if (byRadius > d) d = byRadius;
        if (d >= 3) {
          sampleExitOf(halfWidthAtMost(d - 1), rng);
          x += exit.dx;
          y += exit.dy;
          jumps++;
          continue;
        }
      } else {
        let e = this.freeLevel(x, y);
        // radial bound: hex distance >= |w| − R_max, so a hexagon of radius floor(that) − 1 is free
        const byRadius = Math.floor((Math.sqrt(r2) - rMax) * perUnit) - 1;
        while (e < maxLevel && 2 << e <= byRadius) e++; // 2 << e = 2^(e + 1), e <= maxLevel <= 10
        if (e >= 1) {
          sampleHexExit(e, rng);
          x += hexExit.di;
          y += hexExit.dj;
          jumps++;
          continue;
        }
      }
      if (!intoCluster && this.isPerimeter(x, y)) break;
      let nx = x;
      let ny = y;
      if (tri) {
        const t = rng.nextBelow(6);
        nx += lattice.di[t];
        ny += lattice.dj[t];
      } else {
        const s = rng.nextInt32() & 3;
        if (s === 0) nx++;
        else if (s === 1) nx--;
        else if (s === 2) ny++;
        else ny--;
      }
      steps++;
      if (intoCluster && sites.get(nx, ny) !== 0) break;
      x = nx;
      y = ny;
    }
    this.atI = x;
    this.atJ = y;
    this.jumps = jumps;
    this.steps = steps;
    this.returns = returns;
    this.untilCheck = untilCheck;
    return true;
  }

  /**
   * Square lattice: a lower bound on the L∞ distance from (x, y) to the
   * cluster, from the cell distances. Finds the finest level e whose cell
   * distance c_e is below the cap (the next finer level is capped, or e = 1):
   * there the bound (c_e − 1)·2^e + … is within about 2^e of the distance,
   * and c_e >= C/2 unless e = 1; the capped level e − 1 gives a second bound
   * (c = C); the larger is returned (1 when neither says more).
   */
  private distanceBound(x: number, y: number): number {
    const marks = this.marks;
    const top = this.maxLevel;
    let e = this.guess;
    let v = marks[e - 1].get(x >> e, y >> e);
    if (v === 0) {
      while (e < top) {
        e++;
        v = marks[e - 1].get(x >> e, y >> e);
        if (v !== 0) break;
      }
    } else {
      while (e > 1) {
        const w = marks[e - 2].get(x >> (e - 1), y >> (e - 1));
        if (w === 0) break;
        e--;
        v = w;
      }
    }
    this.guess = e;
    let d = cellBound(e, DIST_CAP - v, x, y);
    if (e > 1 && v !== 0) {
      const below = cellBound(e - 1, DIST_CAP, x, y);
      if (below > d) d = below;
    }
    return d > 1 ? d : 1;
  }

  /** Triangular lattice: the largest level e (0 … maxLevel) whose cell around (x, y) is unmarked (0: none is). */
  private freeLevel(x: number, y: number): number {
    let e = this.guess;
    const marks = this.marks;
    if ((marks[e - 1].get(x >> e, y >> e) & MARKED) === 0) {
      while (e < this.maxLevel && (marks[e].get(x >> (e + 1), y >> (e + 1)) & MARKED) === 0) e++;
    } else {
      e--;
      while (e >= 1 && (marks[e - 1].get(x >> e, y >> e) & MARKED) !== 0) e--;
    }
    this.guess = e >= 1 ? e : 1;
    return e;
  }

  /** Whether (x, y) is a cluster site. */
  isSite(x: number, y: number): boolean {
    return this.sites.get(x, y) !== 0;
  }

  /** Whether (x, y) is an empty site with a cluster site among its nearest neighbours. */
  isPerimeter(x: number, y: number): boolean {
    const s = this.sites;
    if (s.get(x, y) !== 0) return false;
    const near = s.get(x + 1, y) | s.get(x - 1, y) | s.get(x, y + 1) | s.get(x, y - 1);
    return this.triangular ? (near | s.get(x + 1, y - 1) | s.get(x - 1, y + 1)) !== 0 : near !== 0;
  }

  /**
   * Run one walker from the launch circle, as walk() does (same launch,
   * return and exact jumps), but through the perimeter until it steps onto
   * a cluster site: the walk killed on entering the cluster (used by the
   * walker sampler of the lattice breakdown model,
   * worker/models/dbm-square-walkers/kernel.ts). The site it stood on just
   * before that step (an empty site with a cluster neighbour) is left in
   * (atI, atJ). The jumps stay exact: a jump's square (hexagon) of
   * half-width L holds no cluster site within distance L of its centre, so
   * the walk inside it cannot step onto the cluster before its boundary.
   * Stop signal and return value as in walk().
   */
  walkToCluster(rng: Random, rMax: number, launchMargin: number, stop?: StopSignal): boolean {
    return this.run(rng, rMax, launchMargin, stop, true);
  }

  /** Add site (x, y) to the cluster storage and marks. */
  occupy(x: number, y: number): void {
    this.sites.orBits(x, y, 1);
    if (!this.triangular) {
      for (let e = 1; e <= this.maxLevel; e++) {
        const g = this.marks[e - 1];
        const cx = x >> e;
        const cy = y >> e;
        if (g.get(cx, cy) === DIST_CAP) continue;
        g.raiseBlock(cx, cy, DIST_CAP - 1, DIST_BLOCK, 0);
      }
      return;
    }
    for (let e = 1; e <= this.maxLevel; e++) {
      const g = this.marks[e - 1];
      const cx = x >> e;
      const cy = y >> e;
      if ((g.orBits(cx, cy, HOLDS) & HOLDS) !== 0) continue;
      for (let dy = -1; dy <= 1; dy++) for (let dx = -1; dx <= 1; dx++) g.orBits(cx + dx, cy + dy, MARKED);
    }
  }
}
