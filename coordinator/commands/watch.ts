/** `tendril watch ID`: a live progress bar of an ensemble (or of all members of a sweep) until it ends. */
import type { Command } from 'commander';
import { createProgress } from '../progress/index.js';
import { UsageError } from '../usage-error.js';
import { statusLine, sweepStatusLines } from './ensembles.js';
import { addFarmOptions, openFarm, type FarmCliOptions } from './farm-options.js';
import { positiveInt } from './spec-file.js';

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
    const farm = await openFarm(opts);
    try {
      const { sweepStatus } = await import('../farm/sweeps.js');
      // an ensemble id, or a sweep id (then the bar counts the particles of all its members)
      const read = async () => (await farm.store.status(id)) ?? (await sweepStatus(farm.store, id));
      let s = await read();
      if (!s) throw new UsageError(`ensemble id: "${id}" is not known to this farm`);
      const bar = createProgress({ total: s.particles.total, unit: 'particles', label: s.name, mode: opts.progress as 'auto' });
      let stop = false;
      const onSig = () => (stop = true);
      process.once('SIGINT', onSig);
      try {
        for (;;) {
          bar.update(s.particles.done);
          if (s.state !== 'running' || stop) break;
          await new Promise((r) => setTimeout(r, opts.every * 1000));
          s = (await read())!;
        }
      } finally {
        process.off('SIGINT', onSig);
        bar.stop();
      }
      process.stdout.write(('members' in s ? sweepStatusLines(s).join('\n') : statusLine(s)) + '\n');
      if (s.state === 'failed') process.exitCode = 1;
    } finally {
      await farm.close();
    }
  });
}
