/**
 * Process plumbing shared by the benchmarks: is this file the one node was
 * started with, positive-integer options, `tendril worker` processes
 * started (ready once they print "ready:"; their JSON log lines kept when
 * asked) and stopped with SIGTERM, and polling until a condition holds.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { realpathSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const CLI = join(fileURLToPath(import.meta.url), '..', '..', '..', 'coordinator', 'cli.js');

/** True when the module at `metaUrl` is the script node was started with. */
export function isEntryPoint(metaUrl: string): boolean {
  const invoked = process.argv[1];
  if (invoked === undefined) return false;
  try {
    return realpathSync(invoked) === realpathSync(fileURLToPath(metaUrl));
  } catch {
    return false;
  }
}

/** The positive integer after `name` in argv, or `fallback` when the option is absent. */
export function argValue(argv: string[], name: string, fallback: number): number {
  const i = argv.indexOf(name);
  if (i < 0) return fallback;
  const v = Number(argv[i + 1]);
  if (!Number.isSafeInteger(v) || v < 1) throw new RangeError(`${name} must be a positive integer, got "${argv[i + 1]}"`);
  return v;
}

/** A `tendril worker` with one thread on the given Redis and prefix (its stderr shown); resolves once it is ready. */
export async function startBenchWorker(redisUrl: string, prefix: string, artifacts: string, extra: string[] = []): Promise<ChildProcess> {
  return (await spawnBenchWorker(redisUrl, prefix, artifacts, extra, false)).child;
}

/** One JSON line a worker logs on stderr (the fields the benchmarks read). */
export interface WorkerLogLine {
  msg: string;
  ensembleId?: string;
  particles?: number | null;
  seconds?: number;
}

export interface LoggedBenchWorker {
  child: ChildProcess;
  /** The JSON lines logged so far. */
  log: () => WorkerLogLine[];
  /** Settles when the process has exited. */
  exited: Promise<void>;
}

/** startBenchWorker with its stderr kept rather than shown: `log()` reads its JSON log lines. */
export function startLoggedBenchWorker(redisUrl: string, prefix: string, artifacts: string, extra: string[] = []): Promise<LoggedBenchWorker> {
  return spawnBenchWorker(redisUrl, prefix, artifacts, extra, true);
}

function spawnBenchWorker(redisUrl: string, prefix: string, artifacts: string, extra: string[], keepLog: boolean): Promise<LoggedBenchWorker> {
  const child = spawn(process.execPath, [CLI, 'worker', '--redis', redisUrl, '--prefix', prefix, '--artifacts', artifacts, '--concurrency', '1', ...extra], {
    stdio: ['ignore', 'pipe', keepLog ? 'pipe' : 'inherit'],
  });
  let err = '';
  child.stderr?.on('data', (d) => (err += d));
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  const log = () => err.split('\n').filter((l) => l.startsWith('{')).map((l) => JSON.parse(l) as WorkerLogLine);
  return new Promise((resolve, reject) => {
    let out = '';
    child.stdout!.on('data', (d) => {
      out += d;
      if (out.includes('ready:')) resolve({ child, log, exited });
    });
    child.once('exit', (code) => reject(new Error(keepLog ? `worker exited with ${code}: ${err.slice(-500)}` : `worker exited with ${code}`)));
  });
}

/** SIGTERM every worker still running and wait until all have exited. */
export async function stopBenchWorkers(children: readonly ChildProcess[]): Promise<void> {
  await Promise.all(children.map((c) => new Promise<void>((resolve) => {
    if (c.exitCode !== null || c.signalCode !== null) return resolve();
    c.once('exit', () => resolve());
    c.kill('SIGTERM');
  })));
}

/** Resolves once `fn` returns true, asking every `pollMs` milliseconds. */
export async function until(fn: () => Promise<boolean> | boolean, pollMs: number): Promise<void> {
  while (!(await fn())) await new Promise((r) => setTimeout(r, pollMs));
}
