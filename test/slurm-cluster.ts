/**
 * A single-node Slurm cluster of a test's own, from Debian's packages
 * (slurm-wlm, munge): munged with its own key and socket, slurmctld and slurmd
 * as root with a minimal slurm.conf (no cgroups, no accounting), all in a temp
 * folder, on free ports. `startSlurm` returns the cluster, or the reason it
 * cannot run here (not root, a program missing, a daemon that did not come up).
 * The node has 2 CPUs (the tests' machines have 2 cores; with more, the
 * configured 2 are used, with fewer the node never comes up and the reason says so).
 */
import { execFileSync, spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { chmodSync, existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { hostname } from 'node:os';
import { join } from 'node:path';
import { freePort, sleep, tempDir } from './farm-helpers.js';

export interface SlurmCluster {
  dir: string;
  /** Environment for sbatch, squeue, scancel (SLURM_CONF set). */
  env: NodeJS.ProcessEnv;
  run(cmd: string, args: string[]): string;
  /** Stop slurmd, slurmctld and munged and remove the folder. */
  stop(): Promise<void>;
}

const PROGRAMS = ['munged', 'munge', 'slurmctld', 'slurmd', 'sbatch', 'squeue', 'scancel', 'sinfo'];

function onPath(p: string): boolean {
  return spawnSync('sh', ['-c', `command -v ${p}`], { stdio: 'ignore' }).status === 0;
}

function tail(file: string, lines = 8): string {
  try {
    return readFileSync(file, 'utf8').trim().split('\n').slice(-lines).join(' | ');
  } catch {
    return '(no log)';
  }
}

export async function startSlurm(): Promise<SlurmCluster | { reason: string }> {
  if (process.getuid?.() !== 0) return { reason: 'the Slurm daemons of this test run as root; this process is not root' };
  const missing = PROGRAMS.filter((p) => !onPath(p));
  if (missing.length > 0) return { reason: `not on PATH: ${missing.join(', ')} (Debian packages slurm-wlm and munge)` };
  const dir = tempDir('slurm');
  chmodSync(dir, 0o755);
  const mungeDir = join(dir, 'munge');
  mkdirSync(mungeDir, { mode: 0o700 });
  for (const d of ['state', 'spool', 'log']) mkdirSync(join(dir, d));
  const key = join(mungeDir, 'munge.key');
  writeFileSync(key, randomBytes(1024), { mode: 0o400 });
  const socket = join(mungeDir, 'munge.sock');
  const node = hostname().split('.')[0];
  const [ctldPort, dPort] = [await freePort(), await freePort()];
  const conf = join(dir, 'slurm.conf');
  writeFileSync(
    conf,
    [
      'ClusterName=tendriltest',
      `SlurmctldHost=${node}(127.0.0.1)`,
      `SlurmctldPort=${ctldPort}`,
      `SlurmdPort=${dPort}`,
      'SlurmUser=root',
      'SlurmdUser=root',
      'AuthType=auth/munge',
      `AuthInfo=socket=${socket}`,
      'CredType=cred/munge',
      `StateSaveLocation=${join(dir, 'state')}`,
      `SlurmdSpoolDir=${join(dir, 'spool')}`,
      `SlurmctldPidFile=${join(dir, 'slurmctld.pid')}`,
      `SlurmdPidFile=${join(dir, 'slurmd.pid')}`,
      `SlurmctldLogFile=${join(dir, 'log', 'slurmctld.log')}`,
      `SlurmdLogFile=${join(dir, 'log', 'slurmd.log')}`,
      'ProctrackType=proctrack/linuxproc',
      'TaskPlugin=task/none',
      'JobAcctGatherType=jobacct_gather/none',
      'AccountingStorageType=accounting_storage/none',
      'JobCompType=jobcomp/none',
      'SelectType=select/cons_tres',
      'SelectTypeParameters=CR_CPU',
      'SchedulerType=sched/backfill',
      'MpiDefault=none',
      'ReturnToService=2',
      'KillWait=30',
      `NodeName=${node} NodeAddr=127.0.0.1 CPUs=2 State=UNKNOWN`,
      `PartitionName=test Nodes=${node} Default=YES MaxTime=INFINITE State=UP`,
      '',
    ].join('\n'),
  );
  const env = { ...process.env, SLURM_CONF: conf };
  const children: ChildProcess[] = [];
  const daemon = (cmd: string, args: string[]) => {
    const c = spawn(cmd, args, { env, stdio: 'ignore' });
    c.on('error', () => undefined);
    children.push(c);
    return c;
  };
  const stop = async () => {
    for (const c of children.reverse()) {
      if (c.exitCode !== null || c.signalCode !== null) continue;
      const gone = new Promise((r) => c.once('exit', r));
      c.kill('SIGTERM');
      await Promise.race([gone, sleep(15_000)]);
      if (c.exitCode === null && c.signalCode === null) {
        c.kill('SIGKILL');
        await gone;
      }
    }
    rmSync(dir, { recursive: true, force: true });
  };
  const run = (cmd: string, args: string[]) => execFileSync(cmd, args, { env, encoding: 'utf8', cwd: dir, stdio: ['ignore', 'pipe', 'pipe'] });
  const fail = async (reason: string) => {
    await stop();
    return { reason };
  };

  daemon('munged', ['-F', '-f', `--key-file=${key}`, `--socket=${socket}`, `--pid-file=${join(mungeDir, 'munged.pid')}`, `--log-file=${join(mungeDir, 'munged.log')}`, `--seed-file=${join(mungeDir, 'seed')}`]);
  for (let i = 0; i < 100 && !existsSync(socket); i++) await sleep(100);
  if (!existsSync(socket)) return fail(`munged did not start: ${tail(join(mungeDir, 'munged.log'))}`);
  daemon('slurmctld', ['-D', '-c', '-f', conf]);
  await sleep(1000);
  daemon('slurmd', ['-D', '-f', conf, '-N', node]);
  let state = '';
  for (let i = 0; i < 120; i++) {
    try {
      state = run('sinfo', ['-h', '-N', '-o', '%T']).trim();
      if (state === 'idle') break;
    } catch (err) {
      state = (err as Error).message.split('\n')[0];
    }
    await sleep(500);
  }
  if (state !== 'idle') return fail(`the node did not become idle (sinfo: ${state || 'nothing'}); slurmctld: ${tail(join(dir, 'log', 'slurmctld.log'), 3)}; slurmd: ${tail(join(dir, 'log', 'slurmd.log'), 3)}`);
  return { dir, env, run, stop };
}
