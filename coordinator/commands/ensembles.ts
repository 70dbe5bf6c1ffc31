/** `tendril list`, `tendril status ID`, `tendril cancel ID`, `tendril summary ID`. */
import { writeFile } from 'node:fs/promises';
import type { Command } from 'commander';
import { cancelEnsemble } from '../farm/queue.js';
import type { EnsembleStatus, EnsembleStore } from '../farm/store.js';
import { formatDuration } from '../progress/index.js';
import { buildSummary, renderSummary, SUMMARY_FORMATS, type SummaryFormat } from '../summary/index.js';
import { UsageError } from '../usage-error.js';
import { addFarmOptions, openFarm, type FarmCliOptions } from './farm-options.js';

export function statusLine(s: EnsembleStatus): string {
  const r = s.runs;
  const eta = s.etaSeconds === null ? '?' : formatDuration(s.etaSeconds);
  return (
    `${s.id}  ${s.state.padEnd(9)} ${s.name}  runs ${r.done}/${r.planned} done, ${r.running} running, ${r.queued} queued, ${r.failed} failed; ` +
    `${s.particles.done}/${s.particles.total} particles; ${Math.round(s.throughput)} particles/s; ${s.state === 'running' ? `about ${eta} left` : ''}`.trimEnd()
  );
}

async function requireStatus(store: EnsembleStore, id: string): Promise<EnsembleStatus> {
  const s = await store.status(id);
  if (!s) throw new UsageError(`ensemble id: "${id}" is not known to this farm`);
  return s;
}

export function register(program: Command): void {
  addFarmOptions(program.command('list').description('list the newest ensembles on the farm with their state'))
    .option('--json', 'print JSON instead of lines')
    .action(async (opts: FarmCliOptions & { json?: boolean }) => {
      const farm = await openFarm(opts);
      try {
        const all: EnsembleStatus[] = [];
        for (const id of await farm.store.ids(100)) {
          const s = await farm.store.status(id);
          if (s) all.push(s);
        }
        if (opts.json) process.stdout.write(JSON.stringify(all, null, 2) + '\n');
        else if (all.length === 0) process.stdout.write('no ensembles\n');
        else for (const s of all) process.stdout.write(statusLine(s) + '\n');
      } finally {
        await farm.close();
      }
    });

  addFarmOptions(program.command('status').description("one ensemble's runs by state, particles done, throughput and remaining time").argument('<id>', 'ensemble id'))
    .option('--json', 'print JSON instead of a line')
    .action(async (id: string, opts: FarmCliOptions & { json?: boolean }) => {
      const farm = await openFarm(opts);
      try {
        const s = await requireStatus(farm.store, id);
        process.stdout.write(opts.json ? JSON.stringify(s, null, 2) + '\n' : statusLine(s) + '\n');
        for (const f of opts.json ? [] : s.failures) process.stdout.write(`  run ${f.runIndex} failed: ${f.reason}\n`);
      } finally {
        await farm.close();
      }
    });

  addFarmOptions(program.command('cancel').description('cancel an ensemble: queued runs are dropped, running ones stop within seconds').argument('<id>', 'ensemble id')).action(
    async (id: string, opts: FarmCliOptions) => {
      const farm = await openFarm(opts);
      try {
        if (!(await cancelEnsemble(farm.store, farm.queue, id))) throw new UsageError(`ensemble id: "${id}" is not known to this farm`);
        process.stdout.write(`cancelled ${id}\n`);
      } finally {
        await farm.close();
      }
    },
  );

  addFarmOptions(
    program
      .command('summary')
      .description("download an ensemble's summary (per-run tables and the R_g fit) as JSON, CSV or protobuf")
      .argument('<id>', 'ensemble id')
      .option('--format <format>', 'json, csv or pb', 'json')
      .option('--out <file>', 'write to this file instead of standard output'),
  ).action(async (id: string, opts: FarmCliOptions & { format: string; out?: string }) => {
    if (!SUMMARY_FORMATS.includes(opts.format as SummaryFormat)) throw new UsageError(`--format: "${opts.format}" is not allowed; allowed: json, csv, pb`);
    if (opts.format === 'pb' && !opts.out && process.stdout.isTTY) throw new UsageError('--out: missing; allowed: a file name (protobuf is not written to a terminal)');
    const farm = await openFarm(opts);
    try {
      const rec = await farm.store.get(id);
      if (!rec) throw new UsageError(`ensemble id: "${id}" is not known to this farm`);
      const summary = buildSummary({ ensembleId: id, spec: rec.spec, createdAtMs: rec.createdAtMs, results: await farm.store.results(id) });
      const bytes = renderSummary(summary, opts.format as SummaryFormat);
      if (opts.out) await writeFile(opts.out, bytes);
      else process.stdout.write(bytes);
    } finally {
      await farm.close();
    }
  });
}
