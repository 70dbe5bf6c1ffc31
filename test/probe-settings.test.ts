/** One probe-settings schema: a spec's [probe] table, POST /probes and `tendril probe` share names, ranges, defaults and units. */
import { describe, expect, it } from 'vitest';
import { SPEC_SCHEMA, validateSpec } from '../coordinator/spec/index.js';
import { PROBE_REQUEST_SCHEMA, validateProbeRequest } from '../coordinator/farm/probe-requests.js';
import { DEFAULT_PROBE_Q, defaultProbeJobs, PROBE_MIN_STEP, PROBE_SETTINGS_PROPERTIES, probeSettingsOf } from '../coordinator/harmonic/probe-settings.js';

describe('probe settings', () => {
  it('the spec and the request schema carry the very same settings properties', () => {
    const specProbe = SPEC_SCHEMA.properties.probe.properties as Record<string, unknown>;
    const request = PROBE_REQUEST_SCHEMA.properties as Record<string, unknown>;
    for (const [k, v] of Object.entries(PROBE_SETTINGS_PROPERTIES)) {
      expect(specProbe[k]).toBe(v);
      expect(request[k]).toBe(v);
    }
  });

  it('defaults are the same for a spec and a request', () => {
    for (const walkers of [100, 3000, 1_000_000, 1e10]) {
      const spec = validateSpec({ model: 'dla-offlattice-2d', particles: 100, clusters: 1, seed: 1, probe: { walkers } }, { maxTotalParticles: 1e12 }).probe!;
      const req = validateProbeRequest({ walkers, seed: 1, csv: '0,0,1\n' }).settings;
      const want = probeSettingsOf({ walkers });
      expect({ walkers: spec.walkers, jobs: spec.jobs, q: spec.q, contactSample: spec.contactSample, minStep: spec.minStep, window: spec.window }).toEqual(want);
      expect({ walkers: req.walkers, jobs: req.jobs, q: req.q, contactSample: req.contactSample, minStep: req.minStep, window: req.window }).toEqual(want);
      expect(want.jobs).toBe(defaultProbeJobs(walkers));
    }
    expect(probeSettingsOf({ walkers: 1000 }).q).toEqual([...DEFAULT_PROBE_Q]);
    expect(probeSettingsOf({ walkers: 1000 }).minStep).toBe(PROBE_MIN_STEP.default);
  });

  it('refuses the same values with the same words in a spec and a request', () => {
    let specMsg = '';
    try {
      validateSpec({ model: 'dla-offlattice-2d', particles: 100, clusters: 1, seed: 1, probe: { walkers: 1000, min_step: 2 } });
    } catch (e) {
      specMsg = (e as Error).message;
    }
    let reqMsg = '';
    try {
      validateProbeRequest({ walkers: 1000, seed: 1, csv: '0,0,1\n', min_step: 2 });
    } catch (e) {
      reqMsg = (e as Error).message;
    }
    expect(specMsg).toBe('probe.min_step: 2 is out of range; allowed: a number above 0 up to 1');
    expect(reqMsg).toBe('min_step: 2 is out of range; allowed: a number above 0 up to 1');
    const rule = 'two numbers lo, hi with 0 < lo < hi <= 1 and hi >= 2 lo (box sides relative to the set radius R)';
    expect(() => validateSpec({ model: 'dla-offlattice-2d', particles: 100, clusters: 1, seed: 1, probe: { walkers: 1000, window: [0.3, 0.5] } })).toThrow(`probe.window: [0.3,0.5] is out of range; allowed: ${rule}`);
    expect(() => validateProbeRequest({ walkers: 1000, seed: 1, csv: '0,0,1\n', window: [0.3, 0.5] })).toThrow(`window: [0.3,0.5] is out of range; allowed: ${rule}`);
    expect(probeSettingsOf({ walkers: 1000, window: [0.1, 0.5] }).window).toEqual([0.1, 0.5]);
  });
});
