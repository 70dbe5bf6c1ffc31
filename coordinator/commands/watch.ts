/** `tendril watch ID`: a live progress bar of an ensemble (or of all members of a sweep) until it ends. */
import type { Command } from 'commander';
import { createProgress } from '../progress/index.js';
import { UsageError } from '../usage-error.js';
import { requireStatus, statusLine, sweepStatusLines } from './ensembles.js';
import { addFarmOptions, openReader, type FarmCliOptions } from './farm-options.js';
import { readEnsembleStatus, type EnsembleStatus } from '../farm/ensemble-status.js';
import { readSweepStatus, type SweepStatus } from '../farm/sweep-status.js';
import { positiveInt } from './option-values.js';

export function register(program: Command): void {
  addFarmOptions(
    program
      .command('watch')
      .description('show a live progress bar (particles per second, time left) until the ensemble ends')
      .argument('<id>', 'ensemble id')
      .option('--every <seconds>', 'refresh interval', positiveInt('--every', 3600), 2)
      .option('--progress <mode>', 'auto, bar, lines or none', 'auto'),
  ).action(async (id: string, opts: FarmCliOptions & { every: number; progress: string }) => {
    if (!['auto', 'bar', 'lines', 'none'].includes(opts.progress)) throw new UsageError(`--progress: "${opts.progress}" is not allowed; allowed: auto, bar, lines, none`);
    let farm = await openReader(opts);
    try {
      // an ensemble id, or a sweep id (then the bar counts the particles of all its members)
      const read = async (): Promise<EnsembleStatus | SweepStatus | null> => (await readSweepStatus(farm.reader, farm.prefix, id)) ?? (await readEnsembleStatus(farm.reader, farm.prefix, id));
      let s: EnsembleStatus | SweepStatus = (await readSweepStatus(farm.reader, farm.prefix, id)) ?? (await requireStatus(farm.reader, farm.prefix, id));
      // lines mode: one line per refresh (the default of 10 s would hide the refreshes in between)
      const bar = createProgress({ total: s.particles.total, unit: 'particles', label: s.name, mode: opts.progress as 'auto', lineIntervalSeconds: opts.every });
      let stop = false;
      const onSig = () => (stop = true);
      process.once('SIGINT', onSig);
      try {
        for (;;) {
          bar.update(s.particles.done);
          if (s.state !== 'running' || stop) break;
          await new Promise((r) => setTimeout(r, opts.every * 1000));
          try {
            s = (await read()) ?? s;
          } catch {
            // Redis went away (restarted, link lost): keep the last status and connect again at the next refresh
            farm.close();
            farm = await openReader(opts).catch(() => farm);
          }
        }
      } finally {
        process.off('SIGINT', onSig);
        bar.stop();
      }
      process.stdout.write(('members' in s ? sweepStatusLines(s).join('\n') : statusLine(s)) + '\n');
      if (s.state === 'failed') process.exitCode = 1;
    } finally {
      farm.close();
    }
  });
}
