/**
 * Exact exit point of planar Brownian motion from a lens: the domain
 *   Ω = B(w, D) \ D(c, ρ)   (inside the circle C1 = ∂B(w, D), outside the disk),
 * started at its centre point w, where δ = |w − c| − ρ > 0 and
 * δ < D < δ + 2ρ (so the circles cross: Ω is bounded by an arc of the disk's
 * circle C2 and an arc of C1 meeting at two points P, Q).
 *
 * Construction (exact, conformal invariance of Brownian motion; e.g.
 * Mörters & Peres 2010, Brownian Motion, Thm 7.20): the Möbius map
 * T(z) = (z − P)/(z − Q) sends C1 and C2 to lines through 0, so Ω goes onto a
 * wedge {arg ∈ (β, β + θ)}; ζ = (e^{−iβ} T)^{π/θ} maps the wedge onto the
 * upper half-plane, where the exit point from ζ0 = X + iY is Cauchy:
 * X + Y tan(π(U − 1/2)) with U uniform (the Poisson kernel of the
 * half-plane). The sign of the exit point picks the side of the wedge (the
 * disk's arc or C1's arc); the point is mapped back by the inverse maps.
 * The exit time is not needed: a walker's first contact with a set only
 * depends on the path's trace.
 *
 * Used by the probe walkers' final approach (worker/probe/probe-2d.ts): near
 * a disk i, with every other disk at least D away, the walker's first
 * contact is with disk i at the lens exit point if it leaves through the
 * disk's arc; else it continues from the exit point on C1.
 */
import type { Random } from '../core/random.js';

/** Result of the last `lensExit`: the exit point and whether it lies on the disk's circle. */
export const lensExitPoint = { x: 0, y: 0, onDisk: false };

const TWO_PI = 2 * Math.PI;
const mod2pi = (v: number): number => v - TWO_PI * Math.floor(v / TWO_PI);

/** Sample the exit point of Brownian motion from (wx, wy) out of B(w, D) \ D(c, rho); see the header for the preconditions. */
export function lensExit(wx: number, wy: number, cx: number, cy: number, rho: number, D: number, rng: Random): void {
  const vx = cx - wx;
  const vy = cy - wy;
  const s = Math.sqrt(vx * vx + vy * vy);
  const ux = vx / s;
  const uy = vy / s;
  // intersection points of C1 (centre 0, radius D) and C2 (centre s u, radius rho), relative to w
  const a = (D * D - rho * rho + s * s) / (2 * s);
  const h = Math.sqrt(Math.max(0, D * D - a * a));
  const px = a * ux - h * uy;
  const py = a * uy + h * ux;
  const qx = a * ux + h * uy;
  const qy = a * uy - h * ux;
  // T at w (z = 0), at the disk point nearest w (z = (s − rho) u) and at the C1 point opposite the disk (z = −D u)
  let nx = -px, ny = -py, dx = -qx, dy = -qy;
  let den = dx * dx + dy * dy;
  const t0x = (nx * dx + ny * dy) / den;
  const t0y = (ny * dx - nx * dy) / den;
  const e = s - rho;
  nx = e * ux - px; ny = e * uy - py; dx = e * ux - qx; dy = e * uy - qy;
  den = dx * dx + dy * dy;
  const aDisk = Math.atan2((ny * dx - nx * dy) / den, (nx * dx + ny * dy) / den);
  nx = -D * ux - px; ny = -D * uy - py; dx = -D * ux - qx; dy = -D * uy - qy;
  den = dx * dx + dy * dy;
  const aOuter = Math.atan2((ny * dx - nx * dy) / den, (nx * dx + ny * dy) / den);
  const a0 = Math.atan2(t0y, t0x);
  const m0 = Math.sqrt(t0x * t0x + t0y * t0y);
  // the wedge: from the ray `base` counter-clockwise by theta, containing arg T(w)
  const dOuter = mod2pi(aOuter - aDisk);
  const dW = mod2pi(a0 - aDisk);
  let base: number, theta: number, phi: number, diskFirst: boolean;
  if (dW < dOuter) { base = aDisk; theta = dOuter; phi = dW; diskFirst = true; }
  else { base = aOuter; theta = TWO_PI - dOuter; phi = mod2pi(a0 - aOuter); diskFirst = false; }
  const k = Math.PI / theta;
  const mk = Math.pow(m0, k);
  const X = mk * Math.cos(k * phi);
  const Y = mk * Math.sin(k * phi);
  const t = X + Y * Math.tan(Math.PI * (rng.nextDouble() - 0.5));
  const first = t >= 0; // the ray at angle base (else base + theta)
  const mag = Math.pow(Math.abs(t), 1 / k);
  const ang = first ? base : base + theta;
  const tx = mag * Math.cos(ang);
  const ty = mag * Math.sin(ang);
  // z = (P − τ Q)/(1 − τ)
  const numx = px - (tx * qx - ty * qy);
  const numy = py - (tx * qy + ty * qx);
  const ddx = 1 - tx;
  const ddy = -ty;
  const dd = ddx * ddx + ddy * ddy;
  const zx = (numx * ddx + numy * ddy) / dd;
  const zy = (numy * ddx - numx * ddy) / dd;
  const onDisk = first === diskFirst;
  if (onDisk) {
    // put the point on the disk's circle exactly (rounding)
    const rx = wx + zx - cx;
    const ry = wy + zy - cy;
    const rr = Math.sqrt(rx * rx + ry * ry);
    lensExitPoint.x = cx + (rho * rx) / rr;
    lensExitPoint.y = cy + (rho * ry) / rr;
  } else {
    lensExitPoint.x = wx + zx;
    lensExitPoint.y = wy + zy;
  }
  lensExitPoint.onDisk = onDisk;
}
