/** `tendril launch SPEC`: validate a spec and queue its runs on the farm. */
import type { Command } from 'commander';
import { launchEnsemble } from '../farm/queue.js';
import { addFarmOptions, openFarm, type FarmCliOptions } from './farm-options.js';
import { loadSpecFile, positiveInt } from './spec-file.js';

export function register(program: Command): void {
  addFarmOptions(
    program
      .command('launch')
      .description('validate an ensemble spec and queue its runs on the farm; prints the ensemble id')
      .argument('<spec>', 'ensemble spec file (.toml or .json)')
      .option('--max-total-particles <n>', 'raise the ceiling on particles × clusters', positiveInt('--max-total-particles', Number.MAX_SAFE_INTEGER)),
  ).action(async (specPath: string, opts: FarmCliOptions & { maxTotalParticles?: number }) => {
    const spec = await loadSpecFile(specPath, opts.maxTotalParticles);
    const farm = await openFarm(opts);
    try {
      const id = await launchEnsemble(farm.store, farm.queue, spec);
      process.stdout.write(`${id}\n`);
    } finally {
      await farm.close();
    }
  });
}
