import { defineConfig } from 'vitest/config';

// `npm run test:slow`: the long physics checks only (*.slow.test.ts). They grow
// large ensembles, so their time limits are generous: a busy machine makes
// them slower, never wrong.
export default defineConfig({
  test: {
    include: ['test/**/*.slow.test.ts'],
    exclude: ['dist/**', 'node_modules/**'],
    testTimeout: 3_600_000,
    hookTimeout: 3_600_000,
    pool: 'forks',
    poolOptions: { forks: { singleFork: false, maxForks: 2, minForks: 1 } },
    reporters: ['default'],
  },
});
