/**
 * CLI overrides of the spec's [analysis] table, shared by `tendril run` and
 * `tendril summary`. They are checked by the same schema as the spec table,
 * so the messages and ranges are the same.
 */
import type { Command } from 'commander';
import type { AnalysisSettings } from '../spec/index.js';
// the spec module (ajv, the model registry) loads when settings are merged, not when the options are registered (start-up of `status`)
import { UsageError } from '../usage-error.js';

export interface AnalysisCliOptions {
  fitWindow?: string;
  massRadiusWindow?: string;
  resamples?: string;
  level?: string;
  corrections?: boolean;
  localSlopeWidth?: string;
}

export function addAnalysisOptions(cmd: Command): Command {
  return cmd
    .option('--fit-window <from:to>', 'window in N of the R_g and R_max fits, e.g. 1000:100000 (either end may be left empty)')
    .option('--mass-radius-window <from:to>', 'window in r (particle diameters) of the M(r) fit, e.g. 10:60')
    .option('--resamples <n>', 'bootstrap resamples (10 to 1000000)')
    .option('--level <p>', 'confidence level of the intervals (0.5 to 0.999)')
    .option('--corrections', 'also run the corrections-to-scaling fit R = A N^{1/D}(1 + B N^-omega) (off by default; it reports "not determined" unless the data fix omega)')
    .option('--no-corrections', 'skip the corrections-to-scaling fit even if the spec asks for it')
    .option('--local-slope-width <decades>', 'full width of the local-slope window in decades (0.05 to 3)');
}

function window(flag: string, text: string, lo: string, hi: string, doc: Record<string, unknown>): void {
  const m = /^\s*([^:]*):([^:]*)\s*$/.exec(text);
  if (!m || (m[1].trim() === '' && m[2].trim() === '')) throw new UsageError(`${flag}: "${text}" is not allowed; allowed: FROM:TO with numbers, e.g. 1000:100000 (one end may be empty)`);
  for (const [part, field] of [[m[1], lo], [m[2], hi]] as const) {
    if (part.trim() === '') continue;
    const v = Number(part);
    if (!Number.isFinite(v)) throw new UsageError(`${flag}: "${text}" is not allowed; allowed: FROM:TO with numbers, e.g. 1000:100000 (one end may be empty)`);
    doc[field] = v;
  }
}

function number(flag: string, text: string): number {
  const v = Number(text);
  if (text.trim() === '' || !Number.isFinite(v)) throw new UsageError(`${flag}: "${text}" is not allowed; allowed: a number`);
  return v;
}

/** The option (and end of a window) that sets each analysis field. */
const FLAG_OF: Record<string, string> = {
  fit_min_size: '--fit-window FROM',
  fit_max_size: '--fit-window TO',
  mass_radius_min_radius: '--mass-radius-window FROM',
  mass_radius_max_radius: '--mass-radius-window TO',
  resamples: '--resamples',
  level: '--level',
  local_slope_width: '--local-slope-width',
};

/**
 * A spec message about the analysis, worded for the command line: every
 * analysis field the options set is named by its option (the value and the
 * allowed range stay); fields that come from the spec keep their spec name.
 */
export function cliAnalysisMessage(problem: string, fromCli: ReadonlySet<string>): string {
  return problem.replace(/analysis\.([a-z_]+)/g, (whole, f: string) => (fromCli.has(f) && FLAG_OF[f] ? FLAG_OF[f] : whole));
}

/**
 * The spec's analysis settings with the command-line overrides applied,
 * validated against the ensemble's own size when it is given (particles and
 * clusters of its spec): a fit window beyond its particles is refused here,
 * before any work, not reported as "no statistics" after it.
 */
export async function analysisSettingsFromCli(base: AnalysisSettings, o: AnalysisCliOptions, ensemble?: { particles: number; clusters: number }): Promise<AnalysisSettings> {
  const doc: Record<string, unknown> = {};
  if (o.fitWindow !== undefined) window('--fit-window', o.fitWindow, 'fit_min_size', 'fit_max_size', doc);
  if (o.massRadiusWindow !== undefined) window('--mass-radius-window', o.massRadiusWindow, 'mass_radius_min_radius', 'mass_radius_max_radius', doc);
  if (o.resamples !== undefined) doc.resamples = number('--resamples', o.resamples);
  if (o.level !== undefined) doc.level = number('--level', o.level);
  if (o.corrections !== undefined) doc.corrections = o.corrections;
  if (o.localSlopeWidth !== undefined) doc.local_slope_width = number('--local-slope-width', o.localSlopeWidth);
  if (Object.keys(doc).length === 0) return base;
  const { mergeAnalysisSettings, SpecError } = await import('../spec/index.js');
  try {
    return mergeAnalysisSettings(base, doc, ensemble);
  } catch (err) {
    if (err instanceof SpecError) throw new UsageError(cliAnalysisMessage(err.problems[0], new Set(Object.keys(doc))));
    throw err;
  }
}
