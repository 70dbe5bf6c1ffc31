/** Shared by the commands that read an ensemble spec file (run, launch). */
import { readFile } from 'node:fs/promises';
import { UsageError } from '../usage-error.js';
import { formatOf, limitsFromEnv, parseSpecText, SpecError, type EnsembleSpec } from '../spec/index.js';
import { validateLaunch, type Launchable } from '../spec/sweep.js';

/** The text of a spec file; a missing or unreadable file is one UsageError line. */
async function readSpecFile(path: string): Promise<string> {
  try {
    return await readFile(path, 'utf8');
  } catch (err) {
    throw new UsageError(`spec file "${path}": ${(err as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (err as Error).message}`);
  }
}

/** Read, parse and validate a spec file of one ensemble (a sweep is refused in one line); every problem becomes one UsageError line. */
export async function loadSpecFile(path: string, maxTotalParticles?: number): Promise<EnsembleSpec> {
  const got = await loadLaunchFile(path, maxTotalParticles);
  if (got.kind === 'sweep') throw new UsageError(`spec file "${path}": params.${got.sweep.parameter}: a sweep is not allowed here; allowed: a single number (this command takes one ensemble)`);
  return got.spec;
}

/** Read a spec file that may sweep a parameter (coordinator/spec/sweep.ts); every problem becomes one UsageError line. */
export async function loadLaunchFile(path: string, maxTotalParticles?: number): Promise<Launchable> {
  const text = await readSpecFile(path);
  try {
    return validateLaunch(parseSpecText(text, formatOf(path)), limitsFromEnv(process.env, maxTotalParticles));
  } catch (err) {
    if (err instanceof SpecError) throw new UsageError(`spec file "${path}": ${err.message}`);
    throw err;
  }
}

export { positiveInt } from './option-values.js';
