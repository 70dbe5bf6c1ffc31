import { spawnSync } from 'node:child_process';
import { rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { ROOT, tempDir } from './farm-helpers.js';

const CHECK = join(ROOT, 'deploy', 'check-deploy.mjs');
const dir = tempDir('check-deploy');
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function check(args: string[]) {
  const r = spawnSync(process.execPath, [CHECK, ...args], { cwd: dir, encoding: 'utf8' });
  return { code: r.status, lines: r.stdout.trim().split('\n') };
}

describe('npm run check:deploy', () => {
  it('the compose file, the Kubernetes manifests, the Prometheus config and the Slurm script in deploy/ are valid', () => {
    const r = spawnSync('npm', ['run', '--silent', 'check:deploy'], { cwd: ROOT, encoding: 'utf8' });
    expect(r.stdout.trim()).toBe('check-deploy: 5 file(s) valid');
    expect(r.status).toBe(0);
  });

  it('finds a compose file off the specification and Kubernetes documents off their schema, one line each', () => {
    writeFileSync(join(dir, 'compose.yaml'), 'services:\n  web:\n    image: nginx\n    no_such_key: 1\n');
    writeFileSync(
      join(dir, 'k8s.yaml'),
      'apiVersion: apps/v1\nkind: Deployment\nmetadata: {name: w}\nspec:\n  replicas: two\n  selector: {matchLabels: {a: b}}\n  template:\n    metadata: {labels: {a: b}}\n    spec:\n      containers:\n        - image: x\n---\napiVersion: v1\nkind: Servic\nmetadata: {name: s}\n',
    );
    writeFileSync(join(dir, 'bad.sbatch'), '#!/bin/bash\nif true; then\n');
    const r = check(['--compose', 'compose.yaml', '--kubernetes', 'k8s.yaml', '--shell', 'bad.sbatch']);
    expect(r.code).toBe(1);
    expect(r.lines[0]).toMatch(/^compose\.yaml: .*\/services\/web.*must NOT have additional properties/);
    expect(r.lines[1]).toBe('k8s.yaml: document 1 (apps/v1 Deployment "w"): /spec/replicas must be integer; /spec/template/spec/containers/0 must have required property name');
    expect(r.lines[2]).toBe('k8s.yaml: document 2 (v1 Servic "s"): apiVersion/kind is not a known Kubernetes resource');
    expect(r.lines[3]).toMatch(/^bad\.sbatch: .*syntax error/);
    expect(r.lines.at(-1)).toBe('check-deploy: 4 problem(s) in 3 file(s)');
  });
});
