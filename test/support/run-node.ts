/**
 * `node ARGS` in a child process, like spawnSync but without holding the
 * test worker's event loop while the child runs: a test file that waits for
 * a CLI child synchronously cannot report to vitest meanwhile, and a child
 * slowed to a minute by a loaded machine then fails the whole run with
 * `Timeout calling "onTaskUpdate"` (see DEVELOPERS.md).
 */
import { spawn } from 'node:child_process';

export interface NodeRun {
  status: number | null;
  signal: NodeJS.Signals | null;
  stdout: string;
  stderr: string;
}

export function runNode(args: string[], opts: { cwd?: string; env?: NodeJS.ProcessEnv; timeout?: number } = {}): Promise<NodeRun> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, args, { cwd: opts.cwd, env: opts.env ?? process.env, stdio: ['ignore', 'pipe', 'pipe'] });
    let stdout = '';
    let stderr = '';
    child.stdout.setEncoding('utf8').on('data', (d: string) => (stdout += d));
    child.stderr.setEncoding('utf8').on('data', (d: string) => (stderr += d));
    const timer = opts.timeout ? setTimeout(() => child.kill('SIGTERM'), opts.timeout) : null;
    child.once('error', reject);
    child.once('close', (status, signal) => {
      if (timer) clearTimeout(timer);
      resolve({ status, signal, stdout, stderr });
    });
  });
}
