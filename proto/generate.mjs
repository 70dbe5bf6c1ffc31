#!/usr/bin/env node
// Regenerates the static protobuf code from proto/tendril.proto:
//   node proto/generate.mjs [OUT_DIR]      (default proto/generated)
// Writes OUT_DIR/tendril.js (ES module importing protobufjs/minimal.js) and
// OUT_DIR/tendril.d.ts. Used by `npm run proto:generate` and by the test that
// checks the checked-in code is current.
import { execFileSync } from 'node:child_process';
import { mkdirSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const out = resolve(process.argv[2] ?? join(root, 'proto', 'generated'));
mkdirSync(out, { recursive: true });
const bin = (name) => join(root, 'node_modules', '.bin', name);
const js = join(out, 'tendril.js');
execFileSync(bin('pbjs'), ['-t', 'static-module', '-w', 'es6', '--es6', '--force-number', '-o', js, join(root, 'proto', 'tendril.proto')], { cwd: root, stdio: 'inherit' });
execFileSync(bin('pbts'), ['-o', join(out, 'tendril.d.ts'), js], { cwd: root, stdio: 'inherit' });
