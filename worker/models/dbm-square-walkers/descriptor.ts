/**
 * The lattice dielectric breakdown model with the far boundary at infinity,
 * sampled exactly by walkers: the descriptor (kernel.ts states the exact
 * definition and derives the sampler). The launch margin is the lattice
 * walkers' (dla-square's) parameter.
 */
import type { ModelDescriptor } from '../../core/model-descriptor.js';
import { PLANAR_ANISOTROPY_OBSERVABLES } from '../../core/anisotropy.js';
import { breakdownEtaParam, LATTICE_LAUNCH_MARGIN } from '../shared-param-specs.js';
import { DbmSquareWalkers, etaProblem } from './kernel.js';

export const dbmSquareWalkers: ModelDescriptor = {
  kind: 'dbm-square-walkers',
  dimension: 2,
  lattice: 'square',
  definition:
    'sites of the square lattice; a perimeter site s joins with probability proportional to u(s)^eta, u the Green\'s function of the lattice walk with pole at infinity (dbm-square with its far boundary at infinity), sampled exactly by walkers that enter the cluster; eta = 0 or 1 <= eta <= 6',
  definitionFile: 'worker/models/dbm-square-walkers/kernel.ts',
  params: [
    breakdownEtaParam(1, 'exponent η: growth probability ∝ u^η (0: Eden on perimeter sites; 1: harmonic measure; 0 < η < 1 is refused)'),
    LATTICE_LAUNCH_MARGIN,
  ],
  counters: [
    { name: 'walkers', meaning: 'walkers released, each until it steps onto the cluster (0 at eta = 0)' },
    { name: 'attempts', meaning: 'attempts to grow (proposal walkers); attempts − (particles − 1) were rejected' },
    { name: 'jumps', meaning: 'exact jumps to the exit site of a free lattice square' },
    { name: 'steps', meaning: 'single lattice steps next to the cluster' },
    { name: 'returns', meaning: 'returns of far walkers to the launch circle' },
    { name: 'perimeter_sites', meaning: 'number of perimeter sites (empty nearest neighbours of the cluster) at the end' },
  ],
  workCounter: 'jumps',
  observables: PLANAR_ANISOTROPY_OBSERVABLES,
  probe: 'lattice-sites',
  picture: 'disks',
  contactDistance: 1,
  reference: {
    dimension: null,
    bounds: [],
    context: [],
  },
  check: (task) => {
    const problem = etaProblem(task.model.params.eta, task.model.kind);
    if (problem !== null) throw new RangeError(problem);
  },
  create: (task, checkpoint) => new DbmSquareWalkers(task, checkpoint),
};
