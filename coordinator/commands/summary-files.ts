/**
 * Writing a summary into a folder (shared by `tendril run` and `tendril
 * summary --format tables|html`): summary.json, summary.pb, one CSV file per
 * table (see CSV_TABLES in coordinator/summary/index.ts) and, when asked,
 * report.html with plots/ (coordinator/report).
 */
import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { EnsembleSummaryData, RunResultData } from '../../proto/convert.js';
import { writeEnsembleReport, type SampleClusterInput } from '../report/index.js';
import type { EnsembleSpec } from '../spec/index.js';
import { analysisOf, CSV_TABLES, harmonicOfSummary, summaryToJson, summaryToProtobuf, type AdaptiveHistory } from '../summary/index.js';
import type { ObservableSection } from '../stats/observable-bands.js';
import { compareWithBaseline } from '../stats/anisotropy-comparison.js';
import type { ReportBaseline } from './anisotropy-baseline.js';
import { observablesOfSummary } from './summary-observables.js';

export interface SummaryFilesOptions {
  /** Write report.html and plots/ (default true). */
  report?: boolean;
  /** Write summary.json and summary.pb (default true). */
  json?: boolean;
  /** Write the CSV tables (default true). */
  tables?: boolean;
  ensembleId?: string;
  /** A cluster to picture in the report. */
  sampleCluster?: SampleClusterInput;
  /** A probed cluster coloured by harmonic measure, for the report. */
  measurePicture?: { runIndex: number; size: number; png: Uint8Array };
  /** Why a picture is missing (coordinator/commands/report-pictures.ts). */
  pictureNotes?: { sampleCluster?: string; measurePicture?: string };
  /** An isotropic baseline ensemble for the combined anisotropy figure (`--baseline`, coordinator/commands/anisotropy-baseline.ts). */
  baseline?: ReportBaseline;
}

/** Writes the files and returns their names relative to `dir`. */
export async function writeSummaryFiles(
  dir: string,
  s: EnsembleSummaryData,
  runs: readonly RunResultData[],
  spec: EnsembleSpec,
  o: SummaryFilesOptions = {},
): Promise<string[]> {
  await mkdir(dir, { recursive: true });
  const written: string[] = [];
  if (o.json ?? true) {
    await writeFile(join(dir, 'summary.json'), summaryToJson(s));
    await writeFile(join(dir, 'summary.pb'), summaryToProtobuf(s));
    written.push('summary.json', 'summary.pb');
  }
  if (o.tables ?? true) {
    for (const [name, render] of Object.entries(CSV_TABLES)) {
      await writeFile(join(dir, `${name}.csv`), render(s));
      written.push(`${name}.csv`);
    }
  }
  const analysis = analysisOf(s);
  if ((o.report ?? true) && analysis) {
    const files = await writeEnsembleReport(dir, { analysis, runs, spec, sampleCluster: o.sampleCluster, measurePicture: o.measurePicture, pictureNotes: o.pictureNotes, baseline: o.baseline, ensembleId: o.ensembleId ?? s.ensembleId, title: s.partial ? `${s.name} (partial: ${s.clustersDone} of ${s.clustersPlanned} clusters)` : undefined });
    written.push('report.html', `plots/ (${files.svgs.length} SVG, ${files.pngs.length} PNG)`);
  }
  return written;
}

/** One line: this ensemble's k-fold amplitude against the baseline's, with the verdict and its rule (coordinator/stats/anisotropy-comparison.ts); '' when this summary has no observables. */
export function describeBaseline(s: EnsembleSummaryData, baseline: ReportBaseline): string {
  const obs = observablesOfSummary(s);
  if (!obs) return '';
  const c = compareWithBaseline(obs, baseline.observables, baseline.fold);
  const at = (p: { mean: number; lo: number; hi: number } | null) => (p ? `${p.mean.toFixed(4)} [${p.lo.toFixed(4)}, ${p.hi.toFixed(4)}]` : 'n/a');
  return (
    `fold_amplitude_${c.fold} against the baseline ${baseline.label} (${baseline.dir})` +
    (c.size === null ? ': no common size' : ` at N = ${c.size}: ${at(c.own)} against ${at(c.baseline)}`) +
    `: ${c.verdict} (rule: the two bands do not overlap)\n`
  );
}

/** A few lines for people: D from each estimator with its interval, and the adaptive outcome. */
export function describeAnalysis(s: EnsembleSummaryData): string {
  const lines: string[] = [];
  if (s.partial) lines.push(`partial summary: ${s.clustersDone} of ${s.clustersPlanned} planned clusters finished`);
  const a = analysisOf(s);
  if (a) {
    for (const e of Object.values(a.estimators)) {
      if (!e.available || e.D === null) continue;
      const iv = e.interval.bca ?? e.interval.percentile;
      const w = e.fitWindow;
      lines.push(
        `D from ${e.quantity}: ${e.D.toFixed(4)}` +
          (iv ? ` [${iv[0].toFixed(4)}, ${iv[1].toFixed(4)}] (${Math.round(e.interval.level * 100)}% ${e.interval.bca ? 'BCa' : 'percentile'})` : ` (no interval: ${e.interval.status})`) +
          (w && w.firstUsed !== null && w.lastUsed !== null ? `, fit over ${w.variable} = ${short(w.firstUsed)}..${short(w.lastUsed)}` : ''),
      );
    }
  } else if (s.statisticsJson !== '') {
    const x = JSON.parse(s.statisticsJson) as { reason?: string };
    if (x.reason) lines.push(`no statistics: ${x.reason}`);
  }
  const obs = observablesOfSummary(s);
  if (obs) {
    const at = (name: string) => {
      const b = obs.bands.find((x) => x.name === name);
      if (!b || b.sizes.length === 0) return null;
      const i = b.sizes.length - 1;
      return `${b.mean[i].toFixed(4)} [${b.lo[i].toFixed(4)}, ${b.hi[i].toFixed(4)}]`;
    };
    const parts = ['fold_amplitude_4', 'axis_ratio_4', 'fold_amplitude_6', 'axis_ratio_6'].map((n) => [n, at(n)]).filter(([, v]) => v !== null);
    const last = obs.bands[0]?.sizes.at(-1);
    if (parts.length > 0) lines.push(`anisotropy at N = ${last} (mean [${Math.round(obs.level * 100)}% percentile band]): ${parts.map(([n, v]) => `${n} ${v}`).join(', ')}`);
    const noise = obs.foldNoise;
    if (noise) {
      const i = noise.sizes.length - 1;
      lines.push(
        `isotropic noise at N = ${noise.sizes[i]} (mean shell count n = ${Math.round(noise.shellCount[i])}): sqrt(pi/(4n)) = ${noise.mean[i].toPrecision(3)}, ${Math.round(noise.quantile * 100)}% quantile sqrt(ln 20/n) = ${noise.threshold[i].toPrecision(3)}; ` +
          noise.verdicts.map((v) => `${v.name} ${v.verdict}`).join(', ') +
          ` (rule: lower end of the band above the ${Math.round(noise.quantile * 100)}% quantile; angles along a branch are correlated, so isotropic DLA is above it too: compare with an isotropic baseline, tendril run --baseline)`,
      );
    } else if (parts.length > 0 && noise === null) lines.push('isotropic noise: not available (some run lacks shell_count: resumed from a checkpoint written before it was recorded)');
    const phase = obs.foldPhase;
    if (phase && phase.verdicts.length > 0) {
      lines.push(
        `signed fold phase at N = ${phase.verdicts[0].size} (mean of cos k theta over the shell [${Math.round(obs.level * 100)}% percentile band]): ` +
          phase.verdicts.map((v) => `${v.name} ${v.mean.toFixed(4)} [${v.lo.toFixed(4)}, ${v.hi.toFixed(4)}] ${v.verdict}`).join(', ') +
          ` (rule: ${phase.rule})`,
      );
    } else if (parts.length > 0 && phase === null) lines.push('signed fold phase: not available (some run lacks fold_phase_4/fold_phase_6: resumed from a checkpoint written before they were recorded)');
    const g = obs.interfaceGrowth;
    if (g) {
      const iv = g.interval.bca ?? g.interval.percentile;
      lines.push(
        `interface growth exponent beta (w ~ R^beta, fit over N = ${short(g.window.fromSize)}..${short(g.window.toSize)}): ${g.beta.toFixed(4)}` +
          (iv ? ` [${iv[0].toFixed(4)}, ${iv[1].toFixed(4)}] (${Math.round(g.interval.level * 100)}% ${g.interval.bca ? 'BCa' : 'percentile'})` : ` (no interval: ${g.interval.status})`) +
          `; KPZ 1/3: ${g.verdict} (rule: 1/3 inside the interval)`,
      );
    }
  }
  const hm = harmonicOfSummary(s);
  if (hm) {
    const last = hm.bySize[hm.bySize.length - 1];
    const ev = (v: { mean: number; interval: { bca: [number, number] | null; percentile: [number, number] | null } } | null | undefined) => {
      if (!v || !Number.isFinite(v.mean)) return 'n/a';
      const iv = v.interval.bca ?? v.interval.percentile;
      return `${v.mean.toFixed(4)}${iv ? ` [${iv[0].toFixed(4)}, ${iv[1].toFixed(4)}]` : ''}`;
    };
    if (last) {
      lines.push(`harmonic measure at N = ${last.size} (${last.clusters} clusters, ${last.walkers} walkers each): tau'(1) = ${ev(last.informationDimension)}, tau(3) = ${ev(last.tau3)}, max-concentration exponent = ${ev(last.maxConcentrationExponent)}; tau(q) converged for ${last.convergedRange ? `q in [${last.convergedRange[0]}, ${last.convergedRange[1]}]` : 'no q'}`);
    }
    const cg = hm.capacityGrowth;
    if (cg.dimension !== null) lines.push(`capacity growth: D_cap = ${cg.dimension.toFixed(4)}${cg.dimensionInterval ? ` [${cg.dimensionInterval[0].toFixed(4)}, ${cg.dimensionInterval[1].toFixed(4)}]` : ''}`);
    else if (cg.reason) lines.push(`capacity growth: ${cg.reason}`);
    const ci = hm.capacityIncrement;
    if (ci.slope !== null) {
      const iv = ci.slopeInterval?.bca ?? ci.slopeInterval?.percentile;
      lines.push(`capacity increment vs Z(3): log-log slope ${ci.slope.toFixed(3)}${iv ? ` [${iv[0].toFixed(3)}, ${iv[1].toFixed(3)}]` : ''} (1 = proportional: ${ci.proportional === null ? 'not judged' : ci.proportional ? 'yes' : 'no'})`);
    }
    const e = hm.electrostatic;
    if (e.consistent !== null) lines.push(`tau(3) = D, box fit at N = ${e.size}: ${e.consistent ? 'consistent' : 'not consistent'} (tau(3) ${ev(e.tau3)} vs D ${e.massDimension?.value?.toFixed(4) ?? 'n/a'})${e.consistentWithSystematic !== null ? `; with the fit-window systematic: ${e.consistentWithSystematic ? 'consistent' : 'not consistent'}` : ''}`);
    const ws = last?.informationDimensionWithSystematic;
    if (ws) lines.push(`tau'(1) with the fit-window systematic: [${ws[0].toFixed(4)}, ${ws[1].toFixed(4)}] (Makarov: 1)`);
    const ps = e.particleScale;
    if (ps.ratio !== null) {
      const iv = ps.ratioInterval?.bca ?? ps.ratioInterval?.percentile;
      lines.push(`tau(3) = D, particle scale (Z(3) ~ N^(-tau(3)/D)): tau(3)/D = ${ps.ratio.toFixed(3)}${iv ? ` [${iv[0].toFixed(3)}, ${iv[1].toFixed(3)}]` : ''} (${ps.consistent === null ? 'not judged' : ps.consistent ? 'consistent with 1' : 'not consistent with 1'})`);
    }
    const b = hm.breakdownRelation;
    if (b) {
      const est = (v: { estimate: number | null; low: number | null; high: number | null }): string =>
        v.estimate === null ? 'n/a' : `${v.estimate.toFixed(3)}${v.low !== null && v.high !== null ? ` [${v.low.toFixed(3)}, ${v.high.toFixed(3)}]` : ''}`;
      lines.push(`breakdown relation at eta = ${b.eta}: tau(eta+2) - tau(eta) = ${est(b.tauDifference)} vs D of the same sets ${est(b.massDimension)}: ${b.verdict} (intervals overlap = consistent)${b.reason ? ` (${b.reason})` : ''}`);
      lines.push(`capacity increment vs Z(eta+2)/Z(eta): log-log slope ${est(b.capacityIncrement.slope)}: ${b.capacityIncrement.verdict} (1 inside the interval = proportional)`);
    }
  }
  if (s.adaptiveJson !== '') {
    const h = JSON.parse(s.adaptiveJson) as AdaptiveHistory;
    lines.push(`adaptive: ${h.outcome}${h.reason ? ` (${h.reason})` : ''} after ${h.batches.length} batch(es)`);
  }
  return lines.map((l) => l + '\n').join('');
}

function short(v: number): string {
  return Number.isInteger(v) ? String(v) : v.toPrecision(4);
}
