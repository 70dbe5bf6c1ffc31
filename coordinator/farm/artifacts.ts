/**
 * The artifact store holds checkpoints (and later cluster snapshots) by key.
 * The first implementation is a directory that every worker can reach (local
 * disk or a shared filesystem); an object store can implement the same
 * interface. Writes are atomic (temporary file + rename), so a reader never
 * sees half a checkpoint, even when a worker is killed mid-write. The keys
 * are listed in the job contract (worker/runtime/job-contract.ts).
 *
 * Checkpoints of running runs do not pass through put/get as whole buffers:
 * the growth thread writes each one straight into the key's file and a
 * resumed run reads it back from there, in chunks (checkpointFile below,
 * proto/checkpoint-file.ts), so a giant cluster's checkpoint is never one
 * buffer in the worker, nor a base64 string, nor anything in Redis.
 */
import { mkdir, readFile, rename, rm, stat, writeFile, readdir } from 'node:fs/promises';
import { hostname } from 'node:os';
import { join, resolve } from 'node:path';
import { randomBytes } from 'node:crypto';
import { messageOf } from '../../proto/errors.js';

export interface ArtifactStore {
  put(key: string, bytes: Uint8Array): Promise<void>;
  /**
   * The local file of `key`, for writers and readers that stream it in
   * chunks (proto/checkpoint-file.ts: temporary file, flushed, renamed)
   * instead of handing whole buffers to put/get; its folder exists once this
   * resolves. `exists`: whether an artifact is stored under the key now.
   */
  checkpointFile(key: string): Promise<{ path: string; exists: boolean }>;
  /** The bytes, or null when there is no artifact under the key. */
  get(key: string): Promise<Uint8Array | null>;
  delete(key: string): Promise<void>;
  /** Keys starting with the prefix. */
  list(prefix: string): Promise<string[]>;
}

const KEY = /^[A-Za-z0-9_.-]+(\/[A-Za-z0-9_.-]+)*$/;

function checkKey(key: string): void {
  if (!KEY.test(key) || key.split('/').some((p) => p === '.' || p === '..')) throw new RangeError(`artifact key "${key}" is not a plain relative path`);
}

export class DirectoryArtifactStore implements ArtifactStore {
  readonly root: string;
  constructor(root: string) {
    this.root = resolve(root);
  }

  private path(key: string): string {
    checkKey(key);
    return join(this.root, ...key.split('/'));
  }

  async put(key: string, bytes: Uint8Array): Promise<void> {
    const p = this.path(key);
    await mkdir(join(p, '..'), { recursive: true });
    const tmp = `${p}.${randomBytes(4).toString('hex')}.tmp`;
    try {
      await writeFile(tmp, bytes);
      await rename(tmp, p);
    } catch (err) {
      await rm(tmp, { force: true });
      throw err;
    }
  }

  async checkpointFile(key: string): Promise<{ path: string; exists: boolean }> {
    const p = this.path(key);
    await mkdir(join(p, '..'), { recursive: true });
    try {
      return { path: p, exists: (await stat(p)).isFile() };
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === 'ENOENT') return { path: p, exists: false };
      throw err;
    }
  }

  async get(key: string): Promise<Uint8Array | null> {
    try {
      return await readFile(this.path(key));
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null;
      throw err;
    }
  }

  async delete(key: string): Promise<void> {
    await rm(this.path(key), { force: true });
  }

  async list(prefix: string): Promise<string[]> {
    const dir = prefix.includes('/') ? prefix.slice(0, prefix.lastIndexOf('/')) : '';
    let names: string[];
    try {
      names = await readdir(dir ? this.path(dir) : this.root);
    } catch {
      return [];
    }
    return names
      .filter((n) => !n.endsWith('.tmp'))
      .map((n) => (dir ? `${dir}/${n}` : n))
      .filter((k) => k.startsWith(prefix))
      .sort();
  }
}

/**
 * Check that a worker can create, rename and delete files in the artifact
 * folder (creating the folder if needed). Returns null when it can, else one
 * line saying why not. A multi-host farm needs this folder on a filesystem
 * that every worker mounts at the same path (e.g. a cluster's shared /scratch).
 */
export async function artifactFolderProblem(root: string): Promise<string | null> {
  const dir = resolve(root);
  const probe = join(dir, `.write-check-${hostname()}-${process.pid}-${randomBytes(4).toString('hex')}.tmp`);
  try {
    await mkdir(dir, { recursive: true });
    await writeFile(probe, 'tendril');
    await rename(probe, `${probe}.renamed`);
    await rm(`${probe}.renamed`);
    return null;
  } catch (err) {
    await rm(probe, { force: true }).catch(() => undefined);
    const code = (err as NodeJS.ErrnoException).code ?? messageOf(err);
    return `--artifacts: "${dir}" is not writable by this worker (${code}); allowed: a folder this user can create files in, on a filesystem every worker mounts at the same path`;
  }
}

/**
 * Delete temporary files (`*.tmp`) left by writers that died between write and
 * rename, in the folder and one level of subfolders (one per ensemble). Only
 * files older than `olderThanMs` go: a live writer on another host may be
 * between its write and its rename right now. Returns the count removed.
 */
export async function removeOrphanTemporaries(root: string, olderThanMs: number, now = Date.now()): Promise<number> {
  const dir = resolve(root);
  let removed = 0;
  const sweep = async (folder: string, depth: number) => {
    let entries;
    try {
      entries = await readdir(folder, { withFileTypes: true });
    } catch {
      return;
    }
    for (const e of entries) {
      const p = join(folder, e.name);
      if (e.isDirectory() && depth > 0) await sweep(p, depth - 1);
      else if (e.isFile() && e.name.endsWith('.tmp')) {
        try {
          if (now - (await stat(p)).mtimeMs > olderThanMs) {
            await rm(p, { force: true });
            removed++;
          }
        } catch {
          // removed meanwhile by another worker
        }
      }
    }
  };
  await sweep(dir, 1);
  return removed;
}
