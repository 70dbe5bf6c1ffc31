/**
 * Exact fate of a far walker in three dimensions: return to a sphere or escape.
 *
 * Brownian motion in R^3 started at distance r from the centre of a sphere of
 * radius R < r ever hits the sphere with probability R / r (the function R/|x|
 * is harmonic outside the ball, 1 on the sphere and 0 at infinity). Given that
 * it hits, the hit point y has the exterior Poisson kernel of the ball as its
 * density with respect to surface area, ∝ (r² − R²) / |x − y|³ (Kellogg 1929,
 * "Foundations of Potential Theory", ch. IX; exact).
 *
 * Sampling the hit point: with θ the polar angle of y about the direction of
 * x and u = cos θ, |x − y|² = A − B u with A = r² + R², B = 2 r R, and the
 * area element is 2π R² du, so u has density ∝ (A − B u)^(-3/2) on [−1, 1].
 * Its CDF is F(u) = ((A − B u)^(-1/2) − 1/(r + R)) / (1/(r − R) − 1/(r + R)),
 * so inverting at a uniform V gives the distance s = |x − y| directly:
 * 1/s = 1/(r + R) + V (1/(r − R) − 1/(r + R)), and u = (A − s²)/B. The
 * azimuth about x is uniform (symmetry). The frame around x is the branchless
 * orthonormal basis of Duff et al. 2017 (J. Computer Graphics Techniques 6, 1).
 */

import type { Random } from '../core/random.js';
import { direction, sampleDirection } from './uniform-direction.js';

/** Result slots, written by `returnToSphere` when it returns true (no allocation). */
export const returned3 = { x: 0, y: 0, z: 0 };

/**
 * Walker at (x, y, z), |(x, y, z)| = r > radius: returns false when its
 * Brownian path never hits the sphere |p| = radius (probability 1 − radius/r),
 * else true with the first hit point in `returned3`.
 */
export function returnToSphere(x: number, y: number, z: number, radius: number, rng: Random): boolean {
  const r = Math.sqrt(x * x + y * y + z * z);
  if (rng.nextDouble() * r >= radius) return false;
  const a = 1 / (r + radius);
  const inv = a + rng.nextDouble() * (1 / (r - radius) - a);
  const s = 1 / inv;
  let u = (r * r + radius * radius - s * s) / (2 * r * radius);
  if (u > 1) u = 1;
  else if (u < -1) u = -1;
  const w = Math.sqrt(1 - u * u);
  sampleDirection(rng);
  const nx = x / r;
  const ny = y / r;
  const nz = z / r;
  // orthonormal e1, e2 perpendicular to n (Duff et al. 2017)
  const sign = nz >= 0 ? 1 : -1;
  const aa = -1 / (sign + nz);
  const bb = nx * ny * aa;
  const e1x = 1 + sign * nx * nx * aa;
  const e1y = sign * bb;
  const e1z = -sign * nx;
  const e2x = bb;
  const e2y = sign + ny * ny * aa;
  const e2z = -ny;
  const c = w * direction.x;
  const d = w * direction.y;
  returned3.x = radius * (u * nx + c * e1x + d * e2x);
  returned3.y = radius * (u * ny + c * e1y + d * e2y);
  returned3.z = radius * (u * nz + c * e1z + d * e2z);
  return true;
}
