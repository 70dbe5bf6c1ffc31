/** An error caused by the user's input; printed as one line, exit code 2. */
export class UsageError extends Error {
  override name = 'UsageError';
}
