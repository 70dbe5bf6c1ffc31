/**
 * tendril's random generator: xoshiro128** (Blackman & Vigna 2018, "Scrambled
 * linear pseudorandom number generators") on four 32-bit words, which V8 runs
 * with plain int32 arithmetic. The state is four uint32 words and serialises
 * exactly (`state()` / `Random.fromState`).
 *
 * Stream derivation (documented contract, part of the engine version):
 *   key  = ensembleSeed XOR mix64(runIndex + 1) XOR mix64(purpose * 2^32 + 0x7E0D)
 *   then two successive SplitMix64 outputs from `key` give the four state words
 *   (high word first). mix64 is the SplitMix64 finaliser (Steele, Lea & Flood
 *   2014). `purpose` separates independent streams of the same run:
 *   0 = growth, 1 = probe walkers, 2 = bootstrap resampling.
 * A state of four zero words (the only invalid one) is replaced by a fixed word.
 */

const MASK64 = (1n << 64n) - 1n;
const GOLDEN64 = 0x9e3779b97f4a7c15n;

/** SplitMix64 finaliser on unsigned 64-bit BigInts. */
export function mix64(z: bigint): bigint {
  z &= MASK64;
  z = ((z ^ (z >> 30n)) * 0xbf58476d1ce4e5b9n) & MASK64;
  z = ((z ^ (z >> 27n)) * 0x94d049bb133111ebn) & MASK64;
  return (z ^ (z >> 31n)) & MASK64;
}

export const STREAM_GROWTH = 0;
export const STREAM_PROBE = 1;
export const STREAM_BOOTSTRAP = 2;

/** Parse an unsigned 64-bit seed given as a decimal (or 0x-hex) string or a safe integer. */
export function parseSeed(seed: string | number | bigint): bigint {
  let v: bigint;
  if (typeof seed === 'bigint') v = seed;
  else if (typeof seed === 'number') {
    if (!Number.isSafeInteger(seed) || seed < 0) throw new RangeError(`seed ${seed} is not an integer in [0, 2^53)`);
    v = BigInt(seed);
  } else {
    if (!/^(0x[0-9a-fA-F]{1,16}|[0-9]{1,20})$/.test(seed)) throw new RangeError(`seed "${seed}" is not an unsigned 64-bit integer`);
    v = BigInt(seed);
  }
  if (v < 0n || v > MASK64) throw new RangeError(`seed ${v} is outside [0, 2^64)`);
  return v;
}

export class Random {
  private s0: number;
  private s1: number;
  private s2: number;
  private s3: number;

  private constructor(s0: number, s1: number, s2: number, s3: number) {
    if ((s0 | s1 | s2 | s3) === 0) s0 = 0x2545f491;
    this.s0 = s0 | 0;
    this.s1 = s1 | 0;
    this.s2 = s2 | 0;
    this.s3 = s3 | 0;
  }

  /** The stream for (ensemble seed, run index, purpose); see the file header. */
  static forRun(ensembleSeed: string | number | bigint, runIndex: number, purpose = STREAM_GROWTH): Random {
    if (!Number.isSafeInteger(runIndex) || runIndex < 0) throw new RangeError(`run index ${runIndex} is not a non-negative integer`);
    let key = parseSeed(ensembleSeed) ^ mix64(BigInt(runIndex) + 1n) ^ mix64((BigInt(purpose) << 32n) + 0x7e0dn);
    key = (key + GOLDEN64) & MASK64;
    const a = mix64(key);
    key = (key + GOLDEN64) & MASK64;
    const b = mix64(key);
    return new Random(Number(a >> 32n), Number(a & 0xffffffffn), Number(b >> 32n), Number(b & 0xffffffffn));
  }

  static fromState(state: ArrayLike<number>): Random {
    if (state.length !== 4) throw new RangeError(`generator state has ${state.length} words, expected 4`);
    return new Random(state[0], state[1], state[2], state[3]);
  }

  /** Copy of the state as four uint32 words. */
  state(): Uint32Array {
    return Uint32Array.of(this.s0 >>> 0, this.s1 >>> 0, this.s2 >>> 0, this.s3 >>> 0);
  }

  /** Copy the state into `out` (four words) without allocating; `loadState` puts it back. */
  saveState(out: Uint32Array): void {
    out[0] = this.s0 >>> 0;
    out[1] = this.s1 >>> 0;
    out[2] = this.s2 >>> 0;
    out[3] = this.s3 >>> 0;
  }

  /** Restore a state saved by `saveState`. */
  loadState(saved: Uint32Array): void {
    this.s0 = saved[0] | 0;
    this.s1 = saved[1] | 0;
    this.s2 = saved[2] | 0;
    this.s3 = saved[3] | 0;
  }

  /** Next 32 random bits as a signed int32. */
  nextInt32(): number {
    const s1 = this.s1;
    const result = Math.imul(rotl(Math.imul(s1, 5), 7), 9);
    const t = s1 << 9;
    this.s2 ^= this.s0;
    this.s3 ^= s1;
    this.s1 = s1 ^ this.s2;
    this.s0 ^= this.s3;
    this.s2 ^= t;
    this.s3 = rotl(this.s3, 11);
    return result;
  }

  /** Next 32 random bits as an unsigned integer in [0, 2^32). */
  nextUint32(): number {
    return this.nextInt32() >>> 0;
  }

  /** Uniform double in [0, 1) with 53 random bits. */
  nextDouble(): number {
    const hi = this.nextInt32() >>> 5; // 27 bits
    const lo = this.nextInt32() >>> 6; // 26 bits
    return (hi * 67108864 + lo) * 1.1102230246251565e-16; // 2^-53
  }

  /** Uniform double in (0, 1) with 32 random bits (never 0 or 1); cheaper than nextDouble. */
  nextOpen32(): number {
    return ((this.nextInt32() >>> 0) + 0.5) * 2.3283064365386963e-10; // 2^-32
  }

  /** Uniform double in [−1, 1) on the grid of multiples of 2^-31 (one 32-bit draw). */
  nextSigned(): number {
    return this.nextInt32() * 4.656612873077393e-10; // 2^-31
  }

  /** Uniform integer in [0, n) for 1 <= n <= 2^32, without modulo bias (Lemire-style rejection). */
  nextBelow(n: number): number {
    if (!(n >= 1 && n <= 4294967296)) throw new RangeError(`nextBelow(${n}) needs 1 <= n <= 2^32`);
    // a mod n as a − floor(a/n)·n, which is exact here and avoids a floating
    // modulo (a call to fmod): for integers 0 <= a < 2^33 and 1 <= n <= 2^32,
    // write a = qn + s (0 <= s < n); a/n lies in [q, q + 1 − 1/n] and its
    // rounding error is at most (q + 1)·2^−53 < 1/n (as (q + 1)n < 2^53), so
    // fl(a/n) lies in [q, q + 1) and its floor is q; q·n and a − q·n are
    // integers below 2^53, hence exact. Same values as a % n.
    const limit = Math.floor(4294967296 / n) * n; // 2^32 − (2^32 mod n)
    for (;;) {
      const r = this.nextInt32() >>> 0;
      if (r < limit) return r - Math.floor(r / n) * n;
    }
  }
}

function rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}
