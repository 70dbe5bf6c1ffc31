/**
 * Progress reporting for long CLI jobs, on stderr.
 *
 *  - 'bar'   (default when the stream is a TTY): a cli-progress bar with the
 *            count done, the rate and the remaining time;
 *  - 'lines' (default otherwise): one plain line at most every
 *            `lineIntervalSeconds` (default 10 s) plus one at the end, so logs
 *            stay readable;
 *  - 'none': nothing.
 *
 * The rate is work done here per wall second over a recent window (default
 * the last 30 s; see ThroughputWindow): work that was already done when the
 * progress started (a finished or resumed ensemble) and work replayed from
 * earlier invocations (`update(done, { replayed })`) advance the count but
 * never the rate. Until two samples of grown work exist the rate is not
 * known, and neither the rate nor a remaining time is printed (no "?", no
 * "0 s left").
 *
 * Rates and remaining times come from the wall clock, so nothing printed here
 * is deterministic; callers must keep it out of their results.
 */
import cliProgress from 'cli-progress';

export type ProgressMode = 'auto' | 'bar' | 'lines' | 'none';

export interface ProgressOptions {
  total: number;
  /** Plural unit name, e.g. "particles". */
  unit: string;
  /** Label in front of each line or bar; default "tendril". */
  label?: string;
  mode?: ProgressMode;
  stream?: NodeJS.WritableStream & { isTTY?: boolean };
  lineIntervalSeconds?: number;
  /** Width of the window of the rate, in seconds; default 30. */
  rateWindowSeconds?: number;
  /** Clock in milliseconds; injectable for tests. */
  now?: () => number;
}

export interface ProgressUpdate {
  /**
   * Of `done`, how many units were not produced here (results reused from an
   * earlier invocation, the part of a resumed run before its checkpoint, work
   * another process did before we started watching). Cumulative, like `done`.
   */
  replayed?: number;
  /** A new total (an adaptive ensemble plans more clusters batch by batch). */
  total?: number;
}

export interface Progress {
  /** Report that `done` units (absolute, not an increment) are finished. */
  update(done: number, extra?: ProgressUpdate): void;
  /** Final report; idempotent. */
  stop(): void;
  readonly mode: Exclude<ProgressMode, 'auto'>;
}

/** "3 s", "4 min 05 s", "2 h 07 min"; "?" for unknown. */
export function formatDuration(seconds: number): string {
  if (!Number.isFinite(seconds) || seconds < 0) return '?';
  const s = Math.round(seconds);
  if (s < 60) return `${s} s`;
  if (s < 3600) return `${Math.floor(s / 60)} min ${String(s % 60).padStart(2, '0')} s`;
  return `${Math.floor(s / 3600)} h ${String(Math.floor((s % 3600) / 60)).padStart(2, '0')} min`;
}

/** Rates with three significant digits and a thousands separator for large values. */
export function formatRate(perSecond: number): string {
  if (!Number.isFinite(perSecond)) return '?';
  if (perSecond >= 1000) return Math.round(perSecond).toLocaleString('en-US');
  return perSecond.toPrecision(3);
}

/**
 * Throughput over a recent window: samples (time, units grown here) are kept
 * for `windowMs`; the rate is (grown now − grown at the oldest sample in the
 * window) / (time between them). The oldest sample kept is the last one at or
 * before the window's start, so a window always spans at least `windowMs`
 * once that much time has passed. Null until two samples span a positive time
 * and some growth.
 */
export class ThroughputWindow {
  private readonly t: number[] = [];
  private readonly g: number[] = [];
  constructor(private readonly windowMs: number) {}

  add(timeMs: number, grown: number): void {
    this.t.push(timeMs); this.g.push(grown);
    // drop samples older than the one just before the window start
    while (this.t.length > 2 && this.t[1] <= timeMs - this.windowMs) { this.t.shift(); this.g.shift(); }
  }

  /** Units per second over the window, or null while unknown. */
  rate(): number | null {
    const n = this.t.length;
    if (n < 2) return null;
    const dt = (this.t[n - 1] - this.t[0]) / 1000;
    const dg = this.g[n - 1] - this.g[0];
    if (!(dt > 0) || !(dg > 0)) return dg === 0 && dt >= this.windowMs / 1000 ? 0 : null;
    return dg / dt;
  }
}

/** The "rate, time left" part of a progress line; empty while the rate is unknown. */
export function rateText(rate: number | null, remaining: number, unit: string): string {
  if (rate === null) return '';
  if (rate === 0) return `, 0 ${unit}/s (stalled)`;
  return `, ${formatRate(rate)} ${unit}/s, about ${formatDuration(remaining / rate)} left`;
}

export function createProgress(opts: ProgressOptions): Progress {
  const stream = opts.stream ?? process.stderr;
  const label = opts.label ?? 'tendril';
  const now = opts.now ?? (() => performance.now());
  let mode: Exclude<ProgressMode, 'auto'>;
  if (opts.mode === undefined || opts.mode === 'auto') mode = stream.isTTY === true ? 'bar' : 'lines';
  else mode = opts.mode;
  let total = opts.total;
  const start = now();
  const window = new ThroughputWindow(1000 * (opts.rateWindowSeconds ?? 30));
  let stopped = false;
  let last = 0;
  /** Units counted at the first update (work done before we started) plus replays: never part of the rate. */
  let baseline: number | null = null;
  let grownTotal = 0;
  const record = (done: number, replayed: number): void => {
    if (baseline === null) baseline = done - replayed;
    // monotone: a count that falls back (a run restarted from its checkpoint) and climbs again is replayed work
    grownTotal = Math.max(grownTotal, done - replayed - baseline);
    window.add(now(), grownTotal);
    last = done;
  };

  if (mode === 'none') {
    return { mode, update: () => undefined, stop: () => undefined };
  }

  const pctText = (done: number) => (total > 0 ? ((100 * done) / total).toFixed(1) : '100.0');

  if (mode === 'bar') {
    const bar = new cliProgress.SingleBar(
      {
        stream: stream as NodeJS.WriteStream,
        format: `${label} [{bar}] {percentage}% | {value}/{total} ${opts.unit}{tail}`,
        barsize: 30,
        hideCursor: true,
        fps: 5,
      },
      cliProgress.Presets.legacy,
    );
    bar.start(total, 0, { tail: '' });
    const tail = (done: number) => rateText(window.rate(), total - done, opts.unit).replace(/^, /, ' | ').replace(/, about /, ' | about ');
    return {
      mode,
      update(done: number, extra?: ProgressUpdate): void {
        if (stopped) return;
        record(done, extra?.replayed ?? 0);
        if (extra?.total !== undefined && extra.total !== total) { total = extra.total; bar.setTotal(total); }
        bar.update(done, { tail: tail(done) });
      },
      stop(): void {
        if (stopped) return;
        stopped = true;
        const secs = (now() - start) / 1000;
        bar.update(last, { tail: ` | ${formatDuration(secs)} elapsed${grownTotal > 0 && secs > 0 ? `, ${formatRate(grownTotal / secs)} ${opts.unit}/s on average` : ''}` });
        bar.stop();
      },
    };
  }

  const interval = 1000 * (opts.lineIntervalSeconds ?? 10);
  let lastLine = start;
  const line = (done: number, final: boolean): void => {
    const t = now();
    const secs = (t - start) / 1000;
    const head = `${label}: ${done}/${total} ${opts.unit} (${pctText(done)}%)`;
    const tail = final
      ? `${grownTotal > 0 && secs > 0 ? `, ${formatRate(grownTotal / secs)} ${opts.unit}/s on average` : ''}, ${formatDuration(secs)} elapsed`
      : rateText(window.rate(), total - done, opts.unit);
    stream.write(`${head}${tail}\n`);
    lastLine = t;
  };
  return {
    mode,
    update(done: number, extra?: ProgressUpdate): void {
      if (stopped) return;
      record(done, extra?.replayed ?? 0);
      if (extra?.total !== undefined) total = extra.total;
      if (now() - lastLine >= interval) line(done, false);
    },
    stop(): void {
      if (stopped) return;
      stopped = true;
      line(last, true);
    },
  };
}
