/**
 * Version of the growth engine. A run's result depends only on (model
 * parameters, run seed, engine version): bump this whenever a change to any
 * kernel, the random generator or the observables could change a single bit
 * of a result, so that results from different engines are never mixed.
 */
export const ENGINE_VERSION = 'tendril-engine/2';
