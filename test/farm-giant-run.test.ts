/**
 * One large cluster as one long farm job (issue 16): the growth thread
 * streams its checkpoints into the artifact folder, a worker killed with
 * SIGKILL loses at most one checkpoint interval, a fresh worker resumes from
 * the newest checkpoint to the very state an uninterrupted run reaches, and
 * `tendril watch` shows the run's particles while it grows; a resumed run
 * that keeps positions hands its final positions from the growth thread to
 * the main thread by moving the kernel's own array (no copy), bit for bit
 * those of the uninterrupted run.
 *
 * The rule for the lost work (exact, derived here): with checkpoints every E
 * particles, lost = P − R, where P is the last particle count the killed
 * worker reported (its progress entry in Redis, left as it was by the kill)
 * and R is the count of the checkpoint the fresh worker resumes from (the
 * file in the artifact folder after the kill). It must be at most the
 * particles between the two newest checkpoints the killed worker logged
 * (= E). Growth pauses while a checkpoint is written, so a kill in the
 * middle of a write (the newest file is then the one before) still loses at
 * most E particles.
 *
 * Nothing here depends on speed: the test waits for events (checkpoints
 * logged, a progress line printed, the result stored), never for a time.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { Redis } from 'ioredis';
import { afterAll, describe, expect, it } from 'vitest';
import { readCheckpointFile } from '../proto/checkpoint-file.js';
import { isCheckpointFrame } from '../proto/checkpoint-frame.js';
import { launchEnsemble, runQueue } from '../coordinator/farm/queue.js';
import { EnsembleStore } from '../coordinator/farm/store.js';
import { runTaskFor } from '../coordinator/plan.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { checkpointKey, finalKey } from '../worker/runtime/job-contract.js';
import { TaskThreadPool } from '../worker/runtime/task-thread.js';
import { runTask } from '../worker/runtime/task-runner.js';
import { encodeCheckpoint } from '../proto/convert.js';
import { DirectoryArtifactStore } from '../coordinator/farm/artifacts.js';
import { finalPositionsIn, putFinalState } from '../coordinator/farm/final-positions.js';
import { CLI, deleteKeys, REDIS_URL, ROOT, startWorker, stopWorker, tempDir, uniquePrefix, waitFor, type WorkerProc } from './farm-helpers.js';

const PARTICLES = 400_000;
const EVERY = 50_000;

const prefix = uniquePrefix('giant-run');
const artifacts = tempDir('giant-run-artifacts');
const redis = new Redis(REDIS_URL, { maxRetriesPerRequest: null });
const store = new EnsembleStore(redis, prefix);
const queue = runQueue(redis, prefix);
const workers: WorkerProc[] = [];
let watcher: ChildProcess | undefined;
const pool = new TaskThreadPool(1);

afterAll(async () => {
  watcher?.kill('SIGKILL');
  for (const w of workers) await stopWorker(w);
  await pool.close();
  await queue.close();
  await deleteKeys(redis, prefix);
  redis.disconnect();
  rmSync(artifacts, { recursive: true, force: true });
});

interface LogLine { msg: string; ensembleId?: string; particles?: number | null; resumed?: boolean; stateHash?: string; seconds?: number }

const logLines = (text: string): LogLine[] => text.split('\n').filter((l) => l.startsWith('{')).map((l) => JSON.parse(l) as LogLine);

describe('a giant cluster as one farm job', () => {
  it('checkpoints streamed to the artifact folder; SIGKILL loses at most one interval; the resumed run ends in the uninterrupted hash; watch shows its particles', async () => {
    const spec = validateSpec({ model: 'dla-offlattice-2d', particles: PARTICLES, clusters: 1, seed: 16, checkpoint_every_particles: EVERY });
    const first = await startWorker({ prefix, artifacts });
    workers.push(first);
    const id = await launchEnsemble(store, queue, spec);

    // `tendril watch` as a child, mid-run: one line per refresh on stderr
    let watchOut = '';
    watcher = spawn(process.execPath, [CLI, 'watch', id, '--redis', REDIS_URL, '--prefix', prefix, '--progress', 'lines', '--every', '1'], { cwd: ROOT, stdio: ['ignore', 'pipe', 'pipe'] });
    watcher.stdout!.on('data', (d) => (watchOut += d));
    watcher.stderr!.on('data', (d) => (watchOut += d));
    const watchExited = new Promise<number | null>((resolve) => watcher!.once('exit', (code) => resolve(code)));
    const progressLine = new RegExp(`: (\\d+)/${PARTICLES} particles \\(\\d+\\.\\d%\\)`, 'g');
    const midRunCounts = () => [...watchOut.matchAll(progressLine)].map((m) => Number(m[1])).filter((n) => n > 0 && n < PARTICLES);

    const checkpointed = () => logLines(first.output()).filter((l) => l.ensembleId === id && l.msg === 'run checkpointed').map((l) => l.particles as number);
    await waitFor('two checkpoints stored and a progress line of watch', async () => checkpointed().length >= 2 && midRunCounts().length > 0, 240_000);
    first.child.kill('SIGKILL');
    await first.exited;

    const logged = checkpointed();
    const file = join(artifacts, checkpointKey(id, 0));
    expect(existsSync(file)).toBe(true);
    // the thread wrote a frame (proto/checkpoint-frame.ts), not a protobuf message handed over whole
    const stored = readCheckpointFile(file);
    expect(isCheckpointFrame(readFileSync(file).subarray(0, 8))).toBe(true);
    const resumeFrom = stored.state.count;
    // the file is the newest checkpoint logged, or (killed between the rename and the log line) a newer one
    expect(resumeFrom).toBeGreaterThanOrEqual(logged[logged.length - 1]);
    expect(resumeFrom % EVERY).toBe(0);
    // the particles at the kill, as the killed worker last reported them (its progress entry stays after SIGKILL)
    const atKill = Number(await redis.hget(`${prefix}:ensemble:${id}:progress`, '0'));
    expect(atKill).toBeGreaterThan(0);
    const interval = logged[logged.length - 1] - logged[logged.length - 2];
    expect(interval).toBe(EVERY);
    expect(atKill - resumeFrom).toBeLessThanOrEqual(interval);

    // watch printed the run's particles while it grew
    expect(Math.min(...midRunCounts())).toBeLessThan(PARTICLES);

    // a fresh worker resumes from the checkpoint and finishes
    const second = await startWorker({ prefix, artifacts });
    workers.push(second);
    // the same run grown uninterrupted in a worker thread, meanwhile
    const reference = pool.run(runTaskFor(id, spec, 0)).outcome;
    await waitFor('the resumed run done', async () => (await store.status(id))?.state === 'done', 600_000);
    const [result] = await store.results(id);
    expect(result.timings.resumes).toBe(1);
    expect(result.particles).toBe(PARTICLES);
    const started = logLines(second.output()).find((l) => l.ensembleId === id && l.msg === 'run started');
    expect(started).toMatchObject({ resumed: true, particles: null });
    // it read the very checkpoint left by the kill (the read timed in its thread)
    const resumedAt = logLines(second.output()).find((l) => l.ensembleId === id && l.msg === 'run resumed');
    expect(resumedAt).toMatchObject({ particles: resumeFrom });
    expect(resumedAt!.seconds).toBeGreaterThanOrEqual(0);
    const ref = await reference;
    expect(ref.status).toBe('done');
    if (ref.status !== 'done') return;
    expect(result.stateHash).toBe(ref.result.stateHash);
    // the checkpoint is dropped once the result is stored, and no temporary file is left behind
    expect(existsSync(file)).toBe(false);
    expect(readdirSync(join(artifacts, id)).filter((n) => n.endsWith('.tmp'))).toEqual([]);
    // watch ends by itself with the ensemble
    expect(await watchExited).toBe(0);
    expect(watchOut).toMatch(new RegExp(`${id}  done .*${PARTICLES}/${PARTICLES} particles`));
  }, 900_000);

  it('the thread writes every checkpoint (and the one of a stop) into the file itself and hands none over; a run resumed from that file ends in the uninterrupted hash', async () => {
    const spec = validateSpec({ model: 'dla-offlattice-2d', particles: 40_000, clusters: 1, seed: 3, checkpoint_every_particles: 10_000 });
    const task = runTaskFor('thread-file', spec, 0);
    const path = join(artifacts, 'thread-file.checkpoint');
    const handed: Array<{ bytes: Uint8Array | null; count: number }> = [];
    let second: () => void = () => undefined;
    const twoCheckpoints = new Promise<void>((r) => (second = r));
    const h = pool.run(task, {
      checkpointFile: { path, resume: false },
      onCheckpoint: (bytes, count) => {
        handed.push({ bytes, count });
        if (handed.length === 2) second();
      },
    });
    await twoCheckpoints;
    h.stop();
    const stopped = await h.outcome;
    expect(handed.slice(0, 2)).toEqual([{ bytes: null, count: 10_000 }, { bytes: null, count: 20_000 }]);
    expect(handed.every((c) => c.bytes === null)).toBe(true);
    if (stopped.status === 'done') return; // finished before the stop landed (a very fast machine): nothing left to resume
    expect(stopped).toEqual({ status: 'stopped' });
    const onDisk = readCheckpointFile(path).state.count;
    expect(onDisk).toBeGreaterThanOrEqual(20_000);
    expect(onDisk).toBeLessThan(40_000);
    const resumed = await pool.run(task, { checkpointFile: { path, resume: true } }).outcome;
    const reference = await pool.run(task).outcome;
    expect(resumed.status).toBe('done');
    expect(reference.status).toBe('done');
    if (resumed.status !== 'done' || reference.status !== 'done') return;
    expect(resumed.result.timings.resumes).toBe(1);
    expect(resumed.result.stateHash).toBe(reference.result.stateHash);
  }, 300_000);

  it('a run that keeps positions, stopped and resumed from its checkpoint file, hands over its final positions moved from the thread: those of the uninterrupted run, bit for bit, and the same stored frame', async () => {
    const spec = validateSpec({ model: 'dla-offlattice-2d', particles: 30_000, clusters: 1, seed: 5, checkpoint_every_particles: 10_000 });
    const task = { ...runTaskFor('final-moved', spec, 0), keepPositions: true };
    const path = join(artifacts, 'final-moved.checkpoint');
    let first: () => void = () => undefined;
    const oneCheckpoint = new Promise<void>((r) => (first = r));
    const h = pool.run(task, { checkpointFile: { path, resume: false }, onCheckpoint: () => first() });
    await oneCheckpoint;
    h.stop();
    await h.outcome; // stopped, or done on a very fast machine: the file holds a checkpoint either way (written before it is reported)
    const resumed = await pool.run(task, { checkpointFile: { path, resume: true } }).outcome;
    const reference = await runTask(task); // in this thread: its final state is a copy of the kernel's positions
    expect(resumed.status).toBe('done');
    expect(reference.status).toBe('done');
    if (resumed.status !== 'done' || reference.status !== 'done') return;
    expect(resumed.result.timings.resumes).toBe(1);
    expect(resumed.result.stateHash).toBe(reference.result.stateHash);
    const moved = resumed.final!;
    const kept = reference.final!;
    // the kernel's own array, moved whole (its run's 2 values per particle, nothing more), not a decoded copy of a frame
    expect(moved.state.positions.length).toBe(2 * task.particles);
    expect(moved.state.positions.buffer.byteLength).toBe(16 * task.particles);
    expect(moved.state.count).toBe(task.particles);
    expect(Buffer.compare(Buffer.from(moved.state.positions.buffer), Buffer.from(kept.state.positions.buffer, kept.state.positions.byteOffset, kept.state.positions.byteLength))).toBe(0);
    expect(Array.from(moved.state.rngState)).toEqual(Array.from(kept.state.rngState));
    expect(moved.state.counters).toEqual(kept.state.counters);
    expect(moved.state.series).toEqual(kept.state.series);
    // stored streamed: the same bytes as the whole frame, and read back to the same positions
    const store = new DirectoryArtifactStore(artifacts);
    await putFinalState(store, 'final-moved', 0, moved);
    const file = join(artifacts, finalKey('final-moved', 0));
    expect(Buffer.compare(readFileSync(file), Buffer.from(encodeCheckpoint(moved)))).toBe(0);
    const back = await finalPositionsIn(store, 'final-moved', 0);
    expect(back!.count).toBe(task.particles);
    expect(Buffer.compare(Buffer.from(back!.coords.buffer, 0, 16 * task.particles), Buffer.from(moved.state.positions.buffer))).toBe(0);
    expect(await finalPositionsIn(store, 'final-moved', 1)).toBeNull();
  }, 300_000);
});
