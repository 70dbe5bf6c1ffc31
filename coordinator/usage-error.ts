import { TendrilError } from '../proto/errors.js';

/** An error caused by the user's input; printed as one line, exit code 2. */
export class UsageError extends TendrilError {
  override name = 'UsageError';
  readonly kind = 'usage';
}
