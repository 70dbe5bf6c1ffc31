/**
 * Numeric command-line options, checked with the one range checker
 * (worker/core/value-range.ts), so an option reads like a spec field:
 *   --particles: 1 is out of range; allowed: an integer from 2 to 100000000
 */
import { rangeProblem, type ValueRange } from '../../worker/core/value-range.js';
import { UsageError } from '../usage-error.js';

const NUMBER_RE = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
const MAX_SEED = (1n << 64n) - 1n;

/** The number an option's text spells (plain or exponent notation), or the text itself when it is no number. */
export function optionNumber(raw: unknown): number | string {
  const s = typeof raw === 'string' ? raw.trim() : String(raw);
  return NUMBER_RE.test(s) ? Number(s) : s;
}

/** A numeric option inside `range`; throws a UsageError naming the flag, the value and the range. */
export function parseRangeOption(flag: string, raw: unknown, range: ValueRange, unit = ''): number {
  const v = optionNumber(raw);
  const problem = rangeProblem(flag, v, range, unit);
  if (problem !== null) throw new UsageError(problem);
  return v as number;
}

/** A commander argument parser for an integer option from 1 to max. */
export function positiveInt(flag: string, max = 1_000_000): (v: string) => number {
  return (v: string) => parseRangeOption(flag, v, { min: 1, max, integer: true });
}

/** An unsigned 64-bit integer in decimal; returned normalised (no leading zeros). */
export function parseSeedOption(flag: string, raw: unknown): string {
  const s = typeof raw === 'string' ? raw.trim() : String(raw);
  if (!/^\d{1,20}$/.test(s) || BigInt(s) > MAX_SEED) {
    throw new UsageError(`${flag}: ${JSON.stringify(String(raw))} is not allowed; allowed: an unsigned 64-bit integer from 0 to ${MAX_SEED} in decimal`);
  }
  return BigInt(s).toString();
}
