/**
 * `tendril launch SPEC`: validate a spec and queue its runs on the farm;
 * prints the ensemble id. A spec that sweeps a parameter launches one member
 * ensemble per value under a sweep record (coordinator/farm/sweeps.ts) and
 * prints the sweep id, which status, watch, summary and cancel accept.
 */
import type { Command } from 'commander';
import { launchEnsemble } from '../farm/queue.js';
import { addFarmOptions, openFarm, type FarmCliOptions } from './farm-options.js';
import { loadLaunchFile, positiveInt } from './spec-file.js';

export function register(program: Command): void {
  addFarmOptions(
    program
      .command('launch')
      .description('validate an ensemble spec and queue its runs on the farm; prints the ensemble id (the sweep id for a spec that sweeps a parameter)')
      .argument('<spec>', 'ensemble spec file (.toml or .json)')
      .option('--max-total-particles <n>', 'raise the ceiling on particles × clusters', positiveInt('--max-total-particles', Number.MAX_SAFE_INTEGER)),
  ).action(async (specPath: string, opts: FarmCliOptions & { maxTotalParticles?: number }) => {
    const launchable = await loadLaunchFile(specPath, opts.maxTotalParticles);
    const farm = await openFarm(opts);
    try {
      if (launchable.kind === 'sweep') {
        const { launchSweep } = await import('../farm/sweeps.js');
        const got = await launchSweep(farm.store, farm.queue, launchable.sweep);
        process.stdout.write(`${got.id}\n`);
        return;
      }
      const id = await launchEnsemble(farm.store, farm.queue, launchable.spec);
      process.stdout.write(`${id}\n`);
    } finally {
      await farm.close();
    }
  });
}
