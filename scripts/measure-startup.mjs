#!/usr/bin/env node
/**
 * Start-up time of the CLI: median wall time of N runs of `--help`, `grow
 * --help` and `status` (of an unknown id on the local Redis, so it connects
 * and answers), beside a bare `node -e ''` for the machine's baseline.
 * A measurement, not a test: times depend on the machine and its load.
 *
 *   node scripts/measure-startup.mjs [runs] [--cli PATH]   (after npm run build)
 *
 * --cli measures another build of the CLI (e.g. another checkout's
 * dist/coordinator/cli.js), for a before/after comparison on the same load.
 */
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

const args = process.argv.slice(2);
const cliAt = args.indexOf('--cli');
const cli = cliAt >= 0 ? args.splice(cliAt, 2)[1] : fileURLToPath(new URL('../dist/coordinator/cli.js', import.meta.url));
const runs = Number(args[0] ?? 7);
const cases = [
  ['node -e "" (baseline)', ['-e', '']],
  ['tendril --help', [cli, '--help']],
  ['tendril grow --help', [cli, 'grow', '--help']],
  ['tendril status (unknown id, local Redis)', [cli, 'status', 'enotthere', '--prefix', 'startup-measure']],
];
for (const [label, args] of cases) {
  const times = [];
  for (let i = 0; i < runs; i++) {
    const t0 = process.hrtime.bigint();
    spawnSync(process.execPath, args, { stdio: 'ignore' });
    times.push(Number(process.hrtime.bigint() - t0) / 1e9);
  }
  times.sort((a, b) => a - b);
  process.stdout.write(`${label}: median ${times[Math.floor(runs / 2)].toFixed(3)} s (min ${times[0].toFixed(3)}, max ${times[runs - 1].toFixed(3)}) over ${runs} runs\n`);
}
