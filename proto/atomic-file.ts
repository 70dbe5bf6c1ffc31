/**
 * A file written piece by piece and published whole: the pieces go to a
 * temporary name next to it, which is flushed to disk and renamed into
 * place, so a reader never sees half a file, even when the writer is killed
 * mid-write (a killed writer leaves only `*.tmp`). On any error the
 * temporary file is removed and the error rethrown. Used by the streamed
 * checkpoint and snapshot writers.
 */
import { randomBytes } from 'node:crypto';
import { closeSync, fsyncSync, openSync, renameSync, rmSync, writeSync } from 'node:fs';
import { threadId } from 'node:worker_threads';

/** Call `write` with a `put` that appends all of its bytes; returns the number of bytes written. */
export function writeFileAtomically(path: string, write: (put: (bytes: Uint8Array) => void) => void): number {
  // unique per writer: two threads, or two hosts on a shared folder (a stalled run taken up while its first worker still lives), never share one
  const tmp = `${path}.${process.pid}-${threadId}-${randomBytes(4).toString('hex')}.tmp`;
  const fd = openSync(tmp, 'w');
  let written = 0;
  let open = true;
  try {
    write((bytes) => {
      for (let o = 0; o < bytes.length; ) o += writeSync(fd, bytes, o, bytes.length - o);
      written += bytes.length;
    });
    fsyncSync(fd);
    closeSync(fd);
    open = false;
    renameSync(tmp, path);
    return written;
  } catch (err) {
    if (open) closeSync(fd);
    rmSync(tmp, { force: true });
    throw err;
  }
}
