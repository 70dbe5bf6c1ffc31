/**
 * The artifact store holds checkpoints (and later cluster snapshots) by key.
 * The first implementation is a directory that every worker can reach (local
 * disk or a shared filesystem); an object store can implement the same
 * interface. Writes are atomic (temporary file + rename), so a reader never
 * sees half a checkpoint, even when a worker is killed mid-write.
 */
import { mkdir, readFile, rename, rm, writeFile, readdir, stat } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { randomBytes } from 'node:crypto';

export interface ArtifactStore {
  put(key: string, bytes: Uint8Array): Promise<void>;
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

  /**
   * Remove temporaries (`*.tmp`) older than `olderThanMs` left by a process
   * killed between writing and renaming; returns how many were removed.
   * Workers call it when they start (a temporary that young may still be
   * being written by another worker, so it is kept).
   */
  async sweepTemporaries(olderThanMs = 3_600_000, now = Date.now()): Promise<number> {
    let removed = 0;
    const walk = async (dir: string): Promise<void> => {
      let entries;
      try {
        entries = await readdir(dir, { withFileTypes: true });
      } catch {
        return;
      }
      for (const e of entries) {
        const p = join(dir, e.name);
        if (e.isDirectory()) await walk(p);
        else if (e.name.endsWith('.tmp')) {
          try {
            if (now - (await stat(p)).mtimeMs >= olderThanMs) {
              await rm(p, { force: true });
              removed++;
            }
          } catch {
            // gone meanwhile
          }
        }
      }
    };
    await walk(this.root);
    return removed;
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

/** Key of the newest checkpoint of a run. */
export function checkpointKey(ensembleId: string, runIndex: number): string {
  return `${ensembleId}/run-${runIndex}.checkpoint`;
}
