/**
 * Off-lattice dielectric breakdown model DBM(η) in the plane: the descriptor
 * (kernel.ts states the exact definition, the exact method for η >= 1 and the
 * one approximation for η < 1). The walk parameters (min_step,
 * launch_margin) and the range of η are the shared declarations of
 * shared-param-specs.ts, as in dla-offlattice-2d and dbm-square.
 */
import type { ModelDescriptor } from '../../core/model-descriptor.js';
import { OffLatticeDbm2d } from './kernel.js';
import { PLANAR_ANISOTROPY_OBSERVABLES } from '../../core/anisotropy.js';
import { breakdownEtaParam, OFF_LATTICE_MIN_STEP, offLatticeLaunchMargin } from '../shared-param-specs.js';
import { dlaOffLattice2d } from '../dla-offlattice-2d/descriptor.js';

export const dbmOffLattice2d: ModelDescriptor = {
  kind: 'dbm-offlattice-2d',
  dimension: 2,
  lattice: null,
  definition:
    'disks of diameter 1; the next disk grows on particle i with probability ω_i^η / Σ ω^η (ω = harmonic measure from infinity), at a contact point drawn from the harmonic measure restricted to i; η = 1 is DLA',
  definitionFile: 'worker/models/dbm-offlattice-2d/kernel.ts',
  params: [
    breakdownEtaParam(2, 'the power η of the harmonic measure (0: exposed particles equally likely, 1: DLA, larger: sparser)'),
    {
      name: 'recurrence_cap',
      unit: 'walkers',
      default: 1024,
      min: 2,
      max: 1_000_000,
      integer: true,
      meaning: 'for η < 1 only: most walkers timing the recurrence of hits on the proposed particle (the one approximation there; larger is more exact and slower)',
    },
    {
      name: 'method',
      unit: '',
      default: 1,
      min: 0,
      max: 1,
      integer: true,
      meaning: 'for η > 1 only: 0 the exact method (fresh walkers, about 1/Σ ω^η walkers per particle), 1 the history method (ω^(η−1) estimated from recurrence gaps of earlier walker hits; approximate and much faster; kernel.ts states the approximations)',
    },
    {
      name: 'history_extra_gaps',
      unit: 'recurrence gaps',
      default: 0,
      min: 0,
      max: 32,
      integer: true,
      meaning: 'history method only: recurrence gaps per estimate beyond the least that gives a bounded unbiased estimate, floor(η − 1) + 1 (more: less noise, staler)',
    },
    {
      name: 'history_headroom',
      unit: '',
      default: 64,
      min: 1,
      max: 1_000_000,
      meaning: 'history method only: the acceptance normaliser H is this times the running mean of the estimates of ω^(η−1) over recent proposals, at most 1; estimates above H are cut to H (larger: fewer cut, more walkers)',
    },
    OFF_LATTICE_MIN_STEP,
    offLatticeLaunchMargin('circle'),
  ],
  counters: [
    { name: 'walkers', meaning: 'walkers released (every attempt uses one or more)' },
    { name: 'attempts', meaning: 'attempts to grow (proposal walkers); attempts − (particles − 1) were rejected' },
    { name: 'jumps', meaning: 'walk-on-spheres jumps (uniform exits from free disks)' },
    { name: 'short_steps', meaning: 'straight final steps next to the cluster' },
    { name: 'returns', meaning: 'returns of far walkers to the launch circle by the exact Poisson kernel' },
    { name: 'capped', meaning: 'history method: accepted attempts whose estimate of ω^(η−1) exceeded the normaliser (their weight was cut to the normaliser)' },
  ],
  workCounter: 'jumps',
  observables: PLANAR_ANISOTROPY_OBSERVABLES,
  probe: 'disks-2d',
  picture: 'disks',
  contactDistance: 1,
  reference: {
    // D depends on η; published values are not quoted for η ≠ 1 (see the README).
    dimension: null,
    bounds: [],
    context: [
      {
        label: 'DLA value (applies at η = 1 only)',
        value: 1.71,
        source: 'Menshutin, Shchur & Vinokur 2008, Physica A 387, 6299 (off-lattice DLA, 1000 clusters of 5e7 particles)',
      },
    ],
  },
  // the walk's own checks (min_step, launch_margin against the particle count) are DLA's
  check: (task) => dlaOffLattice2d.check?.(task),
  create: (task, checkpoint) => new OffLatticeDbm2d(task, checkpoint),
};
