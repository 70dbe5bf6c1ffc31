/**
 * Progress reporting for long CLI jobs, on stderr.
 *
 *  - 'bar'   (default when the stream is a TTY): a cli-progress bar with the
 *            count done, the rate (units per second) and the remaining time;
 *  - 'lines' (default otherwise): one plain line at most every
 *            `lineIntervalSeconds` (default 10 s) plus one at the end, so logs
 *            stay readable;
 *  - 'none': nothing.
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
  /** Clock in milliseconds; injectable for tests. */
  now?: () => number;
}

export interface Progress {
  /** Report that `done` units (absolute, not an increment) are finished. */
  update(done: number): void;
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

export function createProgress(opts: ProgressOptions): Progress {
  const stream = opts.stream ?? process.stderr;
  const label = opts.label ?? 'tendril';
  const now = opts.now ?? (() => performance.now());
  let mode: Exclude<ProgressMode, 'auto'>;
  if (opts.mode === undefined || opts.mode === 'auto') mode = stream.isTTY === true ? 'bar' : 'lines';
  else mode = opts.mode;
  const total = opts.total;
  const start = now();
  let stopped = false;
  let last = 0;

  if (mode === 'none') {
    return { mode, update: () => undefined, stop: () => undefined };
  }

  if (mode === 'bar') {
    const bar = new cliProgress.SingleBar(
      {
        stream: stream as NodeJS.WriteStream,
        format: `${label} [{bar}] {percentage}% | {value}/{total} ${opts.unit} | {rate} ${opts.unit}/s | {eta_formatted} left`,
        barsize: 30,
        hideCursor: true,
        etaBuffer: 20,
        fps: 5,
      },
      cliProgress.Presets.legacy,
    );
    bar.start(total, 0, { rate: '?' });
    return {
      mode,
      update(done: number): void {
        if (stopped) return;
        last = done;
        const secs = (now() - start) / 1000;
        bar.update(done, { rate: secs > 0 ? formatRate(done / secs) : '?' });
      },
      stop(): void {
        if (stopped) return;
        stopped = true;
        const secs = (now() - start) / 1000;
        bar.update(last, { rate: secs > 0 ? formatRate(last / secs) : '?' });
        bar.stop();
      },
    };
  }

  const interval = 1000 * (opts.lineIntervalSeconds ?? 10);
  let lastLine = start;
  const line = (done: number, final: boolean): void => {
    const t = now();
    const secs = (t - start) / 1000;
    const rate = secs > 0 ? done / secs : NaN;
    const pct = total > 0 ? ((100 * done) / total).toFixed(1) : '100.0';
    const tail = final ? `${formatDuration(secs)} elapsed` : `${formatDuration(rate > 0 ? (total - done) / rate : NaN)} left`;
    stream.write(`${label}: ${done}/${total} ${opts.unit} (${pct}%), ${formatRate(rate)} ${opts.unit}/s, ${tail}\n`);
    lastLine = t;
  };
  return {
    mode,
    update(done: number): void {
      if (stopped) return;
      last = done;
      if (now() - lastLine >= interval) line(done, false);
    },
    stop(): void {
      if (stopped) return;
      stopped = true;
      line(last, true);
    },
  };
}
