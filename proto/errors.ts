/**
 * The error kinds of tendril, one typed class hierarchy for every layer.
 * proto/ is the lowest layer (everything may import it, it imports nothing
 * of ours), so the base class lives here beside ContractError.
 *
 * Code tells errors apart with `instanceof` or by `kind`, never by `.name`
 * strings; a message meant for people is one line (firstLine/messageOf
 * instead of cutting messages by hand). Across worker threads only the kind
 * and the one-line message travel (see worker/runtime/task-thread.ts).
 */

export type ErrorKind =
  /** bad command-line input (exit code 2) */
  | 'usage'
  /** a bad ensemble spec */
  | 'spec'
  /** a bad HTTP request (carries its status) */
  | 'request'
  /** an unreadable wire message or job payload */
  | 'contract'
  /** a task this engine refuses (other engine version, invalid parameters) */
  | 'task-rejected'
  /** a probe job that can never succeed */
  | 'probe-refused'
  /** a probe job that failed (may be retried) */
  | 'probe-failed'
  /** a malformed cluster snapshot */
  | 'snapshot'
  /** bad input to the statistics */
  | 'stats-input'
  /** work stopped on request */
  | 'aborted';

/** The base of every error tendril throws on purpose; its message is one line. */
export abstract class TendrilError extends Error {
  abstract readonly kind: ErrorKind;
  constructor(message: string) {
    super(firstLine(message));
  }
}

/** The first line of a text (messages for people are one line). */
export function firstLine(text: string): string {
  const i = text.indexOf('\n');
  return i < 0 ? text : text.slice(0, i);
}

/** The one-line message of anything thrown. */
export function messageOf(err: unknown): string {
  return firstLine(err instanceof Error ? err.message : String(err));
}

/** The kind of a thrown value, or null when it is not a TendrilError (an unexpected failure). */
export function kindOf(err: unknown): ErrorKind | null {
  return err instanceof TendrilError ? err.kind : null;
}
