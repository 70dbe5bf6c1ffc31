/**
 * Pinned state hashes: runs of fixed (seed, run index, size, parameters)
 * recorded with engine tendril-engine/2 before the model-registry refactor
 * (positions became dimension-strided, counters a name → value map, the
 * model a kind with a parameter map). The engine is unchanged, so every hash
 * and counter must stay exactly what it was. A change to the kernel that
 * alters a trajectory bumps ENGINE_VERSION and records these again.
 * Engine tendril-engine/3 changed only the 3D kernel's walk (its pin is in
 * test/dla-3d-kernel.test.ts): these 2D hashes are unchanged from engine 2
 * to engine 3.
 */
import { describe, expect, it } from 'vitest';
import { ENGINE_VERSION } from '../worker/core/engine-version.js';
import { modelParams } from '../worker/models/registry.js';
import { growInThreads } from './support/grow-in-thread.js';

const PINS: Array<{ seed: string; run: number; n: number; params: Record<string, number>; hash: string; counters: Record<string, number> }> = [
  { seed: '1', run: 0, n: 2, params: {}, hash: '9a03d4dac770a8ea', counters: { jumps: 26, short_steps: 2, returns: 11 } },
  { seed: '1', run: 0, n: 1000, params: {}, hash: 'b6181c3e8526fb28', counters: { jumps: 24660, short_steps: 2949, returns: 3852 } },
  { seed: '7', run: 3, n: 5000, params: {}, hash: '8e82f236bf6fd7ae', counters: { jumps: 167460, short_steps: 14326, returns: 20454 } },
  { seed: '20261202', run: 0, n: 20000, params: {}, hash: '2ba5b42264fa40eb', counters: { jumps: 750849, short_steps: 57342, returns: 76013 } },
  { seed: '18446744073709551615', run: 5, n: 3000, params: {}, hash: 'a5ee80c0ec446978', counters: { jumps: 80317, short_steps: 8763, returns: 10904 } },
  { seed: '42', run: 1, n: 2000, params: { min_step: 0.1 }, hash: '2cfb40848d219e30', counters: { jumps: 49097, short_steps: 5913, returns: 7745 } },
  { seed: '42', run: 2, n: 2000, params: { launch_margin: 10 }, hash: '041743de59f3ab26', counters: { jumps: 61991, short_steps: 5825, returns: 8025 } },
  { seed: '99', run: 0, n: 100000, params: {}, hash: '5b0bd7f9d41bb200', counters: { jumps: 4297355, short_steps: 287273, returns: 373508 } },
];

describe(`state hashes pinned for ${ENGINE_VERSION}`, () => {
  it('the engine is tendril-engine/3, whose 2D hashes are unchanged from tendril-engine/2 (where they were recorded)', () => {
    expect(ENGINE_VERSION).toBe('tendril-engine/3');
  });
  for (const p of PINS) {
    // grown on a worker thread (the same kernel), so the 10^5-particle pin never blocks the test runner
    it(`dla-offlattice-2d seed ${p.seed} run ${p.run}, ${p.n} particles ${JSON.stringify(p.params)}`, async () => {
      const [r] = await growInThreads([{ model: modelParams('dla-offlattice-2d', p.params), particles: p.n, ensembleSeed: p.seed, runIndex: p.run, recordsPerDecade: 10 }], 1);
      expect(r.stateHash).toBe(p.hash);
      expect(r.counters).toEqual(p.counters);
    });
  }
});
