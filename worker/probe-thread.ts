/**
 * Worker-thread body for embedded probing: receives { set, tasks }, builds
 * the geometry once, runs its probe jobs in order and posts the results.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { ProbeGeometry, runProbeJob, type DiskSet, type ProbeTask } from './probe-2d.js';

const data = workerData as { set: DiskSet; tasks: ProbeTask[] };
const geometry = new ProbeGeometry(data.set);
const results = data.tasks.map((t) => runProbeJob(geometry, t));
parentPort?.postMessage(results);
