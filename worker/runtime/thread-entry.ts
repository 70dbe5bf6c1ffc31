/**
 * Where a worker thread's entry file is. In the compiled tree it is the
 * module itself (a .js file next to the caller); under vitest, which runs the
 * TypeScript sources, the thread must still load compiled JavaScript, so the
 * path is mapped into dist/ (run `npm run build` first).
 */
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/** URL of the compiled `<file>.js` next to the caller (a file under worker/), given the caller's import.meta.url. */
export function compiledWorkerEntry(callerUrl: string, file: string): URL {
  const here = fileURLToPath(callerUrl);
  if (here.endsWith('.ts')) {
    const compiled = here.replace(/([\\/])worker([\\/](?:[^\\/]+[\\/])*)[^\\/]+\.ts$/, `$1dist$1worker$2${file}.js`);
    if (!existsSync(compiled)) throw new Error(`compiled thread entry ${compiled} is missing: run npm run build`);
    return new URL(`file://${compiled}`);
  }
  return new URL(`./${file}.js`, callerUrl);
}
