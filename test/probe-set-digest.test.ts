/**
 * Probe set digests are pinned: a probe task carries its set's digest and a
 * farm stores it with each probe request, so a change of the digest function
 * would make stored requests and queued tasks look foreign. The values below
 * were computed by the separate 2D and 3D digest functions before they became
 * one dimension-general digest (worker/probe/set-digest.ts).
 */
import { describe, expect, it } from 'vitest';
import { diskSetDigest } from '../worker/probe/probe-2d.js';
import { ballSetDigest } from '../worker/probe/probe-3d.js';
import { latticeSetDigest } from '../worker/probe/probe-lattice.js';
import { probeSetDigest } from '../worker/probe/probe-set.js';

const x = Float64Array.from([0, 1.5, -2.25, 3e-7, 1e300]);
const y = Float64Array.from([0, -0.5, 4, 7.125, -0]);
const z = Float64Array.from([1, 2, -3, 0.1, 0.2]);

describe('probe set digests (pinned)', () => {
  it('disk sets: one radius for all, a radius per disk, the empty set', () => {
    expect(diskSetDigest({ count: 5, x, y, r: 0.75 })).toBe('5-4ddb3e54');
    expect(diskSetDigest({ count: 5, x, y, r: [1, 2, 3, 4, 5] })).toBe('5-a70f3e54');
    expect(diskSetDigest({ count: 0, x: [], y: [], r: 1 })).toBe('0-811c9dc5');
    expect(probeSetDigest({ count: 5, x, y, r: 0.75 })).toBe('5-4ddb3e54');
  });

  it('ball sets: the "b" tag and the radius after the centres', () => {
    expect(ballSetDigest({ count: 5, x, y, z, radius: 0.75 })).toBe('5-b89c681e0');
    expect(ballSetDigest({ count: 0, x: new Float64Array(0), y: new Float64Array(0), z: new Float64Array(0), radius: 2 })).toBe('0-bd17697cd');
    expect(probeSetDigest({ count: 5, x, y, z, radius: 0.75 })).toBe('5-b89c681e0');
  });

  it('lattice sets: the lattice name before the disk digest of the sites', () => {
    const set = { count: 3, x: [0, 1, 2], y: [0, 0, 1], r: 1, lattice: 'square' as const };
    expect(latticeSetDigest(set)).toBe('square:3-3ba1a50d');
    expect(probeSetDigest(set)).toBe('square:3-3ba1a50d');
  });

  it('only the first count entries enter the digest', () => {
    expect(diskSetDigest({ count: 2, x, y, r: 0.75 })).toBe(diskSetDigest({ count: 2, x: x.subarray(0, 2), y: y.subarray(0, 2), r: 0.75 }));
    expect(ballSetDigest({ count: 2, x, y, z, radius: 0.75 })).toBe(ballSetDigest({ count: 2, x: x.subarray(0, 2), y: y.subarray(0, 2), z: z.subarray(0, 2), radius: 0.75 }));
  });
});
