/**
 * The per-point hit table of a probe run, one text for `tendril probe`
 * (probe-hits.csv) and for GET /probes/:id/hits (pure: no I/O).
 *
 * Disks in the plane (and lattice perimeter sites): index,x,y,r,hits,measure
 * with measure = hits / walkers (every planar probe ends on the set).
 * Balls in 3D: index,x,y,z,r,hits,measure with r the capture radius and
 * measure = hits / (all hits), since a 3D probe may escape to infinity.
 */

type Numbers = ArrayLike<number>;

export function diskHitsCsv(count: number, x: Numbers, y: Numbers, r: number | Numbers, hits: Numbers, walkers: number): string {
  const lines = ['index,x,y,r,hits,measure'];
  for (let i = 0; i < count; i++) lines.push(`${i},${x[i]},${y[i]},${typeof r === 'number' ? r : r[i]},${hits[i]},${hits[i] / walkers}`);
  return lines.join('\n') + '\n';
}

export function ballHitsCsv(count: number, x: Numbers, y: Numbers, z: Numbers, radius: number, hits: Numbers): string {
  let total = 0;
  for (let i = 0; i < count; i++) total += hits[i];
  const lines = ['index,x,y,z,r,hits,measure'];
  for (let i = 0; i < count; i++) lines.push(`${i},${x[i]},${y[i]},${z[i]},${radius},${hits[i]},${total > 0 ? hits[i] / total : 0}`);
  return lines.join('\n') + '\n';
}
