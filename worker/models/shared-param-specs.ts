/**
 * Parameter declarations that several model descriptors share, so that a
 * range or a unit is stated once: the breakdown exponent η of the DBM
 * models, the launch margin of the walker models (lattice, and off-lattice
 * in 2D and 3D) and the off-lattice walkers' final step length. Each
 * descriptor lists them in its own `params` in the order it wants.
 */
import type { ParamSpec } from '../core/model-descriptor.js';

/** η of a dielectric breakdown model, 0 to 6; `meaning` says what φ^η weighs in that model and which η it refuses. */
export function breakdownEtaParam(defaultEta: number, meaning: string): ParamSpec {
  return { name: 'eta', unit: '', default: defaultEta, min: 0, max: 6, meaning };
}

/** launch_margin of the lattice walkers (dla-square, dla-triangular, dbm-square-walkers). */
export const LATTICE_LAUNCH_MARGIN: ParamSpec = {
  name: 'launch_margin',
  unit: 'lattice spacings',
  default: 8,
  min: 2,
  max: 1000,
  meaning: 'launch circle radius minus the largest site distance; the lattice launch law is uniform only approximately, larger is more exact',
};

/** launch_margin of the off-lattice walkers, launched from a circle (2D) or a sphere (3D). */
export function offLatticeLaunchMargin(launchFrom: 'circle' | 'sphere'): ParamSpec {
  return {
    name: 'launch_margin',
    unit: 'particle diameters',
    default: 2,
    min: 0,
    minOpen: true,
    max: 1000,
    meaning: `launch ${launchFrom} radius minus (maximum radius + 1); any value is exact, it only changes speed`,
  };
}

/** min_step of the off-lattice walkers (2D and 3D). */
export const OFF_LATTICE_MIN_STEP: ParamSpec = {
  name: 'min_step',
  unit: 'particle diameters',
  default: 0.02,
  min: 0,
  minOpen: true,
  max: 1,
  meaning: 'length of the straight final steps within this distance of contact (the one approximation; smaller is more exact)',
};
