import { execFile } from 'node:child_process';
import { readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { Command, Help } from 'commander';
import { Redis } from 'ioredis';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { COMMANDS } from '../coordinator/cli.js';
import { EnsembleStore } from '../coordinator/farm/store.js';
import { parseSpec } from '../coordinator/spec/index.js';
import { CLI, deleteKeys, REDIS_URL, ROOT, tempDir, uniquePrefix } from './farm-helpers.js';

// `tendril --help` lists the commands from the table in coordinator/cli.ts
// without loading their modules (start-up time; measured by
// scripts/measure-startup.mjs, never in a test). The table must say what the
// modules register.

describe('the CLI command table', () => {
  it('matches, for every command, the term and description its module registers', async () => {
    for (const e of COMMANDS) {
      const program = new Command();
      (await e.load()).register(program);
      const name = e.term.split(' ')[0];
      const cmd = program.commands.find((c) => c.name() === name);
      expect(cmd, `module of "${name}" registers it`).toBeDefined();
      expect(new Help().subcommandTerm(cmd!)).toBe(e.term);
      expect(cmd!.description()).toBe(e.description);
    }
  });

  it('lists every command a module registers', async () => {
    const all = new Set<string>();
    for (const e of COMMANDS) {
      const program = new Command();
      (await e.load()).register(program);
      for (const c of program.commands) all.add(c.name());
    }
    expect([...all].sort()).toEqual(COMMANDS.map((e) => e.term.split(' ')[0]).sort());
  });
});

// What the read-only farm commands load (start-up time: they must not pay
// for ioredis, BullMQ, ajv, protobufjs or the model kernels; measured by
// scripts/measure-startup.mjs, never timed here). The list of modules is
// taken from a resolve hook (test/support/module-trace.mjs).
describe('what the read-only commands load', () => {
  const prefix = uniquePrefix('startup');
  const redis = new Redis(REDIS_URL, { maxRetriesPerRequest: null });
  const dir = tempDir('startup');
  const HEAVY = [/node_modules\/ioredis\//, /node_modules\/bullmq\//, /node_modules\/ajv\//, /node_modules\/protobufjs\//, /dist\/worker\/models\//, /dist\/coordinator\/spec\//];
  let id = '';

  beforeAll(async () => {
    id = 'estartup1';
    const spec = parseSpec(JSON.stringify({ name: 'startup', model: 'dla-offlattice-2d', particles: 200, clusters: 3, seed: 1, probe: { walkers: 1000, at_sizes: [100] } }), 'json');
    const store = new EnsembleStore(redis, prefix);
    await store.create(id, spec, 3);
    await redis.hset(`${prefix}:ensemble:${id}:failed`, '2', 'a reason');
  });

  afterAll(async () => {
    await deleteKeys(redis, prefix);
    redis.disconnect();
    rmSync(dir, { recursive: true, force: true });
  });

  async function traced(...args: string[]): Promise<{ code: number; stdout: string; modules: string[] }> {
    const file = join(dir, `trace-${args[0]}-${Date.now()}.txt`);
    writeFileSync(file, '');
    const r = await new Promise<{ code: number; stdout: string }>((resolve) =>
      execFile(process.execPath, ['--import', join(ROOT, 'test/support/module-trace.mjs'), CLI, ...args, '--prefix', prefix], { cwd: ROOT, env: { ...process.env, REDIS_URL, MODULE_TRACE_FILE: file } }, (err, stdout) =>
        resolve({ code: err ? Number((err as { code?: number }).code) : 0, stdout }),
      ),
    );
    return { ...r, modules: readFileSync(file, 'utf8').split('\n').filter((l) => l.startsWith('file:')) };
  }

  it('status, list and watch answer without ioredis, BullMQ, ajv, protobufjs, the spec module or any model', async () => {
    const status = await traced('status', id, '--json');
    expect(status.code).toBe(0);
    const s = JSON.parse(status.stdout);
    // the same status the store computes (the store and the CLI share coordinator/farm/ensemble-status.ts)
    expect(s).toEqual(await new EnsembleStore(redis, prefix).status(id));
    expect(s.runs).toEqual({ planned: 3, queued: 2, running: 0, done: 0, failed: 1 });
    expect(s.probes.planned).toBe(6);
    const list = await traced('list');
    expect(list.stdout).toContain(id);
    // the ensemble never ends here, so watch is asked about an unknown id: it connects, reads and refuses
    const watch = await traced('watch', 'enotthere', '--progress', 'none');
    expect(watch.code).toBe(2);
    for (const r of [status, list, watch]) {
      expect(r.modules.some((m) => m.includes('/dist/coordinator/farm/ensemble-status.js')), 'the trace sees our modules').toBe(true);
      expect(r.modules.filter((m) => HEAVY.some((h) => h.test(m)))).toEqual([]);
    }
  });

  it('summary loads the protobuf code it decodes results with (the trace sees packages), but neither ioredis nor BullMQ', async () => {
    const summary = await traced('summary', id, '--resamples', '10');
    expect(summary.code).toBe(0);
    expect(JSON.parse(summary.stdout).ensemble_id).toBe(id);
    expect(summary.modules.some((m) => /node_modules\/protobufjs\//.test(m))).toBe(true);
    expect(summary.modules.filter((m) => /node_modules\/(ioredis|bullmq)\//.test(m))).toEqual([]);
  });
});
