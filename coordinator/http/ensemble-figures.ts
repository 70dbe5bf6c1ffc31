/**
 * Figures of a farm ensemble for the web page (coordinator/http/web-routes.ts):
 * the report's plots (coordinator/report), built from the summary of the
 * results stored so far, and a picture of one cluster.
 *
 * Results hold no positions, so the picture is run 0 grown again from its
 * task (same task, same bits) in a worker thread, off the server's event
 * loop, for clusters up to PICTURE_MAX_PARTICLES; its state hash is compared
 * with the stored result of run 0 when there is one, and the picture says so.
 * Both are kept in memory per ensemble. The figures are rebuilt when more
 * results are stored or the state changes, but while the ensemble runs at most
 * once per max(10 s, 5 × the time the last build took): the analysis runs on
 * the server's thread, and a big ensemble stores results every few seconds.
 */
import { axisOf } from '../../worker/core/positions.js';
import { TaskThreadPool } from '../../worker/runtime/task-thread.js';
import type { EnsembleStore } from '../farm/store.js';
import { farmSummary } from '../farm/summary.js';
import { positionsOf } from '../harmonic/ensemble-probing.js';
import { runTaskFor } from '../plan.js';
import { buildEnsembleReport, clusterFigure, type Figure } from '../report/index.js';
import { analysisOf, defaultSummaryOptions, harmonicOfSummary, type SummaryOptions } from '../summary/index.js';

/** Largest cluster regrown for the picture (a few seconds of one thread). */
export const PICTURE_MAX_PARTICLES = 200_000;

export interface FigureSet {
  clustersDone: number;
  partial: boolean;
  figures: Figure[];
  /** Why figures are missing or empty (no results yet, too few clusters, ...). */
  notes: string[];
}

export interface ClusterPicture {
  png: Uint8Array;
  runIndex: number;
  particles: number;
  /** 'matches' when the regrown state hash equals the stored result's, 'not stored yet' without a result. */
  hashCheck: 'matches' | 'not stored yet';
}

export class EnsembleFigures {
  private readonly figureCache = new Map<string, { key: string; state: string; set: FigureSet; builtAt: number; buildMs: number }>();
  private readonly pictures = new Map<string, Promise<ClusterPicture | string>>();
  private pool: TaskThreadPool | null = null;

  constructor(
    private readonly store: EnsembleStore,
    private readonly summaryOptions: SummaryOptions = defaultSummaryOptions(),
  ) {}

  /** The report's figures for the results stored so far; null for an unknown ensemble. */
  async figures(id: string): Promise<FigureSet | null> {
    const count = await this.store.redis.hlen(`${this.store.prefix}:ensemble:${id}:results`);
    const status = await this.store.status(id);
    if (!status) return null;
    const key = `${count}:${status.state}`;
    const hit = this.figureCache.get(id);
    if (hit?.key === key) return hit.set;
    if (hit && hit.set.figures.length > 0 && hit.state === 'running' && status.state === 'running' && Date.now() - hit.builtAt < Math.max(10_000, 5 * hit.buildMs)) return hit.set;
    const t0 = Date.now();
    const got = await farmSummary(this.store, id, this.summaryOptions);
    if (!got) return null;
    const analysis = analysisOf(got.summary);
    let set: FigureSet;
    if (!analysis) {
      const reason = got.summary.statisticsJson ? ((JSON.parse(got.summary.statisticsJson) as { reason?: string }).reason ?? 'no statistics') : 'no statistics yet';
      set = { clustersDone: got.summary.clustersDone, partial: got.summary.partial, figures: [], notes: [count === 0 ? 'no cluster finished yet' : reason] };
    } else {
      const report = buildEnsembleReport({ analysis: { ...analysis, harmonic: harmonicOfSummary(got.summary) }, runs: got.results, spec: got.record.spec, png: false, embedFont: false, ensembleId: id });
      set = { clustersDone: got.summary.clustersDone, partial: got.summary.partial, figures: report.figures, notes: report.notes.filter((n) => !n.startsWith('no sample cluster')) };
    }
    this.figureCache.set(id, { key, state: status.state, set, builtAt: Date.now(), buildMs: Date.now() - t0 });
    return set;
  }

  /** Run 0 of the ensemble as a PNG, or a one-line reason why there is none. */
  async picture(id: string): Promise<ClusterPicture | string | null> {
    const rec = await this.store.get(id);
    if (!rec) return null;
    if (rec.spec.particles > PICTURE_MAX_PARTICLES) return `clusters of ${rec.spec.particles} particles are not regrown for a picture (at most ${PICTURE_MAX_PARTICLES})`;
    let p = this.pictures.get(id);
    if (!p) {
      p = this.grow(id, rec.spec);
      this.pictures.set(id, p);
    }
    const got = await p;
    if (typeof got !== 'string' && got.hashCheck === 'not stored yet') this.pictures.delete(id); // check again next time
    return got;
  }

  private async grow(id: string, spec: Parameters<typeof runTaskFor>[1]): Promise<ClusterPicture | string> {
    this.pool ??= new TaskThreadPool(1);
    const task = { ...runTaskFor(id, spec, 0), keepPositions: true };
    const out = await this.pool.run(task).outcome;
    if (out.status !== 'done' || !out.final) return `run 0 could not be grown again: ${out.status === 'failed' ? out.message : out.status}`;
    const stored = (await this.store.results(id)).find((r) => r.runIndex === 0);
    if (stored && stored.stateHash !== out.result.stateHash) return `run 0 grown again does not match its stored result (hash ${out.result.stateHash} vs ${stored.stateHash})`;
    const pos = positionsOf(out.final);
    const pic = clusterFigure({ dimension: 2, count: pos.count, x: axisOf(pos, 0), y: axisOf(pos, 1), diameter: 1 }, 0, 600);
    return { png: pic.png, runIndex: 0, particles: pos.count, hashCheck: stored ? 'matches' : 'not stored yet' };
  }

  async close(): Promise<void> {
    await this.pool?.close();
  }
}
