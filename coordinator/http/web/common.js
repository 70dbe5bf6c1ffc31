// Helpers shared by the status pages: JSON fetches and number formats.
export async function getJson(url) {
  const r = await fetch(url, { headers: { accept: 'application/json' } });
  const body = await r.json().catch(() => ({}));
  if (!r.ok) throw new Error(body.error ?? `${url}: HTTP ${r.status}`);
  return body;
}

export function fmtInt(n) {
  return Number.isFinite(n) ? Math.round(n).toLocaleString('en-US') : '–';
}

/** 1234567 -> "1.23 M". */
export function fmtRate(n) {
  if (!Number.isFinite(n)) return '–';
  if (n >= 1e6) return `${(n / 1e6).toFixed(2)} M`;
  if (n >= 1e3) return `${(n / 1e3).toFixed(1)} k`;
  return n.toFixed(0);
}

export function fmtDuration(s) {
  if (s === null || s === undefined || !Number.isFinite(s)) return '–';
  s = Math.max(0, Math.round(s));
  const h = Math.floor(s / 3600), m = Math.floor((s % 3600) / 60), sec = s % 60;
  return h > 0 ? `${h} h ${String(m).padStart(2, '0')} min` : m > 0 ? `${m} min ${String(sec).padStart(2, '0')} s` : `${sec} s`;
}

export function el(tag, attrs = {}, ...children) {
  const e = document.createElement(tag);
  for (const [k, v] of Object.entries(attrs)) {
    if (k === 'class') e.className = v;
    else if (k === 'text') e.textContent = v;
    else e.setAttribute(k, v);
  }
  for (const c of children) e.append(c);
  return e;
}

export function stateBadge(state) {
  return el('span', { class: `state ${state}`, text: state });
}

/** A progress bar: fraction done with a label. */
export function bar(done, total, label) {
  const f = total > 0 ? Math.min(1, done / total) : 0;
  const b = el('div', { class: 'bar', role: 'progressbar', 'aria-valuenow': String(Math.round(f * 100)), 'aria-valuemin': '0', 'aria-valuemax': '100' });
  const fill = el('span');
  fill.style.width = `${(f * 100).toFixed(1)}%`;
  b.append(fill, el('em', { text: label ?? `${(f * 100).toFixed(1)} %` }));
  return b;
}

export const POLL_MS = 2000;

/** Text runs [{text, shift}] (shift -1 subscript, 1 superscript) as a fragment, e.g. R_{max}(N). */
export function richText(runs) {
  const f = document.createDocumentFragment();
  for (const r of runs) f.append(r.shift === 0 ? document.createTextNode(r.text) : el(r.shift < 0 ? 'sub' : 'sup', { text: r.text }));
  return f;
}
