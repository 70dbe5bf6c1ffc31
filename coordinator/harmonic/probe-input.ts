/**
 * Inputs to probe: one of our cluster snapshots (coordinator/snapshot; 2D
 * only), probed as disks of radius = the snapshot's contact distance
 * (diameter) around the centres (see worker/probe/probe-2d.ts), or a CSV of
 * `x,y,r` rows (disk centre and contact radius; an optional header line
 * naming x,y,r; blank lines and lines starting with # are skipped).
 */
import { messageOf } from '../../proto/errors.js';
import { readFileSync } from 'node:fs';
import { decodeSnapshot } from '../snapshot/cluster-snapshot.js';
import type { DiskSet } from '../../worker/probe/probe-2d.js';

export interface ProbeInput extends DiskSet {
  x: Float64Array;
  y: Float64Array;
  r: number | Float64Array;
  kind: 'snapshot' | 'csv';
  /** Radius used to draw each disk in pictures (physical particle radius). */
  drawRadius: number | Float64Array;
}

export function parseDiskCsv(text: string, name = 'CSV'): ProbeInput {
  const xs: number[] = [];
  const ys: number[] = [];
  const rs: number[] = [];
  const lines = text.split(/\r?\n/);
  for (let li = 0; li < lines.length; li++) {
    const line = lines[li].trim();
    if (line === '' || line.startsWith('#')) continue;
    const cells = line.split(',').map((c) => c.trim());
    if (xs.length === 0 && rs.length === 0 && /^x$/i.test(cells[0] ?? '')) {
      if (cells.length !== 3 || !/^y$/i.test(cells[1]) || !/^r$/i.test(cells[2]))
        throw new RangeError(`${name} line ${li + 1}: header must be x,y,r, got "${line}"`);
      continue;
    }
    if (cells.length !== 3) throw new RangeError(`${name} line ${li + 1}: expected 3 values x,y,r, got ${cells.length}`);
    const [x, y, r] = cells.map((c) => (c === '' ? NaN : Number(c)));
    if (!Number.isFinite(x) || !Number.isFinite(y)) throw new RangeError(`${name} line ${li + 1}: x and y must be finite numbers, got "${cells[0]}", "${cells[1]}"`);
    if (!(Number.isFinite(r) && r > 0)) throw new RangeError(`${name} line ${li + 1}: r must be a finite number > 0, got "${cells[2]}"`);
    xs.push(x); ys.push(y); rs.push(r);
  }
  if (xs.length === 0) throw new RangeError(`${name} holds no x,y,r rows`);
  const r = Float64Array.from(rs);
  return { kind: 'csv', count: xs.length, x: Float64Array.from(xs), y: Float64Array.from(ys), r, drawRadius: r };
}

export function readProbeInput(path: string): ProbeInput {
  let bytes: Buffer;
  try {
    bytes = readFileSync(path);
  } catch (e) {
    throw new RangeError(`INPUT "${path}" cannot be read: ${(e as NodeJS.ErrnoException).code ?? String(e)}`);
  }
  const named = path.toLowerCase().endsWith('.snapshot');
  if (named || (bytes.length >= 8 && bytes.subarray(0, 8).toString('latin1') === 'TNDRLSNP')) {
    // a file named .snapshot is read as one, so a damaged one says what is wrong with it (not "wrong extension")
    let s;
    try {
      s = decodeSnapshot(bytes);
    } catch (e) {
      throw new RangeError(`INPUT "${path}" is not a valid snapshot: ${messageOf(e)}`);
    }
    if (s.dimension !== 2) throw new RangeError(`INPUT "${path}" is a ${s.dimension}D snapshot; probing needs dimension 2`);
    return { kind: 'snapshot', count: s.count, x: s.x, y: s.y, r: s.diameter, drawRadius: s.diameter / 2 };
  }
  if (!path.toLowerCase().endsWith('.csv')) throw new RangeError(`INPUT "${path}" must be a .snapshot file or a .csv of x,y,r rows`);
  return parseDiskCsv(bytes.toString('utf8'), `INPUT ${path}`);
}
