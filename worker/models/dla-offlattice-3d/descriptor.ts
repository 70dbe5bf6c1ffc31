/**
 * Off-lattice DLA in three dimensions: the descriptor (kernel.ts states the
 * exact definition and how it is simulated).
 */
import type { ModelDescriptor } from '../../core/model-descriptor.js';
import { OffLatticeDla3d } from './kernel.js';
import { checkMinStepFloor } from '../../core/min-step-floor.js';
import { OFF_LATTICE_MIN_STEP, offLatticeLaunchMargin } from '../shared-param-specs.js';

export const dlaOffLattice3d: ModelDescriptor = {
  kind: 'dla-offlattice-3d',
  dimension: 3,
  lattice: null,
  definition: 'balls of diameter 1; each new ball\'s centre performs Brownian motion in 3D from infinity and sticks where its ball first touches the cluster',
  definitionFile: 'worker/models/dla-offlattice-3d/kernel.ts',
  params: [
    OFF_LATTICE_MIN_STEP,
    offLatticeLaunchMargin('sphere'),
  ],
  counters: [
    { name: 'jumps', meaning: 'walk-on-spheres jumps (uniform exits from free balls)' },
    { name: 'short_steps', meaning: 'straight final steps next to the cluster' },
    { name: 'returns', meaning: 'returns of far walkers to the launch sphere by the exact Poisson kernel' },
    { name: 'escapes', meaning: 'far walkers that never return (probability 1 − R_L/r), replaced by fresh launches' },
  ],
  workCounter: 'jumps',
  observables: [],
  probe: 'balls-3d',
  picture: 'spheres-3d',
  contactDistance: 1,
  reference: {
    dimension: {
      value: 2.495,
      uncertainty: 0.005,
      source: 'Tolman & Meakin 1989, Phys. Rev. A 40, 428 (off-lattice DLA in 3D; citation from memory)',
    },
    bounds: [
      {
        side: 'lower',
        value: 2,
        rule: 'Kesten-type bound in 3D: radius after n particles at most C n^(1/2) up to a logarithmic factor, so D >= 2',
        source: 'Kesten 1987, Stoch. Proc. Appl. 25, 165; the best known 3D form is due to Lawler, as stated by Losev & Smirnov 2025, Commun. Math. Phys. 406, 93 (proved on Z^3; the exponent 1/2 up to logarithms from memory)',
      },
    ],
    context: [
      { label: 'mean-field value (d² + 1)/(d + 1)', value: 5 / 2, source: 'Muthukumar 1983, Phys. Rev. Lett. 50, 839 (citation from memory)' },
    ],
  },
  check: checkMinStepFloor,
  create: (task, checkpoint) => new OffLatticeDla3d(task, checkpoint),
};
