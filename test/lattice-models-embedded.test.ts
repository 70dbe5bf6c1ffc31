import { describe, expect, it } from 'vitest';
import { runEmbedded } from '../coordinator/embedded/index.js';
import { runTaskFor } from '../coordinator/plan.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { decodeCheckpoint, encodeCheckpoint, growthTaskOf, type CheckpointData } from '../proto/convert.js';
import { createKernel } from '../worker/models/registry.js';
import { runTask } from '../worker/runtime/task-runner.js';

// The new models through the same paths as off-lattice DLA: specs, the task runner's checkpoints
// (through the wire encoding, modelState included), and the embedded mode on threads.
const SPECS = [
  { model: 'eden-square', particles: 6000 },
  { model: 'eden-triangular', particles: 6000 },
  { model: 'eden-offlattice-2d', particles: 1500 },
  { model: 'dla-square', particles: 1500, params: { noise_reduction: 2 } },
  { model: 'dla-triangular', particles: 1500, params: { noise_reduction: 2 } },
  // the checkpoints carry the potential (modelState of a few hundred kB)
  { model: 'dbm-square', particles: 200, params: { eta: 2 } },
  // the walker sampler: many walkers per particle, empty modelState
  { model: 'dbm-square-walkers', particles: 250, params: { eta: 2 } },
];

describe('lattice and Eden models: task runner and embedded mode', () => {
  for (const s of SPECS) {
    it(`${s.model}: checkpoints through the wire resume to the uninterrupted hash; embedded runs match direct kernels`, async () => {
      const spec = validateSpec({ name: `${s.model} test`, model: s.model, ...(s.params ? { params: s.params } : {}), particles: s.particles, clusters: 3, seed: '4242', runs_per_job: 1 });
      const run = { ...runTaskFor('lat1', spec, 1), checkpointEveryParticles: Math.floor(s.particles / 3) };
      const checkpoints: CheckpointData[] = [];
      const full = await runTask(run, { onCheckpoint: (c) => void checkpoints.push(c) });
      expect(full.status).toBe('done');
      const hash = full.status === 'done' ? full.result.stateHash : '';
      expect(checkpoints.length).toBeGreaterThan(0);
      for (const c of checkpoints) {
        const resumed = await runTask(run, { checkpoint: decodeCheckpoint(encodeCheckpoint(c)) });
        expect(resumed.status === 'done' && resumed.result.stateHash).toBe(hash);
      }
      const out = await runEmbedded(spec, { ensembleId: `emb-${s.model}`, threads: 2 });
      for (const r of out.results) {
        const k = createKernel(growthTaskOf(runTaskFor('x', spec, r.runIndex)));
        k.growTo(spec.particles);
        expect(r.stateHash).toBe(k.result().stateHash);
      }
      expect(out.results[1].stateHash).toBe(hash);
      const st = JSON.parse(out.summary.statisticsJson) as { observables?: { bands: { name: string }[] } };
      expect(st.observables!.bands.map((b) => b.name)).toContain('axis_ratio_4');
    });
  }
});
