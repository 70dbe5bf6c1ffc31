/**
 * Version of the growth engine. A run's result depends only on (model
 * parameters, run seed, engine version): bump this whenever a change to any
 * kernel, the random generator or the observables could change a single bit
 * of a result, so that results from different engines are never mixed.
 */
// 3: dla-offlattice-3d walks with the near-distance field's tighter bound on
// the free distance (different 3D trajectories); every 2D model, lattice
// model and probe gives the same bits as under tendril-engine/2.
export const ENGINE_VERSION = 'tendril-engine/3';
