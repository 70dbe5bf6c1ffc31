/** Pearson's chi-square of observed counts against probabilities times the total. */
export function chiSquare(counts: ArrayLike<number>, probs: ArrayLike<number>, total: number): number {
  let s = 0;
  for (let i = 0; i < probs.length; i++) s += (counts[i] - total * probs[i]) ** 2 / (total * probs[i]);
  return s;
}

/** Upper 0.001 point of chi-square(k) by the Wilson–Hilferty approximation (Wilson & Hilferty 1931, PNAS 17, 684; from memory). */
export function chi2Critical999(k: number): number {
  const z = 3.0902;
  return k * (1 - 2 / (9 * k) + z * Math.sqrt(2 / (9 * k))) ** 3;
}
