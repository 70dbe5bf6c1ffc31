/**
 * Cluster snapshot: a compact binary file holding the particle centres of one
 * cluster (or any point set of equal balls) in arrival order.
 *
 * Layout, version 1. All integers and floats are little-endian.
 *
 *   offset  size  field
 *   ------  ----  -----------------------------------------------------------
 *        0     8  magic, the ASCII bytes "TNDRLSNP"
 *        8     2  uint16  format version (= 1)
 *       10     1  uint8   dimension D (2 or 3)
 *       11     1  uint8   flags; bit 0 set = points are in arrival order
 *                         (growth order); other bits are reserved and must be 0
 *       12     4  uint32  header length in bytes (= 32); coordinates start here
 *       16     8  uint64  particle count N (at most 2^53 - 1)
 *       24     8  float64 particle diameter d: two particles touch when their
 *                         centres are d apart (1 for our clusters)
 *       32  8·N·D float64 coordinates, one array per axis ("planar" layout):
 *                         x[0..N-1], then y[0..N-1], then (D = 3) z[0..N-1]
 *  32+8ND     4  uint32  CRC-32 (IEEE 802.3 / zlib polynomial, reflected,
 *                         init and final XOR 0xFFFFFFFF) of bytes [0, 32+8ND)
 *
 * Total length is exactly 36 + 8·N·D bytes. The planar layout lets a reader
 * map each axis straight into an array (e.g. numpy.frombuffer(buf, '<f8',
 * count=N, offset=32 + 8*N*k) for axis k). Because the header is 32 bytes,
 * every coordinate is 8-byte aligned from the start of the file.
 */
import { closeSync, fstatSync, openSync, readFileSync, readSync } from 'node:fs';
import { writeFileAtomically } from '../../proto/atomic-file.js';
import { endianness } from 'node:os';
import type { ClusterPositions } from '../../worker/core/growth-kernel.js';
import { axisOf } from '../../worker/core/positions.js';
import { TendrilError } from '../../proto/errors.js';
import { crc32 } from '../../proto/crc32.js';

export { crc32, crc32Portable } from '../../proto/crc32.js';

export const SNAPSHOT_MAGIC = 'TNDRLSNP';
export const SNAPSHOT_VERSION = 1;
export const SNAPSHOT_HEADER_BYTES = 32;
export const SNAPSHOT_TRAILER_BYTES = 4;
/** Flag bit 0: the points are listed in the order they joined the cluster. */
export const FLAG_ARRIVAL_ORDER = 1;
const KNOWN_FLAGS = FLAG_ARRIVAL_ORDER;

export interface PointSet {
  dimension: 2 | 3;
  count: number;
  /** Centres; each array holds at least `count` entries (extra ones are ignored). */
  x: Float64Array;
  y: Float64Array;
  /** Required when dimension is 3. */
  z?: Float64Array;
  /** Contact distance between centres (particle diameter). */
  diameter: number;
  /** True when the points are in arrival order; default true. */
  arrivalOrder?: boolean;
}

export interface DecodedPointSet extends PointSet {
  arrivalOrder: boolean;
  version: number;
}

/** The point set of dimension-strided positions (2 or 3 axes), in arrival order, with contact distance `diameter`. */
export function pointSetOf(p: ClusterPositions, diameter: number, count = p.count): PointSet {
  if (p.dimension !== 2 && p.dimension !== 3) throw new RangeError(`snapshot dimension must be 2 or 3, got ${String(p.dimension)}`);
  const n = Math.min(count, p.count);
  const out: PointSet = { dimension: p.dimension, count: n, x: axisOf(p, 0, n), y: axisOf(p, 1, n), diameter, arrivalOrder: true };
  if (p.dimension === 3) out.z = axisOf(p, 2, n);
  return out;
}

/** Thrown for a malformed snapshot; the message is one line. */
export class SnapshotError extends TendrilError {
  override name = 'SnapshotError';
  readonly kind = 'snapshot';
}

const LITTLE_ENDIAN_HOST = endianness() === 'LE';

function validatePointSet(p: PointSet): void {
  if (p.dimension !== 2 && p.dimension !== 3) throw new RangeError(`snapshot dimension must be 2 or 3, got ${String(p.dimension)}`);
  if (!Number.isSafeInteger(p.count) || p.count < 0) throw new RangeError(`snapshot count must be a non-negative integer, got ${p.count}`);
  if (!(Number.isFinite(p.diameter) && p.diameter > 0)) throw new RangeError(`snapshot diameter must be a finite number > 0, got ${p.diameter}`);
  const axes: Array<[string, Float64Array | undefined]> = [['x', p.x], ['y', p.y]];
  if (p.dimension === 3) axes.push(['z', p.z]);
  for (const [name, a] of axes) {
    if (!(a instanceof Float64Array)) throw new RangeError(`snapshot axis ${name} must be a Float64Array`);
    if (a.length < p.count) throw new RangeError(`snapshot axis ${name} has ${a.length} entries, fewer than count ${p.count}`);
  }
}

/** Encoded length in bytes of a snapshot of `count` points in `dimension` dimensions. */
export function snapshotByteLength(dimension: 2 | 3, count: number): number {
  return SNAPSHOT_HEADER_BYTES + 8 * count * dimension + SNAPSHOT_TRAILER_BYTES;
}

/** The 32-byte header of a snapshot of `count` points. */
function snapshotHeader(dimension: 2 | 3, count: number, diameter: number, arrivalOrder: boolean): Buffer {
  const buf = Buffer.alloc(SNAPSHOT_HEADER_BYTES);
  const view = new DataView(buf.buffer, buf.byteOffset, buf.byteLength);
  buf.write(SNAPSHOT_MAGIC, 0, 'latin1');
  view.setUint16(8, SNAPSHOT_VERSION, true);
  view.setUint8(10, dimension);
  view.setUint8(11, arrivalOrder ? FLAG_ARRIVAL_ORDER : 0);
  view.setUint32(12, SNAPSHOT_HEADER_BYTES, true);
  view.setBigUint64(16, BigInt(count), true);
  view.setFloat64(24, diameter, true);
  return buf;
}

/** Values per chunk when a snapshot is streamed to or from a file (1 MiB of float64). */
const STREAM_CHUNK = 1 << 17;

/**
 * Write the first `count` centres of dimension-strided positions as a
 * snapshot file, streamed: the axes are gathered 1 MiB at a time into one
 * reused buffer, so no copy of the cluster is ever held (a giant cluster's
 * snapshot costs 1 MiB of memory, not 16 bytes per particle). The file is
 * published whole (proto/atomic-file.ts). Same bytes as encodeSnapshot.
 */
export function writeSnapshotFile(path: string, p: ClusterPositions, diameter: number, count = p.count): void {
  const d = p.dimension;
  if (d !== 2 && d !== 3) throw new RangeError(`snapshot dimension must be 2 or 3, got ${String(d)}`);
  if (!(Number.isFinite(diameter) && diameter > 0)) throw new RangeError(`snapshot diameter must be a finite number > 0, got ${diameter}`);
  const n = Math.min(count, p.count);
  writeFileAtomically(path, (put) => {
    const header = snapshotHeader(d, n, diameter, true);
    put(header);
    let crc = crc32(header);
    const chunk = new Float64Array(STREAM_CHUNK);
    const bytes = new Uint8Array(chunk.buffer);
    const view = new DataView(chunk.buffer);
    const c = p.coords;
    for (let k = 0; k < d; k++) {
      for (let i0 = 0; i0 < n; i0 += STREAM_CHUNK) {
        const m = Math.min(STREAM_CHUNK, n - i0);
        if (LITTLE_ENDIAN_HOST) for (let i = 0; i < m; i++) chunk[i] = c[(i0 + i) * d + k];
        else for (let i = 0; i < m; i++) view.setFloat64(8 * i, c[(i0 + i) * d + k], true);
        const part = bytes.subarray(0, 8 * m);
        crc = crc32(part, 0, part.length, crc);
        put(part);
      }
    }
    const trailer = Buffer.alloc(SNAPSHOT_TRAILER_BYTES);
    trailer.writeUInt32LE(crc >>> 0, 0);
    put(trailer);
  });
}

/**
 * Read a snapshot file, streamed: the header first, then each axis straight
 * into its own array (no buffer of the whole file), the CRC computed on the
 * way. Same checks and messages as decodeSnapshot.
 */
export function readSnapshotFile(path: string): DecodedPointSet {
  const fd = openSync(path, 'r');
  try {
    const size = fstatSync(fd).size;
    const head = Buffer.alloc(SNAPSHOT_HEADER_BYTES);
    const got = size >= SNAPSHOT_HEADER_BYTES + SNAPSHOT_TRAILER_BYTES ? readSync(fd, head, 0, SNAPSHOT_HEADER_BYTES, 0) : 0;
    if (got < SNAPSHOT_HEADER_BYTES) {
      // too short to stream: the whole-buffer decoder gives the precise message
      return decodeSnapshot(readFileSync(path));
    }
    const n = checkedSnapshotHeader(head, size);
    const d = head.readUInt8(10) as 2 | 3;
    let crc = crc32(head);
    const axes: Float64Array[] = [];
    let at = SNAPSHOT_HEADER_BYTES;
    for (let k = 0; k < d; k++) {
      const a = new Float64Array(n);
      const bytes = new Uint8Array(a.buffer);
      for (let o = 0; o < bytes.length; ) {
        const len = Math.min(8 * STREAM_CHUNK, bytes.length - o);
        const r = readSync(fd, bytes, o, len, at);
        if (r <= 0) throw new SnapshotError(`snapshot ended early at byte ${at} of ${size}`);
        crc = crc32(bytes, o, o + r, crc);
        o += r;
        at += r;
      }
      if (!LITTLE_ENDIAN_HOST) {
        const view = new DataView(a.buffer);
        for (let i = 0; i < n; i++) a[i] = view.getFloat64(8 * i, true);
      }
      axes.push(a);
    }
    const trailer = Buffer.alloc(SNAPSHOT_TRAILER_BYTES);
    readSync(fd, trailer, 0, SNAPSHOT_TRAILER_BYTES, at);
    const stored = trailer.readUInt32LE(0);
    if (stored !== crc >>> 0) {
      throw new SnapshotError(`snapshot checksum mismatch: stored CRC-32 0x${stored.toString(16).padStart(8, '0')}, computed 0x${(crc >>> 0).toString(16).padStart(8, '0')}`);
    }
    const out: DecodedPointSet = {
      dimension: d,
      count: n,
      x: axes[0],
      y: axes[1],
      diameter: head.readDoubleLE(24),
      arrivalOrder: (head.readUInt8(11) & FLAG_ARRIVAL_ORDER) !== 0,
      version: SNAPSHOT_VERSION,
    };
    if (d === 3) out.z = axes[2];
    return out;
  } finally {
    closeSync(fd);
  }
}

/** Encode a point set into the snapshot format described in the file header. */
export function encodeSnapshot(p: PointSet): Buffer {
  validatePointSet(p);
  const n = p.count;
  const d = p.dimension;
  const total = snapshotByteLength(d, n);
  const buf = Buffer.alloc(total);
  const view = new DataView(buf.buffer, buf.byteOffset, buf.byteLength);
  buf.set(snapshotHeader(d, n, p.diameter, p.arrivalOrder !== false), 0);
  const axes = d === 3 ? [p.x, p.y, p.z as Float64Array] : [p.x, p.y];
  let off = SNAPSHOT_HEADER_BYTES;
  for (const a of axes) {
    if (LITTLE_ENDIAN_HOST) {
      buf.set(new Uint8Array(a.buffer, a.byteOffset, n * 8), off);
    } else {
      for (let i = 0; i < n; i++) view.setFloat64(off + 8 * i, a[i], true);
    }
    off += 8 * n;
  }
  view.setUint32(off, crc32(buf, 0, off), true);
  return buf;
}

/** Check a snapshot's 32-byte header against the file's total length; returns the particle count. */
function checkedSnapshotHeader(bytes: Uint8Array, totalLength: number): number {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const magic = Buffer.from(bytes.buffer, bytes.byteOffset, 8).toString('latin1');
  if (magic !== SNAPSHOT_MAGIC) throw new SnapshotError(`snapshot magic is ${JSON.stringify(magic)}, expected "${SNAPSHOT_MAGIC}"`);
  const version = view.getUint16(8, true);
  if (version !== SNAPSHOT_VERSION) throw new SnapshotError(`snapshot format version is ${version}, this reader knows version ${SNAPSHOT_VERSION}`);
  const d = view.getUint8(10);
  if (d !== 2 && d !== 3) throw new SnapshotError(`snapshot dimension is ${d}, expected 2 or 3`);
  const flags = view.getUint8(11);
  if ((flags & ~KNOWN_FLAGS) !== 0) throw new SnapshotError(`snapshot flags are 0x${flags.toString(16)}, only bit 0 is defined`);
  const headerLen = view.getUint32(12, true);
  if (headerLen !== SNAPSHOT_HEADER_BYTES) throw new SnapshotError(`snapshot header length is ${headerLen}, expected ${SNAPSHOT_HEADER_BYTES}`);
  const countBig = view.getBigUint64(16, true);
  if (countBig > BigInt(Number.MAX_SAFE_INTEGER)) throw new SnapshotError(`snapshot particle count ${countBig} exceeds 2^53 - 1`);
  const n = Number(countBig);
  const expected = snapshotByteLength(d, n);
  if (totalLength !== expected) {
    throw new SnapshotError(`snapshot is ${totalLength} bytes, expected ${expected} for ${n} particles in ${d} dimensions`);
  }
  const diameter = view.getFloat64(24, true);
  if (!(Number.isFinite(diameter) && diameter > 0)) throw new SnapshotError(`snapshot diameter is ${diameter}, expected a finite number > 0`);
  return n;
}

/** Decode and validate a snapshot; throws SnapshotError with a one-line message. */
export function decodeSnapshot(bytes: Uint8Array): DecodedPointSet {
  if (bytes.length < SNAPSHOT_HEADER_BYTES + SNAPSHOT_TRAILER_BYTES) {
    throw new SnapshotError(`snapshot is ${bytes.length} bytes, shorter than the ${SNAPSHOT_HEADER_BYTES + SNAPSHOT_TRAILER_BYTES}-byte minimum`);
  }
  const n = checkedSnapshotHeader(bytes, bytes.length);
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const d = view.getUint8(10) as 2 | 3;
  const flags = view.getUint8(11);
  const version = view.getUint16(8, true);
  const diameter = view.getFloat64(24, true);
  const expected = snapshotByteLength(d, n);
  const crcAt = expected - SNAPSHOT_TRAILER_BYTES;
  const stored = view.getUint32(crcAt, true);
  const actual = crc32(bytes, 0, crcAt);
  if (stored !== actual) {
    throw new SnapshotError(`snapshot checksum mismatch: stored CRC-32 0x${stored.toString(16).padStart(8, '0')}, computed 0x${actual.toString(16).padStart(8, '0')}`);
  }
  const axes: Float64Array[] = [];
  let off = SNAPSHOT_HEADER_BYTES;
  for (let k = 0; k < d; k++) {
    const a = new Float64Array(n);
    if (LITTLE_ENDIAN_HOST) {
      new Uint8Array(a.buffer).set(bytes.subarray(off, off + 8 * n));
    } else {
      for (let i = 0; i < n; i++) a[i] = view.getFloat64(off + 8 * i, true);
    }
    axes.push(a);
    off += 8 * n;
  }
  const out: DecodedPointSet = {
    dimension: d,
    count: n,
    x: axes[0],
    y: axes[1],
    diameter,
    arrivalOrder: (flags & FLAG_ARRIVAL_ORDER) !== 0,
    version,
  };
  if (d === 3) out.z = axes[2];
  return out;
}
