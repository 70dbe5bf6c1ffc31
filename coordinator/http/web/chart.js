// A small line chart on a canvas: particles per second over time, one line
// per series, time axis in seconds before now, redrawn on every poll.
const COLOURS = ['#1f6feb', '#d1242f', '#1a7f37', '#8250df', '#bc4c00', '#0a7ea4', '#bf3989', '#57606a'];

export function colourOf(i) {
  return COLOURS[i % COLOURS.length];
}

function niceStep(range, target) {
  const raw = range / target;
  const p = 10 ** Math.floor(Math.log10(raw));
  const m = raw / p;
  return (m < 1.5 ? 1 : m < 3.5 ? 2 : m < 7.5 ? 5 : 10) * p;
}

function fmtTick(v) {
  if (v >= 1e6) return `${+(v / 1e6).toFixed(2)}M`;
  if (v >= 1e3) return `${+(v / 1e3).toFixed(1)}k`;
  return String(+v.toFixed(1));
}

/** The time window shown: the time watched so far, between 1 and 10 minutes. */
export function windowOf(series, now) {
  let first = now;
  for (const s of series) if (s.points.length) first = Math.min(first, s.points[0].t);
  return Math.min(10 * 60_000, Math.max(60_000, now - first));
}

/**
 * series: [{ label, points: [{ t (ms), v }] }]; draws the last `windowMs`
 * (default: windowOf the series).
 * Returns the number of line segments drawn (for tests and an empty-state note).
 */
export function drawChart(canvas, series, { now = Date.now(), windowMs = windowOf(series, now), yLabel = 'particles / s' } = {}) {
  const dpr = window.devicePixelRatio || 1;
  const w = canvas.clientWidth, h = canvas.clientHeight;
  canvas.width = Math.round(w * dpr);
  canvas.height = Math.round(h * dpr);
  const g = canvas.getContext('2d');
  g.setTransform(dpr, 0, 0, dpr, 0, 0);
  g.clearRect(0, 0, w, h);
  const L = 64, R = 12, T = 12, B = 34;
  const pw = w - L - R, ph = h - T - B;
  const t0 = now - windowMs;
  let vmax = 0;
  for (const s of series) for (const p of s.points) if (p.t >= t0) vmax = Math.max(vmax, p.v);
  vmax = vmax > 0 ? vmax * 1.1 : 1;
  const step = niceStep(vmax, 5);
  const x = (t) => L + ((t - t0) / windowMs) * pw;
  const y = (v) => T + ph - (v / vmax) * ph;
  g.font = '12px system-ui, sans-serif';
  g.strokeStyle = '#d5dae0';
  g.fillStyle = '#5b6572';
  g.lineWidth = 1;
  g.textAlign = 'right';
  g.textBaseline = 'middle';
  for (let v = 0; v <= vmax; v += step) {
    g.beginPath();
    g.moveTo(L, Math.round(y(v)) + 0.5);
    g.lineTo(L + pw, Math.round(y(v)) + 0.5);
    g.stroke();
    g.fillText(fmtTick(v), L - 6, y(v));
  }
  g.textAlign = 'center';
  g.textBaseline = 'top';
  const tStep = niceStep(windowMs / 1000, 6);
  for (let s = 0; s <= windowMs / 1000 + 1e-9; s += tStep) {
    const xx = x(now - s * 1000);
    g.fillText(s === 0 ? 'now' : `-${s} s`, xx, T + ph + 6);
  }
  g.save();
  g.translate(14, T + ph / 2);
  g.rotate(-Math.PI / 2);
  g.textBaseline = 'middle';
  g.fillText(yLabel, 0, 0);
  g.restore();
  g.strokeStyle = '#8c959f';
  g.strokeRect(L + 0.5, T + 0.5, pw, ph);
  let segments = 0;
  series.forEach((s, i) => {
    const pts = s.points.filter((p) => p.t >= t0);
    g.strokeStyle = colourOf(i);
    g.fillStyle = colourOf(i);
    g.lineWidth = 2;
    g.beginPath();
    pts.forEach((p, j) => {
      if (j === 0) g.moveTo(x(p.t), y(p.v));
      else {
        g.lineTo(x(p.t), y(p.v));
        segments++;
      }
    });
    g.stroke();
    if (pts.length === 1) {
      g.beginPath();
      g.arc(x(pts[0].t), y(pts[0].v), 3, 0, 2 * Math.PI);
      g.fill();
    }
  });
  canvas.dataset.segments = String(segments);
  return segments;
}
