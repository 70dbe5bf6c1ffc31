/**
 * The status pages share one head (coordinator/http/web/page.html) around
 * their own bodies (web/NAME.body.html): each page served by the web routes
 * is a whole document with its own title and script, and the shell's
 * placeholders are filled literally. The browser test (test/web-status.test.ts)
 * drives the pages themselves.
 */
import Fastify from 'fastify';
import { afterAll, describe, expect, it } from 'vitest';
import type { EnsembleStore } from '../coordinator/farm/store.js';
import { fillPage, PAGES } from '../coordinator/http/web-page.js';
import { registerWebRoutes } from '../coordinator/http/web-routes.js';

// the page routes never reach the store (only the figure routes do)
const app = Fastify();
registerWebRoutes(app, { store: {} as EnsembleStore });
afterAll(() => app.close());

const HEAD = (title: string, script: string) =>
  `<!DOCTYPE html>\n<html lang="en">\n<head>\n<meta charset="utf-8">\n<meta name="viewport" content="width=device-width, initial-scale=1">\n<title>tendril: ${title}</title>\n<link rel="icon" href="data:,">\n<link rel="stylesheet" href="/web/style.css">\n<script type="module" src="/web/${script}"></script>\n</head>\n<body>\n`;

describe('status pages: one shared head', () => {
  it('every page is served whole, at its route and under /web/, with its own title and script', async () => {
    const expected: Array<[string, string, string, string]> = [
      ['/', 'index.html', 'ensembles', 'index.js'],
      ['/view/abc', 'view.html', 'ensemble', 'view.js'],
      ['/sweep/abc', 'sweep.html', 'sweep', 'sweep.js'],
    ];
    for (const [route, name, title, script] of expected) {
      const page = await app.inject({ method: 'GET', url: route });
      expect(page.statusCode).toBe(200);
      expect(page.headers['content-type']).toBe('text/html; charset=utf-8');
      expect(page.body.startsWith(HEAD(title, script))).toBe(true);
      expect(page.body.endsWith('</main>\n</body>\n</html>\n')).toBe(true);
      expect(page.body).not.toContain('{{');
      expect(page.body.match(/<head>/g)).toHaveLength(1);
      const asset = await app.inject({ method: 'GET', url: `/web/${name}` });
      expect(asset.body).toBe(page.body);
      expect(asset.headers['cache-control']).toBe('no-cache');
    }
    expect(Object.keys(PAGES).sort()).toEqual(['index.html', 'sweep.html', 'view.html']);
  });

  it('the shell and the bodies are not served by themselves', async () => {
    for (const file of ['page.html', 'view.body.html']) {
      const r = await app.inject({ method: 'GET', url: `/web/${file}` });
      expect(r.statusCode).toBe(404);
      expect(r.json().message).toBe(`GET /web/${file}: no such file; allowed: index.html, view.html, sweep.html, sweep.js, common.js, chart.js, index.js, view.js, style.css`);
    }
  });

  it('fillPage fills each placeholder once, literally, and refuses a shell without one', () => {
    const shell = '<title>{{title}}</title><script src="{{script}}"></script>{{body}}';
    expect(fillPage(shell, { title: 'a $& b', script: 'x.js', body: '<p>{{title}}</p>' })).toBe('<title>a $& b</title><script src="x.js"></script><p>{{title}}</p>');
    expect(() => fillPage('{{title}}{{body}}', { title: 't', script: 's', body: 'b' })).toThrow('web/page.html: {{script}} must stand exactly once');
    expect(() => fillPage('{{title}}{{script}}{{body}}{{body}}', { title: 't', script: 's', body: 'b' })).toThrow('web/page.html: {{body}} must stand exactly once');
  });
});
