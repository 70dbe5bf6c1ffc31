/**
 * Particle positions out of tendril: the kept final state of each cluster of
 * an ensemble (spec table [positions]) or a single `.snapshot` file, written
 * as CSV or HDF5 (layouts in docs/snapshot-format.md), or as a `.snapshot`
 * for one run (the HTTP download).
 *
 * The cluster at size n is exactly the first n particles of the final one
 * (particles never move once attached), so "positions at n" is a prefix of
 * the final positions; nothing else is stored.
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { decodeCheckpoint, decodeRunResult } from '../../proto/convert.js';
import type { ClusterPositions } from '../../worker/core/growth-kernel.js';
import { axisOf, prefixOf } from '../../worker/core/positions.js';
import { modelDescriptor } from '../../worker/models/registry.js';
import { DirectoryArtifactStore, type ArtifactStore } from '../farm/artifacts.js';
import { finalKey } from '../../worker/runtime/job-contract.js';
import { decodeSnapshot, encodeSnapshot, type PointSet } from '../snapshot/cluster-snapshot.js';
import { positionSizesOf, validateSpec, type EnsembleSpec } from '../spec/index.js';
import { UsageError } from '../usage-error.js';

export const POSITIONS_FORMAT = 'tendril-positions/1';

export interface ExportedCluster {
  /** Run index within the ensemble, or null for a lone snapshot. */
  runIndex: number | null;
  /** State hash of the run's result, when known. */
  stateHash: string | null;
  positions: ClusterPositions;
}

export interface ExportSource {
  ensembleId: string | null;
  spec: EnsembleSpec | null;
  /** Contact distance between centres (particle diameter). */
  diameter: number;
  /** Sizes to export (ascending, each a prefix; the last is the final size). */
  sizes: number[];
  clusters: ExportedCluster[];
}

/** The positions kept for one run (its final state), or null when none were kept. */
export async function keptPositions(artifacts: ArtifactStore, ensembleId: string, runIndex: number): Promise<ClusterPositions | null> {
  const bytes = await artifacts.get(finalKey(ensembleId, runIndex));
  if (!bytes) return null;
  const c = decodeCheckpoint(bytes);
  return { dimension: c.state.dimension, count: c.state.count, coords: c.state.positions };
}

/** A `.snapshot` of the first `size` particles (default all). */
export function snapshotOf(p: ClusterPositions, diameter: number, size = p.count): Buffer {
  const q = prefixOf(p, size);
  const set: PointSet = { dimension: q.dimension as 2 | 3, count: q.count, x: axisOf(q, 0), y: axisOf(q, 1), diameter, arrivalOrder: true };
  if (q.dimension === 3) set.z = axisOf(q, 2);
  return encodeSnapshot(set);
}

function fromPointSet(s: PointSet): ClusterPositions {
  const d = s.dimension;
  const coords = new Float64Array(s.count * d);
  for (let i = 0; i < s.count; i++) {
    coords[i * d] = s.x[i];
    coords[i * d + 1] = s.y[i];
    if (d === 3) coords[i * d + 2] = s.z![i];
  }
  return { dimension: d, count: s.count, coords };
}

/** A lone `.snapshot` file (from `tendril grow`). */
export async function snapshotSource(path: string): Promise<ExportSource> {
  const set = decodeSnapshot(await readFile(path));
  return { ensembleId: null, spec: null, diameter: set.diameter, sizes: [set.count], clusters: [{ runIndex: null, stateHash: null, positions: fromPointSet(set) }] };
}

/** The output folder of `tendril run` for a spec with [positions]: every run whose final state was kept. */
export async function runFolderSource(dir: string): Promise<ExportSource> {
  let meta: { ensemble_id: string; spec: unknown };
  try {
    meta = JSON.parse(await readFile(join(dir, 'ensemble.json'), 'utf8')) as typeof meta;
  } catch {
    throw new UsageError(`source: "${dir}" is not an output folder of tendril run (no readable ensemble.json); allowed: such a folder or a .snapshot file`);
  }
  const spec = validateSpec(meta.spec);
  if (!spec.positions) {
    throw new UsageError(`source: the spec of "${dir}" has no [positions] table, so no positions were kept; allowed: a run of a spec with [positions] (add it and run again: finished runs are grown anew only for their positions)`);
  }
  const store = new DirectoryArtifactStore(join(dir, 'state'));
  const id = meta.ensemble_id;
  const clusters: ExportedCluster[] = [];
  for (let i = 0; ; i++) {
    if (i >= spec.clusters && !spec.target) break;
    if (spec.target && i >= spec.target.maxClusters) break;
    const p = await keptPositions(store, id, i);
    if (!p) {
      if (spec.target && i >= spec.clusters) break;
      continue;
    }
    const res = await store.get(`${id}/run-${i}.result`);
    clusters.push({ runIndex: i, stateHash: res ? decodeRunResult(res).stateHash : null, positions: p });
  }
  if (clusters.length === 0) throw new UsageError(`source: "${dir}" holds no kept positions yet (no run has finished); allowed: a folder with finished runs`);
  return { ensembleId: id, spec, diameter: modelDescriptor(spec.model.kind).contactDistance, sizes: positionSizesOf(spec), clusters };
}

/** CSV: one row per particle and exported size: run_index, size, particle (arrival order, 0-based), x, y[, z]. */
export function positionsCsv(src: ExportSource): string {
  const dim = src.clusters[0]?.positions.dimension ?? 2;
  const axes = ['x', 'y', 'z'].slice(0, dim);
  const lines = [['run_index', 'size', 'particle', ...axes].join(',')];
  for (const c of src.clusters) {
    const p = c.positions;
    for (const size of src.sizes) {
      if (size > p.count) continue;
      for (let i = 0; i < size; i++) {
        const row: (string | number)[] = [c.runIndex ?? '', size, i];
        for (let k = 0; k < dim; k++) row.push(p.coords[i * dim + k]);
        lines.push(row.join(','));
      }
    }
  }
  return lines.join('\n') + '\n';
}

/**
 * HDF5 (via h5wasm, the HDF5 C library compiled to WebAssembly):
 *   /                       attributes format, ensemble_id, model, params (JSON), seed, particles, dimension, diameter, sizes
 *   /runs/run-NNNNNN        one group per cluster; attributes run_index, state_hash, particles
 *   /runs/run-NNNNNN/positions   float64 [particles, dimension], row i = particle i in arrival order
 * The cluster at an exported size n is positions[0:n].
 */
export async function writePositionsHdf5(path: string, src: ExportSource): Promise<void> {
  const { default: h5wasm } = await import('h5wasm/node');
  await h5wasm.ready;
  const f = new h5wasm.File(path, 'w');
  try {
    f.create_attribute('format', POSITIONS_FORMAT);
    f.create_attribute('ensemble_id', src.ensembleId ?? '');
    f.create_attribute('model', src.spec?.model.kind ?? '');
    f.create_attribute('params', JSON.stringify(src.spec?.model.params ?? {}));
    f.create_attribute('seed', src.spec?.seed ?? '');
    f.create_attribute('particles', src.sizes[src.sizes.length - 1]);
    f.create_attribute('dimension', src.clusters[0]?.positions.dimension ?? 2);
    f.create_attribute('diameter', src.diameter);
    f.create_attribute('sizes', new Float64Array(src.sizes), [src.sizes.length], '<d');
    const runs = f.create_group('runs');
    for (const c of src.clusters) {
      const g = runs.create_group(`run-${String(c.runIndex ?? 0).padStart(6, '0')}`);
      g.create_attribute('run_index', c.runIndex ?? -1);
      g.create_attribute('state_hash', c.stateHash ?? '');
      g.create_attribute('particles', c.positions.count);
      const p = c.positions;
      g.create_dataset({ name: 'positions', data: p.coords.slice(0, p.count * p.dimension), shape: [p.count, p.dimension], dtype: '<d' });
    }
  } finally {
    f.close();
  }
}
