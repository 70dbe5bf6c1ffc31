/**
 * A deliberately simple reference for the off-lattice 2D DLA kernel, for
 * tests only: the same model (worker/models/dla-offlattice-2d/kernel.ts header), simulated
 * with no acceleration at all. Every move is a straight step of fixed length
 * `step` in a uniform direction (drawn with cos/sin, not the kernel's polar
 * sampler); contact is found exactly along the step by brute force over the
 * disks of a plain dense grid; a walker that goes beyond R_L + 2 is returned
 * to the launch circle R_L = R_max + 3 with the wrapped Cauchy law, sampled
 * here by the inverse CDF θ = 2 atan(((1 − ρ)/(1 + ρ)) tan(π(u − ½)))
 * (an independent formula from the kernel's trig-free sampler). Nothing is
 * shared with the kernel but the random generator.
 */

import { Random } from '../../worker/core/random.js';

export function growReference(particles: number, seed: string, runIndex: number, step: number): { x: Float64Array; y: Float64Array; rg: number } {
  const rng = Random.forRun(seed, runIndex, 7);
  const x = new Float64Array(particles);
  const y = new Float64Array(particles);
  // dense grid of cells of side 1.25 (>= 1 + step) holding particle lists,
  // big enough for any cluster of this size
  const side = 1.25;
  if (step > side - 1) throw new RangeError(`reference step must be at most ${side - 1}, got ${step}`);
  const half = Math.ceil(4 * Math.pow(particles, 0.62) + 20);
  const width = 2 * half;
  const head = new Int32Array(width * width).fill(-1);
  const next = new Int32Array(particles);
  const cellOf = (px: number, py: number) => (Math.floor(py / side) + half) * width + (Math.floor(px / side) + half);
  let n = 0;
  let rMax = 0;
  const add = (px: number, py: number) => {
    x[n] = px;
    y[n] = py;
    const c = cellOf(px, py);
    next[n] = head[c];
    head[c] = n;
    rMax = Math.max(rMax, Math.sqrt(px * px + py * py));
    n++;
  };
  add(0, 0);
  while (n < particles) {
    const launch = rMax + 3;
    const far = launch + 2;
    let a = 2 * Math.PI * rng.nextDouble();
    let wx = launch * Math.cos(a);
    let wy = launch * Math.sin(a);
    for (;;) {
      const r = Math.sqrt(wx * wx + wy * wy);
      if (r > far) {
        const rho = launch / r;
        const theta = 2 * Math.atan(((1 - rho) / (1 + rho)) * Math.tan(Math.PI * (rng.nextDouble() - 0.5)));
        const phi = Math.atan2(wy, wx) + theta;
        wx = launch * Math.cos(phi);
        wy = launch * Math.sin(phi);
      }
      a = 2 * Math.PI * rng.nextDouble();
      const ux = Math.cos(a);
      const uy = Math.sin(a);
      // first contact along the step: smallest t in [0, step] with |w + t u − p| = 1
      let tHit = Infinity;
      if (r < rMax + 1 + step + 1e-9) {
        const cx = Math.floor(wx / side);
        const cy = Math.floor(wy / side);
        for (let gy = cy - 1; gy <= cy + 1; gy++)
          for (let gx = cx - 1; gx <= cx + 1; gx++) {
            for (let p = head[(gy + half) * width + gx + half]; p >= 0; p = next[p]) {
              const qx = wx - x[p];
              const qy = wy - y[p];
              const b = qx * ux + qy * uy;
              const c = qx * qx + qy * qy - 1;
              const disc = b * b - c;
              if (disc < 0) continue;
              const t = Math.max(0, -b - Math.sqrt(disc));
              if (t <= step && t < tHit && -b + Math.sqrt(disc) >= 0) tHit = t;
            }
          }
      }
      if (tHit <= step) {
        add(wx + tHit * ux, wy + tHit * uy);
        break;
      }
      wx += step * ux;
      wy += step * uy;
    }
  }
  let sx = 0, sy = 0, s2 = 0;
  for (let i = 0; i < n; i++) { sx += x[i]; sy += y[i]; s2 += x[i] * x[i] + y[i] * y[i]; }
  const mx = sx / n, my = sy / n;
  return { x, y, rg: Math.sqrt(s2 / n - mx * mx - my * my) };
}
