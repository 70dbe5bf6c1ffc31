import { describe, expect, it } from 'vitest';
import { launchEnsemble } from '../coordinator/farm/queue.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { waitFor } from './farm-helpers.js';
import { farmFixture } from './support/farm-fixture.js';

// A worker logs one JSON line (pino) when a run starts, checkpoints, finishes
// or is handed back, with the ensemble, the run and the particles.

const { store, queue, startWorker, waitDone } = farmFixture('worker-logs');

interface LogLine { level: number; msg: string; ensembleId?: string; runIndex?: number; particles?: number | null; resumed?: boolean; counted?: boolean; stateHash?: string; workerId?: string }

function logLines(text: string): LogLine[] {
  return text.split('\n').filter((l) => l.startsWith('{')).map((l) => JSON.parse(l) as LogLine);
}

describe('worker structured logs', () => {
  it('one line per start, checkpoint, finish and hand-back of a run', async () => {
    const w = await startWorker({ extra: ['--log-level', 'info'] });
    const small = await launchEnsemble(store, queue, validateSpec({ model: 'dla-offlattice-2d', particles: 3000, clusters: 1, seed: 4, checkpoint_every_particles: 1000 }));
    await waitDone(small, 'small ensemble done');
    const big = await launchEnsemble(store, queue, validateSpec({ model: 'dla-offlattice-2d', particles: 2_000_000, clusters: 1, seed: 5 }));
    await waitFor('the big run under way', async () => ((await store.status(big))?.particles.done ?? 0) > 2000);
    w.child.kill('SIGTERM');
    expect(await w.exited).toBe(0);
    const lines = logLines(w.output());
    const of = (id: string) => lines.filter((l) => l.ensembleId === id).map((l) => l.msg);
    expect(of(small)).toEqual(['run started', 'run checkpointed', 'run checkpointed', 'run finished']);
    const fin = lines.find((l) => l.ensembleId === small && l.msg === 'run finished')!;
    expect(fin).toMatchObject({ level: 30, runIndex: 0, particles: 3000, counted: true });
    expect(fin.stateHash).toMatch(/^[0-9a-f]+$/);
    expect(fin.workerId).toMatch(/:\d+$/);
    expect(lines.filter((l) => l.ensembleId === small && l.msg === 'run checkpointed').every((l) => typeof l.particles === 'number')).toBe(true);
    expect(of(big)).toEqual(['run started', 'run handed back']);
    expect(lines.find((l) => l.ensembleId === big && l.msg === 'run handed back')!.particles).toBeGreaterThan(2000);
  }, 120_000);
});
