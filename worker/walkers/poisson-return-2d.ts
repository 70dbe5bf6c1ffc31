/**
 * Exact return of a far planar walker to a circle.
 *
 * Planar Brownian motion started at distance r from the centre of a circle of
 * radius R < r hits the circle with probability 1, and the angle θ of the hit
 * point measured from the start direction has the exterior Poisson-kernel
 * density (r² − R²) / (2π (r² + R² − 2 r R cos θ)): a wrapped Cauchy law with
 * concentration ρ = R / r.
 *
 * Sampling without trigonometric calls: with t = tan(θ/2), the law becomes
 * t = k·C with k = (1 − ρ)/(1 + ρ) and C standard Cauchy (substitute
 * cos θ = (1 − t²)/(1 + t²) in the density). C = v/u for (u, v) uniform in
 * the unit disk, so cos θ = (u² − k²v²)/(u² + k²v²) and
 * sin θ = 2kuv/(u² + k²v²).
 */

import type { Random } from '../core/random.js';

/** Result slots, written by `returnToCircle` (no allocation). */
export const returned = { x: 0, y: 0 };

/**
 * Move a walker at (x, y), |(x, y)| = r > radius, to the first point where a
 * Brownian path from it hits the circle |z| = radius; the point is left in
 * `returned`.
 */
export function returnToCircle(x: number, y: number, radius: number, rng: Random): void {
  const r = Math.sqrt(x * x + y * y);
  const rho = radius / r;
  const k = (1 - rho) / (1 + rho);
  let u: number, v: number, s: number;
  do {
    u = rng.nextSigned();
    v = rng.nextSigned();
    s = u * u + v * v;
  } while (s >= 1 || u === 0);
  const kv = k * v;
  const den = u * u + kv * kv;
  const c = (u * u - kv * kv) / den;
  const sn = (2 * u * kv) / den;
  const ux = x / r;
  const uy = y / r;
  returned.x = radius * (ux * c - uy * sn);
  returned.y = radius * (uy * c + ux * sn);
}

/** Angle of the returned point relative to the start direction, in (−π, π]; for tests. */
export function sampleReturnAngle(r: number, radius: number, rng: Random): number {
  returnToCircle(r, 0, radius, rng);
  return Math.atan2(returned.y, returned.x);
}
