/**
 * The status pages share one shell, web/page.html: the document head (the
 * style sheet, the page's title and its script module) around the page's own
 * body, web/NAME.body.html. fillPage puts a page's title, script and body
 * into the shell's {{title}}, {{script}} and {{body}} (pure: no I/O).
 */

/** The pages served by coordinator/http/web-routes.ts, by the name they are served as (GET /web/NAME). */
export const PAGES = {
  'index.html': { title: 'ensembles', script: 'index.js', body: 'index.body.html' },
  'view.html': { title: 'ensemble', script: 'view.js', body: 'view.body.html' },
  'sweep.html': { title: 'sweep', script: 'sweep.js', body: 'sweep.body.html' },
} as const;

export type PageName = keyof typeof PAGES;

/** The shell with each placeholder replaced once by the given text (taken literally, `$` included). */
export function fillPage(shell: string, fill: { title: string; script: string; body: string }): string {
  let out = shell;
  for (const key of ['title', 'script', 'body'] as const) {
    const mark = `{{${key}}}`;
    const at = out.indexOf(mark);
    if (at < 0 || out.indexOf(mark, at + mark.length) >= 0) throw new Error(`web/page.html: ${mark} must stand exactly once`);
    out = out.slice(0, at) + fill[key] + out.slice(at + mark.length);
  }
  return out;
}
