/**
 * Hostile-input fuzzing (issue #11, "keep it fixed"): thousands of seeded,
 * generated specs, probe requests and HTTP requests, including the shapes of
 * the audit (float-defeating parameters, huge and tiny geometry, deep
 * nesting, many unknown keys, keys with newlines and terminal escapes,
 * oversized bodies, missing tokens). Asserted for every input:
 *  - no crash: validation either accepts or throws its own one-line error;
 *  - no 5xx, and an answer to every HTTP request (a request without one
 *    within 15 s counts as a hang);
 *  - every refusal is one line, of bounded length, naming a field first
 *    ("FIELD: ..."), with no control characters.
 * The generator is seeded (mulberry32), so a failure names the case number
 * that reproduces it. Counts are fixed; nothing depends on speed.
 */
import { validateLaunch } from '../coordinator/spec/sweep.js';
import { Redis } from 'ioredis';
import { afterAll, describe, expect, it } from 'vitest';
import type { InjectOptions } from 'fastify';
import { runQueue } from '../coordinator/farm/queue.js';
import { EnsembleStore } from '../coordinator/farm/store.js';
import { ProbeRequestError, validateProbeRequest } from '../coordinator/farm/probe-requests.js';
import { buildApi } from '../coordinator/http/server.js';
import { parseSpecText, SpecError, validateSpec } from '../coordinator/spec/index.js';
import { deleteKeys, REDIS_URL, uniquePrefix } from './farm-helpers.js';

const SEED = 20261203;
const SPECS = 3000;
const PROBES = 4000;
const REQUESTS = 4000;

const TOKEN = 'fuzz-hostile-token-0123456789';
const prefix = uniquePrefix('fuzz');
const redis = new Redis(REDIS_URL, { maxRetriesPerRequest: null });
const store = new EnsembleStore(redis, prefix);
const queue = runQueue(redis, prefix);
// a small ceiling keeps accepted work small; a 1 MiB body limit lets large hostile bodies reach the validators
const app = buildApi({ store, queue, token: TOKEN, limits: { maxTotalParticles: 2_000_000 }, bodyLimit: 1 << 20, probeBodyLimit: 1 << 20 });

afterAll(async () => {
  await app.close();
  await queue.obliterate({ force: true }).catch(() => undefined);
  await queue.close();
  await deleteKeys(redis, prefix);
  redis.disconnect();
});

/** Seeded uniform numbers in [0, 1) (mulberry32). */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const NUMBERS = [0, -0, 1, -1, 2, 0.5, 1e-15, 1e-300, 5e-324, 1e15, 1e300, 1.7976931348623157e308, -1e308, 2 ** 53, 2 ** 53 + 2, 2 ** 64, 0.1, 99.999, 1e10, 4096, 100_000_001, -(2 ** 31)];
const STRINGS = ['', ' ', 'x', '1', '1e-15', 'NaN', 'Infinity', '-0', '18446744073709551616', 'a\nb', 'k\u001b[31mred', '\u0000', '\u202e', 'é', '𝔘', '"quoted"', '../../etc/passwd', 'x'.repeat(5000), '__proto__', 'constructor', '{"toml":1}', 'model = "x"'];
const KEYS = ['model', 'params', 'particles', 'clusters', 'seed', 'name', 'records_per_decade', 'observables', 'checkpoint_interval_seconds', 'checkpoint_every_particles', 'runs_per_job', 'analysis', 'probe', 'target', 'toml', 'bad\nkey', 'k\u001b]0;x\u0007', '__proto__', 'constructor', 'prototype', ''];

function nested(depth: number, leaf: unknown, asArray: boolean): unknown {
  let v: unknown = leaf;
  for (let i = 0; i < depth; i++) v = asArray ? [v] : { a: v };
  return v;
}

/** A hostile JSON value; `depth` bounds the ordinary recursion (deep nesting is made on purpose, iteratively). */
function hostileValue(r: () => number, depth = 0): unknown {
  const k = Math.floor(r() * 12);
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(r() * xs.length)];
  switch (k) {
    case 0: return pick(NUMBERS);
    case 1: return pick(STRINGS);
    case 2: return r() < 0.5;
    case 3: return null;
    case 4: return nested(r() < 0.3 ? 6000 : 40, pick(NUMBERS), r() < 0.5);
    case 5: return new Array(Math.floor(r() * (depth === 0 && r() < 0.1 ? 200_000 : 5))).fill(pick(NUMBERS));
    case 6: {
      if (depth > 3) return 1;
      const o: Record<string, unknown> = {};
      const n = depth === 0 && r() < 0.1 ? 7000 : Math.floor(r() * 5);
      // many keys with plain values (the audit's 6,657 unknown keys), or a few keys with hostile values
      for (let i = 0; i < n; i++) o[n > 100 ? `k${i}` : pick(KEYS)] = n > 100 ? i : hostileValue(r, depth + 1);
      return o;
    }
    case 7: return Math.floor(r() * 1e6);
    case 8: return r() * 2 - 1;
    case 9: return -Math.floor(r() * 100);
    case 10: return [pick(NUMBERS), pick(STRINGS)];
    default: return { min_step: pick(NUMBERS), launch_margin: pick(NUMBERS) };
  }
}

const VALID_SPEC = { model: 'dla-offlattice-2d', particles: 50, clusters: 2, seed: 1 };

/** A spec: the valid one with fields replaced, added or removed, or a hostile value outright. */
function hostileSpec(r: () => number): unknown {
  if (r() < 0.1) return hostileValue(r);
  const doc: Record<string, unknown> = { ...VALID_SPEC };
  const edits = 1 + Math.floor(r() * 3);
  for (let i = 0; i < edits; i++) {
    const key = KEYS[Math.floor(r() * KEYS.length)];
    if (r() < 0.15) delete doc[key];
    else if (key === 'params' && r() < 0.4) {
      // a sweep (coordinator/spec/sweep.ts): a list or a from/to/step table, of hostile or plain values, sometimes two swept parameters
      const swept = () => (r() < 0.5 ? Array.from({ length: Math.floor(r() * 70) }, () => (r() < 0.8 ? 0.01 * (1 + Math.floor(r() * 100)) : hostileValue(r))) : { from: r() < 0.7 ? 0.01 : hostileValue(r), to: r() < 0.7 ? 1 : hostileValue(r), step: r() < 0.7 ? 0.1 * r() : hostileValue(r), ...(r() < 0.1 ? { [KEYS[Math.floor(r() * KEYS.length)]]: 1 } : {}) });
      doc.params = { min_step: swept(), ...(r() < 0.3 ? { launch_margin: r() < 0.5 ? swept() : hostileValue(r) } : {}) };
    } else if (key === 'params') doc.params = { min_step: NUMBERS[Math.floor(r() * NUMBERS.length)], ...(r() < 0.3 ? { launch_margin: hostileValue(r) } : {}) };
    else if (key === 'probe') doc.probe = { walkers: r() < 0.5 ? 1e10 : hostileValue(r), at_sizes: r() < 0.5 ? Array.from({ length: 24 }, (_, j) => 2 + j) : hostileValue(r), min_step: r() < 0.5 ? 1e-300 : 0.02 };
    else if (key === 'analysis') doc.analysis = { resamples: r() < 0.5 ? 1_000_000 : hostileValue(r) };
    else if (key === 'target') doc.target = { half_width: hostileValue(r), max_clusters: hostileValue(r), min_clusters: hostileValue(r) };
    else doc[key] = hostileValue(r);
  }
  return doc;
}

/** A probe request around the audit's shapes. */
function hostileProbe(r: () => number): unknown {
  if (r() < 0.1) return hostileValue(r);
  const pickN = () => NUMBERS[Math.floor(r() * NUMBERS.length)];
  const body: Record<string, unknown> = { walkers: r() < 0.7 ? 100 + Math.floor(r() * 1000) : hostileValue(r), seed: r() < 0.8 ? 1 : hostileValue(r) };
  if (r() < 0.3) body.jobs = r() < 0.5 ? 2 : hostileValue(r);
  if (r() < 0.2) body.min_step = r() < 0.5 ? pickN() : hostileValue(r);
  if (r() < 0.1) body.q = hostileValue(r);
  if (r() < 0.6) {
    const n = 1 + Math.floor(r() * 4);
    body.points = {
      x: Array.from({ length: n }, (_, i) => (r() < 0.3 ? pickN() : 2 * i)),
      y: r() < 0.9 ? Array.from({ length: n }, () => (r() < 0.2 ? pickN() : 0)) : hostileValue(r),
      r: r() < 0.5 ? (r() < 0.5 ? 1 : pickN()) : Array.from({ length: r() < 0.9 ? n : n + 1 }, () => (r() < 0.3 ? pickN() : 1)),
    };
  } else if (r() < 0.8) {
    const rows = Array.from({ length: 1 + Math.floor(r() * 4) }, (_, i) => (r() < 0.3 ? `${pickN()},${pickN()},${pickN()}` : `${2 * i},0,1`));
    body.csv = r() < 0.1 ? rows.join('\n') + '\n' + STRINGS[Math.floor(r() * STRINGS.length)] : rows.join('\n');
  } else body.points = hostileValue(r);
  if (r() < 0.1) body[KEYS[Math.floor(r() * KEYS.length)]] = hostileValue(r);
  return body;
}

const failures: string[] = [];
const note = (line: string) => {
  if (failures.length < 40) failures.push(line);
};

/** A refusal must be one bounded line, free of control characters, naming a field first. */
/** JSON text of a value; values nested too deep for JSON.stringify become a hand-built deep document. */
function jsonText(v: unknown): string {
  try {
    return JSON.stringify(v) ?? 'null';
  } catch {
    return '{"a":'.repeat(6000) + '1' + '}'.repeat(6000);
  }
}

function checkRefusal(where: string, message: unknown): void {
  if (typeof message !== 'string') return note(`${where}: refusal is not a string: ${String(message).slice(0, 100)}`);
  // eslint-disable-next-line no-control-regex
  if (/[\u0000-\u001f\u007f-\u009f]/.test(message)) note(`${where}: refusal holds a control character: ${JSON.stringify(message.slice(0, 200))}`);
  if (message.length > 2000) note(`${where}: refusal of ${message.length} characters`);
  const colon = message.indexOf(': ');
  if (colon < 1 || colon > 200) note(`${where}: refusal does not name a field first: ${JSON.stringify(message.slice(0, 200))}`);
}

describe(`hostile inputs (seed ${SEED})`, () => {
  it(`${SPECS} specs: accepted or refused with one line per problem, nothing else thrown`, () => {
    failures.length = 0;
    const r = rng(SEED);
    for (let i = 0; i < SPECS; i++) {
      const doc = hostileSpec(r);
      try {
        // validateLaunch: validateSpec for a single spec, the sweep checks for a swept parameter
        validateLaunch(doc, { maxTotalParticles: 1e10 });
      } catch (err) {
        if (!(err instanceof SpecError)) {
          note(`spec ${i}: threw ${(err as Error)?.name}: ${String((err as Error)?.message).slice(0, 200)}`);
          continue;
        }
        for (const p of err.problems) checkRefusal(`spec ${i}`, p);
      }
    }
    expect(failures).toEqual([]);
  }, 300_000);

  it(`${PROBES} probe requests: accepted or refused with one line, nothing else thrown`, () => {
    failures.length = 0;
    const r = rng(SEED + 1);
    for (let i = 0; i < PROBES; i++) {
      try {
        validateProbeRequest(hostileProbe(r));
      } catch (err) {
        if (!(err instanceof ProbeRequestError)) note(`probe ${i}: threw ${(err as Error)?.name}: ${String((err as Error)?.message).slice(0, 200)}`);
        else checkRefusal(`probe ${i}`, err.message);
      }
    }
    expect(failures).toEqual([]);
  }, 300_000);

  it('TOML documents nested deep or malformed are one line', () => {
    failures.length = 0;
    const docs = ['a = ' + '{a = '.repeat(5000) + '1' + '}'.repeat(5000), 'x = [' + '['.repeat(5000) + ']'.repeat(5001), '[[[', 'model = "dla-offlattice-2d"\nparticles = 1e999', 'k\u001b = 1'];
    for (const [i, text] of docs.entries()) {
      try {
        validateSpec(parseSpecText(text, 'toml'));
      } catch (err) {
        if (!(err instanceof SpecError)) note(`toml ${i}: threw ${(err as Error)?.name}`);
        else for (const p of err.problems) checkRefusal(`toml ${i}`, p);
      }
    }
    expect(failures).toEqual([]);
  });

  it(`${REQUESTS} HTTP requests: no 5xx, no hang, every 4xx one line naming a field`, async () => {
    failures.length = 0;
    const r = rng(SEED + 2);
    const pick = <T>(xs: readonly T[]): T => xs[Math.floor(r() * xs.length)];
    const ids = ['e1', 'enothere', 'p1', '..%2f..%2fetc', 'x'.repeat(200), '%00', '%0a', 'a b', '__proto__', ''];
    const contentTypes = ['application/json', 'application/toml', 'text/toml', 'text/plain', 'application/x-www-form-urlencoded', 'application/json; charset=latin1', 'multipart/form-data'];
    let hung = 0;
    for (let i = 0; i < REQUESTS; i++) {
      const kind = Math.floor(r() * 10);
      const headers: Record<string, string> = {};
      if (r() < 0.8) headers.authorization = r() < 0.9 ? `Bearer ${TOKEN}` : pick(['Bearer', 'Bearer x', `Basic ${TOKEN}`, `Bearer ${TOKEN} extra`]);
      let o: InjectOptions;
      if (kind <= 3) {
        const asToml = r() < 0.15;
        headers['content-type'] = asToml ? 'application/toml' : r() < 0.9 ? 'application/json' : pick(contentTypes);
        if (r() < 0.2) headers['idempotency-key'] = pick(['k1', 'k 2', 'x'.repeat(200), `fuzz-${i}`]);
        const body = asToml ? pick(['particles = 10', 'a = ' + '{a = '.repeat(3000) + '1' + '}'.repeat(3000), 'model = "dla-offlattice-2d"\nparticles = 50\nclusters = 1\nseed = 1', '[[[']) : r() < 0.1 ? pick(['{', '{"a":', '[', 'nul', '{"__proto__": {"x": 1}}', '{"constructor": {"prototype": {}}}', '']) : jsonText(hostileSpec(r));
        o = { method: 'POST', url: '/ensembles', headers, payload: body };
      } else if (kind <= 6) {
        headers['content-type'] = r() < 0.9 ? 'application/json' : pick(contentTypes);
        const body = r() < 0.1 ? pick(['{', '{"walkers":', '[]', '"x"', '{"points":' + '['.repeat(4000)]) : jsonText(hostileProbe(r));
        o = { method: 'POST', url: '/probes', headers, payload: body };
      } else if (kind === 7) {
        o = { method: pick(['POST', 'DELETE'] as const), url: pick([`/probes/${pick(ids)}/cancel`, `/probes/${pick(ids)}`, `/ensembles/${pick(ids)}/cancel`]), headers };
      } else {
        const q = pick(['', '?format=xlsx', '?format=csv&table=%0a', '?format=json', '?format=pb', `?table=${'x'.repeat(3000)}`]);
        o = { method: pick(['GET', 'GET', 'HEAD', 'PUT', 'PATCH', 'OPTIONS'] as const), url: pick([`/ensembles/${pick(ids)}`, `/ensembles/${pick(ids)}/summary${q}`, `/probes/${pick(ids)}`, `/probes/${pick(ids)}/hits`, '/ensembles', '/health', '/ready', `/${pick(ids)}`]), headers };
      }
      let timer: NodeJS.Timeout | undefined;
      const res = await Promise.race([app.inject(o), new Promise<'hang'>((resolve) => (timer = setTimeout(() => resolve('hang'), 15_000)))]);
      clearTimeout(timer);
      const where = `request ${i} (${o.method} ${String(o.url).slice(0, 60)})`;
      if (res === 'hang') {
        hung++;
        note(`${where}: no answer within 15 s`);
        continue;
      }
      if (res.statusCode >= 500) note(`${where}: ${res.statusCode} ${res.body.slice(0, 200)}`);
      else if (res.statusCode >= 400 && o.method !== 'HEAD') {
        let err: unknown;
        try {
          err = res.json().error;
        } catch {
          note(`${where}: ${res.statusCode} without a JSON error`);
          continue;
        }
        checkRefusal(where, err);
      }
    }
    expect(hung).toBe(0);
    expect(failures).toEqual([]);
  }, 600_000);
});
