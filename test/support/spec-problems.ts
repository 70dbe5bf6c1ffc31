import { SpecError, validateSpec } from '../../coordinator/spec/index.js';

/**
 * The problems a document checker finds (a SpecError's one-line problems), or
 * [] when it accepts the document; any other error is thrown on. The checker
 * is validateSpec unless given (e.g. validateLaunch, or validateSpec with limits).
 */
export function problemsOf(doc: unknown, check: (doc: unknown) => unknown = validateSpec): string[] {
  try {
    check(doc);
  } catch (err) {
    if (err instanceof SpecError) return err.problems;
    throw err;
  }
  return [];
}
