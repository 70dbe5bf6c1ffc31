/**
 * Finding the empty regions a new cluster site encloses, on the potential
 * grid (worker/models/dbm-square/potential-grid.ts), so that their exact
 * potential, 0, is used instead of whatever an iterative solve would leave
 * there (for small η the weight φ^η of a site with a tiny but wrong φ is not
 * small).
 *
 * Empty sites are connected through nearest neighbours. Before the site s
 * was added, its empty region reached the far boundary (growth happens only
 * where φ > 0, i.e. outside holes). Removing s can split that region only
 * into parts that each contain an empty nearest neighbour of s, and two such
 * neighbours that share an empty corner site of s's 3 × 3 block stay
 * connected. So when the empty neighbours of s fall into two or more groups
 * by that local rule, one breadth-first search per group runs in lock step
 * (one site per group per round): a search that reaches a site farther than
 * R_max + 2 from the seed (outside every cluster site's reach) is open, two
 * searches that meet belong to one region, and a region whose searches all
 * run out of sites is enclosed. Exactly one region is open, so the searches
 * stop when every other region has run out; the sites of the enclosed
 * regions become HOLE (φ = 0, never grown into for η > 0). The cost is of
 * the order of the smaller regions' areas, never more than the disk's.
 */
import { EMPTY, HOLE, type PotentialGrid } from './potential-grid.js';

const ROUND_I = Int32Array.of(1, 1, 0, -1, -1, -1, 0, 1);
const ROUND_J = Int32Array.of(0, 1, 1, 1, 0, -1, -1, -1);

export class EnclosedRegions {
  /** Visit stamps per box site (label = base + group); reallocated with the box. */
  private stamp = new Int32Array(0);
  private base = 1;
  private queues: Int32Array[] = [new Int32Array(64), new Int32Array(64), new Int32Array(64), new Int32Array(64)];
  private readonly heads = new Int32Array(4);
  private readonly tails = new Int32Array(4);
  private readonly parent = new Int32Array(4);
  private readonly open = new Uint8Array(4);
  private readonly running = new Uint8Array(4);
  private readonly ring = new Uint8Array(8);
  private readonly joined = new Uint8Array(8);
  private readonly seeds = new Int32Array(4);
  /** Sites marked HOLE so far (for counters and tests). */
  holeSites = 0;

  /** After site (i, j) joined the cluster (grid.kind already CLUSTER): mark the empty regions it encloses as HOLE. */
  afterJoin(grid: PotentialGrid, i: number, j: number, rMax: number): void {
    // the 8 sites around s in cyclic order E, NE, N, NW, W, SW, S, SE; the 4-neighbours are the even positions
    const ring = this.ring;
    for (let k = 0; k < 8; k++) ring[k] = this.isEmpty(grid, i + ROUND_I[k], j + ROUND_J[k]) ? 1 : 0;
    // one empty neighbour per local group: neighbours joined through empty corners of the 3 × 3 block share a group
    const joined = this.joined;
    joined.fill(0);
    const seeds = this.seeds;
    let count = 0;
    for (let k = 0; k < 8; k += 2) {
      if (ring[k] === 0 || joined[k] === 1) continue;
      seeds[count++] = k;
      joined[k] = 1;
      for (let dir = 1; dir >= -1; dir -= 2) {
        let m = k;
        for (;;) {
          const corner = (m + dir + 8) & 7;
          const next = (m + 2 * dir + 8) & 7;
          if (ring[corner] === 0 || ring[next] === 0 || joined[next] === 1) break;
          joined[next] = 1;
          m = next;
        }
      }
    }
    if (count < 2) return;
    this.search(grid, i, j, count, rMax);
  }

  private isEmpty(grid: PotentialGrid, i: number, j: number): boolean {
    const h = grid.half;
    if (i < -h || i > h || j < -h || j > h) return true;
    return grid.kind[grid.index(i, j)] === EMPTY;
  }

  private search(grid: PotentialGrid, si: number, sj: number, g: number, rMax: number): void {
    const seeds = this.seeds;
    const side = grid.side;
    const half = grid.half;
    if (this.stamp.length !== side * side) {
      this.stamp = new Int32Array(side * side);
      this.base = 1;
    }
    if (this.base > 0x7ffffff0) {
      this.stamp.fill(0);
      this.base = 1;
    }
    const base = this.base;
    this.base += 4;
    const stamp = this.stamp;
    const kind = grid.kind;
    const reach = rMax + 2;
    const reach2 = reach * reach;
    for (let a = 0; a < g; a++) {
      this.heads[a] = 0;
      this.tails[a] = 0;
      this.parent[a] = a;
      this.open[a] = 0;
      this.running[a] = 1;
      const i = si + ROUND_I[seeds[a]];
      const j = sj + ROUND_J[seeds[a]];
      if (i * i + j * j > reach2) {
        this.open[a] = 1;
        this.running[a] = 0;
        continue;
      }
      const idx = (j + half) * side + (i + half);
      stamp[idx] = base + a;
      this.push(a, idx);
    }
    const find = (a: number): number => {
      while (this.parent[a] !== a) a = this.parent[a];
      return a;
    };
    for (;;) {
      // resolve: a class is open when any member reached far; done when no member runs
      let unresolved = 0;
      let anyOpen = false;
      for (let a = 0; a < g; a++) {
        if (find(a) !== a) continue;
        let isOpen = false;
        let runs = false;
        for (let b = 0; b < g; b++) {
          if (find(b) !== a) continue;
          if (this.open[b]) isOpen = true;
          if (this.running[b]) runs = true;
        }
        if (isOpen) anyOpen = true;
        else if (runs) unresolved++;
      }
      if (unresolved === 0 || (!anyOpen && unresolved === 1)) break;
      for (let a = 0; a < g; a++) {
        if (!this.running[a]) continue;
        const root = find(a);
        let classOpen = false;
        for (let b = 0; b < g; b++) if (find(b) === root && this.open[b]) classOpen = true;
        if (classOpen) {
          this.running[a] = 0;
          continue;
        }
        if (this.heads[a] === this.tails[a]) {
          this.running[a] = 0;
          continue;
        }
        const idx = this.queues[a][this.heads[a]++];
        const ci = (idx % side) - half;
        const cj = ((idx / side) | 0) - half;
        for (let k = 0; k < 8; k += 2) {
          const ni = ci + ROUND_I[k];
          const nj = cj + ROUND_J[k];
          if (ni * ni + nj * nj > reach2) {
            this.open[a] = 1;
            break;
          }
          const n = (nj + half) * side + (ni + half);
          if (kind[n] !== EMPTY) continue;
          const s = stamp[n];
          if (s >= base && s < base + 4) {
            const other = s - base;
            const ra = find(a);
            const rb = find(other);
            if (ra !== rb) this.parent[rb] = ra;
            continue;
          }
          stamp[n] = base + a;
          this.push(a, n);
        }
      }
    }
    // enclosed classes: not open and nothing running; their visited sites become holes
    for (let a = 0; a < g; a++) {
      const root = find(a);
      let classOpen = false;
      let runs = false;
      for (let b = 0; b < g; b++) {
        if (find(b) !== root) continue;
        if (this.open[b]) classOpen = true;
        if (this.running[b]) runs = true;
      }
      if (classOpen || runs) continue;
      const queue = this.queues[a];
      for (let t = 0; t < this.tails[a]; t++) {
        const idx = queue[t];
        kind[idx] = HOLE;
        grid.phi[idx] = 0;
        this.holeSites++;
      }
    }
  }

  private push(a: number, idx: number): void {
    if (this.tails[a] === this.queues[a].length) {
      const bigger = new Int32Array(2 * this.queues[a].length);
      bigger.set(this.queues[a]);
      this.queues[a] = bigger;
    }
    this.queues[a][this.tails[a]++] = idx;
  }
}
