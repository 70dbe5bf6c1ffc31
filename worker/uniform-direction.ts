/**
 * Uniform random direction in the plane without trigonometry (the polar
 * method): draw (u, v) uniform in the square [−1, 1)² until 0 < u² + v² < 1;
 * then ((u² − v²), 2uv) / (u² + v²) is the unit vector at twice the angle of
 * (u, v), which is uniform on the circle (von Neumann 1951; Marsaglia &
 * Bray 1964 for the related normal sampler; citations from memory).
 */

import type { Random } from './random.js';

/** The last direction drawn by `sampleDirection` (a unit vector). */
export const direction = { x: 1, y: 0 };

export function sampleDirection(rng: Random): void {
  let u: number, v: number, s: number;
  do {
    u = rng.nextSigned();
    v = rng.nextSigned();
    s = u * u + v * v;
  } while (s >= 1 || s === 0);
  direction.x = (u * u - v * v) / s;
  direction.y = (2 * u * v) / s;
}
