/** What the lattice DLA descriptors share: parameters, counters, observables, references. */
import type { ModelDescriptor } from '../../core/model-descriptor.js';
import { PLANAR_ANISOTROPY_OBSERVABLES } from '../../core/anisotropy.js';
import { LATTICE_LAUNCH_MARGIN } from '../shared-param-specs.js';

export const LATTICE_DLA_PARTS: Omit<ModelDescriptor, 'kind' | 'lattice' | 'definition' | 'definitionFile' | 'create'> = {
  dimension: 2,
  params: [
    {
      name: 'noise_reduction',
      unit: '',
      default: 1,
      min: 1,
      max: 1000,
      integer: true,
      meaning: 'hits m a perimeter site needs to join (1: plain lattice DLA; Tang 1985 noise reduction for m > 1)',
    },
    LATTICE_LAUNCH_MARGIN,
  ],
  counters: [
    { name: 'walkers', meaning: 'walkers launched (m per added site on average, for noise reduction m)' },
    { name: 'jumps', meaning: 'exact jumps to the exit site of a free lattice square' },
    { name: 'steps', meaning: 'single lattice steps next to the cluster' },
    { name: 'returns', meaning: 'returns of far walkers to the launch circle' },
  ],
  workCounter: 'jumps',
  observables: PLANAR_ANISOTROPY_OBSERVABLES,
  probe: 'lattice-sites',
  picture: 'disks',
  contactDistance: 1,
  reference: {
    dimension: null,
    bounds: [
      {
        side: 'lower',
        value: 1.5,
        rule: "Kesten's bound: radius after n particles at most C n^(2/3), so D >= 3/2",
        source: 'Kesten 1987, Stoch. Proc. Appl. 25, 165',
      },
    ],
    context: [
      { label: 'off-lattice DLA dimension (small lattice clusters come close; large ones drift toward 3/2)', value: 1.71, source: 'Menshutin, Shchur & Vinokur 2008, Physica A 387, 6299; lattice drift: Loh 2014, arXiv 1407.2586; Grebenkov & Beliaev 2017, Phys. Rev. E 96, 042159' },
    ],
  },
};
