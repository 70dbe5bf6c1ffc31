/**
 * One growth walker of a planar off-lattice cluster of unit-diameter disks,
 * from the launch circle to its first contact. It is the walk of
 * dla-offlattice-2d (worker/models/dla-offlattice-2d/kernel.ts states it in
 * full), shared with dbm-offlattice-2d, whose every walker is this walk:
 *  - launch at a uniform point of the circle of radius R_max + 1 + launch_margin;
 *  - a walker outside that circle goes back to it by the exact Poisson return
 *    (worker/walkers/poisson-return-2d.ts);
 *  - walk-on-spheres: a jump to the exact uniform exit point of the free disk
 *    around the walker (radius from the occupancy index, or r − R_max − 1
 *    when larger) while it is at least min_step;
 *  - next to the cluster, straight steps of min_step, stopping at the first
 *    contact (worker/walkers/segment-contact-2d.ts).
 * Random numbers are drawn in this order (the state hashes of both models
 * depend on it): launch direction; per step, the Poisson return's draws when
 * outside, then one direction.
 *
 * The stop signal is read every STOP_CHECK_EVERY steps; `steps` counts the
 * steps of the current particle at those reads (the kernel zeroes it when a
 * particle begins, so for a breakdown-model particle it spans all its
 * walkers), and a particle past `maxSteps` throws WalkerStuck. The walk
 * allocates nothing: its results are left in fields.
 */

import type { OccupancyIndex2d } from '../index/occupancy-index-2d.js';
import type { Random } from '../core/random.js';
import { returnToCircle, returned } from './poisson-return-2d.js';
import { direction, sampleDirection } from './uniform-direction.js';
import { contact, firstContact } from './segment-contact-2d.js';
import { STOP_CHECK_EVERY, walkInterrupted, type StopSignal } from '../core/stop-signal.js';

/** `walk`'s answer when the stop signal interrupted it. */
export const WALK_STOPPED = -1;

export class PlanarGrowthWalk {
  /** Work of the last walk. */
  jumps = 0;
  shortSteps = 0;
  returns = 0;
  /** Contact point of the last walk (the new disk's centre). */
  hitX = 0;
  hitY = 0;
  /** Steps of the current particle counted at the stop reads; the kernel zeroes it when a particle begins. */
  steps = 0;
  /** Steps until the stop signal is read next (carried across walkers and particles). */
  private untilCheck = STOP_CHECK_EVERY;

  constructor(
    private readonly index: OccupancyIndex2d,
    private readonly rng: Random,
    private readonly minStep: number,
    private readonly launchMargin: number,
    private readonly runIndex: number,
    private readonly maxSteps: number,
  ) {}

  /**
   * Walk one walker on the cluster of maximum centre radius `rMax` until it
   * touches a disk: the arrival index of that disk (contact point in
   * hitX/hitY, work in jumps/shortSteps/returns), or WALK_STOPPED when the
   * stop signal is raised (the caller puts its generator back). `particle`
   * (1-based number of the particle being built) only names it in the stuck
   * message.
   */
  walk(rMax: number, stop: StopSignal | undefined, particle: number): number {
    const rng = this.rng;
    const index = this.index;
    const minStep = this.minStep;
    let untilCheck = this.untilCheck;
    const launch = rMax + 1 + this.launchMargin;
    const launch2 = launch * launch;
    let jumps = 0;
    let shortSteps = 0;
    let returns = 0;
    let hit: number;

    // uniform point on the launch circle
    sampleDirection(rng);
    let wx = launch * direction.x;
    let wy = launch * direction.y;

    for (;;) {
      if (--untilCheck === 0) {
        untilCheck = STOP_CHECK_EVERY;
        this.steps += STOP_CHECK_EVERY;
        if (walkInterrupted(stop, this.steps, this.maxSteps, this.runIndex, particle, Math.sqrt(wx * wx + wy * wy), minStep)) {
          this.untilCheck = STOP_CHECK_EVERY;
          return WALK_STOPPED;
        }
      }
      let r2 = wx * wx + wy * wy;
      if (r2 > launch2) {
        returnToCircle(wx, wy, launch, rng);
        wx = returned.x;
        wy = returned.y;
        r2 = launch2;
        returns++;
      }
      index.query(wx, wy);
      let d = index.free;
      // the disk of radius r − R_max − 1 around the walker is free too
      const reach = rMax + 1 + d;
      if (r2 > reach * reach) d = Math.sqrt(r2) - rMax - 1;

      sampleDirection(rng);
      const cx = direction.x;
      const cy = direction.y;

      if (d >= minStep) {
        // walk-on-spheres: exact exit point of the free disk of radius d
        wx += d * cx;
        wy += d * cy;
        jumps++;
        continue;
      }

      // Final approach: straight step of length minStep, stopping at the
      // first contact. Every centre within 1 + minStep is in index.nearX/Y
      // (d < minStep <= 1 means the exact scan answered).
      const j = firstContact(index.nearX, index.nearY, index.nearCount, wx, wy, cx, cy, minStep, null, null);
      shortSteps++;
      if (j >= 0) {
        wx += contact.t * cx;
        wy += contact.t * cy;
        hit = index.nearId[j];
        break;
      }
      wx += minStep * cx;
      wy += minStep * cy;
    }

    this.jumps = jumps;
    this.shortSteps = shortSteps;
    this.returns = returns;
    this.untilCheck = untilCheck;
    this.hitX = wx;
    this.hitY = wy;
    return hit;
  }
}
