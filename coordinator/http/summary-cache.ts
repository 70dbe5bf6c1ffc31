/**
 * Summaries of farm ensembles for the HTTP API, computed once per ensemble
 * state and off the event loop. The state of an ensemble, as far as its
 * summary goes, is what its status shows: runs done and failed, its state,
 * probes analysed and failed, adaptive batches. While that is unchanged the
 * cached summary is served; requests that arrive while it is being computed
 * share the one computation. The computation runs on a SummaryThread
 * (coordinator/farm/summary-thread.ts) unless the server was given summary
 * options of its own (they may hold functions, which cannot cross threads).
 */
import type { EnsembleSummaryData } from '../../proto/convert.js';
import type { EnsembleRecord, EnsembleStore } from '../farm/store.js';
import { buildSummary, type SummaryInput, type SummaryOptions } from '../summary/index.js';
import { SummaryThread } from '../farm/summary-thread.js';

/** Ensembles whose summary is kept (least recently used dropped first). */
const CACHED_ENSEMBLES = 32;

export interface CachedSummary {
  record: EnsembleRecord;
  summary: EnsembleSummaryData;
}

export class SummaryCache {
  private readonly entries = new Map<string, { key: string; value: Promise<CachedSummary | null> }>();
  private readonly thread: SummaryThread | null;
  /** Summaries computed (not served from the cache); for tests and metrics. */
  computed = 0;

  constructor(
    private readonly store: EnsembleStore,
    private readonly options?: SummaryOptions,
  ) {
    this.thread = options ? null : new SummaryThread();
  }

  async get(id: string): Promise<CachedSummary | null> {
    const status = await this.store.status(id);
    if (!status) return null;
    const key = JSON.stringify([status.state, status.runs.done, status.runs.failed, status.runs.planned, status.probes?.done ?? 0, status.probes?.failed ?? 0, status.adaptive?.batches ?? 0]);
    const hit = this.entries.get(id);
    if (hit && hit.key === key) {
      // most recently used last
      this.entries.delete(id);
      this.entries.set(id, hit);
      return hit.value;
    }
    const value = this.compute(id, status.state !== 'running');
    this.entries.delete(id);
    this.entries.set(id, { key, value });
    // a failed computation is not kept
    value.catch(() => {
      if (this.entries.get(id)?.value === value) this.entries.delete(id);
    });
    while (this.entries.size > CACHED_ENSEMBLES) this.entries.delete(this.entries.keys().next().value!);
    return value;
  }

  private async compute(id: string, finished: boolean): Promise<CachedSummary | null> {
    const record = await this.store.get(id);
    if (!record) return null;
    const results = await this.store.results(id);
    const harmonic = record.spec.probe ? await this.store.harmonicRecords(id) : undefined;
    const input: SummaryInput = {
      ensembleId: id,
      spec: record.spec,
      createdAtMs: record.createdAtMs,
      results,
      clustersPlanned: record.plannedClusters,
      finished,
      adaptive: record.adaptive,
      harmonic,
    };
    this.computed++;
    const summary = this.thread ? await this.thread.build(input) : buildSummary(input, this.options);
    return { record, summary };
  }

  async close(): Promise<void> {
    this.entries.clear();
    await this.thread?.close();
  }
}
