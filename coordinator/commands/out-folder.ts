/**
 * Output folders of the CLI (`--out`), checked before any work starts: the
 * path must be a folder or not exist yet, and the folder (or, when it does
 * not exist, its nearest existing parent) must be writable. Messages are one
 * line naming the flag and the path, never a raw EEXIST/ENOTDIR/EACCES text.
 * Creating the folder is a separate step, done when there is something to
 * write (so an interrupted `tendril grow` leaves no empty folder behind).
 */
import { accessSync, constants, mkdirSync, rmSync, statSync, writeFileSync, type Stats } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { UsageError } from '../usage-error.js';

/** stat, or undefined when the path does not exist (also when a part of it is a file: the caller finds which). */
function statOf(p: string): Stats | undefined {
  try {
    return statSync(p);
  } catch {
    return undefined;
  }
}

/** Check that `out` can be used as an output folder; returns its absolute path. Creates nothing. */
export function checkOutFolder(out: string, flag = '--out'): string {
  const dir = resolve(out);
  const st = statOf(dir);
  if (st) {
    if (!st.isDirectory()) throw new UsageError(`${flag}: "${out}" is an existing file; allowed: a folder, or a path that does not exist yet`);
    try {
      accessSync(dir, constants.W_OK | constants.X_OK);
    } catch {
      throw new UsageError(`${flag}: "${out}" is a folder this user cannot write to; allowed: a writable folder`);
    }
    return dir;
  }
  // walk up to the nearest existing ancestor: it must be a writable folder
  let up = dirname(dir);
  for (;;) {
    const s = statOf(up);
    if (s) {
      if (!s.isDirectory()) throw new UsageError(`${flag}: "${out}" cannot be created: "${up}" is a file, not a folder`);
      try {
        accessSync(up, constants.W_OK | constants.X_OK);
      } catch {
        throw new UsageError(`${flag}: "${out}" cannot be created: "${up}" is a folder this user cannot write to`);
      }
      return dir;
    }
    const next = dirname(up);
    if (next === up) throw new UsageError(`${flag}: "${out}" cannot be created: no part of its path exists`);
    up = next;
  }
}

/**
 * Create the (checked) output folder, one missing component at a time (a
 * recursive mkdir can hang on special file systems such as /proc), and prove
 * it writable by writing and removing a small file; one-line messages on failure.
 */
export function makeOutFolder(dir: string, out: string, flag = '--out'): void {
  const missing: string[] = [];
  for (let p = dir; !statOf(p); p = dirname(p)) {
    missing.unshift(p);
    if (dirname(p) === p) break;
  }
  const probe = resolve(dir, `.tendril-write-test-${process.pid}`);
  try {
    for (const p of missing) mkdirSync(p);
    writeFileSync(probe, '');
    rmSync(probe, { force: true });
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code ?? 'error';
    const what = code === 'EACCES' || code === 'EPERM' || code === 'EROFS' ? 'not writable' : code === 'ENOSPC' ? 'the disk is full' : 'cannot be created here';
    throw new UsageError(`${flag}: "${out}": ${what} (${code})`);
  }
}
