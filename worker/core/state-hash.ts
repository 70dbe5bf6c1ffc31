/**
 * 64-bit digest of a run's final state, printed as 16 hex digits. Two
 * independent 32-bit lanes of the MurmurHash3 (x86, 32-bit) block mix
 * (Appleby 2011, public domain algorithm) over 32-bit words, with different
 * seeds, each finished by the fmix32 avalanche. Float64 values are hashed by
 * their IEEE-754 bits (little-endian word order, as on every platform Node
 * supports), so "same state" means "same bits".
 */

export class StateHasher {
  private h1 = 0x3c6ef372;
  private h2 = 0x1b873593 ^ 0x5bd1e995;
  private words = 0;
  private readonly scratch = new Float64Array(1);
  private readonly scratchWords = new Uint32Array(this.scratch.buffer);

  /** Mix one 32-bit word. */
  word(w: number): this {
    this.h1 = mixLane(this.h1, w);
    this.h2 = mixLane(this.h2, w ^ 0x9e3779b9);
    this.words++;
    return this;
  }

  /** Mix the IEEE bits of one float64. */
  float64(v: number): this {
    this.scratch[0] = v;
    return this.word(this.scratchWords[0]).word(this.scratchWords[1]);
  }

  /** Mix the IEEE bits of the first `count` entries of a Float64Array. */
  float64Array(a: Float64Array, count: number): this {
    const words = new Uint32Array(a.buffer, a.byteOffset, count * 2);
    let h1 = this.h1;
    let h2 = this.h2;
    for (let i = 0; i < words.length; i++) {
      const w = words[i];
      h1 = mixLane(h1, w);
      h2 = mixLane(h2, w ^ 0x9e3779b9);
    }
    this.h1 = h1;
    this.h2 = h2;
    this.words += words.length;
    return this;
  }

  /**
   * Mix the IEEE bits of `count` float64 values a[offset], a[offset + stride],
   * … — the same words, in the same order, as float64Array over a packed
   * copy (so one axis of dimension-strided positions hashes as its own array).
   */
  float64Strided(a: Float64Array, count: number, stride: number, offset: number): this {
    const scratch = this.scratch;
    const sw = this.scratchWords;
    let h1 = this.h1;
    let h2 = this.h2;
    for (let i = 0, j = offset; i < count; i++, j += stride) {
      scratch[0] = a[j];
      const w0 = sw[0];
      const w1 = sw[1];
      h1 = mixLane(h1, w0);
      h2 = mixLane(h2, w0 ^ 0x9e3779b9);
      h1 = mixLane(h1, w1);
      h2 = mixLane(h2, w1 ^ 0x9e3779b9);
    }
    this.h1 = h1;
    this.h2 = h2;
    this.words += 2 * count;
    return this;
  }

  /** Mix a non-negative integer below 2^53 (as two words). */
  integer(n: number): this {
    return this.word(n % 4294967296).word(Math.floor(n / 4294967296));
  }

  digest(): string {
    const a = fmix32(this.h1 ^ this.words) >>> 0;
    const b = fmix32(this.h2 ^ Math.imul(this.words, 0x85ebca6b)) >>> 0;
    return a.toString(16).padStart(8, '0') + b.toString(16).padStart(8, '0');
  }
}

function mixLane(h: number, w: number): number {
  let k = Math.imul(w, 0xcc9e2d51);
  k = (k << 15) | (k >>> 17);
  k = Math.imul(k, 0x1b873593);
  h ^= k;
  h = (h << 13) | (h >>> 19);
  return (Math.imul(h, 5) + 0xe6546b64) | 0;
}

function fmix32(h: number): number {
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return h;
}
