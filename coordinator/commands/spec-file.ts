/** Shared by the commands that read an ensemble spec file (run, launch). */
import { readFile } from 'node:fs/promises';
import { UsageError } from '../usage-error.js';
import { formatOf, limitsFromEnv, parseSpec, parseSpecText, SpecError, type EnsembleSpec } from '../spec/index.js';
import { validateLaunch, type Launchable } from '../spec/sweep.js';

/** Read, parse and validate a spec file; every problem becomes one UsageError line. */
export async function loadSpecFile(path: string, maxTotalParticles?: number): Promise<EnsembleSpec> {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (err) {
    throw new UsageError(`spec file "${path}": ${(err as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (err as Error).message}`);
  }
  try {
    return parseSpec(text, formatOf(path), limitsFromEnv(process.env, maxTotalParticles));
  } catch (err) {
    if (err instanceof SpecError) throw new UsageError(`spec file "${path}": ${err.message}`);
    throw err;
  }
}

/** Read a spec file that may sweep a parameter (coordinator/spec/sweep.ts); every problem becomes one UsageError line. */
export async function loadLaunchFile(path: string, maxTotalParticles?: number): Promise<Launchable> {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (err) {
    throw new UsageError(`spec file "${path}": ${(err as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (err as Error).message}`);
  }
  try {
    return validateLaunch(parseSpecText(text, formatOf(path)), limitsFromEnv(process.env, maxTotalParticles));
  } catch (err) {
    if (err instanceof SpecError) throw new UsageError(`spec file "${path}": ${err.message}`);
    throw err;
  }
}

export { positiveInt } from './option-values.js';
