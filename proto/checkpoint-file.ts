/**
 * Checkpoint files, streamed: written and read in chunks of 1 MiB in the
 * framed layout of proto/checkpoint-frame.ts, so that a checkpoint of a
 * giant cluster never needs a buffer of the whole cluster. The writer reads
 * the positions in place (a kernel's own array, e.g. from checkpointView())
 * and writes a temporary file renamed into place (a reader never sees half
 * a checkpoint, even when the writer is killed mid-write); the reader puts
 * the positions straight into one array, with room for a whole run if asked
 * (a kernel may keep that array as its own).
 *
 * Files written before frames (one protobuf message) are still read.
 */
import { closeSync, fstatSync, openSync, readFileSync, readSync } from 'node:fs';
import { writeFileAtomically } from './atomic-file.js';
import { endianness } from 'node:os';
import { checkpointFromMessage, ContractError, decodeCheckpoint, encodeCheckpointHeader, type CheckpointData } from './convert.js';
import { FRAME_PREFIX_BYTES, FRAME_TRAILER_BYTES, frameHead, framePrefix, isCheckpointFrame } from './checkpoint-frame.js';
import { crc32 } from './crc32.js';
import { messageOf } from './errors.js';
import { tendril } from './generated/tendril.js';

/** Float64 values per chunk (1 MiB). */
const CHUNK_VALUES = 1 << 17;
const LITTLE_ENDIAN = endianness() === 'LE';

/** Write `c` to `path` (atomically: a temporary file, flushed, then renamed). Returns the bytes written. */
export function writeCheckpointFile(path: string, c: CheckpointData): number {
  const s = c.state;
  const values = s.count * s.dimension;
  if (s.positions.length < values) throw new RangeError(`checkpoint positions hold ${s.positions.length} values, fewer than ${values}`);
  return writeFileAtomically(path, (put) => {
    const head = frameHead(encodeCheckpointHeader(c));
    put(head);
    let crc = crc32(head);
    const p = s.positions;
    const chunk = LITTLE_ENDIAN ? null : new Float64Array(CHUNK_VALUES);
    for (let i0 = 0; i0 < values; i0 += CHUNK_VALUES) {
      const m = Math.min(CHUNK_VALUES, values - i0);
      let bytes: Uint8Array;
      if (chunk === null) bytes = new Uint8Array(p.buffer, p.byteOffset + 8 * i0, 8 * m);
      else {
        const view = new DataView(chunk.buffer);
        for (let i = 0; i < m; i++) view.setFloat64(8 * i, p[i0 + i], true);
        bytes = new Uint8Array(chunk.buffer, 0, 8 * m);
      }
      crc = crc32(bytes, 0, bytes.length, crc);
      put(bytes);
    }
    const trailer = new Uint8Array(FRAME_TRAILER_BYTES);
    new DataView(trailer.buffer).setUint32(0, crc >>> 0, true);
    put(trailer);
  });
}

/**
 * Read a checkpoint file (framed, or one protobuf message as written before
 * frames). `roomFor`: give the positions array room for this many particles.
 * Throws ContractError with one line for a damaged or foreign file.
 */
export function readCheckpointFile(path: string, roomFor = 0): CheckpointData {
  const fd = openSync(path, 'r');
  try {
    const size = fstatSync(fd).size;
    const prefix = new Uint8Array(FRAME_PREFIX_BYTES);
    const got = readSync(fd, prefix, 0, FRAME_PREFIX_BYTES, 0);
    if (got < FRAME_PREFIX_BYTES || !isCheckpointFrame(prefix)) return decodeCheckpoint(readFileSync(path), roomFor);
    let p;
    try {
      p = framePrefix(prefix);
    } catch (err) {
      throw new ContractError((err as Error).message);
    }
    const bytesOfValues = size - FRAME_TRAILER_BYTES - p.positionsOffset;
    if (bytesOfValues < 0 || bytesOfValues % 8 !== 0) throw new ContractError(`checkpoint file "${path}" is ${size} bytes, not a whole frame (damaged or cut short)`);
    const head = new Uint8Array(p.positionsOffset);
    readFully(fd, head, 0);
    let crc = crc32(head);
    let m;
    try {
      m = tendril.Checkpoint.decode(head.subarray(FRAME_PREFIX_BYTES, FRAME_PREFIX_BYTES + p.messageLength));
    } catch (err) {
      throw new ContractError(`Checkpoint header in "${path}" cannot be decoded: ${messageOf(err)}`);
    }
    const values = bytesOfValues / 8;
    const positions = new Float64Array(Math.max(roomFor * (m.dimension || 2), values));
    const bytes = new Uint8Array(positions.buffer, 0, bytesOfValues);
    for (let o = 0; o < bytesOfValues; ) {
      const len = Math.min(8 * CHUNK_VALUES, bytesOfValues - o);
      readFully(fd, bytes.subarray(o, o + len), p.positionsOffset + o);
      crc = crc32(bytes, o, o + len, crc);
      o += len;
    }
    const trailer = new Uint8Array(FRAME_TRAILER_BYTES);
    readFully(fd, trailer, size - FRAME_TRAILER_BYTES);
    const stored = new DataView(trailer.buffer).getUint32(0, true);
    if (stored !== crc >>> 0) throw new ContractError(`checkpoint checksum mismatch in "${path}": stored CRC-32 0x${stored.toString(16).padStart(8, '0')}, computed 0x${(crc >>> 0).toString(16).padStart(8, '0')}`);
    if (!LITTLE_ENDIAN) {
      const view = new DataView(positions.buffer);
      for (let i = 0; i < values; i++) positions[i] = view.getFloat64(8 * i, true);
    }
    return checkpointFromMessage(m, positions, values);
  } finally {
    closeSync(fd);
  }
}

function readFully(fd: number, into: Uint8Array, position: number): void {
  for (let o = 0; o < into.length; ) {
    const r = readSync(fd, into, o, into.length - o, position + o);
    if (r <= 0) throw new ContractError(`checkpoint file ended early at byte ${position + o}`);
    o += r;
  }
}

/**
 * The particle count of a checkpoint file, read from its header alone (a
 * framed file: the first bytes, never the positions); a file written before
 * frames is decoded whole. Throws ContractError for a file that is neither.
 */
export function checkpointFileCount(path: string): number {
  const fd = openSync(path, 'r');
  try {
    const prefix = new Uint8Array(FRAME_PREFIX_BYTES);
    const got = readSync(fd, prefix, 0, FRAME_PREFIX_BYTES, 0);
    if (got < FRAME_PREFIX_BYTES || !isCheckpointFrame(prefix)) return decodeCheckpoint(readFileSync(path)).state.count;
    let p;
    try {
      p = framePrefix(prefix);
    } catch (err) {
      throw new ContractError((err as Error).message);
    }
    const message = new Uint8Array(p.messageLength);
    readFully(fd, message, FRAME_PREFIX_BYTES);
    try {
      return Number(tendril.Checkpoint.decode(message).count ?? 0);
    } catch (err) {
      throw new ContractError(`Checkpoint header in "${path}" cannot be decoded: ${messageOf(err)}`);
    }
  } finally {
    closeSync(fd);
  }
}
