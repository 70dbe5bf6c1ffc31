/** One place for error kinds: every error tendril throws on purpose is a TendrilError with a kind and a one-line message. */
import { readFileSync, readdirSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { firstLine, kindOf, messageOf, TendrilError } from '../proto/errors.js';
import { ContractError } from '../proto/convert.js';
import { UsageError } from '../coordinator/usage-error.js';
import { SpecError, validateSpec } from '../coordinator/spec/index.js';
import { SPEC_SCHEMA } from '../coordinator/spec/schema.js';
import { MODELS } from '../worker/models/registry.js';
import { parseGrowOptions } from '../coordinator/commands/grow.js';
import { analysisSettingsFromCli } from '../coordinator/commands/analysis-options.js';
import { parseWindowOption } from '../coordinator/commands/probe.js';
import { SnapshotError } from '../coordinator/snapshot/cluster-snapshot.js';
import { StatsInputError } from '../coordinator/stats/ensemble-data.js';
import { ProbeRequestError, validateProbeRequest } from '../coordinator/farm/probe-requests.js';
import { EmbeddedAborted } from '../coordinator/embedded/index.js';
import { TaskRejected } from '../worker/runtime/task-runner.js';
import { ProbeJobFailed } from '../worker/runtime/probe-thread-pool.js';
import { ProbeJobRefused } from '../worker/runtime/queue-processor.js';

const ROOT = resolve(__dirname, '..');

function sources(dir: string): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir)) {
    const p = join(dir, name);
    if (statSync(p).isDirectory()) {
      if (name !== 'generated') out.push(...sources(p));
    } else if (name.endsWith('.ts') && !name.endsWith('.d.ts')) out.push(p);
  }
  return out;
}

describe('error kinds', () => {
  it('every error class is a TendrilError with its kind', () => {
    const cases: Array<[TendrilError, string]> = [
      [new UsageError('u'), 'usage'],
      [new SpecError(['a', 'b']), 'spec'],
      [new ContractError('c'), 'contract'],
      [new TaskRejected('t'), 'task-rejected'],
      [new ProbeJobRefused('r'), 'probe-refused'],
      [new ProbeJobFailed('f'), 'probe-failed'],
      [new ProbeJobFailed('f', true), 'probe-refused'],
      [new SnapshotError('s'), 'snapshot'],
      [new StatsInputError('x'), 'stats-input'],
      [new ProbeRequestError('p'), 'request'],
      [new EmbeddedAborted('stopped'), 'aborted'],
    ];
    for (const [err, kind] of cases) {
      expect(err).toBeInstanceOf(TendrilError);
      expect(err).toBeInstanceOf(Error);
      expect(kindOf(err)).toBe(kind);
    }
    expect(kindOf(new RangeError('x'))).toBeNull();
    expect(kindOf('text')).toBeNull();
  });

  it('messages are one line', () => {
    expect(new UsageError('first\nsecond').message).toBe('first');
    expect(firstLine('a\nb\nc')).toBe('a');
    expect(messageOf(new Error('x\ny'))).toBe('x');
    expect(messageOf('plain\ntext')).toBe('plain');
    expect(messageOf(42)).toBe('42');
  });

  it('no code tells errors apart by their name or cuts messages by hand', () => {
    const offenders: string[] = [];
    for (const dir of ['coordinator', 'worker', 'proto']) {
      for (const file of sources(join(ROOT, dir))) {
        const text = readFileSync(file, 'utf8');
        text.split('\n').forEach((line, i) => {
          if (/\.split\((['"])\\n\1\)\[0\]/.test(line) || /\.name\s*[!=]==\s*['"][A-Za-z]*(Error|Rejected|Refused|Failed|Aborted)['"]/.test(line)) offenders.push(`${file.slice(ROOT.length + 1)}:${i + 1}: ${line.trim()}`);
        });
      }
    }
    expect(offenders).toEqual([]);
  });
});

/**
 * Issue #11 item 10, "messages name a related field instead of the wrong
 * one": every refusal's first line names the field at fault (the one the
 * input set wrongly), shows its value and says what is allowed. A pair that
 * contradicts each other (min above max, jobs above walkers) is named by one
 * field, with the other field and its value in the allowed range. On the
 * command line, the field is the option the user typed (--param NAME,
 * --fit-window FROM/TO), not the spec field it fills.
 */
describe('every refusal names the field at fault, its value and the allowed range', () => {
  const base = { name: 'x', model: 'dla-offlattice-2d', particles: 1000, clusters: 4, seed: 1 };
  const tables: Record<string, Record<string, unknown>> = { probe: { walkers: 1000, jobs: 2 }, target: { half_width: 0.1, max_clusters: 50 }, positions: { at_sizes: [10] } };
  const problemsOf = (fn: () => unknown): string[] => {
    try {
      fn();
    } catch (err) {
      return err instanceof SpecError ? err.problems : [messageOf(err)];
    }
    return [];
  };
  const fieldOf = (line: string) => line.slice(0, Math.max(0, line.indexOf(': ')));
  /** Wrong values for a schema leaf: wrong types, and just past each end of its range. */
  function wrongValues(s: { type?: string; minimum?: number; maximum?: number; exclusiveMinimum?: number }): unknown[] {
    const out: unknown[] = ['x', true, [], {}, -1, 1e300, 0.5];
    if (s.minimum !== undefined) out.push(s.minimum - 1);
    if (s.exclusiveMinimum !== undefined) out.push(s.exclusiveMinimum);
    if (s.maximum !== undefined) out.push(s.maximum + 1);
    if (s.type === 'array') out.push([null], ['x'], [1e300], [2, 2]);
    return out;
  }
  /** The first line of the refusal of `doc`: names `field` (or a part of it), shows the value, says what is allowed. */
  function expectNamed(field: string, value: unknown, lines: string[], where: string): void {
    if (lines.length === 0) return; // accepted (e.g. 0.5 where any number is allowed)
    const first = lines[0];
    const named = fieldOf(first);
    const ok = named === field || named.startsWith(`${field}.`) || named.startsWith(`${field}[`);
    expect(ok, `${where}: ${field} = ${JSON.stringify(value)} is refused as ${JSON.stringify(first)}`).toBe(true);
    expect(first, where).toMatch(/allowed/);
    if (typeof value === 'number' && Number.isFinite(value)) expect(first.includes(String(value)) || /\de[+-]?\d/.test(first), `${where}: value missing in ${first}`).toBe(true);
  }

  it('spec: each field of the schema, each table field and each model parameter set wrong on its own', () => {
    let checked = 0;
    for (const [k, s] of Object.entries(SPEC_SCHEMA.properties) as Array<[string, any]>) {
      if (s.type === 'object' && s.properties) {
        for (const [k2, s2] of Object.entries(s.properties) as Array<[string, any]>) {
          for (const v of wrongValues(s2)) {
            expectNamed(`${k}.${k2}`, v, problemsOf(() => validateSpec({ ...base, [k]: { ...(tables[k] ?? {}), [k2]: v } })), 'spec');
            checked++;
          }
        }
      } else {
        for (const v of wrongValues(s)) {
          expectNamed(k, v, problemsOf(() => validateSpec({ ...base, [k]: v })), 'spec');
          checked++;
        }
      }
    }
    for (const d of MODELS) {
      for (const p of d.params) {
        for (const v of ['x', true, p.min - 1, p.max + 1, 1e-300, -1]) {
          expectNamed(`params.${p.name}`, v, problemsOf(() => validateSpec({ ...base, model: d.kind, params: { [p.name]: v } })), d.kind);
          checked++;
        }
      }
    }
    expect(checked).toBeGreaterThan(300);
  });

  it('spec: a pair that contradicts itself is named by one field with the other and its value beside it', () => {
    const pairs: Array<[string, string, Record<string, unknown>]> = [
      ['clusters', 'target.max_clusters', { ...base, clusters: 60, target: { half_width: 0.1, max_clusters: 50 } }],
      ['target.min_clusters', 'target.max_clusters', { ...base, target: { half_width: 0.1, max_clusters: 5, min_clusters: 10 } }],
      ['analysis.fit_min_size', 'analysis.fit_max_size', { ...base, analysis: { fit_min_size: 100, fit_max_size: 50 } }],
      ['analysis.fit_min_size', 'particles', { ...base, analysis: { fit_min_size: 5000 } }],
      ['analysis.mass_radius_min_radius', 'analysis.mass_radius_max_radius', { ...base, analysis: { mass_radius_min_radius: 10, mass_radius_max_radius: 5 } }],
      ['analysis.resamples', 'clusters', { ...base, clusters: 10000, analysis: { resamples: 1000000 } }],
      ['checkpoint_every_particles', 'particles', { ...base, checkpoint_every_particles: 5000 }],
      ['positions.at_sizes[0]', 'particles', { ...base, positions: { at_sizes: [5000] } }],
      ['probe.at_sizes[0]', 'particles', { ...base, probe: { walkers: 1000, at_sizes: [5000] } }],
      ['probe.jobs', 'probe.walkers', { ...base, probe: { walkers: 100, jobs: 200 } }],
      ['params.min_step', 'particles', { ...base, particles: 100000000, params: { min_step: 1e-5 } }],
      ['params.min_step', 'particles', { ...base, model: 'dla-offlattice-3d', particles: 100000000, params: { min_step: 1e-5 } }],
    ];
    for (const [field, other, doc] of pairs) {
      const first = problemsOf(() => validateSpec(doc))[0] ?? '';
      expect(fieldOf(first), first).toBe(field);
      expect(first, first).toMatch(/allowed/);
      const otherValue = other === 'particles' ? String(doc.particles) : other === 'clusters' ? String(doc.clusters) : '';
      expect(first.includes(other.split('.').pop()!) || (otherValue !== '' && first.includes(otherValue)), `${field} vs ${other}: ${first}`).toBe(true);
    }
  });

  it('POST /probes: each field set wrong on its own, and the point lists', () => {
    const body = { walkers: 1000, seed: 1, points: { x: [0, 3], y: [0, 0], r: 1 } };
    for (const k of ['walkers', 'jobs', 'contact_sample', 'min_step', 'q', 'window', 'seed', 'name']) {
      for (const v of ['x', true, [], {}, -1, 1e300, 0]) expectNamed(k, v, problemsOf(() => validateProbeRequest({ ...body, [k]: v })), 'probe request');
    }
    const cases: Array<[string, Record<string, unknown>]> = [
      ['points.x', { ...body, points: { x: [], y: [], r: 1 } }],
      ['points.y', { ...body, points: { x: [0, 1, 2], y: [0, 0], r: 1 } }],
      ['points.r', { ...body, points: { x: [0, 3], y: [0, 0], r: [1] } }],
      ['points.x[1]', { ...body, points: { x: [0, 'a'], y: [0, 0], r: 1 } }],
      ['jobs', { ...body, walkers: 100, jobs: 200 }],
    ];
    for (const [field, doc] of cases) expect(fieldOf(problemsOf(() => validateProbeRequest(doc))[0] ?? '')).toBe(field);
  });

  it('command line: the option the user typed is named, not the spec field it fills', async () => {
    // grow: a parameter below the model's floor for this size
    expect(problemsOf(() => parseGrowOptions({ particles: '100', seed: '1', out: '/tmp/x', param: ['min_step=1e-300'] }))[0]).toBe(
      '--param min_step: 1e-300 is out of range; allowed: a number from 0.000001 to 1 for 100 particles (particle diameters; a smaller step is lost in the float spacing of the coordinates)',
    );
    expect(problemsOf(() => parseGrowOptions({ particles: '100', seed: '1' }))[0]).toBe('--out: missing; allowed: a folder name (created if missing)');
    // run / summary: analysis overrides, checked against the ensemble's own size
    const size = { particles: 200, clusters: 4 };
    const cli = async (base: Record<string, number>, o: Record<string, string>) => analysisSettingsFromCli(base, o, size).then(() => '', (err: unknown) => messageOf(err));
    expect(await cli({}, { fitWindow: '500:100' })).toBe('--fit-window FROM: 500 is not allowed; allowed: a number below --fit-window TO (100)');
    expect(await cli({}, { fitWindow: '5000:' })).toBe('--fit-window FROM: 5000 is out of range; allowed: a number from 1 to below particles (200)');
    expect(await cli({ fitMaxSize: 100 }, { fitWindow: '150:' })).toBe('--fit-window FROM: 150 is not allowed; allowed: a number below analysis.fit_max_size (100)');
    expect(await cli({}, { level: '2' })).toBe('--level: 2 is out of range; allowed: a number from 0.5 to 0.999');
    expect(await cli({}, { massRadiusWindow: '60:10' })).toBe('--mass-radius-window FROM: 60 is not allowed; allowed: a number below --mass-radius-window TO (10)');
    // probe: the window option in the same words as every other refusal
    expect(problemsOf(() => parseWindowOption('0.5:0.4'))[0]).toMatch(/^--window: "0\.5:0\.4" is not allowed; allowed: lo:hi, /);
  });
});
