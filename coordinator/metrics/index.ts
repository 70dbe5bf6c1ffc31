/**
 * Prometheus metrics (prom-client). Names use base units and `_total` for
 * counters; labels never carry job or ensemble ids.
 *
 * Worker processes:   tendril_particles_grown_total{model}, tendril_kernel_counter_total{model,counter}
 *                     (the counters each model's descriptor declares, e.g. jumps),
 *                     tendril_runs_finished_total{outcome="stored"|"duplicate"},
 *                     tendril_jobs_failed_total, tendril_runs_active,
 *                     tendril_run_duration_seconds (histogram, minutes to hours),
 *                     tendril_worker_throughput_particles_per_second
 * Coordinator:        tendril_queue_jobs{state}, tendril_runs{state},
 *                     tendril_throughput_particles_per_second
 */
import { createServer, type Server } from 'node:http';
import { Counter, Gauge, Histogram, Registry, collectDefaultMetrics } from 'prom-client';
import type { Queue } from 'bullmq';
import type { ProcessorEvents } from '../../worker/runtime/queue-processor.js';
import type { EnsembleStore } from '../farm/store.js';

/** Run durations from seconds (tests, demos) up to days. */
export const RUN_DURATION_BUCKETS = [1, 10, 30, 60, 120, 300, 600, 1200, 1800, 3600, 7200, 14400, 28800, 57600, 86400, 172800];

export function newRegistry(defaults = true): Registry {
  const r = new Registry();
  if (defaults) collectDefaultMetrics({ register: r, prefix: 'tendril_' });
  return r;
}

export function workerMetrics(registry: Registry): Required<Pick<ProcessorEvents, 'onGrowth' | 'onRunDone' | 'onRunStarted' | 'onRunEnded' | 'onJobFailed'>> & { onProbed: (walkers: number) => void } {
  const probed = new Counter({ name: 'tendril_probe_walkers_total', help: 'Probe walkers run by this worker (harmonic-measure probing).', registers: [registry] });
  const particles = new Counter({ name: 'tendril_particles_grown_total', help: 'Particles added to clusters by this worker, by model.', labelNames: ['model'], registers: [registry] });
  const counters = new Counter({
    name: 'tendril_kernel_counter_total',
    help: 'Work counters of the clusters grown by this worker, by model and counter (as each model declares them, e.g. walk-on-spheres jumps).',
    labelNames: ['model', 'counter'],
    registers: [registry],
  });
  const finished = new Counter({ name: 'tendril_runs_finished_total', help: 'Runs finished by this worker, by whether the result was new.', labelNames: ['outcome'], registers: [registry] });
  const failed = new Counter({ name: 'tendril_jobs_failed_total', help: 'Queue jobs that failed on this worker.', registers: [registry] });
  const active = new Gauge({ name: 'tendril_runs_active', help: 'Runs being grown right now.', registers: [registry] });
  const duration = new Histogram({ name: 'tendril_run_duration_seconds', help: 'Growth time of finished runs, all attempts together.', buckets: RUN_DURATION_BUCKETS, registers: [registry] });
  const recent: Array<[number, number]> = [];
  new Gauge({
    name: 'tendril_worker_throughput_particles_per_second',
    help: 'Particles per second grown by this worker over the last minute.',
    registers: [registry],
    collect() {
      const now = Date.now();
      while (recent.length > 0 && recent[0][0] < now - 60_000) recent.shift();
      this.set(recent.reduce((s, [, n]) => s + n, 0) / 60);
    },
  });
  return {
    onGrowth: (model, p, deltas) => {
      particles.inc({ model }, p);
      for (const [counter, v] of Object.entries(deltas)) if (v > 0) counters.inc({ model, counter }, v);
      recent.push([Date.now(), p]);
    },
    onRunDone: (r, counted) => {
      finished.inc({ outcome: counted ? 'stored' : 'duplicate' });
      duration.observe(r.timings.growSeconds);
    },
    onRunStarted: () => active.inc(),
    onRunEnded: () => active.dec(),
    onJobFailed: () => failed.inc(),
    onProbed: (w) => probed.inc(w),
  };
}

/** Coordinator gauges, computed from Redis when scraped. */
export function coordinatorMetrics(registry: Registry, store: EnsembleStore, queue: Queue): void {
  new Gauge({
    name: 'tendril_queue_jobs',
    help: 'Jobs in the run queue by state.',
    labelNames: ['state'],
    registers: [registry],
    async collect() {
      const c = await queue.getJobCounts('waiting', 'active', 'delayed', 'failed', 'completed', 'prioritized');
      for (const [state, n] of Object.entries(c)) this.set({ state }, n);
    },
  });
  const runsGauge = new Gauge({ name: 'tendril_runs', help: 'Runs of the 100 newest ensembles by state.', labelNames: ['state'], registers: [registry] });
  const tp = new Gauge({ name: 'tendril_throughput_particles_per_second', help: 'Particles per second over the last minute, all ensembles.', registers: [registry] });
  // one collect fills both, so Redis is read once per scrape, in at most three round trips (EnsembleStore.statuses)
  const collectRuns = async () => {
    const totals = { queued: 0, running: 0, done: 0, failed: 0 };
    let throughput = 0;
    for (const s of await store.recentStatuses(100)) {
      totals.queued += s.state === 'cancelled' ? 0 : s.runs.queued;
      totals.running += s.runs.running;
      totals.done += s.runs.done;
      totals.failed += s.runs.failed;
      throughput += s.throughput;
    }
    for (const [state, n] of Object.entries(totals)) runsGauge.set({ state }, n);
    tp.set(throughput);
  };
  (runsGauge as unknown as { collect?: () => Promise<void> }).collect = collectRuns;
}

/** A bare /metrics endpoint (workers). */
export function serveMetrics(registry: Registry, port: number, host = '127.0.0.1'): Promise<Server> {
  const server = createServer((req, res) => {
    if (req.url !== '/metrics') {
      res.writeHead(404).end('not found\n');
      return;
    }
    registry.metrics().then(
      (text) => res.writeHead(200, { 'content-type': registry.contentType }).end(text),
      (err: Error) => res.writeHead(500).end(`${err.message}\n`),
    );
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => resolve(server));
  });
}
