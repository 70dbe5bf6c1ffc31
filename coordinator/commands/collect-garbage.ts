/**
 * A full garbage collection on demand, for `tendril grow` between growing a
 * giant cluster and writing its outputs. A growth kernel allocates almost
 * nothing on the JavaScript heap, so the arrays its index discarded while
 * growing (each replaced by one a quarter larger) wait for a collection that
 * nothing triggers; collecting them before the pictures are drawn keeps the
 * process's peak memory to what is live. Node exposes `gc` only behind a
 * V8 flag, set here for this process.
 */
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';

let gc: (() => void) | undefined;

export function collectGarbage(): void {
  if (gc === undefined) {
    const exposed = (globalThis as { gc?: () => void }).gc;
    if (exposed) gc = exposed;
    else {
      setFlagsFromString('--expose-gc');
      gc = runInNewContext('gc') as () => void;
    }
  }
  gc();
}
