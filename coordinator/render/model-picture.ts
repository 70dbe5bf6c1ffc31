/**
 * The picture of a cluster as its model's descriptor asks for it
 * (ModelDescriptor.picture): planar disks (cluster-picture.ts) or balls in
 * three dimensions, four depth-shaded views (spheres-picture.ts).
 */
import type { PictureKind } from '../../worker/core/model-descriptor.js';
import type { ClusterPositions } from '../../worker/core/growth-kernel.js';
import { axisOf } from '../../worker/core/positions.js';
import type { PointSet } from '../snapshot/cluster-snapshot.js';
import { renderClusterPng } from './cluster-picture.js';
import { renderSpheresPng } from './spheres-picture.js';

/** A point set (arrival order) of the first `count` centres of dimension-strided positions. */
export function pointSetOf(pos: ClusterPositions, diameter: number, count = pos.count): PointSet {
  if (pos.dimension !== 2 && pos.dimension !== 3) throw new RangeError(`positions have dimension ${pos.dimension}; pictures need 2 or 3`);
  const x = axisOf(pos, 0, count);
  const y = axisOf(pos, 1, count);
  if (pos.dimension === 2) return { dimension: 2, count: x.length, x, y, diameter, arrivalOrder: true };
  return { dimension: 3, count: x.length, x, y, z: axisOf(pos, 2, count), diameter, arrivalOrder: true };
}

/** PNG bytes of the picture of the given kind. */
export function renderModelPicture(kind: PictureKind, points: PointSet, size: number): Buffer {
  switch (kind) {
    case 'disks-2d':
      return renderClusterPng(points, { size });
    case 'spheres-3d':
      return renderSpheresPng(points, { size });
  }
}
