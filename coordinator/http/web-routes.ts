/**
 * The web status page of `tendril serve` (routes kept apart from the API in
 * server.ts):
 *
 *   GET /                               every ensemble: state, progress, particles/s chart, time left, failures
 *   GET /view/:id                       one ensemble: progress, probes, report plots, cluster picture,
 *                                       summary downloads, cancel (needs the API token)
 *   GET /sweep/:id                      one sweep: totals, members (links to /view/MEMBER), the D(parameter)
 *                                       figure (GET /sweeps/:id/figure.svg, in server.ts) and table downloads
 *   GET /web/:file                      the page's own scripts and style (no CDN: works on a closed network)
 *   GET /ensembles/:id/figures          {clustersDone, partial, figures: [{name, title, titleRuns, caption, note, svg}], notes}
 *                                       (titleRuns: the title as runs of text, shift -1 subscript, 1 superscript)
 *   GET /ensembles/:id/figures/:name.svg  one report figure (SVG)
 *   GET /ensembles/:id/cluster.png      run 0 grown again (coordinator/http/ensemble-figures.ts)
 *
 * The pages are static (each one the shared head of web/page.html around its
 * own body, coordinator/http/web-page.ts): their scripts read the JSON API
 * that the CLI uses (/ensembles, /ensembles/:id) and the figure routes above.
 */
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { FastifyInstance } from 'fastify';
import type { EnsembleStore } from '../farm/store.js';
import { ENSEMBLE_ID_PATTERN } from '../plan.js';
import { parseRichText } from '../report/index.js';
import type { SummaryOptions } from '../summary/index.js';
import { EnsembleFigures } from './ensemble-figures.js';
import { fillPage, PAGES, type PageName } from './web-page.js';
import { TendrilError } from '../../proto/errors.js';

const WEB_DIR = join(dirname(fileURLToPath(import.meta.url)), 'web');
const ASSETS: Record<string, string> = {
  'index.html': 'text/html; charset=utf-8',
  'view.html': 'text/html; charset=utf-8',
  'sweep.html': 'text/html; charset=utf-8',
  'sweep.js': 'text/javascript; charset=utf-8',
  'common.js': 'text/javascript; charset=utf-8',
  'chart.js': 'text/javascript; charset=utf-8',
  'index.js': 'text/javascript; charset=utf-8',
  'view.js': 'text/javascript; charset=utf-8',
  'style.css': 'text/css; charset=utf-8',
};

export interface WebOptions {
  store: EnsembleStore;
  summary?: SummaryOptions;
}

class NotFound extends TendrilError {
  readonly kind = 'request';
  readonly statusCode = 404;
}

export function registerWebRoutes(app: FastifyInstance, o: WebOptions): void {
  const files = new Map<string, Buffer>();
  const read = (name: string): string => readFileSync(join(WEB_DIR, name), 'utf8');
  // a page is the shared shell around its own body (coordinator/http/web-page.ts)
  const asset = (name: string): Buffer => {
    let b = files.get(name);
    if (!b) {
      const page = Object.hasOwn(PAGES, name) ? PAGES[name as PageName] : undefined;
      b = page ? Buffer.from(fillPage(read('page.html'), { title: page.title, script: page.script, body: read(page.body) })) : readFileSync(join(WEB_DIR, name));
      files.set(name, b);
    }
    return b;
  };
  const figures = new EnsembleFigures(o.store, o.summary);
  app.addHook('onClose', async () => figures.close());
  const checkId = (id: string) => {
    if (!ENSEMBLE_ID_PATTERN.test(id)) throw Object.assign(new Error(`id: ${JSON.stringify(id.slice(0, 80))} is not allowed; allowed: 1 to 64 letters, digits, _ or -`), { statusCode: 400 });
  };

  app.get('/', async (_req, reply) => reply.header('content-type', ASSETS['index.html']).send(asset('index.html')));
  app.get<{ Params: { id: string } }>('/view/:id', async (req, reply) => {
    checkId(req.params.id);
    return reply.header('content-type', ASSETS['view.html']).send(asset('view.html'));
  });
  app.get<{ Params: { id: string } }>('/sweep/:id', async (req, reply) => {
    checkId(req.params.id);
    return reply.header('content-type', ASSETS['sweep.html']).send(asset('sweep.html'));
  });
  app.get<{ Params: { file: string } }>('/web/:file', async (req, reply) => {
    const type = ASSETS[req.params.file];
    if (!type) throw new NotFound(`GET /web/${req.params.file.slice(0, 80)}: no such file; allowed: ${Object.keys(ASSETS).join(', ')}`);
    return reply.header('content-type', type).header('cache-control', 'no-cache').send(asset(req.params.file));
  });

  app.get<{ Params: { id: string } }>('/ensembles/:id/figures', async (req) => {
    checkId(req.params.id);
    const set = await figures.figures(req.params.id);
    if (!set) throw new NotFound(`id: "${req.params.id}" is not an ensemble of this farm`);
    return {
      clustersDone: set.clustersDone,
      partial: set.partial,
      figures: set.figures.map((f) => ({ name: f.name, title: f.title, titleRuns: parseRichText(f.title), caption: f.caption, note: f.note, svg: `/ensembles/${req.params.id}/figures/${f.name}.svg` })),
      notes: set.notes,
    };
  });

  app.get<{ Params: { id: string; name: string } }>('/ensembles/:id/figures/:name', async (req, reply) => {
    checkId(req.params.id);
    const set = await figures.figures(req.params.id);
    if (!set) throw new NotFound(`id: "${req.params.id}" is not an ensemble of this farm`);
    const f = set.figures.find((x) => `${x.name}.svg` === req.params.name);
    if (!f) throw new NotFound(`figure: "${req.params.name.slice(0, 80)}" is not a figure of this ensemble; allowed: ${set.figures.map((x) => `${x.name}.svg`).join(', ') || 'none yet'}`);
    return reply.header('content-type', 'image/svg+xml; charset=utf-8').send(f.svg);
  });

  app.get<{ Params: { id: string } }>('/ensembles/:id/cluster.png', async (req, reply) => {
    checkId(req.params.id);
    const pic = await figures.picture(req.params.id);
    if (pic === null) throw new NotFound(`id: "${req.params.id}" is not an ensemble of this farm`);
    if (typeof pic === 'string') throw Object.assign(new Error(`picture: ${pic}`), { statusCode: 409 });
    return reply
      .header('content-type', 'image/png')
      .header('x-run-index', String(pic.runIndex))
      .header('x-particles', String(pic.particles))
      .header('x-hash-check', pic.hashCheck)
      .send(Buffer.from(pic.png));
  });
}
