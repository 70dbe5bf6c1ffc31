/**
 * The fit window of the box statistics as users give it: box sides relative
 * to R (the radius of the smallest circle about the bounding-box centre
 * enclosing the disks), [lo, hi] with 0 < lo < hi ≤ 1 and hi/lo ≥ 2 (the
 * fits need a range of scales). The same rule serves the CLI (`--window
 * lo:hi`), the API (`window: [lo, hi]`) and the spec (`probe.window`).
 */
export const WINDOW_RULE = 'two numbers lo, hi with 0 < lo < hi <= 1 and hi >= 2 lo (box sides relative to the set radius R)';

/** null when [lo, hi] is allowed, else the reason (to be put after the field name and value). */
export function windowProblem(v: unknown): string | null {
  if (!Array.isArray(v) || v.length !== 2 || v.some((e) => typeof e !== 'number' || !Number.isFinite(e))) return `is not allowed; allowed: ${WINDOW_RULE}`;
  const [lo, hi] = v as [number, number];
  if (!(lo > 0 && lo < hi && hi <= 1 && hi >= 2 * lo)) return `is out of range; allowed: ${WINDOW_RULE}`;
  return null;
}
