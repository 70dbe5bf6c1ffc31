/**
 * Process plumbing shared by the benchmarks: is this file the one node was
 * started with, positive-integer options, and `tendril worker` processes
 * started (ready once they print "ready:") and stopped with SIGTERM.
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

/** A `tendril worker` with one thread on the given Redis and prefix; resolves once it is ready. */
export function startBenchWorker(redisUrl: string, prefix: string, artifacts: string, extra: string[] = []): Promise<ChildProcess> {
  const child = spawn(process.execPath, [CLI, 'worker', '--redis', redisUrl, '--prefix', prefix, '--artifacts', artifacts, '--concurrency', '1', ...extra], {
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  return new Promise((resolve, reject) => {
    let out = '';
    child.stdout!.on('data', (d) => {
      out += d;
      if (out.includes('ready:')) resolve(child);
    });
    child.once('exit', (code) => reject(new Error(`worker exited with ${code}`)));
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
