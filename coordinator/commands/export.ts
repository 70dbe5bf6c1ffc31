/**
 * `tendril export SOURCE --format csv|hdf5 --out FILE`: particle positions
 * out of tendril. SOURCE is the output folder of `tendril run` for a spec
 * with [positions] (every cluster, at the spec's positions.at_sizes and its
 * final size), or a `.snapshot` file (from `tendril grow`). Layouts:
 * docs/snapshot-format.md.
 */
import { messageOf } from '../../proto/errors.js';
import { stat, writeFile } from 'node:fs/promises';
import type { Command } from 'commander';
import { UsageError } from '../usage-error.js';

export function register(program: Command): void {
  program
    .command('export')
    .description('write particle positions (a run folder of a spec with [positions], or a .snapshot file) as CSV or HDF5')
    .argument('<source>', 'output folder of tendril run, or a .snapshot file')
    .requiredOption('--out <file>', 'file to write')
    .option('--format <format>', 'csv or hdf5', 'csv')
    .action(async (source: string, opts: { out: string; format: string }) => {
      if (!['csv', 'hdf5'].includes(opts.format)) throw new UsageError(`--format: "${opts.format}" is not allowed; allowed: csv, hdf5`);
      const info = await stat(source).catch(() => null);
      if (!info) throw new UsageError(`source: "${source}" does not exist; allowed: an output folder of tendril run or a .snapshot file`);
      const ex = await import('../export/cluster-export.js');
      let src;
      try {
        src = info.isDirectory() ? await ex.runFolderSource(source) : await ex.snapshotSource(source);
      } catch (err) {
        if (err instanceof UsageError) throw err;
        throw new UsageError(`source: "${source}": ${messageOf(err)}`);
      }
      if (opts.format === 'csv') await writeFile(opts.out, ex.positionsCsv(src));
      else await ex.writePositionsHdf5(opts.out, src);
      const n = src.clusters.length;
      process.stdout.write(`wrote ${opts.out}: ${n} cluster${n === 1 ? '' : 's'} at size${src.sizes.length === 1 ? '' : 's'} ${src.sizes.join(', ')}\n`);
    });
}
