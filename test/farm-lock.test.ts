import { describe, expect, it } from 'vitest';
import { launchEnsemble } from '../coordinator/farm/queue.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { freePort, waitFor } from './farm-helpers.js';
import { farmFixture } from './support/farm-fixture.js';

const { store, queue, startWorker, waitDone } = farmFixture('lock');

describe('worker lock renewal and metrics', () => {
  it('a run far longer than the lock duration never stalls (growth is off the main thread); /metrics counts it', async () => {
    const port = await freePort();
    // lock of 1 s, stalled check every 0.5 s, a second worker ready to steal a stalled job
    const extra = ['--lock-ms', '1000', '--stalled-ms', '500'];
    await startWorker({ extra: [...extra, '--metrics-port', String(port)] });
    const spec = validateSpec({ model: 'dla-offlattice-2d', particles: 600000, clusters: 1, seed: 2 });
    const id = await launchEnsemble(store, queue, spec);
    await waitFor('run started', async () => ((await store.status(id))?.runs.running ?? 0) === 1);
    await startWorker({ extra });
    await waitDone(id, 'done', 120_000);
    const job = (await queue.getJob(`${id}-0`))!;
    expect(job.stalledCounter).toBe(0);
    expect(job.attemptsStarted).toBe(1);
    const [r] = await store.results(id);
    expect(r.timings.resumes).toBe(0);
    expect(r.timings.growSeconds).toBeGreaterThan(2); // the run outlived the 1 s lock at least twice over
    const text = await (await fetch(`http://127.0.0.1:${port}/metrics`)).text();
    expect(text).toMatch(/^tendril_particles_grown_total\{model="dla-offlattice-2d"\} \d+$/m);
    const grown = Number(/^tendril_particles_grown_total\{model="dla-offlattice-2d"\} (\d+)$/m.exec(text)![1]);
    expect(grown).toBeGreaterThan(590000);
    expect(grown).toBeLessThanOrEqual(600000);
    expect(text).toMatch(/^tendril_runs_finished_total\{outcome="stored"\} 1$/m);
    expect(text).toMatch(/^tendril_run_duration_seconds_count 1$/m);
    expect(text).toMatch(/^tendril_runs_active 0$/m);
  });
});
