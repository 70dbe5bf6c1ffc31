/** The Eden model on the square lattice: the descriptor (kernel.ts states the exact definition). */
import type { ModelDescriptor } from '../../core/model-descriptor.js';
import { EdenSquare } from './kernel.js';
import { LATTICE_EDEN_PARTS } from '../eden-lattice/eden-descriptor-parts.js';

export const edenSquare: ModelDescriptor = {
  ...LATTICE_EDEN_PARTS,
  kind: 'eden-square',
  lattice: 'square',
  definition: 'sites of the square lattice (spacing 1); each step adds one perimeter site chosen uniformly among all perimeter sites (Eden B, site convention)',
  definitionFile: 'worker/models/eden-square/kernel.ts',
  create: (task, checkpoint) => new EdenSquare(task, checkpoint),
};
