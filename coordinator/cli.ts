#!/usr/bin/env node
/**
 * The `tendril` command line. Each subcommand lives in coordinator/commands/
 * and exports `register(program)`; add new ones to COMMANDS below.
 *
 * Errors are reported as one line on stderr with a non-zero exit code.
 */
import { realpathSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Command, CommanderError } from 'commander';
import { UsageError } from './usage-error.js';
import { ENGINE_VERSION } from '../worker/core/engine-version.js';
import { messageOf } from '../proto/errors.js';

type Register = (program: Command) => void;

const COMMANDS: Array<() => Promise<{ register: Register }>> = [
  () => import('./commands/grow.js'),
  () => import('./commands/run.js'),
  () => import('./commands/launch.js'),
  () => import('./commands/ensembles.js'),
  () => import('./commands/watch.js'),
  () => import('./commands/worker.js'),
  () => import('./commands/serve.js'),
  () => import('./commands/probe.js'),
  () => import('./commands/models.js'),
];

export async function main(argv: string[]): Promise<number> {
  const program = new Command();
  program
    .name('tendril')
    .description('Batch simulation farm for Laplacian-growth aggregates (DLA and relatives).')
    .version(ENGINE_VERSION, '--version', 'print the engine version')
    .exitOverride()
    .configureOutput({ writeErr: (s) => process.stderr.write(s) })
    .showHelpAfterError(false);
  for (const load of COMMANDS) (await load()).register(program);
  try {
    await program.parseAsync(argv, { from: 'node' });
    return typeof process.exitCode === 'number' ? process.exitCode : 0;
  } catch (err) {
    if (err instanceof CommanderError) {
      // commander already printed its message (help, version or a usage error)
      return err.exitCode === 0 ? 0 : 2;
    }
    if (err instanceof UsageError) {
      process.stderr.write(`tendril: ${err.message}\n`);
      return 2;
    }
    process.stderr.write(`tendril: ${messageOf(err)}\n`);
    return 1;
  }
}

function isEntryPoint(): boolean {
  const invoked = process.argv[1];
  if (invoked === undefined) return false;
  try {
    return realpathSync(invoked) === realpathSync(fileURLToPath(import.meta.url));
  } catch {
    return false;
  }
}

/**
 * Resolves once everything written to `stream` so far has been handed to the
 * operating system (a pipe to a slow reader may take a while), or the reader
 * has gone away. process.exit before that cuts the output short.
 */
export function drained(stream: NodeJS.WritableStream & { writableLength?: number; destroyed?: boolean }): Promise<void> {
  return new Promise((resolve) => {
    if (stream.destroyed) return resolve();
    stream.once('error', () => resolve());
    stream.write('', () => resolve());
  });
}

if (isEntryPoint()) {
  // a reader that closes early (| head) is not an error of ours
  process.stdout.on('error', () => undefined);
  main(process.argv)
    .then(async (code) => {
      await Promise.all([drained(process.stdout), drained(process.stderr)]);
      return code;
    })
    .then((code) => process.exit(code));
}
