/**
 * Is the union of closed disks D(p_i, r_i) connected? Two disks meet when
 * |p_i − p_j| ≤ r_i + r_j (touching counts; a relative slack of 1e-9 absorbs
 * the rounding of coordinates written as decimals, e.g. a row of touching
 * disks read from a CSV). Union–find over the pairs found with a hash grid
 * of cells of side 2.002·max r (every meeting pair lies in neighbouring cells):
 * O(n) for sets of bounded density. Exact up to the stated slack.
 */
export function diskUnionConnected(n: number, x: ArrayLike<number>, y: ArrayLike<number>, r: number | ArrayLike<number>): boolean {
  if (n <= 1) return true;
  const rad = (i: number): number => (typeof r === 'number' ? r : r[i]);
  let rMax = 0;
  for (let i = 0; i < n; i++) if (rad(i) > rMax) rMax = rad(i);
  const side = 2 * rMax * 1.001; // wider than any meeting distance (with slack), so meeting disks sit in neighbouring cells
  const parent = new Int32Array(n);
  for (let i = 0; i < n; i++) parent[i] = i;
  const find = (i: number): number => {
    while (parent[i] !== i) { parent[i] = parent[parent[i]]; i = parent[i]; }
    return i;
  };
  let components = n;
  const cells = new Map<string, number[]>();
  const key = (cx: number, cy: number): string => `${cx},${cy}`;
  for (let i = 0; i < n; i++) {
    const cx = Math.floor(x[i] / side);
    const cy = Math.floor(y[i] / side);
    for (let dx = -1; dx <= 1; dx++)
      for (let dy = -1; dy <= 1; dy++) {
        const list = cells.get(key(cx + dx, cy + dy));
        if (list === undefined) continue;
        for (const j of list) {
          const reach = (rad(i) + rad(j)) * (1 + 1e-9);
          if ((x[i] - x[j]) ** 2 + (y[i] - y[j]) ** 2 > reach * reach) continue;
          const a = find(i);
          const b = find(j);
          if (a !== b) { parent[a] = b; components--; }
        }
      }
    const k = key(cx, cy);
    const own = cells.get(k);
    if (own) own.push(i); else cells.set(k, [i]);
  }
  return components === 1;
}
