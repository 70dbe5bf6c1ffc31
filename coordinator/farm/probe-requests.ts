/**
 * Probe requests: a user's own point set (a digitised deposit, a crack
 * pattern, …) probed on the farm, submitted through the HTTP API
 * (POST /probes). The set and the settings are kept in Redis; the probe is
 * split into seeded jobs on the shared queue (the same ProbeJobData as the
 * probes of ensembles, with source "request"), and the worker that stores
 * the last job result analyses them (coordinator/harmonic/probe-run.ts
 * analyseResults: the same analysis as `tendril probe`). Job j uses
 * Random.forRun(seed, j, STREAM_PROBE), so the measures equal those of
 * `tendril probe` with the same set, seed, walkers and jobs.
 *
 * Keys (P = prefix):
 *   P:probe:ID        hash: request (settings JSON, with dimension 2 or 3, and radius in 3D),
 *                     set (float64 x | y | r, little-endian; balls: x | y | z, the radius in request),
 *                     created_at_ms, measures (HarmonicMeasures JSON, once analysed),
 *                     hits (float64 per disk, once analysed), failed (reason),
 *                     cancelled (time in ms, once cancelled: its jobs are skipped, a running one is stopped)
 *   P:probe:ID:done   set: job indices whose results are stored
 *   P:probes          sorted set of request ids by creation time
 * Job results live in the artifact store under ID/request/job-J.json.
 */
import { randomBytes } from 'node:crypto';
import type { Queue } from 'bullmq';
import type { Redis } from 'ioredis';
import type { DiskSet } from '../../worker/probe/probe-2d.js';
import type { BallSet } from '../../worker/probe/probe-3d.js';
import { isBallSet, probeSetDigest, type ProbeSet } from '../../worker/probe/probe-set.js';
import { planProbeRun } from '../harmonic/probe-run.js';
import { quoteValue } from '../../worker/core/value-range.js';
import { JOB_PAYLOAD_VERSION, type ProbeJobData } from '../../worker/runtime/job-contract.js';
import { parseDiskCsv } from '../harmonic/probe-input.js';
import { probeGeometryProblem } from '../../worker/probe/probe-limits.js';
import { excerpt, fieldKey, nestingProblem } from '../spec/document-limits.js';
import type { HarmonicMeasures } from '../harmonic/probe-analysis.js';
import { PROBE_SETTINGS_PROPERTIES, probeSettingsOf, probeSettingsProblems, type ProbeSettings, type ProbeSettingsDocument } from '../harmonic/probe-settings.js';
import { NAME_SCHEMA, SEED_SCHEMA } from '../spec/schema.js';
import { compileChecker, type Checker } from '../spec/schema-messages.js';
import { TendrilError } from '../../proto/errors.js';

export interface ProbeRequestSettings extends ProbeSettings {
  name: string;
  seed: string;
}

export class ProbeRequestError extends TendrilError {
  override name = 'ProbeRequestError';
  readonly kind = 'request';
}

/** Most disks in one request. */
export const MAX_REQUEST_DISKS = 2_000_000;

/**
 * The JSON schema of a POST /probes body: the shared probe settings
 * (coordinator/harmonic/probe-settings.ts), a seed, an optional name, and the
 * set as csv text or points (their contents are checked by validateProbeRequest);
 * points with a z array are balls in 3D (one radius r), probed as the spec
 * path probes a dla-offlattice-3d cluster (worker/probe/probe-set.ts).
 */
export const PROBE_REQUEST_SCHEMA = {
  $id: 'tendril/probe-request',
  type: 'object',
  additionalProperties: false,
  required: ['walkers', 'seed'],
  properties: {
    name: NAME_SCHEMA,
    csv: { type: 'string', description: 'text of x,y,r rows' },
    points: { type: 'object', description: '{x: [...], y: [...], r: number or [...]} with x and y of equal length; with z: [...] as well, balls in 3D of one radius r' },
    ...PROBE_SETTINGS_PROPERTIES,
    seed: SEED_SCHEMA,
  },
} as const;

/** The schema-level problems of a probe request body, one line each. */
export const probeRequestProblems: Checker = compileChecker(PROBE_REQUEST_SCHEMA);

/** The set of a probe request: disks (x, y, r per disk) or balls in 3D (x, y, z, one radius). */
export type RequestSet = (DiskSet & { x: Float64Array; y: Float64Array; r: Float64Array }) | BallSet;

/**
 * Check a request body: { name?, csv? | points?: {x: [...], y: [...], z?: [...], r: number | [...]},
 * walkers, seed, jobs?, q?, contact_sample?, min_step?, window? }. Points with z are balls in 3D
 * (one radius r; no contact_sample). Throws ProbeRequestError with one line naming the field, the
 * value and what is allowed.
 */
export function validateProbeRequest(body: unknown): { settings: ProbeRequestSettings; set: RequestSet } {
  const fail = (m: string): never => {
    throw new ProbeRequestError(m);
  };
  const show = quoteValue;
  if (typeof body !== 'object' || body === null || Array.isArray(body)) fail('body: not allowed; allowed: a JSON object with walkers, seed and csv or points');
  const tooDeep = nestingProblem(body, 'body');
  if (tooDeep !== null) fail(tooDeep);
  for (const k of ['name', 'csv', 'points', 'walkers', 'seed', 'jobs', 'q', 'contact_sample', 'min_step']) {
    if ((body as Record<string, unknown>)[k] === null) fail(`${k}: null is not allowed; allowed: leave the field out to take its default`);
  }
  const schemaProblems = probeRequestProblems(body);
  if (schemaProblems.length > 0) fail(schemaProblems[0]);
  const b = body as Record<string, unknown>;
  if (BigInt(b.seed as string | number) >= 1n << 64n) fail(`seed: ${show(b.seed)} is out of range; allowed: an integer from 0 to 18446744073709551615`);
  const doc = b as unknown as ProbeSettingsDocument;
  const settingsProblems = probeSettingsProblems(doc);
  if (settingsProblems.length > 0) fail(settingsProblems[0]);
  if ((b.csv === undefined) === (b.points === undefined)) fail('csv, points: exactly one must be given; allowed: csv (text of x,y,r rows) or points ({x: [...], y: [...], r: number or [...]})');
  let x: Float64Array, y: Float64Array, r: Float64Array;
  let z: Float64Array | undefined;
  if (b.csv !== undefined) {
    try {
      const s = parseDiskCsv(b.csv as string, 'csv');
      x = s.x; y = s.y; r = s.r as Float64Array;
    } catch (e) {
      return fail((e as Error).message);
    }
  } else {
    const p = b.points as Record<string, unknown>;
    if (!Array.isArray(p.x) || !Array.isArray(p.y)) return fail(`points: ${show(b.points)} is not allowed; allowed: {x: [...], y: [...], r: number or [...]} with x and y of equal length`);
    const n = p.x.length;
    if (n > MAX_REQUEST_DISKS) fail(`points.x: ${n} values is out of range; allowed: at most ${MAX_REQUEST_DISKS}`);
    if (n < 1) fail('points.x: 0 values is not allowed; allowed: at least 1 number');
    if (p.y.length !== n) fail(`points.y: ${p.y.length} values is not allowed; allowed: as many as points.x (${n})`);
    if (Array.isArray(p.r) && p.r.length !== n) fail(`points.r: ${p.r.length} values is not allowed; allowed: one number, or as many as points.x (${n})`);
    if (p.z !== undefined) {
      // balls in 3D: one radius, no contact points (as a [probe] table of a 3D model)
      if (!Array.isArray(p.z)) fail(`points.z: ${show(p.z)} is not allowed; allowed: an array of as many numbers as points.x (${n}), for balls in 3D`);
      if ((p.z as unknown[]).length !== n) fail(`points.z: ${(p.z as unknown[]).length} values is not allowed; allowed: as many as points.x (${n})`);
      if (typeof p.r !== 'number') fail(`points.r: ${show(p.r)} is not allowed; allowed: one number > 0 for balls (points with z): every ball has the same radius`);
      if (b.contact_sample !== undefined) fail(`contact_sample: ${show(b.contact_sample)} is not used for balls (points with z); allowed: no contact_sample (3D probes keep no contact points: the Newtonian capacity comes from the share of probes that hit)`);
      z = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        const zi = (p.z as unknown[])[i];
        if (typeof zi !== 'number' || !Number.isFinite(zi)) fail(`points.z[${i}]: ${show(zi)} is not allowed; allowed: a finite number`);
        z[i] = zi as number;
      }
    }
    x = new Float64Array(n); y = new Float64Array(n); r = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const xi = p.x[i], yi = p.y[i];
      if (typeof xi !== 'number' || !Number.isFinite(xi)) fail(`points.x[${i}]: ${show(xi)} is not allowed; allowed: a finite number`);
      if (typeof yi !== 'number' || !Number.isFinite(yi)) fail(`points.y[${i}]: ${show(yi)} is not allowed; allowed: a finite number`);
      const ri = typeof p.r === 'number' ? p.r : Array.isArray(p.r) ? p.r[i] : undefined;
      if (typeof ri !== 'number' || !(Number.isFinite(ri) && ri > 0)) fail(`points.r${Array.isArray(p.r) ? `[${i}]` : ''}: ${show(ri)} is not allowed; allowed: a finite number > 0 (one for all, or one per point)`);
      x[i] = xi as number; y[i] = yi as number; r[i] = ri as number;
    }
  }
  if (x!.length > MAX_REQUEST_DISKS) fail(`points: ${x!.length} disks is out of range; allowed: at most ${MAX_REQUEST_DISKS}`);
  const shape = probeGeometryProblem({ count: x!.length, x: x!, y: y!, r: r!, ...(z ? { z } : {}) }, probeSettingsOf(doc).minStep, b.csv !== undefined ? 'csv' : 'points');
  if (shape !== null) fail(shape);
  const settings = { name: (b.name as string | undefined) ?? 'probe', seed: BigInt(b.seed as string | number).toString(), ...probeSettingsOf(doc) };
  if (z) return { settings: { ...settings, contactSample: 0 }, set: { count: x!.length, x: x!, y: y!, z, radius: r![0] } };
  return { settings, set: { count: x!.length, x: x!, y: y!, r: r! } };
}

/** The three float64 axes a request set is stored as: x | y | r (disks) or x | y | z (balls). */
function storedAxes(set: RequestSet): [Float64Array, Float64Array, Float64Array] {
  return isBallSet(set) ? [set.x, set.y, set.z] : [set.x, set.y, set.r];
}

export interface ProbeRequestStatus {
  id: string;
  name: string;
  state: 'running' | 'done' | 'failed' | 'cancelled';
  createdAt: string;
  /** 2: disks in the plane; 3: balls. */
  dimension: 2 | 3;
  /** Disks (or balls, in 3D) in the set. */
  disks: number;
  walkers: number;
  jobs: { planned: number; done: number };
  failure: string | null;
  measures: HarmonicMeasures | null;
}

export class ProbeRequestStore {
  constructor(readonly redis: Redis, readonly prefix: string) {}

  private k(id: string, part?: string): string {
    return part ? `${this.prefix}:probe:${id}:${part}` : `${this.prefix}:probe:${id}`;
  }

  async create(id: string, settings: ProbeRequestSettings, set: RequestSet, createdAtMs = Date.now()): Promise<void> {
    const n = set.count;
    const bytes = Buffer.alloc(24 * n);
    const [a0, a1, a2] = storedAxes(set);
    for (let i = 0; i < n; i++) {
      bytes.writeDoubleLE(a0[i], 8 * i);
      bytes.writeDoubleLE(a1[i], 8 * (n + i));
      bytes.writeDoubleLE(a2[i], 8 * (2 * n + i));
    }
    const shape = isBallSet(set) ? { dimension: 3, radius: set.radius } : { dimension: 2 };
    const ok = await this.redis.hsetnx(this.k(id), 'request', JSON.stringify({ ...settings, disks: n, ...shape, digest: probeSetDigest(set) }));
    if (!ok) throw new Error(`probe request ${id} exists already`);
    await this.redis.multi().hset(this.k(id), { set: bytes, created_at_ms: String(createdAtMs) }).zadd(`${this.prefix}:probes`, createdAtMs, id).exec();
  }

  /** The stored settings (dimension absent: a request stored before 3D sets, planar). */
  async settings(id: string): Promise<(ProbeRequestSettings & { disks: number; digest: string; dimension?: 2 | 3; radius?: number }) | null> {
    const s = await this.redis.hget(this.k(id), 'request');
    return s ? JSON.parse(s) : null;
  }

  async set(id: string): Promise<ProbeSet | null> {
    const [b, s] = await Promise.all([this.redis.hgetBuffer(this.k(id), 'set'), this.settings(id)]);
    if (!b || !s) return null;
    const n = b.length / 24;
    const all = new Float64Array(3 * n);
    for (let i = 0; i < 3 * n; i++) all[i] = b.readDoubleLE(8 * i);
    if (s.dimension === 3) return { count: n, x: all.subarray(0, n), y: all.subarray(n, 2 * n), z: all.subarray(2 * n), radius: s.radius! };
    return { count: n, x: all.subarray(0, n), y: all.subarray(n, 2 * n), r: all.subarray(2 * n) };
  }

  async jobStored(id: string, job: number): Promise<number> {
    const r = await this.redis.multi().sadd(this.k(id, 'done'), String(job)).scard(this.k(id, 'done')).exec();
    return Number(r?.[1]?.[1] ?? 0);
  }

  async hasMeasures(id: string): Promise<boolean> {
    return (await this.redis.hexists(this.k(id), 'measures')) === 1;
  }

  async saveMeasures(id: string, m: HarmonicMeasures, counts: Float64Array): Promise<boolean> {
    const ok = await this.redis.hsetnx(this.k(id), 'measures', JSON.stringify(m));
    if (ok) await this.redis.multi().hset(this.k(id), 'hits', Buffer.from(counts.buffer, counts.byteOffset, counts.byteLength)).hdel(this.k(id), 'failed').exec();
    return ok === 1;
  }

  async failed(id: string, reason: string): Promise<void> {
    if (!(await this.hasMeasures(id))) await this.redis.hset(this.k(id), 'failed', reason.slice(0, 500));
  }

  /** Mark a request cancelled; false when there is no such request. Its jobs are skipped, and a running job is stopped by its worker. */
  async cancel(id: string, now = Date.now()): Promise<boolean> {
    if (!(await this.settings(id))) return false;
    await this.redis.hsetnx(this.k(id), 'cancelled', String(now));
    return true;
  }

  async isCancelled(id: string): Promise<boolean> {
    return (await this.redis.hexists(this.k(id), 'cancelled')) === 1;
  }

  async hits(id: string): Promise<Float64Array | null> {
    const b = await this.redis.hgetBuffer(this.k(id), 'hits');
    if (!b) return null;
    const out = new Float64Array(b.length / 8);
    for (let i = 0; i < out.length; i++) out[i] = b.readDoubleLE(8 * i);
    return out;
  }

  async status(id: string): Promise<ProbeRequestStatus | null> {
    const [s, created, measures, failed, done, cancelled] = await Promise.all([
      this.settings(id), this.redis.hget(this.k(id), 'created_at_ms'), this.redis.hget(this.k(id), 'measures'), this.redis.hget(this.k(id), 'failed'), this.redis.scard(this.k(id, 'done')),
      this.redis.hexists(this.k(id), 'cancelled'),
    ]);
    if (!s) return null;
    return {
      id, name: s.name, state: measures ? 'done' : cancelled ? 'cancelled' : failed ? 'failed' : 'running', createdAt: new Date(Number(created ?? 0)).toISOString(),
      dimension: s.dimension ?? 2, disks: s.disks, walkers: s.walkers, jobs: { planned: s.jobs, done }, failure: failed, measures: measures ? JSON.parse(measures) : null,
    };
  }

  async purge(id: string): Promise<void> {
    await this.redis.multi().del(this.k(id), this.k(id, 'done')).zrem(`${this.prefix}:probes`, id).exec();
  }
}

/** A fresh request id: "p" + base-36 time + 8 random hex digits. */
export function newProbeRequestId(now = Date.now()): string {
  return `p${now.toString(36)}${randomBytes(4).toString('hex')}`;
}

/** Record a request and queue its jobs (job ids "ID-J": queued once). */
export async function launchProbeRequest(store: ProbeRequestStore, queue: Queue, settings: ProbeRequestSettings, set: RequestSet, attempts = 5): Promise<string> {
  const id = newProbeRequestId();
  await store.create(id, settings, set);
  const tasks = planProbeRun(set, probeSetDigest(set), settings);
  const jobs = tasks.map((task) => ({
    name: 'probe',
    data: { v: JOB_PAYLOAD_VERSION, kind: 'probe', source: 'request', ensembleId: id, runIndex: 0, size: set.count, task } satisfies ProbeJobData,
    opts: { jobId: `${id}-${task.jobIndex}`, attempts, backoff: { type: 'exponential' as const, delay: 5000 }, removeOnComplete: { age: 7 * 86400, count: 10000 }, removeOnFail: { age: 30 * 86400 } },
  }));
  for (let i = 0; i < jobs.length; i += 500) await queue.addBulk(jobs.slice(i, i + 500));
  return id;
}
