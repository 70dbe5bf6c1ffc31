/**
 * Layering, checked by dependency-cruiser with the rules of
 * .dependency-cruiser.cjs: no import cycles, worker/ imports only worker/ and
 * proto/ of ours, the pure kernels import no runtime, Node built-in or npm
 * package, proto/ imports only proto/. The second test plants each kind of
 * violation in a scratch tree to show the rules catch them.
 */
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = resolve(__dirname, '..');
const CONFIG = join(ROOT, '.dependency-cruiser.cjs');
const DEPCRUISE = join(ROOT, 'node_modules', 'dependency-cruiser', 'bin', 'dependency-cruise.mjs');

interface Violation {
  from: string;
  to: string;
  rule: { name: string };
}

function cruise(cwd: string, dirs: string[]): { violations: Violation[]; cruised: number } {
  let out: string;
  try {
    out = execFileSync(process.execPath, [DEPCRUISE, ...dirs, '--config', CONFIG, '--output-type', 'json'], { cwd, encoding: 'utf8', maxBuffer: 64 << 20 });
  } catch (err) {
    // exits non-zero when it finds errors; the JSON is still on stdout
    out = (err as { stdout?: string }).stdout ?? '';
    if (out === '') throw err;
  }
  const r = JSON.parse(out) as { summary: { violations: Violation[]; totalCruised: number } };
  return { violations: r.summary.violations, cruised: r.summary.totalCruised };
}

describe('layering', () => {
  it('worker/, coordinator/ and proto/ keep the rules of .dependency-cruiser.cjs', () => {
    const r = cruise(ROOT, ['worker', 'coordinator', 'proto']);
    expect(r.cruised).toBeGreaterThan(100);
    expect(r.violations.map((v) => `${v.rule.name}: ${v.from} -> ${v.to}`)).toEqual([]);
  }, 120_000);

  it('the rules catch a cycle, worker/ importing coordinator/, an impure kernel and proto/ importing worker/', () => {
    const dir = mkdtempSync(join(tmpdir(), 'tendril-layering-'));
    try {
      const files: Record<string, string> = {
        'tsconfig.json': JSON.stringify({ compilerOptions: { module: 'NodeNext', moduleResolution: 'NodeNext', strict: true } }),
        'package.json': JSON.stringify({ type: 'module' }),
        'worker/runtime/run.ts': "import { b } from '../../coordinator/b.js';\nexport const a = b;\n",
        'coordinator/b.ts': "import { c } from './c.js';\nexport const b = c + 1;\n",
        'coordinator/c.ts': "import { b } from './b.js';\nexport const c = 1;\nexport const d = () => b;\n",
        'worker/core/k.ts': "import { readFileSync } from 'node:fs';\nimport { a } from '../runtime/run.js';\nexport const k = [readFileSync, a];\n",
        'proto/p.ts': "import { k } from '../worker/core/k.js';\nexport const p = k;\n",
      };
      for (const [name, text] of Object.entries(files)) {
        mkdirSync(dirname(join(dir, name)), { recursive: true });
        writeFileSync(join(dir, name), text);
      }
      const rules = new Set(cruise(dir, ['worker', 'coordinator', 'proto']).violations.map((v) => v.rule.name));
      expect([...rules].sort()).toEqual(['kernels-are-pure', 'kernels-no-core-modules', 'no-circular', 'proto-imports-proto-only', 'worker-imports-worker-and-proto-only']);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  }, 120_000);
});
