/**
 * Sweeps over one model parameter: a spec whose `params.NAME` is a list of
 * values or a range with a step becomes one ordinary ensemble (a "member")
 * per value.
 *
 *   params.eta = [0, 0.5, 1, 1.5, 2]                 the values, strictly increasing
 *   params.eta = { from = 0, to = 4, step = 0.5 }     from, from + step, ... up to `to` (inclusive,
 *                                                     within 10^-9 step); each value rounded to 12
 *                                                     significant digits (0.1 + 0.2 is 0.3)
 *
 * At most one parameter may be swept, with 2 to MAX_SWEEP_VALUES values,
 * each inside the parameter's own range (the model descriptor's ValueRange).
 * Every other field of the spec applies to every member. Member i is the
 * spec with `params.NAME = values[i]`, the name "<name> (NAME: <value>)" and
 * the seed memberSeed(seed, i) (below), so members draw independent random
 * streams and a member is an ordinary ensemble: same plan, same results,
 * same hashes as a single spec with that seed.
 *
 * A spec without a swept parameter is not a sweep: validateLaunch returns it
 * unchanged as a single ensemble (validateSpec), so the single-ensemble
 * path is untouched.
 */
import { mix64, parseSeed } from '../../worker/core/random.js';
import { describeRange, quoteValue, rangeProblem } from '../../worker/core/value-range.js';
import { isModelKind, modelDescriptor } from '../../worker/models/registry.js';
import type { ParamSpec } from '../../worker/core/model-descriptor.js';
import { nestingProblem } from './document-limits.js';
import { limitsFromEnv, maxRunsOf, SpecError, specDocumentProblems, specToDocument, validateSpec, type EnsembleSpec, type SpecLimits } from './index.js';

/** Most values one sweep may have (each is a whole ensemble). */
export const MAX_SWEEP_VALUES = 64;
/** Significant digits a value of a range is rounded to (removes float noise of from + i·step). */
const RANGE_DIGITS = 12;

/** A validated sweep: the swept parameter, its values and one member spec per value. */
export interface SweepSpec {
  name: string;
  /** The model parameter swept (`params.NAME`). */
  parameter: string;
  /** Values in increasing order. */
  values: number[];
  /** How the values were given: a list, or a range with a step (kept for the canonical document). */
  given: { list: number[] } | { from: number; to: number; step: number };
  /** The ensemble seed of the sweep (decimal string); member i uses memberSeed(seed, i). */
  seed: string;
  /** Member i: the spec with params[parameter] = values[i] and its derived seed. */
  members: EnsembleSpec[];
}

/** A launchable document: one ensemble, or a sweep of ensembles. */
export type Launchable = { kind: 'single'; spec: EnsembleSpec } | { kind: 'sweep'; sweep: SweepSpec };

const MASK64 = (1n << 64n) - 1n;
const GOLDEN64 = 0x9e3779b97f4a7c15n;
/** Tag of the sweep-member derivation ("SWEP"), so it never coincides with a run stream's key (worker/core/random.ts). */
const SWEEP_TAG = 0x53574550n;

/**
 * The ensemble seed of member `index` of a sweep with ensemble seed `seed`
 * (a pure function of the two; documented contract):
 *
 *   key  = seed XOR mix64(SWEEP_TAG · 2^32 + index + 1)
 *   seed_i = mix64((key + 0x9E3779B97F4A7C15) mod 2^64)
 *
 * with mix64 the SplitMix64 finaliser (Steele, Lea & Flood 2014) and
 * SWEEP_TAG = 0x53574550. Runs of member i then draw Random.forRun(seed_i,
 * run, purpose) as in any ensemble. mix64 is a bijection of 64-bit words,
 * so different indices give different seeds for one sweep seed.
 */
export function memberSeed(seed: string | number | bigint, index: number): string {
  if (!Number.isSafeInteger(index) || index < 0) throw new RangeError(`sweep member index ${index} is not a non-negative integer`);
  const key = parseSeed(seed) ^ mix64((SWEEP_TAG << 32n) + BigInt(index) + 1n);
  return mix64((key + GOLDEN64) & MASK64).toString();
}

/** Text of a swept value in names and folder names: shortest round-trip form. */
export function valueText(v: number): string {
  return String(v);
}

/** The folder of member `value` inside a sweep's output folder, e.g. "eta-0.5". */
export function memberFolder(parameter: string, value: number): string {
  return `${parameter}-${valueText(value)}`;
}

interface SweepField {
  parameter: string;
  raw: unknown;
}

/** The swept parameters of a document: params entries that are arrays or tables. */
function sweptFields(doc: Record<string, unknown>): SweepField[] {
  const p = doc.params;
  if (typeof p !== 'object' || p === null || Array.isArray(p)) return [];
  return Object.entries(p as Record<string, unknown>)
    .filter(([, v]) => typeof v === 'object' && v !== null)
    .map(([parameter, raw]) => ({ parameter, raw }));
}

/** True when a spec document sweeps a parameter (a params entry is a list or a table). */
export function isSweepDocument(doc: unknown): boolean {
  return typeof doc === 'object' && doc !== null && !Array.isArray(doc) && sweptFields(doc as Record<string, unknown>).length > 0;
}

/** Round to RANGE_DIGITS significant digits (0 stays 0). */
function roundValue(v: number): number {
  return v === 0 ? 0 : Number(v.toPrecision(RANGE_DIGITS));
}

/**
 * The values of one swept field, or the problems (one line each naming
 * params.NAME[...], the value and what is allowed). `range` is the
 * parameter's own range when the model knows it.
 */
export function sweepValues(field: string, raw: unknown, range: ParamSpec | null, unitText: string): { values: number[]; given: SweepSpec['given'] | null; problems: string[] } {
  const problems: string[] = [];
  const listRule = `a list of 2 to ${MAX_SWEEP_VALUES} numbers in strictly increasing order, or a table { from, to, step }`;
  const allowedValue = range ? describeRange(range, unitText) : 'a number';
  if (Array.isArray(raw)) {
    if (raw.length < 2 || raw.length > MAX_SWEEP_VALUES) return { values: [], given: null, problems: [`${field}: a list of ${raw.length} value${raw.length === 1 ? '' : 's'} is not allowed; allowed: ${listRule}`] };
    raw.forEach((v, i) => {
      const p = range ? rangeProblem(`${field}[${i}]`, v, range, unitText) : typeof v === 'number' && Number.isFinite(v) ? null : `${field}[${i}]: ${quoteValue(v)} is not a number; allowed: ${allowedValue}`;
      if (p !== null) problems.push(p);
      else if (i > 0 && typeof raw[i - 1] === 'number' && !(v > raw[i - 1])) problems.push(`${field}[${i}]: ${quoteValue(v)} is not allowed after ${quoteValue(raw[i - 1])}; allowed: values in strictly increasing order`);
    });
    return problems.length > 0 ? { values: [], given: null, problems } : { values: [...(raw as number[])], given: { list: [...(raw as number[])] }, problems };
  }
  const t = raw as Record<string, unknown>;
  for (const k of Object.keys(t)) if (!['from', 'to', 'step'].includes(k)) problems.push(`${field}.${/^[A-Za-z0-9_]{1,40}$/.test(k) ? k : quoteValue(k)}: not a field of a sweep range; allowed: from, to, step (or ${listRule})`);
  for (const k of ['from', 'to', 'step']) {
    const v = t[k];
    if (v === undefined) problems.push(`${field}.${k}: missing; allowed: ${k === 'step' ? 'a number above 0' : allowedValue}`);
    else if (typeof v !== 'number' || !Number.isFinite(v)) problems.push(`${field}.${k}: ${quoteValue(v)} is not a number; allowed: ${k === 'step' ? 'a number above 0' : allowedValue}`);
  }
  if (problems.length > 0) return { values: [], given: null, problems };
  const from = t.from as number, to = t.to as number, step = t.step as number;
  if (range) for (const k of ['from', 'to'] as const) {
    const p = rangeProblem(`${field}.${k}`, t[k], range, unitText);
    if (p !== null) problems.push(p);
  }
  if (!(step > 0)) problems.push(`${field}.step: ${quoteValue(step)} is out of range; allowed: a number above 0`);
  else if (!(to > from)) problems.push(`${field}.to: ${quoteValue(to)} is not allowed; allowed: a number above ${field}.from (${from})`);
  if (problems.length > 0) return { values: [], given: null, problems };
  const count = Math.floor((to - from) / step + 1e-9) + 1;
  if (count < 2 || count > MAX_SWEEP_VALUES) {
    return { values: [], given: null, problems: [`${field}.step: ${quoteValue(step)} gives ${count} value${count === 1 ? '' : 's'} from ${from} to ${to}; allowed: a step giving 2 to ${MAX_SWEEP_VALUES} values`] };
  }
  const values: number[] = [];
  for (let i = 0; i < count; i++) values.push(roundValue(from + i * step));
  if (range?.integer) {
    const bad = values.find((v) => !Number.isSafeInteger(v));
    if (bad !== undefined) return { values: [], given: null, problems: [`${field}.step: ${quoteValue(step)} gives the value ${bad}; allowed: an integer step (${field.replace(/^params\./, '')} takes ${describeRange(range, unitText)})`] };
  }
  return { values, given: { from, to, step }, problems };
}

/**
 * Validate a document that may sweep a parameter. Problems of the sweep
 * come first (one line each); then the document with the first value in
 * place of the sweep is validated like any spec, and the total work of all
 * members is held against the ceiling. Throws SpecError listing every problem.
 */
export function validateLaunch(doc: unknown, limits: SpecLimits = limitsFromEnv()): Launchable {
  if (!isSweepDocument(doc)) return { kind: 'single', spec: validateSpec(doc, limits) };
  // nesting first, as validateSpec does: quoting a value nested 10^5 deep would overflow the stack
  const tooDeep = nestingProblem(doc, 'spec');
  if (tooDeep !== null) throw new SpecError([tooDeep]);
  const d = doc as Record<string, unknown>;
  const fields = sweptFields(d);
  const problems: string[] = [];
  if (fields.length > 1) {
    problems.push(`params.${fields[1].parameter}: a second swept parameter is not allowed (params.${fields[0].parameter} is swept); allowed: at most one swept parameter, the others single numbers`);
  }
  const f = fields[0];
  const desc = isModelKind(d.model) ? modelDescriptor(d.model) : null;
  const param = desc?.params.find((p) => p.name === f.parameter) ?? null;
  if (desc && !param) {
    problems.push(`params.${/^[A-Za-z0-9_]{1,64}$/.test(f.parameter) ? f.parameter : quoteValue(f.parameter)}: not a parameter of ${desc.kind}; allowed: ${desc.params.map((p) => p.name).join(', ') || 'none'}`);
  }
  const unitText = param && desc ? (param.unit ? `${param.unit}, for ${desc.kind}` : `for ${desc.kind}`) : '';
  const sv = desc && param ? sweepValues(`params.${f.parameter}`, f.raw, param, unitText) : { values: [], given: null, problems: [] as string[] };
  problems.push(...sv.problems);
  // the rest of the spec, with the first value standing in for the sweep (its own problems are the members' below)
  const first = sv.values[0] ?? param?.default ?? 0;
  const stand = { ...d, params: { ...(d.params as Record<string, unknown>), [f.parameter]: first } };
  const unlimited = { maxTotalParticles: Number.MAX_SAFE_INTEGER };
  let base: EnsembleSpec | null = null;
  let restFine = true;
  try {
    base = validateSpec(stand, unlimited);
  } catch (err) {
    if (!(err instanceof SpecError)) throw err;
    const rest = err.problems.filter((p) => !p.startsWith(`params.${f.parameter}:`));
    problems.push(...rest);
    restFine = rest.length === 0;
  }
  if (restFine && sv.values.length > 0) {
    // each member's own checks against the cluster size (a model check may depend on the swept value)
    for (const [i, v] of sv.values.entries()) {
      try {
        const m = validateSpec({ ...stand, params: { ...stand.params, [f.parameter]: v } }, unlimited);
        base ??= m;
      } catch (err) {
        if (!(err instanceof SpecError)) throw err;
        for (const p of err.problems) problems.push(p.replace(`params.${f.parameter}:`, `params.${f.parameter}[${i}]:`));
      }
    }
  }
  if (base && sv.values.length > 0) {
    const total = base.particles * maxRunsOf(base) * sv.values.length;
    if (total > limits.maxTotalParticles) {
      problems.push(
        `particles × ${base.target ? 'target.max_clusters' : 'clusters'} × values of params.${f.parameter}: ${base.particles} × ${maxRunsOf(base)} × ${sv.values.length} = ${total} is above the total-work ceiling; allowed: at most ${limits.maxTotalParticles} (the operator may raise it with TENDRIL_MAX_TOTAL_PARTICLES)`,
      );
    }
  }
  if (problems.length > 0 || !base || !sv.given) {
    throw new SpecError(problems.length > 0 ? [...new Set(problems)] : [`params.${f.parameter}: ${quoteValue(f.raw)} is not allowed; allowed: a list of 2 to ${MAX_SWEEP_VALUES} numbers in strictly increasing order, or a table { from, to, step }`]);
  }
  const given = sv.given;
  const members = sv.values.map((v, i) => ({
    ...base!,
    name: memberName(base!.name, f.parameter, v),
    model: { kind: base!.model.kind, params: { ...base!.model.params, [f.parameter]: v } },
    seed: memberSeed(base!.seed, i),
  }));
  return { kind: 'sweep', sweep: { name: base.name, parameter: f.parameter, values: sv.values, given, seed: base.seed, members } };
}

/** A member's name: "<sweep name> (NAME: <value>)" (within the 100 characters and the characters of a name). */
function memberName(name: string, parameter: string, v: number): string {
  const tail = ` (${parameter}: ${valueText(v)})`;
  return name.slice(0, Math.max(1, 100 - tail.length)) + tail;
}

/** The canonical document of a sweep: the first member's document with the sweep in params and the sweep's own seed and name. */
export function sweepToDocument(s: SweepSpec): Record<string, unknown> {
  const doc = specToDocument(s.members[0]);
  const swept = 'list' in s.given ? [...s.given.list] : { from: s.given.from, to: s.given.to, step: s.given.step };
  return { ...doc, name: s.name, seed: s.seed, params: { ...(doc.params as Record<string, number>), [s.parameter]: swept } };
}

/**
 * The schema-level problems of a document that may sweep (the HTTP body
 * validator): a sweep document is checked with its first value standing in
 * and the sweep's own problems; any other document as a spec.
 */
export function launchDocumentProblems(doc: unknown): string[] {
  if (!isSweepDocument(doc)) return specDocumentProblems(doc);
  try {
    validateLaunch(doc, { maxTotalParticles: Number.MAX_SAFE_INTEGER });
    return [];
  } catch (err) {
    if (err instanceof SpecError) return err.problems;
    throw err;
  }
}
