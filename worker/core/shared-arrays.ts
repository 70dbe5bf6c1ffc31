/**
 * Typed arrays in shared memory, for read-only structures built once and
 * read by several threads (the probe geometry, worker/probe/probe-set.ts):
 * a SharedArrayBuffer is not copied when posted to another thread, so every
 * thread reads the same bytes.
 */

/** A copy of a[0 .. length) in a new SharedArrayBuffer. */
export function sharedInt32(a: Int32Array, length = a.length): Int32Array {
  const s = new Int32Array(new SharedArrayBuffer(4 * length));
  s.set(a.subarray(0, length));
  return s;
}

/** A copy of a[0 .. length) in a new SharedArrayBuffer. */
export function sharedUint8(a: Uint8Array, length = a.length): Uint8Array {
  const s = new Uint8Array(new SharedArrayBuffer(length));
  s.set(a.subarray(0, length));
  return s;
}

/** A copy of a[0 .. length) in a new SharedArrayBuffer. */
export function sharedFloat64(a: Float64Array, length = a.length): Float64Array {
  const s = new Float64Array(new SharedArrayBuffer(8 * length));
  s.set(a.subarray(0, length));
  return s;
}

/**
 * Every typed array reachable from `value` (through plain objects and
 * arrays) whose memory is not a SharedArrayBuffer, by path: empty when
 * posting `value` to a thread copies no array's contents.
 */
export function unsharedArrays(value: unknown, path = '$'): string[] {
  if (ArrayBuffer.isView(value)) return value.buffer instanceof SharedArrayBuffer ? [] : [path];
  if (value instanceof ArrayBuffer) return [path];
  if (Array.isArray(value)) return value.flatMap((v, i) => unsharedArrays(v, `${path}[${i}]`));
  if (value !== null && typeof value === 'object') return Object.entries(value).flatMap(([k, v]) => unsharedArrays(v, `${path}.${k}`));
  return [];
}
