/**
 * Summaries computed off the event loop. The full analysis of an ensemble
 * (bootstrap intervals over every estimator) can take many seconds; the HTTP
 * server hands it to one worker thread so that /health, status and other
 * requests keep being answered meanwhile. Inputs and outputs are plain data
 * (structured clone); the analysis options are the spec's own
 * (defaultSummaryOptions), so the result is the very summary buildSummary
 * gives on the main thread.
 *
 * This one file is both the client (main thread) and the thread's entry; it
 * imports only the summary builder, never a module that starts a task thread.
 */
import { messageOf } from '../../proto/errors.js';
import { isMainThread, parentPort, Worker, workerData } from 'node:worker_threads';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { EnsembleSummaryData } from '../../proto/convert.js';
import { buildSummary, defaultSummaryOptions, type SummaryInput } from '../summary/index.js';

type ToThread = { id: number; input: SummaryInput };
type FromThread = { id: number; summary?: EnsembleSummaryData; error?: string };

const ROLE = 'tendril-summary';

if (!isMainThread && parentPort && (workerData as { role?: string } | null)?.role === ROLE) {
  const port = parentPort;
  port.on('message', (m: ToThread) => {
    try {
      port.postMessage({ id: m.id, summary: buildSummary(m.input, defaultSummaryOptions()) } satisfies FromThread);
    } catch (err) {
      port.postMessage({ id: m.id, error: messageOf(err) } satisfies FromThread);
    }
  });
}

/** The compiled entry of this file (under vitest the sources are .ts: map into dist/). */
function entryUrl(): URL {
  const here = fileURLToPath(import.meta.url);
  if (here.endsWith('.ts')) {
    const compiled = here.replace(/([\\/])coordinator([\\/])farm([\\/])summary-thread\.ts$/, '$1dist$1coordinator$2farm$3summary-thread.js');
    if (!existsSync(compiled)) throw new Error(`compiled thread entry ${compiled} is missing: run npm run build`);
    return new URL(`file://${compiled}`);
  }
  return new URL(import.meta.url);
}

/** One summary thread, started on first use; jobs run one at a time in order. */
export class SummaryThread {
  private worker: Worker | null = null;
  private nextId = 1;
  private readonly pending = new Map<number, { resolve: (s: EnsembleSummaryData) => void; reject: (e: Error) => void }>();

  private start(): Worker {
    if (this.worker) return this.worker;
    const w = new Worker(entryUrl(), { workerData: { role: ROLE } });
    w.unref();
    w.on('message', (m: FromThread) => {
      const p = this.pending.get(m.id);
      if (!p) return;
      this.pending.delete(m.id);
      if (m.summary) p.resolve(m.summary);
      else p.reject(new Error(`summary: ${m.error ?? 'no result'}`));
    });
    const fail = (why: string) => {
      this.worker = null;
      for (const p of this.pending.values()) p.reject(new Error(`summary thread ${why}`));
      this.pending.clear();
    };
    w.on('error', (err) => fail(`crashed: ${messageOf(err)}`));
    w.on('exit', (code) => fail(`exited with code ${code}`));
    this.worker = w;
    return w;
  }

  build(input: SummaryInput): Promise<EnsembleSummaryData> {
    const w = this.start();
    const id = this.nextId++;
    return new Promise((resolve, reject) => {
      this.pending.set(id, { resolve, reject });
      w.postMessage({ id, input } satisfies ToThread);
    });
  }

  async close(): Promise<void> {
    const w = this.worker;
    this.worker = null;
    if (w) await w.terminate();
  }
}
