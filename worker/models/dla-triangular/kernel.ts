/**
 * Diffusion-limited aggregation on the triangular lattice (spacing 1, 6 neighbours (±1, 0), (0, ±1), (1, −1), (−1, 1); site (i, j) at (i + j/2, j·√3/2) in the plane), with noise reduction.
 *
 * Exact definition: the cluster starts as the seed site (0, 0); a walker
 * performs the lattice's simple random walk from infinity and stops at the
 * first perimeter site it visits (an empty site with a cluster neighbour);
 * that site gets a hit, and a perimeter site joins the cluster on its m-th
 * hit (m = noise_reduction; m = 1 is plain lattice DLA). How it is simulated
 * (exact jumps by the walk's own exit law, and the two stated launch/return
 * approximations with their measured effect) is in
 * worker/models/dla-lattice/dla-lattice-kernel.ts.
 */
import type { GrowthCheckpoint, GrowthTask } from '../../core/growth-kernel.js';
import { TRIANGULAR } from '../../lattice/planar-lattice.js';
import { DlaLatticeKernel } from '../dla-lattice/dla-lattice-kernel.js';

export class DlaTriangular extends DlaLatticeKernel {
  constructor(task: GrowthTask, checkpoint?: GrowthCheckpoint) {
    super(TRIANGULAR, task, checkpoint);
  }
}
