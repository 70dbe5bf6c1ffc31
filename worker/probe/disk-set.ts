/** A planar set of disks to probe: centres and contact radii (one radius for all, or one per disk). */
export interface DiskSet {
  count: number;
  x: ArrayLike<number>;
  y: ArrayLike<number>;
  /** Contact radius of every disk (a number) or per disk. */
  r: number | ArrayLike<number>;
}
