/**
 * The one description of an allowed numeric range, and its one-line
 * messages. Model parameters, spec fields, CLI options and request fields
 * all describe their limits with a ValueRange, so the same limit reads the
 * same everywhere: "params.min_step: 1e-15 is out of range; allowed: a
 * number above 0 and at most 1 (particle diameters)".
 */

export interface ValueRange {
  min: number;
  max: number;
  /** The minimum itself is not allowed (min < v). */
  minOpen?: boolean;
  /** The maximum itself is not allowed (v < max). */
  maxOpen?: boolean;
  /** Only integers are allowed. */
  integer?: boolean;
}

/** True when v is a finite number inside the range. */
export function inRange(v: unknown, r: ValueRange): v is number {
  if (typeof v !== 'number' || !Number.isFinite(v)) return false;
  if (r.integer && !Number.isSafeInteger(v)) return false;
  if (r.minOpen ? !(v > r.min) : !(v >= r.min)) return false;
  if (r.maxOpen ? !(v < r.max) : !(v <= r.max)) return false;
  return true;
}

/** "a number above 0 and at most 1", "an integer from 2 to 100000000". */
export function describeRange(r: ValueRange, unit = ''): string {
  const kind = r.integer ? 'an integer' : 'a number';
  let text: string;
  if (!r.minOpen && !r.maxOpen) text = `${kind} from ${r.min} to ${r.max}`;
  else text = `${kind} ${r.minOpen ? 'above' : 'at least'} ${r.min} and ${r.maxOpen ? 'below' : 'at most'} ${r.max}`;
  return unit ? `${text} (${unit})` : text;
}

/** A value as a message quotes it: numbers and strings as JSON, at most 60 characters, never multi-line. */
export function quoteValue(v: unknown): string {
  if (v === undefined) return 'nothing';
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : String(v);
  if (typeof v === 'bigint') return v.toString();
  let s: string;
  try {
    s = JSON.stringify(v) ?? String(v);
  } catch {
    s = String(v);
  }
  return s.length > 60 ? `${s.slice(0, 57)}...` : s;
}

/** The one-line problem of a value outside its range, or null when it is inside. */
export function rangeProblem(field: string, v: unknown, r: ValueRange, unit = ''): string | null {
  if (inRange(v, r)) return null;
  const what = typeof v === 'number' ? (Number.isFinite(v) ? 'is out of range' : 'is not a finite number') : 'is not a number';
  return `${field}: ${quoteValue(v)} ${what}; allowed: ${describeRange(r, unit)}`;
}

/** Throw a RangeError with the one-line problem of a value outside its range. */
export function checkRange(field: string, v: unknown, r: ValueRange, unit = ''): number {
  const p = rangeProblem(field, v, r, unit);
  if (p !== null) throw new RangeError(p);
  return v as number;
}

/** The JSON-schema keywords of a range (for schemas built from descriptors). */
export function rangeSchema(r: ValueRange): Record<string, unknown> {
  return {
    type: r.integer ? 'integer' : 'number',
    ...(r.minOpen ? { exclusiveMinimum: r.min } : { minimum: r.min }),
    ...(r.maxOpen ? { exclusiveMaximum: r.max } : { maximum: r.max }),
  };
}
