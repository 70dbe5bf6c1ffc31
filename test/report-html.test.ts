import { axisOf } from '../worker/core/positions.js';
import { beforeAll, describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PNG } from 'pngjs';
import type { GrowthResult } from '../worker/core/growth-kernel.js';
import { createKernel, defaultModelParams } from '../worker/models/registry.js';
import { ENGINE_VERSION } from '../worker/core/engine-version.js';
import { analyzeEnsemble, type EnsembleAnalysis } from '../coordinator/stats/index.js';
import { encodeSnapshot, type PointSet } from '../coordinator/snapshot/index.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { writeEnsembleReport, type ReportFiles } from '../coordinator/report/index.js';
import { fmt, fmtRange } from '../coordinator/report/labels.js';
import { checkXml } from './report-xml-check.js';

const CLUSTERS = 6;
const PARTICLES = 3000;
const SEED = '20261202';

function grow(particles: number, runIndex: number, seed = SEED): { result: GrowthResult; points: PointSet } {
  const k = createKernel({ model: defaultModelParams('dla-offlattice-2d'), particles, ensembleSeed: seed, runIndex, recordsPerDecade: 20 });
  k.growTo(particles);
  const p = k.positions();
  return { result: k.result(), points: { dimension: 2, count: p.count, x: axisOf(p, 0, p.count), y: axisOf(p, 1, p.count), diameter: 1 } };
}

function svgSize(svg: string): [number, number] {
  const m = /<svg [^>]*width="(\d+(?:\.\d+)?)" height="(\d+(?:\.\d+)?)"/.exec(svg);
  if (!m) throw new Error('svg without width/height');
  return [Number(m[1]), Number(m[2])];
}

/** Decode a PNG and count pixels that are not white, and dark ones (text, axes) in a row band. */
function pngStats(file: string, rowFrom = 0, rowTo = Infinity): { width: number; height: number; nonWhite: number; darkInRows: number; colours: number } {
  const png = PNG.sync.read(readFileSync(file));
  let nonWhite = 0, darkInRows = 0;
  const colours = new Set<number>();
  for (let y = 0; y < png.height; y++) {
    for (let x = 0; x < png.width; x++) {
      const o = 4 * (y * png.width + x);
      const r = png.data[o], g = png.data[o + 1], b = png.data[o + 2];
      if (r < 250 || g < 250 || b < 250) nonWhite++;
      if (y >= rowFrom && y < rowTo && r + g + b < 200) darkInRows++;
      if ((x + y) % 7 === 0) colours.add((r << 16) | (g << 8) | b);
    }
  }
  return { width: png.width, height: png.height, nonWhite, darkInRows, colours: colours.size };
}

/** The row of the estimates table for one estimator, as { value, lo/hi pairs, status }. */
function tableRow(html: string, key: string): { cells: string; values: string[]; los: string[]; his: string[]; status: string | null } {
  const m = new RegExp(`<tr data-estimator="${key}">(.*?)</tr>`).exec(html);
  if (!m) throw new Error(`no row for ${key}`);
  const cells = m[1];
  return {
    cells,
    values: [...cells.matchAll(/data-value="([^"]*)"/g)].map((x) => x[1]),
    los: [...cells.matchAll(/data-lo="([^"]*)"/g)].map((x) => x[1]),
    his: [...cells.matchAll(/data-hi="([^"]*)"/g)].map((x) => x[1]),
    status: /data-status="([^"]*)"/.exec(cells)?.[1] ?? null,
  };
}

describe('ensemble report from a real small DLA ensemble', () => {
  let dir: string;
  let files: ReportFiles;
  let analysis: EnsembleAnalysis;
  let html: string;

  beforeAll(async () => {
    const grown = Array.from({ length: CLUSTERS }, (_, i) => grow(PARTICLES, i));
    const runs = grown.map((g) => g.result);
    analysis = analyzeEnsemble(runs, { resamples: 400, corrections: true });
    const spec = validateSpec({ name: 'report test', model: 'dla-offlattice-2d', particles: PARTICLES, clusters: CLUSTERS, seed: SEED });
    dir = mkdtempSync(join(tmpdir(), 'tendril-report-'));
    files = await writeEnsembleReport(dir, {
      analysis, runs, spec, title: 'DLA <report> & "test"', ensembleId: 'ens-1',
      sampleCluster: { points: encodeSnapshot(grown[0].points), runIndex: 0 },
    });
    html = readFileSync(files.html, 'utf8');
    return () => rmSync(dir, { recursive: true, force: true });
  });

  it('writes report.html and one SVG and PNG per figure', () => {
    expect(existsSync(join(dir, 'report.html'))).toBe(true);
    const expected = ['estimator-comparison', 'radius-of-gyration', 'max-radius', 'mass-radius', 'local-slopes-size', 'local-slopes-radius', 'corrections-to-scaling', 'sample-cluster'];
    expect(files.figures).toEqual(expected);
    const present = readdirSync(join(dir, 'plots'));
    for (const f of expected) {
      expect(present).toContain(`${f}.svg`);
      expect(present).toContain(`${f}.png`);
    }
    expect(present).toContain('sample-cluster-raster.png');
    // a small real ensemble does not determine omega: the corrections figure says so instead of drawing a fit
    expect(analysis.corrections.radiusOfGyration!.determined).toBe(false);
    expect(files.notes).toHaveLength(1);
    expect(files.notes[0]).toMatch(/corrections-to-scaling.*no determined corrections fit: R_g\(N\)[^:]*: not determined \(/);
  });

  it('is well-formed, self-contained and escapes text', () => {
    const { rootTags } = checkXml(html, ['meta']);
    expect(rootTags).toEqual(['html']);
    // no network: no http(s) resources, no scripts
    expect(html).not.toMatch(/(src|href)="https?:/);
    expect(html).not.toMatch(/<script/i);
    expect(html).toContain('@font-face');
    expect(html).toContain('DLA &lt;report&gt; &amp; &quot;test&quot;');
    expect(html).not.toContain('<report>');
    // every figure inline
    expect((html.match(/<svg /g) ?? []).length).toBe(files.figures.length);
    expect(html).toContain(ENGINE_VERSION);
    expect(html).toContain('<th>seed</th>');
    for (const f of files.svgs) {
      const svg = readFileSync(f, 'utf8');
      checkXml(svg);
      // the file beside the page is the very figure shown inline
      expect(html).toContain(svg.replace(/^<\?xml[^>]*>\n/, '').trimEnd());
    }
    // element ids (clip paths of the inline SVGs, tables, figures) are unique on the page
    const ids = [...html.matchAll(/ id="([^"]+)"/g)].map((m) => m[1]);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it('labels axes with quantities and units and shows the reference as not fitted', () => {
    const svg = (n: string) => readFileSync(join(dir, 'plots', `${n}.svg`), 'utf8');
    expect(svg('radius-of-gyration')).toContain('cluster size N (particles)');
    expect(svg('radius-of-gyration')).toMatch(/radius of gyration R<\/tspan><tspan dy="[^"]+" font-size="[^"]+">g<\/tspan><tspan dy="[^"]+"> \(particle diameters\)/);
    expect(svg('max-radius')).toContain('(particle diameters)');
    expect(svg('mass-radius')).toContain('distance r from the seed (particle diameters)');
    expect(svg('radius-of-gyration')).toContain('fit window');
    expect(svg('local-slopes-size')).toContain('effective dimension D');
    expect(svg('local-slopes-size')).toContain('not a fit input');
    expect(svg('local-slopes-size')).toContain('Kesten');
    expect(svg('estimator-comparison')).toContain('fractal dimension D');
    expect(svg('estimator-comparison')).toContain('BCa');
    expect(svg('estimator-comparison')).toContain('percentile');
    expect(svg('sample-cluster')).toContain('particle diameters');
  });

  it('puts the analysis numbers in the estimates table unchanged', () => {
    for (const key of ['radiusOfGyration', 'maxRadius', 'massRadius'] as const) {
      const e = analysis.estimators[key];
      expect(e.available).toBe(true);
      const row = tableRow(html, key);
      expect(row.values).toEqual([String(e.D)]);
      expect(row.los).toEqual([String(e.interval.percentile![0]), String(e.interval.bca![0])]);
      expect(row.his).toEqual([String(e.interval.percentile![1]), String(e.interval.bca![1])]);
      expect(row.status).toBe(e.interval.status);
      expect(row.cells).toContain(`>${fmt(e.D)}<`);
      expect(row.cells).toContain(`>${fmtRange(e.interval.bca)}<`);
      expect(row.cells).toContain(`${e.fitWindow!.points} points`);
    }
    const c = analysis.corrections.radiusOfGyration!;
    if (c.determined) expect(tableRow(html, 'radiusOfGyrationCorrected').values).toEqual([String(c.D.value)]);
    else expect(html).toMatch(new RegExp(`data-estimator="radiusOfGyrationCorrected"><th>[^]*?</th><td colspan="3" class="warn">not determined: ${c.reason!.replace(/[.*+?^${}()|[\]\\]/g, '\\$&').slice(0, 20)}`));
    // the published value sits in the consistency panel, with its source
    expect(html).toContain('D = 1.71 ± 0.0002');
    expect(html).toContain('Menshutin');
    expect(html).toContain('never used as a fit input');
    // every verdict column states its rule beside its table; "computed" is an interval status, not a verdict
    expect(html).toContain('Rule: pair agrees: the interval (BCa, else percentile) of the paired bootstrap difference');
    expect(html).toContain('Rule: published value inside our interval: yes when');
    expect(html).toContain('Rule: bound: satisfied if');
    expect(html).toContain('it is not a verdict on D');
    // small clusters: if anything disagrees, the note under the estimates table says why
    const disagrees = analysis.consistency.pairs.some((q) => q.agree === false) || analysis.consistency.rows.some((r) => r.referenceInsideInterval === false);
    expect(analysis.consistency.finiteSizeNote !== null).toBe(disagrees);
    if (disagrees) expect(html).toMatch(/<p class="note" id="finite-size-note"><b>Why the estimates differ:<\/b> These clusters have N = \d+ particles/);
  });

  it('renders PNGs at twice the SVG size, with text and data drawn', () => {
    for (const f of files.figures) {
      const [w, h] = svgSize(readFileSync(join(dir, 'plots', `${f}.svg`), 'utf8'));
      // the top 30 px hold only the bold title (the panel starts lower): dark pixels there are text
      const st = pngStats(join(dir, "plots", `${f}.png`), 0, 2 * 30);
      expect([st.width, st.height]).toEqual([2 * w, 2 * h]);
      expect(st.nonWhite).toBeGreaterThan(0.02 * st.width * st.height);
      expect(st.colours).toBeGreaterThan(8);
      expect(st.darkInRows).toBeGreaterThan(200);
    }
    const raster = PNG.sync.read(readFileSync(join(dir, 'plots', 'sample-cluster-raster.png')));
    expect(raster.width).toBe(900);
  });
});

describe('ensemble report from degenerate inputs', () => {
  const dirs: string[] = [];
  const tmp = () => { const d = mkdtempSync(join(tmpdir(), 'tendril-report-degenerate-')); dirs.push(d); return d; };
  let one: GrowthResult;
  let four: GrowthResult[];
  beforeAll(() => {
    one = grow(600, 0, '7').result;
    four = Array.from({ length: 4 }, (_, i) => grow(600, i, '8').result);
    return () => { for (const d of dirs) rmSync(d, { recursive: true, force: true }); };
  });

  it('a single cluster: no intervals, clear notes, still a full report', async () => {
    const analysis = analyzeEnsemble([one], { resamples: 50 });
    const files = await writeEnsembleReport(tmp(), { analysis, runs: [one], pngScale: 1 });
    const html = readFileSync(files.html, 'utf8');
    checkXml(html, ['meta']);
    expect(html).toContain('a single cluster: no spread across clusters and no bootstrap intervals');
    expect(html).toContain('no sample cluster was given');
    expect(html).toContain('too few clusters for an interval');
    const row = tableRow(html, 'radiusOfGyration');
    expect(row.status).toBe('too-few-clusters');
    expect(row.values).toEqual([String(analysis.estimators.radiusOfGyration.D)]);
    expect(row.los).toEqual([]);
    for (const f of files.svgs) checkXml(readFileSync(f, 'utf8'));
    for (const f of files.pngs) {
      const st = pngStats(f);
      expect(st.nonWhite).toBeGreaterThan(0);
    }
    expect(readFileSync(join(files.html, '..', 'plots', 'radius-of-gyration.svg'), 'utf8')).toContain('no interval');
  });

  it('an unavailable estimator, an unstable interval and a broken snapshot render as notes', async () => {
    const runs = four.map((r) => ({ ...r, massRadius: { radii: [], counts: [] } }));
    const analysis = structuredClone(analyzeEnsemble(runs, { resamples: 60, corrections: false, minClusters: 2 }));
    expect(analysis.estimators.massRadius.available).toBe(false);
    const mr = analysis.estimators.maxRadius;
    mr.interval = { ...mr.interval, status: 'unstable', percentile: null, bca: null, notes: ['12% of replicates not finite'] };
    const bad = new Uint8Array(40); // not a snapshot
    const files = await writeEnsembleReport(tmp(), { analysis, runs, sampleCluster: bad, png: false });
    const html = readFileSync(files.html, 'utf8');
    checkXml(html, ['meta']);
    expect(files.pngs).toEqual([]);
    expect(tableRow(html, 'massRadius').cells).toContain('not available: no mass-radius counts in the runs');
    expect(tableRow(html, 'maxRadius').status).toBe('unstable');
    expect(tableRow(html, 'maxRadius').cells).toContain('12% of replicates not finite');
    expect(tableRow(html, 'radiusOfGyration').status).toBe('ok');
    expect(html).toContain('no sample cluster picture: snapshot magic is');
    expect(html).toContain('The corrections-to-scaling fit was switched off.');
    expect(files.figures).not.toContain('corrections-to-scaling');
    const mass = readFileSync(join(files.html, '..', 'plots', 'mass-radius.svg'), 'utf8');
    checkXml(mass);
    expect(mass).toContain('no mass-radius counts in the runs');
    const cmp = readFileSync(join(files.html, '..', 'plots', 'estimator-comparison.svg'), 'utf8');
    expect(cmp).toContain('not available: no mass-radius counts');
    expect(cmp).toContain('no interval: unstable');
    expect(html).not.toContain('id="file-notes"');
  });

  it('runs that cannot be read still give a report of the analysis', async () => {
    const analysis = analyzeEnsemble(four, { resamples: 60 });
    const files = await writeEnsembleReport(tmp(), { analysis, runs: [], png: false, embedFont: false });
    const html = readFileSync(files.html, 'utf8');
    checkXml(html, ['meta']);
    expect(html).toContain('the run results could not be read for the curves');
    expect(html).not.toContain('@font-face');
    expect(tableRow(html, 'radiusOfGyration').values).toEqual([String(analysis.estimators.radiusOfGyration.D)]);
  });
});
