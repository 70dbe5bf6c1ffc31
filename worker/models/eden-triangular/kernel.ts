/**
 * The Eden model on the triangular lattice (spacing 1, 6 neighbours (±1, 0), (0, ±1), (1, −1), (−1, 1); site (i, j) at (i + j/2, j·√3/2) in the plane).
 *
 * Exact definition ("Eden B", perimeter sites): the cluster starts as the
 * seed site (0, 0); at every step one perimeter site (an empty site with at
 * least one cluster neighbour) is chosen uniformly among all perimeter
 * sites and added. The shared kernel, its sparse storage and its
 * determinism are described in worker/models/eden-lattice/eden-lattice-kernel.ts.
 */
import type { GrowthCheckpoint, GrowthTask } from '../../core/growth-kernel.js';
import { TRIANGULAR } from '../../lattice/planar-lattice.js';
import { EdenLatticeKernel } from '../eden-lattice/eden-lattice-kernel.js';

export class EdenTriangular extends EdenLatticeKernel {
  constructor(task: GrowthTask, checkpoint?: GrowthCheckpoint) {
    super(TRIANGULAR, task, checkpoint);
  }
}
