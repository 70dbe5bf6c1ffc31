/** One place for error kinds: every error tendril throws on purpose is a TendrilError with a kind and a one-line message. */
import { readFileSync, readdirSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { firstLine, kindOf, messageOf, TendrilError } from '../proto/errors.js';
import { ContractError } from '../proto/convert.js';
import { UsageError } from '../coordinator/usage-error.js';
import { SpecError } from '../coordinator/spec/index.js';
import { SnapshotError } from '../coordinator/snapshot/cluster-snapshot.js';
import { StatsInputError } from '../coordinator/stats/ensemble-data.js';
import { ProbeRequestError } from '../coordinator/farm/probe-requests.js';
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
