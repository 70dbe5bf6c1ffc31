/** The Eden model on the triangular lattice: the descriptor (kernel.ts states the exact definition). */
import type { ModelDescriptor } from '../../core/model-descriptor.js';
import { EdenTriangular } from './kernel.js';
import { LATTICE_EDEN_PARTS } from '../eden-lattice/eden-descriptor-parts.js';

export const edenTriangular: ModelDescriptor = {
  ...LATTICE_EDEN_PARTS,
  kind: 'eden-triangular',
  lattice: 'triangular',
  definition: 'sites of the triangular lattice (spacing 1); each step adds one perimeter site chosen uniformly among all perimeter sites (Eden B, site convention)',
  definitionFile: 'worker/models/eden-triangular/kernel.ts',
  create: (task, checkpoint) => new EdenTriangular(task, checkpoint),
};
