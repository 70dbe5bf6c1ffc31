/**
 * The Eden model on the square lattice (spacing 1, 4 neighbours (±1, 0), (0, ±1); site (i, j) at (i, j) in the plane).
 *
 * Exact definition ("Eden B", perimeter sites): the cluster starts as the
 * seed site (0, 0); at every step one perimeter site (an empty site with at
 * least one cluster neighbour) is chosen uniformly among all perimeter
 * sites and added. The shared kernel, its sparse storage and its
 * determinism are described in worker/models/eden-lattice/eden-lattice-kernel.ts.
 */
import type { GrowthCheckpoint, GrowthTask } from '../../core/growth-kernel.js';
import { SQUARE } from '../../lattice/planar-lattice.js';
import { EdenLatticeKernel } from '../eden-lattice/eden-lattice-kernel.js';

export class EdenSquare extends EdenLatticeKernel {
  constructor(task: GrowthTask, checkpoint?: GrowthCheckpoint) {
    super(SQUARE, task, checkpoint);
  }
}
