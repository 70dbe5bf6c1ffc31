/**
 * The cluster picture of a model, as its descriptor declares it
 * (ModelDescriptor.picture): the point set drawn, or one line saying the
 * model has no picture. grow and run ask here instead of assuming a planar
 * cluster.
 */
import type { ClusterPositions } from '../../worker/core/growth-kernel.js';
import { modelDescriptor } from '../../worker/models/registry.js';
import { pointSetOf, type PointSet } from '../snapshot/cluster-snapshot.js';
import { renderClusterPng } from './cluster-picture.js';
import { renderSpheresPng } from './spheres-picture.js';

/** The point set of a cluster of `kind`, drawn as its picture kind says; null when the model declares no picture. */
export function picturePointsOf(kind: string, positions: ClusterPositions): PointSet | null {
  const d = modelDescriptor(kind);
  switch (d.picture) {
    case null:
      return null;
    case 'disks':
    case 'spheres-3d':
      return pointSetOf(positions, d.contactDistance);
  }
}

/** PNG bytes of a model's cluster picture: disks in the plane, or four depth-shaded views of balls in 3D. */
export function renderModelPicture(kind: string, points: PointSet, size: number): Buffer {
  return modelDescriptor(kind).picture === 'spheres-3d' ? renderSpheresPng(points, { size }) : renderClusterPng(points, { size });
}

/** One line for a model without a picture (null when it has one). */
export function noPictureReason(kind: string): string | null {
  return modelDescriptor(kind).picture === null ? `${kind} declares no cluster picture (see tendril models)` : null;
}
