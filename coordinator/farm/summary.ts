/**
 * The summary of a farm ensemble, finished or not: built from the results
 * stored so far, marked partial while the ensemble is still running, with
 * the batch history of an adaptive ensemble. Used by `tendril summary` and
 * the HTTP summary route.
 */
import type { EnsembleSummaryData, RunResultData } from '../../proto/convert.js';
import { buildSummary, defaultSummaryOptions, type SummaryOptions } from '../summary/index.js';
import type { EnsembleReader, EnsembleRecord } from './ensemble-reader.js';

export interface FarmSummary {
  record: EnsembleRecord;
  results: RunResultData[];
  summary: EnsembleSummaryData;
}

export async function farmSummary(store: EnsembleReader, id: string, opts: SummaryOptions = defaultSummaryOptions()): Promise<FarmSummary | null> {
  const record = await store.get(id);
  if (!record) return null;
  const results = await store.results(id);
  const status = await store.status(id);
  const harmonic = record.spec.probe ? await store.harmonicRecords(id) : undefined;
  const summary = buildSummary(
    {
      ensembleId: id,
      spec: record.spec,
      createdAtMs: record.createdAtMs,
      results,
      clustersPlanned: record.plannedClusters,
      finished: status !== null && status.state !== 'running',
      adaptive: record.adaptive,
      harmonic,
    },
    opts,
  );
  return { record, results, summary };
}
