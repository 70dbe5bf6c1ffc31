#!/usr/bin/env node
/**
 * Build (npm run build) only when a source changed since the last build: a
 * stamp in dist/ records the path, size and modification time of every file
 * the build reads or copies (every file under coordinator/, worker/, proto/
 * and test/ — sources, the generated protobuf code, the web page's files —
 * and tsconfig.json, package.json, package-lock.json). `npm start` and `npm test` call this, so a second run
 * starts at once. Delete dist/ (or run npm run build) to force a build.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const stampFile = join(root, 'dist', '.build-stamp');

function walk(dir, out) {
  if (!existsSync(dir)) return;
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = join(dir, e.name);
    if (e.isDirectory()) walk(p, out);
    else out.push(p); // every file: sources, and assets the build copies (proto/generated, coordinator/http/web)
  }
}

function fingerprint() {
  const files = [];
  for (const d of ['coordinator', 'worker', 'proto', 'test']) walk(join(root, d), files);
  for (const f of ['tsconfig.json', 'package.json', 'package-lock.json']) if (existsSync(join(root, f))) files.push(join(root, f));
  return files
    .sort()
    .map((f) => { const s = statSync(f); return `${relative(root, f)} ${s.size} ${s.mtimeMs}`; })
    .join('\n');
}

const now = fingerprint();
const before = existsSync(stampFile) ? readFileSync(stampFile, 'utf8') : null;
if (before === now && existsSync(join(root, 'dist', 'coordinator', 'cli.js'))) process.exit(0);
const r = spawnSync(process.platform === 'win32' ? 'npm.cmd' : 'npm', ['run', 'build', '--silent'], { cwd: root, stdio: 'inherit' });
if (r.status !== 0) process.exit(r.status ?? 1);
writeFileSync(stampFile, now);
