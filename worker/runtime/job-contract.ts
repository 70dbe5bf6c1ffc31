/**
 * The job contract between the coordinator (which queues jobs and reads
 * results) and the workers (which run them): the queue name, the job
 * payloads and their readers, and every artifact key. Both sides import it
 * from here, so the layout is written down once.
 *
 * Queue "runs" carries two kinds of job (version JOB_PAYLOAD_VERSION):
 *   name "run"    RunJobData: one or more run tasks of an ensemble (protobuf RunTask, base64)
 *   name "probe"  ProbeJobData: one job of the probe of (run, size) of an
 *                 ensemble, or of a probe request's point set
 *
 * Artifact keys (ID = ensemble or probe request id, I = run index):
 *   ID/run-I.checkpoint                    newest checkpoint of a running run (protobuf Checkpoint)
 *   ID/run-I.result                        result of a run of the embedded mode (protobuf RunResult)
 *   ID/run-I.harmonic.json                 a probed cluster's harmonic measures (embedded mode)
 *   ID/run-I.final                         final state of a run that keeps positions (Checkpoint at count = particles)
 *   ID/run-I.hits                          summed probe hit counts per particle (float64) for pictures
 *   ID/probe/run-I-size-N/job-J.json       result of probe job J of (run I, size N)
 *   ID/request/job-J.json                  result of probe job J of a probe request
 */
import { ContractError, decodeRunTask, type RunTaskData } from '../../proto/convert.js';
import { checkProbeTask, type ProbeTask } from '../probe/probe-2d.js';

export const QUEUE_NAME = 'runs';
export const JOB_PAYLOAD_VERSION = 1;

export interface RunJobData {
  v: number;
  ensembleId: string;
  /** Base64 protobuf RunTask messages. */
  tasks: string[];
}

/** Payload of a probe job (version 1): one job of the probe of (run, size) of an ensemble. */
export interface ProbeJobData {
  v: number;
  kind: 'probe';
  /** What is probed: a cluster of an ensemble (default) or the point set of a probe request. */
  source?: 'cluster' | 'request';
  /** The ensemble id, or the probe request id. */
  ensembleId: string;
  runIndex: number;
  size: number;
  /** The probe task (worker/probe/probe-2d.ts ProbeTask), plain JSON. */
  task: ProbeTask;
}

/** Read a probe job payload; throws ContractError naming what is wrong. */
export function readProbeJobData(data: unknown): ProbeJobData {
  const d = data as Partial<ProbeJobData> | null;
  if (typeof d !== 'object' || d === null) throw new ContractError('probe job payload is not an object');
  if (d.v !== JOB_PAYLOAD_VERSION) throw new ContractError(`probe job payload v is ${JSON.stringify(d.v)}, this worker reads only version ${JOB_PAYLOAD_VERSION}`);
  if (typeof d.ensembleId !== 'string' || d.ensembleId === '') throw new ContractError('probe job payload ensembleId is missing');
  if (!Number.isSafeInteger(d.runIndex) || (d.runIndex as number) < 0) throw new ContractError(`probe job payload runIndex is ${JSON.stringify(d.runIndex)}, must be a non-negative integer`);
  if (!Number.isSafeInteger(d.size) || (d.size as number) < 1) throw new ContractError(`probe job payload size is ${JSON.stringify(d.size)}, must be a positive integer`);
  if (typeof d.task !== 'object' || d.task === null) throw new ContractError('probe job payload task is missing');
  if (d.source !== undefined && d.source !== 'cluster' && d.source !== 'request') throw new ContractError(`probe job payload source is ${JSON.stringify(d.source)}, must be "cluster" or "request"`);
  try {
    checkProbeTask(d.task);
  } catch (err) {
    throw new ContractError(`probe job payload task: ${(err as Error).message}`);
  }
  return d as ProbeJobData;
}

/** Read a job payload; throws ContractError naming what is wrong. */
export function readJobData(data: unknown): { ensembleId: string; tasks: RunTaskData[] } {
  const d = data as Partial<RunJobData> | null;
  if (typeof d !== 'object' || d === null) throw new ContractError('job payload is not an object');
  if (d.v !== JOB_PAYLOAD_VERSION) throw new ContractError(`job payload v is ${JSON.stringify(d.v)}, this worker reads only version ${JOB_PAYLOAD_VERSION}`);
  if (typeof d.ensembleId !== 'string' || d.ensembleId === '') throw new ContractError('job payload ensembleId is missing');
  if (!Array.isArray(d.tasks) || d.tasks.length === 0) throw new ContractError('job payload tasks is not a non-empty list');
  const tasks = d.tasks.map((t, i) => {
    if (typeof t !== 'string' || !/^[A-Za-z0-9+/]*={0,2}$/.test(t)) throw new ContractError(`job payload tasks[${i}] is not base64 text`);
    const run = decodeRunTask(Buffer.from(t, 'base64'));
    if (run.ensembleId !== d.ensembleId) throw new ContractError(`job payload tasks[${i}] belongs to ensemble ${run.ensembleId}, not ${d.ensembleId}`);
    return run;
  });
  return { ensembleId: d.ensembleId, tasks };
}

// ---------------------------------------------------------------- artifact keys

/** Newest checkpoint of a run. */
export const checkpointKey = (id: string, run: number): string => `${id}/run-${run}.checkpoint`;
/** Result of a run of the embedded mode. */
export const resultKey = (id: string, run: number): string => `${id}/run-${run}.result`;
/** Harmonic measures of a probed cluster (embedded mode). */
export const harmonicKey = (id: string, run: number): string => `${id}/run-${run}.harmonic.json`;
/** Final state of a run that keeps positions. */
export const finalKey = (id: string, run: number): string => `${id}/run-${run}.final`;
/** Summed probe hit counts of a run's final cluster. */
export const hitsKey = (id: string, run: number): string => `${id}/run-${run}.hits`;
/** Result of probe job `job` of (run, size). */
export const probeResultKey = (id: string, run: number, size: number, job: number): string => `${id}/probe/run-${run}-size-${size}/job-${job}.json`;
/** Result of probe job `job` of a probe request. */
export const requestResultKey = (id: string, job: number): string => `${id}/request/job-${job}.json`;
