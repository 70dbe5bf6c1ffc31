/**
 * How the tile pools of the sparse grids (worker/index/tiled-grids.ts,
 * worker/index/window-bit-grid.ts) and the tile directory's blocks
 * (worker/index/tile-directory.ts) are sized: reserved up front where the
 * system allows, grown by a quarter at a time once large.
 */

/**
 * Length of a pool of `unit`-sized tiles grown from `length` to hold tile
 * `tile`: doubled while small (fewer copies), a quarter more once past
 * 2^20 entries (the slack stays under 25 % of what is used).
 */
export function poolGrowth(length: number, tile: number, unit: number): number {
  const factor = length < 1 << 20 ? 2 : 1.25;
  const tiles = Math.max(tile + 1, Math.ceil((length / unit) * factor));
  return tiles * unit;
}

/**
 * A zero-filled typed array of `reserve` entries, or of `need` entries when
 * the system refuses the reservation (e.g. with strict overcommit, where
 * address space counts as memory) or it exceeds a typed array's 2^32
 * entries; a grid then grows as it would without a reservation.
 */
export function reservedArray<T>(make: (length: number) => T, need: number, reserve: number): T {
  if (reserve <= need) return make(need);
  try {
    return make(reserve);
  } catch (e) {
    if (e instanceof RangeError) return make(need);
    throw e;
  }
}
