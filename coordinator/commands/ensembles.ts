/** `tendril list`, `tendril status ID`, `tendril cancel ID`, `tendril summary ID`. */
import { existsSync } from 'node:fs';
import { writeFile } from 'node:fs/promises';
import type { RunResultData } from '../../proto/convert.js';
import type { EnsembleSpec } from '../spec/index.js';
import type { Command } from 'commander';
import { ensembleIds, readEnsembleStatus, readEnsembleStatuses, type EnsembleStatus, type StatusReader } from '../farm/ensemble-status.js';
import { readSweepStatus, sweepIds, type SweepStatus } from '../farm/sweep-status.js';
import type { EnsembleReader } from '../farm/ensemble-reader.js';
import { formatDuration, formatRate } from '../progress/index.js';
import { CSV_TABLE_NAMES, SUMMARY_FORMATS, type SummaryFormat } from '../summary/formats.js';
import { UsageError } from '../usage-error.js';
import { addAnalysisOptions, type AnalysisCliOptions } from './analysis-options.js';
import { addFarmOptions, openFarm, openReader, type FarmCliOptions } from './farm-options.js';
// list and status read through the small Redis reader; ioredis, the queue, the spec validator, the protobuf code,
// the statistics and the report load only in the commands that use them (start-up time: test/cli-startup.test.ts)

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

export async function requireStatus(reader: StatusReader, prefix: string, id: string): Promise<EnsembleStatus> {
  const s = await readEnsembleStatus(reader, prefix, id);
  if (!s) throw new UsageError(`ensemble id: "${id}" is not known to this farm`);
  return s;
}

/** The report's pictures from the workers' artifact folder (coordinator/commands/report-pictures.ts). */
async function farmReportPictures(id: string, spec: EnsembleSpec, results: readonly RunResultData[], folder: string | undefined) {
  const [{ reportPictures }, { DirectoryArtifactStore }] = await Promise.all([import('./report-pictures.js'), import('../farm/artifacts.js')]);
  if (folder !== undefined && !existsSync(folder)) throw new UsageError(`--artifacts: "${folder}" does not exist; allowed: the workers' artifact folder`);
  return reportPictures({
    ensembleId: id,
    spec,
    results,
    artifacts: folder !== undefined ? new DirectoryArtifactStore(folder) : null,
    noStoreHint: "give the workers' artifact folder with --artifacts DIR or TENDRIL_ARTIFACTS",
  });
}

export function register(program: Command): void {
  addFarmOptions(program.command('list').description('list the newest ensembles on the farm with their state'))
    .option('--json', 'print JSON instead of lines')
    .action(async (opts: FarmCliOptions & { json?: boolean }) => {
      const farm = await openReader(opts);
      try {
        // every status in three round trips, not one ensemble after another
        const all = (await readEnsembleStatuses(farm.reader, farm.prefix, await ensembleIds(farm.reader, farm.prefix, 100))).filter((s): s is EnsembleStatus => s !== null);
        if (opts.json) process.stdout.write(JSON.stringify(all, null, 2) + '\n');
        else if (all.length === 0) process.stdout.write('no ensembles\n');
        else {
          for (const s of all) process.stdout.write(statusLine(s) + '\n');
          // sweeps: one line each (their members are listed above as ensembles)
          for (const id of await sweepIds(farm.reader, farm.prefix, 100)) {
            const sw = await readSweepStatus(farm.reader, farm.prefix, id);
            if (sw) process.stdout.write(sweepStatusLines(sw)[0] + '\n');
          }
        }
      } finally {
        farm.close();
      }
    });

  addFarmOptions(program.command('status').description("one ensemble's runs by state, particles done, throughput and remaining time").argument('<id>', 'ensemble id'))
    .option('--json', 'print JSON instead of a line')
    .action(async (id: string, opts: FarmCliOptions & { json?: boolean }) => {
      const farm = await openReader(opts);
      try {
        const sw = await readSweepStatus(farm.reader, farm.prefix, id);
        if (sw) {
          process.stdout.write(opts.json ? JSON.stringify(sw, null, 2) + '\n' : sweepStatusLines(sw).join('\n') + '\n');
          return;
        }
        const s = await requireStatus(farm.reader, farm.prefix, id);
        process.stdout.write(opts.json ? JSON.stringify(s, null, 2) + '\n' : statusLine(s) + '\n');
        for (const f of opts.json ? [] : s.failures) process.stdout.write(`  run ${f.runIndex} failed: ${f.reason}\n`);
      } finally {
        farm.close();
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
        .option('--out <path>', 'file (json, csv, pb) or folder (tables, html); default standard output for json and csv')
        .option('--artifacts <dir>', "the workers' artifact folder, where --format html finds the sample cluster and the harmonic-measure picture (default: TENDRIL_ARTIFACTS)")
        .option('--baseline <dir>', 'with --format html: the folder of an earlier summary (tendril run --out, or --format html --out) of an isotropic model, drawn with this ensemble in the anisotropy figure'),
    ),
  ).action(async (id: string, opts: FarmCliOptions & AnalysisCliOptions & { format: string; table: string; out?: string; artifacts?: string; baseline?: string }) => {
    const formats = [...SUMMARY_FORMATS, 'tables', 'html'];
    if (!formats.includes(opts.format)) throw new UsageError(`--format: "${opts.format}" is not allowed; allowed: ${formats.join(', ')}`);
    if (!CSV_TABLE_NAMES.includes(opts.table)) throw new UsageError(`--table: "${opts.table}" is not allowed; allowed: ${CSV_TABLE_NAMES.join(', ')}`);
    if (opts.format === 'pb' && !opts.out && process.stdout.isTTY) throw new UsageError('--out: missing; allowed: a file name (protobuf is not written to a terminal)');
    if ((opts.format === 'tables' || opts.format === 'html') && !opts.out) throw new UsageError(`--out: missing; allowed: a folder name (--format ${opts.format} writes several files)`);
    if (opts.baseline !== undefined && opts.format !== 'html') throw new UsageError(`--baseline: given with --format ${opts.format}; allowed: only with --format html`);
    const [{ farmSummary }, { defaultSummaryOptions, renderSummary }, { describeAnalysis, describeBaseline, writeSummaryFiles }, { analysisSettingsFromCli }, { loadBaseline }] = await Promise.all([
      import('../farm/summary.js'), import('../summary/index.js'), import('./summary-files.js'), import('./analysis-options.js'), import('./anisotropy-baseline.js'),
    ]);
    // read through the small RESP client: the summary needs no ioredis (start-up time)
    const farm = await openReader(opts);
    const { EnsembleReader } = await import('../farm/ensemble-reader.js');
    const store = new EnsembleReader(farm.reader, farm.prefix);
    try {
      const rec = await store.get(id);
      if (!rec) {
        if (await summariseSweep(store, id, opts)) return;
        throw new UsageError(`ensemble id: "${id}" is not known to this farm`);
      }
      const baseline = opts.baseline !== undefined ? await loadBaseline(opts.baseline, rec.spec.model.kind) : undefined;
      const analysis = await analysisSettingsFromCli(rec.spec.analysis, opts, { particles: rec.spec.particles, clusters: rec.spec.target?.maxClusters ?? rec.plannedClusters });
      const got = (await farmSummary(store, id, defaultSummaryOptions(analysis)))!;
      if (opts.format === 'tables' || opts.format === 'html') {
        const html = opts.format === 'html';
        const pictures = html ? await farmReportPictures(id, rec.spec, got.results, opts.artifacts ?? (process.env.TENDRIL_ARTIFACTS || undefined)) : null;
        const written = await writeSummaryFiles(opts.out!, got.summary, got.results, rec.spec, {
          report: html, json: html, tables: true, ensembleId: id, sampleCluster: pictures?.sampleCluster, measurePicture: pictures?.measurePicture, pictureNotes: pictures?.notes, baseline,
        });
        process.stdout.write(describeAnalysis(got.summary) + (baseline ? describeBaseline(got.summary, baseline) : '') + `wrote ${written.join(', ')} into ${opts.out}\n`);
        return;
      }
      const bytes = renderSummary(got.summary, opts.format as SummaryFormat, opts.table);
      if (opts.out) await writeFile(opts.out, bytes);
      else process.stdout.write(bytes);
    } finally {
      farm.close();
    }
  });
}

/**
 * `tendril summary SWEEP_ID`: the sweep's table as JSON (sweep.json) or CSV
 * (sweep.csv), or with --format tables|html a folder holding the sweep's
 * files and each member's summary files in <param>-<value>/ (as `tendril
 * run` writes them). False when the id is not a sweep.
 */
async function summariseSweep(store: EnsembleReader, id: string, opts: AnalysisCliOptions & { format: string; out?: string }): Promise<boolean> {
  const [{ farmSweepSummary, getSweep }, { defaultSummaryOptions }, { sweepToCsv, sweepToJson, describeSweep }, { writeSweepFiles }, { writeSummaryFiles }, { analysisSettingsFromCli }, { memberFolder }, { join }] = await Promise.all([
    import('../farm/sweeps.js'), import('../summary/index.js'), import('../summary/sweep-summary.js'), import('./sweep-files.js'), import('./summary-files.js'), import('./analysis-options.js'), import('../spec/sweep.js'), import('node:path'),
  ]);
  const rec = await getSweep(store, id);
  if (!rec) return false;
  if (opts.format === 'pb') throw new UsageError('--format: "pb" is not allowed for a sweep; allowed: json, csv, tables, html (each member\'s protobuf summary: tendril summary MEMBER_ID --format pb)');
  const analysis = await analysisSettingsFromCli(rec.sweep.members[0].analysis, opts);
  const got = (await farmSweepSummary(store, id, defaultSummaryOptions(analysis)))!;
  if (opts.format === 'tables' || opts.format === 'html') {
    const html = opts.format === 'html';
    const written = await writeSweepFiles(opts.out!, got.summary, { report: html });
    for (const [i, m] of got.members.entries()) {
      const folder = memberFolder(rec.sweep.parameter, rec.sweep.values[i]);
      await writeSummaryFiles(join(opts.out!, folder), m.summary, m.results, m.record.spec, { report: html, json: html, tables: true, ensembleId: m.record.id });
      written.push(`${folder}/`);
    }
    process.stdout.write(describeSweep(got.summary) + `wrote ${written.join(', ')} into ${opts.out}\n`);
    return true;
  }
  const text = opts.format === 'csv' ? sweepToCsv(got.summary) : sweepToJson(got.summary);
  if (opts.out) await writeFile(opts.out, text);
  else process.stdout.write(text);
  return true;
}
