/**
 * `tendril serve`: the coordinator's HTTP API, the web status page at / and
 * /metrics. Binds 127.0.0.1 by default; refuses any other address unless an
 * API token is configured (TENDRIL_API_TOKEN, or --token-file). Without a token, creating and
 * cancelling are refused; everything else works.
 */
import { readFile } from 'node:fs/promises';
import type { Command } from 'commander';
import { startAdaptiveSweeps } from '../farm/adaptive.js';
import { buildApi, isLoopback } from '../http/server.js';
import { DirectoryArtifactStore } from '../farm/artifacts.js';
import { coordinatorMetrics, newRegistry } from '../metrics/index.js';
import { limitsFromEnv } from '../spec/index.js';
import { UsageError } from '../usage-error.js';
import { addFarmOptions, openFarm, type FarmCliOptions } from './farm-options.js';
import { positiveInt } from './spec-file.js';

interface ServeOptions extends FarmCliOptions {
  host: string;
  port: number;
  tokenFile?: string;
  artifacts?: string;
  bodyLimit: number;
  maxTotalParticles?: number;
}

/** Longest a Redis command of the API may take before the request answers 503. */
export const REDIS_COMMAND_TIMEOUT_MS = 5000;

export async function readToken(file: string | undefined, env: NodeJS.ProcessEnv = process.env): Promise<string | undefined> {
  let token: string | undefined;
  if (file) {
    try {
      token = (await readFile(file, 'utf8')).trim();
    } catch (err) {
      throw new UsageError(`--token-file: cannot read "${file}": ${(err as NodeJS.ErrnoException).code ?? (err as Error).message}`);
    }
  } else token = env.TENDRIL_API_TOKEN?.trim() || undefined;
  if (token !== undefined && (token.length < 16 || !/^[\x21-\x7e]+$/.test(token))) {
    throw new UsageError(`API token: ${token.length} characters is not allowed; allowed: at least 16 printable characters without spaces`);
  }
  return token;
}

export function register(program: Command): void {
  addFarmOptions(
    program
      .command('serve')
      .description('run the HTTP API (create, list, status, cancel, summary downloads), the web status page at / and /metrics')
      .option('--host <address>', 'address to bind (non-loopback needs an API token)', '127.0.0.1')
      .option('--port <port>', 'port', positiveInt('--port', 65535), 8740)
      .option('--artifacts <dir>', 'the workers\' artifact folder, for snapshot downloads (default: TENDRIL_ARTIFACTS or ./tendril-artifacts)')
      .option('--token-file <file>', 'file holding the API bearer token (default: TENDRIL_API_TOKEN)')
      .option('--body-limit <bytes>', 'largest request body', positiveInt('--body-limit', 16 * 1024 * 1024), 65536)
      .option('--max-total-particles <n>', 'raise the ceiling on particles × clusters', positiveInt('--max-total-particles', Number.MAX_SAFE_INTEGER)),
  ).action(async (opts: ServeOptions) => {
    const token = await readToken(opts.tokenFile);
    if (!token && !isLoopback(opts.host)) {
      throw new UsageError(`--host: "${opts.host}" is reachable from other machines; allowed without an API token: 127.0.0.1, ::1 or localhost (set TENDRIL_API_TOKEN or --token-file)`);
    }
    const limits = limitsFromEnv(process.env, opts.maxTotalParticles);
    // the API answers 503 at once while Redis is down, and no command waits more than 5 s
    const farm = await openFarm(opts, REDIS_COMMAND_TIMEOUT_MS);
    const registry = newRegistry();
    coordinatorMetrics(registry, farm.store, farm.queue);
    const artifacts = new DirectoryArtifactStore(opts.artifacts ?? process.env.TENDRIL_ARTIFACTS ?? 'tendril-artifacts');
    const app = buildApi({ store: farm.store, queue: farm.queue, token, limits, registry, bodyLimit: opts.bodyLimit, artifacts });
    const address = await app.listen({ host: opts.host, port: opts.port });
    // adaptive ensembles: a sweep judges finished batches that no worker judged (e.g. it died right after storing the last result)
    const stopSweeps = startAdaptiveSweeps(farm.store, farm.queue, 30_000, (line) => process.stderr.write(`tendril serve: ${line}\n`));
    process.stdout.write(`serving on ${address}${token ? '' : ' (no API token: creating and cancelling are disabled)'}\n`);
    await new Promise<void>((resolve) => {
      const stop = () => void stopSweeps().then(() => app.close()).then(() => farm.close()).finally(resolve);
      process.once('SIGTERM', stop);
      process.once('SIGINT', stop);
    });
  });
}
