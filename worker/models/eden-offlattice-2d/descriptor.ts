/** The off-lattice Eden model in the plane: the descriptor (kernel.ts states the exact definition). */
import type { ModelDescriptor } from '../../core/model-descriptor.js';
import { OffLatticeEden2d } from './kernel.js';
import { EDEN_OBSERVABLES, EDEN_REFERENCE } from '../eden-lattice/eden-descriptor-parts.js';

export const edenOffLattice2d: ModelDescriptor = {
  kind: 'eden-offlattice-2d',
  dimension: 2,
  lattice: null,
  definition:
    'disks of diameter 1; each new disk touches the cluster at a place drawn uniformly (in arc length) from the free parts of the unit circles around the centres, overlapping no disk',
  definitionFile: 'worker/models/eden-offlattice-2d/kernel.ts',
  params: [],
  counters: [{ name: 'redraws', meaning: 'contact places drawn again because rounding at an arc end made the new disk overlap one (a null set; normally 0 or a few)' }],
  workCounter: null,
  observables: EDEN_OBSERVABLES,
  probe: null,
  picture: 'disks',
  contactDistance: 1,
  reference: EDEN_REFERENCE,
  create: (task, checkpoint) => new OffLatticeEden2d(task, checkpoint),
};
