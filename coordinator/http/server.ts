/**
 * The coordinator's HTTP API (fastify). Routes (JSON unless said otherwise):
 *
 *   POST /ensembles                  create: body = spec (JSON, or TOML with content-type
 *                                    application/toml); token required; 201 {id, status}
 *   GET  /ensembles                  list with status, newest first
 *   GET  /ensembles/:id              status: runs by state, particles done, throughput, ETA
 *   POST /ensembles/:id/cancel       cancel; token required
 *   GET  /ensembles/:id/summary?format=json|csv|pb[&table=NAME]
 *   GET  /sweeps                     sweeps with their totals, newest first
 *   GET  /sweeps/:id                 a sweep (POST /ensembles with a swept parameter answers
 *                                    {id, status: "/sweeps/ID", ensembles: [member ids]}): totals
 *                                    and each member's status
 *   GET  /sweeps/:id/summary?format=json|csv   the sweep's D(parameter) table (tendril.sweep/1)
 *   GET  /sweeps/:id/figure.svg      its D(parameter) plot (the web page of a sweep is /sweep/:id)
 *   POST /probes                     probe a point set of your own on the farm: body = {csv | points,
 *                                    walkers, seed, jobs?, q?, contact_sample?, min_step?, window?, name?};
 *                                    points with z ({x, y, z, r: one number}) are balls in 3D (e.g. a
 *                                    dla-offlattice-3d cluster); token required; 201 {id, status}
 *   GET  /probes/:id                 state, dimension, jobs done, and the harmonic measures once analysed
 *   GET  /probes/:id/hits            CSV index,x,y,r,hits,measure per disk (3D: index,x,y,z,r,hits,measure
 *                                    per ball, measure = share of the probes that hit) once analysed
 *   POST /probes/:id/cancel          cancel a probe request (also DELETE /probes/:id); token required:
 *                                    its queued jobs are skipped and running ones stopped within seconds
 *   GET  /, /view/:id, /web/*, /ensembles/:id/figures[/NAME.svg], /ensembles/:id/cluster.png
 *                                    the web status page (coordinator/http/web-routes.ts)
 *   GET  /metrics                    Prometheus text format
 *   GET  /health                     liveness: the process answers (never touches Redis)
 *   GET  /ready                      readiness: 200 {ok, redis: "ok"} when Redis answers within 2 s, else 503
 *
 * POST /ensembles accepts an Idempotency-Key header (1 to 128 printable characters): repeating the
 * request with the same key and spec returns the same ensemble (200) instead of creating another;
 * the same key with another spec is a 422 (coordinator/farm/idempotent-launch.ts).
 *
 * While Redis is unreachable, routes that need it answer 503 at once (the connection of `tendril serve`
 * fails fast: no offline queue, commands time out after 5 s).
 *
 * Errors: 4xx with {error: "<one line naming the field, value and what is allowed>"};
 * a bad spec also carries {problems: [...]}, one line per bad field.
 *
 * The route schemas document the API (OpenAPI style) and are what fastify
 * validates requests with: every schema is checked by
 * coordinator/spec/schema-messages.ts, and the spec body by the very checker
 * of `tendril run`/`launch` (built from the model descriptors), so the CLI and
 * the API give the same one-line messages. The bearer token is checked when
 * the request arrives, before its body is read.
 */
import { timingSafeEqual, createHash } from 'node:crypto';
import Fastify, { type FastifyInstance, type FastifyReply, type FastifyRequest } from 'fastify';
import type { Queue } from 'bullmq';
import type { Registry } from 'prom-client';
import { cancelEnsemble, launchEnsemble } from '../farm/queue.js';
import type { ArtifactStore } from '../farm/artifacts.js';
import { keptPositions, snapshotOf } from '../export/cluster-export.js';
import { modelDescriptor } from '../../worker/models/registry.js';
import type { EnsembleStore } from '../farm/store.js';
import { ENSEMBLE_ID_PATTERN } from '../plan.js';
import { parseSpecText, SpecError, SPEC_SCHEMA, type SpecLimits } from '../spec/index.js';
import { compileChecker } from '../spec/schema-messages.js';
import { nestingProblem } from '../spec/document-limits.js';
import { SummaryCache } from './summary-cache.js';
import { IDEMPOTENCY_KEY_PATTERN, IdempotencyConflict, idempotentEnsembleId, launchIdempotent } from '../farm/idempotent-launch.js';
import { launchSweep, readSweepStatus, sweepExists, sweepIds, sweepSummaryOf } from '../farm/sweeps.js';
import { launchDocumentProblems, validateLaunch } from '../spec/sweep.js';
import { sweepToCsv, sweepToJson } from '../summary/sweep-summary.js';
import { sweepFigure } from '../report/sweep-report.js';
import { launchProbeRequest, PROBE_REQUEST_SCHEMA, probeRequestProblems, ProbeRequestError, ProbeRequestStore, validateProbeRequest } from '../farm/probe-requests.js';
import { registerWebRoutes } from './web-routes.js';
import { isBallSet } from '../../worker/probe/probe-set.js';
import { ballHitsCsv, diskHitsCsv } from '../harmonic/hits-csv.js';
import { CSV_TABLE_NAMES, renderSummary, SUMMARY_FORMATS, type SummaryFormat, type SummaryOptions } from '../summary/index.js';
import { messageOf, TendrilError } from '../../proto/errors.js';

export interface ApiOptions {
  store: EnsembleStore;
  queue: Queue;
  /** Bearer token for creating and cancelling; when absent those routes are refused. */
  token?: string;
  limits: SpecLimits;
  registry?: Registry;
  /** Largest request body in bytes (default 64 KiB). */
  bodyLimit?: number;
  /** Largest probe-request body in bytes (default 128 MiB: point sets are large). */
  probeBodyLimit?: number;
  /**
   * Summary options; default defaultSummaryOptions() (the full analysis, with the spec's [analysis] settings),
   * computed on a thread. Options given here are applied on the main thread.
   */
  summary?: SummaryOptions;
  logger?: boolean;
  /** The workers' artifact store (final positions of specs with [positions] or [probe]); without it snapshot downloads answer 404. */
  artifacts?: ArtifactStore;
}

/** A "__proto__" key, or a "constructor" key holding "prototype", in a JSON body. */
class PrototypeKey extends Error {}

function refusePrototypeKeys(this: unknown, key: string, value: unknown): unknown {
  if (key === '__proto__' || (key === 'constructor' && typeof value === 'object' && value !== null && Object.prototype.hasOwnProperty.call(value, 'prototype'))) {
    throw new PrototypeKey('body: a "__proto__" or "constructor" key is not allowed; allowed: a JSON object of the documented fields');
  }
  return value;
}

/** A request body sent as TOML (content type application/toml or text/toml). */
class TomlBody {
  constructor(readonly text: string) {}
}

class ApiError extends TendrilError {
  readonly kind = 'request';
  constructor(
    readonly status: number,
    message: string,
    readonly problems?: string[],
  ) {
    super(message);
  }
}

const STATUS_SCHEMA = {
  type: 'object',
  properties: {
    id: { type: 'string' },
    name: { type: 'string' },
    state: { type: 'string', enum: ['running', 'done', 'failed', 'cancelled'] },
    createdAt: { type: 'string' },
    runs: {
      type: 'object',
      properties: { planned: { type: 'integer' }, queued: { type: 'integer' }, running: { type: 'integer' }, done: { type: 'integer' }, failed: { type: 'integer' } },
    },
    particles: { type: 'object', properties: { done: { type: 'number' }, total: { type: 'number' } } },
    throughput: { type: 'number', description: 'particles per second over the last minute' },
    etaSeconds: { type: ['number', 'null'] },
    failures: { type: 'array', items: { type: 'object', properties: { runIndex: { type: 'integer' }, reason: { type: 'string' } } } },
    adaptive: {
      type: ['object', 'null'],
      description: 'adaptive ensembles: outcome (running, target-reached, cap-reached), batches planned, cluster cap',
      properties: { outcome: { type: 'string' }, batches: { type: 'integer' }, maxClusters: { type: 'integer' } },
    },
    probes: {
      type: ['object', 'null'],
      description: 'ensembles with [probe]: (run, size) probes planned, analysed and failed',
      properties: {
        planned: { type: 'integer' }, done: { type: 'integer' }, failed: { type: 'integer' },
        failures: { type: 'array', items: { type: 'object', properties: { runIndex: { type: 'integer' }, size: { type: 'integer' }, reason: { type: 'string' } } } },
      },
    },
  },
} as const;

const ERROR_SCHEMA = { type: 'object', properties: { error: { type: 'string' }, problems: { type: 'array', items: { type: 'string' } } } } as const;
const ID_PARAMS = { type: 'object', required: ['id'], properties: { id: { type: 'string', pattern: ENSEMBLE_ID_PATTERN.source, $comment: '1 to 64 letters, digits, _ or -' } } } as const;

function digest(s: string): Buffer {
  return createHash('sha256').update(s).digest();
}

export function buildApi(o: ApiOptions): FastifyInstance {
  // ids longer than find-my-way's default 100 characters reach checkId, which says what is allowed
  const app = Fastify({ logger: o.logger ?? false, bodyLimit: o.bodyLimit ?? 65536, maxParamLength: 2048 });
  // Route schemas are validated with our one-line messages; the spec body with the spec's own checker.
  // Documents nested too deep are refused first (no checker ever walks them).
  app.setValidatorCompiler(({ schema }) => {
    const id = (schema as { $id?: string }).$id;
    const isSpec = id === SPEC_SCHEMA.$id;
    const isBody = isSpec || id === PROBE_REQUEST_SCHEMA.$id;
    const check = isSpec ? launchDocumentProblems : id === PROBE_REQUEST_SCHEMA.$id ? probeRequestProblems : compileChecker(schema);
    return (data: unknown) => {
      const deep = isBody ? nestingProblem(data, isSpec ? 'spec' : 'body') : null;
      const problems = deep !== null ? [deep] : check(data);
      if (problems.length === 0) return { value: data };
      return { error: new ApiError(400, problems.length === 1 ? problems[0] : `${problems[0]} (and ${problems.length - 1} more, listed in "problems")`, problems) };
    };
  });
  // JSON bodies: parsed natively; a "__proto__" key, or "constructor" holding "prototype", is refused by name
  // (escaped keys too: the reviver sees decoded keys; it only runs when the text could hold such a key)
  app.addContentTypeParser('application/json', { parseAs: 'string' }, (_req, body, done) => {
    const text = body as string;
    if (text.trim() === '') return done(Object.assign(new Error('body: empty; allowed: a JSON object'), { statusCode: 400 }), undefined);
    try {
      const suspicious = /\\u|proto|constructor/.test(text);
      done(null, suspicious ? JSON.parse(text, refusePrototypeKeys) : JSON.parse(text));
    } catch (err) {
      if (err instanceof PrototypeKey) return done(Object.assign(new Error(err.message), { statusCode: 400 }), undefined);
      const e = err as Error & { statusCode?: number };
      e.statusCode = 400;
      done(e, undefined);
    }
  });
  // a TOML body arrives as a TomlBody (a JSON body {"toml": ...} is an ordinary, invalid, spec)
  app.addContentTypeParser(['application/toml', 'text/toml'], { parseAs: 'string' }, (_req, body, done) => done(null, new TomlBody(body as string)));

  app.setErrorHandler((err: Error & { statusCode?: number; code?: string }, _req, reply) => {
    if (err instanceof ApiError) return reply.code(err.status).send(err.problems ? { error: err.message, problems: err.problems } : { error: err.message });
    if (isRedisUnavailable(err)) return reply.code(503).header('retry-after', '5').send({ error: `redis: unavailable (${messageOf(err).slice(0, 120)}); allowed: retry once GET /ready answers 200` });
    const status = err.statusCode && err.statusCode >= 400 && err.statusCode < 500 ? err.statusCode : 500;
    let msg = messageOf(err);
    if (err.code === 'FST_ERR_CTP_BODY_TOO_LARGE') msg = `body: larger than ${o.bodyLimit ?? 65536} bytes; allowed: at most ${o.bodyLimit ?? 65536} bytes`;
    if (err.code === 'FST_ERR_CTP_INVALID_MEDIA_TYPE') msg = 'content-type: not supported; allowed: application/json or application/toml';
    if (err.code === 'FST_ERR_CTP_EMPTY_JSON_BODY') msg = 'body: empty; allowed: an ensemble spec';
    if (err.code === 'FST_ERR_CTP_INVALID_JSON_BODY' || err instanceof SyntaxError) msg = `body: not valid JSON (${msg})`;

    return reply.code(status).send({ error: status === 500 ? `internal error: ${msg}` : msg });
  });
  app.setNotFoundHandler((req, reply) => {
    const path = req.url.split('?')[0];
    return reply.code(404).send({ error: `${req.method} ${path.length > 80 ? `${path.slice(0, 77)}...` : path}: no such route` });
  });

  const expected = o.token ? digest(o.token) : undefined;
  const requireToken = async (req: FastifyRequest, reply: FastifyReply) => {
    if (!expected) throw new ApiError(403, 'authorization: this server has no API token configured, so creating and cancelling are disabled; allowed: start it with TENDRIL_API_TOKEN or --token-file');
    const h = req.headers.authorization;
    const m = typeof h === 'string' ? /^Bearer ([^\s]+)$/.exec(h) : null;
    if (!m) {
      reply.header('www-authenticate', 'Bearer');
      throw new ApiError(401, 'authorization: missing; allowed: a header "Authorization: Bearer <token>"');
    }
    if (!timingSafeEqual(digest(m[1]), expected)) {
      reply.header('www-authenticate', 'Bearer error="invalid_token"');
      throw new ApiError(401, 'authorization: the bearer token is not valid');
    }
  };

  const checkId = (id: string) => {
    if (!ENSEMBLE_ID_PATTERN.test(id)) throw new ApiError(400, `id: ${JSON.stringify(id.slice(0, 80))} is not allowed; allowed: 1 to 64 letters, digits, _ or -`);
  };
  const status = async (id: string) => {
    checkId(id);
    const s = await o.store.status(id);
    if (!s) throw new ApiError(404, `id: "${id}" is not an ensemble of this farm`);
    return s;
  };

  app.get('/health', async () => ({ ok: true }));

  app.get('/ready', async (_req, reply) => {
    let timer: NodeJS.Timeout | undefined;
    try {
      const pong = await Promise.race([
        o.store.redis.ping(),
        new Promise<never>((_, reject) => {
          timer = setTimeout(() => reject(new Error('no answer within 2 s')), 2000);
        }),
      ]);
      if (pong !== 'PONG') throw new Error(`unexpected answer ${JSON.stringify(String(pong).slice(0, 40))}`);
      return { ok: true, redis: 'ok' };
    } catch (err) {
      return reply.code(503).send({ error: `redis: not ready (${messageOf(err).slice(0, 120)})`, redis: 'unavailable' });
    } finally {
      clearTimeout(timer);
    }
  });

  // summaries: once per ensemble state, computed on a thread (see summary-cache.ts)
  const summaries = new SummaryCache(o.store, o.summary);
  app.addHook('onClose', async () => summaries.close());

  app.post(
    '/ensembles',
    {
      onRequest: requireToken,
      // a TOML body becomes the spec document before it is validated
      preValidation: async (req) => {
        const doc: unknown = req.body;
        if (!(doc instanceof TomlBody)) return;
        try {
          req.body = parseSpecText(doc.text, 'toml');
        } catch (err) {
          if (err instanceof SpecError) throw new ApiError(400, err.problems[0], err.problems);
          throw err;
        }
      },
      schema: {
        body: SPEC_SCHEMA,
        headers: { type: 'object', properties: { 'idempotency-key': { type: 'string', description: 'repeat-safe creation: the same key and spec give the same ensemble (200 on a repeat)' } } },
        response: {
          200: { type: 'object', properties: { id: { type: 'string' }, status: { type: 'string' }, ensembles: { type: 'array', items: { type: 'string' }, description: 'a sweep: its member ensembles, in order of value' } } },
          201: { type: 'object', properties: { id: { type: 'string' }, status: { type: 'string' }, ensembles: { type: 'array', items: { type: 'string' }, description: 'a sweep: its member ensembles, in order of value' } } },
          400: ERROR_SCHEMA, 401: ERROR_SCHEMA, 422: ERROR_SCHEMA, 503: ERROR_SCHEMA,
        },
      },
    },
    async (req, reply) => {
      try {
        const key = req.headers['idempotency-key'];
        if (key !== undefined && (typeof key !== 'string' || !IDEMPOTENCY_KEY_PATTERN.test(key))) {
          throw new ApiError(400, `idempotency-key: ${JSON.stringify(String(key).slice(0, 40))} is not allowed; allowed: 1 to 128 printable characters without spaces`);
        }
        const launchable = validateLaunch(req.body, o.limits);
        if (launchable.kind === 'sweep') {
          const got = await launchSweep(o.store, o.queue, launchable.sweep, typeof key === 'string' ? { idempotencyKey: key } : {});
          return reply.code(got.created ? 201 : 200).send({ id: got.id, status: `/sweeps/${got.id}`, ensembles: got.memberIds });
        }
        const spec = launchable.spec;
        if (typeof key === 'string' && (await sweepExists(o.store, idempotentEnsembleId(o.store.prefix, key)))) {
          throw new IdempotencyConflict('idempotency-key: used before for a sweep; allowed: a new key for a single ensemble');
        }
        if (typeof key === 'string') {
          const got = await launchIdempotent(o.store, o.queue, spec, key);
          return reply.code(got.created ? 201 : 200).send({ id: got.id, status: `/ensembles/${got.id}` });
        }
        const id = await launchEnsemble(o.store, o.queue, spec);
        return reply.code(201).send({ id, status: `/ensembles/${id}` });
      } catch (err) {
        if (err instanceof IdempotencyConflict) throw new ApiError(422, err.message);
        if (err instanceof SpecError) throw new ApiError(400, err.problems.length === 1 ? err.problems[0] : `${err.problems[0]} (and ${err.problems.length - 1} more, listed in "problems")`, err.problems);
        throw err;
      }
    },
  );

  app.get('/ensembles', { schema: { response: { 200: { type: 'object', properties: { ensembles: { type: 'array', items: STATUS_SCHEMA } } } } } }, async () => {
    // all statuses in one transaction (EnsembleStore.statuses), not one ensemble after another
    return { ensembles: await o.store.recentStatuses(100) };
  });

  app.get<{ Params: { id: string } }>(
    '/ensembles/:id',
    { schema: { params: ID_PARAMS, response: { 200: STATUS_SCHEMA, 404: ERROR_SCHEMA } } },
    async (req) => status(req.params.id),
  );

  app.post<{ Params: { id: string } }>(
    '/ensembles/:id/cancel',
    { onRequest: requireToken, schema: { params: ID_PARAMS, response: { 404: ERROR_SCHEMA, 401: ERROR_SCHEMA, 409: ERROR_SCHEMA } } },
    async (req) => {
      checkId(req.params.id);
      const outcome = await cancelEnsemble(o.store, o.queue, req.params.id);
      if (outcome === 'unknown') throw new ApiError(404, `id: "${req.params.id}" is not an ensemble of this farm`);
      if (outcome === 'finished') {
        const st = await o.store.status(req.params.id);
        throw new ApiError(409, `id: "${req.params.id}" has already finished (state ${st?.state ?? 'done'}); there is nothing to cancel`);
      }
      return { id: req.params.id, cancelled: true, alreadyCancelled: outcome === 'already-cancelled' };
    },
  );

  app.get('/sweeps', async () => {
    // newest first, as GET /ensembles
    const all = await Promise.all((await sweepIds(o.store.reads, o.store.prefix, 100)).map((id) => readSweepStatus(o.store.reads, o.store.prefix, id)));
    return { sweeps: all.filter((s) => s !== null) };
  });

  app.get<{ Params: { id: string } }>('/sweeps/:id', { schema: { params: ID_PARAMS, response: { 404: ERROR_SCHEMA } } }, async (req) => {
    checkId(req.params.id);
    const s = await readSweepStatus(o.store.reads, o.store.prefix, req.params.id);
    if (!s) throw new ApiError(404, `id: "${req.params.id}" is not a sweep of this farm`);
    return s;
  });

  app.get<{ Params: { id: string } }>('/sweeps/:id/figure.svg', { schema: { params: ID_PARAMS, response: { 404: ERROR_SCHEMA } } }, async (req, reply) => {
    checkId(req.params.id);
    const got = await sweepSummaryOf(o.store, req.params.id, (mid) => summaries.get(mid));
    if (!got) throw new ApiError(404, `id: "${req.params.id}" is not a sweep of this farm`);
    return reply.header('content-type', 'image/svg+xml; charset=utf-8').send(sweepFigure(got.summary).svg);
  });

  app.get<{ Params: { id: string }; Querystring: { format?: string } }>(
    '/sweeps/:id/summary',
    { schema: { params: ID_PARAMS, querystring: { type: 'object', properties: { format: { type: 'string', enum: ['json', 'csv'] } } }, response: { 404: ERROR_SCHEMA } } },
    async (req, reply) => {
      checkId(req.params.id);
      const format = req.query.format ?? 'json';
      // member summaries from the cache: built once per member state, off the event loop
      const got = await sweepSummaryOf(o.store, req.params.id, (mid) => summaries.get(mid));
      if (!got) throw new ApiError(404, `id: "${req.params.id}" is not a sweep of this farm`);
      return reply
        .header('content-type', format === 'csv' ? 'text/csv; charset=utf-8' : 'application/json; charset=utf-8')
        .header('content-disposition', `attachment; filename="${got.record.id}-sweep.${format}"`)
        .header('x-summary-partial', got.summary.partial ? 'true' : 'false')
        .send(format === 'csv' ? sweepToCsv(got.summary) : sweepToJson(got.summary));
    },
  );

  app.get<{ Params: { id: string }; Querystring: { format?: string; table?: string } }>(
    '/ensembles/:id/summary',
    {
      schema: {
       
        params: ID_PARAMS,
        querystring: { type: 'object', properties: { format: { type: 'string', enum: SUMMARY_FORMATS }, table: { type: 'string', description: 'CSV table (format=csv)' } } },
      },
    },
    async (req, reply) => {
      const format = req.query.format ?? 'json';
      if (!SUMMARY_FORMATS.includes(format as SummaryFormat)) throw new ApiError(400, `format: ${JSON.stringify(format.slice(0, 40))} is not allowed; allowed: one of "json", "csv", "pb"`);
      const table = req.query.table ?? 'series';
      if (!CSV_TABLE_NAMES.includes(table)) throw new ApiError(400, `table: ${JSON.stringify(table.slice(0, 40))} is not allowed; allowed: one of ${CSV_TABLE_NAMES.map((t) => JSON.stringify(t)).join(', ')}`);
      checkId(req.params.id);
      const got = await summaries.get(req.params.id);
      if (!got) throw new ApiError(404, `id: "${req.params.id}" is not an ensemble of this farm`);
      const type = format === 'pb' ? 'application/x-protobuf' : format === 'csv' ? 'text/csv; charset=utf-8' : 'application/json; charset=utf-8';
      const name = format === 'csv' ? `${got.record.id}-${table}.csv` : `${got.record.id}-summary.${format}`;
      return reply
        .header('content-type', type)
        .header('content-disposition', `attachment; filename="${name}"`)
        .header('x-summary-partial', got.summary.partial ? 'true' : 'false')
        .send(Buffer.from(renderSummary(got.summary, format as SummaryFormat, table)));
    },
  );

  app.get<{ Params: { id: string; run: string }; Querystring: { size?: string } }>(
    '/ensembles/:id/runs/:run/snapshot',
    {
      schema: {
        params: { type: 'object', required: ['id', 'run'], properties: { id: ID_PARAMS.properties.id, run: { type: 'string', pattern: '^[0-9]{1,9}$' } } },
        querystring: { type: 'object', properties: { size: { type: 'string', description: 'the cluster at this many particles (a prefix of the final one); default the final size' } } },
      },
    },
    async (req, reply) => {
      checkId(req.params.id);
      const rec = await o.store.get(req.params.id);
      if (!rec) throw new ApiError(404, `id: "${req.params.id}" is not an ensemble of this farm`);
      const run = Number(req.params.run);
      if (!/^[0-9]{1,9}$/.test(req.params.run) || run >= rec.plannedClusters) {
        throw new ApiError(404, `run: ${JSON.stringify(req.params.run.slice(0, 20))} is not a run of ${req.params.id}; allowed: an integer from 0 to ${rec.plannedClusters - 1}`);
      }
      if (!rec.spec.positions && !rec.spec.probe) throw new ApiError(404, `run ${run}: its ensemble keeps no positions; allowed: ensembles whose spec has a [positions] table`);
      const pos = o.artifacts ? await keptPositions(o.artifacts, req.params.id, run) : null;
      if (!pos) throw new ApiError(404, `run ${run}: no positions are kept for it${o.artifacts ? ' (not finished yet)' : ' (this server was started without the artifact folder)'}`);
      let size = pos.count;
      if (req.query.size !== undefined) {
        size = Number(req.query.size);
        if (!/^[0-9]{1,12}$/.test(req.query.size) || size < 1 || size > pos.count) throw new ApiError(400, `size: ${JSON.stringify(req.query.size.slice(0, 20))} is not allowed; allowed: an integer from 1 to ${pos.count}`);
      }
      return reply
        .header('content-type', 'application/octet-stream')
        .header('content-disposition', `attachment; filename="${req.params.id}-run-${run}${size === pos.count ? '' : `-n${size}`}.snapshot"`)
        .send(snapshotOf(pos, modelDescriptor(rec.spec.model.kind).contactDistance, size));
    },
  );

  const probeStore = new ProbeRequestStore(o.store.redis, o.store.prefix);
  const probeLimit = o.probeBodyLimit ?? 128 * 1024 * 1024;
  const probeStatus = async (id: string) => {
    checkId(id);
    const s = await probeStore.status(id);
    if (!s) throw new ApiError(404, `id: "${id}" is not a probe request of this farm`);
    return s;
  };

  app.post(
    '/probes',
    { onRequest: requireToken, bodyLimit: probeLimit, schema: { body: PROBE_REQUEST_SCHEMA, response: { 201: { type: 'object', properties: { id: { type: 'string' }, status: { type: 'string' } } }, 400: ERROR_SCHEMA, 401: ERROR_SCHEMA } } },
    async (req, reply) => {
      let v;
      try {
        v = validateProbeRequest(req.body);
        if (v.settings.walkers > o.limits.maxTotalParticles) {
          throw new ProbeRequestError(`walkers: ${v.settings.walkers} is above the total-work ceiling; allowed: at most ${o.limits.maxTotalParticles} (a walker counts as one particle; the operator may raise it with TENDRIL_MAX_TOTAL_PARTICLES)`);
        }
      } catch (err) {
        if (err instanceof ProbeRequestError) throw new ApiError(400, err.message);
        throw err;
      }
      const id = await launchProbeRequest(probeStore, o.queue, v.settings, v.set);
      return reply.code(201).send({ id, status: `/probes/${id}` });
    },
  );

  app.get<{ Params: { id: string } }>('/probes/:id', { schema: { params: ID_PARAMS, response: { 404: ERROR_SCHEMA } } }, async (req) => probeStatus(req.params.id));

  const cancelProbe = async (req: FastifyRequest<{ Params: { id: string } }>) => {
    checkId(req.params.id);
    if (!(await probeStore.cancel(req.params.id))) throw new ApiError(404, `id: "${req.params.id}" is not a probe request of this farm`);
    return { id: req.params.id, cancelled: true };
  };
  app.post<{ Params: { id: string } }>('/probes/:id/cancel', { onRequest: requireToken, schema: { params: ID_PARAMS, response: { 404: ERROR_SCHEMA, 401: ERROR_SCHEMA } } }, cancelProbe);
  app.delete<{ Params: { id: string } }>('/probes/:id', { onRequest: requireToken, schema: { params: ID_PARAMS, response: { 404: ERROR_SCHEMA, 401: ERROR_SCHEMA } } }, cancelProbe);

  app.get<{ Params: { id: string } }>('/probes/:id/hits', { schema: { params: ID_PARAMS, response: { 404: ERROR_SCHEMA } } }, async (req, reply) => {
    const s = await probeStatus(req.params.id);
    const [set, hits] = await Promise.all([probeStore.set(s.id), probeStore.hits(s.id)]);
    if (!set || !hits) throw new ApiError(409, `id: "${s.id}" is not analysed yet (state ${s.state}, ${s.jobs.done} of ${s.jobs.planned} jobs done)`);
    // the table `tendril probe` writes (in 3D the measure is the share of the probes that hit: a probe may escape)
    const csv = isBallSet(set) ? ballHitsCsv(set.count, set.x, set.y, set.z, set.radius, hits) : diskHitsCsv(set.count, set.x, set.y, set.r, hits, s.walkers);
    return reply.header('content-type', 'text/csv; charset=utf-8').header('content-disposition', `attachment; filename="${s.id}-hits.csv"`).send(csv);
  });

  registerWebRoutes(app, { store: o.store, summary: o.summary });

  app.get('/metrics', async (_req, reply) => {
    if (!o.registry) throw new ApiError(404, 'GET /metrics: metrics are not enabled');
    return reply.header('content-type', o.registry.contentType).send(await o.registry.metrics());
  });

  return app;
}

/** Errors of a Redis that is down or too slow (ioredis and its fail-fast options), answered 503. */
export function isRedisUnavailable(err: Error & { code?: string }): boolean {
  return (
    /max retries per request|Stream isn't writeable|Command timed out|Connection is closed|enableOfflineQueue|ECONNREFUSED|ECONNRESET|EPIPE|ETIMEDOUT|LOADING Redis is loading/.test(err.message ?? '') ||
    ['ECONNREFUSED', 'ECONNRESET', 'EPIPE', 'ETIMEDOUT'].includes(err.code ?? '')
  );
}

/** True for addresses that only this machine can reach. */
export function isLoopback(host: string): boolean {
  return host === 'localhost' || host === '::1' || /^127\.\d+\.\d+\.\d+$/.test(host);
}
