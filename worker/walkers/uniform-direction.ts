/**
 * Uniform random direction in the plane from one 32-bit draw.
 *
 * The draw u picks the angle θ = 2π (u + ½) / 2^32, uniform on a grid of 2^32
 * angles (finer than the polar method with two 32-bit draws). cos θ and
 * sin θ come from a 4096-entry table at the angle's top 12 bits, rotated by
 * the remaining small angle δ < 2π/4096 with its Taylor series
 * cos δ = 1 − δ²/2 + δ⁴/24, sin δ = δ − δ³/6 + δ⁵/120, whose truncation
 * error (< δ⁶/720 ≈ 2·10⁻²⁰) is far below double rounding. No trigonometric
 * call in the hot loop, no rejection, no division.
 *
 * The table is computed with Math.cos/Math.sin at load time; V8's versions
 * are deterministic, so the same engine gives the same bits everywhere.
 */

import type { Random } from '../core/random.js';

const TABLE_BITS = 12;
const TABLE_SIZE = 1 << TABLE_BITS;
const LOW_BITS = 32 - TABLE_BITS;
const LOW_MASK = (1 << LOW_BITS) - 1;
/** Radians per unit of the 32-bit draw. */
const STEP = (2 * Math.PI) / 4294967296;
const COS = new Float64Array(TABLE_SIZE);
const SIN = new Float64Array(TABLE_SIZE);
for (let i = 0; i < TABLE_SIZE; i++) {
  const a = (2 * Math.PI * i) / TABLE_SIZE;
  COS[i] = Math.cos(a);
  SIN[i] = Math.sin(a);
}

/** The last direction drawn by `sampleDirection` (a unit vector). */
export const direction = { x: 1, y: 0 };

export function sampleDirection(rng: Random): void {
  const u = rng.nextInt32();
  const i = u >>> LOW_BITS;
  const d = ((u & LOW_MASK) + 0.5) * STEP;
  const d2 = d * d;
  const cd = 1 - d2 * (0.5 - d2 * (1 / 24));
  const sd = d * (1 - d2 * (1 / 6 - d2 * (1 / 120)));
  const c = COS[i];
  const s = SIN[i];
  direction.x = c * cd - s * sd;
  direction.y = s * cd + c * sd;
}
