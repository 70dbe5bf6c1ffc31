/**
 * The "Harmonic measure" section of the ensemble report and its figures.
 *
 * The HarmonicSection objects below are RENDERING TEST DATA built by hand:
 * smooth made-up curves with the shapes a section can have (several sizes,
 * one size, missing intervals, reasons), not physics and not the output of
 * coordinator/harmonic. Nothing here checks a physical value; the tests
 * check that the report shows what the section says, marks what it flags,
 * draws the bound lines, and survives thin data.
 */
import { axisOf } from '../worker/core/positions.js';
import { beforeAll, describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PNG } from 'pngjs';
import type { GrowthResult } from '../worker/core/growth-kernel.js';
import { createKernel, defaultModelParams } from '../worker/models/registry.js';
import { analyzeEnsemble, type EnsembleAnalysis } from '../coordinator/stats/index.js';
import { unavailableInterval, type IntervalSummary } from '../coordinator/stats/bca.js';
import type { EnsembleValue } from '../coordinator/harmonic/ensemble-intervals.js';
import type { HarmonicAtSize, HarmonicSection } from '../coordinator/harmonic/harmonic-section-types.js';
import { renderMeasurePng } from '../coordinator/harmonic/measure-picture.js';
import { buildEnsembleReport, writeEnsembleReport, type ReportInput } from '../coordinator/report/index.js';
import { fmt } from '../coordinator/report/labels.js';
import { checkXml } from './report-xml-check.js';

const HARMONIC_FIGURES = ['harmonic-tau', 'harmonic-f-alpha', 'harmonic-capacity', 'harmonic-capacity-increment', 'harmonic-electrostatic'];
const MAIN_FIGURES = ['estimator-comparison', 'radius-of-gyration', 'max-radius', 'mass-radius', 'local-slopes-size', 'local-slopes-radius', 'corrections-to-scaling'];

function interval(m: number, w: number, bca = true): IntervalSummary {
  return { level: 0.95, percentile: [m - 1.1 * w, m + 0.9 * w], bca: bca ? [m - w, m + w] : null, status: 'ok', notes: [], biasCorrection: 0, acceleration: 0, standardError: w / 2, replicatesUsed: 2000 };
}
function ev(mean: number, w: number | null, clusters = 8): EnsembleValue {
  return { mean, clusters, interval: w === null ? unavailableInterval(0.95, 'too-few-clusters', `${clusters} clusters; at least 3 are needed`) : interval(mean, w) };
}

/** A made-up concave τ(q) with τ(1) = 0 and τ′(1) = 1 (rendering data only). */
function madeUpTau(q: number, b: number): number {
  return 0.6 * (q - 1) + (0.4 * (1 - Math.exp(-b * (q - 1)))) / b;
}

/** The run of converged q holding q = 1 on a sorted grid (rendering data). */
function rangeAround1(q: number[], conv: boolean[]): [number, number] | null {
  let k = q.indexOf(1);
  if (k < 0 || !conv[k]) return null;
  let a = k;
  while (a > 0 && conv[a - 1]) a--;
  while (k < q.length - 1 && conv[k + 1]) k++;
  return [q[a], q[k]];
}

function atSize(size: number, q: number[], b: number, o: { clusters?: number; withIntervals?: boolean; notConverged?: number[]; unjudged?: number[] } = {}): HarmonicAtSize {
  const clusters = o.clusters ?? 8;
  const tau = q.map((v) => madeUpTau(v, b));
  const alpha = q.map((_, k) => {
    const a = k === 0 ? 0 : k - 1, c = k === q.length - 1 ? k : k + 1;
    return (tau[c] - tau[a]) / (q[c] - q[a]);
  });
  const conv = q.map((v) => !(o.notConverged ?? []).includes(v) && !(o.unjudged ?? []).includes(v));
  const t3 = q.indexOf(3);
  const width = (v: number) => (o.withIntervals === false ? null : 0.02 + 0.03 * Math.abs(v - 1));
  return {
    size, clusters, walkers: 20000, q,
    tau: q.map((v, k) => ev(tau[k], width(v), clusters)),
    dq: q.map((v, k) => (v === 1 ? null : tau[k] / (v - 1))),
    alpha, f: q.map((v, k) => v * alpha[k] - tau[k]),
    convergedFraction: q.map((v) => ((o.unjudged ?? []).includes(v) ? null : (o.notConverged ?? []).includes(v) ? 0.6 : 1)),
    converged: conv,
    convergedRange: rangeAround1(q, conv),
    systematic: { tau: q.map(() => 0.01), informationDimension: 0.02 },
    resolutionSystematic: { tau: q.map(() => 0.005), informationDimension: 0.005 },
    informationDimensionWithSystematic: null,
    tau3WithSystematic: null,
    informationDimension: ev(1.004, o.withIntervals === false ? null : 0.012, clusters),
    maxConcentrationExponent: ev(0.62, o.withIntervals === false ? null : 0.03, clusters),
    beurlingRespected: true,
    logCapacity: ev(Math.log(0.9 * Math.pow(size, 0.585)), o.withIntervals === false ? null : 0.02, clusters),
    z3: ev(2.5 * Math.pow(size, -1.0), o.withIntervals === false ? null : 1e-5, clusters),
    tau3: t3 >= 0 ? ev(tau[t3], width(3), clusters) : null,
  };
}

const Q = Array.from({ length: 25 }, (_, k) => -1 + 0.25 * k);
const NOT_CONVERGED = [-1, -0.75, 5];
const UNJUDGED = [4.75];

/** Four sizes, intervals everywhere, a few q flagged (rendering data). */
function fullSection(): HarmonicSection {
  const sizes = [1000, 2000, 4000, 8000];
  const bySize = sizes.map((n, i) => atSize(n, Q, 1.2 + 0.1 * (sizes.length - 1 - i), n === 8000 ? { notConverged: NOT_CONVERGED, unjudged: UNJUDGED } : {}));
  const top = bySize[3];
  const inc = sizes.slice(0, -1).map((n, k) => (bySize[k + 1].logCapacity.mean - bySize[k].logCapacity.mean) / (sizes[k + 1] - n));
  const z3 = sizes.slice(0, -1).map((n, k) => Math.sqrt(bySize[k].z3.mean * bySize[k + 1].z3.mean));
  return {
    schema: 'tendril-harmonic/1',
    convention: 'Z(q,eps) = sum over boxes of side eps of mu(box)^q ~ (eps/R)^tau(q)',
    probe: { walkers: 20000, jobs: 4, q: Q, sizes, contactSample: 2000, minStep: 0.05 },
    bySize,
    capacityGrowth: {
      sizes, meanLogCapacity: bySize.map((s) => s.logCapacity.mean), exponent: 0.585, exponentInterval: interval(0.585, 0.01),
      dimension: 1 / 0.585, dimensionInterval: [1 / 0.595, 1 / 0.575], reason: null,
    },
    capacityIncrement: {
      fromSize: sizes.slice(0, -1), toSize: sizes.slice(1), meanIncrement: inc, z3, ratio: inc.map((v, k) => v / z3[k]),
      slope: 1.03, slopeInterval: interval(1.03, 0.08), proportional: true, reason: null,
    },
    electrostatic: {
      size: 8000, tau3: top.tau3, massDimension: { estimator: 'radiusOfGyration', value: 1.71, interval: [1.69, 1.73] },
      consistent: false, consistentWithSystematic: true, source: 'electrostatic scaling law (rendering test data)',
      particleScale: { sizes, clusters: 8, ratio: 0.99, ratioInterval: interval(0.99, 0.02), consistent: true, reason: null },
    },
    clustersAtAllSizes: 8,
  };
}

/** One size, two clusters (no intervals), no q = 3, no mass D (rendering data). */
function thinSection(): HarmonicSection {
  const q = [0, 0.5, 1, 1.5, 2];
  const s = atSize(1500, q, 1.2, { clusters: 2, withIntervals: false });
  s.beurlingRespected = null;
  return {
    schema: 'tendril-harmonic/1', convention: 'test', probe: { walkers: 500, jobs: 1, q, sizes: [1500], contactSample: 200, minStep: 0.05 },
    bySize: [s],
    capacityGrowth: { sizes: [1500], meanLogCapacity: [s.logCapacity.mean], exponent: null, exponentInterval: null, dimension: null, dimensionInterval: null, reason: 'one probed size: no growth fit' },
    capacityIncrement: { fromSize: [], toSize: [], meanIncrement: [], z3: [], ratio: [], slope: null, slopeInterval: null, proportional: null, reason: 'fewer than two probed sizes' },
    electrostatic: { size: 1500, tau3: null, massDimension: null, consistent: null, consistentWithSystematic: null, source: 'test', particleScale: { sizes: [1500], clusters: 0, ratio: null, ratioInterval: null, consistent: null, reason: 'one probed size' } },
    clustersAtAllSizes: 2,
  };
}

function grow(particles: number, runIndex: number, seed: string): { result: GrowthResult; x: Float64Array; y: Float64Array; n: number } {
  const k = createKernel({ model: defaultModelParams('dla-offlattice-2d'), particles, ensembleSeed: seed, runIndex, recordsPerDecade: 20 });
  k.growTo(particles);
  const p = k.positions();
  return { result: k.result(), x: Float64Array.from(axisOf(p, 0, p.count)), y: Float64Array.from(axisOf(p, 1, p.count)), n: p.count };
}

function figureSvg(html: string, name: string): string {
  const m = new RegExp(`<figure id="figure-${name}">(<svg [\\s\\S]*?</svg>)`).exec(html);
  if (!m) throw new Error(`no figure ${name}`);
  return m[1];
}

const h2s = (html: string) => [...html.matchAll(/<h2 id="([^"]+)"/g)].map((m) => m[1]);

describe('report: harmonic measure section', () => {
  let runs: GrowthResult[];
  let analysis: EnsembleAnalysis;
  let picture: Uint8Array;
  beforeAll(() => {
    const grown = Array.from({ length: 4 }, (_, i) => grow(500, i, '31'));
    runs = grown.map((g) => g.result);
    analysis = analyzeEnsemble(runs, { resamples: 60 });
    // hit counts made up from the distance to the seed (rendering data, not a probe)
    const g = grown[0];
    const counts = Array.from({ length: g.n }, (_, i) => Math.floor(Math.hypot(g.x[i], g.y[i]) ** 2 / 40));
    picture = renderMeasurePng(g.n, g.x, g.y, 0.5, counts, 256);
  });
  const input = (harmonic: HarmonicSection | null | undefined, extra: Partial<ReportInput> = {}): ReportInput =>
    ({ analysis: harmonic === undefined ? analysis : { ...analysis, harmonic }, runs, png: false, embedFont: false, ...extra });

  it('without harmonic statistics the report is unchanged in structure', () => {
    const plain = buildEnsembleReport(input(undefined));
    expect(plain.figures.map((f) => f.name)).toEqual(MAIN_FIGURES);
    expect(h2s(plain.html)).toEqual(['section-estimates', 'section-consistency', 'section-corrections', 'section-notes', 'section-figures', 'section-options']);
    expect(plain.html).not.toContain('harmonic');
    // an explicit null is the same as absent
    expect(buildEnsembleReport(input(null)).html).toBe(plain.html);
    // a measure picture without harmonic statistics is only named in the notes
    const withPic = buildEnsembleReport(input(undefined, { measurePicture: { runIndex: 0, size: 500, png: picture } }));
    expect(withPic.figures.map((f) => f.name)).toEqual(MAIN_FIGURES);
    expect(withPic.notes).toContain('a harmonic measure picture was given but the statistics have no harmonic section: not shown');
  });

  it('several sizes: section, tables, every figure, bounds, legends and flagged q', () => {
    const h = fullSection();
    const built = buildEnsembleReport(input(h, { measurePicture: { runIndex: 0, size: 500, png: picture } }));
    const html = built.html;
    checkXml(html, ['meta']);
    expect(h2s(html)).toEqual(['section-estimates', 'section-consistency', 'section-corrections', 'section-notes', 'section-figures', 'section-harmonic', 'section-options']);
    expect(built.figures.map((f) => f.name)).toEqual([...MAIN_FIGURES, ...HARMONIC_FIGURES, 'harmonic-measure']);
    const harmonicPart = html.slice(html.indexOf('id="section-harmonic"'), html.indexOf('id="section-options"'));
    for (const f of [...HARMONIC_FIGURES, 'harmonic-measure']) {
      expect(harmonicPart).toContain(`<figure id="figure-${f}">`);
      checkXml(figureSvg(html, f));
      expect(built.figures.find((x) => x.name === f)!.note).toBeNull();
    }
    expect((html.match(/<svg /g) ?? []).length).toBe(built.figures.length);
    const ids = [...html.matchAll(/ id="([^"]+)"/g)].map((m) => m[1]);
    expect(new Set(ids).size).toBe(ids.length);

    // τ(q): the bound lines with their legends, the band, the other sizes, flagged q
    const tau = figureSvg(html, 'harmonic-tau');
    expect(tau).toContain('τ(q) = q − 1: upper bound');
    expect(tau).toContain('τ(q) = (q − 1)/2, q ≥ 1: Beurling lower bound');
    expect(tau).toContain('95% BCa interval');
    for (const n of [1000, 2000, 4000]) expect(tau).toContain(`N = ${n} (8 clusters): ensemble mean`);
    expect(tau).toContain('not converged (probe halves disagree');
    expect(tau).toContain('convergence not judged');
    // one grey square per not-converged q, one grey triangle per unjudged q (the legend adds one of each)
    const greySquares = (tau.match(/<rect [^>]*fill="#9a9a9a"/g) ?? []).length;
    const greyTriangles = (tau.match(/<path d="M[^"]*Z" fill="#9a9a9a"/g) ?? []).length;
    expect(greySquares).toBe(NOT_CONVERGED.length + 1);
    expect(greyTriangles).toBe(UNJUDGED.length + 1);
    expect(tau).toContain('stroke-dasharray="7 4"');
    expect(tau).toContain('stroke-dasharray="9 3 2 3"');
    const tauCaption = /<figure id="figure-harmonic-tau">[\s\S]*?<figcaption>([\s\S]*?)<\/figcaption>/.exec(html)![1];
    expect(tauCaption).toContain('for q ≥ 1 only');
    expect(tauCaption).toContain('Makarov');
    expect(tauCaption).toContain('Jones &amp; Wolff');

    // f(α): the lines f = α and α = 1/2, one line per other size
    const fa = figureSvg(html, 'harmonic-f-alpha');
    expect(fa).toContain('f(α) = α');
    expect(fa).toContain('α = 1/2: Beurling');
    expect(fa).toContain('N = 1000 (8 clusters)');

    // capacity: fit legend with β and D_cap; increment: fitted slope and slope 1
    const cap = figureSvg(html, 'harmonic-capacity');
    expect(cap).toContain('fit cap = A N');
    expect(cap).toContain(fmt(0.585));
    expect(cap).toContain(fmt(1 / 0.585, 3));
    expect(cap).toContain('cluster size N (particles)');
    expect(cap).toContain('(particle diameters)');
    const inc = figureSvg(html, 'harmonic-capacity-increment');
    expect(inc).toContain('fitted slope = 1.030');
    expect(inc).toContain('slope 1: increment = c Z(3)');
    expect(inc).toContain('N = 1000–2000');
    const es = figureSvg(html, 'harmonic-electrostatic');
    expect(es).toContain('D from R');
    expect(es).toContain('Electrostatic scaling law τ(3) = D at N = 8000: not consistent');
    expect(es).toContain('τ(3), N = 8000');
    expect(es).toContain('intervals do not overlap');

    // the measure picture: the PNG itself as a data URI
    expect(figureSvg(html, 'harmonic-measure')).toContain(`href="data:image/png;base64,${Buffer.from(picture).toString('base64')}"`);
    expect(html).toContain('never hit by a probe walker');

    // τ(q) table at the largest size: every q, the flags as the section has them
    const rows = [...html.matchAll(/<tr data-q="([^"]+)"[^>]*>(.*?)<\/tr>/g)];
    expect(rows.map((r) => Number(r[1]))).toEqual(Q);
    const flag = (q: number) => /data-converged="([^"]+)"/.exec(rows[Q.indexOf(q)][2])![1];
    for (const q of NOT_CONVERGED) expect(flag(q)).toBe('no');
    for (const q of UNJUDGED) expect(flag(q)).toBe('none');
    expect(flag(2)).toBe('yes');
    const top = h.bySize[3];
    expect(rows[Q.indexOf(3)][2]).toContain(`data-value="${top.tau[Q.indexOf(3)].mean}"`);
    // the checks: verdicts as the section states them or as the intervals give
    const check = (k: string) => new RegExp(`<li data-check="${k}">(.*?)</li>`).exec(html)![1];
    expect(check('tau1')).toContain('data-verdict="yes"');
    expect(check('makarov')).toContain('data-verdict="yes"');
    expect(check('beurling')).toContain('data-verdict="yes"');
    expect(check('increment')).toContain('data-verdict="yes"');
    expect(check('electrostatic')).toContain('data-verdict="no"');
    expect(check('capacity')).toContain(fmt(1 / 0.585));
    expect(check('electrostatic-particle')).toContain('data-verdict="yes"');
    expect(check('q-range')).toContain('for q from −0.5 to 4.5');
    expect(built.notes.filter((n) => n.includes('harmonic'))).toEqual([]);
  });

  it('thin data: one size, no intervals, reasons: notes and empty figures, no exception', () => {
    const built = buildEnsembleReport(input(thinSection()));
    const html = built.html;
    checkXml(html, ['meta']);
    expect(built.figures.map((f) => f.name)).toEqual([...MAIN_FIGURES, ...HARMONIC_FIGURES]);
    for (const f of HARMONIC_FIGURES) checkXml(figureSvg(html, f));
    expect(built.notes).toContain('no harmonic measure picture was given');
    expect(html).toContain('One size was probed');
    expect(figureSvg(html, 'harmonic-tau')).toContain('no interval: 2 clusters; at least 3 are needed');
    expect(figureSvg(html, 'harmonic-capacity')).toContain('no power-law fit: one probed size: no growth fit');
    expect(built.figures.find((f) => f.name === 'harmonic-capacity-increment')!.note).toBe('no capacity increments: fewer than two probed sizes');
    expect(built.figures.find((f) => f.name === 'harmonic-electrostatic')!.note).toContain('q = 3 is not on the q grid');
    expect(built.notes).toContain('figure harmonic-capacity-increment: no capacity increments: fewer than two probed sizes');
    const check = (k: string) => new RegExp(`<li data-check="${k}"[^>]*>(.*?)</li>`).exec(html)![1];
    expect(check('makarov')).toContain('data-verdict="none"');
    expect(check('beurling')).toContain('data-verdict="none"');
    expect(check('capacity')).toContain('one probed size: no growth fit');
    expect(check('electrostatic')).toContain('data-verdict="none"');
    // D_1 column: q = 1 has no D_q of its own
    expect(html).toContain('see τ′(1)');
  });

  it('values lost to JSON (NaN becomes null) and an empty section do not break the page', () => {
    const h = JSON.parse(JSON.stringify(fullSection())) as HarmonicSection;
    const s = h.bySize[3] as unknown as { alpha: Array<number | null>; f: Array<number | null>; tau: Array<{ mean: number | null }> };
    s.alpha[0] = null; s.f[0] = null; s.tau[1].mean = null;
    h.capacityIncrement.meanIncrement[0] = -1e-5;
    const built = buildEnsembleReport(input(h));
    checkXml(built.html, ['meta']);
    expect(figureSvg(built.html, 'harmonic-capacity-increment')).toContain('1 interval(s) with Δ ln cap/ΔN ≤ 0 or Z(3) ≤ 0 not drawn');
    const empty: HarmonicSection = { ...thinSection(), bySize: [] };
    const e = buildEnsembleReport(input(empty));
    checkXml(e.html, ['meta']);
    for (const f of HARMONIC_FIGURES) expect(e.figures.find((x) => x.name === f)!.note).not.toBeNull();
    expect(e.html).toContain('No probed size with a q grid.');
  });

  it('writes SVG and PNG files of every harmonic figure and the measure raster', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tendril-report-harmonic-'));
    try {
      const files = await writeEnsembleReport(dir, { analysis: { ...analysis, harmonic: fullSection() }, runs, embedFont: false, pngScale: 1, measurePicture: { runIndex: 0, size: 500, png: picture } });
      for (const f of [...HARMONIC_FIGURES, 'harmonic-measure']) {
        const svg = readFileSync(join(dir, 'plots', `${f}.svg`), 'utf8');
        checkXml(svg);
        expect(existsSync(join(dir, 'plots', `${f}.png`))).toBe(true);
        const png = PNG.sync.read(readFileSync(join(dir, 'plots', `${f}.png`)));
        const m = /<svg [^>]*width="(\d+(?:\.\d+)?)" height="(\d+(?:\.\d+)?)"/.exec(svg)!;
        expect([png.width, png.height]).toEqual([Math.round(Number(m[1])), Math.round(Number(m[2]))]);
      }
      expect(readFileSync(join(dir, 'plots', 'harmonic-measure-raster.png')).equals(Buffer.from(picture))).toBe(true);
      expect(files.figures.slice(-6)).toEqual([...HARMONIC_FIGURES, 'harmonic-measure']);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
