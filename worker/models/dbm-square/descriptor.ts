/** The dielectric breakdown model on the square lattice with the Laplace potential: the descriptor (kernel.ts states the exact definition). */
import type { ModelDescriptor } from '../../core/model-descriptor.js';
import { PLANAR_ANISOTROPY_OBSERVABLES } from '../../core/anisotropy.js';
import { breakdownEtaParam } from '../shared-param-specs.js';
import { DbmSquare } from './kernel.js';

export const dbmSquare: ModelDescriptor = {
  kind: 'dbm-square',
  dimension: 2,
  lattice: 'square',
  definition:
    'sites of the square lattice; the discrete Laplace equation is solved with potential 0 on the cluster and 1 on a far circle; a perimeter site (empty nearest neighbour of the cluster) joins with probability proportional to its potential to the power eta (Niemeyer, Pietronero & Wiesmann 1984)',
  definitionFile: 'worker/models/dbm-square/kernel.ts',
  params: [
    breakdownEtaParam(1, 'exponent η: growth probability ∝ φ^η (0: Eden on perimeter sites; 1: harmonic measure)'),
    {
      name: 'far_factor',
      unit: '',
      default: 2,
      min: 1,
      max: 20,
      meaning: 'far boundary radius R_far = max(far_factor · R_max, R_max + far_margin); larger is closer to the boundary at infinity',
    },
    { name: 'far_margin', unit: 'lattice spacings', default: 16, min: 2, max: 1000, meaning: 'smallest gap between the cluster and the far boundary (see far_factor)' },
    {
      name: 'tolerance',
      unit: '',
      default: 1e-9,
      min: 1e-13,
      max: 1e-3,
      meaning: 'the potential solve stops when the largest residual |φ − mean of the four neighbours| is at most this',
    },
  ],
  counters: [
    { name: 'solver_iterations', meaning: 'conjugate-gradient iterations of the potential solves, all particles (0 at eta = 0: no potential is needed)' },
    { name: 'perimeter_sites', meaning: 'number of perimeter sites (empty nearest neighbours of the cluster) at the end' },
  ],
  workCounter: 'solver_iterations',
  observables: PLANAR_ANISOTROPY_OBSERVABLES,
  probe: 'lattice-sites',
  picture: 'disks',
  contactDistance: 1,
  reference: {
    dimension: null,
    bounds: [],
    context: [],
  },
  create: (task, checkpoint) => new DbmSquare(task, checkpoint),
};
