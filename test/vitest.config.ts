import { defineConfig } from 'vitest/config';

// `npm test`: every test but the long physics checks (*.slow.test.ts), which
// `npm run test:slow` runs with test/vitest.slow.config.ts. Tests run from
// TypeScript sources; tests that start worker threads or child processes use
// the compiled tree in dist/ (built by the pretest step).
export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    exclude: ['dist/**', 'node_modules/**', 'test/**/*.slow.test.ts'],
    testTimeout: 120_000,
    hookTimeout: 120_000,
    pool: 'forks',
    poolOptions: { forks: { singleFork: false, maxForks: 2, minForks: 1 } },
    reporters: ['default'],
    // LOOP_WATCH_FILE=FILE: record the longest stretch each test file holds its worker's event loop (test/support/loop-watch.ts)
    setupFiles: process.env.LOOP_WATCH_FILE ? ['./test/support/loop-watch.ts'] : [],
  },
});
