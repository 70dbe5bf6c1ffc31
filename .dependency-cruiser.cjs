/**
 * Layering rules, checked by test/layering.test.ts (part of `npm test`):
 *   - no import cycles anywhere;
 *   - worker/ imports only worker/ and proto/ of ours (plus Node built-ins and
 *     npm packages, which only worker/runtime/ uses);
 *   - the pure kernels (worker/core, models, walkers, index, probe) import no
 *     runtime, no Node built-in and no npm package;
 *   - proto/ imports nothing of ours but proto/;
 *   - nothing but tests imports test/.
 */
/** @type {import('dependency-cruiser').IConfiguration} */
module.exports = {
  forbidden: [
    {
      name: 'no-circular',
      severity: 'error',
      comment: 'an import cycle',
      from: {},
      to: { circular: true },
    },
    {
      name: 'worker-imports-worker-and-proto-only',
      severity: 'error',
      comment: 'worker/ may import worker/ and proto/ of this repository, nothing else of it',
      from: { path: '^worker/' },
      to: { dependencyTypesNot: ['core', 'npm', 'npm-dev', 'npm-optional', 'npm-peer', 'npm-no-pkg', 'npm-unknown'], pathNot: '^(worker|proto)/' },
    },
    {
      name: 'kernels-are-pure',
      severity: 'error',
      comment: 'kernels (models, indexes, random, walkers, probes) do no I/O: no runtime, Node built-in or npm package',
      from: { path: '^worker/(core|models|walkers|index|probe)/' },
      to: { path: '^worker/runtime/|^node:|node_modules' },
    },
    {
      name: 'kernels-no-core-modules',
      severity: 'error',
      comment: 'kernels import no Node built-in',
      from: { path: '^worker/(core|models|walkers|index|probe)/' },
      to: { dependencyTypes: ['core'] },
    },
    {
      name: 'proto-imports-proto-only',
      severity: 'error',
      comment: 'proto/ is the wire contract: it imports nothing else of ours',
      from: { path: '^proto/' },
      to: { pathNot: '^proto/', dependencyTypesNot: ['core', 'npm', 'npm-dev', 'npm-no-pkg', 'npm-unknown'] },
    },
    {
      name: 'no-test-imports',
      severity: 'error',
      comment: 'only tests import test/',
      from: { pathNot: '^test/' },
      to: { path: '^test/' },
    },
    {
      name: 'not-to-unresolvable',
      severity: 'error',
      comment: 'an import that does not resolve (the checker would miss its edges)',
      from: {},
      to: { couldNotResolve: true },
    },
  ],
  options: {
    doNotFollow: { path: 'node_modules' },
    exclude: { path: '(^|/)(dist|node_modules)/|\\.d\\.ts$' },
    tsPreCompilationDeps: true,
    tsConfig: { fileName: 'tsconfig.json' },
    enhancedResolveOptions: {
      exportsFields: ['exports'],
      conditionNames: ['import', 'require', 'node', 'default', 'types'],
      extensions: ['.ts', '.js', '.mjs', '.cjs', '.json'],
    },
  },
};
