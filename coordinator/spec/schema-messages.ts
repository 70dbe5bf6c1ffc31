/**
 * JSON-schema checking with tendril's one-line messages: every problem names
 * the field, the value found and what is allowed, e.g.
 *   particles: 0 is out of range; allowed: an integer from 2 to 100000000
 * The spec (coordinator/spec/), the HTTP routes (coordinator/http/) and the
 * probe settings all check their documents with compileChecker, so one
 * schema gives the same words on the CLI and over HTTP.
 */
import { createRequire } from 'node:module';
import type { Ajv as AjvInstance, ErrorObject } from 'ajv';
import { excerpt, fieldKey, MAX_LISTED_PROBLEMS } from './document-limits.js';

let shared: AjvInstance | null = null;
/**
 * The shared Ajv instance (strict: a schema with an unknown keyword is a
 * programming error), loaded on the first check: loading ajv and compiling
 * the spec schema cost about 0.2 s, which commands that only read stored
 * (already validated) specs, such as `tendril summary`, need not pay.
 */
function ajv(): AjvInstance {
  if (shared === null) {
    const { Ajv } = createRequire(import.meta.url)('ajv') as typeof import('ajv');
    shared = new Ajv({ allErrors: true, strict: true, strictTypes: false });
  }
  return shared;
}

/** The problems of a document against a schema, one line each (empty when it is valid). */
export type Checker = (doc: unknown) => string[];

/**
 * A checker for `schema`. `override` may replace the messages of the errors
 * under one instance path prefix (e.g. "/params", whose messages come from
 * the model registry) by its own lines.
 */
export function compileChecker(schema: object, override?: { path: string; problems: (doc: unknown) => string[] }): Checker {
  let compiled: ReturnType<AjvInstance['compile']> | null = null;
  return (doc) => {
    compiled ??= ajv().compile(schema);
    const validate = compiled;
    if (validate(doc)) return [];
    const errors = validate.errors ?? [];
    if (!override) return problemsOf(schema, errors, doc);
    const under = (e: ErrorObject) => e.instancePath === override.path || e.instancePath.startsWith(override.path + '/');
    const rest = errors.filter((e) => !under(e) && e.keyword !== 'if');
    const out = problemsOf(schema, rest, doc);
    if (errors.some(under)) for (const p of override.problems(doc)) if (!out.includes(p)) out.push(p);
    return out;
  };
}

function problemsOf(root: object, errors: ErrorObject[], doc: unknown): string[] {
  const out: string[] = [];
  const seen = new Set<string>();
  // anyOf failures (the seed) produce one error per branch plus the anyOf itself; keep the anyOf one.
  const anyOfPaths = new Set(errors.filter((e) => e.keyword === 'anyOf').map((e) => e.instancePath));
  for (const e of errors) {
    if (out.length >= MAX_LISTED_PROBLEMS) {
      out.push(`spec: more problems than these ${MAX_LISTED_PROBLEMS}; allowed: fix these and submit again to see the rest`);
      break;
    }
    if (e.keyword === 'if') continue;
    if (e.keyword !== 'anyOf' && [...anyOfPaths].some((p) => e.schemaPath.includes('/anyOf/') && e.instancePath === p)) continue;
    const msg = messageOf(root, e, doc);
    if (!seen.has(msg)) {
      seen.add(msg);
      out.push(msg);
    }
  }
  return out;
}

function fieldOf(instancePath: string): string {
  if (instancePath === '') return 'spec';
  return instancePath
    .slice(1)
    .split('/')
    .map((s) => s.replace(/~1/g, '/').replace(/~0/g, '~'))
    .map((s, i) => (/^\d+$/.test(s) ? `[${s}]` : i === 0 ? fieldKey(s) : `.${fieldKey(s)}`))
    .join('');
}

function valueAt(doc: unknown, instancePath: string): unknown {
  let v: any = doc;
  if (instancePath === '') return v;
  for (const part of instancePath.slice(1).split('/')) v = v?.[part.replace(/~1/g, '/').replace(/~0/g, '~')];
  return v;
}

function schemaAt(root: object, schemaPath: string): any {
  // "#/properties/particles/maximum" -> the schema of the property
  const parts = schemaPath.replace(/^#\/?/, '').split('/');
  parts.pop();
  let s: any = root;
  for (const p of parts) s = s?.[p];
  return s;
}

/** What a schema allows, in words ("an integer from 2 to 100000000"). */
export function allowedOf(s: any): string {
  if (!s) return 'see the spec schema';
  if (s.anyOf) return s.description ?? s.anyOf.map(allowedOf).join(' or ');
  if (s.enum) return `one of ${s.enum.map((x: unknown) => JSON.stringify(x)).join(', ')}`;
  if (s.type === 'integer' || s.type === 'number') {
    const kind = s.type === 'integer' ? 'an integer' : 'a number';
    const lo = s.minimum !== undefined ? `from ${s.minimum}` : s.exclusiveMinimum !== undefined ? `above ${s.exclusiveMinimum}` : '';
    const hi = s.maximum !== undefined ? `${lo ? ' ' : ''}${lo.startsWith('from') ? 'to' : 'up to'} ${s.maximum}` : '';
    return `${kind}${lo || hi ? ' ' : ''}${lo}${hi}`;
  }
  if (s.type === 'string') {
    if (s.pattern && s.$comment) return s.$comment;
    const len = s.maxLength !== undefined ? ` of ${s.minLength ?? 0} to ${s.maxLength} characters` : '';
    return `a string${len}${s.pattern ? ` matching ${s.pattern}` : ''}`;
  }
  if (s.type === 'array') {
    if (s.$comment) return s.$comment;
    const items = s.items?.enum ? ` of distinct values from ${s.items.enum.map((x: unknown) => JSON.stringify(x)).join(', ')}` : '';
    return `a non-empty list${items}`;
  }
  if (s.type === 'boolean') return 'true or false';
  if (s.type === 'object') return `a table with the fields ${Object.keys(s.properties ?? {}).join(', ')}`;
  return 'see the spec schema';
}

function messageOf(root: object, e: ErrorObject, doc: unknown): string {
  const field = fieldOf(e.instancePath);
  // bounded excerpt: quoting never serialises the whole value
  const value = excerpt(valueAt(doc, e.instancePath), 60);
  switch (e.keyword) {
    case 'required': {
      const name = (e.params as { missingProperty: string }).missingProperty;
      const s = (schemaAt(root, e.schemaPath)?.properties as Record<string, unknown> | undefined)?.[name];
      return `${e.instancePath === '' ? '' : field + '.'}${fieldKey(name)}: missing; allowed: ${allowedOf(s)}`;
    }
    case 'additionalProperties': {
      const name = (e.params as { additionalProperty: string }).additionalProperty;
      const parent = schemaAt(root, e.schemaPath);
      return `${e.instancePath === '' ? '' : field + '.'}${fieldKey(name)}: unknown field; allowed fields: ${Object.keys(parent?.properties ?? {}).join(', ')}`;
    }
    case 'minimum':
    case 'maximum':
    case 'exclusiveMinimum':
    case 'exclusiveMaximum':
      return `${field}: ${value} is out of range; allowed: ${allowedOf(schemaAt(root, e.schemaPath))}`;
    case 'uniqueItems':
      return `${field}: ${value} repeats an entry; allowed: ${allowedOf(schemaAt(root, e.schemaPath))}`;
    case 'minItems':
      return `${field}: ${value} is empty; allowed: ${allowedOf(schemaAt(root, e.schemaPath))}`;
    default:
      return `${field}: ${value} is not allowed; allowed: ${allowedOf(schemaAt(root, e.schemaPath))}`;
  }
}
