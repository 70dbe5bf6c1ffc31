/**
 * The cluster picture of a model, as its descriptor declares it
 * (ModelDescriptor.picture): the point set drawn, or one line saying the
 * model has no picture. grow and run ask here instead of assuming a planar
 * cluster.
 */
import type { ClusterPositions } from '../../worker/core/growth-kernel.js';
import { modelDescriptor } from '../../worker/models/registry.js';
import { pointSetOf, type PointSet } from '../snapshot/cluster-snapshot.js';

/** The point set of a cluster of `kind`, drawn as its picture kind says; null when the model declares no picture. */
export function picturePointsOf(kind: string, positions: ClusterPositions): PointSet | null {
  const d = modelDescriptor(kind);
  switch (d.picture) {
    case null:
      return null;
    case 'disks':
      return pointSetOf(positions, d.contactDistance);
  }
}

/** One line for a model without a picture (null when it has one). */
export function noPictureReason(kind: string): string | null {
  return modelDescriptor(kind).picture === null ? `${kind} declares no cluster picture (see tendril models)` : null;
}
