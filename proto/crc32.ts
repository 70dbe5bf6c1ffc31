/**
 * CRC-32 (IEEE 802.3 / zlib polynomial, reflected, init and final XOR
 * 0xFFFFFFFF), the checksum of snapshot and checkpoint files. It can be
 * continued over a file written or read in pieces: pass the CRC of the bytes
 * before as `prior`.
 */
import * as zlib from 'node:zlib';

// zlib.crc32 exists from Node 20.15; a namespace import keeps older Nodes loading.
const nativeCrc32 = (zlib as { crc32?: (data: Uint8Array) => number }).crc32;

let crcTable: Uint32Array | undefined;

/**
 * Table-driven CRC-32 (IEEE), used when node:zlib has no crc32 (Node < 20.15).
 * `prior` continues the CRC of the bytes before `data` (0 to start).
 */
export function crc32Portable(data: Uint8Array, start = 0, end = data.length, prior = 0): number {
  if (crcTable === undefined) {
    crcTable = new Uint32Array(256);
    for (let n = 0; n < 256; n++) {
      let c = n;
      for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
      crcTable[n] = c >>> 0;
    }
  }
  const t = crcTable;
  let c = (prior ^ 0xffffffff) >>> 0;
  for (let i = start; i < end; i++) c = t[(c ^ data[i]) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

/** CRC-32 (IEEE) of data[start, end), continuing `prior` (the CRC of the bytes before; 0 to start). */
export function crc32(data: Uint8Array, start = 0, end = data.length, prior = 0): number {
  if (nativeCrc32 !== undefined) return (nativeCrc32 as (d: Uint8Array, v?: number) => number)(data.subarray(start, end), prior) >>> 0;
  return crc32Portable(data, start, end, prior);
}

