/**
 * `--baseline DIR` of `tendril run`: the output folder of an earlier `tendril
 * run` of an isotropic model (off-lattice DLA, usually) whose k-fold
 * amplitude is drawn beside this ensemble's in one figure of the report
 * (coordinator/report/observable-plots.ts, anisotropyComparisonFigure) and
 * compared by the rule of coordinator/stats/anisotropy-comparison.ts.
 *
 * The baseline is read from DIR/summary.pb (any readable contract version);
 * it must carry statistics.observables with a k-fold amplitude. k is the
 * fold of this ensemble's lattice (4 square, 6 triangular), else of the
 * baseline's, else 4.
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { decodeEnsembleSummary } from '../../proto/convert.js';
import { modelDescriptor } from '../../worker/models/registry.js';
import type { ObservableSection } from '../stats/observable-bands.js';
import { UsageError } from '../usage-error.js';
import { observablesOfSummary } from './summary-observables.js';

/** What the report needs of the baseline. */
export interface ReportBaseline {
  /** This ensemble's label in the figure (its model kind). */
  own: string;
  /** The baseline's label (its model kind). */
  label: string;
  fold: number;
  observables: ObservableSection;
  /** The folder it was read from (for messages). */
  dir: string;
}

const FOLD: Record<string, number> = { square: 4, triangular: 6 };

/** The fold k for a pair of model kinds: this model's lattice, else the baseline's, else 4. */
export function foldOf(ownKind: string, baselineKind: string): number {
  const own = modelDescriptor(ownKind).lattice;
  if (own && FOLD[own]) return FOLD[own];
  const other = modelDescriptor(baselineKind).lattice;
  return other && FOLD[other] ? FOLD[other] : 4;
}

/** Read and check the baseline of `dir` for an ensemble of model `ownKind`; one-line UsageError when unusable. */
export async function loadBaseline(dir: string, ownKind: string): Promise<ReportBaseline> {
  const path = join(dir, 'summary.pb');
  let bytes: Uint8Array;
  try {
    bytes = await readFile(path);
  } catch {
    throw new UsageError(`--baseline: "${dir}" holds no summary.pb; allowed: the --out folder of a finished tendril run of a planar model`);
  }
  let kind: string;
  let observables: ObservableSection | null;
  try {
    const s = decodeEnsembleSummary(bytes);
    kind = String((JSON.parse(s.specJson) as { model?: unknown }).model);
    modelDescriptor(kind);
    observables = observablesOfSummary(s);
  } catch (e) {
    throw new UsageError(`--baseline: "${path}" is not a readable ensemble summary (${(e as Error).message.slice(0, 120)}); allowed: the summary.pb written by tendril run`);
  }
  const fold = foldOf(ownKind, kind);
  if (!observables || !observables.bands.some((b) => b.name === `fold_amplitude_${fold}` && b.sizes.length > 0)) {
    throw new UsageError(`--baseline: "${dir}" (model ${kind}) has no fold_amplitude_${fold} in its summary; allowed: the --out folder of a tendril run of a planar model (every planar model records it)`);
  }
  return { own: ownKind, label: kind, fold, observables, dir };
}
