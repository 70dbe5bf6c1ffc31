import { describe, expect, it } from 'vitest';
import {
  crc32,
  crc32Portable,
  decodeSnapshot,
  encodeSnapshot,
  SnapshotError,
  snapshotByteLength,
} from '../coordinator/snapshot/index.js';

function points(n: number, seed = 1): { x: Float64Array; y: Float64Array; z: Float64Array } {
  // Deterministic, irregular coordinates including negative values and non-round doubles.
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  const z = new Float64Array(n);
  let s = seed >>> 0;
  const next = (): number => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 2 ** 32 - 0.5;
  };
  for (let i = 0; i < n; i++) {
    x[i] = next() * 1e3 + Math.PI * 1e-9;
    y[i] = next() * 1e-3;
    z[i] = next() * 77.7;
  }
  return { x, y, z };
}

describe('CRC-32', () => {
  it('gives the standard check value for "123456789"', () => {
    // 0xCBF43926 is the published check value of CRC-32/ISO-HDLC (the zlib / IEEE 802.3 CRC);
    // common practice, e.g. the "catalogue of parametrised CRC algorithms" (from memory).
    const data = new TextEncoder().encode('123456789');
    expect(crc32(data)).toBe(0xcbf43926);
    expect(crc32Portable(data)).toBe(0xcbf43926);
  });

  it('native and portable implementations agree on ranges', () => {
    const data = new Uint8Array(10_000);
    for (let i = 0; i < data.length; i++) data[i] = (i * 131 + (i >> 7)) & 0xff;
    for (const [a, b] of [[0, 10_000], [3, 9_999], [500, 501], [7, 7]] as const) {
      expect(crc32(data, a, b)).toBe(crc32Portable(data, a, b));
    }
  });
});

describe('cluster snapshot', () => {
  it('round-trips 2D points exactly, ignoring extra array entries', () => {
    const { x, y } = points(1000);
    const bytes = encodeSnapshot({ dimension: 2, count: 900, x, y, diameter: 1 });
    expect(bytes.length).toBe(snapshotByteLength(2, 900));
    expect(bytes.length).toBe(36 + 8 * 900 * 2);
    const back = decodeSnapshot(bytes);
    expect(back.dimension).toBe(2);
    expect(back.count).toBe(900);
    expect(back.diameter).toBe(1);
    expect(back.arrivalOrder).toBe(true);
    expect(back.version).toBe(1);
    expect(back.z).toBeUndefined();
    expect(Array.from(back.x)).toEqual(Array.from(x.subarray(0, 900)));
    expect(Array.from(back.y)).toEqual(Array.from(y.subarray(0, 900)));
  });

  it('round-trips 3D points with another contact diameter and no arrival order', () => {
    const { x, y, z } = points(333, 7);
    const bytes = encodeSnapshot({ dimension: 3, count: 333, x, y, z, diameter: 0.25, arrivalOrder: false });
    const back = decodeSnapshot(bytes);
    expect(back.dimension).toBe(3);
    expect(back.diameter).toBe(0.25);
    expect(back.arrivalOrder).toBe(false);
    expect(Array.from(back.z!)).toEqual(Array.from(z));
    expect(Array.from(back.x)).toEqual(Array.from(x));
  });

  it('round-trips an empty point set', () => {
    const back = decodeSnapshot(encodeSnapshot({ dimension: 2, count: 0, x: new Float64Array(0), y: new Float64Array(0), diameter: 1 }));
    expect(back.count).toBe(0);
    expect(back.x.length).toBe(0);
  });

  it('follows the documented byte layout', () => {
    const x = Float64Array.of(1.5, -2.25);
    const y = Float64Array.of(3, 0.1);
    const bytes = encodeSnapshot({ dimension: 2, count: 2, x, y, diameter: 1 });
    const v = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    expect(bytes.subarray(0, 8).toString('latin1')).toBe('TNDRLSNP');
    expect(v.getUint16(8, true)).toBe(1);
    expect(v.getUint8(10)).toBe(2);
    expect(v.getUint8(11)).toBe(1);
    expect(v.getUint32(12, true)).toBe(32);
    expect(v.getBigUint64(16, true)).toBe(2n);
    expect(v.getFloat64(24, true)).toBe(1);
    // planar layout: x[0], x[1], y[0], y[1]
    expect(v.getFloat64(32, true)).toBe(1.5);
    expect(v.getFloat64(40, true)).toBe(-2.25);
    expect(v.getFloat64(48, true)).toBe(3);
    expect(v.getFloat64(56, true)).toBe(0.1);
    expect(v.getUint32(64, true)).toBe(crc32Portable(bytes, 0, 64));
    expect(bytes.length).toBe(68);
  });

  it('rejects input it cannot encode', () => {
    const x = new Float64Array(3);
    expect(() => encodeSnapshot({ dimension: 2, count: 4, x, y: x, diameter: 1 })).toThrow(/axis x has 3 entries, fewer than count 4/);
    expect(() => encodeSnapshot({ dimension: 3, count: 3, x, y: x, diameter: 1 })).toThrow(/axis z must be a Float64Array/);
    expect(() => encodeSnapshot({ dimension: 2, count: 3, x, y: x, diameter: 0 })).toThrow(/diameter must be a finite number > 0, got 0/);
    expect(() => encodeSnapshot({ dimension: 4 as 2, count: 3, x, y: x, diameter: 1 })).toThrow(/dimension must be 2 or 3, got 4/);
  });

  describe('decode validation', () => {
    const { x, y } = points(50, 3);
    const good = encodeSnapshot({ dimension: 2, count: 50, x, y, diameter: 1 });
    const patched = (f: (v: DataView) => void, fixCrc = true): Buffer => {
      const b = Buffer.from(good);
      const v = new DataView(b.buffer, b.byteOffset, b.byteLength);
      f(v);
      if (fixCrc) v.setUint32(b.length - 4, crc32Portable(b, 0, b.length - 4), true);
      return b;
    };
    const cases: Array<[string, Uint8Array, RegExp]> = [
      ['too short', good.subarray(0, 20), /^snapshot is 20 bytes, shorter than the 36-byte minimum$/],
      ['bad magic', patched((v) => v.setUint8(0, 0x58)), /^snapshot magic is "XNDRLSNP", expected "TNDRLSNP"$/],
      ['future version', patched((v) => v.setUint16(8, 2, true)), /^snapshot format version is 2, this reader knows version 1$/],
      ['bad dimension', patched((v) => v.setUint8(10, 1)), /^snapshot dimension is 1, expected 2 or 3$/],
      ['unknown flags', patched((v) => v.setUint8(11, 0x81)), /^snapshot flags are 0x81, only bit 0 is defined$/],
      ['bad header length', patched((v) => v.setUint32(12, 40, true)), /^snapshot header length is 40, expected 32$/],
      ['truncated', good.subarray(0, good.length - 8), /^snapshot is 828 bytes, expected 836 for 50 particles in 2 dimensions$/],
      ['count too large for file', patched((v) => v.setBigUint64(16, 51n, true)), /^snapshot is 836 bytes, expected 852 for 51 particles/],
      ['huge count', patched((v) => v.setBigUint64(16, 1n << 60n, true)), /^snapshot particle count \d+ exceeds 2\^53 - 1$/],
      ['bad diameter', patched((v) => v.setFloat64(24, -1, true)), /^snapshot diameter is -1, expected a finite number > 0$/],
      ['flipped coordinate bit', patched((v) => v.setUint8(100, v.getUint8(100) ^ 4), false), /^snapshot checksum mismatch: stored CRC-32 0x[0-9a-f]{8}, computed 0x[0-9a-f]{8}$/],
      ['flipped checksum bit', patched((v) => v.setUint8(good.length - 1, v.getUint8(good.length - 1) ^ 1), false), /^snapshot checksum mismatch/],
    ];
    it.each(cases)('%s gives a one-line error', (_name, bytes, pattern) => {
      let caught: unknown;
      try {
        decodeSnapshot(bytes);
      } catch (e) {
        caught = e;
      }
      expect(caught).toBeInstanceOf(SnapshotError);
      const msg = (caught as Error).message;
      expect(msg).not.toContain('\n');
      expect(msg).toMatch(pattern);
    });

    it('accepts the unpatched bytes, also from an unaligned view', () => {
      const shifted = new Uint8Array(good.length + 3);
      shifted.set(good, 3);
      const back = decodeSnapshot(shifted.subarray(3));
      expect(back.count).toBe(50);
      expect(back.x[17]).toBe(x[17]);
    });
  });
});

describe('snapshots of dimension-strided positions', () => {
  it('pointSetOf keeps every axis, in 2 and 3 dimensions, and the snapshot records the dimension', async () => {
    const { pointSetOf, encodeSnapshot, decodeSnapshot } = await import('../coordinator/snapshot/cluster-snapshot.js');
    const coords = Float64Array.from([0, 0, 0, 1, 2, 3, -4, 5, 6]);
    const p3 = pointSetOf({ dimension: 3, count: 3, coords }, 1);
    expect([...p3.z!]).toEqual([0, 3, 6]);
    const back = decodeSnapshot(encodeSnapshot(p3));
    expect(back.dimension).toBe(3);
    expect([...back.x]).toEqual([0, 1, -4]);
    expect([...back.y]).toEqual([0, 2, 5]);
    expect([...back.z!]).toEqual([0, 3, 6]);
    const p2 = pointSetOf({ dimension: 2, count: 2, coords: coords.subarray(0, 6) }, 2);
    expect(decodeSnapshot(encodeSnapshot(p2))).toMatchObject({ dimension: 2, count: 2, diameter: 2 });
    expect([...p2.y]).toEqual([0, 1]);
    expect(() => pointSetOf({ dimension: 4, count: 1, coords }, 1)).toThrow('snapshot dimension must be 2 or 3, got 4');
  });
});

describe('snapshot files streamed to and from disk', () => {
  it('writeSnapshotFile writes the bytes of encodeSnapshot from strided positions; readSnapshotFile reads them back; a damaged file is refused', async () => {
    const { mkdtempSync, readFileSync, rmSync, writeFileSync } = await import('node:fs');
    const { tmpdir } = await import('node:os');
    const { join } = await import('node:path');
    const { writeSnapshotFile, readSnapshotFile, pointSetOf } = await import('../coordinator/snapshot/index.js');
    const dir = mkdtempSync(join(tmpdir(), 'tendril-snapshot-stream-'));
    try {
      // more than one 1 MiB chunk per axis (2^17 values), in 2D and 3D
      for (const d of [2, 3] as const) {
        const n = 300_001;
        const p = points(n, d);
        const coords = new Float64Array(n * d);
        for (let i = 0; i < n; i++) {
          coords[i * d] = p.x[i];
          coords[i * d + 1] = p.y[i];
          if (d === 3) coords[i * d + 2] = p.z[i];
        }
        const pos = { dimension: d, count: n, coords };
        const path = join(dir, `c${d}.snapshot`);
        writeSnapshotFile(path, pos, 1);
        const expected = encodeSnapshot(pointSetOf(pos, 1));
        expect(Buffer.compare(readFileSync(path), expected)).toBe(0);
        const back = readSnapshotFile(path);
        const whole = decodeSnapshot(expected);
        expect(back.count).toBe(n);
        expect(back.dimension).toBe(d);
        expect(Buffer.compare(Buffer.from(back.x.buffer), Buffer.from(whole.x.buffer))).toBe(0);
        expect(Buffer.compare(Buffer.from(back.y.buffer), Buffer.from(whole.y.buffer))).toBe(0);
        if (d === 3) expect(Buffer.compare(Buffer.from(back.z!.buffer), Buffer.from(whole.z!.buffer))).toBe(0);
        const damaged = Buffer.from(expected);
        damaged[40 + 8 * 200_000] ^= 4;
        writeFileSync(path, damaged);
        expect(() => readSnapshotFile(path)).toThrow(SnapshotError);
        expect(() => readSnapshotFile(path)).toThrow(/^snapshot checksum mismatch: stored CRC-32 0x[0-9a-f]{8}, computed 0x[0-9a-f]{8}$/);
        writeFileSync(path, damaged.subarray(0, damaged.length - 8));
        expect(() => readSnapshotFile(path)).toThrow(/^snapshot is \d+ bytes, expected \d+ for 300001 particles in [23] dimensions$/);
      }
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('CRC-32 continued over pieces equals the CRC of the whole (native and portable)', () => {
    const data = new Uint8Array(5000);
    for (let i = 0; i < data.length; i++) data[i] = (i * 7 + (i >> 3)) & 0xff;
    const whole = crc32(data);
    expect(crc32(data, 1234, data.length, crc32(data, 0, 1234))).toBe(whole);
    expect(crc32Portable(data, 1234, data.length, crc32Portable(data, 0, 1234))).toBe(whole);
  });
});
