/** The Eden model on the square lattice: the descriptor (kernel.ts states the exact definition). */
import type { ModelDescriptor } from '../../core/model-descriptor.js';
import { EdenSquare } from './kernel.js';
import { EDEN_OBSERVABLES, EDEN_REFERENCE } from '../eden-lattice/eden-descriptor-parts.js';

export const edenSquare: ModelDescriptor = {
  kind: 'eden-square',
  dimension: 2,
  lattice: 'square',
  definition: 'sites of the square lattice (spacing 1); each step adds one perimeter site chosen uniformly among all perimeter sites (Eden B, site convention)',
  definitionFile: 'worker/models/eden-square/kernel.ts',
  params: [],
  counters: [{ name: 'perimeter_sites', meaning: 'number of perimeter sites (empty sites next to the cluster) at the end' }],
  workCounter: null,
  observables: EDEN_OBSERVABLES,
  probe: 'lattice-sites',
  picture: 'disks',
  contactDistance: 1,
  reference: EDEN_REFERENCE,
  create: (task, checkpoint) => new EdenSquare(task, checkpoint),
};
