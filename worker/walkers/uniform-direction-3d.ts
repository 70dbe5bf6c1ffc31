/**
 * Uniform random direction in three dimensions from two 32-bit draws.
 *
 * Archimedes' hat-box theorem: for a uniform point on the unit sphere the
 * z coordinate is uniform on [−1, 1] and the azimuth is uniform and
 * independent of it. z = (u + ½)·2^-31 for a signed 32-bit draw u (a grid of
 * 2^32 values symmetric about 0), and the azimuth comes from the planar
 * table method of worker/walkers/uniform-direction.ts (one more draw). No
 * rejection, no trigonometric call.
 */

import type { Random } from '../core/random.js';
import { direction, sampleDirection } from './uniform-direction.js';

/** The last direction drawn by `sampleDirection3d` (a unit vector). */
export const direction3 = { x: 0, y: 0, z: 1 };

export function sampleDirection3d(rng: Random): void {
  const z = (rng.nextInt32() + 0.5) * 4.656612873077393e-10; // 2^-31
  const s = Math.sqrt(1 - z * z);
  sampleDirection(rng);
  direction3.x = s * direction.x;
  direction3.y = s * direction.y;
  direction3.z = z;
}
