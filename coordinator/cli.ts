#!/usr/bin/env node
/**
 * The `tendril` command line. Each subcommand lives in coordinator/commands/
 * and exports `register(program)`; add new ones to COMMANDS below.
 *
 * Errors are reported as one line on stderr with a non-zero exit code.
 */
import { realpathSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Command, CommanderError, Help } from 'commander';
import { UsageError } from './usage-error.js';
import { ENGINE_VERSION } from '../worker/core/engine-version.js';
import { messageOf } from '../proto/errors.js';

type Register = (program: Command) => void;

export interface CommandEntry {
  /** The term shown in `tendril --help` (name, [options], arguments). */
  term: string;
  description: string;
  load: () => Promise<{ register: Register }>;
}

/**
 * Every subcommand: its help line and its module. Only the module of the
 * command being run is loaded (start-up time: `--help` and `status` do not
 * pay for fastify, BullMQ, resvg or h5wasm); test/cli-startup.test.ts checks
 * that each term and description matches what the module registers.
 */
export const COMMANDS: CommandEntry[] = [
  { term: 'grow [options]', description: 'grow one cluster of a model (see tendril models) and write its run result, snapshot and picture', load: () => import('./commands/grow.js') },
  { term: 'run [options] <spec>', description: 'grow an ensemble locally with worker threads (no Redis) and write its summary', load: () => import('./commands/run.js') },
  { term: 'launch [options] <spec>', description: 'validate an ensemble spec and queue its runs on the farm; prints the ensemble id (the sweep id for a spec that sweeps a parameter)', load: () => import('./commands/launch.js') },
  { term: 'list [options]', description: 'list the newest ensembles on the farm with their state', load: () => import('./commands/ensembles.js') },
  { term: 'status [options] <id>', description: "one ensemble's runs by state, particles done, throughput and remaining time", load: () => import('./commands/ensembles.js') },
  { term: 'cancel [options] <id>', description: 'cancel an ensemble: queued runs are dropped, running ones stop within seconds', load: () => import('./commands/ensembles.js') },
  {
    term: 'summary [options] <id>',
    description: "an ensemble's summary (estimators with bootstrap intervals, local slopes, per-run tables; partial while it runs) as JSON, one CSV table, protobuf, a folder of CSV tables, or an HTML report",
    load: () => import('./commands/ensembles.js'),
  },
  { term: 'watch [options] <id>', description: 'show a live progress bar (particles per second, time left) until the ensemble ends', load: () => import('./commands/watch.js') },
  { term: 'worker [options]', description: 'grow queued runs: one job per core, checkpoints to the artifact folder, /metrics on request', load: () => import('./commands/worker.js') },
  { term: 'serve [options]', description: 'run the HTTP API (create, list, status, cancel, summary downloads), the web status page at / and /metrics', load: () => import('./commands/serve.js') },
  { term: 'probe [options] <input>', description: 'measure the harmonic measure of a cluster snapshot or a CSV of x,y,r disks with probe walkers', load: () => import('./commands/probe.js') },
  {
    term: 'export [options] <source>',
    description: 'write particle positions (a run folder of a spec with [positions], or a .snapshot file) as CSV or HDF5',
    load: () => import('./commands/export.js'),
  },
  {
    term: 'models [options]',
    description: 'list every growth model: definition, parameters (unit, default, range, meaning), reference values',
    load: () => import('./commands/models.js'),
  },
];

const nameOf = (e: CommandEntry) => e.term.split(' ')[0];

/** The subcommand named on the command line (`tendril help NAME` too), if any. */
function invokedCommand(argv: string[]): CommandEntry | undefined {
  const args = argv.slice(2);
  const first = args.findIndex((a) => !a.startsWith('-'));
  if (first < 0) return undefined;
  const name = args[first] === 'help' ? args[first + 1] : args[first];
  return COMMANDS.find((e) => nameOf(e) === name);
}

export async function main(argv: string[]): Promise<number> {
  const program = new Command();
  program
    .name('tendril')
    .description('Batch simulation farm for Laplacian-growth aggregates (DLA and relatives).')
    .version(ENGINE_VERSION, '--version', 'print the engine version')
    .exitOverride()
    .configureOutput({ writeErr: (s) => process.stderr.write(s) })
    .showHelpAfterError(false);
  const wanted = invokedCommand(argv);
  if (wanted) {
    // only the command being run is loaded; registering its module adds it (and its siblings in the same module)
    (await wanted.load()).register(program);
  } else {
    // top-level help or an unknown command: the list, without loading any command module
    const terms = new Map(COMMANDS.map((e) => [nameOf(e), e.term]));
    program.configureHelp({ subcommandTerm: (cmd) => terms.get(cmd.name()) ?? new Help().subcommandTerm(cmd) });
    // the models module is loaded too: it adds the list of models to the top-level help
    (await import('./commands/models.js')).register(program);
    for (const e of COMMANDS) if (nameOf(e) !== 'models') program.command(nameOf(e)).description(e.description);
  }
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
