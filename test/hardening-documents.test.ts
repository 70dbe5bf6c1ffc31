/**
 * Issue #11 items 6 and 7: deep nesting is a 400 with one line (API and
 * CLI), and error building is bounded: excerpts of at most 60 characters,
 * escaped key names, at most 20 problems listed, work linear in the document
 * (coordinator/spec/document-limits.ts).
 */
import { execFile } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { describe, expect, it } from 'vitest';
import { excerpt, fieldKey, MAX_LISTED_PROBLEMS, nestingProblem } from '../coordinator/spec/document-limits.js';
import { CLI, ROOT } from './farm-helpers.js';
import { problemsOf } from './support/spec-problems.js';
import { farmFixture } from './support/farm-fixture.js';

const TOKEN = 'hardening-documents-token';
const { artifacts: dir, api } = farmFixture('harddoc');
const app = api({ token: TOKEN, limits: { maxTotalParticles: 1e9 }, bodyLimit: 4 << 20 });
const auth = { authorization: `Bearer ${TOKEN}`, 'content-type': 'application/json' };

const nested = (depth: number) => '{"a":'.repeat(depth) + '1' + '}'.repeat(depth);

describe('deep nesting', () => {
  it.each([
    ['/ensembles', `{"model":"dla-offlattice-2d","particles":10,"clusters":1,"seed":1,"params":${nested(5000)}}`, 'params: nested more than 32 levels deep; allowed: at most 32 levels of tables and lists'],
    ['/ensembles', nested(100_000), 'a: nested more than 32 levels deep; allowed: at most 32 levels of tables and lists'],
    ['/probes', `{"walkers":100,"seed":1,"points":${nested(5000)}}`, 'points: nested more than 32 levels deep; allowed: at most 32 levels of tables and lists'],
    ['/ensembles', '['.repeat(5000) + ']'.repeat(5000), 'spec: nested more than 32 levels deep; allowed: at most 32 levels of tables and lists'],
  ])('POST %s nested deep is a 400 with one line', async (url, payload, msg) => {
    const r = await app.inject({ method: 'POST', url, headers: auth, payload });
    expect(r.statusCode).toBe(400);
    expect(r.json().error).toBe(msg);
  });

  it('the CLI refuses a deeply nested spec file with one line and exit code 2', async () => {
    const file = join(dir, 'deep.json');
    writeFileSync(file, nested(5000));
    let code = 0;
    let stderr = '';
    try {
      await promisify(execFile)(process.execPath, [CLI, 'run', file, '--out', join(dir, 'out'), '--progress', 'none'], { cwd: ROOT });
    } catch (e) {
      ({ code, stderr } = e as { code: number; stderr: string });
    }
    expect(code).toBe(2);
    expect(stderr).toBe(`tendril: spec file "${file}": a: nested more than 32 levels deep; allowed: at most 32 levels of tables and lists\n`);
  });

  it('32 levels are allowed by the walk; 33 are not', () => {
    expect(nestingProblem(JSON.parse(nested(32)), 'spec')).toBeNull();
    expect(nestingProblem(JSON.parse(nested(33)), 'spec')).toMatch(/^a: nested more than 32/);
  });
});

describe('error building is bounded', () => {
  it('a document of 100,000 unknown keys lists at most 20 problems, each one bounded line', () => {
    const doc: Record<string, number> = {};
    for (let i = 0; i < 100_000; i++) doc[`k${i}`] = i;
    const p = problemsOf(doc);
    expect(p.length).toBe(MAX_LISTED_PROBLEMS + 1);
    expect(p[MAX_LISTED_PROBLEMS]).toBe(`spec: more problems than these ${MAX_LISTED_PROBLEMS}; allowed: fix these and submit again to see the rest`);
    for (const line of p) {
      expect(line).not.toContain('\n');
      expect(line.length).toBeLessThan(400);
    }
  });

  it('key names with newlines or terminal escapes are printed escaped', async () => {
    const p = problemsOf({ model: 'dla-offlattice-2d', particles: 10, clusters: 1, seed: 1, 'bad\nkey\u001b[31m': 1 });
    expect(p[0]).toBe('"bad\\nkey\\u001b[31m": unknown field; allowed fields: name, model, params, particles, clusters, seed, records_per_decade, observables, checkpoint_interval_seconds, checkpoint_every_particles, runs_per_job, analysis, probe, positions, target');
    const q = problemsOf({ model: 'dla-offlattice-2d', particles: 10, clusters: 1, seed: 1, params: { 'x\u001b]0;pwn\u0007': 1 } });
    expect(q[0]).toMatch(/^params\."x\\u001b\]0;pwn\\u0007": not a parameter of dla-offlattice-2d/);
    const r = await app.inject({ method: 'POST', url: '/probes', headers: auth, payload: JSON.stringify({ walkers: 100, seed: 1, csv: '0,0,1', 'k\r\n\u009b2J': 1 }) });
    expect(r.json().error).toMatch(/^"k\\r\\n\\u009b2J": unknown field; allowed fields: name, csv, points, walkers, /);
  });

  it('excerpts stop at their budget whatever the value', () => {
    const big = { a: 'x'.repeat(1_000_000), b: Array.from({ length: 100_000 }, (_, i) => i) };
    expect(excerpt(big)).toBe(`{"a":"${'x'.repeat(51)}...`);
    expect(excerpt(big).length).toBe(60);
    expect(excerpt([1, 2, 3])).toBe('[1,2,3]');
    expect(excerpt('line\nbreak')).toBe('"line\\nbreak"');
    expect(fieldKey('x'.repeat(100))).toBe(`"${'x'.repeat(40)}..."`);
  });
});
