/**
 * Finds tests that hold the event loop of their vitest worker (which then
 * cannot report to the runner: "Timeout calling onTaskUpdate"). A setup file,
 * active only when LOOP_WATCH_FILE names a file:
 *
 *   LOOP_WATCH_FILE=/tmp/loop.jsonl npx vitest run --config test/vitest.config.ts test/FILE.test.ts
 *
 * A 50 ms heartbeat measures every stretch in which the loop did not turn;
 * after each test file one JSON line gives the longest stretch and the test
 * that was running when it ended. A measurement, not a test: stretches
 * depend on the machine and its load.
 */
import { appendFileSync } from 'node:fs';
import { loadavg } from 'node:os';
import { afterAll, afterEach, beforeAll, beforeEach } from 'vitest';

const out = process.env.LOOP_WATCH_FILE;
if (out) {
  const TICK = 50;
  let last = performance.now();
  let worst = 0;
  let worstTest = '(collecting)';
  let current = '(collecting)';
  let file = '';
  const beat = () => {
    const now = performance.now();
    const held = now - last - TICK;
    if (held > worst) {
      worst = held;
      worstTest = current;
    }
    last = now;
  };
  const timer = setInterval(beat, TICK);
  timer.unref();
  beforeAll((suite) => {
    file = (suite as { file?: { filepath?: string } }).file?.filepath ?? (suite as { filepath?: string }).filepath ?? '';
  });
  beforeEach((ctx) => {
    beat();
    current = ctx.task.name;
  });
  afterEach(() => beat());
  afterAll(() => {
    beat();
    clearInterval(timer);
    appendFileSync(out, JSON.stringify({ file: file.replace(/.*\/test\//, 'test/'), longestHeldMs: Math.max(0, Math.round(worst)), during: worstTest, loadAverage: loadavg()[0] }) + '\n');
  });
}

