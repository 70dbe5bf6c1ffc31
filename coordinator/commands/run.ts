/**
 * `tendril run SPEC --out DIR`: grow a whole ensemble in this process with a
 * pool of worker threads (no Redis) and write the summary into DIR.
 * Interrupting (Ctrl-C) keeps checkpoints in DIR; running the same command
 * again continues from them. A spec that sweeps a parameter
 * (coordinator/spec/sweep.ts) grows each member into DIR/<param>-<value>
 * and writes the sweep's table and report into DIR.
 */
import { mkdir, readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { Command } from 'commander';
import { createProgress, type Progress, type ProgressMode } from '../progress/index.js';
import { runEmbedded, EmbeddedAborted, type EmbeddedProgress } from '../embedded/index.js';
import { DirectoryArtifactStore } from '../farm/artifacts.js';
import { newEnsembleId } from '../plan.js';
import { specToDocument, type EnsembleSpec } from '../spec/index.js';
import { buildSummary, defaultSummaryOptions } from '../summary/index.js';
import { UsageError } from '../usage-error.js';
import { addAnalysisOptions, analysisSettingsFromCli, type AnalysisCliOptions } from './analysis-options.js';
import { describeAnalysis, describeBaseline, writeSummaryFiles } from './summary-files.js';
import { loadBaseline, type ReportBaseline } from './anisotropy-baseline.js';
import { clusterMeasurePicture, reportPictures } from './report-pictures.js';
import { loadLaunchFile, positiveInt } from './spec-file.js';
import { memberFolder, sweepToDocument, type SweepSpec } from '../spec/sweep.js';
import { buildSweepSummary, describeSweep, type SweepMemberInput } from '../summary/sweep-summary.js';
import { writeSweepFiles } from './sweep-files.js';
import type { EnsembleSummaryData } from '../../proto/convert.js';
import { checkOutFolder, makeOutFolder } from './out-folder.js';

interface RunOptions extends AnalysisCliOptions {
  out: string;
  report?: boolean;
  threads?: number;
  maxTotalParticles?: number;
  progress: string;
  baseline?: string;
  /** The loaded --baseline (set by the action). */
  baselineData?: ReportBaseline;
}

export function register(program: Command): void {
  const cmd = program
    .command('run')
    .description('grow an ensemble locally with worker threads (no Redis) and write its summary')
    .argument('<spec>', 'ensemble spec file (.toml or .json)')
    .requiredOption('--out <dir>', 'output folder (summary files, checkpoints of an interrupted run)')
    .option('--threads <n>', 'worker threads (default: available cores)', positiveInt('--threads', 1024))
    .option('--max-total-particles <n>', 'raise the ceiling on particles × clusters', positiveInt('--max-total-particles', Number.MAX_SAFE_INTEGER))
    .option('--progress <mode>', 'progress display: auto, bar, lines or none', 'auto')
    .option('--no-report', 'skip report.html and its plots')
    .option('--baseline <dir>', 'the --out folder of an earlier tendril run of an isotropic model (e.g. dla-offlattice-2d): the report draws its k-fold anisotropy with this one on the same axes');
  addAnalysisOptions(cmd).action(async (specPath: string, opts: RunOptions) => {
    if (!['auto', 'bar', 'lines', 'none'].includes(opts.progress)) {
      throw new UsageError(`--progress: "${opts.progress}" is not allowed; allowed: auto, bar, lines, none`);
    }
    const launchable = await loadLaunchFile(specPath, opts.maxTotalParticles);
    // CLI analysis options are checked before any folder is made
    await analysisSettingsFromCli(launchable.kind === 'single' ? launchable.spec.analysis : launchable.sweep.members[0].analysis, opts);
    if (opts.baseline !== undefined) {
      opts.baselineData = await loadBaseline(opts.baseline, launchable.kind === 'single' ? launchable.spec.model.kind : launchable.sweep.members[0].model.kind);
    }
    // refused before any growth when unusable (a file, an unwritable parent); never a raw EEXIST/ENOTDIR
    makeOutFolder(checkOutFolder(opts.out), opts.out);
    if (launchable.kind === 'single') {
      await runInto(launchable.spec, opts.out, opts);
      return;
    }
    await runSweep(launchable.sweep, opts);
  });
}

/**
 * A sweep: each member grows into its own folder OUT/<param>-<value> exactly
 * as `tendril run` grows a single spec (same files, same resuming), one
 * member after the other; then the sweep's table (sweep.json, sweep.csv)
 * and report.html with the D(parameter) plot go into OUT.
 */
async function runSweep(sweep: SweepSpec, opts: RunOptions): Promise<void> {
  const doc = sweepToDocument(sweep);
  const metaPath = join(opts.out, 'sweep-spec.json');
  let sweepId = newEnsembleId().replace(/^e/, 's');
  try {
    const meta = JSON.parse(await readFile(metaPath, 'utf8')) as { sweep_id: string; spec: unknown };
    if (JSON.stringify(meta.spec) !== JSON.stringify(doc)) {
      throw new UsageError(`--out: "${opts.out}" holds another sweep (${meta.sweep_id}); allowed: an empty folder or one holding this same sweep`);
    }
    sweepId = meta.sweep_id;
  } catch (err) {
    if (err instanceof UsageError) throw err;
    await writeFile(metaPath, JSON.stringify({ sweep_id: sweepId, spec: doc }, null, 2) + '\n');
  }
  const members: SweepMemberInput[] = [];
  for (const [i, member] of sweep.members.entries()) {
    const dir = join(opts.out, memberFolder(sweep.parameter, sweep.values[i]));
    makeOutFolder(checkOutFolder(dir), dir);
    process.stdout.write(`${sweep.parameter} = ${sweep.values[i]} (${i + 1} of ${sweep.members.length}):\n`);
    const got = await runInto(member, dir, opts, `${sweepId}-${i}`);
    if (!got) {
      process.stderr.write(`tendril: the sweep stopped at ${sweep.parameter} = ${sweep.values[i]}; run the same command again to continue\n`);
      return;
    }
    members.push({ value: sweep.values[i], ensembleId: got.ensembleId, summary: got.summary });
  }
  const summary = buildSweepSummary({ sweepId, name: sweep.name, modelKind: sweep.members[0].model.kind, parameter: sweep.parameter, seed: sweep.seed, document: doc, members });
  const written = await writeSweepFiles(opts.out, summary, { report: opts.report !== false });
  process.stdout.write(describeSweep(summary) + `wrote ${written.map((f) => join(opts.out, f)).join(', ')}\n`);
}

/**
 * Grow one ensemble into `out` (summary files, report, checkpoints of an
 * interrupted run); null when interrupted (a partial summary is written).
 */
async function runInto(spec: EnsembleSpec, out: string, opts: RunOptions, newId: string = newEnsembleId()): Promise<{ ensembleId: string; summary: EnsembleSummaryData } | null> {
  const analysis = await analysisSettingsFromCli(spec.analysis, opts, { particles: spec.particles, clusters: spec.target?.maxClusters ?? spec.clusters });
  const doc = specToDocument(spec);
  const metaPath = join(out, 'ensemble.json');
  let ensembleId = newId;
  let createdAtMs = Date.now();
  try {
    const meta = JSON.parse(await readFile(metaPath, 'utf8')) as { ensemble_id: string; created_at_ms: number; spec: unknown };
    if (JSON.stringify(meta.spec) !== JSON.stringify(doc)) {
      throw new UsageError(`--out: "${out}" holds another ensemble (${meta.ensemble_id}); allowed: an empty folder or one holding this same spec`);
    }
    ensembleId = meta.ensemble_id;
    createdAtMs = meta.created_at_ms;
  } catch (err) {
    if (err instanceof UsageError) throw err;
    await writeFile(metaPath, JSON.stringify({ ensemble_id: ensembleId, created_at_ms: createdAtMs, spec: doc }, null, 2) + '\n');
  }
  const state = new DirectoryArtifactStore(join(out, 'state'));
  const progress = new PhasedProgress(spec.name, spec.particles * spec.clusters, opts.progress as ProgressMode);
  const abort = new AbortController();
  const onSignal = () => abort.abort();
  process.once('SIGINT', onSignal);
  process.once('SIGTERM', onSignal);
  try {
    const outcome = await runEmbedded(spec, {
      ensembleId,
      createdAtMs,
      threads: opts.threads,
      store: state,
      signal: abort.signal,
      onProgress: (p) => progress.update(p),
      summary: defaultSummaryOptions(analysis),
    });
    progress.stop();
    const s = outcome.summary;
    const pictures =
      opts.report !== false
        ? await reportPictures({
            ensembleId,
            spec,
            results: outcome.results,
            artifacts: state,
            measurePicture: outcome.picture
              ? clusterMeasurePicture(outcome.picture.runIndex, outcome.picture.size, outcome.picture.x, outcome.picture.y, outcome.picture.counts)
              : undefined,
          })
        : null;
    const written = await writeSummaryFiles(out, s, outcome.results, spec, {
      report: opts.report !== false,
      ensembleId,
      sampleCluster: pictures?.sampleCluster,
      measurePicture: pictures?.measurePicture,
      pictureNotes: pictures?.notes,
      baseline: opts.baselineData,
    });
    process.stdout.write(
      `${spec.name}: ${s.clustersDone} clusters of ${spec.particles} particles in ${outcome.wallSeconds.toFixed(1)} s` +
        (outcome.reused > 0 ? ` (${outcome.reused} taken from an earlier run)` : '') +
        '\n' + describeAnalysis(s) +
        (opts.baselineData ? describeBaseline(s, opts.baselineData) : '') +
        `wrote ${written.map((f) => join(out, f)).join(', ')}\n`,
    );
    return { ensembleId, summary: s };
  } catch (err) {
    progress.stop();
    if (err instanceof EmbeddedAborted) {
      // a partial summary of the runs finished so far (no report: it is rewritten when the run completes)
      if (err.results.length > 0) {
        const partial = buildSummary(
          { ensembleId, spec, createdAtMs, results: err.results, clustersPlanned: err.clustersPlanned, finished: false, adaptive: err.adaptive, harmonic: err.harmonic },
          defaultSummaryOptions(analysis),
        );
        await writeSummaryFiles(out, partial, err.results, spec, { report: false, ensembleId });
      }
      process.stderr.write(`tendril: ${err.message}; ${err.results.length > 0 ? 'wrote a partial summary; ' : ''}run the same command again to continue\n`);
      process.exitCode = 130;
      return null;
    }
    throw err;
  } finally {
    process.off('SIGINT', onSignal);
    process.off('SIGTERM', onSignal);
  }
}

/**
 * Progress of `tendril run`: growth (particles, replays excluded from the
 * rate) and, for specs with [probe], each probing pass as its own progress
 * (probe jobs), so the growth bar never sits at 100% while probes run.
 */
class PhasedProgress {
  private growth: Progress | null = null;
  private probing: Progress | null = null;
  constructor(private readonly label: string, private readonly firstTotal: number, private readonly mode: ProgressMode) {}

  update(p: EmbeddedProgress): void {
    if (p.phase === 'probing') {
      if (!this.probing) {
        this.growth?.stop();
        this.growth = null;
        this.probing = createProgress({ total: p.probePassTotal, unit: 'probe jobs', label: `${this.label} (probing)`, mode: this.mode });
      }
      this.probing.update(p.probePassDone, { total: p.probePassTotal });
      return;
    }
    if (this.probing) { this.probing.stop(); this.probing = null; }
    this.growth ??= createProgress({ total: p.particlesTotal || this.firstTotal, unit: 'particles', label: this.label, mode: this.mode });
    this.growth.update(p.particlesDone, { replayed: p.particlesReplayed, total: p.particlesTotal });
  }

  stop(): void {
    this.probing?.stop();
    this.growth?.stop();
  }
}
