/**
 * Framed checkpoints (proto/checkpoint-frame.ts) and their streamed files
 * (proto/checkpoint-file.ts): every model's checkpoint survives the frame
 * and the file to the same final state hash; checkpoints written as one
 * protobuf message (before frames) are still read; a damaged file is refused
 * with one line; a kernel resumed from a file with room for its run keeps
 * that array (no second copy of the cluster); and `tendril grow` killed with
 * SIGKILL after a checkpoint resumes with --resume to the uninterrupted hash.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { decodeCheckpoint, encodeCheckpoint, encodeCheckpointMessage, type CheckpointData, type RunTaskData } from '../proto/convert.js';
import { readCheckpointFile, writeCheckpointFile } from '../proto/checkpoint-file.js';
import { isCheckpointFrame } from '../proto/checkpoint-frame.js';
import { ENGINE_VERSION } from '../worker/core/engine-version.js';
import type { GrowthCheckpoint, GrowthTask } from '../worker/core/growth-kernel.js';
import { createKernel, MODELS, modelParams } from '../worker/models/registry.js';
import { OffLatticeDla2d } from '../worker/models/dla-offlattice-2d/kernel.js';

const CLI = fileURLToPath(new URL('../dist/coordinator/cli.js', import.meta.url));
let work: string;

beforeAll(() => {
  work = mkdtempSync(join(tmpdir(), 'tendril-checkpoint-file-'));
});
afterAll(() => {
  if (work !== undefined) rmSync(work, { recursive: true, force: true });
});

function runOf(task: GrowthTask): RunTaskData {
  return { ...task, ensembleId: 'e1', checkpointIntervalSeconds: 8, checkpointEveryParticles: 0, engineVersion: ENGINE_VERSION };
}

function taskOf(kind: string, particles = 600): GrowthTask {
  return { model: modelParams(kind), particles, ensembleSeed: '99', runIndex: 1, recordsPerDecade: 10 };
}

function finalHash(task: GrowthTask, cp?: GrowthCheckpoint): string {
  const k = createKernel(task, cp);
  k.growTo(task.particles);
  return k.result().stateHash;
}

describe('checkpoint views', () => {
  // the models that grow giant clusters write their checkpoints from a view of their own
  // positions (GrowthKernel.checkpointView): a copy would put a second whole-cluster array beside
  // the first at every checkpoint (1.6 GB at 10^8 in 2D)
  const WITH_VIEW = ['dla-offlattice-2d', 'dla-square', 'dla-triangular', 'eden-square', 'eden-triangular', 'eden-offlattice-2d', 'dbm-square-walkers'];
  for (const kind of WITH_VIEW) {
    it(`${kind}: the view is the checkpoint, with the kernel's own positions array`, () => {
      const k = createKernel(taskOf(kind));
      k.growTo(300);
      expect(k.checkpointView).toBeDefined();
      const view = k.checkpointView!();
      const copy = k.checkpoint();
      expect(view.positions.buffer).toBe(k.positions().coords.buffer);
      expect(copy.positions.buffer).not.toBe(k.positions().coords.buffer);
      expect({ ...view, positions: Array.from(view.positions) }).toEqual({ ...copy, positions: Array.from(copy.positions) });
    });
  }
});

describe('framed checkpoints', () => {
  for (const d of MODELS) {
    const kind = d.kind;
    it(`${kind}: frame in memory and streamed file both resume to the uninterrupted hash`, () => {
      const task = taskOf(kind);
      const whole = finalHash(task);
      const k = createKernel(task);
      k.growTo(250);
      const c: CheckpointData = { run: runOf(task), state: k.checkpointView ? k.checkpointView() : k.checkpoint(), growSeconds: 1.5, startedAtMs: 7, resumes: 2 };
      const bytes = encodeCheckpoint(c);
      expect(isCheckpointFrame(bytes)).toBe(true);
      const path = join(work, `${kind}.checkpoint`);
      const written = writeCheckpointFile(path, c);
      // the file and the in-memory frame are the same bytes
      expect(written).toBe(bytes.length);
      expect(Buffer.compare(readFileSync(path), Buffer.from(bytes))).toBe(0);
      const fromFrame = decodeCheckpoint(bytes);
      const fromFile = readCheckpointFile(path);
      for (const r of [fromFrame, fromFile]) {
        expect(r.state.count).toBe(250);
        expect(r.growSeconds).toBe(1.5);
        expect(r.resumes).toBe(2);
        expect(r.run).toEqual(c.run);
        expect(r.state.series).toEqual(c.state.series);
        expect(finalHash(task, r.state)).toBe(whole);
      }
      // three growths of 600 particles: dbm-square (a Laplace solve per particle) takes about 7 s on a loaded core
    }, 120_000);
  }

  it('reads a checkpoint written as one protobuf message (the layout before frames)', () => {
    const task = taskOf('dla-offlattice-2d');
    const k = createKernel(task);
    k.growTo(300);
    const c: CheckpointData = { run: runOf(task), state: k.checkpoint(), growSeconds: 3, startedAtMs: 1, resumes: 0 };
    const old = encodeCheckpointMessage(c);
    expect(isCheckpointFrame(old)).toBe(false);
    const path = join(work, 'old.checkpoint');
    writeFileSync(path, old);
    for (const r of [decodeCheckpoint(old), readCheckpointFile(path)]) {
      expect(Array.from(r.state.positions.subarray(0, 600))).toEqual(Array.from(c.state.positions.subarray(0, 600)));
      expect(finalHash(task, r.state)).toBe(finalHash(task));
    }
  });

  it('refuses a damaged frame with one line naming the checksum', () => {
    const task = taskOf('dla-offlattice-2d');
    const k = createKernel(task);
    k.growTo(200);
    const bytes = encodeCheckpoint({ run: runOf(task), state: k.checkpoint(), growSeconds: 0, startedAtMs: 0, resumes: 0 });
    bytes[bytes.length - 100] ^= 1;
    const path = join(work, 'damaged.checkpoint');
    writeFileSync(path, bytes);
    expect(() => decodeCheckpoint(bytes)).toThrow(/^checkpoint checksum mismatch: stored CRC-32 0x[0-9a-f]{8}, computed 0x[0-9a-f]{8}$/);
    expect(() => readCheckpointFile(path)).toThrow(/^checkpoint checksum mismatch in ".*": stored CRC-32/);
    writeFileSync(path, bytes.subarray(0, bytes.length - 13));
    expect(() => readCheckpointFile(path)).toThrow(/not a whole frame|checksum mismatch/);
  });

  it('a 2D kernel resumed with room for its run keeps the read array as its positions', () => {
    const task = taskOf('dla-offlattice-2d', 800);
    const k = createKernel(task);
    k.growTo(400);
    const path = join(work, 'room.checkpoint');
    writeCheckpointFile(path, { run: runOf(task), state: k.checkpointView!(), growSeconds: 0, startedAtMs: 0, resumes: 0 });
    const c = readCheckpointFile(path, task.particles);
    expect(c.state.positions.length).toBe(2 * task.particles);
    const resumed = createKernel(task, c.state);
    expect(resumed.positions().coords).toBe(c.state.positions);
    resumed.growTo(task.particles);
    expect(resumed.result().stateHash).toBe(finalHash(task));
  });

  it('a 2D kernel resumed from a file rebuilds an index of the same size as the one that grew to that count (reserved for the whole run: nothing grows by copying on resume)', () => {
    const task = taskOf('dla-offlattice-2d', 20_000);
    const grown = new OffLatticeDla2d(task);
    grown.growTo(12_000);
    const path = join(work, 'index.checkpoint');
    writeCheckpointFile(path, { run: runOf(task), state: grown.checkpointView(), growSeconds: 0, startedAtMs: 0, resumes: 0 });
    const resumed = new OffLatticeDla2d(task, readCheckpointFile(path, task.particles).state);
    expect(resumed.count).toBe(12_000);
    // the index's allocation (reservations included) is a function of the run's size and of the tiles its particles touch, not of how they arrived
    expect(resumed.indexBytes).toBe(grown.indexBytes);
    grown.growTo(task.particles);
    resumed.growTo(task.particles);
    expect(resumed.result().stateHash).toBe(grown.result().stateHash);
  });
});

describe('tendril grow --checkpoint-every / --resume', () => {
  it('killed with SIGKILL after a checkpoint, resumes to the hash of an uninterrupted run', async () => {
    if (!existsSync(CLI)) throw new Error(`${CLI} is missing; run npm run build first`);
    const N = 250_000; // more than one 0.5 s checkpoint interval of growth on any machine (about 1.6 s at 160,000/s)
    const out = join(work, 'killed');
    const child = spawn(process.execPath, [CLI, 'grow', '--particles', String(N), '--seed', '5', '--out', out, '--quiet', '--checkpoint-every', '0.5'], { stdio: 'ignore' });
    let gone = false;
    const exited = new Promise<void>((resolve) => child.on('exit', () => ((gone = true), resolve())));
    const checkpoint = join(out, 'grow.checkpoint');
    while (!existsSync(checkpoint) && !gone) await new Promise((r) => setTimeout(r, 50));
    expect(gone, 'the grow ended before its first checkpoint').toBe(false);
    child.kill('SIGKILL');
    await exited;
    expect(existsSync(join(out, 'run-result.json'))).toBe(false);
    const at = readCheckpointFile(checkpoint).state.count;
    expect(at).toBeLessThan(N);
    const r = spawnSync(process.execPath, [CLI, 'grow', '--particles', String(N), '--seed', '5', '--out', out, '--quiet', '--resume'], { encoding: 'utf8', timeout: 600_000 });
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const result = JSON.parse(readFileSync(join(out, 'run-result.json'), 'utf8')) as { stateHash: string };
    expect(result.stateHash).toBe(finalHash({ model: modelParams('dla-offlattice-2d'), particles: N, ensembleSeed: '5', runIndex: 0, recordsPerDecade: 10 }));
    expect(existsSync(checkpoint)).toBe(false);
  }, 900_000);

  it('refuses --resume without a checkpoint, and one of another cluster, with one line', () => {
    const out = join(work, 'none');
    let r = spawnSync(process.execPath, [CLI, 'grow', '--particles', '1000', '--seed', '5', '--out', out, '--resume'], { encoding: 'utf8' });
    expect(r.status).not.toBe(0);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/--resume: no checkpoint at ".*grow\.checkpoint"; allowed: /);
    const task: GrowthTask = { model: modelParams('dla-offlattice-2d'), particles: 1000, ensembleSeed: '5', runIndex: 0, recordsPerDecade: 10 };
    const k = createKernel(task);
    k.growTo(100);
    const other = join(work, 'other');
    spawnSync('mkdir', ['-p', other]);
    writeCheckpointFile(join(other, 'grow.checkpoint'), { run: { ...runOf(task), ensembleId: 'grow' }, state: k.checkpoint(), growSeconds: 0, startedAtMs: 0, resumes: 0 });
    r = spawnSync(process.execPath, [CLI, 'grow', '--particles', '1000', '--seed', '6', '--out', other, '--resume'], { encoding: 'utf8' });
    expect(r.status).not.toBe(0);
    expect(r.stderr.trim()).toMatch(/^tendril: --seed: 6 differs from the checkpoint's 5; allowed: the options of the interrupted run$/);
    r = spawnSync(process.execPath, [CLI, 'grow', '--particles', '1000', '--seed', '5', '--out', other, '--checkpoint-every', '0.1'], { encoding: 'utf8' });
    expect(r.stderr.trim()).toMatch(/--checkpoint-every/);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
  });
});
