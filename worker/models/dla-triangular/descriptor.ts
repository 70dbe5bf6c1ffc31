/** Lattice DLA on the triangular lattice with noise reduction: the descriptor (kernel.ts states the exact definition). */
import type { ModelDescriptor } from '../../core/model-descriptor.js';
import { DlaTriangular } from './kernel.js';
import { LATTICE_DLA_PARTS } from '../dla-lattice/dla-descriptor-parts.js';

export const dlaTriangular: ModelDescriptor = {
  ...LATTICE_DLA_PARTS,
  kind: 'dla-triangular',
  lattice: 'triangular',
  definition:
    'sites of the triangular lattice; each walker performs the simple random walk from infinity and stops at the first perimeter site it visits; a perimeter site joins on its noise_reduction-th hit',
  definitionFile: 'worker/models/dla-triangular/kernel.ts',
  create: (task, checkpoint) => new DlaTriangular(task, checkpoint),
};
