import { defineConfig } from 'vitest/config';

// Tests run from TypeScript sources; tests that start worker threads or child
// processes use the compiled tree in dist/ (built by `npm test`'s pretest step).
export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    exclude: ['dist/**', 'node_modules/**'],
    testTimeout: 120_000,
    hookTimeout: 120_000,
    pool: 'forks',
    poolOptions: { forks: { singleFork: false, maxForks: 2, minForks: 1 } },
    reporters: ['default'],
  },
});
