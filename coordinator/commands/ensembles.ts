/** `tendril list`, `tendril status ID`, `tendril cancel ID`, `tendril summary ID`. */
import { writeFile } from 'node:fs/promises';
import type { Command } from 'commander';
import type { EnsembleStatus, EnsembleStore } from '../farm/store.js';
import type { SweepStatus } from '../farm/sweeps.js';
import { formatDuration, formatRate } from '../progress/index.js';
import { CSV_TABLE_NAMES, SUMMARY_FORMATS, type SummaryFormat } from '../summary/formats.js';
import { UsageError } from '../usage-error.js';
import { addAnalysisOptions, type AnalysisCliOptions } from './analysis-options.js';
import { addFarmOptions, openFarm, type FarmCliOptions } from './farm-options.js';
// the queue, the statistics and the report load only in the commands that use them (start-up time of list/status)

/**
 * One line of an ensemble's state. Parts are joined with "; " and only
 * present when they mean something: throughput and time left only while it
 * runs and once a rate is known (particles grown per wall second over the
 * store's recent window; finished and replayed work never count).
 */
export function statusLine(s: EnsembleStatus): string {
  const r = s.runs;
  const parts = [
    `${s.id}  ${s.state.padEnd(9)} ${s.name}  runs ${r.done}/${r.planned} done, ${r.running} running, ${r.queued} queued, ${r.failed} failed`,
    `${s.particles.done}/${s.particles.total} particles`,
  ];
  if (s.state === 'running' && s.throughput > 0) {
    parts.push(`${formatRate(s.throughput)} particles/s${s.etaSeconds !== null ? `, about ${formatDuration(s.etaSeconds)} left` : ''}`);
  }
  if (s.adaptive) parts.push(`adaptive: ${s.adaptive.outcome} after ${s.adaptive.batches} batch(es), cap ${s.adaptive.maxClusters} clusters`);
  if (s.probes) {
    parts.push(`probes ${s.probes.done}/${s.probes.planned} analysed${s.probes.failed > 0 ? `, ${s.probes.failed} failed (first: run ${s.probes.failures[0].runIndex} at N = ${s.probes.failures[0].size}: ${s.probes.failures[0].reason})` : ''}`);
  }
  return parts.join('; ');
}

/** The lines of a sweep's state: the totals over its members, then one line per member (its value, then its status line). */
export function sweepStatusLines(s: SweepStatus): string[] {
  const r = s.runs;
  const head = [
    `${s.id}  ${s.state.padEnd(9)} ${s.name}  sweep over ${s.parameter} (${s.values.length} values)  runs ${r.done}/${r.planned} done, ${r.running} running, ${r.queued} queued, ${r.failed} failed`,
    `${s.particles.done}/${s.particles.total} particles`,
  ];
  if (s.state === 'running' && s.throughput > 0) head.push(`${formatRate(s.throughput)} particles/s${s.etaSeconds !== null ? `, about ${formatDuration(s.etaSeconds)} left` : ''}`);
  return [head.join('; '), ...s.members.map((m) => `  ${s.parameter} = ${m.value}: ${m.status ? statusLine(m.status) : 'member ensemble missing'}`)];
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
        else {
          for (const s of all) process.stdout.write(statusLine(s) + '\n');
          // sweeps: one line each (their members are listed above as ensembles)
          const { sweepIds, sweepStatus } = await import('../farm/sweeps.js');
          for (const id of await sweepIds(farm.store, 100)) {
            const sw = await sweepStatus(farm.store, id);
            if (sw) process.stdout.write(sweepStatusLines(sw)[0] + '\n');
          }
        }
      } finally {
        await farm.close();
      }
    });

  addFarmOptions(program.command('status').description("one ensemble's runs by state, particles done, throughput and remaining time").argument('<id>', 'ensemble id'))
    .option('--json', 'print JSON instead of a line')
    .action(async (id: string, opts: FarmCliOptions & { json?: boolean }) => {
      const farm = await openFarm(opts);
      try {
        if (!(await farm.store.exists(id))) {
          const { sweepStatus } = await import('../farm/sweeps.js');
          const sw = await sweepStatus(farm.store, id);
          if (sw) {
            process.stdout.write(opts.json ? JSON.stringify(sw, null, 2) + '\n' : sweepStatusLines(sw).join('\n') + '\n');
            return;
          }
        }
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
        const { cancelEnsemble } = await import('../farm/queue.js');
        if (!(await farm.store.exists(id))) {
          const { cancelSweep } = await import('../farm/sweeps.js');
          const outcomes = await cancelSweep(farm.store, farm.queue, id);
          if (outcomes) {
            const n = outcomes.filter((o) => o === 'cancelled').length;
            process.stdout.write(`${n > 0 ? `cancelled ${id}` : `nothing to cancel in ${id}`}: ${outcomes.map((o, i) => `member ${i} ${o}`).join(', ')}\n`);
            return;
          }
        }
        const outcome = await cancelEnsemble(farm.store, farm.queue, id);
        if (outcome === 'unknown') throw new UsageError(`ensemble id: "${id}" is not known to this farm`);
        if (outcome === 'finished') {
          const st = await farm.store.status(id);
          process.stderr.write(`tendril: ensemble ${id} has already finished (state ${st?.state ?? 'done'}); nothing was cancelled\n`);
          process.exitCode = 1;
          return;
        }
        process.stdout.write(outcome === 'already-cancelled' ? `${id} was already cancelled\n` : `cancelled ${id}\n`);
      } finally {
        await farm.close();
      }
    },
  );

  addFarmOptions(
    addAnalysisOptions(
      program
        .command('summary')
        .description(
          "an ensemble's summary (estimators with bootstrap intervals, local slopes, per-run tables; partial while it runs) as JSON, one CSV table, protobuf, a folder of CSV tables, or an HTML report",
        )
        .argument('<id>', 'ensemble id')
        .option('--format <format>', 'json, csv, pb, tables (a folder of CSV files) or html (report.html with plots, into a folder)', 'json')
        .option('--table <name>', `CSV table for --format csv: ${CSV_TABLE_NAMES.join(', ')}`, 'series')
        .option('--out <path>', 'file (json, csv, pb) or folder (tables, html); default standard output for json and csv'),
    ),
  ).action(async (id: string, opts: FarmCliOptions & AnalysisCliOptions & { format: string; table: string; out?: string }) => {
    const formats = [...SUMMARY_FORMATS, 'tables', 'html'];
    if (!formats.includes(opts.format)) throw new UsageError(`--format: "${opts.format}" is not allowed; allowed: ${formats.join(', ')}`);
    if (!CSV_TABLE_NAMES.includes(opts.table)) throw new UsageError(`--table: "${opts.table}" is not allowed; allowed: ${CSV_TABLE_NAMES.join(', ')}`);
    if (opts.format === 'pb' && !opts.out && process.stdout.isTTY) throw new UsageError('--out: missing; allowed: a file name (protobuf is not written to a terminal)');
    if ((opts.format === 'tables' || opts.format === 'html') && !opts.out) throw new UsageError(`--out: missing; allowed: a folder name (--format ${opts.format} writes several files)`);
    const [{ farmSummary }, { defaultSummaryOptions, renderSummary }, { describeAnalysis, writeSummaryFiles }, { analysisSettingsFromCli }] = await Promise.all([
      import('../farm/summary.js'), import('../summary/index.js'), import('./summary-files.js'), import('./analysis-options.js'),
    ]);
    const farm = await openFarm(opts);
    try {
      const rec = await farm.store.get(id);
      if (!rec) {
        if (await summariseSweep(farm.store, id, opts)) return;
        throw new UsageError(`ensemble id: "${id}" is not known to this farm`);
      }
      const analysis = analysisSettingsFromCli(rec.spec.analysis, opts);
      const got = (await farmSummary(farm.store, id, defaultSummaryOptions(analysis)))!;
      if (opts.format === 'tables' || opts.format === 'html') {
        const html = opts.format === 'html';
        const written = await writeSummaryFiles(opts.out!, got.summary, got.results, rec.spec, { report: html, json: html, tables: true, ensembleId: id });
        process.stdout.write(describeAnalysis(got.summary) + `wrote ${written.join(', ')} into ${opts.out}\n`);
        return;
      }
      const bytes = renderSummary(got.summary, opts.format as SummaryFormat, opts.table);
      if (opts.out) await writeFile(opts.out, bytes);
      else process.stdout.write(bytes);
    } finally {
      await farm.close();
    }
  });
}

/**
 * `tendril summary SWEEP_ID`: the sweep's table as JSON (sweep.json) or CSV
 * (sweep.csv), or with --format tables|html a folder holding the sweep's
 * files and each member's summary files in <param>-<value>/ (as `tendril
 * run` writes them). False when the id is not a sweep.
 */
async function summariseSweep(store: EnsembleStore, id: string, opts: AnalysisCliOptions & { format: string; out?: string }): Promise<boolean> {
  const [{ farmSweepSummary }, { defaultSummaryOptions }, { sweepToCsv, sweepToJson, describeSweep }, { writeSweepFiles }, { writeSummaryFiles }, { analysisSettingsFromCli }, { memberFolder }, { join }] = await Promise.all([
    import('../farm/sweeps.js'), import('../summary/index.js'), import('../summary/sweep-summary.js'), import('./sweep-files.js'), import('./summary-files.js'), import('./analysis-options.js'), import('../spec/sweep.js'), import('node:path'),
  ]);
  const probe = await (await import('../farm/sweeps.js')).getSweep(store, id);
  if (!probe) return false;
  if (opts.format === 'pb') throw new UsageError('--format: "pb" is not allowed for a sweep; allowed: json, csv, tables, html (each member\'s protobuf summary: tendril summary MEMBER_ID --format pb)');
  const analysis = analysisSettingsFromCli(probe.sweep.members[0].analysis, opts);
  const got = (await farmSweepSummary(store, id, defaultSummaryOptions(analysis)))!;
  if (opts.format === 'tables' || opts.format === 'html') {
    const html = opts.format === 'html';
    const written = await writeSweepFiles(opts.out!, got.summary, { report: html });
    for (const [i, m] of got.members.entries()) {
      const dir = join(opts.out!, memberFolder(got.record.sweep.parameter, got.record.sweep.values[i]));
      await writeSummaryFiles(dir, m.summary, m.results, m.record.spec, { report: html, json: html, tables: true, ensembleId: m.record.id });
      written.push(`${memberFolder(got.record.sweep.parameter, got.record.sweep.values[i])}/`);
    }
    process.stdout.write(describeSweep(got.summary) + `wrote ${written.join(', ')} into ${opts.out}\n`);
    return true;
  }
  const text = opts.format === 'csv' ? sweepToCsv(got.summary) : sweepToJson(got.summary);
  if (opts.out) await writeFile(opts.out, text);
  else process.stdout.write(text);
  return true;
}
