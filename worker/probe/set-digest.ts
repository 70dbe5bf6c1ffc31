/**
 * Digest of a probe set in any dimension (pure): "n-" + tag + FNV-1a (32 bit)
 * over the float64 words (low word, then high word) of every item's values in
 * order (item 0's columns, then item 1's, …), then of the trailing values.
 * A column is an array with one value per item or one number for all items.
 * A probe task carries the digest, so a job never runs on a set other than
 * the one it was planned for; cheap enough to compute without building the
 * geometry. FNV-1a: Fowler, Noll and Vo's hash (common practice, no source).
 *
 * Disk sets (worker/probe/probe-2d.ts diskSetDigest) digest the columns
 * x, y, r with no tag; ball sets (worker/probe/probe-3d.ts ballSetDigest)
 * digest x, y, z, then the common radius, with tag "b", which keeps a ball
 * set's digest apart from a disk set's.
 */
export function setDigest(count: number, columns: ReadonlyArray<ArrayLike<number> | number>, trailing: readonly number[], tag: string): string {
  let h = 0x811c9dc5;
  const word = new Float64Array(1);
  const words = new Uint32Array(word.buffer);
  const mixIn = (v: number): void => {
    word[0] = v;
    h = Math.imul(h ^ words[0], 0x01000193);
    h = Math.imul(h ^ words[1], 0x01000193);
  };
  for (let i = 0; i < count; i++) {
    for (let c = 0; c < columns.length; c++) {
      const column = columns[c];
      mixIn(typeof column === 'number' ? column : column[i]);
    }
  }
  for (const v of trailing) mixIn(v);
  return `${count}-${tag}${(h >>> 0).toString(16).padStart(8, '0')}`;
}
