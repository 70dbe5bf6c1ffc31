/**
 * The framed checkpoint layout (frame version 1): a small protobuf header
 * followed by the positions as raw float64, so that a checkpoint of a giant
 * cluster is written and read in chunks straight from and into the kernel's
 * own positions array (proto/checkpoint-file.ts), never as one protobuf
 * message holding a copy of every coordinate. All integers little-endian.
 *
 *   offset     size      field
 *   0          8         magic, the ASCII bytes "TNDRLCKP"
 *   8          2         uint16 frame version (= 1)
 *   10         2         uint16 reserved (= 0)
 *   12         4         uint32 H, length of the header message
 *   16         H         protobuf `Checkpoint` (proto/tendril.proto) with every
 *                        field but the coordinates (`positions`, `x`, `y` empty);
 *                        its `count` and `dimension` say how many values follow
 *   16 + H     P         zero bytes, P in 0..7, so that the positions start at
 *                        a multiple of 8
 *   A = 16+H+P 8·count·D float64 centres in arrival order, interleaved
 *                        (x0, y0[, z0], x1, …), D = dimension
 *   A + 8·count·D  4     uint32 CRC-32 (proto/crc32.ts) of every byte before
 *
 * A reader tells the layouts apart by the first 8 bytes: a checkpoint
 * written before frames (one protobuf `Checkpoint` message, contract 1 or 2)
 * starts with the varint tag of field 1, never with "T"; both are read.
 */
import { crc32 } from './crc32.js';

export const CHECKPOINT_FRAME_MAGIC = 'TNDRLCKP';
export const CHECKPOINT_FRAME_VERSION = 1;
/** Bytes before the header message. */
export const FRAME_PREFIX_BYTES = 16;
export const FRAME_TRAILER_BYTES = 4;

/** True when the bytes start with the frame magic. */
export function isCheckpointFrame(bytes: Uint8Array): boolean {
  if (bytes.length < 8) return false;
  for (let i = 0; i < 8; i++) if (bytes[i] !== CHECKPOINT_FRAME_MAGIC.charCodeAt(i)) return false;
  return true;
}

/** Prefix, header message and padding: everything before the positions (whose offset is the result's length). */
export function frameHead(message: Uint8Array): Uint8Array {
  const start = FRAME_PREFIX_BYTES + message.length;
  const padded = (start + 7) & ~7;
  const head = new Uint8Array(padded);
  for (let i = 0; i < 8; i++) head[i] = CHECKPOINT_FRAME_MAGIC.charCodeAt(i);
  const view = new DataView(head.buffer);
  view.setUint16(8, CHECKPOINT_FRAME_VERSION, true);
  view.setUint16(10, 0, true);
  view.setUint32(12, message.length, true);
  head.set(message, FRAME_PREFIX_BYTES);
  return head;
}

/** Total length of a frame whose header message is `messageLength` bytes and which holds `values` float64. */
export function frameLength(messageLength: number, values: number): number {
  return ((FRAME_PREFIX_BYTES + messageLength + 7) & ~7) + 8 * values + FRAME_TRAILER_BYTES;
}

/** What the first bytes of a frame say: the header message's length and where the positions start. */
export interface FramePrefix {
  messageLength: number;
  positionsOffset: number;
}

/** Read the 16-byte prefix; throws RangeError with one line when it is not a frame this build reads. */
export function framePrefix(bytes: Uint8Array): FramePrefix {
  if (bytes.length < FRAME_PREFIX_BYTES || !isCheckpointFrame(bytes)) throw new RangeError(`checkpoint does not start with "${CHECKPOINT_FRAME_MAGIC}"`);
  const view = new DataView(bytes.buffer, bytes.byteOffset, FRAME_PREFIX_BYTES);
  const version = view.getUint16(8, true);
  if (version !== CHECKPOINT_FRAME_VERSION) throw new RangeError(`checkpoint frame version is ${version}, this build reads version ${CHECKPOINT_FRAME_VERSION}`);
  const messageLength = view.getUint32(12, true);
  return { messageLength, positionsOffset: (FRAME_PREFIX_BYTES + messageLength + 7) & ~7 };
}

/** Check the CRC-32 trailer of a whole frame held in memory; throws RangeError with one line. */
export function checkFrameCrc(bytes: Uint8Array): void {
  if (bytes.length < FRAME_PREFIX_BYTES + FRAME_TRAILER_BYTES) throw new RangeError(`checkpoint frame is ${bytes.length} bytes, too short`);
  const at = bytes.length - FRAME_TRAILER_BYTES;
  const stored = new DataView(bytes.buffer, bytes.byteOffset + at, FRAME_TRAILER_BYTES).getUint32(0, true);
  const actual = crc32(bytes, 0, at);
  if (stored !== actual) throw new RangeError(`checkpoint checksum mismatch: stored CRC-32 0x${stored.toString(16).padStart(8, '0')}, computed 0x${actual.toString(16).padStart(8, '0')}`);
}
