/**
 * The model contract, checked for every registered model (a new model gets
 * these checks by being one line of worker/models/registry.ts):
 *   - determinism: the same task gives the same state hash and counters,
 *     however growth is chunked;
 *   - resume: a checkpoint taken at several points, sent through the wire
 *     format, continues to the very same final state;
 *   - parameters: every value outside a parameter's range (and an unknown
 *     name) is refused with one line naming params.NAME, the model and the
 *     allowed range, by the registry, the spec and the kernel constructor;
 *   - wire: the run task, checkpoint and run result survive the protobuf
 *     round trip;
 *   - the result carries the declared dimension, counters and observables.
 * Sizes are small: this is about the contract, not the physics.
 */
import { describe, expect, it } from 'vitest';
import { decodeCheckpoint, decodeRunResult, decodeRunTask, encodeCheckpoint, encodeRunResult, encodeRunTask, type RunTaskData } from '../proto/convert.js';
import { SpecError, validateSpec } from '../coordinator/spec/index.js';
import { ENGINE_VERSION } from '../worker/core/engine-version.js';
import type { GrowthTask } from '../worker/core/growth-kernel.js';
import type { ParamSpec } from '../worker/core/model-descriptor.js';
import { describeRange } from '../worker/core/value-range.js';
import { checkModelParams, createKernel, MODELS, modelParams } from '../worker/models/registry.js';

const N = 400;

function taskOf(kind: string, runIndex = 2): GrowthTask {
  return { model: modelParams(kind), particles: N, ensembleSeed: '1234567890123', runIndex, recordsPerDecade: 10 };
}

function runTaskOf(t: GrowthTask): RunTaskData {
  return { ...t, ensembleId: 'contract', checkpointIntervalSeconds: 60, checkpointEveryParticles: 0, engineVersion: ENGINE_VERSION };
}

/** Values outside the range of p, each with why. */
function badValues(p: ParamSpec): Array<[string, unknown]> {
  const span = Math.max(1, Math.abs(p.max - p.min));
  const out: Array<[string, unknown]> = [
    ['below the minimum', p.minOpen ? p.min : p.min - span],
    ['above the maximum', p.maxOpen ? p.max : p.max + span],
    ['not finite', Number.NaN],
    ['infinite', Number.POSITIVE_INFINITY],
    ['a string', String(p.default)],
  ];
  if (p.integer) out.push(['not an integer', p.min + 0.5]);
  return out;
}

for (const d of MODELS) {
  describe(`model contract: ${d.kind}`, () => {
    it('the same task gives the same state hash and counters, however growth is chunked', () => {
      const a = createKernel(taskOf(d.kind));
      a.growTo(N);
      const b = createKernel(taskOf(d.kind));
      for (let n = 2; n <= N; n += 37) b.growTo(n);
      b.growTo(N);
      expect(b.result().stateHash).toBe(a.result().stateHash);
      expect(b.result().counters).toEqual(a.result().counters);
      const other = createKernel(taskOf(d.kind, 3));
      other.growTo(N);
      expect(other.result().stateHash).not.toBe(a.result().stateHash);
    });

    it('the result carries the declared dimension, counters and observables', () => {
      const k = createKernel(taskOf(d.kind));
      k.growTo(N);
      const r = k.result();
      expect(r.dimension).toBe(d.dimension);
      expect(k.positions().dimension).toBe(d.dimension);
      expect(r.particles).toBe(N);
      expect(Object.keys(r.counters).sort()).toEqual(d.counters.map((c) => c.name).sort());
      if (d.workCounter !== null) expect(d.counters.map((c) => c.name)).toContain(d.workCounter);
      expect(Object.keys(r.series.extra).sort()).toEqual(d.observables.map((o) => o.name).sort());
      expect(r.model).toEqual(modelParams(d.kind));
    });

    it('resumes from checkpoints at several points (through the wire format) to the same final state', async () => {
      const whole = createKernel(taskOf(d.kind));
      whole.growTo(N);
      const want = whole.result();
      for (const at of [1, 2, 17, Math.floor(N / 2), N - 1]) {
        // let the runner's messages through between resumes (a slow model holds the loop for seconds each)
        await new Promise((resolve) => setImmediate(resolve));
        const k = createKernel(taskOf(d.kind));
        k.growTo(at);
        expect(k.count).toBe(at);
        const bytes = encodeCheckpoint({ run: runTaskOf(taskOf(d.kind)), state: k.checkpoint(), growSeconds: 1, startedAtMs: 0, resumes: 0 });
        const back = decodeCheckpoint(bytes);
        const resumed = createKernel(taskOf(d.kind), back.state);
        expect(resumed.count).toBe(at);
        resumed.growTo(N);
        const r = resumed.result();
        expect([at, r.stateHash]).toEqual([at, want.stateHash]);
        expect(r.counters).toEqual(want.counters);
        expect(r.series).toEqual(want.series);
      }
    });

    it('task, checkpoint and result survive the protobuf round trip', () => {
      const t = runTaskOf(taskOf(d.kind));
      expect(decodeRunTask(encodeRunTask(t))).toEqual(t);
      const k = createKernel(taskOf(d.kind));
      k.growTo(Math.floor(N / 3));
      const c = { run: t, state: k.checkpoint(), growSeconds: 2.5, startedAtMs: 1000, resumes: 1 };
      const cb = decodeCheckpoint(encodeCheckpoint(c));
      expect(cb.state.positions.subarray(0, c.state.count * c.state.dimension)).toEqual(c.state.positions.subarray(0, c.state.count * c.state.dimension));
      expect({ ...cb.state, positions: null }).toEqual({ ...c.state, positions: null });
      k.growTo(N);
      const result = { ...k.result(), ensembleId: 'contract', timings: { growSeconds: 1, startedAtMs: 2, finishedAtMs: 3, resumes: 0, finishedBy: 'test' } };
      expect(decodeRunResult(encodeRunResult(result))).toEqual(result);
    });

    for (const p of d.params) {
      const allowed = describeRange(p, p.unit ? `${p.unit}, for ${d.kind}` : `for ${d.kind}`);
      for (const [why, v] of badValues(p)) {
        it(`refuses params.${p.name} ${why} in one line naming it, the model and the range`, () => {
          const model = modelParams(d.kind, { [p.name]: v as number });
          let message = '';
          try {
            checkModelParams(model);
          } catch (err) {
            expect(err).toBeInstanceOf(RangeError);
            message = (err as Error).message;
          }
          expect(message).toMatch(new RegExp(`^params\\.${p.name}: `));
          expect(message.endsWith(`; allowed: ${allowed}`)).toBe(true);
          expect(message).not.toContain('\n');
          expect(() => createKernel({ ...taskOf(d.kind), model })).toThrow(message);
          if (typeof v === 'number' && Number.isFinite(v)) {
            let spec: string[] = [];
            try {
              validateSpec({ model: d.kind, particles: 100, clusters: 1, seed: 1, params: { [p.name]: v } });
            } catch (err) {
              spec = (err as SpecError).problems;
            }
            expect(spec).toEqual([message]);
          }
        });
      }
    }

    it('refuses a parameter of no model in one line naming it and the allowed names', () => {
      const msg = `params.no_such_param: not a parameter of ${d.kind}; allowed: ${d.params.map((p) => p.name).join(', ') || 'none'}`;
      expect(() => checkModelParams(modelParams(d.kind, { no_such_param: 1 }))).toThrow(msg);
      expect(() => validateSpec({ model: d.kind, particles: 100, clusters: 1, seed: 1, params: { no_such_param: 1 } })).toThrow(msg);
    });

    it('every default is inside its range and the defaults pass the checks', () => {
      expect(() => checkModelParams(modelParams(d.kind))).not.toThrow();
      for (const p of d.params) expect(p.default).toBeGreaterThanOrEqual(p.min);
    });
  });
}
