/**
 * `npm run bench`: runs the benchmark parts in turn and prints, for each, a
 * human-readable block followed by one JSON line per measurement.
 *
 *   node dist/test/bench/run-benchmarks.js [--only growth|dla3d|aggregate[,..]] [--sizes 10000,100000]
 *
 * Parts:
 *   growth     test/bench/growth-bench.ts: one cluster per size, each in a fresh
 *              process (--sizes or env TENDRIL_BENCH_SIZES; default 10^4, 10^5, 10^6;
 *              --repeat K grows each size K times and adds the median rate)
 *   dla3d      the same growth benchmark for off-lattice DLA in 3D
 *              (dla-offlattice-3d; --sizes, default 10^5 and 10^6)
 *   aggregate  test/bench/aggregate-bench.ts: runAggregateBenchmark()
 *   probe      test/bench/probe-bench.ts: runProbeBenchmark() — probe walkers per
 *              second on a grown cluster (10^6 particles, 10^6 walkers, one core)
 *   probe-scaling  test/bench/probe-scaling-bench.ts: 10^7 probe walkers on a 10^6
 *              cluster as a farm probe request, one worker process against two
 *   farm       test/bench/farm-bench.ts: runFarmBenchmark() — the same ensemble
 *              (20 × 3·10^5 by default) on two worker processes over Redis
 *              (REDIS_URL) against the embedded mode on two threads
 *   eden       test/bench/lattice-bench.ts: Eden models (square and triangular at
 *              10^6 and 10^7, off-lattice at 10^5 and 10^6): particles/s, peak RSS
 *   lattice    test/bench/lattice-bench.ts: square-lattice DLA at 10^5 and 10^6,
 *              triangular at 10^5: particles/s, moves per particle, peak RSS
 *   dbm-lattice  test/bench/lattice-bench.ts (opt-in: hours at 10^4): the lattice dielectric breakdown
 *              model at η = 2, 10^3 to 10^4, with the walker sampler
 *              (dbm-square-walkers: particles/s, walkers per particle, CPU s)
 *              and with the potential solve (dbm-square: solver iterations
 *              per particle); peak RSS. `--models dbm-square-walkers` runs
 *              only the walker sampler
 *   giant      test/bench/giant-bench.ts (opt-in: only with --only giant): 2D
 *              off-lattice DLA at 10^5, 10^6, 10^7 (--sizes; --giant-1e8 adds
 *              10^8): particles/s, jumps, peak RSS, bytes per particle,
 *              checkpoint write/read times; --kill-resume [--kill-size N]
 *              SIGKILLs a tendril grow after a checkpoint and resumes it
 *   giant-farm test/bench/giant-farm-bench.ts (opt-in: only with --only giant-farm):
 *              one 2D off-lattice DLA cluster of 10^7 (--farm-size) as one farm job
 *              on one worker over Redis, SIGKILLed after two checkpoints and resumed
 *              by a fresh worker: checkpoint write/read times, worker peak RSS and
 *              CPU seconds, work lost, final state hash (--no-kill: grown to its
 *              end by the first worker, for the peak of a worker that grew it all)
 *   dbm        test/bench/dbm-bench.ts: off-lattice DBM at η = 0.5, 2 (to 10^5)
 *              and 4 (to 10^4): particles per CPU second and walkers per particle
 *              against N, within --dbm-seconds CPU seconds per η (default 600);
 *              --dbm-etas 0.5,2 runs only those η; --dbm-method 0 uses the exact
 *              method for η > 1 (default: the model's default, the history method)
 *   dbm-cap    test/bench/dbm-cap-bench.ts: total variation between the capped
 *              η < 1 growth law and the exact one on a 2000-disk cluster, per cap
 */
import { repeatFromArgs, runGrowthBenchmark, sizesFromArgs } from './growth-bench.js';
import { runAggregateBenchmark } from './aggregate-bench.js';
import { runFarmBenchmark } from './farm-bench.js';
import { runProbeBenchmark } from './probe-bench.js';
import { runProbeScalingBenchmark } from './probe-scaling-bench.js';
import { runLatticeBenchmark } from './lattice-bench.js';
import { giantOptionsFromArgs, runGiantBenchmark } from './giant-bench.js';
import { DBM_BENCH_PLAN, runDbmBenchmark } from './dbm-bench.js';
import { runDbmCapBenchmark } from './dbm-cap-bench.js';
import { giantFarmKillFromArgs, giantFarmSizeFromArgs, runGiantFarmBenchmark } from './giant-farm-bench.js';

const PARTS = ['growth', 'dla3d', 'aggregate', 'probe', 'probe-scaling', 'farm', 'eden', 'lattice', 'dbm', 'dbm-cap', 'dbm-lattice', 'giant', 'giant-farm'] as const;
/** Parts run only when named in --only (long, and not for CI). */
const OPT_IN: readonly string[] = ['giant', 'dbm-lattice', 'giant-farm'];
/** Default sizes of the dla3d part. */
const DLA3D_SIZES = [100_000, 1_000_000];
type Part = (typeof PARTS)[number];

export function partsFromArgs(argv: string[]): Part[] {
  const i = argv.indexOf('--only');
  const eq = argv.find((a) => a.startsWith('--only='));
  const text = i >= 0 ? argv[i + 1] ?? '' : eq !== undefined ? eq.slice('--only='.length) : undefined;
  if (text === undefined) return PARTS.filter((p) => !OPT_IN.includes(p));
  const parts = text.split(',').map((s) => s.trim()).filter((s) => s !== '');
  const bad = parts.find((p) => !(PARTS as readonly string[]).includes(p));
  if (parts.length === 0 || bad !== undefined) throw new RangeError(`--only must be a comma-separated list of ${PARTS.join(', ')}, got "${text}"`);
  return parts as Part[];
}

/** `--models a,b` (or `--models=a,b`): the models kept in a lattice part, or undefined for all. */
function modelsFromArgs(argv: string[]): string[] | undefined {
  const i = argv.indexOf('--models');
  const eq = argv.find((a) => a.startsWith('--models='));
  const text = i >= 0 ? argv[i + 1] ?? '' : eq !== undefined ? eq.slice('--models='.length) : undefined;
  if (text === undefined) return undefined;
  const models = text.split(',').map((s) => s.trim()).filter((s) => s !== '');
  if (models.length === 0) throw new RangeError(`--models must be a comma-separated list of model kinds, got "${text}"`);
  return models;
}

function runAggregate(): void {
  const r = runAggregateBenchmark();
  process.stdout.write(`aggregate: ${r.runs} runs x ${r.sizes} sizes, ${r.resamples} resamples: ${r.seconds.toFixed(2)} s\n`);
  process.stdout.write(JSON.stringify(r) + '\n');
}

async function main(argv: string[]): Promise<number> {
  const parts = partsFromArgs(argv);
  let failed = 0;
  for (const part of parts) {
    try {
      if (part === 'growth') await runGrowthBenchmark({ sizes: sizesFromArgs(argv), repeat: repeatFromArgs(argv) });
      else if (part === 'giant') {
        const given = argv.some((a) => a === '--sizes' || a.startsWith('--sizes='));
        await runGiantBenchmark(giantOptionsFromArgs(argv, given ? sizesFromArgs(argv) : undefined));
      }
      else if (part === 'giant-farm') {
        const r = await runGiantFarmBenchmark(giantFarmSizeFromArgs(argv), process.env.REDIS_URL, giantFarmKillFromArgs(argv));
        const writes = `written in ${r.checkpoints.map((c) => c.writeSeconds.toFixed(2)).join(', ')} s`;
        process.stdout.write(
          r.secondWorker
            ? `giant-farm: ${r.particles} particles as one farm job: checkpoint ${(r.checkpointBytes / 1e6).toFixed(0)} MB ${writes}, read in ${r.resumeReadSeconds?.toFixed(2)} s; lost ${r.lostParticles} particles (interval ${r.checkpointEveryParticles}); peak RSS ${r.firstWorker.peakRssMB} / ${r.secondWorker.peakRssMB} MiB; hash ${r.stateHash}\n`
            : `giant-farm: ${r.particles} particles as one farm job, not killed: checkpoints ${writes}; peak RSS ${r.firstWorker.peakRssMB} MiB; hash ${r.stateHash}\n`,
        );
        process.stdout.write(JSON.stringify(r) + '\n');
      }
      else if (part === 'dla3d') {
        const given = argv.some((a) => a === '--sizes' || a.startsWith('--sizes='));
        await runGrowthBenchmark({ sizes: given ? sizesFromArgs(argv) : DLA3D_SIZES, model: 'dla-offlattice-3d', repeat: repeatFromArgs(argv) });
      }
      else if (part === 'eden' || part === 'lattice' || part === 'dbm-lattice') await runLatticeBenchmark(part, argv.some((a) => a === '--sizes' || a.startsWith('--sizes=')) ? sizesFromArgs(argv) : undefined, modelsFromArgs(argv));
      else if (part === 'aggregate') runAggregate();
      else if (part === 'dbm-cap') runDbmCapBenchmark();
      else if (part === 'dbm') {
        const k = argv.findIndex((a) => a === '--dbm-seconds');
        const budget = k >= 0 ? Number(argv[k + 1]) : 600;
        if (!(budget > 0)) throw new RangeError(`--dbm-seconds must be a positive number of seconds, got "${argv[k + 1]}"`);
        const e = argv.findIndex((a) => a === '--dbm-etas');
        let plan = DBM_BENCH_PLAN;
        if (e >= 0) {
          const etas = (argv[e + 1] ?? '').split(',').map(Number);
          plan = DBM_BENCH_PLAN.filter((p) => etas.includes(p.eta));
          if (plan.length !== etas.length) throw new RangeError(`--dbm-etas: "${argv[e + 1]}" is not a comma-separated list of η from ${DBM_BENCH_PLAN.map((p) => p.eta).join(', ')}`);
        }
        const mi = argv.findIndex((a) => a === '--dbm-method');
        const method = mi >= 0 ? Number(argv[mi + 1]) : undefined;
        if (method !== undefined && method !== 0 && method !== 1) throw new RangeError(`--dbm-method: "${argv[mi + 1]}" is out of range; allowed: 0 (exact) or 1 (history)`);
        runDbmBenchmark(budget, plan, method);
      }
      else if (part === 'probe') {
        const r = runProbeBenchmark(1_000_000, 1_000_000);
        process.stdout.write(`probe: ${r.walkers} walkers on ${r.particles} particles: ${Math.round(r.walkersPerSecond)} walkers/s\n`);
        process.stdout.write(JSON.stringify(r) + '\n');
      }
      else if (part === 'probe-scaling') {
        const r = await runProbeScalingBenchmark({ redisUrl: process.env.REDIS_URL });
        process.stdout.write(`probe scaling: ${r.walkers} walkers on ${r.particles} particles: 1 worker ${r.oneWorkerSeconds.toFixed(1)} s, 2 workers ${r.twoWorkerSeconds.toFixed(1)} s, ratio ${r.scalingRatio.toFixed(3)} (target <= 1.2)\n`);
        process.stdout.write(JSON.stringify(r) + '\n');
      }
      else {
        // the two modes are timed in turn three times; the ratio of a single
        // pair moves by ±15% with the machine's other load, so the median is reported
        const pairs = [];
        for (let i = 0; i < 3; i++) {
          const r = await runFarmBenchmark({ redisUrl: process.env.REDIS_URL });
          process.stdout.write(JSON.stringify(r) + '\n');
          pairs.push(r);
        }
        const ratios = pairs.map((r) => r.throughputRatio).sort((a, b) => a - b);
        const trips = pairs.map((r) => r.queueRoundTripSeconds).sort((a, b) => a - b);
        const summary = {
          benchmark: 'farm-overhead-median',
          clusters: pairs[0].clusters,
          particles: pairs[0].particles,
          throughputRatioMedian: ratios[1],
          throughputRatios: pairs.map((r) => r.throughputRatio),
          queueRoundTripSecondsMedian: trips[1],
          sameHashes: pairs.every((r) => r.sameHashes),
        };
        process.stdout.write(
          `farm: ${summary.clusters} clusters of ${summary.particles}: farm/embedded throughput, median of 3: ${summary.throughputRatioMedian.toFixed(3)}; queue round trip ${(1000 * summary.queueRoundTripSecondsMedian).toFixed(1)} ms\n`,
        );
        process.stdout.write(JSON.stringify(summary) + '\n');
      }
    } catch (err) {
      failed++;
      process.stderr.write(`bench ${part}: ${err instanceof Error ? err.message.split('\n')[0] : String(err)}\n`);
    }
  }
  return failed === 0 ? 0 : 1;
}

main(process.argv.slice(2)).then(
  (code) => process.exit(code),
  (err) => {
    process.stderr.write(`bench: ${err instanceof Error ? err.message : String(err)}\n`);
    process.exit(2);
  },
);
