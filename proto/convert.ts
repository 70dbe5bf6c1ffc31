/**
 * Conversions between tendril's plain objects and the protobuf messages of
 * proto/tendril.proto. proto/ imports nothing else of ours, so the plain shapes
 * are declared here; they are structurally identical to the kernel contract of
 * worker/core/growth-kernel.ts (test/proto-contract.test.ts checks that both
 * ways). Model parameters and counters travel as name → value maps, so the
 * contract carries any model; the registry (worker/models/registry.ts) checks
 * them when a task is run.
 *
 * Every decoder checks what it reads and throws a ContractError with a
 * one-line message naming the bad field, so a malformed job fails with a
 * reason instead of crashing a process.
 */
import { tendril } from './generated/tendril.js';
import { TendrilError } from './errors.js';
import { checkFrameCrc, FRAME_PREFIX_BYTES, FRAME_TRAILER_BYTES, frameHead, frameLength, framePrefix, isCheckpointFrame } from './checkpoint-frame.js';
import { crc32 } from './crc32.js';

export { tendril };

/**
 * Version of the wire contract written into every message; see the header of
 * tendril.proto. Readers accept every version in READABLE_CONTRACT_VERSIONS:
 * contract 1 (one model, x/y arrays, fixed counters) is read into the shapes
 * of contract 2 (a model kind with a parameter map, dimension-strided
 * positions, counters by name, model state).
 */
export const CONTRACT_VERSION = 2;
export const READABLE_CONTRACT_VERSIONS: readonly number[] = [1, 2];

export class ContractError extends TendrilError {
  override name = 'ContractError';
  readonly kind = 'contract';
}

/** A model and its numeric parameters by name (mirrors ModelParams of worker/core/growth-kernel.ts). */
export interface PlainModel {
  kind: string;
  params: Record<string, number>;
}

export interface PlainGrowthTask {
  model: PlainModel;
  particles: number;
  ensembleSeed: string;
  runIndex: number;
  recordsPerDecade: number;
}

/** A run task as queued: the growth task plus where it belongs and how to checkpoint it. */
export interface RunTaskData extends PlainGrowthTask {
  ensembleId: string;
  /** Checkpoint at least this often (seconds of wall-clock time); 0 = only on shutdown. */
  checkpointIntervalSeconds: number;
  /** Also checkpoint every this many particles; 0 = off. */
  checkpointEveryParticles: number;
  engineVersion: string;
  /** Hand back the final positions with the result (for probing); absent = false. */
  keepPositions?: boolean;
}

export interface PlainSeries {
  sizes: number[];
  radiusOfGyration: number[];
  maxRadius: number[];
  centerOffset: number[];
  extra: Record<string, number[]>;
}
export interface PlainMassRadius {
  radii: number[];
  counts: number[];
}
export type PlainCounters = Record<string, number>;
export interface PlainGrowthResult {
  engineVersion: string;
  model: PlainModel;
  dimension: number;
  particles: number;
  ensembleSeed: string;
  runIndex: number;
  series: PlainSeries;
  massRadius: PlainMassRadius;
  counters: PlainCounters;
  stateHash: string;
}
export interface PlainGrowthCheckpoint {
  engineVersion: string;
  task: PlainGrowthTask;
  dimension: number;
  count: number;
  positions: Float64Array;
  rngState: Uint32Array;
  counters: PlainCounters;
  series: PlainSeries;
  modelState: Uint8Array;
}

export interface RunTimingsData {
  growSeconds: number;
  startedAtMs: number;
  finishedAtMs: number;
  resumes: number;
  finishedBy: string;
}

export interface RunResultData extends PlainGrowthResult {
  ensembleId: string;
  timings: RunTimingsData;
}

/** A stored checkpoint: the kernel's state plus the run it belongs to and the time already spent. */
export interface CheckpointData {
  run: RunTaskData;
  state: PlainGrowthCheckpoint;
  growSeconds: number;
  startedAtMs: number;
  resumes: number;
}

// ---------------------------------------------------------------- helpers

function fail(msg: string): never {
  throw new ContractError(msg);
}

function checkVersion(what: string, v: number): void {
  if (!READABLE_CONTRACT_VERSIONS.includes(v)) fail(`${what}.contract_version is ${v}, this build reads versions ${READABLE_CONTRACT_VERSIONS.join(' and ')}`);
}

function decodeWith<T>(what: string, decode: (b: Uint8Array) => T, bytes: Uint8Array): T {
  try {
    return decode(bytes);
  } catch (err) {
    fail(`${what}: not a valid protobuf message (${err instanceof Error ? err.message : String(err)})`);
  }
}

export function growthTaskOf(run: RunTaskData): PlainGrowthTask {
  return {
    model: { kind: run.model.kind, params: { ...run.model.params } },
    particles: run.particles,
    ensembleSeed: run.ensembleSeed,
    runIndex: run.runIndex,
    recordsPerDecade: run.recordsPerDecade,
  };
}

/** The only model of contract 1, by its contract-2 kind and parameter names. */
const LEGACY_KIND = 'dla-offlattice-2d';

function modelToProto(m: PlainModel): tendril.IModelParams {
  return { kind: m.kind, params: { ...m.params } };
}

function modelFromProto(what: string, m: tendril.IModelParams | null | undefined): PlainModel {
  if (m?.kind) {
    const params: Record<string, number> = {};
    for (const [k, v] of Object.entries(m.params ?? {})) params[k] = Number(v);
    return { kind: m.kind, params };
  }
  const d = m?.offlatticeDla2d;
  if (d) return { kind: LEGACY_KIND, params: { min_step: d.minStep ?? 0, launch_margin: d.launchMargin ?? 0 } };
  return fail(`${what}.model is missing`);
}

function seriesToProto(s: PlainSeries): tendril.IGrowthSeries {
  const extra: Record<string, tendril.IDoubleList> = {};
  for (const [k, v] of Object.entries(s.extra)) extra[k] = { values: v };
  return { sizes: s.sizes, radiusOfGyration: s.radiusOfGyration, maxRadius: s.maxRadius, centerOffset: s.centerOffset, extra };
}

function seriesFromProto(s: tendril.IGrowthSeries | null | undefined): PlainSeries {
  const sizes = (s?.sizes ?? []).map(Number);
  const rg = (s?.radiusOfGyration ?? []).slice();
  const mr = (s?.maxRadius ?? []).slice();
  const co = (s?.centerOffset ?? []).slice();
  if (rg.length !== sizes.length || mr.length !== sizes.length || co.length !== sizes.length) {
    fail(`series has ${sizes.length} sizes but ${rg.length}/${mr.length}/${co.length} values`);
  }
  const extra: Record<string, number[]> = {};
  for (const [k, v] of Object.entries(s?.extra ?? {})) {
    const values = (v?.values ?? []).slice();
    if (values.length !== sizes.length) fail(`series.extra["${k.slice(0, 40)}"] has ${values.length} values for ${sizes.length} sizes`);
    extra[k] = values;
  }
  return { sizes, radiusOfGyration: rg, maxRadius: mr, centerOffset: co, extra };
}

/** Counters by name (contract 2), or contract 1's fixed counters under their names. */
function countersFromProto(values: { [k: string]: number } | null | undefined, legacy: tendril.IGrowthCounters | null | undefined): PlainCounters {
  if (values && Object.keys(values).length > 0) {
    const out: PlainCounters = {};
    for (const [k, v] of Object.entries(values)) out[k] = Number(v);
    return out;
  }
  if (legacy) return { jumps: legacy.jumps ?? 0, short_steps: legacy.shortSteps ?? 0, returns: legacy.returns ?? 0 };
  return {};
}

function checkDimension(what: string, d: number): number {
  if (d !== 2 && d !== 3) fail(`${what}.dimension is ${d}, allowed: 2 or 3`);
  return d;
}

const LITTLE_ENDIAN = new Uint8Array(Uint16Array.of(1).buffer)[0] === 1;

function floatsToBytes(a: Float64Array, count: number): Uint8Array {
  const n = Math.min(count, a.length);
  if (LITTLE_ENDIAN) return new Uint8Array(a.buffer, a.byteOffset, n * 8);
  const out = new Uint8Array(n * 8);
  const view = new DataView(out.buffer);
  for (let i = 0; i < n; i++) view.setFloat64(i * 8, a[i], true);
  return out;
}

function bytesToFloats(what: string, b: Uint8Array | null | undefined, count: number): Float64Array {
  const len = b?.length ?? 0;
  if (len !== count * 8) fail(`${what} holds ${len} bytes, expected ${count * 8} for ${count} values`);
  const out = new Float64Array(count);
  if (LITTLE_ENDIAN) new Uint8Array(out.buffer).set(b!);
  else {
    const view = new DataView(b!.buffer, b!.byteOffset, b!.byteLength);
    for (let i = 0; i < count; i++) out[i] = view.getFloat64(i * 8, true);
  }
  return out;
}

// ---------------------------------------------------------------- run task

export function runTaskToProto(t: RunTaskData): tendril.RunTask {
  return tendril.RunTask.create({
    contractVersion: CONTRACT_VERSION,
    ensembleId: t.ensembleId,
    runIndex: t.runIndex,
    ensembleSeed: t.ensembleSeed,
    model: modelToProto(t.model),
    particles: t.particles,
    recordsPerDecade: t.recordsPerDecade,
    checkpointIntervalSeconds: t.checkpointIntervalSeconds,
    checkpointEveryParticles: t.checkpointEveryParticles,
    engineVersion: t.engineVersion,
    keepPositions: t.keepPositions === true,
  });
}

export function runTaskFromProto(m: tendril.IRunTask): RunTaskData {
  checkVersion('RunTask', m.contractVersion ?? 0);
  const t: RunTaskData = {
    ensembleId: m.ensembleId ?? '',
    runIndex: m.runIndex ?? 0,
    ensembleSeed: m.ensembleSeed ?? '',
    model: modelFromProto('RunTask', m.model),
    particles: m.particles ?? 0,
    recordsPerDecade: m.recordsPerDecade ?? 0,
    checkpointIntervalSeconds: m.checkpointIntervalSeconds ?? 0,
    checkpointEveryParticles: m.checkpointEveryParticles ?? 0,
    engineVersion: m.engineVersion ?? '',
  };
  if (m.keepPositions) t.keepPositions = true;
  if (t.ensembleId === '') fail('RunTask.ensemble_id is empty');
  if (!/^[0-9]{1,20}$/.test(t.ensembleSeed)) fail(`RunTask.ensemble_seed "${t.ensembleSeed}" is not a decimal unsigned 64-bit integer`);
  if (t.particles < 1) fail(`RunTask.particles is ${t.particles}, must be >= 1`);
  if (t.recordsPerDecade < 1) fail(`RunTask.records_per_decade is ${t.recordsPerDecade}, must be >= 1`);
  if (!(t.checkpointIntervalSeconds >= 0)) fail(`RunTask.checkpoint_interval_seconds is ${t.checkpointIntervalSeconds}, must be >= 0`);
  if (t.engineVersion === '') fail('RunTask.engine_version is empty');
  return t;
}

export function encodeRunTask(t: RunTaskData): Uint8Array {
  return tendril.RunTask.encode(runTaskToProto(t)).finish();
}

export function decodeRunTask(bytes: Uint8Array): RunTaskData {
  return runTaskFromProto(decodeWith('RunTask', (b) => tendril.RunTask.decode(b), bytes));
}

// ---------------------------------------------------------------- run result

export function runResultToProto(r: RunResultData): tendril.RunResult {
  return tendril.RunResult.create({
    contractVersion: CONTRACT_VERSION,
    ensembleId: r.ensembleId,
    runIndex: r.runIndex,
    engineVersion: r.engineVersion,
    model: modelToProto(r.model),
    particles: r.particles,
    ensembleSeed: r.ensembleSeed,
    series: seriesToProto(r.series),
    massRadius: { ...r.massRadius },
    counterValues: { ...r.counters },
    dimension: r.dimension,
    stateHash: r.stateHash,
    timings: { ...r.timings },
  });
}

export function runResultFromProto(m: tendril.IRunResult): RunResultData {
  checkVersion('RunResult', m.contractVersion ?? 0);
  const mr = m.massRadius;
  const radii = (mr?.radii ?? []).slice();
  const counts = (mr?.counts ?? []).slice();
  if (radii.length !== counts.length) fail(`RunResult.mass_radius has ${radii.length} radii but ${counts.length} counts`);
  const t = m.timings;
  const r: RunResultData = {
    ensembleId: m.ensembleId ?? '',
    runIndex: m.runIndex ?? 0,
    engineVersion: m.engineVersion ?? '',
    model: modelFromProto('RunResult', m.model),
    dimension: checkDimension('RunResult', m.contractVersion === 1 ? 2 : (m.dimension ?? 0)),
    particles: m.particles ?? 0,
    ensembleSeed: m.ensembleSeed ?? '',
    series: seriesFromProto(m.series),
    massRadius: { radii, counts },
    counters: countersFromProto(m.counterValues, m.counters),
    stateHash: m.stateHash ?? '',
    timings: {
      growSeconds: t?.growSeconds ?? 0,
      startedAtMs: t?.startedAtMs ?? 0,
      finishedAtMs: t?.finishedAtMs ?? 0,
      resumes: t?.resumes ?? 0,
      finishedBy: t?.finishedBy ?? '',
    },
  };
  if (r.stateHash === '') fail('RunResult.state_hash is empty');
  return r;
}

export function encodeRunResult(r: RunResultData): Uint8Array {
  return tendril.RunResult.encode(runResultToProto(r)).finish();
}

export function decodeRunResult(bytes: Uint8Array): RunResultData {
  return runResultFromProto(decodeWith('RunResult', (b) => tendril.RunResult.decode(b), bytes));
}

// ---------------------------------------------------------------- checkpoint

/** The protobuf Checkpoint of c; without its coordinates when `withPositions` is false (the header of a frame). */
function checkpointMessage(c: CheckpointData, withPositions: boolean): tendril.Checkpoint {
  const s = c.state;
  return tendril.Checkpoint.create({
    contractVersion: CONTRACT_VERSION,
    engineVersion: s.engineVersion,
    task: runTaskToProto(c.run),
    count: s.count,
    dimension: s.dimension,
    positions: withPositions ? floatsToBytes(s.positions, s.count * s.dimension) : new Uint8Array(0),
    rngState: Array.from(s.rngState),
    counterValues: { ...s.counters },
    series: seriesToProto(s.series),
    modelState: s.modelState,
    growSeconds: c.growSeconds,
    startedAtMs: c.startedAtMs,
    resumes: c.resumes,
  });
}

/** The header message of a framed checkpoint (proto/checkpoint-frame.ts): everything but the coordinates. */
export function encodeCheckpointHeader(c: CheckpointData): Uint8Array {
  return tendril.Checkpoint.encode(checkpointMessage(c, false)).finish();
}

/**
 * The checkpoint of a header message (encodeCheckpointHeader) and positions
 * held apart from it (count × dimension values, e.g. an array moved from
 * another thread): the positions are kept as they are, not copied.
 */
export function checkpointFromHeader(header: Uint8Array, positions: Float64Array): CheckpointData {
  const m = decodeWith('Checkpoint', (b) => tendril.Checkpoint.decode(b), header);
  return checkpointFromMessage(m, positions, positions.length);
}

/**
 * A checkpoint as one framed buffer (proto/checkpoint-frame.ts): the header
 * message, then the positions copied once, then the CRC. Checkpoints written
 * to files go through proto/checkpoint-file.ts instead, in chunks.
 */
export function encodeCheckpoint(c: CheckpointData): Uint8Array<ArrayBuffer> {
  const s = c.state;
  const values = s.count * s.dimension;
  if (s.positions.length < values) fail(`Checkpoint positions hold ${s.positions.length} values, fewer than ${values}`);
  const head = frameHead(encodeCheckpointHeader(c));
  const out = new Uint8Array(frameLength(head.length - FRAME_PREFIX_BYTES, values));
  out.set(head, 0);
  out.set(floatsToBytes(s.positions, values), head.length);
  const at = out.length - FRAME_TRAILER_BYTES;
  new DataView(out.buffer).setUint32(at, crc32(out, 0, at), true);
  return out;
}

/** The checkpoint encoded as one protobuf message, the layout written before frames (still read; for tests of that reading). */
export function encodeCheckpointMessage(c: CheckpointData): Uint8Array {
  return tendril.Checkpoint.encode(checkpointMessage(c, true)).finish();
}

/** Contract 1 positions: x and y arrays, interleaved into contract 2's layout. */
function legacyPositions(m: tendril.ICheckpoint, count: number): Float64Array {
  const x = bytesToFloats('Checkpoint.x', m.x, count);
  const y = bytesToFloats('Checkpoint.y', m.y, count);
  const out = new Float64Array(2 * count);
  for (let i = 0; i < count; i++) {
    out[2 * i] = x[i];
    out[2 * i + 1] = y[i];
  }
  return out;
}

/**
 * Decode a checkpoint, framed (proto/checkpoint-frame.ts) or a single
 * protobuf message (the layout before frames). `roomFor`: give a framed
 * checkpoint's positions array room for this many particles (a kernel
 * resuming a run of N particles may then keep it as its own, with no second
 * copy).
 */
export function decodeCheckpoint(bytes: Uint8Array, roomFor = 0): CheckpointData {
  if (isCheckpointFrame(bytes)) {
    let prefix;
    try {
      prefix = framePrefix(bytes);
      checkFrameCrc(bytes);
    } catch (err) {
      fail((err as Error).message);
    }
    const m = decodeWith('Checkpoint', (b) => tendril.Checkpoint.decode(b), bytes.subarray(FRAME_PREFIX_BYTES, FRAME_PREFIX_BYTES + prefix.messageLength));
    const values = bytes.length - FRAME_TRAILER_BYTES - prefix.positionsOffset;
    if (values < 0 || values % 8 !== 0) fail(`Checkpoint frame holds ${values} bytes of positions, not a whole number of float64`);
    const positions = new Float64Array(Math.max(roomFor * (m.dimension || 2), values / 8));
    const raw = bytes.subarray(prefix.positionsOffset, prefix.positionsOffset + values);
    if (LITTLE_ENDIAN) new Uint8Array(positions.buffer, 0, values).set(raw);
    else {
      const view = new DataView(raw.buffer, raw.byteOffset, raw.byteLength);
      for (let i = 0; i < values / 8; i++) positions[i] = view.getFloat64(8 * i, true);
    }
    return checkpointFromMessage(m, positions, values / 8);
  }
  const m = decodeWith('Checkpoint', (b) => tendril.Checkpoint.decode(b), bytes);
  return checkpointFromMessage(m, null, 0);
}

/**
 * The checkpoint of a decoded message. `positions`: the coordinates read
 * from a frame (`values` of them; the message holds none), or null to take
 * them from the message itself.
 */
export function checkpointFromMessage(m: tendril.ICheckpoint, positions: Float64Array | null, values: number): CheckpointData {
  checkVersion('Checkpoint', m.contractVersion ?? 0);
  if (!m.task) fail('Checkpoint.task is missing');
  const run = runTaskFromProto(m.task);
  const count = m.count ?? 0;
  if (count < 1 || count > run.particles) fail(`Checkpoint.count is ${count}, allowed 1..${run.particles}`);
  const rng = m.rngState ?? [];
  if (rng.length !== 4) fail(`Checkpoint.rng_state has ${rng.length} words, expected 4`);
  const legacy = m.contractVersion === 1;
  const dimension = checkDimension('Checkpoint', legacy ? 2 : (m.dimension ?? 0));
  if (positions !== null && values !== count * dimension) fail(`Checkpoint frame holds ${values} position values, expected ${count * dimension} for ${count} particles in ${dimension} dimensions`);
  return {
    run,
    state: {
      engineVersion: m.engineVersion ?? '',
      task: growthTaskOf(run),
      dimension,
      count,
      positions: positions ?? (legacy ? legacyPositions(m, count) : bytesToFloats('Checkpoint.positions', m.positions, count * dimension)),
      rngState: Uint32Array.from(rng),
      counters: countersFromProto(m.counterValues, m.counters),
      series: seriesFromProto(m.series),
      modelState: m.modelState ? Uint8Array.from(m.modelState) : new Uint8Array(0),
    },
    growSeconds: m.growSeconds ?? 0,
    startedAtMs: m.startedAtMs ?? 0,
    resumes: m.resumes ?? 0,
  };
}

// ---------------------------------------------------------------- summary

export interface PowerLawFitData {
  exponent: number;
  prefactor: number;
  rSquared: number;
  points: number;
  minX: number;
  maxX: number;
}

export interface EnsembleSummaryData {
  ensembleId: string;
  name: string;
  engineVersion: string;
  specJson: string;
  clustersPlanned: number;
  clustersDone: number;
  runs: RunResultData[];
  radiusOfGyrationFit: PowerLawFitData | null;
  fractalDimension: number | null;
  createdAtMs: number;
  meanSizes: number[];
  meanLogRadiusOfGyration: number[];
  /** JSON text added by the statistics library; "" when absent. */
  statisticsJson: string;
  /** True while the ensemble is unfinished (computed from the runs stored so far). */
  partial: boolean;
  /** Adaptive target, outcome and batch history as JSON; "" for a fixed count. */
  adaptiveJson: string;
}

export function encodeEnsembleSummary(s: EnsembleSummaryData): Uint8Array {
  const msg = tendril.EnsembleSummary.create({
    contractVersion: CONTRACT_VERSION,
    ensembleId: s.ensembleId,
    name: s.name,
    engineVersion: s.engineVersion,
    specJson: s.specJson,
    clustersPlanned: s.clustersPlanned,
    clustersDone: s.clustersDone,
    runs: s.runs.map(runResultToProto),
    radiusOfGyrationFit: s.radiusOfGyrationFit ? { ...s.radiusOfGyrationFit } : null,
    fractalDimension: s.fractalDimension ?? 0,
    createdAtMs: s.createdAtMs,
    meanSizes: s.meanSizes,
    meanLogRadiusOfGyration: s.meanLogRadiusOfGyration,
    statisticsJson: s.statisticsJson,
    partial: s.partial,
    adaptiveJson: s.adaptiveJson,
  });
  return tendril.EnsembleSummary.encode(msg).finish();
}

export function decodeEnsembleSummary(bytes: Uint8Array): EnsembleSummaryData {
  const m = decodeWith('EnsembleSummary', (b) => tendril.EnsembleSummary.decode(b), bytes);
  checkVersion('EnsembleSummary', m.contractVersion ?? 0);
  const f = m.radiusOfGyrationFit;
  return {
    ensembleId: m.ensembleId ?? '',
    name: m.name ?? '',
    engineVersion: m.engineVersion ?? '',
    specJson: m.specJson ?? '',
    clustersPlanned: m.clustersPlanned ?? 0,
    clustersDone: m.clustersDone ?? 0,
    runs: (m.runs ?? []).map(runResultFromProto),
    radiusOfGyrationFit: f
      ? {
          exponent: f.exponent ?? 0,
          prefactor: f.prefactor ?? 0,
          rSquared: f.rSquared ?? 0,
          points: f.points ?? 0,
          minX: f.minX ?? 0,
          maxX: f.maxX ?? 0,
        }
      : null,
    fractalDimension: f ? (m.fractalDimension ?? 0) : null,
    createdAtMs: m.createdAtMs ?? 0,
    meanSizes: (m.meanSizes ?? []).slice(),
    meanLogRadiusOfGyration: (m.meanLogRadiusOfGyration ?? []).slice(),
    statisticsJson: m.statisticsJson ?? '',
    partial: m.partial ?? false,
    adaptiveJson: m.adaptiveJson ?? '',
  };
}
