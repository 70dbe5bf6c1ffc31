/** Lattice DLA on the square lattice with noise reduction: the descriptor (kernel.ts states the exact definition). */
import type { ModelDescriptor } from '../../core/model-descriptor.js';
import { DlaSquare } from './kernel.js';
import { LATTICE_DLA_PARTS } from '../dla-lattice/dla-descriptor-parts.js';

export const dlaSquare: ModelDescriptor = {
  ...LATTICE_DLA_PARTS,
  kind: 'dla-square',
  lattice: 'square',
  definition:
    'sites of the square lattice; each walker performs the simple random walk from infinity and stops at the first perimeter site it visits; a perimeter site joins on its noise_reduction-th hit',
  definitionFile: 'worker/models/dla-square/kernel.ts',
  create: (task, checkpoint) => new DlaSquare(task, checkpoint),
};
