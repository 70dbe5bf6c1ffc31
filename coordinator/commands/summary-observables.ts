/**
 * The model-observable section of an ensemble summary (its statistics JSON,
 * schema tendril.observables/1), shared by the summary files and by the
 * anisotropy baseline read with --baseline.
 */
import type { EnsembleSummaryData } from '../../proto/convert.js';
import type { ObservableSection } from '../stats/observable-bands.js';

/** The model-observable section of a summary's statistics, or null. */
export function observablesOfSummary(s: EnsembleSummaryData): ObservableSection | null {
  if (s.statisticsJson === '') return null;
  const x = JSON.parse(s.statisticsJson) as { observables?: ObservableSection };
  return x.observables?.schema === 'tendril.observables/1' ? x.observables : null;
}
