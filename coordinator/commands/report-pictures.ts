/**
 * The two pictures of an ensemble report — a sample cluster and a probed
 * cluster coloured by harmonic measure — for `tendril summary --format html`
 * (farm) and `tendril run` (embedded), drawn from what the artifact store
 * keeps, with a one-line reason for each picture that cannot be drawn.
 *
 * Run results hold no positions. The sample cluster is the lowest run with a
 * result: its final positions when the store keeps them (specs with
 * [positions] or [probe]), else the run grown again from its task (same task,
 * same bits; its state hash is checked against the stored result) up to
 * REGROW_MAX_PARTICLES. The harmonic-measure picture needs a probed run's
 * final positions and hit counts, both kept in the store at its final size.
 */
import { decodeCheckpoint, growthTaskOf, type RunResultData } from '../../proto/convert.js';
import { axisOf } from '../../worker/core/positions.js';
import { finalKey, hitsKey } from '../../worker/runtime/job-contract.js';
import { createKernel } from '../../worker/models/registry.js';
import type { ArtifactStore } from '../farm/artifacts.js';
import { CLUSTER_CONTACT_RADIUS, positionsOf } from '../harmonic/ensemble-probing.js';
import { measurePictureGeometry, renderMeasurePng } from '../harmonic/measure-picture.js';
import type { MeasurePictureInput } from '../report/harmonic-plots.js';
import { runTaskFor } from '../plan.js';
import { noPictureReason, picturePointsOf } from '../render/model-picture.js';
import type { SampleClusterInput } from '../report/index.js';
import type { EnsembleSpec } from '../spec/index.js';

/** Largest cluster grown again for the picture when the store keeps no positions (a few seconds of one thread). */
export const REGROW_MAX_PARTICLES = 200_000;

export interface ReportPictures {
  sampleCluster?: SampleClusterInput;
  measurePicture?: MeasurePictureInput;
  /** Why a picture is missing, shown in the report's notes. */
  notes: { sampleCluster?: string; measurePicture?: string };
}

export interface ReportPictureSource {
  ensembleId: string;
  spec: EnsembleSpec;
  results: readonly RunResultData[];
  /** The artifact store of the ensemble; null when none was given (then only regrowing is possible). */
  artifacts: ArtifactStore | null;
  /** Said in the notes when `artifacts` is null: how to give one. */
  noStoreHint?: string;
  /** A measure picture already at hand (embedded mode probed it in this invocation). */
  measurePicture?: ReportPictures['measurePicture'];
}

/** A probed cluster (particles of diameter 1) coloured by harmonic measure, with its scale in particle diameters. */
export function clusterMeasurePicture(runIndex: number, size: number, x: Float64Array, y: Float64Array, counts: ArrayLike<number>): MeasurePictureInput {
  const r = CLUSTER_CONTACT_RADIUS / 2;
  return { runIndex, size, png: renderMeasurePng(size, x, y, r, counts), scale: { pixelsPerUnit: measurePictureGeometry(size, x, y, r).scale, unit: 'particle diameters' } };
}

const HOW_KEPT = 'final positions are kept for specs with [positions] or [probe]';

export async function reportPictures(src: ReportPictureSource): Promise<ReportPictures> {
  const out: ReportPictures = { notes: {} };
  const runs = [...src.results].sort((a, b) => a.runIndex - b.runIndex);
  const noStore = src.artifacts === null ? ` (no artifact store was given${src.noStoreHint ? `: ${src.noStoreHint}` : ''})` : '';
  // ---- the sample cluster
  const noPicture = noPictureReason(src.spec.model.kind);
  if (noPicture !== null) out.notes.sampleCluster = `no sample cluster picture: ${noPicture}`;
  else if (runs.length === 0) out.notes.sampleCluster = 'no sample cluster picture: no run has finished';
  else {
    const run = runs[0];
    const kept = src.artifacts ? await src.artifacts.get(finalKey(src.ensembleId, run.runIndex)) : null;
    if (kept) {
      const points = picturePointsOf(src.spec.model.kind, positionsOf(decodeCheckpoint(kept)));
      if (points) out.sampleCluster = { points, runIndex: run.runIndex };
    } else if (src.spec.particles <= REGROW_MAX_PARTICLES) {
      const k = createKernel(growthTaskOf(runTaskFor(src.ensembleId, src.spec, run.runIndex)));
      k.growTo(src.spec.particles);
      const hash = k.result().stateHash;
      if (hash !== run.stateHash) out.notes.sampleCluster = `no sample cluster picture: run ${run.runIndex} grown again does not match its stored result (state hash ${hash} vs ${run.stateHash})`;
      else {
        const points = picturePointsOf(src.spec.model.kind, k.positions());
        if (points) out.sampleCluster = { points, runIndex: run.runIndex };
      }
    } else {
      out.notes.sampleCluster =
        `no sample cluster picture: run ${run.runIndex}'s positions are not in the artifact store${noStore} (${HOW_KEPT}), ` +
        `and clusters of ${src.spec.particles} particles are not grown again for a picture (at most ${REGROW_MAX_PARTICLES})`;
    }
  }
  // ---- the harmonic-measure picture (probed ensembles only)
  if (!src.spec.probe) return out;
  if (src.measurePicture) {
    out.measurePicture = src.measurePicture;
    return out;
  }
  if (!src.artifacts) {
    out.notes.measurePicture = `no harmonic measure picture: the probed clusters' positions and hits are in the artifact store${noStore}`;
    return out;
  }
  const size = src.spec.particles;
  for (const run of runs) {
    const hits = await src.artifacts.get(hitsKey(src.ensembleId, run.runIndex));
    if (!hits) continue;
    const fin = await src.artifacts.get(finalKey(src.ensembleId, run.runIndex));
    if (!fin) continue;
    const pos = positionsOf(decodeCheckpoint(fin));
    const counts = new Float64Array(Uint8Array.from(hits).buffer);
    if (counts.length !== size || pos.count !== size) continue;
    out.measurePicture = clusterMeasurePicture(run.runIndex, size, axisOf(pos, 0, size), axisOf(pos, 1, size), counts);
    return out;
  }
  out.notes.measurePicture = `no harmonic measure picture: no run has both its final positions and its probe hits in the artifact store (runs ${runs.length > 0 ? `${runs[0].runIndex}…${runs[runs.length - 1].runIndex}` : 'none'} looked at; the probes may still be running)`;
  return out;
}
