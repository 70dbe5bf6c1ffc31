#!/usr/bin/env node
/**
 * `npm run check:deploy`: validates the deployment files.
 *
 *   compose files      dclint (the Compose specification's JSON schema plus its
 *                      error-level rules; style warnings are not reported)
 *   Kubernetes files   every YAML document is parsed (yaml) and checked against
 *                      the JSON schema of its apiVersion/kind (kubernetes-models)
 *   other YAML         parsed (prometheus.yml)
 *   Slurm batch files  `bash -n` (syntax)
 *
 * Usage: node deploy/check-deploy.mjs [--compose F]... [--kubernetes F]... [--yaml F]... [--shell F]...
 * Without arguments: the files under deploy/. Prints one line per problem
 * ("FILE: where: what"), then a closing line; exit code 1 when any problem.
 */
import { spawnSync } from 'node:child_process';
import { readdirSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseAllDocuments } from 'yaml';

const require = createRequire(import.meta.url);
const deploy = dirname(fileURLToPath(import.meta.url));
const root = join(deploy, '..');

function filesFromArgs(argv) {
  const sets = { compose: [], kubernetes: [], yaml: [], shell: [] };
  if (argv.length === 0) {
    sets.compose.push(join(deploy, 'compose.yaml'));
    for (const f of readdirSync(join(deploy, 'kubernetes')).filter((n) => /\.ya?ml$/.test(n)).sort()) sets.kubernetes.push(join(deploy, 'kubernetes', f));
    sets.yaml.push(join(deploy, 'prometheus.yml'));
    for (const f of readdirSync(join(deploy, 'slurm')).filter((n) => n.endsWith('.sbatch')).sort()) sets.shell.push(join(deploy, 'slurm', f));
    return sets;
  }
  for (let i = 0; i < argv.length; i += 2) {
    const kind = argv[i].replace(/^--/, '');
    if (!(kind in sets) || argv[i + 1] === undefined) {
      process.stderr.write(`check-deploy: argument ${JSON.stringify(argv[i])} is not allowed; allowed: --compose, --kubernetes, --yaml or --shell followed by a file\n`);
      process.exit(2);
    }
    sets[kind].push(argv[i + 1]);
  }
  return sets;
}

const problems = [];
const show = (f) => relative(process.cwd(), f) || f;

function parseYaml(file) {
  let docs;
  try {
    docs = parseAllDocuments(readFileSync(file, 'utf8'));
  } catch (err) {
    problems.push(`${show(file)}: ${err.message.split('\n')[0]}`);
    return [];
  }
  const out = [];
  docs.forEach((d, i) => {
    for (const e of d.errors) problems.push(`${show(file)}: document ${i + 1}: ${e.message.split('\n')[0]}`);
    if (d.errors.length === 0) out.push(d.toJS());
  });
  return out;
}

/** The kubernetes-models class of an apiVersion and kind, or null. */
function modelOf(apiVersion, kind) {
  if (typeof apiVersion !== 'string' || typeof kind !== 'string' || !/^[A-Za-z0-9.\/]+$/.test(apiVersion) || !/^[A-Za-z]+$/.test(kind)) return null;
  try {
    return require(`kubernetes-models/${apiVersion}/${kind}`)[kind] ?? null;
  } catch {
    return null;
  }
}

function checkKubernetes(file) {
  parseYaml(file).forEach((doc, i) => {
    if (doc === null || doc === undefined) return;
    const where = `document ${i + 1} (${doc.apiVersion} ${doc.kind}${doc.metadata?.name ? ` "${doc.metadata.name}"` : ''})`;
    const Model = modelOf(doc.apiVersion, doc.kind);
    if (!Model) {
      problems.push(`${show(file)}: ${where}: apiVersion/kind is not a known Kubernetes resource`);
      return;
    }
    try {
      new Model(doc).validate();
    } catch (err) {
      const details = err.errors?.map((e) => `${e.instancePath || '/'} ${e.message}`).join('; ');
      problems.push(`${show(file)}: ${where}: ${details || err.message.split('\n')[0]}`);
    }
  });
}

function checkCompose(file) {
  const bin = join(dirname(require.resolve('dclint/package.json')), 'bin', 'dclint.cjs');
  const r = spawnSync(process.execPath, [bin, '--quiet', '--color=false', '-f', 'compact', file], { encoding: 'utf8' });
  if (r.status !== 0) {
    const lines = `${r.stdout}\n${r.stderr}`.split('\n').map((l) => l.trim()).filter((l) => l && !/^✖|^\d+ problems?/.test(l));
    for (const l of lines.length ? lines : [`dclint exited with ${r.status}`]) problems.push(`${show(file)}: ${l.startsWith(file) ? l.slice(file.length).replace(/^[:\s]+/, '') : l}`);
  }
}

function checkShell(file) {
  const r = spawnSync('bash', ['-n', file], { encoding: 'utf8' });
  if (r.status !== 0) for (const l of r.stderr.trim().split('\n')) problems.push(`${show(file)}: ${l}`);
}

const sets = filesFromArgs(process.argv.slice(2));
for (const f of sets.compose) checkCompose(f);
for (const f of sets.kubernetes) checkKubernetes(f);
for (const f of sets.yaml) parseYaml(f);
for (const f of sets.shell) checkShell(f);
const count = Object.values(sets).reduce((a, s) => a + s.length, 0);
for (const p of problems) process.stdout.write(`${p}\n`);
process.stdout.write(problems.length ? `check-deploy: ${problems.length} problem(s) in ${count} file(s)\n` : `check-deploy: ${count} file(s) valid\n`);
process.exit(problems.length ? 1 : 0);
