import { afterEach, describe, expect, it, vi } from 'vitest';
import { main } from '../coordinator/cli.js';
import { MODELS } from '../worker/models/registry.js';
import { describeRange } from '../worker/core/value-range.js';

/** Run the CLI in this process and capture what it writes. */
async function cli(...args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = '';
  let stderr = '';
  const out = vi.spyOn(process.stdout, 'write').mockImplementation((s: string | Uint8Array) => ((stdout += String(s)), true));
  const err = vi.spyOn(process.stderr, 'write').mockImplementation((s: string | Uint8Array) => ((stderr += String(s)), true));
  try {
    const code = await main(['node', 'tendril', ...args]);
    return { code, stdout, stderr };
  } finally {
    out.mockRestore();
    err.mockRestore();
  }
}

afterEach(() => {
  process.exitCode = undefined;
});

describe('tendril models', () => {
  it('lists every registered model with its definition, parameters and reference values', async () => {
    const r = await cli('models');
    expect(r.code).toBe(0);
    for (const d of MODELS) {
      expect(r.stdout).toContain(`${d.kind}  (${d.dimension}D`);
      expect(r.stdout).toContain(d.definition);
      for (const p of d.params) {
        expect(r.stdout).toContain(`    ${p.name} = ${p.default}${p.unit ? ` ${p.unit}` : ''} (default); allowed: ${describeRange(p)}; ${p.meaning}`);
      }
      const ref = d.reference.dimension;
      if (ref) expect(r.stdout).toContain(`D = ${ref.value} ± ${ref.uncertainty} (${ref.source})`);
      for (const b of d.reference.bounds) expect(r.stdout).toContain(b.source);
    }
  });

  it('--format json carries the same facts, machine-readable', async () => {
    const r = await cli('models', '--format', 'json');
    expect(r.code).toBe(0);
    const doc = JSON.parse(r.stdout) as { models: Array<{ kind: string; params: Array<Record<string, unknown>>; reference: { dimension: { value: number; error: number; source: string } | null } }> };
    expect(doc.models.map((m) => m.kind)).toEqual(MODELS.map((m) => m.kind));
    for (const [i, d] of MODELS.entries()) {
      expect(doc.models[i].params.map((p) => [p.name, p.unit, p.default, p.min, p.max, p.meaning])).toEqual(d.params.map((p) => [p.name, p.unit, p.default, p.min, p.max, p.meaning]));
      expect(doc.models[i].reference.dimension).toEqual(d.reference.dimension ? { value: d.reference.dimension.value, error: d.reference.dimension.uncertainty, source: d.reference.dimension.source } : null);
    }
  });

  it('refuses an unknown format in one line', async () => {
    const r = await cli('models', '--format', 'yaml');
    expect(r.code).toBe(2);
    expect(r.stderr).toBe('tendril: --format: "yaml" is not allowed; allowed: one of text, json\n');
  });

  it('tendril --help lists the models', async () => {
    const r = await cli('--help');
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('Models (details: tendril models):');
    for (const d of MODELS) expect(r.stdout).toMatch(new RegExp(`^  ${d.kind} +${d.definition.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}$`, 'm'));
    expect(r.stdout).toMatch(/^ +models \[options\] +list every growth model/m);
  });
});
