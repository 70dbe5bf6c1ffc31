/**
 * The unbiased estimate of ω^b from recurrence gaps used by the history
 * method of dbm-offlattice-2d (kernel.ts header): with S the sum of g
 * independent geometric gaps of mean 1/ω (negative binomial,
 * P(S = s) = C(s − 1, g − 1) ω^g (1 − ω)^(s − g), s >= g) and g > b > 0,
 *
 *   h_g(s) = Π_{j=g}^{s−1} (1 − b/j) = Γ(s − b) Γ(g) / (Γ(g − b) Γ(s))
 *
 * has E[h_g(S)] = ω^b (derived in the kernel header from the binomial series
 * of (1 − x)^(b − g)), and 0 < h_g(s) <= 1 with h_g(g) = 1.
 *
 * Computed as exp(L(s) − L(g)) with L(n) = Σ_{j=j0}^{n−1} ln(1 − b/j),
 * j0 = floor(b) + 1: a table up to TABLE, and beyond it
 * L(n) = L(TABLE) + R(n) − R(TABLE), R(x) = ln Γ(x − b) − ln Γ(x) from
 * Stirling's series (three correction terms; error below 1e-15 for x >= TABLE).
 */
const TABLE = 1 << 14;

function stirlingCorrection(z: number): number {
  const z2 = z * z;
  return 1 / (12 * z) - 1 / (360 * z * z2) + 1 / (1260 * z * z2 * z2);
}

export class RecurrencePower {
  /** The smallest whole number of gaps with an estimate: floor(b) + 1. */
  readonly minGaps: number;
  private readonly logs = new Float64Array(TABLE + 1);
  private readonly tail: number;

  constructor(readonly b: number) {
    if (!(b > 0)) throw new RangeError(`RecurrencePower needs b > 0, got ${b}`);
    this.minGaps = Math.floor(b) + 1;
    let acc = 0;
    for (let n = this.minGaps; n <= TABLE; n++) {
      this.logs[n] = acc;
      acc += Math.log1p(-b / n);
    }
    this.tail = this.logs[TABLE] - this.ratio(TABLE);
  }

  /** ln Γ(x − b) − ln Γ(x) for large x. */
  private ratio(x: number): number {
    const b = this.b;
    return -b * Math.log(x) + (x - b - 0.5) * Math.log1p(-b / x) + b + stirlingCorrection(x - b) - stirlingCorrection(x);
  }

  private logProduct(n: number): number {
    return n <= TABLE ? this.logs[n] : this.tail + this.ratio(n);
  }

  /** h_g(s) for minGaps <= g <= s. */
  weight(g: number, s: number): number {
    return Math.exp(this.logProduct(s) - this.logs[g]);
  }
}
