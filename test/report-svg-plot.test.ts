import { describe, expect, it } from 'vitest';
import { autoDomain, escapeXml, formatTick, linearTicks, logTicks, niceStep, parseRichText, Plot, Scale, svgText } from '../coordinator/report/svg-plot.js';
import { checkXml } from './report-xml-check.js';

describe('svg-plot: ticks and scales', () => {
  it('log scale puts decades at equal distances and labels them', () => {
    const s = new Scale('log', [1, 1e4], [0, 400]);
    expect(s.map(10)).toBeCloseTo(100, 9);
    expect(s.map(1000)).toBeCloseTo(300, 9);
    const majors = logTicks([1, 1e4]).filter((t) => t.major).map((t) => t.value);
    expect(majors).toEqual([1, 10, 100, 1000, 1e4]);
    expect(logTicks([1, 1e4]).find((t) => t.value === 1e4)?.label).toBe('10^{4}');
    // minor ticks 2..9 inside each decade
    expect(logTicks([1, 1e4]).filter((t) => !t.major).length).toBe(4 * 8);
  });

  it('a log axis spanning less than a decade still gets at least two labelled ticks', () => {
    const t = logTicks([1.5, 2.4]).filter((x) => x.label);
    expect(t.length).toBeGreaterThanOrEqual(2);
    for (const x of t) { expect(x.value).toBeGreaterThanOrEqual(1.5); expect(x.value).toBeLessThanOrEqual(2.4); }
  });

  it('linear ticks use nice steps and print them exactly (1.75, not 1.8)', () => {
    expect(niceStep(1, 5)).toBe(0.2);
    expect(niceStep(1.2, 5)).toBe(0.25);
    const t = linearTicks([1.45, 2.6]).filter((x) => x.major);
    expect(t.map((x) => x.label)).toEqual(['1.50', '1.75', '2.00', '2.25', '2.50']);
    expect(formatTick(-0.5, 0.5)).toBe('−0.5');
    expect(formatTick(0, 0.1)).toBe('0.0');
  });

  it('autoDomain pads data and never returns an empty range', () => {
    const [a, b] = autoDomain([3, 3, 3], 'linear');
    expect(a).toBeLessThan(3); expect(b).toBeGreaterThan(3);
    const [c, d] = autoDomain([10, 1000], 'log');
    expect(c).toBeLessThan(10); expect(d).toBeGreaterThan(1000);
    expect(autoDomain([], 'log')).toEqual([1, 10]);
    expect(autoDomain([-1, 0, NaN], 'log')).toEqual([1, 10]);
  });
});

describe('svg-plot: text', () => {
  it('parses sub- and superscripts', () => {
    expect(parseRichText('R_g(N)')).toEqual([{ text: 'R', shift: 0 }, { text: 'g', shift: -1 }, { text: '(N)', shift: 0 }]);
    expect(parseRichText('N^{1/D}')).toEqual([{ text: 'N', shift: 0 }, { text: '1/D', shift: 1 }]);
    expect(parseRichText('R_{max}')).toEqual([{ text: 'R', shift: 0 }, { text: 'max', shift: -1 }]);
  });

  it('escapes every text it writes', () => {
    expect(escapeXml(`<a & "b" 'c'>`)).toBe('&lt;a &amp; &quot;b&quot; &#39;c&#39;&gt;');
    const t = svgText(0, 0, '<script>&_{x}');
    expect(t).not.toContain('<script>');
    expect(t).toContain('&lt;script&gt;&amp;');
    checkXml(t);
  });
});

describe('svg-plot: a whole plot', () => {
  it('writes well-formed SVG with axis labels, a legend and skipped non-finite points', () => {
    const xs = [10, 100, 1000, 10000];
    const p = new Plot({ idPrefix: 't', title: 'T <1>', x: { label: 'cluster size N (particles)', kind: 'log' }, y: { label: 'R_g (particle diameters)', kind: 'log' } });
    p.band(xs, [1, 4, 15, 60], [2, 6, 25, 90], '#0072B2', 'band');
    p.line(xs, [1.5, 5, NaN, 75], { colour: '#000' }, 'line');
    p.points(xs, [1.5, 5, 20, -1], '#D55E00', 'points');
    p.errorBars(xs, [1, 4, 15, 60], [2, 6, 25, 90], '#333');
    p.hline(30, { colour: '#999', dash: '2 2' }, 'thirty');
    p.note('a note & more');
    const svg = p.toSvg();
    checkXml(svg);
    expect(svg).toContain('T &lt;1&gt;');
    expect(svg).toContain('cluster size N (particles)');
    expect(svg).toContain('particle diameters');
    expect(svg).toContain('a note &amp; more');
    // the point at y = -1 is left out on a log axis: three markers in the panel, one in the legend
    expect((svg.match(/<circle /g) ?? []).length).toBe(4);
    // the line breaks at NaN: two subpaths
    const path = /<path d="(M[^"]*)" stroke="#000"/.exec(svg);
    expect(path).not.toBeNull();
    expect((path![1].match(/M/g) ?? []).length).toBe(2);
  });
});
