/** What the Eden models' descriptors share: observables, reference values (no published D is needed: the cluster is compact); the lattice ones also the rest of LATTICE_EDEN_PARTS. */
import type { ModelDescriptor, ModelReference, NamedQuantity } from '../../core/model-descriptor.js';
import { PLANAR_ANISOTROPY_OBSERVABLES } from '../../core/anisotropy.js';
import { RADIAL_INTERFACE_OBSERVABLES } from '../../core/radial-interface.js';

export const EDEN_OBSERVABLES: readonly NamedQuantity[] = [...PLANAR_ANISOTROPY_OBSERVABLES, ...RADIAL_INTERFACE_OBSERVABLES];

export const EDEN_REFERENCE: ModelReference = {
  dimension: {
    value: 2,
    uncertainty: 0,
    source: 'exact: Eden clusters are compact (Eden 1961, Proc. 4th Berkeley Symp. Math. Stat. Prob. 4, 223; citation from memory)',
  },
  bounds: [],
  context: [
    { label: 'KPZ growth exponent β of the interface width (w ∝ R^β)', value: 1 / 3, source: 'Kardar, Parisi & Zhang 1986, Phys. Rev. Lett. 56, 889; radial Eden: Ferreira & Alves 2006, J. Stat. Mech. P11007 (citations from memory)' },
  ],
};

/** The descriptor of a lattice Eden model but for its lattice and definition. */
export const LATTICE_EDEN_PARTS: Omit<ModelDescriptor, 'kind' | 'lattice' | 'definition' | 'definitionFile' | 'create'> = {
  dimension: 2,
  params: [],
  counters: [{ name: 'perimeter_sites', meaning: 'number of perimeter sites (empty sites next to the cluster) at the end' }],
  workCounter: null,
  observables: EDEN_OBSERVABLES,
  probe: 'lattice-sites',
  picture: 'disks',
  contactDistance: 1,
  reference: EDEN_REFERENCE,
};
