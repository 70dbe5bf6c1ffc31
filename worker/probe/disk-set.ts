/** A planar set of disks to probe: centres and contact radii (one radius for all, or one per disk). */
export interface DiskSet {
  count: number;
  x: ArrayLike<number>;
  y: ArrayLike<number>;
  /** Contact radius of every disk (a number) or per disk. */
  r: number | ArrayLike<number>;
  /**
   * Set only for the clusters of lattice models: the centres are sites of
   * this lattice (spacing 1) and the set is probed by lattice walkers
   * (worker/probe/probe-lattice.ts); r is then not used.
   */
  lattice?: 'square' | 'triangular';
}
