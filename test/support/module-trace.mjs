/**
 * `node --import ./test/support/module-trace.mjs ...` appends the URL of every
 * module the process resolves (ES imports, and the entry of each CommonJS
 * package imported from them) to the file named by MODULE_TRACE_FILE, one a
 * line. test/cli-startup.test.ts uses it to check what a command loads.
 */
import { register } from 'node:module';

register(
  'data:text/javascript,' +
    encodeURIComponent(`
import { appendFileSync } from 'node:fs';
export async function resolve(specifier, context, next) {
  const r = await next(specifier, context);
  if (process.env.MODULE_TRACE_FILE) appendFileSync(process.env.MODULE_TRACE_FILE, r.url + '\\n');
  return r;
}
`),
);
