/**
 * The smallest min_step the float arithmetic can honour, shared by the
 * off-lattice walkers (2D and 3D) whose final approach takes straight steps
 * of length min_step.
 */
import type { GrowthTask } from './growth-kernel.js';

/**
 * The smallest min_step for a cluster of `particles`: a straight step must
 * move the walker by at least 2^12 float spacings wherever it can be. Centres
 * are never farther than particles − 1 from the origin (a chain of touching
 * unit particles, in any dimension) and walkers step near the cluster, within
 * particles + 1 + launch_margin; the spacing of doubles there is at most that
 * radius × 2^-52, so the floor is radius × 2^-40, and never below 10^-6
 * (exact arithmetic, no source needed). Returned rounded up to three
 * significant digits, as the message prints it.
 */
export function minStepFloor(particles: number, launchMargin: number): number {
  const floor = Math.max(1e-6, (particles + 1 + launchMargin) * 2 ** -40);
  let shown = Number(floor.toPrecision(3));
  if (shown < floor) shown = Number((floor * 1.005).toPrecision(3));
  return shown;
}

/** A descriptor's task check: refuses params.min_step below minStepFloor in one line naming the field, the value and the range. */
export function checkMinStepFloor(task: GrowthTask): void {
  const { min_step: minStep, launch_margin: margin } = task.model.params;
  const floor = minStepFloor(task.particles, margin);
  if (!(minStep >= floor)) {
    throw new RangeError(
      `params.min_step: ${minStep} is out of range; allowed: a number from ${floor} to 1 for ${task.particles} particles (particle diameters; a smaller step is lost in the float spacing of the coordinates)`,
    );
  }
}
