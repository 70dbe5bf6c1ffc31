// The probe's final approach at convex vertices (worker/probe/probe-2d.ts, steps 4 and 5).
// Set: an equilateral triangle drawn as 3 x 12 touching disks of radius 1 (sharp convex vertices).
// Measured: the share of the probes touching the 3 vertex disks, with 2 x 10^6 walkers per run:
//  - exact lens final approach at min_step 0.02 (the default) and 0.1: the same (the lens step
//    is exact; min_step only bounds where it falls back to straight steps, at concave junctions);
//  - the old straight final approach at min_step 0.002 (reference, 10 times finer than the
//    default): agrees with the lens step;
//  - the old straight final approach at min_step 0.1: detected as low (the test has power).
// Second shape: the apex disk of an isosceles triangle of apex angle 20 degrees (legs of 12
// touching disks), 4 x 10^6 walkers per run: lens step at 0.02 against straight steps at 0.002.
// Rule: two shares agree when |z| < 3.3 (two-sided p = 0.001), z = difference over the binomial
// standard errors combined (common practice, no source); "detected" means z < -3.3.
import { describe, expect, it } from 'vitest';
import { ProbeGeometry, ProbeWalk } from '../worker/probe/probe-2d.js';
import { Random, STREAM_PROBE } from '../worker/core/random.js';
import { yieldToRunner } from './support/grow.js';

const N = 2_000_000;
const SIDE = 12;

function triangle(): { count: number; x: number[]; y: number[]; r: number; vertices: number[] } {
  const x: number[] = [], y: number[] = [], vertices: number[] = [];
  const R = (2 * SIDE) / Math.sqrt(3);
  const v = [0, 1, 2].map((k) => [R * Math.cos((2 * Math.PI * k) / 3 + Math.PI / 2), R * Math.sin((2 * Math.PI * k) / 3 + Math.PI / 2)]);
  for (let s = 0; s < 3; s++) {
    vertices.push(x.length);
    for (let k = 0; k < SIDE; k++) { x.push(v[s][0] + ((v[(s + 1) % 3][0] - v[s][0]) * k) / SIDE); y.push(v[s][1] + ((v[(s + 1) % 3][1] - v[s][1]) * k) / SIDE); }
  }
  return { count: x.length, x, y, r: 1, vertices };
}

async function vertexShare(minStep: number, straight: boolean, seed: string): Promise<{ p: number; se: number; steps: number }> {
  const t = triangle();
  const g = new ProbeGeometry(t);
  const walk = new ProbeWalk(g, minStep, 0, Random.forRun(seed, 0, STREAM_PROBE), straight);
  const isVertex = new Uint8Array(t.count);
  for (const i of t.vertices) isVertex[i] = 1;
  let hits = 0;
  for (let w = 0; w < N; w++) {
    hits += isVertex[walk.run()];
    if (w % 200_000 === 199_999) await yieldToRunner();
  }
  const p = hits / N;
  return { p, se: Math.sqrt((p * (1 - p)) / N), steps: walk.shortSteps / N };
}

function apexShape(apexDegrees: number): { count: number; x: number[]; y: number[]; r: number } {
  const L = 12;
  const a = (apexDegrees * Math.PI) / 180;
  const x: number[] = [0], y: number[] = [0]; // disk 0: the apex
  const e1 = [Math.cos(-a / 2), Math.sin(-a / 2)], e2 = [Math.cos(a / 2), Math.sin(a / 2)];
  for (let k = 1; k <= L; k++) { x.push(2 * k * e1[0], 2 * k * e2[0]); y.push(2 * k * e1[1], 2 * k * e2[1]); }
  const bx = 2 * L * e1[0], by0 = 2 * L * e1[1], by1 = 2 * L * e2[1];
  const nb = Math.ceil((by1 - by0) / 2);
  for (let k = 1; k < nb; k++) { x.push(bx); y.push(by0 + ((by1 - by0) * k) / nb); }
  return { count: x.length, x, y, r: 1 };
}

async function apexShare(apexDegrees: number, minStep: number, straight: boolean, seed: string): Promise<{ p: number; se: number }> {
  const g = new ProbeGeometry(apexShape(apexDegrees));
  const walk = new ProbeWalk(g, minStep, 0, Random.forRun(seed, 0, STREAM_PROBE), straight);
  const n = 4_000_000;
  let hits = 0;
  for (let w = 0; w < n; w++) {
    if (walk.run() === 0) hits++;
    if (w % 200_000 === 199_999) await yieldToRunner();
  }
  const p = hits / n;
  return { p, se: Math.sqrt((p * (1 - p)) / n) };
}

const z = (a: { p: number; se: number }, b: { p: number; se: number }) => (a.p - b.p) / Math.hypot(a.se, b.se);

describe('final approach at the vertices of a triangle of disks', () => {
  it('lens step (exact) is independent of min_step, agrees with straight steps at min_step 0.002, and straight steps at 0.1 lose vertex hits', async () => {
    const lens = await vertexShare(0.02, false, '501');
    const lensCoarse = await vertexShare(0.1, false, '502');
    const fine = await vertexShare(0.002, true, '503');
    const straight = await vertexShare(0.02, true, '504');
    const coarse = await vertexShare(0.1, true, '505');
    const show = (name: string, r: { p: number; se: number; steps: number }) =>
      `${name}: vertex share ${r.p.toFixed(5)} +- ${r.se.toFixed(5)} (${(r.p / fine.p).toFixed(4)} of the fine straight reference; ${r.steps.toFixed(2)} final-approach steps per walker)`;
    console.log([show('lens 0.02', lens), show('lens 0.1', lensCoarse), show('straight 0.002', fine), show('straight 0.02', straight), show('straight 0.1', coarse)].join('\n'));
    expect(Math.abs(z(lens, lensCoarse))).toBeLessThan(3.3);
    expect(Math.abs(z(lens, fine))).toBeLessThan(3.3);
    expect(z(coarse, lens)).toBeLessThan(-3.3);
  });

  it('apex disk of an isosceles triangle of apex angle 20 degrees: lens step at 0.02 agrees with straight steps at 0.002', async () => {
    const deg = 20;
    const straight = await apexShare(deg, 0.02, true, '701');
    const fine = await apexShare(deg, 0.002, true, '702');
    const lens = await apexShare(deg, 0.02, false, '703');
    console.log(`apex ${deg} degrees: lens 0.02 ${lens.p.toFixed(5)} +- ${lens.se.toFixed(5)}, straight 0.002 ${fine.p.toFixed(5)}, straight 0.02 ${straight.p.toFixed(5)} (${(100 * (straight.p / fine.p - 1)).toFixed(2)}% +- ${(100 * Math.hypot(straight.se, fine.se) / fine.p).toFixed(2)}%)`);
    expect(Math.abs(z(lens, fine))).toBeLessThan(3.3);
  });
});
