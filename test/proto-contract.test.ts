import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  CONTRACT_VERSION,
  ContractError,
  decodeCheckpoint,
  decodeEnsembleSummary,
  decodeRunResult,
  decodeRunTask,
  encodeCheckpoint,
  encodeEnsembleSummary,
  encodeRunResult,
  encodeRunTask,
  tendril,
  type PlainGrowthCheckpoint,
  type PlainGrowthResult,
  type PlainGrowthTask,
  type RunResultData,
  type RunTaskData,
} from '../proto/convert.js';
import type { GrowthCheckpoint, GrowthResult, GrowthTask } from '../worker/core/growth-kernel.js';

// Compile-time check: the plain shapes of proto/convert.ts and the kernel
// contract are assignable both ways (tsc fails the build otherwise).
const _taskA = (t: GrowthTask): PlainGrowthTask => t;
const _taskB = (t: PlainGrowthTask): GrowthTask => t;
const _resA = (r: GrowthResult): PlainGrowthResult => r;
const _resB = (r: PlainGrowthResult): GrowthResult => r;
const _cpA = (c: GrowthCheckpoint): PlainGrowthCheckpoint => c;
const _cpB = (c: PlainGrowthCheckpoint): GrowthCheckpoint => c;
void [_taskA, _taskB, _resA, _resB, _cpA, _cpB];

const task: RunTaskData = {
  ensembleId: 'e-1',
  runIndex: 7,
  ensembleSeed: '18446744073709551615',
  model: { kind: 'dla-offlattice-2d', params: { min_step: 0.25, launch_margin: 2 } },
  particles: 5000,
  recordsPerDecade: 10,
  checkpointIntervalSeconds: 120,
  checkpointEveryParticles: 0,
  engineVersion: 'tendril-engine/1',
};

const result: RunResultData = {
  ensembleId: 'e-1',
  runIndex: 7,
  engineVersion: 'tendril-engine/1',
  model: task.model,
  dimension: 2,
  particles: 5000,
  ensembleSeed: task.ensembleSeed,
  series: { sizes: [1, 10, 100], radiusOfGyration: [0, 1.5, 6.25], maxRadius: [0, 3, 12], centerOffset: [0, 0.1, 0.2], extra: { axis_ratio: [1, 1.25, 0.5] } },
  massRadius: { radii: [1, 2, 4], counts: [1, 5, 17] },
  counters: { jumps: 2 ** 40 + 3, short_steps: 12, returns: 1 },
  stateHash: 'abc123',
  timings: { growSeconds: 1.5, startedAtMs: 1.7e12, finishedAtMs: 1.7e12 + 1500, resumes: 2, finishedBy: 'host:1' },
};

describe('protobuf contract', () => {
  it('checked-in generated code is current', () => {
    const dir = mkdtempSync(join(tmpdir(), 'tendril-proto-'));
    try {
      execFileSync(process.execPath, ['proto/generate.mjs', dir], { cwd: join(import.meta.dirname, '..'), stdio: 'pipe' });
      for (const f of ['tendril.js', 'tendril.d.ts']) {
        const fresh = readFileSync(join(dir, f), 'utf8');
        const checkedIn = readFileSync(join(import.meta.dirname, '..', 'proto', 'generated', f), 'utf8');
        expect(checkedIn, `proto/generated/${f} is stale: run npm run proto:generate`).toBe(fresh);
      }
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  }, 60_000);

  it('round-trips a run task, including a seed above 2^53', () => {
    const back = decodeRunTask(encodeRunTask(task));
    expect(back).toEqual(task);
  });

  it('round-trips a run result with counters above 2^32 exactly', () => {
    const back = decodeRunResult(encodeRunResult(result));
    expect(back).toEqual(result);
    expect(back.counters.jumps).toBe(2 ** 40 + 3);
  });

  for (const dimension of [2, 3]) {
    it(`round-trips a ${dimension}D checkpoint bit for bit, with counters and model state`, () => {
      const n = 1000;
      const positions = new Float64Array(dimension * n + 5);
      for (let i = 0; i < dimension * n; i++) positions[i] = Math.sin(i) * 1e3 + 1e-12 * i;
      const bytes = encodeCheckpoint({
        run: task,
        state: {
          engineVersion: 'tendril-engine/1',
          task: { model: task.model, particles: task.particles, ensembleSeed: task.ensembleSeed, runIndex: 7, recordsPerDecade: 10 },
          dimension,
          count: n,
          positions,
          rngState: Uint32Array.of(1, 0xffffffff, 3, 4),
          counters: { jumps: 5, short_steps: 6, returns: 2 ** 45 },
          series: { sizes: [1], radiusOfGyration: [0], maxRadius: [0], centerOffset: [0], extra: { width: [0.5] } },
          modelState: Uint8Array.of(9, 8, 7),
        },
        growSeconds: 3,
        startedAtMs: 10,
        resumes: 1,
      });
      const back = decodeCheckpoint(bytes);
      expect(back.state.count).toBe(n);
      expect(back.state.dimension).toBe(dimension);
      expect(back.state.positions.length).toBe(dimension * n);
      expect(Array.from(back.state.positions)).toEqual(Array.from(positions.subarray(0, dimension * n)));
      expect(Array.from(back.state.rngState)).toEqual([1, 0xffffffff, 3, 4]);
      expect(back.state.counters).toEqual({ jumps: 5, short_steps: 6, returns: 2 ** 45 });
      expect(back.state.series.extra).toEqual({ width: [0.5] });
      expect(Array.from(back.state.modelState)).toEqual([9, 8, 7]);
      expect(back.state.task.runIndex).toBe(7);
      expect(back.run).toEqual(task);
      expect(back.resumes).toBe(1);
    });
  }

  it('reads contract 1 (one model as a oneof, x and y arrays, fixed counters) into the contract-2 shapes', () => {
    const n = 3;
    const x = Float64Array.of(0, 1, -0.5);
    const y = Float64Array.of(0, 0.25, 2);
    const legacyTask = { contractVersion: 1, ensembleId: 'e-1', runIndex: 7, ensembleSeed: '5', model: { offlatticeDla2d: { minStep: 0.25, launchMargin: 2 } }, particles: 10, recordsPerDecade: 10, checkpointIntervalSeconds: 5, checkpointEveryParticles: 0, engineVersion: 'tendril-engine/2' };
    const bytes = tendril.Checkpoint.encode({
      contractVersion: 1, engineVersion: 'tendril-engine/2', task: legacyTask, count: n,
      x: new Uint8Array(x.buffer), y: new Uint8Array(y.buffer), rngState: [1, 2, 3, 4],
      counters: { jumps: 11, shortSteps: 12, returns: 13 }, series: { sizes: [], radiusOfGyration: [], maxRadius: [], centerOffset: [] },
    }).finish();
    const back = decodeCheckpoint(bytes);
    expect(back.run.model).toEqual({ kind: 'dla-offlattice-2d', params: { min_step: 0.25, launch_margin: 2 } });
    expect(back.state.dimension).toBe(2);
    expect(Array.from(back.state.positions)).toEqual([0, 0, 1, 0.25, -0.5, 2]);
    expect(back.state.counters).toEqual({ jumps: 11, short_steps: 12, returns: 13 });
    expect(back.state.modelState.length).toBe(0);
    const legacyResult = tendril.RunResult.encode({ ...tendril.RunResult.decode(encodeRunResult(result)), contractVersion: 1, counterValues: {}, counters: { jumps: 1, shortSteps: 2, returns: 3 }, model: { offlatticeDla2d: { minStep: 0.1, launchMargin: 3 } } }).finish();
    const r = decodeRunResult(legacyResult);
    expect(r.counters).toEqual({ jumps: 1, short_steps: 2, returns: 3 });
    expect(r.dimension).toBe(2);
    expect(r.model).toEqual({ kind: 'dla-offlattice-2d', params: { min_step: 0.1, launch_margin: 3 } });
  });

  it('round-trips an ensemble summary', () => {
    const s = {
      ensembleId: 'e-1',
      name: 'demo',
      engineVersion: 'tendril-engine/1',
      specJson: '{"a":1}',
      clustersPlanned: 2,
      clustersDone: 1,
      runs: [result],
      radiusOfGyrationFit: { exponent: 0.58, prefactor: 0.5, rSquared: 0.99, points: 3, minX: 10, maxX: 100 },
      fractalDimension: 1 / 0.58,
      createdAtMs: 5,
      meanSizes: [10, 100],
      meanLogRadiusOfGyration: [0.4, 1.8],
      statisticsJson: '{"schema":"x"}',
      partial: true,
      adaptiveJson: '{"outcome":"running"}',
    };
    expect(decodeEnsembleSummary(encodeEnsembleSummary(s))).toEqual(s);
  });

  const bad: Array<[string, () => unknown, RegExp]> = [
    ['garbage bytes', () => decodeRunTask(Uint8Array.of(0xff, 0xff, 0xff, 0xff, 0x0f)), /^RunTask: not a valid protobuf message/],
    ['unknown version', () => decodeRunTask(tendril.RunTask.encode({ ...encodeObj(), contractVersion: 99 }).finish()), /RunTask\.contract_version is 99, this build reads versions 1 and 2/],
    ['missing model', () => decodeRunTask(tendril.RunTask.encode({ ...encodeObj(), model: null }).finish()), /RunTask\.model is missing/],
    ['bad seed', () => decodeRunTask(tendril.RunTask.encode({ ...encodeObj(), ensembleSeed: '-3' }).finish()), /ensemble_seed "-3"/],
    ['zero particles', () => decodeRunTask(tendril.RunTask.encode({ ...encodeObj(), particles: 0 }).finish()), /RunTask\.particles is 0/],
    ['empty message', () => decodeRunTask(new Uint8Array(0)), /contract_version is 0/],
    ['result without hash', () => decodeRunResult(tendril.RunResult.encode({ ...tendril.RunResult.decode(encodeRunResult(result)), stateHash: '' }).finish()), /state_hash is empty/],
  ];
  for (const [name, fn, msg] of bad) {
    it(`refuses ${name} with a one-line ContractError`, () => {
      let err: unknown;
      try {
        fn();
      } catch (e) {
        err = e;
      }
      expect(err).toBeInstanceOf(ContractError);
      expect((err as Error).message).toMatch(msg);
      expect((err as Error).message).not.toContain('\n');
    });
  }

  it('writes the contract version into every message', () => {
    expect(tendril.RunTask.decode(encodeRunTask(task)).contractVersion).toBe(CONTRACT_VERSION);
  });
});

function encodeObj(): tendril.IRunTask {
  return tendril.RunTask.decode(encodeRunTask(task)).toJSON() as tendril.IRunTask;
}
