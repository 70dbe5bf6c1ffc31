/**
 * Diffusion-limited aggregation on the square lattice (spacing 1, 4 neighbours; site (i, j) at (i, j) in the plane), with noise reduction.
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
import { SQUARE } from '../../lattice/planar-lattice.js';
import { DlaLatticeKernel } from '../dla-lattice/dla-lattice-kernel.js';

export class DlaSquare extends DlaLatticeKernel {
  constructor(task: GrowthTask, checkpoint?: GrowthCheckpoint) {
    super(SQUARE, task, checkpoint);
  }
}
